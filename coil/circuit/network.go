package circuit

import (
	"errors"
	"fmt"
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
)

// Kind is what a part is.
type Kind int

const (
	Resistor  Kind = iota // Value in ohms
	Capacitor             // Value in farads; ESR or Q adds a series resistance
	Inductor              // Value in henries; ESR or Q adds a series resistance
	Wound                 // a wound coil: Coil holds its model
	Impedance             // a fixed complex impedance Z (a load): open in the lossless network
)

func (k Kind) String() string {
	switch k {
	case Resistor:
		return "resistor"
	case Capacitor:
		return "capacitor"
	case Inductor:
		return "inductor"
	case Wound:
		return "coil"
	case Impedance:
		return "impedance"
	}
	return fmt.Sprintf("Kind(%d)", int(k))
}

// Ground is node 0. Every other node has an index into Network.Nodes.
const Ground = 0

// Part joins node A to node B. For a wound coil A is the hot end and B the
// cold end; a tapped coil also joins Tap.
type Part struct {
	Name  string
	Kind  Kind
	A, B  int
	Value float64    // Ω, F or H by Kind; ignored for a wound coil
	Z     complex128 // Kind Impedance: R + jX in ohms at every frequency

	// ESR is a series resistance for a capacitor or inductor, in ohms.
	// Zero with Q > 0 means ESR = X(QFrequency)/Q: constant resistance,
	// the value a SPICE netlist carries.
	ESR        float64
	Q          float64
	QFrequency float64

	// Coil is the wound coil's model (Kind Wound).
	Coil *coil.Geometry
	// TapNode is the tap's node and TapTurns its turns from the cold end;
	// TapNode < 0 for a coil without a tap.
	TapNode  int
	TapTurns float64
	// Mounting is the wound coil's mounting (zero: one end grounded): its
	// self-capacitance puts the winding's resonance at that mounting's SRF
	// (coil.ModelAtMounted).
	Mounting coil.Mounting
}

// Coupling is a mutual coupling k between two inductive parts (inductors
// or untapped wound coils), by index into Network.Parts.
type Coupling struct {
	Name string
	P, Q int
	K    float64
}

// Port is a place a source or analyser connects: from Node to ground, with
// a real reference impedance Z0 in ohms.
type Port struct {
	Node int
	Z0   float64
}

// Network is a circuit ready to solve. Nodes[0] is ground.
type Network struct {
	Nodes     []string
	Parts     []Part
	Couplings []Coupling
	Ports     []Port
}

// Error is a fault in a network's structure or values; Part names the
// part (or node) at fault.
type Error struct {
	Part   string
	Reason string
}

func (e *Error) Error() string {
	if e.Part == "" {
		return "circuit: " + e.Reason
	}
	return "circuit: " + e.Part + ": " + e.Reason
}

func errorf(part, format string, args ...any) error {
	return &Error{Part: part, Reason: fmt.Sprintf(format, args...)}
}

// ErrSingular reports a network whose equations have no unique solution
// at a frequency: a node cut off from ground at that frequency, or an
// ideal loop of inductors and sources.
var ErrSingular = errors.New("circuit: the network's equations are singular")

