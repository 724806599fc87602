package coil

import (
	"math"
	"testing"
)

// skinByODE is an independent route to the internal impedance of a round
// wire: integrate the current-density equation J” + J'/u = 2j·J (u = ρ/δ)
// outward from the axis with RK4, then Z/R_dc = j·x·J(x)/J'(x) (Ampère's
// law gives the enclosed current from J'). No Bessel series involved.
func skinByODE(x float64) complex128 {
	const steps = 20000
	// Start just off the axis with the series J = 1 + (j/2)u² − u⁴/16.
	u0 := 1e-3 * math.Min(1, x)
	J := complex(1-math.Pow(u0, 4)/16, u0*u0/2)
	dJ := complex(-math.Pow(u0, 3)/4, u0)
	h := (x - u0) / steps
	f := func(u float64, j, dj complex128) (complex128, complex128) {
		return dj, complex(0, 2)*j - dj/complex(u, 0)
	}
	u := u0
	for range steps {
		k1a, k1b := f(u, J, dJ)
		k2a, k2b := f(u+h/2, J+complex(h/2, 0)*k1a, dJ+complex(h/2, 0)*k1b)
		k3a, k3b := f(u+h/2, J+complex(h/2, 0)*k2a, dJ+complex(h/2, 0)*k2b)
		k4a, k4b := f(u+h, J+complex(h, 0)*k3a, dJ+complex(h, 0)*k3b)
		J += complex(h/6, 0) * (k1a + 2*k2a + 2*k3a + k4a)
		dJ += complex(h/6, 0) * (k1b + 2*k2b + 2*k3b + k4b)
		u += h
	}
	return complex(0, x) * J / dJ
}

func TestSkinAgainstODE(t *testing.T) {
	t.Parallel()
	const odeTol = 1e-7 // RK4 with 20000 steps
	for _, x := range []float64{0.3, 1, 2, 3.3, 5, 8, 12, 20, 35} {
		want := skinByODE(x)
		r, phi := SkinFactors(x)
		wantPhi := 4 * imag(want) / (x * x)
		if relErr(r, real(want)) > odeTol || relErr(phi, wantPhi) > odeTol {
			t.Errorf("x=%g: R/Rdc %.9f φ %.9f; ODE gives %.9f %.9f", x, r, phi, real(want), wantPhi)
		}
	}
}

func TestSkinLimits(t *testing.T) {
	t.Parallel()
	// Low frequency: R/R_dc ≈ 1 + x⁴/48 (Ramo et al. 1994 §5.6, series of
	// ber/bei), φ ≈ 1 − x⁴/96... checked to the order the series gives.
	for _, x := range []float64{0.05, 0.1, 0.3} {
		r, phi := SkinFactors(x)
		if math.Abs(r-(1+math.Pow(x, 4)/48)) > math.Pow(x, 8)/100 {
			t.Errorf("x=%g: R/Rdc %.12f, low-frequency series %.12f", x, r, 1+math.Pow(x, 4)/48)
		}
		if phi > 1 || phi < 1-math.Pow(x, 4)/40 {
			t.Errorf("x=%g: φ %.12f not just below 1", x, phi)
		}
	}
	// High frequency: R/R_dc → x/2 + 1/4 (Wheeler 1942, the current in a
	// layer one skin depth deep, plus his curvature term) and φ → 2/x.
	for _, x := range []float64{40, 100, 1000} {
		r, phi := SkinFactors(x)
		if relErr(r, x/2+0.25) > 0.2/(x*x) || relErr(phi, 2/x) > 0.2/(x*x) { // next terms are 3/(16x²) relative
			t.Errorf("x=%g: R/Rdc %.9f φ %.9f, asymptotes %.9f %.9f", x, r, phi, x/2+0.25, 2/x)
		}
	}
	// The table and the asymptote meet without a step at x = 40.
	rl, pl := SkinFactors(skinSeriesMax - 1e-9)
	rh, ph := SkinFactors(skinSeriesMax)
	if relErr(rl, rh) > 1e-7 || relErr(pl, ph) > 1e-5 {
		t.Errorf("step at the series/asymptote seam: R %.10f→%.10f φ %.10f→%.10f", rl, rh, pl, ph)
	}
}

// Interpolated table against the direct series between nodes.
func TestSkinInterpolation(t *testing.T) {
	t.Parallel()
	const interpTol = 1e-7
	for x := 0.013; x < skinSeriesMax; x += 0.37 {
		z := skinSeries(x)
		r, phi := SkinFactors(x)
		if relErr(r, real(z)) > interpTol || relErr(phi, 4*imag(z)/(x*x)) > interpTol {
			t.Errorf("x=%g: interp %.10f %.10f series %.10f %.10f", x, r, phi, real(z), 4*imag(z)/(x*x))
		}
	}
}

func TestSkinDepthCopper(t *testing.T) {
	t.Parallel()
	// Copper at 20 °C: 66 µm at 1 MHz, 6.6 µm at 100 MHz (handbook value
	// from IACS resistivity; from memory, 2 significant figures).
	tests := []struct {
		name string
		f    float64
		want float64
	}{
		{"1 MHz", 1e6, 66e-6},
		{"100 MHz", 100e6, 6.6e-6},
	}
	for _, tc := range tests {
		if got := SkinDepth(CopperResistivity20, tc.f); relErr(got, tc.want) > 0.01 {
			t.Errorf("%s: δ = %.4g m, want %.2g m", tc.name, got, tc.want)
		}
	}
}
