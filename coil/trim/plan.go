package trim

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
)

// A whole trim in one call: Plan calibrates the coil on a measurement,
// sets the target, finds the correction and the next reading, moves the
// tap of a tapped coil, and says what the builder should know (Findings).
// Callers render the Result; they decide nothing about what it means.

// TargetSource says where a trim's target came from.
type TargetSource int

const (
	// TargetModel is the model's terminal inductance for the coil as
	// specified, at the operating frequency.
	TargetModel TargetSource = iota
	// TargetGiven is a terminal inductance the builder asked for.
	TargetGiven
	// TargetResonance is a resonance with a given capacitance across the
	// coil: an effective inductance.
	TargetResonance
)

// String is the JSON name: model, given, resonance.
func (s TargetSource) String() string {
	return [...]string{"model", "given", "resonance"}[s]
}

// Aim is what the builder asked the trim to reach.
type Aim struct {
	Source TargetSource
	// Inductance is the terminal inductance wanted (TargetGiven).
	Inductance unit.Inductance
	// Resonance and Capacitance (TargetResonance): resonate at Resonance
	// with Capacitance across the terminals.
	Resonance   unit.Frequency
	Capacitance unit.Capacitance
}

// TapRequest describes the tap of a tapped coil under trim.
type TapRequest struct {
	// Turns is where the tap is, in turns from the cold end.
	Turns float64
	// Ratio is the unloaded voltage ratio to keep; nil keeps the ratio of
	// the coil as specified at Turns.
	Ratio *float64
	// Bottom and Top are meter readings of the sections (cold end to tap,
	// tap to hot end); either may be nil.
	Bottom, Top *Measurement
}

// Request is one trim.
type Request struct {
	// Geometry is the coil as specified, with the springback the builder
	// assumed.
	Geometry coil.Geometry
	// Frequency is the operating frequency (0 for low frequency).
	Frequency   unit.Frequency
	Measurement Measurement
	Aim         Aim
	// Tolerance is the relative miss accepted as on target.
	Tolerance float64
	// LengthSteps are the resolutions an outside length is set to,
	// coarsest first (see LengthSteps).
	LengthSteps []unit.Length
	// OnFormer reports that the coil stays on its former; otherwise it was
	// wound on a mandrel and slid off, free to spring back.
	OnFormer bool
	// Tap is the tap of a tapped coil; nil for none.
	Tap *TapRequest
}

// TapPlan is where the tap goes after the correction.
type TapPlan struct {
	Turns, NewTurns float64
	// WantRatio is the voltage ratio to keep.
	WantRatio float64
	// RatioBefore is the ratio of the coil as built and RatioAfter after
	// the change, each with the measured Offset.
	RatioBefore, RatioAfter float64
	// Offset is the measured ratio less the model's (zero without both
	// section readings); it is kept when the tap moves.
	Offset float64
	// OutOfReach reports that WantRatio lies beyond every quarter-turn tap:
	// NewTurns is the nearest end.
	OutOfReach bool
	// Sections are the section calibrations; nil without section readings.
	Sections *SectionCalibration
}

// Moves reports that the tap changes place.
func (t *TapPlan) Moves() bool { return t.NewTurns != t.Turns }

