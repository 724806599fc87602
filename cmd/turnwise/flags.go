package main

import (
	"fmt"
	"strings"
	"turnwise/internal/spec"

	"github.com/spf13/cobra"
	"gonum.org/v1/gonum/unit"
)

// Quantity flags: each keeps what the user typed (for messages) and the
// parsed value; set reports whether the flag was given. K names the kind
// of value and parses it (the kinds are in internal/spec).
type valueFlag[T any, K valueKind[T]] struct {
	raw string
	v   T
	set bool
}

// valueKind is one kind of flag value: its name in the help and its parser.
type valueKind[T any] interface {
	Name() string
	Parse(s string) (T, error)
}

func (f *valueFlag[T, K]) String() string { return f.raw }
func (f *valueFlag[T, K]) Type() string   { var k K; return k.Name() }
func (f *valueFlag[T, K]) Set(s string) error {
	var k K
	v, err := k.Parse(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

// ptr is the value when the flag was given, else nil.
func (f *valueFlag[T, K]) ptr() *T {
	if !f.set {
		return nil
	}
	return &f.v
}

// given is what a check of the flag needs besides its value.
func (f *valueFlag[T, K]) given() spec.Given { return spec.Given{Raw: f.raw, Set: f.set} }

// opt is the flag as internal/spec takes it.
func opt[T any, K valueKind[T]](f *valueFlag[T, K]) spec.Opt[T] {
	return spec.Opt[T]{V: f.v, Given: spec.Given{Raw: f.raw, Set: f.set}}
}

type (
	lengthFlag      = valueFlag[unit.Length, spec.LengthKind]
	frequencyFlag   = valueFlag[unit.Frequency, spec.FrequencyKind]
	inductanceFlag  = valueFlag[unit.Inductance, spec.InductanceKind]
	capacitanceFlag = valueFlag[unit.Capacitance, spec.CapacitanceKind]
	percentFlag     = valueFlag[float64, spec.PercentKind] // a fraction
	temperatureFlag = valueFlag[unit.Temperature, spec.TemperatureKind]
	resistanceFlag  = valueFlag[unit.Resistance, spec.ResistanceKind]
	powerFlag       = valueFlag[float64, spec.PowerKind] // W
	ratioFlag       = valueFlag[float64, spec.RatioKind]
	turnsFlag       = valueFlag[float64, spec.TurnsKind]
	wireSizeFlag    = valueFlag[unit.Length, spec.WireSizeKind]
	// designFreqFlag takes one frequency, or a band LOW-HIGH.
	designFreqFlag = valueFlag[spec.FreqOrBand, spec.FreqOrBandKind]
	// designInductanceFlag takes one inductance, or a window MIN-MAX.
	designInductanceFlag = valueFlag[spec.InductanceWindow, spec.InductanceWindowKind]
	// tempRangeFlag is --temp-range, e.g. 10C-40C; low and high in kelvin.
	tempRangeFlag = valueFlag[spec.TempRange, spec.TempRangeKind]
	// targetFlag is trim's --target: an inductance or a resonance frequency.
	targetFlag = valueFlag[spec.TrimTarget, spec.TrimTargetKind]
	// capTolFlag is a capacitor tolerance: relative (5%) or absolute (0.25pF).
	capTolFlag = valueFlag[spec.CapTol, spec.CapTolKind]
)

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
