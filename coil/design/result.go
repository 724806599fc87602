package design

import (
	"fmt"
	"math"
	"slices"
	"strings"
	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// Near-duplicates: two candidates whose supports and wires both differ by
// less than this fraction (a 6 mm drill and a 15/64 in drill; 0.60 mm and
// 0.63 mm wire, neighbours in the metric series) are one choice for a
// builder; only the better is listed.
const nearDuplicate = 0.07

// paretoStep thins the Pareto set: successive points are kept only when Q
// rises by at least this fraction (the highest-Q point is always kept).
// paretoSlack lets the search skip a coil whose Q would be within this
// fraction of a point it already has at no larger volume. Together: every
// coil the stock allows has a returned Pareto point of no larger volume
// and at least 1/((1+paretoStep)(1+paretoSlack)) of its Q (about 0.85).
const (
	paretoStep  = 0.05
	paretoSlack = 0.12
)

// pick chooses the candidates: pair bests by score, skipping
// near-duplicates of those already chosen. exact is false when it had to
// look past the topN bests, which pruning does not keep exact.
func (x *search) pick() (picked []*found, exact bool) {
	var bests []*found
	for _, ci := range x.pairCoil {
		if ci >= 0 {
			bests = append(bests, &x.coils[ci])
		}
	}
	slices.SortFunc(bests, func(a, b *found) int {
		if c := cmpFloat(b.score, a.score); c != 0 {
			return c
		}
		return a.pair.idx - b.pair.idx
	})
	exact = true
	for i, b := range bests {
		if len(picked) == x.s.top {
			break
		}
		if i >= x.topN {
			exact = false
		}
		dup := false
		for _, p := range picked {
			if x.nearSame(b.pair, p.pair) {
				dup = true
				break
			}
		}
		if !dup {
			picked = append(picked, b)
		}
	}
	if len(picked) < x.s.top && len(bests) >= x.topN {
		exact = false // the list ran short: a pruned pair might have filled it
	}
	return picked, exact
}

func (x *search) result(picked []*found) (Result, error) {
	s := x.s
	r := Result{
		Required:  unit.Inductance(s.required),
		Effective: s.effective,
		Frequency: unit.Frequency(s.opF),
		Tolerance: s.tol,
	}
	for _, co := range picked {
		c, err := x.candidate(*co)
		if err != nil {
			return Result{}, err
		}
		r.Candidates = append(r.Candidates, c)
	}
	explain(r.Candidates, x)

	// Pareto, thinned: a point dropped is within paretoStep of the last
	// one kept, which is no larger; the highest-Q point stays.
	var thin []found
	for i, co := range x.pareto {
		if len(thin) == 0 || i == len(x.pareto)-1 || co.lean.q >= thin[len(thin)-1].lean.q*(1+paretoStep) {
			thin = append(thin, co)
		}
	}
	for _, co := range thin {
		c, err := x.candidate(co)
		if err != nil {
			return Result{}, err
		}
		c.Why = fmt.Sprintf("Pareto: Q %.0f in %.3g cm³ (%s long, %s across)", c.Prediction.Q,
			co.vol*1e6, shortMM(float64(c.Prediction.WindingLength)), shortMM(float64(c.Prediction.OutsideDiameter)))
		r.Pareto = append(r.Pareto, c)
	}
	r.Warnings = x.warnings(r.Candidates)
	r.Stats = x.stats
	return r, nil
}

func (x *search) nearSame(a, b *pair) bool {
	near := func(u, v float64) bool { return math.Abs(u/v-1) < nearDuplicate }
	sa, _ := x.support(a)
	sb, _ := x.support(b)
	return sa.OnFormer == sb.OnFormer && near(float64(sa.Diameter), float64(sb.Diameter)) &&
		near(float64(x.wire(a).Diameter), float64(x.wire(b).Diameter))
}

// candidate re-checks a solved coil through coil.Predict and coil.Window and fills
// the record.
func (x *search) candidate(co found) (Candidate, error) {
	s := x.s
	g := x.geometry(co.pair, co.n, co.pitch)
	p, err := coil.Predict(g, unit.Frequency(s.opF))
	if err != nil {
		return Candidate{}, fmt.Errorf("coil: design search produced a coil the model refuses: %w", err)
	}
	matched := float64(p.Inductance)
	if s.effective {
		m := p
		if s.opF != s.matchF {
			coil.Evaluate(&m, &g, s.matchF)
		}
		matched = float64(m.InductanceEffective)
	}
	if rel := math.Abs(matched/s.required - 1); rel > s.tol {
		return Candidate{}, fmt.Errorf("coil: design search missed the target by %.3g %%", rel*100)
	}
	c := Candidate{
		Wire:       x.wire(co.pair),
		Prediction: p,
		Matched:    unit.Inductance(matched),
		Score:      co.score,
		Free:       co.pair.free != nil,
	}
	c.Support, c.SpringbackSource = x.support(co.pair)
	c.TrimMin, c.TrimMax, err = coil.Window(g, unit.Frequency(s.opF))
	if err != nil {
		return Candidate{}, err
	}
	if c.TrimLengthPerPercent, err = coil.LengthPerPercent(g, unit.Frequency(s.opF)); err != nil {
		return Candidate{}, err
	}
	if s.effective {
		ext := float64(s.t.Capacitance + s.t.Stray)
		tight, loose := g, g
		tight.Pitch = unit.Length(co.pair.do)
		loose.Pitch = unit.Length(math.Max(coil.LoosestPitchFactor*co.pair.do, float64(g.Pitch)))
		c.TuneLow = unit.Frequency(resonanceOf(&tight, ext, s.matchF))
		c.TuneHigh = unit.Frequency(resonanceOf(&loose, ext, s.matchF))
	}
	return c, nil
}

// resonanceOf is the frequency at which g's effective inductance
// resonates with the external capacitance ext, by fixed-point iteration
// from f0 (the effective inductance varies slowly with f below the SRF).
// Zero when the coil self-resonates first.
func resonanceOf(g *coil.Geometry, ext, f0 float64) float64 {
	var p coil.Prediction
	f := f0
	for range 6 {
		coil.Evaluate(&p, g, f)
		le := float64(p.InductanceEffective)
		if !(le > 0) || f >= float64(p.SRF) {
			return 0
		}
		f = 1 / (twoPi * math.Sqrt(le*ext))
	}
	return f
}

// explain writes each candidate's one-line Why: what it is best at among
// those listed, and how it differs from the first.
func explain(cs []Candidate, x *search) {
	if len(cs) == 0 {
		return
	}
	vol := func(c *Candidate) float64 {
		od := float64(c.Prediction.OutsideDiameter)
		return math.Pi / 4 * od * od * float64(c.Prediction.WindingLength)
	}
	ease := func(c *Candidate) float64 {
		p := &c.Prediction
		do := float64(p.Geometry.WireOverall)
		if do == 0 {
			do = float64(p.Geometry.WireDiameter)
		}
		return easePenalty(p.Geometry.Turns, float64(p.Geometry.Pitch), do, float64(p.SheetLength)/float64(p.MeanDiameter))
	}
	argBest := func(better func(a, b *Candidate) bool) int {
		k := 0
		for i := range cs {
			if better(&cs[i], &cs[k]) {
				k = i
			}
		}
		return k
	}
	hasF := x.s.opF > 0
	bestQ := argBest(func(a, b *Candidate) bool { return a.Prediction.Q > b.Prediction.Q*(1+1e-9) })
	smallest := argBest(func(a, b *Candidate) bool { return vol(a) < vol(b)*(1-1e-9) })
	leastWire := argBest(func(a, b *Candidate) bool { return a.Prediction.WireLength < b.Prediction.WireLength*(1-1e-9) })
	easiest := argBest(func(a, b *Candidate) bool { return ease(a) < ease(b)-1e-9 })
	highSRF := argBest(func(a, b *Candidate) bool { return a.Prediction.SRF > b.Prediction.SRF*(1+1e-9) })
	first := &cs[0]
	for i := range cs {
		c := &cs[i]
		var parts []string
		if i == 0 {
			parts = append(parts, "best overall")
		}
		if len(cs) > 1 {
			if hasF && i == bestQ {
				parts = append(parts, fmt.Sprintf("highest Q (%.0f)", c.Prediction.Q))
			}
			if i == smallest {
				parts = append(parts, fmt.Sprintf("smallest (%.2g cm³)", vol(c)*1e6))
			}
			if i == leastWire {
				parts = append(parts, "least wire")
			}
			if i == easiest {
				parts = append(parts, "easiest to wind")
			}
			if hasF && i == highSRF {
				parts = append(parts, fmt.Sprintf("highest SRF (%.3g × f)", float64(c.Prediction.SRF)/x.s.opF))
			}
		}
		if i > 0 && len(parts) == 0 {
			// Nothing of its own to boast: say what it varies.
			for j := range i {
				o := &cs[j]
				switch {
				case o.Support.Name == c.Support.Name && o.Wire.Name != c.Wire.Name:
					parts = append(parts, fmt.Sprintf("#%d with %s instead of %s", j+1, c.Wire.Name, o.Wire.Name))
				case o.Wire.Name == c.Wire.Name && o.Support.Name != c.Support.Name:
					parts = append(parts, fmt.Sprintf("#%d on %s instead of %s", j+1, c.Support.Name, o.Support.Name))
				default:
					continue
				}
				break
			}
		}
		if i > 0 {
			var diff []string
			if hasF {
				dq := c.Prediction.Q/first.Prediction.Q - 1
				switch {
				case dq > 0.005:
					diff = append(diff, fmt.Sprintf("Q %.0f %% higher", dq*100))
				case dq < -0.005:
					diff = append(diff, fmt.Sprintf("Q %.0f %% lower", -dq*100))
				}
			}
			// Sizes relative to #1, so that the line reads the same in any unit.
			rel := func(a, b unit.Length, more, less string) {
				switch r := float64(a)/float64(b) - 1; {
				case r > 0.005:
					diff = append(diff, fmt.Sprintf("%.0f %% %s", r*100, more))
				case r < -0.005:
					diff = append(diff, fmt.Sprintf("%.0f %% %s", -r*100, less))
				}
			}
			rel(c.Prediction.WindingLength, first.Prediction.WindingLength, "longer", "shorter")
			rel(c.Prediction.OutsideDiameter, first.Prediction.OutsideDiameter, "wider", "slimmer")
			if len(diff) > 0 {
				parts = append(parts, strings.Join(diff, ", ")+" than #1")
			}
		}
		g := &c.Prediction.Geometry
		do := float64(g.WireOverall)
		if do == 0 {
			do = float64(g.WireDiameter)
		}
		if r := float64(g.Pitch) / do; math.Abs(r-2) < 0.1 {
			parts = append(parts, "space with a second wire")
		} else if math.Abs(r-3) < 0.1 {
			parts = append(parts, "space with two wires")
		}
		c.Why = strings.Join(parts, "; ")
	}
}

func (x *search) warnings(cs []Candidate) []string {
	s := x.s
	var w []string
	if s.opF == 0 {
		w = append(w, "no operating frequency: Q and the self-resonance were not ranked; give one to rank by them")
	}
	for _, c := range cs {
		if c.SpringbackSource == coil.SpringbackNone {
			w = append(w, "springback 0 % assumed for mandrel coils without a saved calibration: measure the bore after release, or run `turnwise trim --save` once, and the next design on that mandrel accounts for it")
			break
		}
	}
	for _, c := range cs {
		if c.Prediction.Flags&coil.FlagLongWire != 0 {
			w = append(w, "some candidates have more wire than a tenth of a wavelength in the winding: the lumped model is only a guide for them")
			break
		}
	}
	if x.thinnedSupports+x.thinnedWires > 0 {
		w = append(w, fmt.Sprintf("dense stock: %d support and %d wire rows within %.0f %% of a row listed before them were searched as that row", x.thinnedSupports, x.thinnedWires, thinStep*100))
	}
	if len(cs) < s.top {
		w = append(w, fmt.Sprintf("only %d distinct coil(s) meet the target and the limits", len(cs)))
	}
	return w
}

// shortMM formats a length for a "why" line: 0.06 mm, 3.2 mm, 41 mm.
func shortMM(m float64) string {
	switch mmv := m * 1e3; {
	case mmv < 1:
		return fmt.Sprintf("%.2f mm", mmv)
	case mmv < 10:
		return fmt.Sprintf("%.1f mm", mmv)
	default:
		return fmt.Sprintf("%.0f mm", mmv)
	}
}
