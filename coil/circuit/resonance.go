package circuit

import (
	"math"
	"math/cmplx"
	"sort"

	"turnwise/coil"
)

// ResonanceKind says how a resonance shows at port 1.
type ResonanceKind int

const (
	Parallel ResonanceKind = iota // |Z| maximum: a pole of the port impedance
	Series                        // |Z| minimum: a zero of the port impedance
)

func (k ResonanceKind) String() string {
	if k == Series {
		return "series"
	}
	return "parallel"
}

// Resonance is a resonance seen at port 1.
type Resonance struct {
	Kind ResonanceKind
	// Natural is the lossless natural frequency (Hz).
	Natural float64
	// Frequency is the maximum (parallel) or minimum (series) of |Z| at
	// port 1 with every loss in place and port 2, if any, terminated.
	Frequency float64
	// Impedance is the port-1 impedance at Frequency.
	Impedance complex128
	// Q is Frequency over the −3 dB bandwidth of |Z|; zero when both −3 dB
	// points do not lie between the neighbouring resonances.
	Q float64
	// Part is the part holding most of the mode's electric energy: the
	// capacitor of a tank, or a coil for its own self-resonance.
	Part string
	// Distinct is false when the losses smooth the extremum away (|Z| is
	// monotonic across the resonance's neighbourhood).
	Distinct bool
}

// Resonances finds the resonances seen at port 1 below fMax, lowest first.
func (s *Solver) Resonances(fMax float64) ([]Resonance, error) {
	fMax = math.Min(fMax, coil.MaxFrequency)
	par, err := s.NaturalFrequencies(fMax, false)
	if err != nil {
		return nil, err
	}
	ser, err := s.NaturalFrequencies(fMax, true)
	if err != nil {
		return nil, err
	}
	port := s.net.Ports[0].Node
	type crit struct {
		m    Mode
		kind ResonanceKind
	}
	var cs []crit
	// A mode in both lists has no voltage and no current at port 1: it is
	// not seen there (a pole cancelled by a zero).
	inBoth := func(f float64, other []Mode) bool {
		for _, o := range other {
			if math.Abs(o.Frequency-f) < 1e-7*f {
				return true
			}
		}
		return false
	}
	for _, m := range par {
		if math.Abs(m.Shape[port]) < 1e-7 || inBoth(m.Frequency, ser) {
			continue
		}
		cs = append(cs, crit{m, Parallel})
	}
	for _, m := range ser {
		if inBoth(m.Frequency, par) {
			continue
		}
		cs = append(cs, crit{m, Series})
	}
	sort.Slice(cs, func(i, j int) bool { return cs[i].m.Frequency < cs[j].m.Frequency })
	out := make([]Resonance, 0, len(cs))
	for i, c := range cs {
		f0 := c.m.Frequency
		lo, hi := f0/3, math.Min(f0*3, coil.MaxFrequency)
		if i > 0 {
			lo = math.Max(lo, cs[i-1].m.Frequency)
		}
		if i+1 < len(cs) {
			hi = math.Min(hi, cs[i+1].m.Frequency)
		}
		r, err := s.refine(c.kind, f0, lo, hi)
		if err != nil {
			return nil, err
		}
		r.Part = s.dominantPart(c.m)
		out = append(out, r)
	}
	return out, nil
}

// zin is |Z| at port 1, with port 2 terminated.
func (s *Solver) zin(f float64) (complex128, error) {
	r, err := s.Response(f)
	if err != nil {
		return 0, err
	}
	return r.Zin, nil
}

// refine finds the extremum of |Z| in (lo, hi) by golden-section search in
// ln f, then the −3 dB points by bisection.
func (s *Solver) refine(kind ResonanceKind, f0, lo, hi float64) (Resonance, error) {
	sign := -1.0 // minimise −ln|Z| for a maximum
	if kind == Series {
		sign = 1
	}
	var ferr error
	g := func(lf float64) float64 {
		z, err := s.zin(math.Exp(lf))
		if err != nil {
			ferr = err
			return math.Inf(1)
		}
		return sign * math.Log(cmplx.Abs(z))
	}
	a, b := math.Log(lo), math.Log(hi)
	// Shrink the bracket around f0 while that keeps an interior extremum:
	// the lossless frequency is a very good start.
	a, b = goldenMin(g, a, b, func(a, b float64) bool { return b-a > 1e-13*math.Max(1, math.Abs(a)) })
	if ferr != nil {
		return Resonance{}, ferr
	}
	fr := math.Exp(0.5 * (a + b))
	z, err := s.zin(fr)
	if err != nil {
		return Resonance{}, err
	}
	res := Resonance{Kind: kind, Natural: f0, Frequency: fr, Impedance: z}
	// An extremum pressed against the bracket is not a resonance the
	// losses left standing.
	edge := math.Abs(math.Log(fr/lo)) < 1e-6 || math.Abs(math.Log(hi/fr)) < 1e-6
	res.Distinct = !edge
	if edge {
		res.Frequency = f0
		res.Impedance, _ = s.zin(f0)
		return res, nil
	}
	target := cmplx.Abs(z) * math.Sqrt2
	if kind == Parallel {
		target = cmplx.Abs(z) / math.Sqrt2
	}
	// Crossing of |Z| = target between x and the peak, by bisection.
	cross := func(x, peak float64) (float64, bool) {
		h := func(f float64) float64 {
			zz, err := s.zin(f)
			if err != nil {
				return math.NaN()
			}
			return sign * (cmplx.Abs(zz) - target)
		}
		hx, hp := h(x), h(peak)
		if !(hx > 0 && hp < 0) {
			return 0, false
		}
		for it := 0; it < 100 && math.Abs(x-peak) > 1e-13*peak; it++ {
			m := math.Sqrt(x * peak)
			if h(m) > 0 {
				x = m
			} else {
				peak = m
			}
		}
		return math.Sqrt(x * peak), true
	}
	f1, ok1 := cross(lo, fr)
	f2, ok2 := cross(hi, fr)
	if ok1 && ok2 && f2 > f1 {
		res.Q = fr / (f2 - f1)
	}
	return res, nil
}

// dominantPart is the part with the most electric energy in the mode.
func (s *Solver) dominantPart(m Mode) string {
	best, name := -1.0, ""
	for i := range s.net.Parts {
		p := &s.net.Parts[i]
		var c, dv float64
		switch p.Kind {
		case Capacitor:
			c, dv = p.Value, m.Shape[p.A]-m.Shape[p.B]
		case Wound:
			c = float64(s.wnd[i].m.SelfCapacitance)
			if p.TapNode >= 0 {
				dv = m.Shape[p.A] - m.Shape[p.B]
			} else {
				dv = m.Shape[s.internal[i]] - m.Shape[p.B]
			}
		default:
			continue
		}
		if e := c * dv * dv; e > best {
			best, name = e, p.Name
		}
	}
	return name
}

// goldenMin narrows [a, b] around a minimum of g by golden-section search
// while wide(a, b) holds, for at most 200 steps, and returns the bracket.
func goldenMin(g func(float64) float64, a, b float64, wide func(a, b float64) bool) (float64, float64) {
	const phi = 0.6180339887498949
	x1, x2 := b-phi*(b-a), a+phi*(b-a)
	g1, g2 := g(x1), g(x2)
	for it := 0; it < 200 && wide(a, b); it++ {
		if g1 < g2 {
			b, x2, g2 = x2, x1, g1
			x1 = b - phi*(b-a)
			g1 = g(x1)
		} else {
			a, x1, g1 = x1, x2, g2
			x2 = a + phi*(b-a)
			g2 = g(x2)
		}
	}
	return a, b
}
