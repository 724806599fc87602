package trim

import (
	"math"

	"turnwise/coil"
)

// implTol: code against an independent calculation of the same formula.
// Model tolerances are set per test from the accuracy the source claims.
const implTol = 1e-9

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

// vhfExample is the coil from the README: 5 turns of 1 mm bare wire on a
// 6 mm mandrel, 8 mm long outside, 5 mm leads.
func vhfExample() coil.Geometry {
	return coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 1.75e-3, LeadLength: 5e-3}
}
