package coil

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/unit"

	"gonum.org/v1/gonum/integrate/quad"
)

// helixNeumann is the low-frequency inductance of n turns of round wire of
// radius r wound as a helix of radius a and pitch p, by the Neumann
// integral of the wire's centre line with itself (Maxwell; Grover 1946,
// ch. 1). The integral diverges where the centre line meets itself, so
// the self term of the round wire is taken exactly as the same wire
// straightened: a straight round wire of the helix's length ℓ with uniform
// (DC) current, μ0/(2π)·[ℓ·asinh(ℓ/g) − √(ℓ² + g²) + g] with g = r·e^(−1/4)
// its geometric mean distance from itself (Grover 1946, ch. 2 and 5). The
// bending is the finite remainder, the Neumann integrand of the helix less
// that of the straight line, both with the true distance between centre
// lines:
//
//	L = L_straight + μ0/(4π)·2∫₀ᵀ (T − u)·[(a²cos u + b²)/ρ(u) − c/u] du
//	ρ(u)² = 4a²sin²(u/2) + b²u²,  b = p/2π,  c = √(a² + b²),  T = 2πN,
//
// with u the difference of winding angles (the integrand depends on it
// alone, which turns the double integral into one). Neighbouring turns
// keep their exact centre distance, so the thin-wire error is only that of
// the straight self term, O((r/a)²). gonum/integrate/quad Gauss–Legendre
// on quarter turns does the rest. For a single turn at zero pitch it gives
// the ring's μ0R(ln(8R/r) − 7/4) (Kirchhoff; Rosa & Grover 1912), which
// the tests check.
func helixNeumann(n, a, p, r float64) float64 { return helixNeumannPts(n, a, p, r, 32) }

func helixNeumannPts(n, a, p, r float64, pts int) float64 {
	b := p / (2 * math.Pi)
	c := math.Hypot(a, b)
	g := r * math.Exp(-0.25)
	T := 2 * math.Pi * n
	f := func(u float64) float64 {
		s := math.Sin(u / 2)
		rho := math.Sqrt(4*a*a*s*s + b*b*u*u)
		return (T - u) * ((a*a*math.Cos(u)+b*b)/rho - c/u)
	}
	var sum float64
	for lo := 0.0; lo < T; lo += math.Pi / 2 {
		sum += quad.Fixed(f, lo, math.Min(lo+math.Pi/2, T), pts, nil, 0)
	}
	ell := c * T
	straight := Mu0 / (2 * math.Pi) * (ell*math.Asinh(ell/g) - math.Sqrt(ell*ell+g*g) + g)
	return straight + Mu0/(4*math.Pi)*2*sum
}

// TestHelixNeumannRing: one turn at vanishing pitch is a ring; Kirchhoff's
// thin-ring inductance μ0R(ln(8R/r) − 7/4) (Rosa & Grover 1912, formula
// for a circular ring of round wire, uniform current) holds to O((r/R)²).
func TestHelixNeumannRing(t *testing.T) {
	for _, rr := range []float64{0.002, 0.005, 0.01} {
		R := 0.01
		r := rr * R
		want := Mu0 * R * (math.Log(8*R/r) - 1.75) // Kirchhoff thin ring, Rosa & Grover 1912
		if e := relErr(helixNeumann(1, R, 1e-12, r), want); e > 5e-4 {
			t.Errorf("r/R %g: helix integral %.6g, ring %.6g (rel %.2g)", rr, helixNeumann(1, R, 1e-12, r), want, e)
		}
	}
}

// TestInductanceAgainstHelix compares the model's low-frequency helix
// inductance (Nagaoka with Rosa's corrections) with the helix Neumann
// integral: within 0.2 % where the two coincide (p ≤ D/20), within 1 %
// up to the steep-pitch warning (p ≤ D/8), and the warning set beyond it.
// At p = D/2 Rosa's ring approximation is 2–13 % low: the pitch correction
// the issue asks for is not in the model yet.
func TestInductanceAgainstHelix(t *testing.T) {
	for _, n := range []float64{2, 3, 5, 10, 20, 40} {
		for _, pD := range []float64{0.03, 0.05, 0.08, 0.1, 0.125, 0.2, 0.5} {
			for _, pd := range []float64{1.2, 2, 5} {
				dm := 0.01
				p := pD * dm
				d := p / pd
				c := NewCore(n, p, d, dm, RosaMutual(n))
				ref := helixNeumann(n, dm/2, p, d/2)
				e := relErr(c.LCoilDC, ref)
				g := Geometry{FormerDiameter: unit.Length(dm - d), WireDiameter: unit.Length(d), Turns: n, Pitch: unit.Length(p)}
				var pr Prediction
				evaluate(&pr, &g, 0, Grounded)
				steep := pr.Flags&FlagSteepPitch != 0
				switch {
				case pD <= 0.05 && e > 2e-3:
					t.Errorf("N %g p/D %g p/d %g: model %.5g H, helix integral %.5g H: %.2f %% > 0.2 %%", n, pD, pd, c.LCoilDC, ref, e*100)
				case pD <= 0.125 && e > 1e-2:
					t.Errorf("N %g p/D %g p/d %g: %.2f %% > 1 %% without the steep-pitch warning", n, pD, pd, e*100)
				case pD > 0.125 && !steep:
					t.Errorf("N %g p/D %g: no steep-pitch warning (model %.2f %% off the helix integral)", n, pD, e*100)
				case pD <= 0.125 && steep:
					t.Errorf("N %g p/D %g: steep-pitch warning where the model is within %.2f %%", n, pD, e*100)
				}
			}
		}
	}
}

// TestHelixNeumannConverges: doubling the quadrature points changes
// nothing that matters.
func TestHelixNeumannConverges(t *testing.T) {
	a, b := helixNeumann(7, 0.005, 0.004, 0.0004), helixNeumannPts(7, 0.005, 0.004, 0.0004, 64)
	if relErr(a, b) > 1e-7 {
		t.Errorf("32 points %.9g, 64 points %.9g", a, b)
	}
}
