package coil

import (
	"math"
	"testing"
)

// The loaded-Q rule by hand (Terman 1943, from memory): a tank of
// X = 100 Ω and Q_u = 200 has R_p = 20 kΩ; 50 Ω at a tap of voltage
// ratio 0.05 loads it with 50/0.0025 = 20 kΩ, so R = 10 kΩ and Q_L = 100:
// matched, half the unloaded Q.
func TestLoadedQByHand(t *testing.T) {
	t.Parallel()
	if got := LoadedQ(100, 20e3, 50, 0.05); math.Abs(got-100) > 1e-9 {
		t.Errorf("matched: Q_L %g, want 100", got)
	}
	// 50 Ω at n = 0.1 loads with 5 kΩ: R = 4 kΩ, Q_L = 40.
	if got := LoadedQ(100, 20e3, 50, 0.1); math.Abs(got-40) > 1e-9 {
		t.Errorf("n=0.1: Q_L %g, want 40", got)
	}
}

// TapForLoad: the wanted ratio follows the rule; each tap's loaded Q is
// the rule at the ratio coil.Tap gives for that tap; the link's loaded Q
// is recomputed from its M and L by hand.
func TestTapForLoad(t *testing.T) {
	t.Parallel()
	g := Geometry{FormerDiameter: 20e-3, WireDiameter: 0.5e-3, WireOverall: 0.55e-3, Turns: 40, Pitch: 1e-3, LeadLength: 20e-3}
	for _, tc := range []struct {
		name string
		goal LoadGoal
	}{
		{"matched, model Q", LoadGoal{Frequency: 7.1e6, Source: 50}},
		{"loaded Q 40, tank Q 150", LoadGoal{Frequency: 7.1e6, Source: 50, TankQ: 150, LoadedQ: 40}},
		{"tank impedance", LoadGoal{Frequency: 7.1e6, Source: 50, TankImpedance: 30e3, LoadedQ: 20}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			p, err := TapForLoad(g, tc.goal)
			if err != nil {
				t.Fatal(err)
			}
			x, rp := float64(p.X), float64(p.TankR)
			want := 50 * (1/(p.WantLoadedQ*x) - 1/rp)
			if math.Abs(p.WantRatio/want-1) > 1e-12 {
				t.Errorf("ratio %g, want %g", p.WantRatio, want)
			}
			if len(p.Taps) == 0 {
				t.Fatal("no taps")
			}
			for _, c := range p.Taps {
				s, err := Tap(g, c.TapTurns, tc.goal.Frequency)
				if err != nil {
					t.Fatal(err)
				}
				if math.Abs(s.Ratio*s.Ratio/c.Achieved-1) > 1e-12 {
					t.Errorf("tap %g: ratio %g re-checked as %g", c.TapTurns, c.Achieved, s.Ratio*s.Ratio)
				}
				if math.Abs(c.LoadedQ/LoadedQ(x, rp, 50, s.Ratio)-1) > 1e-12 {
					t.Errorf("tap %g: Q_L %g", c.TapTurns, c.LoadedQ)
				}
			}
			if p.Within != (math.Abs(p.Taps[0].Error) <= TapRatioTolerance) {
				t.Errorf("within %v, error %g", p.Within, p.Taps[0].Error)
			}
			l := p.Link
			w := 2 * math.Pi * float64(tc.goal.Frequency)
			wm, xl := w*float64(l.M), w*float64(l.L)
			ql := x / (x/p.TankQ + wm*wm*50/(2500+xl*xl))
			if math.Abs(l.LoadedQ/ql-1) > 1e-12 {
				t.Errorf("link Q_L %g, by hand %g", l.LoadedQ, ql)
			}
			d := p.Divider
			series := float64(d.C1) * float64(d.C2) / float64(d.C1+d.C2)
			if math.Abs(series/float64(d.Tank)-1) > 1e-12 || math.Abs(d.Ratio*d.Ratio/p.WantRatio-1) > 1e-12 {
				t.Errorf("divider %+v", d)
			}
		})
	}
}
