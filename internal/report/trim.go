package report

import (
	"fmt"
	"io"
	"math"
	"strings"
	"text/tabwriter"
	"turnwise/coil"
	"turnwise/coil/trim"
	"turnwise/forms"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"

	"gonum.org/v1/gonum/unit"
)

// SavedCalibration is what `trim --save` wrote (built by
// spec.AppendCalibration).
type SavedCalibration = spec.SavedCalibration

// fmtLenStep prints a length to the resolution it was rounded to (0.1 mm
// as "9.1 mm"), or to lf's usual precision when exact.
func fmtLenStep(lf quantity.LengthFormat, m float64, step unit.Length) string {
	if step <= 0 {
		return lf.Format(m)
	}
	if lf.Inches {
		return fmt.Sprintf("%.3f in", m/0.0254)
	}
	// The fewest decimals that show the step: 0.1 mm one, 0.05 mm two.
	dec := int(math.Max(0, math.Ceil(-math.Log10(float64(step)*1e3)-1e-9)))
	return fmt.Sprintf("%.*f mm", dec, m*1e3)
}

// sbPct prints a springback with two decimals: "4.12 %".
func sbPct(s float64) string {
	if math.Abs(s) < 0.00005 {
		s = 0
	}
	return fmt.Sprintf("%.2f %%", s*100)
}

// signedFarads prints a capacitance that may come out below zero (a fitted
// intercept) in the same unit as its positive neighbours.
func signedFarads(c float64) string {
	if c < 0 {
		return "−" + quantity.FormatCapacitance(-c)
	}
	return quantity.FormatCapacitance(c)
}

// quarterTurns prints a turns difference: "¼ turn", "1½ turns".
func quarterTurns(d float64) string { return quantity.FormatTurnsWord(math.Abs(d)) }

// expectText is the predicted value after the change, in the target's terms.
func expectText(res *Trim) string {
	c := res.Correction
	if res.Aim.Source == trim.TargetResonance && res.AfterResonance > 0 {
		return fmt.Sprintf("resonance at %s", quantity.FormatEng(float64(res.AfterResonance), "Hz", 4))
	}
	// Three figures, but at least one decimal: "131 nH" for 130.6 nH would
	// read as a 0.8 % miss of a 130 nH target that the 0.5 % rounding met.
	after := quantity.FormatEng(float64(c.After), "H", 3)
	if !strings.Contains(after, ".") {
		after = quantity.FormatEng(float64(c.After), "H", 4)
	}
	if f := res.Target.Frequency; f > 0 {
		return after + " at " + quantity.FormatEng(float64(f), "Hz", 4)
	}
	return after
}

// ActionWords says a correction in words for the table ("remove turns",
// not the JSON token remove_turns).
func ActionWords(a trim.Action) string {
	return strings.ReplaceAll(a.String(), "_", " ")
}

// TrimInstruction is the one clear sentence a builder acts on.
func TrimInstruction(res *Trim) string {
	c := res.Correction
	lf := res.LF
	step := c.LengthStep
	var s string
	switch c.Action {
	case trim.ActionNone:
		if res.OnTarget {
			s = fmt.Sprintf("leave it: %s is within %s of the target %s", quantity.FormatEng(float64(c.Before), "H", 3), quantity.FormatPercent(res.Tolerance), quantity.FormatEng(float64(c.Target), "H", 3))
		} else {
			s = fmt.Sprintf("leave it: the change is smaller than you can set; %s is %+.1f %% from the target", quantity.FormatEng(float64(c.Before), "H", 3), res.Miss*100)
		}
	case trim.ActionSqueeze, trim.ActionSpread:
		s = fmt.Sprintf("%s from %s to %s outside length; expect %s", c.Action, fmtLenStep(lf, float64(c.LengthBefore), step),
			fmtLenStep(lf, float64(c.LengthAfter), step), expectText(res))
	case trim.ActionAddTurns:
		s = fmt.Sprintf("rewind with %s (%s more) at %s outside length; expect %s", quantity.FormatTurnsWord(c.Geometry.Turns),
			quarterTurns(c.Geometry.Turns-res.Calibration.Geometry.Turns), fmtLenStep(lf, float64(c.LengthAfter), step), expectText(res))
	case trim.ActionRemoveTurns:
		end := ""
		if res.Tap != nil {
			end = " at the hot end" // the tap counts from the cold end
		}
		s = fmt.Sprintf("remove %s%s (%s left) and set %s outside length; expect %s", quarterTurns(res.Calibration.Geometry.Turns-c.Geometry.Turns), end,
			quantity.FormatTurnsWord(c.Geometry.Turns), fmtLenStep(lf, float64(c.LengthAfter), step), expectText(res))
	}
	if t := res.Tap; t != nil && t.Moves() {
		s += fmt.Sprintf("; move the tap from %s to %s from the cold end", quantity.FormatTurns(t.Turns), quantity.FormatTurnsWord(t.NewTurns))
	}
	return s
}

