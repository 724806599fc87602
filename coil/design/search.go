package design

import (
	"math"
	"slices"
	"sort"
	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// The search:
//
//  1. Pairs. Rows that repeat an earlier one physically are dropped, and a
//     dense stock is thinned (thinRows: more than denseRows rows of a class
//     within the near-duplicate limit; rows within thinStep of an earlier
//     kept row are searched as that row), so that the pairs grow no faster
//     than the stock; every
//     remaining support × wire that passes the wire rules (WireSuits) and
//     the diameter limit becomes a pair. Supports are sorted by diameter so
//     that each wire meets only the supports its rules allow.
//  2. A cheap bound per pair (bound): the fewest turns nLB any coil of the
//     pair can have, from an upper bound on the inductance (the model at
//     DC with the leads' full internal inductance), and from it a bound on
//     the score. When a pair's turn comes and this bound can still win,
//     refine splits the pitch range into bands and bounds each (fewest
//     turns at the band's tight end, least proximity at its loose end).
//  3. Best-first branch and bound (design_bnb.go) over pairs and stretches
//     of turns, each expanded only if its bound can still enter the top
//     list (or beat its pair's best) or the Pareto set. A pair is opened
//     at nLo, the fewest quarter turns whose close winding reaches
//     (1+m)·target (m the trim margin), and bounded above it; then nHi,
//     the most whose loosest pitch stays at or below (1−m)·target; the
//     stretch between is bisected at solved knots whose exact pitch,
//     length and wire bound what lies between.
//  4. Each turns count visited gets the pitch that hits the target
//     exactly (solvePitch): a first guess from Wheeler's closed form,
//     extrapolated from the previous counts' solutions, then Newton steps
//     in (ln p, ln L) with the slope learned so far inside the bracket
//     close winding … loosest pitch; two or three evaluations usually do.
//
// Evaluations call coil's inner functions, the code coil.Predict runs
// (eval.go); the candidates returned are re-checked through coil.Predict and coil.Window. The
// bounds rely on the inductance rising with the turns and falling with the
// pitch (tested for two turns and more, hence DefaultMinTurns).

// pair is one support × wire.
type pair struct {
	idx    int
	si     int      // index into Constraints.Supports; −1 for a free diameter
	free   *Support // the free-diameter support, else nil
	wi     int      // index into Constraints.Wires and search.wires
	cal    int      // index into Constraints.Calibrations, −1 for none
	sb     float64  // springback applied
	tinned bool
	do     float64 // overall wire diameter
	dm     float64 // wire-centre diameter
	od     float64 // outside diameter
	nLB    float64 // no coil of fewer turns can hit the target
	ub     float64 // score bound: scoreBound at nLB, then the best slice's
	slices int     // index into search.slices of its pitch-band bounds; −1 before refine
}

// wireData holds what depends on the wire alone.
type wireData struct {
	r        float64 // bare radius
	do       float64
	rdcPerM  float64                        // Ω/m at the conductor temperature
	atMatch  coil.WireAt                    // at the matching frequency
	atOp     coil.WireAt                    // at the operating frequency
	fs       float64                        // R_ac/R_dc at the operating frequency
	proxLB   float64                        // least proximity factor at any pitch up to coil.LoosestPitchFactor·d_o
	sliceRow [boundSlices]coil.ProximityRow // Φ at the loose end of each pitch band
	leadsMax float64                        // both leads, internal inductance at its DC value
	rLeads   float64                        // both leads at the operating frequency
	tinned   bool
}

// found is a solved coil.
type found struct {
	pair    *pair
	n       float64
	pitch   float64
	lean    lean // at the operating frequency
	matched float64
	score   float64
	vol     float64 // outside volume, m³
}

type search struct {
	s     *settings
	w     weights
	wires []wireData
	pairs []*pair
	stats Stats

	topN      int       // per-pair bests kept for the threshold
	top       []top     // the best per-pair bests, descending
	pairScore []float64 // each pair's best score so far (−Inf: none)
	pairCoil  []int     // index into coils of each pair's best, −1: none
	coils     []found   // pair bests as they were found
	pareto    []found   // ascending volume, strictly ascending Q
	heap      nodeHeap  // best-first queue
	// Work set aside (see resume).
	parkedPairs []*pair
	parkedAbove []parked
	parkedNodes []parkedNode
	parkedTurns []parkedTurns
	slices      []slice // pitch-band bounds of refined pairs

	grDiv float64 // lower bound on 1−(f/SRF)² at the matching frequency for feasible coils
	grMin float64 // same at the operating frequency

	// relax names one constraint to ignore (the infeasibility report).
	relax string
	miss  missLog
	cals  map[calKey]int // latest calibration of each named pair

	kmN, km float64 // coil.RosaMutual(kmN), cached across a pitch solve

	// Rows of a dense stock not searched (see thinRows).
	thinnedSupports, thinnedWires int
}

func newSearch(s *settings, relax string, topN int) *search {
	x := &search{s: s, w: weightsFor(s.c.Prefer, s.opF > 0), grDiv: 1, grMin: 1, relax: relax}
	x.topN = topN
	if s.opF > 0 {
		x.grMin = 1 - 1/(s.srfRatio*s.srfRatio)
	}
	if s.effective && s.opF > 0 && relax != "min_srf_ratio" {
		r := s.matchF / (s.srfRatio * s.opF)
		x.grDiv = 1 - r*r
	}
	if x.grDiv < 0.05 || (s.effective && relax == "min_srf_ratio") {
		x.grDiv = 0.05 // SRF ≥ 1.05·f (eval's cut-off) at least
	}
	return x
}

// runSearch runs the search. The top list's threshold is the topN-th
// best pair score, so the first topN pair bests are exact; the
// near-duplicate rule then picks the candidates from them in order. When it
// needs more than topN to fill the list (many near-duplicates at the top),
// the search resumes with twice as many, taking up only the work it set
// aside.
func runSearch(s *settings) (Result, error) {
	x := newSearch(s, "", 4*s.top)
	x.run()
	if len(x.coils) == 0 {
		return Result{}, x.infeasible()
	}
	for {
		picked, exact := x.pick()
		if exact || x.topN >= len(x.pairs) {
			return x.result(picked)
		}
		x.resume(2 * x.topN)
	}
}

// run does steps 1–3 and the free-diameter search.
func (x *search) run() {
	x.prepareWires()
	x.makePairs()
	x.slices = make([]slice, 0, len(x.pairs)*boundSlices/2)
	x.pairScore = make([]float64, len(x.pairs))
	x.pairCoil = make([]int, len(x.pairs))
	for i, p := range x.pairs {
		x.bound(p)
		x.pairScore[i], x.pairCoil[i] = math.Inf(-1), -1
	}
	if x.relax != "" {
		// Reporting a miss: every pair, no pruning.
		for _, p := range x.pairs {
			if p.nLB > 0 {
				x.walkPair(p, true)
			}
		}
		return
	}
	order := slices.Clone(x.pairs)
	slices.SortFunc(order, func(a, b *pair) int {
		if c := cmpFloat(b.ub, a.ub); c != 0 {
			return c
		}
		return a.idx - b.idx
	})
	x.drain(order)
	if x.s.c.FreeDiameter != nil {
		x.searchFree()
	}
}

func (x *search) prepareWires() {
	c := &x.s.c
	rho := coil.CopperResistivity(c.Temperature)
	lead := float64(c.LeadLength)
	x.wires = make([]wireData, len(c.Wires))
	for i, w := range c.Wires {
		d := float64(w.Diameter)
		do := float64(w.Overall)
		if do == 0 {
			do = d
		}
		r := d / 2
		dw := wireData{r: r, do: do, tinned: w.Conductor == coil.Tinned}
		dw.atMatch = coil.NewWireAt(r, rho, lead, x.s.matchF)
		dw.atOp = coil.NewWireAt(r, rho, lead, x.s.opF)
		dw.atMatch.Plate(coil.PlatingRatio(w.Conductor, 0, rho, x.s.matchF))
		dw.atOp.Plate(coil.PlatingRatio(w.Conductor, 0, rho, x.s.opF))
		dw.rdcPerM = dw.atOp.RdcPerM
		dw.fs = dw.atOp.Fs
		dw.leadsMax = 2 * coil.LeadInductance(lead, r, 1)
		dw.rLeads = dw.atOp.RLeads
		phiMin := coil.ProximityMin(d / (coil.LoosestPitchFactor * do))
		dw.proxLB = coil.PartialProximity(phiMin, dw.fs)
		for k := range boundSlices {
			dw.sliceRow[k] = coil.NewProximityRow(d / (sliceRatios[k+1] * do))
		}
		x.wires[i] = dw
	}
}

// support returns the pair's support with its springback applied, and
// where that came from.
func (x *search) support(p *pair) (Support, coil.SpringbackSource) {
	var sup Support
	if p.free != nil {
		sup = *p.free
	} else {
		sup = x.s.c.Supports[p.si]
	}
	switch {
	case p.cal >= 0:
		cal := x.s.c.Calibrations[p.cal]
		sup.Springback, sup.SpringbackNote = cal.Springback, cal.Note
		return sup, coil.SpringbackCalibration
	case sup.Springback != 0:
		return sup, coil.SpringbackGiven
	case sup.OnFormer:
		return sup, coil.SpringbackOnFormer
	}
	return sup, coil.SpringbackNone
}

func (x *search) wire(p *pair) WireOption { return x.s.c.Wires[p.wi] }

// geometry is the pair's coil with n turns at pitch.
func (x *search) geometry(p *pair, n, pitch float64) coil.Geometry {
	sup, _ := x.support(p)
	w := x.wire(p)
	return coil.Geometry{
		FormerDiameter: sup.Diameter,
		Springback:     p.sb,
		WireDiameter:   w.Diameter,
		WireOverall:    w.Overall,
		Conductor:      w.Conductor,
		Temperature:    x.s.c.Temperature,
		LeadLength:     x.s.c.LeadLength,
		Turns:          n,
		Pitch:          unit.Length(pitch),
	}
}

type calKey struct{ support, wire string }

func (x *search) makePairs() {
	c := &x.s.c
	if len(c.Calibrations) > 0 {
		x.cals = map[calKey]int{}
		for i, cal := range c.Calibrations {
			x.cals[calKey{cal.Support, cal.Wire}] = i // later ones win
		}
	}
	sups, wires := x.uniqueRows()
	// Supports by diameter, so that each wire meets only the range its
	// rules allow (a self-supporting coil needs D_f ≤ d/ratio; every coil
	// D_f ≥ BendRatio·d): the pairs touched are the pairs that can be
	// wound, not every row against every row.
	slices.SortStableFunc(sups, func(a, b int) int {
		return cmpFloat(float64(c.Supports[a].Diameter), float64(c.Supports[b].Diameter))
	})
	diam := make([]float64, len(sups))
	for i, si := range sups {
		diam[i] = float64(c.Supports[si].Diameter)
	}
	type span struct{ wi, lo, hi int }
	var spans []span
	for _, wi := range wires {
		w := &c.Wires[wi]
		if !x.mightSuit(w) {
			continue
		}
		d := float64(w.Diameter)
		lo := sort.SearchFloat64s(diam, BendRatio*d*(1-1e-9))
		spans = append(spans, span{wi, lo, len(diam)})
	}
	// Count first: the pairs are stored in one slice whose elements the
	// search points to, so it must not grow.
	count := 0
	for _, sp := range spans {
		w := c.Wires[sp.wi]
		for _, si := range sups[sp.lo:sp.hi] {
			sup := &c.Supports[si]
			if !sup.OnFormer && float64(sup.Diameter) > float64(w.Diameter)/SelfSupportWireRatio*(1+1e-9) {
				continue
			}
			if wireRule(*sup, w, c) == ruleOK {
				count++
			}
		}
	}
	store := make([]pair, 0, count)
	for _, sp := range spans {
		w := c.Wires[sp.wi]
		for _, si := range sups[sp.lo:sp.hi] {
			sup := c.Supports[si]
			if !sup.OnFormer && float64(sup.Diameter) > float64(w.Diameter)/SelfSupportWireRatio*(1+1e-9) {
				continue // too thin to stand on its own on this mandrel
			}
			if wireRule(sup, w, c) != ruleOK {
				continue
			}
			store = append(store, x.newPairValue(si, nil, sp.wi))
			p := &store[len(store)-1]
			if x.relax != "max_diameter" && c.MaxDiameter > 0 && p.od > float64(c.MaxDiameter)*(1+1e-12) {
				x.miss.note("max_diameter", p.od/float64(c.MaxDiameter), p, 0, 0)
				store = store[:len(store)-1]
				continue
			}
			p.idx = len(x.pairs)
			x.pairs = append(x.pairs, p)
		}
	}
	x.stats.Pairs = len(x.pairs)
}

// mightSuit reports whether wire w passes the rules that do not depend on
// the support.
func (x *search) mightSuit(w *WireOption) bool {
	c := &x.s.c
	d := float64(w.Diameter)
	return !(c.MinWire > 0 && d < float64(c.MinWire)*(1-1e-9) || c.MaxWire > 0 && d > float64(c.MaxWire)*(1+1e-9) ||
		d < HandMinWire || d > HandMaxWire)
}

// uniqueRows returns the indices of the supports and wires that differ
// physically: a row repeating an earlier one (same diameter, kind and
// springback; same wire, insulation and conductor) would give the same
// coils, so only the first, in stock order, is searched. Rows named in a
// calibration are always kept.
func (x *search) uniqueRows() (sups, wires []int) {
	c := &x.s.c
	calS, calW := map[string]bool{}, map[string]bool{}
	for _, cal := range c.Calibrations {
		calS[cal.Support], calW[cal.Wire] = true, true
	}
	type sKey struct {
		d, sb    float64
		onFormer bool
	}
	seenS := map[sKey]bool{}
	for i, s := range c.Supports {
		k := sKey{float64(s.Diameter), s.Springback, s.OnFormer}
		if !calS[s.Name] {
			if seenS[k] {
				continue
			}
			seenS[k] = true
		}
		sups = append(sups, i)
	}
	type wKey struct {
		d, do float64
		cond  coil.Conductor
	}
	seenW := map[wKey]bool{}
	for i, w := range c.Wires {
		do := w.Overall
		if do == 0 {
			do = w.Diameter
		}
		k := wKey{float64(w.Diameter), float64(do), w.Conductor}
		if !calW[w.Name] {
			if seenW[k] {
				continue
			}
			seenW[k] = true
		}
		wires = append(wires, i)
	}
	sups, x.thinnedSupports = thinRows(sups, func(i int) (float64, float64, rowClass) {
		sp := &c.Supports[i]
		return float64(sp.Diameter), float64(sp.Diameter), rowClass{onFormer: sp.OnFormer, springback: sp.Springback}
	}, func(i int) bool { return calS[c.Supports[i].Name] })
	wires, x.thinnedWires = thinRows(wires, func(i int) (float64, float64, rowClass) {
		w := &c.Wires[i]
		do := w.Overall
		if do == 0 {
			do = w.Diameter
		}
		return float64(w.Diameter), float64(do), rowClass{conductor: w.Conductor}
	}, func(i int) bool { return calW[c.Wires[i].Name] })
	return sups, wires
}

// Dense stock. A stock with more than denseRows rows of one class (supports
// of one kind and springback; wires of one conductor) within the
// near-duplicate limit of one diameter is thinned: a row within thinStep of
// a row kept before it in stock order (both its diameters, bare and
// overall, for a wire) is not searched. Such rows are near-duplicates of
// the kept row, of which the candidate list would show one at most, and a
// diameter 1 % off is within what drills and wire are made to (common
// practice). Without the cap every support meets every wire, and the
// search's work grows with the square of the stock. The built-in stock
// holds at most 11 rows of a class within the limit, so it is never
// thinned.
const (
	denseRows = 16
	thinStep  = 0.01
)

// rowClass is what rows must share to be thinned together: a support's
// kind and springback, a wire's conductor.
type rowClass struct {
	onFormer   bool
	springback float64
	conductor  coil.Conductor
}

// thinRows thins the rows idx (already in stock order) when they are
// dense (see denseRows). key returns a row's two diameters and its class;
// keep reports rows that are never dropped (named in a calibration). It
// returns the rows to search and how many it dropped.
func thinRows(idx []int, key func(int) (d, do float64, class rowClass), keep func(int) bool) ([]int, int) {
	type row struct {
		i     int
		d, do float64
	}
	byClass := map[rowClass][]row{}
	for _, i := range idx {
		d, do, cl := key(i)
		byClass[cl] = append(byClass[cl], row{i, d, do})
	}
	dense := false
	for _, rows := range byClass {
		ds := make([]float64, len(rows))
		for k, r := range rows {
			ds[k] = r.d
		}
		slices.Sort(ds)
		// The most rows within the near-duplicate limit of one row.
		lo, hi := 0, 0
		for k, d := range ds {
			for ds[lo] < d*(1-nearDuplicate) {
				lo++
			}
			if hi < k {
				hi = k
			}
			for hi+1 < len(ds) && ds[hi+1] < d*(1+nearDuplicate) {
				hi++
			}
			if hi-lo+1 > denseRows {
				dense = true
			}
		}
	}
	if !dense {
		return idx, 0
	}
	within := func(a, b float64) bool { return math.Abs(a/b-1) < thinStep }
	kept := map[rowClass][]row{}
	out := idx[:0:0]
	for _, i := range idx {
		d, do, cl := key(i)
		drop := false
		if !keep(i) {
			for _, k := range kept[cl] {
				if within(d, k.d) && within(do, k.do) {
					drop = true
					break
				}
			}
		}
		if drop {
			continue
		}
		kept[cl] = append(kept[cl], row{i, d, do})
		out = append(out, i)
	}
	return out, len(idx) - len(out)
}

func cmpFloat(a, b float64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}

// newPairValue makes the pair of support si (or the free support) and
// wire wi.
func (x *search) newPairValue(si int, free *Support, wi int) pair {
	sup := free
	if free == nil {
		sup = &x.s.c.Supports[si]
	}
	p := pair{si: si, free: free, wi: wi, cal: -1, slices: -1, sb: sup.Springback}
	if len(x.cals) > 0 {
		if i, ok := x.cals[calKey{sup.Name, x.s.c.Wires[wi].Name}]; ok {
			p.cal, p.sb = i, x.s.c.Calibrations[i].Springback
		}
	}
	dw := &x.wires[wi]
	p.tinned = dw.tinned
	bore := float64(sup.Diameter) * (1 + p.sb)
	p.do, p.dm, p.od = dw.do, bore+dw.do, bore+2*dw.do
	return p
}

// top is an entry of the top list.
type top struct {
	score float64
	pair  int
}

// record files a solved coil that meets every constraint: into the
// Pareto set, and as its pair's best when it beats it.
func (x *search) record(c found) {
	x.addPareto(c)
	i := c.pair.idx
	if c.score <= x.pairScore[i] {
		return
	}
	x.pairScore[i] = c.score
	if x.pairCoil[i] >= 0 {
		x.coils[x.pairCoil[i]] = c
	} else {
		x.pairCoil[i] = len(x.coils)
		x.coils = append(x.coils, c)
	}
	// Update the top list: at most one entry per pair.
	for k, t := range x.top {
		if t.pair == i {
			x.top = slices.Delete(x.top, k, k+1)
			break
		}
	}
	if len(x.top) == x.topN && c.score <= x.top[len(x.top)-1].score {
		return
	}
	k := sort.Search(len(x.top), func(k int) bool { return x.top[k].score < c.score })
	x.top = slices.Insert(x.top, k, top{c.score, i})
	if len(x.top) > x.topN {
		x.top = x.top[:x.topN]
	}
}

// threshold is the score a coil must beat to change the top list; it only
// rises.
func (x *search) threshold() float64 {
	if len(x.top) < x.topN {
		return math.Inf(-1)
	}
	return x.top[len(x.top)-1].score
}

// dominated reports whether a coil of Q at most q and volume at least vol
// would be dominated by the Pareto set.
func (x *search) dominated(q, vol float64) bool {
	// The Pareto point with the largest volume ≤ vol has the highest Q
	// among those.
	i := sort.Search(len(x.pareto), func(i int) bool { return x.pareto[i].vol > vol })
	return i > 0 && x.pareto[i-1].lean.q >= q
}

// addPareto inserts c into the Q-versus-volume front if nothing dominates it.
func (x *search) addPareto(c found) {
	if x.s.opF == 0 {
		return
	}
	q := c.lean.q
	if x.dominated(q, c.vol) {
		return
	}
	i := sort.Search(len(x.pareto), func(i int) bool { return x.pareto[i].vol >= c.vol })
	// Remove the points c dominates: volume ≥ c's and Q ≤ c's.
	j := i
	for j < len(x.pareto) && x.pareto[j].lean.q <= q {
		j++
	}
	x.pareto = slices.Replace(x.pareto, i, j, c)
}
