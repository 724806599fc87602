package spec

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/circuit"
	"turnwise/coil/thermal"
	"turnwise/forms"
)

// tank builds a parallel tank: part 0 is the inductor (a wound coil from
// spec s, or an ideal inductor when s is nil), then the capacitors.
func tank(t *testing.T, s *Spec, caps []*forms.CircuitPart) (*circuit.Network, map[int]Spec, []*forms.CircuitPart) {
	t.Helper()
	net := &circuit.Network{Nodes: []string{"gnd", "tank"}, Ports: []circuit.Port{{Node: 1, Z0: 1e9}}}
	coils := map[int]Spec{}
	lumped := []*forms.CircuitPart{nil}
	if s != nil {
		g := s.Geometry
		net.Parts = append(net.Parts, circuit.Part{Name: "L", Kind: circuit.Wound, A: 1, B: 0, Coil: &g, TapNode: -1})
		coils[0] = *s
	} else {
		net.Parts = append(net.Parts, circuit.Part{Name: "L", Kind: circuit.Inductor, A: 1, B: 0, Value: 10e-6, Q: 200, QFrequency: 5e6, TapNode: -1})
	}
	for _, c := range caps {
		net.Parts = append(net.Parts, circuit.Part{Name: c.Name, Kind: circuit.Capacitor, A: 1, B: 0, Value: c.Value, Q: 1000, QFrequency: 5e6, TapNode: -1})
		lumped = append(lumped, c)
	}
	return net, coils, lumped
}

func resonances(t *testing.T, net *circuit.Network) []circuit.Resonance {
	t.Helper()
	s, err := circuit.NewSolver(net)
	if err != nil {
		t.Fatal(err)
	}
	rs, err := s.Resonances(1e9)
	if err != nil || len(rs) == 0 {
		t.Fatalf("%v: %d resonances", err, len(rs))
	}
	return rs
}

// An ideal inductor (held) with an N750 capacitor drifts +375 ppm/K:
// d ln f = −½ d ln C (the check; N750 from IEC 60384-8, from memory).
func TestCircuitThermalIdealN750(t *testing.T) {
	t.Parallel()
	c := &forms.CircuitPart{Kind: "capacitor", Name: "C", Value: 100e-12, Tempco: -750e-6, HasTempco: true, TempcoRaw: "N750"}
	net, coils, lumped := tank(t, nil, []*forms.CircuitPart{c})
	rs := resonances(t, net)
	d, err := CircuitThermal(nil, net, coils, lumped, rs, CircuitThermalSettings{Low: 288.15, High: 308.15})
	if err != nil {
		t.Fatal(err)
	}
	got := d.Drifts[0].PerK
	if math.Abs(got-375e-6) > 1e-9 { // −½ × −750 ppm/K
		t.Errorf("drift %.6g ppm/K, want +375", got*1e6)
	}
	// Over 15 °C … 35 °C: f/√(1−750e-6·ΔT) at both ends (exact for a linear C).
	f0 := d.Drifts[0].Frequency
	want := f0/math.Sqrt(1-750e-6*15) - f0/math.Sqrt(1+750e-6*5)
	if sh := d.Shifts[0]; sh == nil || math.Abs(sh.Hz-want) > 1e-6*f0 {
		t.Errorf("shift %+v, want %.6g Hz", sh, want)
	}
	if u := d.Drifts[0].Uncertainty; math.Abs(u-60e-6) > 1e-9 { // ½ × N750's ±120 ppm/K
		t.Errorf("uncertainty %.4g ppm/K, want 60", u*1e6)
	}
}

