package tuning

import (
	"fmt"
	"math"
	"strings"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/optimize"
	"gonum.org/v1/gonum/unit"
)

// TapSearch says what ChooseTap may change besides the tap.
type TapSearch struct {
	// VaryPitch lets the search also set the pitch, anywhere from
	// close-wound to coil.LoosestPitchFactor wire diameters (the turns are
	// held). The pitch is continuous: gonum/optimize's Nelder–Mead runs
	// on it, with every quarter-turn tap tried at each pitch.
	VaryPitch bool
}

// ClearanceNone is TapPlan.Clearance when no harmonic of the low range
// can come near the high range inside a listed band (no band on the low
// range).
const ClearanceNone = 99

// TapPlan is ChooseTap's answer: the chosen tap (and pitch), the circuit
// it gives, and how it meets the requirements.
type TapPlan struct {
	Span     Span
	Geometry coil.Geometry // the coil as chosen; only the pitch may differ from the request
	TapTurns float64
	Feasible bool
	// Conflicts lists, in words, each requirement the chosen tap still
	// misses; empty when Feasible.
	Conflicts []string
	// Clearance is the smallest distance, over the dial stretches where the
	// low range is in a listed band and over orders 2 and 3, of the
	// harmonic from the high range's peak, in half-passbands: above 1 the
	// harmonic is outside the passband. ClearanceNone when none applies.
	Clearance float64
	// Tried counts the quarter-turn taps evaluated at the requested pitch
	// (the pitch search's own candidates are not counted); Covering,
	// Overlapping and Clean count how many of them met each requirement on
	// its own, and CoveringOverlapping both of the first two: together they
	// say which requirement is the one that conflicts.
	Tried, Covering, Overlapping, Clean, CoveringOverlapping int
}

// tapScore is one candidate's standing against the requirements.
type tapScore struct {
	tap                    float64
	coverShort, overShort  float64 // shortfalls, as fractions
	coincidence, clearance float64 // Σ(1 − depth) inside passbands; min depth
	slack                  float64 // smallest band-edge margin or overlap, fraction
}

func (s tapScore) covers() bool   { return s.coverShort == 0 }
func (s tapScore) overlaps() bool { return s.overShort == 0 }
func (s tapScore) clean() bool    { return s.coincidence == 0 }
func (s tapScore) feasible() bool { return s.covers() && s.overlaps() && s.clean() }

// cost orders candidates: every feasible one before any infeasible one;
// among feasible ones, the larger clearance (up to 10 half-passbands, about
// 20 dB) wins, then the larger slack (room for tolerances at the band
// edges and in the overlap); among infeasible ones, the smaller total
// shortfall, with coverage and overlap counted in units of the margin.
func (s tapScore) cost(margin float64) float64 {
	if s.feasible() {
		return -math.Min(s.clearance, 10) - math.Min(s.slack, 0.5)
	}
	return 100 + (s.coverShort+s.overShort)/margin + s.coincidence
}

