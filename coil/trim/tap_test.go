package trim

import (
	"errors"
	"math"
	"testing"
	"turnwise/coil"
)

// Section readings made from the model for a coil with a known springback
// give that springback back for each section, no residual against the
// whole-coil calibration, and the model's tap ratio as the measured one:
// with M = (L − L_a − L_b)/2 the ratio (L_b + M)/L is an identity.
func TestCalibrateSectionsRoundTrip(t *testing.T) {
	t.Parallel()
	const sb = 0.04
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 2e-3, LeadLength: 4e-3}
	truth := g
	truth.Springback = sb
	const tap = 1.25
	sec, err := coil.Tap(truth, tap, 0)
	if err != nil {
		t.Fatal(err)
	}
	whole := Measurement{Kind: MeasureDirect, Inductance: sec.L, MeterTolerance: 0.02}
	cal, err := Calibrate(g, whole)
	if err != nil {
		t.Fatal(err)
	}
	bottom := &Measurement{Kind: MeasureDirect, Inductance: sec.LB, MeterTolerance: 0.02}
	top := &Measurement{Kind: MeasureDirect, Inductance: sec.LA, MeterTolerance: 0.02}
	sc, err := CalibrateSections(cal, tap, bottom, top)
	if err != nil {
		t.Fatal(err)
	}
	for name, f := range map[string]*SectionFit{"bottom": sc.Bottom, "top": sc.Top} {
		if math.Abs(f.Springback-sb) > 1e-7 || math.Abs(f.Residual) > 1e-7 {
			t.Errorf("%s: springback %g residual %g, want %g and 0", name, f.Springback, f.Residual, sb)
		}
	}
	if relErr(sc.MeasuredRatio, sec.Ratio) > 1e-9 || relErr(sc.ModelRatio, sec.Ratio) > 1e-7 {
		t.Errorf("ratio measured %g model %g, true %g", sc.MeasuredRatio, sc.ModelRatio, sec.Ratio)
	}

	// A bottom section that reads 5 % high departs from the rest by that.
	bottom.Inductance *= 1.05
	sc, err = CalibrateSections(cal, tap, bottom, nil)
	if err != nil {
		t.Fatal(err)
	}
	if want := 1/1.05 - 1; math.Abs(sc.Bottom.Residual-want) > 1e-6 || sc.Bottom.Springback <= sb || sc.Top != nil || sc.MeasuredRatio != 0 {
		t.Errorf("high bottom: residual %g (want %g), springback %g", sc.Bottom.Residual, want, sc.Bottom.Springback)
	}
}

func TestCalibrateSectionsRefuses(t *testing.T) {
	t.Parallel()
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 2e-3, LeadLength: 4e-3}
	cal, err := Calibrate(g, Measurement{Kind: MeasureDirect, Inductance: 90e-9, MeterTolerance: 0.02})
	if err != nil {
		t.Fatal(err)
	}
	ok := &Measurement{Kind: MeasureDirect, Inductance: 20e-9}
	tests := []struct {
		name      string
		tap       float64
		bottom    *Measurement
		wantParam string
	}{
		{"tap at the end", 5, ok, "tap_turns"},
		{"tap beyond", 6, ok, "tap_turns"},
		{"third of a turn", 1.3, ok, "tap_turns"},
		{"resonance for a section", 1, &Measurement{Kind: MeasureResonance, Resonances: []Resonance{{100e6, 10e-12}}}, "measured_bottom"},
		{"section larger than the coil could be", 1, &Measurement{Kind: MeasureDirect, Inductance: 1e-6}, "measured_bottom"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			_, err := CalibrateSections(cal, tc.tap, tc.bottom, nil)
			var ie *coil.InputError
			if !errors.As(err, &ie) || ie.Param != tc.wantParam {
				t.Fatalf("err = %v, want *coil.InputError for %q", err, tc.wantParam)
			}
		})
	}
}

// MoveTap picks the quarter turn nearest the ratio among all of them.
func TestMoveTap(t *testing.T) {
	t.Parallel()
	g := coil.Geometry{FormerDiameter: 20e-3, WireDiameter: 0.5e-3, WireOverall: 0.55e-3, Turns: 28, Pitch: 0.6e-3, LeadLength: 30e-3}
	for _, ratio := range []float64{0.1, 0.25, 0.5} {
		c, err := MoveTap(g, 5e6, ratio)
		if err != nil {
			t.Fatal(err)
		}
		best := math.Inf(1)
		for q := 1; q < 28*4; q++ {
			s, err := coil.Tap(g, float64(q)/4, 5e6)
			if err != nil {
				t.Fatal(err)
			}
			best = math.Min(best, math.Abs(s.Ratio-ratio))
		}
		if math.Abs(math.Abs(c.Ratio-ratio)-best) > 1e-12 {
			t.Errorf("ratio %g: tap %g gives %g, but a tap %g off exists", ratio, c.TapTurns, c.Ratio, best)
		}
	}
}

// ResonanceWith against the fixed-point iteration of the round trips.
func TestResonanceWith(t *testing.T) {
	t.Parallel()
	for _, cc := range trimCoils {
		f, err := ResonanceWith(cc.g, cc.c)
		if err != nil {
			t.Fatal(err)
		}
		if want := resonanceFixedPoint(t, cc.g, float64(cc.c)); relErr(float64(f), want) > 1e-9 {
			t.Errorf("%s: %v, fixed point %g", cc.name, f, want)
		}
	}
	if _, err := ResonanceWith(vhfExample(), 0.01e-12); err == nil {
		t.Error("a capacitor too small to resonate below the SRF was accepted")
	}
}
