package coil

import (
	"math"
	"testing"
)

// Rosa's mutual correction B: the series against the direct sum over pairs
// of turns (independent route), and both against Rosa's table.
func TestRosaMutualSeriesVsSum(t *testing.T) {
	t.Parallel()
	const seriesTol = 5e-8 // absolute; the series is truncated at 1/n⁹
	for n := 1; n <= 200; n++ {
		got, want := RosaMutual(float64(n)), RosaMutualSum(n)
		if math.Abs(got-want) > seriesTol {
			t.Errorf("n=%d: series %.9f, direct sum %.9f", n, got, want)
		}
	}
}

func TestRosaMutualTable(t *testing.T) {
	t.Parallel()
	const tableTol = 1e-4 // table gives four decimals
	tests := []struct {
		name string
		n    float64
		want float64
	}{
		{"1 turn", 1, 0.0000},  // Rosa 1906 / Grover 1946 Table 39 (B), from memory
		{"2 turns", 2, 0.1137}, // ditto
		{"3 turns", 3, 0.1663}, // ditto
		{"4 turns", 4, 0.1973}, // ditto
		{"5 turns", 5, 0.2180}, // ditto
		{"10 turns", 10, 0.2664},
		{"infinite", 1e9, 0.3379}, // ln(2π) − 3/2, Rosa 1906
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			if got := RosaMutual(tc.n); math.Abs(got-tc.want) > tableTol {
				t.Errorf("RosaMutual(%g) = %.5f, want %.4f", tc.n, got, tc.want)
			}
		})
	}
}

func TestRosaSelf(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name       string
		pOverD     float64
		phi        float64
		want, tol  float64
		wantSource string
	}{
		{"close-wound DC", 1, 1, 0.5568, 1e-4, "Rosa's A for p/d = 1, Grover 1946 Table 38, from memory"},
		{"p/d=2 DC", 2, 1, -0.1363, 1e-4, "Grover 1946 Table 38, from memory"},
		{"close-wound, no internal inductance", 1, 0, 0.5568 + 0.25, 1e-4, "internal inductance μ0/8π per metre removed"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			if got := RosaSelf(tc.pOverD*1e-3, 1e-3, tc.phi); math.Abs(got-tc.want) > tc.tol {
				t.Errorf("got %.5f want %.4f (%s)", got, tc.want, tc.wantSource)
			}
		})
	}
}