// ChooseTap chooses the tap of spec's coil (spec.TapTurns is ignored) so
// that every listed band lies wholly inside one range with spec.Margin to
// spare at both ends, the two ranges overlap by at least the margin, and
// no harmonic of order 2 … spec.MaxHarmonic of the low range falls inside the high
// range's passband where the low range is in a listed band. Every
// quarter-turn tap on the winding is tried; among taps meeting all three
// the one keeping harmonics farthest from the high range's peak is chosen.
//
// When no tap meets them all, ChooseTap returns the best compromise with
// an error wrapping coil.ErrInfeasible that names the requirements in conflict.
func ChooseTap(spec Spec, search TapSearch) (TapPlan, error) {
	if len(spec.Bands) == 0 {
		return TapPlan{}, coil.InputErrorf("band", "choosing a tap needs the bands to cover; list them, e.g. 3.5-3.8MHz")
	}
	if spec.Geometry.Turns < 0.5 {
		return TapPlan{}, coil.InputErrorf("turns", "a coil needs at least half a turn to take a tap")
	}
	spec.TapTurns = 0
	if _, err := validateSpan(&spec); err != nil {
		return TapPlan{}, err
	}
	margin := spec.Margin
	if margin == 0 {
		margin = DefaultMargin
	}
	plan := TapPlan{}
	best, err := bestTap(spec, spec.Geometry, margin, &plan)
	if err != nil {
		return TapPlan{}, err
	}
	geom := spec.Geometry
	if search.VaryPitch {
		g, s, err := searchPitch(spec, margin)
		if err != nil {
			return TapPlan{}, err
		}
		if s.cost(margin) < best.cost(margin) {
			geom, best = g, s
		}
	}
	if err := plan.settle(spec, geom, best, margin); err != nil {
		return TapPlan{}, err
	}
	if !plan.Feasible {
		return plan, fmt.Errorf("%w: no tap meets every requirement: %s; of the %d quarter-turn taps at the requested pitch %d cover every band, %d overlap, %d are free of harmonic coincidences and %d both cover and overlap; the best compromise, at %g turns, misses: %s",
			coil.ErrInfeasible, plan.binding(), plan.Tried, plan.Covering, plan.Overlapping, plan.Clean, plan.CoveringOverlapping, plan.TapTurns, strings.Join(plan.Conflicts, "; "))
	}
	return plan, nil
}

// binding words which requirement conflicts, from the counts over the
// taps tried.
func (p *TapPlan) binding() string {
	switch {
	case p.Covering == 0:
		return "no tap covers every band with the margin (the bands need more than the two ranges span)"
	case p.Overlapping == 0:
		return "no tap makes the ranges overlap by the margin"
	case p.CoveringOverlapping == 0:
		return "covering every band and overlapping the ranges conflict: the taps that cover every band leave too little overlap, and those that overlap miss a band"
	}
	return "every tap that covers the bands and overlaps puts a harmonic of the low range inside the high range's passband"
}

// bestTap tries every quarter-turn tap of g and returns the lowest cost.
func bestTap(spec Spec, g coil.Geometry, margin float64, plan *TapPlan) (tapScore, error) {
	spec.Geometry = g
	m, err := newCoilModel(g, spec.Mounting)
	if err != nil {
		return tapScore{}, err
	}
	steps := int(math.Round(g.Turns * 4))
	best := tapScore{tap: -1}
	for i := 1; i < steps; i++ {
		spec.TapTurns = float64(i) / 4
		s, err := scoreTap(spec, m, margin)
		if err != nil {
			return tapScore{}, err
		}
		plan.Tried++
		if s.covers() {
			plan.Covering++
		}
		if s.overlaps() {
			plan.Overlapping++
		}
		if s.clean() {
			plan.Clean++
		}
		if s.covers() && s.overlaps() {
			plan.CoveringOverlapping++
		}
		if best.tap < 0 || s.cost(margin) < best.cost(margin) {
			best = s
		}
	}
	if best.tap < 0 {
		return tapScore{}, coil.InputErrorf("turns", "a coil of %g turns has no quarter-turn tap on its winding", g.Turns)
	}
	return best, nil
}

// scoreTap measures one candidate against the requirements; m is
// spec.Geometry's coilModel.
func scoreTap(spec Spec, m *coilModel, margin float64) (tapScore, error) {
	return scoreTapOpt(spec, m, margin, false)
}

