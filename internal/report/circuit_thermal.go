package report

import (
	"fmt"
	"io"
	"text/tabwriter"

	"turnwise/coil/thermal"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

// CompensationRecord is a proposed split of a resonance's fixed capacitor
// in JSON: the two capacitors (class and E12 value, F), the pair's
// coefficient per kelvin, and the drift left with its uncertainty in ppm/K.
type CompensationRecord struct {
	Replaces           string            `json:"replaces"`
	Capacitance        float64           `json:"capacitance"`
	Parts              []SplitPartRecord `json:"parts"`
	Total              float64           `json:"total"`
	ValueError         float64           `json:"value_error"` // fraction
	CoefficientPerK    float64           `json:"coefficient_per_k"`
	ResidualPPMPerK    float64           `json:"residual_ppm_per_k"`
	UncertaintyPPMPerK float64           `json:"uncertainty_ppm_per_k"`
	WithinTolerance    bool              `json:"within_tolerance"`
}

// SplitPartRecord is one capacitor of a split.
type SplitPartRecord struct {
	Value  float64 `json:"value"`
	Tempco string  `json:"tempco"`
	EIA    string  `json:"eia,omitempty"`
}

// CircuitResonanceThermal is the drift and, with --compensate, the split
// of resonance j of d (nil pointers when not computed).
func CircuitResonanceThermal(d *spec.CircuitDrift, j int) (*DriftRecord, *CompensationRecord) {
	if d == nil || j >= len(d.Drifts) {
		return nil, nil
	}
	dr := NewDriftRecord(d.Drifts[j].Drift, d.Shifts[j])
	sp := d.Splits[j]
	if sp == nil {
		return &dr, nil
	}
	c := &CompensationRecord{Replaces: sp.Part, Capacitance: sp.Value, Total: sp.Split.Total, ValueError: sp.Split.ValueError,
		CoefficientPerK: sp.Split.Coefficient, ResidualPPMPerK: sp.Residual * 1e6, UncertaintyPPMPerK: sp.Uncertainty * 1e6,
		WithinTolerance: abs(sp.Residual) <= sp.Uncertainty}
	for _, p := range splitParts(sp.Split) {
		c.Parts = append(c.Parts, SplitPartRecord{Value: p.Value, Tempco: p.Class.Code, EIA: p.Class.EIA})
	}
	return &dr, c
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

func splitParts(s thermal.Split) []thermal.Part {
	if s.B.Value > 0 {
		return []thermal.Part{s.A, s.B}
	}
	return []thermal.Part{s.A}
}

// WriteCircuitDrift prints circuit's TEMPERATURE DRIFT block: each
// resonance's drift in Hz/K and ppm/K, its shift over the range, and the
// proposed splits. freqs are the resonances' frequencies as the table
// above printed them.
func WriteCircuitDrift(w io.Writer, d *spec.CircuitDrift, freqs []float64) error {
	if d == nil || len(d.Drifts) == 0 {
		return nil
	}
	fmt.Fprintln(w, "\nTEMPERATURE DRIFT (every part moved by its coefficient; ± the classes' tolerances, root sum square)")
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	for j, dr := range d.Drifts {
		f := dr.Frequency
		if j < len(freqs) {
			f = freqs[j]
		}
		fmt.Fprintf(tw, "  %s\t%s\n", quantity.FormatFrequency(f), driftText(dr.Drift, d.Shifts[j]))
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	for j, sp := range d.Splits {
		if sp == nil {
			continue
		}
		f := d.Drifts[j].Frequency
		if j < len(freqs) {
			f = freqs[j]
		}
		var parts string
		for i, p := range splitParts(sp.Split) {
			if i > 0 {
				parts += " ∥ "
			}
			parts += quantity.FormatCapacitance(p.Value) + " " + p.Class.Code
			if p.Class.EIA != "" && p.Class.EIA != p.Class.Code {
				parts += " (" + p.Class.EIA + ")"
			}
		}
		fmt.Fprintf(w, "\nCOMPENSATION of %s (resonance %s): replace %s by %s\n", sp.Part, quantity.FormatFrequency(f),
			quantity.FormatCapacitance(sp.Value), parts)
		fmt.Fprintf(w, "  together %s (%+.2g %% of the value: retune with the trimmer or the pitch), %s combined\n",
			quantity.FormatCapacitance(sp.Split.Total), sp.Split.ValueError*100, quantity.FormatPPMPerK(sp.Split.Coefficient, 3))
		fmt.Fprintf(w, "  drift left %s ± %.2g ppm/K (was %s)\n", quantity.FormatPPMPerK(sp.Residual, 2), sp.Uncertainty*1e6,
			quantity.FormatPPMPerK(d.Drifts[j].PerK, 3))
	}
	return nil
}
