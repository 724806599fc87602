package tuning

import (
	"fmt"
	"math"
	"strings"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// ChooseCoil: turns, pitch and tap chosen together for a list of bands on
// one two-gang capacitor and one former and wire.
//
// Every whole number of turns from CoilSearch.MinTurns to MaxTurns is
// tried at the pitches of coilPitches (close-wound to three wire
// diameters), each with every quarter-turn tap, scored as ChooseTap
// scores a tap (coverage with the margin, overlap, no harmonic of the low
// range inside the high range's passband where the low range is in a
// band). The lowest cost wins: a feasible coil before any infeasible one,
// then the widest harmonic clearance and slack.
//
// When none is feasible the plan says what would make it possible, from
// what the best compromise misses:
//
//   - a band below the low range: more turns (when the most tried were
//     not enough) or a capacitor of larger maximum;
//   - a band above the high range: less minimum capacitance (strays,
//     trimmers, a capacitor of smaller minimum);
//   - a gap between the ranges: a capacitor of larger swing;
//   - a harmonic coincidence or a conflict between the bands: a second
//     winding with a band switch, or a different section B (--gang-b).
//
// Turns are stepped by one up to 30 and by about 4 % above.

// coilPitches are the pitches tried, in overall wire diameters.
var coilPitches = []float64{1.05, 1.5, 2, 3}

// CoilSearch bounds the turns ChooseCoil tries.
type CoilSearch struct {
	// MinTurns and MaxTurns, whole turns; zero: 3 and 3 × the given
	// coil's turns (at most 200).
	MinTurns, MaxTurns float64
}

// CoilPlan is ChooseCoil's answer.
type CoilPlan struct {
	TapPlan
	// Turns tried and the pitches per turn count.
	TurnsFrom, TurnsTo float64
	Coils              int
	// Advice says what would make an infeasible request possible.
	Advice []string
}

// ChooseCoil chooses turns, pitch and tap of spec's coil (its turns,
// pitch and tap are starting values only) for spec's bands.
func ChooseCoil(spec Spec, cs CoilSearch) (CoilPlan, error) {
	if len(spec.Bands) == 0 {
		return CoilPlan{}, coil.InputErrorf("band", "choosing a coil needs the bands to cover; list them, e.g. 3.5-3.8MHz")
	}
	spec.TapTurns = 0
	if _, err := validateSpan(&spec); err != nil {
		return CoilPlan{}, err
	}
	lo, hi := cs.MinTurns, cs.MaxTurns
	if lo == 0 {
		lo = 3
	}
	if hi == 0 {
		hi = math.Min(200, math.Max(lo, 3*math.Ceil(spec.Geometry.Turns)))
	}
	if !coil.Finite(lo) || !coil.Finite(hi) || lo < 1 || hi < lo || hi > 500 {
		return CoilPlan{}, coil.InputErrorf("turns_range", "%g to %g turns: give whole turns from 1 to 500, the first no more than the second", lo, hi)
	}
	margin := spec.Margin
	if margin == 0 {
		margin = DefaultMargin
	}
	plan := CoilPlan{TurnsFrom: math.Ceil(lo), TurnsTo: math.Floor(hi)}
	g0 := spec.Geometry
	do := float64(g0.OverallDiameter())
	var best tapScore
	var bestG coil.Geometry
	found := false
	for n := plan.TurnsFrom; n <= plan.TurnsTo; n += math.Max(1, math.Round(n*0.04)) {
		for _, pf := range coilPitches {
			g := g0
			g.Turns, g.Pitch = n, unit.Length(pf*do)
			if g.Validate() != nil {
				continue
			}
			s, err := bestTapCoarse(spec, g, margin)
			if err != nil {
				continue // e.g. a coil the model refuses; others remain
			}
			plan.Coils++
			if !found || s.cost(margin) < best.cost(margin) {
				best, bestG, found = s, g, true
			}
		}
	}
	if !found {
		return CoilPlan{}, coil.InputErrorf("turns_range", "no coil from %g to %g turns could be evaluated on this former and wire", lo, hi)
	}
	if err := plan.settle(spec, bestG, best, margin); err != nil {
		return CoilPlan{}, err
	}
	if plan.Feasible {
		return plan, nil
	}
	plan.Advice = coilAdvice(&plan, spec, margin)
	return plan, fmt.Errorf("%w: no coil of %g to %g turns on this former covers every band with the ranges overlapping and no harmonic coincidence; the best compromise, %g turns at %s pitch tapped %g turns from the cold end, misses: %s; %s",
		coil.ErrInfeasible, plan.TurnsFrom, plan.TurnsTo, bestG.Turns, quantity.FormatMillimetres(float64(bestG.Pitch)), best.tap,
		strings.Join(plan.Conflicts, "; "), strings.Join(plan.Advice, "; "))
}

func coilAdvice(p *CoilPlan, spec Spec, margin float64) []string {
	var out []string
	sp := &p.Span
	fmin, fmax := math.Inf(1), 0.0
	for _, b := range spec.Bands {
		fmin = math.Min(fmin, float64(b.Low))
		fmax = math.Max(fmax, float64(b.High))
	}
	if float64(sp.Low.Min) > fmin*(1-margin) {
		more := "a capacitor of larger maximum per section"
		if p.Geometry.Turns >= p.TurnsTo {
			more = "more turns (--max-turns) or " + more
		}
		out = append(out, fmt.Sprintf("the low range bottoms out at %s, above the lowest band edge %s less the margin: %s would reach it",
			quantity.FormatFrequency(float64(sp.Low.Min)), quantity.FormatFrequency(fmin), more))
	}
	top := sp.Low.Max
	if sp.HasHigh {
		top = sp.High.Max
	}
	if float64(top) < fmax*(1+margin) {
		out = append(out, fmt.Sprintf("the top of the ranges is %s, below the highest band edge %s plus the margin: less minimum capacitance (shorter wiring, smaller strays and trimmers, a capacitor of smaller minimum) would reach it",
			quantity.FormatFrequency(float64(top)), quantity.FormatFrequency(fmax)))
	}
	if sp.HasHigh && sp.Overlap < 0 {
		out = append(out, "the ranges leave a gap: a capacitor of larger swing (maximum over minimum) would close it")
	}
	if len(out) == 0 || len(sp.Coincidences) > 0 {
		out = append(out, "coverage, overlap and harmonics conflict on every coil tried: a second winding with a band switch for the lowest or highest band, or a different section B capacitance (--gang-b), would")
	}
	return out
}

// bestTapCoarse is bestTap for a coil of many turns: taps about N/40
// turns apart first, then every quarter turn around the best of them.
func bestTapCoarse(spec Spec, g coil.Geometry, margin float64) (tapScore, error) {
	steps := int(math.Round(g.Turns * 4))
	stride := max(1, steps/160)
	spec.Geometry = g
	m, err := newCoilModel(g, spec.Mounting)
	if err != nil {
		return tapScore{}, err
	}
	best := tapScore{tap: -1}
	try := func(i int) error {
		spec.TapTurns = float64(i) / 4
		s, err := scoreTapOpt(spec, m, margin, true)
		if err != nil {
			return err
		}
		if best.tap < 0 || s.cost(margin) < best.cost(margin) {
			best = s
		}
		return nil
	}
	for i := stride; i < steps; i += stride {
		if err := try(i); err != nil {
			return tapScore{}, err
		}
	}
	if best.tap < 0 {
		return tapScore{}, coil.InputErrorf("turns", "a coil of %g turns has no quarter-turn tap on its winding", g.Turns)
	}
	c := int(math.Round(best.tap * 4))
	for i := max(1, c-stride+1); i < min(steps, c+stride); i++ {
		if i != c {
			if err := try(i); err != nil {
				return tapScore{}, err
			}
		}
	}
	return best, nil
}
