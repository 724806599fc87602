package main

import (
	"strings"

	"turnwise/forms"
)

// Table formatting goes through forms' printers so that tables and build
// sheets print the same digits.

func eng(v float64, unitSym string, sig int) string { return forms.FormatEng(v, unitSym, sig) }

func farads(c float64) string { return forms.FormatCapacitance(c) }

func fmtTurns(n float64) string { return forms.FormatTurns(n) }

// turnsWord prints turns with their noun: "¾ turn", "1 turn", "3¼ turns".
func turnsWord(n float64) string { return forms.FormatTurnsWord(n) }

func pct(x float64) string { return forms.FormatPercent(x) }

// lengthFormatter prints lengths in the user's display unit.
type lengthFormatter struct{ forms.LengthFormat }

func newLengthFormatter(units string) lengthFormatter {
	return lengthFormatter{forms.LengthFormat{Inches: strings.EqualFold(units, "in")}}
}

func (lf lengthFormatter) fmt(m float64) string { return lf.Format(m) }
