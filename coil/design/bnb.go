package design

import (
	"math"
	"slices"
)

// Best-first branch and bound over the pairs and their turns. A node is a
// pair not yet opened (bounded by pair.ub) or a stretch of turns
// between two solved knots (bounded by intervalBound). The node with the
// highest bound is expanded first, so the top list's threshold rises as
// fast as it can and a node is opened only if, when its turn comes, it can
// still enter the top list (or beat its pair's best) or the Pareto set.
//
//   - Opening a pair finds nLo, solves it, bounds every count above it
//     (the open stretch), then finds nHi, solves it and queues the stretch
//     between.
//   - Expanding a stretch longer than a turn solves its middle and queues
//     both halves; a shorter one is enumerated, skipping the quarter and
//     half turns whose own bound (less their ease penalty) cannot win.

type node struct {
	ub, qub, vol float64
	pair         *pair
	a, b         knot
	pen          float64 // least turns penalty inside the stretch
	seq          int
}

// nodeHeap is a max-heap of stretch nodes by bound (then by age), held as
// indices into a node store so that nothing is copied but an int.
type nodeHeap struct {
	nodes []node
	idx   []int32
	free  []int32 // slots of popped nodes, for reuse
}

func (h *nodeHeap) less(i, j int32) bool {
	a, b := &h.nodes[i], &h.nodes[j]
	if a.ub != b.ub {
		return a.ub > b.ub
	}
	return a.seq < b.seq
}

func (h *nodeHeap) Len() int { return len(h.idx) }

func (h *nodeHeap) top() *node { return &h.nodes[h.idx[0]] }

func (h *nodeHeap) push(n node) {
	var slot int32
	if k := len(h.free); k > 0 {
		slot = h.free[k-1]
		h.free = h.free[:k-1]
		h.nodes[slot] = n
	} else {
		h.nodes = append(h.nodes, n)
		slot = int32(len(h.nodes) - 1)
	}
	h.idx = append(h.idx, slot)
	for i := len(h.idx) - 1; i > 0; {
		parent := (i - 1) / 2
		if !h.less(h.idx[i], h.idx[parent]) {
			break
		}
		h.idx[i], h.idx[parent] = h.idx[parent], h.idx[i]
		i = parent
	}
}

// pop removes the top node and returns it.
func (h *nodeHeap) pop() node {
	top := h.idx[0]
	last := len(h.idx) - 1
	h.idx[0] = h.idx[last]
	h.idx = h.idx[:last]
	for i := 0; ; {
		l, r := 2*i+1, 2*i+2
		m := i
		if l < len(h.idx) && h.less(h.idx[l], h.idx[m]) {
			m = l
		}
		if r < len(h.idx) && h.less(h.idx[r], h.idx[m]) {
			m = r
		}
		if m == i {
			break
		}
		h.idx[i], h.idx[m] = h.idx[m], h.idx[i]
		i = m
	}
	h.free = append(h.free, top)
	return h.nodes[top]
}

func (x *search) push(n node) {
	n.seq = x.stats.Nodes
	x.stats.Nodes++
	x.heap.push(n)
}

// walker returns a walk over pair p that records into the search.
func (x *search) walker(p *pair) *walk {
	wk := &walk{x: x, p: p, global: true}
	wk.maxLen = float64(x.s.c.MaxLength)
	wk.maxWire = float64(x.s.c.MaxWireLength)
	return wk
}

// drain expands nodes, best bound first, until none can win: the unopened
// pairs in order (sorted by bound) interleaved with the stretch heap.
func (x *search) drain(order []*pair) {
	next := 0
	for {
		var p *pair
		if next < len(order) && (x.heap.Len() == 0 || order[next].ub >= x.heap.top().ub) {
			p = order[next]
			next++
		} else if x.heap.Len() > 0 {
			n := x.heap.pop()
			wk := x.walker(n.pair)
			if wk.cannotWin(n.ub, n.qub, n.vol) {
				x.park(parked{node: n})
				continue
			}
			x.expand(wk, &n)
			continue
		} else {
			return
		}
		if p.nLB == 0 {
			continue // no turns count can work
		}
		wk := x.walker(p)
		if wk.cannotWin(p.ub, x.qBound(p, p.nLB), x.volumeBound(p, p.nLB)) {
			x.park(parked{pair: p})
			continue
		}
		x.refine(p)
		if wk.cannotOpen() {
			x.park(parked{pair: p})
			continue
		}
		x.openPair(wk)
	}
}

