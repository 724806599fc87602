package match

import (
	"context"
	"math"
	"testing"
)

// demoFileCoupler is the demo coupler as testdata/circuits/coupler.toml
// builds it: tappedCoupler(8) with the wire's overall diameter the bare
// 1.6 mm, since the file gives no enamel build-up.
func demoFileCoupler() Setup {
	s := tappedCoupler(8)
	s.Network.Parts = append(s.Network.Parts[:0:0], s.Network.Parts...)
	g := *demoCoil()
	g.WireOverall = 1.6e-3
	s.Network.Parts[1].Coil = &g
	return s
}

// bruteBest is the least |Γ| over a steps×steps grid of dial positions
// covering both capacitors' whole ranges, then refined by Nelder–Mead
// from the grid's best node.
func bruteBest(e *engine, steps int) candidate {
	best := candidate{u: []float64{0, 0}, gamma: math.Inf(1)}
	u := []float64{0, 0}
	for a := range steps {
		for b := range steps {
			u[0], u[1] = float64(a)/float64(steps-1), float64(b)/float64(steps-1)
			if g := e.gamma(u); g < best.gamma {
				best = candidate{u: []float64{u[0], u[1]}, gamma: g}
			}
		}
	}
	if nm := e.local(best.u, 0.5/float64(steps-1)); nm.gamma < best.gamma {
		best = nm
	}
	return best
}

// At 10.12 MHz the demo coupler leaves its 2 kΩ row unmatched while the
// 945.7 Ω row matches. That is the network, not a miss of the search: a
// 401×401 grid over both dials (every 0.25 % of each dial's log range),
// refined from its best node, finds no setting with SWR ≤ 1.5 for any
// 2 kΩ load. For 2000 + j0 the best is SWR ≈ 1.73 with C1 at its 250 pF
// stop; C1 needs ≈ 465 pF to reach SWR 1, so a C1 with a larger maximum
// (500 pF here) matches the same load. The search's reported SWR for each
// unmatched load is the brute force's minimum.
func TestDemo2kOhmUnmatchedAt10MHz(t *testing.T) {
	const f = 10.12e6
	limit := gammaFor(DefaultSWR) // SWR 1.5, issue 12's default limit
	s := demoFileCoupler()
	grid := Grid{RMin: 2000, RMax: 2000, NR: 1, XMin: -1000, XMax: 1000, NX: 3}
	r, err := Map(context.Background(), s, Options{Frequencies: []float64{f}, Grid: grid})
	if err != nil {
		t.Fatal(err)
	}
	p, err := s.prepare()
	if err != nil {
		t.Fatal(err)
	}
	e, err := newEngine(p, f)
	if err != nil {
		t.Fatal(err)
	}
	for j, pt := range r.Frequencies[0].Points {
		t.Run(loadString(pt.LoadR, pt.LoadX), func(t *testing.T) {
			e.setLoad(complex(grid.R(0), grid.X(j)))
			b := bruteBest(e, 401)
			t.Logf("brute force best SWR %.4f at C1 %.1f pF, C2 %.2f pF; search SWR %.4f",
				swr(b.gamma), e.capacitance(0, b.u[0])*1e12, e.capacitance(1, b.u[1])*1e12, pt.SWR)
			if b.gamma <= limit {
				t.Fatalf("brute force reaches SWR %.4f: the load is matchable", swr(b.gamma))
			}
			if pt.Matched {
				t.Fatalf("search reports a match (SWR %g) the brute force cannot find", pt.SWR)
			}
			if e := relErr(pt.SWR, swr(b.gamma)); e > 1e-3 {
				t.Errorf("search's best SWR %.5f, brute force %.5f", pt.SWR, swr(b.gamma))
			}
			if pt.LoadX == 0 {
				if c1 := e.capacitance(0, b.u[0]); relErr(c1, 250e-12) > 1e-3 { // the range's top, coupler.toml
					t.Errorf("2 kΩ + j0: best C1 %g F, expected the 250 pF stop", c1)
				}
			}
		})
	}

	// The same load with C1's range widened to 500 pF is matched.
	wide := demoFileCoupler()
	wide.Adjustable[0].Max = 500e-12
	rw, err := Map(context.Background(), wide, Options{Frequencies: []float64{f},
		Grid: Grid{RMin: 2000, RMax: 2000, NR: 1, NX: 1}})
	if err != nil {
		t.Fatal(err)
	}
	pt := rw.Frequencies[0].Points[0]
	if !pt.Matched || pt.Settings[0].Capacitance <= 250e-12 {
		t.Errorf("C1 to 500 pF: matched %v SWR %g settings %v; expected a match with C1 above 250 pF", pt.Matched, pt.SWR, pt.Settings)
	}
}
