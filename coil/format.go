package coil

import (
	"fmt"
	"math"
)

// Numbers in error and warning messages. The command tables print through
// forms' printers; coil cannot import forms, so messages use these.

// fmtHz formats a frequency with an engineering prefix.
func fmtHz(f float64) string {
	switch a := math.Abs(f); {
	case a >= 1e9:
		return fmt.Sprintf("%.4g GHz", f/1e9)
	case a >= 1e6:
		return fmt.Sprintf("%.4g MHz", f/1e6)
	case a >= 1e3:
		return fmt.Sprintf("%.4g kHz", f/1e3)
	}
	return fmt.Sprintf("%.4g Hz", f)
}

// fmtH formats an inductance with an engineering prefix.
func fmtH(h float64) string {
	switch a := math.Abs(h); {
	case a >= 1:
		return fmt.Sprintf("%.4g H", h)
	case a >= 1e-3:
		return fmt.Sprintf("%.4g mH", h*1e3)
	case a >= 1e-6:
		return fmt.Sprintf("%.4g µH", h*1e6)
	case a >= 1e-9:
		return fmt.Sprintf("%.4g nH", h*1e9)
	}
	return fmt.Sprintf("%.4g pH", h*1e12)
}

// fmtF formats a capacitance with an engineering prefix.
func fmtF(c float64) string {
	switch a := math.Abs(c); {
	case a >= 1e-6:
		return fmt.Sprintf("%.4g µF", c*1e6)
	case a >= 1e-9:
		return fmt.Sprintf("%.4g nF", c*1e9)
	}
	return fmt.Sprintf("%.4g pF", c*1e12)
}

// mm formats a length in millimetres.
func mm(x float64) string { return fmt.Sprintf("%.4g mm", x*1e3) }

// fmtTurns prints quarter turns as a builder says them: 5, 5¼, ¾.
func fmtTurns(n float64) string {
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

// Formatters for the messages of the packages under coil (the design
// search words its refusals with the model's numbers).

// FormatHz formats a frequency with an engineering prefix.
func FormatHz(f float64) string { return fmtHz(f) }

// FormatH formats an inductance with an engineering prefix.
func FormatH(h float64) string { return fmtH(h) }

// FormatF formats a capacitance with an engineering prefix.
func FormatF(c float64) string { return fmtF(c) }

// FormatMM formats a length in millimetres.
func FormatMM(x float64) string { return mm(x) }

// FormatTurns prints quarter turns as a builder says them: 5, 5¼, ¾.
func FormatTurns(n float64) string { return fmtTurns(n) }
