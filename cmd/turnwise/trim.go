package main

import (
	"context"
	"io"
	"os"
	"strings"
	"turnwise/internal/report"
	"turnwise/internal/spec"

	"github.com/spf13/cobra"

	"turnwise/coil/trim"
)

// trimOptions holds everything `turnwise trim` needs; no cobra types.
type trimOptions struct {
	coil     coilOptions
	stock    *stockOptions
	job      string
	coilName string
	freq     frequencyFlag
	target   targetFlag

	// The measurement.
	measuredL    inductanceFlag
	meterFreq    frequencyFlag
	fixtureL     inductanceFlag
	fixtureLeads lengthFlag
	meterTol     percentFlag
	measuredF    frequencyFlag
	withCap      capacitanceFlag
	circuitCap   capacitanceFlag
	stray        capacitanceFlag
	resonances   resonanceListFlag
	capTol       capTolFlag
	freqTol      percentFlag
	tolerance    percentFlag

	// A tapped coil.
	tap            turnsFlag
	tapRatio       ratioFlag
	measuredBottom inductanceFlag
	measuredTop    inductanceFlag

	// A measured sweep (turnwise fit's flags).
	sweepFile string
	sweep     sweepOptions

	save  bool
	units *choiceFlag
	json  bool
}

func newTrimOptions() *trimOptions {
	return &trimOptions{
		stock:     newStockOptions(),
		units:     newChoice("mm", "mm", "in"),
		meterTol:  percentFlag{raw: "2%", v: 0.02},
		capTol:    capTolFlag{raw: "5%", v: spec.CapTol{Rel: 0.05}},
		freqTol:   percentFlag{raw: "0.1%", v: 0.001},
		tolerance: percentFlag{raw: "0.5%", v: 0.005},
	}
}

