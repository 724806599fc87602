package coil

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// Nagaoka's coefficient against the published table. Values as D/l → K_N,
// Rosa & Grover 1912 (Bull. Bureau of Standards 8(1), Table 36) and Grover
// 1946, Table 36; recalled from memory, four decimals, so tol 1e-4 abs.
func TestNagaokaTable(t *testing.T) {
	t.Parallel()
	const tableTol = 1e-4
	tests := []struct {
		name     string
		dOverL   float64
		want     float64
		wantNote string
	}{
		{"D/l=0.05", 0.05, 0.9791, "Rosa & Grover 1912, from memory"},
		{"D/l=0.1", 0.1, 0.9588, "Rosa & Grover 1912, from memory"},
		{"D/l=0.2", 0.2, 0.9201, "Rosa & Grover 1912, from memory"},
		{"D/l=0.5", 0.5, 0.8181, "Rosa & Grover 1912, from memory"},
		{"D/l=1", 1, 0.6884, "Rosa & Grover 1912, from memory"},
		{"D/l=1.5", 1.5, 0.5950, "Rosa & Grover 1912, from memory"},
		{"D/l=2", 2, 0.5255, "Rosa & Grover 1912, from memory"},
		{"D/l=3", 3, 0.4292, "Rosa & Grover 1912, from memory"},
		{"D/l=5", 5, 0.3198, "Rosa & Grover 1912, from memory"},
		{"D/l=10", 10, 0.2033, "Rosa & Grover 1912, from memory"},
		{"D/l=20", 20, 0.1236, "Grover 1946 Table 36, from memory"},
		{"D/l=100", 100, 0.0350, "Grover 1946 Table 36, from memory"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got := Nagaoka(1 / tc.dOverL)
			if math.Abs(got-tc.want) > tableTol {
				t.Errorf("Nagaoka(l/D=%g) = %.5f, want %.4f (%s)", 1/tc.dOverL, got, tc.want, tc.wantNote)
			}
		})
	}
}

// sheetInductanceIntegral computes a current sheet's inductance without
// elliptic integrals: Neumann's formula for coaxial rings, integrated over
// the sheet's length in closed form, leaves one integral over the angle,
//
//	L = μ0·N²·a²/l² ∫0^π cos φ · 2[l·asinh(l/c) − √(l²+c²) + c] dφ,
//	c = 2a·sin(φ/2),
//
// done here by Gauss–Legendre quadrature after φ = π·s² (which removes the
// logarithmic singularity at φ = 0).
func sheetInductanceIntegral(n, diameterM, lengthM float64) float64 {
	a, l := diameterM/2, lengthM
	f := func(s float64) float64 {
		phi := math.Pi * s * s
		c := 2 * a * math.Sin(phi/2)
		if c == 0 {
			return 0
		}
		inner := 2 * (l*math.Asinh(l/c) - math.Hypot(l, c) + c)
		return math.Cos(phi) * inner * 2 * math.Pi * s
	}
	// Panels: the logarithmic peak (φ up to about l/a, for short coils),
	// then up to φ = π/2 where the integrand changes sign, then the rest.
	s1 := math.Sqrt(math.Min(0.25, l/a) / math.Pi)
	s2 := math.Sqrt(0.5)
	v := quad.Fixed(f, 0, s1, 400, nil, 0) + quad.Fixed(f, s1, s2, 400, nil, 0) + quad.Fixed(f, s2, 1, 400, nil, 0)
	return Mu0 * n * n * a * a / (l * l) * v
}

// The elliptic closed form against the independent integral, l/D from
// 0.01 to 100 (the range the model promises).
func TestNagaokaAgainstIntegral(t *testing.T) {
	t.Parallel()
	const integralTol = 1e-10 // quadrature converges to ~1e-12 here
	for _, ld := range []float64{0.01, 0.03, 0.1, 0.3, 0.5, 1, 2, 5, 10, 30, 100} {
		d := 0.02
		l := ld * d
		want := sheetInductanceIntegral(7, d, l)
		got := SheetInductance(7, d, l)
		if relErr(got, want) > integralTol {
			t.Errorf("l/D=%g: closed form %.12g H, integral %.12g H (rel %.2g)", ld, got, want, relErr(got, want))
		}
	}
}

// Properties: K_N → 1 − 4D/(3πl) for long coils (first term of the
// series, Grover 1946 eq. 118) and decreases monotonically with D/l.
func TestNagaokaLimits(t *testing.T) {
	t.Parallel()
	for _, ld := range []float64{200, 1000} {
		want := 1 - 4/(3*math.Pi*ld)
		if got := Nagaoka(ld); math.Abs(got-want) > 1/(ld*ld)+1e-9 {
			t.Errorf("long-coil limit l/D=%g: got %.10f want %.10f", ld, got, want)
		}
	}
	prev := 2.0
	for ld := 100.0; ld > 0.009; ld *= 0.9 {
		k := Nagaoka(ld)
		if !(k < prev) || k <= 0 || math.IsNaN(k) {
			t.Fatalf("Nagaoka not decreasing or not positive at l/D=%g: %g after %g", ld, k, prev)
		}
		prev = k
	}
	for _, bad := range []float64{0, -1, math.NaN(), math.Inf(1)} {
		if !math.IsNaN(Nagaoka(bad)) {
			t.Errorf("Nagaoka(%g) should be NaN", bad)
		}
	}
}

// The long-coil limit of the inductance itself: μ0·N²·π·r²/l.
func TestSheetLongCoilLimit(t *testing.T) {
	t.Parallel()
	n, d, l := 1000.0, 0.01, 10.0
	want := Mu0 * n * n * math.Pi * d * d / 4 / l
	if got := SheetInductance(n, d, l); relErr(got, want) > 1e-3 {
		t.Errorf("got %g want %g", got, want)
	}
}
