package design

import (
	"math"
	"turnwise/coil"
)

// Bounds on a pair before any full evaluation: the fewest turns, and the
// score of each pitch band (see bound).

// upperL is an upper bound on the matched value of n turns at pitch, for
// any coil that meets the SRF limit: the model's inductance at DC (the
// internal inductance only falls with frequency) plus the leads with their
// full internal inductance; for an effective target the helix part is
// divided by the least 1 − (f/SRF)². Rosa's ring part falls with the
// pitch; the helix's own part (coil.HelixPitchCorrection) rises, and for
// short fat coils past p ≈ 0.7·D so does the whole (the helix integral
// agrees), so the bound takes the helix part at the loosest pitch the
// search tries when that is larger: it then holds for every looser pitch
// too (TestDesignMonotoneInPitch).
func (x *search) upperL(p *pair, n, pitch float64) float64 {
	x.stats.BoundEvaluations++
	dw := &x.wires[p.wi]
	c := x.core(p, n, pitch)
	dl := c.Pitched
	if loose := coil.LoosestPitchFactor * dw.do; loose > pitch {
		dl = math.Max(dl, coil.HelixPitchMax(n, loose, 2*dw.r, p.dm))
	}
	return dw.leadsMax + (c.LCoilDC-c.Pitched+dl)/x.grDiv
}

// minTurnsAt is the fewest quarter turns, at least floor, whose upperL at
// pitch reaches need: no coil with that pitch or a looser one and fewer
// turns can reach it (upperL rises with the turns and falls with the
// pitch). The search starts at start (≥ floor). +Inf beyond coil.MaxTurns.
func (x *search) minTurnsAt(p *pair, pitch, need, floor, start float64) float64 {
	a := p.dm / 2
	ok := func(n float64) bool { return x.upperL(p, n, pitch) >= need }
	// Newton steps with L ∝ N^α (Wheeler's form) up to a count that
	// reaches need.
	n := math.Max(start, floor)
	v := x.upperL(p, n, pitch)
	for i := 0; v < need; i++ {
		var n2 float64
		if i < 4 {
			alpha := 2 - n*pitch/(n*pitch+0.9*a)
			n2 = math.Ceil(n*(1+(need/v-1)/alpha)*4) / 4
		}
		if n2 <= n {
			n2 = n + 0.25*float64(int(1)<<min(i, 20))
		}
		if n2 > coil.MaxTurns {
			return math.Inf(1)
		}
		n, v = n2, x.upperL(p, n2, pitch)
	}
	// n reaches need; gallop down to one that does not, then bisect.
	hi := n
	step := 0.25
	for {
		lo := hi - step
		if lo < floor-1e-9 {
			if floor < hi && !ok(floor) {
				return quarterBisect(floor, hi, ok)
			}
			return math.Min(floor, hi)
		}
		if !ok(lo) {
			return quarterBisect(lo, hi, ok)
		}
		hi = lo
		step *= 2
	}
}

// boundSlices is how many pitch bands the pair bound splits
// [d_o, coil.LoosestPitchFactor·d_o] into.
const boundSlices = 4

// bound sets p.nLB and the pair's bounds; nLB = 0 means the pair cannot
// work. A coil of the pair with its pitch in a band [p_k, p_k+1] has at
// least minTurnsAt(p_k) turns, so its helix, size and wire are at least
// those of that many turns at p_k, its proximity factor at least that at
// p_k+1, and its spacing penalty at least the least over the band. The
// pair's bound is the best band's.
func (x *search) bound(p *pair) {
	x.stats.Bounded++
	s := x.s
	dw := &x.wires[p.wi]
	if dw.leadsMax >= s.required*(1-s.margin) && !s.effective {
		// The leads alone leave no room for a coil.
		x.miss.tooSmall(dw.leadsMax, p, 0)
		return
	}
	// Wheeler's long-coil form inverted for N at close winding is the
	// first guess.
	a := p.dm / 2
	T := s.required
	need0 := T * (1 + s.margin) // close winding must reach this
	if s.effective {
		need0 = T // an effective value at close winding has no upper bound
	}
	tc := math.Max(need0-dw.leadsMax, need0*0.05)
	k := coil.Mu0 * math.Pi * a * a
	guess := (tc*dw.do + math.Sqrt(tc*tc*dw.do*dw.do+4*k*0.9*a*tc)) / (2 * k)
	guess = math.Max(s.minTurns, math.Floor(guess*4)/4)
	if guess > coil.MaxTurns {
		x.miss.tooLarge(p)
		return
	}
	nLB := x.minTurnsAt(p, dw.do, need0, s.minTurns, guess)
	if math.IsInf(nLB, 1) {
		x.miss.tooLarge(p)
		return
	}
	p.nLB = nLB
	p.ub = x.scoreBound(p, nLB)
}

