package spec

import (
	"errors"
	"fmt"

	"turnwise/coil"
)

// UsageError is bad input found before the model runs: a missing or
// conflicting option, a value that does not parse. The message names the
// command's flag (a job file's key has the same name).
type UsageError struct {
	Msg string
	Err error // the cause Msg was made from, when there is one (a cobra flag error)
}

func (e *UsageError) Error() string { return e.Msg }
func (e *UsageError) Unwrap() error { return e.Err }

// Usagef formats a *UsageError.
func Usagef(format string, args ...any) error {
	return &UsageError{Msg: fmt.Sprintf(format, args...)}
}

// FlagError attaches the flag (or job key) an error belongs to.
type FlagError struct {
	Flag string
	Err  error
}

func (e *FlagError) Error() string {
	var ie *coil.InputError
	if errors.As(e.Err, &ie) {
		return "--" + e.Flag + ": " + ie.Reason
	}
	return "--" + e.Flag + ": " + e.Err.Error()
}
func (e *FlagError) Unwrap() error { return e.Err }

// withFlag wraps err in a *FlagError when it is a *coil.InputError whose
// Param flags maps to a flag (ok true); otherwise it returns err as it is.
// It is the one mechanism behind each command's parameter-to-flag table.
func withFlag(err error, flags map[string]string) (_ error, ok bool) {
	ie, isInput := errors.AsType[*coil.InputError](err)
	if !isInput || flags[ie.Param] == "" {
		return err, false
	}
	return &FlagError{Flag: flags[ie.Param], Err: err}, true
}

// SweepFlagError names the flag of fit and trim --sweep a sweep error
// belongs to.
func SweepFlagError(err error) error {
	err, _ = withFlag(err, map[string]string{"fixture": "fixture", "open": "open", "short": "short", "freq": "freq", "fit_range": "fit-to"})
	return err
}
