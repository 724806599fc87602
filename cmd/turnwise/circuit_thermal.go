package main

import (
	"github.com/spf13/cobra"

	"turnwise/coil/thermal"
	"turnwise/forms"
	"turnwise/internal/spec"
)

// The temperature part of `turnwise circuit`: flags, and the drift of
// every resonance through spec.CircuitThermal.

type circuitThermalOptions struct {
	tempRange  tempRangeFlag
	compensate bool
	pitch      *choiceFlag
}

func (o *circuitThermalOptions) addFlags(cmd *cobra.Command) {
	o.pitch = newPitchFollows()
	addTempRangeFlag(cmd, &o.tempRange)
	cmd.Flags().BoolVar(&o.compensate, "compensate", false, "for each resonance set by a fixed capacitor, propose two capacitors of standard classes and E12 values that cancel its drift")
	addPitchFollowsFlag(cmd, o.pitch)
}

// addCircuitThermal computes the drift of r's resonances and adds it (and
// its warnings) to r.
func addCircuitThermal(o *circuitThermalOptions, cat *forms.Catalog, m *spec.CircuitModel, r *spec.CircuitResult) error {
	set := spec.CircuitThermalSettings{Compensate: o.compensate}
	set.Pitch, _ = thermal.ParsePitchFollows(o.pitch.v)
	if o.tempRange.set {
		set.Low, set.High = o.tempRange.v.Low, o.tempRange.v.High
	}
	d, err := spec.CircuitThermal(cat, m.Net, m.Coils, m.Lumped, r.Resonances, set)
	if err != nil {
		return err
	}
	r.Thermal = d
	r.Warnings = append(r.Warnings, d.Warnings...)
	return nil
}
