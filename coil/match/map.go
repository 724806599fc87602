package match

import (
	"context"
	"fmt"
	"math"

	"turnwise/coil"
	"turnwise/coil/circuit"
	"turnwise/internal/quantity"
)

// DefaultSWR is the SWR at port 1 a load must reach to count as matched.
const DefaultSWR = 1.5

// Grid is the rectangle of load impedances R + jX: NR resistances spaced
// logarithmically from RMin to RMax and NX reactances spaced evenly from
// XMin to XMax, in ohms.
type Grid struct {
	RMin, RMax float64
	NR         int
	XMin, XMax float64
	NX         int
}

// DefaultGrid is 9 resistances from 5 Ω to 2 kΩ by 9 reactances from
// −1 kΩ to +1 kΩ: the spread of a wire antenna fed off resonance.
func DefaultGrid() Grid {
	return Grid{RMin: 5, RMax: 2000, NR: 9, XMin: -1000, XMax: 1000, NX: 9}
}

// R is the grid's i-th resistance.
func (g Grid) R(i int) float64 {
	if g.NR == 1 {
		return g.RMin
	}
	return g.RMin * math.Pow(g.RMax/g.RMin, float64(i)/float64(g.NR-1))
}

// X is the grid's j-th reactance.
func (g Grid) X(j int) float64 {
	if g.NX == 1 {
		return g.XMin
	}
	return g.XMin + (g.XMax-g.XMin)*float64(j)/float64(g.NX-1)
}

func (g Grid) validate() error {
	switch {
	case !(g.RMin > 0) || !(g.RMax >= g.RMin) || math.IsInf(g.RMax, 0):
		return inputErr("load-r", "the resistance range must run from a positive minimum up, e.g. 5-2000ohm")
	case g.NR < 1 || g.NR > 200:
		return inputErr("load-r", "%d resistance steps: give 1 to 200", g.NR)
	case math.IsNaN(g.XMin) || math.IsNaN(g.XMax) || math.IsInf(g.XMin, 0) || math.IsInf(g.XMax, 0) || g.XMax < g.XMin:
		return inputErr("load-x", "the reactance range must run from a minimum up to a maximum, e.g. -1000-1000ohm")
	case g.NX < 1 || g.NX > 200:
		return inputErr("load-x", "%d reactance steps: give 1 to 200", g.NX)
	}
	return nil
}

// Options say what to map.
type Options struct {
	Frequencies []float64 // Hz, at least one
	Grid        Grid      // the zero value means DefaultGrid
	SWR         float64   // limit; 0 means DefaultSWR
	// Power is the power the transmitter delivers into port 1, in watts
	// (for a modulated signal, its peak envelope power: the voltages are
	// those at the envelope's peak). Zero maps without stress.
	Power float64
}

func (o *Options) normalise() error {
	if len(o.Frequencies) == 0 {
		return inputErr("freq", "no frequency: give at least one, e.g. --freq 7.1MHz")
	}
	for _, f := range o.Frequencies {
		if !(f > 0) || f > coil.MaxFrequency {
			return inputErr("freq", "%g Hz is outside 0 … 10 GHz", f)
		}
	}
	if o.Grid == (Grid{}) {
		o.Grid = DefaultGrid()
	}
	if err := o.Grid.validate(); err != nil {
		return err
	}
	if o.SWR == 0 {
		o.SWR = DefaultSWR
	}
	if !(o.SWR > 1) || math.IsInf(o.SWR, 0) {
		return inputErr("swr", "the SWR limit must be above 1, e.g. 1.5")
	}
	if math.IsNaN(o.Power) || math.IsInf(o.Power, 0) || o.Power < 0 {
		return inputErr("power", "the power must be zero or positive, e.g. 100W")
	}
	return nil
}

// Setting is one adjustable capacitor's value.
type Setting struct {
	Part        string
	Capacitance float64 // F
}

// Loss is the share of the input power one part dissipates.
type Loss struct {
	Part  string
	Share float64 // of the power into port 1, 0…1
}

