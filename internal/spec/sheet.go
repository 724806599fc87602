package spec

import (
	"unicode"

	"gonum.org/v1/gonum/unit"

	"errors"
	"fmt"
	"math"
	"strings"
	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/coil/tuning"
	"turnwise/forms"
	"turnwise/internal/quantity"
	"turnwise/sheets"
)

// Build-sheet pages from job coils: the same Spec and wording as the
// command tables, assembled into sheets.Coil values.

// DescribeWire says what the wire is in a builder's words, e.g.
// "1.00 mm bare copper wire", "1.00mm silver-plated bare wire" or
// "22awg copper wire, grade 1 enamel (0.68 mm overall)". Tables and build
// sheets both use it.
func DescribeWire(s Spec, lf quantity.LengthFormat) string {
	w := s.Wire
	desc := w.Name
	if w.Origin == "command line" || desc == "" {
		desc = lf.FormatSize(float64(w.Bare)) // every digit the user gave: 0.315 mm, not 0.32 mm
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
	return fmt.Sprintf("%s wire, %s (%s overall)", desc, ins, lf.Format(float64(s.Geometry.OverallDiameter())))
}

// JobSheetCoil is the page data of one job coil: the design search for a target, the
// tap and the two-gang span when asked for. Errors point into the job file.
func JobSheetCoil(job *forms.Job, jc *forms.JobCoil, cat *forms.Catalog, lf quantity.LengthFormat) (sheets.Coil, []string, error) {
	var c sheets.Coil
	var built Spec
	if jc.Target != nil {
		spec, cand, res, err := DesignJobCoil(job, jc, cat)
		if err != nil {
			return c, nil, err
		}
		built = spec
		c = NewSheetCoil(spec, cand.Prediction, lf)
		c.Target = &sheets.Target{
			Description: targetDescription(jc, res),
			Inductance:  unit.Inductance(res.Required),
			Effective:   res.Effective,
			Tolerance:   res.Tolerance,
			Rank:        1,
			Why:         cand.Why,
		}
		if bf := cand.Band; bf != nil && res.Band != nil {
			bt := res.Band.Target
			c.Target.Band = &sheets.TargetBand{
				Low: bf.Low, High: bf.High, Fixed: bt.Fixed, Stray: bt.Stray,
				TrimMin: bt.TrimMin, TrimMax: bt.TrimMax,
				TrimmerLow: bf.TrimmerLow, TrimmerHigh: bf.TrimmerHigh,
			}
		}
	} else {
		spec, p, err := PredictJobCoil(job, jc, cat)
		if err != nil {
			return c, nil, err
		}
		built = spec
		c = NewSheetCoil(spec, p, lf)
	}
	th, err := SheetThermal(job, jc, cat, built, c.Prediction)
	if err != nil {
		return c, nil, err
	}
	c.Thermal = th
	c.Name, c.Quantity, c.Notes, c.HighVoltage = jc.Name, jc.Quantity, jc.Notes, jc.Transmit
	g, f := c.Prediction.Geometry, c.Prediction.Frequency

	if t := jc.Tap; t != nil {
		var s coil.Sections
		var err error
		var miss float64 // (achieved − asked)/asked for a tap-ratio
		key := "tap"
		if t.Turns != nil {
			s, err = coil.Tap(g, *t.Turns, f)
		} else {
			key = "tap-ratio"
			var choices []coil.TapChoice
			choices, err = coil.FindTap(g, f, coil.GoalVoltageRatio, *t.Ratio)
			if len(choices) > 0 {
				s, miss = choices[0].Sections, choices[0].Error
			}
		}
		if err != nil {
			if errors.Is(err, coil.ErrInfeasible) {
				return c, nil, fmt.Errorf("job %q: line %d: %s: %s: %w", job.File, jc.KeyLine(key), jc.Label(), key, err)
			}
			return c, nil, JobFieldError(job, jc, key, err)
		}
		c.Tap = SheetTap(s)
		if t.Ratio != nil {
			off := fmt.Sprintf("%+.1f %%", miss*100)
			if math.Abs(miss) >= 0.1 {
				off = fmt.Sprintf("%+.0f %%", miss*100)
				c.Warnings = append(c.Warnings, fmt.Sprintf("tap-ratio %.3g: the nearest quarter-turn tap, at turn %s from the cold end, gives %.3g (%s); change the turns or the pitch to come closer",
					*t.Ratio, strings.TrimPrefix(quantity.FormatTurns(s.TapTurns), "0"), s.Ratio, off))
			}
			c.Tap.Purpose = fmt.Sprintf("This is the quarter turn nearest the voltage ratio %.3g asked for (%s).", *t.Ratio, off)
		}
	}
	if jc.Span != nil {
		sp, tap, w, err := spanJobCoil(job, jc, g, c.Tap)
		if err != nil {
			return c, nil, err
		}
		c.Span = sp
		if tap != nil {
			c.Tap = tap
		}
		c.Warnings = append(c.Warnings, w...)
	}
	return c, SheetWarnings(c.Name, c.Warnings), nil
}

// SheetWarnings prefixes each warning with the coil's name.
func SheetWarnings(name string, ws []string) []string {
	out := make([]string, len(ws))
	for i, w := range ws {
		out[i] = fmt.Sprintf("coil %q: %s", name, w)
	}
	return out
}

// NewSheetCoil is the page data of a predicted coil; the wire is
// described as the tables describe it (DescribeWire).
func NewSheetCoil(spec Spec, p coil.Prediction, lf quantity.LengthFormat) sheets.Coil {
	desc := DescribeWire(spec, lf)
	c := sheets.Coil{
		Wire:             desc,
		WireKey:          desc,
		Support:          spec.SupportKind,
		SupportName:      spec.SupportName,
		SpringbackSource: spec.SpringbackSource,
		SpringbackNote:   spec.SpringbackNote,
		CloseWound:       spec.PitchSource == "close-wound" || closeWound(p.Geometry),
		Prediction:       p,
		Warnings:         p.WarningsIn(lf),
	}
	if p.Frequency > 0 {
		if p0, err := coil.Predict(p.Geometry, 0); err == nil {
			c.LowFrequency = unit.Inductance(p0.Inductance)
		}
	}
	if dl, err := coil.LengthPerPercent(p.Geometry, p.Frequency); err == nil {
		c.TrimPerPercent = unit.Length(dl)
	}
	if least, most, err := coil.Window(p.Geometry, p.Frequency); err == nil {
		c.TrimLeast, c.TrimMost = unit.Inductance(least), unit.Inductance(most)
	}
	return c
}

// SheetTap is the page data of a tap.
func SheetTap(s coil.Sections) *sheets.Tap {
	return &sheets.Tap{
		Turns:    s.TapTurns,
		Ratio:    s.Ratio,
		LBelow:   unit.Inductance(s.LB),
		LAbove:   unit.Inductance(s.LA),
		Mutual:   unit.Inductance(s.M),
		Coupling: s.K,
	}
}

// DesignJobCoil runs the design search for a job coil with a target and
// returns the best candidate and its Spec (FromCandidate).
func DesignJobCoil(job *forms.Job, jc *forms.JobCoil, cat *forms.Catalog) (Spec, design.Candidate, design.Result, error) {
	t, w := jc.Target, jc.Winding
	o := &SearchOptions{
		Support:    t.Support,
		Mandrel:    w.Mandrel,
		Former:     w.Former,
		Insulation: w.Insulation,
		Conductor:  w.Conductor,
		Springback: w.Springback,
		Prefer:     t.Prefer,
		Top:        1,
	}
	if w.Wire != "" {
		o.Wires = []string{w.Wire}
	}
	if t.Inductance != nil {
		o.Inductance = *t.Inductance
	}
	if t.Cap != nil {
		o.Capacitance = *t.Cap
	}
	if t.Stray != nil {
		o.Stray = *t.Stray
	}
	if w.Freq != nil {
		o.Freq = *w.Freq
	}
	if t.Band != nil && t.Trimmer != nil {
		o.BandLow, o.BandHigh = t.Band.Low, t.Band.High
		o.TrimMin, o.TrimMax = t.Trimmer[0], t.Trimmer[1]
	}
	if t.Tolerance != nil {
		o.Tolerance = *t.Tolerance
	}
	if w.Leads != nil {
		o.Leads = *w.Leads
	}
	if w.Temp != nil {
		o.Temp = *w.Temp
	}
	if t.MaxLength != nil {
		o.MaxLength = *t.MaxLength
	}
	if t.MaxDiameter != nil {
		o.MaxDiameter = *t.MaxDiameter
	}
	if t.MaxWireLength != nil {
		o.MaxWireLength = *t.MaxWireLength
	}
	if t.MinSRFRatio != nil {
		o.MinSRFRatio = *t.MinSRFRatio
	}
	res, err := Search(cat, o)
	if err != nil {
		if errors.Is(err, coil.ErrInfeasible) {
			return Spec{}, design.Candidate{}, res, fmt.Errorf("job %q: line %d: %s: %w", job.File, jc.Line, jc.Label(), err)
		}
		return Spec{}, design.Candidate{}, res, JobCoilError(job, jc, err)
	}
	if len(res.Candidates) == 0 {
		return Spec{}, design.Candidate{}, res, fmt.Errorf("job %q: line %d: %s: %w: the design search returned no candidate", job.File, jc.Line, jc.Label(), coil.ErrInfeasible)
	}
	cand := res.Candidates[0]
	return FromCandidate(WireRows(cat, o), cand), cand, res, nil
}

// targetDescription says what a job coil's target is.
func targetDescription(jc *forms.JobCoil, res design.Result) string {
	t := jc.Target
	if t.Band != nil && t.Trimmer != nil {
		d := fmt.Sprintf("tune %s–%s with a %s–%s trimmer", quantity.FormatFrequency(float64(t.Band.Low)), quantity.FormatFrequency(float64(t.Band.High)),
			quantity.FormatCapacitance(float64(t.Trimmer[0])), quantity.FormatCapacitance(float64(t.Trimmer[1])))
		var parts []string
		if t.Cap != nil && *t.Cap > 0 {
			parts = append(parts, quantity.FormatCapacitance(float64(*t.Cap))+" fixed")
		}
		if t.Stray != nil && *t.Stray > 0 {
			parts = append(parts, quantity.FormatCapacitance(float64(*t.Stray))+" stray")
		}
		if len(parts) > 0 {
			d += " across " + strings.Join(parts, " + ")
		}
		return d
	}
	tol := fmt.Sprintf(", L within ± %.3g %%", res.Tolerance*100)
	if t.Cap != nil {
		c := quantity.FormatCapacitance(float64(*t.Cap))
		if t.Stray != nil && *t.Stray > 0 {
			c += " + " + quantity.FormatCapacitance(float64(*t.Stray)) + " stray"
		}
		return fmt.Sprintf("resonate with %s at %s%s", c, quantity.FormatEng(float64(*jc.Winding.Freq), "Hz", 4), tol)
	}
	d := quantity.FormatEng(float64(*t.Inductance), "H", 3) + " at the terminals"
	if jc.Winding.Freq != nil {
		d += " at " + quantity.FormatEng(float64(*jc.Winding.Freq), "Hz", 4)
	}
	return d + tol
}

// spanJobCoil solves the two-gang circuit of a job coil and converts it to
// the chart's data; with choose-tap it returns the chosen tap too.
func spanJobCoil(job *forms.Job, jc *forms.JobCoil, g coil.Geometry, tap *sheets.Tap) (*sheets.Span, *sheets.Tap, []string, error) {
	js := jc.Span
	if _, named := tuning.ParseLaw(js.Law); js.GangA.Max == 0 && named {
		return nil, nil, nil, JobFieldError(job, jc, "gang", errors.New("a gang of 0 pF leaves section A with no capacitor; give the capacitor's minimum and maximum per section, e.g. 15-365pF"))
	}
	law := js.Law
	if _, named := tuning.ParseLaw(law); !named {
		law = JobPath(job, law)
	}
	set := SpanSettings{
		GangA: [2]float64{float64(js.GangA.Min), float64(js.GangA.Max)}, GangB: [2]float64{float64(js.GangB.Min), float64(js.GangB.Max)},
		GangBSet: js.GangBSet, Law: law, TrimA: js.TrimA, TrimB: js.TrimB, StrayA: js.StrayA, StrayB: js.StrayB,
		Steps: max(js.Steps, 101), LoadedQ: js.LoadedQ, Margin: js.Margin, ChooseTap: js.ChooseTap,
	}
	if tap != nil {
		set.Tap = tap.Turns
	}
	for _, b := range js.Bands {
		set.Bands = append(set.Bands, tuning.Band{Name: b.Name, Low: b.Low, High: b.High})
	}
	out, err := BuildSpan(g, set)
	var warnings []string
	if err != nil {
		if !errors.Is(err, coil.ErrInfeasible) || out.Plan == nil {
			return nil, nil, nil, spanJobError(job, jc, err)
		}
		// choose-tap found no tap meeting everything: print its best
		// compromise and say so.
		warnings = append(warnings, "choose-tap: no tap meets every requirement; the sheet shows the best compromise: "+strings.Join(out.Plan.Conflicts, "; "))
	}
	a, b, _ := GangFromSettings(set)
	sp := out.Span
	s := &sheets.Span{
		GangA:     DescribeGang(a),
		GangB:     DescribeGang(b),
		Capacitor: sheetCapacitor(a, b),
		Law:       DescribeLaw(a),
		Overlap:   unit.Frequency(sp.Overlap),
		Notes:     sp.Warnings,
	}
	for _, d := range sp.Dial {
		s.Dial = append(s.Dial, sheets.DialPoint{Setting: d.Setting, FLow: unit.Frequency(d.FLow), FHigh: unit.Frequency(d.FHigh)})
	}
	for _, bc := range sp.Bands {
		where, on := bc.Placement()
		sb := sheets.Band{Low: unit.Frequency(bc.Band.Low), High: unit.Frequency(bc.Band.High), Label: bc.Band.Name,
			Range: where.String(), DialLow: on.SettingAtLow, DialHigh: on.SettingAtHigh}
		for _, r := range bc.Ranges {
			sb.Ranges = append(sb.Ranges, sheets.BandRange{Range: r.Range, DialLow: r.SettingAtLow, DialHigh: r.SettingAtHigh, Whole: r.Whole})
		}
		s.Bands = append(s.Bands, sb)
	}
	for _, co := range sp.Coincidences {
		s.Coincidences = append(s.Coincidences, sheets.Coincidence{
			Setting: co.Setting, Order: co.Order, Band: co.Band,
			FLow: unit.Frequency(co.FLow), FHigh: unit.Frequency(co.FHigh), Depth: co.Depth,
		})
	}
	var chosen *sheets.Tap
	if out.Plan != nil {
		chosen = SheetTap(sp.Sections)
		chosen.Purpose = "The tap was chosen for the bands (choose-tap)."
	}
	return s, chosen, warnings, nil
}

// spanJobError reports an error of the two-gang glue, which speaks in
// span's flags, at the job file's key of the same name: "--law: ..." is
// reported at law = with the dashes dropped, and a bad capacitor table at
// the law key.
func spanJobError(job *forms.Job, jc *forms.JobCoil, err error) error {
	var fe *FlagError
	if errors.As(err, &fe) {
		return JobFieldError(job, jc, fe.Flag, fe.Err)
	}
	key := ""
	if _, named := tuning.ParseLaw(jc.Span.Law); !named {
		key = "law"
	}
	var ue *UsageError
	if errors.As(err, &ue) {
		msg := ue.Msg
		if rest, ok := strings.CutPrefix(msg, "--"); ok {
			if i := strings.IndexAny(rest, " :"); i > 0 && jc.Has(rest[:i]) {
				key, msg = rest[:i], strings.TrimLeft(rest[i:], ": ")
			}
		}
		return JobFieldError(job, jc, key, errors.New(strings.ReplaceAll(msg, "--", "")))
	}
	return JobFieldError(job, jc, key, err)
}

// sheetCapacitor is the two-gang capacitor to buy, without the board's
// stray capacitance.
func sheetCapacitor(a, b tuning.GangSection) string {
	a.Stray, b.Stray = 0, 0
	if DescribeGang(b) == DescribeGang(a) {
		return DescribeGang(a) + " per section"
	}
	return "A " + DescribeGang(a) + ", B " + DescribeGang(b)
}

// FlagSheetCoil is the build-sheet page of the one coil described by
// predict's flags: name and quantity as given, a tap at tapTurns from the
// cold end when tapSet (tapRaw as typed). Errors name the flag.
func FlagSheetCoil(cs Spec, p coil.Prediction, lf quantity.LengthFormat, name string, qty int, tapSet bool, tapTurns float64, tapRaw string) (sheets.Coil, []string, error) {
	if qty < 1 || qty > 10000 {
		return sheets.Coil{}, nil, Usagef("--quantity %d: give how many to build, 1 to 10000", qty)
	}
	if strings.TrimSpace(name) == "" {
		return sheets.Coil{}, nil, Usagef("--name is empty; name the coil as the builder will call it, e.g. --name L1")
	}
	if strings.ContainsFunc(name, unicode.IsControl) {
		return sheets.Coil{}, nil, Usagef("--name holds a control character; name the coil in printable text, e.g. --name L1")
	}
	c := NewSheetCoil(cs, p, lf)
	c.Name, c.Quantity = strings.TrimSpace(name), qty
	if tapSet {
		if tapTurns <= 0 {
			return c, nil, Usagef("--tap %s: a tap at the cold end is no tap; give the turns from the cold (grounded) end, e.g. --tap 1.5", tapRaw)
		}
		s, err := coil.Tap(cs.Geometry, tapTurns, p.Frequency)
		if err != nil {
			return c, nil, &FlagError{Flag: "tap", Err: err}
		}
		c.Tap = SheetTap(s)
	}
	return c, SheetWarnings(c.Name, c.Warnings), nil
}
