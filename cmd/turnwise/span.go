package main

// `turnwise span`: a tapped coil on a two-gang capacitor.
//
// Glue for other commands (the build sheet): buildSpan(geom, spanSettings)
// builds the span, or with ChooseTap the tap plan, from the same values the
// span flags carry once parsed; gangFromSettings turns the capacitor values
// into the two tuning.GangSection values. spanOptions.settings() shows how the
// flags map onto spanSettings.

import (
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"strings"
	"text/tabwriter"
	"turnwise/internal/quantity"

	"github.com/spf13/cobra"
	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/tuning"
	"turnwise/forms"
)

// spanSettings are the values of span's options once parsed: what a job
// file or the flags give. Zero values mean the command's defaults.
type spanSettings struct {
	Tap          float64          // turns from the cold end (ignored with ChooseTap)
	GangA, GangB [2]float64       // min, max in farads; GangB zero means as GangA
	GangBSet     bool             // GangB was given
	Law          string           // "slc" (default), "slf", "slw" or the path of a measured table
	TrimA, TrimB unit.Capacitance // trimmers across each section
	StrayA       unit.Capacitance // wiring stray at the top of the coil
	StrayB       unit.Capacitance // wiring stray at the tap
	Steps        int              // dial rows, 0 for 11
	Bands        []tuning.Band
	LoadedQ      float64 // 0: half the coil model's Q
	Margin       float64 // fraction, 0 for tuning.DefaultMargin
	ChooseTap    bool
	VaryPitch    bool
}

// spanOutcome is what buildSpan returns: the span, and with ChooseTap the
// plan that chose its tap (nil otherwise).
type spanOutcome struct {
	Span     tuning.Span
	Geometry coil.Geometry // as used; ChooseTap with VaryPitch may change the pitch
	Plan     *tuning.TapPlan
}

// gangFromSettings turns the capacitor values into the two sections. A
// law that is not slc, slf or slw is read as a measured-table file.
func gangFromSettings(s spanSettings) (a, b tuning.GangSection, err error) {
	a = tuning.GangSection{Min: unit.Capacitance(s.GangA[0]), Max: unit.Capacitance(s.GangA[1]), Trimmer: s.TrimA, Stray: s.StrayA}
	b = tuning.GangSection{Min: a.Min, Max: a.Max, Trimmer: s.TrimB, Stray: s.StrayB}
	if s.GangBSet {
		b.Min, b.Max = unit.Capacitance(s.GangB[0]), unit.Capacitance(s.GangB[1])
	}
	if law, ok := tuning.ParseLaw(s.Law); ok {
		a.Law, b.Law = law, law
	} else {
		f, err := os.Open(s.Law)
		if err != nil {
			if errors.Is(err, os.ErrNotExist) {
				return a, b, usageErrorf("--law: %q is neither slc, slf, slw nor an existing table file; check the path", s.Law)
			}
			return a, b, fmt.Errorf("--law: %w", err)
		}
		defer f.Close()
		if s.GangA != [2]float64{} || s.GangBSet {
			return a, b, usageErrorf("--law %s: a measured table gives the capacitance itself; drop --gang and --gang-b", s.Law)
		}
		t, err := forms.LoadGangTable(f, s.Law)
		if err != nil {
			return a, b, err
		}
		a.Law, b.Law = tuning.LawTable, tuning.LawTable
		for _, p := range t.Points {
			a.Table = append(a.Table, tuning.GangPoint{Setting: p.Setting, Capacitance: p.A})
			b.Table = append(b.Table, tuning.GangPoint{Setting: p.Setting, Capacitance: p.B})
		}
		a.Min, a.Max = a.Table[0].Capacitance, a.Table[len(a.Table)-1].Capacitance
		b.Min, b.Max = b.Table[0].Capacitance, b.Table[len(b.Table)-1].Capacitance
		return a, b, nil
	}
	if s.GangA == [2]float64{} {
		return a, b, usageErrorf("--gang is required: the capacitor's minimum and maximum per section, e.g. --gang 15-365pF")
	}
	return a, b, nil
}

