package sheets

import (
	"fmt"
	"strings"

	"turnwise/forms"
)

// Numbers are printed with the same precision as `turnwise predict`'s
// table, so a page and the command agree digit for digit.

func eng(v float64, unitSym string, sig int) string { return forms.FormatEng(v, unitSym, sig) }

func farads(c float64) string { return forms.FormatCapacitance(c) }

// hz prints a frequency with four significant figures.
func hz(f float64) string { return eng(f, "Hz", 4) }

// lengths prints lengths in the display unit.
type lengths struct{ inches bool }

// of prints a length in the display unit, as predict's table does.
func (u lengths) of(m float64) string { return forms.LengthFormat{Inches: u.inches}.Format(m) }

// short prints a length for a label on the drawing: one decimal fewer.
func (u lengths) short(m float64) string {
	if u.inches {
		return fmt.Sprintf("%.3f in", m/0.0254)
	}
	return fmt.Sprintf("%.2f mm", m*1e3)
}

func turns(n float64) string { return forms.FormatTurns(n) }

// turnsWord is "1 turn", "1½ turns", "5 turns".
func turnsWord(n float64) string {
	if t := turns(n); t != "1" {
		return t + " turns"
	}
	return "1 turn"
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

func pct(x float64) string { return forms.FormatPercent(x) }

// latin maps the few characters Windows-1252 lacks to plain text, so the
// core font never prints a question mark.
var latin = strings.NewReplacer(
	"Ω", "ohm", "≥", ">=", "≤", "<=", "→", "->", "≈", "~", "λ", "lambda",
	"φ", "phi", "−", "-", "\u2009", " ", "\u202f", " ",
)
