package report

import (
	"fmt"
	"io"
	"math"
	"strings"
	"text/tabwriter"

	"turnwise/coil/match"
	"turnwise/internal/quantity"
)

// MatchRequest is what the match writers print besides the result: the
// circuit file, its title, a label per frequency (a band name or ""),
// and the tap ranking when --choose-tap ran.
type MatchRequest struct {
	Circuit string
	Title   string
	Labels  []string // per frequency, may be shorter
	TapCoil string
	Taps    []match.TapCoverage
}

func (r MatchRequest) label(i int) string {
	if i < len(r.Labels) {
		return r.Labels[i]
	}
	return ""
}

// matchStressRecord is one part's stress in JSON.
type matchStressRecord struct {
	VPeak       float64 `json:"v_peak"`
	VRMS        float64 `json:"v_rms"`
	IRMS        float64 `json:"i_rms"`
	Dissipation float64 `json:"dissipation"`
}

type matchPointRecord struct {
	LoadR      float64                      `json:"load_r"`
	LoadX      float64                      `json:"load_x"`
	Matched    bool                         `json:"matched"`
	SWR        float64                      `json:"swr"`
	Settings   map[string]float64           `json:"settings"`
	Efficiency *float64                     `json:"efficiency"`
	Losses     map[string]float64           `json:"losses,omitempty"`
	Stress     map[string]matchStressRecord `json:"stress,omitempty"`
}

type matchWhereRecord struct {
	Frequency float64 `json:"frequency"`
	LoadR     float64 `json:"load_r"`
	LoadX     float64 `json:"load_x"`
}

type matchWorstRecord struct {
	Part          string           `json:"part"`
	VPeak         float64          `json:"v_peak"`
	VPeakAt       matchWhereRecord `json:"v_peak_at"`
	IRMS          float64          `json:"i_rms"`
	IRMSAt        matchWhereRecord `json:"i_rms_at"`
	Dissipation   float64          `json:"dissipation"`
	DissipationAt matchWhereRecord `json:"dissipation_at"`
	Rating        float64          `json:"rating,omitempty"`
	HeatLimit     float64          `json:"heat_limit,omitempty"`
	OverRating    bool             `json:"over_rating"`
	OverHeating   bool             `json:"over_heating"`
}

type matchFrequencyRecord struct {
	Frequency float64            `json:"frequency"`
	Band      string             `json:"band,omitempty"`
	Coverage  float64            `json:"coverage"`
	Matched   int                `json:"matched"`
	Points    []matchPointRecord `json:"points"`
	Worst     []matchWorstRecord `json:"worst,omitempty"`
}

type matchTapRecord struct {
	TapTurns     float64   `json:"tap_turns"`
	Coverage     float64   `json:"coverage"`
	PerFrequency []float64 `json:"per_frequency"`
}

type matchGridRecord struct {
	RMin float64 `json:"r_min"`
	RMax float64 `json:"r_max"`
	NR   int     `json:"r_steps"`
	XMin float64 `json:"x_min"`
	XMax float64 `json:"x_max"`
	NX   int     `json:"x_steps"`
}

func worstRecords(ws []match.Worst) []matchWorstRecord {
	at := func(w match.Where) matchWhereRecord { return matchWhereRecord{w.Frequency, w.R, w.X} }
	var out []matchWorstRecord
	for _, w := range ws {
		out = append(out, matchWorstRecord{Part: w.Part, VPeak: w.VPeak, VPeakAt: at(w.VPeakAt), IRMS: w.IRMS, IRMSAt: at(w.IRMSAt),
			Dissipation: w.Dissipation, DissipationAt: at(w.DissipationAt), Rating: w.Rating, HeatLimit: w.HeatLimit,
			OverRating: w.OverRating, OverHeating: w.OverHeating})
	}
	return out
}

