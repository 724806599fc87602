package main

import (
	"context"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strings"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"
	"gonum.org/v1/gonum/unit"

	"turnwise/coil/design"
	"turnwise/forms"
)

// defaultDesignLeads is assumed when --leads is not given: 10 mm each, a
// short mount on a board or tag strip (common practice). A warning says so.
const defaultDesignLeads unit.Length = 10e-3

// wireSizeFlag takes a bare diameter or a gauge (--min-wire, --max-wire).
type wireSizeFlag struct {
	raw string
	v   unit.Length
}

func (f *wireSizeFlag) String() string { return f.raw }
func (f *wireSizeFlag) Type() string   { return "diameter|gauge" }
func (f *wireSizeFlag) Set(s string) error {
	v, err := parseWireSize(s)
	if err != nil {
		return err
	}
	f.raw, f.v = s, v
	return nil
}

// designOptions holds everything `turnwise design` needs; no cobra types.
type designOptions struct {
	inductance    inductanceFlag
	capacitance   capacitanceFlag
	stray         capacitanceFlag
	freq          frequencyFlag
	tolerance     percentFlag
	leads         lengthFlag
	temp          temperatureFlag
	support       *choiceFlag
	mandrel       string
	former        string
	wires         []string
	insulation    string
	conductor     string
	springback    percentFlag
	maxLength     lengthFlag
	maxDiameter   lengthFlag
	maxWireLength lengthFlag
	minSRFRatio   float64
	minWire       wireSizeFlag
	maxWire       wireSizeFlag
	trimMargin    percentFlag
	prefer        *choiceFlag
	top           int
	freeDiameter  bool
	stock         *stockOptions
	units         *choiceFlag
	json          bool
}

func newDesignOptions() *designOptions {
	return &designOptions{
		support: newChoice("any", "any", "mandrel", "former"),
		prefer:  newChoice("balanced", "balanced", "q", "small", "easy"),
		units:   newChoice("mm", "mm", "in"),
		stock:   newStockOptions(),
		top:     design.DefaultTop,
	}
}

func (o *designOptions) addFlags(fs *pflag.FlagSet) {
	fs.Var(&o.inductance, "inductance", "the inductance wanted at the terminals, leads included, at --freq when given, e.g. 4.7uH")
	fs.Var(&o.capacitance, "cap", "resonate with this capacitance at --freq instead, e.g. 22pF (the coil's own self-capacitance is accounted for)")
	fs.Var(&o.stray, "stray", "wiring and device capacitance across the coil, added to --cap, e.g. 3pF")
	fs.Var(&o.freq, "freq", "operating frequency for L at f, Q and the SRF check; with --cap, the resonance, e.g. 145MHz")
	fs.Var(&o.tolerance, "tolerance", "how close the predicted value must be, percent (default 2%)")
	fs.Var(&o.leads, "leads", "length of each of the two leads to the solder joint, e.g. 5mm (default 10mm, with a warning)")
	fs.Var(&o.temp, "temp", "conductor temperature (default 20C)")
	fs.Var(o.support, "support", "any, mandrel (self-supporting: slid off after winding) or former (the coil stays on it)")
	fs.StringVar(&o.mandrel, "mandrel", "", "use only this mandrel: a stock name or a diameter, e.g. 6mm")
	fs.StringVar(&o.former, "former", "", "use only this former: a stock name or an outside diameter, e.g. 20mm")
	fs.StringArrayVar(&o.wires, "wire", nil, "use only this wire (repeat for several): a gauge, a bare diameter or a stock name")
	fs.StringVar(&o.insulation, "insulation", "", "for --wire: none, grade1, grade2 or the overall diameter")
	fs.StringVar(&o.conductor, "conductor", "", "for --wire: copper, silver-plated or tinned")
	fs.Var(&o.springback, "springback", "growth of the bore off every mandrel, percent (default: your saved calibrations, else 0)")
	fs.Var(&o.maxLength, "max-length", "longest outside winding length you accept, e.g. 15mm")
	fs.Var(&o.maxDiameter, "max-diameter", "largest outside diameter over the wire, e.g. 12mm")
	fs.Var(&o.maxWireLength, "max-wire-length", "most wire you can spare, leads and stripping included, e.g. 300mm")
	fs.Float64Var(&o.minSRFRatio, "min-srf-ratio", design.DefaultSRFRatio, "least self-resonance as a multiple of the operating frequency (3 is common practice)")
	fs.Var(&o.minWire, "min-wire", "thinnest wire to consider: a bare diameter or a gauge, e.g. 0.5mm or 24awg")
	fs.Var(&o.maxWire, "max-wire", "thickest wire to consider, e.g. 2mm or 12awg")
	fs.Var(&o.trimMargin, "trim-margin", "how far inside the squeeze/spread window the target must sit, percent (default 5%)")
	fs.Var(o.prefer, "prefer", "shift the ranking: balanced, q (highest Q), small or easy (easiest to wind)")
	fs.IntVar(&o.top, "top", design.DefaultTop, "how many candidates to list")
	fs.BoolVar(&o.freeDiameter, "free-diameter", false, "also consider a support of any diameter (rounded to 0.1 mm) instead of only the stock's")
	o.stock.addFlags(fs)
	fs.Var(o.units, "units", "display lengths in mm or in")
	fs.BoolVar(&o.json, "json", false, "print JSON (SI units) instead of a table")
}

