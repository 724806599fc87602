package match

import (
	"fmt"
	"math"

	"turnwise/coil"
	"turnwise/coil/circuit"
)

// loadPartName is the name the load takes in the solved network.
const loadPartName = "load"

// Adjustable is a capacitor the builder turns: the part's name and its
// range in farads.
type Adjustable struct {
	Part     string
	Min, Max float64
}

// Setup is a coupler: the network without its load (port 1 is the
// transmitter or receiver side), the node the load connects to (the other
// side of the load is ground), the capacitors that can be turned, and the
// voltage ratings of the capacitors that have one.
type Setup struct {
	Network    circuit.Network
	LoadNode   string
	Adjustable []Adjustable
	// Ratings holds capacitor voltage ratings in volts by part name. A
	// rating is compared with the peak voltage across the part (a
	// capacitor's working voltage is a peak value).
	Ratings map[string]float64
}

// inputErr is the error for a bad setup or option, naming its key.
func inputErr(key, format string, args ...any) error {
	return &coil.InputError{Param: key, Reason: fmt.Sprintf(format, args...)}
}

// prepared is a validated Setup.
type prepared struct {
	src      *circuit.Network
	loadNode int
	adj      []int // part indexes of the adjustable capacitors
	lo, hi   []float64
	ratings  []float64 // per part: 0 when none
}

func (s *Setup) prepare() (*prepared, error) {
	net := &s.Network
	if len(net.Ports) == 0 {
		return nil, inputErr("port", "the coupler has no port: give one where the transmitter connects")
	}
	p := &prepared{src: net, loadNode: -1, ratings: make([]float64, len(net.Parts))}
	for i, name := range net.Nodes {
		if i != circuit.Ground && name == s.LoadNode {
			p.loadNode = i
		}
	}
	if s.LoadNode == "" {
		return nil, inputErr("load.node", "no load node: name the node the antenna connects to, e.g. [load] node = \"ant\"")
	}
	if p.loadNode < 0 {
		if s.LoadNode == net.Nodes[circuit.Ground] {
			return nil, inputErr("load.node", "the load cannot connect to ground: name the node the antenna connects to")
		}
		return nil, inputErr("load.node", "node %q does not exist in the circuit: name a node a part connects to", s.LoadNode)
	}
	for _, pt := range net.Ports {
		if pt.Node == p.loadNode {
			return nil, inputErr("load.node", "node %q is the port: the load goes on the far side of the coupler", s.LoadNode)
		}
	}
	if len(s.Adjustable) == 0 {
		return nil, inputErr("range", "no adjustable capacitor: give at least one capacitor a range, e.g. range = \"10pF-250pF\"")
	}
	index := map[string]int{}
	for i, pt := range net.Parts {
		index[pt.Name] = i
	}
	seen := map[string]bool{}
	for _, a := range s.Adjustable {
		i, ok := index[a.Part]
		switch {
		case !ok:
			return nil, inputErr("range", "adjustable part %q is not in the circuit", a.Part)
		case net.Parts[i].Kind != circuit.Capacitor:
			return nil, inputErr("range", "%s is a %v: only capacitors can be adjustable", a.Part, net.Parts[i].Kind)
		case seen[a.Part]:
			return nil, inputErr("range", "%s is listed twice as adjustable", a.Part)
		case !(a.Min > 0) || !(a.Max > a.Min) || math.IsInf(a.Max, 0):
			return nil, inputErr("range", "%s: the range must run from a positive minimum to a larger maximum, e.g. 10pF-250pF", a.Part)
		}
		seen[a.Part] = true
		p.adj = append(p.adj, i)
		p.lo, p.hi = append(p.lo, a.Min), append(p.hi, a.Max)
	}
	if len(p.adj) > 3 {
		return nil, inputErr("range", "%d adjustable capacitors: at most 3 can be searched", len(p.adj))
	}
	for name, v := range s.Ratings {
		i, ok := index[name]
		if !ok {
			return nil, inputErr("rating", "part %q is not in the circuit", name)
		}
		if !(v > 0) || math.IsInf(v, 0) {
			return nil, inputErr("rating", "%s: a rating must be a positive voltage, e.g. 1kV", name)
		}
		p.ratings[i] = v
	}
	return p, nil
}
