package thermal

import "math"

// Drift is how one resonance moves with temperature.
type Drift struct {
	Frequency float64 // Hz, at the reference temperature
	// PerK is d ln f / dT, per kelvin; HzPerK is f·PerK.
	PerK, HzPerK float64
	// Uncertainty is the root-sum-square of every part's coefficient
	// tolerance carried to d ln f / dT; WorstCase their sum of magnitudes.
	Uncertainty, WorstCase float64
}

// Shift is a resonance's move over a temperature range.
type Shift struct {
	Low, High   float64 // the range's ends, kelvin
	FLow, FHigh float64 // the resonance at each end, Hz
	Hz          float64 // FHigh − FLow
	Relative    float64 // Hz / Frequency at the reference
	Uncertainty float64 // Hz: |ΔT|·f·Drift.Uncertainty
}

// TankDrift is the drift of a simple LC tank at f: d ln f = −½(d ln L +
// d ln C). tolL is the uncertainty of the inductor's coefficient.
func TankDrift(f, tempcoL, tolL float64, c Class) Drift {
	per := -0.5 * (tempcoL + c.Nominal)
	u := 0.5 * math.Hypot(tolL, c.Tolerance)
	return Drift{Frequency: f, PerK: per, HzPerK: per * f, Uncertainty: u, WorstCase: 0.5 * (math.Abs(tolL) + c.Tolerance)}
}

// TankShift is a simple tank's resonance at the ends of a range (kelvin)
// around the reference temperature ref, with L and C each growing linearly
// by its coefficient: f(T) = f/√((1+τ_L·ΔT)(1+τ_C·ΔT)).
func TankShift(d Drift, tempcoL float64, c Class, ref, low, high float64) Shift {
	at := func(t float64) float64 {
		dt := t - ref
		return d.Frequency / math.Sqrt((1+tempcoL*dt)*(1+c.Nominal*dt))
	}
	s := Shift{Low: low, High: high, FLow: at(low), FHigh: at(high)}
	s.Hz = s.FHigh - s.FLow
	s.Relative = s.Hz / d.Frequency
	s.Uncertainty = math.Abs(high-low) * d.Frequency * d.Uncertainty
	return s
}
