package report

import (
	"fmt"
	"io"
	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/internal/quantity"
)

// Band and tapped designs: the per-candidate trimmer settings, the tap and
// its alternatives, in JSON and in the table.

type bandRecord2 struct {
	Low        float64 `json:"low"`
	High       float64 `json:"high"`
	Centre     float64 `json:"centre"`
	Fixed      float64 `json:"fixed_capacitance"`
	Stray      float64 `json:"stray"`
	TrimMin    float64 `json:"trimmer_min"`
	TrimMax    float64 `json:"trimmer_max"`
	TrimMargin float64 `json:"trimmer_margin"`
	MinQ       float64 `json:"min_q,omitempty"`
	WindowLow  float64 `json:"effective_inductance_min"`
	WindowHigh float64 `json:"effective_inductance_max"`
}

func newBandRecord(b *design.BandInfo) *bandRecord2 {
	if b == nil {
		return nil
	}
	t := b.Target
	return &bandRecord2{float64(t.Low), float64(t.High), float64(b.Centre), float64(t.Fixed), float64(t.Stray), float64(t.TrimMin), float64(t.TrimMax),
		t.TrimMargin, t.MinQ, float64(b.WindowLow), float64(b.WindowHigh)}
}

type bandEdgesRecord struct {
	Low  float64 `json:"low"`
	High float64 `json:"high"`
}

type tapChoiceRec struct {
	TapTurns  float64 `json:"tap_turns"`
	Ratio     float64 `json:"impedance_ratio"`
	Error     float64 `json:"error"`
	LoadedQ   float64 `json:"loaded_q,omitempty"`
	Bandwidth float64 `json:"bandwidth,omitempty"`
}

type linkRec struct {
	Turns     float64 `json:"turns"`
	Diameter  float64 `json:"diameter"`
	M         float64 `json:"mutual_inductance"`
	L         float64 `json:"inductance"`
	K         float64 `json:"k"`
	Offset    float64 `json:"offset"`
	Reflected float64 `json:"reflected_resistance"`
	LoadedQ   float64 `json:"loaded_q"`
	Bandwidth float64 `json:"bandwidth"`
	SeriesCap float64 `json:"series_capacitor,omitempty"`
}

type dividerRec struct {
	Tank  float64 `json:"tank_capacitance"`
	C1    float64 `json:"c_top"`
	C2    float64 `json:"c_bottom"`
	Ratio float64 `json:"voltage_ratio"`
	QC2   float64 `json:"q_c_bottom,omitempty"`
}

// LoadPlanRecord is a tap plan for a load in JSON (design and tap).
type LoadPlanRecord struct {
	WantRatio   float64        `json:"impedance_ratio_wanted"`
	Tolerance   float64        `json:"ratio_tolerance"`
	Within      bool           `json:"within_tolerance"`
	Reactance   float64        `json:"reactance,omitempty"`
	TankQ       float64        `json:"tank_q,omitempty"`
	TankR       float64        `json:"tank_impedance,omitempty"`
	WantLoadedQ float64        `json:"loaded_q_wanted,omitempty"`
	Taps        []tapChoiceRec `json:"taps"`
	Link        *linkRec       `json:"link,omitempty"`
	Divider     *dividerRec    `json:"capacitive_divider,omitempty"`
}

// NewLoadPlanRecord turns a plan into its JSON record.
func NewLoadPlanRecord(p coil.LoadPlan) *LoadPlanRecord {
	r := &LoadPlanRecord{WantRatio: p.WantRatio, Tolerance: coil.TapRatioTolerance, Within: p.Within, Reactance: float64(p.X), TankQ: p.TankQ,
		TankR: float64(p.TankR), WantLoadedQ: p.WantLoadedQ, Taps: []tapChoiceRec{}}
	for _, t := range p.Taps {
		r.Taps = append(r.Taps, tapChoiceRec{t.TapTurns, t.Achieved, t.Error, t.LoadedQ, float64(t.Bandwidth)})
	}
	if l := p.Link; l != nil {
		r.Link = &linkRec{l.Turns, float64(l.Diameter), float64(l.M), float64(l.L), l.K, float64(l.Offset), float64(l.Reflected), l.LoadedQ, float64(l.Bandwidth), float64(l.SeriesCap)}
	}
	if d := p.Divider; d != nil {
		r.Divider = &dividerRec{float64(d.Tank), float64(d.C1), float64(d.C2), d.Ratio, d.QC2}
	}
	return r
}