// Validate checks the structure: every node used by at least two part
// terminals (or a part and a port), no part shorted to itself, ports off
// ground, couplings between inductive parts with |k| < 1, every node
// reaching ground through parts, and finite positive values.
func (n *Network) Validate() error {
	nn := len(n.Nodes)
	if nn < 2 {
		return errorf("", "no nodes besides ground")
	}
	if len(n.Ports) == 0 {
		return errorf("", "no port: give at least one")
	}
	if len(n.Ports) > 2 {
		return errorf("", "%d ports: one or two are supported", len(n.Ports))
	}
	uses := make([]int, nn)
	parent := make([]int, nn)
	for i := range parent {
		parent[i] = i
	}
	find := func(i int) int {
		for parent[i] != i {
			parent[i] = parent[parent[i]]
			i = parent[i]
		}
		return i
	}
	union := func(a, b int) { parent[find(a)] = find(b) }
	inNet := func(i int) bool { return i >= 0 && i < nn }
	names := map[string]bool{}
	for _, p := range n.Parts {
		if p.Name == "" {
			return errorf("", "a part has no name")
		}
		if names[p.Name] {
			return errorf(p.Name, "two parts share this name")
		}
		names[p.Name] = true
		if !inNet(p.A) || !inNet(p.B) {
			return errorf(p.Name, "joins a node that does not exist")
		}
		if p.A == p.B {
			return errorf(p.Name, "both ends on node %q: the part is shorted to itself", n.Nodes[p.A])
		}
		uses[p.A]++
		uses[p.B]++
		union(p.A, p.B)
		switch p.Kind {
		case Resistor, Capacitor, Inductor:
			if !(p.Value > 0) || math.IsInf(p.Value, 0) {
				return errorf(p.Name, "value must be a positive number")
			}
			if p.ESR < 0 || math.IsNaN(p.ESR) || math.IsInf(p.ESR, 0) {
				return errorf(p.Name, "series resistance must be zero or positive")
			}
			if p.Q < 0 || math.IsNaN(p.Q) || math.IsInf(p.Q, 0) || (p.Q > 0 && !(p.QFrequency > 0)) {
				return errorf(p.Name, "a Q needs a positive value and the frequency it is stated at")
			}
		case Wound:
			if p.Coil == nil {
				return errorf(p.Name, "a coil part needs its winding")
			}
			if err := p.Coil.Validate(); err != nil {
				return &Error{Part: p.Name, Reason: err.Error()}
			}
			if p.TapNode >= 0 {
				if !inNet(p.TapNode) {
					return errorf(p.Name, "tap joins a node that does not exist")
				}
				if p.TapNode == p.A || p.TapNode == p.B {
					return errorf(p.Name, "tap on the same node as an end: the section is shorted")
				}
				if !(p.TapTurns > 0 && p.TapTurns < p.Coil.Turns) {
					return errorf(p.Name, "tap must be between the ends (0 < tap < %g turns)", p.Coil.Turns)
				}
				uses[p.TapNode]++
				union(p.TapNode, p.A)
			}
		case Impedance:
			if math.IsNaN(real(p.Z)) || math.IsNaN(imag(p.Z)) || math.IsInf(real(p.Z), 0) ||
				math.IsInf(imag(p.Z), 0) || real(p.Z) < 0 || p.Z == 0 {
				return errorf(p.Name, "impedance must be finite and non-zero with a resistance of zero or more")
			}
		default:
			return errorf(p.Name, "unknown kind %v", p.Kind)
		}
	}
	for _, pt := range n.Ports {
		if pt.Node == Ground {
			return errorf("port", "on ground: a port must be on a node other than gnd")
		}
		if !inNet(pt.Node) {
			return errorf("port", "on a node that does not exist")
		}
		if !(pt.Z0 > 0) || math.IsInf(pt.Z0, 0) {
			return errorf("port", "reference impedance must be a positive number of ohms")
		}
		uses[pt.Node]++
	}
	if len(n.Ports) == 2 && n.Ports[0].Node == n.Ports[1].Node {
		return errorf("port", "both ports on node %q", n.Nodes[n.Ports[0].Node])
	}
	for i := 1; i < nn; i++ {
		if uses[i] < 2 {
			return errorf(n.Nodes[i], "node connects to only one part: join it to something or remove it")
		}
	}
	for i := 1; i < nn; i++ {
		if find(i) != find(Ground) {
			return errorf(n.Nodes[i], "node is in a sub-network with no path to gnd")
		}
	}
	for _, c := range n.Couplings {
		if c.P < 0 || c.P >= len(n.Parts) || c.Q < 0 || c.Q >= len(n.Parts) || c.P == c.Q {
			return errorf(c.Name, "coupling must join two different parts")
		}
		for _, i := range []int{c.P, c.Q} {
			p := n.Parts[i]
			if p.Kind != Inductor && !(p.Kind == Wound && p.TapNode < 0) {
				return errorf(c.Name, "%s is not an inductor or an untapped coil", p.Name)
			}
		}
		if !(math.Abs(c.K) < 1) {
			return errorf(c.Name, "coupling k must be between -1 and 1 (exclusive)")
		}
	}
	return nil
}

// omega is 2πf.
func omega(f float64) float64 { return 2 * math.Pi * f }

// SeriesR is a capacitor's or inductor's series resistance as the solver
// takes it: the ESR, or else X(QFrequency)/Q (zero for neither).
func (p *Part) SeriesR() float64 {
	if p.ESR > 0 || p.Q == 0 {
		return p.ESR
	}
	w := omega(p.QFrequency)
	if p.Kind == Capacitor {
		return 1 / (w * p.Value * p.Q)
	}
	return w * p.Value / p.Q
}

// woundAt is a wound coil's model at f: sections for a tapped coil.
type woundAt struct {
	m          coil.SeriesModel
	la, lb, mm float64 // tapped: sections (leads included) and mutual
	ra, rb     float64
}

func (p *Part) woundAt(f float64) (woundAt, error) {
	m, err := coil.ModelAtMounted(*p.Coil, unit.Frequency(f), p.Mounting)
	if err != nil {
		return woundAt{}, &Error{Part: p.Name, Reason: err.Error()}
	}
	w := woundAt{m: m}
	if p.TapNode >= 0 {
		s, err := coil.Tap(*p.Coil, p.TapTurns, unit.Frequency(f))
		if err != nil {
			return woundAt{}, &Error{Part: p.Name, Reason: err.Error()}
		}
		w.la, w.lb, w.mm = float64(s.LA), float64(s.LB), float64(s.M)
		// The loss divides between the sections as the wire does.
		frac := p.TapTurns / p.Coil.Turns
		r := float64(m.R + m.RLeads)
		w.rb, w.ra = r*frac, r*(1-frac)
	}
	return w, nil
}
