package trim

import (
	"fmt"
	"math"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Action is the change a correction asks of the builder.
type Action int

const (
	ActionNone Action = iota
	ActionSqueeze
	ActionSpread
	ActionAddTurns
	ActionRemoveTurns
)

// String is the JSON name: none, squeeze, spread, add_turns, remove_turns.
func (a Action) String() string {
	return [...]string{"none", "squeeze", "spread", "add_turns", "remove_turns"}[a]
}

// CorrectOptions tune Correct.
type CorrectOptions struct {
	// Tolerance is the relative miss accepted as on target: a coil within
	// it is left alone, and a rounded length must land within it.
	Tolerance float64
	// LengthSteps are the resolutions the builder can set an outside
	// length to, coarsest first (e.g. 0.1 mm, 0.05 mm, 0.02 mm, 0.01 mm).
	// The first whose rounding keeps the prediction within Tolerance is
	// used, else the last. Empty: the exact length.
	LengthSteps []unit.Length
}

// Correction is the change that brings a calibrated coil to its target.
type Correction struct {
	Action Action
	// Target, Before and After are in the target's sense: the aim, the
	// coil as built, and the coil after the change.
	Target, Before, After unit.Inductance
	// Geometry is the coil after the change (turns and pitch).
	Geometry coil.Geometry
	// LengthBefore and LengthAfter are outside winding lengths.
	LengthBefore, LengthAfter unit.Length
	// LengthStep is the resolution LengthAfter was rounded to; zero when
	// exact.
	LengthStep unit.Length
	// WindowLeast and WindowMost are what squeezing and spreading can
	// reach with the coil's present turns, in the target's sense, and
	// WindowLeastPitch and WindowMostPitch the pitches where they are. They
	// are the window's ends (coil.Window) unless the inductance turns
	// upward inside it (short fat coils past p ≈ 0.7·D, see scanWindow).
	WindowLeast, WindowMost           unit.Inductance
	WindowLeastPitch, WindowMostPitch unit.Length
	// LengthPerPercent is the length change per 1 % of inductance around
	// the corrected coil, for the final touch (see LengthPerPercent).
	LengthPerPercent unit.Length
}

// windowPitches are coil.WindowPitches as plain floats for the solvers.
func windowPitches(g coil.Geometry) (tight, loose float64) {
	t, l := coil.WindowPitches(g)
	return float64(t), float64(l)
}

// Correct finds, for the calibrated coil g, the change that brings it to
// t, in the order a builder prefers: leave it (within Tolerance); squeeze
// or spread to a new outside length inside the window; else add or remove
// quarter turns, with the new length. A target no number of turns reaches
// (the self-resonance falls below the target's frequency first, or even
// one turn is too much) wraps ErrInfeasible.
func Correct(g coil.Geometry, t Target, opt CorrectOptions) (Correction, error) {
	var c Correction
	if err := g.Validate(); err != nil {
		return c, err
	}
	if tl := float64(t.Inductance); !finite(tl) || tl <= 0 {
		return c, inputErrorf("target", "must be a positive inductance, e.g. 48nH")
	}
	if !finite(opt.Tolerance) || opt.Tolerance < 0 || opt.Tolerance > 0.5 {
		return c, inputErrorf("tolerance", "%.3g %% is outside 0 … 50 %%", opt.Tolerance*100)
	}
	want := float64(t.Inductance)
	before, err := t.Of(g)
	if err != nil {
		return c, err
	}
	tight, loose := windowPitches(g)
	if _, err := t.Of(withPitch(g, tight)); err != nil {
		return c, err
	}
	if _, err := t.Of(withPitch(g, loose)); err != nil {
		return c, err
	}
	w := scanWindow(g, t)
	least, most := unit.Inductance(w.least), unit.Inductance(w.most)
	c.Target, c.Before = t.Inductance, before
	c.WindowLeast, c.WindowMost = least, most
	c.WindowLeastPitch, c.WindowMostPitch = unit.Length(w.leastAt), unit.Length(w.mostAt)
	c.LengthBefore = g.WindingLength()
	c.Geometry, c.After, c.LengthAfter = g, before, c.LengthBefore

	switch {
	case math.Abs(float64(before)/want-1) <= opt.Tolerance:
		c.Action = ActionNone
	case want <= float64(most) && want >= float64(least):
		c.set(solvePitch(g, t, opt))
		c.After, err = t.Of(c.Geometry)
		if err != nil {
			return c, err
		}
		if alt, ok := marginTurns(g, t, opt, c.Geometry); ok {
			c.set(alt.Geometry, alt.LengthStep)
			c.After, c.Action = alt.After, ActionRemoveTurns
			break
		}
		switch {
		case c.LengthAfter < c.LengthBefore:
			c.Action = ActionSqueeze
		case c.LengthAfter > c.LengthBefore:
			c.Action = ActionSpread
		default:
			// The nearest settable length is the present one.
			c.Action = ActionNone
		}
	default:
		n, err := findTurns(g, t, want > float64(most))
		if err != nil {
			return c, err
		}
		c.set(solvePitch(rewound(g, n), t, opt))
		c.After, err = t.Of(c.Geometry)
		if err != nil {
			return c, err
		}
		c.Action = ActionRemoveTurns
		if n > g.Turns {
			c.Action = ActionAddTurns
		}
	}
	if c.Action == ActionNone {
		c.Geometry, c.After, c.LengthAfter, c.LengthStep = g, before, c.LengthBefore, 0
	}
	dl, err := coil.LengthPerPercent(c.Geometry, t.Frequency)
	if err == nil {
		c.LengthPerPercent = dl
	}
	return c, nil
}

// WindowMargin is the rule for a spread: a final pitch within this
// fraction of the window's width (close-wound … LoosestPitchFactor·d_o)
// of its loose end sits where the turns barely hold and a small slip
// leaves the window, so removing a quarter turn and spreading into the
// middle of the window is preferred when that reaches the target with the
// pitch at least WindowMargin from both ends. The close-wound end needs no
// margin: pushing the turns together is an exact, easy setting (common
// practice).
const WindowMargin = 0.10

// windowPlace is where pitch p sits in g's window: 0 close-wound, 1 at the
// loosest pitch.
func windowPlace(g coil.Geometry, p float64) float64 {
	tight, loose := windowPitches(g)
	if loose <= tight {
		return 0
	}
	return (p - tight) / (loose - tight)
}

// marginTurns is the WindowMargin rule: when spread, the corrected coil
// got sits within the margin of the window's loose end, the same coil with
// a quarter turn less, spread to the target, if that lands inside the
// margins and within the tolerance.
func marginTurns(g coil.Geometry, t Target, opt CorrectOptions, got coil.Geometry) (Correction, bool) {
	var c Correction
	if got.Pitch <= g.Pitch || windowPlace(g, float64(got.Pitch)) <= 1-WindowMargin || g.Turns < 1.25 {
		return c, false
	}
	h := rewound(g, g.Turns-0.25)
	ng, step := solvePitch(h, t, opt)
	if x := windowPlace(h, float64(ng.Pitch)); x < WindowMargin || x > 1-WindowMargin {
		return c, false
	}
	v, err := t.Of(ng)
	if err != nil || math.Abs(float64(v)/float64(t.Inductance)-1) > math.Max(opt.Tolerance, 0.005) {
		return c, false
	}
	c.set(ng, step)
	c.After = v
	return c, true
}

// set records the corrected geometry and the length step it was rounded to.
func (c *Correction) set(ng coil.Geometry, step unit.Length) {
	c.Geometry, c.LengthStep = ng, step
	c.LengthAfter = ng.WindingLength()
}

// rewound is g wound again with n turns: its pitch is brought inside the
// standard window (a new winding starts from LoosestPitchFactor·d_o at
// most, whatever the old one was).
func rewound(g coil.Geometry, n float64) coil.Geometry {
	g.Turns = n
	do := float64(g.OverallDiameter())
	g.Pitch = unit.Length(math.Max(do, math.Min(float64(g.Pitch), coil.LoosestPitchFactor*do)))
	return g
}

func withPitch(g coil.Geometry, p float64) coil.Geometry {
	g.Pitch = unit.Length(p)
	return g
}

// valueAtPitch evaluates the target's sense at pitch p; a model failure
// (the frequency above the self-resonance) counts as +Inf.
func valueAtPitch(g coil.Geometry, t Target, p float64) float64 {
	v, err := t.Of(withPitch(g, p))
	if err != nil {
		return math.Inf(1)
	}
	return float64(v)
}

// window is the target's value sampled over a coil's squeeze/spread
// window, with its extremes.
type window struct {
	p, v                  []float64 // pitches (ascending) and values
	least, leastAt        float64
	most, mostAt          float64
	tight, loose, present float64
}

// windowSamples is the number of pitches scanWindow samples. The value is
// smooth and has at most one interior minimum (it falls with the pitch,
// and for short fat coils the helix's own part makes it rise again past
// p ≈ 0.7·D; HelixPitchCorrection, checked against the helix Neumann
// integral), which the golden-section refinement finds.
const windowSamples = 24

// scanWindow samples g's window and locates its least and most values. The
// search must not assume the value falls monotonically with the pitch: at
// p > 0.7·D on short fat coils it rises again (e.g. 4 turns of 1 mm on a
// 5.8 mm mean diameter: least at p ≈ 4.5 mm, 0.77·D). The most is at an
// end (close winding in practice); the least is refined by golden section
// when it lies inside.
func scanWindow(g coil.Geometry, t Target) window {
	tight, loose := windowPitches(g)
	w := window{tight: tight, loose: loose, present: float64(g.Pitch)}
	w.p = make([]float64, 0, windowSamples+2)
	w.v = make([]float64, 0, windowSamples+2)
	for i := range windowSamples {
		p := tight + (loose-tight)*float64(i)/(windowSamples-1)
		w.p = append(w.p, p)
		w.v = append(w.v, valueAtPitch(g, t, p))
	}
	im, iM := 0, 0
	for i, v := range w.v {
		if v < w.v[im] {
			im = i
		}
		if v > w.v[iM] {
			iM = i
		}
	}
	w.most, w.mostAt = w.v[iM], w.p[iM]
	w.least, w.leastAt = w.v[im], w.p[im]
	if im > 0 && im < len(w.p)-1 {
		// Golden section on the samples either side; insert the minimum
		// among the samples so that every crossing of a level above it has
		// a sign change between neighbours.
		a, b := w.p[im-1], w.p[im+1]
		const r = 0.6180339887498949
		x1, x2 := b-r*(b-a), a+r*(b-a)
		f1, f2 := valueAtPitch(g, t, x1), valueAtPitch(g, t, x2)
		for b-a > 1e-9*loose {
			if f1 < f2 {
				b, x2, f2 = x2, x1, f1
				x1 = b - r*(b-a)
				f1 = valueAtPitch(g, t, x1)
			} else {
				a, x1, f1 = x1, x2, f2
				x2 = a + r*(b-a)
				f2 = valueAtPitch(g, t, x2)
			}
		}
		pm := (a + b) / 2
		if vm := valueAtPitch(g, t, pm); vm < w.least {
			w.least, w.leastAt = vm, pm
			at := im
			if pm > w.p[im] {
				at = im + 1
			}
			w.p = append(w.p[:at], append([]float64{pm}, w.p[at:]...)...)
			w.v = append(w.v[:at], append([]float64{vm}, w.v[at:]...)...)
		}
	}
	return w
}

// root finds the pitch in w at which the value is want: of the sampled
// intervals whose ends straddle want, the one nearest the present pitch
// (the least change for the builder), refined by bisection. With want
// outside the window it returns the pitch of the nearer extreme.
func (w *window) root(g coil.Geometry, t Target, want float64) float64 {
	switch {
	case want >= w.most:
		return w.mostAt
	case want <= w.least:
		return w.leastAt
	}
	best, bestDist := -1, math.Inf(1)
	for i := 0; i+1 < len(w.p); i++ {
		if (w.v[i]-want)*(w.v[i+1]-want) > 0 {
			continue
		}
		dist := 0.0
		if w.present < w.p[i] {
			dist = w.p[i] - w.present
		} else if w.present > w.p[i+1] {
			dist = w.present - w.p[i+1]
		}
		if dist < bestDist {
			best, bestDist = i, dist
		}
	}
	if best < 0 {
		return w.leastAt // not reached: least < want < most has a crossing
	}
	lo, hi := w.p[best], w.p[best+1]
	falling := w.v[best] > w.v[best+1]
	for range 100 {
		mid := (lo + hi) / 2
		if (valueAtPitch(g, t, mid) > want) == falling {
			lo = mid
		} else {
			hi = mid
		}
		if hi-lo < 1e-12*w.loose {
			break
		}
	}
	return (lo + hi) / 2
}

// solvePitch finds the pitch within g's window that brings g to t (the
// nearest extreme when t is outside it; scanWindow, as the value need not
// fall monotonically with the pitch), then rounds the outside length to
// the coarsest of opt.LengthSteps that keeps the prediction within
// opt.Tolerance, and returns the step used (zero for exact).
func solvePitch(g coil.Geometry, t Target, opt CorrectOptions) (coil.Geometry, unit.Length) {
	want := float64(t.Inductance)
	w := scanWindow(g, t)
	loose := w.loose
	exact := withPitch(g, w.root(g, t, want))
	if want >= w.most || want <= w.least {
		return exact, 0
	}
	if g.Turns <= 1 || len(opt.LengthSteps) == 0 {
		return exact, 0
	}
	// Round the outside length, keeping the pitch inside the window.
	do := float64(g.OverallDiameter())
	minLen, maxLen := g.Turns*do, (g.Turns-1)*loose+do
	ex := float64(exact.WindingLength())
	best, bestStep := exact, unit.Length(0)
	for i, step := range opt.LengthSteps {
		st := float64(step)
		if !(st > 0) {
			continue
		}
		l := math.Round(ex/st) * st
		if l < minLen*(1-1e-12) {
			l = math.Ceil(minLen/st-1e-9) * st
		}
		if l > maxLen*(1+1e-12) {
			l = math.Floor(maxLen/st+1e-9) * st
		}
		if l < minLen*(1-1e-12) || l > maxLen*(1+1e-12) {
			continue // the window is narrower than the step
		}
		rg := withPitch(g, math.Max((l-do)/(g.Turns-1), do))
		v, err := t.Of(rg)
		if err != nil {
			continue
		}
		best, bestStep = rg, step
		if math.Abs(float64(v)/want-1) <= opt.Tolerance || i == len(opt.LengthSteps)-1 {
			break
		}
	}
	return best, bestStep
}

// findTurns returns the quarter-turn count nearest g's whose window
// reaches t: more turns when more is set, fewer otherwise.
func findTurns(g coil.Geometry, t Target, more bool) (float64, error) {
	want := float64(t.Inductance)
	tight, _ := windowPitches(g)
	withTurns := func(n float64) coil.Geometry { return rewound(g, n) }
	// reaches reports whether n turns can reach the target from the side
	// it lies on: the window's most is at least want (more), or its least
	// at most want (fewer). The ends are evaluated first for the model's
	// own failure (the frequency above the self-resonance); the extremes
	// come from scanWindow, as the value need not be monotone in the pitch.
	reaches := func(n float64) (bool, error) {
		h := withTurns(n)
		if more {
			if _, err := t.Of(withPitch(h, tight)); err != nil {
				return false, err
			}
			return scanWindow(h, t).most >= want, nil
		}
		_, loose := windowPitches(h)
		if _, err := t.Of(withPitch(h, loose)); err != nil {
			return false, err
		}
		return scanWindow(h, t).least <= want, nil
	}
	q0 := math.Round(g.Turns * 4)
	if more {
		// Exponential then binary search over quarter turns.
		lastBad := q0
		step := 1.0
		var q float64
		for {
			q = q0 + step
			if q > coil.MaxTurns*4 {
				q = coil.MaxTurns * 4
			}
			ok, err := reaches(q / 4)
			if err != nil {
				return 0, &infeasibleError{fmt.Sprintf("the target %s needs more turns than %s, and with %g turns the coil's self-resonance is already too close to %s; use a larger diameter, which needs fewer turns",
					quantity.FormatInductance(want), quantity.FormatTurns(g.Turns), q/4, quantity.FormatFrequency(float64(t.Frequency)))}
			}
			if ok {
				break
			}
			if q == coil.MaxTurns*4 {
				return 0, &infeasibleError{fmt.Sprintf("the target %s is out of reach: even %d close-wound turns are not enough", quantity.FormatInductance(want), coil.MaxTurns)}
			}
			lastBad = q
			step *= 2
		}
		lo, hi := lastBad, q // lo fails, hi reaches
		for hi-lo > 1 {
			mid := math.Floor((lo + hi) / 2)
			ok, err := reaches(mid / 4)
			if err == nil && ok {
				hi = mid
			} else {
				lo = mid
			}
		}
		return hi / 4, nil
	}
	// Fewer turns: the value falls with n, so search down to one turn.
	if ok, err := reaches(1); err != nil || !ok {
		v := scanWindow(withTurns(1), t).least
		if !finite(v) {
			return 0, &infeasibleError{fmt.Sprintf("the target %s is out of reach: even a single turn of this wire on this diameter is past its self-resonance at %s; use a smaller diameter",
				quantity.FormatInductance(want), quantity.FormatFrequency(float64(t.Frequency)))}
		}
		return 0, &infeasibleError{fmt.Sprintf("the target %s is below what a single turn of this wire on this diameter gives (%s at its least): use a smaller diameter",
			quantity.FormatInductance(want), quantity.FormatInductance(v))}
	}
	lo, hi := 4.0, q0 // lo reaches, hi does not
	for hi-lo > 1 {
		mid := math.Ceil((lo + hi) / 2)
		ok, err := reaches(mid / 4)
		if err == nil && ok {
			lo = mid
		} else {
			hi = mid
		}
	}
	return lo / 4, nil
}

// Expected is what the next measurement, made the same way, should read.
type Expected struct {
	// Inductance (MeasureDirect) is the meter's reading, fixture included.
	Inductance unit.Inductance
	// Resonances are the frequencies expected with the same capacitors.
	Resonances []Resonance
}

// ExpectedReading predicts the reading of m on the coil g (calibrated and
// corrected), given the calibration cal that came from m.
func ExpectedReading(g coil.Geometry, cal Calibration, m Measurement) (Expected, error) {
	var e Expected
	gm := g
	gm.LeadLength += m.FixtureLeadLength
	r := cal.Reading
	switch m.Kind {
	case MeasureDirect, MeasureSweep:
		v, err := r.sense().of(gm)
		if err != nil {
			return e, err
		}
		e.Inductance = unit.Inductance(v) + m.FixtureInductance
	case MeasureResonance, MeasureInCircuit:
		res := m.Resonances[0]
		f, err := ResonanceWith(gm, r.Capacitance)
		if err != nil {
			return e, err
		}
		e.Resonances = []Resonance{{Frequency: f, Capacitance: res.Capacitance}}
	case MeasureTwoCapacitor:
		p, err := coil.Predict(gm, r.Frequency)
		if err != nil {
			return e, err
		}
		// The measured total stray, with the change of the self-capacitance
		// the terminals see.
		c0 := float64(r.TotalStray) + float64(terminalSelfCapacitance(p)) - float64(cal.SelfCapacitanceAtTerminals)
		for _, res := range m.Resonances {
			e.Resonances = append(e.Resonances, Resonance{
				Frequency:   coil.ResonantFrequency(p.Inductance, res.Capacitance+unit.Capacitance(c0)),
				Capacitance: res.Capacitance,
			})
		}
	}
	return e, nil
}

// ResonanceWith is the frequency at which the coil g resonates with c
// across its terminals: the root of ω²·L_eff(ω)·c = 1, with the model's
// effective inductance (leads, skin effect and self-capacitance at ω). The
// effective inductance grows with frequency, so the root is unique below
// the self-resonance; a c too small to resonate below 90 % of it is an
// *InputError.
func ResonanceWith(g coil.Geometry, capacitance unit.Capacitance) (unit.Frequency, error) {
	c := float64(capacitance)
	if !finite(c) || c <= 0 {
		return 0, inputErrorf("capacitance", "must be positive, e.g. 22pF")
	}
	p0, err := coil.Predict(g, 0)
	if err != nil {
		return 0, err
	}
	h := func(f float64) float64 {
		p, err := coil.Predict(g, unit.Frequency(f))
		if err != nil {
			return math.Inf(1)
		}
		return f - 1/(twoPi*math.Sqrt(float64(p.InductanceEffective)*c))
	}
	hi := 0.9 * float64(p0.SRF)
	lo := 0.5 / (twoPi * math.Sqrt(float64(p0.Inductance)*c))
	if lo >= hi || h(hi) < 0 {
		return 0, inputErrorf("resonance", "%s across this coil does not resonate below 90 %% of its self-resonance; use a larger capacitor", quantity.FormatCapacitanceShort(c))
	}
	for range 200 {
		mid := (lo + hi) / 2
		if h(mid) < 0 {
			lo = mid
		} else {
			hi = mid
		}
		if hi-lo < 1e-12*hi {
			break
		}
	}
	return unit.Frequency((lo + hi) / 2), nil
}
