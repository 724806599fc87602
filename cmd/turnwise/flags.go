package main

import (
	"fmt"
	"strconv"
	"strings"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"

	"github.com/spf13/cobra"
	"gonum.org/v1/gonum/unit"
)

// Quantity flags: each keeps what the user typed (for messages) and the
// parsed value; set reports whether the flag was given. K names the kind
// of value and parses it.
type valueFlag[T any, K valueKind[T]] struct {
	raw string
	v   T
	set bool
}

// valueKind is one kind of flag value: its name in the help and its parser.
type valueKind[T any] interface {
	name() string
	parse(s string) (T, error)
}

func (f *valueFlag[T, K]) String() string { return f.raw }
func (f *valueFlag[T, K]) Type() string   { var k K; return k.name() }
func (f *valueFlag[T, K]) Set(s string) error {
	var k K
	v, err := k.parse(s)
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
	lengthFlag      = valueFlag[unit.Length, lengthKind]
	frequencyFlag   = valueFlag[unit.Frequency, frequencyKind]
	inductanceFlag  = valueFlag[unit.Inductance, inductanceKind]
	capacitanceFlag = valueFlag[unit.Capacitance, capacitanceKind]
	percentFlag     = valueFlag[float64, percentKind] // a fraction
	temperatureFlag = valueFlag[unit.Temperature, temperatureKind]
	resistanceFlag  = valueFlag[unit.Resistance, resistanceKind]
	powerFlag       = valueFlag[float64, powerKind] // W
	ratioFlag       = valueFlag[float64, ratioKind]
	turnsFlag       = valueFlag[float64, turnsKind]
	wireSizeFlag    = valueFlag[unit.Length, wireSizeKind]
	// designFreqFlag takes one frequency, or a band LOW-HIGH.
	designFreqFlag = valueFlag[spec.FreqOrBand, freqOrBandKind]
	// designInductanceFlag takes one inductance, or a window MIN-MAX.
	designInductanceFlag = valueFlag[spec.InductanceWindow, inductanceWindowKind]
	// tempRangeFlag is --temp-range, e.g. 10C-40C; low and high in kelvin.
	tempRangeFlag = valueFlag[spec.TempRange, tempRangeKind]
)

type (
	lengthKind           struct{}
	frequencyKind        struct{}
	inductanceKind       struct{}
	capacitanceKind      struct{}
	percentKind          struct{}
	temperatureKind      struct{}
	resistanceKind       struct{}
	powerKind            struct{}
	ratioKind            struct{}
	turnsKind            struct{}
	wireSizeKind         struct{}
	freqOrBandKind       struct{}
	inductanceWindowKind struct{}
	tempRangeKind        struct{}
)

func (freqOrBandKind) name() string                            { return "frequency|band" }
func (freqOrBandKind) parse(s string) (spec.FreqOrBand, error) { return spec.ParseFreqOrBand(s) }
func (inductanceWindowKind) name() string                      { return "inductance|window" }
func (inductanceWindowKind) parse(s string) (spec.InductanceWindow, error) {
	return spec.ParseInductanceWindow(s)
}
func (tempRangeKind) name() string                           { return "range" }
func (tempRangeKind) parse(s string) (spec.TempRange, error) { return spec.ParseTempRange(s) }

func (lengthKind) name() string                                { return "length" }
func (lengthKind) parse(s string) (unit.Length, error)         { return quantity.ParseLength(s) }
func (inductanceKind) name() string                            { return "inductance" }
func (inductanceKind) parse(s string) (unit.Inductance, error) { return quantity.ParseInductance(s) }
func (capacitanceKind) name() string                           { return "capacitance" }
func (capacitanceKind) parse(s string) (unit.Capacitance, error) {
	return quantity.ParseCapacitance(s)
}
func (percentKind) name() string                                 { return "percent" }
func (percentKind) parse(s string) (float64, error)              { return quantity.ParsePercent(s) }
func (temperatureKind) name() string                             { return "temperature" }
func (temperatureKind) parse(s string) (unit.Temperature, error) { return quantity.ParseTemperature(s) }
func (resistanceKind) name() string                              { return "resistance" }
func (resistanceKind) parse(s string) (unit.Resistance, error)   { return spec.ParseResistance(s) }
func (powerKind) name() string                                   { return "power" }
func (powerKind) parse(s string) (float64, error)                { return quantity.ParsePower(s) }
func (ratioKind) name() string                                   { return "ratio" }
func (ratioKind) parse(s string) (float64, error)                { return spec.ParseRatio(s) }
func (wireSizeKind) name() string                                { return "diameter|gauge" }
func (wireSizeKind) parse(s string) (unit.Length, error)         { return spec.ParseWireSize(s) }
func (turnsKind) name() string                                   { return "turns" }

// parse takes a number of turns in quarter steps ("5", "5.25").
func (turnsKind) parse(s string) (float64, error) {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || !(v == v) || v > 1e9 || v < -1e9 {
		return 0, fmt.Errorf("%q is not a number of turns; use e.g. 5 or 5.25 (quarter turns)", s)
	}
	return v, nil
}

// MinFrequency is the lowest frequency a flag accepts, Hz: below it a coil
// is a resistor and the printed numbers lose their meaning.
const MinFrequency = 1.0

func (frequencyKind) name() string { return "frequency" }
func (frequencyKind) parse(s string) (unit.Frequency, error) {
	v, err := quantity.ParseFrequency(s)
	if err != nil {
		return 0, err
	}
	if v < 0 || (v > 0 && v < MinFrequency) {
		return 0, fmt.Errorf("%q is below %g Hz, the lowest frequency turnwise works at; give e.g. 7.1MHz", clip(s), MinFrequency)
	}
	return v, nil
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
