package thermal

import (
	"math"
	"testing"

	"turnwise/coil/tuning"
)

// A two-gang circuit whose every inductance and capacitance grows as
// copper does (self-supporting coil, a gang of copper's coefficient, no
// strays) has both resonances falling by α_Cu per kelvin: f ∝ 1/√(LC)
// with L and C each ∝ the length scale. Exactly so with the sections at
// low frequency; at f the skin term (internal inductance with copper's
// resistivity) departs from it, more in the high range, whose frequency
// rests on the sections' leakage inductance.
func TestSpanDriftScales(t *testing.T) {
	t.Parallel()
	spec := tuning.Spec{Geometry: demoCoil(), TapTurns: 4,
		A: tuning.GangSection{Min: 15e-12, Max: 365e-12, Law: tuning.LawSLC},
		B: tuning.GangSection{Min: 15e-12, Max: 365e-12, Law: tuning.LawSLC}}
	cu := Class{Code: "copper-like", Nominal: CopperExpansion}
	ds, err := SpanDrift(spec, Support{SelfSupporting: true}, cu, []float64{0, 0.5, 1})
	if err != nil {
		t.Fatal(err)
	}
	for _, x := range []float64{0, 0.5, 1} {
		a, err := dialAt(spec, Support{SelfSupporting: true}, CopperExpansion, x, -Step, 0)
		if err != nil {
			t.Fatal(err)
		}
		b, _ := dialAt(spec, Support{SelfSupporting: true}, CopperExpansion, x, Step, 0)
		for _, r := range [][2]float64{{float64(a.Low), float64(b.Low)}, {float64(a.High), float64(b.High)}} {
			// f(1−αh)/f(1+αh) exactly: (f_b − f_a)/(2h·f0) with f0 the mean to O(h²).
			per := (r[1] - r[0]) / (2 * Step * (r[0] + r[1]) / 2)
			if rel(per, -CopperExpansion) > 1e-6 { // dimensional analysis
				t.Errorf("setting %g at low frequency: %.8g /K, want %.8g", x, per, -CopperExpansion)
			}
		}
	}
	for _, d := range ds {
		for _, r := range []Drift{d.Low, d.High} {
			if math.Abs(r.PerK+CopperExpansion) > 5e-6 { // skin term, a few ppm/K at HF (TestSkinTermAnalytic)
				t.Errorf("setting %g: %.4g MHz drifts %.3f ppm/K, want about %.3f", d.Setting, r.Frequency/1e6, r.PerK*1e6, -CopperExpansion*1e6)
			}
		}
	}
}

// The usual case: a self-supporting coil on an air gang; both ranges fall
// (coil and gang both grow), within ½(α_Cu + air's coefficient and
// tolerance).
func TestSpanDriftAirGang(t *testing.T) {
	t.Parallel()
	g := demoCoil()
	spec := tuning.Spec{Geometry: g, TapTurns: 4,
		A: tuning.GangSection{Min: 15e-12, Max: 365e-12, Law: tuning.LawSLC, Stray: 5e-12},
		B: tuning.GangSection{Min: 15e-12, Max: 365e-12, Law: tuning.LawSLC}}
	ds, err := SpanDrift(spec, Support{SelfSupporting: true}, AirVariable, []float64{0, 0.5, 1})
	if err != nil {
		t.Fatal(err)
	}
	for _, d := range ds {
		if !(d.Low.PerK < 0) || !(d.Low.Uncertainty > 0) {
			t.Errorf("setting %g: low %+v", d.Setting, d.Low)
		}
		// Both capacitors and the coil grow: both ranges fall, by less than
		// ½(α_Cu + air's +50 ppm/K) plus the uncertainty.
		bound := 0.5*(CopperExpansion+AirVariable.Nominal) + 0.5*AirVariable.Tolerance + 10e-6
		if math.Abs(d.Low.PerK) > bound || (d.High.Frequency > 0 && math.Abs(d.High.PerK) > bound) {
			t.Errorf("setting %g: drifts %.3g, %.3g ppm/K beyond %.3g", d.Setting, d.Low.PerK*1e6, d.High.PerK*1e6, bound*1e6)
		}
		t.Logf("dial %3.0f %%: low %.4g MHz %.2f ± %.2f ppm/K, high %.4g MHz %.2f ± %.2f ppm/K", d.Setting*100,
			d.Low.Frequency/1e6, d.Low.PerK*1e6, d.Low.Uncertainty*1e6, d.High.Frequency/1e6, d.High.PerK*1e6, d.High.Uncertainty*1e6)
	}
	if _, err := SpanDrift(spec, Support{SelfSupporting: true}, AirVariable, []float64{1.5}); err == nil {
		t.Error("setting 150 %: no error")
	}
}

// SpanShift over a range centred on the coil's temperature (20 °C) agrees
// with the drift per kelvin times the range: the first-order terms match
// and the second-order ones cancel between the ends, leaving third order
// (below 1e-7 of f for tens of ppm/K over 30 K). It refuses a reversed
// range.
func TestSpanShiftLinear(t *testing.T) {
	t.Parallel()
	spec := tuning.Spec{Geometry: demoCoil(), TapTurns: 4,
		A: tuning.GangSection{Min: 15e-12, Max: 365e-12, Law: tuning.LawSLC, Stray: 5e-12},
		B: tuning.GangSection{Min: 15e-12, Max: 365e-12, Law: tuning.LawSLC}}
	sup := Support{SelfSupporting: true}
	ds, err := SpanDrift(spec, sup, AirVariable, []float64{0, 0.5, 1})
	if err != nil {
		t.Fatal(err)
	}
	for _, d := range ds {
		lo, hi, err := SpanShift(spec, sup, AirVariable, d, 278.15, 308.15) // 5 °C … 35 °C
		if err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct {
			dr Drift
			sh Shift
		}{{d.Low, lo}, {d.High, hi}} {
			want := c.dr.HzPerK * 30
			if math.Abs(c.sh.Hz-want) > 1e-7*c.dr.Frequency {
				t.Errorf("setting %g, %.4g MHz: shift %.1f Hz, drift × 30 K = %.1f Hz", d.Setting, c.dr.Frequency/1e6, c.sh.Hz, want)
			}
			if !(c.sh.Uncertainty > 0) {
				t.Errorf("setting %g: no uncertainty", d.Setting)
			}
		}
	}
	if _, _, err := SpanShift(spec, sup, AirVariable, ds[0], 313, 283); err == nil {
		t.Error("reversed range: no error")
	}
}
