package main

// `turnwise span`: a tapped coil on a two-gang capacitor.
//
// Glue for other commands (the build sheet): spec.BuildSpan(geom, spec.SpanSettings)
// builds the span, or with ChooseTap the tap plan, from the same values the
// span flags carry once parsed; gangFromSettings turns the capacitor values
// into the two tuning.GangSection values. spanOptions.settings() shows how the
// flags map onto spec.SpanSettings.

import (
	"context"
	"errors"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"turnwise/coil"
	"turnwise/coil/tuning"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// spanOptions holds everything `turnwise span` needs; no cobra types.
type spanOptions struct {
	coil       coilOptions
	stock      *stockOptions
	tap        turnsFlag
	gang       string
	gangB      string
	law        string
	trimA      capacitanceFlag
	trimB      capacitanceFlag
	strayA     capacitanceFlag
	strayB     capacitanceFlag
	steps      int
	bands      []string
	bandsFile  string
	loadedQ    float64
	margin     percentFlag
	chooseTap  bool
	varyPitch  bool
	chart      bool
	units      *choiceFlag
	json       bool
	driftAt    string
	tempRange  tempRangeFlag
	gangTC     string
	pitch      *choiceFlag
	maxHarm    int
	chooseCoil bool
	minTurns   float64
	maxTurns   float64
	spread     percentFlag
}

func newSpanCmd(g *globalOptions) *cobra.Command {
	opts := &spanOptions{stock: newStockOptions(), units: newChoice("mm", "mm", "in"), pitch: newPitchFollows()}
	cmd := &cobra.Command{
		Use:   "span",
		Short: "Both tuning ranges of a tapped coil on a two-gang capacitor",
		Long: strings.TrimSpace(`
A wide-range tuner without band switching: one two-gang variable
capacitor, section A from the top of the coil to ground and section B
from a tap to ground, on one shaft. At every dial setting the circuit has
two resonances, a low range and a high range; span prints both across the
dial, whether they overlap, where your bands fall on the dial, and the
dial settings where a harmonic (2nd to --max-harmonic, default 5th) of
the low range lands inside the high range's passband: a receiver with a
harmonic-rich oscillator tuned there hears strong stations from the other
band. It also names every stretch of the dial where the high range stays
within 2 % of an integer multiple of the low range (the harmonic follows
it along the stretch), and warns when a band takes less than --bandspread
(default 3 %) of the dial.

The dial runs from 0 % (plates fully open: the top of both ranges) to
100 % (fully meshed). Both resonances come from the two-node circuit with
the sections' mutual inductance and the coil's self-capacitance (across
the whole coil), not from two separate tanks. The high range's passband
is f/Q with Q the loaded Q: half the coil model's Q unless --loaded-q.

--choose-tap tries every quarter-turn tap (and with --vary-pitch every
pitch from close-wound to three wire diameters) for one that covers every
band with --margin to spare, makes the ranges overlap by --margin and
keeps harmonics out of the passband where the low range is in a band.
When none does it prints the best compromise and exits with status 3.

--choose-coil chooses turns (--min-turns to --max-turns), pitch (close-wound
to three wire diameters) and tap together on the former and wire given.
When no coil does, it says what would: more turns, a capacitor of larger
maximum or smaller minimum, or a second winding with a band switch.

Caution: a tank driven by a transmitter carries high RF voltage at the
hot end and across the capacitor; use a capacitor rated for it and follow
local regulations and licensed practice.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise span --former "pvc 20mm" --wire 0.5mm --turns 40 --pitch 1mm --leads 20mm --tap 17 --gang 15-365pF --stray-a 5pF --stray-b 5pF --band 80m=3.5-3.8MHz --band 40m=7.0-7.2MHz --band 31m=9.4-9.9MHz
  turnwise span --former "pvc 20mm" --wire 0.5mm --turns 40 --pitch 1mm --leads 20mm --gang 15-365pF --bands testdata/span/hf-listening.txt --choose-tap --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			if !opts.chooseTap && !opts.chooseCoil && !opts.tap.set {
				return usageErrorf("give --tap TURNS (counted from the cold, grounded end, e.g. --tap 12.5), --choose-tap or --choose-coil")
			}
			if err := mutuallyExclusive(cmd, "tap", "choose-coil"); err != nil {
				return err
			}
			if err := mutuallyExclusive(cmd, "choose-tap", "choose-coil"); err != nil {
				return err
			}
			if (cmd.Flags().Changed("min-turns") || cmd.Flags().Changed("max-turns")) && !opts.chooseCoil {
				return usageErrorf("--min-turns and --max-turns bound --choose-coil; add it")
			}
			if err := mutuallyExclusive(cmd, "tap", "choose-tap"); err != nil {
				return err
			}
			if opts.varyPitch && !opts.chooseTap {
				return usageErrorf("--vary-pitch works with --choose-tap; add it or drop --vary-pitch")
			}
			return runSpan(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	fs := cmd.Flags()
	opts.coil.addFlags(fs)
	opts.stock.addFlags(fs)
	fs.Var(&opts.tap, "tap", "tap position in turns from the cold (grounded) end, quarter turns, e.g. 12.5")
	fs.StringVar(&opts.gang, "gang", "", "each gang section's capacitance MIN-MAX, e.g. 15-365pF (MIN = MAX is a fixed capacitor: 47-47pF)")
	fs.StringVar(&opts.gangB, "gang-b", "", "section B's MIN-MAX when it differs from section A's")
	fs.StringVar(&opts.law, "law", "slc", "capacitance law: slc (straight-line capacitance), slf (frequency), slw (wavelength) or a measured table file")
	fs.Var(&opts.trimA, "trim-a", "trimmer across section A (top of the coil), e.g. 5pF")
	fs.Var(&opts.trimB, "trim-b", "trimmer across section B (at the tap)")
	fs.Var(&opts.strayA, "stray-a", "wiring stray from the top of the coil to ground, e.g. 5pF (a few pF is typical)")
	fs.Var(&opts.strayB, "stray-b", "wiring stray from the tap to ground")
	fs.IntVar(&opts.steps, "steps", 11, "dial rows to print, from 0 % to 100 %")
	fs.StringArrayVar(&opts.bands, "band", nil, "a band to cover, LOW-HIGH or NAME=LOW-HIGH, e.g. 80m=3.5-3.8MHz (repeat for more)")
	fs.StringVar(&opts.bandsFile, "bands", "", "a file of bands, one per line: NAME LOW-HIGH")
	fs.Float64Var(&opts.loadedQ, "loaded-q", 0, "the circuit's loaded Q for the passband (default: half the coil model's Q)")
	fs.Var(&opts.margin, "margin", "how far inside a range each band must sit, and how much the ranges must overlap, percent (default 3)")
	fs.BoolVar(&opts.chooseTap, "choose-tap", false, "choose the tap for the bands instead of giving --tap")
	fs.BoolVar(&opts.varyPitch, "vary-pitch", false, "with --choose-tap, also choose the pitch (turns held)")
	fs.BoolVar(&opts.chooseCoil, "choose-coil", false, "choose turns, pitch and tap together for the bands (the --turns and --pitch given are only a start)")
	fs.Float64Var(&opts.minTurns, "min-turns", 0, "with --choose-coil, the fewest turns to try (default 3)")
	fs.Float64Var(&opts.maxTurns, "max-turns", 0, "with --choose-coil, the most turns to try (default 3 × --turns, at most 200)")
	fs.IntVar(&opts.maxHarm, "max-harmonic", tuning.DefaultMaxHarmonic, "highest harmonic of the low range checked against the high range, 2 to 20")
	fs.Var(&opts.spread, "bandspread", "warn when a band takes less than this share of the dial, percent (default 3)")
	fs.BoolVar(&opts.chart, "chart", false, "add a text chart of both ranges across the dial")
	fs.Var(opts.units, "units", "display lengths in mm or in")
	fs.BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	fs.StringVar(&opts.driftAt, "drift-at", "0,50,100", "dial settings (percent, comma-separated) at which to print both ranges' temperature drift, or none")
	addTempRangeFlag(cmd, &opts.tempRange)
	fs.StringVar(&opts.gangTC, "gang-tempco", "air", "the gang's temperature coefficient: air (air-variable, typical), a ceramic class (C0G, N750 …) or a number such as +100ppm/K")
	addPitchFollowsFlag(cmd, opts.pitch)
	return cmd
}

// settings parses the capacitor and band flags into spec.SpanSettings.
func (o *spanOptions) settings() (spec.SpanSettings, error) {
	s := spec.SpanSettings{
		Tap: o.tap.v, Law: o.law, TrimA: o.trimA.v, TrimB: o.trimB.v, StrayA: o.strayA.v, StrayB: o.strayB.v,
		Steps: o.steps, LoadedQ: o.loadedQ, ChooseTap: o.chooseTap, VaryPitch: o.varyPitch,
		Mounting:    o.coil.mounting.v,
		MaxHarmonic: o.maxHarm, ChooseCoil: o.chooseCoil, MinTurns: o.minTurns, MaxTurns: o.maxTurns,
	}
	err := s.ApplyFlags(spec.SpanFlags{
		Gang: o.gang, GangB: o.gangB, Bands: o.bands, BandsFile: o.bandsFile,
		Margin: o.margin.given(), MarginV: o.margin.v, Spread: o.spread.given(), SpreadV: o.spread.v,
	})
	return s, err
}

func runSpan(_ context.Context, opts *spanOptions, stdout, stderr io.Writer) error {
	cat, err := opts.stock.load()
	if err != nil {
		return err
	}
	cs, err := spec.Resolve(cat, opts.coil.winding())
	if err != nil {
		return err
	}
	set, err := opts.settings()
	if err != nil {
		return err
	}
	out, spanErr := spec.BuildSpan(cs.Geometry, set)
	if spanErr != nil && !errors.Is(spanErr, coil.ErrInfeasible) {
		return spec.AttachFlag(spanErr, cs.SupportKind.String(), cs.PitchSource)
	}
	if out.Plan == nil && spanErr != nil {
		return spanErr
	}
	if err := spec.AddSpanDrift(cat, cs, set, &out, opts.driftAt, opts.gangTC, opts.pitch.v, opts.tempRange.ptr()); err != nil {
		return err
	}
	if opts.json {
		if err := report.WriteSpanJSON(stdout, cs, set, out); err != nil {
			return err
		}
	} else {
		if err := report.WriteSpanTable(stdout, cs, set, out, newLengthFormatter(opts.units.v), opts.chart); err != nil {
			return err
		}
	}
	printWarnings(stderr, out.Span.Warnings)
	return spanErr
}
