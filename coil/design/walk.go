package design

import (
	"math"
	"turnwise/coil"
)

// One pair's turns, visited: the knots of the branch and bound, and the
// depth-first walk the free-diameter objective and the miss report use.

// walkPair enumerates the turns of pair p and returns its best coil. With
// global set it also feeds the Pareto set, prunes against the top list and
// notes near misses; without, it only looks for the pair's best (the
// free-diameter search's objective).
//
// Turns are visited branch-and-bound fashion: first a few knots spread
// over the range, solved and scored; then each stretch between two knots
// is enumerated only if its bound (intervalBound, which uses the knots'
// exact pitch, size and wire as the stretch's extremes) can still enter
// the top list or the Pareto set.
func (x *search) walkPair(p *pair, global bool) (found, bool) {
	x.stats.Searched++
	wk := walk{x: x, p: p, global: global}
	nLo, vLoose, ok := x.turnsLow(p)
	if !ok {
		return found{}, false
	}
	wk.maxLen = float64(x.s.c.MaxLength)
	if x.relax == "max_length" {
		wk.maxLen = 0
	}
	wk.maxWire = float64(x.s.c.MaxWireLength)
	if x.relax == "max_wire_length" {
		wk.maxWire = 0
	}
	if x.relax != "" {
		// The nearest miss is the fewest turns that work.
		nHi := x.turnsHigh(p, nLo, vLoose)
		for n := nLo; n <= nHi+1e-9; n += 0.25 {
			k := wk.visit(n, &wk.sv)
			if k.stop || k.solved && k.kept {
				break
			}
		}
		return wk.best, wk.found
	}
	// The low end; a bound over every count above it from what it shows;
	// the high end; then bisection of every stretch whose bound can still
	// win.
	a := wk.visit(nLo, &wk.sv)
	if a.solved && !a.stop {
		open := knot{n: math.Inf(1), pitch: coil.LoosestPitchFactor * p.do}
		open.lean.ld = math.Inf(1)
		if ub, qub, vol := x.intervalBound(p, &a, &open, 0); wk.cannotWin(ub, qub, vol) {
			return wk.best, wk.found
		}
	}
	nHi := x.turnsHigh(p, nLo, vLoose)
	if a.stop || !a.solved {
		if !a.stop && nHi > nLo {
			// An unsolved end (should not happen) leaves a plain walk.
			for n := nLo + 0.25; n <= nHi+1e-9; n += 0.25 {
				if wk.visit(n, &wk.sv).stop {
					break
				}
			}
		}
		return wk.best, wk.found
	}
	if nHi > nLo {
		b := wk.visit(nHi, &wk.sv)
		wk.stretch(&a, &b)
	}
	return wk.best, wk.found
}

// stretch visits the turns strictly between knots a and b (a solved and
// within the limits), bisecting while the stretch is long and its bound
// can still win. It reports whether a limit that only grows with the turns
// was met (the caller stops there).
func (wk *walk) stretch(a, b *knot) (stopped bool) {
	x, p := wk.x, wk.p
	if b.n-a.n < 0.5-1e-9 {
		return b.stop
	}
	interiorPen := 0.0 // least turns penalty inside
	if math.Floor(b.n-1e-9) < math.Ceil(a.n+1e-9) {
		interiorPen = 0.25
		if math.Floor(2*b.n-1e-9) < math.Ceil(2*a.n+1e-9) {
			interiorPen = 0.5
		}
	}
	ub, qub, vol := x.intervalBound(p, a, b, interiorPen)
	if wk.cannotWin(ub, qub, vol) {
		return b.stop
	}
	if b.n-a.n > 1+1e-9 {
		mid := math.Round((a.n+b.n)/2*4) / 4
		sv := pitchSolver{n1: a.n, p1: a.pitch, slope: a.slope}
		m := wk.visit(mid, &sv)
		if m.stop && !m.solved {
			// Over a limit already at mid: only below it can work.
			return wk.stretchOpen(a, mid) || true
		}
		if !m.solved {
			return wk.stretchOpen(a, b.n) || b.stop
		}
		if wk.stretch(a, &m) || m.stop {
			return true
		}
		return wk.stretch(&m, b)
	}
	sv := pitchSolver{n1: a.n, p1: a.pitch, slope: a.slope}
	for n := a.n + 0.25; n < b.n-1e-9; n += 0.25 {
		extra := x.w.ease * 0.5 * (turnsPenalty(n) - interiorPen)
		if extra > 0 && wk.cannotWin(ub-extra, qub, vol) {
			continue
		}
		if k := wk.visit(n, &sv); k.stop {
			return true
		}
	}
	return b.stop
}

