package circuit

import (
	"math"
	"sort"

	"gonum.org/v1/gonum/mat"

	"turnwise/coil"
)

// Mode is a natural frequency of the lossless network.
type Mode struct {
	Frequency float64
	// Shape is the mode's node voltages (index by node, ground 0),
	// scaled to a largest magnitude of 1.
	Shape []float64
}

// NaturalFrequencies returns the natural frequencies of the lossless
// network below fMax (Hz), lowest first. Resistors, fixed impedances and
// port terminations are removed (open); capacitor and inductor series
// resistances are dropped. With shortPort1 the node of port 1 is tied to
// ground, which gives the series resonances seen at port 1; without it,
// the parallel ones. Each wound coil's inductance is taken at the mode's
// own frequency by fixed-point iteration.
func (s *Solver) NaturalFrequencies(fMax float64, shortPort1 bool) ([]Mode, error) {
	short := -1
	if shortPort1 {
		short = s.net.Ports[0].Node
	}
	// First pass with every coil at a low frequency.
	f0 := []float64{}
	lowF := 1.0 // Hz: the model's low-frequency values
	modes, err := s.eigen(lowF, short, 0)
	if err != nil {
		return nil, err
	}
	for _, m := range modes {
		f0 = append(f0, m.Frequency)
	}
	fMax = math.Min(fMax, coil.MaxFrequency)
	var out []Mode
	for _, guess := range f0 {
		if guess > fMax*1.5 || guess > coil.MaxFrequency {
			continue
		}
		f := guess
		var best Mode
		for it := 0; it < 12; it++ {
			w := 2 * math.Pi * f
			ms, err := s.eigen(f, short, w*w)
			if err != nil {
				return nil, err
			}
			best = nearest(ms, f)
			if best.Frequency == 0 {
				break
			}
			done := math.Abs(best.Frequency-f) < 1e-11*f
			f = best.Frequency
			if done || f > coil.MaxFrequency {
				break
			}
		}
		if best.Frequency > 0 && best.Frequency <= fMax {
			out = append(out, best)
		}
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Frequency < out[j].Frequency })
	// Two guesses can converge on one mode.
	var uniq []Mode
	for _, m := range out {
		if len(uniq) > 0 && math.Abs(m.Frequency-uniq[len(uniq)-1].Frequency) < 1e-9*m.Frequency {
			continue
		}
		uniq = append(uniq, m)
	}
	return uniq, nil
}

func nearest(ms []Mode, f float64) Mode {
	var best Mode
	bd := math.Inf(1)
	for _, m := range ms {
		if d := math.Abs(math.Log(m.Frequency / f)); d < bd {
			best, bd = m, d
		}
	}
	return best
}

