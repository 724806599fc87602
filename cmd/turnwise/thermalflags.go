package main

import (
	"github.com/spf13/cobra"
	"gonum.org/v1/gonum/unit"

	"turnwise/internal/quantity"
)

// Flags of the temperature features, shared by predict, design, span and
// circuit.

// newPitchFollows is --pitch-follows: on a former, what sets the pitch as
// the temperature changes.
func newPitchFollows() *choiceFlag { return newChoice("former", "former", "wire") }

const pitchFollowsUsage = "on a former, what sets the pitch as the temperature changes: former (turns ride its surface) or wire"

func addPitchFollowsFlag(cmd *cobra.Command, f *choiceFlag) {
	cmd.Flags().Var(f, "pitch-follows", pitchFollowsUsage)
}

// tempRangeFlag is --temp-range, e.g. 10C-40C; low and high in kelvin.
type tempRangeFlag struct {
	raw       string
	low, high unit.Temperature
	set       bool
}

func (f *tempRangeFlag) String() string { return f.raw }
func (f *tempRangeFlag) Type() string   { return "range" }
func (f *tempRangeFlag) Set(s string) error {
	lo, hi, err := quantity.ParseTemperatureRange(s)
	if err != nil {
		return err
	}
	f.raw, f.low, f.high, f.set = s, lo, hi, true
	return nil
}

func addTempRangeFlag(cmd *cobra.Command, f *tempRangeFlag) {
	cmd.Flags().Var(f, "temp-range", "temperature range for the drift, e.g. 10C-40C (the shift of each frequency from end to end)")
}