// PartStress is what one part, or one section of a tapped coil ("L1 top",
// "L1 bottom"), sees at the stated power.
type PartStress struct {
	Part        string
	VRMS, VPeak float64 // V across it
	IRMS        float64 // A through it
	Dissipation float64 // W
}

// Point is the answer for one load at one frequency.
type Point struct {
	LoadR, LoadX float64 // Ω
	Matched      bool
	// SWR at port 1: at the settings for a matched load, the best the
	// search found for one that is not.
	SWR        float64
	Settings   []Setting    // matched loads only
	Efficiency float64      // power into the load over power into port 1 (matched only)
	Losses     []Loss       // per lossy part (matched only)
	Stress     []PartStress // at Options.Power (matched only, when Power > 0)
}

// Where is a load at a frequency.
type Where struct {
	Frequency, R, X float64
}

// Worst is the largest stress one part sees over a set of matched loads,
// with the load where each maximum occurs.
type Worst struct {
	Part                    string
	VPeak                   float64
	VPeakAt                 Where
	IRMS                    float64
	IRMSAt                  Where
	Dissipation             float64
	DissipationAt           Where
	Rating                  float64 // V peak, capacitors with a rating; 0 none
	HeatLimit               float64 // W, wound coils (see HeatRule); 0 none
	OverRating, OverHeating bool
}

// FrequencyMap is the map at one frequency.
type FrequencyMap struct {
	Frequency float64
	Coverage  float64 // share of the grid's loads matched, 0…1
	Matched   int
	Points    []Point // R outer, X inner
	Worst     []Worst // at Options.Power, over this frequency's matched loads
}

// Result is a whole map.
type Result struct {
	SWR         float64
	Power       float64
	Grid        Grid
	Frequencies []FrequencyMap
	Worst       []Worst // over every frequency
	HeatRule    string  // the wire heating rule, when Power > 0
	Warnings    []string
	Cautions    []string // when Power > 0
	Evaluations int      // circuit solutions the search used
}

// Cautions are shown whenever a power is given.
var Cautions = []string{
	"RF burns: never touch the coil, the capacitors or the antenna lead while transmitting; RF burns are deep and slow to heal.",
	"High voltage: the hot end of the coil and both sides of each capacitor carry the peak voltages listed here; allow for them in spacing and insulation.",
	"Keep the covers on and the capacitor shafts insulated while transmitting; adjust only with the transmitter off or at the lowest power.",
	"Follow your local regulations and the practice of your licence for power, frequencies and safe antenna installation.",
}

// Map maps which loads the setup matches at each frequency.
func Map(ctx context.Context, setup Setup, opts Options) (*Result, error) {
	if err := opts.normalise(); err != nil {
		return nil, err
	}
	p, err := setup.prepare()
	if err != nil {
		return nil, err
	}
	res := &Result{SWR: opts.SWR, Power: opts.Power, Grid: opts.Grid}
	limit := gammaFor(opts.SWR)
	heat := heatLimits(p.src)
	if opts.Power > 0 {
		res.HeatRule = HeatRule
		res.Cautions = append([]string(nil), Cautions...)
	}
	overall := map[string]*Worst{}
	var order []string
	for _, f := range opts.Frequencies {
		e, err := newEngine(p, f)
		if err != nil {
			return nil, err
		}
		fm := FrequencyMap{Frequency: f}
		worst := map[string]*Worst{}
		var fOrder []string
		for i := range opts.Grid.NR {
			for j := range opts.Grid.NX {
				if err := ctx.Err(); err != nil {
					return nil, err
				}
				pt, err := e.point(opts.Grid.R(i), opts.Grid.X(j), limit, opts.Power)
				if err != nil {
					return nil, err
				}
				if pt.Matched {
					fm.Matched++
					for _, s := range pt.Stress {
						w := Where{f, pt.LoadR, pt.LoadX}
						fOrder = mergeWorst(worst, fOrder, s, w)
						order = mergeWorst(overall, order, s, w)
					}
				}
				fm.Points = append(fm.Points, pt)
			}
		}
		fm.Coverage = float64(fm.Matched) / float64(len(fm.Points))
		fm.Worst = finishWorst(worst, fOrder, p, heat)
		res.Evaluations += e.evals
		res.Frequencies = append(res.Frequencies, fm)
		if fm.Matched == 0 {
			res.Warnings = append(res.Warnings, fmt.Sprintf("at %s no load of the grid reaches SWR %.3g: check the capacitor ranges and the tap for this band",
				quantity.FormatFrequency(f), opts.SWR))
		}
	}
	res.Worst = finishWorst(overall, order, p, heat)
	for _, w := range res.Worst {
		if w.OverRating {
			res.Warnings = append(res.Warnings, fmt.Sprintf("%s sees %.0f V peak (at %s, load %s) above its %.0f V rating: use a capacitor rated at least %.0f V",
				w.Part, w.VPeak, quantity.FormatFrequency(w.VPeakAt.Frequency), loadString(w.VPeakAt.R, w.VPeakAt.X), w.Rating, 1.5*w.VPeak))
		}
		if w.OverHeating {
			res.Warnings = append(res.Warnings, fmt.Sprintf("%s dissipates %.3g W (at %s, load %s), above %.3g W for a %g K rise by the heating rule: use thicker wire, a larger coil or less power",
				w.Part, w.Dissipation, quantity.FormatFrequency(w.DissipationAt.Frequency), loadString(w.DissipationAt.R, w.DissipationAt.X), w.HeatLimit, heatRise))
		}
	}
	return res, nil
}

