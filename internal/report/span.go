package report

import (
	"fmt"
	"io"
	"math"
	"strings"
	"text/tabwriter"
	"turnwise/coil"
	"turnwise/coil/tuning"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"

	"gonum.org/v1/gonum/unit"
)

// dialPct prints a dial setting as a builder reads the scale.
func dialPct(x float64) string { return fmt.Sprintf("%.1f %%", x*100) }

func hz(f unit.Frequency) string { return quantity.FormatEng(float64(f), "Hz", 4) }

func WriteSpanTable(w io.Writer, s spec.Spec, set spec.SpanSettings, out spec.SpanOutcome, lf quantity.LengthFormat, chart bool) error {
	sp := out.Span
	sec := sp.Sections
	g := out.Geometry
	a, b, err := spec.GangFromSettings(set)
	if err != nil {
		return err
	}
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(label, value string) { fmt.Fprintf(tw, "  %s\t%s\n", label, value) }

	fmt.Fprintf(tw, "%s of %s on %s, pitch %s, tapped %s from the cold end\n\n",
		quantity.FormatTurnsWord(g.Turns), spec.DescribeWire(s, lf), s.SupportName, lf.Format(float64(g.Pitch)), quantity.FormatTurnsWord(sec.TapTurns))

	if out.CoilPlan != nil {
		writeCoilChoice(tw, out.CoilPlan, lf)
	} else if p := out.Plan; p != nil {
		fmt.Fprintln(tw, "TAP CHOICE")
		verdict := "meets every requirement"
		if !p.Feasible {
			verdict = "no tap meets every requirement: this is the best compromise"
		}
		row("chosen tap", fmt.Sprintf("%s from the cold end (%s)", quantity.FormatTurnsWord(p.TapTurns), verdict))
		if set.VaryPitch {
			row("chosen pitch", fmt.Sprintf("%s, outside length %s (you asked for %s)", lf.Format(float64(p.Geometry.Pitch)), lf.Format(float64(p.Geometry.WindingLength())), lf.Format(float64(s.Geometry.Pitch))))
		}
		tried := "candidates tried"
		if set.VaryPitch {
			tried = "taps tried at your pitch"
		}
		row(tried, fmt.Sprintf("%d: %d cover every band, %d overlap, %d keep harmonics out, %d cover and overlap",
			p.Tried, p.Covering, p.Overlapping, p.Clean, p.CoveringOverlapping))
		if p.Clearance >= tuning.ClearanceNone {
			row("harmonic clearance", "no listed band lies on the low range's dial where a harmonic could reach the high range")
		} else {
			row("harmonic clearance", fmt.Sprintf("closest harmonic %.1f half-passbands from the high range's peak (above 1 is outside the passband)", p.Clearance))
		}
		for _, c := range p.Conflicts {
			row("conflict", c)
		}
		fmt.Fprintln(tw)
	}

	fmt.Fprintln(tw, "CIRCUIT")
	row("section A", spec.DescribeGang(a)+", "+spec.DescribeLaw(a)+": top of the coil to ground")
	row("section B", spec.DescribeGang(b)+", "+spec.DescribeLaw(b)+": tap to ground")
	row("coil self-capacitance", quantity.FormatCapacitance(float64(sp.SelfCapacitance))+" across the whole coil (equivalent: resonates the coil at its SRF, helical-line model)")
	fmt.Fprintln(tw, "\nTAP")
	row("where", fmt.Sprintf("%s up from the cold (grounded) end, %s along the coil from where the winding starts",
		quantity.FormatTurnsWord(sec.TapTurns), lf.Format(float64(sec.TapPosition))))
	at := "low frequency"
	if sec.Frequency > 0 {
		at = hz(sec.Frequency)
	}
	row("L whole coil", quantity.FormatEng(float64(sec.L), "H", 3)+" at "+at+", leads included")
	row("L below / above the tap", quantity.FormatEng(float64(sec.LB), "H", 3)+" / "+quantity.FormatEng(float64(sec.LA), "H", 3)+" (cold lead below, hot lead above)")
	row("mutual M, coupling k", fmt.Sprintf("%s, %.3f", quantity.FormatEng(float64(sec.M), "H", 3), sec.K))
	row("voltage at the tap", fmt.Sprintf("%.3f of the voltage across the coil (unloaded)", sec.Ratio))

	fmt.Fprintln(tw, "\nDIAL (0 % = plates fully open, 100 % = fully meshed)")
	fmt.Fprintln(tw, "  DIAL\tSECTION A\tSECTION B\tLOW RANGE\tHIGH RANGE")
	for _, r := range sp.Dial {
		high := "none"
		if r.FHigh > 0 {
			high = hz(r.FHigh)
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\t%s\n", dialPct(r.Setting), quantity.FormatCapacitance(float64(r.CA)), quantity.FormatCapacitance(float64(r.CB)), hz(r.FLow), high)
	}

	fmt.Fprintln(tw, "\nRANGES")
	row("low range", hz(sp.Low.Min)+" to "+hz(sp.Low.Max))
	if sp.HasHigh {
		row("high range", hz(sp.High.Min)+" to "+hz(sp.High.Max))
		switch {
		case sp.Overlap >= 0:
			row("overlap", fmt.Sprintf("%s to %s (%s, %.1f %%): everything from %s to %s tunes on one range or the other",
				hz(sp.High.Min), hz(sp.Low.Max), hz(sp.Overlap), sp.OverlapFraction()*100, hz(sp.Low.Min), hz(sp.High.Max)))
		default:
			row("gap", fmt.Sprintf("%s to %s (%s) is on neither range: %s",
				hz(sp.Low.Max), hz(sp.High.Min), hz(-sp.Overlap), sp.GapAdvice()))
		}
	} else {
		row("high range", "none: the circuit has one resonance")
	}

	if len(sp.Bands) > 0 {
		fmt.Fprintf(tw, "\nBANDS (%.0f %% margin at a range's end)\n", sp.Margin*100)
		for _, bc := range sp.Bands {
			name := bandName(bc.Band)
			if len(bc.Ranges) == 0 {
				row(name, "on neither range")
				continue
			}
			var parts []string
			for _, on := range bc.Ranges {
				p := fmt.Sprintf("%s range, dial %s (%s) to %s (%s)", on.Range, dialPct(on.SettingAtHigh), hz(bc.Band.High), dialPct(on.SettingAtLow), hz(bc.Band.Low))
				switch {
				case !on.Whole:
					p = fmt.Sprintf("%s range reaches only %.0f %% of it, dial %s to %s", on.Range, on.Fraction*100, dialPct(on.SettingAtHigh), dialPct(on.SettingAtLow))
				case on.TightAtEnd(sp.Margin):
					p += fmt.Sprintf(", only %.1f %% from the range's end", on.Margin*100)
				}
				parts = append(parts, p)
			}
			row(name, strings.Join(parts, "; "))
		}
	}

	orders := fmt.Sprintf("2nd to %s", tuning.Ordinal(sp.MaxHarmonic))
	fmt.Fprintf(tw, "\nHARMONIC COINCIDENCES (%s harmonic of the low range)\n", orders)
	switch {
	case !sp.HasHigh:
		row("none", "there is no high range")
	case len(sp.Coincidences) == 0 && len(sp.Bands) > 0:
		row("none", fmt.Sprintf("where the low range is in a listed band, no %s harmonic falls inside the high range's passband", orders))
	case len(sp.Coincidences) == 0:
		row("none", fmt.Sprintf("nowhere on the dial does a %s harmonic fall inside the high range's passband", orders))
	}
	for _, c := range sp.Coincidences {
		span := "at " + dialPct(c.Setting)
		if c.Stretch() {
			span = fmt.Sprintf("%s to %s, closest at %s", dialPct(c.SettingFrom), dialPct(c.SettingTo), dialPct(c.Setting))
		}
		where := ""
		if c.Band != "" {
			where = " in " + c.Band
		}
		inside := fmt.Sprintf("is %s from the high range's peak %s, inside the %s passband (Q %.0f), %.1f dB down",
			hz(unit.Frequency(math.Abs(float64(c.Offset)))), hz(c.FHigh), hz(c.Passband), c.LoadedQ, c.AttenuationDB)
		if c.OnPeak() {
			inside = fmt.Sprintf("is on the high range's peak, in the middle of its %s passband (Q %.0f)", hz(c.Passband), c.LoadedQ)
		}
		row("dial "+span, fmt.Sprintf("low range at %s%s: its %s harmonic %s %s; strong signals near %s get through",
			hz(c.FLow), where, tuning.Ordinal(c.Order), hz(c.Harmonic), inside, hz(c.FHigh)))
	}
	for _, tr := range sp.Tracking {
		row(fmt.Sprintf("dial %s to %s", dialPct(tr.SettingFrom), dialPct(tr.SettingTo)),
			fmt.Sprintf("the high range is %.3g–%.3g× the low range, within %.0f %% of %d: the %s harmonic follows it along the whole stretch",
				tr.RatioMin, tr.RatioMax, tuning.TrackingTolerance*100, tr.Order, tuning.Ordinal(tr.Order)))
	}
	row("passband rule", tuning.PassbandRule(set.LoadedQ))
	if err := tw.Flush(); err != nil {
		return err
	}
	if out.Drift != nil {
		if err := writeSpanDrift(w, out.Drift); err != nil {
			return err
		}
	}
	if chart {
		fmt.Fprintln(w)
		return writeSpanChart(w, sp)
	}
	return nil
}

func bandName(b tuning.Band) string {
	r := fmt.Sprintf("%s–%s", strings.TrimSuffix(quantity.FormatEng(float64(b.Low), "Hz", 4), " MHz"), hz(b.High))
	if b.Low < 1e6 || b.High < 1e6 {
		r = hz(b.Low) + "–" + hz(b.High)
	}
	if b.Name != "" {
		return b.Name + " " + r
	}
	return r
}

// spanRecord is the JSON document of `turnwise span`.
type spanRecord struct {
	Schema          int               `json:"schema"`
	Coil            CoilRecord        `json:"coil"`
	TapTurns        float64           `json:"tap_turns"`
	TapPosition     float64           `json:"tap_position"`
	Sections        sectionsRecord    `json:"sections"`
	SelfCapacitance float64           `json:"self_capacitance"`
	GangA           gangRecord        `json:"gang_a"`
	GangB           gangRecord        `json:"gang_b"`
	Dial            []dialRecord      `json:"dial"`
	LowRange        rangeRecord       `json:"low_range"`
	HighRange       *rangeRecord      `json:"high_range"`
	Overlap         float64           `json:"overlap"`
	Margin          float64           `json:"margin"`
	Bands           []bandRecord      `json:"bands"`
	Coincidences    []coincidenceRec  `json:"coincidences"`
	MaxHarmonic     int               `json:"max_harmonic"`
	Tracking        []trackingRec     `json:"tracking"`
	PassbandRule    string            `json:"passband_rule"`
	ChooseTap       *chooseTapRecord  `json:"choose_tap,omitempty"`
	ChooseCoil      *chooseCoilRecord `json:"choose_coil,omitempty"`
	Drift           *spanDriftRecord  `json:"drift,omitempty"`
	Warnings        []string          `json:"warnings"`
	DialConvention  string            `json:"dial_convention"`
}

type sectionsRecord struct {
	L           float64 `json:"l"`
	LA          float64 `json:"l_a"`
	LB          float64 `json:"l_b"`
	M           float64 `json:"m"`
	K           float64 `json:"k"`
	Ratio       float64 `json:"ratio"`
	TapTurns    float64 `json:"tap_turns"`
	TapPosition float64 `json:"tap_position"`
	Frequency   float64 `json:"frequency"`
}

func newSectionsRecord(s coil.Sections) sectionsRecord {
	return sectionsRecord{L: float64(s.L), LA: float64(s.LA), LB: float64(s.LB), M: float64(s.M), K: s.K, Ratio: s.Ratio,
		TapTurns: s.TapTurns, TapPosition: float64(s.TapPosition), Frequency: float64(s.Frequency)}
}

type gangRecord struct {
	Min     float64 `json:"min"`
	Max     float64 `json:"max"`
	Law     string  `json:"law"`
	Trimmer float64 `json:"trimmer"`
	Stray   float64 `json:"stray"`
}

type dialRecord struct {
	Setting float64 `json:"setting"`
	CA      float64 `json:"c_a"`
	CB      float64 `json:"c_b"`
	CTop    float64 `json:"c_top"`
	CTap    float64 `json:"c_tap"`
	FLow    float64 `json:"f_low"`
	FHigh   float64 `json:"f_high"`
}

type rangeRecord struct {
	Min float64 `json:"min"`
	Max float64 `json:"max"`
}

type bandRecord struct {
	Name    string        `json:"name"`
	Low     float64       `json:"low"`
	High    float64       `json:"high"`
	Covered bool          `json:"covered"`
	Range   string        `json:"range"` // "low", "high", "both", "part" or "none"
	Ranges  []bandOnRange `json:"ranges"`
}

type bandOnRange struct {
	Range         string  `json:"range"`
	SettingAtLow  float64 `json:"setting_at_low"`
	SettingAtHigh float64 `json:"setting_at_high"`
	Whole         bool    `json:"whole"`
	Margin        float64 `json:"margin"`
	Fraction      float64 `json:"fraction"`
}

type coincidenceRec struct {
	Setting       float64 `json:"setting"`
	Order         int     `json:"order"`
	FLow          float64 `json:"f_low"`
	FHigh         float64 `json:"f_high"`
	Offset        float64 `json:"offset"`
	Harmonic      float64 `json:"harmonic"`
	Passband      float64 `json:"passband"`
	LoadedQ       float64 `json:"loaded_q"`
	Depth         float64 `json:"depth"`
	AttenuationDB float64 `json:"attenuation_db"`
	SettingFrom   float64 `json:"setting_from"`
	SettingTo     float64 `json:"setting_to"`
	Band          string  `json:"band"`
}

// trackingRec is a dial stretch where the high range stays near an
// integer multiple of the low range.
type trackingRec struct {
	Order       int     `json:"order"`
	SettingFrom float64 `json:"setting_from"`
	SettingTo   float64 `json:"setting_to"`
	RatioMin    float64 `json:"ratio_min"`
	RatioMax    float64 `json:"ratio_max"`
	Deviation   float64 `json:"deviation"`
}

type chooseTapRecord struct {
	Feasible            bool     `json:"feasible"`
	TapTurns            float64  `json:"tap_turns"`
	Pitch               float64  `json:"pitch"`
	Clearance           float64  `json:"clearance"`
	Conflicts           []string `json:"conflicts"`
	Tried               int      `json:"tried"`
	Covering            int      `json:"covering"`
	Overlapping         int      `json:"overlapping"`
	Clean               int      `json:"clean"`
	CoveringOverlapping int      `json:"covering_overlapping"`
}

func gangRec(g tuning.GangSection) gangRecord {
	return gangRecord{Min: float64(g.Min), Max: float64(g.Max), Law: g.Law.String(), Trimmer: float64(g.Trimmer), Stray: float64(g.Stray)}
}

func newSpanRecord(s spec.Spec, set spec.SpanSettings, out spec.SpanOutcome) (spanRecord, error) {
	sp := out.Span
	a, b, err := spec.GangFromSettings(set)
	if err != nil {
		return spanRecord{}, err
	}
	var p coil.Prediction
	p, err = coil.Predict(out.Geometry, sp.Sections.Frequency)
	if err != nil {
		return spanRecord{}, err
	}
	s.Geometry = out.Geometry
	rec := spanRecord{
		Schema:          SchemaVersion,
		Coil:            NewCoilRecord(s, p),
		TapTurns:        sp.Sections.TapTurns,
		TapPosition:     float64(sp.Sections.TapPosition),
		Sections:        newSectionsRecord(sp.Sections),
		SelfCapacitance: float64(sp.SelfCapacitance),
		GangA:           gangRec(a),
		GangB:           gangRec(b),
		LowRange:        rangeRecord{float64(sp.Low.Min), float64(sp.Low.Max)},
		Overlap:         float64(sp.Overlap),
		Margin:          sp.Margin,
		Bands:           []bandRecord{},
		Coincidences:    []coincidenceRec{},
		MaxHarmonic:     sp.MaxHarmonic,
		Tracking:        []trackingRec{},
		PassbandRule:    tuning.PassbandRule(set.LoadedQ),
		Warnings:        append([]string{}, sp.Warnings...),
		DialConvention:  tuning.DialConvention,
		Drift:           newSpanDriftRecord(out.Drift),
	}
	if sp.HasHigh {
		rec.HighRange = &rangeRecord{float64(sp.High.Min), float64(sp.High.Max)}
	}
	for _, r := range sp.Dial {
		rec.Dial = append(rec.Dial, dialRecord{r.Setting, float64(r.CA), float64(r.CB), float64(r.CTop), float64(r.CTap), float64(r.FLow), float64(r.FHigh)})
	}
	for _, bc := range sp.Bands {
		where, _ := bc.Placement()
		br := bandRecord{Name: bc.Band.Name, Low: float64(bc.Band.Low), High: float64(bc.Band.High), Covered: bc.Covered, Range: where.String(), Ranges: []bandOnRange{}}
		for _, on := range bc.Ranges {
			br.Ranges = append(br.Ranges, bandOnRange{on.Range, on.SettingAtLow, on.SettingAtHigh, on.Whole, on.Margin, on.Fraction})
		}
		rec.Bands = append(rec.Bands, br)
	}
	for _, c := range sp.Coincidences {
		rec.Coincidences = append(rec.Coincidences, coincidenceRec{c.Setting, c.Order, float64(c.FLow), float64(c.FHigh), float64(c.Offset),
			float64(c.Harmonic), float64(c.Passband), c.LoadedQ, c.Depth, c.AttenuationDB, c.SettingFrom, c.SettingTo, c.Band})
	}
	for _, tr := range sp.Tracking {
		rec.Tracking = append(rec.Tracking, trackingRec{tr.Order, tr.SettingFrom, tr.SettingTo, tr.RatioMin, tr.RatioMax, tr.Closest})
	}
	rec.ChooseCoil = newChooseCoilRecord(out.CoilPlan)
	if pl := out.Plan; pl != nil {
		rec.ChooseTap = &chooseTapRecord{pl.Feasible, pl.TapTurns, float64(pl.Geometry.Pitch), pl.Clearance, append([]string{}, pl.Conflicts...),
			pl.Tried, pl.Covering, pl.Overlapping, pl.Clean, pl.CoveringOverlapping}
	}
	return rec, nil
}

func WriteSpanJSON(w io.Writer, s spec.Spec, set spec.SpanSettings, out spec.SpanOutcome) error {
	rec, err := newSpanRecord(s, set, out)
	if err != nil {
		return err
	}
	return writeJSON(w, rec)
}

// writeSpanChart draws both ranges against the dial in text: frequency on
// a logarithmic scale upwards, dial 0–100 % across; L and H mark the low
// and high range, '-' shades the listed bands, '*' marks coincidences.
func writeSpanChart(w io.Writer, sp tuning.Span) error {
	const width, height = 51, 18
	fMin, fMax := float64(sp.Low.Min), float64(sp.Low.Max)
	if sp.HasHigh {
		fMax = math.Max(fMax, float64(sp.High.Max))
	}
	for _, b := range sp.Bands {
		fMin, fMax = math.Min(fMin, float64(b.Band.Low)), math.Max(fMax, float64(b.Band.High))
	}
	lo, hi := math.Log(fMin*0.97), math.Log(fMax*1.03)
	rowOf := func(f float64) int {
		return int(math.Round((hi - math.Log(f)) / (hi - lo) * (height - 1)))
	}
	grid := make([][]rune, height)
	for i := range grid {
		grid[i] = []rune(strings.Repeat(" ", width))
	}
	for _, b := range sp.Bands {
		for r := rowOf(float64(b.Band.High)); r <= rowOf(float64(b.Band.Low)); r++ {
			for c := range grid[r] {
				grid[r][c] = '-'
			}
		}
	}
	// Interpolate the dial rows in ln f for each column.
	at := func(x float64, high bool) float64 {
		d := sp.Dial
		i := int(x * float64(len(d)-1))
		if i >= len(d)-1 {
			i = len(d) - 2
		}
		t := x*float64(len(d)-1) - float64(i)
		a, b := float64(d[i].FLow), float64(d[i+1].FLow)
		if high {
			a, b = float64(d[i].FHigh), float64(d[i+1].FHigh)
		}
		return math.Exp(math.Log(a) + t*(math.Log(b)-math.Log(a)))
	}
	for c := range width {
		x := float64(c) / (width - 1)
		grid[rowOf(at(x, false))][c] = 'L'
		if sp.HasHigh {
			grid[rowOf(at(x, true))][c] = 'H'
		}
	}
	for _, co := range sp.Coincidences {
		c := int(math.Round(co.Setting * (width - 1)))
		grid[rowOf(float64(co.FHigh))][c] = '*'
	}
	labelled := map[int]bool{}
	for r := range height {
		f := math.Exp(hi - float64(r)/(height-1)*(hi-lo))
		label := ""
		if r%3 == 0 || r == height-1 {
			label = quantity.FormatEng(f, "Hz", 3)
			labelled[r] = true
		}
		if _, err := fmt.Fprintf(w, "%10s |%s\n", label, string(grid[r])); err != nil {
			return err
		}
	}
	fmt.Fprintf(w, "%10s +%s\n", "", strings.Repeat("-", width))
	fmt.Fprintf(w, "%10s  0 %%%s50 %%%s100 %% dial\n", "", strings.Repeat(" ", width/2-5), strings.Repeat(" ", width/2-6))
	fmt.Fprintf(w, "%10s  plates open%smeshed\n", "", strings.Repeat(" ", width-16))
	_, err := fmt.Fprintln(w, "           L low range, H high range, - listed bands, * harmonic coincidence")
	return err
}
