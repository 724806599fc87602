package spec

import (
	"errors"
	"os"
	"path/filepath"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/sweep"
	"turnwise/coil/trim"
	"turnwise/forms"
)

// Opt is a flag's value with how it was given.
type Opt[T any] struct {
	V T
	Given
}

// TrimFlags is what trim's flags gave, as values: the measurement, the
// target, the tap and where the coil comes from.
type TrimFlags struct {
	Freq                         Opt[unit.Frequency]
	MeasuredL, FixtureL          Opt[unit.Inductance]
	MeterFreq, MeasuredF         Opt[unit.Frequency]
	FixtureLeads                 Opt[unit.Length]
	MeterTol, FreqTol, Tolerance Opt[float64] // fractions
	WithCap, CircuitCap, Stray   Opt[unit.Capacitance]
	Resonances                   []trim.Resonance
	CapTol                       Given
	CapTolRel, CapTolAbs         float64 // a fraction; farads
	Target                       Given
	TargetL                      unit.Inductance
	TargetF                      unit.Frequency
	TargetIsFreq                 bool
	Tap, TapRatio                Opt[float64]
	MeasuredBottom, MeasuredTop  Opt[unit.Inductance]
	Sweep                        bool // --sweep FILE was given
	Job, CoilName                string
	Save                         bool
	Stock                        Stock // --stock and --use
	StockGiven                   bool  // --stock or --use were given on the command line
	Winding                      forms.JobWinding
	FirstCoilFlag                string // the first coil flag given, or ""
}

// Stock is a selection of catalogs: a stock file and which rows to use
// (builtin, mine, both; "" for the default).
type Stock struct{ Path, Use string }

// Load reads the selected catalogs.
func (s Stock) Load() (*forms.Catalog, error) { return LoadCatalog(s.Path, s.Use) }

// TrimCoil is the coil under test, resolved from flags or a job entry.
type TrimCoil struct {
	Spec     Spec
	Freq     unit.Frequency
	TapTurns *float64 // nil for an untapped coil
	TapRatio *float64 // the ratio to keep, when given
	Stock    Stock    // the stock a --save writes into
	Catalog  *forms.Catalog
	// Job and JobEntry are set when the coil came from a job file; errors
	// on the coil then point at its keys.
	Job      *forms.Job
	JobEntry *forms.JobCoil
}