// nextText says what the same measurement should read after the change.
func nextText(res *Trim) string {
	m, e := res.Meas, res.Next
	switch m.Kind {
	case trim.MeasureDirect:
		s := "the meter should read " + quantity.FormatEng(float64(e.Inductance), "H", 3)
		if m.TestFrequency > 0 {
			s += " at " + quantity.FormatEng(float64(m.TestFrequency), "Hz", 3)
		}
		if m.FixtureInductance > 0 || m.FixtureLeadLength > 0 {
			s += " with the same fixture"
		}
		return s
	case trim.MeasureResonance:
		return fmt.Sprintf("it should resonate at %s with the same %s", quantity.FormatEng(float64(e.Resonances[0].Frequency), "Hz", 4), quantity.FormatCapacitance(float64(e.Resonances[0].Capacitance)))
	case trim.MeasureInCircuit:
		return fmt.Sprintf("the circuit should resonate at %s", quantity.FormatEng(float64(e.Resonances[0].Frequency), "Hz", 4))
	case trim.MeasureSweep:
		return "the fitted L of a new sweep should be " + quantity.FormatEng(float64(e.Inductance), "H", 4)
	}
	var parts []string
	for _, r := range e.Resonances {
		parts = append(parts, fmt.Sprintf("%s with %s", quantity.FormatEng(float64(r.Frequency), "Hz", 4), quantity.FormatCapacitance(float64(r.Capacitance))))
	}
	return "expect " + strings.Join(parts, ", ")
}

// TrimWarnings words the library's findings, then the model's warnings
// for the corrected coil.
func TrimWarnings(res *Trim) []string {
	w := []string{}
	for _, f := range res.Findings {
		w = append(w, findingText(res, f))
	}
	return append(w, res.After.WarningsIn(res.LF)...)
}

// findingText is one finding in the builder's words.
func findingText(res *Trim, f trim.Finding) string {
	switch f.Kind {
	case trim.SpringbackUnusual:
		return fmt.Sprintf("the fitted springback %s is unusual for wire released from a mandrel (a few percent is typical; common practice): check --turns, --length, --leads and the fixture before trusting or saving it", quantity.FormatPercent(f.Value))
	case trim.SpringbackOnFormer:
		return fmt.Sprintf("a coil left on its former does not spring back: the fitted %s stands for model and measurement error (leads, uneven pitch, fixture); check them before saving it", quantity.FormatPercent(f.Value))
	case trim.MissWithinUncertainty:
		return fmt.Sprintf("the coil misses the target by %+.1f %%, less than the measurement's own uncertainty (±%.1f %%): the change may not be needed; measure more precisely first", f.Value*100, f.Limit*100)
	case trim.NoStray:
		return "no fixture stray given (--stray): 0 pF assumed; a probe or fixture adds some pF, which matters with a small test capacitor; the two-capacitor method (--resonance twice) measures it"
	case trim.NegativeStray:
		return fmt.Sprintf("the capacitance across the coil came out slightly negative (%s ± %s), within the readings' uncertainty: treat it as zero", signedFarads(f.Value), quantity.FormatCapacitance(f.Limit))
	case trim.Scatter:
		return fmt.Sprintf("the resonances scatter by %.2g %% about the fitted line, more than the frequency readings' accuracy: recheck the capacitor values", f.Value*100)
	case trim.HighReadingFrequency:
		return fmt.Sprintf("the reading at %s is above a third of the coil's self-resonance (%s): it leans on the self-capacitance estimate; a lower-frequency reading (a larger capacitor) calibrates better",
			quantity.FormatEng(f.Value, "Hz", 3), quantity.FormatEng(f.Limit, "Hz", 3))
	case trim.SectionDeparts:
		name := map[trim.Section]string{trim.Bottom: "bottom (cold end to tap)", trim.Top: "top (tap to hot end)"}[f.Section]
		return fmt.Sprintf("the %s section reads %+.1f %% against the rest of the coil, more than the readings' uncertainty: its turns are closer or wider than the rest, or the tap is not at %s",
			name, f.Value*100, quantity.FormatTurnsWord(res.Tap.Turns))
	case trim.TapOutOfReach:
		t := res.Tap
		return fmt.Sprintf("no quarter-turn tap gives the voltage ratio %.3f: the nearest, %s from the cold end, gives %.3f", t.WantRatio, quantity.FormatTurnsWord(t.NewTurns), t.RatioAfter)
	case trim.NewWinding:
		return fmt.Sprintf("adding turns means winding a new coil: cut %s of wire", res.LF.Format(f.Value))
	}
	return fmt.Sprintf("finding %d", f.Kind)
}

