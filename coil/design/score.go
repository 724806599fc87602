package design

import (
	"math"
	"turnwise/coil"
)

// twoPi saves a multiply in hot paths.
const twoPi = 2 * math.Pi

// The score of a coil that meets the target and every constraint (higher
// is better), in natural-log units so that each term is scale-free:
//
//	score = w_q·u(Q) + w_srf·min(ln(SRF/(r·f)), ln 3)
//	        − w_size·ln(∛V / 1 cm) − w_cu·ln(wire / 1 m) − w_ease·E − tinned
//
//	u(Q) = ln Q − ln(1 + Q/Q_knee)
//
// Q and SRF at the operating frequency f (both terms drop out without
// one), r the minimum SRF ratio, V the outside volume π/4·OD²·length (∛V
// is the coil's size as a length), "wire" the length to cut.
//
// u(Q) grows like ln Q for low Q and flattens above Q_knee = 250: an
// unloaded Q several times the circuit's loaded Q (10–50 for most filters,
// tanks and preselectors) keeps the insertion loss small, and more costs
// size for little (common practice). Since Q grows about in proportion to
// the coil's size, the balanced weights settle near Q ≈ Q_knee;
// --prefer q removes the knee.
//
// E, the winding difficulty, adds
//
//   - ½ × (0 whole turns, ¼ half turns, ½ quarter turns);
//   - ½ × the distance of the pitch from 2 or 3 wire diameters (a spacer
//     of one or two turns of the same wire sets those exactly; common
//     practice), in half-diameter units, at most 1;
//   - |ln| of how far l/D lies outside 0.5 … 2 (common practice: such
//     coils hold their shape and their Q is near its best).
//
// Tinned wire loses 0.1: its tin skin raises the RF resistance beyond what
// the model counts.
//
// Weights (q, srf, size, cu, ease): balanced 1, 0.3, 0.5, 0.1, 0.3;
// --prefer q 1, 0.3, 0.3, 0.05, 0.2 without the knee; small 0.6, 0.3,
// 1.5, 0.1, 0.3; easy 0.6, 0.3, 0.4, 0.1, 1.2.

type weights struct{ q, srf, size, cu, ease, knee float64 }

// qKnee is Q_knee above.
const qKnee = 250

func weightsFor(p Preference, hasF bool) weights {
	w := weights{q: 1, srf: 0.3, size: 0.5, cu: 0.1, ease: 0.3, knee: qKnee}
	switch p {
	case PreferQ:
		w = weights{q: 1, srf: 0.3, size: 0.3, cu: 0.05, ease: 0.2, knee: math.Inf(1)}
	case PreferSmall:
		w = weights{q: 0.6, srf: 0.3, size: 1.5, cu: 0.1, ease: 0.3, knee: qKnee}
	case PreferEasy:
		w = weights{q: 0.6, srf: 0.3, size: 0.4, cu: 0.1, ease: 1.2, knee: qKnee}
	}
	if !hasF {
		w.q, w.srf = 0, 0
	}
	return w
}

// utility is u(Q); it rises with Q, so a bound on Q bounds it.
func (w weights) utility(q float64) float64 {
	return math.Log(q) - math.Log1p(q/w.knee)
}

const (
	scoreSizeRef  = 1e-2 // m
	scoreWireRef  = 1.0  // m
	scoreSRFCap   = 1.0986122886681098
	tinnedPenalty = 0.1
)

// easePenalty is E above.
func easePenalty(n, pitch, overall, lOverD float64) float64 {
	turns := turnsPenalty(n)
	r := pitch / overall
	spacing := math.Min(1, math.Min(math.Abs(r-2), math.Abs(r-3))/0.5)
	var shape float64
	switch {
	case lOverD < 0.5:
		shape = math.Log(0.5 / lOverD)
	case lOverD > 2:
		shape = math.Log(lOverD / 2)
	}
	return 0.5*turns + 0.5*spacing + shape
}

// turnsPenalty: 0 for whole turns, ¼ for half turns, ½ for quarter turns.
func turnsPenalty(n float64) float64 {
	switch frac := n - math.Floor(n); {
	case frac < 1e-9:
		return 0
	case math.Abs(frac-0.5) < 1e-9:
		return 0.25
	}
	return 0.5
}

