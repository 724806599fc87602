package report

import (
	"fmt"
	"io"
	"strings"
	"turnwise/coil/design"
	"turnwise/forms"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

// designCandidateRecord is one candidate in JSON: the predict keys plus the
// search's own.
type designCandidateRecord struct {
	Rank int `json:"rank"`
	CoilRecord
	TempcoRecord
	Matched          float64 `json:"matched_inductance"` // what was compared with the target
	Score            float64 `json:"score"`
	Why              string  `json:"why"`
	TrimMin          float64 `json:"trim_min"` // terminal L at the loosest sensible pitch
	TrimMax          float64 `json:"trim_max"` // terminal L close-wound
	TuneLow          float64 `json:"tune_low,omitempty"`
	TuneHigh         float64 `json:"tune_high,omitempty"`
	SpringbackOrigin string  `json:"springback_note,omitempty"`
	FreeDiameter     bool    `json:"free_diameter,omitempty"`
	// Band designs: the band and the trimmer settings at its edges.
	Band        *bandEdgesRecord `json:"band,omitempty"`
	TrimmerLow  *float64         `json:"trimmer_low,omitempty"`
	TrimmerHigh *float64         `json:"trimmer_high,omitempty"`
	Tap         *LoadPlanRecord  `json:"tap,omitempty"`
}

func newDesignCandidateRecord(cat *forms.Catalog, so *spec.SearchOptions, rows map[string]forms.Wire, rank int, c design.Candidate) designCandidateRecord {
	cs := spec.FromCandidate(rows, c)
	rec := NewCoilRecord(cs, c.Prediction)
	rec.TrimLengthPerPercent = float64(c.TrimLengthPerPercent)
	var tc TempcoRecord
	if k, ok, _ := spec.Tempco(cat, cs, c.Prediction.Frequency, so.PitchFollows); ok {
		tc = NewTempcoRecord(k, float64(c.Prediction.Frequency))
	}
	out := designCandidateRecord{
		Rank: rank, CoilRecord: rec, TempcoRecord: tc, Matched: float64(c.Matched), Score: c.Score, Why: c.Why,
		TrimMin: float64(c.TrimMin), TrimMax: float64(c.TrimMax),
		TuneLow: float64(c.TuneLow), TuneHigh: float64(c.TuneHigh),
		SpringbackOrigin: c.Support.SpringbackNote, FreeDiameter: c.Free,
	}
	if b := c.Band; b != nil {
		lo, hi := float64(b.TrimmerLow), float64(b.TrimmerHigh)
		out.TrimmerLow, out.TrimmerHigh = &lo, &hi
		out.Band = &bandEdgesRecord{float64(b.Low), float64(b.High)}
	}
	if tp := c.Tapped; tp != nil {
		out.Tap = NewLoadPlanRecord(tp.Plan)
	}
	return out
}

type designTargetRecord struct {
	Inductance    float64 `json:"inductance,omitempty"`
	Capacitance   float64 `json:"capacitance,omitempty"`
	Stray         float64 `json:"stray,omitempty"`
	Resonance     float64 `json:"resonance,omitempty"`
	Frequency     float64 `json:"frequency"` // operating; 0 when none
	Tolerance     float64 `json:"tolerance"`
	Required      float64 `json:"required_inductance"`
	Effective     bool    `json:"required_is_effective"`
	LeadLength    float64 `json:"lead_length"`
	MaxLength     float64 `json:"max_length,omitempty"`
	MaxDiameter   float64 `json:"max_diameter,omitempty"`
	MaxWireLength float64 `json:"max_wire_length,omitempty"`
	MinSRFRatio   float64 `json:"min_srf_ratio"`
	TrimMargin    float64 `json:"trim_margin"`
	Prefer        string  `json:"prefer"`
}

type designSearchRecord struct {
	Pairs       int `json:"pairs"`
	Searched    int `json:"pairs_opened"`
	Coils       int `json:"coils_solved"`
	Evaluations int `json:"evaluations"`
}

func WriteDesignJSON(w io.Writer, cat *forms.Catalog, so *spec.SearchOptions, res design.Result, warnings []string) error {
	t := designTargetRecord{
		Frequency: float64(res.Frequency), Tolerance: res.Tolerance, Required: float64(res.Required),
		Effective: res.Effective, LeadLength: float64(so.Leads), MaxLength: float64(so.MaxLength),
		MaxDiameter: float64(so.MaxDiameter), MaxWireLength: float64(so.MaxWireLength),
		MinSRFRatio: orDefault(so.MinSRFRatio, design.DefaultSRFRatio), TrimMargin: orDefault(so.TrimMargin, design.DefaultTrimMargin),
		Prefer: orDefaultString(so.Prefer, "balanced"),
	}
	if res.Effective {
		t.Capacitance, t.Stray, t.Resonance = float64(so.Capacitance), float64(so.Stray), float64(so.Freq)
	} else {
		t.Inductance = float64(so.Inductance)
	}
	doc := struct {
		Schema     int                     `json:"schema"`
		Target     designTargetRecord      `json:"target"`
		Band       *bandRecord2            `json:"band,omitempty"`
		Candidates []designCandidateRecord `json:"candidates"`
		Pareto     []designCandidateRecord `json:"pareto"`
		Search     designSearchRecord      `json:"search"`
		Warnings   []string                `json:"warnings"`
	}{Schema: SchemaVersion, Target: t, Band: newBandRecord(res.Band), Candidates: []designCandidateRecord{}, Pareto: []designCandidateRecord{}, Warnings: warnings}
	if doc.Warnings == nil {
		doc.Warnings = []string{}
	}
	rows := spec.WireRows(cat, so)
	for i, c := range res.Candidates {
		doc.Candidates = append(doc.Candidates, newDesignCandidateRecord(cat, so, rows, i+1, c))
	}
	for i, c := range res.Pareto {
		doc.Pareto = append(doc.Pareto, newDesignCandidateRecord(cat, so, rows, i+1, c))
	}
	doc.Search = designSearchRecord{res.Stats.Pairs, res.Stats.Searched, res.Stats.Coils, res.Stats.Evaluations}
	return writeJSON(w, doc)
}

func orDefault(v, def float64) float64 {
	if v == 0 {
		return def
	}
	return v
}

func orDefaultString(v, def string) string {
	if v == "" {
		return def
	}
	return v
}

// WriteDesignTable prints the target, the candidates (five lines each: what
// to wind, the build numbers, what it will measure, how to trim it, why)
// and the Pareto list.
func WriteDesignTable(w io.Writer, cat *forms.Catalog, so *spec.SearchOptions, res design.Result, lf quantity.LengthFormat) error {
	f := float64(res.Frequency)
	tol := "± " + quantity.FormatPercent(res.Tolerance)
	leads := "2 × " + lf.Format(float64(so.Leads)) + " leads"
	if res.Band != nil {
		writeBandTarget(w, res.Band, leads)
	} else if res.Effective {
		c := quantity.FormatCapacitance(float64(so.Capacitance))
		if so.Stray > 0 {
			c += " + " + quantity.FormatCapacitance(float64(so.Stray)) + " stray"
		}
		fmt.Fprintf(w, "TARGET  resonate with %s at %s: %s effective at the terminals %s, %s included\n",
			c, quantity.FormatEng(float64(so.Freq), "Hz", 4), quantity.FormatEng(float64(res.Required), "H", 3), tol, leads)
	} else {
		at := "at low frequency"
		if f > 0 {
			at = "at " + quantity.FormatEng(f, "Hz", 4)
		}
		fmt.Fprintf(w, "TARGET  %s at the terminals %s %s, %s included\n", quantity.FormatEng(float64(res.Required), "H", 3), at, tol, leads)
	}
	var limits []string
	if so.MaxLength > 0 {
		limits = append(limits, "outside length ≤ "+lf.Format(float64(so.MaxLength)))
	}
	if so.MaxDiameter > 0 {
		limits = append(limits, "outside diameter ≤ "+lf.Format(float64(so.MaxDiameter)))
	}
	if so.MaxWireLength > 0 {
		limits = append(limits, "wire ≤ "+lf.Format(float64(so.MaxWireLength)))
	}
	if f > 0 {
		limits = append(limits, fmt.Sprintf("SRF ≥ %g × f", orDefault(so.MinSRFRatio, design.DefaultSRFRatio)))
	}
	limits = append(limits, "target inside the trim window by "+quantity.FormatPercent(orDefault(so.TrimMargin, design.DefaultTrimMargin)))
	fmt.Fprintf(w, "LIMITS  %s\n", strings.Join(limits, "; "))
	fmt.Fprintf(w, "SEARCH  %d support × wire pairs, %d opened, %d coils solved\n", res.Stats.Pairs, res.Stats.Searched, res.Stats.Coils)

	rows := spec.WireRows(cat, so)
	for i, c := range res.Candidates {
		fmt.Fprintln(w)
		writeDesignCandidate(w, cat, so, rows, i+1, c, res, lf)
	}
	if len(res.Pareto) > 0 {
		fmt.Fprintln(w)
		fmt.Fprintln(w, "Q VERSUS SIZE (Pareto: no coil found is both smaller and of higher Q)")
		for _, c := range thinForTable(res.Pareto, 8) {
			p := c.Prediction
			g := p.Geometry
			fmt.Fprintf(w, "  Q %4.0f  %s long × %s across  %s turns of %s on %s\n", p.Q,
				lf.Format(float64(p.WindingLength)), lf.Format(float64(p.OutsideDiameter)), quantity.FormatTurns(g.Turns), c.Wire.Name, c.Support.Name)
		}
	}
	fmt.Fprintln(w)
	fmt.Fprintln(w, "Strip enamel only at the joints (flame, solder pot and strippers burn and give off fumes). Tank and coupler")
	fmt.Fprintln(w, "coils in a transmitter carry high RF voltage and current: follow local regulations and licensed practice.")
	return nil
}

func writeDesignCandidate(w io.Writer, cat *forms.Catalog, so *spec.SearchOptions, rows map[string]forms.Wire, rank int, c design.Candidate, res design.Result, lf quantity.LengthFormat) {
	cs := spec.FromCandidate(rows, c)
	p := c.Prediction
	g := p.Geometry
	how := "slide off: self-supporting"
	if c.Support.OnFormer {
		how = "stays on the former"
	}
	fmt.Fprintf(w, "#%d  %s turns of %s on %s (%s)\n", rank, quantity.FormatTurns(g.Turns), spec.DescribeWire(cs, lf), c.Support.Name, how)
	overall := float64(g.OverallDiameter())
	build := fmt.Sprintf("pitch %s (%.2f × wire), outside length %s, bore %s, outside %s, wire to cut %s",
		lf.Format(float64(g.Pitch)), float64(g.Pitch)/overall, lf.Format(float64(p.WindingLength)),
		lf.Format(float64(p.InsideDiameter)), lf.Format(float64(p.OutsideDiameter)), lf.FormatCut(float64(p.WireLength)))
	switch c.SpringbackSource {
	case "calibration":
		build += fmt.Sprintf("; springback %s from your calibration (%s)", quantity.FormatPercent(g.Springback), c.Support.SpringbackNote)
	case "support":
		build += fmt.Sprintf("; springback %s (given)", quantity.FormatPercent(g.Springback))
	case "none":
		build += "; springback 0 % assumed"
	}
	fmt.Fprintf(w, "    %s\n", build)
	f := float64(res.Frequency)
	if f > 0 {
		fmt.Fprintf(w, "    L %s at the terminals, %s effective at %s; Q %.0f (likely %.0f … %.0f); SRF %s (%.1f × f)\n",
			quantity.FormatEng(float64(p.Inductance), "H", 3), quantity.FormatEng(float64(p.InductanceEffective), "H", 3), quantity.FormatEng(f, "Hz", 4),
			p.Q, p.QMin, p.QMax, quantity.FormatEng(float64(p.SRF), "Hz", 3), float64(p.SRF)/f)
	} else {
		fmt.Fprintf(w, "    L %s at the terminals (low frequency); SRF %s\n", quantity.FormatEng(float64(p.Inductance), "H", 3), quantity.FormatEng(float64(p.SRF), "Hz", 3))
	}
	trim := fmt.Sprintf("trim: %s close-wound … %s spread to 3 × wire", quantity.FormatEng(float64(c.TrimMax), "H", 3), quantity.FormatEng(float64(c.TrimMin), "H", 3))
	if res.Effective && c.TuneLow > 0 && c.TuneHigh > 0 {
		trim += fmt.Sprintf(" (resonance %s … %s)", quantity.FormatEng(float64(c.TuneLow), "Hz", 4), quantity.FormatEng(float64(c.TuneHigh), "Hz", 4))
	}
	if c.TrimLengthPerPercent > 0 {
		trim += fmt.Sprintf("; %s of length per 1 %% of L", lf.Format(float64(c.TrimLengthPerPercent)))
	}
	fmt.Fprintf(w, "    %s\n", trim)
	if line := designTempcoLine(cat, so, cs, c); line != "" {
		fmt.Fprintf(w, "    %s\n", line)
	}
	writeBandTapLines(w, c, res, lf)
	fmt.Fprintf(w, "    why: %s\n", c.Why)
}

// thinForTable keeps at most n points of the Pareto list, evenly spread,
// always the first and last.
func thinForTable(ps []design.Candidate, n int) []design.Candidate {
	if len(ps) <= n {
		return ps
	}
	out := make([]design.Candidate, 0, n)
	for i := range n {
		out = append(out, ps[i*(len(ps)-1)/(n-1)])
	}
	return out
}

// designTempcoLine is a candidate's temperature line in ppm/K, or "" when
// its former's material is unknown.
func designTempcoLine(cat *forms.Catalog, so *spec.SearchOptions, cs spec.Spec, c design.Candidate) string {
	k, ok, _ := spec.Tempco(cat, cs, c.Prediction.Frequency, so.PitchFollows)
	if !ok {
		return ""
	}
	line := "tempco: L " + quantity.FormatPPMPerK(k.LowFrequency, 3) + " at low frequency"
	if k.Spread > 0 {
		line += fmt.Sprintf(" (± %.2g)", k.Spread*1e6)
	}
	if c.Prediction.Frequency > 0 {
		line += ", " + quantity.FormatPPMPerK(k.Inductance, 3) + " at f; Q " + quantity.FormatPPMPerK(k.Q, 3)
	}
	return line + "; pitch follows " + k.PitchRule
}
