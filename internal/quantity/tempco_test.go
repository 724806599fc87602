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
