package main

import (
	"context"
	"encoding/json"
	"fmt"
	"io"
	"strings"
	"text/tabwriter"
	"turnwise/internal/quantity"

	"github.com/spf13/cobra"

	"turnwise/coil"
	"turnwise/coil/thermal"
)

// predictOptions holds everything `turnwise predict` needs; no cobra types.
type predictOptions struct {
	coil  coilOptions
	stock *stockOptions
	freq  frequencyFlag
	units *choiceFlag
	json  bool
	pitch *choiceFlag // what the pitch follows with temperature on a former
}

func newPredictCmd(g *globalOptions) *cobra.Command {
	opts := &predictOptions{stock: newStockOptions(), units: newChoice("mm", "mm", "in"), pitch: newChoice("former", "former", "wire")}
	cmd := &cobra.Command{
		Use:   "predict",
		Short: "Predict L, self-resonance and Q of a coil you describe",
		Long: strings.TrimSpace(`
Describe a coil as you would wind it and turnwise predicts what it will
measure: inductance at the terminals (leads included), the helix alone at
DC and at the operating frequency, self-capacitance and self-resonance
(SRF), effective inductance and Q at --freq, and the build numbers: bore,
outside diameter, outside length, wire to cut.

The SRF is for a coil with one end grounded (Medhurst's mounting); floating
at both ends the same coil resonates 1.3–1.6× higher. Q is an estimate and
is printed with its uncertainty band.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise predict --mandrel 6mm --wire 1mm --turns 5 --length 8mm --leads 5mm --freq 145MHz
  turnwise predict --former 25mm --wire 22awg --turns 30 --leads 20mm --freq 3.7MHz --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			return runPredict(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	opts.coil.addFlags(cmd.Flags())
	opts.stock.addFlags(cmd.Flags())
	cmd.Flags().Var(&opts.freq, "freq", "operating frequency for L at f, effective L and Q, e.g. 145MHz")
	cmd.Flags().Var(opts.units, "units", "display lengths in mm or in")
	cmd.Flags().BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	cmd.Flags().Var(opts.pitch, "pitch-follows", "on a former, what sets the pitch as the temperature changes: former (turns ride its surface) or wire")
	return cmd
}

// predictCoil resolves the flags and evaluates the model, attaching flag
// names to model errors.
func predictCoil(co *coilOptions, so *stockOptions, f frequencyFlag) (coilSpec, coil.Prediction, error) {
	cat, err := so.load()
	if err != nil {
		return coilSpec{}, coil.Prediction{}, err
	}
	spec, err := co.resolve(cat)
	if err != nil {
		return spec, coil.Prediction{}, err
	}
	p, err := coil.Predict(spec.Geometry, f.v)
	if err != nil {
		return spec, p, co.attachFlag(err, spec.SupportKind, spec.PitchSource)
	}
	return spec, p, nil
}

func runPredict(_ context.Context, opts *predictOptions, stdout, stderr io.Writer) error {
	spec, p, err := predictCoil(&opts.coil, opts.stock, opts.freq)
	if err != nil {
		return err
	}
	rec := newCoilRecord(spec, p)
	if dl, err := coil.LengthPerPercent(spec.Geometry, p.Frequency); err == nil {
		rec.TrimLengthPerPercent = float64(dl)
	}
	tc := tempcoRecord{}
	if cat, err := opts.stock.load(); err == nil {
		pf, _ := thermal.ParsePitchFollows(opts.pitch.v)
		var warn string
		if tc, warn = newTempcoRecord(cat, spec, float64(p.Frequency), pf); warn != "" {
			rec.Warnings = append(rec.Warnings, warn)
		}
	}
	if opts.json {
		doc := struct {
			Schema int `json:"schema"`
			coilRecord
			tempcoRecord
		}{schemaVersion, rec, tc}
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		return enc.Encode(doc)
	}
	if err := writePredictTable(stdout, spec, p, rec, newLengthFormatter(opts.units.v)); err != nil {
		return err
	}
	if err := writeTempcoTable(stdout, tc); err != nil {
		return err
	}
	for _, w := range rec.Warnings {
		fmt.Fprintf(stderr, "warning: %s\n", w)
	}
	return nil
}

// describeWire says what the wire is in a builder's words, e.g.
// "1.00 mm bare copper wire", "1.00mm silver-plated bare wire" or
// "22awg copper wire, grade 1 enamel (0.68 mm overall)". Tables and build
// sheets both use it.
func describeWire(s coilSpec, lf lengthFormatter) string {
	w := s.Wire
	desc := w.Name
	if w.Origin == "command line" || desc == "" {
		desc = lf.fmt(float64(w.Bare))
	}
	cond := s.Geometry.Conductor.String()
	named := strings.Contains(strings.ToLower(desc), cond)
	if w.Insulation == "none" || w.Insulation == "" {
		if named {
			return desc + " bare wire"
		}
		return fmt.Sprintf("%s bare %s wire", desc, cond)
	}
	if !named {
		desc += " " + cond
	}
	ins := map[string]string{"grade1": "grade 1 enamel", "grade2": "grade 2 enamel", "grade3": "grade 3 enamel", "custom": "insulated"}[w.Insulation]
	if ins == "" {
		ins = w.Insulation
	}
	return fmt.Sprintf("%s wire, %s (%s overall)", desc, ins, lf.fmt(float64(s.Geometry.OverallDiameter())))
}

func writePredictTable(w io.Writer, s coilSpec, p coil.Prediction, rec coilRecord, lf lengthFormatter) error {
	g := p.Geometry
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(label, value string) { fmt.Fprintf(tw, "  %s\t%s\n", label, value) }

	fmt.Fprintf(tw, "%s turns of %s on %s (%s)\n\n", quantity.FormatTurns(g.Turns), describeWire(s, lf), s.SupportName,
		map[string]string{"mandrel": "slide off: self-supporting", "former": "stays on the former"}[s.SupportKind])

	fmt.Fprintln(tw, "BUILD")
	row("wind on", lf.fmt(float64(g.FormerDiameter))+" "+s.SupportKind)
	switch s.SpringbackSource {
	case "given":
		row("springback", quantity.FormatPercent(g.Springback)+" (given)")
	case "calibration":
		row("springback", quantity.FormatPercent(g.Springback)+" (your saved calibration: "+s.SpringbackNote+")")
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
	row("pitch", fmt.Sprintf("%s (%.2f × wire%s)", lf.fmt(float64(g.Pitch)), float64(g.Pitch)/rec.WireOverallDiameter, pitchNote))
	row("outside length", lf.fmt(float64(p.WindingLength))+" over the wire (measure this with calipers)")
	row("bore / outside dia.", lf.fmt(float64(p.InsideDiameter))+" / "+lf.fmt(float64(p.OutsideDiameter)))
	row("leads", "2 × "+lf.fmt(float64(g.LeadLength)))
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
		row("trim", fmt.Sprintf("squeeze or spread %s of outside length per 1 %% of L", lf.fmt(rec.TrimLengthPerPercent)))
	}

	fmt.Fprintln(tw, "\nSELF-RESONANCE (one end grounded)")
	row("self-capacitance", quantity.FormatCapacitance(float64(p.SelfCapacitance))+" (Medhurst)")
	row("SRF", fmt.Sprintf("%s  (Medhurst; a full-wave check puts it at %s … %s)", quantity.FormatEng(float64(p.SRF), "Hz", 3), quantity.FormatEng(float64(p.SRFMin), "Hz", 3), quantity.FormatEng(float64(p.SRFMax), "Hz", 3)))
	row("floating at both ends", fmt.Sprintf("%s … %s", quantity.FormatEng(float64(p.SRFFloatingMin), "Hz", 3), quantity.FormatEng(float64(p.SRFFloatingMax), "Hz", 3)))

	if f > 0 {
		fmt.Fprintf(tw, "\nLOSS AT %s\n", quantity.FormatEng(f, "Hz", 4))
		row("R dc", quantity.FormatEng(float64(p.RDC), "Ω", 3))
		row("skin depth", lf.fmt(float64(p.SkinDepth)))
		row("R ac", fmt.Sprintf("%s  (skin × %.2f, proximity × %.2f)", quantity.FormatEng(float64(p.RAC), "Ω", 3), p.SkinFactor, p.ProximityFactor))
		row("Q", fmt.Sprintf("%.0f  (likely %.0f … %.0f; an estimate, measure it)", p.Q, p.QMin, p.QMax))
	}
	return tw.Flush()
}
