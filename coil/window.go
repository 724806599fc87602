package coil

import (
	"gonum.org/v1/gonum/unit"
)

// LoosestPitchFactor is the loosest pitch, in overall wire diameters, that a
// builder can set by spreading turns and still keep them even and the coil
// in shape (a gap of two wire diameters; common practice).
const LoosestPitchFactor = 3.0

// WindowPitches are the pitches at the ends of the squeeze/spread window:
// close-wound (d_o) and LoosestPitchFactor·d_o, or the coil's own pitch
// when it is already looser than that.
func WindowPitches(g Geometry) (tight, loose unit.Length) {
	do := g.overall()
	return unit.Length(do), unit.Length(max(LoosestPitchFactor*do, float64(g.Pitch)))
}

// Window is the range of terminal inductance at f a coil of g's turns can
// be trimmed to by squeezing or spreading: close-wound (the most) down to
// LoosestPitchFactor·d_o (the least). Pitch does not enter; the turns are
// held. The self-resonance check of Predict is not applied at the window's
// ends.
func Window(g Geometry, f unit.Frequency) (least, most unit.Inductance, err error) {
	if err := g.Validate(); err != nil {
		return 0, 0, err
	}
	tight, loose := g, g
	tight.Pitch, loose.Pitch = WindowPitches(g)
	var a, b Prediction
	evaluate(&a, &tight, float64(f), Grounded)
	evaluate(&b, &loose, float64(f), Grounded)
	return b.Inductance, a.Inductance, nil
}
