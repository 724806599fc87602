package main

import (
	"context"
	"io"
	"path/filepath"
	"strings"

	"github.com/spf13/cobra"

	"turnwise/forms/touchstone"
	"turnwise/internal/report"
	"turnwise/internal/spec"
	"turnwise/sheets"
)

// circuitOptions holds everything `turnwise circuit` needs; no cobra types.
type circuitOptions struct {
	file       string
	stock      *stockOptions
	stockGiven bool
	from, to   frequencyFlag
	points     int
	log        bool
	logSet     bool
	bands      []string
	bandsFile  string
	at         []string
	lo, ifreq  frequencyFlag
	signal     frequencyFlag
	spiceAt    frequencyFlag
	json       bool
	plot       string
	touchstone string
	spice      string
	thermal    circuitThermalOptions
}

func newCircuitCmd(g *globalOptions) *cobra.Command {
	opts := &circuitOptions{stock: newStockOptions()}
	cmd := &cobra.Command{
		Use:   "circuit FILE",
		Short: "Compute what a network of coils, capacitors and resistors does",
		Long: strings.TrimSpace(`
Put the coils in the circuit they serve and compute what it does. FILE is a
circuit file (TOML; see the README): coils with predict's winding keys or a
job file's coil, capacitors, inductors and resistors by value, couplings and
one or two ports.

Each wound coil enters with its own model at every frequency (L and loss
with the skin and proximity effects, self-capacitance). Resonances are found
exactly: the natural frequencies of the lossless network, then refined with
the losses to the |Z| maximum (parallel) or minimum (series) at port 1, each
with its Q and impedance. The sweep runs from half the lowest to twice the
highest resonance unless --from and --to say otherwise.

--band names the bands the network serves: for each, the resonance that
serves it, and a warning for every other resonance inside or within 10 % of
it (a coil's own self-resonance, for example), naming the part. --at gives
the rejection below the passband peak; --lo and --if list the image and the
other mixer products up to third order with their rejection below the wanted
signal. One port: the response is |Z| at port 1. Two ports: |S21| and |S11|
and the -3 dB passband.

Caution: tank and trap coils in a transmitter carry high RF voltage; keep
to your licence and local regulations.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise circuit testdata/circuits/frontend.toml --band 80m=3.5-3.8MHz --band 2m=144-146MHz --plot frontend.svg
  turnwise circuit testdata/circuits/converter.toml --lo 116MHz --if 29MHz --json
  turnwise circuit testdata/circuits/trap.toml --at 7.1MHz --touchstone trap.s2p --spice trap.cir`),
		Args: func(_ *cobra.Command, args []string) error {
			if len(args) != 1 {
				return usageErrorf("give one circuit file, e.g. turnwise circuit testdata/circuits/frontend.toml")
			}
			return nil
		},
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.file = args[0]
			opts.logSet = cmd.Flags().Changed("log")
			opts.stockGiven = cmd.Flags().Changed("stock") || cmd.Flags().Changed("use")
			return runCircuit(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	fs := cmd.Flags()
	opts.stock.addFlags(fs)
	fs.Var(&opts.from, "from", "sweep start (default half the lowest resonance)")
	fs.Var(&opts.to, "to", "sweep end (default twice the highest resonance)")
	fs.IntVar(&opts.points, "points", 401, "sweep points")
	fs.BoolVar(&opts.log, "log", false, "space the sweep points logarithmically (default when the range spans more than a decade)")
	fs.StringArrayVar(&opts.bands, "band", nil, "a band the network serves, NAME=LOW-HIGH, e.g. 2m=144-146MHz (repeat for more)")
	fs.StringVar(&opts.bandsFile, "bands", "", "a file of bands, one per line: NAME LOW-HIGH")
	fs.StringArrayVar(&opts.at, "at", nil, "a frequency to report impedance, |S21| and rejection at (repeat for more)")
	fs.Var(&opts.lo, "lo", "mixer oscillator frequency, with --if: list the image and other mixer products")
	fs.Var(&opts.ifreq, "if", "mixer output (intermediate) frequency, with --lo")
	fs.Var(&opts.signal, "signal", "the wanted input with --lo/--if: LO+IF or |LO-IF| (default: whichever the network passes better)")
	fs.Var(&opts.spiceAt, "spice-at", "frequency the coils' equivalents are taken at in --spice (default the centre of the sweep, geometric)")
	fs.BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	fs.StringVar(&opts.plot, "plot", "", "draw the response to FILE.svg or FILE.png")
	fs.StringVar(&opts.touchstone, "touchstone", "", "write the response as Touchstone 1.1: FILE.s1p (one port) or FILE.s2p (two)")
	fs.StringVar(&opts.spice, "spice", "", "write a SPICE netlist of the circuit (ngspice) to FILE.cir")
	opts.thermal.addFlags(cmd)
	return cmd
}

// settings parses the flags into spec.CircuitSettings.
func (o *circuitOptions) settings() (spec.CircuitSettings, error) {
	set := spec.CircuitSettings{From: float64(o.from.v), To: float64(o.to.v), Points: o.points,
		LO: float64(o.lo.v), IF: float64(o.ifreq.v), Signal: float64(o.signal.v)}
	err := set.ApplyFlags(spec.CircuitFlags{
		From: o.from.given(), To: o.to.given(), Log: o.log, LogSet: o.logSet,
		Bands: o.bands, BandsFile: o.bandsFile, At: o.at, ParseAt: spec.FrequencyKind{}.Parse,
		LOSet: o.lo.set, IFSet: o.ifreq.set, SignalSet: o.signal.set,
		Plot: o.plot, Touchstone: o.touchstone, Spice: o.spice,
	})
	return set, err
}

func runCircuit(ctx context.Context, opts *circuitOptions, stdout, stderr io.Writer) error {
	set, err := opts.settings()
	if err != nil {
		return err
	}
	c, cat, m, err := spec.LoadCircuitModel(opts.file, opts.stock.path, opts.stock.use.v, opts.stockGiven)
	if err != nil {
		return err
	}
	if opts.touchstone != "" {
		if err := m.CheckTouchstoneName(opts.touchstone); err != nil {
			return err
		}
	}
	if len(set.Bands) == 0 {
		set.Bands = spec.FileBands(c)
	}
	r, err := spec.AnalyzeCircuit(m, set)
	if err != nil {
		return err
	}
	if err := addCircuitThermal(&opts.thermal, cat, m, r); err != nil {
		return err
	}
	// Files first, so an unwritable path fails before anything is printed.
	if opts.plot != "" {
		format := strings.TrimPrefix(strings.ToLower(filepath.Ext(opts.plot)), ".")
		if err := writeOutput(ctx, "--plot", opts.plot, circuitInputs(opts), stdout, func(w io.Writer) error {
			return sheets.PlotCircuit(w, r.SheetCircuit(), format, 160, 100)
		}); err != nil {
			return err
		}
	}
	if opts.touchstone != "" {
		if err := writeOutput(ctx, "--touchstone", opts.touchstone, circuitInputs(opts), stdout, func(w io.Writer) error {
			return writeCircuitTouchstone(w, m, r)
		}); err != nil {
			return err
		}
	}
	if opts.spice != "" {
		netlist, err := m.SpiceNetlist(r, opts.spiceAt.ptr())
		if err != nil {
			return err
		}
		if err := writeOutput(ctx, "--spice", opts.spice, circuitInputs(opts), stdout, netlist); err != nil {
			return err
		}
	}
	if opts.json {
		return report.WriteCircuitJSON(stdout, r)
	}
	return report.WriteCircuitTable(stdout, r)
}

// circuitInputs are the files a circuit run reads: an output must not be one
// of them.
func circuitInputs(opts *circuitOptions) []string {
	return []string{opts.file, opts.stock.path}
}

// writeCircuitTouchstone writes the sweep's S parameters as Touchstone 1.1.
func writeCircuitTouchstone(w io.Writer, m *spec.CircuitModel, r *spec.CircuitResult) error {
	d := touchstone.Data{Ports: r.Ports, Param: touchstone.S, Z0: m.Net.Ports[0].Z0}
	for _, resp := range r.Sweep {
		d.Points = append(d.Points, touchstone.Point{Frequency: resp.Frequency, M: resp.S})
	}
	if r.Ports == 2 && m.Net.Ports[1].Z0 != m.Net.Ports[0].Z0 {
		return usageErrorf("the two ports have different reference impedances; Touchstone 1.1 has one")
	}
	return touchstone.Write(w, d, []string{"turnwise circuit: " + r.TitleOrFile(), "computed response, not a measurement"})
}
