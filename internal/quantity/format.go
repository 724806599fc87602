package quantity

import (
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Printing quantities is the mirror of parsing them: the command tables and
// the build sheets both print through these, so a sheet and `turnwise
// predict` agree digit for digit.

// FormatEng prints v with an SI prefix and sig significant figures:
// FormatEng(4.8e-8, "H", 3) = "48.0 nH". Non-finite values print "n/a".
func FormatEng(v float64, unitSym string, sig int) string {
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

// FormatCapacitance prints a capacitance in pF below 1 nF, the unit
// builders think in, else with an SI prefix.
func FormatCapacitance(c float64) string {
	if c > 0 && c < 1e-9 {
		return fmt.Sprintf("%.3g pF", c*1e12)
	}
	return FormatEng(c, "F", 3)
}

// LengthFormat prints lengths in a display unit: millimetres (the zero
// value) or inches.
type LengthFormat struct{ Inches bool }

// Format prints a length in metres in the run's one display unit: mm with
// two decimals (three significant figures below 0.1 mm, e.g. "0.0759 mm";
// m from 1 m), or inches with three decimals (three significant figures
// below 0.01 in, e.g. "0.00868 in"; one decimal from 10 in). A run never
// mixes in µm or mil.
func (f LengthFormat) Format(m float64) string {
	if f.Inches {
		in := m / Inch
		switch {
		case in != 0 && math.Abs(in) < 0.01:
			return smallFixed(in) + " in"
		case math.Abs(in) >= 10:
			return fmt.Sprintf("%.1f in", in)
		}
		return fmt.Sprintf("%.3f in", in)
	}
	if m != 0 && math.Abs(m) < 0.1e-3 {
		return smallFixed(m*1e3) + " mm"
	}
	if math.Abs(m) >= 1 {
		return fmt.Sprintf("%.3f m", m)
	}
	return fmt.Sprintf("%.2f mm", m*1e3)
}

// smallFixed prints |v| < 0.1 to three significant figures in fixed
// notation (never an exponent), trailing zeros dropped: 0.0759, 0.001.
func smallFixed(v float64) string {
	dec := 2 - int(math.Floor(math.Log10(math.Abs(v))))
	if dec > 12 {
		dec = 12
	}
	s := strings.TrimRight(strconv.FormatFloat(v, 'f', dec, 64), "0")
	return strings.TrimSuffix(s, ".")
}

// FormatSize prints a stock size (a wire's or a rod's diameter) with every
// digit it was given, up to 0.1 µm or 0.00001 in: "0.315 mm", not
// "0.32 mm"; at least Format's decimals ("1.00 mm", "0.040 in").
func (f LengthFormat) FormatSize(m float64) string {
	v, minDec, maxDec, sym := m*1e3, 2, 4, " mm"
	if f.Inches {
		v, minDec, maxDec, sym = m/Inch, 3, 5, " in"
	}
	if v == 0 || math.Abs(v) >= 1000 {
		return f.Format(m)
	}
	s := strconv.FormatFloat(v, 'f', maxDec, 64)
	if i := strings.IndexByte(s, '.'); i >= 0 {
		keep := len(s)
		for keep > i+1+minDec && s[keep-1] == '0' {
			keep--
		}
		s = s[:keep]
	}
	return s + sym
}

// FormatTurns prints quarter turns as a builder says them: 5, 5¼, 5½, 5¾,
// and ¾ (not 0¾) below one turn.
func FormatTurns(n float64) string {
	whole := math.Floor(n + 1e-9)
	w := fmt.Sprintf("%.0f", whole)
	frac := n - whole
	if whole == 0 && frac >= 0.125 {
		w = ""
	}
	switch {
	case frac < 0.125:
		return w
	case frac < 0.375:
		return w + "¼"
	case frac < 0.625:
		return w + "½"
	}
	return w + "¾"
}

// FormatTurnsWord prints turns with their noun: "¾ turn", "1 turn",
// "5¼ turns".
func FormatTurnsWord(n float64) string {
	if n <= 1 {
		return FormatTurns(n) + " turn"
	}
	return FormatTurns(n) + " turns"
}

// FormatPercent prints a fraction as a percentage with three significant
// figures: 0.031 → "3.1 %".
func FormatPercent(x float64) string { return fmt.Sprintf("%.3g %%", x*100) }

// Lengths the builder cuts (wire, leads, a former) are printed to what a
// ruler gives at the bench, not to the model's digits: "139 mm", not
// "138.53 mm". Dimensions checked with calipers keep Format's precision.

// CutStep is the resolution of a length to cut: 1 mm, or 0.01 in.
func (f LengthFormat) CutStep() float64 {
	if f.Inches {
		return Inch / 100
	}
	return 1e-3
}

// RoundCut rounds a length to cut to CutStep, half away from zero.
func (f LengthFormat) RoundCut(m float64) float64 {
	st := f.CutStep()
	return math.Round(m/st) * st
}

// FormatCut prints a length to cut: whole millimetres ("139 mm", from 1 m
// "2.327 m"), or inches to 0.01 in (0.1 in from 10 in).
func (f LengthFormat) FormatCut(m float64) string {
	m = f.RoundCut(m)
	if f.Inches {
		in := m / Inch
		if math.Abs(in) >= 10 {
			return fmt.Sprintf("%.1f in", in)
		}
		return fmt.Sprintf("%.2f in", in)
	}
	if math.Abs(m) >= 1 {
		return fmt.Sprintf("%.3f m", m)
	}
	return fmt.Sprintf("%.0f mm", m*1e3)
}
