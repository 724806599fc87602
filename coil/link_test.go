package coil

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// Maxwell's formula against Neumann's double line integral for two
// coaxial circles, which reduces to one integral over the angle between
// the two current elements (Grover 1946, ch. 13):
//
//	M = μ0·a·b/2 · ∫₀^{2π} cos φ / √(a² + b² + d² − 2ab·cos φ) dφ
//
// evaluated with gonum's Gauss–Legendre quadrature.
func TestLoopMutualAgainstNeumann(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct{ a, b, d float64 }{
		{0.01, 0.01, 0.001}, {0.01, 0.012, 0.0005}, {0.01, 0.011, 0.02}, {0.005, 0.02, 0.01}, {0.1, 0.1, 0.3},
	} {
		f := func(phi float64) float64 {
			return math.Cos(phi) / math.Sqrt(tc.a*tc.a+tc.b*tc.b+tc.d*tc.d-2*tc.a*tc.b*math.Cos(phi))
		}
		want := Mu0 * tc.a * tc.b / 2 * quad.Fixed(f, 0, 2*math.Pi, 2000, nil, 0)
		got := LoopMutual(tc.a, tc.b, tc.d)
		if math.Abs(got/want-1) > 1e-6 {
			t.Errorf("a=%g b=%g d=%g: Maxwell %g, Neumann %g", tc.a, tc.b, tc.d, got, want)
		}
	}
	// Far apart: two dipoles, M → μ0·π·a²·b²/(2·d³) (from memory: the
	// field on the axis of a small loop).
	a, b, d := 0.01, 0.01, 1.0
	if got, want := LoopMutual(a, b, d), Mu0*math.Pi*a*a*b*b/(2*d*d*d); math.Abs(got/want-1) > 1e-3 {
		t.Errorf("dipole limit %g, want %g", got, want)
	}
}

// A link's M is the sum over turn pairs; a one-turn link over a one-turn
// coil is one Maxwell term, and k stays below 1.
func TestLinkOver(t *testing.T) {
	t.Parallel()
	g := Geometry{FormerDiameter: 20e-3, WireDiameter: 0.5e-3, WireOverall: 0.55e-3, Turns: 40, Pitch: 1e-3}
	prev := 0.0
	for n := 1.0; n <= 4; n++ {
		l, err := LinkOver(g, n, 1e-3)
		if err != nil {
			t.Fatal(err)
		}
		if !(l.K > 0 && l.K < 1) || !(float64(l.M) > prev) {
			t.Errorf("%g turns: %+v", n, l)
		}
		prev = float64(l.M)
	}
	if _, err := LinkOver(g, 1.5, 1e-3); err == nil {
		t.Error("half a link turn accepted")
	}
}