// Result is everything a trim works out.
type Result struct {
	// Spec is the coil as specified, at the operating frequency.
	Spec        coil.Prediction
	Calibration Calibration
	Aim         Aim
	Target      Target
	Correction  Correction
	// Next is what the same measurement should read after the change.
	Next Expected
	// After is the corrected coil at the operating frequency.
	After coil.Prediction
	// AfterResonance (TargetResonance) is the corrected coil's resonance
	// with the aim's capacitance; zero when it cannot be found.
	AfterResonance unit.Frequency
	// Deviation is the reading against the model's expectation for the
	// coil as specified: reading/ModelBefore − 1.
	Deviation float64
	// Miss is the coil as built against the target, Before/Target − 1;
	// OnTarget reports |Miss| ≤ Tolerance, the request's.
	Miss      float64
	OnTarget  bool
	Tolerance float64
	// MissAfter is the corrected coil against the target, After/Target − 1.
	MissAfter float64
	// LoosePitch is the pitch at the spread end of the window.
	LoosePitch unit.Length
	// SelfCapacitanceThroughLeads (two-capacitor method) reports that the
	// leads change the self-capacitance seen at the terminals by more than
	// SelfCapacitanceLeadsLimit, so both figures are worth showing.
	SelfCapacitanceThroughLeads bool
	// MeasuredSelfCapacitanceUncertainty is the uncertainty of
	// Calibration.MeasuredSelfCapacitance: the line's intercept and the
	// given stray's, root-sum-square.
	MeasuredSelfCapacitanceUncertainty unit.Capacitance
	Tap                                *TapPlan
	// Findings are what the builder should know, most important first.
	// The model's own warnings for the corrected coil are After.Warnings().
	Findings []Finding
}

// LengthSteps are the resolutions a builder sets an outside length to,
// coarsest first: 0.1 mm with calipers on a springy coil, finer only when
// the coil is so sensitive that 0.1 mm misses the tolerance (common
// practice); in inches 0.005, 0.002 and 0.001 in.
func LengthSteps(inches bool) []unit.Length {
	if inches {
		return []unit.Length{0.005 * 0.0254, 0.002 * 0.0254, 0.001 * 0.0254}
	}
	return []unit.Length{0.1e-3, 0.05e-3, 0.02e-3, 0.01e-3}
}

// SelfCapacitanceLeadsLimit is the relative difference between the
// self-capacitance across the winding and at the terminals beyond which
// the leads matter (Result.SelfCapacitanceThroughLeads).
const SelfCapacitanceLeadsLimit = 0.05

// Plan runs the whole trim. Errors are *coil.InputError naming the field
// (the measurement's fields as Measurement.Reduce names them; "frequency"
// for the operating frequency; "target" for the aim, including a
// resonance aim too close to the self-resonance; "tap_turns" and
// "tap_ratio" for the tap; the coil's own fields), or wrap
// coil.ErrInfeasible when no squeeze, spread or turns change reaches the
// target.
func Plan(req Request) (*Result, error) {
	g := req.Geometry
	p, err := coil.Predict(g, req.Frequency)
	if err != nil {
		return nil, err
	}
	res := &Result{Spec: p, Aim: req.Aim, Tolerance: req.Tolerance}
	if res.Calibration, err = Calibrate(g, req.Measurement); err != nil {
		return nil, err
	}
	cal := res.Calibration
	switch req.Aim.Source {
	case TargetResonance:
		res.Target = ResonanceTarget(req.Aim.Resonance, req.Aim.Capacitance)
	case TargetGiven:
		res.Target = Target{Inductance: req.Aim.Inductance, Frequency: req.Frequency}
	default:
		res.Target = Target{Inductance: p.Inductance, Frequency: req.Frequency}
	}
	res.Correction, err = Correct(cal.Geometry, res.Target, CorrectOptions{Tolerance: req.Tolerance, LengthSteps: req.LengthSteps})
	if err != nil {
		var ie *coil.InputError
		switch {
		case errors.As(err, &ie) && ie.Param == "frequency" && req.Aim.Source == TargetResonance:
			return nil, &coil.InputError{Param: "target", Reason: ie.Reason}
		case errors.Is(err, coil.ErrInfeasible):
			return nil, fmt.Errorf("no squeeze, spread or turns change reaches the target: %w", err)
		}
		return nil, err
	}
	c := res.Correction
	if res.Next, err = ExpectedReading(c.Geometry, cal, req.Measurement); err != nil {
		return nil, err
	}
	if res.After, err = coil.Predict(c.Geometry, req.Frequency); err != nil {
		return nil, err
	}
	if req.Aim.Source == TargetResonance {
		if f, err := ResonanceWith(c.Geometry, req.Aim.Capacitance); err == nil {
			res.AfterResonance = f
		}
	}
	if req.Tap != nil {
		if res.Tap, err = PlanTap(g, cal, c.Geometry, req.Frequency, *req.Tap); err != nil {
			return nil, err
		}
	}

	r := cal.Reading
	res.Deviation = float64(r.Inductance)/float64(cal.ModelBefore) - 1
	res.Miss = float64(c.Before)/float64(c.Target) - 1
	res.OnTarget = math.Abs(res.Miss) <= req.Tolerance
	res.MissAfter = float64(c.After)/float64(c.Target) - 1
	_, res.LoosePitch = coil.WindowPitches(g)
	if r.Kind == MeasureTwoCapacitor || r.Kind == MeasureSweep {
		ct, cs := cal.SelfCapacitanceAtTerminals, cal.SelfCapacitance
		res.SelfCapacitanceThroughLeads = math.Abs(float64(ct/cs)-1) > SelfCapacitanceLeadsLimit
		res.MeasuredSelfCapacitanceUncertainty = unit.Capacitance(math.Hypot(float64(r.TotalStrayUncertainty), float64(req.Measurement.StrayTolerance)))
	}
	res.Findings = findings(req, res)
	return res, nil
}

