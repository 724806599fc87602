package trim

import (
	"errors"
	"fmt"
	"math"

	"turnwise/coil"
)

// twoPi is 2π.
const twoPi = 2 * math.Pi

// inputErrorf is bad input for the field param, as *coil.InputError so
// that callers map every package's input errors the same way.
func inputErrorf(param, format string, args ...any) error {
	e := fmt.Errorf(format, args...) // a %w verb keeps its error as the cause
	return &coil.InputError{Param: param, Reason: e.Error(), Err: errors.Unwrap(e)}
}

// infeasibleError is a valid request no coil meets; errors.Is finds
// coil.ErrInfeasible.
type infeasibleError struct{ msg string }

func (e *infeasibleError) Error() string        { return e.msg }
func (e *infeasibleError) Is(target error) bool { return target == coil.ErrInfeasible }

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }
