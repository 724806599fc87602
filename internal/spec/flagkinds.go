package spec

import (
	"fmt"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/trim"
	"turnwise/internal/quantity"
)

// Flag value kinds: each names its kind of value for the help (Name) and
// parses what the user typed (Parse). The command's one generic flag type
// takes a kind as its type parameter.
type (
	LengthKind           struct{}
	FrequencyKind        struct{}
	InductanceKind       struct{}
	CapacitanceKind      struct{}
	PercentKind          struct{} // a fraction
	TemperatureKind      struct{}
	ResistanceKind       struct{}
	PowerKind            struct{} // W
	RatioKind            struct{}
	TurnsKind            struct{}
	WireSizeKind         struct{}
	FreqOrBandKind       struct{}
	InductanceWindowKind struct{}
	TempRangeKind        struct{}
	TrimTargetKind       struct{}
	CapTolKind           struct{}
)

func (FreqOrBandKind) Name() string                       { return "frequency|band" }
func (FreqOrBandKind) Parse(s string) (FreqOrBand, error) { return ParseFreqOrBand(s) }
func (InductanceWindowKind) Name() string                 { return "inductance|window" }
func (InductanceWindowKind) Parse(s string) (InductanceWindow, error) {
	return ParseInductanceWindow(s)
}
func (TempRangeKind) Name() string                      { return "range" }
func (TempRangeKind) Parse(s string) (TempRange, error) { return ParseTempRange(s) }

func (LengthKind) Name() string                                { return "length" }
func (LengthKind) Parse(s string) (unit.Length, error)         { return quantity.ParseLength(s) }
func (InductanceKind) Name() string                            { return "inductance" }
func (InductanceKind) Parse(s string) (unit.Inductance, error) { return quantity.ParseInductance(s) }
func (CapacitanceKind) Name() string                           { return "capacitance" }
func (CapacitanceKind) Parse(s string) (unit.Capacitance, error) {
	return quantity.ParseCapacitance(s)
}
func (PercentKind) Name() string                                 { return "percent" }
func (PercentKind) Parse(s string) (float64, error)              { return quantity.ParsePercent(s) }
func (TemperatureKind) Name() string                             { return "temperature" }
func (TemperatureKind) Parse(s string) (unit.Temperature, error) { return quantity.ParseTemperature(s) }
func (ResistanceKind) Name() string                              { return "resistance" }
func (ResistanceKind) Parse(s string) (unit.Resistance, error)   { return ParseResistance(s) }
func (PowerKind) Name() string                                   { return "power" }
func (PowerKind) Parse(s string) (float64, error)                { return quantity.ParsePower(s) }
func (RatioKind) Name() string                                   { return "ratio" }
func (RatioKind) Parse(s string) (float64, error)                { return ParseRatio(s) }
func (WireSizeKind) Name() string                                { return "diameter|gauge" }
func (WireSizeKind) Parse(s string) (unit.Length, error)         { return ParseWireSize(s) }
func (TurnsKind) Name() string                                   { return "turns" }

// Parse takes a number of turns in quarter steps ("5", "5.25").
func (TurnsKind) Parse(s string) (float64, error) {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || !(v == v) || v > 1e9 || v < -1e9 {
		return 0, fmt.Errorf("%q is not a number of turns; use e.g. 5 or 5.25 (quarter turns)", s)
	}
	return v, nil
}

// MinFrequency is the lowest frequency a flag accepts, Hz: below it a coil
// is a resistor and the printed numbers lose their meaning.
const MinFrequency = 1.0

func (FrequencyKind) Name() string { return "frequency" }
func (FrequencyKind) Parse(s string) (unit.Frequency, error) {
	v, err := quantity.ParseFrequency(s)
	if err != nil {
		return 0, err
	}
	if v < 0 || (v > 0 && v < MinFrequency) {
		return 0, fmt.Errorf("%q is below %g Hz, the lowest frequency turnwise works at; give e.g. 7.1MHz", quantity.Clip(s), MinFrequency)
	}
	return v, nil
}

// TrimTarget is trim's --target: an inductance (48nH) or a resonance
// frequency (145MHz).
type TrimTarget struct {
	L      unit.Inductance
	F      unit.Frequency
	IsFreq bool
}

func (TrimTargetKind) Name() string { return "L|F" }
func (TrimTargetKind) Parse(s string) (TrimTarget, error) {
	if l, err := quantity.ParseInductance(s); err == nil {
		return TrimTarget{L: l}, nil
	}
	if fr, err := quantity.ParseFrequency(s); err == nil {
		return TrimTarget{F: fr, IsFreq: true}, nil
	}
	return TrimTarget{}, fmt.Errorf("%q is neither an inductance (48nH) nor a resonance frequency (145MHz, with --circuit-cap)", s)
}

// CapTol is a capacitor tolerance: relative (5%) or absolute (0.25pF).
type CapTol struct {
	Rel float64
	Abs float64 // farads
}

func (CapTolKind) Name() string { return "percent|C" }
func (CapTolKind) Parse(s string) (CapTol, error) {
	t := strings.TrimSpace(s)
	if strings.HasSuffix(strings.ToLower(t), "f") {
		c, err := quantity.ParseCapacitance(t)
		if err != nil {
			return CapTol{}, err
		}
		return CapTol{Abs: float64(c)}, nil
	}
	v, err := quantity.ParsePercent(t)
	if err != nil {
		return CapTol{}, err
	}
	return CapTol{Rel: v}, nil
}

// ParseResonance reads one --resonance F@C reading.
func ParseResonance(s string) (trim.Resonance, error) {
	fs, cs, ok := strings.Cut(s, "@")
	if !ok {
		return trim.Resonance{}, fmt.Errorf("%q: write a resonance and its capacitor as F@C, e.g. 9.81MHz@100pF", s)
	}
	fr, err := quantity.ParseFrequency(strings.TrimSpace(fs))
	if err != nil {
		return trim.Resonance{}, fmt.Errorf("%q: %w", s, err)
	}
	c, err := quantity.ParseCapacitance(strings.TrimSpace(cs))
	if err != nil {
		return trim.Resonance{}, fmt.Errorf("%q: %w", s, err)
	}
	return trim.Resonance{Frequency: fr, Capacitance: c}, nil
}
