package coil

import (
	"math"
	"math/cmplx"
	"testing"

	"gonum.org/v1/gonum/unit"
)

// odeSurfaceImpedance integrates the one-dimensional field equations
// dE/dx = −jωμ0·H, dH/dx = −σ(x)·E through the plating, from the copper
// interface (where E/H is copper's own surface impedance) up to the
// surface, with fourth-order Runge–Kutta: an independent route to the
// closed-form layered impedance.
func odeSurfaceImpedance(rho1, t, rho2, f float64) complex128 {
	w := 2 * math.Pi * f
	d2 := SkinDepth(rho2, f)
	e, h := complex(rho2/d2, rho2/d2), complex(1, 0)
	sigma := 1 / rho1
	n := 4000
	dx := -t / float64(n) // from x = t back to the surface x = 0
	deriv := func(e, h complex128) (complex128, complex128) {
		return complex(0, -w*Mu0) * h, complex(-sigma, 0) * e
	}
	for range n {
		k1e, k1h := deriv(e, h)
		k2e, k2h := deriv(e+k1e*complex(dx/2, 0), h+k1h*complex(dx/2, 0))
		k3e, k3h := deriv(e+k2e*complex(dx/2, 0), h+k2h*complex(dx/2, 0))
		k4e, k4h := deriv(e+k3e*complex(dx, 0), h+k3h*complex(dx, 0))
		e += (k1e + 2*k2e + 2*k3e + k4e) * complex(dx/6, 0)
		h += (k1h + 2*k2h + 2*k3h + k4h) * complex(dx/6, 0)
	}
	return e / h
}

func TestLayeredSurfaceImpedance(t *testing.T) {
	rhoCu := CopperResistivity20
	for _, c := range []struct {
		name    string
		rho1, t float64
		f       float64
	}{
		{"tin 1um at 3.5MHz", TinResistivity20, 1e-6, 3.5e6},
		{"tin 1um at 145MHz", TinResistivity20, 1e-6, 145e6},
		{"tin 10um at 145MHz", TinResistivity20, 10e-6, 145e6},
		{"silver 2um at 30MHz", SilverResistivity20, 2e-6, 30e6},
		{"silver 5um at 1GHz", SilverResistivity20, 5e-6, 1e9},
	} {
		t.Run(c.name, func(t *testing.T) {
			got := LayeredSurfaceImpedance(c.rho1, c.t, rhoCu, c.f)
			want := odeSurfaceImpedance(c.rho1, c.t, rhoCu, c.f) // RK4 of the field equations
			if cmplx.Abs(got-want) > 1e-6*cmplx.Abs(want) {
				t.Errorf("closed form %v, field integration %v", got, want)
			}
		})
	}
}

func TestPlatingRatioLimits(t *testing.T) {
	rhoCu := CopperResistivity20
	f := 30e6
	// t → 0: copper.
	if r := PlatingRatio(Tinned, 1e-12, rhoCu, f); math.Abs(r-1) > 1e-4 {
		t.Errorf("vanishing tin: ratio %g, want 1", r)
	}
	// t ≫ δ: the plating metal alone, Re Z ∝ √ρ.
	wantTin := math.Sqrt(TinResistivity20 / rhoCu) // Rs = √(πfμ0ρ)
	if r := PlatingRatio(Tinned, 100e-6, rhoCu, 10e9); math.Abs(r-wantTin) > 1e-3*wantTin {
		t.Errorf("thick tin: ratio %g, want %g", r, wantTin)
	}
	wantAg := math.Sqrt(SilverResistivity20 / rhoCu)
	if r := PlatingRatio(SilverPlated, 100e-6, rhoCu, 10e9); math.Abs(r-wantAg) > 1e-3*wantAg {
		t.Errorf("thick silver: ratio %g, want %g", r, wantAg)
	}
	if r := PlatingRatio(Copper, 0, rhoCu, f); r != 1 {
		t.Errorf("copper: ratio %g, want exactly 1", r)
	}
	if r := PlatingRatio(Tinned, 0, rhoCu, 0); r != 1 {
		t.Errorf("DC: ratio %g, want exactly 1", r)
	}
}

// A VHF coil of 1 mm wire, 5 turns on 8 mm: plated wire's Q against copper.
func TestPlatedQ(t *testing.T) {
	base := Geometry{FormerDiameter: 8e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 2e-3, LeadLength: 5e-3}
	q := func(c Conductor, plating float64, f float64) float64 {
		g := base
		g.Conductor = c
		g.Plating = unit.Length(plating)
		p, err := Predict(g, unit.Frequency(f))
		if err != nil {
			t.Fatal(err)
		}
		return p.Q
	}
	for _, f := range []float64{3.5e6, 30e6, 145e6} {
		cu, tin, ag := q(Copper, 0, f), q(Tinned, 0, f), q(SilverPlated, 0, f)
		t.Logf("f %.4g MHz: Q copper %.1f, tinned %.1f (%.3f), silver-plated %.1f (%.3f)", f/1e6, cu, tin, tin/cu, ag, ag/cu)
		if !(tin < cu) {
			t.Errorf("%g Hz: tinned Q %g not below copper %g", f, tin, cu)
		}
		if !(ag > cu) {
			t.Errorf("%g Hz: silver-plated Q %g not above copper %g", f, ag, cu)
		}
	}
	// A thin plating changes the surface resistance only at second order
	// in t/δ (its first-order term, jωμ0·t, is reactive), so 1 µm of tin
	// costs little; 5 µm, a third of tin's 17 µm skin depth at 100 MHz,
	// costs clearly more.
	for _, um := range []float64{1, 2, 5, 10} {
		t.Logf("100 MHz: %g µm tin Q/Q_copper %.3f", um, q(Tinned, um*1e-6, 100e6)/q(Copper, 0, 100e6))
	}
	if cu, tin := q(Copper, 0, 100e6), q(Tinned, 5e-6, 100e6); tin > 0.9*cu {
		t.Errorf("100 MHz: 5 µm tinned Q %g is within 10 %% of copper %g", tin, cu)
	}
	// A thicker tin plating is worse still.
	if a, b := q(Tinned, 1e-6, 100e6), q(Tinned, 5e-6, 100e6); !(b < a) {
		t.Errorf("5 µm tin Q %g not below 1 µm %g", b, a)
	}
}

func TestPlatingValidate(t *testing.T) {
	for _, c := range []struct {
		name string
		cond Conductor
		t    float64
	}{
		{"negative", Tinned, -1e-6},
		{"copper with plating", Copper, 1e-6},
		{"thicker than a quarter of the wire", Tinned, 0.3e-3},
		{"NaN", SilverPlated, math.NaN()},
	} {
		t.Run(c.name, func(t *testing.T) {
			g := Geometry{FormerDiameter: 8e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 2e-3, Conductor: c.cond, Plating: unit.Length(c.t)}
			if err := g.Validate(); err == nil {
				t.Error("accepted")
			}
		})
	}
}
