package match

import (
	"context"
	"errors"
	"math"
	"math/cmplx"
	"testing"

	"turnwise/coil"
	"turnwise/coil/circuit"
)

const implTol = 1e-9

func relErr(a, b float64) float64 { return math.Abs(a-b) / math.Max(math.Abs(b), 1e-300) }

// solverSWR puts settings back into a fresh circuit solver of the user's
// network (wound coils as wound coils, not the lumped copy) with the load
// at loadNode, and returns the SWR at port 1.
func solverSWR(t *testing.T, s Setup, f float64, pt Point) float64 {
	t.Helper()
	net := s.Network
	net.Parts = append([]circuit.Part(nil), net.Parts...)
	load := -1
	for i, n := range net.Nodes {
		if n == s.LoadNode {
			load = i
		}
	}
	for _, st := range pt.Settings {
		for i := range net.Parts {
			if net.Parts[i].Name == st.Part {
				net.Parts[i].Value = st.Capacitance
			}
		}
	}
	net.Parts = append(net.Parts, circuit.Part{Name: "zl", Kind: circuit.Impedance, A: load, B: 0, Z: complex(pt.LoadR, pt.LoadX), TapNode: -1})
	sv, err := circuit.NewSolver(&net)
	if err != nil {
		t.Fatal(err)
	}
	r, err := sv.Response(f)
	if err != nil {
		t.Fatal(err)
	}
	g := cmplx.Abs(r.S[0][0])
	return (1 + g) / (1 - g)
}

// Every matched point of the demo coupler's map, re-solved with its
// reported settings by a fresh circuit solver on the wound-coil network,
// shows the SWR the map claims and meets the limit.
func TestMatchedPointsRecheck(t *testing.T) {
	s := tappedCoupler(8)
	r, err := Map(context.Background(), s, Options{Frequencies: demoFrequencies})
	if err != nil {
		t.Fatal(err)
	}
	n, worst := 0, 0.0
	for _, fm := range r.Frequencies {
		for _, pt := range fm.Points {
			if !pt.Matched {
				if pt.Settings != nil || pt.SWR <= DefaultSWR {
					t.Errorf("%g Hz %g%+gj: unmatched point carries settings or a passing SWR %g", fm.Frequency, pt.LoadR, pt.LoadX, pt.SWR)
				}
				continue
			}
			got := solverSWR(t, s, fm.Frequency, pt)
			if n == 0 {
				t.Logf("first: claimed %.15g solver %.15g", pt.SWR, got)
			}
			n++
			worst = math.Max(worst, math.Abs(got-pt.SWR))
			if got > DefaultSWR+1e-9 || math.Abs(got-pt.SWR) > 1e-6 {
				t.Errorf("%g Hz %g%+gj: claimed SWR %g, solver %g", fm.Frequency, pt.LoadR, pt.LoadX, pt.SWR, got)
			}
		}
	}
	if n < 50 {
		t.Fatalf("only %d matched points to check", n)
	}
	t.Logf("%d matched points re-checked; worst SWR difference %.2g", n, worst)
}

// The reduced nodal network the search uses agrees with the circuit
// solver on the wound-coil network.
func TestFastMatchesSolver(t *testing.T) {
	s := tappedCoupler(6)
	p, err := s.prepare()
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range demoFrequencies {
		e, err := newEngine(p, f)
		if err != nil {
			t.Fatal(err)
		}
		for _, z := range []complex128{12 - 300i, 50, 700 + 900i} {
			e.setLoad(z)
			for _, u := range [][]float64{{0, 0}, {0.3, 0.8}, {1, 0.45}} {
				fast, slow := e.gamma(u), e.solverGamma(u)
				if math.Abs(fast-slow) > 1e-9 {
					t.Errorf("%g Hz load %v dials %v: |Γ| reduced %.12g, solver %.12g", f, z, u, fast, slow)
				}
			}
		}
	}
}