// WriteMatchJSON prints the map as JSON: SI units (Ω, F, V, A, W, Hz),
// shares and efficiencies as fractions 0…1.
func WriteMatchJSON(w io.Writer, req MatchRequest, res *match.Result) error {
	doc := struct {
		Schema      int                    `json:"schema"`
		Circuit     string                 `json:"circuit"`
		Title       string                 `json:"title,omitempty"`
		SWRLimit    float64                `json:"swr_limit"`
		Power       float64                `json:"power"`
		Grid        matchGridRecord        `json:"grid"`
		Frequencies []matchFrequencyRecord `json:"frequencies"`
		Worst       []matchWorstRecord     `json:"worst,omitempty"`
		HeatRule    string                 `json:"heat_rule,omitempty"`
		TapCoil     string                 `json:"tap_coil,omitempty"`
		Taps        []matchTapRecord       `json:"taps,omitempty"`
		Cautions    []string               `json:"cautions,omitempty"`
		Warnings    []string               `json:"warnings"`
	}{
		Schema: SchemaVersion, Circuit: req.Circuit, Title: req.Title, SWRLimit: res.SWR, Power: res.Power,
		Grid:        matchGridRecord{res.Grid.RMin, res.Grid.RMax, res.Grid.NR, res.Grid.XMin, res.Grid.XMax, res.Grid.NX},
		Frequencies: []matchFrequencyRecord{}, Worst: worstRecords(res.Worst), HeatRule: res.HeatRule,
		TapCoil: req.TapCoil, Cautions: res.Cautions, Warnings: append([]string{}, res.Warnings...),
	}
	for i, fm := range res.Frequencies {
		fr := matchFrequencyRecord{Frequency: fm.Frequency, Band: req.label(i), Coverage: fm.Coverage, Matched: fm.Matched,
			Points: []matchPointRecord{}, Worst: worstRecords(fm.Worst)}
		for _, p := range fm.Points {
			pr := matchPointRecord{LoadR: p.LoadR, LoadX: p.LoadX, Matched: p.Matched, SWR: p.SWR, Settings: map[string]float64{}}
			if p.Matched {
				eff := p.Efficiency
				pr.Efficiency = &eff
				for _, s := range p.Settings {
					pr.Settings[s.Part] = s.Capacitance
				}
				pr.Losses = map[string]float64{}
				for _, l := range p.Losses {
					pr.Losses[l.Part] = l.Share
				}
				if len(p.Stress) > 0 {
					pr.Stress = map[string]matchStressRecord{}
					for _, s := range p.Stress {
						pr.Stress[s.Part] = matchStressRecord{VPeak: s.VPeak, VRMS: s.VRMS, IRMS: s.IRMS, Dissipation: s.Dissipation}
					}
				}
			}
			fr.Points = append(fr.Points, pr)
		}
		doc.Frequencies = append(doc.Frequencies, fr)
	}
	for _, t := range req.Taps {
		doc.Taps = append(doc.Taps, matchTapRecord{TapTurns: t.TapTurns, Coverage: t.Coverage, PerFrequency: t.PerFrequency})
	}
	return writeJSON(w, doc)
}

// MatchFrequencyName is how tables and plots name a frequency: "7.1 MHz"
// or "7.1 MHz (40m)".
func MatchFrequencyName(f float64, label string) string {
	s := quantity.FormatFrequency(f)
	if label != "" {
		s += " (" + label + ")"
	}
	return s
}

// MatchSummary is one line per frequency: coverage, the capacitor
// settings and efficiencies over the matched loads. The build sheet
// prints the same lines.
func MatchSummary(req MatchRequest, res *match.Result) []string {
	var out []string
	for i, fm := range res.Frequencies {
		s := fmt.Sprintf("%s: %s of the loads matched (%d of %d)", MatchFrequencyName(fm.Frequency, req.label(i)),
			quantity.FormatPercent(fm.Coverage), fm.Matched, len(fm.Points))
		if fm.Matched > 0 {
			effLo, effHi := math.Inf(1), math.Inf(-1)
			lo, hi := map[string]float64{}, map[string]float64{}
			var order []string
			for _, p := range fm.Points {
				if !p.Matched {
					continue
				}
				effLo, effHi = math.Min(effLo, p.Efficiency), math.Max(effHi, p.Efficiency)
				for _, st := range p.Settings {
					if _, ok := lo[st.Part]; !ok {
						lo[st.Part], hi[st.Part] = st.Capacitance, st.Capacitance
						order = append(order, st.Part)
					}
					lo[st.Part], hi[st.Part] = math.Min(lo[st.Part], st.Capacitance), math.Max(hi[st.Part], st.Capacitance)
				}
			}
			s += fmt.Sprintf("; efficiency %s to %s", quantity.FormatPercent(effLo), quantity.FormatPercent(effHi))
			for _, n := range order {
				s += fmt.Sprintf("; %s %s to %s", n, quantity.FormatCapacitanceShort(lo[n]), quantity.FormatCapacitanceShort(hi[n]))
			}
		}
		out = append(out, s)
	}
	return out
}

