package circuit

import (
	"math"
	"math/cmplx"
	"testing"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
)

const implTol = 1e-9

func rel(a, b float64) float64 { return math.Abs(a-b) / math.Max(math.Abs(b), 1e-300) }

// tank is L ∥ C from node "top" to ground with port 1 on "top"; the
// inductor's loss is a series resistance r.
func tank(l, c, r float64) *Network {
	return &Network{
		Nodes: []string{"gnd", "top"},
		Parts: []Part{
			{Name: "L1", Kind: Inductor, A: 1, B: 0, Value: l, ESR: r},
			{Name: "C1", Kind: Capacitor, A: 1, B: 0, Value: c},
		},
		Ports: []Port{{Node: 1, Z0: 50}},
	}
}

// solver is NewSolver(n), failing the test on an error.
func solver(t *testing.T, n *Network) *Solver {
	t.Helper()
	s, err := NewSolver(n)
	if err != nil {
		t.Fatal(err)
	}
	return s
}

// resonances is n's resonances below fMax, failing the test on an error.
func resonances(t *testing.T, n *Network, fMax float64) []Resonance {
	t.Helper()
	rs, err := solver(t, n).Resonances(fMax)
	if err != nil {
		t.Fatal(err)
	}
	return rs
}

// lone is wound coil g alone from port 1 ("hot") to ground, mounted m.
func lone(g *coil.Geometry, m coil.Mounting) *Network {
	return &Network{
		Nodes: []string{"gnd", "hot"},
		Parts: []Part{{Name: "L1", Kind: Wound, A: 1, B: 0, Coil: g, TapNode: -1, Mounting: m}},
		Ports: []Port{{Node: 1, Z0: 50}},
	}
}

// A parallel tank worked by hand: f0 = 1/(2π√(LC)); with series loss r the
// impedance peak is about (ωL)²/r = Q·ωL and Q = ωL/r (any circuit text,
// e.g. Terman, Radio Engineers' Handbook, 1943, from memory).
func TestParallelTankByHand(t *testing.T) {
	l, c, r := 10e-6, 180e-12, 2.0
	n := tank(l, c, r)
	f0 := 1 / (2 * math.Pi * math.Sqrt(l*c))
	// 10 µH with 180 pF resonates near 3.75 MHz (common practice: the
	// 80 m band's tank).
	if f0 < 3.6e6 || f0 > 3.9e6 {
		t.Fatalf("hand value %g", f0)
	}
	rs := resonances(t, n, 1e9)
	if len(rs) != 1 || rs[0].Kind != Parallel {
		t.Fatalf("resonances %+v", rs)
	}
	if rel(rs[0].Natural, f0) > implTol {
		t.Errorf("natural %g, hand %g", rs[0].Natural, f0)
	}
	q := 2 * math.Pi * f0 * l / r
	// The |Z| maximum of a tank with series loss sits a fraction 1/(2Q²)
	// off f0; the Q from the −3 dB points agrees with ωL/r to about 1/Q².
	if rel(rs[0].Frequency, f0) > 1/(q*q) {
		t.Errorf("peak %g, f0 %g", rs[0].Frequency, f0)
	}
	if rel(rs[0].Q, q) > 2/(q*q)+1e-6 {
		t.Errorf("Q %g, hand %g", rs[0].Q, q)
	}
	zpk := cmplx.Abs(rs[0].Impedance)
	if want := q * 2 * math.Pi * f0 * l; rel(zpk, want) > 2/(q*q) {
		t.Errorf("|Z| at peak %g, hand %g", zpk, want)
	}
	if rs[0].Part != "C1" {
		t.Errorf("dominant part %q", rs[0].Part)
	}
}

// A series trap: L and C in series from the line to ground notch at f0
// with |Z| = r there (hand: the reactances cancel).
func TestSeriesTrapByHand(t *testing.T) {
	l, c, r := 1e-6, 100e-12, 1.5
	n := &Network{
		Nodes: []string{"gnd", "in", "mid"},
		Parts: []Part{
			{Name: "L1", Kind: Inductor, A: 1, B: 2, Value: l, ESR: r},
			{Name: "C1", Kind: Capacitor, A: 2, B: 0, Value: c},
			{Name: "Rload", Kind: Resistor, A: 1, B: 0, Value: 1e6},
		},
		Ports: []Port{{Node: 1, Z0: 50}},
	}
	rs := resonances(t, n, 1e9)
	f0 := 1 / (2 * math.Pi * math.Sqrt(l*c))
	if len(rs) != 1 || rs[0].Kind != Series {
		t.Fatalf("resonances %+v", rs)
	}
	if rel(rs[0].Frequency, f0) > 1e-6 {
		t.Errorf("notch %g, hand %g", rs[0].Frequency, f0)
	}
	// |Z| = r ∥ 1 MΩ at the notch.
	if want := r * 1e6 / (r + 1e6); rel(cmplx.Abs(rs[0].Impedance), want) > 1e-6 {
		t.Errorf("|Z| at notch %g, hand %g", cmplx.Abs(rs[0].Impedance), want)
	}
	q := 2 * math.Pi * f0 * l / r
	if rel(rs[0].Q, q) > 1e-3 {
		t.Errorf("Q %g, hand %g", rs[0].Q, q)
	}
}