func kindText(k trim.MeasurementKind) string {
	switch k {
	case trim.MeasureDirect:
		return "inductance meter"
	case trim.MeasureResonance:
		return "resonance with a known capacitor"
	case trim.MeasureInCircuit:
		return "resonance in its circuit"
	case trim.MeasureSweep:
		return "network analyser sweep, fitted"
	}
	return "two-capacitor method"
}

func senseText(r trim.Reading) string {
	switch {
	case r.Kind == trim.MeasureSweep:
		return fmt.Sprintf("fitted L at %s, self-capacitance separated", quantity.FormatEng(float64(r.Frequency), "Hz", 4))
	case r.Kind == trim.MeasureTwoCapacitor:
		return fmt.Sprintf("at the terminals near %s, self-capacitance separated", quantity.FormatEng(float64(r.Frequency), "Hz", 3))
	case r.Effective:
		return "effective at " + quantity.FormatEng(float64(r.Frequency), "Hz", 4) + ", self-capacitance included"
	}
	return "at the terminals, low frequency"
}

func targetSenseText(t trim.Target) string {
	switch {
	case t.Effective:
		return "effective at " + quantity.FormatEng(float64(t.Frequency), "Hz", 4)
	case t.Frequency > 0:
		return "at the terminals at " + quantity.FormatEng(float64(t.Frequency), "Hz", 4)
	}
	return "at the terminals, low frequency"
}

