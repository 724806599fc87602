package main

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/unit"
)

// resistanceFlag takes a resistance with its unit: "50ohm", "50Ω",
// "2.5kohm", "47k" is refused (the unit is never guessed).
type resistanceFlag struct {
	raw string
	v   unit.Resistance
	set bool
}

func (f *resistanceFlag) String() string { return f.raw }
func (f *resistanceFlag) Type() string   { return "resistance" }
func (f *resistanceFlag) Set(s string) error {
	v, err := parseResistance(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

func parseResistance(s string) (unit.Resistance, error) {
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
