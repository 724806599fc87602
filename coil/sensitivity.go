package coil

import (
	"math"

	"gonum.org/v1/gonum/unit"
)

// LengthPerPercent is the change of outside winding length that changes the
// terminal inductance at f by 1 %, with the turns held: how far a builder
// squeezes (shorter, more L) or spreads (longer, less L) per percent. It
// is zero for a single turn, whose length a pitch change does not alter.
// Computed by a central difference of the model in the pitch.
func LengthPerPercent(g Geometry, f unit.Frequency) (unit.Length, error) {
	if err := g.Validate(); err != nil {
		return 0, err
	}
	if g.Turns <= 1 {
		return 0, nil
	}
	p0 := float64(g.Pitch)
	h := 1e-4 * p0
	lo, hi := g, g
	lo.Pitch = unit.Length(math.Max(p0-h, g.overall()))
	hi.Pitch = unit.Length(p0 + h)
	var a, b, c Prediction
	evaluate(&a, &lo, float64(f), Grounded)
	evaluate(&b, &hi, float64(f), Grounded)
	evaluate(&c, &g, float64(f), Grounded)
	dLdp := float64(b.Inductance-a.Inductance) / float64(hi.Pitch-lo.Pitch)
	if dLdp == 0 || !finite(dLdp) {
		return 0, nil
	}
	dp := 0.01 * float64(c.Inductance) / math.Abs(dLdp)
	return unit.Length((g.Turns - 1) * dp), nil
}