func WriteTrimTable(w io.Writer, res *Trim) error {
	lf := res.LF
	cal, r, c, m := res.Calibration, res.Calibration.Reading, res.Correction, res.Meas
	g := res.Coil.Geometry
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(label, value string) { fmt.Fprintf(tw, "  %s\t%s\n", label, value) }

	fmt.Fprintf(tw, "Trim: %s turns of %s on %s (%s)\n\n", quantity.FormatTurns(g.Turns), spec.DescribeWire(res.Coil, lf), res.Coil.SupportName,
		map[coil.SupportKind]string{coil.SupportMandrel: "slid off: self-supporting", coil.SupportFormer: "stays on the former"}[res.Coil.SupportKind])
	fmt.Fprintf(tw, "→ %s\n", res.Instruction)

	fmt.Fprintf(tw, "\nMEASUREMENT (%s)\n", kindText(r.Kind))
	switch m.Kind {
	case trim.MeasureDirect:
		v := quantity.FormatEng(float64(m.Inductance), "H", 4)
		if m.FixtureInductance > 0 {
			v += " − fixture " + quantity.FormatEng(float64(m.FixtureInductance), "H", 3)
		}
		if m.TestFrequency > 0 {
			v += " at " + quantity.FormatEng(float64(m.TestFrequency), "Hz", 3)
		}
		row("reading", v)
	case trim.MeasureResonance, trim.MeasureInCircuit:
		rs := m.Resonances[0]
		v := fmt.Sprintf("%s with %s", quantity.FormatEng(float64(rs.Frequency), "Hz", 4), quantity.FormatCapacitance(float64(rs.Capacitance)))
		if m.Stray > 0 {
			v += " + " + quantity.FormatCapacitance(float64(m.Stray)) + " stray"
		}
		row("reading", v)
	case trim.MeasureSweep:
		row("fit", fmt.Sprintf("self-capacitance %s ± %s, residual %.2g (see turnwise fit)", quantity.FormatCapacitance(float64(m.Sweep.Capacitance)), quantity.FormatCapacitance(float64(m.Sweep.CapacitanceUncertainty)), m.Sweep.Residual))
	default:
		var parts []string
		for _, rs := range m.Resonances {
			parts = append(parts, fmt.Sprintf("%s with %s", quantity.FormatEng(float64(rs.Frequency), "Hz", 4), quantity.FormatCapacitance(float64(rs.Capacitance))))
		}
		row("readings", strings.Join(parts, ", "))
	}
	if m.FixtureLeadLength > 0 {
		row("fixture leads", "2 × "+lf.Format(float64(m.FixtureLeadLength))+" of extra wire (in the model for the reading)")
	}
	row("inductance", fmt.Sprintf("%s ± %s  (%s)", quantity.FormatEng(float64(r.Inductance), "H", 4), uncertaintyPct(r.Uncertainty), senseText(r)))
	if r.Kind == trim.MeasureTwoCapacitor {
		row("capacitance across it", fmt.Sprintf("%s ± %s  (fixture stray + self-capacitance)", signedFarads(float64(r.TotalStray)), quantity.FormatCapacitance(float64(r.TotalStrayUncertainty))))
		if u1 := r.StrayUncertaintyOnePercent; u1 > 0 {
			row("", fmt.Sprintf("the capacitor tolerance swamps it: the uncertainty is larger than the value; 1 %% capacitors would give ± %s (and L ± %.1f %%) from the same readings",
				quantity.FormatCapacitance(float64(u1)), r.UncertaintyOnePercent*100))
		}
		sc := fmt.Sprintf("model %s (equivalent, from the helical-line SRF)", quantity.FormatCapacitance(float64(cal.SelfCapacitance)))
		if ct := cal.SelfCapacitanceAtTerminals; res.SelfCapacitanceThroughLeads {
			// Long leads: the line sees the self-capacitance through them.
			sc = fmt.Sprintf("model %s across the winding (equivalent, from the helical-line SRF), %s at the terminals through the leads", quantity.FormatCapacitance(float64(cal.SelfCapacitance)), quantity.FormatCapacitance(float64(ct)))
		}
		if m.Stray > 0 {
			u := float64(res.MeasuredSelfCapacitanceUncertainty)
			sc = fmt.Sprintf("%s ± %s measured (less --stray %s); %s", signedFarads(float64(cal.MeasuredSelfCapacitance)), quantity.FormatCapacitance(u), quantity.FormatCapacitance(float64(m.Stray)), sc)
		}
		row("self-capacitance", sc)
		if len(m.Resonances) > 2 {
			row("fit", fmt.Sprintf("the resonances lie within %.2g %% (rms) of the line", r.FitResidual*100))
		}
	}
	sbNote := "no springback assumed"
	switch res.Coil.SpringbackSource {
	case "given":
		sbNote = "springback " + sbPct(g.Springback) + " as given"
	case coil.SpringbackCalibration:
		sbNote = "your saved springback " + sbPct(g.Springback)
	}
	row("the model expected", fmt.Sprintf("%s  (%s): the coil reads %+.1f %%", quantity.FormatEng(float64(cal.ModelBefore), "H", 4), sbNote, res.Deviation*100))

	fmt.Fprintln(tw, "\nTHE COIL AS BUILT")
	row("springback", fmt.Sprintf("%s  (%s … %s within the reading's uncertainty)", sbPct(cal.Springback), sbPct(cal.SpringbackLow), sbPct(cal.SpringbackHigh)))
	row("effective diameter", fmt.Sprintf("%s wire-centre, bore %s", lf.Format(float64(cal.EffectiveDiameter)), lf.Format(float64(cal.Geometry.InsideDiameter()))))
	row("inductance", fmt.Sprintf("%s  (%s)", quantity.FormatEng(float64(c.Before), "H", 4), targetSenseText(res.Target)))

	fmt.Fprintln(tw, "\nCORRECTION")
	tgt := quantity.FormatEng(float64(c.Target), "H", 4) + " " + targetSenseText(res.Target)
	switch res.Aim.Source {
	case trim.TargetModel:
		tgt += " (the model's value for the coil as specified)"
	case trim.TargetResonance:
		tgt = fmt.Sprintf("resonance at %s with %s: %s", quantity.FormatEng(float64(res.Aim.Resonance), "Hz", 4), quantity.FormatCapacitance(float64(res.Aim.Capacitance)), tgt)
	}
	row("target", tgt)
	// The least is at the loosest pitch unless the inductance turns upward
	// inside the window (short fat coils, p > 0.7·D).
	leastAt, mostAt := res.LoosePitch, "close-wound"
	if c.WindowLeastPitch > 0 {
		leastAt = c.WindowLeastPitch
	}
	if c.WindowMostPitch > g.OverallDiameter()*(1+1e-9) {
		mostAt = "pitch " + lf.Format(float64(c.WindowMostPitch))
	}
	row("squeeze/spread window", fmt.Sprintf("%s (pitch %s) … %s (%s), with %s turns", quantity.FormatEng(float64(c.WindowLeast), "H", 3), lf.Format(float64(leastAt)),
		quantity.FormatEng(float64(c.WindowMost), "H", 3), mostAt, quantity.FormatTurns(g.Turns)))
	ng := c.Geometry
	switch c.Action {
	case trim.ActionNone:
		row("action", "none")
	default:
		row("action", ActionWords(c.Action))
		if ng.Turns != g.Turns {
			row("turns", fmt.Sprintf("%s, was %s", quantity.FormatTurns(ng.Turns), quantity.FormatTurns(g.Turns)))
		}
		row("outside length", fmt.Sprintf("%s (pitch %s), was %s", fmtLenStep(lf, float64(c.LengthAfter), c.LengthStep), lf.Format(float64(ng.Pitch)), fmtLenStep(lf, float64(c.LengthBefore), c.LengthStep)))
		row("predicted", fmt.Sprintf("%s  (%+.2f %% from the target)", quantity.FormatEng(float64(c.After), "H", 4), res.MissAfter*100))
	}
	if c.LengthPerPercent > 0 {
		row("fine trim", fmt.Sprintf("%s of outside length per 1 %% of L", lf.Format(float64(c.LengthPerPercent))))
	}
	if t := res.Tap; t != nil {
		tapLine := fmt.Sprintf("%s from the cold end, voltage ratio %.3f (as built) → %.3f; wanted %.3f", quantity.FormatTurnsWord(t.NewTurns), t.RatioBefore, t.RatioAfter, t.WantRatio)
		if t.Moves() {
			tapLine = "move from " + quantity.FormatTurns(t.Turns) + " to " + tapLine
		} else {
			tapLine = "stays at " + tapLine
		}
		row("tap", tapLine)
		if s := t.Sections; s != nil {
			for _, sec := range []struct {
				name string
				fit  *trim.SectionFit
			}{{"bottom section", s.Bottom}, {"top section", s.Top}} {
				if sec.fit == nil {
					continue
				}
				row(sec.name, fmt.Sprintf("%s ± %.1f %% measured, %s in the model; springback %s alone",
					quantity.FormatEng(float64(sec.fit.Reading.Inductance), "H", 3), sec.fit.Reading.Uncertainty*100, quantity.FormatEng(float64(sec.fit.Model), "H", 3), quantity.FormatPercent(sec.fit.Springback)))
			}
			if s.MeasuredRatio != 0 {
				row("tap ratio, measured", fmt.Sprintf("%.3f (model %.3f): the offset is kept when the tap moves", s.MeasuredRatio, s.ModelRatio))
			}
		}
	}
	row("then measure again", nextText(res))
	if res.Meas.Kind == trim.MeasureInCircuit {
		row("caution", "switch the circuit off and discharge it before squeezing the coil")
	}

	if s := res.Saved; s != nil {
		fmt.Fprintln(tw, "\nSAVED")
		row("calibration", fmt.Sprintf("springback %s for %s and %s in %s", forms.SpringbackText(s.Springback), s.Mandrel, s.Wire, s.Path))
		if s.Backup != "" {
			row("previous file", "kept as "+s.Backup)
		}
		for _, a := range s.Added {
			row("added", a)
		}
		if s.Superseded != nil {
			row("supersedes", fmt.Sprintf("springback %s (%s)", quantity.FormatPercent(s.Superseded.Springback), s.Superseded.Note))
		}
		row("from now on", "predict and design use it for this mandrel and wire (unless --springback is given)")
	}
	return tw.Flush()
}

