package thermal

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/circuit"
)

func n750() Class { c, _ := ParseClass("N750"); return c }

// An ideal (temperature-stable) inductor with an N750 capacitor: d ln f =
// −½(0 − 750 ppm/K) = +375 ppm/K, by the closed form and by the solver.
func TestN750TankDrifts375(t *testing.T) {
	t.Parallel()
	const l, c = 1e-6, 100e-12
	f0 := 1 / (2 * math.Pi * math.Sqrt(l*c))
	d := TankDrift(f0, 0, 0, n750())
	if math.Abs(d.PerK-375e-6) > 1e-12 { // −½·(−750 ppm/K), IEC 60384-8 N750
		t.Errorf("closed form %.6g /K, want 375e-6", d.PerK)
	}
	net := &circuit.Network{
		Nodes: []string{"gnd", "tank"},
		Parts: []circuit.Part{
			{Name: "L1", Kind: circuit.Inductor, A: 1, B: 0, Value: l},
			{Name: "C1", Kind: circuit.Capacitor, A: 1, B: 0, Value: c},
		},
		Ports: []circuit.Port{{Node: 1, Z0: 50}},
	}
	rds, err := NetworkDrift(net, []PartCoefficient{{}, {Class: n750()}}, 100e6)
	if err != nil {
		t.Fatal(err)
	}
	if len(rds) != 1 {
		t.Fatalf("%d resonances", len(rds))
	}
	rd := rds[0]
	// Central difference of (1−750e-6·ΔT)^−½: O(h²) error ~ (3/8)(750e-6)² relative.
	if rel(rd.PerK, 375e-6) > 1e-5 {
		t.Errorf("network drift %.8g /K, want 375e-6", rd.PerK)
	}
	if rel(rd.Uncertainty, 60e-6) > 1e-4 { // ½ × N750's ±120 ppm/K
		t.Errorf("uncertainty %.6g /K, want 60e-6", rd.Uncertainty)
	}
	if rel(rd.Sensitivity[1], -0.5) > 1e-6 {
		t.Errorf("sensitivity to C %.8g, want −½", rd.Sensitivity[1])
	}
	// Over 10 °C … 40 °C around 20 °C: the closed form and the solver agree.
	ref := 293.15
	want := TankShift(d, 0, n750(), ref, 283.15, 313.15)
	got, err := NetworkShift(net, []PartCoefficient{{}, {Class: n750()}}, rd, ref, 283.15, 313.15)
	if err != nil {
		t.Fatal(err)
	}
	if rel(got.Hz, want.Hz) > 1e-6 {
		t.Errorf("shift %.6g Hz, closed form %.6g Hz", got.Hz, want.Hz)
	}
	if rel(want.Relative, 375e-6*30) > 0.02 { // linear estimate 30 K × 375 ppm/K
		t.Errorf("shift %.6g relative, want about %.6g", want.Relative, 375e-6*30)
	}
}

// A wound coil in the network drifts as its own coefficient says: a
// self-supporting coil with a C0G capacitor moves by −½·α_Cu (the coil's
// self-capacitance, across the same tank, scales with its diameter too).
func TestWoundTankDrift(t *testing.T) {
	t.Parallel()
	g := demoCoil()
	c0g, _ := ParseClass("C0G")
	net := &circuit.Network{
		Nodes: []string{"gnd", "tank"},
		Parts: []circuit.Part{
			{Name: "L1", Kind: circuit.Wound, A: 1, B: 0, Coil: &g, TapNode: -1},
			{Name: "C1", Kind: circuit.Capacitor, A: 1, B: 0, Value: 100e-12},
		},
		Ports: []circuit.Port{{Node: 1, Z0: 50}},
	}
	rds, err := NetworkDrift(net, []PartCoefficient{{Support: &Support{SelfSupporting: true}}, {Class: c0g}}, 30e6)
	if err != nil {
		t.Fatal(err)
	}
	if len(rds) != 1 {
		t.Fatalf("%d resonances below 30 MHz", len(rds))
	}
	co, err := Tempco(g, unit.Frequency(rds[0].Frequency), Support{SelfSupporting: true})
	if err != nil {
		t.Fatal(err)
	}
	want := -0.5 * co.Effective
	if math.Abs(rds[0].PerK-want) > 0.5e-6 {
		t.Errorf("drift %.4g ppm/K, −½ coil's %.4g ppm/K", rds[0].PerK*1e6, want*1e6)
	}
	t.Logf("self-supporting coil + C0G at %.4g MHz: %.3f ppm/K (−½ tempco %.3f)", rds[0].Frequency/1e6, rds[0].PerK*1e6, want*1e6)
	_ = coil.CopperTempCoeff
}