func (x *search) score(c *found) float64 {
	w := x.w
	p := &c.lean
	s := 0.0
	if x.s.opF > 0 {
		s += w.q * w.utility(p.q)
		s += w.srf * math.Min(math.Log(p.srf/(x.s.srfRatio*x.s.opF)), scoreSRFCap)
	}
	s -= w.size * math.Log(math.Cbrt(c.vol)/scoreSizeRef)
	s -= w.cu * math.Log(p.wire/scoreWireRef)
	s -= w.ease * easePenalty(c.n, c.pitch, c.pair.do, p.ld)
	if c.pair.tinned {
		s -= tinnedPenalty
	}
	return s
}

// Bounds for pair p at n or more turns, valid for any coil that meets the
// target and the SRF limit (the pitch lies between close winding and
// LoosestPitchFactor·d_o because the window holds the target).

// volumeBound: the outside diameter is fixed and the length is at least
// the close-wound n·d_o.
func (x *search) volumeBound(p *pair, n float64) float64 {
	return math.Pi / 4 * p.od * p.od * n * p.do
}

// wireBound: at least n circles of the wire-centre diameter, the leads and
// the allowance.
func (x *search) wireBound(p *pair, n float64) float64 {
	return n*math.Pi*p.dm + 2*float64(x.s.c.LeadLength) + float64(coil.CutAllowance)
}

// scoreBound bounds every coil of pair p with n or more turns, from the
// cheapest facts: close winding, the least proximity factor.
func (x *search) scoreBound(p *pair, n float64) float64 {
	w := x.w
	b := 0.0
	if x.s.opF > 0 {
		b += w.q*w.utility(x.qBound(p, n)) + w.srf*scoreSRFCap
	}
	b -= w.size * math.Log(math.Cbrt(x.volumeBound(p, n))/scoreSizeRef)
	b -= w.cu * math.Log(x.wireBound(p, n)/scoreWireRef)
	if p.tinned {
		b -= tinnedPenalty
	}
	return b
}

// qBound: Q = ω·L_eff/R_eff with R_eff = R_leads + R_coil/g², L_eff =
// L_leads + L_coil/g, g = 1 − (f/SRF)² in [grMin, 1]. R_coil is at least
// the skin-effect resistance of n circles times the least proximity factor
// at the loosest pitch over every l/D a coil of n turns or more can have
// (radiation only adds).
func (x *search) qBound(p *pair, n float64) float64 {
	if x.s.opF == 0 {
		return 0
	}
	dw := &x.wires[p.wi]
	// The loosest band's row: Φ at d/(3·d_o), least over l/D ≥ n·d_o/D.
	phi := dw.sliceRow[boundSlices-1].MinOver(n*dw.do/p.dm, math.Inf(1))
	prox := coil.PartialProximity(phi, dw.fs)
	return x.qFromR(p, dw.rdcPerM*dw.fs*prox*n*math.Pi*p.dm)
}

// qFromR bounds Q given a lower bound rc on R_coil. For a terminal target
// L_coil = target − L_leads exactly, and Q(y) = ω(L_l + L_c·y)/(R_l +
// R_c·y²), y = 1/g in [1, 1/grMin], is maximised in closed form. For an
// effective target at f, L_eff is the target and R_eff ≥ R_l + R_c. When
// the match is at another frequency, L_eff ≤ target·(1 + 1/grMin).
func (x *search) qFromR(p *pair, rc float64) float64 {
	s := x.s
	fr := &x.wires[p.wi].atOp
	w := twoPi * s.opF
	ll, rl := fr.Leads, fr.RLeads
	switch {
	case !s.effective:
		lc := s.required - ll
		q := func(y float64) float64 { return w * (ll + lc*y) / (rl + rc*y*y) }
		best := math.Max(q(1), q(1/x.grMin))
		if lc > 0 && rc > 0 {
			if y := (-ll + math.Sqrt(ll*ll+lc*lc*rl/rc)) / lc; y > 1 && y < 1/x.grMin {
				best = math.Max(best, q(y))
			}
		}
		return best
	case s.opF == s.matchF:
		return w * s.required / (rl + rc)
	}
	return w * s.required * (1 + 1/x.grMin) / (rl + rc)
}