// Two ports through a series resistor: S21 of a 50 Ω series resistor
// between 50 Ω ports is 2·50/(2·50 + R) (any network text).
func TestSParametersSeriesResistor(t *testing.T) {
	n := &Network{
		Nodes: []string{"gnd", "a", "b"},
		Parts: []Part{
			{Name: "R1", Kind: Resistor, A: 1, B: 2, Value: 50},
			{Name: "Ra", Kind: Resistor, A: 1, B: 0, Value: 1e12},
			{Name: "Rb", Kind: Resistor, A: 2, B: 0, Value: 1e12},
		},
		Ports: []Port{{Node: 1, Z0: 50}, {Node: 2, Z0: 50}},
	}
	s := solver(t, n)
	r, err := s.Response(1e6)
	if err != nil {
		t.Fatal(err)
	}
	if want := 100.0 / 150; rel(cmplx.Abs(r.S[1][0]), want) > 1e-9 {
		t.Errorf("S21 %v, hand %g", r.S[1][0], want)
	}
	if want := 50.0 / 150; rel(cmplx.Abs(r.S[0][0]), want) > 1e-9 {
		t.Errorf("S11 %v, hand %g", r.S[0][0], want)
	}
	if rel(real(r.Zin), 100) > 1e-9 {
		t.Errorf("Zin %v, want 100", r.Zin)
	}
}

// The dual-band network: a large tank and a small one sharing the port
// node through a coupling capacitor each; the eigenproblem's natural
// frequencies must be the zeros of the lossless port admittance, checked
// by bisection on a fine sweep (an independent route).
func TestNaturalFrequenciesMatchSweep(t *testing.T) {
	n := &Network{
		Nodes: []string{"gnd", "in", "hf", "vhf"},
		Parts: []Part{
			{Name: "Lhf", Kind: Inductor, A: 2, B: 0, Value: 10e-6},
			{Name: "Chf", Kind: Capacitor, A: 2, B: 0, Value: 180e-12},
			{Name: "Ck1", Kind: Capacitor, A: 1, B: 2, Value: 10e-12},
			{Name: "Lv", Kind: Inductor, A: 3, B: 0, Value: 45e-9},
			{Name: "Cv", Kind: Capacitor, A: 3, B: 0, Value: 25e-12},
			{Name: "Ck2", Kind: Capacitor, A: 1, B: 3, Value: 2e-12},
		},
		Ports: []Port{{Node: 1, Z0: 50}},
	}
	s := solver(t, n)
	par, err := s.NaturalFrequencies(1e10, false)
	if err != nil {
		t.Fatal(err)
	}
	// Independent route: the lossless Zin is reactive; its poles are
	// where 1/Zin crosses zero. Bisection between sign changes of Im(1/Z).
	y := func(f float64) float64 {
		r, _ := s.Response(f)
		return imag(1 / r.Zin)
	}
	var found []float64
	prev, fp := y(1e6), 1e6
	for f := 1e6 * 1.001; f < 1e9; f *= 1.001 {
		v := y(f)
		if prev < 0 && v > 0 || prev > 0 && v < 0 {
			a, b := fp, f
			for k := 0; k < 80; k++ {
				m := math.Sqrt(a * b)
				if (y(m) > 0) == (y(a) > 0) {
					a = m
				} else {
					b = m
				}
			}
			// Keep zeros of Y (poles of Z), not its own poles: |Z| large.
			r, _ := s.Response(math.Sqrt(a * b))
			if cmplx.Abs(r.Zin) > 1e3 {
				found = append(found, math.Sqrt(a*b))
			}
		}
		prev, fp = v, f
	}
	if len(found) != len(par) {
		t.Fatalf("sweep found %v, eigen %v", found, par)
	}
	for i := range found {
		if rel(par[i].Frequency, found[i]) > 1e-8 {
			t.Errorf("mode %d: eigen %g, sweep %g", i, par[i].Frequency, found[i])
		}
	}
}