// TrimMeasurement builds the trim.Measurement from the flags and checks
// their combination. via is the flag the reading came from. A sweep's
// reading is left for the caller to fit (Kind MeasureSweep).
func TrimMeasurement(o TrimFlags) (trim.Measurement, string, error) {
	var m trim.Measurement
	given := 0
	for _, set := range []bool{o.MeasuredL.Set, o.MeasuredF.Set, len(o.Resonances) > 0, o.Sweep} {
		if set {
			given++
		}
	}
	switch {
	case given == 0:
		return m, "", Usagef("give a measurement: --measured-l 52nH (an inductance meter), --measured-f F with --with-cap C (a test capacitor) or --circuit-cap C (in its circuit), or --resonance F1@C1 --resonance F2@C2 (two-capacitor method)")
	case given > 1:
		return m, "", Usagef("give one measurement: --measured-l, --measured-f, --resonance or --sweep, not several")
	}
	for _, t := range []struct {
		flag string
		f    Opt[float64]
		max  float64
	}{{"meter-tol", o.MeterTol, 0.5}, {"freq-tol", o.FreqTol, 0.2}, {"tolerance", o.Tolerance, 0.2}} {
		if t.f.V < 0 || t.f.V > t.max {
			return m, "", Usagef("--%s %s is outside 0 … %g%%", t.flag, t.f.Raw, t.max*100)
		}
	}
	if o.CapTolRel < 0 || o.CapTolRel > 0.5 || o.CapTolAbs < 0 || o.CapTolAbs > 1e-9 {
		return m, "", Usagef("--cap-tol %s is not a sensible tolerance; use e.g. 5%% or 0.25pF", o.CapTol.Raw)
	}
	sections := o.MeasuredBottom.Set || o.MeasuredTop.Set
	meterOnly := []struct {
		name string
		set  bool
	}{{"meter-freq", o.MeterFreq.Set}, {"fixture-l", o.FixtureL.Set}}
	m.MeterTolerance = o.MeterTol.V
	m.CapacitorTolerance, m.CapacitorToleranceAbs = o.CapTolRel, unit.Capacitance(o.CapTolAbs)
	m.FrequencyTolerance = o.FreqTol.V
	m.FixtureLeadLength = o.FixtureLeads.V
	via := ""
	switch {
	case o.Sweep:
		via = "sweep"
		m.Kind = trim.MeasureSweep // fitted by the caller, at the coil's frequency
	case o.MeasuredL.Set:
		m.Kind, m.Inductance, via = trim.MeasureDirect, o.MeasuredL.V, "measured-l"
		m.TestFrequency, m.FixtureInductance = o.MeterFreq.V, o.FixtureL.V
		if o.Stray.Set {
			return m, "", Usagef("--stray belongs to a resonance (--measured-f or --resonance); an inductance meter reading does not need it")
		}
	case o.MeasuredF.Set:
		via = "measured-f"
		for _, f := range meterOnly {
			if f.set && !sections {
				return m, "", Usagef("--%s belongs to an inductance meter reading (--measured-l); drop it for a resonance", f.name)
			}
		}
		switch {
		case o.WithCap.Set:
			m.Kind = trim.MeasureResonance
			m.Resonances = []trim.Resonance{{Frequency: o.MeasuredF.V, Capacitance: o.WithCap.V}}
			m.Stray, m.StrayTolerance = o.Stray.V, o.Stray.V/2
		case o.CircuitCap.Set:
			if o.Stray.Set {
				return m, "", Usagef("--stray belongs to a test fixture (--with-cap); --circuit-cap already includes the circuit's strays")
			}
			m.Kind = trim.MeasureInCircuit
			m.Resonances = []trim.Resonance{{Frequency: o.MeasuredF.V, Capacitance: o.CircuitCap.V}}
		default:
			return m, "", Usagef("--measured-f needs the capacitance it resonated with: --with-cap C (a known capacitor across the coil) or --circuit-cap C (the coil in its circuit)")
		}
	default:
		via = "resonance"
		for _, f := range meterOnly {
			if f.set && !sections {
				return m, "", Usagef("--%s belongs to an inductance meter reading (--measured-l); drop it for a resonance", f.name)
			}
		}
		m.Resonances = o.Resonances
		m.Kind = trim.MeasureTwoCapacitor
		if len(o.Resonances) == 1 {
			m.Kind = trim.MeasureResonance
		}
		m.Stray, m.StrayTolerance = o.Stray.V, o.Stray.V/2
	}
	if o.CircuitCap.Set && m.Kind != trim.MeasureInCircuit && !o.TargetIsFreq {
		return m, "", Usagef("--circuit-cap is the capacitance of the coil's own circuit: it goes with --measured-f (a resonance in that circuit) or with a resonance --target such as 145MHz; drop it, or give one of those")
	}
	if o.WithCap.Set && !o.MeasuredF.Set {
		return m, "", Usagef("--with-cap is the capacitor of a --measured-f resonance; give --measured-f too, or use --resonance F@C")
	}
	if sections && !o.Tap.Set && o.Job == "" {
		return m, "", Usagef("--measured-bottom and --measured-top are readings of a tapped coil's sections: give --tap, the tap in turns from the cold end")
	}
	if o.TapRatio.Set && !o.Tap.Set && o.Job == "" {
		return m, "", Usagef("--tap-ratio needs --tap, where the tap is now")
	}
	return m, via, nil
}

