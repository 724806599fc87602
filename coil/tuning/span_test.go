package tuning

import (
	"math"
	"strings"
	"testing"
	"turnwise/coil"
)

// hfBands are the invented example's bands: 80 m and 40 m amateur (ITU
// Region 1 edges, common practice) and the 31 m broadcast band.
var hfBands = []Band{{"80m", 3.5e6, 3.8e6}, {"40m", 7.0e6, 7.2e6}, {"31m", 9.4e6, 9.9e6}}

func hfGang() GangSection { return GangSection{Min: 15e-12, Max: 365e-12, Stray: 5e-12} }

func TestSolveSpanExample(t *testing.T) {
	t.Parallel()
	sp, err := Solve(Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands})
	if err != nil {
		t.Fatal(err)
	}
	if len(sp.Dial) != 11 || sp.Dial[0].Setting != 0 || sp.Dial[10].Setting != 1 {
		t.Fatalf("dial rows %+v", sp.Dial)
	}
	for i, r := range sp.Dial {
		if !(r.FLow > 0 && r.FHigh > r.FLow) {
			t.Fatalf("row %d: %+v", i, r)
		}
		if i > 0 && !(r.FLow < sp.Dial[i-1].FLow && r.FHigh < sp.Dial[i-1].FHigh) {
			t.Errorf("row %d: frequencies do not fall as the plates mesh", i)
		}
		// Each row is the eigen solution at its own capacitances.
		want, _ := TwoNodeResonances(sp.Sections, r.CTop, r.CTap)
		if r.FLow != want.Low || r.FHigh != want.High {
			t.Errorf("row %d differs from TwoNodeResonances", i)
		}
		if relErr(float64(r.CTop), float64(r.CA)+5e-12+float64(sp.SelfCapacitance)) > implTol || relErr(float64(r.CTap), float64(r.CB)+5e-12) > implTol {
			t.Errorf("row %d: node capacitances %v %v", i, r.CTop, r.CTap)
		}
	}
	if sp.Overlap != sp.Low.Max-sp.High.Min || !sp.HasHigh {
		t.Errorf("overlap %v, ranges %+v %+v", sp.Overlap, sp.Low, sp.High)
	}
	// Band edges: the range is tuned to the edge at the reported setting.
	c, _ := newSpanCircuit(Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang()})
	for _, bc := range sp.Bands {
		if !bc.Covered {
			t.Errorf("band %s not covered: %+v", bc.Band.Name, bc)
		}
		for _, on := range bc.Ranges {
			high := on.Range == "high"
			if f := c.freq(on.SettingAtLow, high); relErr(f, float64(bc.Band.Low)) > 1e-9 {
				t.Errorf("%s on %s range: at %g the range is at %g, band edge %g", bc.Band.Name, on.Range, on.SettingAtLow, f, float64(bc.Band.Low))
			}
			if f := c.freq(on.SettingAtHigh, high); relErr(f, float64(bc.Band.High)) > 1e-9 {
				t.Errorf("%s on %s range: at %g the range is at %g, band edge %g", bc.Band.Name, on.Range, on.SettingAtHigh, f, float64(bc.Band.High))
			}
		}
	}
}

// Coincidences, checked against a brute-force scan: wherever the low
// range is in a listed band and a harmonic is inside the passband, a
// reported coincidence's stretch contains that setting; at each reported
// point the offset is the harmonic minus the high range.
func TestSpanCoincidences(t *testing.T) {
	t.Parallel()
	spec := Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands}
	sp, err := Solve(spec)
	if err != nil {
		t.Fatal(err)
	}
	if len(sp.Coincidences) == 0 {
		t.Fatal("the example's 3rd-harmonic coincidence in 40 m was not found")
	}
	c, _ := newSpanCircuit(spec)
	for _, co := range sp.Coincidences {
		r, _ := c.at(co.Setting)
		off := float64(co.Order)*float64(r.FLow) - float64(r.FHigh)
		if math.Abs(off-float64(co.Offset)) > 1e-6*float64(r.FHigh) || co.Depth > 1 {
			t.Errorf("%+v: offset at its setting is %g", co, off)
		}
		x := 2 * co.LoadedQ * float64(co.Offset) / float64(co.FHigh)
		if relErr(co.AttenuationDB, 10*math.Log10(1+x*x)) > implTol && co.AttenuationDB > 1e-12 {
			t.Errorf("attenuation %g dB", co.AttenuationDB)
		}
	}
	const n = 4000
	for i := 0; i <= n; i++ {
		x := float64(i) / n
		r, _ := c.at(x)
		var band string
		for _, b := range hfBands {
			if r.FLow >= b.Low && r.FLow <= b.High {
				band = b.Name
			}
		}
		if band == "" {
			continue
		}
		for _, m := range []int{2, 3} {
			h := c.measure(band, m, r)
			if h.Depth > 0.9 { // clear of the edge, where grid resolution decides
				continue
			}
			found := false
			for _, co := range sp.Coincidences {
				if co.Order == m && x >= co.SettingFrom-1e-3 && x <= co.SettingTo+1e-3 {
					found = true
				}
			}
			if !found {
				t.Errorf("dial %g: order %d harmonic %.1f%% of half-passband from the peak, not reported", x, m, h.Depth*100)
			}
		}
	}
}