// scoreTapOpt is scoreTap; quick skips the harmonic scan when the tap
// already misses coverage or overlap (it cannot be feasible), which is
// what makes ChooseCoil's many coils affordable.
func scoreTapOpt(spec Spec, m *coilModel, margin float64, quick bool) (tapScore, error) {
	c, err := newSpanCircuitOf(spec, m)
	if err != nil {
		return tapScore{}, err
	}
	open, err := c.at(0)
	if err != nil {
		return tapScore{}, err
	}
	meshed, err := c.at(1)
	if err != nil {
		return tapScore{}, err
	}
	s := tapScore{tap: spec.TapTurns, clearance: ClearanceNone}
	low := FreqRange{Min: meshed.FLow, Max: open.FLow}
	high := FreqRange{Min: meshed.FHigh, Max: open.FHigh}
	hasHigh := open.FHigh > 0 && meshed.FHigh > 0
	s.slack = math.Inf(1)
	for _, b := range spec.Bands {
		room := bandRoom(b, low, high, hasHigh, margin)
		s.coverShort += math.Max(0, margin-room)
		s.slack = math.Min(s.slack, room-margin)
	}
	if hasHigh {
		ov := float64(low.Max-high.Min) / float64(high.Min)
		s.overShort = math.Max(0, margin-ov)
		s.slack = math.Min(s.slack, ov-margin)
	} else {
		s.overShort = 1
		return s, nil
	}
	if quick && (s.coverShort > 0 || s.overShort > 0) {
		return s, nil
	}
	// The same rows and runs as Solve's coincidences, so that the
	// verdict here is the one the chosen span reports.
	for _, w := range c.lowWindows(spec.Bands, low) {
		rows, err := c.windowRows(w)
		if err != nil {
			return tapScore{}, err
		}
		for _, m := range orders(c.maxHarm) {
			runs := c.runs(w.band, m, rows)
			for _, co := range runs {
				s.clearance = math.Min(s.clearance, co.Depth)
				s.coincidence += math.Max(1-co.Depth, 1e-9) // 1e-9: on the passband edge
			}
			if len(runs) == 0 {
				for _, r := range rows {
					s.clearance = math.Min(s.clearance, c.measure(w.band, m, r).Depth)
				}
			}
		}
	}
	return s, nil
}

// bandRoom is how far band b sits inside the range that holds it best: the
// low range, the high range, or, when neither holds it with the margin
// and they overlap by the margin, both together from the low range's bottom to the high range's top (a band
// wider than either range).
func bandRoom(b Band, low, high FreqRange, hasHigh bool, margin float64) float64 {
	room := rangeRoom(b, low)
	if hasHigh {
		room = math.Max(room, rangeRoom(b, high))
		if room < margin && float64(low.Max-high.Min)/float64(high.Min) >= margin {
			room = math.Max(room, rangeRoom(b, FreqRange{Min: low.Min, Max: high.Max}))
		}
	}
	return room
}

// rangeRoom is how far band b sits inside rg at its tighter end, as a
// fraction of that band edge (negative when the band runs past the end).
func rangeRoom(b Band, rg FreqRange) float64 {
	lo, hi := float64(b.Low), float64(b.High)
	return math.Min((lo-float64(rg.Min))/lo, (float64(rg.Max)-hi)/hi)
}

