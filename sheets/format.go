package sheets

import (
	"fmt"
	"math"
	"strings"
	"turnwise/internal/quantity"
)

// Numbers are printed through internal/quantity's printers with the precision of
// `turnwise predict`'s table, so a page and the command agree digit for
// digit; lengths to cut are the exception (cut, lead, stock below).

// hz prints a frequency with four significant figures.
func hz(f float64) string { return quantity.FormatEng(f, "Hz", 4) }

// lengths prints lengths in the display unit.
type lengths struct{ inches bool }

// of prints a length in the display unit, as predict's table does.
func (u lengths) of(m float64) string { return u.form().Format(m) }

// Lengths the builder cuts (wire, leads, a former) are printed to what a
// ruler gives at the bench, not to the model's digits: "Cut 139 mm of
// wire", not "138.53 mm"; the strip allowance alone is 20 mm. Dimensions
// checked with calipers (bore, outside diameter and length, pitch) keep
// predict's precision through of.

func (u lengths) form() quantity.LengthFormat { return quantity.LengthFormat{Inches: u.inches} }

// cutRound rounds a cut length to the cut resolution (1 mm or 0.01 in).
func (u lengths) cutRound(m float64) float64 { return u.form().RoundCut(m) }

// cutUp rounds a length up to the cut resolution: for a least length.
func (u lengths) cutUp(m float64) float64 {
	st := u.form().CutStep()
	return math.Ceil(m/st-1e-9) * st
}

// cut prints a length to cut, as predict's table does.
func (u lengths) cut(m float64) string { return u.form().FormatCut(m) }

// lead prints a lead or strip length: like cut, but a lead given as 4.5 mm
// stays 4.5 mm ("4 mm", "4.5 mm", "0.16 in").
func (u lengths) lead(m float64) string {
	if u.inches {
		return u.cut(m)
	}
	return strings.TrimSuffix(fmt.Sprintf("%.1f", m*1e3), ".0") + " mm"
}

// stock prints how much to have in stock: rounded up to 10 mm ("2.70 m",
// "850 mm") or to the whole inch.
func (u lengths) stock(m float64) string {
	if u.inches {
		return fmt.Sprintf("%.0f in", math.Ceil(m/0.0254-1e-9))
	}
	cm := math.Ceil(m*100 - 1e-9)
	if cm >= 100 {
		return fmt.Sprintf("%.2f m", cm/100)
	}
	return fmt.Sprintf("%.0f mm", cm*10)
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

// latin maps the few characters Windows-1252 lacks to plain text, so the
// core font never prints a question mark.
var latin = strings.NewReplacer(
	"Ω", "ohm", "≥", ">=", "≤", "<=", "→", "->", "≈", "~", "λ", "lambda",
	"φ", "phi", "−", "-", "\u2009", " ", "\u202f", " ",
)
