package design

import (
	"fmt"
	"math"
	"sort"
	"strings"
	"turnwise/coil"
	"turnwise/internal/quantity"
)

// When no coil fits, Design says which constraint binds and what is
// nearest. It searches again with each of the builder's limits lifted in
// turn (maximum length, diameter, wire length, minimum SRF ratio); a limit
// whose lifting lets coils through binds, and the one that the nearest such
// coil exceeds least is reported, with that coil. With no limit to blame,
// the target itself is out of reach of the stock (too small or too large),
// or the wire rules leave nothing to wind.

// near is the coil nearest to meeting one constraint.
type near struct {
	ratio    float64 // how far over the limit: > 1
	value    float64 // the coil's value of the constrained quantity
	pair     *pair
	n, pitch float64
}

type missLog struct {
	near  map[string]near
	small *near // smallest inductance reachable, value in H
	large *pair // a pair that needed more than coil.MaxTurns
	// selfResonant: a pair's fewest turns, spread to the loosest pitch,
	// self-resonate within 5 % of the resonance (effective target).
	selfResonant bool
}

func (m *missLog) note(constraint string, ratio float64, p *pair, n, pitch float64) {
	if m.near == nil {
		m.near = map[string]near{}
	}
	if old, ok := m.near[constraint]; ok && old.ratio <= ratio {
		return
	}
	m.near[constraint] = near{ratio: ratio, pair: p, n: n, pitch: pitch}
}

func (m *missLog) hasBetter(constraint string, r float64) bool {
	old, ok := m.near[constraint]
	return ok && old.ratio <= r
}

func (m *missLog) tooSmall(l float64, p *pair, n float64) {
	if m.small == nil || l < m.small.value {
		m.small = &near{value: l, pair: p, n: n}
	}
}

func (m *missLog) tooLarge(p *pair) {
	if m.large == nil {
		m.large = p
	}
}

// relaxed records, in a search that ignores constraint, how far a coil
// that meets everything else is from meeting it.
func (m *missLog) relaxed(constraint string, c *found, s *settings) {
	var v, limit float64
	p := &c.lean
	switch constraint {
	case "max_length":
		v, limit = p.length, float64(s.c.MaxLength)
	case "max_diameter":
		v, limit = p.od, float64(s.c.MaxDiameter)
	case "max_wire_length":
		v, limit = p.wire, float64(s.c.MaxWireLength)
	case "min_q":
		v, limit = s.c.MinQ, p.q // ratio: floor over Q, the nearest has the most Q
		if m.near == nil {
			m.near = map[string]near{}
		}
		if r := v / limit; !m.hasBetter(constraint, r) {
			m.near[constraint] = near{ratio: r, value: p.q, pair: c.pair, n: c.n, pitch: c.pitch}
		}
		return
	case "min_srf_ratio":
		v = p.srf
		if m.near == nil {
			m.near = map[string]near{}
		}
		r := s.srfRatio * s.opF / v
		if old, ok := m.near[constraint]; !ok || r < old.ratio {
			m.near[constraint] = near{ratio: r, value: v, pair: c.pair, n: c.n, pitch: c.pitch}
		}
		return
	default:
		return
	}
	if m.near == nil {
		m.near = map[string]near{}
	}
	r := v / limit
	if old, ok := m.near[constraint]; !ok || r < old.ratio {
		m.near[constraint] = near{ratio: r, value: v, pair: c.pair, n: c.n, pitch: c.pitch}
	}
}

// describe names a coil for a message: "5¼ turns of 1.00mm on 6mm drill".
func (x *search) describe(n near) string {
	sup, _ := x.support(n.pair)
	s := fmt.Sprintf("%s turns of %s on %s", quantity.FormatTurns(n.n), x.wire(n.pair).Name, sup.Name)
	if n.pitch > 0 {
		s += fmt.Sprintf(" at %s pitch", shortMM(n.pitch))
	}
	return s
}

func (x *search) targetWords() string {
	s := x.s
	if s.effective {
		return fmt.Sprintf("resonance at %s with %s (%s effective)", quantity.FormatFrequency(s.matchF),
			quantity.FormatCapacitanceShort(float64(s.t.Capacitance+s.t.Stray)), quantity.FormatInductance(s.required))
	}
	return quantity.FormatInductance(s.required)
}

