package coil

import (
	"math"

	"gonum.org/v1/gonum/unit"
)

// The model's inner evaluation, in plain floats: evaluate (Predict) and the
// design search both call these, so that every formula and constant of
// the inductance, self-resonance and loss exists once. Nothing here
// allocates.

// RadiationConstant is 320π⁴ Ω (≈ 31171 Ω): the radiation resistance of a
// small loop of N turns and area A at wavelength λ is 320π⁴·(N·A/λ²)²
// (Kraus, Antennas, 2nd ed. 1988, small-loop radiation resistance).
const RadiationConstant = 320 * math.Pi * math.Pi * math.Pi * math.Pi

// CopperResistivity is the IACS resistivity of copper at conductor
// temperature t (zero means 20 °C), Ω·m.
func CopperResistivity(t unit.Temperature) float64 {
	k := float64(t)
	if t == 0 {
		k = roomKelvin
	}
	return CopperResistivity20 * (1 + CopperTempCoeff*(k-roomKelvin))
}

// WireAt holds what depends on the wire and one frequency alone, so that a
// caller evaluating many coils of one wire computes it once.
type WireAt struct {
	F       float64 // frequency, Hz; zero for DC
	Delta   float64 // skin depth, m (zero at DC)
	Fs      float64 // R_ac/R_dc of isolated straight wire
	Phi     float64 // internal-inductance fraction
	Leads   float64 // both leads' inductance, H
	RLeads  float64 // both leads' resistance, Ω (zero at DC)
	Lambda  float64 // wavelength, m (zero at DC)
	RdcPerM float64 // DC resistance per metre, Ω/m
}

// NewWireAt computes the parts for bare radius r, resistivity rho, lead
// length lead (each) and frequency f (zero for DC).
func NewWireAt(r, rho, lead, f float64) WireAt {
	rdcPerM := rho / (math.Pi * r * r)
	if f == 0 {
		return WireAt{Fs: 1, Phi: 1, Leads: 2 * LeadInductance(lead, r, 1), RdcPerM: rdcPerM}
	}
	delta := SkinDepth(rho, f)
	fs, phi := SkinFactors(r / delta)
	return WireAt{F: f, Delta: delta, Fs: fs, Phi: phi, Leads: 2 * LeadInductance(lead, r, phi),
		RLeads: rdcPerM * fs * 2 * lead, Lambda: SpeedOfLight / f, RdcPerM: rdcPerM}
}

// Core is the part of an evaluation shared by every frequency: the
// winding's shape and its low-frequency inductance.
type Core struct {
	N, Pitch float64 // turns, pitch
	D        float64 // bare wire diameter
	Dm, A    float64 // mean diameter and radius
	L, LD    float64 // Rosa's l = N·p, and l/D
	Kn       float64 // Nagaoka's K_N(l/D)
	Ls       float64 // current-sheet inductance
	KsDC     float64 // Rosa's k_s at DC
	Km       float64 // Rosa's k_m
	PerK     float64 // inductance per unit of Rosa's correction, μ0·a·N
	Pitched  float64 // the helix beyond Rosa's rings (HelixPitchCorrection), H
	Internal float64 // the wire's internal inductance at DC, μ0·ℓ/8π, H
	LCoilDC  float64 // the helix alone, low frequency
}

// NewCore evaluates the winding of n turns at pitch, bare wire diameter d
// and mean diameter dm; km is RosaMutual(n), passed in so that a caller
// may reuse it across pitches.
func NewCore(n, pitch, d, dm, km float64) Core {
	a := dm / 2
	l := n * pitch
	ld := l / dm
	kn := Nagaoka(ld)
	ls := Mu0 * math.Pi * a * a * n * n / l * kn
	lnRatio := math.Log(2 * pitch / d)
	perK := Mu0 * a * n
	ksDC := 1.25 - lnRatio
	dl, sec := HelixPitchCorrection(n, pitch, d, dm)
	return Core{N: n, Pitch: pitch, D: d, Dm: dm, A: a, L: l, LD: ld, Kn: kn, Ls: ls,
		KsDC: ksDC, Km: km, PerK: perK, Pitched: dl, Internal: perK * sec / 4,
		LCoilDC: ls - perK*(ksDC+km) + dl}
}