// sliceRatios are the pitch bands' edges in overall wire diameters:
// LoosestPitchFactor^(k/boundSlices).
var sliceRatios = func() (r [boundSlices + 1]float64) {
	for k := range r {
		r[k] = math.Pow(coil.LoosestPitchFactor, float64(k)/boundSlices)
	}
	return r
}()

// refine computes the pair's pitch-band bounds (once) and tightens p.ub.
func (x *search) refine(p *pair) {
	if p.slices >= 0 {
		return
	}
	p.slices = len(x.slices)
	x.slices = append(x.slices, make([]slice, boundSlices)...)
	x.stats.Refined++
	dw := &x.wires[p.wi]
	T := x.s.required
	ub := math.Inf(-1)
	n := p.nLB
	for k := range boundSlices {
		p0 := sliceRatios[k] * dw.do
		if k > 0 {
			n = x.minTurnsAt(p, p0, T, n, n)
		}
		if math.IsInf(n, 1) {
			x.slices[p.slices+k] = slice{ub: math.Inf(-1)}
			continue
		}
		sl := x.sliceBound(p, n, p0, sliceRatios[k+1]*dw.do, &dw.sliceRow[k])
		x.slices[p.slices+k] = sl
		ub = math.Max(ub, sl.ub)
	}
	p.ub = math.Min(p.ub, ub)
}

// slice is the bound of one pitch band of a pair: at least n turns.
type slice struct{ ub, q, vol, n float64 }

// sliceTurns is the least turns of pitch band k of refined pair p.
func (x *search) sliceTurns(p *pair, k int) float64 { return x.slices[p.slices+k].n }

// sliceBound bounds coils of at least n turns with pitch in [p0, p1].
func (x *search) sliceBound(p *pair, n, p0, p1 float64, row *coil.ProximityRow) slice {
	w := x.w
	dw := &x.wires[p.wi]
	helix := coil.HelixLength(n, p.dm, p0)
	length := (n-1)*p0 + dw.do
	vol := math.Pi / 4 * p.od * p.od * length
	wire := helix + 2*float64(x.s.c.LeadLength) + float64(coil.CutAllowance)
	ld := n * p0 / p.dm
	sl := slice{vol: vol, n: n}
	sl.ub = -w.size*math.Log(math.Cbrt(vol)/scoreSizeRef) - w.cu*math.Log(wire/scoreWireRef)
	if x.s.opF > 0 {
		fr := &dw.atOp
		phi := row.MinOver(ld, math.Inf(1))
		prox := coil.PartialProximity(phi, fr.Fs)
		sl.q = x.qFromR(p, dw.rdcPerM*fr.Fs*helix*prox)
		sl.ub += w.q*w.utility(sl.q) + w.srf*scoreSRFCap
	}
	if x.s.opF > 0 {
		// Fewer turns than the band allows would not hit the target, so
		// the SRF bound takes the band's own least turns as its most
		// too only when the band is closed; here it is open-ended above.
		srf := x.srfUpper(p, math.Inf(1), ld, math.Inf(1))
		if srf < x.s.srfRatio*x.s.opF {
			return slice{ub: math.Inf(-1), vol: vol, n: n}
		}
	}
	sl.ub -= w.ease * (0.5*spacingPenaltyMin(p0/dw.do, p1/dw.do) + shapePenaltyMin(ld, math.Inf(1)))
	if p.tinned {
		sl.ub -= tinnedPenalty
	}
	return sl
}