// infeasible builds the error for a search that found nothing.
func (x *search) infeasible() error {
	s := x.s
	c := &s.c
	type lifted struct {
		name string
		near near
	}
	var binds []lifted
	if c.MinQ > 0 && len(x.pairs) > 0 {
		// The floor alone binds when lifting it lets coils through: say
		// so, with the best Q there is.
		y := newSearch(s, "min_q", s.top)
		y.run()
		if n, ok := y.miss.near["min_q"]; ok && len(y.coils) > 0 {
			return &InfeasibleError{Constraint: "min_q", Message: x.bindMessage("min_q", n), Nearest: n.value}
		}
	}
	if len(x.pairs) > 0 || x.miss.near["max_diameter"].pair != nil {
		for _, name := range []string{"max_length", "max_diameter", "max_wire_length", "min_srf_ratio"} {
			switch {
			case name == "max_length" && c.MaxLength == 0,
				name == "max_diameter" && c.MaxDiameter == 0,
				name == "max_wire_length" && c.MaxWireLength == 0,
				name == "min_srf_ratio" && s.opF == 0:
				continue
			}
			y := newSearch(s, name, s.top)
			y.run()
			if n, ok := y.miss.near[name]; ok && len(y.coils) > 0 {
				binds = append(binds, lifted{name, n})
			}
		}
	}
	if len(binds) > 0 {
		sort.SliceStable(binds, func(i, j int) bool { return binds[i].near.ratio < binds[j].near.ratio })
		b := binds[0]
		return &InfeasibleError{Constraint: b.name, Message: x.bindMessage(b.name, b.near), Nearest: b.near.value}
	}
	switch {
	case len(x.pairs) == 0 && x.miss.near["max_diameter"].pair == nil:
		return &InfeasibleError{Constraint: "wire_rules", Message: x.rulesMessage()}
	case x.miss.small != nil && x.miss.large == nil && !x.anyLargeMiss():
		return &InfeasibleError{Constraint: "target_too_small", Message: x.smallMessage(), Nearest: x.miss.small.value}
	case x.miss.large != nil:
		return &InfeasibleError{Constraint: "target_too_large", Message: fmt.Sprintf(
			"no coil meets %s: even the largest support needs more than %d turns", x.targetWords(), coil.MaxTurns)}
	case len(x.pairs) == 0:
		return &InfeasibleError{Constraint: "stock", Message: "no support and wire in the stock can be combined under the limits given"}
	}
	if n, ok := x.miss.near["trim_margin"]; ok && x.miss.small == nil {
		return &InfeasibleError{Constraint: "trim_margin", Message: fmt.Sprintf(
			"no coil puts %s inside its squeeze/spread window with a %.3g %% margin; nearest: %s; use a smaller trim margin",
			x.targetWords(), s.margin*100, x.describe(n))}
	}
	if x.miss.selfResonant && x.miss.small == nil {
		return &InfeasibleError{Constraint: "min_srf_ratio", Message: fmt.Sprintf(
			"no coil in the stock reaches %s below its own self-resonance: at %s every one that could resonates by itself; use more capacitance (less inductance), a smaller support, or a strip line",
			x.targetWords(), quantity.FormatFrequency(s.matchF))}
	}
	if len(binds) == 0 && x.multipleLimits() {
		return &InfeasibleError{Constraint: "limits", Message: fmt.Sprintf(
			"no coil meets %s under all the limits together, though each alone can be met; relax more than one of them", x.targetWords())}
	}
	if x.miss.small != nil {
		return &InfeasibleError{Constraint: "target_too_small", Message: x.smallMessage(), Nearest: x.miss.small.value}
	}
	return &InfeasibleError{Constraint: "stock", Message: fmt.Sprintf("no coil in the stock meets %s", x.targetWords())}
}

func (x *search) anyLargeMiss() bool {
	for k := range x.miss.near {
		if k != "trim_margin" {
			return true
		}
	}
	return false
}

func (x *search) multipleLimits() bool {
	c := &x.s.c
	k := 0
	for _, set := range []bool{c.MaxLength > 0, c.MaxDiameter > 0, c.MaxWireLength > 0, x.s.opF > 0} {
		if set {
			k++
		}
	}
	return k > 1
}

