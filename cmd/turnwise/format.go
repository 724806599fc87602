package main

import (
	"strings"

	"turnwise/internal/quantity"
)

// newLengthFormatter prints lengths in the user's display unit (--units),
// through internal/quantity as the build sheets do.
func newLengthFormatter(units string) quantity.LengthFormat {
	return quantity.LengthFormat{Inches: strings.EqualFold(units, "in")}
}
