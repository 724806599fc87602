package main

import (
	"context"
	"io"
	"strings"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"

	"turnwise/coil/design"
	"turnwise/coil/thermal"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// designOptions holds everything `turnwise design` needs; no cobra types.
type designOptions struct {
	inductance    designInductanceFlag
	capacitance   capacitanceFlag
	stray         capacitanceFlag
	freq          designFreqFlag
	band          designFreqFlag
	trimmer       string
	trimmerMargin percentFlag
	minQ          float64
	tapRatio      ratioFlag
	tapImpedance  resistanceFlag
	tankImpedance resistanceFlag
	tankQ         float64
	loadedQ       float64
	tolerance     percentFlag
	leads         lengthFlag
	temp          temperatureFlag
	support       *choiceFlag
	mandrel       string
	former        string
	wires         []string
	insulation    string
	conductor     string
	springback    percentFlag
	maxLength     lengthFlag
	maxDiameter   lengthFlag
	maxWireLength lengthFlag
	minSRFRatio   float64
	minWire       wireSizeFlag
	maxWire       wireSizeFlag
	trimMargin    percentFlag
	prefer        *choiceFlag
	top           int
	freeDiameter  bool
	stock         *stockOptions
	units         *choiceFlag
	json          bool
	pitch         *choiceFlag // what the pitch follows with temperature on a former
}

func newDesignOptions() *designOptions {
	return &designOptions{
		support: newChoice("any", "any", "mandrel", "former"),
		prefer:  newChoice("balanced", "balanced", "q", "small", "easy"),
		units:   newChoice("mm", "mm", "in"),
		stock:   newStockOptions(),
		top:     design.DefaultTop,
		pitch:   newPitchFollows(),
	}
}

func (o *designOptions) addFlags(fs *pflag.FlagSet) {
	fs.Var(&o.inductance, "inductance", "the inductance wanted at the terminals, leads included, at --freq when given, e.g. 4.7uH")
	fs.Var(&o.capacitance, "cap", "resonate with this capacitance at --freq instead, e.g. 22pF (the coil's own self-capacitance is accounted for)")
	fs.Var(&o.stray, "stray", "wiring and device capacitance across the coil, added to --cap, e.g. 3pF")
	fs.Var(&o.freq, "freq", "operating frequency for L at f, Q and the SRF check; with --cap, the resonance, e.g. 145MHz (a band LOW-HIGH is --band)")
	fs.Var(&o.band, "band", "a band the coil must tune with --cap and --trimmer, LOW-HIGH, e.g. 144-146MHz")
	fs.StringVar(&o.trimmer, "trimmer", "", "trimmer in parallel with --cap, MIN-MAX, e.g. 2-10pF")
	fs.Var(&o.trimmerMargin, "trimmer-margin", "share of the trimmer's swing kept free at each band edge, percent (default 10%)")
	fs.Float64Var(&o.minQ, "min-q", 0, "least unloaded Q at the operating frequency (the band centre for --band), e.g. 150")
	fs.Var(&o.tapRatio, "tap-ratio", "also tap each coil for this impedance ratio, e.g. 1:50")
	fs.Var(&o.tapImpedance, "tap-impedance", "also tap each coil for this resistance at the tap, e.g. 50ohm (with --loaded-q, --tank-q or --tank-impedance)")
	fs.Var(&o.tankImpedance, "tank-impedance", "the tank's parallel resistance at resonance, e.g. 20kohm (default: from the coil's Q)")
	fs.Float64Var(&o.tankQ, "tank-q", 0, "the tank's unloaded Q (default: the coil model's Q)")
	fs.Float64Var(&o.loadedQ, "loaded-q", 0, "the loaded Q wanted with the tap load (default: matched, half the unloaded Q)")
	fs.Var(&o.tolerance, "tolerance", "how close the predicted value must be, percent (default 2%)")
	fs.Var(&o.leads, "leads", "length of each of the two leads to the solder joint, e.g. 5mm (default 10mm, with a warning)")
	fs.Var(&o.temp, "temp", "conductor temperature (default 20C)")
	fs.Var(o.support, "support", "any, mandrel (self-supporting: slid off after winding) or former (the coil stays on it)")
	fs.StringVar(&o.mandrel, "mandrel", "", "use only this mandrel: a stock name or a diameter, e.g. 6mm")
	fs.StringVar(&o.former, "former", "", "use only this former: a stock name or an outside diameter, e.g. 20mm")
	fs.StringArrayVar(&o.wires, "wire", nil, "use only this wire (repeat for several): a gauge, a bare diameter or a stock name")
	fs.StringVar(&o.insulation, "insulation", "", "for --wire: none, grade1, grade2 or the overall diameter")
	fs.StringVar(&o.conductor, "conductor", "", "for --wire: copper, silver-plated or tinned")
	fs.Var(&o.springback, "springback", "growth of the bore off every mandrel, percent (default: your saved calibrations, else 0)")
	fs.Var(&o.maxLength, "max-length", "longest outside winding length you accept, e.g. 15mm")
	fs.Var(&o.maxDiameter, "max-diameter", "largest outside diameter over the wire, e.g. 12mm")
	fs.Var(&o.maxWireLength, "max-wire-length", "most wire you can spare, leads and stripping included, e.g. 300mm")
	fs.Float64Var(&o.minSRFRatio, "min-srf-ratio", design.DefaultSRFRatio, "least self-resonance as a multiple of the operating frequency (3 is common practice)")
	fs.Var(&o.minWire, "min-wire", "thinnest wire to consider: a bare diameter or a gauge, e.g. 0.5mm or 24awg")
	fs.Var(&o.maxWire, "max-wire", "thickest wire to consider, e.g. 2mm or 12awg")
	fs.Var(&o.trimMargin, "trim-margin", "how far inside the squeeze/spread window the target must sit, percent (default 5%)")
	fs.Var(o.prefer, "prefer", "shift the ranking: balanced, q (highest Q), small or easy (easiest to wind)")
	fs.IntVar(&o.top, "top", design.DefaultTop, "how many candidates to list")
	fs.BoolVar(&o.freeDiameter, "free-diameter", false, "also consider a support of any diameter (rounded to 0.1 mm) instead of only the stock's")
	o.stock.addFlags(fs)
	fs.Var(o.units, "units", "display lengths in mm or in")
	fs.BoolVar(&o.json, "json", false, "print JSON (SI units) instead of a table")
	fs.Var(o.pitch, "pitch-follows", pitchFollowsUsage)
}

func newDesignCmd(g *globalOptions) *cobra.Command {
	opts := newDesignOptions()
	cmd := &cobra.Command{
		Use:   "design",
		Short: "Find coils you can wind from your stock for a target inductance or resonance",
		Long: strings.TrimSpace(`
Give what the circuit needs — an inductance (--inductance), or a capacitance
it must resonate with (--cap with --freq) — and turnwise searches every
mandrel, former and wire in the stock for coils that hit it, then lists the
best few, each with one line of why.

Every candidate can be trimmed onto the target after you measure it: the
target sits inside its squeeze/spread window (close-wound down to a pitch of
three wire diameters) with a margin (--trim-margin, default 5 %). For a
resonance target the coil's own self-capacitance and the leads are part of
the calculation: what is matched is the effective inductance at --freq.

Ranking: coils that meet the target and every limit, by Q at the operating
frequency (with diminishing returns above about 250), self-resonance margin,
size, ease of winding (whole turns, a pitch of two or three wire diameters,
a length of 0.5 to 2 diameters) and wire used; --prefer shifts the weights.
The Pareto list shows, for each size, the highest Q the stock reaches
(within about 15 %), so nobody has to trust the weights.

A band (--band 144-146MHz, or --freq 144-146MHz) is tuned by --cap (fixed)
and --trimmer MIN-MAX in parallel, plus --stray: every candidate's
effective inductance, taken at each band edge, lets the trimmer tune both
edges with --trimmer-margin (default 10 %) of its swing left at each end;
the trimmer settings at the edges are printed. --min-q sets a floor on Q
(at the band centre). --inductance MIN-MAX asks for a window instead.

Tapped designs: --tap-ratio R, or --tap-impedance 50ohm with the tank's
--tank-q or --tank-impedance (default: the coil's own Q) and the
--loaded-q wanted (default: matched, half the unloaded Q). A resistance R_s
at a tap of voltage ratio n loads the tank as R_s/n² in parallel (Terman
1943): Q_L = (R_p ∥ R_s/n²)/X. The nearest quarter-turn taps are printed;
when none is within ±10 % of the impedance ratio, a link winding over the
cold end (coupling from Maxwell's formula for coaxial turns) and a
capacitive divider are given instead.

Self-supporting coils (--support mandrel) use only wire of at least 0.6 mm
and 1/15 of the mandrel diameter, so that they keep their shape; any coil
needs a support at least twice the wire diameter; hand winding takes wire
from 0.2 mm to 4.2 mm (common practice).
` + exitStatusHelp),
		Example: exampleText(`
  turnwise design --freq 145MHz --cap 22pF --leads 5mm --max-length 15mm
  turnwise design --inductance 4.7uH --freq 7MHz --leads 15mm --support former --json
  turnwise design --band 144-146MHz --cap 15pF --trimmer 2-10pF --stray 2pF --min-q 150 --leads 5mm
  turnwise design --band 144-146MHz --cap 15pF --trimmer 2-10pF --leads 5mm --tap-impedance 50ohm`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			if err := mutuallyExclusive(cmd, "inductance", "cap"); err != nil {
				return err
			}
			if err := mutuallyExclusive(cmd, "inductance", "band"); err != nil {
				return err
			}
			if err := mutuallyExclusive(cmd, "mandrel", "former"); err != nil {
				return err
			}
			return runDesign(cmd.Context(), opts, cmd.Flags().Changed("min-srf-ratio"), cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	opts.addFlags(cmd.Flags())
	return cmd
}

// searchOptions turns the flags into the glue's options.
func (o *designOptions) searchOptions(srfGiven bool) (*spec.SearchOptions, []string, error) {
	so := &spec.SearchOptions{
		Inductance:    o.inductance.v.Min,
		InductanceMax: o.inductance.v.Max,
		MinQ:          o.minQ,
		TapRatio:      o.tapRatio.v,
		TapSource:     o.tapImpedance.v,
		TankImpedance: o.tankImpedance.v,
		TankQ:         o.tankQ,
		LoadedQ:       o.loadedQ,
		TrimmerMargin: o.trimmerMargin.v,
		Capacitance:   o.capacitance.v,
		Stray:         o.stray.v,
		Freq:          o.freq.v.F,
		Tolerance:     o.tolerance.v,
		Leads:         o.leads.v,
		Temp:          o.temp.v,
		Support:       o.support.v,
		Mandrel:       o.mandrel,
		Former:        o.former,
		Wires:         o.wires,
		Insulation:    o.insulation,
		Conductor:     o.conductor,
		MaxLength:     o.maxLength.v,
		MaxDiameter:   o.maxDiameter.v,
		MaxWireLength: o.maxWireLength.v,
		MinWire:       o.minWire.v,
		MaxWire:       o.maxWire.v,
		TrimMargin:    o.trimMargin.v,
		Prefer:        o.prefer.v,
		Top:           o.top,
		FreeDiameter:  o.freeDiameter,
	}
	so.PitchFollows, _ = thermal.ParsePitchFollows(o.pitch.v)
	if o.springback.set {
		v := o.springback.v
		so.Springback = &v
	}
	notes, err := so.ApplyFlags(spec.SearchFlags{
		MaxLength: o.maxLength.given(), MaxDiameter: o.maxDiameter.given(), MaxWireLength: o.maxWireLength.given(),
		Tolerance: o.tolerance.given(), TrimMargin: o.trimMargin.given(), TrimmerMargin: o.trimmerMargin.given(),
		TapRatio: o.tapRatio.given(), TapImpedance: o.tapImpedance.given(), TankImpedance: o.tankImpedance.given(),
		Leads: o.leads.given(), MinSRFRatio: o.minSRFRatio, SRFGiven: srfGiven, Trimmer: o.trimmer,
		Freq: bandGiven(&o.freq), Band: bandGiven(&o.band),
	})
	return so, notes, err
}

func runDesign(_ context.Context, opts *designOptions, srfGiven bool, stdout, stderr io.Writer) error {
	so, notes, err := opts.searchOptions(srfGiven)
	if err != nil {
		return err
	}
	cat, err := opts.stock.load()
	if err != nil {
		return err
	}
	res, err := spec.Search(cat, so)
	if err != nil {
		return err
	}
	warnings := append(notes, res.Warnings...)
	if opts.json {
		if err := report.WriteDesignJSON(stdout, cat, so, res, warnings); err != nil {
			return err
		}
	} else if err := report.WriteDesignTable(stdout, cat, so, res, newLengthFormatter(opts.units.v)); err != nil {
		return err
	}
	printWarnings(stderr, warnings)
	return nil
}

func bandGiven(f *designFreqFlag) spec.BandGiven {
	return spec.BandGiven{Given: f.given(), IsBand: f.v.IsBand, Lo: f.v.Lo, Hi: f.v.Hi}
}
