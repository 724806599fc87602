package match

import (
	"math"
	"math/cmplx"

	"turnwise/coil/circuit"
)

// fastNet is the lumped network at one frequency reduced to its nodal
// admittance matrix with the adjustable capacitors and the load left out,
// so that one trial setting costs a stamp and a small elimination rather
// than a full assembly. The inductive branches enter through their
// branch impedance matrix: Y_L = A·Z_b⁻¹·Aᵀ (A the node–branch incidence),
// which is modified nodal analysis with the branch currents eliminated.
// The search uses it; every setting it reports is solved again by the
// circuit solver (TestFastMatchesSolver holds the two together).
type fastNet struct {
	n    int // unknowns: nodes − 1
	w    float64
	y0   []complex128 // n×n, fixed parts, port 1 open, port 2 terminated
	port int          // port 1's unknown
	z0   float64
	adj  [][2]int       // adjustable capacitors' unknowns (−1: ground)
	caps []circuit.Part // adjustable capacitors, Value set per trial
	load [2]int
	a    []complex128 // scratch
	x    []complex128
}

func newFastNet(ln *lumped, adj []int, f float64) (*fastNet, bool) {
	net := &ln.net
	n := len(net.Nodes) - 1
	w := 2 * math.Pi * f
	fn := &fastNet{n: n, w: w, y0: make([]complex128, n*n), a: make([]complex128, n*n), x: make([]complex128, n),
		port: net.Ports[0].Node - 1, z0: net.Ports[0].Z0}
	stamp := func(i, j int, y complex128) {
		i, j = i-1, j-1
		if i >= 0 {
			fn.y0[i*n+i] += y
		}
		if j >= 0 {
			fn.y0[j*n+j] += y
		}
		if i >= 0 && j >= 0 {
			fn.y0[i*n+j] -= y
			fn.y0[j*n+i] -= y
		}
	}
	isAdj := map[int]bool{}
	for _, li := range adj {
		isAdj[li] = true
		p := net.Parts[li]
		fn.adj = append(fn.adj, [2]int{p.A - 1, p.B - 1})
		fn.caps = append(fn.caps, p)
	}
	var br []int // inductor part indexes
	brIndex := map[int]int{}
	for i, p := range net.Parts {
		switch {
		case i == ln.load || isAdj[i]:
		case p.Kind == circuit.Resistor:
			stamp(p.A, p.B, complex(1/p.Value, 0))
		case p.Kind == circuit.Impedance:
			stamp(p.A, p.B, 1/p.Z)
		case p.Kind == circuit.Capacitor:
			stamp(p.A, p.B, 1/complex(p.SeriesR(), -1/(w*p.Value)))
		case p.Kind == circuit.Inductor:
			brIndex[i] = len(br)
			br = append(br, i)
		default:
			return nil, false // a wound coil left unreplaced: not expected
		}
	}
	if len(net.Ports) == 2 {
		stamp(net.Ports[1].Node, circuit.Ground, complex(1/net.Ports[1].Z0, 0))
	}
	lp := net.Parts[ln.load]
	fn.load = [2]int{lp.A - 1, lp.B - 1}
	nb := len(br)
	if nb > 0 {
		zb := make([]complex128, nb*nb)
		for k, i := range br {
			p := net.Parts[i]
			zb[k*nb+k] = complex(p.SeriesR(), w*p.Value)
		}
		for _, c := range net.Couplings {
			bp, bq := brIndex[c.P], brIndex[c.Q]
			m := complex(0, w*c.K*math.Sqrt(net.Parts[c.P].Value*net.Parts[c.Q].Value))
			zb[bp*nb+bq] += m
			zb[bq*nb+bp] += m
		}
		yb, ok := invert(zb, nb)
		if !ok {
			return nil, false
		}
		for b, ib := range br {
			for c, ic := range br {
				y := yb[b*nb+c]
				pb, qb := net.Parts[ib].A-1, net.Parts[ib].B-1
				pc, qc := net.Parts[ic].A-1, net.Parts[ic].B-1
				add := func(r, s int, v complex128) {
					if r >= 0 && s >= 0 {
						fn.y0[r*n+s] += v
					}
				}
				add(pb, pc, y)
				add(pb, qc, -y)
				add(qb, pc, -y)
				add(qb, qc, y)
			}
		}
	}
	return fn, true
}

// zin is the impedance at port 1 with capacitances c and load z.
func (fn *fastNet) zin(c []float64, z complex128) (complex128, bool) {
	n := fn.n
	a := fn.a
	copy(a, fn.y0)
	stamp := func(i, j int, y complex128) {
		if i >= 0 {
			a[i*n+i] += y
		}
		if j >= 0 {
			a[j*n+j] += y
		}
		if i >= 0 && j >= 0 {
			a[i*n+j] -= y
			a[j*n+i] -= y
		}
	}
	for k, nodes := range fn.adj {
		p := &fn.caps[k]
		p.Value = c[k]
		stamp(nodes[0], nodes[1], 1/complex(p.SeriesR(), -1/(fn.w*c[k])))
	}
	stamp(fn.load[0], fn.load[1], 1/z)
	x := fn.x
	clear(x)
	x[fn.port] = 1
	if !gaussSolve(a, x, n, cmplx.Abs) {
		return 0, false
	}
	zi := x[fn.port]
	if cmplx.IsNaN(zi) || cmplx.IsInf(zi) {
		return 0, false
	}
	return zi, true
}

// invert is a small dense complex inverse by Gauss–Jordan elimination
// with partial pivoting.
func invert(m []complex128, n int) ([]complex128, bool) {
	a := append([]complex128(nil), m...)
	inv := make([]complex128, n*n)
	for i := range n {
		inv[i*n+i] = 1
	}
	for k := range n {
		piv, best := k, cmplx.Abs(a[k*n+k])
		for i := k + 1; i < n; i++ {
			if v := cmplx.Abs(a[i*n+k]); v > best {
				piv, best = i, v
			}
		}
		if !(best > 1e-300) {
			return nil, false
		}
		for j := range n {
			a[k*n+j], a[piv*n+j] = a[piv*n+j], a[k*n+j]
			inv[k*n+j], inv[piv*n+j] = inv[piv*n+j], inv[k*n+j]
		}
		d := 1 / a[k*n+k]
		for j := range n {
			a[k*n+j] *= d
			inv[k*n+j] *= d
		}
		for i := range n {
			if i == k || a[i*n+k] == 0 {
				continue
			}
			m := a[i*n+k]
			for j := range n {
				a[i*n+j] -= m * a[k*n+j]
				inv[i*n+j] -= m * inv[k*n+j]
			}
		}
	}
	return inv, true
}
