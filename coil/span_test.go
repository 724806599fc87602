package coil

import (
	"math"
	"testing"
)

// hfBands are the invented example's bands: 80 m and 40 m amateur (ITU
// Region 1 edges, common practice) and the 31 m broadcast band.
var hfBands = []Band{{"80m", 3.5e6, 3.8e6}, {"40m", 7.0e6, 7.2e6}, {"31m", 9.4e6, 9.9e6}}

func hfGang() GangSection { return GangSection{Min: 15e-12, Max: 365e-12, Stray: 5e-12} }

func TestSolveSpanExample(t *testing.T) {
	t.Parallel()
	sp, err := SolveSpan(SpanSpec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands})
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
	c, _ := newSpanCircuit(SpanSpec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang()})
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
	spec := SpanSpec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands}
	sp, err := SolveSpan(spec)
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
	sp, err := SolveSpan(SpanSpec{Geometry: g, TapTurns: 17, A: hfGang(), B: GangSection{}})
	if err != nil {
		t.Fatal(err)
	}
	if sp.HasHigh || len(sp.Coincidences) != 0 {
		t.Errorf("B at zero: high range %v, coincidences %d", sp.HasHigh, len(sp.Coincidences))
	}
	for _, r := range sp.Dial {
		want := ResonantFrequency(sp.Sections.L, r.CTop)
		if r.FHigh != 0 || relErr(float64(r.FLow), float64(want)) > implTol {
			t.Errorf("setting %g: %v, single tank %v", r.Setting, r.FLow, want)
		}
	}
}

// The tap at the top: both sections across the whole coil, one range.
func TestSpanTapAtTop(t *testing.T) {
	t.Parallel()
	g := hfTapExample()
	sp, err := SolveSpan(SpanSpec{Geometry: g, TapTurns: g.Turns, A: hfGang(), B: hfGang()})
	if err != nil {
		t.Fatal(err)
	}
	if sp.HasHigh {
		t.Error("tap at the top has a high range")
	}
	for _, r := range sp.Dial {
		if want := ResonantFrequency(sp.Sections.L, r.CTop+r.CTap); relErr(float64(r.FLow), float64(want)) > implTol {
			t.Errorf("setting %g: %v, want %v", r.Setting, r.FLow, want)
		}
	}
}

// A fixed capacitor on section B (MIN = MAX): only section A moves.
func TestSpanFixedB(t *testing.T) {
	t.Parallel()
	sp, err := SolveSpan(SpanSpec{Geometry: hfTapExample(), TapTurns: 10, A: hfGang(), B: GangSection{Min: 47e-12, Max: 47e-12}, Steps: 5})
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
	base := SpanSpec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang()}
	tests := []struct {
		name  string
		edit  func(s *SpanSpec)
		param string
	}{
		{"tap beyond", func(s *SpanSpec) { s.TapTurns = 41 }, "tap_turns"},
		{"steps", func(s *SpanSpec) { s.Steps = 1 }, "steps"},
		{"band upside down", func(s *SpanSpec) { s.Bands = []Band{{"x", 7e6, 3e6}} }, "band"},
		{"Q negative", func(s *SpanSpec) { s.LoadedQ = -1 }, "loaded_q"},
		{"gang B", func(s *SpanSpec) { s.B.Max = 1e-12 }, "gang_b"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			s := base
			tc.edit(&s)
			_, err := SolveSpan(s)
			ie, ok := err.(*InputError)
			if !ok || ie.Param != tc.param {
				t.Errorf("err = %v, want InputError %s", err, tc.param)
			}
		})
	}
}
