package trim

import (
	"errors"
	"math"
	"os/exec"
	"strings"
	"testing"

	"turnwise/coil"
)

// The springback rule, at and around its limits.
func TestSpringbackFinding(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name     string
		s        float64
		onFormer bool
		want     FindingKind // 0: no finding
	}{
		{"mandrel, a few percent", 0.04, false, 0},      // typical (common practice)
		{"mandrel, at the upper limit", 0.15, false, 0}, // the limit itself passes
		{"mandrel, beyond the upper limit", 0.16, false, SpringbackUnusual},
		{"mandrel, slightly tighter", -0.02, false, 0},
		{"mandrel, much tighter", -0.05, false, SpringbackUnusual},
		{"former, none", 0.01, true, 0},
		{"former, 5 %", 0.05, true, SpringbackOnFormer},
		{"former, -5 %", -0.05, true, SpringbackOnFormer},
		{"former, 10 % is not a mandrel's finding", 0.10, true, SpringbackOnFormer},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			f, ok := springbackFinding(tc.s, tc.onFormer)
			if got := map[bool]FindingKind{true: f.Kind, false: 0}[ok]; got != tc.want {
				t.Fatalf("springback %g on former %v: finding %v, want %v", tc.s, tc.onFormer, got, tc.want)
			}
			if ok && f.Value != tc.s {
				t.Errorf("value %g, want the springback %g", f.Value, tc.s)
			}
		})
	}
}

func TestMissScatterSectionRules(t *testing.T) {
	t.Parallel()
	t.Run("miss", func(t *testing.T) {
		t.Parallel()
		for _, tc := range []struct {
			a        Action
			miss, u  float64
			want     bool
			describe string
		}{
			{ActionSqueeze, 0.01, 0.02, true, "a change of 1 % against ±2 % reading"},
			{ActionSqueeze, -0.03, 0.02, false, "a miss larger than the uncertainty"},
			{ActionNone, 0.01, 0.02, false, "no change proposed"},
		} {
			if _, ok := missFinding(tc.a, tc.miss, tc.u); ok != tc.want {
				t.Errorf("%s: finding %v, want %v", tc.describe, ok, tc.want)
			}
		}
	})
	t.Run("scatter", func(t *testing.T) {
		t.Parallel()
		for _, tc := range []struct {
			resid, tol float64
			want       bool
		}{
			{0.001, 0.0001, false}, // below the floor
			{0.003, 0.0001, true},
			{0.003, 0.001, false}, // within three times the accuracy
			{0.004, 0.001, true},
		} {
			if got := scatters(tc.resid, tc.tol); got != tc.want {
				t.Errorf("scatter %g with accuracy %g: %v, want %v", tc.resid, tc.tol, got, tc.want)
			}
		}
	})
	t.Run("section", func(t *testing.T) {
		t.Parallel()
		// A section reading 5 % high has model/reading − 1 = 1/1.05 − 1;
		// against ±2 % readings (rss 2.8 %) it departs.
		fit := &SectionFit{Reading: Reading{Uncertainty: 0.02}, Residual: 1/1.05 - 1}
		f, ok := sectionFinding(Top, fit, 0.02)
		if !ok || f.Section != Top || math.Abs(f.Value-0.05) > 1e-12 {
			t.Errorf("5 %% high section: %+v %v, want a Top finding of +5 %%", f, ok)
		}
		fit.Residual = 1/1.02 - 1
		if _, ok := sectionFinding(Bottom, fit, 0.02); ok {
			t.Error("a 2 % departure within ±2.8 % was flagged")
		}
		if _, ok := sectionFinding(Bottom, nil, 0.02); ok {
			t.Error("a section not measured was flagged")
		}
	})
}