// A coil of our own on a rigid PVC former with a C0G capacitor drifts
// down by tens of ppm/K; the split --compensate proposes, put back into
// the network and solved again, leaves under 5 ppm/K (the bound),
// and agrees with the split's own linear residual.
func TestCircuitThermalCompensatePVC(t *testing.T) {
	t.Parallel()
	cat, err := forms.BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	turns, leads, pitch := 14.0, 10e-3, 1e-3
	s, err := Resolve(cat, forms.JobWinding{Former: "pvc 20mm", Wire: "0.5mm", Insulation: "grade1", Turns: &turns, Leads: lenp(leads), Pitch: lenp(pitch)})
	if err != nil {
		t.Fatal(err)
	}
	c := &forms.CircuitPart{Kind: "capacitor", Name: "C", Value: 150e-12, HasTempco: true, TempcoRaw: "C0G"}
	net, coils, lumped := tank(t, &s, []*forms.CircuitPart{c})
	rs := resonances(t, net)
	d, err := CircuitThermal(cat, net, coils, lumped, rs, CircuitThermalSettings{Compensate: true})
	if err != nil {
		t.Fatal(err)
	}
	before := d.Drifts[0].PerK
	if !(before < -20e-6) {
		t.Fatalf("PVC tank drift %.3g ppm/K: want well below -20 (PVC ~70 ppm/K in L)", before*1e6)
	}
	sp := d.Splits[0]
	if sp == nil {
		t.Fatal("no split proposed")
	}
	// Put the split back: C replaced by its two capacitors.
	parts := []*forms.CircuitPart{{Kind: "capacitor", Name: "A", Value: sp.Split.A.Value, HasTempco: true, TempcoRaw: sp.Split.A.Class.Code}}
	if sp.Split.B.Value > 0 {
		parts = append(parts, &forms.CircuitPart{Kind: "capacitor", Name: "B", Value: sp.Split.B.Value, HasTempco: true, TempcoRaw: sp.Split.B.Class.Code})
	}
	net2, coils2, lumped2 := tank(t, &s, parts)
	d2, err := CircuitThermal(cat, net2, coils2, lumped2, resonances(t, net2), CircuitThermalSettings{})
	if err != nil {
		t.Fatal(err)
	}
	after := d2.Drifts[0].PerK
	if math.Abs(after) > 5e-6 {
		t.Errorf("compensated drift %.3g ppm/K (split %+v), want under 5", after*1e6, sp.Split)
	}
	// The total moved by a few percent, so the linear residual is close,
	// not exact.
	if math.Abs(after-sp.Residual) > 2e-6 {
		t.Errorf("re-solved %.3g ppm/K vs predicted residual %.3g", after*1e6, sp.Residual*1e6)
	}
	t.Logf("before %.2f ppm/K; %s: %g pF %s + %g pF %s; after %.2f ppm/K ± %.2f", before*1e6, sp.Part,
		sp.Split.A.Value*1e12, sp.Split.A.Class.Code, sp.Split.B.Value*1e12, sp.Split.B.Class.Code, after*1e6, sp.Uncertainty*1e6)
	if _, err := thermal.ParseClass(sp.Split.A.Class.Code); err != nil {
		t.Errorf("split class %q is not a standard class: %v", sp.Split.A.Class.Code, err)
	}
}

// A former of unknown material leaves no drift and says why.
func TestCircuitThermalUnknownFormer(t *testing.T) {
	t.Parallel()
	cat, _ := forms.BuiltIn()
	turns := 14.0
	s, err := Resolve(cat, forms.JobWinding{Former: "21mm", Wire: "0.5mm", Turns: &turns, Leads: lenp(10e-3), Pitch: lenp(1e-3)})
	if err != nil {
		t.Fatal(err)
	}
	c := &forms.CircuitPart{Kind: "capacitor", Name: "C", Value: 150e-12}
	net, coils, lumped := tank(t, &s, []*forms.CircuitPart{c})
	d, err := CircuitThermal(cat, net, coils, lumped, resonances(t, net), CircuitThermalSettings{})
	if err != nil || len(d.Drifts) != 0 || len(d.Warnings) == 0 {
		t.Errorf("err %v, %d drifts, warnings %q: want none and a warning", err, len(d.Drifts), d.Warnings)
	}
}

func lenp(m float64) *unit.Length { l := unit.Length(m); return &l }