// MatchWorstRows is the stress table: one row per part, worst over the
// map at the stated power, with its limit and whether it is exceeded.
func MatchWorstRows(ws []match.Worst) [][]string {
	rows := [][]string{{"part", "V peak", "V rms", "I rms", "dissipation", "limit", ""}}
	for _, w := range ws {
		limit, flag := "", "ok"
		if w.Rating > 0 {
			limit = fmt.Sprintf("%.0f V rating", w.Rating)
			if w.OverRating {
				flag = "OVER RATING"
			}
		}
		if w.HeatLimit > 0 {
			limit = fmt.Sprintf("%.3g W heating rule", w.HeatLimit)
			if w.OverHeating {
				flag = "TOO HOT"
			}
		}
		if limit == "" {
			flag = ""
		}
		rows = append(rows, []string{w.Part, fmt.Sprintf("%.0f V", w.VPeak), fmt.Sprintf("%.0f V", w.VPeak/math.Sqrt2),
			fmt.Sprintf("%.3g A", w.IRMS), fmt.Sprintf("%.3g W", w.Dissipation), limit, flag})
	}
	return rows
}

// WriteMatchTable prints the map as text: per frequency the coverage
// line, a character map of the load rectangle and the worst stress per
// part; then the worst over every frequency, the tap ranking, the heating
// rule and the cautions.
func WriteMatchTable(w io.Writer, req MatchRequest, res *match.Result) error {
	var b strings.Builder
	if req.Title != "" {
		fmt.Fprintf(&b, "%s\n", req.Title)
	}
	g := res.Grid
	fmt.Fprintf(&b, "Match map of %s: loads R %s to %s (%d steps, logarithmic) by X %s to %s (%d steps), SWR ≤ %.3g at the port",
		req.Circuit, ohms(g.RMin), ohms(g.RMax), g.NR, ohms(g.XMin), ohms(g.XMax), g.NX, res.SWR)
	if res.Power > 0 {
		fmt.Fprintf(&b, ", stress at %.4g W", res.Power)
	}
	b.WriteString("\n")
	summary := MatchSummary(req, res)
	for i, fm := range res.Frequencies {
		fmt.Fprintf(&b, "\n%s\n", summary[i])
		writeCharMap(&b, g, fm)
		if len(fm.Worst) > 0 {
			b.WriteString("  worst stress at this frequency:\n")
			writeRows(&b, MatchWorstRows(fm.Worst), "    ")
		}
	}
	if len(res.Worst) > 0 && len(res.Frequencies) > 1 {
		fmt.Fprintf(&b, "\nWorst stress over every frequency at %.4g W:\n", res.Power)
		writeRows(&b, MatchWorstRows(res.Worst), "  ")
	}
	if len(req.Taps) > 0 {
		fmt.Fprintf(&b, "\nTap of %s by matched share (mean over the frequencies):\n", req.TapCoil)
		rows := [][]string{{"tap", "coverage", "per frequency"}}
		for _, t := range req.Taps {
			var per []string
			for _, c := range t.PerFrequency {
				per = append(per, quantity.FormatPercent(c))
			}
			rows = append(rows, []string{quantity.FormatTurns(t.TapTurns) + " turns", quantity.FormatPercent(t.Coverage), strings.Join(per, ", ")})
		}
		writeRows(&b, rows, "  ")
	}
	if res.HeatRule != "" {
		fmt.Fprintf(&b, "\nHeating rule: %s.\n", res.HeatRule)
	}
	if len(res.Cautions) > 0 {
		b.WriteString("\nCAUTION\n")
		for _, c := range res.Cautions {
			fmt.Fprintf(&b, "  - %s\n", c)
		}
	}
	_, err := io.WriteString(w, b.String())
	return err
}

func ohms(v float64) string { return fmt.Sprintf("%.4g Ω", v) }

// writeCharMap draws the load rectangle: X across, R down (low R at the
// top), '#' matched, '.' not.
func writeCharMap(b *strings.Builder, g match.Grid, fm match.FrequencyMap) {
	fmt.Fprintf(b, "  %10s  X %s … %s\n", "R \\", ohms(g.XMin), ohms(g.XMax))
	for i := range g.NR {
		fmt.Fprintf(b, "  %10s  ", ohms(g.R(i)))
		for j := range g.NX {
			if fm.Points[i*g.NX+j].Matched {
				b.WriteByte('#')
			} else {
				b.WriteByte('.')
			}
		}
		b.WriteByte('\n')
	}
}

func writeRows(b *strings.Builder, rows [][]string, indent string) {
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	for _, r := range rows {
		fmt.Fprintf(tw, "%s%s\n", indent, strings.Join(r, "\t"))
	}
	tw.Flush()
}
