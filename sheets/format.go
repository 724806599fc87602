package sheets

import (
	"fmt"
	"math"
	"strings"
)

// Numbers are printed with the same precision as `turnwise predict`'s
// table, so a page and the command agree digit for digit.

// eng formats v with an SI prefix and sig significant figures: eng(4.8e-8,
// "H", 3) = "48.0 nH".
func eng(v float64, unitSym string, sig int) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "n/a"
	}
	if v == 0 {
		return "0 " + unitSym
	}
	prefixes := []struct {
		exp int
		sym string
	}{{12, "T"}, {9, "G"}, {6, "M"}, {3, "k"}, {0, ""}, {-3, "m"}, {-6, "µ"}, {-9, "n"}, {-12, "p"}, {-15, "f"}}
	a := math.Abs(v)
	for _, p := range prefixes {
		scale := math.Pow(10, float64(p.exp))
		if a >= scale*(1-1e-12) || p.exp == -15 {
			x := v / scale
			digits := max(sig-1-int(math.Floor(math.Log10(math.Abs(x)))), 0)
			return fmt.Sprintf("%.*f %s%s", digits, x, p.sym, unitSym)
		}
	}
	return fmt.Sprintf("%g %s", v, unitSym)
}

// farads prints a capacitance in pF below 1 nF, as builders think of it.
func farads(c float64) string {
	if c > 0 && c < 1e-9 {
		return fmt.Sprintf("%.3g pF", c*1e12)
	}
	return eng(c, "F", 3)
}

// hz prints a frequency with four significant figures.
func hz(f float64) string { return eng(f, "Hz", 4) }

// lengths prints lengths in the display unit.
type lengths struct{ inches bool }

// of prints a length: mm with two decimals (µm below 0.1 mm, m from 1 m) or
// inches with three.
func (u lengths) of(m float64) string {
	if u.inches {
		in := m / 0.0254
		switch {
		case in != 0 && math.Abs(in) < 0.01:
			return fmt.Sprintf("%.2f mil", in*1000)
		case math.Abs(in) >= 10:
			return fmt.Sprintf("%.1f in", in)
		}
		return fmt.Sprintf("%.3f in", in)
	}
	if m != 0 && math.Abs(m) < 0.1e-3 {
		return fmt.Sprintf("%.1f µm", m*1e6)
	}
	if math.Abs(m) >= 1 {
		return fmt.Sprintf("%.3f m", m)
	}
	return fmt.Sprintf("%.2f mm", m*1e3)
}

// short prints a length for a label on the drawing: one decimal fewer.
func (u lengths) short(m float64) string {
	if u.inches {
		return fmt.Sprintf("%.3f in", m/0.0254)
	}
	return fmt.Sprintf("%.2f mm", m*1e3)
}

// turns prints quarter turns as a builder says them: 5, 5¼, 5½, 5¾.
func turns(n float64) string {
	whole := math.Floor(n + 1e-9)
	switch frac := n - whole; {
	case frac < 0.125:
		return fmt.Sprintf("%.0f", whole)
	case frac < 0.375:
		return fmt.Sprintf("%.0f¼", whole)
	case frac < 0.625:
		return fmt.Sprintf("%.0f½", whole)
	default:
		return fmt.Sprintf("%.0f¾", whole)
	}
}

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

func pct(x float64) string { return fmt.Sprintf("%.3g %%", x*100) }

// latin maps the few characters Windows-1252 lacks to plain text, so the
// core font never prints a question mark.
var latin = strings.NewReplacer(
	"Ω", "ohm", "≥", ">=", "≤", "<=", "→", "->", "≈", "~", "λ", "lambda",
	"φ", "phi", "−", "-", "\u2009", " ", "\u202f", " ",
)
