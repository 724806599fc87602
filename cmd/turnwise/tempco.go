package main

import (
	"fmt"
	"io"
	"text/tabwriter"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/thermal"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

// Temperature coefficients for predict (and, through the same record,
// design and sheets): the glue from the catalog's materials to
// thermal.Support, the JSON fields and the table rows.

// thermalSupport says what a resolved coil's dimensions follow: a coil off
// a mandrel follows the wire; one on a former follows the former's
// material from the catalog (built-in materials table, or a stock file's
// material/expansion keys); the wire's coefficient is the catalog's copper
// row. ok is false, with the reason, when a former's material is unknown.
func thermalSupport(cat *forms.Catalog, s coilSpec, pitch thermal.PitchFollows) (sup thermal.Support, ok bool, why string) {
	sup.Pitch = pitch
	if cu, err := cat.Material("copper"); err == nil {
		sup.Wire = cu.Expansion
	}
	if s.SupportKind != "former" {
		sup.SelfSupporting = true
		return sup, true, ""
	}
	f, err := cat.Former(s.SupportName)
	if err != nil || f.Material == "" || f.Expansion == 0 {
		return sup, false, fmt.Sprintf("the material of former %q is unknown, so no temperature coefficient: use a catalog former, or give material or expansion for it in your stock file", s.SupportName)
	}
	sup.Former, sup.FormerLow, sup.FormerHigh = f.Expansion, f.ExpansionLow, f.ExpansionHigh
	return sup, true, ""
}

// tempcoRecord is the JSON form of a coil's temperature coefficients, per
// kelvin (17e-6 for 17 ppm/K). Absent when the former's material is unknown.
type tempcoRecord struct {
	Tempco             *float64 `json:"tempco,omitempty"`               // L at the terminals at f
	TempcoLowFrequency *float64 `json:"tempco_low_frequency,omitempty"` // of inductance_coil
	TempcoQ            *float64 `json:"tempco_q,omitempty"`             // of q at f
	TempcoSkin         *float64 `json:"tempco_skin,omitempty"`          // part of tempco from copper's resistivity
	TempcoUncertainty  *float64 `json:"tempco_uncertainty,omitempty"`   // the former's class spread
	PitchFollows       string   `json:"pitch_follows,omitempty"`
}

// newTempcoRecord computes the coefficients of spec at f; the second
// result is a warning when they cannot be given.
func newTempcoRecord(cat *forms.Catalog, spec coilSpec, f float64, pitch thermal.PitchFollows) (tempcoRecord, string) {
	sup, ok, why := thermalSupport(cat, spec, pitch)
	if !ok {
		return tempcoRecord{}, why
	}
	c, err := thermal.Tempco(spec.Geometry, unit.Frequency(f), sup)
	if err != nil {
		return tempcoRecord{}, "no temperature coefficient: " + err.Error()
	}
	r := tempcoRecord{Tempco: &c.Inductance, TempcoLowFrequency: &c.LowFrequency, PitchFollows: c.PitchRule}
	if f > 0 {
		r.TempcoQ, r.TempcoSkin = &c.Q, &c.Skin
	}
	if c.Spread > 0 {
		r.TempcoUncertainty = &c.Spread
	}
	return r, ""
}

// writeTempcoTable prints the coefficients in ppm/K.
func writeTempcoTable(w io.Writer, r tempcoRecord) error {
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
