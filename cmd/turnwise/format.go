package main

import (
	"fmt"
	"math"
	"strings"
)

// eng formats v with an SI prefix and sig significant figures, e.g.
// eng(4.8e-8, "H", 3) = "48.0 nH".
func eng(v float64, unitSym string, sig int) string {
	if v == 0 {
		if unitSym == "H" {
			return "0 nH"
		}
		return "0 " + unitSym
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "n/a"
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
			digits := sig - 1 - int(math.Floor(math.Log10(math.Abs(x))))
			if digits < 0 {
				digits = 0
			}
			return fmt.Sprintf("%.*f %s%s", digits, x, p.sym, unitSym)
		}
	}
	return fmt.Sprintf("%g %s", v, unitSym)
}

// lengthFormatter prints lengths in the user's display unit.
type lengthFormatter struct{ inches bool }

func newLengthFormatter(units string) lengthFormatter {
	return lengthFormatter{inches: strings.EqualFold(units, "in")}
}

// fmt prints a length: mm with two decimals (µm below 0.1 mm) or inches
// with three.
func (lf lengthFormatter) fmt(m float64) string {
	if lf.inches {
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

// turns prints quarter turns as a builder says them: 5, 5¼, 5½, 5¾.
func fmtTurns(n float64) string {
	whole := math.Floor(n + 1e-9)
	frac := n - whole
	switch {
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

// farads prints a capacitance in pF, the unit builders think in, below 1 nF.
func farads(c float64) string {
	if c > 0 && c < 1e-9 {
		return fmt.Sprintf("%.3g pF", c*1e12)
	}
	return eng(c, "F", 3)
}

func pct(x float64) string { return fmt.Sprintf("%.3g %%", x*100) }
