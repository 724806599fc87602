package tuning

import (
	"errors"
	"strings"
	"testing"
	"turnwise/coil"
)

// 160 m, 80 m and 40 m (ITU Region 1 edges, common practice) on the
// invented 40-turn coil: no tap of it covers them (ChooseTap fails), but
// choosing the turns and pitch too finds a coil that does, and the span
// of that coil, solved on its own, covers every band with the margin,
// overlaps and has no coincidence.
func TestChooseCoilWhereChooseTapFails(t *testing.T) {
	t.Parallel()
	bands := []Band{{"160m", 1.81e6, 2.0e6}, {"80m", 3.5e6, 3.8e6}, {"40m", 7e6, 7.2e6}}
	spec := Spec{Geometry: hfTapExample(), A: hfGang(), B: hfGang(), Bands: bands}
	if _, err := ChooseTap(spec, TapSearch{}); !errors.Is(err, coil.ErrInfeasible) {
		t.Fatalf("premise: ChooseTap on 40 turns: %v", err)
	}
	plan, err := ChooseCoil(spec, CoilSearch{})
	if err != nil {
		t.Fatal(err)
	}
	if !plan.Feasible || plan.Coils < 50 {
		t.Fatalf("plan %+v", plan)
	}
	spec.Geometry, spec.TapTurns = plan.Geometry, plan.TapTurns
	sp, err := Solve(spec)
	if err != nil {
		t.Fatal(err)
	}
	for _, b := range sp.Bands {
		if bandRoom(b.Band, sp.Low, sp.High, sp.HasHigh, DefaultMargin) < DefaultMargin {
			t.Errorf("band %s not covered with the margin: low %+v high %+v", b.Band.Name, sp.Low, sp.High)
		}
	}
	if !sp.HasHigh || float64(sp.Overlap)/float64(sp.High.Min) < DefaultMargin {
		t.Errorf("overlap %v", sp.Overlap)
	}
	if len(sp.Coincidences) != 0 {
		t.Errorf("coincidences %+v", sp.Coincidences)
	}
}

// Impossible: 1.8–30 MHz as one band with a 15–200 pF capacitor. The
// plan says what would make it possible.
func TestChooseCoilImpossibleSaysWhy(t *testing.T) {
	t.Parallel()
	g := GangSection{Min: 15e-12, Max: 200e-12, Stray: 5e-12}
	spec := Spec{Geometry: hfTapExample(), A: g, B: g, Bands: []Band{{"", 1.8e6, 30e6}}}
	plan, err := ChooseCoil(spec, CoilSearch{MaxTurns: 80})
	if !errors.Is(err, coil.ErrInfeasible) || plan.Feasible {
		t.Fatalf("err %v", err)
	}
	if len(plan.Advice) == 0 || !strings.Contains(err.Error(), plan.Advice[0]) {
		t.Errorf("advice %q not in %v", plan.Advice, err)
	}
}
