package tuning

import (
	"strings"
	"testing"
)

func TestParseLaw(t *testing.T) {
	t.Parallel()
	tests := []struct {
		in   string
		want Law
		ok   bool
	}{
		{"", LawSLC, true},
		{"slc", LawSLC, true},
		{" SLF ", LawSLF, true},
		{"slw", LawSLW, true},
		{"testdata/gang.csv", LawTable, false},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			t.Parallel()
			if got, ok := ParseLaw(tc.in); got != tc.want || ok != tc.ok {
				t.Errorf("ParseLaw(%q) = %v, %v; want %v, %v", tc.in, got, ok, tc.want, tc.ok)
			}
		})
	}
}

func TestPassbandRule(t *testing.T) {
	t.Parallel()
	if got := PassbandRule(0); !strings.Contains(got, "half the coil model's Q") {
		t.Errorf("PassbandRule(0) = %q", got)
	}
	if got := PassbandRule(150); !strings.Contains(got, "(150)") {
		t.Errorf("PassbandRule(150) = %q", got)
	}
}

// Placement on hand-made coverages, and on the HF example's span, where
// each band's dial settings tune its edges on the range named.
func TestBandPlacement(t *testing.T) {
	t.Parallel()
	low := BandOnRange{Range: "low", Whole: true, SettingAtLow: 0.8, SettingAtHigh: 0.6}
	high := BandOnRange{Range: "high", Whole: true, SettingAtLow: 0.3, SettingAtHigh: 0.1}
	part := BandOnRange{Range: "high", Fraction: 0.4, SettingAtLow: 0.02, SettingAtHigh: 0}
	tests := []struct {
		name   string
		ranges []BandOnRange
		want   Placement
		on     BandOnRange
	}{
		{"none", nil, PlacedNone, BandOnRange{}},
		{"low", []BandOnRange{low}, PlacedLow, low},
		{"high", []BandOnRange{high}, PlacedHigh, high},
		{"both", []BandOnRange{low, high}, PlacedBoth, low},
		{"part", []BandOnRange{part}, PlacedPart, part},
		{"whole beats part", []BandOnRange{part, low}, PlacedLow, low},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			bc := BandCoverage{Ranges: tc.ranges}
			if p, on := bc.Placement(); p != tc.want || on != tc.on {
				t.Errorf("Placement() = %v, %+v; want %v, %+v", p, on, tc.want, tc.on)
			}
		})
	}
	sp, err := Solve(Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands})
	if err != nil {
		t.Fatal(err)
	}
	c, _ := newSpanCircuit(Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang()})
	for _, bc := range sp.Bands {
		p, on := bc.Placement()
		if p == PlacedNone || p == PlacedPart {
			t.Errorf("%s: %v, the example covers it", bc.Band.Name, p)
			continue
		}
		if f := c.freq(on.SettingAtLow, on.Range == "high"); relErr(f, float64(bc.Band.Low)) > 1e-9 {
			t.Errorf("%s placed %v: the %s range is at %g at the band's low edge setting", bc.Band.Name, p, on.Range, f)
		}
	}
}

func TestSpanRules(t *testing.T) {
	t.Parallel()
	for p, want := range map[Placement]string{PlacedNone: "none", PlacedLow: "low", PlacedHigh: "high", PlacedBoth: "both", PlacedPart: "part"} {
		if p.String() != want { // the words of the span JSON's "range" key
			t.Errorf("%d.String() = %q, want %q", int(p), p.String(), want)
		}
	}
	sp := Span{HasHigh: true, Overlap: 0.3e6, High: FreqRange{Min: 6e6, Max: 20e6}}
	if got := sp.OverlapFraction(); relErr(got, 0.05) > implTol {
		t.Errorf("OverlapFraction = %g, want 0.05", got)
	}
	if got := (&Span{}).OverlapFraction(); got != 0 {
		t.Errorf("no high range: %g", got)
	}
	on := BandOnRange{Whole: true, Margin: 0.02}
	if !on.TightAtEnd(DefaultMargin) || on.TightAtEnd(0.01) || (BandOnRange{Margin: -0.1}).TightAtEnd(DefaultMargin) {
		t.Error("TightAtEnd")
	}
	if (Coincidence{SettingFrom: 0.3, SettingTo: 0.3005}).Stretch() || !(Coincidence{SettingFrom: 0.3, SettingTo: 0.31}).Stretch() {
		t.Error("Stretch")
	}
}