type resonanceJSON struct {
	Frequency   float64 `json:"frequency"`
	Capacitance float64 `json:"capacitance"`
}

type trimMeasurementJSON struct {
	Kind              string          `json:"kind"`
	Reading           float64         `json:"reading,omitempty"` // meter reading (direct)
	TestFrequency     float64         `json:"test_frequency,omitempty"`
	FixtureInductance float64         `json:"fixture_inductance,omitempty"`
	FixtureLeadLength float64         `json:"fixture_lead_length,omitempty"`
	Resonances        []resonanceJSON `json:"resonances,omitempty"`
	Stray             float64         `json:"stray,omitempty"`
	MeterTolerance    float64         `json:"meter_tolerance"`
	CapTolerance      float64         `json:"capacitor_tolerance"`
	CapToleranceAbs   float64         `json:"capacitor_tolerance_abs"`
	FreqTolerance     float64         `json:"frequency_tolerance"`
}

type trimTapJSON struct {
	TapTurns      float64      `json:"tap_turns"`
	NewTapTurns   float64      `json:"new_tap_turns"`
	RatioWanted   float64      `json:"ratio_wanted"`
	RatioAsBuilt  float64      `json:"ratio_as_built"`
	RatioAfter    float64      `json:"ratio_after"`
	RatioOffset   float64      `json:"ratio_offset"`
	MeasuredRatio *float64     `json:"measured_ratio,omitempty"`
	Bottom        *sectionJSON `json:"bottom,omitempty"`
	Top           *sectionJSON `json:"top,omitempty"`
}

