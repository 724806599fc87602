package coil

import "math"

// The search's inner loop evaluates the same model as evaluate (predict.go)
// but only the quantities it needs, with everything that depends on the
// wire and frequency alone computed once per wire. The arithmetic follows
// evaluate step for step, so the values agree to rounding;
// TestDesignLeanMatchesEvaluate holds the two together, and every
// candidate returned is re-evaluated through Predict.

// dsFreq holds what depends on the wire and one frequency.
type dsFreq struct {
	f      float64
	fs     float64 // R_ac/R_dc
	phi    float64 // internal-inductance fraction
	leads  float64 // both leads' inductance
	rLeads float64 // both leads' resistance
	lambda float64 // wavelength
}

func newDsFreq(r, rho, rdcPerM, lead, f float64) dsFreq {
	if f == 0 {
		return dsFreq{fs: 1, phi: 1, leads: 2 * LeadInductance(lead, r, 1)}
	}
	fs, phi := SkinFactors(r / SkinDepth(rho, f))
	return dsFreq{f: f, fs: fs, phi: phi, leads: 2 * LeadInductance(lead, r, phi),
		rLeads: rdcPerM * fs * 2 * lead, lambda: SpeedOfLight / f}
}

// dsCore is the part of an evaluation shared by every frequency.
type dsCore struct {
	n, pitch, dm, a, l, ld float64
	lCoilDC, perK          float64
}

func (x *dsSearch) core(p *dsPair, n, pitch float64) dsCore {
	dw := &x.wires[p.wi]
	d := 2 * dw.r
	dm := p.dm
	a := dm / 2
	l := n * pitch
	ld := l / dm
	kn := Nagaoka(ld)
	ls := Mu0 * math.Pi * a * a * n * n / l * kn
	lnRatio := math.Log(2 * pitch / d)
	if n != x.kmN {
		x.kmN, x.km = n, RosaMutual(n)
	}
	km := x.km
	perK := Mu0 * a * n
	ksDC := 1.25 - lnRatio
	return dsCore{n: n, pitch: pitch, dm: dm, a: a, l: l, ld: ld, lCoilDC: ls - perK*(ksDC+km), perK: perK}
}

// srf is the self-resonance, one end grounded, as evaluate computes it.
func (x *dsSearch) srf(p *dsPair, c *dsCore) float64 {
	dw := &x.wires[p.wi]
	h, _ := MedhurstH(c.ld)
	cs := h * 1e-10 * c.dm
	srf := 1 / (twoPi * math.Sqrt(c.lCoilDC*cs))
	_, phiSRF := SkinFactors(dw.r / SkinDepth(dw.rho, srf))
	lSRF := c.lCoilDC - c.perK*(1-phiSRF)/4
	return 1 / (twoPi * math.Sqrt(lSRF*cs))
}

// terminal is the terminal inductance at fr's frequency.
func terminal(c *dsCore, fr *dsFreq) (lCoil, total float64) {
	if fr.f == 0 {
		return c.lCoilDC, c.lCoilDC + fr.leads
	}
	lCoil = c.lCoilDC - c.perK*(1-fr.phi)/4
	return lCoil, lCoil + fr.leads
}

// matched evaluates the matched value of pair p at n turns and pitch:
// the terminal inductance, or the effective one (+Inf at or past 0.95 of
// the self-resonance, as eval).
func (x *dsSearch) matched(p *dsPair, n, pitch float64) float64 {
	x.stats.Evaluations++
	c := x.core(p, n, pitch)
	fr := &x.wires[p.wi].atMatch
	lCoil, total := terminal(&c, fr)
	if !x.s.effective {
		return total
	}
	srf := x.srf(p, &c)
	if srf < 1.05*fr.f {
		return math.Inf(1)
	}
	rr := fr.f / srf
	return fr.leads + lCoil/(1-rr*rr)
}

// dsLean is what the score needs of a coil.
type dsLean struct {
	q, srf   float64
	length   float64 // outside winding length
	od       float64
	wire     float64 // to cut
	ld       float64
	longWire bool
}

// lean evaluates pair p at n turns and pitch at the operating frequency.
func (x *dsSearch) lean(p *dsPair, n, pitch float64) dsLean {
	x.stats.Evaluations++
	dw := &x.wires[p.wi]
	c := x.core(p, n, pitch)
	helix := n * math.Sqrt(math.Pi*math.Pi*c.dm*c.dm+pitch*pitch)
	out := dsLean{
		length: (n-1)*pitch + dw.do,
		od:     p.od,
		wire:   helix + 2*float64(x.s.c.LeadLength) + float64(CutAllowance),
		ld:     c.ld,
		srf:    x.srf(p, &c),
	}
	fr := &dw.atOp
	if fr.f == 0 {
		return out
	}
	lCoil, _ := terminal(&c, fr)
	rr := fr.f / out.srf
	gr := 1 - rr*rr
	lEff := fr.leads + lCoil/gr
	phiMax := ProximityFactor(c.ld, 2*dw.r/pitch)
	prox := 1 + (phiMax-1)*(fr.fs-1)/fr.fs
	area := math.Pi * c.a * c.a
	nAL := n * area / (fr.lambda * fr.lambda)
	rRad := 31171 * nAL * nAL
	rCoil := dw.rdcPerM*fr.fs*helix*prox + rRad
	rEff := fr.rLeads + rCoil/(gr*gr)
	out.q = twoPi * fr.f * lEff / rEff
	out.longWire = helix > fr.lambda/10
	return out
}
