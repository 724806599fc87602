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
}

func (e *InputError) Error() string { return e.Param + ": " + e.Reason }

// ErrInfeasible is returned (wrapped) when a request is valid but no coil
// can meet it.
var ErrInfeasible = errors.New("coil: no coil meets the request")

func inputErrorf(param, format string, args ...any) error {
	return &InputError{Param: param, Reason: fmt.Sprintf(format, args...)}
}
