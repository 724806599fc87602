package design

import "math"

// implTol: code against an independent calculation of the same formula.
const implTol = 1e-9

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}
