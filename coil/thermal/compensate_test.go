package thermal

import (
	"math"
	"testing"

	"turnwise/coil/circuit"
)

// Our own tank: the demo coil on a 20 mm rigid-PVC former with 100 pF.
// The split Compensate proposes, put back into the network as two
// capacitors with their classes, leaves under 5 ppm/K.
func TestCompensationOnPVC(t *testing.T) {
	t.Parallel()
	g := demoCoil()
	sup := &Support{Former: pvc, FormerLow: 50e-6, FormerHigh: 80e-6}
	c0g, _ := ParseClass("C0G")
	const cTank = 100e-12
	net := &circuit.Network{
		Nodes: []string{"gnd", "tank"},
		Parts: []circuit.Part{
			{Name: "L1", Kind: circuit.Wound, A: 1, B: 0, Coil: &g, TapNode: -1},
			{Name: "C1", Kind: circuit.Capacitor, A: 1, B: 0, Value: cTank},
		},
		Ports: []circuit.Port{{Node: 1, Z0: 50}},
	}
	rds, err := NetworkDrift(net, []PartCoefficient{{Support: sup}, {Class: c0g}}, 30e6)
	if err != nil || len(rds) != 1 {
		t.Fatalf("%v %+v", err, rds)
	}
	before := rds[0]
	sens := before.Sensitivity[1]
	target := c0g.Nominal - before.PerK/sens
	split, err := Compensate(cTank, sens, target, CompensateOptions{})
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("before: %.2f ppm/K at %.4g MHz; split %g pF %s + %g pF %s: coefficient %.1f ppm/K (target %.1f), residual %.2f ± %.2f ppm/K, value %+.1f %%",
		before.PerK*1e6, before.Frequency/1e6, split.A.Value*1e12, split.A.Class.Code, split.B.Value*1e12, split.B.Class.Code,
		split.Coefficient*1e6, target*1e6, split.Residual*1e6, split.Uncertainty*1e6, split.ValueError*100)
	if math.Abs(before.PerK) < 20e-6 {
		t.Fatalf("uncompensated drift %.3g ppm/K is too small to test compensation", before.PerK*1e6)
	}
	// Put back: C1 and C2 of the split's classes in the solver.
	back := &circuit.Network{
		Nodes: net.Nodes,
		Parts: []circuit.Part{
			net.Parts[0],
			{Name: "C1", Kind: circuit.Capacitor, A: 1, B: 0, Value: split.A.Value},
			{Name: "C2", Kind: circuit.Capacitor, A: 1, B: 0, Value: split.B.Value},
		},
		Ports: net.Ports,
	}
	coefs := []PartCoefficient{{Support: sup}, {Class: split.A.Class}, {Class: split.B.Class}}
	if split.B.Value == 0 {
		back.Parts = back.Parts[:2]
		coefs = coefs[:2]
	}
	after, err := NetworkDrift(back, coefs, 30e6)
	if err != nil || len(after) != 1 {
		t.Fatalf("%v %+v", err, after)
	}
	if math.Abs(after[0].PerK) >= 5e-6 { // the bound
		t.Errorf("compensated drift %.3g ppm/K, want under 5", after[0].PerK*1e6)
	}
	// The split's own residual predicts the solver's to first order (the
	// total moved by ValueError, which shifts the frequency, not the slope).
	if math.Abs(after[0].PerK-split.Residual) > 1e-6 {
		t.Errorf("solver %.3g ppm/K, split's residual %.3g ppm/K", after[0].PerK*1e6, split.Residual*1e6)
	}
	t.Logf("after: %.3f ppm/K ± %.2f (RSS)", after[0].PerK*1e6, after[0].Uncertainty*1e6)
}

// A simple tank with an ideal inductor of +100 ppm/K needs −100 ppm/K:
// the search must find a pair whose residual is inside its uncertainty.
func TestCompensateSimple(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		c, tauL float64
	}{{100e-12, 100e-6}, {47e-12, 60e-6}, {330e-12, 20e-6}, {1e-9, 300e-6}} {
		s, err := Compensate(tc.c, -0.5, -tc.tauL, CompensateOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if !s.WithinTolerance || math.Abs(s.ValueError) > 0.05 {
			t.Errorf("C %g τL %g: %+v", tc.c, tc.tauL, s)
		}
		// Check the pair by hand: combined coefficient, residual.
		coef := (s.A.Value*s.A.Class.Nominal + s.B.Value*s.B.Class.Nominal) / (s.A.Value + s.B.Value)
		if math.Abs(coef-s.Coefficient) > 1e-15 || math.Abs(-0.5*(coef+tc.tauL)-s.Residual) > 1e-15 {
			t.Errorf("coefficient %g vs %g, residual %g", coef, s.Coefficient, s.Residual)
		}
		if !isE12(s.A.Value) || (s.B.Value != 0 && !isE12(s.B.Value)) {
			t.Errorf("not E12 values: %g, %g", s.A.Value, s.B.Value)
		}
	}
	if _, err := Compensate(0, -0.5, 0, CompensateOptions{}); err == nil {
		t.Error("zero capacitance: no error")
	}
	if _, err := Compensate(100e-12, 0, 0, CompensateOptions{}); err == nil {
		t.Error("zero sensitivity: no error")
	}
}

// isE12 checks a value against the IEC 60063 E12 series.
func isE12(v float64) bool {
	m := v / math.Pow10(int(math.Floor(math.Log10(v)+1e-9)))
	for _, e := range E12 {
		if math.Abs(m-e) < 1e-6 {
			return true
		}
	}
	return false
}
