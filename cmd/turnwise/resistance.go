package main

import (
	"turnwise/internal/spec"

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
	v, err := spec.ParseResistance(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}