// parked is work set aside because it could not win at the time: an
// unopened pair, a pair opened up to its first knot (above set), or a
// stretch node. Pareto dominance never lapses, but a lower threshold (a
// longer top list) can revive it; resume does that.
type parked struct {
	pair   *pair
	above  bool
	a      knot
	vLoose float64
	node   node
}

// parkedNode is a stretch node set aside, kept small: its knots are
// solved again if it is revived.
type parkedNode struct {
	pair                 *pair
	an, bn, ub, qub, vol float64
}

// parkedTurns is one turns count skipped inside a stretch, with where
// its pitch solve would start.
type parkedTurns struct {
	pair                    *pair
	n, ub, qub, vol         float64
	fromN, fromPitch, slope float64
}

func (x *search) park(w parked) {
	if x.relax != "" {
		return
	}
	switch {
	case w.node.pair != nil:
		n := &w.node
		x.parkedNodes = append(x.parkedNodes, parkedNode{pair: n.pair, an: n.a.n, bn: n.b.n, ub: n.ub, qub: n.qub, vol: n.vol})
	case w.above:
		x.parkedAbove = append(x.parkedAbove, w)
	default:
		x.parkedPairs = append(x.parkedPairs, w.pair)
	}
}

// resume lengthens the top list to topN and takes up the parked work that
// the lower threshold revives, instead of searching again from scratch.
func (x *search) resume(topN int) {
	x.topN = topN
	x.top = x.top[:0]
	for i, ci := range x.pairCoil {
		if ci >= 0 {
			x.top = append(x.top, top{x.pairScore[i], i})
		}
	}
	slices.SortFunc(x.top, func(a, b top) int {
		if c := cmpFloat(b.score, a.score); c != 0 {
			return c
		}
		return a.pair - b.pair
	})
	if len(x.top) > topN {
		x.top = x.top[:topN]
	}
	nodes, above, pairs := x.parkedNodes, x.parkedAbove, x.parkedPairs
	x.parkedNodes, x.parkedAbove, x.parkedPairs = nil, nil, nil
	thr := x.threshold()
	for _, n := range nodes {
		if n.ub < thr {
			x.parkedNodes = append(x.parkedNodes, n) // still below
			continue
		}
		wk := x.walker(n.pair)
		var sv pitchSolver
		a := wk.visit(n.an, &sv)
		b := wk.visit(n.bn, &sv)
		x.pushStretch(wk, a, b)
	}
	turns := x.parkedTurns
	x.parkedTurns = nil
	for _, t := range turns {
		wk := x.walker(t.pair)
		if wk.cannotWin(t.ub, t.qub, t.vol) {
			x.parkedTurns = append(x.parkedTurns, t)
			continue
		}
		sv := pitchSolver{n1: t.fromN, p1: t.fromPitch, slope: t.slope}
		wk.visit(t.n, &sv)
	}
	for _, w := range above {
		wk := x.walker(w.pair)
		if !x.aboveCanWin(wk, &w.a) {
			x.park(w)
			continue
		}
		x.openAbove(wk, w.a, w.vLoose)
	}
	slices.SortFunc(pairs, func(a, b *pair) int {
		if c := cmpFloat(b.ub, a.ub); c != 0 {
			return c
		}
		return a.idx - b.idx
	})
	x.drain(pairs)
}

// cannotOpen is cannotWin for an unopened pair: every pitch band must be
// unable to win.
func (wk *walk) cannotOpen() bool {
	p := wk.p
	for _, sl := range wk.x.slices[p.slices : p.slices+boundSlices] {
		if !math.IsInf(sl.ub, -1) && !wk.cannotWin(sl.ub, sl.q, sl.vol) {
			return false
		}
	}
	return true
}

