package trim

import (
	"errors"
	"math"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Trimming a built coil: a measurement (trim_measure.go) says what the coil
// is; Calibrate finds the springback — the effective diameter — that makes
// the model agree with it; Correct (trim_correct.go) finds the squeeze,
// spread or turns change that brings the calibrated coil to a target.
//
// Which model value a reading is compared with:
//
//   - a meter reading at low frequency: the terminal inductance at DC
//     (coil + leads, full internal inductance); self-capacitance is
//     negligible far below the self-resonance;
//   - a meter reading at a stated test frequency, or one resonance: the
//     effective inductance at that frequency, which includes the coil's
//     Medhurst self-capacitance and the skin effect at that frequency. A
//     resonance with C_total across the terminals satisfies
//     ω²·L_eff(ω)·C_total = 1, so 1/(ω²C_total) is L_eff;
//   - the two-capacitor method: its line already separates the capacitance
//     across the coil (self-capacitance included) from L, so the slope is
//     compared with the terminal inductance at the readings' frequency,
//     without the model's self-capacitance — counting it again would
//     count it twice.

// sense is a way of reading the model: the inductance at f, with or
// without the self-capacitance.
type sense struct {
	freq      unit.Frequency
	effective bool
}

func (r Reading) sense() sense { return sense{r.Frequency, r.Effective} }

// of evaluates the model for g in this sense.
func (s sense) of(g coil.Geometry) (float64, error) {
	p, err := coil.Predict(g, s.freq)
	if err != nil {
		return 0, err
	}
	if s.effective {
		return float64(p.InductanceEffective), nil
	}
	return float64(p.Inductance), nil
}

// Calibration is what a measurement says about the coil as built.
type Calibration struct {
	Reading Reading
	// Geometry is the coil as built (its own leads, no fixture) with the
	// fitted springback.
	Geometry coil.Geometry
	// Springback is the fitted springback: the one that makes the model
	// agree with the reading. It stands for everything the model does not
	// see (the bore's real growth, lead bends, uneven pitch), folded into
	// one effective diameter.
	Springback float64
	// SpringbackLow and SpringbackHigh are the fits at the ends of the
	// reading's uncertainty band (clamped to MinSpringback … MaxSpringback).
	SpringbackLow, SpringbackHigh float64
	// EffectiveDiameter is the wire-centre diameter D = D_f·(1+s) + d_o
	// with the fitted springback.
	EffectiveDiameter unit.Length
	// ModelBefore is the model's value, in the reading's sense, for the
	// coil as specified (its given springback) — what it expected to read.
	ModelBefore unit.Inductance
	// Measured is the coil's terminal inductance (its own leads, no
	// fixture, no self-capacitance) at the reading's frequency, as the
	// calibrated model gives it.
	Measured unit.Inductance
	// Residual is the relative difference between the calibrated model and
	// the reading (model/reading − 1); with one reading and one unknown it
	// is zero to the solver's precision.
	Residual float64
	// SelfCapacitance is Medhurst's self-capacitance of the calibrated coil,
	// across the winding.
	SelfCapacitance unit.Capacitance
	// SelfCapacitanceAtTerminals is SelfCapacitance as the instrument sees
	// it through the leads (fixture wire included), which sit in series
	// outside it: to first order in ω²LC the effective inductance
	// L_leads + L_coil/(1 − ω²·L_coil·C_s) is L·(1 + ω²·L·C_t) with
	// C_t ≈ C_s·(L_coil/L)². The two-capacitor line measures C_t (plus the
	// fixture stray), not C_s; with short leads the two agree.
	SelfCapacitanceAtTerminals unit.Capacitance
	// MeasuredSelfCapacitance (two-capacitor method only) is the measured
	// total capacitance across the coil less the given fixture stray: a
	// check of Medhurst's figure. Zero otherwise.
	MeasuredSelfCapacitance unit.Capacitance
}

// Calibrate reduces the measurement of the coil g (its Springback the
// builder's assumption) and fits the springback that makes the model
// agree. A reading no springback in MinSpringback … MaxSpringback can
// explain is an *InputError: the coil description or the reading is wrong.
func Calibrate(g coil.Geometry, m Measurement) (Calibration, error) {
	var c Calibration
	if err := g.Validate(); err != nil {
		return c, err
	}
	r, err := m.Reduce()
	if err != nil {
		return c, err
	}
	c.Reading = r
	gm := g
	gm.LeadLength += m.FixtureLeadLength
	if err := gm.Validate(); err != nil {
		return c, inputErrorf("fixture_lead_length", "the leads with the fixture's wire are too long: %w", err)
	}
	sn := r.sense()
	before, err := sn.of(gm)
	if err != nil {
		return c, readingError(r, err)
	}
	c.ModelBefore = unit.Inductance(before)

	want := float64(r.Inductance)
	s, err := fitSpringback(gm, sn, want)
	if err != nil {
		return c, err
	}
	c.Springback = s
	c.SpringbackLow = fitSpringbackClamped(gm, sn, want*(1-r.Uncertainty))
	c.SpringbackHigh = fitSpringbackClamped(gm, sn, want*(1+r.Uncertainty))

	gm.Springback = s
	got, err := sn.of(gm)
	if err != nil {
		return c, readingError(r, err)
	}
	c.Residual = got/want - 1
	pm, err := coil.Predict(gm, r.Frequency)
	if err != nil {
		return c, readingError(r, err)
	}
	c.SelfCapacitanceAtTerminals = terminalSelfCapacitance(pm)

	cal := g
	cal.Springback = s
	c.Geometry = cal
	c.EffectiveDiameter = cal.MeanDiameter()
	p, err := coil.Predict(cal, r.Frequency)
	if err != nil {
		return c, readingError(r, err)
	}
	c.Measured = p.Inductance
	c.SelfCapacitance = p.SelfCapacitance
	if r.Kind == MeasureTwoCapacitor {
		c.MeasuredSelfCapacitance = r.TotalStray - m.Stray
	}
	return c, nil
}

// terminalSelfCapacitance is p's self-capacitance as seen at the
// terminals through the leads, at p's frequency (see
// Calibration.SelfCapacitanceAtTerminals). With Predict's
// L_eff = L_leads + L_coil/(1 − (f/SRF)²), the first-order term is
// ω²·L_coil/ω_SRF², so C_t = L_coil/(L·ω_SRF)², which is C_s·(L_coil/L)²
// up to the skin effect's change of L_coil between f and the SRF.
func terminalSelfCapacitance(p coil.Prediction) unit.Capacitance {
	ws := twoPi * float64(p.SRF)
	l := float64(p.Inductance)
	return unit.Capacitance(float64(p.InductanceCoilAtF) / (l * l * ws * ws))
}

// readingError explains a model failure at the reading's frequency.
func readingError(r Reading, err error) error {
	var ie *coil.InputError
	if errors.As(err, &ie) && ie.Param == "frequency" {
		if r.Kind == MeasureDirect {
			return inputErrorf("test_frequency", "the meter's test frequency %s is at or above 90 %% of this coil's self-resonance: the lumped model cannot use the reading; measure at a lower test frequency", quantity.FormatFrequency(float64(r.Frequency)))
		}
		return inputErrorf("resonance", "the reading at %s is at or above 90 %% of this coil's self-resonance: the lumped model cannot use it; measure with a larger capacitor (a lower frequency)", quantity.FormatFrequency(float64(r.Frequency)))
	}
	return err
}

// springbackValue evaluates the model at springback s; a frequency at or
// above the self-resonance (large s) counts as +Inf, where the apparent
// inductance is heading.
func springbackValue(g coil.Geometry, sn sense, s float64) float64 {
	g.Springback = s
	v, err := sn.of(g)
	if err != nil {
		return math.Inf(1)
	}
	return v
}

// fitSpringback solves model(s) = want for s; the model grows with s (a
// larger diameter, more inductance and self-capacitance).
func fitSpringback(g coil.Geometry, sn sense, want float64) (float64, error) {
	return bisectSpringback(func(s float64) float64 { return springbackValue(g, sn, s) }, want, "measured_inductance", "this coil")
}

// bisectSpringback solves value(s) = want for s in MinSpringback …
// MaxSpringback, value rising with s. A want outside the range is an
// *InputError for param; what names the thing measured ("this coil").
func bisectSpringback(value func(s float64) float64, want float64, param, what string) (float64, error) {
	lo, hi := coil.MinSpringback, coil.MaxSpringback
	vlo, vhi := value(lo), value(hi)
	if want < vlo {
		return 0, inputErrorf(param, "%s is less than %s can be even if its bore were 20 %% smaller than the mandrel (%s): check the turns, length and leads, and the reading's unit",
			quantity.FormatInductance(want), what, quantity.FormatInductance(vlo))
	}
	if want > vhi {
		return 0, inputErrorf(param, "%s is more than %s can be even with 50 %% springback (%s): check the turns, length and leads, and the reading's unit",
			quantity.FormatInductance(want), what, quantity.FormatInductance(vhi))
	}
	for range 100 {
		mid := (lo + hi) / 2
		if value(mid) < want {
			lo = mid
		} else {
			hi = mid
		}
		if hi-lo < 1e-13 {
			break
		}
	}
	return (lo + hi) / 2, nil
}

// fitSpringbackClamped is fitSpringback held to the springback limits.
func fitSpringbackClamped(g coil.Geometry, sn sense, want float64) float64 {
	s, err := fitSpringback(g, sn, want)
	if err == nil {
		return s
	}
	if want < springbackValue(g, sn, coil.MinSpringback) {
		return coil.MinSpringback
	}
	return coil.MaxSpringback
}

// Target is the inductance a trim aims for, read in one sense of the
// model: the terminal inductance at Frequency (zero for low frequency) or,
// when Effective, the effective inductance there (self-capacitance
// included), which is what a resonance with a fixed capacitor depends on.
type Target struct {
	Inductance unit.Inductance
	Frequency  unit.Frequency
	Effective  bool
}

// ResonanceTarget is the target that makes a coil resonate at f with c
// across its terminals: an effective inductance of 1/(ω²c) at f.
func ResonanceTarget(f unit.Frequency, c unit.Capacitance) Target {
	return Target{Inductance: coil.InductanceForResonance(f, c), Frequency: f, Effective: true}
}

// Of is the model's value for g in the target's sense.
func (t Target) Of(g coil.Geometry) (unit.Inductance, error) {
	v, err := sense{t.Frequency, t.Effective}.of(g)
	return unit.Inductance(v), err
}