func loadString(r, x float64) string {
	sign := "+"
	if x < 0 {
		sign = "-"
	}
	return fmt.Sprintf("%.4g%sj%.4g ohm", r, sign, math.Abs(x))
}

// point solves one load.
func (e *engine) point(r, x, limit, power float64) (Point, error) {
	pt := Point{LoadR: r, LoadX: x}
	e.setLoad(complex(r, x))
	cands := e.search(limit, false)
	best := -1
	bestEff := -1.0
	var bestState circuit.State
	var bestPin float64
	for i, c := range cands {
		if c.gamma > limit {
			continue
		}
		// The circuit solver has the last word on every match.
		if g := e.solverGamma(c.u); g > limit {
			continue
		} else {
			cands[i].gamma = g
		}
		st, pin, err := e.drive(c.u)
		if err != nil || !(pin > 0) {
			continue
		}
		eff := st.PartLoss(e.ln.load) / pin
		if eff > bestEff {
			best, bestEff, bestState, bestPin = i, eff, st, pin
		}
	}
	if best < 0 {
		g := 1.0
		if len(cands) > 0 {
			g = cands[0].gamma
		}
		pt.SWR = finiteSWR(g)
		return pt, nil
	}
	c := cands[best]
	pt.Matched = true
	pt.SWR = swr(c.gamma)
	pt.Efficiency = bestEff
	for k, i := range e.p.adj {
		pt.Settings = append(pt.Settings, Setting{Part: e.p.src.Parts[i].Name, Capacitance: e.capacitance(k, c.u[k])})
	}
	pt.Losses = e.losses(bestState, bestPin)
	if power > 0 {
		pt.Stress = e.stress(bestState, math.Sqrt(power/bestPin))
	}
	return pt, nil
}

// finiteSWR keeps an unmatched point's SWR printable.
func finiteSWR(g float64) float64 {
	const maxSWR = 1e6
	if g >= 1 {
		return maxSWR
	}
	return math.Min(swr(g), maxSWR)
}

// losses is each lossy part's share of the input power.
func (e *engine) losses(st circuit.State, pin float64) []Loss {
	var out []Loss
	src := e.p.src
	for i, pp := range src.Parts {
		var w float64
		switch {
		case pp.Kind == circuit.Wound:
			w = e.coilLoss(st, i)
		case e.at[i] >= 0 && (pp.Kind == circuit.Capacitor || pp.Kind == circuit.Inductor || pp.Kind == circuit.Resistor):
			w = st.PartLoss(e.at[i])
		}
		if w > 0 {
			out = append(out, Loss{Part: pp.Name, Share: w / pin})
		}
	}
	return out
}

func (e *engine) coilParts(orig int) coilParts {
	for _, c := range e.ln.coils {
		if c.orig == orig {
			return c
		}
	}
	return coilParts{top: -1, bottom: -1, leads: -1}
}

