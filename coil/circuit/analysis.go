package circuit

import (
	"errors"
	"math"
	"math/cmplx"
	"sort"

	"turnwise/coil"
)

// What a builder asks of a network: a sweep, the bands it serves and what
// else resonates near them, rejection at stated frequencies, the mixer
// products a converter's tank must reject, and a two-port's passband.

// Frequencies returns n sweep points from lo to hi, evenly spaced or, with
// log, evenly spaced in ln f. The end points are exact.
func Frequencies(lo, hi float64, n int, log bool) ([]float64, error) {
	if !(lo > 0) || !(hi > lo) || hi > coil.MaxFrequency || math.IsInf(hi, 0) {
		return nil, errorf("", "sweep needs 0 < from < to ≤ 10 GHz")
	}
	if n < 2 || n > 1_000_000 {
		return nil, errorf("", "sweep needs 2 to 1000000 points")
	}
	f := make([]float64, n)
	for i := range f {
		x := float64(i) / float64(n-1)
		if log {
			f[i] = lo * math.Pow(hi/lo, x)
		} else {
			f[i] = lo + (hi-lo)*x
		}
	}
	f[0], f[n-1] = lo, hi
	return f, nil
}

// Sweep solves the network at each frequency.
func (s *Solver) Sweep(freqs []float64) ([]Response, error) {
	out := make([]Response, len(freqs))
	for i, f := range freqs {
		r, err := s.Response(f)
		if err != nil {
			return nil, err
		}
		out[i] = r
	}
	return out, nil
}

// Gain is the magnitude a network's selectivity is read from: |S21| for a
// two-port, |Z| at port 1 (the voltage a current source develops across
// it) for a one-port.
func (r Response) Gain() float64 {
	if r.Ports == 2 {
		return cmplx.Abs(r.S[1][0])
	}
	return cmplx.Abs(r.Zin)
}

// GainAt is the Gain at f.
func (s *Solver) GainAt(f float64) (float64, error) {
	r, err := s.Response(f)
	if err != nil {
		return 0, err
	}
	return r.Gain(), nil
}

// DefaultRange is the sweep a network's resonances call for: half the
// lowest to twice the highest. With no resonance it is 1 kHz … 1 GHz.
func DefaultRange(res []Resonance) (lo, hi float64) {
	if len(res) == 0 {
		return 1e3, 1e9
	}
	lo, hi = math.Inf(1), 0
	for _, r := range res {
		lo, hi = math.Min(lo, r.Frequency), math.Max(hi, r.Frequency)
	}
	return lo / 2, math.Min(hi*2, coil.MaxFrequency)
}

// Band is a frequency range a network must serve, in Hz.
type Band struct {
	Name      string
	Low, High float64
}

// Centre is the band's arithmetic centre.
func (b Band) Centre() float64 { return (b.Low + b.High) / 2 }

// near reports whether f lies in the band or within margin (a fraction of
// the nearer edge) of it.
func (b Band) near(f, margin float64) bool {
	return f >= b.Low*(1-margin) && f <= b.High*(1+margin)
}

// StrayMargin is how close to a band a stray resonance is reported: within
// 10 % of an edge.
const StrayMargin = 0.10

// BandFit is the resonance that serves a band.
type BandFit struct {
	Band
	// Resonance indexes the serving resonance; -1 when none lies within
	// StrayMargin of the band.
	Resonance int
	Frequency float64
	// Offset is (Frequency − centre)/centre.
	Offset float64
	Inside bool
}

// SelfResonance is a coil's own self-resonance, alone, as a range: the
// model's estimate band for a coil with one end grounded, or the floating
// range (1.3–1.6× the grounded value) for one with both ends above ground.
type SelfResonance struct {
	Part      string
	Index     int
	Low, High float64
	Floating  bool
}

// SelfResonances are the wound coils' own self-resonances. floating says,
// by part index, which coils have both ends above ground (nil: none).
func (s *Solver) SelfResonances(floating []bool) ([]SelfResonance, error) {
	var out []SelfResonance
	for i, p := range s.net.Parts {
		if p.Kind != Wound {
			continue
		}
		pr, err := coil.Predict(*p.Coil, 0)
		if err != nil {
			return nil, &Error{Part: p.Name, Reason: err.Error()}
		}
		sr := SelfResonance{Part: p.Name, Index: i, Low: float64(pr.SRFMin), High: float64(pr.SRFMax)}
		if i < len(floating) && floating[i] {
			sr.Floating = true
			sr.Low, sr.High = float64(pr.SRFFloatingMin), float64(pr.SRFFloatingMax)
		}
		out = append(out, sr)
	}
	return out, nil
}

