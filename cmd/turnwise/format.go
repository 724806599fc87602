package main

import (
	"strings"
	"turnwise/internal/quantity"
)

// Tables print through internal/quantity, as the build sheets do, so both
// print the same digits.

// lengthFormatter prints lengths in the user's display unit.
type lengthFormatter struct{ quantity.LengthFormat }

func newLengthFormatter(units string) lengthFormatter {
	return lengthFormatter{quantity.LengthFormat{Inches: strings.EqualFold(units, "in")}}
}

func (lf lengthFormatter) fmt(m float64) string { return lf.Format(m) }
