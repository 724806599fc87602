package main

import (
	"github.com/spf13/cobra"
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

func addTempRangeFlag(cmd *cobra.Command, f *tempRangeFlag) {
	cmd.Flags().Var(f, "temp-range", "temperature range for the drift, e.g. 10C-40C (the shift of each frequency from end to end)")
}