// ResolveTrimCoil finds the coil under test: the coil flags, or
// --job/--coil. With --save the stock file must be named; a stock file
// that does not exist yet is started from the built-in catalog.
func ResolveTrimCoil(o TrimFlags) (TrimCoil, error) {
	tc := TrimCoil{Stock: o.Stock, Freq: o.Freq.V}
	if o.Tap.Set {
		v := o.Tap.V
		tc.TapTurns = &v
	}
	if o.TapRatio.Set {
		v := o.TapRatio.V
		tc.TapRatio = &v
	}
	if o.Job == "" {
		if o.CoilName != "" {
			return tc, Usagef("--coil names a coil of a job file: give --job FILE too, or describe the coil with --mandrel/--former, --wire, --turns")
		}
		so, _, err := saveStockFor(o.Save, o.Stock)
		if err != nil {
			return tc, err
		}
		cat, err := so.Load()
		if err != nil {
			return tc, err
		}
		cs, err := Resolve(cat, o.Winding)
		if err != nil {
			return tc, err
		}
		tc.Spec, tc.Catalog, tc.Stock = cs, cat, so
		return tc, nil
	}

	if o.CoilName == "" {
		return tc, Usagef("--job needs --coil NAME, the coil of the job file you measured")
	}
	if f := o.FirstCoilFlag; f != "" {
		return tc, Usagef("--job takes the coil from the job file; drop --%s (or drop --job and describe the coil with flags)", f)
	}
	job, err := LoadJob(o.Job)
	if err != nil {
		return tc, err
	}
	entry, err := job.Coil(o.CoilName)
	if err != nil {
		return tc, &FlagError{Flag: "coil", Err: err}
	}
	// --stock or --use on the command line win over the job's own stock.
	var so Stock
	so.Path, so.Use = JobStock(job, o.Stock.Path, o.Stock.Use, o.StockGiven)
	saveSo, fresh, err := saveStockFor(o.Save, so)
	if err != nil {
		return tc, err
	}
	var cat *forms.Catalog
	if fresh {
		cat, err = saveSo.Load() // the stock file is new: built-in rows only
	} else {
		cat, err = JobCatalog(job, o.Stock.Path, o.Stock.Use, o.StockGiven)
	}
	if err != nil {
		return tc, err
	}
	cs, err := ResolveJobCoil(job, entry, cat)
	if err != nil {
		return tc, err
	}
	tc.Spec, tc.Catalog, tc.Stock, tc.Job, tc.JobEntry = cs, cat, saveSo, job, entry
	if !o.Freq.Set && entry.Winding.Freq != nil {
		tc.Freq = *entry.Winding.Freq
	}
	if entry.Tap != nil && !o.Tap.Set {
		switch {
		case entry.Tap.Turns != nil:
			v := *entry.Tap.Turns
			tc.TapTurns = &v
		case entry.Tap.Ratio != nil:
			// The sheet put the tap at the quarter turn nearest the ratio.
			choice, err := trim.MoveTap(cs.Geometry, tc.Freq, *entry.Tap.Ratio)
			if err != nil && choice.TapTurns == 0 {
				return tc, JobFieldError(job, entry, "tap-ratio", err)
			}
			v := choice.TapTurns
			tc.TapTurns = &v
			if tc.TapRatio == nil {
				r := *entry.Tap.Ratio
				tc.TapRatio = &r
			}
		}
	}
	if tc.TapTurns == nil && (o.MeasuredBottom.Set || o.MeasuredTop.Set) {
		return tc, Usagef("--measured-bottom and --measured-top are readings of a tapped coil's sections; coil %q has no tap: give --tap", entry.Name)
	}
	return tc, nil
}

// saveStockFor returns the stock selection to load. With --save it needs a
// stock file; when that file does not exist yet, the built-in catalog
// alone is loaded (the save creates the file) and fresh is true.
func saveStockFor(save bool, so Stock) (_ Stock, fresh bool, _ error) {
	if !save {
		return so, false, nil
	}
	if so.Path == "" {
		return so, false, Usagef("--save needs your stock file: give --stock FILE (created if missing) or set TURNWISE_STOCK")
	}
	if _, err := os.Stat(so.Path); errors.Is(err, os.ErrNotExist) {
		if dir := filepath.Dir(so.Path); !isDir(dir) {
			return so, false, Usagef("--save: the stock file's directory %s does not exist; create it first or give another --stock", dir)
		}
		if so.Use == "mine" {
			return so, false, Usagef("--use mine: %q does not exist yet; drop --use to start it with --save", so.Path)
		}
		return Stock{Path: so.Path, Use: "builtin"}, true, nil
	}
	return so, false, nil
}

