package coil

import (
	"math"
	"math/cmplx"
)

// Plated wire: a thin skin of another metal on a copper core.
//
// At radio frequencies the current crowds into the outer skin depth, so a
// plating comparable to a skin depth carries much of it. A plating of
// resistivity ρ1 and thickness t on a copper core (ρ2) has the surface
// impedance of a two-layer conductor, the input impedance of a plating
// "line" of propagation constant k1 terminated by the core's own surface
// impedance (Ramo, Whinnery & Van Duzer, Fields and Waves in Communication
// Electronics, 3rd ed. 1994, §5.6 and the layered-conductor problem of §6;
// the same transmission-line form appears in Collin, Foundations for
// Microwave Engineering, 2nd ed. 1992, §2.9):
//
//	Z = Z1·(Z2 + Z1·tanh(k1·t)) / (Z1 + Z2·tanh(k1·t)),
//	Zi = (1+j)/(σi·δi),  k1 = (1+j)/δ1.
//
// t → 0 gives copper's Z2; t ≫ δ1 gives the plating metal's Z1. The wire's
// excess AC resistance (R_ac − R_dc, from the isolated-wire skin factor) is
// scaled by Re Z / Re Z2 (our interpolation between the two exact limits:
// at DC the thin plating carries a negligible share of the current, with
// the skin effect developed the loss per unit surface is Re Z·|H|²/2).

// Resistivities at 20 °C, Ω·m (CRC Handbook of Chemistry and Physics,
// "Electrical resistivity of pure metals": tin 11.5 µΩ·cm, silver
// 1.59 µΩ·cm). A plating's resistivity follows the copper core's
// temperature ratio (tin's and silver's coefficients, 0.0042 and 0.0038
// per K, are within 10 % of copper's).
const (
	TinResistivity20    = 1.15e-7
	SilverResistivity20 = 1.59e-8
)

// Typical plating thicknesses, m (from memory: electro-tinned and hot-dip
// tinned copper wire carries about 1 µm of tin; silver-plated copper wire
// for RF is sold with 1–5 µm of silver, 2 µm being a common class). Give
// Geometry.Plating to override them.
const (
	TypicalTinPlating    = 1e-6
	TypicalSilverPlating = 2e-6
	// MaxPlating is the thickest plating the model accepts, m.
	MaxPlating = 100e-6
)

// TypicalPlating is the plating thickness assumed for conductor c when
// none is given: zero for bare copper.
func (c Conductor) TypicalPlating() float64 {
	switch c {
	case Tinned:
		return TypicalTinPlating
	case SilverPlated:
		return TypicalSilverPlating
	}
	return 0
}

// platingResistivity20 is the plating metal's resistivity at 20 °C; zero
// for bare copper.
func (c Conductor) platingResistivity20() float64 {
	switch c {
	case Tinned:
		return TinResistivity20
	case SilverPlated:
		return SilverResistivity20
	}
	return 0
}

// LayeredSurfaceImpedance is the surface impedance (Ω per square) at
// frequency f > 0 of a layer of resistivity rho1 and thickness t on a
// half-space of resistivity rho2, both non-magnetic.
func LayeredSurfaceImpedance(rho1, t, rho2, f float64) complex128 {
	d1 := SkinDepth(rho1, f)
	d2 := SkinDepth(rho2, f)
	z1 := complex(rho1/d1, rho1/d1) // (1+j)/(σ1·δ1)
	z2 := complex(rho2/d2, rho2/d2)
	if t <= 0 {
		return z2
	}
	u := t / d1
	if u > 40 { // tanh(k1·t) is 1 to double precision
		return z1
	}
	th := cmplx.Tanh(complex(u, u))
	return z1 * (z2 + z1*th) / (z1 + z2*th)
}

// PlatingRatio is Re Z/Re Z_copper for conductor c with a plating of
// thickness t (zero: the conductor's typical plating) on a copper core of
// resistivity rhoCu, at frequency f: 1 for bare copper or at DC.
func PlatingRatio(c Conductor, t, rhoCu, f float64) float64 {
	rho20 := c.platingResistivity20()
	if rho20 == 0 || f <= 0 {
		return 1
	}
	if t == 0 {
		t = c.TypicalPlating()
	}
	rho1 := rho20 * rhoCu / CopperResistivity20
	z := LayeredSurfaceImpedance(rho1, t, rhoCu, f)
	return real(z) / (rhoCu / SkinDepth(rhoCu, f))
}

// Plate applies a plating's surface-resistance ratio (PlatingRatio) to the
// wire's AC resistance: the excess over DC, F_s − 1, scales with it, for
// the winding and the leads alike.
func (w *WireAt) Plate(ratio float64) {
	if w.F == 0 || ratio == 1 || !(ratio > 0) || math.IsInf(ratio, 0) {
		return
	}
	fs := 1 + (w.Fs-1)*ratio
	if w.Fs > 0 {
		w.RLeads *= fs / w.Fs
	}
	w.Fs = fs
}
