package quantity

import (
	"math"
	"testing"
)

func TestParsePower(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want float64
		ok   bool
	}{
		{"100W", 100, true},   // SI prefix rules (BIPM SI Brochure, 9th ed., from memory)
		{"1.5kW", 1500, true}, // kilo = 1e3
		{"500mW", 0.5, true},  // milli = 1e-3
		{"-5W", -5, true},     // read as written; the caller refuses a negative power
		{"100", 0, false},     // no unit
		{"100V", 0, false},    // a voltage
	} {
		t.Run(tc.in, func(t *testing.T) {
			got, err := ParsePower(tc.in)
			if (err == nil) != tc.ok {
				t.Fatalf("err = %v, want ok %v", err, tc.ok)
			}
			if tc.ok && math.Abs(got-tc.want) > 1e-12*math.Abs(tc.want) {
				t.Errorf("got %g, want %g", got, tc.want)
			}
		})
	}
}
