package design

import (
	"errors"
	"fmt"
	"math"
	"testing"
	"turnwise/coil"
)

// maxParetoQ is the highest Q on r's Pareto front: the highest-Q coil the
// stock allows (nothing beats it on Q, so nothing dominates it).
func maxParetoQ(r Result) float64 {
	q := 0.0
	for _, p := range r.Pareto {
		q = math.Max(q, p.Prediction.Q)
	}
	return q
}

// A Q floor is a constraint of the search, not a filter after it: asked
// for the five best coils of Q at least 90 % of the best the stock can do,
// the search lists five, where filtering its hundred best unfloored coils
// (what design --min-q did before) keeps fewer. Every coil listed, and
// every Pareto point, reaches the floor and meets the target and limits.
func TestDesignMinQFillsTheList(t *testing.T) {
	t.Parallel()
	for _, tc := range designCases() {
		if tc.name != "vhf inductance" && tc.name != "q at other f" {
			continue
		}
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			c := tc.c
			c.Top = MaxTop
			all, err := Search(tc.t, c)
			if err != nil {
				t.Fatal(err)
			}
			floor := 0.9 * maxParetoQ(all)
			filtered := 0
			for _, k := range all.Candidates {
				if k.Prediction.Q >= floor {
					filtered++
				}
			}
			c = tc.c
			c.MinQ = floor
			res, err := Search(tc.t, c)
			if err != nil {
				t.Fatal(err)
			}
			if len(res.Candidates) != DefaultTop {
				t.Errorf("floor Q %.0f: %d candidates, want %d", floor, len(res.Candidates), DefaultTop)
			}
			if filtered >= DefaultTop {
				t.Errorf("filtering the %d best unfloored coils already gives %d of Q ≥ %.0f: the case does not show the gap", len(all.Candidates), filtered, floor)
			}
			for _, k := range res.Candidates {
				checkCoil(t, tc, res, k)
				if k.Prediction.Q < floor {
					t.Errorf("candidate %s turns of %s on %s has Q %.1f below the floor %.1f", fmt.Sprint(k.Prediction.Geometry.Turns), k.Wire.Name, k.Support.Name, k.Prediction.Q, floor)
				}
			}
			for _, k := range res.Pareto {
				if k.Prediction.Q < floor {
					t.Errorf("Pareto point of Q %.1f below the floor %.1f", k.Prediction.Q, floor)
				}
			}
		})
	}
}

// With a floor, the top candidate is the best-scoring coil of Q at least
// the floor on a brute-force grid over a small stock (every quarter turn,
// 600 pitches from close-wound to the loosest), so the pruning by the Q
// bound drops nothing that reaches the floor.
func TestDesignMinQAgainstBruteForce(t *testing.T) {
	t.Parallel()
	sups, wires, cases := bruteStock()
	const steps = 600
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			tc.c.Supports, tc.c.Wires = sups, wires
			unfloored, err := Search(tc.t, tc.c)
			if err != nil {
				t.Fatal(err)
			}
			// A floor above the unfloored top candidate's Q, so the floor binds.
			floor := math.Max(unfloored.Candidates[0].Prediction.Q*1.02, 0.85*maxParetoQ(unfloored))
			tc.c.MinQ = floor
			res, err := Search(tc.t, tc.c)
			if err != nil {
				t.Fatal(err)
			}
			s, _ := resolve(tc.t, tc.c)
			best, bestName := math.Inf(-1), ""
			bruteForce(tc.t, &tc.c, s, steps, func(p coil.Prediction, g coil.Geometry, sp Support, w WireOption) {
				if p.Q < floor {
					return
				}
				if sc := testScore(p, tc.c.Prefer, s.srfRatio, w.Conductor == coil.Tinned); sc > best {
					best, bestName = sc, fmt.Sprintf("%g turns of %s on %s at %.3g mm (Q %.0f)", g.Turns, w.Name, sp.Name, float64(g.Pitch)*1e3, p.Q)
				}
			})
			if math.IsInf(best, -1) {
				t.Fatalf("the grid finds no coil of Q ≥ %.0f: pick a lower floor", floor)
			}
			top := res.Candidates[0]
			// 0.25 % off target moves the score by a few thousandths
			// (as in TestDesignOptimalAgainstBruteForce).
			const scoreSlack = 0.01
			if best > top.Score+scoreSlack {
				t.Errorf("floor Q %.0f: brute force finds %s scoring %.4f, above the top candidate's %.4f", floor, bestName, best, top.Score)
			}
			if best < top.Score-scoreSlack {
				t.Errorf("floor Q %.0f: brute force's best %.4f is far below the top candidate's %.4f: the grid misses it", floor, best, top.Score)
			}
			for _, k := range append(res.Candidates, res.Pareto...) {
				if k.Prediction.Q < floor {
					t.Errorf("coil of Q %.1f listed under the floor %.1f", k.Prediction.Q, floor)
				}
			}
		})
	}
}

// A floor above every coil is an *InfeasibleError on "min_q" naming the
// best Q the stock reaches: the top of the unfloored Pareto front.
func TestDesignMinQInfeasible(t *testing.T) {
	t.Parallel()
	tc := designCases()[1] // vhf inductance
	all, err := Search(tc.t, tc.c)
	if err != nil {
		t.Fatal(err)
	}
	qmax := maxParetoQ(all)
	c := tc.c
	c.MinQ = 1.2 * qmax
	_, err = Search(tc.t, c)
	var ie *InfeasibleError
	if !errors.As(err, &ie) || ie.Constraint != "min_q" {
		t.Fatalf("err = %v, want an *InfeasibleError on min_q", err)
	}
	if relErr(ie.Nearest, qmax) > 1e-3 {
		t.Errorf("nearest Q %.2f, want the best the stock reaches, %.2f", ie.Nearest, qmax)
	}
}
