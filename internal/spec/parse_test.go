package spec

import (
	"math"
	"testing"
)

func TestParseRatio(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		in   string
		want float64
		ok   bool
	}{
		{"0.2", 0.2, true}, {"20%", 0.2, true}, {"1:5", 0.2, true}, {" 1 : 50 ", 0.02, true},
		{"0", 0, false}, {"1", 0, false}, {"5:1", 0, false}, {"1:0", 0, false}, {"abc", 0, false}, {"NaN", 0, false},
	} {
		got, err := ParseRatio(tc.in)
		if (err == nil) != tc.ok || (tc.ok && math.Abs(got-tc.want) > 1e-12) {
			t.Errorf("ParseRatio(%q) = %v, %v", tc.in, got, err)
		}
	}
}