// L-network by hand (Bowick, RF Circuit Design, 2nd ed., ch. 4): from the
// 50 Ω port, series arm jωL − j/(ωC_s), shunt C_p across the load. For a
// load admittance G + jB the shunt arm makes Re Z = 50 Ω:
// B + ωC_p = √(G/50 − G²), then the series arm cancels the remaining
// reactance: ωL − 1/(ωC_s) = (B + ωC_p)/(G² + (B + ωC_p)²).
// For a real load R this is Bowick's Q = √(R/50 − 1), X_p = R/Q, X_s = 50·Q.
func TestLNetworkByHand(t *testing.T) {
	const f = 7.1e6
	const l = 10e-6
	w := 2 * math.Pi * f
	s := lNetwork(l, 0, f)
	for _, z := range []complex128{1000, 300, 600 - 200i, 150 + 100i} {
		y := 1 / z
		g, b := real(y), imag(y)
		bt := math.Sqrt(g/50 - g*g)
		cp := (bt - b) / w
		xs := bt / (g*g + bt*bt)
		cs := 1 / (w * (w*l - xs))
		r, err := Map(context.Background(), s, Options{Frequencies: []float64{f},
			Grid: Grid{RMin: real(z), RMax: real(z), NR: 1, XMin: imag(z), XMax: imag(z), NX: 1}})
		if err != nil {
			t.Fatal(err)
		}
		pt := r.Frequencies[0].Points[0]
		if !pt.Matched {
			t.Fatalf("load %v not matched (SWR %g); hand C_s %g, C_p %g", z, pt.SWR, cs, cp)
		}
		const tol = 1e-3 // the search stops at |Γ| < 1e-5; capacitances then agree to well under 0.1 %
		if e := relErr(pt.Settings[0].Capacitance, cs); e > tol {
			t.Errorf("load %v: C_s %g, hand %g (rel %.2g)", z, pt.Settings[0].Capacitance, cs, e)
		}
		if e := relErr(pt.Settings[1].Capacitance, cp); e > tol {
			t.Errorf("load %v: C_p %g, hand %g (rel %.2g)", z, pt.Settings[1].Capacitance, cp, e)
		}
		if math.Abs(pt.Efficiency-1) > 1e-9 {
			t.Errorf("load %v: lossless network efficiency %g", z, pt.Efficiency)
		}
	}
	// Bowick's real-load numbers for 1 kΩ: Q = √19 = 4.359, X_p = 229.4 Ω.
	q := math.Sqrt(1000/50.0 - 1)
	if e := relErr(1000/q, 229.4); e > 1e-3 { // Bowick's formula evaluated by hand, 4 figures
		t.Errorf("X_p %g", 1000/q)
	}
}

// A load outside what the L-network can reach is reported unmatched, not
// forced: a 10 Ω load needs the shunt arm at the low side, which this
// L-network does not have (√(G/50 − G²) is imaginary for R < 50 Ω real).
func TestUnmatchableReported(t *testing.T) {
	s := lNetwork(10e-6, 0, 7.1e6)
	r, err := Map(context.Background(), s, Options{Frequencies: []float64{7.1e6},
		Grid: Grid{RMin: 10, RMax: 10, NR: 1, XMin: 0, XMax: 0, NX: 1}})
	if err != nil {
		t.Fatal(err)
	}
	pt := r.Frequencies[0].Points[0]
	if pt.Matched || pt.SWR <= DefaultSWR || len(pt.Settings) != 0 {
		t.Fatalf("10 Ω load: matched %v SWR %g settings %v", pt.Matched, pt.SWR, pt.Settings)
	}
	if r.Frequencies[0].Coverage != 0 || len(r.Warnings) == 0 {
		t.Errorf("coverage %g warnings %v", r.Frequencies[0].Coverage, r.Warnings)
	}
}

