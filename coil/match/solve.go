package match

import (
	"math"
	"math/cmplx"
	"sort"

	"gonum.org/v1/gonum/optimize"

	"turnwise/coil/circuit"
)

// The search over the adjustable capacitors for one load, at one
// frequency.
//
// Each capacitor's setting is a dial position u in [0, 1], logarithmic
// in capacitance: C = C_min·(C_max/C_min)^u. The objective is |Γ|², the
// reflection at port 1 for its reference impedance. The search
//
//  1. evaluates |Γ| on a grid of dial positions (gridSteps per axis),
//  2. takes the grid's local minima (no neighbour lower, diagonals
//     included), best first, at most maxStarts of them,
//  3. runs gonum/optimize's Nelder–Mead from each, in a folded
//     coordinate u = (1 − cos πx)/2 that keeps every trial inside the
//     capacitors' ranges without a penalty, until |Γ| < gammaStop or
//     the evaluation budget is spent,
//  4. keeps every end point that meets the SWR limit and returns them.
//
// What it guarantees: every setting it reports as a match was evaluated
// by the circuit solver and meets the limit (no load is forced); a
// mismatch it reports is the best |Γ| over the grid and the local
// searches. It does not prove that no setting exists when it reports none:
// a match region that lies between grid nodes and outside the basin of
// every started minimum can be missed. TestCoverageAtLeastBruteForce
// compares the coverage with a 201×201 dial grid;
// TestDemo2kOhmUnmatchedAt10MHz pins a row the demo cannot match (C1's
// 250 pF stop), where the reported best SWR is a 401×401 grid's minimum.
const (
	maxStarts  = 4
	gammaStop  = 1e-5 // SWR 1.00002: the search stops here
	startEvals = 160  // Nelder–Mead evaluations per start
)

// gridSteps is the number of grid positions per dial for d dials.
func gridSteps(d int) int {
	switch d {
	case 1:
		return 41
	case 2:
		return 9
	}
	return 5
}

// engine solves one prepared setup at one frequency.
type engine struct {
	p      *prepared
	ln     *lumped
	s      *circuit.Solver
	f      float64
	at     []int // per user part: its lumped index (−1 for a wound coil)
	adj    []int // lumped indexes of the adjustable capacitors
	lnr    []float64
	z0     float64
	evals  int
	values []float64 // scratch: capacitances
	fast   *fastNet  // nil: search with the circuit solver itself
	z      complex128
	gridW  [][3]complex128 // per dial grid node: Z_in for the three reference loads
}

// The reference loads the grid's Möbius maps are fitted through.
var mobiusZ = [3]complex128{10, 50, 250}

// gridByMobius fills vals with |Γ| at every dial grid node for the
// current load. For fixed capacitors the input impedance is a Möbius
// (bilinear) function of the load impedance, Z_in = (A·z + B)/(C·z + D)
// from the chain matrix, so it is fixed by its values at three loads:
// with K the cross-ratio of (z, z1, z2, z3),
//
//	Z_in = (w1·(w2 − w3) − K·w3·(w2 − w1)) / ((w2 − w3) − K·(w2 − w1)).
//
// The three values per node are solved once per frequency; each load then
// costs a few complex operations per node. The grid only chooses the
// starts; every value the search keeps comes from the network itself.
func (e *engine) gridByMobius(vals []float64, total, n int, pos func(int, []float64)) {
	if e.gridW == nil {
		e.gridW = make([][3]complex128, total)
		u := make([]float64, len(e.adj))
		for idx := range total {
			pos(idx, u)
			for k := range e.values {
				e.values[k] = e.capacitance(k, u[k])
			}
			for m, zr := range mobiusZ {
				w, ok := e.fast.zin(e.values, zr)
				if !ok {
					w = cmplx.Inf()
				}
				e.gridW[idx][m] = w
			}
		}
	}
	z1, z2, z3 := mobiusZ[0], mobiusZ[1], mobiusZ[2]
	kk := (e.z - z1) * (z2 - z3) / ((e.z - z3) * (z2 - z1))
	z0 := complex(e.fast.z0, 0)
	for idx, w := range e.gridW {
		zi := (w[0]*(w[1]-w[2]) - kk*w[2]*(w[1]-w[0])) / ((w[1] - w[2]) - kk*(w[1]-w[0]))
		g := cmplx.Abs((zi - z0) / (zi + z0))
		if math.IsNaN(g) || g > 1 {
			g = 1
		}
		vals[idx] = g
	}
}