// Section B at zero: one resonance at every setting, the whole coil's
// tank with section A, its stray and the self-capacitance.
func TestSpanGangBZero(t *testing.T) {
	t.Parallel()
	g := hfTapExample()
	sp, err := Solve(Spec{Geometry: g, TapTurns: 17, A: hfGang(), B: GangSection{}})
	if err != nil {
		t.Fatal(err)
	}
	if sp.HasHigh || len(sp.Coincidences) != 0 {
		t.Errorf("B at zero: high range %v, coincidences %d", sp.HasHigh, len(sp.Coincidences))
	}
	for _, r := range sp.Dial {
		want := coil.ResonantFrequency(sp.Sections.L, r.CTop)
		if r.FHigh != 0 || relErr(float64(r.FLow), float64(want)) > implTol {
			t.Errorf("setting %g: %v, single tank %v", r.Setting, r.FLow, want)
		}
	}
}

// The tap at the top: both sections across the whole coil, one range.
func TestSpanTapAtTop(t *testing.T) {
	t.Parallel()
	g := hfTapExample()
	sp, err := Solve(Spec{Geometry: g, TapTurns: g.Turns, A: hfGang(), B: hfGang()})
	if err != nil {
		t.Fatal(err)
	}
	if sp.HasHigh {
		t.Error("tap at the top has a high range")
	}
	for _, r := range sp.Dial {
		if want := coil.ResonantFrequency(sp.Sections.L, r.CTop+r.CTap); relErr(float64(r.FLow), float64(want)) > implTol {
			t.Errorf("setting %g: %v, want %v", r.Setting, r.FLow, want)
		}
	}
}

// A fixed capacitor on section B (MIN = MAX): only section A moves.
func TestSpanFixedB(t *testing.T) {
	t.Parallel()
	sp, err := Solve(Spec{Geometry: hfTapExample(), TapTurns: 10, A: hfGang(), B: GangSection{Min: 47e-12, Max: 47e-12}, Steps: 5})
	if err != nil {
		t.Fatal(err)
	}
	for _, r := range sp.Dial {
		if r.CB != 47e-12 || r.CTap != 47e-12 {
			t.Errorf("setting %g: C_B %v", r.Setting, r.CB)
		}
	}
	if len(sp.Dial) != 5 {
		t.Errorf("%d rows, want 5", len(sp.Dial))
	}
}

func TestSolveSpanBadInput(t *testing.T) {
	t.Parallel()
	base := Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang()}
	tests := []struct {
		name  string
		edit  func(s *Spec)
		param string
	}{
		{"tap beyond", func(s *Spec) { s.TapTurns = 41 }, "tap_turns"},
		{"steps", func(s *Spec) { s.Steps = 1 }, "steps"},
		{"band upside down", func(s *Spec) { s.Bands = []Band{{"x", 7e6, 3e6}} }, "band"},
		{"Q negative", func(s *Spec) { s.LoadedQ = -1 }, "loaded_q"},
		{"gang B", func(s *Spec) { s.B.Max = 1e-12 }, "gang_b"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			s := base
			tc.edit(&s)
			_, err := Solve(s)
			ie, ok := err.(*coil.InputError)
			if !ok || ie.Param != tc.param {
				t.Errorf("err = %v, want coil.InputError %s", err, tc.param)
			}
		})
	}
}

// A loaded Q so high that the passband is narrower than the dial scan's
// step: the harmonic still crosses the high range's peak, and that
// crossing must be reported (a scan that only tests rows for "inside"
// misses it). The crossing is located independently by a fine scan of
// 3·f_low − f_high for a sign change.
func TestSpanCoincidenceNarrowPassband(t *testing.T) {
	t.Parallel()
	for _, q := range []float64{1e4, 1e5} {
		spec := Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), LoadedQ: q}
		sp, err := Solve(spec)
		if err != nil {
			t.Fatal(err)
		}
		c, _ := newSpanCircuit(spec)
		const n = 20000
		var crossings []float64
		prev := math.NaN()
		for i := 0; i <= n; i++ {
			x := float64(i) / n
			g := 3*c.freq(x, false) - c.freq(x, true)
			if i > 0 && (g > 0) != (prev > 0) {
				crossings = append(crossings, x)
			}
			prev = g
		}
		if len(crossings) == 0 {
			t.Fatal("the example has no 3rd-harmonic crossing to test")
		}
		for _, x := range crossings {
			found := false
			for _, co := range sp.Coincidences {
				if co.Order == 3 && math.Abs(co.Setting-x) <= 1.0/n && co.Depth <= 1 {
					found = true
				}
			}
			if !found {
				t.Errorf("Q %g: the 3rd harmonic crosses the high range's peak at %.4f of the dial, reported %+v", q, x, sp.Coincidences)
			}
		}
	}
}