// intervalBound bounds the coils of pair p with turns strictly between
// knots a and b (both solved): pitch, l/D, outside length and wire all
// rise with the turns, so a's values bound them from below and b's pitch
// from above; the proximity factor is least at b's spacing over the l/D
// span. interiorPen is the least turns penalty inside. It returns the
// score bound and the Q and volume bounds for the Pareto test.
func (x *search) intervalBound(p *pair, a, b *knot, interiorPen float64) (ub, qub, vol float64) {
	w := x.w
	dw := &x.wires[p.wi]
	vol = math.Pi / 4 * a.lean.od * a.lean.od * a.lean.length
	ub = -w.size*math.Log(math.Cbrt(vol)/scoreSizeRef) - w.cu*math.Log(a.lean.wire/scoreWireRef)
	if x.s.opF > 0 {
		fr := &dw.atOp
		helix := coil.HelixLength(a.n, p.dm, a.pitch)
		phi := coil.ProximityMinOver(a.lean.ld, b.lean.ld, 2*dw.r/b.pitch)
		prox := coil.PartialProximity(phi, fr.Fs)
		qub = x.qFromR(p, dw.rdcPerM*fr.Fs*helix*prox)
		ub += w.q*w.utility(qub) + w.srf*scoreSRFCap
	}
	if x.s.opF > 0 {
		srf := x.srfUpper(p, b.n, a.lean.ld, b.lean.ld)
		if srf < x.s.srfRatio*x.s.opF {
			return math.Inf(-1), 0, vol // every coil here self-resonates too low
		}
		ub += w.srf * (math.Min(math.Log(srf/(x.s.srfRatio*x.s.opF)), scoreSRFCap) - scoreSRFCap)
	}
	spacing := spacingPenaltyMin(a.pitch/p.do, b.pitch/p.do)
	shape := shapePenaltyMin(a.lean.ld, b.lean.ld)
	ub -= w.ease * (0.5*interiorPen + 0.5*spacing + shape)
	if p.tinned {
		ub -= tinnedPenalty
	}
	return ub, qub, vol
}

// srfUpper bounds the self-resonance of coils of pair p with at most nMax
// turns and l/D in [ldA, ldB] that hit the target: SRF = 1/(2π√(L·C))
// with C at least coil.SelfCapacitanceMinOver over the span times D (a
// tabulated lower bound on the helical-line model's equivalent
// self-capacitance, one end grounded, checked by its test), and L (the
// helix at the SRF) at least the helix at f less all its internal
// inductance, μ0·a·N/4. The helix at f is the target less the leads
// (terminal target), or at least (target − leads)·g for an effective one.
func (x *search) srfUpper(p *pair, nMax, ldA, ldB float64) float64 {
	dw := &x.wires[p.wi]
	T := x.s.required
	var lc float64
	if x.s.effective {
		lc = (T - dw.leadsMax) * x.grDiv
	} else {
		lc = T - dw.atMatch.Leads
	}
	l := lc - coil.Mu0*(p.dm/2)*nMax/4
	if !(l > 0) {
		return math.Inf(1) // no useful bound
	}
	c := coil.SelfCapacitanceMinOver(ldA, ldB) * p.dm
	if !(c > 0) {
		return math.Inf(1) // no useful bound
	}
	return 1 / (twoPi * math.Sqrt(l*c))
}

// spacingPenaltyMin is the least spacing term of E for pitch/d_o in [r1, r2].
func spacingPenaltyMin(r1, r2 float64) float64 {
	best := math.Inf(1)
	for _, r := range []float64{r1, r2, 2, 3} {
		if r >= r1 && r <= r2 {
			best = math.Min(best, math.Min(1, math.Min(math.Abs(r-2), math.Abs(r-3))/0.5))
		}
	}
	return best
}

// shapePenaltyMin is the least l/D term of E for l/D in [a, b].
func shapePenaltyMin(a, b float64) float64 {
	switch {
	case b < 0.5:
		return math.Log(0.5 / b)
	case a > 2:
		return math.Log(a / 2)
	}
	return 0
}
