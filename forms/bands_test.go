package forms

import (
	"errors"
	"math"
	"strings"
	"testing"
	"turnwise/internal/quantity"
)

func TestParseBand(t *testing.T) {
	t.Parallel()
	tests := []struct {
		in           string
		name         string
		lo, hi       float64
		wantErrMatch string
	}{
		{"3.5-3.8MHz", "", 3.5e6, 3.8e6, ""},
		{"3.5MHz-3.8MHz", "", 3.5e6, 3.8e6, ""},
		{"7000-7200kHz", "", 7.0e6, 7.2e6, ""},
		{"80m=3.5-3.8MHz", "80m", 3.5e6, 3.8e6, ""},
		{" 31m = 9.4 - 9.9 MHz ", "31m", 9.4e6, 9.9e6, ""},
		{"999kHz-1.1MHz", "", 0.999e6, 1.1e6, ""},
		{"3.8-3.5MHz", "", 0, 0, "lower edge must come first"},
		{"3.5MHz", "", 0, 0, "no dash"},
		{"3.5-3.8", "", 0, 0, "unit"},
		{"=3.5-3.8MHz", "", 0, 0, "empty name"},
		{"3.5-3.8pF", "", 0, 0, "upper end"},
		{"", "", 0, 0, "no number"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			t.Parallel()
			b, err := ParseBand(tc.in)
			if tc.wantErrMatch != "" {
				var qe *quantity.Error
				if !errors.As(err, &qe) || !strings.Contains(err.Error(), tc.wantErrMatch) {
					t.Errorf("err = %v, want quantity.Error with %q", err, tc.wantErrMatch)
				}
				return
			}
			if err != nil || b.Name != tc.name || math.Abs(float64(b.Low)/tc.lo-1) > 1e-12 || math.Abs(float64(b.High)/tc.hi-1) > 1e-12 {
				t.Errorf("ParseBand(%q) = %+v, %v", tc.in, b, err)
			}
		})
	}
}

func TestParseCapacitanceRange(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		in     string
		lo, hi float64
		ok     bool
	}{
		{"15-365pF", 15e-12, 365e-12, true}, {"12pF-365pF", 12e-12, 365e-12, true}, {"47-47pF", 47e-12, 47e-12, true},
		{"47pF", 47e-12, 47e-12, true}, {"0.01-0.5nF", 10e-12, 500e-12, true},
		{"365-15pF", 0, 0, false}, {"15-365", 0, 0, false}, {"big", 0, 0, false}, {"15-365MHz", 0, 0, false},
	} {
		lo, hi, err := ParseCapacitanceRange(tc.in)
		if (err == nil) != tc.ok || (tc.ok && (math.Abs(float64(lo)/tc.lo-1) > 1e-12 || math.Abs(float64(hi)/tc.hi-1) > 1e-12)) {
			t.Errorf("ParseCapacitanceRange(%q) = %v, %v, %v", tc.in, lo, hi, err)
		}
	}
}

func TestLoadBands(t *testing.T) {
	t.Parallel()
	good := "# listening\n80m 3.5-3.8MHz\n\n31m broadcast  9.4-9.9MHz # evenings\n40m=7.0-7.2MHz\n7.0-7.3MHz\n"
	bands, err := LoadBands(strings.NewReader(good), "b.txt")
	if err != nil {
		t.Fatal(err)
	}
	if len(bands) != 4 || bands[1].Name != "31m broadcast" || bands[2].Name != "40m" || bands[3].Name != "" || bands[0].High != 3.8e6 {
		t.Errorf("bands %+v", bands)
	}
	for _, tc := range []struct {
		name, text string
		line       int
	}{
		{"bad range", "80m 3.5-3.8MHz\n40m 7.2-7.0MHz\n", 2},
		{"no unit", "\n\n80m 3.5-3.8\n", 3},
		{"empty", "# nothing\n", 0},
	} {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			_, err := LoadBands(strings.NewReader(tc.text), "b.txt")
			var pe *ParseError
			if !errors.As(err, &pe) || pe.Line != tc.line || pe.File != "b.txt" {
				t.Errorf("err = %v, want ParseError at line %d", err, tc.line)
			}
		})
	}
}

func FuzzLoadBands(f *testing.F) {
	f.Add("80m 3.5-3.8MHz\n40m=7.0-7.2MHz\n")
	f.Add("3.5-3.8\n")
	f.Add("x = - \n")
	f.Fuzz(func(t *testing.T, s string) {
		bands, err := LoadBands(strings.NewReader(s), "fuzz")
		if err != nil {
			return
		}
		for _, b := range bands {
			if !(b.Low > 0 && b.High > b.Low) || math.IsInf(float64(b.High), 0) {
				t.Fatalf("accepted band %+v from %q", b, s)
			}
		}
	})
}
