package match

import (
	"math"

	"turnwise/coil/circuit"
)

// The wire heating rule. A coil's RF loss leaves it by free convection
// and radiation from the outside of the winding. With a combined
// coefficient h = 10 W/(m²·K) for a small cylinder in still air (free
// convection in gases spans 2–25 W/(m²·K), Incropera and DeWitt,
// Fundamentals of Heat and Mass Transfer, Table 1.1, from memory) and a
// temperature rise of 40 K above ambient (common practice for enamelled
// or bare copper near plastic formers and capacitors), a coil may
// dissipate at most
//
//	P_max = h · π·D_out·ℓ · ΔT
//
// with D_out the winding's outside diameter and ℓ its length. This is
// a rule of thumb, not a thermal model: a coil in a closed box, or close
// to other hot parts, needs more margin.
const (
	heatH    = 10.0 // W/(m²·K)
	heatRise = 40.0 // K
)

// HeatRule states the rule in the output.
const HeatRule = "coil dissipation at most 10 W/(m²·K) × 40 K × the winding's outside surface π·D_out·length (free convection in still air; common practice)"

// heatLimits is each wound coil's allowed dissipation in watts, by part
// name.
func heatLimits(n *circuit.Network) map[string]float64 {
	out := map[string]float64{}
	for _, p := range n.Parts {
		if p.Kind != circuit.Wound || p.Coil == nil {
			continue
		}
		g := p.Coil
		dOut := float64(g.FormerDiameter)*(1+g.Springback) + 2*float64(g.OverallDiameter())
		length := g.Turns*float64(g.Pitch) + float64(g.OverallDiameter())
		out[p.Name] = heatH * math.Pi * dOut * length * heatRise
	}
	return out
}