// A gap between the ranges comes with the tap that closes it. The overlap
// is not monotonic in the tap (the high range rises towards both ends), so
// the advice cannot be a fixed direction: from a tap a quarter turn above
// the cold end the fix is to move up, from one near the top to move down.
func TestSpanGapAdvice(t *testing.T) {
	t.Parallel()
	g := hfTapExample()
	overlapAt := func(spec Spec, tap float64) float64 {
		spec.TapTurns = tap
		c, err := newSpanCircuit(spec)
		if err != nil {
			t.Fatal(err)
		}
		open, _ := c.at(0)
		meshed, _ := c.at(1)
		return float64(open.FLow - meshed.FHigh)
	}
	for _, tap := range []float64{0.25, g.Turns - 1} {
		spec := Spec{Geometry: g, TapTurns: tap, A: hfGang(), B: hfGang(), Steps: 2}
		sp, err := Solve(spec)
		if err != nil {
			t.Fatal(err)
		}
		if sp.Overlap >= 0 {
			t.Fatalf("tap %g: the ranges overlap (%v); the test needs a gap", tap, sp.Overlap)
		}
		if !(sp.WidestOverlap >= 0) || !strings.Contains(sp.GapAdvice(), "overlap by") {
			t.Fatalf("tap %g: advice %q, widest overlap %v", tap, sp.GapAdvice(), sp.WidestOverlap)
		}
		if (sp.WidestOverlapTap > tap) != (tap < g.Turns/2) {
			t.Errorf("tap %g: advised tap %g is on the wrong side", tap, sp.WidestOverlapTap)
		}
		// The advised tap's own span has that overlap, and no quarter-turn
		// tap overlaps more (relative to the high range's bottom).
		fix := spec
		fix.TapTurns = sp.WidestOverlapTap
		got, err := Solve(fix)
		if err != nil || relErr(float64(got.Overlap), float64(sp.WidestOverlap)) > implTol {
			t.Errorf("tap %g: span at the advised tap overlaps %v, advice says %v (%v)", tap, got.Overlap, sp.WidestOverlap, err)
		}
		best := float64(got.Overlap) / float64(got.High.Min)
		for i := 1; i < int(g.Turns*4); i++ {
			x := float64(i) / 4
			spec.TapTurns = x
			c, _ := newSpanCircuit(spec)
			meshed, _ := c.at(1)
			if rel := overlapAt(spec, x) / float64(meshed.FHigh); rel > best+1e-12 {
				t.Errorf("tap %g overlaps by %.4f, more than the advised %g's %.4f", x, rel, sp.WidestOverlapTap, best)
			}
		}
	}
	// A capacitor with too little swing: no tap closes the gap, and the
	// advice says so.
	spec := Spec{Geometry: g, TapTurns: 17, A: GangSection{Min: 100e-12, Max: 365e-12}, B: GangSection{Min: 100e-12, Max: 365e-12}, Steps: 2}
	sp, err := Solve(spec)
	if err != nil {
		t.Fatal(err)
	}
	if sp.Overlap >= 0 || sp.WidestOverlap >= 0 || !strings.Contains(sp.GapAdvice(), "no tap on this winding closes it") {
		t.Errorf("100–365 pF: overlap %v, widest %v, advice %q", sp.Overlap, sp.WidestOverlap, sp.GapAdvice())
	}
	for i := 1; i < int(g.Turns*4); i++ {
		if ov := overlapAt(spec, float64(i)/4); ov > float64(sp.WidestOverlap)+1e-6 {
			t.Errorf("tap %g leaves a gap of %g Hz, smaller than the advised %v", float64(i)/4, -ov, -sp.WidestOverlap)
		}
	}
}

// A high range reaching past the coil's self-resonance is flagged as
// outside the lumped model, not only as past a third of it.
func TestSpanAboveSRFWarning(t *testing.T) {
	t.Parallel()
	sp, err := Solve(Spec{Geometry: hfTapExample(), TapTurns: 0.25, A: hfGang(), B: hfGang(), Steps: 2})
	if err != nil {
		t.Fatal(err)
	}
	p, _ := coil.Predict(hfTapExample(), 0)
	if !(sp.High.Max > p.SRF) {
		t.Fatalf("high range top %v is below the SRF %v; the test needs it above", sp.High.Max, p.SRF)
	}
	if !strings.Contains(strings.Join(sp.Warnings, "\n"), "lumped circuit does not hold") {
		t.Errorf("warnings %q", sp.Warnings)
	}
}
