package coil

import (
	"fmt"
	"math"
)

// Numbers in error and warning messages. The command tables print through
// forms' printers; coil cannot import forms, so messages use these. They
// are exported for the packages under coil/ (trim), whose messages read the
// same way.

// Short names used inside coil.
var (
	fmtHz    = FormatFrequency
	fmtH     = FormatInductance
	fmtF     = FormatCapacitance
	mm       = FormatLength
	fmtTurns = FormatTurns
)

// FormatFrequency formats a frequency with an engineering prefix.
func FormatFrequency(f float64) string {
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

// FormatInductance formats an inductance with an engineering prefix.
func FormatInductance(h float64) string {
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

// FormatCapacitance formats a capacitance with an engineering prefix.
func FormatCapacitance(c float64) string {
	switch a := math.Abs(c); {
	case a >= 1e-6:
		return fmt.Sprintf("%.4g µF", c*1e6)
	case a >= 1e-9:
		return fmt.Sprintf("%.4g nF", c*1e9)
	}
	return fmt.Sprintf("%.4g pF", c*1e12)
}

// FormatLength formats a length in millimetres.
func FormatLength(x float64) string { return fmt.Sprintf("%.4g mm", x*1e3) }

// FormatTurns prints quarter turns as a builder says them: 5, 5¼, ¾.
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

// Formatters for the messages of the packages under coil (the design
// search words its refusals with the model's numbers).
