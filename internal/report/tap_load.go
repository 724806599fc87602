package report

import (
	"fmt"
	"io"
	"turnwise/coil"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

// `turnwise tap --source`: the tap (or link, or divider) for a load and a
// loaded Q.

// TapLoadRecord is the JSON document of a tap for a load.
type TapLoadRecord struct {
	Schema    int             `json:"schema"`
	Goal      string          `json:"goal"` // "load"
	Source    float64         `json:"source"`
	Frequency float64         `json:"frequency"`
	LoadedQ   float64         `json:"loaded_q"` // of the nearest tap
	Bandwidth float64         `json:"bandwidth"`
	Rule      string          `json:"rule"`
	Plan      *LoadPlanRecord `json:"plan"`
	Coil      CoilRecord      `json:"coil"`
	Warnings  []string        `json:"warnings"`
}

// LoadRule names the rule the plan follows.
const LoadRule = "a resistance R_s at a tap of voltage ratio n loads the tank with R_s/n² in parallel; Q_L = (R_p ∥ R_s/n²)/X, bandwidth f/Q_L (Terman 1943); a tap is accepted within ±10 % of the impedance ratio"

// WriteTapLoadJSON writes the plan as JSON.
func WriteTapLoadJSON(w io.Writer, s spec.Spec, p coil.Prediction, source float64, plan coil.LoadPlan, warnings []string) error {
	rec := TapLoadRecord{Schema: SchemaVersion, Goal: "load", Source: source, Frequency: float64(plan.Frequency), Rule: LoadRule,
		Plan: NewLoadPlanRecord(plan), Coil: NewCoilRecord(s, p), Warnings: append([]string{}, warnings...)}
	if len(plan.Taps) > 0 {
		rec.LoadedQ, rec.Bandwidth = plan.Taps[0].LoadedQ, float64(plan.Taps[0].Bandwidth)
	}
	return writeJSON(w, rec)
}

// WriteTapLoadTable prints the plan.
func WriteTapLoadTable(w io.Writer, s spec.Spec, p coil.Prediction, source float64, plan coil.LoadPlan, lf quantity.LengthFormat) error {
	g := p.Geometry
	fmt.Fprintf(w, "%s turns of %s on %s, pitch %s: %s effective at %s\n", quantity.FormatTurns(g.Turns), spec.DescribeWire(s, lf), s.SupportName,
		lf.Format(float64(g.Pitch)), quantity.FormatEng(float64(p.InductanceEffective), "H", 3), quantity.FormatEng(float64(plan.Frequency), "Hz", 4))
	fmt.Fprintf(w, "LOAD  %s at the tap\n", quantity.FormatEng(source, "Ω", 3))
	WriteLoadPlanLines(w, plan, "  ", lf)
	fmt.Fprintf(w, "RULE  %s\n", LoadRule)
	fmt.Fprintln(w, "Caution: a tank driven by a transmitter carries high RF voltage at its hot end; follow local regulations and licensed practice.")
	return nil
}
