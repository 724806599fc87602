package main

// `turnwise match CIRCUIT`: which loads a coupler brings to its port's
// impedance, with which capacitor settings, at what loss and stress.

import (
	"context"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"turnwise/coil/match"
	"turnwise/internal/report"
	"turnwise/internal/spec"
	"turnwise/internal/sweepfile"
)

// matchOptions holds everything `turnwise match` needs; no cobra types.
type matchOptions struct {
	circuit   string
	stock     *stockOptions
	stockSet  bool
	freqs     []string
	bands     []string
	bandsFile string
	loadR     string
	loadX     string
	rSteps    int
	xSteps    int
	swr       float64
	power     powerFlag
	chooseTap bool
	tapCoil   string
	keep      int
	json      bool
	plot      string
}

func newMatchCmd(g *globalOptions) *cobra.Command {
	opts := &matchOptions{stock: newStockOptions()}
	cmd := &cobra.Command{
		Use:   "match CIRCUIT",
		Short: "Which loads a coupler can match, with its settings, loss and part stress",
		Long: strings.TrimSpace(`
match reads a circuit file describing a coupler: the capacitors you turn
carry a range (range = "10pF-250pF"), the node the antenna connects to is
[load] node = "...", and the transmitter is port 1. For each frequency and
each load R + jX on a grid over --load-r (logarithmic steps) by --load-x
(even steps) it searches the capacitor settings for the least reflection
at the port, and calls a load matched when the SWR is at most --swr. Where
several settings match (an L network's two branches, a tapped tank's low-
and high-Q settings) it reports the one with least loss.

The search: a grid over the dials (logarithmic in capacitance), then a
bounded Levenberg–Marquardt from the grid's best minima and a Nelder–Mead
second look at near misses. Every match it reports was solved again by
the circuit solver at the settings it prints; a load it cannot match is
reported unmatched with the best SWR found, never forced. It does not
prove that no setting exists for an unmatched load: a match region
narrower than the dial grid and outside every started basin can be
missed.

For each matched load it gives the efficiency (power into the load over
power into the port) and each lossy part's share: coils from their AC
resistance at the frequency, capacitors from their q or esr. With --power
it gives the peak and RMS voltage across each capacitor and each coil
section and the RMS current in each coil at that power (a modulated
signal's peak envelope power gives the voltages at the envelope's peak),
the worst case per part over the map, compares capacitors with their
rating = and coils with a stated heating rule, and warns where exceeded.

--choose-tap tries every quarter-turn tap of the tapped coil and ranks the
taps by matched share over the frequencies, then maps the best one.
--plot FILE.svg or FILE.png draws the matched region per frequency.

Caution: at transmit power the hot end of the coil and the capacitors
carry high RF voltage; keep covers on while transmitting and follow local
regulations and licensed practice. The cautions are printed with --power.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise match testdata/circuits/coupler.toml --freq 3.6MHz --freq 7.1MHz --power 100W
  turnwise match testdata/circuits/coupler.toml --band 40m=7.0-7.2MHz --load-r 10-500ohm --load-x -300-300ohm --json
  turnwise match testdata/circuits/coupler.toml --freq 14.2MHz --choose-tap --plot map.png`),
		Args: func(cmd *cobra.Command, args []string) error {
			if len(args) != 1 {
				return usageErrorf("give one circuit file, e.g. turnwise match testdata/circuits/coupler.toml --freq 7.1MHz")
			}
			return nil
		},
		RunE: func(cmd *cobra.Command, args []string) error {
			opts.circuit = args[0]
			opts.stockSet = cmd.Flags().Changed("stock") || cmd.Flags().Changed("use")
			return runMatch(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	fs := cmd.Flags()
	opts.stock.addFlags(fs)
	fs.StringArrayVar(&opts.freqs, "freq", nil, "a frequency to map, e.g. 7.1MHz (repeat for more)")
	fs.StringArrayVar(&opts.bands, "band", nil, "a band to map at its centre, LOW-HIGH or NAME=LOW-HIGH, e.g. 40m=7.0-7.2MHz (repeat for more)")
	fs.StringVar(&opts.bandsFile, "bands", "", "a file of bands, one per line: NAME LOW-HIGH (each mapped at its centre)")
	fs.StringVar(&opts.loadR, "load-r", "5-2000ohm", "load resistances MIN-MAX, stepped logarithmically")
	fs.StringVar(&opts.loadX, "load-x", "-1000-1000ohm", "load reactances MIN-MAX, stepped evenly")
	fs.IntVar(&opts.rSteps, "r-steps", 9, "resistance steps on the grid")
	fs.IntVar(&opts.xSteps, "x-steps", 9, "reactance steps on the grid")
	fs.Float64Var(&opts.swr, "swr", match.DefaultSWR, "SWR at the port a load must reach to count as matched")
	fs.Var(&opts.power, "power", "power into the port, e.g. 100W: adds part stress, ratings, heating and cautions")
	fs.BoolVar(&opts.chooseTap, "choose-tap", false, "choose the tap (quarter turns) that matches the most loads, then map it")
	fs.StringVar(&opts.tapCoil, "tap-coil", "", "with --choose-tap, the tapped coil to move when the circuit has several")
	fs.IntVar(&opts.keep, "taps", 5, "with --choose-tap, how many of the best taps to list")
	fs.BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	fs.StringVar(&opts.plot, "plot", "", "also draw the matched region per frequency to FILE.svg or FILE.png")
	return cmd
}

// request is the parsed command line: the map options and a label per
// frequency.
func (o *matchOptions) request() (match.Options, []string, error) {
	return spec.MatchOptions(spec.MatchFlags{
		Freqs: o.freqs, Bands: o.bands, BandsFile: o.bandsFile, LoadR: o.loadR, LoadX: o.loadX,
		RSteps: o.rSteps, XSteps: o.xSteps, SWR: o.swr, Power: o.power.v, PowerSet: o.power.set, PowerRaw: o.power.raw,
	})
}

func runMatch(ctx context.Context, opts *matchOptions, stdout, stderr io.Writer) error {
	mo, labels, err := opts.request()
	if err != nil {
		return err
	}
	format := ""
	if opts.plot != "" {
		if format, err = sweepfile.PlotFormat(opts.plot); err != nil {
			return usageErrorf("--plot %s: name a .svg or .png file", opts.plot)
		}
	}
	cp, err := spec.LoadCoupler(opts.circuit, opts.stock.path, opts.stock.use.v, opts.stockSet)
	if err != nil {
		return err
	}
	req := report.MatchRequest{Circuit: opts.circuit, Title: cp.File.Title, Labels: labels}
	if opts.chooseTap {
		name, err := spec.TappedCoil(&cp.Setup.Network, opts.tapCoil)
		if err != nil {
			return err
		}
		taps, err := match.ChooseTap(ctx, cp.Setup, mo, name, opts.keep)
		if err != nil {
			return spec.MatchError(err, opts.circuit)
		}
		req.TapCoil, req.Taps = name, taps
		cp.SetTap(name, taps[0].TapTurns) // map the best tap
	}
	res, err := match.Map(ctx, cp.Setup, mo)
	if err != nil {
		return spec.MatchError(err, opts.circuit)
	}
	if format != "" {
		err := writeOutput(ctx, "--plot", opts.plot, []string{opts.circuit, opts.stock.path}, stdout, func(w io.Writer) error {
			return report.WriteMatchPlot(w, format, req, res)
		})
		if err != nil {
			return err
		}
	}
	if opts.json {
		return report.WriteMatchJSON(stdout, req, res)
	}
	if err := report.WriteMatchTable(stdout, req, res); err != nil {
		return err
	}
	printWarnings(stderr, res.Warnings)
	return nil
}