// Plan's target follows the aim, and its miss, on-target and deviation
// are the ratios they name.
func TestPlanTargetsAndRatios(t *testing.T) {
	t.Parallel()
	g := vhfExample()
	p, err := coil.Predict(g, 145e6)
	if err != nil {
		t.Fatal(err)
	}
	m := Measurement{Kind: MeasureDirect, Inductance: 106e-9, MeterTolerance: 0.02}
	for _, tc := range []struct {
		name string
		aim  Aim
		want Target
	}{
		{"model", Aim{}, Target{Inductance: p.Inductance, Frequency: 145e6}},
		{"given", Aim{Source: TargetGiven, Inductance: 95e-9}, Target{Inductance: 95e-9, Frequency: 145e6}},
		{"resonance", Aim{Source: TargetResonance, Resonance: 140e6, Capacitance: 12e-12}, ResonanceTarget(140e6, 12e-12)},
	} {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			res, err := Plan(Request{Geometry: g, Frequency: 145e6, Measurement: m, Aim: tc.aim, Tolerance: 0.005, LengthSteps: LengthSteps(false)})
			if err != nil {
				t.Fatal(err)
			}
			if res.Target != tc.want {
				t.Errorf("target %+v, want %+v", res.Target, tc.want)
			}
			c := res.Correction
			if e := relErr(res.Miss, float64(c.Before)/float64(c.Target)-1); e > implTol {
				t.Errorf("miss %g", res.Miss)
			}
			if res.OnTarget != (math.Abs(res.Miss) <= 0.005) {
				t.Errorf("on target %v with miss %g", res.OnTarget, res.Miss)
			}
			if e := relErr(res.Deviation, 106e-9/float64(res.Calibration.ModelBefore)-1); e > implTol {
				t.Errorf("deviation %g", res.Deviation)
			}
			if tc.aim.Source == TargetResonance && res.AfterResonance == 0 {
				t.Error("no resonance after the change")
			}
		})
	}
}

// Plan's errors name the field: a resonance aim too close to the
// self-resonance is the target's fault, and a target no change reaches
// wraps coil.ErrInfeasible.
func TestPlanErrors(t *testing.T) {
	t.Parallel()
	g := vhfExample()
	m := Measurement{Kind: MeasureDirect, Inductance: 106e-9, MeterTolerance: 0.02}
	p, err := coil.Predict(g, 0)
	if err != nil {
		t.Fatal(err)
	}
	_, err = Plan(Request{Geometry: g, Measurement: m, Aim: Aim{Source: TargetResonance, Resonance: p.SRF, Capacitance: 0.1e-12}, Tolerance: 0.005})
	var ie *coil.InputError
	if !errors.As(err, &ie) || ie.Param != "target" {
		t.Errorf("resonance aim at the SRF: %v, want an *InputError for target", err)
	}
	_, err = Plan(Request{Geometry: g, Measurement: m, Aim: Aim{Source: TargetGiven, Inductance: 1e-12}, Tolerance: 0.005})
	if !errors.Is(err, coil.ErrInfeasible) {
		t.Errorf("1 pH: %v, want ErrInfeasible", err)
	}
	_, err = Plan(Request{Geometry: g, Measurement: m, Tolerance: 0.005, Tap: &TapRequest{Turns: 5}})
	if !errors.As(err, &ie) || ie.Param != "tap_turns" {
		t.Errorf("tap at the end: %v, want an *InputError for tap_turns", err)
	}
	ratio := 0.99
	bottom := &Measurement{Kind: MeasureDirect, Inductance: 30e-9, MeterTolerance: 0.02}
	top := &Measurement{Kind: MeasureDirect, Inductance: 50e-9, MeterTolerance: 0.02}
	_, err = Plan(Request{Geometry: g, Measurement: m, Tolerance: 0.005, Tap: &TapRequest{Turns: 1, Ratio: &ratio, Bottom: bottom, Top: top}})
	if !errors.As(err, &ie) || (ie.Param != "tap_ratio" && ie.Param != "measured_bottom" && ie.Param != "measured_top") {
		t.Errorf("ratio 0.99 with sections: %v, want an *InputError for the tap or its readings", err)
	}
}

