package circuit

import (
	"testing"

	"turnwise/coil"
)

// A wound coil's self-resonance in the network follows its mounting: the
// grounded SRF with one end on ground, the floating SRF when the part says
// Floating (coil.Predict's values for the same coil, the same equivalent
// self-capacitance).
func TestWoundCoilMounting(t *testing.T) {
	g := coil.Geometry{FormerDiameter: 10e-3, WireDiameter: 0.8e-3, Turns: 12, Pitch: 1.6e-3}
	p, err := coil.Predict(g, 0)
	if err != nil {
		t.Fatal(err)
	}
	for _, tc := range []struct {
		m    coil.Mounting
		want float64
	}{{coil.Grounded, float64(p.SRF)}, {coil.Floating, float64(p.SRFFloating)}} {
		t.Run(tc.m.String(), func(t *testing.T) {
			rs := resonances(t, lone(&g, tc.m), 10e9)
			if len(rs) != 1 || rel(rs[0].Natural, tc.want) > 1e-3 {
				t.Errorf("resonances %+v, want one at %g Hz", rs, tc.want)
			}
		})
	}
	if float64(p.SRFFloating) < 1.1*float64(p.SRF) {
		t.Fatalf("floating SRF %g not above grounded %g", float64(p.SRFFloating), float64(p.SRF))
	}
}