type sectionJSON struct {
	MeasuredInductance float64 `json:"measured_inductance"`
	Uncertainty        float64 `json:"measured_inductance_uncertainty"`
	ModelInductance    float64 `json:"model_inductance"`
	Residual           float64 `json:"residual"`
	Springback         float64 `json:"springback"`
	EffectiveDiameter  float64 `json:"effective_diameter"`
}

// onePercentJSON is the two-capacitor method's uncertainty with 1 %
// capacitors (coil/trim.OnePercent): the capacitance across the coil (F)
// and L as a fraction, as the table's advice line prints them.
type onePercentJSON struct {
	Capacitance        float64 `json:"capacitance"`
	InductanceFraction float64 `json:"inductance_fraction"`
}

type savedJSON struct {
	StockFile  string   `json:"stock_file"`
	Backup     string   `json:"backup,omitempty"`
	Mandrel    string   `json:"mandrel"`
	Wire       string   `json:"wire"`
	Springback float64  `json:"springback"`
	Note       string   `json:"note"`
	Added      []string `json:"added,omitempty"`
}

type TrimRecord struct {
	Schema      int                 `json:"schema"`
	Instruction string              `json:"instruction"`
	Measurement trimMeasurementJSON `json:"measurement"`

	MeasuredInductance            float64  `json:"measured_inductance"`
	MeasuredInductanceUncertainty float64  `json:"measured_inductance_uncertainty"`
	MeasuredSense                 string   `json:"measured_sense"`
	MeasurementFrequency          float64  `json:"measurement_frequency"`
	StrayCapacitance              *float64 `json:"stray_capacitance,omitempty"`
	StrayCapacitanceUncertainty   *float64 `json:"stray_capacitance_uncertainty,omitempty"`
	// OnePercentUncertainty is what 1 % capacitors would give from the same
	// readings, present when the given tolerance swamps the stray.
	OnePercentUncertainty        *onePercentJSON `json:"one_percent_uncertainty,omitempty"`
	SelfCapacitanceMeasured      *float64        `json:"self_capacitance_measured,omitempty"`
	SelfCapacitanceModel         float64         `json:"self_capacitance_model"`
	SelfCapacitanceModelTerminal *float64        `json:"self_capacitance_model_terminal,omitempty"`
	FitResidual                  *float64        `json:"fit_residual,omitempty"`
	ModelInductance              float64         `json:"model_inductance"`
	InductanceTerminal           float64         `json:"inductance_terminal"`

	SpringbackBefore        float64 `json:"springback_before"`
	SpringbackSource        string  `json:"springback_source"`
	Springback              float64 `json:"springback"`
	SpringbackLow           float64 `json:"springback_low"`
	SpringbackHigh          float64 `json:"springback_high"`
	EffectiveDiameter       float64 `json:"effective_diameter"`
	EffectiveInsideDiameter float64 `json:"effective_inside_diameter"`
	Residual                float64 `json:"residual"`

	TargetInductance  float64  `json:"target_inductance"`
	TargetFrequency   float64  `json:"target_frequency"`
	TargetSense       string   `json:"target_sense"`
	TargetSource      string   `json:"target_source"`
	TargetResonance   *float64 `json:"target_resonance,omitempty"`
	TargetCapacitance *float64 `json:"target_capacitance,omitempty"`
	InductanceAsBuilt float64  `json:"inductance_as_built"`
	WindowLeast       float64  `json:"window_least"`
	WindowMost        float64  `json:"window_most"`

	Action               string   `json:"action"`
	Turns                float64  `json:"turns"`
	NewTurns             float64  `json:"new_turns"`
	Pitch                float64  `json:"pitch"`
	NewPitch             float64  `json:"new_pitch"`
	WindingLength        float64  `json:"winding_length"`
	NewWindingLength     float64  `json:"new_winding_length"`
	LengthStep           float64  `json:"length_step"`
	PredictedInductance  float64  `json:"predicted_inductance"`
	PredictedResonance   *float64 `json:"predicted_resonance,omitempty"`
	TrimLengthPerPercent float64  `json:"trim_length_per_percent"`
	NewWireLength        float64  `json:"new_wire_length"`

	NextMeasurement struct {
		Inductance float64         `json:"inductance,omitempty"`
		Resonances []resonanceJSON `json:"resonances,omitempty"`
	} `json:"next_measurement"`

	Tap      *trimTapJSON `json:"tap,omitempty"`
	Saved    *savedJSON   `json:"saved,omitempty"`
	Coil     CoilRecord   `json:"coil"`
	Warnings []string     `json:"warnings"`
}

