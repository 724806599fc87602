package coil

import (
	"errors"
	"fmt"
)

// InputError reports a geometry or request the model cannot accept. Param
// names the field in snake_case ("pitch", "former_diameter", "turns", ...)
// so that callers can map it to their own flag or key names.
type InputError struct {
	Param  string // field at fault
	Reason string // what is wrong and how to fix it
	Err    error  // the cause Reason was written from, if any (errors.Is/As see it)
}

func (e *InputError) Error() string { return e.Param + ": " + e.Reason }
func (e *InputError) Unwrap() error { return e.Err }

// ErrInfeasible is returned (wrapped) when a request is valid but no coil
// can meet it.
var ErrInfeasible = errors.New("coil: no coil meets the request")

// InputErrorf is a *InputError naming the request's field param, its
// reason formatted like fmt.Errorf: a %w verb keeps its error as the
// cause. Every package under coil reports bad input with it.
func InputErrorf(param, format string, args ...any) error {
	e := fmt.Errorf(format, args...)
	return &InputError{Param: param, Reason: e.Error(), Err: errors.Unwrap(e)}
}

func inputErrorf(param, format string, args ...any) error { return InputErrorf(param, format, args...) }