func (x *search) bindMessage(name string, n near) string {
	s := x.s
	c := &s.c
	tw := x.targetWords()
	switch name {
	case "max_length":
		msg := fmt.Sprintf("no coil reaches %s within %s outside length: the shortest that does is %s (%s); allow %s",
			tw, shortMM(float64(c.MaxLength)), shortMM(n.value), x.describe(n), shortMM(math.Ceil(n.value*2e3)/2e3))
		if l, nn, ok := x.mostWithin(n.pair, float64(c.MaxLength)); ok && l < s.required*(1-s.tol) {
			msg += fmt.Sprintf(", or accept %s from %s turns close-wound on the same support", quantity.FormatInductance(l), quantity.FormatTurns(nn))
		}
		return msg
	case "max_diameter":
		return fmt.Sprintf("no coil reaches %s within %s outside diameter: the slimmest that does is %s across (%s); allow %s",
			tw, shortMM(float64(c.MaxDiameter)), shortMM(n.value), x.describe(n), shortMM(math.Ceil(n.value*2e3)/2e3))
	case "max_wire_length":
		return fmt.Sprintf("no coil reaches %s with at most %s of wire: the least any needs is %s (%s); allow %s",
			tw, shortMM(float64(c.MaxWireLength)), shortMM(n.value), x.describe(n), shortMM(math.Ceil(n.value*1e3)/1e3))
	case "min_q":
		return fmt.Sprintf("no coil the stock allows reaches Q %.0f at %s under these limits; the best found has Q %.0f (%s; a larger diameter, thicker or silver-plated wire, or a looser length limit raise Q)",
			c.MinQ, quantity.FormatFrequency(s.opF), n.value, x.describe(n))
	case "min_srf_ratio":
		ratio := n.value / s.opF
		return fmt.Sprintf("no coil for %s keeps its self-resonance at %g × %s = %s: the highest is %s (%.3g × f) with %s; accept a ratio of %.2g, or a smaller inductance or a smaller support",
			tw, s.srfRatio, quantity.FormatFrequency(s.opF), quantity.FormatFrequency(s.srfRatio*s.opF), quantity.FormatFrequency(n.value), ratio, x.describe(n), math.Floor(ratio*10)/10)
	}
	return "no coil meets " + tw
}

// mostWithin is the matched value of the most quarter turns of
// close-wound wire that fit within length on pair p; false when fewer
// than the least turns the search allows fit.
func (x *search) mostWithin(p *pair, length float64) (float64, float64, bool) {
	n := math.Floor(length/p.do*4+1e-9) / 4
	if n < x.s.minTurns {
		return 0, 0, false
	}
	return x.matched(p, n, p.do), n, true
}

func (x *search) smallMessage() string {
	s := x.s
	sm := x.miss.small
	lead := float64(s.c.LeadLength)
	if sm.n == 0 {
		return fmt.Sprintf("%s is less than the two %s leads alone (%s even with %s, the thickest wire that fits): shorten the leads, or make the leads the inductor",
			x.targetWords(), shortMM(lead), quantity.FormatInductance(sm.value), x.wire(sm.pair).Name)
	}
	return fmt.Sprintf("%s is below what the stock can make: the least is %s spread to %g × the wire, %s; use shorter leads, a smaller support or a strip line",
		x.targetWords(), x.describe(*sm), coil.LoosestPitchFactor, quantity.FormatInductance(sm.value))
}

func (x *search) rulesMessage() string {
	type kv struct {
		k string
		v int
	}
	counts := map[string]int{}
	c := &x.s.c
	for _, sp := range c.Supports {
		for _, w := range c.Wires {
			if ok, why := WireSuits(sp, w, c); !ok {
				counts[why]++
			}
		}
	}
	var all []kv
	for k, v := range counts {
		all = append(all, kv{k, v})
	}
	sort.Slice(all, func(i, j int) bool { return all[i].v > all[j].v || all[i].v == all[j].v && all[i].k < all[j].k })
	var parts []string
	for i, e := range all {
		if i == 3 {
			break
		}
		parts = append(parts, e.k)
	}
	return "no wire in the stock suits any support: " + strings.Join(parts, "; ") + "; add suitable wire or a former"
}
