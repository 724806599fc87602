package coil

import (
	"math"
	"testing"
)

// Medhurst's H at table rows (Medhurst 1947, Table 1, recalled from
// memory: see testdata/SOURCES.md) and the shape of his curve.
func TestMedhurstTable(t *testing.T) {
	t.Parallel()
	const tableTol = 1e-12
	tests := []struct {
		name string
		ld   float64
		want float64
	}{
		{"short", 0.1, 0.96},  // Medhurst 1947 Table 1, from memory
		{"square", 1.0, 0.46}, // ditto
		{"l/D=2", 2.0, 0.50},  // ditto
		{"l/D=5", 5.0, 0.81},  // ditto
		{"long", 50, 5.80},    // ditto
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, in := MedhurstH(tc.ld)
			if !in || math.Abs(got-tc.want) > tableTol {
				t.Errorf("H(%g) = %g (in table %v), want %g", tc.ld, got, in, tc.want)
			}
		})
	}
	// H has its minimum (about 0.44 pF/cm) near l/D ≈ 1.2 and grows on
	// both sides (Medhurst 1947, Fig. 2).
	hMin, ldMin := math.Inf(1), 0.0
	for ld := 0.1; ld <= 50; ld *= 1.01 {
		h, _ := MedhurstH(ld)
		if h < hMin {
			hMin, ldMin = h, ld
		}
	}
	if ldMin < 1 || ldMin > 1.5 || math.Abs(hMin-0.44) > 0.005 {
		t.Errorf("minimum H %.3f at l/D %.3f; Medhurst's is about 0.44 at 1.1–1.3", hMin, ldMin)
	}
	// Extrapolation continues the table without a step.
	for _, edge := range []float64{0.1, 50} {
		a, _ := MedhurstH(edge * (1 - 1e-9))
		b, _ := MedhurstH(edge * (1 + 1e-9))
		if relErr(a, b) > 1e-6 {
			t.Errorf("step at l/D=%g: %g vs %g", edge, a, b)
		}
	}
}

func TestSelfCapacitance(t *testing.T) {
	t.Parallel()
	// A 25 mm coil, 25 mm long: C = 0.46 pF/cm × 2.5 cm = 1.15 pF
	// (Medhurst 1947 Table 1, H at l/D = 1, from memory).
	c, in := SelfCapacitance(0.025, 0.025)
	if !in || relErr(c, 1.15e-12) > 1e-9 {
		t.Errorf("C = %g F, want 1.15 pF", c)
	}
}

func TestProximityFactor(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name       string
		ld, dp     float64
		want, tol  float64
		wantSource string
	}{
		{"close-wound square coil", 1, 1, 5.55, 1e-12, "Medhurst 1947 Table 4, from memory"},
		{"half-spaced long coil", 10, 0.5, 1.86, 1e-12, "Medhurst 1947 Table 4, from memory"},
		{"very long close-wound", 1e6, 1, 3.41, 1e-4, "Medhurst 1947 Table 4, l/D = ∞ column, from memory"},
		{"wide spacing", 1, 0, 1, 1e-12, "no neighbours, no proximity effect"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			if got := ProximityFactor(tc.ld, tc.dp); math.Abs(got-tc.want) > tc.tol {
				t.Errorf("Φ(%g, %g) = %.4f, want %.4f (%s)", tc.ld, tc.dp, got, tc.want, tc.wantSource)
			}
		})
	}
	// Φ grows with d/p (closer turns, more crowding) at every l/D.
	for _, ld := range []float64{0, 0.5, 1, 3, 7, 20} {
		prev := 0.0
		for dp := 0.0; dp <= 1.0001; dp += 0.05 {
			v := ProximityFactor(ld, dp)
			if v < prev-1e-12 || v < 1 {
				t.Errorf("Φ(l/D=%g) not rising with d/p at %g: %g after %g", ld, dp, v, prev)
			}
			prev = v
		}
	}
}

func TestResonance(t *testing.T) {
	t.Parallel()
	// 10 µH with 180 pF resonates near 3.7 MHz (common practice; the
	// 80 m band tank): 1/(2π√(10e-6·180e-12)) = 3.751 MHz.
	f := ResonantFrequency(10e-6, 180e-12)
	if math.Abs(float64(f)-3.751e6) > 1e3 {
		t.Errorf("f = %g Hz, want 3.751 MHz", float64(f))
	}
	if relErr(float64(InductanceForResonance(f, 180e-12)), 10e-6) > implTol {
		t.Error("InductanceForResonance does not invert ResonantFrequency")
	}
	if relErr(float64(CapacitanceForResonance(f, 10e-6)), 180e-12) > implTol {
		t.Error("CapacitanceForResonance does not invert ResonantFrequency")
	}
}