func newDesignCmd(g *globalOptions) *cobra.Command {
	opts := newDesignOptions()
	cmd := &cobra.Command{
		Use:   "design",
		Short: "Find coils you can wind from your stock for a target inductance or resonance",
		Long: strings.TrimSpace(`
Give what the circuit needs — an inductance (--inductance), or a capacitance
it must resonate with (--cap with --freq) — and turnwise searches every
mandrel, former and wire in the stock for coils that hit it, then lists the
best few, each with one line of why.

Every candidate can be trimmed onto the target after you measure it: the
target sits inside its squeeze/spread window (close-wound down to a pitch of
three wire diameters) with a margin (--trim-margin, default 5 %). For a
resonance target the coil's own self-capacitance and the leads are part of
the calculation: what is matched is the effective inductance at --freq.

Ranking: coils that meet the target and every limit, by Q at the operating
frequency (with diminishing returns above about 250), self-resonance margin,
size, ease of winding (whole turns, a pitch of two or three wire diameters,
a length of 0.5 to 2 diameters) and wire used; --prefer shifts the weights.
The Pareto list shows, for each size, the highest Q the stock reaches
(within about 15 %), so nobody has to trust the weights.

Self-supporting coils (--support mandrel) use only wire of at least 0.6 mm
and 1/15 of the mandrel diameter, so that they keep their shape; any coil
needs a support at least twice the wire diameter; hand winding takes wire
from 0.2 mm to 4.2 mm (common practice).
` + exitStatusHelp),
		Example: exampleText(`
  turnwise design --freq 145MHz --cap 22pF --leads 5mm --max-length 15mm
  turnwise design --inductance 4.7uH --freq 7MHz --leads 15mm --support former --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			if err := mutuallyExclusive(cmd, "inductance", "cap"); err != nil {
				return err
			}
			if err := mutuallyExclusive(cmd, "mandrel", "former"); err != nil {
				return err
			}
			return runDesign(cmd.Context(), opts, cmd.Flags().Changed("min-srf-ratio"), cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	opts.addFlags(cmd.Flags())
	return cmd
}

// searchOptions turns the flags into the glue's options.
func (o *designOptions) searchOptions(srfGiven bool) (*designSearchOptions, []string, error) {
	var notes []string
	so := &designSearchOptions{
		Inductance:    o.inductance.v,
		Capacitance:   o.capacitance.v,
		Stray:         o.stray.v,
		Freq:          o.freq.v,
		Tolerance:     o.tolerance.v,
		Leads:         o.leads.v,
		Temp:          o.temp.v,
		Support:       o.support.v,
		Mandrel:       o.mandrel,
		Former:        o.former,
		Wires:         o.wires,
		Insulation:    o.insulation,
		Conductor:     o.conductor,
		MaxLength:     o.maxLength.v,
		MaxDiameter:   o.maxDiameter.v,
		MaxWireLength: o.maxWireLength.v,
		MinWire:       o.minWire.v,
		MaxWire:       o.maxWire.v,
		TrimMargin:    o.trimMargin.v,
		Prefer:        o.prefer.v,
		Top:           o.top,
		FreeDiameter:  o.freeDiameter,
	}
	switch {
	case o.top < 1 || o.top > design.MaxTop:
		return nil, nil, usageErrorf("--top %d: give a number from 1 to %d", o.top, design.MaxTop)
	case o.tolerance.set && !(o.tolerance.v > 0):
		return nil, nil, usageErrorf("--tolerance %s: give a positive percentage, e.g. 2%%", o.tolerance.raw)
	case o.trimMargin.set && !(o.trimMargin.v > 0):
		return nil, nil, usageErrorf("--trim-margin %s: give a positive percentage, e.g. 5%%", o.trimMargin.raw)
	case math.IsNaN(o.minSRFRatio) || math.IsInf(o.minSRFRatio, 0) || srfGiven && o.minSRFRatio == 0:
		return nil, nil, usageErrorf("--min-srf-ratio %g: give a ratio from 1.2 to 100, such as 3 (common practice)", o.minSRFRatio)
	}
	if srfGiven {
		so.MinSRFRatio = o.minSRFRatio
	}
	if o.springback.set {
		v := o.springback.v
		so.Springback = &v
	}
	if !o.leads.set {
		so.Leads = defaultDesignLeads
		notes = append(notes, "--leads not given: 10 mm each assumed; at VHF leads are often 10–20 % of the inductance, so give the real length")
	}
	return so, notes, nil
}

func runDesign(_ context.Context, opts *designOptions, srfGiven bool, stdout, stderr io.Writer) error {
	so, notes, err := opts.searchOptions(srfGiven)
	if err != nil {
		return err
	}
	cat, err := opts.stock.load()
	if err != nil {
		return err
	}
	res, err := runDesignSearch(cat, so)
	if err != nil {
		return err
	}
	warnings := append(notes, res.Warnings...)
	if opts.json {
		return writeDesignJSON(stdout, cat, so, res, warnings)
	}
	if err := writeDesignTable(stdout, cat, so, res, newLengthFormatter(opts.units.v)); err != nil {
		return err
	}
	for _, w := range warnings {
		fmt.Fprintf(stderr, "warning: %s\n", w)
	}
	return nil
}

// designSpec is the coilSpec of a candidate, its wire described by the
// row the search took it from.
func designSpec(rows map[string]forms.Wire, c design.Candidate) coilSpec {
	kind := coil.SupportMandrel
	if c.Support.OnFormer {
		kind = coil.SupportFormer
	}
	w, ok := rows[c.Wire.Name]
	if !ok {
		overall := c.Wire.Overall
		if overall == 0 {
			overall = c.Wire.Diameter
		}
		w = forms.Wire{Name: c.Wire.Name, System: "user", Bare: c.Wire.Diameter, Overall: overall,
			Insulation: "custom", Conductor: c.Wire.Conductor.String(), Origin: "design"}
	}
	src := c.SpringbackSource
	if src == coil.SpringbackOnFormer {
		src = coil.SpringbackNone
	}
	return coilSpec{
		Geometry: c.Prediction.Geometry, Wire: w, SupportKind: kind, SupportName: c.Support.Name,
		SpringbackSource: src, SpringbackNote: c.Support.SpringbackNote, PitchSource: coil.PitchGiven,
	}
}

// wireRows indexes the search's wire rows by name.
func wireRows(cat *forms.Catalog, so *designSearchOptions) map[string]forms.Wire {
	rows, _ := designWireRows(cat, so) // the search already accepted them
	m := make(map[string]forms.Wire, len(rows))
	for _, w := range rows {
		if _, dup := m[w.Name]; !dup {
			m[w.Name] = w
		}
	}
	return m
}

// designCandidateRecord is one candidate in JSON: the predict keys plus the
// search's own.
type designCandidateRecord struct {
	Rank int `json:"rank"`
	coilRecord
	Matched          float64 `json:"matched_inductance"` // what was compared with the target
	Score            float64 `json:"score"`
	Why              string  `json:"why"`
	TrimMin          float64 `json:"trim_min"` // terminal L at the loosest sensible pitch
	TrimMax          float64 `json:"trim_max"` // terminal L close-wound
	TuneLow          float64 `json:"tune_low,omitempty"`
	TuneHigh         float64 `json:"tune_high,omitempty"`
	SpringbackOrigin string  `json:"springback_note,omitempty"`
	FreeDiameter     bool    `json:"free_diameter,omitempty"`
}

func newDesignCandidateRecord(rows map[string]forms.Wire, rank int, c design.Candidate) designCandidateRecord {
	spec := designSpec(rows, c)
	rec := newCoilRecord(spec, c.Prediction)
	rec.TrimLengthPerPercent = float64(c.TrimLengthPerPercent)
	return designCandidateRecord{
		Rank: rank, coilRecord: rec, Matched: float64(c.Matched), Score: c.Score, Why: c.Why,
		TrimMin: float64(c.TrimMin), TrimMax: float64(c.TrimMax),
		TuneLow: float64(c.TuneLow), TuneHigh: float64(c.TuneHigh),
		SpringbackOrigin: c.Support.SpringbackNote, FreeDiameter: c.Free,
	}
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

func writeDesignJSON(w io.Writer, cat *forms.Catalog, so *designSearchOptions, res design.Result, warnings []string) error {
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
		Candidates []designCandidateRecord `json:"candidates"`
		Pareto     []designCandidateRecord `json:"pareto"`
		Search     designSearchRecord      `json:"search"`
		Warnings   []string                `json:"warnings"`
	}{Schema: schemaVersion, Target: t, Candidates: []designCandidateRecord{}, Pareto: []designCandidateRecord{}, Warnings: warnings}
	if doc.Warnings == nil {
		doc.Warnings = []string{}
	}
	rows := wireRows(cat, so)
	for i, c := range res.Candidates {
		doc.Candidates = append(doc.Candidates, newDesignCandidateRecord(rows, i+1, c))
	}
	for i, c := range res.Pareto {
		doc.Pareto = append(doc.Pareto, newDesignCandidateRecord(rows, i+1, c))
	}
	doc.Search = designSearchRecord{res.Stats.Pairs, res.Stats.Searched, res.Stats.Coils, res.Stats.Evaluations}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(doc)
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

// writeDesignTable prints the target, the candidates (five lines each: what
// to wind, the build numbers, what it will measure, how to trim it, why)
// and the Pareto list.
func writeDesignTable(w io.Writer, cat *forms.Catalog, so *designSearchOptions, res design.Result, lf lengthFormatter) error {
	f := float64(res.Frequency)
	tol := fmt.Sprintf("± %.3g %%", res.Tolerance*100)
	leads := "2 × " + lf.fmt(float64(so.Leads)) + " leads"
	if res.Effective {
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
		limits = append(limits, "outside length ≤ "+lf.fmt(float64(so.MaxLength)))
	}
	if so.MaxDiameter > 0 {
		limits = append(limits, "outside diameter ≤ "+lf.fmt(float64(so.MaxDiameter)))
	}
	if so.MaxWireLength > 0 {
		limits = append(limits, "wire ≤ "+lf.fmt(float64(so.MaxWireLength)))
	}
	if f > 0 {
		limits = append(limits, fmt.Sprintf("SRF ≥ %g × f", orDefault(so.MinSRFRatio, design.DefaultSRFRatio)))
	}
	limits = append(limits, fmt.Sprintf("target inside the trim window by %.3g %%", orDefault(so.TrimMargin, design.DefaultTrimMargin)*100))
	fmt.Fprintf(w, "LIMITS  %s\n", strings.Join(limits, "; "))
	fmt.Fprintf(w, "SEARCH  %d support × wire pairs, %d opened, %d coils solved\n", res.Stats.Pairs, res.Stats.Searched, res.Stats.Coils)

	rows := wireRows(cat, so)
	for i, c := range res.Candidates {
		fmt.Fprintln(w)
		writeDesignCandidate(w, rows, i+1, c, res, lf)
	}
	if len(res.Pareto) > 0 {
		fmt.Fprintln(w)
		fmt.Fprintln(w, "Q VERSUS SIZE (Pareto: no coil found is both smaller and of higher Q)")
		for _, c := range thinForTable(res.Pareto, 8) {
			p := c.Prediction
			g := p.Geometry
			fmt.Fprintf(w, "  Q %4.0f  %s long × %s across  %s turns of %s on %s\n", p.Q,
				lf.fmt(float64(p.WindingLength)), lf.fmt(float64(p.OutsideDiameter)), quantity.FormatTurns(g.Turns), c.Wire.Name, c.Support.Name)
		}
	}
	fmt.Fprintln(w)
	fmt.Fprintln(w, "Strip enamel only at the joints (flame, solder pot and strippers burn and give off fumes). Tank and coupler")
	fmt.Fprintln(w, "coils in a transmitter carry high RF voltage and current: follow local regulations and licensed practice.")
	return nil
}

func writeDesignCandidate(w io.Writer, rows map[string]forms.Wire, rank int, c design.Candidate, res design.Result, lf lengthFormatter) {
	spec := designSpec(rows, c)
	p := c.Prediction
	g := p.Geometry
	how := "slide off: self-supporting"
	if c.Support.OnFormer {
		how = "stays on the former"
	}
	fmt.Fprintf(w, "#%d  %s turns of %s on %s (%s)\n", rank, quantity.FormatTurns(g.Turns), describeWire(spec, lf), c.Support.Name, how)
	overall := float64(g.OverallDiameter())
	build := fmt.Sprintf("pitch %s (%.2f × wire), outside length %s, bore %s, outside %s, wire to cut %s",
		lf.fmt(float64(g.Pitch)), float64(g.Pitch)/overall, lf.fmt(float64(p.WindingLength)),
		lf.fmt(float64(p.InsideDiameter)), lf.fmt(float64(p.OutsideDiameter)), lf.FormatCut(float64(p.WireLength)))
	switch c.SpringbackSource {
	case coil.SpringbackCalibration:
		build += fmt.Sprintf("; springback %s from your calibration (%s)", quantity.FormatPercent(g.Springback), c.Support.SpringbackNote)
	case coil.SpringbackGiven:
		build += fmt.Sprintf("; springback %s (given)", quantity.FormatPercent(g.Springback))
	case coil.SpringbackNone:
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
		trim += fmt.Sprintf("; %s of length per 1 %% of L", lf.fmt(float64(c.TrimLengthPerPercent)))
	}
	fmt.Fprintf(w, "    %s\n", trim)
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
