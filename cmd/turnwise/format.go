package main

import (
	"fmt"
	"io"
	"strings"

	"turnwise/internal/quantity"
)

// newLengthFormatter prints lengths in the user's display unit (--units),
// through internal/quantity as the build sheets do.
func newLengthFormatter(units string) quantity.LengthFormat {
	return quantity.LengthFormat{Inches: strings.EqualFold(units, "in")}
}

// printWarnings writes each warning on its own line to stderr. Every
// command calls it in table and JSON mode alike: with --json the warnings
// are in the JSON warnings array and on stderr (README).
func printWarnings(stderr io.Writer, warnings []string) {
	for _, w := range warnings {
		fmt.Fprintf(stderr, "warning: %s\n", w)
	}
}