func newTrimCmd(g *globalOptions) *cobra.Command {
	opts := newTrimOptions()
	cmd := &cobra.Command{
		Use:   "trim",
		Short: "Turn a measurement of a wound coil into a squeeze, spread or turns change",
		Long: strings.TrimSpace(`
Measure the coil you wound and trim tells you what to change to land on
target: squeeze or spread it to a new outside length or, when that is not
enough, add or remove quarter turns; for a tapped coil, where the tap goes.
It also works out the springback — the effective diameter that makes the
model agree with your coil — and --save keeps it in your stock file, so
predict and design get that mandrel and wire right next time.

Describe the coil with the same flags as predict (or --job FILE --coil
NAME), then give one measurement:

  --measured-l 52nH               an inductance meter (--meter-freq if it
                                  states its test frequency, --fixture-l
                                  for its reading with the clips shorted)
  --measured-f F --with-cap C     one resonance with a known capacitor
                                  across the coil (--stray for the
                                  fixture's own capacitance)
  --measured-f F --circuit-cap C  the resonance in the circuit it was
                                  designed for, with that circuit's
                                  capacitance
  --resonance F1@C1 --resonance F2@C2
                                  the two-capacitor method: two resonances
                                  with two capacitors give L and the
                                  capacitance already across the coil
                                  (fixture and self-capacitance) together

The reading is compared with the model in its own terms: a low-frequency
meter reading with the terminal inductance at DC; a reading at a stated
frequency, or one resonance, with the effective inductance there (the
coil's self-capacitance included); the two-capacitor line, which measures
the self-capacitance itself, with the terminal inductance without it.

--target is the inductance wanted at the terminals at --freq (default: the
model's value for the coil as specified), or a frequency to resonate at
with --circuit-cap. Each reading carries the accuracy of the meter, the
capacitors and the frequency (--meter-tol, --cap-tol, --freq-tol); the
springback comes with the band that follows from them.

Caution: never squeeze a coil in a live circuit. Tank and coupler coils
carry high RF voltage; switch off and discharge before touching, and follow
local regulations and licensed practice for anything that transmits.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise trim --mandrel 4.6mm --wire 1mm --turns 4 --length 8mm --leads 5mm --measured-l 52nH --target 48nH
  turnwise trim --former 25mm --wire 22awg --turns 30 --leads 20mm --freq 3.7MHz --resonance 2.0MHz@330pF --resonance 0.9435MHz@1.5nF
  turnwise trim --job testdata/club-night.toml --coil "L1 filter input" --measured-f 131MHz --circuit-cap 17pF --target 137.5MHz --stock ~/coils/stock.toml --save`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			return runTrim(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	fs := cmd.Flags()
	opts.coil.addFlags(fs)
	opts.stock.addFlags(fs)
	fs.StringVar(&opts.sweepFile, "sweep", "", "a network analyser's sweep of the coil (Touchstone .s1p/.s2p): the fitted L at --freq is the measurement (see turnwise fit; --fixture, --open, --short)")
	opts.sweep.addFlags(cmd)
	fs.StringVar(&opts.job, "job", "", "take the coil from this job file (with --coil NAME) instead of the coil flags")
	fs.StringVar(&opts.coilName, "coil", "", "the coil's name in the --job file")
	fs.Var(&opts.freq, "freq", "operating frequency: the target is the inductance at the terminals there (default: low frequency)")
	fs.Var(&opts.target, "target", "inductance wanted at the terminals at --freq, e.g. 48nH, or a resonance frequency with --circuit-cap, e.g. 145MHz (default: the model's value for the coil as specified)")
	fs.Var(&opts.measuredL, "measured-l", "an inductance meter's reading, e.g. 52nH")
	fs.Var(&opts.meterFreq, "meter-freq", "the meter's test frequency, when it states one, e.g. 1MHz (default: low frequency)")
	fs.Var(&opts.fixtureL, "fixture-l", "subtract the meter's reading with its clips shorted, e.g. 3nH")
	fs.Var(&opts.fixtureLeads, "fixture-leads", "extra wire on each lead between the coil's solder points and the instrument during the measurement, e.g. 10mm")
	fs.Var(&opts.meterTol, "meter-tol", "the meter's accuracy, percent")
	fs.Var(&opts.measuredF, "measured-f", "a resonance frequency, with --with-cap (test fixture) or --circuit-cap (in its circuit), e.g. 98.2MHz")
	fs.Var(&opts.withCap, "with-cap", "the known capacitor across the coil for --measured-f, e.g. 22pF")
	fs.Var(&opts.circuitCap, "circuit-cap", "the capacitance across the coil in its design circuit (tuning capacitor plus strays), e.g. 22pF")
	fs.Var(&opts.stray, "stray", "fixture capacitance across the coil besides the known capacitor (probe, wiring), e.g. 1.5pF; taken as ±50 %")
	fs.Var(&opts.resonances, "resonance", "a resonance and its capacitor, F@C, e.g. 9.81MHz@100pF; give two or more for the two-capacitor method")
	fs.Var(&opts.capTol, "cap-tol", "tolerance of the known capacitors: a percentage or an absolute value, e.g. 1% or 0.25pF")
	fs.Var(&opts.freqTol, "freq-tol", "accuracy of the frequency reading, percent (a dip meter's dial is nearer 2%)")
	fs.Var(&opts.tolerance, "tolerance", "how close to the target counts as on target, percent")
	fs.Var(&opts.tap, "tap", "the tap, in turns from the cold (grounded) end, for a tapped coil")
	fs.Var(&opts.tapRatio, "tap-ratio", "the tap's unloaded voltage ratio to keep, e.g. 0.25 or 1:4 (default: the coil as specified at --tap)")
	fs.Var(&opts.measuredBottom, "measured-bottom", "meter reading from the cold end to the tap, e.g. 12nH (same meter flags)")
	fs.Var(&opts.measuredTop, "measured-top", "meter reading from the tap to the hot end, e.g. 30nH (same meter flags)")
	fs.BoolVar(&opts.save, "save", false, "write the springback into your stock file (--stock) for this mandrel and wire; the old file is kept as FILE.bak")
	fs.Var(opts.units, "units", "display lengths in mm or in")
	fs.BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	return cmd
}

// trimResult is the library's result with what the writers need besides.
type trimResult = report.Trim

func runTrim(ctx context.Context, opts *trimOptions, stdout, stderr io.Writer) error {
	flags := opts.values()
	m, via, err := spec.TrimMeasurement(flags)
	if err != nil {
		return err
	}
	tc, err := spec.ResolveTrimCoil(flags)
	if err != nil {
		return err
	}
	if m.Kind == trim.MeasureSweep {
		_, _, fit, err := opts.sweep.load(opts.sweepFile, float64(tc.Freq))
		if err != nil {
			return err
		}
		m.Sweep = spec.TrimSweepFit(fit)
	}
	lf := newLengthFormatter(opts.units.v)
	req, err := spec.TrimRequest(flags, tc, m, trim.LengthSteps(lf.Inches))
	if err != nil {
		return err
	}
	plan, err := trim.Plan(req)
	if err != nil {
		return spec.TrimError(via, tc, err)
	}
	res := &trimResult{Result: plan, Coil: tc.Spec, Meas: m, LF: lf}
	res.Instruction = report.TrimInstruction(res)
	res.Warnings = report.TrimWarnings(res)
	if opts.save {
		s, err := saveTrimCalibration(ctx, tc.Stock.Path, res)
		if err != nil {
			return err
		}
		res.Saved = s
	}
	if opts.json {
		if err := report.WriteTrimJSON(stdout, res); err != nil {
			return err
		}
	} else if err := report.WriteTrimTable(stdout, res); err != nil {
		return err
	}
	printWarnings(stderr, res.Warnings)
	return nil
}

// values is what the flags gave, for internal/spec.
func (o *trimOptions) values() spec.TrimFlags {
	return spec.TrimFlags{
		Freq: opt(&o.freq), MeasuredL: opt(&o.measuredL), FixtureL: opt(&o.fixtureL),
		MeterFreq: opt(&o.meterFreq), MeasuredF: opt(&o.measuredF), FixtureLeads: opt(&o.fixtureLeads),
		MeterTol: opt(&o.meterTol), FreqTol: opt(&o.freqTol), Tolerance: opt(&o.tolerance),
		WithCap: opt(&o.withCap), CircuitCap: opt(&o.circuitCap), Stray: opt(&o.stray),
		Resonances: o.resonances.v,
		CapTol:     spec.Given{Raw: o.capTol.raw, Set: o.capTol.raw != ""}, CapTolRel: o.capTol.v.Rel, CapTolAbs: o.capTol.v.Abs,
		Target: spec.Given{Raw: o.target.raw, Set: o.target.set}, TargetL: o.target.v.L, TargetF: o.target.v.F, TargetIsFreq: o.target.v.IsFreq,
		Tap: opt(&o.tap), TapRatio: opt(&o.tapRatio),
		MeasuredBottom: opt(&o.measuredBottom), MeasuredTop: opt(&o.measuredTop),
		Sweep: o.sweepFile != "", Job: o.job, CoilName: o.coilName, Save: o.save,
		Stock:      spec.Stock{Path: o.stock.path, Use: o.stock.use.v},
		StockGiven: o.stock.path != os.Getenv("TURNWISE_STOCK") || o.stock.use.v != "",
		Winding:    o.coil.winding(), FirstCoilFlag: o.coil.firstSet(),
	}
}

// firstSet names the first coil flag given, or "".
func (o *coilOptions) firstSet() string { return spec.FirstWindingKey(o.winding()) }

// resonanceListFlag collects --resonance F@C readings.
type resonanceListFlag struct {
	raw []string
	v   []trim.Resonance
}

func (f *resonanceListFlag) String() string { return strings.Join(f.raw, ",") }
func (f *resonanceListFlag) Type() string   { return "F@C" }
func (f *resonanceListFlag) Set(s string) error {
	r, err := spec.ParseResonance(s)
	if err != nil {
		return err
	}
	f.raw, f.v = append(f.raw, s), append(f.v, r)
	return nil
}
