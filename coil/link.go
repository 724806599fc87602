package coil

import (
	"math"

	"gonum.org/v1/gonum/mathext"
	"gonum.org/v1/gonum/unit"
)

// Link windings: a few turns wound over the cold end of a coil, coupled to
// it by their mutual inductance.
//
// The mutual inductance of two coaxial circular filaments of radii a and
// b, a distance d apart along the axis, is Maxwell's formula
//
//	M = μ0·√(a·b)·[(2/k − k)·K(k) − (2/k)·E(k)],   k² = 4ab/((a+b)² + d²)
//
// with K and E the complete elliptic integrals of the first and second
// kind (gonum's mathext takes the parameter m = k²). A link and the coil
// are sums of such filaments, one per turn at its wire centre, so M is
// the sum over every pair of turns (a fractional last turn counts by its
// fraction). The link's own inductance is the same double sum over its
// turns plus each turn's self-inductance as a loop of round wire,
// μ0·a·(ln(8a/r) − 2) (no internal inductance: RF, skin effect).
//
// References: J. C. Maxwell, A Treatise on Electricity and Magnetism,
// Clarendon Press, 1873, vol. 2, art. 701; F. W. Grover, Inductance
// Calculations, Van Nostrand, 1946, ch. 13 (coaxial circles) and ch. 12
// (the loop of round wire).

// LoopMutual is the mutual inductance (H) of two coaxial circular
// filaments of radii a and b (m) whose planes are d apart (Maxwell).
func LoopMutual(a, b, d float64) float64 {
	k2 := 4 * a * b / ((a+b)*(a+b) + d*d)
	if k2 >= 1 {
		k2 = math.Nextafter(1, 0)
	}
	k := math.Sqrt(k2)
	return Mu0 * math.Sqrt(a*b) * ((2/k-k)*mathext.CompleteK(k2) - 2/k*mathext.CompleteE(k2))
}

// LoopSelf is the inductance (H) of a circular loop of radius a of round
// wire of radius r, with the current on the wire's surface (Grover).
func LoopSelf(a, r float64) float64 { return Mu0 * a * (math.Log(8*a/r) - 2) }

// Link is a link winding over the cold end of a coil.
type Link struct {
	Turns    float64     // whole turns
	Diameter unit.Length // wire-centre diameter of the link turns
	Wire     unit.Length // overall diameter of the link wire (its pitch: close-wound)
	// M is the mutual inductance with the coil's winding, L the link's own
	// inductance (both without leads), K = M/√(L_coil·L) with L_coil the
	// winding's low-frequency inductance.
	M, L unit.Inductance
	K    float64
	// Offset is the axial distance of the link's first turn beyond the
	// coil's cold-end turn (zero: directly over it).
	Offset unit.Length
}

// LinkOver returns a link of turns whole turns of wire of overall
// diameter wire, close-wound directly over the cold end of g's winding
// (the first link turn over the first coil turn).
func LinkOver(g Geometry, turns float64, wire unit.Length) (Link, error) {
	return LinkOverAt(g, turns, wire, 0)
}

// LinkOverAt is LinkOver with the link moved offset beyond the cold end
// along the axis (looser coupling).
func LinkOverAt(g Geometry, turns float64, wire, offset unit.Length) (Link, error) {
	if !finite(float64(offset)) || offset < 0 || offset > 1 {
		return Link{}, inputErrorf("link_offset", "must be between 0 and 1 m")
	}
	if err := g.Validate(); err != nil {
		return Link{}, err
	}
	if !finite(turns) || turns < 1 || turns > 50 || turns != math.Floor(turns) {
		return Link{}, inputErrorf("link_turns", "%g: give a whole number of turns from 1 to 50", turns)
	}
	if !finite(float64(wire)) || wire <= 0 || wire > 10e-3 {
		return Link{}, inputErrorf("link_wire", "the link wire's overall diameter must be above 0 and at most 10 mm")
	}
	p, err := Predict(g, 0)
	if err != nil {
		return Link{}, err
	}
	ac := float64(p.MeanDiameter) / 2
	al := float64(p.OutsideDiameter)/2 + float64(wire)/2
	pitch := float64(g.Pitch)
	lw := float64(wire)
	var m float64
	for i := 0; float64(i) < g.Turns; i++ {
		w := math.Min(1, g.Turns-float64(i))
		for j := 0; float64(j) < turns; j++ {
			m += w * LoopMutual(ac, al, float64(i)*pitch+float64(j)*lw+float64(offset))
		}
	}
	var l float64
	for j := 0; float64(j) < turns; j++ {
		l += LoopSelf(al, lw/2)
		for k := 0; float64(k) < turns; k++ {
			if k != j {
				l += LoopMutual(al, al, float64(j-k)*lw)
			}
		}
	}
	lc := float64(p.InductanceCoil)
	return Link{Turns: turns, Diameter: unit.Length(2 * al), Wire: wire, M: unit.Inductance(m), L: unit.Inductance(l), K: m / math.Sqrt(lc*l), Offset: offset}, nil
}
