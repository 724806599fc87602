package thermal

import (
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/tuning"
)

// DialDrift is the drift of both ranges of a two-gang circuit at one dial
// setting.
type DialDrift struct {
	Setting   float64
	Low, High Drift // High.Frequency is zero when the circuit has one resonance
	// SectionsAt is the frequency the coil's sections were evaluated at
	// (the geometric mean of the two resonances at the reference).
	SectionsAt float64
}

// SpanDrift computes the drift of spec's two ranges at each dial setting
// (0 plates open … 1 fully meshed): the coil's dimensions move by its
// support, both gang sections and their trimmers by gang's coefficient
// (AirVariable for the usual air-spaced gang), strays stay. Each
// resonance is solved again (tuning.TwoNodeResonances, the coil's sections
// and self-capacitance from the model at the moved geometry) at ±Step
// kelvin. The uncertainty carries the gang's tolerance and the former's
// class spread, root sum square.
func SpanDrift(spec tuning.Spec, s Support, gang Class, settings []float64) ([]DialDrift, error) {
	if _, err := tuning.Solve(tuning.Spec{Geometry: spec.Geometry, TapTurns: spec.TapTurns, A: spec.A, B: spec.B}); err != nil {
		return nil, err
	}
	if err := s.validate(); err != nil {
		return nil, err
	}
	for _, x := range settings {
		if !(x >= 0 && x <= 1) {
			return nil, coil.InputErrorf("dial", "setting %g is outside 0 … 100 %%", x*100)
		}
	}
	out := make([]DialDrift, 0, len(settings))
	for _, x := range settings {
		base, err := dialAt(spec, s, gang.Nominal, x, 0, 0)
		if err != nil {
			return nil, err
		}
		fRef := float64(base.Low)
		if base.High > 0 {
			fRef = math.Sqrt(float64(base.Low) * float64(base.High))
		}
		slope := func(sup Support, tau float64) (lo, hi float64, err error) {
			a, err := dialAt(spec, sup, tau, x, -Step, fRef)
			if err != nil {
				return 0, 0, err
			}
			b, err := dialAt(spec, sup, tau, x, Step, fRef)
			if err != nil {
				return 0, 0, err
			}
			lo = float64(b.Low-a.Low) / (2 * Step)
			if a.High > 0 && b.High > 0 {
				hi = float64(b.High-a.High) / (2 * Step)
			}
			return lo, hi, nil
		}
		ref, err := dialAt(spec, s, gang.Nominal, x, 0, fRef)
		if err != nil {
			return nil, err
		}
		dl, dh, err := slope(s, gang.Nominal)
		if err != nil {
			return nil, err
		}
		// Tolerances: the gang's, then the former's spread.
		var uL, uH []float64
		if gang.Tolerance > 0 {
			l2, h2, err := slope(s, gang.Nominal+gang.Tolerance)
			if err != nil {
				return nil, err
			}
			uL, uH = append(uL, l2-dl), append(uH, h2-dh)
		}
		if !s.SelfSupporting && s.FormerHigh > s.FormerLow {
			s2 := s
			s2.Former += (s.FormerHigh - s.FormerLow) / 2
			l2, h2, err := slope(s2, gang.Nominal)
			if err != nil {
				return nil, err
			}
			uL, uH = append(uL, l2-dl), append(uH, h2-dh)
		}
		dd := DialDrift{Setting: x, Low: makeDrift(float64(ref.Low), dl, uL), SectionsAt: fRef}
		if ref.High > 0 {
			dd.High = makeDrift(float64(ref.High), dh, uH)
		}
		out = append(out, dd)
	}
	return out, nil
}

// makeDrift builds a Drift from a slope in Hz/K and the slope's changes
// under each tolerance.
func makeDrift(f, hzPerK float64, us []float64) Drift {
	d := Drift{Frequency: f, HzPerK: hzPerK, PerK: hzPerK / f}
	var ss, sum float64
	for _, u := range us {
		ss += (u / f) * (u / f)
		sum += math.Abs(u / f)
	}
	d.Uncertainty, d.WorstCase = math.Sqrt(ss), sum
	return d
}

// dialAt solves the two-gang circuit at setting x, dT kelvin from the
// reference, the gang sections and trimmers scaled by (1 + tau·dT). fRef
// is the frequency for the coil's sections (zero: low frequency).
func dialAt(spec tuning.Spec, s Support, tau, x, dT, fRef float64) (tuning.Resonances, error) {
	g := s.At(spec.Geometry, dT)
	sec, err := coil.Tap(g, spec.TapTurns, unit.Frequency(fRef))
	if err != nil {
		return tuning.Resonances{}, err
	}
	var p coil.Prediction
	coil.Evaluate(&p, &g, 0)
	k := unit.Capacitance(1 + tau*dT)
	ct := (spec.A.Capacitance(x)+spec.A.Trimmer)*k + spec.A.Stray + p.SelfCapacitance
	cb := (spec.B.Capacitance(x)+spec.B.Trimmer)*k + spec.B.Stray
	return tuning.TwoNodeResonances(sec, ct, cb)
}

// SpanShift is the move of both ranges at dial setting d.Setting (a
// result of SpanDrift for the same spec, support and gang) over a
// temperature range low … high in kelvin: the circuit solved again at
// each end, the reference being the coil's own temperature (zero: 20 °C).
// The uncertainty is |high − low|·f·d.Uncertainty. hi is zero when the
// circuit has one resonance.
func SpanShift(spec tuning.Spec, s Support, gang Class, d DialDrift, low, high float64) (lo, hi Shift, err error) {
	if !(high > low) || low <= 0 {
		return lo, hi, coil.InputErrorf("temp_range", "%g K … %g K: give a low end below the high end, both above absolute zero", low, high)
	}
	ref := kelvin(spec.Geometry.Temperature)
	fRef := d.SectionsAt
	a, err := dialAt(spec, s, gang.Nominal, d.Setting, low-ref, fRef)
	if err != nil {
		return lo, hi, err
	}
	b, err := dialAt(spec, s, gang.Nominal, d.Setting, high-ref, fRef)
	if err != nil {
		return lo, hi, err
	}
	mk := func(dr Drift, fa, fb float64) Shift {
		sh := Shift{Low: low, High: high, FLow: fa, FHigh: fb, Hz: fb - fa}
		sh.Relative = sh.Hz / dr.Frequency
		sh.Uncertainty = (high - low) * dr.Frequency * dr.Uncertainty
		return sh
	}
	lo = mk(d.Low, float64(a.Low), float64(b.Low))
	if d.High.Frequency > 0 && a.High > 0 && b.High > 0 {
		hi = mk(d.High, float64(a.High), float64(b.High))
	}
	return lo, hi, nil
}
