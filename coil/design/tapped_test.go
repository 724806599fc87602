package design

import (
	"math"
	"testing"
	"turnwise/coil"
)

// A tapped design for a 50 Ω antenna on the 2 m tank: every candidate's
// taps re-check through coil.Tap (the same computation `turnwise tap --at`
// runs), and the tolerance verdict follows the ±10 % rule.
func TestTappedDesignRechecks(t *testing.T) {
	t.Parallel()
	sups, wires := testStock()
	b := BandTarget{Low: 144e6, High: 146e6, Fixed: 15e-12, Stray: 2e-12, TrimMin: 2e-12, TrimMax: 10e-12}
	res, err := SearchBand(b, Constraints{Supports: sups, Wires: wires, LeadLength: 5e-3, Top: 3})
	if err != nil {
		t.Fatal(err)
	}
	res, err = AddTaps(res, TapGoalInfo{Load: &coil.LoadGoal{Source: 50}}, 145e6)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range res.Candidates {
		p := c.Tapped.Plan
		if len(p.Taps) == 0 || p.Link == nil {
			t.Fatalf("plan %+v", p)
		}
		for _, tc := range p.Taps {
			s, err := coil.Tap(c.Prediction.Geometry, tc.TapTurns, 145e6)
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(s.ImpedanceRatio()/tc.Achieved-1) > 1e-12 {
				t.Errorf("tap %g: %g, tap gives %g", tc.TapTurns, tc.Achieved, s.ImpedanceRatio())
			}
		}
		if p.Within != (math.Abs(p.Taps[0].Error) <= 0.10) {
			t.Errorf("within %v at %g", p.Within, p.Taps[0].Error)
		}
	}
	// A plain ratio goal: 1:945 (the ratio of a 47 kΩ tank to 50 Ω).
	res, err = AddTaps(res, TapGoalInfo{Ratio: 1.0 / 945}, 145e6)
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range res.Candidates {
		if c.Tapped.Plan.WantRatio != 1.0/945 || c.Tapped.Plan.Divider == nil {
			t.Errorf("%+v", c.Tapped.Plan)
		}
	}
}