// PlanTap calibrates the sections of a tapped coil, when they were read,
// on the calibration cal of the coil specified as spec, and finds the
// quarter-turn tap of the corrected coil (corrected) that
// keeps the wanted ratio at f. A measured offset of the ratio from the
// model (both sections read) is kept: the tap moves to where the model
// gives the wanted ratio less the offset.
func PlanTap(spec coil.Geometry, cal Calibration, corrected coil.Geometry, f unit.Frequency, req TapRequest) (*TapPlan, error) {
	n := req.Turns
	g := cal.Geometry
	if n <= 0 || n >= spec.Turns {
		return nil, inputErrorf("tap_turns", "%g is not on the winding: a tap goes more than 0 and less than %g turns from the cold end", n, spec.Turns)
	}
	specTap, err := coil.Tap(spec, n, f)
	if err != nil {
		return nil, tapError(err)
	}
	t := &TapPlan{Turns: n, WantRatio: specTap.Ratio}
	if req.Ratio != nil {
		t.WantRatio = *req.Ratio
	}
	if req.Bottom != nil || req.Top != nil {
		sc, err := CalibrateSections(cal, n, req.Bottom, req.Top)
		if err != nil {
			return nil, err
		}
		t.Sections = &sc
		if sc.MeasuredRatio != 0 {
			t.Offset = sc.MeasuredRatio - sc.ModelRatio
		}
	}
	built, err := coil.Tap(g, n, f)
	if err != nil {
		return nil, tapError(err)
	}
	t.RatioBefore = built.Ratio + t.Offset
	want := t.WantRatio - t.Offset
	if !(want > 0 && want < 1) {
		return nil, inputErrorf("tap_ratio", "the ratio %.3g less the measured offset %+.3g is outside 0 … 1", t.WantRatio, t.Offset)
	}
	choice, err := MoveTap(corrected, f, want)
	if err != nil && choice.TapTurns == 0 {
		return nil, tapError(err)
	}
	t.NewTurns, t.RatioAfter = choice.TapTurns, choice.Ratio+t.Offset
	// FindTap returns an end tap for a ratio beyond every tap on the winding.
	last := corrected.Turns - 0.25
	t.OutOfReach = (choice.TapTurns <= 0.25 && want < choice.Ratio) || (choice.TapTurns >= last && want > choice.Ratio)
	return t, nil
}

// tapError names the tap's ratio where the tap model calls it the target.
func tapError(err error) error {
	var ie *coil.InputError
	if errors.As(err, &ie) && ie.Param == "target" {
		return &coil.InputError{Param: "tap_ratio", Reason: ie.Reason}
	}
	return err
}