func (e *engine) coilLoss(st circuit.State, orig int) float64 {
	c := e.coilParts(orig)
	w := 0.0
	for _, li := range []int{c.top, c.bottom, c.leads} {
		if li >= 0 {
			w += e.sectionLoss(st, li)
		}
	}
	return w
}

// sectionLoss is the power dissipated in a coil section's resistance,
// ½·R·|I|² for a peak phasor. ½·Re(V·I*) across a section would also carry
// the power the mutual inductance moves between the sections (it cancels
// only in their sum) and can come out negative.
func (e *engine) sectionLoss(st circuit.State, li int) float64 {
	i := cmplxAbs(st.PartCurrent(li))
	return 0.5 * e.ln.net.Parts[li].ESR * i * i
}

// stress is every capacitor's, inductor's and coil section's voltage and
// current, scaled by k from the 1 V EMF state to the stated power.
func (e *engine) stress(st circuit.State, k float64) []PartStress {
	mag := func(c complex128) float64 { return k * math.Hypot(real(c), imag(c)) }
	entry := func(name string, v, i complex128, w float64) PartStress {
		vp := mag(v)
		return PartStress{Part: name, VPeak: vp, VRMS: vp / math.Sqrt2, IRMS: mag(i) / math.Sqrt2, Dissipation: w * k * k}
	}
	var out []PartStress
	for i, pp := range e.p.src.Parts {
		switch pp.Kind {
		case circuit.Capacitor, circuit.Inductor:
			li := e.at[i]
			out = append(out, entry(pp.Name, st.PartVoltage(li), st.PartCurrent(li), st.PartLoss(li)))
		case circuit.Wound:
			c := e.coilParts(i)
			whole := st.V[c.hot] - st.V[c.cold]
			if c.tap >= 0 {
				it, ib := st.PartCurrent(c.top), st.PartCurrent(c.bottom)
				big := it
				if cmplxAbs(ib) > cmplxAbs(it) {
					big = ib
				}
				out = append(out, entry(pp.Name, whole, big, e.coilLoss(st, i)),
					entry(pp.Name+" top", st.PartVoltage(c.top), it, e.sectionLoss(st, c.top)),
					entry(pp.Name+" bottom", st.PartVoltage(c.bottom), ib, e.sectionLoss(st, c.bottom)))
				continue
			}
			cur := st.PartCurrent(c.top)
			if c.leads >= 0 && cmplxAbs(st.PartCurrent(c.leads)) > cmplxAbs(cur) {
				cur = st.PartCurrent(c.leads)
			}
			out = append(out, entry(pp.Name, whole, cur, e.coilLoss(st, i)))
		}
	}
	return out
}

func cmplxAbs(c complex128) float64 { return math.Hypot(real(c), imag(c)) }

func mergeWorst(m map[string]*Worst, order []string, s PartStress, at Where) []string {
	w, ok := m[s.Part]
	if !ok {
		w = &Worst{Part: s.Part, VPeak: -1, IRMS: -1, Dissipation: -1}
		m[s.Part] = w
		order = append(order, s.Part)
	}
	if s.VPeak > w.VPeak {
		w.VPeak, w.VPeakAt = s.VPeak, at
	}
	if s.IRMS > w.IRMS {
		w.IRMS, w.IRMSAt = s.IRMS, at
	}
	if s.Dissipation > w.Dissipation {
		w.Dissipation, w.DissipationAt = s.Dissipation, at
	}
	return order
}

func finishWorst(m map[string]*Worst, order []string, p *prepared, heat map[string]float64) []Worst {
	var out []Worst
	for _, name := range order {
		w := *m[name]
		for i, pp := range p.src.Parts {
			if pp.Name == name && p.ratings[i] > 0 {
				w.Rating = p.ratings[i]
				w.OverRating = w.VPeak > w.Rating
			}
		}
		if lim, ok := heat[name]; ok {
			w.HeatLimit = lim
			w.OverHeating = w.Dissipation > lim
		}
		out = append(out, w)
	}
	return out
}
