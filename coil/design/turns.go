package design

import (
	"math"
	"turnwise/coil"
)

// The turns range of a pair and the pitch that hits the target.

// turnsRange finds the turns whose window holds the target with the
// margin: nLo, the fewest whose close winding reaches (1+m)·target, and
// nHi, the most whose loosest pitch stays at or below (1−m)·target. Both
// values rise with the turns, so each boundary is found by galloping from
// a guess and bisecting on quarter turns. ok is false when the range is
// empty.
func (x *search) turnsRange(p *pair) (nLo, nHi float64, ok bool) {
	nLo, vLoose, ok := x.turnsLow(p)
	if !ok {
		return 0, 0, false
	}
	return nLo, x.turnsHigh(p, nLo, vLoose), true
}

// turnsLow finds nLo and the value at the loosest pitch there; ok is false
// when even nLo's loosest pitch is above (1−m)·target.
func (x *search) turnsLow(p *pair) (nLo, vLoose float64, ok bool) {
	s := x.s
	T := s.required
	hi, lo := T*(1+s.margin), T*(1-s.margin)
	loose := coil.LoosestPitchFactor * p.do
	closeOK := func(n float64) bool { return x.matched(p, n, p.do) >= hi }
	// nLo: nLB cannot be beaten from below.
	nLo = p.nLB
	if !closeOK(nLo) {
		a, step := nLo, 0.25 // closeOK(a) is false
		b := a + step
		for !closeOK(b) {
			a = b
			step *= 2
			b = a + step
			if b > coil.MaxTurns {
				x.miss.tooLarge(p)
				return 0, 0, false
			}
		}
		nLo = quarterBisect(a, b, closeOK)
	}
	vLoose = x.matched(p, nLo, loose)
	if math.IsInf(vLoose, 1) {
		// Past its own resonance even spread out: too much coil for f.
		x.miss.selfResonant = true
		return 0, 0, false
	}
	if vLoose > lo {
		if nLo == s.minTurns {
			x.miss.tooSmall(vLoose, p, nLo)
		} else {
			x.miss.note("trim_margin", vLoose/lo, p, nLo, 0)
		}
		return 0, 0, false
	}
	return nLo, vLoose, true
}

// turnsHigh finds nHi ≥ nLo given the value vLoose at nLo's loosest pitch.
func (x *search) turnsHigh(p *pair, nLo, vLoose float64) (nHi float64) {
	s := x.s
	lo := s.required * (1 - s.margin)
	loose := coil.LoosestPitchFactor * p.do
	looseOK := func(n float64) bool { return x.matched(p, n, loose) <= lo }
	// Wheeler's form L ∝ N²/(N·p + 0.9a) at the loosest pitch gives the
	// guess; then gallop and bisect.
	a := p.dm / 2
	alpha := 2 - nLo*loose/(nLo*loose+0.9*a)
	guess := math.Floor(nLo*math.Pow(lo/vLoose, 1/alpha)*4) / 4
	guess = math.Min(math.Max(guess, nLo), coil.MaxTurns)
	var okN, badN float64 // looseOK(okN), !looseOK(badN)
	if looseOK(guess) {
		okN = guess
		step := math.Max(0.25, math.Floor(guess*0.02*4)/4)
		for {
			b := okN + step
			if b > coil.MaxTurns {
				return okN
			}
			if !looseOK(b) {
				badN = b
				break
			}
			okN = b
			step *= 2
		}
	} else {
		badN = guess
		step := math.Max(0.25, math.Floor(guess*0.02*4)/4)
		okN = nLo
		for b := badN - step; b > nLo; b -= step {
			if looseOK(b) {
				okN = b
				break
			}
			badN = b
			step *= 2
		}
	}
	return quarterBisect(okN, badN, func(n float64) bool { return !looseOK(n) }) - 0.25
}

// quarterBisect returns the least quarter turn in (a, b] for which pred
// holds, given !pred(a) and pred(b), pred monotone.
func quarterBisect(a, b float64, pred func(float64) bool) float64 {
	for b-a > 0.25+1e-9 {
		m := math.Floor((a+b)/2*4) / 4
		if m <= a {
			m = a + 0.25
		}
		if pred(m) {
			b = m
		} else {
			a = m
		}
	}
	return b
}

