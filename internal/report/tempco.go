package report

import (
	"fmt"
	"io"
	"text/tabwriter"

	"turnwise/coil/thermal"
	"turnwise/internal/quantity"
)

// TempcoRecord is the JSON form of a coil's temperature coefficients, per
// kelvin (17e-6 for 17 ppm/K), embedded in predict's document and in each
// design candidate. Absent when the former's material is unknown.
type TempcoRecord struct {
	Tempco             *float64 `json:"tempco,omitempty"`               // L at the terminals at f
	TempcoLowFrequency *float64 `json:"tempco_low_frequency,omitempty"` // of inductance_coil
	TempcoQ            *float64 `json:"tempco_q,omitempty"`             // of q at f
	TempcoSkin         *float64 `json:"tempco_skin,omitempty"`          // part of tempco from copper's resistivity
	TempcoUncertainty  *float64 `json:"tempco_uncertainty,omitempty"`   // the former's class spread
	PitchFollows       string   `json:"pitch_follows,omitempty"`
}

// NewTempcoRecord is the record of c at frequency f (zero: low frequency
// only, so no tempco_q and no skin part).
func NewTempcoRecord(c thermal.Coefficients, f float64) TempcoRecord {
	r := TempcoRecord{Tempco: ptr(c.Inductance), TempcoLowFrequency: ptr(c.LowFrequency), PitchFollows: c.PitchRule}
	if f > 0 {
		r.TempcoQ, r.TempcoSkin = ptr(c.Q), ptr(c.Skin)
	}
	if c.Spread > 0 {
		r.TempcoUncertainty = ptr(c.Spread)
	}
	return r
}

// WriteTempcoTable prints predict's TEMPERATURE block, in ppm/K; nothing
// when the record is empty.
func WriteTempcoTable(w io.Writer, r TempcoRecord) error {
	if r.TempcoLowFrequency == nil {
		return nil
	}
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(label, value string) { fmt.Fprintf(tw, "  %s\t%s\n", label, value) }
	fmt.Fprintln(tw, "\nTEMPERATURE")
	lf := quantity.FormatPPMPerK(*r.TempcoLowFrequency, 3)
	if r.TempcoUncertainty != nil {
		lf += fmt.Sprintf(" ± %.2g (the former's class spread)", *r.TempcoUncertainty*1e6)
	}
	row("tempco of L, low frequency", lf)
	if r.TempcoSkin != nil {
		row("tempco of L at f", fmt.Sprintf("%s  (skin effect, copper's resistivity: %s)", quantity.FormatPPMPerK(*r.Tempco, 3), quantity.FormatPPMPerK(*r.TempcoSkin, 2)))
		row("tempco of Q", quantity.FormatPPMPerK(*r.TempcoQ, 3))
	}
	row("pitch follows", r.PitchFollows)
	return tw.Flush()
}
