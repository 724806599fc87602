package coil

import (
	"math"
	"math/cmplx"
)

// Skin effect in an isolated round wire.
//
// The internal impedance per unit length of a round wire of radius r is
// (Ramo, Whinnery & Van Duzer 1994, §5.6; Wheeler 1942)
//
//	Z/R_dc = (z/2)·J0(z)/J1(z),   z = (1−j)·x,   x = r/δ,
//
// with δ the skin depth. The real part is R_ac/R_dc; the imaginary part is
// ωL_int/R_dc = (x²/4)·φ, where φ is the internal inductance as a fraction
// of its DC value μ0/8π per metre. Writing t = x²/2, the Bessel series
// collapse to
//
//	Z/R_dc = S0/S1,  S0 = Σ (jt)^m/(m!)²,  S1 = Σ (jt)^m/(m!(m+1)!),
//
// which is summed directly for x ≤ skinSeriesMax and tabulated once for fast
// interpolation. Beyond that the Hankel asymptotic expansion gives
//
//	R_ac/R_dc ≈ x/2 + 1/4 + 3/(32x),   φ ≈ 2/x − 3/(8x³).

const (
	skinSeriesMax = 40.0
	skinStep      = 0.05
)

// skinSeries evaluates S0/S1 for x = r/δ by direct summation.
func skinSeries(x float64) complex128 {
	t := x * x / 2
	jt := complex(0, t)
	term0 := complex(1, 0) // (jt)^m/(m!)²
	term1 := complex(1, 0) // (jt)^m/(m!(m+1)!)
	s0, s1 := term0, term1
	for m := 1; m < 400; m++ {
		fm := float64(m)
		term0 *= jt / complex(fm*fm, 0)
		term1 *= jt / complex(fm*(fm+1), 0)
		s0 += term0
		s1 += term1
		if cmplx.Abs(term0) < 1e-18*cmplx.Abs(s0) && cmplx.Abs(term1) < 1e-18*cmplx.Abs(s1) {
			break
		}
	}
	return s0 / s1
}

// skinTable holds R_ac/R_dc and φ at x = i·skinStep.
var skinTableR, skinTablePhi = buildSkinTable()

func buildSkinTable() (r, phi []float64) {
	n := int(skinSeriesMax/skinStep) + 1
	r = make([]float64, n)
	phi = make([]float64, n)
	for i := range n {
		x := float64(i) * skinStep
		if i == 0 {
			r[i], phi[i] = 1, 1
			continue
		}
		z := skinSeries(x)
		r[i] = real(z)
		phi[i] = 4 * imag(z) / (x * x)
	}
	return r, phi
}

// SkinFactors returns R_ac/R_dc and the internal-inductance fraction φ of an
// isolated round wire for x = radius/skin depth ≥ 0.
func SkinFactors(x float64) (rRatio, phi float64) {
	if x >= skinSeriesMax {
		ix := 1 / x
		return x/2 + 0.25 + 3.0/32*ix, 2*ix - 3.0/8*ix*ix*ix
	}
	if x <= 0 {
		return 1, 1
	}
	if x < 1 {
		// Near the axis of the table the series is short and exact.
		z := skinSeries(x)
		return real(z), 4 * imag(z) / (x * x)
	}
	// Four-point Lagrange interpolation on the uniform table.
	u := x / skinStep
	i := int(u)
	if i < 1 {
		i = 1
	}
	if i > len(skinTableR)-3 {
		i = len(skinTableR) - 3
	}
	s := u - float64(i) // in [−1, 2]
	w0 := -s * (s - 1) * (s - 2) / 6
	w1 := (s + 1) * (s - 1) * (s - 2) / 2
	w2 := -(s + 1) * s * (s - 2) / 2
	w3 := (s + 1) * s * (s - 1) / 6
	rRatio = w0*skinTableR[i-1] + w1*skinTableR[i] + w2*skinTableR[i+1] + w3*skinTableR[i+2]
	phi = w0*skinTablePhi[i-1] + w1*skinTablePhi[i] + w2*skinTablePhi[i+1] + w3*skinTablePhi[i+2]
	return rRatio, phi
}

// SkinDepth is δ = √(ρ/(π·f·μ0)) for a non-magnetic conductor of
// resistivity rho (Ω·m) at frequency f (Hz).
func SkinDepth(rho, f float64) float64 {
	return math.Sqrt(rho / (math.Pi * f * Mu0))
}
