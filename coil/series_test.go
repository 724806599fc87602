package coil

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/unit"
)

// The series model, with its self-capacitance put back the way Predict
// does it, must give Predict's effective inductance and resistance.
func TestModelAtMatchesPredict(t *testing.T) {
	g := Geometry{FormerDiameter: 10e-3, WireDiameter: 1e-3, Turns: 8, Pitch: 2e-3, LeadLength: 10e-3}
	for _, f := range []unit.Frequency{0, 1e6, 30e6, 100e6} {
		p, err := Predict(g, f)
		if err != nil {
			t.Fatal(err)
		}
		m, err := ModelAt(g, f)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(float64(m.L+m.LLeads-p.Inductance)) > 1e-12*float64(p.Inductance) {
			t.Errorf("f=%v: L %v, Predict %v", f, m.L+m.LLeads, p.Inductance)
		}
		if f == 0 {
			continue
		}
		// Predict's effective values: leads plus the winding transformed by
		// its self-capacitance, 1/(1−(f/SRF)²) for L and its square for R.
		rr := float64(f / p.SRF)
		gr := 1 - rr*rr
		if l := float64(m.LLeads) + float64(m.L)/gr; math.Abs(l-float64(p.InductanceEffective)) > 1e-12*l {
			t.Errorf("f=%v: rebuilt L_eff %g, Predict %g", f, l, float64(p.InductanceEffective))
		}
		want := float64(m.RLeads) + float64(m.R)/(gr*gr)
		if math.Abs(want-float64(p.RAC)) > 1e-9*float64(p.RAC) {
			t.Errorf("f=%v: rebuilt R_ac %g, Predict %g", f, want, float64(p.RAC))
		}
	}
	// Above the self-resonance ModelAt still answers.
	p, _ := Predict(g, 0)
	if _, err := ModelAt(g, 2*p.SRF); err != nil {
		t.Errorf("ModelAt above SRF: %v", err)
	}
}
