package spec

import (
	"errors"
	"fmt"
	"os"
	"turnwise/coil"
	"turnwise/coil/tuning"
	"turnwise/forms"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// The two-gang glue: BuildSpan(geom, SpanSettings) builds the span, or with
// ChooseTap the tap plan, from the values span's flags (or a job coil's
// keys of the same names) carry once parsed; GangFromSettings turns the
// capacitor values into the two tuning.GangSection values.

// SpanSettings are the values of span's options once parsed: what a job
// file or the flags give. Zero values mean the command's defaults.
type SpanSettings struct {
	Mounting     coil.Mounting    // the coil's mounting: its SRF feeds the circuit
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
	ChooseCoil   bool    // choose turns, pitch and tap together
	MinTurns     float64 // for ChooseCoil; 0: 3
	MaxTurns     float64 // for ChooseCoil; 0: 3 × the coil's turns
	MaxHarmonic  int     // highest harmonic order checked; 0 for tuning.DefaultMaxHarmonic
	Bandspread   float64 // least share of the dial per band before a warning; 0 for 3 %
}

// SpanOutcome is what BuildSpan returns: the span, and with ChooseTap the
// plan that chose its tap (nil otherwise).
type SpanOutcome struct {
	Span     tuning.Span
	Geometry coil.Geometry // as used; ChooseTap with VaryPitch may change the pitch
	Plan     *tuning.TapPlan
	// Drift is the ranges' temperature drift at chosen dial settings, when
	// computed (BuildSpanDrift); nil otherwise.
	Drift *SpanDrift
	// CoilPlan is the ChooseCoil plan (nil otherwise); Plan then points
	// at its tap plan.
	CoilPlan *tuning.CoilPlan
}

// GangFromSettings turns the capacitor values into the two sections. A
// law that is not slc, slf or slw is read as a measured-table file.
func GangFromSettings(s SpanSettings) (a, b tuning.GangSection, err error) {
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
				return a, b, Usagef("--law: %q is neither slc, slf, slw nor an existing table file; check the path", s.Law)
			}
			return a, b, fmt.Errorf("--law: %w", err)
		}
		defer f.Close()
		if s.GangA != [2]float64{} || s.GangBSet {
			return a, b, Usagef("--law %s: a measured table gives the capacitance itself; drop --gang and --gang-b", s.Law)
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
		return a, b, Usagef("--gang is required: the capacitor's minimum and maximum per section, e.g. --gang 15-365pF")
	}
	return a, b, nil
}

// BuildSpan solves the two-gang circuit for geometry g with settings s,
// choosing the tap first when s.ChooseTap is set. An infeasible choice
// returns the best compromise together with an error wrapping
// coil.ErrInfeasible.
func BuildSpan(g coil.Geometry, s SpanSettings) (SpanOutcome, error) {
	a, b, err := GangFromSettings(s)
	if err != nil {
		return SpanOutcome{}, err
	}
	spec := tuning.Spec{Geometry: g, TapTurns: s.Tap, A: a, B: b, Steps: s.Steps, Bands: s.Bands, LoadedQ: s.LoadedQ, Margin: s.Margin, Mounting: s.Mounting,
		MaxHarmonic: s.MaxHarmonic, Bandspread: s.Bandspread}
	if s.ChooseCoil {
		plan, err := tuning.ChooseCoil(spec, tuning.CoilSearch{MinTurns: s.MinTurns, MaxTurns: s.MaxTurns})
		if err != nil && !errors.Is(err, coil.ErrInfeasible) {
			return SpanOutcome{}, spanFlagError(err, s.GangBSet)
		}
		return SpanOutcome{Span: plan.Span, Geometry: plan.Geometry, Plan: &plan.TapPlan, CoilPlan: &plan}, err
	}
	if s.ChooseTap {
		plan, err := tuning.ChooseTap(spec, tuning.TapSearch{VaryPitch: s.VaryPitch})
		if err != nil && !errors.Is(err, coil.ErrInfeasible) {
			return SpanOutcome{}, spanFlagError(err, s.GangBSet)
		}
		return SpanOutcome{Span: plan.Span, Geometry: plan.Geometry, Plan: &plan}, err
	}
	sp, err := tuning.Solve(spec)
	if err != nil {
		return SpanOutcome{}, spanFlagError(err, s.GangBSet)
	}
	return SpanOutcome{Span: sp, Geometry: g}, nil
}

// spanFlagError names the span flag a coil.InputError belongs to.
func spanFlagError(err error, gangBSet bool) error {
	gangB := "gang-b"
	if !gangBSet {
		gangB = "gang"
	}
	flags := map[string]string{
		"tap_turns": "tap", "gang_a": "gang", "gang_b": gangB, "gang_a_law": "law", "gang_b_law": "law",
		"gang_a_table": "law", "gang_b_table": "law", "gang_a_trimmer": "trim-a", "gang_b_trimmer": "trim-b",
		"gang_a_stray": "stray-a", "gang_b_stray": "stray-b", "steps": "steps", "loaded_q": "loaded-q",
		"margin": "margin", "band": "band", "max_harmonic": "max-harmonic", "bandspread": "bandspread", "turns_range": "max-turns",
	}
	err, _ = withFlag(err, flags)
	return err
}

// DescribeLaw names a section's capacitance law.
func DescribeLaw(a tuning.GangSection) string {
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

// DescribeGang says what a gang section is: range, trimmer and stray.
func DescribeGang(a tuning.GangSection) string {
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
