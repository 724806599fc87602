package quantity

import (
	"math"
	"strings"
	"testing"
)

func TestParsePerKelvin(t *testing.T) {
	t.Parallel()
	tests := []struct {
		in      string
		want    float64
		errPart string
	}{
		{"-750ppm/K", -750e-6, ""},
		{"+70 ppm/K", 70e-6, ""},
		{"70ppm/°C", 70e-6, ""},
		{"16.5e-6/K", 16.5e-6, ""},
		{"0.00393/K", 0.00393, ""}, // IACS copper resistance coefficient
		{"0ppm/K", 0, ""},
		{"70", 0, "needs its unit"},
		{"70ppm/m", 0, "not ppm/K"},
		{"", 0, "empty"},
		{"0.5/K", 0, "10 %"},
		{"abc", 0, "temperature coefficient"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			got, err := ParsePerKelvin(tc.in)
			if tc.errPart != "" {
				if err == nil || !strings.Contains(err.Error(), tc.errPart) {
					t.Fatalf("err %v, want %q", err, tc.errPart)
				}
				return
			}
			if err != nil || math.Abs(got-tc.want) > 1e-15 {
				t.Fatalf("%g, %v; want %g", got, err, tc.want)
			}
		})
	}
}

func TestFormatPPMPerK(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		x    float64
		want string
	}{{375e-6, "+375 ppm/K"}, {-1.234e-6, "-1.23 ppm/K"}, {0, "0 ppm/K"}, {-1893.7e-6, "-1890 ppm/K"}, {70.6e-6, "+70.6 ppm/K"}} {
		if got := FormatPPMPerK(tc.x, 3); got != tc.want {
			t.Errorf("%g: %q, want %q", tc.x, got, tc.want)
		}
	}
}

func TestParseTemperatureRange(t *testing.T) {
	t.Parallel()
	tests := []struct {
		in      string
		lo, hi  float64 // kelvin (0 °C = 273.15 K, SI definition)
		errPart string
	}{
		{"10C-40C", 283.15, 313.15, ""},
		{"-10C-40C", 263.15, 313.15, ""},
		{"-20C--5C", 253.15, 268.15, ""},
		{"40C-10C", 283.15, 313.15, ""},
		{"50F-104F", 283.15, 313.15, ""}, // 50 °F = 10 °C, 104 °F = 40 °C
		{"283K-313K", 283, 313, ""},
		{"10C..40C", 283.15, 313.15, ""},
		{"10C to 40C", 283.15, 313.15, ""},
		{"10-40", 0, 0, "two temperatures"},
		{"10C-10C", 0, 0, "equal ends"},
		{"10C-40", 0, 0, "high end"},
		{"", 0, 0, "two temperatures"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			lo, hi, err := ParseTemperatureRange(tc.in)
			if tc.errPart != "" {
				if err == nil || !strings.Contains(err.Error(), tc.errPart) {
					t.Fatalf("err %v, want %q", err, tc.errPart)
				}
				return
			}
			if err != nil || math.Abs(float64(lo)-tc.lo) > 1e-9 || math.Abs(float64(hi)-tc.hi) > 1e-9 {
				t.Fatalf("%v … %v, %v; want %g … %g", lo, hi, err, tc.lo, tc.hi)
			}
		})
	}
}
