package coil

import (
	"math"

	"gonum.org/v1/gonum/integrate/quad"
	"gonum.org/v1/gonum/unit"
)

// Sections describes a coil tapped TapTurns turns from its cold (grounded)
// end. The part below the tap and the part above it are coaxial coils of
// the coil's diameter and pitch, each evaluated by the same model as a
// whole coil; the mutual inductance is what is left over:
//
//	M = (L − L_a − L_b)/2,   k = M/√(L_a·L_b),   ratio = (L_b + M)/L
//
// ratio is the unloaded voltage at the tap as a fraction of the voltage
// across the whole coil.
//
// Leads: the cold lead carries the bottom section's current and the hot
// lead the top section's, so each is in series with its section and is
// counted in it (L_b includes the cold lead, L_a the hot lead; neither is
// coupled to the winding). The tap lead is not modelled: it belongs to the
// circuit connected at the tap and should be kept short. A tap at 0 turns
// is the cold terminal itself (L_b = 0, ratio 0) and a tap at N turns the
// hot terminal (L_b = L, ratio 1); anywhere between, the tap is on the
// winding, so the sections jump by one lead's inductance at the ends.
type Sections struct {
	Turns    float64 // N, the whole coil
	TapTurns float64 // n, counted from the cold end, quarter turns
	// TapPosition is the axial distance n·p from the centre of the wire
	// where the winding starts at the cold end to the tap.
	TapPosition unit.Length
	Frequency   unit.Frequency  // the inductances are at this frequency (0: low frequency)
	L           unit.Inductance // whole coil at the terminals, both leads
	LA          unit.Inductance // top section, tap to hot end, hot lead included
	LB          unit.Inductance // bottom section, cold end to tap, cold lead included
	M           unit.Inductance // mutual inductance of the two sections
	K           float64         // coupling coefficient M/√(L_a·L_b); 0 at the ends
	Ratio       float64         // unloaded voltage ratio (L_b + M)/L
}

// ImpedanceRatio is Ratio²: the impedance seen at the tap as a fraction of
// the impedance across the whole tuned coil. It holds for a high-Q tank
// whose tap load is light (much larger than the bottom section's
// reactance); with loose coupling between the sections and a heavy load the
// real transformation is smaller.
func (s Sections) ImpedanceRatio() float64 { return s.Ratio * s.Ratio }

// Tap returns the sections of g tapped tapTurns turns from the cold end, at
// frequency f (0 for low frequency). tapTurns must be a multiple of a
// quarter turn from 0 to g.Turns.
func Tap(g Geometry, tapTurns float64, f unit.Frequency) (Sections, error) {
	if err := g.Validate(); err != nil {
		return Sections{}, err
	}
	if !finite(float64(f)) || f < 0 || f > MaxFrequency {
		return Sections{}, inputErrorf("frequency", "must be between 0 and 10 GHz, e.g. 7MHz")
	}
	if err := validateTap(g.Turns, tapTurns); err != nil {
		return Sections{}, err
	}
	return sections(&g, tapTurns, float64(f)), nil
}

func validateTap(turns, tap float64) error {
	switch {
	case !finite(tap) || tap < 0:
		return inputErrorf("tap_turns", "must be zero or more turns from the cold end, e.g. 3.25")
	case tap > turns:
		return inputErrorf("tap_turns", "%g is beyond the coil's %g turns; count the tap from the cold end, at most %g", tap, turns, turns)
	case math.Abs(tap*4-math.Round(tap*4)) > 1e-9:
		return inputErrorf("tap_turns", "%g is not a whole number of quarter turns; use e.g. %g", tap, math.Round(tap*4)/4)
	}
	return nil
}