func newEngine(p *prepared, f float64) (*engine, error) {
	ln, err := buildLumped(p.src, p.loadNode, f)
	if err != nil {
		return nil, err
	}
	s, err := circuit.NewSolver(&ln.net)
	if err != nil {
		return nil, err
	}
	e := &engine{p: p, ln: ln, s: s, f: f, z0: ln.net.Ports[0].Z0}
	e.at = make([]int, len(p.src.Parts))
	for i := range e.at {
		e.at[i] = -1
	}
	for li, o := range ln.orig {
		if o >= 0 && p.src.Parts[o].Kind != circuit.Wound {
			e.at[o] = li
		}
	}
	for k, i := range p.adj {
		e.adj = append(e.adj, e.at[i])
		e.lnr = append(e.lnr, math.Log(p.hi[k]/p.lo[k]))
	}
	e.values = make([]float64, len(p.adj))
	if fn, ok := newFastNet(ln, e.adj, f); ok {
		e.fast = fn
	}
	return e, nil
}

func (e *engine) setLoad(z complex128) {
	e.ln.net.Parts[e.ln.load].Z = z
	e.z = z
}

// capacitance is dial k's capacitance at position u.
func (e *engine) capacitance(k int, u float64) float64 {
	u = math.Min(1, math.Max(0, u))
	return e.p.lo[k] * math.Exp(u*e.lnr[k])
}

func (e *engine) set(u []float64) {
	for k, li := range e.adj {
		e.ln.net.Parts[li].Value = e.capacitance(k, u[k])
	}
}

// gamma is |Γ| at port 1 at dial positions u (1 where the equations are
// singular), from the reduced network.
func (e *engine) gamma(u []float64) float64 {
	e.evals++
	if e.fast == nil {
		return e.solverGamma(u)
	}
	for k := range e.values {
		e.values[k] = e.capacitance(k, u[k])
	}
	z, ok := e.fast.zin(e.values, e.z)
	if !ok {
		return 1
	}
	z0 := complex(e.fast.z0, 0)
	g := cmplx.Abs((z - z0) / (z + z0))
	if math.IsNaN(g) {
		return 1
	}
	return g
}

// solverGamma is |Γ| at port 1 at dial positions u from the circuit
// solver: the check every reported setting passes.
func (e *engine) solverGamma(u []float64) float64 {
	e.set(u)
	r, err := e.s.Response(e.f)
	if err != nil {
		return 1
	}
	g := cmplx.Abs(r.S[0][0])
	if math.IsNaN(g) {
		return 1
	}
	return g
}

// nearMiss is the |Γ| below which a load the Newton route did not match
// gets a derivative-free second look: three times the limit's SWR − 1
// (SWR 2.5 for a 1.5 limit). A load further off sits in a local minimum
// the Newton route has already found.
func nearMiss(limit float64) float64 {
	s := swr(limit)
	return gammaFor(1 + 3*(s-1))
}

// fold maps the optimiser's unbounded coordinate to a dial position.
func fold(x float64) float64 { return 0.5 - 0.5*math.Cos(math.Pi*x) }

// unfold is fold's inverse on [0, 1].
func unfold(u float64) float64 { return math.Acos(1-2*u) / math.Pi }

// candidate is one end point of the search.
type candidate struct {
	u     []float64
	gamma float64
}