// A matched lossless tank: the port through C1 to the hot node, an ideal
// inductor and C2 from there to ground, the load R across C2. All the
// power P reaches R, so the tank capacitor's peak voltage is √(2·P·R)
// (P = V²/(2R) for a peak phasor; from memory, any circuits text).
func TestTankVoltageByHand(t *testing.T) {
	const f = 7.1e6
	s := Setup{
		Network: circuit.Network{
			Nodes: []string{"gnd", "tx", "hot"},
			Parts: []circuit.Part{
				{Name: "C1", Kind: circuit.Capacitor, A: 1, B: 2, Value: 50e-12, TapNode: -1},
				{Name: "L", Kind: circuit.Inductor, A: 2, B: 0, Value: 3e-6, TapNode: -1},
				{Name: "C2", Kind: circuit.Capacitor, A: 2, B: 0, Value: 100e-12, TapNode: -1},
			},
			Ports: []circuit.Port{{Node: 1, Z0: 50}},
		},
		LoadNode:   "hot",
		Adjustable: []Adjustable{{"C1", 5e-12, 500e-12}, {"C2", 5e-12, 500e-12}},
	}
	for _, tc := range []struct{ p, r float64 }{{100, 2000}, {400, 800}, {10, 5000}} {
		r, err := Map(context.Background(), s, Options{Frequencies: []float64{f}, Power: tc.p,
			Grid: Grid{RMin: tc.r, RMax: tc.r, NR: 1, NX: 1}})
		if err != nil {
			t.Fatal(err)
		}
		pt := r.Frequencies[0].Points[0]
		if !pt.Matched {
			t.Fatalf("R %g not matched", tc.r)
		}
		want := math.Sqrt(2 * tc.p * tc.r)
		for _, st := range pt.Stress {
			if st.Part == "C2" {
				// the match is to |Γ| < 1e-5, so the power into R is P to 1e-10
				if e := relErr(st.VPeak, want); e > 1e-6 {
					t.Errorf("P %g R %g: C2 %g V peak, hand %g", tc.p, tc.r, st.VPeak, want)
				}
				if e := relErr(st.VRMS, want/math.Sqrt2); e > 1e-6 {
					t.Errorf("RMS %g", st.VRMS)
				}
			}
		}
		if len(r.Cautions) == 0 || r.HeatRule == "" {
			t.Errorf("power given but no cautions or heat rule")
		}
	}
}

// Coverage from the search is at least that of a brute-force 201×201
// dial grid, solved load by load with the circuit solver's reduced
// network, on a small case (the demo coupler, 5×5 loads, two bands).
func TestCoverageAtLeastBruteForce(t *testing.T) {
	if testing.Short() {
		t.Skip("brute force: 2 million solutions")
	}
	s := tappedCoupler(8)
	grid := Grid{RMin: 5, RMax: 2000, NR: 5, XMin: -1000, XMax: 1000, NX: 5}
	freqs := []float64{3.6e6, 14.2e6}
	r, err := Map(context.Background(), s, Options{Frequencies: freqs, Grid: grid})
	if err != nil {
		t.Fatal(err)
	}
	p, _ := s.prepare()
	limit := gammaFor(DefaultSWR)
	for fi, f := range freqs {
		e, err := newEngine(p, f)
		if err != nil {
			t.Fatal(err)
		}
		brute := 0
		k := 0
		for i := range grid.NR {
			for j := range grid.NX {
				e.setLoad(complex(grid.R(i), grid.X(j)))
				hit := false
				const steps = 201
				u := []float64{0, 0}
				for a := 0; a < steps && !hit; a++ {
					for b := 0; b < steps; b++ {
						u[0], u[1] = float64(a)/(steps-1), float64(b)/(steps-1)
						if e.gamma(u) <= limit {
							hit = true
							break
						}
					}
				}
				pt := r.Frequencies[fi].Points[k]
				k++
				if hit {
					brute++
					if !pt.Matched {
						t.Errorf("%g Hz load %g%+gj: brute force matches, search does not (SWR %g)", f, pt.LoadR, pt.LoadX, pt.SWR)
					}
				}
			}
		}
		t.Logf("%g Hz: search %d, brute force %d of %d", f, r.Frequencies[fi].Matched, brute, grid.NR*grid.NX)
		if r.Frequencies[fi].Matched < brute {
			t.Errorf("%g Hz: coverage %d below brute force %d", f, r.Frequencies[fi].Matched, brute)
		}
	}
}

