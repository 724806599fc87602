package tuning

import (
	"math"

	"turnwise/coil"
)

// Tolerances. implTol: code against an independent calculation of the same
// formula.
const implTol = 1e-9

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

// hfTapExample is the invented HF example of the coil package's tap tests:
// 40 turns of 0.5 mm wire on a 20 mm former at 1 mm pitch.
func hfTapExample() coil.Geometry {
	return coil.Geometry{FormerDiameter: 20e-3, WireDiameter: 0.5e-3, WireOverall: 0.55e-3, Turns: 40, Pitch: 1e-3, LeadLength: 20e-3}
}