// Stray is a resonance inside or near a band that does not serve it.
type Stray struct {
	Band      string
	Part      string  // the part that causes it
	Frequency float64 // the network resonance, or the centre of a coil's own range
	Low, High float64 // a coil's own self-resonance range; both Frequency otherwise
	Self      bool    // a coil's own self-resonance
	Inside    bool    // inside the band rather than within the margin
}

// FitBands picks, for each band, the resonance that serves it (the one
// nearest the centre in ln f, among those within StrayMargin) and lists
// every other resonance, and every coil's own self-resonance range, that
// lies inside or within StrayMargin of a band.
func FitBands(bands []Band, res []Resonance, self []SelfResonance) ([]BandFit, []Stray) {
	var fits []BandFit
	var strays []Stray
	for _, b := range bands {
		fit := BandFit{Band: b, Resonance: -1}
		best := math.Inf(1)
		for i, r := range res {
			if !b.near(r.Frequency, StrayMargin) {
				continue
			}
			if d := math.Abs(math.Log(r.Frequency / b.Centre())); d < best {
				best, fit.Resonance = d, i
			}
		}
		if fit.Resonance >= 0 {
			r := res[fit.Resonance]
			fit.Frequency = r.Frequency
			fit.Offset = (r.Frequency - b.Centre()) / b.Centre()
			fit.Inside = b.near(r.Frequency, 0)
		}
		fits = append(fits, fit)
		for i, r := range res {
			if i == fit.Resonance || !b.near(r.Frequency, StrayMargin) {
				continue
			}
			strays = append(strays, Stray{Band: b.Name, Part: r.Part, Frequency: r.Frequency,
				Low: r.Frequency, High: r.Frequency, Inside: b.near(r.Frequency, 0)})
		}
		for _, sr := range self {
			if sr.High < b.Low*(1-StrayMargin) || sr.Low > b.High*(1+StrayMargin) {
				continue
			}
			strays = append(strays, Stray{Band: b.Name, Part: sr.Part, Frequency: math.Sqrt(sr.Low * sr.High),
				Low: sr.Low, High: sr.High, Self: true, Inside: sr.High >= b.Low && sr.Low <= b.High})
		}
	}
	return fits, strays
}

// Product is an input frequency a mixer turns into its output (IF):
// |M·LO ± N·f| = IF.
type Product struct {
	M, N      int
	Sum       bool // M·LO + N·f = IF (else |M·LO − N·f| = IF)
	Frequency float64
	Wanted    bool // the signal the converter is for
	Image     bool // M = N = 1 on the other side of the LO
}

// Products lists every input frequency f up to fMax with
// |m·lo ± n·f| = ifreq for 1 ≤ m, n ≤ 3, lowest first, marking the wanted
// signal (wanted, which must be lo + ifreq or |lo − ifreq|) and its image.
// A frequency reached by several (m, n) is listed once, by the lowest
// order m + n.
func Products(lo, ifreq, wanted, fMax float64) ([]Product, error) {
	if !(lo > 0) || !(ifreq > 0) || math.IsInf(lo, 0) || math.IsInf(ifreq, 0) {
		return nil, errors.New("circuit: LO and IF must be positive frequencies")
	}
	if math.Abs(wanted-(lo+ifreq)) > 1e-9*wanted && math.Abs(wanted-math.Abs(lo-ifreq)) > 1e-9*wanted {
		return nil, errors.New("circuit: the wanted signal must be LO + IF or |LO − IF|")
	}
	var out []Product
	add := func(p Product) {
		if !(p.Frequency > 0) || p.Frequency > fMax {
			return
		}
		for i, q := range out {
			if math.Abs(q.Frequency-p.Frequency) <= 1e-9*p.Frequency {
				if p.M+p.N < q.M+q.N {
					out[i] = p
				}
				return
			}
		}
		out = append(out, p)
	}
	for m := 1; m <= 3; m++ {
		for n := 1; n <= 3; n++ {
			ml, nf := float64(m)*lo, float64(n)
			add(Product{M: m, N: n, Frequency: (ml - ifreq) / nf}) // m·LO − n·f = IF
			add(Product{M: m, N: n, Frequency: (ml + ifreq) / nf}) // n·f − m·LO = IF
			add(Product{M: m, N: n, Sum: true, Frequency: (ifreq - ml) / nf})
		}
	}
	for i := range out {
		p := &out[i]
		if p.M == 1 && p.N == 1 && !p.Sum {
			if math.Abs(p.Frequency-wanted) <= 1e-9*wanted {
				p.Wanted = true
			} else {
				p.Image = true
			}
		}
	}
	sort.Slice(out, func(i, j int) bool { return out[i].Frequency < out[j].Frequency })
	return out, nil
}

