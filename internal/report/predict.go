package report

import (
	"fmt"
	"io"
	"strings"
	"text/tabwriter"
	"turnwise/coil"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

func WritePredictTable(w io.Writer, s spec.Spec, p coil.Prediction, rec CoilRecord, lf quantity.LengthFormat) error {
	g := p.Geometry
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(label, value string) { fmt.Fprintf(tw, "  %s\t%s\n", label, value) }

	fmt.Fprintf(tw, "%s turns of %s on %s (%s)\n\n", quantity.FormatTurns(g.Turns), spec.DescribeWire(s, lf), s.SupportName,
		map[coil.SupportKind]string{coil.SupportMandrel: "slide off: self-supporting", coil.SupportFormer: "stays on the former"}[s.SupportKind])

	fmt.Fprintln(tw, "BUILD")
	row("wind on", lf.Format(float64(g.FormerDiameter))+" "+s.SupportKind.String())
	switch s.SpringbackSource {
	case "given":
		row("springback", quantity.FormatPercent(g.Springback)+" (given)")
	case "calibration":
		if note := strings.TrimSpace(s.SpringbackNote); note != "" {
			row("springback", quantity.FormatPercent(g.Springback)+" (your saved calibration: "+note+")")
		} else {
			row("springback", quantity.FormatPercent(g.Springback)+" (your saved calibration)")
		}
	default:
		if s.SupportKind == "mandrel" {
			row("springback", "0 % assumed: measure the bore after release, or run `turnwise trim --save` once")
		}
	}
	row("turns", quantity.FormatTurns(g.Turns))
	pitchNote := ""
	if s.PitchSource == "close-wound" {
		pitchNote = ", close-wound"
	}
	row("pitch", fmt.Sprintf("%s (%.2f × wire%s)", lf.Format(float64(g.Pitch)), float64(g.Pitch)/rec.WireOverallDiameter, pitchNote))
	row("outside length", lf.Format(float64(p.WindingLength))+" over the wire (measure this with calipers)")
	row("bore / outside dia.", lf.Format(float64(p.InsideDiameter))+" / "+lf.Format(float64(p.OutsideDiameter)))
	row("leads", "2 × "+lf.Format(float64(g.LeadLength)))
	row("wire to cut", fmt.Sprintf("%s (winding %s + leads + %s for stripping), %.2f g copper",
		lf.FormatCut(float64(p.WireLength)), lf.FormatCut(float64(p.HelixWire)), lf.FormatCut(float64(coil.CutAllowance)), float64(p.CopperMass)*1e3))

	f := float64(p.Frequency)
	fmt.Fprintln(tw, "\nINDUCTANCE")
	if f > 0 {
		row("at the terminals, "+quantity.FormatEng(f, "Hz", 4), fmt.Sprintf("%s  (coil %s + leads %s)", quantity.FormatEng(float64(p.Inductance), "H", 3), quantity.FormatEng(float64(p.InductanceCoilAtF), "H", 3), quantity.FormatEng(float64(p.InductanceLeads), "H", 3)))
		row("effective at "+quantity.FormatEng(f, "Hz", 4), quantity.FormatEng(float64(p.InductanceEffective), "H", 3)+"  (what a meter at f sees: self-capacitance included)")
		row("coil alone, low frequency", quantity.FormatEng(float64(p.InductanceCoil), "H", 3)+fmt.Sprintf("  (skin effect removes %s at f)", quantity.FormatEng(float64(p.InductanceCoil-p.InductanceCoilAtF), "H", 2)))
	} else {
		row("at the terminals, low frequency", fmt.Sprintf("%s  (coil %s + leads %s)", quantity.FormatEng(float64(p.Inductance), "H", 3), quantity.FormatEng(float64(p.InductanceCoil), "H", 3), quantity.FormatEng(float64(p.InductanceLeads), "H", 3)))
	}
	row("current sheet (Nagaoka)", fmt.Sprintf("%s  (K = %.4f)", quantity.FormatEng(float64(p.InductanceSheet), "H", 4), p.Nagaoka))
	wh := quantity.FormatEng(float64(p.InductanceWheeler), "H", 3)
	if !p.WheelerValid {
		wh += "  (outside Wheeler's range: coil shorter than 0.8 × radius)"
	}
	row("Wheeler 1928 cross-check", wh)
	if rec.TrimLengthPerPercent > 0 {
		row("trim", fmt.Sprintf("squeeze or spread %s of outside length per 1 %% of L", lf.Format(rec.TrimLengthPerPercent)))
	}

	fmt.Fprintln(tw, "\nSELF-RESONANCE (helical-line model)")
	used := func(m coil.Mounting) string {
		if p.SRFMounting == m {
			return "; used for effective L and Q"
		}
		return ""
	}
	row("SRF, one end grounded", fmt.Sprintf("%s ± %.0f %%  (± from its held-out differences to NEC-2%s)", quantity.FormatEng(float64(p.SRF), "Hz", 3), p.SRFUncertainty*100, used(coil.Grounded)))
	row("SRF, both ends floating", fmt.Sprintf("%s ± %.0f %%%s", quantity.FormatEng(float64(p.SRFFloating), "Hz", 3), p.SRFFloatingUncertainty*100, floatNote(used(coil.Floating))))
	row("self-capacitance", quantity.FormatCapacitance(float64(p.SelfCapacitance))+fmt.Sprintf("  (equivalent, %s: the C that resonates the winding at its SRF)", p.SRFMounting.Description()))

	if f > 0 {
		fmt.Fprintf(tw, "\nLOSS AT %s\n", quantity.FormatEng(f, "Hz", 4))
		row("R dc", quantity.FormatEng(float64(p.RDC), "Ω", 3))
		row("skin depth", lf.Format(float64(p.SkinDepth)))
		row("R ac", fmt.Sprintf("%s  (skin × %.2f, proximity × %.2f)", quantity.FormatEng(float64(p.RAC), "Ω", 3), p.SkinFactor, p.ProximityFactor))
		row("Q", fmt.Sprintf("%.0f  (likely %.0f … %.0f; an estimate, measure it)", p.Q, p.QMin, p.QMax))
	}
	return tw.Flush()
}

// NewPredictRecord is predict's record of a coil: the coil record with
// the trim sensitivity at the operating frequency.
func NewPredictRecord(s spec.Spec, p coil.Prediction) CoilRecord {
	rec := NewCoilRecord(s, p)
	if dl, err := coil.LengthPerPercent(s.Geometry, p.Frequency); err == nil {
		rec.TrimLengthPerPercent = float64(dl)
	}
	return rec
}

// WritePredictJSON writes predict's JSON document.
// tc (empty when the former's material is unknown) adds the temperature
// coefficients.
func WritePredictJSON(w io.Writer, rec CoilRecord, tc TempcoRecord) error {
	return writeJSON(w, struct {
		Schema int `json:"schema"`
		CoilRecord
		TempcoRecord
	}{SchemaVersion, rec, tc})
}

// floatNote wraps the floating row's note in parentheses, or leaves it out.
func floatNote(s string) string {
	if s == "" {
		return ""
	}
	return "  (" + strings.TrimPrefix(s, "; ") + ")"
}