// searchPitch runs Nelder–Mead on the pitch, reparameterised so that any
// real u maps into [d_o, coil.LoosestPitchFactor·d_o]:
//
//	p = d_o·(1 + (F−1)·(1 + tanh u)/2)
//
// and at each pitch every tap is tried. A coarse scan of nine pitches picks
// the starting point, since the best tap switches as the pitch moves.
func searchPitch(spec Spec, margin float64) (coil.Geometry, tapScore, error) {
	g0 := spec.Geometry
	do := float64(g0.OverallDiameter())
	pitchOf := func(u float64) unit.Length {
		return unit.Length(do * (1 + (coil.LoosestPitchFactor-1)*(1+math.Tanh(u))/2))
	}
	var firstErr error
	eval := func(u float64) (coil.Geometry, tapScore) {
		g := g0
		g.Pitch = pitchOf(u)
		s, err := bestTap(spec, g, margin, &TapPlan{})
		if err != nil {
			if firstErr == nil {
				firstErr = err
			}
			return g, tapScore{coverShort: math.Inf(1)}
		}
		return g, s
	}
	bestU, bestCost := 0.0, math.Inf(1)
	var bestG coil.Geometry
	var bestS tapScore
	for i := range 9 {
		u := -2.5 + 5*float64(i)/8
		g, s := eval(u)
		if c := s.cost(margin); c < bestCost {
			bestU, bestCost, bestG, bestS = u, c, g, s
		}
	}
	if firstErr != nil {
		return coil.Geometry{}, tapScore{}, firstErr
	}
	p := optimize.Problem{Func: func(x []float64) float64 {
		_, s := eval(x[0])
		return s.cost(margin)
	}}
	settings := &optimize.Settings{FuncEvaluations: 40, Converger: &optimize.FunctionConverge{Absolute: 1e-6, Iterations: 8}}
	res, err := optimize.Minimize(p, []float64{bestU}, settings, &optimize.NelderMead{SimplexSize: 0.3})
	if firstErr != nil {
		return coil.Geometry{}, tapScore{}, firstErr
	}
	// A run stopped by its evaluation budget returns no error and still
	// holds a usable best point; a failed run leaves the coarse scan's.
	if err == nil && res != nil && res.F < bestCost {
		g, s := eval(res.X[0])
		return g, s, nil
	}
	return bestG, bestS, nil
}

// describeConflicts words each requirement the span still misses.
// settle solves spec's coil g tapped at best's tap and takes the span, the
// choice and what it still misses into the plan.
func (p *TapPlan) settle(spec Spec, g coil.Geometry, best tapScore, margin float64) error {
	spec.Geometry, spec.TapTurns = g, best.tap
	sp, err := Solve(spec)
	if err != nil {
		return err
	}
	p.Span, p.Geometry, p.TapTurns = sp, g, best.tap
	p.Feasible = best.feasible()
	p.Clearance = math.Min(best.clearance, ClearanceNone)
	p.Conflicts = describeConflicts(&sp, best, margin)
	return nil
}

func describeConflicts(sp *Span, s tapScore, margin float64) []string {
	var out []string
	for _, b := range sp.Bands {
		room := rangeRoom(b.Band, sp.Low)
		rg, name := sp.Low, "low"
		if sp.HasHigh {
			if h := rangeRoom(b.Band, sp.High); h > room {
				room, rg, name = h, sp.High, "high"
			}
		}
		if bandRoom(b.Band, sp.Low, sp.High, sp.HasHigh, margin) >= margin {
			continue
		}
		edge := fmt.Sprintf("the %s range runs %s to %s", name, quantity.FormatFrequency(float64(rg.Min)), quantity.FormatFrequency(float64(rg.Max)))
		out = append(out, fmt.Sprintf("band %s is not inside either range with %.0f %% to spare (%s)",
			bandWithEdges(b.Band), margin*100, edge))
	}
	if !sp.HasHigh {
		out = append(out, "the circuit has no high range")
	} else if s.overShort > 0 {
		if sp.Overlap < 0 {
			out = append(out, fmt.Sprintf("the ranges leave a gap from %s to %s", quantity.FormatFrequency(float64(sp.Low.Max)), quantity.FormatFrequency(float64(sp.High.Min))))
		} else {
			out = append(out, fmt.Sprintf("the ranges overlap by only %.1f %% (less than %.0f %%)", float64(sp.Overlap)/float64(sp.High.Min)*100, margin*100))
		}
	}
	if s.coincidence > 0 {
		for _, co := range sp.Coincidences {
			out = append(out, fmt.Sprintf("the %s harmonic of the low range%s falls inside the high range's passband at %.1f %% of the dial (%s against %s)",
				Ordinal(co.Order), inBand(co.Band), co.Setting*100, quantity.FormatFrequency(float64(co.Harmonic)), quantity.FormatFrequency(float64(co.FHigh))))
		}
	}
	return out
}