func (x *search) openPair(wk *walk) {
	p := wk.p
	x.stats.Searched++
	nLo, vLoose, ok := x.turnsLow(p)
	if !ok {
		return
	}
	a := wk.visit(nLo, &wk.sv)
	if a.stop {
		return
	}
	if !a.solved {
		// An unsolved end (not expected) leaves a plain walk.
		nHi := x.turnsHigh(p, nLo, vLoose)
		wk.stretchOpen(&a, nHi+0.25)
		return
	}
	if !x.aboveCanWin(wk, &a) {
		x.park(parked{pair: p, above: true, a: a, vLoose: vLoose})
		return
	}
	x.openAbove(wk, a, vLoose)
}

// openAbove finishes opening a pair above its first knot a.
func (x *search) openAbove(wk *walk, a knot, vLoose float64) {
	nHi := x.turnsHigh(wk.p, a.n, vLoose)
	if nHi <= a.n {
		return
	}
	b := wk.visit(nHi, &wk.sv)
	x.pushStretch(wk, a, b)
}

// aboveCanWin reports whether any coil of the pair with more turns than
// knot a can win. Such a coil has a pitch above a's, so the pitch bands
// below it drop out, and the others tighten: at least a's turns and a's
// pitch.
func (x *search) aboveCanWin(wk *walk, a *knot) bool {
	p := wk.p
	dw := &x.wires[p.wi]
	for k := range boundSlices {
		sl := x.slices[p.slices+k]
		p1 := sliceRatios[k+1] * dw.do
		if math.IsInf(sl.ub, -1) || p1 <= a.pitch {
			continue
		}
		n := x.sliceTurns(p, k)
		p0 := math.Max(sliceRatios[k]*dw.do, a.pitch)
		tight := x.sliceBound(p, math.Max(n, a.n+0.25), p0, p1, &dw.sliceRow[k])
		if !wk.cannotWin(tight.ub, tight.q, tight.vol) {
			return true
		}
	}
	return false
}

// pushStretch queues the turns strictly between a and b, if there are any
// and they can win.
func (x *search) pushStretch(wk *walk, a, b knot) {
	if !a.solved || a.stop || b.n-a.n < 0.5-1e-9 {
		return
	}
	pen := 0.0
	if math.Floor(b.n-1e-9) < math.Ceil(a.n+1e-9) {
		pen = 0.25
		if math.Floor(2*b.n-1e-9) < math.Ceil(2*a.n+1e-9) {
			pen = 0.5
		}
	}
	ub, qub, vol := x.intervalBound(wk.p, &a, &b, pen)
	n := node{ub: ub, qub: qub, vol: vol, pair: wk.p, a: a, b: b, pen: pen}
	if wk.cannotWin(ub, qub, vol) {
		if !math.IsInf(ub, -1) {
			x.park(parked{node: n})
		}
		return
	}
	x.push(n)
}

func (x *search) expand(wk *walk, n *node) {
	a, b := n.a, n.b
	sv := pitchSolver{n1: a.n, p1: a.pitch, slope: a.slope}
	if b.n-a.n > 1+1e-9 {
		mid := math.Round((a.n+b.n)/2*4) / 4
		m := wk.visit(mid, &sv)
		switch {
		case m.stop && !m.solved:
			wk.stretchOpen(&a, mid)
		case !m.solved:
			wk.stretchOpen(&a, b.n)
		default:
			x.pushStretch(wk, a, m)
			if !m.stop {
				x.pushStretch(wk, m, b)
			}
		}
		return
	}
	for k := a.n + 0.25; k < b.n-1e-9; k += 0.25 {
		extra := x.w.ease * 0.5 * (turnsPenalty(k) - n.pen)
		if extra > 0 && wk.cannotWin(n.ub-extra, n.qub, n.vol) {
			if x.relax == "" {
				x.parkedTurns = append(x.parkedTurns, parkedTurns{pair: n.pair, n: k, ub: n.ub - extra,
					qub: n.qub, vol: n.vol, fromN: a.n, fromPitch: a.pitch, slope: a.slope})
			}
			continue
		}
		if wk.visit(k, &sv).stop {
			return
		}
	}
}
