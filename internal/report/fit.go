package report

import (
	"fmt"
	"io"
	"text/tabwriter"

	"turnwise/coil"
	"turnwise/coil/sweep"
	"turnwise/internal/quantity"
)

// FitUncertainty holds the standard uncertainties of FitRecord's figures,
// same keys and units.
type FitUncertainty struct {
	Inductance             float64 `json:"inductance"`
	InductanceLowFrequency float64 `json:"inductance_low_frequency"`
	SelfCapacitance        float64 `json:"self_capacitance"`
	SRF                    float64 `json:"srf"`
	Q                      float64 `json:"q"`
	RDCPart                float64 `json:"r_dc_part"`
	RSkinCoefficient       float64 `json:"r_skin_coefficient"`
}

// FitCompare is the model of the coil as wound against the fit.
type FitCompare struct {
	Inductance     float64 `json:"inductance"`
	SRF            float64 `json:"srf"`
	Q              float64 `json:"q"`
	InductanceDiff float64 `json:"inductance_difference"` // fit/model − 1
	SRFDiff        float64 `json:"srf_difference"`
	QDiff          float64 `json:"q_difference"`
}

// FitRecord is `turnwise fit --json` (SI units).
type FitRecord struct {
	Schema                 int            `json:"schema"`
	File                   string         `json:"file"`
	Fixture                string         `json:"fixture"`
	Corrected              bool           `json:"open_short_corrected"`
	Frequency              float64        `json:"frequency"`
	Inductance             float64        `json:"inductance"`
	InductanceLowFrequency float64        `json:"inductance_low_frequency"`
	SelfCapacitance        float64        `json:"self_capacitance"`
	SRF                    float64        `json:"srf"`
	SRFSource              string         `json:"srf_source"` // "data" or "fit"
	Q                      float64        `json:"q"`
	RDCPart                float64        `json:"r_dc_part"`
	RSkinCoefficient       float64        `json:"r_skin_coefficient"` // ohm/√Hz
	LeadInductance         *float64       `json:"lead_inductance,omitempty"`
	Residual               float64        `json:"residual"`
	Uncertainty            FitUncertainty `json:"uncertainty"`
	PointsUsed             int            `json:"points_used"`
	FitFrom                float64        `json:"fit_from"`
	FitTo                  float64        `json:"fit_to"`
	Compare                *FitCompare    `json:"compare,omitempty"`
	Warnings               []string       `json:"warnings"`
}

// NewFitRecord builds the JSON record; model is the prediction for the
// coil as wound at the fit's frequency, or nil.
func NewFitRecord(file string, fx sweep.Fixture, corrected, lead bool, f *sweep.Fit, model *coil.Prediction) FitRecord {
	r := FitRecord{Schema: 1, File: file, Fixture: fx.String(), Corrected: corrected, Frequency: f.Frequency,
		Inductance: f.Inductance.Value, InductanceLowFrequency: f.InductanceLow.Value,
		SelfCapacitance: f.SelfCapacitance.Value, SRF: f.SRF.Value, SRFSource: "fit", Q: f.Q.Value,
		RDCPart: f.RDC.Value, RSkinCoefficient: f.RSkin.Value, Residual: f.Residual,
		Uncertainty: FitUncertainty{f.Inductance.Uncertainty, f.InductanceLow.Uncertainty, f.SelfCapacitance.Uncertainty,
			f.SRF.Uncertainty, f.Q.Uncertainty, f.RDC.Uncertainty, f.RSkin.Uncertainty},
		PointsUsed: f.PointsUsed, FitFrom: f.FMinUsed, FitTo: f.FMaxUsed, Warnings: FitWarnings(f)}
	if f.SRFFromData {
		r.SRFSource = "data"
	}
	if lead {
		v := f.LeadInductance.Value
		r.LeadInductance = &v
	}
	if model != nil {
		r.Compare = &FitCompare{Inductance: float64(model.Inductance), SRF: float64(model.SRF), Q: model.Q,
			InductanceDiff: f.InductanceLow.Value/float64(model.Inductance) - 1,
			SRFDiff:        f.SRF.Value/float64(model.SRF) - 1, QDiff: f.Q.Value/model.Q - 1}
	}
	return r
}