// WriteLoadPlanLines prints a tap plan, each line indented by indent.
func WriteLoadPlanLines(w io.Writer, p coil.LoadPlan, indent string, lf quantity.LengthFormat) {
	if p.TankQ > 0 {
		fmt.Fprintf(w, "%stank: X %s, unloaded Q %.0f (R_p %s); wanted loaded Q %.0f: impedance ratio %.4g (1:%.0f) by the rule Q_L = (R_p ∥ R_s/n²)/X\n",
			indent, quantity.FormatEng(float64(p.X), "Ω", 3), p.TankQ, quantity.FormatEng(float64(p.TankR), "Ω", 3), p.WantLoadedQ, p.WantRatio, 1/p.WantRatio)
	} else {
		fmt.Fprintf(w, "%simpedance ratio wanted %.4g (1:%.0f)\n", indent, p.WantRatio, 1/p.WantRatio)
	}
	for i, t := range p.Taps {
		mark := "nearest"
		if i > 0 {
			mark = "next"
		}
		q := ""
		if t.LoadedQ > 0 {
			q = fmt.Sprintf(", loaded Q %.0f, bandwidth %s", t.LoadedQ, quantity.FormatEng(float64(t.Bandwidth), "Hz", 3))
		}
		fmt.Fprintf(w, "%stap %s: %s from the cold end gives ratio %.4g (%+.0f %%)%s\n", indent, mark, quantity.FormatTurnsWord(t.TapTurns), t.Achieved, t.Error*100, q)
	}
	if p.Within {
		fmt.Fprintf(w, "%s  the nearest tap is within ±%.0f %% of the ratio: use it\n", indent, coil.TapRatioTolerance*100)
		return
	}
	fmt.Fprintf(w, "%s  no quarter-turn tap is within ±%.0f %% of the ratio; instead:\n", indent, coil.TapRatioTolerance*100)
	if l := p.Link; l != nil {
		where := "close-wound over the cold end"
		if l.Offset > 0 {
			where = fmt.Sprintf("%s beyond the cold end's turn, along the axis", lf.Format(float64(l.Offset)))
		}
		turns := fmt.Sprintf("%g turns", l.Turns)
		if l.Turns == 1 {
			turns = "1 turn"
		}
		s := fmt.Sprintf("%s  link: %s of insulated wire %s (%s across), M %s, k %.3f: loaded Q %.0f, bandwidth %s",
			indent, turns, where, lf.Format(float64(l.Diameter)), quantity.FormatEng(float64(l.M), "H", 3), l.K, l.LoadedQ, quantity.FormatEng(float64(l.Bandwidth), "Hz", 3))
		if l.SeriesCap > 0 {
			s += fmt.Sprintf("; put %s in series with the link to tune out its reactance", quantity.FormatCapacitance(float64(l.SeriesCap)))
		}
		fmt.Fprintln(w, s)
	}
	if d := p.Divider; d != nil {
		s := fmt.Sprintf("%s  capacitive divider: replace the tank's %s by %s (top to tap node) in series with %s (tap node to ground), source across the %s",
			indent, quantity.FormatCapacitance(float64(d.Tank)), quantity.FormatCapacitance(float64(d.C1)), quantity.FormatCapacitance(float64(d.C2)), quantity.FormatCapacitance(float64(d.C2)))
		if d.QC2 > 0 && d.QC2 < 5 {
			s += fmt.Sprintf(" (ωC₂R_s is only %.1f: the divider transforms less than the rule says; check on the bench)", d.QC2)
		}
		fmt.Fprintln(w, s)
	}
}

// writeBandTapLines prints a candidate's trimmer settings and tap. The two
// settings keep three figures each ("6.10 pF", "5.46 pF") so they read alike.
func writeBandTapLines(w io.Writer, c design.Candidate, res design.Result, lf quantity.LengthFormat) {
	if b := c.Band; b != nil && res.Band != nil {
		t := res.Band.Target
		fmt.Fprintf(w, "    trimmer: %s at %s, %s at %s (range %s–%s; %.0f %% and %.0f %% of its swing left at the ends)\n",
			quantity.FormatEng(float64(b.TrimmerLow), "F", 3), quantity.FormatFrequency(float64(t.Low)),
			quantity.FormatEng(float64(b.TrimmerHigh), "F", 3), quantity.FormatFrequency(float64(t.High)),
			quantity.FormatCapacitance(float64(t.TrimMin)), quantity.FormatCapacitance(float64(t.TrimMax)), b.MarginLow*100, b.MarginHigh*100)
	}
	if tp := c.Tapped; tp != nil {
		WriteLoadPlanLines(w, tp.Plan, "    ", lf)
	}
}

// writeBandTarget prints the TARGET line of a band design.
func writeBandTarget(w io.Writer, b *design.BandInfo, leads string) {
	t := b.Target
	c := quantity.FormatCapacitance(float64(t.Fixed))
	if t.Stray > 0 {
		c += " + " + quantity.FormatCapacitance(float64(t.Stray)) + " stray"
	}
	q := ""
	if t.MinQ > 0 {
		q = fmt.Sprintf("; Q ≥ %.0f at %s", t.MinQ, quantity.FormatFrequency(float64(b.Centre)))
	}
	fmt.Fprintf(w, "TARGET  tune %s–%s with %s and a %s–%s trimmer, %.0f %% of its swing free at each end: %s … %s effective, %s included%s\n",
		quantity.FormatFrequency(float64(t.Low)), quantity.FormatFrequency(float64(t.High)), c,
		quantity.FormatCapacitance(float64(t.TrimMin)), quantity.FormatCapacitance(float64(t.TrimMax)), t.TrimMargin*100,
		quantity.FormatEng(float64(b.WindowLow), "H", 3), quantity.FormatEng(float64(b.WindowHigh), "H", 3), leads, q)
}
