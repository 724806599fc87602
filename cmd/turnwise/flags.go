package main

import (
	"fmt"
	"strings"
	"turnwise/internal/quantity"

	"github.com/spf13/cobra"
	"gonum.org/v1/gonum/unit"
)

// Quantity flags: each keeps what the user typed (for messages) and the
// parsed SI value; set reports whether the flag was given.

type lengthFlag struct {
	raw string
	v   unit.Length
	set bool
}

func (f *lengthFlag) String() string { return f.raw }
func (f *lengthFlag) Type() string   { return "length" }
func (f *lengthFlag) Set(s string) error {
	v, err := quantity.ParseLength(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

// MinFrequency is the lowest frequency a flag accepts, Hz: below it a coil
// is a resistor and the printed numbers lose their meaning.
const MinFrequency = 1.0

type frequencyFlag struct {
	raw string
	v   unit.Frequency
	set bool
}

func (f *frequencyFlag) String() string { return f.raw }
func (f *frequencyFlag) Type() string   { return "frequency" }
func (f *frequencyFlag) Set(s string) error {
	v, err := quantity.ParseFrequency(s)
	if err != nil {
		return err
	}
	if v < 0 || (v > 0 && v < MinFrequency) {
		return fmt.Errorf("%q is below %g Hz, the lowest frequency turnwise works at; give e.g. 7.1MHz", clip(s), MinFrequency)
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

type inductanceFlag struct {
	raw string
	v   unit.Inductance
	set bool
}

func (f *inductanceFlag) String() string { return f.raw }
func (f *inductanceFlag) Type() string   { return "inductance" }
func (f *inductanceFlag) Set(s string) error {
	v, err := quantity.ParseInductance(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

type capacitanceFlag struct {
	raw string
	v   unit.Capacitance
	set bool
}

func (f *capacitanceFlag) String() string { return f.raw }
func (f *capacitanceFlag) Type() string   { return "capacitance" }
func (f *capacitanceFlag) Set(s string) error {
	v, err := quantity.ParseCapacitance(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

type percentFlag struct {
	raw string
	v   float64 // fraction
	set bool
}

func (f *percentFlag) String() string { return f.raw }
func (f *percentFlag) Type() string   { return "percent" }
func (f *percentFlag) Set(s string) error {
	v, err := quantity.ParsePercent(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

type temperatureFlag struct {
	raw string
	v   unit.Temperature
	set bool
}

func (f *temperatureFlag) String() string { return f.raw }
func (f *temperatureFlag) Type() string   { return "temperature" }
func (f *temperatureFlag) Set(s string) error {
	v, err := quantity.ParseTemperature(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

// choiceFlag accepts one of a fixed set of words.
type choiceFlag struct {
	v       string
	choices []string
}

func newChoice(def string, choices ...string) *choiceFlag {
	return &choiceFlag{v: def, choices: choices}
}
func (f *choiceFlag) String() string { return f.v }
func (f *choiceFlag) Type() string   { return strings.Join(f.choices, "|") }
func (f *choiceFlag) Set(s string) error {
	for _, c := range f.choices {
		if strings.EqualFold(s, c) {
			f.v = c
			return nil
		}
	}
	return fmt.Errorf("%q is not one of %s", s, strings.Join(f.choices, ", "))
}

// exampleText trims the blank lines around a command's examples but keeps
// their indentation (strings.TrimSpace would unindent the first line).
func exampleText(s string) string { return strings.Trim(s, "\n") }

// noArgs refuses positional arguments as a usage error (exit 2).
func noArgs(cmd *cobra.Command, args []string) error {
	if len(args) > 0 {
		return usageErrorf("%s takes no arguments (got %q); every input is a flag, see --help", cmd.CommandPath(), args[0])
	}
	return nil
}

// mutuallyExclusive reports two flags given together.
func mutuallyExclusive(cmd *cobra.Command, a, b string) error {
	if cmd.Flags().Changed(a) && cmd.Flags().Changed(b) {
		return usageErrorf("--%s and --%s cannot be used together; give one", a, b)
	}
	return nil
}