// sections evaluates a validated geometry and tap.
func sections(g *Geometry, n, f float64) Sections {
	var whole Prediction
	evaluate(&whole, g, f, Grounded)
	lTotal := float64(whole.Inductance)
	lead := float64(whole.InductanceLeads) / 2
	s := Sections{
		Turns:       g.Turns,
		TapTurns:    n,
		TapPosition: unit.Length(n * float64(g.Pitch)),
		Frequency:   unit.Frequency(f),
		L:           unit.Inductance(lTotal),
	}
	switch {
	case n <= 0:
		s.LA = s.L
		return s
	case n >= g.Turns:
		s.LB = s.L
		s.Ratio = 1
		return s
	}
	lb := helixInductance(g, n, f) + lead
	la := helixInductance(g, g.Turns-n, f) + lead
	m := (lTotal - la - lb) / 2
	s.LA, s.LB, s.M = unit.Inductance(la), unit.Inductance(lb), unit.Inductance(m)
	s.K = m / math.Sqrt(la*lb)
	s.Ratio = (lb + m) / lTotal
	return s
}

// helixInductance is the inductance of n turns of g's winding alone, no
// leads, at f. From one turn up it is the whole-coil model. Below one turn
// the current-sheet picture has no meaning (Rosa's mutual series diverges
// and the round-wire correction outgrows the sheet), so a partial turn is
// taken as a circular arc of the wire: one turn's model value scaled by the
// ratio of the arc's inductance to the full ring's (arcInductance). That
// is continuous at one turn and exactly zero at zero turns.
func helixInductance(g *Geometry, n, f float64) float64 {
	if n <= 0 {
		return 0
	}
	h := *g
	h.LeadLength = 0
	h.Turns = math.Max(n, 1)
	var p Prediction
	evaluate(&p, &h, f, Grounded)
	one := float64(p.InductanceCoilAtF)
	if n >= 1 {
		return one
	}
	a := float64(p.MeanDiameter) / 2
	gmd := float64(g.WireDiameter) / 2 * math.Exp(-p.InternalFraction/4)
	return one * arcInductance(a, gmd, twoPi*n) / arcInductance(a, gmd, twoPi)
}

// arcInductance is the self-inductance of a circular arc of radius a and
// angle theta (radians, up to 2π) of round wire whose geometric mean
// distance from itself is gmd: Neumann's double line integral along the
// arc, with the second path displaced by gmd (Grover 1946, ch. 1):
//
//	L = μ0·a/(2π) · ∫₀^θ (θ−ψ)·cos ψ / √(4 sin²(ψ/2) + (gmd/a)²) dψ
//
// integrated with Gauss–Legendre rules on intervals that double in width
// away from the near-singular point ψ = 0. For the full ring it gives
// Maxwell's μ0·a·(ln(8a/gmd) − 2) for a ≫ gmd (tested).
func arcInductance(a, gmd, theta float64) float64 {
	rho := gmd / a
	rho2 := rho * rho
	fn := func(psi float64) float64 {
		s := math.Sin(psi / 2)
		return (theta - psi) * math.Cos(psi) / math.Sqrt(4*s*s+rho2)
	}
	// The integrand has near-poles at ψ = ±i·gmd/a and, for an arc near a
	// full ring, at ψ = 2π ± i·gmd/a, where the arc's ends meet. Panels
	// start well inside that distance from each and double outwards.
	var sum float64
	first := math.Min(theta, math.Pi)
	lo, hi := 0.0, math.Min(rho/8, first)
	for lo < first {
		sum += quad.Fixed(fn, lo, hi, 20, quad.Legendre{}, 0)
		lo, hi = hi, math.Min(2*hi, first)
	}
	if theta > math.Pi {
		// ψ = 2π − u for u from 2π − θ up to π.
		u0 := twoPi - theta
		lo, hi := u0, u0+math.Max(rho/8, u0)
		for lo < math.Pi {
			hi = math.Min(hi, math.Pi)
			sum += quad.Fixed(fn, twoPi-hi, twoPi-lo, 20, quad.Legendre{}, 0)
			lo, hi = hi, hi+2*(hi-lo)
		}
	}
	return Mu0 * a / twoPi * sum
}