// buildSpan solves the two-gang circuit for geometry g with settings s,
// choosing the tap first when s.ChooseTap is set. An infeasible choice
// returns the best compromise together with an error wrapping
// coil.ErrInfeasible.
func buildSpan(g coil.Geometry, s spanSettings) (spanOutcome, error) {
	a, b, err := gangFromSettings(s)
	if err != nil {
		return spanOutcome{}, err
	}
	spec := tuning.Spec{Geometry: g, TapTurns: s.Tap, A: a, B: b, Steps: s.Steps, Bands: s.Bands, LoadedQ: s.LoadedQ, Margin: s.Margin}
	if s.ChooseTap {
		plan, err := tuning.ChooseTap(spec, tuning.TapSearch{VaryPitch: s.VaryPitch})
		if err != nil && !errors.Is(err, coil.ErrInfeasible) {
			return spanOutcome{}, spanFlagError(err, s.GangBSet)
		}
		return spanOutcome{Span: plan.Span, Geometry: plan.Geometry, Plan: &plan}, err
	}
	sp, err := tuning.Solve(spec)
	if err != nil {
		return spanOutcome{}, spanFlagError(err, s.GangBSet)
	}
	return spanOutcome{Span: sp, Geometry: g}, nil
}

// spanFlagError names the span flag a coil.InputError belongs to.
func spanFlagError(err error, gangBSet bool) error {
	var ie *coil.InputError
	if !errors.As(err, &ie) {
		return err
	}
	gangB := "gang-b"
	if !gangBSet {
		gangB = "gang"
	}
	flag := map[string]string{
		"tap_turns": "tap", "gang_a": "gang", "gang_b": gangB, "gang_a_law": "law", "gang_b_law": "law",
		"gang_a_table": "law", "gang_b_table": "law", "gang_a_trimmer": "trim-a", "gang_b_trimmer": "trim-b",
		"gang_a_stray": "stray-a", "gang_b_stray": "stray-b", "steps": "steps", "loaded_q": "loaded-q",
		"margin": "margin", "band": "band",
	}[ie.Param]
	if flag == "" {
		return err
	}
	return &flagError{flag, err}
}

// spanOptions holds everything `turnwise span` needs; no cobra types.
type spanOptions struct {
	coil      coilOptions
	stock     *stockOptions
	tap       turnsFlag
	gang      string
	gangB     string
	law       string
	trimA     capacitanceFlag
	trimB     capacitanceFlag
	strayA    capacitanceFlag
	strayB    capacitanceFlag
	steps     int
	bands     []string
	bandsFile string
	loadedQ   float64
	margin    percentFlag
	chooseTap bool
	varyPitch bool
	chart     bool
	units     *choiceFlag
	json      bool
}

