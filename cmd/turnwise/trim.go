package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"turnwise/internal/quantity"
	"turnwise/internal/report"
	"turnwise/internal/spec"

	"github.com/spf13/cobra"
	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/trim"
	"turnwise/forms"
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

	save  bool
	units *choiceFlag
	json  bool
}

func newTrimOptions() *trimOptions {
	return &trimOptions{
		stock:     newStockOptions(),
		units:     newChoice("mm", "mm", "in"),
		meterTol:  percentFlag{raw: "2%", v: 0.02},
		capTol:    capTolFlag{raw: "5%", rel: 0.05},
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

// trimCoil is the coil under test, resolved from flags or a job entry.
type trimCoil struct {
	spec     spec.Spec
	freq     unit.Frequency
	tapTurns *float64 // nil for an untapped coil
	tapRatio *float64 // the ratio to keep, when given
	stock    *stockOptions
	cat      *forms.Catalog
	// job and jobEntry are set when the coil came from a job file; errors
	// on the coil then point at its keys.
	job      *forms.Job
	jobEntry *forms.JobCoil
}

// trimResult is the library's result with what the writers need besides.
type trimResult = report.Trim

func runTrim(_ context.Context, opts *trimOptions, stdout, stderr io.Writer) error {
	m, via, err := opts.measurement()
	if err != nil {
		return err
	}
	tc, err := opts.resolveCoil()
	if err != nil {
		return err
	}
	res, err := trimCompute(opts, tc, m, via)
	if err != nil {
		return err
	}
	if opts.save {
		s, err := saveTrimCalibration(tc, res)
		if err != nil {
			return err
		}
		res.Saved = s
	}
	if opts.json {
		return report.WriteTrimJSON(stdout, res)
	}
	if err := report.WriteTrimTable(stdout, res); err != nil {
		return err
	}
	for _, w := range res.Warnings {
		fmt.Fprintf(stderr, "warning: %s\n", w)
	}
	return nil
}

// trimCompute is the trim itself: the request from the flags, one call to
// trim.Plan, and the flag each input error belongs to.
func trimCompute(opts *trimOptions, tc trimCoil, m trim.Measurement, via string) (*trimResult, error) {
	lf := newLengthFormatter(opts.units.v)
	req := trim.Request{
		Geometry:    tc.spec.Geometry,
		Frequency:   tc.freq,
		Measurement: m,
		Tolerance:   opts.tolerance.v,
		LengthSteps: trim.LengthSteps(lf.Inches),
		OnFormer:    tc.spec.SupportKind == coil.SupportFormer,
	}
	switch {
	case opts.target.isFreq:
		if !opts.circuitCap.set {
			return nil, usageErrorf("--target %s is a frequency: give --circuit-cap, the capacitance it resonates with in the circuit", opts.target.raw)
		}
		if !(opts.target.f > 0) {
			return nil, usageErrorf("--target %s: a resonance to aim for must be a positive frequency, e.g. 145MHz", opts.target.raw)
		}
		req.Aim = trim.Aim{Source: trim.TargetResonance, Resonance: opts.target.f, Capacitance: opts.circuitCap.v}
	case opts.target.set:
		req.Aim = trim.Aim{Source: trim.TargetGiven, Inductance: opts.target.l}
	}
	if tc.tapTurns != nil {
		section := func(f inductanceFlag) *trim.Measurement {
			if !f.set {
				return nil
			}
			return &trim.Measurement{Kind: trim.MeasureDirect, Inductance: f.v, TestFrequency: opts.meterFreq.v,
				FixtureInductance: opts.fixtureL.v, MeterTolerance: opts.meterTol.v, FixtureLeadLength: opts.fixtureLeads.v}
		}
		req.Tap = &trim.TapRequest{Turns: *tc.tapTurns, Ratio: tc.tapRatio,
			Bottom: section(opts.measuredBottom), Top: section(opts.measuredTop)}
	}
	plan, err := trim.Plan(req)
	if err != nil {
		return nil, opts.trimError(via, tc, err)
	}
	res := &trimResult{Result: plan, Coil: tc.spec, Meas: m, LF: lf}
	res.Instruction = report.TrimInstruction(res)
	res.Warnings = report.TrimWarnings(res)
	return res, nil
}

// measurement builds the trim.Measurement from the flags and checks their
// combination. via is the flag the reading came from.
func (o *trimOptions) measurement() (trim.Measurement, string, error) {
	var m trim.Measurement
	given := 0
	for _, set := range []bool{o.measuredL.set, o.measuredF.set, len(o.resonances.v) > 0} {
		if set {
			given++
		}
	}
	switch {
	case given == 0:
		return m, "", usageErrorf("give a measurement: --measured-l 52nH (an inductance meter), --measured-f F with --with-cap C (a test capacitor) or --circuit-cap C (in its circuit), or --resonance F1@C1 --resonance F2@C2 (two-capacitor method)")
	case given > 1:
		return m, "", usageErrorf("give one measurement: --measured-l, --measured-f or --resonance, not several")
	}
	for _, t := range []struct {
		flag string
		f    *percentFlag
		max  float64
	}{{"meter-tol", &o.meterTol, 0.5}, {"freq-tol", &o.freqTol, 0.2}, {"tolerance", &o.tolerance, 0.2}} {
		if t.f.v < 0 || t.f.v > t.max {
			return m, "", usageErrorf("--%s %s is outside 0 … %g%%", t.flag, t.f.raw, t.max*100)
		}
	}
	if o.capTol.rel < 0 || o.capTol.rel > 0.5 || o.capTol.abs < 0 || o.capTol.abs > 1e-9 {
		return m, "", usageErrorf("--cap-tol %s is not a sensible tolerance; use e.g. 5%% or 0.25pF", o.capTol.raw)
	}
	sections := o.measuredBottom.set || o.measuredTop.set
	meterOnly := []struct {
		name string
		set  bool
	}{{"meter-freq", o.meterFreq.set}, {"fixture-l", o.fixtureL.set}}
	m.MeterTolerance = o.meterTol.v
	m.CapacitorTolerance, m.CapacitorToleranceAbs = o.capTol.rel, unit.Capacitance(o.capTol.abs)
	m.FrequencyTolerance = o.freqTol.v
	m.FixtureLeadLength = o.fixtureLeads.v
	via := ""
	switch {
	case o.measuredL.set:
		m.Kind, m.Inductance, via = trim.MeasureDirect, o.measuredL.v, "measured-l"
		m.TestFrequency, m.FixtureInductance = o.meterFreq.v, o.fixtureL.v
		if o.stray.set {
			return m, "", usageErrorf("--stray belongs to a resonance (--measured-f or --resonance); an inductance meter reading does not need it")
		}
	case o.measuredF.set:
		via = "measured-f"
		for _, f := range meterOnly {
			if f.set && !sections {
				return m, "", usageErrorf("--%s belongs to an inductance meter reading (--measured-l); drop it for a resonance", f.name)
			}
		}
		switch {
		case o.withCap.set:
			m.Kind = trim.MeasureResonance
			m.Resonances = []trim.Resonance{{Frequency: o.measuredF.v, Capacitance: o.withCap.v}}
			m.Stray, m.StrayTolerance = o.stray.v, o.stray.v/2
		case o.circuitCap.set:
			if o.stray.set {
				return m, "", usageErrorf("--stray belongs to a test fixture (--with-cap); --circuit-cap already includes the circuit's strays")
			}
			m.Kind = trim.MeasureInCircuit
			m.Resonances = []trim.Resonance{{Frequency: o.measuredF.v, Capacitance: o.circuitCap.v}}
		default:
			return m, "", usageErrorf("--measured-f needs the capacitance it resonated with: --with-cap C (a known capacitor across the coil) or --circuit-cap C (the coil in its circuit)")
		}
	default:
		via = "resonance"
		for _, f := range meterOnly {
			if f.set && !sections {
				return m, "", usageErrorf("--%s belongs to an inductance meter reading (--measured-l); drop it for a resonance", f.name)
			}
		}
		m.Resonances = o.resonances.v
		m.Kind = trim.MeasureTwoCapacitor
		if len(o.resonances.v) == 1 {
			m.Kind = trim.MeasureResonance
		}
		m.Stray, m.StrayTolerance = o.stray.v, o.stray.v/2
	}
	if o.circuitCap.set && m.Kind != trim.MeasureInCircuit && !o.target.isFreq {
		return m, "", usageErrorf("--circuit-cap is the capacitance of the coil's own circuit: it goes with --measured-f (a resonance in that circuit) or with a resonance --target such as 145MHz; drop it, or give one of those")
	}
	if o.withCap.set && !o.measuredF.set {
		return m, "", usageErrorf("--with-cap is the capacitor of a --measured-f resonance; give --measured-f too, or use --resonance F@C")
	}
	if sections && !o.tap.set && o.job == "" {
		return m, "", usageErrorf("--measured-bottom and --measured-top are readings of a tapped coil's sections: give --tap, the tap in turns from the cold end")
	}
	if o.tapRatio.set && !o.tap.set && o.job == "" {
		return m, "", usageErrorf("--tap-ratio needs --tap, where the tap is now")
	}
	return m, via, nil
}

// resolveCoil finds the coil under test: the coil flags, or --job/--coil.
func (o *trimOptions) resolveCoil() (trimCoil, error) {
	tc := trimCoil{stock: o.stock, freq: o.freq.v}
	if o.tap.set {
		v := o.tap.v
		tc.tapTurns = &v
	}
	if o.tapRatio.set {
		v := o.tapRatio.v
		tc.tapRatio = &v
	}
	if o.job == "" {
		if o.coilName != "" {
			return tc, usageErrorf("--coil names a coil of a job file: give --job FILE too, or describe the coil with --mandrel/--former, --wire, --turns")
		}
		so, err := o.saveStockOptionsFor(o.stock)
		if err != nil {
			return tc, err
		}
		cat, err := so.load()
		if err != nil {
			return tc, err
		}
		cs, err := spec.Resolve(cat, o.coil.winding())
		if err != nil {
			return tc, err
		}
		tc.spec, tc.cat, tc.stock = cs, cat, so
		return tc, nil
	}

	if o.coilName == "" {
		return tc, usageErrorf("--job needs --coil NAME, the coil of the job file you measured")
	}
	if f := o.coil.firstSet(); f != "" {
		return tc, usageErrorf("--job takes the coil from the job file; drop --%s (or drop --job and describe the coil with flags)", f)
	}
	job, err := spec.LoadJob(o.job)
	if err != nil {
		return tc, err
	}
	entry, err := job.Coil(o.coilName)
	if err != nil {
		return tc, &flagError{Flag: "coil", Err: err}
	}
	// --stock or --use on the command line win over the job's own stock.
	flagsGiven := o.stock.path != os.Getenv("TURNWISE_STOCK") || o.stock.use.v != ""
	so := jobStockOptions(job, o.stock, flagsGiven)
	saveSo, err := o.saveStockOptionsFor(so)
	if err != nil {
		return tc, err
	}
	var cat *forms.Catalog
	if saveSo != so {
		cat, err = saveSo.load() // the stock file is new: built-in rows only
	} else {
		cat, err = spec.JobCatalog(job, o.stock.path, o.stock.use.v, flagsGiven)
	}
	if err != nil {
		return tc, err
	}
	cs, err := spec.ResolveJobCoil(job, entry, cat)
	if err != nil {
		return tc, err
	}
	tc.spec, tc.cat, tc.stock, tc.job, tc.jobEntry = cs, cat, saveSo, job, entry
	if !o.freq.set && entry.Winding.Freq != nil {
		tc.freq = *entry.Winding.Freq
	}
	if entry.Tap != nil && !o.tap.set {
		switch {
		case entry.Tap.Turns != nil:
			v := *entry.Tap.Turns
			tc.tapTurns = &v
		case entry.Tap.Ratio != nil:
			// The sheet put the tap at the quarter turn nearest the ratio.
			choice, err := trim.MoveTap(cs.Geometry, tc.freq, *entry.Tap.Ratio)
			if err != nil && choice.TapTurns == 0 {
				return tc, spec.JobFieldError(job, entry, "tap-ratio", err)
			}
			v := choice.TapTurns
			tc.tapTurns = &v
			if tc.tapRatio == nil {
				r := *entry.Tap.Ratio
				tc.tapRatio = &r
			}
		}
	}
	if tc.tapTurns == nil && (o.measuredBottom.set || o.measuredTop.set) {
		return tc, usageErrorf("--measured-bottom and --measured-top are readings of a tapped coil's sections; coil %q has no tap: give --tap", entry.Name)
	}
	return tc, nil
}

// saveStockOptionsFor returns the stock selection to load. With --save it
// needs a stock file; when that file does not exist yet, the built-in
// catalog alone is loaded (the save creates the file).
func (o *trimOptions) saveStockOptionsFor(so *stockOptions) (*stockOptions, error) {
	if !o.save {
		return so, nil
	}
	if so.path == "" {
		return nil, usageErrorf("--save needs your stock file: give --stock FILE (created if missing) or set TURNWISE_STOCK")
	}
	if _, err := os.Stat(so.path); errors.Is(err, os.ErrNotExist) {
		if dir := filepath.Dir(so.path); !isDir(dir) {
			return nil, usageErrorf("--save: the stock file's directory %s does not exist; create it first or give another --stock", dir)
		}
		if so.use.v == "mine" {
			return nil, usageErrorf("--use mine: %q does not exist yet; drop --use to start it with --save", so.path)
		}
		out := newStockOptions()
		out.path, out.use.v = so.path, "builtin"
		return out, nil
	}
	return so, nil
}

func isDir(path string) bool {
	st, err := os.Stat(path)
	return err == nil && st.IsDir()
}

// firstSet names the first coil flag given, or "".
func (o *coilOptions) firstSet() string {
	for _, f := range []struct {
		name string
		set  bool
	}{
		{"mandrel", o.mandrel != ""}, {"former", o.former != ""}, {"wire", o.wire != ""},
		{"insulation", o.insulation != ""}, {"conductor", o.conductor != ""},
		{"springback", o.springback.set}, {"turns", o.turns.set}, {"pitch", o.pitch.set},
		{"length", o.length.set}, {"leads", o.leads.set}, {"temp", o.temp.set},
	} {
		if f.set {
			return f.name
		}
	}
	return ""
}

// coilError names the flag (or job key) a model error on the coil belongs to.
func (tc trimCoil) coilError(o *trimOptions, err error) error {
	var ie *coil.InputError
	if errors.As(err, &ie) && ie.Param == "frequency" {
		return &flagError{Flag: "freq", Err: err}
	}
	if tc.job != nil {
		return spec.JobCoilError(tc.job, tc.jobEntry, spec.AttachFlag(err, tc.spec.SupportKind.String(), tc.spec.PitchSource))
	}
	return spec.AttachFlag(err, tc.spec.SupportKind.String(), tc.spec.PitchSource)
}

// trimError names the flag (or job key) an error of trim.Plan belongs to.
// via is the flag the measurement came from.
func (o *trimOptions) trimError(via string, tc trimCoil, err error) error {
	var ie *coil.InputError
	if !errors.As(err, &ie) {
		return err
	}
	flag := map[string]string{
		"frequency":           "freq",
		"target":              "target",
		"tap_turns":           "tap",
		"tap_ratio":           "tap-ratio",
		"measured_inductance": via,
		"resonance":           via,
		"capacitance":         via,
		"measurement":         via,
		"fixture_inductance":  "fixture-l",
		"test_frequency":      "meter-freq",
		"stray":               "stray",
		"tolerance":           "cap-tol",
		"fixture_lead_length": "fixture-leads",
		"measured_bottom":     "measured-bottom",
		"measured_top":        "measured-top",
	}[ie.Param]
	if flag == "" {
		return tc.coilError(o, err)
	}
	return &flagError{Flag: flag, Err: err}
}

// targetFlag takes an inductance (48nH) or a resonance frequency (145MHz).
type targetFlag struct {
	raw    string
	l      unit.Inductance
	f      unit.Frequency
	isFreq bool
	set    bool
}

func (f *targetFlag) String() string { return f.raw }
func (f *targetFlag) Type() string   { return "L|F" }
func (f *targetFlag) Set(s string) error {
	if l, err := quantity.ParseInductance(s); err == nil {
		*f = targetFlag{raw: s, l: l, set: true}
		return nil
	}
	if fr, err := quantity.ParseFrequency(s); err == nil {
		*f = targetFlag{raw: s, f: fr, isFreq: true, set: true}
		return nil
	}
	return fmt.Errorf("%q is neither an inductance (48nH) nor a resonance frequency (145MHz, with --circuit-cap)", s)
}

// resonanceListFlag collects --resonance F@C readings.
type resonanceListFlag struct {
	raw []string
	v   []trim.Resonance
}

func (f *resonanceListFlag) String() string { return strings.Join(f.raw, ",") }
func (f *resonanceListFlag) Type() string   { return "F@C" }
func (f *resonanceListFlag) Set(s string) error {
	fs, cs, ok := strings.Cut(s, "@")
	if !ok {
		return fmt.Errorf("%q: write a resonance and its capacitor as F@C, e.g. 9.81MHz@100pF", s)
	}
	fr, err := quantity.ParseFrequency(strings.TrimSpace(fs))
	if err != nil {
		return fmt.Errorf("%q: %w", s, err)
	}
	c, err := quantity.ParseCapacitance(strings.TrimSpace(cs))
	if err != nil {
		return fmt.Errorf("%q: %w", s, err)
	}
	f.raw = append(f.raw, s)
	f.v = append(f.v, trim.Resonance{Frequency: fr, Capacitance: c})
	return nil
}

// capTolFlag is a capacitor tolerance: relative (5%) or absolute (0.25pF).
type capTolFlag struct {
	raw string
	rel float64
	abs float64 // farads
}

func (f *capTolFlag) String() string { return f.raw }
func (f *capTolFlag) Type() string   { return "percent|C" }
func (f *capTolFlag) Set(s string) error {
	t := strings.TrimSpace(s)
	if strings.HasSuffix(strings.ToLower(t), "f") {
		c, err := quantity.ParseCapacitance(t)
		if err != nil {
			return err
		}
		*f = capTolFlag{raw: s, abs: float64(c)}
		return nil
	}
	v, err := quantity.ParsePercent(t)
	if err != nil {
		return err
	}
	*f = capTolFlag{raw: s, rel: v}
	return nil
}
