package design

import (
	"math"

	"turnwise/coil"
)

// The search's inner loop evaluates the model through coil's own inner
// functions (coil.NewCore, SelfResonance, CoilAt, LossAt: the code
// Predict runs), computing only the quantities it needs, with
// everything that depends on the wire and frequency alone (coil.WireAt)
// computed once per wire. Every candidate returned is re-evaluated
// through coil.Predict.

// core evaluates pair p's winding at n turns and pitch.
func (x *search) core(p *pair, n, pitch float64) coil.Core {
	if n != x.kmN {
		x.kmN, x.km = n, coil.RosaMutual(n)
	}
	return coil.NewCore(n, pitch, 2*x.wires[p.wi].r, p.dm, x.km)
}

// srf is the self-resonance, one end grounded, as coil.Predict computes it.
func (x *search) srf(c *coil.Core) float64 {
	_, srf, _ := c.SelfResonance()
	return srf
}

// matched evaluates the matched value of pair p at n turns and pitch:
// the terminal inductance, or the effective one (+Inf at or past 0.95 of
// the self-resonance, as eval).
func (x *search) matched(p *pair, n, pitch float64) float64 {
	x.stats.Evaluations++
	c := x.core(p, n, pitch)
	fr := &x.wires[p.wi].atMatch
	if !x.s.effective {
		return c.CoilAt(fr) + fr.Leads
	}
	srf := x.srf(&c)
	if srf < 1.05*fr.F {
		return math.Inf(1)
	}
	return c.Effective(fr, srf)
}

// lean is what the score needs of a coil.
type lean struct {
	q, srf   float64
	length   float64 // outside winding length
	od       float64
	wire     float64 // to cut
	ld       float64
	longWire bool
}

// lean evaluates pair p at n turns and pitch at the operating frequency.
func (x *search) lean(p *pair, n, pitch float64) lean {
	x.stats.Evaluations++
	dw := &x.wires[p.wi]
	c := x.core(p, n, pitch)
	helix := c.Helix()
	out := lean{
		length: (n-1)*pitch + dw.do,
		od:     p.od,
		wire:   helix + 2*float64(x.s.c.LeadLength) + float64(coil.CutAllowance),
		ld:     c.LD,
		srf:    x.srf(&c),
	}
	fr := &dw.atOp
	if fr.F == 0 {
		return out
	}
	out.q = c.LossAt(fr, helix, out.srf).Q
	out.longWire = helix > fr.Lambda/10
	return out
}
