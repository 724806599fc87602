package coil

import (
	"math"

	"gonum.org/v1/gonum/mathext"
)

// Nagaoka returns Nagaoka's coefficient K_N for a current sheet of length l
// and diameter D, given as the ratio lOverD = l/D > 0. K_N → 1 for a long
// coil and → 0 for a short one.
//
// Closed form (Nagaoka 1909; Grover 1946, ch. 13), with k² = D²/(D²+l²) and
// k'² = 1 − k²:
//
//	K_N = 4/(3π·k') · [ (k'²/k²)·(K(k) − E(k)) + E(k) − k ]
//
// K and E are the complete elliptic integrals of the first and second kind
// (gonum mathext, parameter m = k²). Accurate to about 1e-10 relative for
// 0.01 ≤ l/D ≤ 1000 (cancellation grows beyond); NaN for lOverD ≤ 0.
func Nagaoka(lOverD float64) float64 {
	if !(lOverD > 0) || math.IsInf(lOverD, 0) {
		return math.NaN()
	}
	r2 := lOverD * lOverD
	m := 1 / (1 + r2)   // k²
	mc := r2 / (1 + r2) // k'²
	k := math.Sqrt(m)
	kc := math.Sqrt(mc)
	bigK := mathext.CompleteK(m)
	bigE := mathext.CompleteE(m)
	return 4 / (3 * math.Pi * kc) * ((mc/m)*(bigK-bigE) + bigE - k)
}

// SheetInductance is the inductance of a uniform current sheet of n turns,
// diameter d and length l: μ0·π·(d/2)²·n²/l · K_N(l/d).
func SheetInductance(n, diameterM, lengthM float64) float64 {
	a := diameterM / 2
	return Mu0 * math.Pi * a * a * n * n / lengthM * Nagaoka(lengthM/diameterM)
}