// pitchSolver carries what one turns count teaches the next: the last
// solutions (for extrapolation) and the slope d ln L / d ln p.
type pitchSolver struct {
	n1, p1, n2, p2 float64 // last two solutions, n1 the latest
	slope          float64
	value          float64 // matched value at the last solution
}

// solvePitch finds the pitch at which pair p with n turns hits the
// target. The bracket is close winding (above the target: n ≥ nLo) to
// the loosest pitch (below: n ≤ nHi). The first guess extrapolates the
// previous solutions through Wheeler's form (N·p + 0.9a ∝ N² at fixed L
// and D), or inverts that form outright; Newton steps in (ln p, ln L) use
// the slope learned so far and fall back to bisection when they leave the
// bracket.
//
// The value need not fall monotonically with the pitch: for short fat
// coils it rises again past p ≈ 0.8·D (coil.HelixPitchCorrection, as the
// helix Neumann integral does). It falls and then at most rises once, so
// with f(close) > 0 > f(loosest) it crosses the target exactly once (a
// rising tail ends below the target, so lies wholly below it), and the
// sign-kept bracket converges to that crossing whatever the slope; Newton
// steps only use a falling slope and fall back to bisection. The turns
// range (turnsRange) takes the window's ends, not its interior least: a
// coil whose interior dips below (1−m)·target while its loosest end does
// not is left out, which only omits candidates (never admits one outside
// the trim window) and concerns p > 0.7·D only (design's loosest pitch is
// 3·d_o, so wire thick against the diameter, D < 4.3·d_o).
func (x *search) solvePitch(p *pair, n float64, sv *pitchSolver) (float64, bool) {
	T := x.s.required
	const relTol = 1e-7
	a := p.dm / 2
	lo, hi := p.do, coil.LoosestPitchFactor*p.do // bracket: f(lo) > 0 > f(hi)
	var p0 float64
	switch {
	case sv.n2 > 0:
		// c = (p + 0.9a/N)/N is nearly constant at fixed L and D;
		// extrapolate it linearly in N.
		c1 := (sv.p1 + 0.9*a/sv.n1) / sv.n1
		c2 := (sv.p2 + 0.9*a/sv.n2) / sv.n2
		c := c1 + (c1-c2)*(n-sv.n1)/(sv.n1-sv.n2)
		p0 = c*n - 0.9*a/n
	case sv.n1 > 0:
		c := (sv.p1 + 0.9*a/sv.n1) / sv.n1
		p0 = c*n - 0.9*a/n
	default:
		lead := x.wires[p.wi].atMatch.Leads
		tc := math.Max(T-lead, T*0.05)
		p0 = (coil.Mu0*math.Pi*a*a*n*n/tc - 0.9*a) / n
	}
	if !(p0 > lo && p0 < hi) {
		p0 = (lo + hi) / 2
	}
	// slope is d ln L / d ln p; Wheeler's form gives the first one.
	slope := sv.slope
	if slope >= 0 {
		slope = -n * p0 / (n*p0 + 0.9*a)
	}
	pPrev, fPrev := math.NaN(), math.NaN()
	for range 40 {
		v := x.matched(p, n, p0)
		f := v/T - 1
		if math.IsNaN(f) {
			return 0, false
		}
		if math.Abs(f) < relTol {
			sv.n2, sv.p2 = sv.n1, sv.p1
			sv.n1, sv.p1 = n, p0
			sv.slope, sv.value = slope, v
			return p0, true
		}
		if f > 0 {
			lo = p0
		} else {
			hi = p0
		}
		if !math.IsInf(f, 0) && !math.IsNaN(fPrev) && !math.IsInf(fPrev, 0) && f != fPrev {
			if sl := (f - fPrev) / (p0 - pPrev) * p0; sl < 0 {
				slope = sl
			}
		}
		next := math.NaN()
		if !math.IsInf(f, 0) {
			next = p0 * (1 - f/slope)
		}
		if !(next > lo && next < hi) {
			next = (lo + hi) / 2
		}
		pPrev, fPrev = p0, f
		p0 = next
		if hi-lo < 1e-12*hi {
			break
		}
	}
	return 0, false
}