// stretchOpen walks the turns strictly between a and nb one by one,
// without a bound from above (the knot at nb has no solution).
func (wk *walk) stretchOpen(a *knot, nb float64) bool {
	sv := pitchSolver{n1: a.n, p1: a.pitch, slope: a.slope}
	for n := a.n + 0.25; n < nb-1e-9; n += 0.25 {
		if wk.visit(n, &sv).stop {
			return true
		}
	}
	return false
}

// knot is a visited turns count.
type knot struct {
	n, pitch, slope float64
	lean            lean
	solved          bool // a pitch was found
	kept            bool // it met every constraint
	stop            bool // it, and every count above, breaks a limit that only grows
}

// walk is the state of one pair's walk.
type walk struct {
	x               *search
	p               *pair
	global          bool
	maxLen, maxWire float64
	sv              pitchSolver
	best            found
	found           bool
}

// cannotWin reports whether coils bounded by score ub, Q qub and volume
// vol can enter neither the top list (nor beat the pair's best) nor the
// Pareto set.
func (wk *walk) cannotWin(ub, qub, vol float64) bool {
	x := wk.x
	if math.IsInf(ub, -1) {
		return true // nothing there meets the limits
	}
	if x.s.c.MinQ > 0 && x.relax != "min_q" && qub < x.s.c.MinQ {
		return true // nothing there reaches the Q floor
	}
	if ub >= wk.bestScore() && (!wk.global || ub >= x.threshold()) {
		return false
	}
	if !wk.global || x.s.opF == 0 {
		return true
	}
	return x.dominated(qub/(1+paretoSlack), vol)
}

func (wk *walk) bestScore() float64 {
	if wk.global {
		return wk.x.pairScore[wk.p.idx]
	}
	if wk.found {
		return wk.best.score
	}
	return math.Inf(-1)
}

// visit solves, scores and records n turns.
func (wk *walk) visit(n float64, sv *pitchSolver) knot {
	x, p, s := wk.x, wk.p, wk.x.s
	// Until solved, the knot's pitch and l/D are their upper bounds.
	k := knot{n: n, pitch: coil.LoosestPitchFactor * p.do}
	k.lean.ld = n * k.pitch / p.dm
	if wk.maxLen > 0 && n*p.do > wk.maxLen*(1+1e-12) {
		x.miss.note("max_length", n*p.do/wk.maxLen, p, n, 0)
		k.stop = true
		return k
	}
	if wk.maxWire > 0 {
		if cut := x.wireBound(p, n); cut > wk.maxWire*(1+1e-12) {
			x.miss.note("max_wire_length", cut/wk.maxWire, p, n, 0)
			k.stop = true
			return k
		}
	}
	pitch, ok := x.solvePitch(p, n, sv)
	if !ok {
		return k
	}
	x.stats.Coils++
	k.solved, k.pitch, k.slope = true, pitch, sv.slope
	co := found{pair: p, n: n, pitch: pitch, lean: x.lean(p, n, pitch), matched: sv.value}
	k.lean = co.lean
	if wk.maxLen > 0 && co.lean.length > wk.maxLen*(1+1e-12) {
		x.miss.note("max_length", co.lean.length/wk.maxLen, p, n, pitch)
		k.stop = true // length only grows with turns
		return k
	}
	if wk.maxWire > 0 && co.lean.wire > wk.maxWire*(1+1e-12) {
		x.miss.note("max_wire_length", co.lean.wire/wk.maxWire, p, n, pitch)
		k.stop = true
		return k
	}
	if s.opF > 0 && x.relax != "min_srf_ratio" && co.lean.srf < s.srfRatio*s.opF {
		x.miss.note("min_srf_ratio", s.srfRatio*s.opF/co.lean.srf, p, n, pitch)
		return k
	}
	if s.c.MinQ > 0 && x.relax != "min_q" && co.lean.q < s.c.MinQ {
		x.miss.note("min_q", s.c.MinQ/co.lean.q, p, n, pitch)
		return k
	}
	if x.relax != "" {
		x.miss.relaxed(x.relax, &co, s)
	}
	k.kept = true
	co.vol = math.Pi / 4 * co.lean.od * co.lean.od * co.lean.length
	co.score = x.score(&co)
	if wk.global {
		x.record(co)
	}
	if !wk.found || co.score > wk.best.score {
		wk.best, wk.found = co, true
	}
	return k
}
