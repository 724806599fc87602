package spec

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"turnwise/forms"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Values typed on the command line that internal/quantity does not parse:
// tap ratios and resistances.

// ParseRatio reads "0.2", "20%" or "1:5" (the first number over the second).
func ParseRatio(s string) (float64, error) {
	t := strings.TrimSpace(s)
	bad := fmt.Errorf("%q is not a ratio; write 0.2, 20%% or 1:5", s)
	var v float64
	switch {
	case strings.Contains(t, ":"):
		a, b, _ := strings.Cut(t, ":")
		x, err1 := strconv.ParseFloat(strings.TrimSpace(a), 64)
		y, err2 := strconv.ParseFloat(strings.TrimSpace(b), 64)
		if err1 != nil || err2 != nil || y == 0 {
			return 0, bad
		}
		v = x / y
	case strings.HasSuffix(t, "%"):
		p, err := quantity.ParsePercent(t)
		if err != nil {
			return 0, bad
		}
		v = p
	default:
		x, err := strconv.ParseFloat(t, 64)
		if err != nil {
			return 0, bad
		}
		v = x
	}
	if a, b, ok := strings.Cut(t, ":"); ok && v > 1 && !math.IsInf(v, 0) {
		return 0, fmt.Errorf("%q: a tap ratio is the part over the whole, so it must be below 1; did you mean %s:%s?", s, strings.TrimSpace(b), strings.TrimSpace(a))
	}
	if math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 || v >= 1 {
		return 0, fmt.Errorf("%q: a tap ratio must be between 0 and 1 (the tap sees part of the whole coil), e.g. 0.2 or 1:5", s)
	}
	return v, nil
}

// ParseResistance reads a resistance with its unit: "50ohm", "50Ω",
// "2.5kohm"; "47k" is refused (the unit is never guessed).
func ParseResistance(s string) (unit.Resistance, error) {
	t := strings.TrimSpace(s)
	bad := fmt.Errorf("%q is not a resistance; write e.g. 50ohm, 50Ω or 2.5kohm", s)
	low := strings.ToLower(t)
	var num string
	switch {
	case strings.HasSuffix(low, "ohms"):
		num = t[:len(t)-4]
	case strings.HasSuffix(low, "ohm"):
		num = t[:len(t)-3]
	case strings.HasSuffix(t, "Ω"):
		num = strings.TrimSuffix(t, "Ω")
	default:
		return 0, bad
	}
	num = strings.TrimSpace(num)
	mult := 1.0
	switch {
	case strings.HasSuffix(num, "k"):
		mult, num = 1e3, num[:len(num)-1]
	case strings.HasSuffix(num, "M"):
		mult, num = 1e6, num[:len(num)-1]
	case strings.HasSuffix(num, "m"):
		mult, num = 1e-3, num[:len(num)-1]
	}
	v, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, bad
	}
	v *= mult
	if !(v > 0) || v > 1e9 {
		return 0, fmt.Errorf("%q: a resistance must be positive and at most 1 GΩ, e.g. 50ohm", s)
	}
	return unit.Resistance(v), nil
}

// Given is how a flag was given: as typed (Raw, for messages) and whether
// at all (Set).
type Given struct {
	Raw string
	Set bool
}

// FreqOrBand is one frequency (F) or a band Lo-Hi (IsBand), as design's
// --freq and --band take.
type FreqOrBand struct {
	F      unit.Frequency
	IsBand bool
	Lo, Hi unit.Frequency
}

// ParseFreqOrBand reads one frequency ("145MHz") or a band LOW-HIGH.
func ParseFreqOrBand(s string) (FreqOrBand, error) {
	if isRange(s) {
		b, err := forms.ParseBand(s)
		if err != nil {
			return FreqOrBand{}, err
		}
		return FreqOrBand{IsBand: true, Lo: b.Low, Hi: b.High}, nil
	}
	v, err := quantity.ParseFrequency(s)
	return FreqOrBand{F: v}, err
}

// InductanceWindow is one inductance (Max 0) or a window Min-Max.
type InductanceWindow struct{ Min, Max unit.Inductance }

// ParseInductanceWindow reads one inductance ("4.7uH") or a window MIN-MAX.
func ParseInductanceWindow(s string) (InductanceWindow, error) {
	if isRange(s) {
		lo, hi, err := forms.ParseInductanceRange(s)
		return InductanceWindow{Min: lo, Max: hi}, err
	}
	v, err := quantity.ParseInductance(s)
	return InductanceWindow{Min: v}, err
}

// isRange tells a range LOW-HIGH from one value that may carry a sign.
func isRange(s string) bool {
	return strings.Contains(strings.TrimLeft(strings.TrimSpace(s), "+-"), "-")
}

// TempRange is --temp-range's low and high temperature, in kelvin.
type TempRange struct{ Low, High unit.Temperature }

// ParseTempRange reads a temperature range, e.g. 10C-40C.
func ParseTempRange(s string) (TempRange, error) {
	lo, hi, err := quantity.ParseTemperatureRange(s)
	return TempRange{Low: lo, High: hi}, err
}
