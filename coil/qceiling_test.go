package coil

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/unit"
)

// The top of the likely Q band never exceeds the Q of the same coil with
// no proximity loss: removing proximity divides the winding's resistance by
// Φ and leaves the leads and radiation, so that ceiling is at most Φ·Q. At
// wide pitches (p/d 6…10) Medhurst's Φ is within a few per cent of 1
// (Medhurst 1947, from memory) and 1.1·Q would promise more than the wire
// alone allows; at close pitch Φ > 1.1 and 1.1·Q stands.
func TestQMaxCappedAtNoProximityCeiling(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name       string
		pd         float64
		wantCapped bool // the ceiling, not 1.1·Q, sets QMax
	}{
		{"p/d 1.5 close", 1.5, false},
		{"p/d 6", 6, true},
		{"p/d 8", 8, true},
		{"p/d 10", 10, true},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			g := Geometry{FormerDiameter: 30e-3, WireDiameter: 1e-3, Turns: 6, Pitch: unit.Length(tc.pd * 1e-3)}
			p, err := Predict(g, 7e6)
			if err != nil {
				t.Fatal(err)
			}
			bound := p.Q * p.ProximityFactor // no-proximity Q is at most this
			if p.QMax > bound*(1+1e-9) {
				t.Errorf("QMax %.2f above Φ·Q = %.2f (Q %.2f, Φ %.3f)", p.QMax, bound, p.Q, p.ProximityFactor)
			}
			if p.QMax < p.Q {
				t.Errorf("QMax %.2f below Q %.2f", p.QMax, p.Q)
			}
			capped := math.Abs(p.QMax-p.Q*QMaxFactor) > 1e-9*p.Q
			if capped != tc.wantCapped {
				t.Errorf("QMax %.2f vs 1.1·Q %.2f (Φ %.3f): capped=%v, want %v", p.QMax, p.Q*QMaxFactor, p.ProximityFactor, capped, tc.wantCapped)
			}
		})
	}
}