// PlanTap keeps the measured offset: the ratio as built is the measured
// ratio (the calibrated model's plus the offset is an identity), and the
// new tap is the quarter turn whose model ratio is nearest the wanted one
// less the offset, found here by trying them all.
func TestPlanTapKeepsOffset(t *testing.T) {
	t.Parallel()
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 8, Pitch: 2e-3, LeadLength: 4e-3}
	truth := g
	truth.Springback = 0.04
	const tap, f = 2.0, 0
	sec, err := coil.Tap(truth, tap, f)
	if err != nil {
		t.Fatal(err)
	}
	cal, err := Calibrate(g, Measurement{Kind: MeasureDirect, Inductance: sec.L, MeterTolerance: 0.02})
	if err != nil {
		t.Fatal(err)
	}
	// The bottom section reads 6 % high: the tap sits a little higher than
	// the model puts it.
	bottom := &Measurement{Kind: MeasureDirect, Inductance: sec.LB * 1.06, MeterTolerance: 0.02}
	top := &Measurement{Kind: MeasureDirect, Inductance: sec.LA, MeterTolerance: 0.02}
	corrected := cal.Geometry
	corrected.Pitch = 1.8e-3
	want := 0.3
	tp, err := PlanTap(g, cal, corrected, f, TapRequest{Turns: tap, Ratio: &want, Bottom: bottom, Top: top})
	if err != nil {
		t.Fatal(err)
	}
	sc := tp.Sections
	if sc == nil || sc.MeasuredRatio == 0 {
		t.Fatal("both sections read, but no measured ratio")
	}
	if math.Abs(tp.Offset-(sc.MeasuredRatio-sc.ModelRatio)) > 1e-15 || tp.Offset <= 0 {
		t.Errorf("offset %g, measured %g model %g", tp.Offset, sc.MeasuredRatio, sc.ModelRatio)
	}
	if math.Abs(tp.RatioBefore-sc.MeasuredRatio) > 1e-12 {
		t.Errorf("ratio as built %g, measured %g", tp.RatioBefore, sc.MeasuredRatio)
	}
	best, bestTurns := math.Inf(1), 0.0
	for q := 1; q < int(corrected.Turns*4); q++ {
		s, err := coil.Tap(corrected, float64(q)/4, f)
		if err != nil {
			t.Fatal(err)
		}
		if d := math.Abs(s.Ratio - (want - tp.Offset)); d < best {
			best, bestTurns = d, float64(q)/4
		}
	}
	if tp.NewTurns != bestTurns {
		t.Errorf("new tap %g turns, the nearest to %g less the offset is %g", tp.NewTurns, want, bestTurns)
	}
	if tp.OutOfReach {
		t.Error("a ratio of 0.3 on 8 turns was called out of reach")
	}
	// Without section readings there is no offset.
	tp, err = PlanTap(g, cal, corrected, f, TapRequest{Turns: tap, Ratio: &want})
	if err != nil {
		t.Fatal(err)
	}
	if tp.Offset != 0 || tp.Sections != nil {
		t.Errorf("no sections read: offset %g", tp.Offset)
	}
	// A ratio beyond the first quarter turn's is out of reach.
	tiny := 1e-4
	if tp, err = PlanTap(g, cal, corrected, f, TapRequest{Turns: tap, Ratio: &tiny}); err != nil || !tp.OutOfReach || tp.NewTurns != 0.25 {
		t.Errorf("ratio 1e-4: %+v, %v; want the quarter-turn tap, out of reach", tp, err)
	}
}

// trim imports coil, internal/quantity, the standard library and gonum, nothing of the
// command, the sheets or the catalogs.
func TestImports(t *testing.T) {
	if testing.Short() {
		t.Skip("runs go list")
	}
	out, err := exec.Command("go", "list", "-deps", "turnwise/coil/trim").CombinedOutput()
	if err != nil {
		t.Fatalf("go list: %v\n%s", err, out)
	}
	for _, dep := range strings.Fields(string(out)) {
		if strings.HasPrefix(dep, "turnwise/") && dep != "turnwise/coil" && dep != "turnwise/coil/trim" && dep != "turnwise/internal/quantity" {
			t.Errorf("trim imports %s", dep)
		}
		if strings.Contains(dep, "cobra") || strings.Contains(dep, "gofpdf") {
			t.Errorf("trim depends on %s", dep)
		}
	}
}
