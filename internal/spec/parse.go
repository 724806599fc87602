package spec

import (
	"fmt"
	"math"
	"strconv"
	"strings"
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
