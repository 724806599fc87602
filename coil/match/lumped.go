package match

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/circuit"
)

// coilParts is where a wound coil went in a lumped network at one
// frequency: its section inductors (top and bottom for a tapped coil; the
// winding, and the leads when it has them, for one without), by index.
type coilParts struct {
	orig           int // index in the user's network
	top, bottom    int // tapped: sections; untapped: winding in top, −1
	leads          int // untapped with leads: the leads' inductor, else −1
	hot, tap, cold int
}

// lumped is the user's network at one frequency with every wound coil
// replaced by its model at that frequency (coil.ModelAt, coil.Tap) as
// inductors, a coupling and the self-capacitance, so that the inner loop of
// the search does not evaluate the coil model again for each setting.
// The replacement follows circuit's own stamping of a wound coil (leads
// in series, self-capacitance across the winding, a tapped coil's loss
// divided between its sections as the wire is); TestLumpedMatchesWound
// holds the two to each other.
type lumped struct {
	net   circuit.Network
	orig  []int // per lumped part: the user's part index, or −1 (self-capacitance, load)
	coils []coilParts
	load  int // index of the load part
}

func buildLumped(src *circuit.Network, loadNode int, f float64) (*lumped, error) {
	n := &lumped{}
	n.net.Nodes = append([]string(nil), src.Nodes...)
	n.net.Ports = append([]circuit.Port(nil), src.Ports...)
	winding := make([]int, len(src.Parts)) // user's part -> the lumped part carrying its coupled inductance
	add := func(p circuit.Part, orig int) int {
		n.net.Parts = append(n.net.Parts, p)
		n.orig = append(n.orig, orig)
		return len(n.net.Parts) - 1
	}
	for i, p := range src.Parts {
		winding[i] = -1
		if p.Kind != circuit.Wound {
			winding[i] = add(p, i)
			continue
		}
		m, err := coil.ModelAt(*p.Coil, unit.Frequency(f))
		if err != nil {
			return nil, &circuit.Error{Part: p.Name, Reason: err.Error()}
		}
		cp := coilParts{orig: i, top: -1, bottom: -1, leads: -1, hot: p.A, tap: -1, cold: p.B}
		ind := func(name string, a, b int, l, r float64) circuit.Part {
			return circuit.Part{Name: name, Kind: circuit.Inductor, A: a, B: b, Value: l, ESR: r, TapNode: -1}
		}
		cs := float64(m.SelfCapacitance)
		if p.TapNode >= 0 {
			s, err := coil.Tap(*p.Coil, p.TapTurns, unit.Frequency(f))
			if err != nil {
				return nil, &circuit.Error{Part: p.Name, Reason: err.Error()}
			}
			frac := p.TapTurns / p.Coil.Turns
			r := float64(m.R + m.RLeads)
			cp.tap = p.TapNode
			cp.top = add(ind(p.Name+" top", p.A, p.TapNode, float64(s.LA), r*(1-frac)), i)
			cp.bottom = add(ind(p.Name+" bottom", p.TapNode, p.B, float64(s.LB), r*frac), i)
			k := float64(s.M) / math.Sqrt(float64(s.LA)*float64(s.LB))
			n.net.Couplings = append(n.net.Couplings, circuit.Coupling{Name: p.Name + " tap", P: cp.top, Q: cp.bottom, K: k})
			if cs > 0 {
				add(circuit.Part{Name: p.Name + " self", Kind: circuit.Capacitor, A: p.A, B: p.B, Value: cs, TapNode: -1}, -1)
			}
		} else {
			a := p.A
			if p.Coil.LeadLength > 0 {
				x := len(n.net.Nodes)
				n.net.Nodes = append(n.net.Nodes, p.Name+" internal")
				cp.leads = add(ind(p.Name+" leads", p.A, x, float64(m.LLeads), float64(m.RLeads)), i)
				a = x
			}
			cp.top = add(ind(p.Name, a, p.B, float64(m.L), float64(m.R)), i)
			if cs > 0 {
				add(circuit.Part{Name: p.Name + " self", Kind: circuit.Capacitor, A: a, B: p.B, Value: cs, TapNode: -1}, -1)
			}
		}
		winding[i] = cp.top
		n.coils = append(n.coils, cp)
	}
	for _, c := range src.Couplings {
		if c.P < 0 || c.P >= len(winding) || c.Q < 0 || c.Q >= len(winding) {
			return nil, &circuit.Error{Part: c.Name, Reason: "coupling must join two different parts"}
		}
		c.P, c.Q = winding[c.P], winding[c.Q]
		n.net.Couplings = append(n.net.Couplings, c)
	}
	n.load = add(circuit.Part{Name: loadPartName, Kind: circuit.Impedance, A: loadNode, B: circuit.Ground, Z: 50, TapNode: -1}, -1)
	if err := n.net.Validate(); err != nil {
		return nil, fmt.Errorf("match: the network at %g Hz: %w", f, err)
	}
	return n, nil
}
