package trim

import (
	"errors"
	"math"
	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// Trimming a tapped coil. The sections are measured with an inductance
// meter, cold end to tap (bottom) and tap to hot end (top), each compared
// with the section of the tap model (Tap) at the meter's frequency: the
// terminal inductance of the section, its own lead included, the tap lead
// not (clip the meter at the tap itself). A section's self-capacitance is
// not modelled, so a meter test frequency should be far below the coil's
// self-resonance.

// SectionFit is one section's calibration.
type SectionFit struct {
	Reading Reading
	// Springback and EffectiveDiameter make the section's model agree with
	// its own reading.
	Springback        float64
	EffectiveDiameter unit.Length
	// Model is the section in the model calibrated on the whole coil, and
	// Residual = Model/reading − 1: how far this section departs from the
	// rest of the coil (a tighter or looser part, or a tap off its place).
	Model    unit.Inductance
	Residual float64
}

// SectionCalibration is what section readings say about a tapped coil.
type SectionCalibration struct {
	TapTurns    float64
	Bottom, Top *SectionFit // nil when that section was not measured
	// ModelRatio is the unloaded voltage ratio at the tap in the model
	// calibrated on the whole coil, at the readings' frequency.
	ModelRatio float64
	// MeasuredRatio is (L + L_b − L_a)/(2L), with M = (L − L_a − L_b)/2,
	// from both section readings and the whole coil's terminal inductance
	// at the same frequency (from its calibration); zero unless both
	// sections were measured.
	MeasuredRatio float64
}

// CalibrateSections fits the sections of the coil cal.Geometry tapped
// tapTurns turns from the cold end. bottom and top are direct readings
// (Kind MeasureDirect); either may be nil.
func CalibrateSections(cal Calibration, tapTurns float64, bottom, top *Measurement) (SectionCalibration, error) {
	sc := SectionCalibration{TapTurns: tapTurns}
	g := cal.Geometry
	if err := g.Validate(); err != nil {
		return sc, err
	}
	// The tap's own checks (quarter turns, on the coil) come first.
	if _, err := coil.Tap(g, tapTurns, 0); err != nil {
		return sc, err
	}
	if tapTurns <= 0 || tapTurns >= g.Turns {
		return sc, inputErrorf("tap_turns", "the tap must be on the winding, between 0 and %g turns from the cold end", g.Turns)
	}
	var f unit.Frequency
	for _, m := range []*Measurement{bottom, top} {
		if m != nil {
			f = m.TestFrequency
		}
	}
	if bottom != nil && top != nil && bottom.TestFrequency != top.TestFrequency {
		return sc, inputErrorf("test_frequency", "measure both sections at the same meter frequency")
	}
	whole, err := coil.Tap(g, tapTurns, f)
	if err != nil {
		return sc, err
	}
	sc.ModelRatio = whole.Ratio
	fit := func(m *Measurement, param, what string, pick func(coil.Sections) unit.Inductance) (*SectionFit, error) {
		if m == nil {
			return nil, nil
		}
		if m.Kind != MeasureDirect {
			return nil, inputErrorf(param, "a section is measured with an inductance meter (a direct reading)")
		}
		r, err := m.Reduce()
		if err != nil {
			var ie *coil.InputError
			if errors.As(err, &ie) && ie.Param == "measured_inductance" {
				ie.Param = param
			}
			return nil, err
		}
		gm := g
		gm.LeadLength += m.FixtureLeadLength
		value := func(s float64) float64 {
			h := gm
			h.Springback = s
			sec, err := coil.Tap(h, tapTurns, f)
			if err != nil {
				return math.Inf(1)
			}
			return float64(pick(sec))
		}
		want := float64(r.Inductance)
		s, err := bisectSpringback(value, want, param, what)
		if err != nil {
			return nil, err
		}
		h := g
		h.Springback = s
		model := float64(pick(whole))
		if m.FixtureLeadLength != 0 {
			model = value(cal.Springback)
		}
		return &SectionFit{
			Reading:           r,
			Springback:        s,
			EffectiveDiameter: h.MeanDiameter(),
			Model:             unit.Inductance(model),
			Residual:          model/want - 1,
		}, nil
	}
	if sc.Bottom, err = fit(bottom, "measured_bottom", "the bottom section (cold end to tap)", func(s coil.Sections) unit.Inductance { return s.LB }); err != nil {
		return sc, err
	}
	if sc.Top, err = fit(top, "measured_top", "the top section (tap to hot end)", func(s coil.Sections) unit.Inductance { return s.LA }); err != nil {
		return sc, err
	}
	if sc.Bottom != nil && sc.Top != nil {
		l := float64(whole.L)
		lb, la := float64(sc.Bottom.Reading.Inductance), float64(sc.Top.Reading.Inductance)
		sc.MeasuredRatio = (l + lb - la) / (2 * l)
	}
	return sc, nil
}

// MoveTap returns the quarter-turn tap of g (the corrected coil) whose
// unloaded voltage ratio at f is nearest ratio.
func MoveTap(g coil.Geometry, f unit.Frequency, ratio float64) (coil.TapChoice, error) {
	cs, err := coil.FindTap(g, f, coil.GoalVoltageRatio, ratio)
	if len(cs) == 0 {
		return coil.TapChoice{}, err
	}
	return cs[0], err
}
