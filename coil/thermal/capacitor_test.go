package thermal

import (
	"math"
	"strings"
	"testing"
)

func TestParseClass(t *testing.T) {
	t.Parallel()
	tests := []struct {
		in       string
		nom, tol float64 // ppm/K
		errPart  string
	}{
		{"C0G", 0, 30, ""},         // EIA-198 C0G: 0 ± 30 ppm/K (from memory)
		{"NP0", 0, 30, ""},         // IEC 60384-8 NP0 = C0G (from memory)
		{"npo", 0, 30, ""},         // the letter O typed for zero, common practice
		{"N750", -750, 120, ""},    // IEC 60384-8 N750 (from memory)
		{"U2J", -750, 120, ""},     // EIA-198: U 7.5, 2 ×−100, J ±120 (from memory)
		{"N150", -150, 30, ""},     // IEC 60384-8 N150 (from memory)
		{"S2H", -330, 60, ""},      // EIA-198: S 3.3, 2 ×−100, H ±60 (from memory)
		{"P3K", -1500, 250, ""},    // EIA-198: P 1.5, 3 ×−1000, K ±250 (from memory)
		{"M7G", 100, 30, ""},       // EIA-198: M 1.0, 7 ×+100, G ±30 = P100 (from memory)
		{"P100", 100, 30, ""},      // IEC 60384-8 P100 (from memory)
		{"air", 50, 50, ""},        // typical air variable (from memory)
		{"-750ppm/K", -750, 0, ""}, // a number: no tolerance stated
		{"-750±120ppm/K", -750, 120, ""},
		{"+30+/-10ppm/K", 30, 10, ""},
		{"X7R", 0, 0, "not a class"}, // class 2: no linear coefficient
		{"750", 0, 0, "not a class"},
		{"", 0, 0, "empty"},
	}
	for _, tc := range tests {
		t.Run(tc.in, func(t *testing.T) {
			c, err := ParseClass(tc.in)
			if tc.errPart != "" {
				if err == nil || !strings.Contains(err.Error(), tc.errPart) {
					t.Fatalf("err %v, want %q", err, tc.errPart)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(c.Nominal*1e6-tc.nom) > 1e-9 || math.Abs(c.Tolerance*1e6-tc.tol) > 1e-9 {
				t.Errorf("%s: %g ± %g ppm/K, want %g ± %g", tc.in, c.Nominal*1e6, c.Tolerance*1e6, tc.nom, tc.tol)
			}
			if c.Source == "" {
				t.Error("no source")
			}
		})
	}
}

// Every named class agrees with the EIA code listed beside it: the two
// tables are independent routes to the same numbers.
func TestClassesMatchTheirEIACodes(t *testing.T) {
	t.Parallel()
	for _, c := range Classes() {
		e, ok := parseEIA(c.EIA)
		if !ok {
			t.Errorf("%s: EIA code %q does not parse", c.Code, c.EIA)
			continue
		}
		if math.Abs(e.Nominal-c.Nominal) > 1e-12 || math.Abs(e.Tolerance-c.Tolerance) > 1e-12 {
			t.Errorf("%s: %g ± %g, EIA %s says %g ± %g", c.Code, c.Nominal, c.Tolerance, c.EIA, e.Nominal, e.Tolerance)
		}
		if c.Source == "" {
			t.Errorf("%s: no source", c.Code)
		}
	}
}
