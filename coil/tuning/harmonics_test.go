package tuning

import (
	"math"
	"strings"
	"testing"
)

// A tap that puts the high range at 3.96–3.98× the low range across the
// whole dial (the invented HF coil tapped 26.25 turns from the cold end):
// the 4th harmonic of the low range follows the high range within 1 %.
// Checking only orders 2 and 3 says nothing; the default (up to 5) names
// the stretch, and the stretch is the whole dial.
func TestFourthHarmonicTracking(t *testing.T) {
	t.Parallel()
	base := Spec{Geometry: hfTapExample(), TapTurns: 26.25, A: hfGang(), B: hfGang()}
	c, err := newSpanCircuit(base)
	if err != nil {
		t.Fatal(err)
	}
	// The premise, checked by brute force: the ratio is within 2 % of 4
	// at every 1 % of the dial.
	for i := 0; i <= 100; i++ {
		r, _ := c.at(float64(i) / 100)
		if q := float64(r.FHigh) / float64(r.FLow); math.Abs(q/4-1) > 0.02 {
			t.Fatalf("premise: ratio %.4f at %d %%", q, i)
		}
	}
	for _, tc := range []struct {
		name   string
		maxH   int
		want4  bool
		wantOK bool
	}{
		{"up to 3rd misses it", 3, false, true},
		{"default finds it", 0, true, true},
		{"up to 6th finds it", 6, true, true},
	} {
		t.Run(tc.name, func(t *testing.T) {
			spec := base
			spec.MaxHarmonic = tc.maxH
			sp, err := Solve(spec)
			if err != nil {
				t.Fatal(err)
			}
			var got *Tracking
			for i := range sp.Tracking {
				if sp.Tracking[i].Order == 4 {
					got = &sp.Tracking[i]
				}
			}
			if (got != nil) != tc.want4 {
				t.Fatalf("order-4 tracking %v, want %v (%+v)", got != nil, tc.want4, sp.Tracking)
			}
			if got == nil {
				return
			}
			if got.SettingFrom != 0 || got.SettingTo != 1 {
				t.Errorf("stretch %g–%g, want the whole dial", got.SettingFrom, got.SettingTo)
			}
			if !(got.RatioMin > 3.9 && got.RatioMax < 4.05 && got.Closest < 0.02) {
				t.Errorf("tracking %+v", *got)
			}
			found := false
			for _, w := range sp.Warnings {
				if strings.Contains(w, "4th harmonic") && strings.Contains(w, "whole dial") {
					found = true
				}
			}
			if !found {
				t.Errorf("no 4th-harmonic warning in %q", sp.Warnings)
			}
		})
	}
}

// A 5th-order coincidence inside the passband is reported as one: a tap
// where f_high/f_low crosses 5 on the dial, with a loaded Q low enough for
// the harmonic to be inside the passband near the crossing.
func TestFifthOrderCoincidence(t *testing.T) {
	t.Parallel()
	// Find, by brute force, a tap whose ratio crosses 5 on the dial.
	var tap float64
	for i := 4; i < 160; i++ {
		c, err := newSpanCircuit(Spec{Geometry: hfTapExample(), TapTurns: float64(i) / 4, A: hfGang(), B: hfGang()})
		if err != nil {
			t.Fatal(err)
		}
		a, _ := c.at(0)
		b, _ := c.at(1)
		ra, rb := float64(a.FHigh/a.FLow), float64(b.FHigh/b.FLow)
		if (ra-5)*(rb-5) < 0 {
			tap = float64(i) / 4
			break
		}
	}
	if tap == 0 {
		t.Skip("no tap of the example crosses a ratio of 5")
	}
	sp, err := Solve(Spec{Geometry: hfTapExample(), TapTurns: tap, A: hfGang(), B: hfGang(), LoadedQ: 50})
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, co := range sp.Coincidences {
		if co.Order == 5 {
			n++
			if math.Abs(float64(co.Harmonic)-5*float64(co.FLow)) > 1e-9*float64(co.Harmonic) || co.Depth > 1 {
				t.Errorf("%+v", co)
			}
		}
	}
	if n == 0 {
		t.Errorf("tap %g: no 5th-order coincidence in %+v", tap, sp.Coincidences)
	}
}