func isDir(path string) bool {
	st, err := os.Stat(path)
	return err == nil && st.IsDir()
}

// TrimRequest is the trim.Plan request from the flags for the coil tc
// and the measurement m; steps are the length steps of the display units.
func TrimRequest(o TrimFlags, tc TrimCoil, m trim.Measurement, steps []unit.Length) (trim.Request, error) {
	req := trim.Request{
		Geometry:    tc.Spec.Geometry,
		Frequency:   tc.Freq,
		Measurement: m,
		Tolerance:   o.Tolerance.V,
		LengthSteps: steps,
		OnFormer:    tc.Spec.SupportKind == coil.SupportFormer,
	}
	switch {
	case o.TargetIsFreq:
		if !o.CircuitCap.Set {
			return req, Usagef("--target %s is a frequency: give --circuit-cap, the capacitance it resonates with in the circuit", o.Target.Raw)
		}
		if !(o.TargetF > 0) {
			return req, Usagef("--target %s: a resonance to aim for must be a positive frequency, e.g. 145MHz", o.Target.Raw)
		}
		req.Aim = trim.Aim{Source: trim.TargetResonance, Resonance: o.TargetF, Capacitance: o.CircuitCap.V}
	case o.Target.Set:
		req.Aim = trim.Aim{Source: trim.TargetGiven, Inductance: o.TargetL}
	}
	if tc.TapTurns != nil {
		section := func(f Opt[unit.Inductance]) *trim.Measurement {
			if !f.Set {
				return nil
			}
			return &trim.Measurement{Kind: trim.MeasureDirect, Inductance: f.V, TestFrequency: o.MeterFreq.V,
				FixtureInductance: o.FixtureL.V, MeterTolerance: o.MeterTol.V, FixtureLeadLength: o.FixtureLeads.V}
		}
		req.Tap = &trim.TapRequest{Turns: *tc.TapTurns, Ratio: tc.TapRatio,
			Bottom: section(o.MeasuredBottom), Top: section(o.MeasuredTop)}
	}
	return req, nil
}

// coilError names the flag (or job key) a model error on the coil belongs to.
func (tc TrimCoil) coilError(err error) error {
	var ie *coil.InputError
	if errors.As(err, &ie) && ie.Param == "frequency" {
		return &FlagError{Flag: "freq", Err: err}
	}
	if tc.Job != nil {
		return JobCoilError(tc.Job, tc.JobEntry, AttachFlag(err, tc.Spec.SupportKind.String(), tc.Spec.PitchSource))
	}
	return AttachFlag(err, tc.Spec.SupportKind.String(), tc.Spec.PitchSource)
}

// TrimError names the flag (or job key) an error of trim.Plan belongs to.
// via is the flag the measurement came from.
func TrimError(via string, tc TrimCoil, err error) error {
	if _, ok := errors.AsType[*coil.InputError](err); !ok {
		return err
	}
	flags := map[string]string{
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
	}
	if fe, ok := withFlag(err, flags); ok {
		return fe
	}
	return tc.coilError(err)
}

// TrimSweepFit is a sweep's fit as trim's reading.
func TrimSweepFit(fit *sweep.Fit) trim.SweepFit {
	return trim.SweepFit{
		Inductance: unit.Inductance(fit.InductanceLow.Value), Uncertainty: fit.InductanceLow.Uncertainty / fit.InductanceLow.Value,
		Frequency: unit.Frequency(fit.Frequency), Capacitance: unit.Capacitance(fit.SelfCapacitance.Value),
		CapacitanceUncertainty: unit.Capacitance(fit.SelfCapacitance.Uncertainty), Residual: fit.Residual,
	}
}
