package main

import (
	"context"
	"io"
	"strings"

	"github.com/spf13/cobra"
	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/sweep"
	"turnwise/internal/report"
	"turnwise/internal/spec"
	"turnwise/internal/sweepfile"
)

// sweepOptions are the flags that describe a measured sweep; fit and
// trim --sweep share them.
type sweepOptions struct {
	fixture     string
	open, short string
	from, to    frequencyFlag
	lead        bool
}

func (o *sweepOptions) addFlags(cmd *cobra.Command) {
	fs := cmd.Flags()
	fs.StringVar(&o.fixture, "fixture", "", "how the coil was connected: reflection (one port, coil to ground), series (two ports, coil between them) or shunt (two ports, coil from the line to ground) (default: reflection for .s1p, series for .s2p)")
	fs.StringVar(&o.open, "open", "", "the jig measured open (same fixture), for open/short correction; needs --short")
	fs.StringVar(&o.short, "short", "", "the jig measured with a short where the coil goes; needs --open")
	fs.Var(&o.from, "fit-from", "fit the points from this frequency up (default: the whole sweep)")
	fs.Var(&o.to, "fit-to", "fit the points up to this frequency (default: below 0.8 of the self-resonance)")
	fs.BoolVar(&o.lead, "fit-lead", false, "also fit a series lead inductance of the fixture (a jig without open/short correction)")
}

// load reads and fits the sweep in file at f (0: the lowest frequency fitted).
func (o *sweepOptions) load(file string, f float64) (sweepfile.Loaded, sweep.Fixture, *sweep.Fit, error) {
	ld, fx, fit, err := sweepfile.Fit(sweepfile.Request{File: file, Fixture: o.fixture, Open: o.open, Short: o.short,
		FMin: float64(o.from.v), FMax: float64(o.to.v), Frequency: f, Lead: o.lead})
	if err != nil {
		return ld, fx, nil, spec.SweepFlagError(err)
	}
	return ld, fx, fit, nil
}

type fitOptions struct {
	file    string
	sweep   sweepOptions
	freq    frequencyFlag
	coil    coilOptions
	stock   *stockOptions
	compare bool
	plot    string
	json    bool
}

func newFitCmd(g *globalOptions) *cobra.Command {
	opts := &fitOptions{stock: newStockOptions()}
	cmd := &cobra.Command{
		Use:   "fit FILE.s1p|FILE.s2p",
		Short: "Fit a coil's equivalent model to a network analyser's sweep",
		Long: strings.TrimSpace(`
Read a Touchstone sweep (version 1.1 or 2.0, one or two ports) of a wound
coil, turn it into the coil's impedance for the fixture it was measured in,
and fit the equivalent model: L with a loss R_dc + k·√f in series, the
self-capacitance across them. It prints L at --freq (apparent, with the
self-capacitance) and at low frequency, the self-capacitance, the
self-resonance (read from the data where the sweep crosses it), Q at
--freq, the loss, the fit's residual and each figure's uncertainty, and
warns when the sweep is too noisy or too narrow to say much.

Points up to 0.8 of the self-resonance are fitted unless --fit-from and
--fit-to say otherwise. --open and --short remove a test jig measured alone
(open/short correction). --compare with the coil flags of predict shows the
model for the coil as wound beside the measurement. --plot draws |Z| and Q
against frequency with the fit (and the model with --compare) as .svg or .png.

Caution: an analyser's port is delicate; never sweep a coil that is still
in a powered circuit.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise fit testdata/sweep/l1-as-wound.s1p --open testdata/sweep/jig-open.s1p --short testdata/sweep/jig-short.s1p
  turnwise fit coil.s2p --fixture series --freq 137.5MHz --compare --mandrel 6mm --wire 1mm --turns 5 --length 10mm --leads 4mm --plot fit.svg`),
		Args: func(cmd *cobra.Command, args []string) error {
			if len(args) != 1 {
				return usageErrorf("fit takes one sweep file (.s1p or .s2p), got %d arguments", len(args))
			}
			return nil
		},
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.file = args[0]
			if opts.compare && opts.coil.firstSet() == "" {
				return usageErrorf("--compare needs the coil as wound: give the coil flags of predict (--mandrel or --former, --wire, --turns, ...)")
			}
			if !opts.compare && opts.coil.firstSet() != "" {
				return usageErrorf("--%s describes a coil: add --compare to set it beside the measurement", opts.coil.firstSet())
			}
			if opts.plot != "" {
				if _, err := sweepfile.PlotFormat(opts.plot); err != nil {
					return &flagError{Flag: "plot", Err: err}
				}
			}
			return runFit(cmd.Context(), opts, g.stdout, g.stderr)
		},
	}
	fs := cmd.Flags()
	opts.sweep.addFlags(cmd)
	fs.Var(&opts.freq, "freq", "where L and Q are given (default: the lowest frequency fitted)")
	fs.BoolVar(&opts.compare, "compare", false, "set the model of the coil described by the coil flags beside the measurement")
	opts.coil.addFlags(fs)
	opts.stock.addFlags(fs)
	fs.StringVar(&opts.plot, "plot", "", "draw |Z| and Q against frequency, measured and fitted, to FILE.svg or FILE.png")
	fs.BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	return cmd
}

func runFit(ctx context.Context, opts *fitOptions, stdout, _ io.Writer) error {
	ld, fx, fit, err := opts.sweep.load(opts.file, float64(opts.freq.v))
	if err != nil {
		return err
	}
	var model *coil.Prediction
	var asWound *coil.Geometry
	if opts.compare {
		ff := frequencyFlag{v: unit.Frequency(fit.Frequency), set: true}
		s, p, err := predictCoil(&opts.coil, opts.stock, ff)
		if err != nil {
			return err
		}
		model, asWound = &p, &s.Geometry
	}
	rec := report.NewFitRecord(opts.file, fx, ld.Corrected, opts.sweep.lead, fit, model)
	if opts.plot != "" {
		format, _ := sweepfile.PlotFormat(opts.plot)
		if err := writeOutput(ctx, "--plot", opts.plot, []string{opts.file, opts.sweep.open, opts.sweep.short, opts.stock.path}, stdout, func(w io.Writer) error {
			return sweepfile.PlotFit(w, format, opts.file, ld, fit, asWound)
		}); err != nil {
			return err
		}
	}
	if opts.json {
		return report.WriteFitJSON(stdout, rec)
	}
	return report.WriteFitText(stdout, rec)
}
