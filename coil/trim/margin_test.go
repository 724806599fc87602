package trim

import (
	"testing"

	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// WindowMargin: a spread that would end within 10 % of the window's loose
// end (pitch 2.99 mm against a 3.00 mm limit, issue 10) becomes a quarter
// turn less spread into the window's middle; a spread well inside the
// window stays a spread.
func TestCorrectPrefersWindowMargin(t *testing.T) {
	t.Parallel()
	// 6 turns of 1 mm wire on 6 mm, 8 mm long, 5 mm leads: window pitch
	// 1.00 mm (close-wound) … 3.00 mm (LoosestPitchFactor·d_o).
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 6, Pitch: unit.Length((8e-3 - 1e-3) / 5), LeadLength: 5e-3}
	least, _, err := coil.Window(g, 0)
	if err != nil {
		t.Fatal(err)
	}
	tight, loose := windowPitches(g)
	cases := []struct {
		name       string
		target     float64 // fraction above the window's least
		wantAction Action
	}{
		{"deep spread to the loose end", 1.003, ActionRemoveTurns},
		{"spread inside the margin", 1.10, ActionSpread},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			tgt := Target{Inductance: unit.Inductance(float64(least) * tc.target)}
			c, err := Correct(g, tgt, CorrectOptions{Tolerance: 0.002})
			if err != nil {
				t.Fatal(err)
			}
			if c.Action != tc.wantAction {
				t.Fatalf("action %v, want %v (pitch %.3g mm in %.3g … %.3g mm)", c.Action, tc.wantAction, float64(c.Geometry.Pitch)*1e3, tight*1e3, loose*1e3)
			}
			x := windowPlace(c.Geometry, float64(c.Geometry.Pitch))
			if x < WindowMargin || x > 1-WindowMargin {
				t.Errorf("final pitch %.3g mm sits at %.2f of its window, want %.2f … %.2f", float64(c.Geometry.Pitch)*1e3, x, WindowMargin, 1-WindowMargin)
			}
			if miss := float64(c.After)/float64(tgt.Inductance) - 1; miss > 0.005 || miss < -0.005 {
				t.Errorf("after %.4g H misses the target by %.2f %%", float64(c.After), miss*100)
			}
		})
	}
}
