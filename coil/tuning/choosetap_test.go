package tuning

import (
	"errors"
	"math"
	"strings"
	"testing"
	"turnwise/coil"
)

// checkPlan verifies a feasible plan's span independently of the scoring:
// every band inside a range with the margin, the ranges overlapping by the
// margin, and no coincidence reported.
func checkPlan(t *testing.T, p TapPlan, bands []Band, margin float64) {
	t.Helper()
	sp := p.Span
	for _, b := range bands {
		ok := false
		for _, rg := range []FreqRange{sp.Low, sp.High} {
			if float64(b.Low) >= float64(rg.Min)*(1+margin) && float64(b.High) <= float64(rg.Max)*(1-margin) {
				ok = true
			}
		}
		if !ok {
			t.Errorf("band %s not inside a range with %g margin: low %+v high %+v", b.Name, margin, sp.Low, sp.High)
		}
	}
	if float64(sp.Low.Max) < float64(sp.High.Min)*(1+margin) {
		t.Errorf("ranges overlap by less than the margin: %+v %+v", sp.Low, sp.High)
	}
	if len(sp.Coincidences) != 0 {
		t.Errorf("coincidences left: %+v", sp.Coincidences)
	}
	if p.Span.Sections.TapTurns != p.TapTurns {
		t.Errorf("span is at tap %g, plan says %g", p.Span.Sections.TapTurns, p.TapTurns)
	}
}

// The invented example: at tap 17 the low range's 3rd harmonic lands on
// the high range in 40 m; ChooseTap finds a tap without it that covers
// 80 m, 40 m and 31 m with the default 3 % margin.
func TestChooseTapExample(t *testing.T) {
	t.Parallel()
	spec := Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands}
	p, err := ChooseTap(spec, TapSearch{})
	if err != nil {
		t.Fatal(err)
	}
	if !p.Feasible || len(p.Conflicts) != 0 || p.Clearance <= 1 {
		t.Fatalf("plan %+v", p)
	}
	checkPlan(t, p, hfBands, DefaultMargin)
	if p.Tried != int(hfTapExample().Turns*4)-1 {
		t.Errorf("tried %d taps, want every quarter turn on the winding", p.Tried)
	}
	if p.Geometry.Pitch != hfTapExample().Pitch {
		t.Error("pitch changed without VaryPitch")
	}
}

// Bands a 15–365 pF capacitor cannot reach together with overlap: 160 m,
// 20 m and 10 m need a 16:1 span across two ranges of about 4:1 each that
// must also overlap. ChooseTap says which requirement conflicts and still
// returns its best compromise.
func TestChooseTapInfeasible(t *testing.T) {
	t.Parallel()
	bands := []Band{{"160m", 1.81e6, 2.0e6}, {"20m", 14.0e6, 14.35e6}, {"10m", 28.0e6, 29.7e6}} // amateur bands, Region 1 (common practice)
	spec := Spec{Geometry: hfTapExample(), A: hfGang(), B: hfGang(), Bands: bands}
	p, err := ChooseTap(spec, TapSearch{})
	if !errors.Is(err, coil.ErrInfeasible) {
		t.Fatalf("err = %v, want coil.ErrInfeasible", err)
	}
	if p.Feasible || len(p.Conflicts) == 0 || p.Span.Dial == nil {
		t.Errorf("compromise %+v", p)
	}
	if p.CoveringOverlapping != 0 {
		t.Errorf("%d taps cover and overlap; the test expects none", p.CoveringOverlapping)
	}
}

// With the pitch free as well the answer is never worse than with the
// pitch held, and the pitch stays in the window the search promises.
func TestChooseTapVaryPitch(t *testing.T) {
	if testing.Short() {
		t.Skip("runs Nelder–Mead over the pitch")
	}
	t.Parallel()
	bands := []Band{{"80m", 3.5e6, 3.8e6}, {"40m", 7.0e6, 7.2e6}, {"19m", 15.1e6, 15.8e6}} // 19 m broadcast band
	g := hfTapExample()
	spec := Spec{Geometry: g, A: hfGang(), B: hfGang(), Bands: bands, Margin: 0.05}
	fixed, errFixed := ChooseTap(spec, TapSearch{})
	free, errFree := ChooseTap(spec, TapSearch{VaryPitch: true})
	if errFree != nil && !errors.Is(errFree, coil.ErrInfeasible) {
		t.Fatal(errFree)
	}
	if errFixed == nil && errFree != nil {
		t.Errorf("feasible with the pitch held, infeasible with it free: %v", errFree)
	}
	do := float64(g.OverallDiameter())
	if p := float64(free.Geometry.Pitch); p < do*(1-1e-12) || p > coil.LoosestPitchFactor*do*(1+1e-12) {
		t.Errorf("pitch %g outside [%g, %g]", p, do, coil.LoosestPitchFactor*do)
	}
	if free.Feasible {
		checkPlan(t, free, bands, 0.05)
	}
	if fixed.Feasible && free.Feasible && free.Clearance < math.Min(fixed.Clearance, 10)-1e-9 && free.Clearance < 10 {
		t.Errorf("free pitch clearance %g below fixed %g", free.Clearance, fixed.Clearance)
	}
}

func TestChooseTapNeedsBands(t *testing.T) {
	t.Parallel()
	_, err := ChooseTap(Spec{Geometry: hfTapExample(), A: hfGang(), B: hfGang()}, TapSearch{})
	var ie *coil.InputError
	if !errors.As(err, &ie) || ie.Param != "band" {
		t.Errorf("err = %v, want band coil.InputError", err)
	}
}

// The binding requirement follows from the counts over the taps tried.
func TestTapPlanBinding(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		plan TapPlan
		want string
	}{
		{"nothing covers", TapPlan{Tried: 10, Overlapping: 5, Clean: 10}, "no tap covers every band"},
		{"nothing overlaps", TapPlan{Tried: 10, Covering: 4, Clean: 10}, "no tap makes the ranges overlap"},
		{"cover or overlap", TapPlan{Tried: 10, Covering: 4, Overlapping: 5, Clean: 10}, "conflict"},
		{"harmonics", TapPlan{Tried: 10, Covering: 4, Overlapping: 5, CoveringOverlapping: 2, Clean: 8}, "harmonic"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			if got := tc.plan.binding(); !strings.Contains(got, tc.want) {
				t.Errorf("binding() = %q, want it to say %q", got, tc.want)
			}
		})
	}
}