func ptr(v float64) *float64 { return &v }

// resonancesJSON lists resonance readings in SI units (nil for none).
func resonancesJSON(rs []trim.Resonance) []resonanceJSON {
	var out []resonanceJSON
	for _, r := range rs {
		out = append(out, resonanceJSON{float64(r.Frequency), float64(r.Capacitance)})
	}
	return out
}

// senseName is the JSON word for which inductance a value is: the
// effective one at frequency, or the terminal one.
func senseName(effective bool) string {
	if effective {
		return "effective"
	}
	return "terminal"
}

func WriteTrimJSON(w io.Writer, res *Trim) error {
	cal, r, c, m := res.Calibration, res.Calibration.Reading, res.Correction, res.Meas
	g := res.Coil.Geometry
	d := TrimRecord{Schema: SchemaVersion, Instruction: res.Instruction}
	d.Measurement = trimMeasurementJSON{
		Kind: m.Kind.String(), TestFrequency: float64(m.TestFrequency), FixtureInductance: float64(m.FixtureInductance),
		FixtureLeadLength: float64(m.FixtureLeadLength), Stray: float64(m.Stray),
		MeterTolerance: m.MeterTolerance, CapTolerance: m.CapacitorTolerance, CapToleranceAbs: float64(m.CapacitorToleranceAbs),
		FreqTolerance: m.FrequencyTolerance,
	}
	if m.Kind == trim.MeasureDirect {
		d.Measurement.Reading = float64(m.Inductance)
	}
	d.Measurement.Resonances = resonancesJSON(m.Resonances)
	d.MeasuredInductance = float64(r.Inductance)
	d.MeasuredInductanceUncertainty = r.Uncertainty
	d.MeasuredSense = senseName(r.Effective)
	d.MeasurementFrequency = float64(r.Frequency)
	if r.Kind == trim.MeasureTwoCapacitor {
		d.StrayCapacitance = ptr(float64(r.TotalStray))
		d.StrayCapacitanceUncertainty = ptr(float64(r.TotalStrayUncertainty))
		if u1 := r.StrayUncertaintyOnePercent; u1 > 0 {
			d.OnePercentUncertainty = &onePercentJSON{Capacitance: float64(u1), InductanceFraction: r.UncertaintyOnePercent}
		}
		if m.Stray > 0 {
			d.SelfCapacitanceMeasured = ptr(float64(cal.MeasuredSelfCapacitance))
		}
		d.SelfCapacitanceModelTerminal = ptr(float64(cal.SelfCapacitanceAtTerminals))
		if len(m.Resonances) > 2 {
			d.FitResidual = ptr(r.FitResidual)
		}
	}
	d.SelfCapacitanceModel = float64(cal.SelfCapacitance)
	d.ModelInductance = float64(cal.ModelBefore)
	d.InductanceTerminal = float64(cal.Measured)
	d.SpringbackBefore, d.SpringbackSource = g.Springback, res.Coil.SpringbackSource.String()
	d.Springback, d.SpringbackLow, d.SpringbackHigh = cal.Springback, cal.SpringbackLow, cal.SpringbackHigh
	d.EffectiveDiameter = float64(cal.EffectiveDiameter)
	d.EffectiveInsideDiameter = float64(cal.Geometry.InsideDiameter())
	d.Residual = cal.Residual

	d.TargetInductance, d.TargetFrequency = float64(c.Target), float64(res.Target.Frequency)
	d.TargetSense = senseName(res.Target.Effective)
	d.TargetSource = res.Aim.Source.String()
	if res.Aim.Source == trim.TargetResonance {
		d.TargetResonance, d.TargetCapacitance = ptr(float64(res.Aim.Resonance)), ptr(float64(res.Aim.Capacitance))
		if res.AfterResonance > 0 {
			d.PredictedResonance = ptr(float64(res.AfterResonance))
		}
	}
	d.InductanceAsBuilt = float64(c.Before)
	d.WindowLeast, d.WindowMost = float64(c.WindowLeast), float64(c.WindowMost)

	d.Action = c.Action.String()
	d.Turns, d.NewTurns = g.Turns, c.Geometry.Turns
	d.Pitch, d.NewPitch = float64(g.Pitch), float64(c.Geometry.Pitch)
	d.WindingLength, d.NewWindingLength = float64(c.LengthBefore), float64(c.LengthAfter)
	d.LengthStep = float64(c.LengthStep)
	d.PredictedInductance = float64(c.After)
	d.TrimLengthPerPercent = float64(c.LengthPerPercent)
	d.NewWireLength = float64(res.After.WireLength)
	d.NextMeasurement.Inductance = float64(res.Next.Inductance)
	d.NextMeasurement.Resonances = resonancesJSON(res.Next.Resonances)
	if t := res.Tap; t != nil {
		tj := &trimTapJSON{TapTurns: t.Turns, NewTapTurns: t.NewTurns, RatioWanted: t.WantRatio, RatioAsBuilt: t.RatioBefore,
			RatioAfter: t.RatioAfter, RatioOffset: t.Offset}
		if s := t.Sections; s != nil {
			if s.MeasuredRatio != 0 {
				tj.MeasuredRatio = ptr(s.MeasuredRatio)
			}
			sec := func(f *trim.SectionFit) *sectionJSON {
				if f == nil {
					return nil
				}
				return &sectionJSON{float64(f.Reading.Inductance), f.Reading.Uncertainty, float64(f.Model), f.Residual, f.Springback, float64(f.EffectiveDiameter)}
			}
			tj.Bottom, tj.Top = sec(s.Bottom), sec(s.Top)
		}
		d.Tap = tj
	}
	if s := res.Saved; s != nil {
		d.Saved = &savedJSON{StockFile: s.Path, Backup: s.Backup, Mandrel: s.Mandrel, Wire: s.Wire, Springback: s.Springback, Note: s.Note, Added: s.Added}
	}
	d.Coil = NewCoilRecord(res.Coil, res.Spec)
	d.Warnings = res.Warnings
	return writeJSON(w, d)
}

// Trim is trim.Plan's result with what the writers need besides: the
// coil's description, the measurement as given and the display units.
type Trim struct {
	*trim.Result
	Coil        spec.Spec // the coil as resolved (its Spec field is trim.Result's prediction)
	Meas        trim.Measurement
	Instruction string
	Warnings    []string
	Saved       *SavedCalibration
	LF          quantity.LengthFormat
}

// uncertaintyPct prints a relative uncertainty to one decimal of a percent,
// or to two significant figures when it is finer than that (a fitted sweep's
// ±0.016 %), so it never reads as "± 0.0 %".
func uncertaintyPct(u float64) string {
	if u*100 >= 0.1 {
		return fmt.Sprintf("%.1f %%", u*100)
	}
	return fmt.Sprintf("%.2g %%", u*100)
}
