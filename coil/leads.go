package coil

import "math"

// LeadInductance is the inductance of one straight round wire of length
// lengthM and radius radiusM, with φ the fraction of its DC internal
// inductance still present (see RosaSelf). The external part is the exact
// result for a straight filament at the wire's surface (Rosa 1908; Grover
// 1946, ch. 5):
//
//	L = (μ0/2π)·[ ℓ·asinh(ℓ/r) − √(ℓ²+r²) + r ] + φ·μ0·ℓ/(8π)
//
// For ℓ ≫ r and φ = 1 it is the familiar (μ0/2π)·ℓ·(ln(2ℓ/r) − 3/4). It is
// zero for ℓ = 0 and never negative. The two leads are taken as far enough
// apart that their mutual inductance is negligible.
func LeadInductance(lengthM, radiusM, phi float64) float64 {
	if lengthM <= 0 {
		return 0
	}
	l, r := lengthM, radiusM
	ext := Mu0 / twoPi * (l*math.Asinh(l/r) - math.Hypot(l, r) + r)
	return ext + phi*Mu0*l/(8*math.Pi)
}