// A wound coil on its own shows its self-resonance as a parallel
// resonance at the port, near Predict's SRF (the same self-capacitance;
// Predict takes L at the SRF by one fixed-point step, the solver iterates).
func TestWoundCoilSelfResonance(t *testing.T) {
	g := coil.Geometry{FormerDiameter: 20e-3, WireDiameter: 0.5e-3, Turns: 40, Pitch: 0.6e-3}
	rs := resonances(t, lone(&g, coil.Grounded), 10e9)
	p, err := coil.Predict(g, 0)
	if err != nil {
		t.Fatal(err)
	}
	if len(rs) != 1 || rs[0].Part != "L1" {
		t.Fatalf("resonances %+v", rs)
	}
	if rel(rs[0].Natural, float64(p.SRF)) > 1e-3 {
		t.Errorf("self-resonance %g, Predict %g", rs[0].Natural, float64(p.SRF))
	}
}

func TestValidateRefuses(t *testing.T) {
	base := func() *Network { return tank(1e-6, 1e-12, 0) }
	cases := []struct {
		name string
		mod  func(n *Network)
	}{
		{"port on ground", func(n *Network) { n.Ports[0].Node = 0 }},
		{"shorted part", func(n *Network) { n.Parts[0].B = 1 }},
		{"dangling node", func(n *Network) {
			n.Nodes = append(n.Nodes, "x")
			n.Parts = append(n.Parts, Part{Name: "R9", Kind: Resistor, A: 1, B: 2, Value: 1})
		}},
		{"floating island", func(n *Network) {
			n.Nodes = append(n.Nodes, "x", "y")
			n.Parts = append(n.Parts, Part{Name: "R8", Kind: Resistor, A: 2, B: 3, Value: 1},
				Part{Name: "R9", Kind: Resistor, A: 2, B: 3, Value: 2})
		}},
		{"negative value", func(n *Network) { n.Parts[1].Value = -1 }},
		{"k of one", func(n *Network) {
			n.Parts = append(n.Parts, Part{Name: "L2", Kind: Inductor, A: 1, B: 0, Value: 1e-6})
			n.Couplings = []Coupling{{Name: "K1", P: 0, Q: 2, K: 1}}
		}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			n := base()
			c.mod(n)
			if _, err := NewSolver(n); err == nil {
				t.Error("accepted")
			}
		})
	}
}

// With leads, the coil's self-resonance is still a parallel resonance at
// the port; a series resonance of the leads with the self-capacitance
// sits above it.
func TestWoundCoilWithLeads(t *testing.T) {
	g := coil.Geometry{FormerDiameter: 20e-3, WireDiameter: 0.5e-3, Turns: 40, Pitch: 0.6e-3, LeadLength: 20e-3}
	rs := resonances(t, lone(&g, coil.Grounded), 10e9)
	p, _ := coil.Predict(g, 0)
	if len(rs) < 2 || rs[0].Kind != Parallel || rs[1].Kind != Series {
		t.Fatalf("resonances %+v", rs)
	}
	if rel(rs[0].Natural, float64(p.SRF)) > 1e-3 {
		t.Errorf("self-resonance %g, Predict %g", rs[0].Natural, float64(p.SRF))
	}
	// Hand: the leads (L_lead) resonate in series with C_s at
	// √(1 + L_lead/L)/(2π√(L_lead·C_s)): with port 1 shorted the leads and
	// the winding are in parallel across C_s.
	m, _ := coil.ModelAt(g, unit.Frequency(rs[1].Natural))
	want := math.Sqrt(1+float64(m.LLeads/m.L)) / (2 * math.Pi * math.Sqrt(float64(m.LLeads)*float64(m.SelfCapacitance)))
	if rel(rs[1].Natural, want) > 1e-6 {
		t.Errorf("lead resonance %g, hand %g", rs[1].Natural, want)
	}
}

