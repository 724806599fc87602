package main

// `turnwise match CIRCUIT`: which loads a coupler brings to its port's
// impedance, with which capacitor settings, at what loss and stress.

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"sort"
	"strings"

	"github.com/spf13/cobra"

	"turnwise/coil"
	"turnwise/coil/circuit"
	"turnwise/coil/match"
	"turnwise/forms"
	"turnwise/internal/quantity"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// powerFlag is a power with a unit, e.g. 100W.
type powerFlag struct {
	raw string
	v   float64
	set bool
}

func (f *powerFlag) String() string { return f.raw }
func (f *powerFlag) Type() string   { return "power" }
func (f *powerFlag) Set(s string) error {
	v, err := quantity.ParsePower(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

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

// matchRequest is a parsed command line: the map options and a label per
// frequency.
func (o *matchOptions) request() (match.Options, []string, error) {
	var mo match.Options
	var labels []string
	for _, s := range o.freqs {
		f, err := quantity.ParseFrequency(s)
		if err != nil {
			return mo, nil, &flagError{Flag: "freq", Err: err}
		}
		mo.Frequencies = append(mo.Frequencies, float64(f))
		labels = append(labels, "")
	}
	var bands []forms.Band
	for _, s := range o.bands {
		b, err := forms.ParseBand(s)
		if err != nil {
			return mo, nil, &flagError{Flag: "band", Err: err}
		}
		bands = append(bands, b)
	}
	if o.bandsFile != "" {
		f, err := os.Open(o.bandsFile)
		if err != nil {
			if errors.Is(err, os.ErrNotExist) {
				return mo, nil, usageErrorf("--bands: %q does not exist; check the path", o.bandsFile)
			}
			return mo, nil, fmt.Errorf("--bands: %w", err)
		}
		defer f.Close()
		list, err := forms.LoadBands(f, o.bandsFile)
		if err != nil {
			return mo, nil, err
		}
		bands = append(bands, list...)
	}
	for _, b := range bands {
		mo.Frequencies = append(mo.Frequencies, float64(b.Low+b.High)/2)
		labels = append(labels, b.Name)
	}
	if len(mo.Frequencies) == 0 {
		return mo, nil, usageErrorf("give at least one --freq (e.g. --freq 7.1MHz), --band or --bands")
	}
	// Lowest frequency first, each label with its frequency.
	order := make([]int, len(mo.Frequencies))
	for i := range order {
		order[i] = i
	}
	sort.SliceStable(order, func(a, b int) bool { return mo.Frequencies[order[a]] < mo.Frequencies[order[b]] })
	fs, ls := make([]float64, len(order)), make([]string, len(order))
	for k, i := range order {
		fs[k], ls[k] = mo.Frequencies[i], labels[i]
	}
	mo.Frequencies, labels = fs, ls
	rLo, rHi, err := spec.ParseOhmRange(o.loadR)
	if err != nil {
		return mo, nil, &flagError{Flag: "load-r", Err: err}
	}
	xLo, xHi, err := spec.ParseOhmRange(o.loadX)
	if err != nil {
		return mo, nil, &flagError{Flag: "load-x", Err: err}
	}
	mo.Grid = match.Grid{RMin: rLo, RMax: rHi, NR: o.rSteps, XMin: xLo, XMax: xHi, NX: o.xSteps}
	if o.rSteps < 1 || o.rSteps > 200 {
		return mo, nil, usageErrorf("--r-steps %d: give 1 to 200", o.rSteps)
	}
	if o.xSteps < 1 || o.xSteps > 200 {
		return mo, nil, usageErrorf("--x-steps %d: give 1 to 200", o.xSteps)
	}
	mo.SWR = o.swr
	if o.power.set && !(o.power.v >= 0) {
		return mo, nil, usageErrorf("--power %s: the power must be zero or positive, e.g. 100W", o.power.raw)
	}
	mo.Power = o.power.v
	return mo, labels, nil
}

// coupler is a circuit file made ready to map.
type coupler struct {
	file  *forms.Circuit
	setup match.Setup
}

// loadCoupler reads a circuit file and builds its coupler; stock and
// flagsGiven choose the catalogs its coils draw on.
func loadCoupler(path string, so *stockOptions, flagsGiven bool) (*coupler, error) {
	c, err := spec.LoadCircuitFile(path)
	if err != nil {
		return nil, err
	}
	cat, err := so.load()
	if err != nil {
		return nil, err
	}
	m, err := spec.BuildCircuit(c, cat, so.path, so.use.v, flagsGiven)
	if err != nil {
		return nil, err
	}
	s, err := spec.MatchSetup(c, m.Net)
	if err != nil {
		return nil, err
	}
	return &coupler{file: c, setup: s}, nil
}

// matchFlags are the match.InputError keys that are this command's flags;
// the others (range, load.node, rating, port) are circuit file keys.
var matchFlags = map[string]bool{"freq": true, "load-r": true, "load-x": true, "swr": true, "power": true, "choose-tap": true}

// matchError names the flag or the circuit file key of a refusal.
func matchError(err error, file string) error {
	var ie *coil.InputError
	if !errors.As(err, &ie) {
		return err
	}
	if matchFlags[ie.Param] {
		return &flagError{Flag: ie.Param, Err: err}
	}
	return &forms.ParseError{Kind: "circuit", File: file, Field: ie.Param, Err: errors.New(ie.Reason)}
}

// tappedCoil is the coil --choose-tap moves: --tap-coil, or the only
// tapped coil of the circuit.
func tappedCoil(net *circuit.Network, name string) (string, error) {
	var tapped []string
	for _, p := range net.Parts {
		if p.Kind == circuit.Wound && p.TapNode >= 0 {
			tapped = append(tapped, p.Name)
		}
	}
	switch {
	case name != "":
		return name, nil
	case len(tapped) == 1:
		return tapped[0], nil
	case len(tapped) == 0:
		return "", usageErrorf("--choose-tap: the circuit has no tapped coil; give a [[coil]] tap = and tap_node =")
	}
	return "", usageErrorf("--choose-tap: the circuit has %d tapped coils (%s); name one with --tap-coil", len(tapped), strings.Join(tapped, ", "))
}

func runMatch(ctx context.Context, opts *matchOptions, stdout, stderr io.Writer) error {
	mo, labels, err := opts.request()
	if err != nil {
		return err
	}
	format := ""
	if opts.plot != "" {
		switch strings.ToLower(filepath.Ext(opts.plot)) {
		case ".svg":
			format = "svg"
		case ".png":
			format = "png"
		default:
			return usageErrorf("--plot %s: name a .svg or .png file", opts.plot)
		}
	}
	cp, err := loadCoupler(opts.circuit, opts.stock, opts.stockSet)
	if err != nil {
		return err
	}
	req := report.MatchRequest{Circuit: opts.circuit, Title: cp.file.Title, Labels: labels}
	if opts.chooseTap {
		name, err := tappedCoil(&cp.setup.Network, opts.tapCoil)
		if err != nil {
			return err
		}
		taps, err := match.ChooseTap(ctx, cp.setup, mo, name, opts.keep)
		if err != nil {
			return matchError(err, opts.circuit)
		}
		req.TapCoil, req.Taps = name, taps
		// Map the best tap.
		parts := append([]circuit.Part(nil), cp.setup.Network.Parts...)
		for i := range parts {
			if parts[i].Name == name {
				parts[i].TapTurns = taps[0].TapTurns
			}
		}
		cp.setup.Network.Parts = parts
	}
	res, err := match.Map(ctx, cp.setup, mo)
	if err != nil {
		return matchError(err, opts.circuit)
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
	for _, w := range res.Warnings {
		fmt.Fprintf(stderr, "warning: %s\n", w)
	}
	return nil
}
