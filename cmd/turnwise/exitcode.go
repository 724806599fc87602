package main

import (
	"errors"
	"fmt"
	"io"
	"turnwise/internal/quantity"

	"turnwise/coil"
	"turnwise/forms"
	"turnwise/forms/touchstone"
)

// Exit codes, the same for every command (design.md).
const (
	exitOK         = 0   // success
	exitFailure    = 1   // runtime failure: I/O, an unexpected error
	exitBadInput   = 2   // bad flag, value, file content or combination
	exitInfeasible = 3   // a valid request that no coil meets
	exitSignal     = 128 // + the signal number: interrupted (130 Ctrl-C, 143 SIGTERM)
)

// exitStatusHelp ends every command's Long help.
const exitStatusHelp = `
EXIT STATUS
  0  success
  1  runtime failure (for example an unwritable file)
  2  bad input: the message names the flag or field and the fix
  3  valid request, but no coil meets it: the message says which
     constraint binds and what is nearest
  130, 143  interrupted (Ctrl-C, SIGTERM): no output file is written`

// exitCode maps an error to the process exit status.
func exitCode(err error) int {
	if err == nil {
		return exitOK
	}
	var (
		ue *usageError
		fe *flagError
		ie *coil.InputError
		pe *forms.ParseError
		qe *quantity.Error
		te *touchstone.ParseError
	)
	switch {
	case errors.Is(err, coil.ErrInfeasible):
		return exitInfeasible
	case errors.Is(err, forms.ErrNotFound):
		return exitBadInput
	case errors.As(err, &ue), errors.As(err, &fe), errors.As(err, &ie),
		errors.As(err, &pe), errors.As(err, &qe), errors.As(err, &te):
		return exitBadInput
	}
	return exitFailure
}

// printError writes err once, on one line per wrapped layer the user needs.
func printError(w io.Writer, err error) {
	fmt.Fprintf(w, "turnwise: %s\n", quantity.ClipMessage(err.Error()))
}