// Helix is the length of wire in the winding.
func (c *Core) Helix() float64 { return HelixLength(c.N, c.Dm, c.Pitch) }

// HelixLength is the wire in n turns of mean diameter dm at pitch.
func HelixLength(n, dm, pitch float64) float64 {
	return n * math.Sqrt(math.Pi*math.Pi*dm*dm+pitch*pitch)
}

// PartialProximity scales the excess of Medhurst's Φ (phiMax, which holds
// once the skin effect is developed) by (F_s − 1)/F_s, so that it vanishes
// at DC as x⁴, as proximity loss does, and reaches Φ at high frequency
// (our interpolation, part of Q's band). It rises with phiMax, so a lower
// bound on Φ gives a lower bound on the result.
func PartialProximity(phiMax, fs float64) float64 { return 1 + (phiMax-1)*(fs-1)/fs }

// SelfResonance returns the self-resonance with one end grounded from the
// helical-line model (HelixSRF), whether the coil is inside the range the
// model was validated over (SRFValid), and the equivalent lumped
// self-capacitance 1/(ω²L) at that frequency. The coil's own inductance
// at the SRF comes from the DC value less its internal part (the skin
// effect is developed at any practical SRF).
func (c *Core) SelfResonance() (cs, srf float64, inTable bool) {
	srf = HelixSRF(c.N, c.Pitch, c.D, c.Dm, c.Km, true)
	lSRF := c.LCoilDC - c.Internal
	w := twoPi * srf
	return 1 / (w * w * lSRF), srf, SRFValid(c.LD, c.Pitch/c.D)
}

// FloatingResonance is the self-resonance with both ends floating.
func (c *Core) FloatingResonance() float64 {
	return HelixSRF(c.N, c.Pitch, c.D, c.Dm, c.Km, false)
}

// CoilAt is the helix's inductance at w's frequency: the internal
// inductance is lost as the skin effect develops.
func (c *Core) CoilAt(w *WireAt) float64 {
	if w.F == 0 {
		return c.LCoilDC
	}
	return c.LCoilDC - c.Internal*(1-w.Phi)
}

// Effective is the apparent inductance at the terminals at w's frequency
// with the self-capacitance included, for self-resonance srf.
func (c *Core) Effective(w *WireAt, srf float64) float64 {
	rr := w.F / srf
	return w.Leads + c.CoilAt(w)/(1-rr*rr)
}

// Loss is the loss side of an evaluation at one frequency.
type Loss struct {
	Proximity  float64 // Medhurst's Φ scaled for partial skin effect
	RRadiation float64 // Ω
	REff       float64 // effective series resistance at the terminals, Ω
	LEff       float64 // effective inductance, H
	Q          float64
}

// LossAt evaluates the loss at w's frequency (not DC) for a winding of
// helix wire length and self-resonance srf.
func (c *Core) LossAt(w *WireAt, helix, srf float64) Loss {
	rr := w.F / srf
	gr := 1 - rr*rr
	lEff := c.Effective(w, srf)
	prox := PartialProximity(ProximityFactor(c.LD, c.D/c.Pitch), w.Fs)
	area := math.Pi * c.A * c.A
	nAL := c.N * area / (w.Lambda * w.Lambda)
	rRad := RadiationConstant * nAL * nAL // small loop, Kraus 1988
	rCoil := w.RdcPerM*w.Fs*helix*prox + rRad
	rEff := w.RLeads + rCoil/(gr*gr)
	return Loss{Proximity: prox, RRadiation: rRad, REff: rEff, LEff: lEff, Q: twoPi * w.F * lEff / rEff}
}