// search returns the end points of the local searches, best |Γ| first.
// With first set it stops at the first end point within limit (enough
// to know the load is covered).
func (e *engine) search(limit float64, first bool) []candidate {
	d := len(e.adj)
	n := gridSteps(d)
	total := 1
	for range d {
		total *= n
	}
	vals := make([]float64, total)
	u := make([]float64, d)
	pos := func(idx int, u []float64) {
		for k := range d {
			u[k] = float64(idx%n) / float64(n-1)
			idx /= n
		}
	}
	if e.fast != nil {
		e.gridByMobius(vals, total, n, pos)
	} else {
		for idx := range total {
			pos(idx, u)
			vals[idx] = e.gamma(u)
		}
	}
	// Local minima of the grid, diagonals included.
	var starts []int
	for idx := range total {
		if isLocalMin(vals, idx, n, d) {
			starts = append(starts, idx)
		}
	}
	sort.Slice(starts, func(a, b int) bool { return vals[starts[a]] < vals[starts[b]] })
	if len(starts) > maxStarts {
		starts = starts[:maxStarts]
	}
	var out []candidate
	for _, idx := range starts {
		pos(idx, u)
		var c candidate
		if e.fast != nil {
			c = e.levenberg(u)
		} else {
			c = e.local(u, 0.6/float64(n-1))
		}
		if vals[idx] < c.gamma { // never worse than the start
			c = candidate{u: append([]float64(nil), u...), gamma: vals[idx]}
		}
		out = append(out, c)
		if first && c.gamma <= limit {
			break
		}
	}
	sort.Slice(out, func(a, b int) bool { return out[a].gamma < out[b].gamma })
	if e.fast != nil && len(out) > 0 && out[0].gamma > limit && out[0].gamma < nearMiss(limit) {
		// Not within the limit by Newton's route from any start: one
		// Nelder–Mead from the best end point, which needs no derivative
		// and settles on a minimum at the box's edge.
		if nm := e.local(out[0].u, 0.6/float64(n-1)); nm.gamma < out[0].gamma {
			out = append([]candidate{nm}, out...)
		}
	}
	return out
}

func isLocalMin(vals []float64, idx, n, d int) bool {
	v := vals[idx]
	coord := make([]int, d)
	rest := idx
	for k := range d {
		coord[k] = rest % n
		rest /= n
	}
	// Walk the 3^d − 1 neighbours.
	nb := 1
	for range d {
		nb *= 3
	}
	for m := range nb {
		off, j, stride, ok, self := m, 0, 1, true, true
		for k := range d {
			dk := off%3 - 1
			off /= 3
			c := coord[k] + dk
			if c < 0 || c >= n {
				ok = false
				break
			}
			if dk != 0 {
				self = false
			}
			j += c * stride
			stride *= n
		}
		if !ok || self {
			continue
		}
		if vals[j] < v || (vals[j] == v && j < idx) {
			return false
		}
	}
	return true
}

// local runs Nelder–Mead from dial positions u0.
func (e *engine) local(u0 []float64, step float64) candidate {
	d := len(u0)
	x0 := make([]float64, d)
	for k, u := range u0 {
		x0[k] = unfold(u)
	}
	best := math.Inf(1)
	ub := make([]float64, d)
	prob := optimize.Problem{
		Func: func(x []float64) float64 {
			for k := range x {
				ub[k] = fold(x[k])
			}
			g := e.gamma(ub)
			best = math.Min(best, g)
			return g * g
		},
		Status: func() (optimize.Status, error) {
			if best < gammaStop {
				return optimize.Success, nil
			}
			return optimize.NotTerminated, nil
		},
	}
	set := &optimize.Settings{
		FuncEvaluations: startEvals,
		Converger:       &optimize.FunctionConverge{Absolute: 1e-14, Relative: 1e-10, Iterations: 30},
	}
	res, err := optimize.Minimize(prob, x0, set, &optimize.NelderMead{SimplexSize: step})
	if err != nil || res == nil {
		return candidate{u: append([]float64(nil), u0...), gamma: 1}
	}
	c := candidate{u: make([]float64, d)}
	for k, x := range res.X {
		c.u[k] = fold(x)
	}
	c.gamma = e.gamma(c.u) // re-evaluate at the reported point
	return c
}

// drive is the network driven at port 1 with dial positions u: the
// state, and the power into port 1 for a 1 V peak EMF.
func (e *engine) drive(u []float64) (circuit.State, float64, error) {
	e.set(u)
	st, err := e.s.Drive(e.f, 1)
	if err != nil {
		return circuit.State{}, 0, err
	}
	v := st.V[e.ln.net.Ports[0].Node]
	i := (1 - v) / complex(e.z0, 0)
	return st, 0.5 * real(v*cmplx.Conj(i)), nil
}

// swr from |Γ|.
func swr(g float64) float64 {
	if g >= 1 {
		return math.Inf(1)
	}
	return (1 + g) / (1 - g)
}

// gammaFor is the |Γ| of an SWR.
func gammaFor(s float64) float64 { return (s - 1) / (s + 1) }
