package design

import (
	"errors"
	"fmt"
	"math"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Design to a band: the coil must let a trimmer tune both band edges.
//
// With C_f the fixed capacitance plus the stray and the trimmer running
// from T_min to T_max, the trimmer setting that tunes the coil to f is
//
//	T(f) = 1/(ω²·L_eff(f)) − C_f
//
// with L_eff(f) the coil's effective inductance at f, its self-capacitance
// and leads included (coil.Prediction.InductanceEffective). The band edge
// f_1 needs the most capacitance and f_2 the least; each must leave a
// margin m = BandTrimMargin·(T_max − T_min) (default 10 % of the swing)
// to the trimmer's end:
//
//	T(f_1) ≤ T_max − m,   T(f_2) ≥ T_min + m
//
// so, L_eff changing slowly with f, L_eff must lie between
// A = 1/(ω_1²(C_f + T_max − m)) and B = 1/(ω_2²(C_f + T_min + m)). The
// search aims at the geometric centre √(A·B) at the band centre
// √(f_1·f_2) with the window as its tolerance; every coil it finds is then
// re-predicted at both edges and kept only when both settings are inside
// the margins (and, with MinQ, when its Q at the band centre reaches it).

// DefaultBandTrimMargin is the share of the trimmer's swing kept free at
// each end: 10 % (common practice: room for the capacitor's tolerance and
// for drift).
const DefaultBandTrimMargin = 0.10

// BandTarget is a band to tune with a fixed capacitor and a trimmer in
// parallel with it.
type BandTarget struct {
	Low, High unit.Frequency
	// Fixed is the fixed capacitor across the coil (zero for none), Stray
	// the wiring and device capacitance; both add to the trimmer.
	Fixed, Stray unit.Capacitance
	// TrimMin and TrimMax are the trimmer's range; TrimMax must be above
	// TrimMin.
	TrimMin, TrimMax unit.Capacitance
	// TrimMargin is the share of the trimmer's swing kept free at each
	// end; zero means DefaultBandTrimMargin.
	TrimMargin float64
	// MinQ, when positive, is the least unloaded Q at the band centre.
	MinQ float64
}

// BandFit is where the trimmer sits for one candidate of a band design.
type BandFit struct {
	Low, High unit.Frequency // the band
	// TrimmerLow and TrimmerHigh are the trimmer settings that tune the
	// coil to the band's low and high edge.
	TrimmerLow, TrimmerHigh unit.Capacitance
	// LEffLow and LEffHigh are the effective inductances at the edges.
	LEffLow, LEffHigh unit.Inductance
	// MarginLow and MarginHigh are the room left to the trimmer's ends,
	// as fractions of its swing: (T_max − TrimmerLow)/swing and
	// (TrimmerHigh − T_min)/swing.
	MarginLow, MarginHigh float64
}

// BandInfo describes a band design's target in a Result.
type BandInfo struct {
	Target BandTarget // as resolved (TrimMargin set)
	// Centre is the band centre √(f_1·f_2), where Q is ranked.
	Centre unit.Frequency
	// WindowLow and WindowHigh bound the effective inductance that the
	// trimmer's usable range tunes across the band (A and B above).
	WindowLow, WindowHigh unit.Inductance
}

// SearchBand finds coils whose effective inductance lets the trimmer tune
// both edges of the band with the margin to spare, ranked as Search ranks
// them at the band centre. Top and the Pareto list apply after the edge
// and Q checks.
func SearchBand(b BandTarget, c Constraints) (Result, error) {
	res := Result{}
	info := &BandInfo{}
	lo, hi := float64(b.Low), float64(b.High)
	bad := func(v float64) bool { return !coil.Finite(v) || v < 0 }
	switch {
	case bad(lo) || bad(hi) || lo == 0 || hi <= lo:
		return res, coil.InputErrorf("band", "give the band as LOW-HIGH with LOW below HIGH, e.g. 144-146MHz")
	case hi > coil.MaxFrequency:
		return res, coil.InputErrorf("band", "must be at most 10 GHz")
	case bad(float64(b.Fixed)) || bad(float64(b.Stray)) || bad(float64(b.TrimMin)) || bad(float64(b.TrimMax)):
		return res, coil.InputErrorf("trimmer", "capacitances must be finite and not negative")
	case !(b.TrimMax > b.TrimMin):
		return res, coil.InputErrorf("trimmer", "give the trimmer's range as MIN-MAX with MIN below MAX, e.g. 2-10pF")
	case !coil.Finite(b.TrimMargin) || b.TrimMargin < 0 || b.TrimMargin >= 0.5:
		return res, coil.InputErrorf("trimmer_margin", "%.3g %% of the trimmer's swing is outside 0 … 50 %%", b.TrimMargin*100)
	case !coil.Finite(b.MinQ) || b.MinQ < 0 || b.MinQ > 1e5:
		return res, coil.InputErrorf("min_q", "%g is outside 0 … 100000", b.MinQ)
	}
	if b.TrimMargin == 0 {
		b.TrimMargin = DefaultBandTrimMargin
	}
	info.Target = b
	cf := float64(b.Fixed + b.Stray)
	swing := float64(b.TrimMax - b.TrimMin)
	m := b.TrimMargin * swing
	cMax, cMin := cf+float64(b.TrimMax)-m, cf+float64(b.TrimMin)+m
	w1, w2 := 2*math.Pi*lo, 2*math.Pi*hi
	A, B := 1/(w1*w1*cMax), 1/(w2*w2*cMin)
	info.WindowLow, info.WindowHigh = unit.Inductance(A), unit.Inductance(B)
	fc := math.Sqrt(lo * hi)
	info.Centre = unit.Frequency(fc)
	if !(B > A) {
		// The capacitance must swing by (f2/f1)² between the edges.
		need := (hi / lo) * (hi / lo)
		have := cMax / cMin
		// Trimmer maximum that would do with this minimum and margin:
		// (cf + Tmax − m) = need·(cf + Tmin + m), m depending on Tmax.
		// Solve for Tmax: cf + Tmax(1−k) + k·Tmin = need(cf + Tmin(1−k) + k·Tmax), k = margin.
		k := b.TrimMargin
		tmin := float64(b.TrimMin)
		tmaxNeed := (need*(cf+tmin*(1-k)) - cf - k*tmin) / ((1 - k) - need*k)
		msg := fmt.Sprintf("the trimmer cannot tune %s–%s: the band needs the capacitance to swing by %.4g× between its edges, and %s fixed and stray with a %s–%s trimmer (%.0f %% kept free at each end) swings only %.4g×",
			quantity.FormatFrequency(lo), quantity.FormatFrequency(hi), need, quantity.FormatCapacitance(cf),
			quantity.FormatCapacitance(float64(b.TrimMin)), quantity.FormatCapacitance(float64(b.TrimMax)), k*100, have)
		if tmaxNeed > 0 && (1-k)-need*k > 0 {
			msg += fmt.Sprintf("; a trimmer reaching %s, or less fixed capacitance, would", quantity.FormatCapacitance(tmaxNeed))
		} else {
			msg += "; use a larger trimmer or less fixed capacitance"
		}
		return res, &InfeasibleError{Constraint: "trimmer", Message: msg}
	}
	lc := math.Sqrt(A * B)
	tol := math.Min(B/lc-1, 1-A/lc)
	tol = math.Min(math.Max(tol, MinTolerance), 0.5)
	t := Target{Resonance: unit.Frequency(fc), Capacitance: unit.Capacitance(1 / (4 * math.Pi * math.Pi * fc * fc * lc)), Tolerance: tol}
	want := c.Top
	if want == 0 {
		want = DefaultTop
	}
	c.Top = MaxTop
	c.MinQ = b.MinQ
	r, err := Search(t, c)
	if err != nil {
		var ie *InfeasibleError
		if errors.As(err, &ie) {
			ie.Message = fmt.Sprintf("for %s–%s (an effective inductance of %s to %s): %s", quantity.FormatFrequency(lo), quantity.FormatFrequency(hi),
				quantity.FormatInductance(A), quantity.FormatInductance(B), ie.Message)
		}
		return res, err
	}
	res = r
	res.Band = info
	var kept, pareto []Candidate
	bestQ, edgeMiss := 0.0, 0
	for _, cand := range r.Candidates {
		bc, ok := checkBand(cand, b, cf, m)
		bestQ = math.Max(bestQ, cand.Prediction.Q)
		if !ok {
			edgeMiss++
			continue
		}
		if b.MinQ > 0 && cand.Prediction.Q < b.MinQ {
			continue
		}
		if len(kept) < want {
			cand.Band = &bc
			kept = append(kept, cand)
		}
	}
	for _, cand := range r.Pareto {
		if bc, ok := checkBand(cand, b, cf, m); ok && (b.MinQ == 0 || cand.Prediction.Q >= b.MinQ) {
			cand.Band = &bc
			pareto = append(pareto, cand)
		}
	}
	res.Candidates, res.Pareto = kept, pareto
	if len(kept) == 0 {
		switch {
		case b.MinQ > 0 && bestQ < b.MinQ:
			return res, &InfeasibleError{Constraint: "min_q", Nearest: bestQ, Message: fmt.Sprintf("no coil the stock allows reaches Q %.0f at %s under these limits; the best found has Q %.0f (a larger diameter, thicker or silver-plated wire, or a looser length limit raise Q)",
				b.MinQ, quantity.FormatFrequency(fc), bestQ)}
		default:
			return res, &InfeasibleError{Constraint: "trimmer", Message: fmt.Sprintf("%d coils hit the band centre, but none leaves %.0f %% of the trimmer's swing free at both edges once its inductance is taken at each edge; widen the trimmer or lower --trim-margin", edgeMiss, b.TrimMargin*100)}
		}
	}
	return res, nil
}

// checkBand re-predicts cand at both band edges and returns where the
// trimmer sits; ok when both settings keep the margin m (farads).
func checkBand(cand Candidate, b BandTarget, cf, m float64) (BandFit, bool) {
	g := cand.Prediction.Geometry
	bc := BandFit{}
	setting := func(f float64) (float64, float64, bool) {
		p, err := coil.Predict(g, unit.Frequency(f))
		if err != nil || !(p.InductanceEffective > 0) {
			return 0, 0, false
		}
		w := 2 * math.Pi * f
		le := float64(p.InductanceEffective)
		return 1/(w*w*le) - cf, le, true
	}
	tl, ll, ok1 := setting(float64(b.Low))
	th, lh, ok2 := setting(float64(b.High))
	if !ok1 || !ok2 {
		return bc, false
	}
	swing := float64(b.TrimMax - b.TrimMin)
	bc.Low, bc.High = b.Low, b.High
	bc.TrimmerLow, bc.TrimmerHigh = unit.Capacitance(tl), unit.Capacitance(th)
	bc.LEffLow, bc.LEffHigh = unit.Inductance(ll), unit.Inductance(lh)
	bc.MarginLow = (float64(b.TrimMax) - tl) / swing
	bc.MarginHigh = (th - float64(b.TrimMin)) / swing
	tolF := 1e-9 * swing
	return bc, tl <= float64(b.TrimMax)-m+tolF && th >= float64(b.TrimMin)+m-tolF
}

// WithMinQ keeps the candidates of r whose Q at the operating frequency is
// at least minQ, at most top of them; the Pareto list likewise. A search
// given Constraints.MinQ lists only such coils already (its floor prunes
// inside the search); this re-check on the full model's Q is a safety net. None left is an *InfeasibleError on
// "min_q" naming the best Q found.
func WithMinQ(r Result, minQ float64, top int) (Result, error) {
	if minQ <= 0 {
		return r, nil
	}
	if r.Frequency == 0 {
		return r, coil.InputErrorf("min_q", "a Q floor needs the frequency it holds at; give the operating frequency")
	}
	best := 0.0
	var kept, pareto []Candidate
	for _, c := range r.Candidates {
		best = math.Max(best, c.Prediction.Q)
		if c.Prediction.Q >= minQ && len(kept) < top {
			kept = append(kept, c)
		}
	}
	for _, c := range r.Pareto {
		if c.Prediction.Q >= minQ {
			pareto = append(pareto, c)
		}
	}
	r.Candidates, r.Pareto = kept, pareto
	if len(kept) == 0 {
		return r, &InfeasibleError{Constraint: "min_q", Nearest: best, Message: fmt.Sprintf("no coil the stock allows reaches Q %.0f at %s under these limits; the best found has Q %.0f (a larger diameter, thicker or silver-plated wire, or a looser length limit raise Q)",
			minQ, quantity.FormatFrequency(float64(r.Frequency)), best)}
	}
	return r, nil
}