// FitWarnings words the fit's flags.
func FitWarnings(f *sweep.Fit) []string {
	out := []string{}
	for _, g := range f.Flags {
		var s string
		switch g.Kind {
		case sweep.Noisy:
			s = fmt.Sprintf("the sweep is noisy: rms residual %.2g of S against %.2g; average more, lower the IF bandwidth or calibrate again", g.Value, g.Limit)
		case sweep.LUncertain:
			s = fmt.Sprintf("L is uncertain by ±%.2g %% (more than %.2g %%): the sweep says little about the coil", g.Value*100, g.Limit*100)
		case sweep.Narrow:
			s = "the sweep is too narrow or too far below the self-resonance to separate the self-capacitance from L: sweep wider, towards the self-resonance"
		case sweep.LossUnresolved:
			s = fmt.Sprintf("Q is uncertain by ±%.2g %%: the loss is below what the sweep resolves", g.Value*100)
		case sweep.DCLossFixed:
			s = "the DC part of the loss came out negative (noise) and was fixed at zero"
		case sweep.OutsideFit:
			s = fmt.Sprintf("--freq %s is outside the points fitted: the figures there are extrapolated", quantity.FormatFrequency(g.Value))
		}
		out = append(out, s)
	}
	return out
}

// WriteFitJSON writes the record.
func WriteFitJSON(w io.Writer, r FitRecord) error {
	return writeJSON(w, r)
}

// WriteFitText writes the fit as a table.
func WriteFitText(w io.Writer, r FitRecord) error {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	pm := func(v, u float64, f func(float64) string) string {
		return fmt.Sprintf("%s ± %s", f(v), f(u))
	}
	fmt.Fprintf(tw, "sweep\t%s (%s fixture%s)\n", r.File, r.Fixture, map[bool]string{true: ", open/short corrected"}[r.Corrected])
	fmt.Fprintf(tw, "points fitted\t%d, %s to %s\n", r.PointsUsed, quantity.FormatFrequency(r.FitFrom), quantity.FormatFrequency(r.FitTo))
	fmt.Fprintf(tw, "L at %s\t%s\t(apparent, self-capacitance included)\n", quantity.FormatFrequency(r.Frequency), pm(r.Inductance, r.Uncertainty.Inductance, quantity.FormatInductance))
	fmt.Fprintf(tw, "L, low frequency\t%s\n", pm(r.InductanceLowFrequency, r.Uncertainty.InductanceLowFrequency, quantity.FormatInductance))
	fmt.Fprintf(tw, "self-capacitance\t%s\n", pm(r.SelfCapacitance, r.Uncertainty.SelfCapacitance, quantity.FormatCapacitanceShort))
	fmt.Fprintf(tw, "SRF\t%s\t(from the %s)\n", pm(r.SRF, r.Uncertainty.SRF, quantity.FormatFrequency), map[string]string{"data": "data", "fit": "fit"}[r.SRFSource])
	fmt.Fprintf(tw, "Q at %s\t%.3g ± %.2g\n", quantity.FormatFrequency(r.Frequency), r.Q, r.Uncertainty.Q)
	fmt.Fprintf(tw, "loss\t%.3g Ω + %.3g Ω·√(f/MHz)\n", r.RDCPart, r.RSkinCoefficient*1e3)
	if r.LeadInductance != nil {
		fmt.Fprintf(tw, "fixture lead\t%s\n", quantity.FormatInductance(*r.LeadInductance))
	}
	fmt.Fprintf(tw, "residual\t%.2g (rms, in units of S)\n", r.Residual)
	if c := r.Compare; c != nil {
		fmt.Fprintf(tw, "\n\tmodel\tmeasured\tdifference\n")
		fmt.Fprintf(tw, "L\t%s\t%s\t%+.1f %%\n", quantity.FormatInductance(c.Inductance), quantity.FormatInductance(r.InductanceLowFrequency), c.InductanceDiff*100)
		fmt.Fprintf(tw, "SRF\t%s\t%s\t%+.1f %%\n", quantity.FormatFrequency(c.SRF), quantity.FormatFrequency(r.SRF), c.SRFDiff*100)
		fmt.Fprintf(tw, "Q\t%.3g\t%.3g\t%+.0f %%\n", c.Q, r.Q, c.QDiff*100)
	}
	if err := tw.Flush(); err != nil {
		return err
	}
	for _, s := range r.Warnings {
		fmt.Fprintf(w, "warning: %s\n", s)
	}
	return nil
}