// Least loss among matches: with an inductor of finite Q the L-network's
// reported setting is no lossier than any other end point that matches.
func TestLeastLossChosen(t *testing.T) {
	s := tappedCoupler(8)
	p, _ := s.prepare()
	e, err := newEngine(p, 7.1e6)
	if err != nil {
		t.Fatal(err)
	}
	limit := gammaFor(DefaultSWR)
	pt, err := e.point(300, 200, limit, 0)
	if err != nil || !pt.Matched {
		t.Fatalf("not matched: %v %+v", err, pt)
	}
	e.setLoad(complex(300, 200))
	for _, c := range e.search(limit, false) {
		if c.gamma > limit {
			continue
		}
		st, pin, err := e.drive(c.u)
		if err != nil {
			t.Fatal(err)
		}
		if eff := st.PartLoss(e.ln.load) / pin; eff > pt.Efficiency+1e-12 {
			t.Errorf("a match at %v has efficiency %g above the reported %g", c.u, eff, pt.Efficiency)
		}
	}
}

func TestBadInputs(t *testing.T) {
	good := func() Setup { return tappedCoupler(8) }
	opts := Options{Frequencies: []float64{7e6}, Grid: Grid{RMin: 50, RMax: 50, NR: 1, NX: 1}}
	cases := []struct {
		name string
		s    Setup
		o    Options
		key  string
	}{
		{"no adjustable", func() Setup { s := good(); s.Adjustable = nil; return s }(), opts, "range"},
		{"adjustable not a capacitor", func() Setup { s := good(); s.Adjustable = []Adjustable{{"L1", 1e-12, 2e-12}}; return s }(), opts, "range"},
		{"missing load node", func() Setup { s := good(); s.LoadNode = "antenna"; return s }(), opts, "load.node"},
		{"load on ground", func() Setup { s := good(); s.LoadNode = "gnd"; return s }(), opts, "load.node"},
		{"negative power", good(), Options{Frequencies: []float64{7e6}, Power: -5}, "power"},
		{"no frequency", good(), Options{}, "freq"},
		{"bad swr", good(), Options{Frequencies: []float64{7e6}, SWR: 0.5}, "swr"},
		{"bad R range", good(), Options{Frequencies: []float64{7e6}, Grid: Grid{RMin: -1, RMax: 5, NR: 3, NX: 1}}, "load-r"},
		{"bad rating", func() Setup { s := good(); s.Ratings = map[string]float64{"C1": -1}; return s }(), opts, "rating"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Map(context.Background(), tc.s, tc.o)
			var ie *coil.InputError
			if !errors.As(err, &ie) || ie.Param != tc.key {
				t.Fatalf("got %v, want an input error naming %q", err, tc.key)
			}
		})
	}
}

// ChooseTap's best tap has at least the coverage of every tap Map gives
// for the same grid, and its coverage equals Map's at that tap.
func TestChooseTap(t *testing.T) {
	if testing.Short() {
		t.Skip("maps every quarter turn")
	}
	grid := Grid{RMin: 5, RMax: 2000, NR: 4, XMin: -1000, XMax: 1000, NX: 4}
	freqs := []float64{3.6e6, 14.2e6}
	best, err := ChooseTap(context.Background(), tappedCoupler(8), Options{Frequencies: freqs, Grid: grid}, "L1", 3)
	if err != nil {
		t.Fatal(err)
	}
	if len(best) != 3 || best[0].Coverage < best[1].Coverage || best[1].Coverage < best[2].Coverage {
		t.Fatalf("ranking %+v", best)
	}
	for _, tap := range []float64{2, 8, best[0].TapTurns} {
		r, err := Map(context.Background(), tappedCoupler(tap), Options{Frequencies: freqs, Grid: grid})
		if err != nil {
			t.Fatal(err)
		}
		cov := 0.0
		for _, fm := range r.Frequencies {
			cov += fm.Coverage / float64(len(freqs))
		}
		if cov > best[0].Coverage+1e-12 {
			t.Errorf("tap %g covers %g, above the chosen tap %g's %g", tap, cov, best[0].TapTurns, best[0].Coverage)
		}
		if tap == best[0].TapTurns && math.Abs(cov-best[0].Coverage) > 1e-12 {
			t.Errorf("chosen tap: ChooseTap %g, Map %g", best[0].Coverage, cov)
		}
	}
	t.Logf("best taps %+v", best)
	if _, err := ChooseTap(context.Background(), tappedCoupler(8), Options{Frequencies: freqs}, "C1", 3); err == nil {
		t.Error("a capacitor accepted as the tapped coil")
	}
}
