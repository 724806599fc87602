package match

import (
	"turnwise/coil"
	"turnwise/coil/circuit"
)

// lNetwork is an L-network from a 50 Ω port: the series arm a fixed
// inductor L (Q at f when q > 0) and the adjustable capacitor CS, from
// "tx" through "mid" to "ant"; the shunt arm the adjustable capacitor CP
// from "ant" to ground.
func lNetwork(l, q, f float64) Setup {
	return Setup{
		Network: circuit.Network{
			Nodes: []string{"gnd", "tx", "mid", "ant"},
			Parts: []circuit.Part{
				{Name: "CS", Kind: circuit.Capacitor, A: 1, B: 2, Value: 100e-12, TapNode: -1},
				{Name: "L", Kind: circuit.Inductor, A: 2, B: 3, Value: l, Q: q, QFrequency: f, TapNode: -1},
				{Name: "CP", Kind: circuit.Capacitor, A: 3, B: 0, Value: 100e-12, TapNode: -1},
			},
			Ports: []circuit.Port{{Node: 1, Z0: 50}},
		},
		LoadNode:   "ant",
		Adjustable: []Adjustable{{"CS", 10e-12, 1000e-12}, {"CP", 10e-12, 1000e-12}},
	}
}

// demoCoil is the invented demo coupler's winding: 24 turns of 1.6 mm
// enamelled copper on a 50 mm former at 3.2 mm pitch, 30 mm leads.
func demoCoil() *coil.Geometry {
	return &coil.Geometry{
		FormerDiameter: 50e-3, WireDiameter: 1.6e-3, WireOverall: 1.68e-3,
		Turns: 24, Pitch: 3.2e-3, LeadLength: 30e-3,
	}
}

// tappedCoupler is a tapped coil with two adjustable capacitors: the
// transmitter through C1 (10–250 pF) to the tap, the coil's hot end at the
// antenna node with C2 (10–250 pF) across the whole coil to ground.
func tappedCoupler(tap float64) Setup {
	return Setup{
		Network: circuit.Network{
			Nodes: []string{"gnd", "tx", "tap", "ant"},
			Parts: []circuit.Part{
				{Name: "C1", Kind: circuit.Capacitor, A: 1, B: 2, Value: 100e-12, Q: 1000, QFrequency: 10e6, TapNode: -1},
				{Name: "L1", Kind: circuit.Wound, A: 3, B: 0, Coil: demoCoil(), TapNode: 2, TapTurns: tap},
				{Name: "C2", Kind: circuit.Capacitor, A: 3, B: 0, Value: 100e-12, Q: 1000, QFrequency: 10e6, TapNode: -1},
			},
			Ports: []circuit.Port{{Node: 1, Z0: 50}},
		},
		LoadNode:   "ant",
		Adjustable: []Adjustable{{"C1", 10e-12, 250e-12}, {"C2", 10e-12, 250e-12}},
		Ratings:    map[string]float64{"C1": 1000, "C2": 2000},
	}
}
