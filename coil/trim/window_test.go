package trim

import (
	"math"
	"testing"

	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// fatCoil is 4 turns of 1 mm wire on a 1.6 mm rod (mean diameter 2.6 mm):
// its window runs to p = 3 mm = 1.15·D, and there the inductance rises
// again past p ≈ 0.8·D. The helix Neumann integral agrees (coil's
// helix_neumann_test.go, computed for this coil: 16.22, 13.75, 13.15,
// 13.41, 14.16 nH without leads at p = 1, 1.5, 2.05, 2.5, 3 mm, the model
// within 0.01 nH of each).
func fatCoil(pitch float64) coil.Geometry {
	return coil.Geometry{FormerDiameter: 1.6e-3, WireDiameter: 1e-3, Turns: 4, Pitch: unit.Length(pitch), LeadLength: 5e-3}
}

// TestWindowNotMonotone: the window's least lies inside it, and the scan
// finds it (no sample of a fine sweep is lower).
func TestWindowNotMonotone(t *testing.T) {
	g := fatCoil(2e-3)
	tgt := Target{Inductance: 1e-9}
	w := scanWindow(g, tgt)
	tight, loose := windowPitches(g)
	if !(w.leastAt > tight && w.leastAt < loose) {
		t.Fatalf("least at %g, want inside %g … %g", w.leastAt, tight, loose)
	}
	if end := valueAtPitch(g, tgt, loose); !(w.least < end*0.97) {
		t.Errorf("least %g not below the loose end %g by 3 %%", w.least, end)
	}
	for i := range 2001 {
		p := tight + (loose-tight)*float64(i)/2000
		if v := valueAtPitch(g, tgt, p); v < w.least*(1-1e-9) {
			t.Fatalf("at pitch %g the value %g is below the scan's least %g", p, v, w.least)
		}
	}
}

// TestCorrectNotMonotone: targets between the window's least and its
// loose end lie on both branches; the correction lands on each, choosing
// the crossing nearest the present pitch, and a target below the least
// needs fewer turns.
func TestCorrectNotMonotone(t *testing.T) {
	tgt := Target{Inductance: 1e-9}
	w := scanWindow(fatCoil(2e-3), tgt)
	end := valueAtPitch(fatCoil(2e-3), tgt, 3e-3)
	for _, tc := range []struct {
		name           string
		present, value float64
		action         Action
	}{
		{"falling branch from close winding", 1e-3, (w.least + end) / 2, ActionSpread},
		{"rising branch from the loose end", 3e-3, (w.least + end) / 2, ActionSqueeze},
		{"just above the least", 2.4e-3, w.least * 1.002, ActionSqueeze},
		{"below the least", 2e-3, w.least * 0.97, ActionRemoveTurns},
	} {
		t.Run(tc.name, func(t *testing.T) {
			g := fatCoil(tc.present)
			c, err := Correct(g, Target{Inductance: unit.Inductance(tc.value)}, CorrectOptions{Tolerance: 0.001})
			if err != nil {
				t.Fatal(err)
			}
			if c.Action != tc.action {
				t.Errorf("action %v, want %v", c.Action, tc.action)
			}
			if e := relErr(float64(c.After), tc.value); e > 0.001 {
				t.Errorf("after %g, want %g (rel %.2g)", float64(c.After), tc.value, e)
			}
			if c.Action == ActionSpread || c.Action == ActionSqueeze {
				// The crossing nearest the present pitch: none lies nearer.
				moved := math.Abs(float64(c.Geometry.Pitch) - tc.present)
				for i := range 401 {
					p := 1e-3 + 2e-3*float64(i)/400
					if math.Abs(p-tc.present) < moved*0.99 && relErr(valueAtPitch(g, Target{Inductance: 1}, p), tc.value) < 1e-4 {
						t.Errorf("pitch %g is a nearer crossing than %g", p, float64(c.Geometry.Pitch))
					}
				}
			}
		})
	}
}
