package design

import (
	"fmt"
	"math"

	"turnwise/coil"
)

// twoPi saves a multiply in hot paths.
const twoPi = 2 * math.Pi

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// inputErrorf is a *coil.InputError naming the request's field param.
func inputErrorf(param, format string, args ...any) error {
	return &coil.InputError{Param: param, Reason: fmt.Sprintf(format, args...)}
}
