package coil

import "math"

// QCeiling is the Q the same winding would have at w's frequency with no
// proximity loss at all: the skin-effect resistance of the straightened
// wire, the leads and the radiation resistance only, with the same
// self-resonance magnification. No single-layer coil of this wire and
// shape can do better, so it caps the top of the likely Q band
// (Prediction.QMax): at wide pitches (p/d 6…10) Medhurst's Φ is close to 1
// and QMaxFactor·Q would otherwise promise more than the wire can give.
func (c *Core) QCeiling(w *WireAt, helix, srf float64) float64 {
	rr := w.F / srf
	gr := 1 - rr*rr
	lEff := w.Leads + c.CoilAt(w)/gr
	area := math.Pi * c.A * c.A
	nAL := c.N * area / (w.Lambda * w.Lambda)
	rRad := RadiationConstant * nAL * nAL
	rEff := w.RLeads + (w.RdcPerM*w.Fs*helix+rRad)/(gr*gr)
	return twoPi * w.F * lEff / rEff
}

// qMaxCapped is the top of the likely Q band: QMaxFactor·q, never above
// the no-proximity ceiling and never below q itself.
func qMaxCapped(q, ceiling float64) float64 {
	return math.Max(q, math.Min(q*QMaxFactor, ceiling))
}
