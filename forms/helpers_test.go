package forms

import "math"

// implTol compares a value with the same value computed by hand in SI:
// only rounding in the last bits may differ.
const implTol = 1e-12

func closeRel(got, want, tol float64) bool {
	if want == 0 {
		return math.Abs(got) <= tol
	}
	return math.Abs(got-want) <= tol*math.Abs(want)
}