// eigen solves Γ·v = ω²·C·v with every coil's model at f; node short is
// tied to ground (−1 for none). w02 scales the pencil (the eigenvalues
// near it are the most accurate); 0 takes tr Γ / tr C.
func (s *Solver) eigen(f float64, short int, w02 float64) ([]Mode, error) {
	if err := s.values(f); err != nil {
		return nil, err
	}
	n := s.net
	nn := s.nodes
	// Nodal capacitance matrix (ground row/column kept, dropped below).
	c := make([]float64, nn*nn)
	addC := func(i, j int, v float64) {
		c[i*nn+i] += v
		c[j*nn+j] += v
		c[i*nn+j] -= v
		c[j*nn+i] -= v
	}
	for i := range n.Parts {
		p := &n.Parts[i]
		switch p.Kind {
		case Capacitor:
			addC(p.A, p.B, p.Value)
		case Wound:
			cs := float64(s.wnd[i].m.SelfCapacitance)
			if p.TapNode >= 0 {
				addC(p.A, p.B, cs)
			} else {
				addC(s.internal[i], p.B, cs)
			}
		}
	}
	// Branch inductance matrix, its inverse, and Γ = A·L⁻¹·Aᵀ.
	nb := len(s.branches)
	gam := make([]float64, nn*nn)
	if nb > 0 {
		lm := mat.NewSymDense(nb, nil)
		for bi := range s.branches {
			lm.SetSym(bi, bi, s.branchL(bi))
			br := s.branches[bi]
			if br.role == roleTop {
				lm.SetSym(bi, bi+1, s.wnd[br.part].mm)
			}
		}
		for _, cp := range n.Couplings {
			bp, bq := s.inductiveBranch(cp.P), s.inductiveBranch(cp.Q)
			lm.SetSym(bp, bq, cp.K*math.Sqrt(s.branchL(bp)*s.branchL(bq)))
		}
		var ch mat.Cholesky
		if !ch.Factorize(lm) {
			return nil, errorf("", "the inductance matrix is not positive definite: check the couplings")
		}
		var inv mat.SymDense
		if err := ch.InverseTo(&inv); err != nil {
			return nil, ErrSingular
		}
		for bi, b1 := range s.branches {
			for bj, b2 := range s.branches {
				g := inv.At(bi, bj)
				if g == 0 {
					continue
				}
				gam[b1.p*nn+b2.p] += g
				gam[b1.q*nn+b2.q] += g
				gam[b1.p*nn+b2.q] -= g
				gam[b1.q*nn+b2.p] -= g
			}
		}
	}
	// Unknown nodes: not ground, not the shorted node, and touched by
	// something reactive. Nodes without capacitance carry no inertia:
	// they are condensed out (Γ' = Γcc − Γcn·Γnn⁻¹·Γnc) so that the
	// scaling below sees only the modes that matter.
	var capIdx, noCap []int
	for i := 1; i < nn; i++ {
		if i == short || (c[i*nn+i] == 0 && gam[i*nn+i] == 0) {
			continue
		}
		if c[i*nn+i] > 0 {
			capIdx = append(capIdx, i)
		} else {
			noCap = append(noCap, i)
		}
	}
	idx := capIdx
	m := len(idx)
	if m == 0 {
		return nil, nil
	}
	g := mat.NewSymDense(m, nil)
	for r, i := range idx {
		for q, j := range idx[:r+1] {
			g.SetSym(r, q, gam[i*nn+j])
		}
	}
	var back *mat.Dense // v_noCap = back·v_cap
	if k := len(noCap); k > 0 {
		gnn := mat.NewSymDense(k, nil)
		big := 0.0
		for r, i := range noCap {
			for q, j := range noCap[:r+1] {
				gnn.SetSym(r, q, gam[i*nn+j])
			}
			big = math.Max(big, gam[i*nn+i])
		}
		gnc := mat.NewDense(k, m, nil)
		for r, i := range noCap {
			for q, j := range idx {
				gnc.Set(r, q, gam[i*nn+j])
			}
		}
		var ch mat.Cholesky
		if !ch.Factorize(gnn) {
			// A floating inductor between nodes without capacitance: its
			// nodes are undetermined; a tiny stiffness fixes them.
			for r := 0; r < k; r++ {
				gnn.SetSym(r, r, gnn.At(r, r)+1e-12*big)
			}
			if !ch.Factorize(gnn) {
				return nil, ErrSingular
			}
		}
		back = mat.NewDense(k, m, nil)
		if err := ch.SolveTo(back, gnc); err != nil {
			return nil, ErrSingular
		}
		back.Scale(-1, back)
		var corr mat.Dense
		corr.Mul(gnc.T(), back) // −Γcn·Γnn⁻¹·Γnc
		for r := 0; r < m; r++ {
			for q := 0; q <= r; q++ {
				g.SetSym(r, q, g.At(r, q)+0.5*(corr.At(r, q)+corr.At(q, r)))
			}
		}
	}
	trC, trG := 0.0, 0.0
	for r, i := range idx {
		trC += c[i*nn+i]
		trG += g.At(r, r)
	}
	if trC == 0 || !(trG > 0) {
		return nil, nil
	}
	if !(w02 > 0) {
		w02 = trG / trC
	}
	bm := mat.NewSymDense(m, nil)
	cm := mat.NewSymDense(m, nil)
	for r, i := range idx {
		for q, j := range idx[:r+1] {
			bm.SetSym(r, q, g.At(r, q)/w02+c[i*nn+j])
			cm.SetSym(r, q, c[i*nn+j])
		}
	}
	var chB mat.Cholesky
	if !chB.Factorize(bm) {
		// A part of the network that floats once the resistors and port
		// terminations are gone (a trap between two ports): a tiny
		// capacitance to ground from every node gives its common mode a
		// zero frequency, which is dropped below, and moves the others by
		// about 1e-12 relative.
		eps := 1e-12 * trC / float64(m)
		for r := 0; r < m; r++ {
			bm.SetSym(r, r, bm.At(r, r)+eps)
			cm.SetSym(r, r, cm.At(r, r)+eps)
		}
		if !chB.Factorize(bm) {
			return nil, ErrSingular
		}
	}
	var lt mat.TriDense
	chB.LTo(&lt)
	// M = L⁻¹·C·L⁻ᵀ.
	var x, y mat.Dense
	if err := x.Solve(&lt, cm); err != nil {
		return nil, ErrSingular
	}
	if err := y.Solve(&lt, x.T()); err != nil {
		return nil, ErrSingular
	}
	sym := mat.NewSymDense(m, nil)
	for r := 0; r < m; r++ {
		for q := 0; q <= r; q++ {
			sym.SetSym(r, q, 0.5*(y.At(r, q)+y.At(q, r)))
		}
	}
	var es mat.EigenSym
	if !es.Factorize(sym, true) {
		return nil, ErrSingular
	}
	vals := es.Values(nil)
	var vecs mat.Dense
	es.VectorsTo(&vecs)
	var modes []Mode
	for k, mu := range vals {
		if !(mu > 1e-12 && mu < 1-1e-12) {
			continue // an infinite (no capacitance) or DC mode
		}
		om2 := w02 * (1/mu - 1)
		fr := math.Sqrt(om2) / (2 * math.Pi)
		// v = L⁻ᵀ·w in node coordinates.
		wv := mat.NewVecDense(m, nil)
		for r := 0; r < m; r++ {
			wv.SetVec(r, vecs.At(r, k))
		}
		var v mat.VecDense
		if err := v.SolveVec(lt.T(), wv); err != nil {
			continue
		}
		shape := make([]float64, nn)
		big := 0.0
		for r, i := range idx {
			shape[i] = v.AtVec(r)
			big = math.Max(big, math.Abs(shape[i]))
		}
		if back != nil {
			var vn mat.VecDense
			vn.MulVec(back, &v)
			for r, i := range noCap {
				shape[i] = vn.AtVec(r)
				big = math.Max(big, math.Abs(shape[i]))
			}
		}
		if big > 0 {
			for i := range shape {
				shape[i] /= big
			}
		}
		modes = append(modes, Mode{Frequency: fr, Shape: shape})
	}
	return modes, nil
}

// values evaluates every wound coil's model at f.
func (s *Solver) values(f float64) error {
	for i := range s.net.Parts {
		p := &s.net.Parts[i]
		if p.Kind != Wound {
			continue
		}
		wa, err := p.woundAt(f)
		if err != nil {
			return err
		}
		s.wnd[i] = wa
	}
	s.lf = 0 // the factorisation no longer matches the stored models
	return nil
}