// A tapped coil with a capacitor from the hot end and another from the
// tap to ground is the two-gang circuit; its two natural frequencies are
// the roots of the 2×2 pencil det(Γ − ω²C) = 0, worked here in closed form.
func TestTappedCoilTwoNode(t *testing.T) {
	g := coil.Geometry{FormerDiameter: 20e-3, WireDiameter: 0.6e-3, Turns: 30, Pitch: 1e-3}
	n := &Network{
		Nodes: []string{"gnd", "hot", "tap"},
		Parts: []Part{
			{Name: "L1", Kind: Wound, A: 1, B: 0, Coil: &g, TapNode: 2, TapTurns: 10},
			{Name: "CA", Kind: Capacitor, A: 1, B: 0, Value: 200e-12},
			{Name: "CB", Kind: Capacitor, A: 2, B: 0, Value: 300e-12},
		},
		Ports: []Port{{Node: 1, Z0: 50}},
	}
	s := solver(t, n)
	modes, err := s.NaturalFrequencies(1e9, false)
	if err != nil {
		t.Fatal(err)
	}
	// Keep the two tank modes (the self-capacitance adds none here: it is
	// across the hot end, in parallel with CA).
	if len(modes) != 2 {
		t.Fatalf("modes %+v", modes)
	}
	for _, md := range modes {
		sec, _ := coil.Tap(g, 10, unit.Frequency(md.Frequency))
		m, _ := coil.ModelAt(g, unit.Frequency(md.Frequency))
		la, lb, mm := float64(sec.LA), float64(sec.LB), float64(sec.M)
		ca := 200e-12 + float64(m.SelfCapacitance)
		cb := 300e-12
		// Node equations with v_hot, v_tap: branch currents through La
		// (hot→tap) and Lb (tap→gnd) with mutual M. Γ = A·L⁻¹·Aᵀ.
		det := la*lb - mm*mm
		ia, ib, im := lb/det, la/det, -mm/det
		// A = [[1,0],[−1,1]] (rows hot, tap; columns branch a, b).
		g11 := ia
		g12 := -ia + im
		g22 := ia - 2*im + ib
		w2 := math.Pow(2*math.Pi*md.Frequency, 2)
		d := (g11-w2*ca)*(g22-w2*cb) - g12*g12
		scale := (g11 + w2*ca) * (g22 + w2*cb)
		if math.Abs(d) > 1e-9*scale {
			t.Errorf("f=%g: det %g (scale %g)", md.Frequency, d, scale)
		}
	}
}

// A solver reused at one frequency re-reads every value a caller changes
// (a capacitor's setting, a load, a port's Z0, a coil's geometry): each
// answer equals a fresh solver's on the changed network.
func TestSolverRereadsChangedValues(t *testing.T) {
	g := coil.Geometry{FormerDiameter: unit.Length(20e-3), WireDiameter: unit.Length(1e-3), Turns: 10, Pitch: unit.Length(2e-3)}
	n := &Network{
		Nodes: []string{"gnd", "top"},
		Parts: []Part{
			{Name: "L1", Kind: Wound, A: 1, B: 0, Coil: &g, TapNode: -1},
			{Name: "C1", Kind: Capacitor, A: 1, B: 0, Value: 100e-12},
			{Name: "RL", Kind: Impedance, A: 1, B: 0, Z: complex(5000, 0)},
		},
		Ports: []Port{{Node: 1, Z0: 50}},
	}
	const f = 3.5e6
	s := solver(t, n)
	changes := []struct {
		name string
		edit func()
	}{
		{"capacitor value", func() { n.Parts[1].Value = 150e-12 }},
		{"load impedance", func() { n.Parts[2].Z = complex(2000, 300) }},
		{"port Z0", func() { n.Ports[0].Z0 = 75 }},
		{"coil geometry", func() { g.Turns = 12 }},
	}
	for _, c := range changes {
		t.Run(c.name, func(t *testing.T) {
			before, err := s.Response(f)
			if err != nil {
				t.Fatal(err)
			}
			c.edit()
			got, err := s.Response(f)
			if err != nil {
				t.Fatal(err)
			}
			want, err := solver(t, n).Response(f)
			if err != nil {
				t.Fatal(err)
			}
			if cmplx.Abs(got.Zin-want.Zin) > implTol*cmplx.Abs(want.Zin) {
				t.Errorf("reused solver Zin %v, fresh %v", got.Zin, want.Zin)
			}
			if cmplx.Abs(got.S[0][0]-want.S[0][0]) > implTol {
				t.Errorf("reused solver S11 %v, fresh %v", got.S[0][0], want.S[0][0])
			}
			if cmplx.Abs(before.S[0][0]-want.S[0][0]) <= implTol {
				t.Errorf("the change did not move S11 (%v): the test cannot tell", want.S[0][0])
			}
		})
	}
}