// Passband is a two-port's −3 dB passband around its |S21| peak.
type Passband struct {
	Peak, PeakDB float64 // frequency of the |S21| maximum and |S21| there in dB
	Low, High    float64 // −3 dB points (0 when the sweep range holds none)
}

// FindPassband refines the |S21| maximum near the best of freqs and finds
// the −3 dB points by bisection within [freqs[0], freqs[last]].
func (s *Solver) FindPassband(freqs []float64) (Passband, error) {
	if len(s.net.Ports) != 2 || len(freqs) < 3 {
		return Passband{}, errorf("", "a passband needs two ports and a sweep")
	}
	g := make([]float64, len(freqs))
	bi := 0
	for i, f := range freqs {
		v, err := s.GainAt(f)
		if err != nil {
			return Passband{}, err
		}
		g[i] = v
		if v > g[bi] {
			bi = i
		}
	}
	lo, hi := freqs[max(bi-1, 0)], freqs[min(bi+1, len(freqs)-1)]
	var ferr error
	gain := func(f float64) float64 {
		v, err := s.GainAt(f)
		if err != nil {
			ferr = err
		}
		return v
	}
	// Golden-section search for the maximum in [lo, hi].
	a, b := goldenMin(func(f float64) float64 { return -gain(f) }, lo, hi,
		func(a, b float64) bool { return b-a > 1e-12*b })
	if ferr != nil {
		return Passband{}, ferr
	}
	pk := (a + b) / 2
	gp := math.Max(gain(pk), g[bi])
	if g[bi] > gain(pk) {
		pk = freqs[bi]
	}
	pb := Passband{Peak: pk, PeakDB: 20 * math.Log10(gp)}
	target := gp / math.Sqrt2
	cross := func(out float64) float64 {
		if gain(out) >= target {
			return 0
		}
		in := pk
		for it := 0; it < 200 && math.Abs(out-in) > 1e-12*pk; it++ {
			m := (out + in) / 2
			if gain(m) >= target {
				in = m
			} else {
				out = m
			}
		}
		return (out + in) / 2
	}
	pb.Low, pb.High = cross(freqs[0]), cross(freqs[len(freqs)-1])
	return pb, ferr
}

// CoilEquivalent is a wound coil's model frozen at one frequency, as a
// SPICE netlist carries it: the leads (LeadL, LeadR) in series with the
// winding (WindingL, WindingR), the self-capacitance C across the winding;
// L and R are the totals at the terminals. A tapped coil is its two
// sections LA (hot end to tap) and LB (tap to cold end) with resistances
// RA, RB and mutual inductance M, and C across the whole coil.
type CoilEquivalent struct {
	Frequency          float64
	L, R, C            float64
	LeadL, LeadR       float64
	WindingL, WindingR float64
	Tapped             bool
	LA, LB, M, RA, RB  float64
}

// Equivalent returns part i's equivalent at f (Kind Wound only).
func (s *Solver) Equivalent(i int, f float64) (CoilEquivalent, error) {
	p := &s.net.Parts[i]
	if p.Kind != Wound {
		return CoilEquivalent{}, errorf(p.Name, "is not a wound coil")
	}
	w, err := p.woundAt(f)
	if err != nil {
		return CoilEquivalent{}, err
	}
	m := w.m
	e := CoilEquivalent{Frequency: f, L: float64(m.L + m.LLeads), R: float64(m.R + m.RLeads), C: float64(m.SelfCapacitance),
		LeadL: float64(m.LLeads), LeadR: float64(m.RLeads), WindingL: float64(m.L), WindingR: float64(m.R)}
	if p.TapNode >= 0 {
		e.Tapped, e.LA, e.LB, e.M, e.RA, e.RB = true, w.la, w.lb, w.mm, w.ra, w.rb
	}
	return e, nil
}