func newSpanCmd(g *globalOptions) *cobra.Command {
	opts := &spanOptions{stock: newStockOptions(), units: newChoice("mm", "mm", "in")}
	cmd := &cobra.Command{
		Use:   "span",
		Short: "Both tuning ranges of a tapped coil on a two-gang capacitor",
		Long: strings.TrimSpace(`
A wide-range tuner without band switching: one two-gang variable
capacitor, section A from the top of the coil to ground and section B
from a tap to ground, on one shaft. At every dial setting the circuit has
two resonances, a low range and a high range; span prints both across the
dial, whether they overlap, where your bands fall on the dial, and the
dial settings where a harmonic (2nd or 3rd) of the low range lands inside
the high range's passband: a receiver with a harmonic-rich oscillator
tuned there hears strong stations from the other band.

The dial runs from 0 % (plates fully open: the top of both ranges) to
100 % (fully meshed). Both resonances come from the two-node circuit with
the sections' mutual inductance and the coil's self-capacitance (across
the whole coil), not from two separate tanks. The high range's passband
is f/Q with Q the loaded Q: half the coil model's Q unless --loaded-q.

--choose-tap tries every quarter-turn tap (and with --vary-pitch every
pitch from close-wound to three wire diameters) for one that covers every
band with --margin to spare, makes the ranges overlap by --margin and
keeps harmonics out of the passband where the low range is in a band.
When none does it prints the best compromise and exits with status 3.

Caution: a tank driven by a transmitter carries high RF voltage at the
hot end and across the capacitor; use a capacitor rated for it and follow
local regulations and licensed practice.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise span --former "pvc 20mm" --wire 0.5mm --turns 40 --pitch 1mm --leads 20mm --tap 17 --gang 15-365pF --stray-a 5pF --stray-b 5pF --band 80m=3.5-3.8MHz --band 40m=7.0-7.2MHz --band 31m=9.4-9.9MHz
  turnwise span --former "pvc 20mm" --wire 0.5mm --turns 40 --pitch 1mm --leads 20mm --gang 15-365pF --bands testdata/span/hf-listening.txt --choose-tap --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			if !opts.chooseTap && !opts.tap.set {
				return usageErrorf("give --tap TURNS (counted from the cold, grounded end, e.g. --tap 12.5) or --choose-tap")
			}
			if err := mutuallyExclusive(cmd, "tap", "choose-tap"); err != nil {
				return err
			}
			if opts.varyPitch && !opts.chooseTap {
				return usageErrorf("--vary-pitch works with --choose-tap; add it or drop --vary-pitch")
			}
			return runSpan(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	fs := cmd.Flags()
	opts.coil.addFlags(fs)
	opts.stock.addFlags(fs)
	fs.Var(&opts.tap, "tap", "tap position in turns from the cold (grounded) end, quarter turns, e.g. 12.5")
	fs.StringVar(&opts.gang, "gang", "", "each gang section's capacitance MIN-MAX, e.g. 15-365pF (MIN = MAX is a fixed capacitor: 47-47pF)")
	fs.StringVar(&opts.gangB, "gang-b", "", "section B's MIN-MAX when it differs from section A's")
	fs.StringVar(&opts.law, "law", "slc", "capacitance law: slc (straight-line capacitance), slf (frequency), slw (wavelength) or a measured table file")
	fs.Var(&opts.trimA, "trim-a", "trimmer across section A (top of the coil), e.g. 5pF")
	fs.Var(&opts.trimB, "trim-b", "trimmer across section B (at the tap)")
	fs.Var(&opts.strayA, "stray-a", "wiring stray from the top of the coil to ground, e.g. 5pF (a few pF is typical)")
	fs.Var(&opts.strayB, "stray-b", "wiring stray from the tap to ground")
	fs.IntVar(&opts.steps, "steps", 11, "dial rows to print, from 0 % to 100 %")
	fs.StringArrayVar(&opts.bands, "band", nil, "a band to cover, LOW-HIGH or NAME=LOW-HIGH, e.g. 80m=3.5-3.8MHz (repeat for more)")
	fs.StringVar(&opts.bandsFile, "bands", "", "a file of bands, one per line: NAME LOW-HIGH")
	fs.Float64Var(&opts.loadedQ, "loaded-q", 0, "the circuit's loaded Q for the passband (default: half the coil model's Q)")
	fs.Var(&opts.margin, "margin", "how far inside a range each band must sit, and how much the ranges must overlap, percent (default 3)")
	fs.BoolVar(&opts.chooseTap, "choose-tap", false, "choose the tap for the bands instead of giving --tap")
	fs.BoolVar(&opts.varyPitch, "vary-pitch", false, "with --choose-tap, also choose the pitch (turns held)")
	fs.BoolVar(&opts.chart, "chart", false, "add a text chart of both ranges across the dial")
	fs.Var(opts.units, "units", "display lengths in mm or in")
	fs.BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	return cmd
}

// settings parses the capacitor and band flags into spanSettings.
func (o *spanOptions) settings() (spanSettings, error) {
	s := spanSettings{
		Tap: o.tap.v, Law: o.law, TrimA: o.trimA.v, TrimB: o.trimB.v, StrayA: o.strayA.v, StrayB: o.strayB.v,
		Steps: o.steps, LoadedQ: o.loadedQ, ChooseTap: o.chooseTap, VaryPitch: o.varyPitch,
	}
	if o.margin.set {
		if o.margin.v <= 0 {
			return s, usageErrorf("--margin must be above 0 %%, e.g. 3%%")
		}
		s.Margin = o.margin.v
	}
	if o.gang != "" {
		lo, hi, err := forms.ParseCapacitanceRange(o.gang)
		if err != nil {
			return s, &flagError{"gang", err}
		}
		if hi == 0 {
			return s, usageErrorf("--gang %s leaves section A, across the whole coil, without a capacitor; give the capacitor's minimum and maximum per section, e.g. --gang 15-365pF", o.gang)
		}
		s.GangA = [2]float64{float64(lo), float64(hi)}
	}
	if o.gangB != "" {
		lo, hi, err := forms.ParseCapacitanceRange(o.gangB)
		if err != nil {
			return s, &flagError{"gang-b", err}
		}
		s.GangB, s.GangBSet = [2]float64{float64(lo), float64(hi)}, true
	}
	for _, b := range o.bands {
		fb, err := forms.ParseBand(b)
		if err != nil {
			return s, &flagError{"band", err}
		}
		s.Bands = append(s.Bands, tuning.Band{Name: fb.Name, Low: fb.Low, High: fb.High})
	}
	if o.bandsFile != "" {
		f, err := os.Open(o.bandsFile)
		if err != nil {
			if errors.Is(err, os.ErrNotExist) {
				return s, usageErrorf("--bands: %q does not exist; check the path", o.bandsFile)
			}
			return s, fmt.Errorf("--bands: %w", err)
		}
		defer f.Close()
		list, err := forms.LoadBands(f, o.bandsFile)
		if err != nil {
			return s, err
		}
		for _, b := range list {
			s.Bands = append(s.Bands, tuning.Band{Name: b.Name, Low: b.Low, High: b.High})
		}
	}
	return s, nil
}

func runSpan(_ context.Context, opts *spanOptions, stdout, stderr io.Writer) error {
	cat, err := opts.stock.load()
	if err != nil {
		return err
	}
	spec, err := opts.coil.resolve(cat)
	if err != nil {
		return err
	}
	set, err := opts.settings()
	if err != nil {
		return err
	}
	out, spanErr := buildSpan(spec.Geometry, set)
	if spanErr != nil && !errors.Is(spanErr, coil.ErrInfeasible) {
		return opts.coil.attachFlag(spanErr, spec.SupportKind, spec.PitchSource)
	}
	if out.Plan == nil && spanErr != nil {
		return spanErr
	}
	if opts.json {
		if err := writeSpanJSON(stdout, spec, set, out); err != nil {
			return err
		}
	} else {
		if err := writeSpanTable(stdout, spec, set, out, newLengthFormatter(opts.units.v), opts.chart); err != nil {
			return err
		}
		for _, w := range out.Span.Warnings {
			fmt.Fprintf(stderr, "warning: %s\n", w)
		}
	}
	return spanErr
}

// dialPct prints a dial setting as a builder reads the scale.
func dialPct(x float64) string { return fmt.Sprintf("%.1f %%", x*100) }

func hz(f unit.Frequency) string { return quantity.FormatEng(float64(f), "Hz", 4) }

func describeLaw(a tuning.GangSection) string {
	switch a.Law {
	case tuning.LawSLF:
		return "straight-line frequency"
	case tuning.LawSLW:
		return "straight-line wavelength"
	case tuning.LawTable:
		return "measured table"
	}
	return "straight-line capacitance"
}

func describeGang(a tuning.GangSection) string {
	s := fmt.Sprintf("%s–%s", quantity.FormatCapacitance(float64(a.Min)), quantity.FormatCapacitance(float64(a.Max)))
	if a.Min == a.Max {
		s = quantity.FormatCapacitance(float64(a.Min)) + " fixed"
	}
	if a.Trimmer > 0 {
		s += " + trimmer " + quantity.FormatCapacitance(float64(a.Trimmer))
	}
	if a.Stray > 0 {
		s += " + stray " + quantity.FormatCapacitance(float64(a.Stray))
	}
	return s
}

func writeSpanTable(w io.Writer, s coilSpec, set spanSettings, out spanOutcome, lf lengthFormatter, chart bool) error {
	sp := out.Span
	sec := sp.Sections
	g := out.Geometry
	a, b, err := gangFromSettings(set)
	if err != nil {
		return err
	}
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	row := func(label, value string) { fmt.Fprintf(tw, "  %s\t%s\n", label, value) }

	fmt.Fprintf(tw, "%s of %s on %s, pitch %s, tapped %s from the cold end\n\n",
		quantity.FormatTurnsWord(g.Turns), describeWire(s, lf), s.SupportName, lf.fmt(float64(g.Pitch)), quantity.FormatTurnsWord(sec.TapTurns))

	if p := out.Plan; p != nil {
		fmt.Fprintln(tw, "TAP CHOICE")
		verdict := "meets every requirement"
		if !p.Feasible {
			verdict = "no tap meets every requirement: this is the best compromise"
		}
		row("chosen tap", fmt.Sprintf("%s from the cold end (%s)", quantity.FormatTurnsWord(p.TapTurns), verdict))
		if set.VaryPitch {
			row("chosen pitch", fmt.Sprintf("%s, outside length %s (you asked for %s)", lf.fmt(float64(p.Geometry.Pitch)), lf.fmt(float64(p.Geometry.WindingLength())), lf.fmt(float64(s.Geometry.Pitch))))
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
	row("section A", describeGang(a)+", "+describeLaw(a)+": top of the coil to ground")
	row("section B", describeGang(b)+", "+describeLaw(b)+": tap to ground")
	row("coil self-capacitance", quantity.FormatCapacitance(float64(sp.SelfCapacitance))+" across the whole coil (Medhurst)")
	fmt.Fprintln(tw, "\nTAP")
	row("where", fmt.Sprintf("%s up from the cold (grounded) end, %s along the coil from where the winding starts",
		quantity.FormatTurnsWord(sec.TapTurns), lf.fmt(float64(sec.TapPosition))))
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

	fmt.Fprintln(tw, "\nHARMONIC COINCIDENCES (2nd and 3rd harmonic of the low range)")
	switch {
	case !sp.HasHigh:
		row("none", "there is no high range")
	case len(sp.Coincidences) == 0 && len(sp.Bands) > 0:
		row("none", "where the low range is in a listed band, no 2nd or 3rd harmonic falls inside the high range's passband")
	case len(sp.Coincidences) == 0:
		row("none", "nowhere on the dial does a 2nd or 3rd harmonic fall inside the high range's passband")
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
			hz(c.FLow), where, ordinalWord(c.Order), hz(c.Harmonic), inside, hz(c.FHigh)))
	}
	row("passband rule", tuning.PassbandRule(set.LoadedQ))
	if err := tw.Flush(); err != nil {
		return err
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

func ordinalWord(m int) string {
	switch m {
	case 2:
		return "2nd"
	case 3:
		return "3rd"
	}
	return fmt.Sprintf("%dth", m)
}

// spanRecord is the JSON document of `turnwise span`.
type spanRecord struct {
	Schema          int              `json:"schema"`
	Coil            coilRecord       `json:"coil"`
	TapTurns        float64          `json:"tap_turns"`
	TapPosition     float64          `json:"tap_position"`
	Sections        sectionsRecord   `json:"sections"`
	SelfCapacitance float64          `json:"self_capacitance"`
	GangA           gangRecord       `json:"gang_a"`
	GangB           gangRecord       `json:"gang_b"`
	Dial            []dialRecord     `json:"dial"`
	LowRange        rangeRecord      `json:"low_range"`
	HighRange       *rangeRecord     `json:"high_range"`
	Overlap         float64          `json:"overlap"`
	Margin          float64          `json:"margin"`
	Bands           []bandRecord     `json:"bands"`
	Coincidences    []coincidenceRec `json:"coincidences"`
	PassbandRule    string           `json:"passband_rule"`
	ChooseTap       *chooseTapRecord `json:"choose_tap,omitempty"`
	Warnings        []string         `json:"warnings"`
	DialConvention  string           `json:"dial_convention"`
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

func newSpanRecord(s coilSpec, set spanSettings, out spanOutcome) (spanRecord, error) {
	sp := out.Span
	a, b, err := gangFromSettings(set)
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
		Schema:          schemaVersion,
		Coil:            newCoilRecord(s, p),
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
		PassbandRule:    tuning.PassbandRule(set.LoadedQ),
		Warnings:        append([]string{}, sp.Warnings...),
		DialConvention:  tuning.DialConvention,
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
	if pl := out.Plan; pl != nil {
		rec.ChooseTap = &chooseTapRecord{pl.Feasible, pl.TapTurns, float64(pl.Geometry.Pitch), pl.Clearance, append([]string{}, pl.Conflicts...),
			pl.Tried, pl.Covering, pl.Overlapping, pl.Clean, pl.CoveringOverlapping}
	}
	return rec, nil
}

func writeSpanJSON(w io.Writer, s coilSpec, set spanSettings, out spanOutcome) error {
	rec, err := newSpanRecord(s, set, out)
	if err != nil {
		return err
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(rec)
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
