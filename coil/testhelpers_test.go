package coil

import "math"

// Tolerances. implTol: code against an independent calculation of the same
// formula. Model tolerances are set per test from the accuracy the source
// claims (or the precision of its table).
const implTol = 1e-9

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}
