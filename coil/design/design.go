package design

import (
	"fmt"
	"math"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Design search: a target in, ranked windable coils out. Types, defaults,
// rules and the entry point are here; the search is spread over
// design_search.go (pairs, the top list, the Pareto set), design_bound.go
// (bounds before evaluating), design_bnb.go (best-first branch and bound),
// design_turns.go (turns range, pitch solve), design_walk.go (visiting
// turns), design_eval.go (the lean evaluation), design_score.go (the
// ranking and its bounds), design_result.go (candidates, Pareto list, why
// lines), design_free.go (a free diameter, with gonum/optimize) and
// design_miss.go (what to say when nothing fits).

// Target is what the coil must do. Give Inductance, or Resonance with
// Capacitance.
type Target struct {
	// Inductance is the terminal inductance wanted: leads included, at
	// Frequency when that is set (low frequency otherwise).
	Inductance unit.Inductance
	// Resonance, with Capacitance: the coil must resonate with
	// Capacitance + Stray at Resonance. The L needed is derived with the
	// coil's own self-capacitance and leads included: the coil's effective
	// inductance at Resonance (coil.Prediction.InductanceEffective) must equal
	// 1/(ω²·(Capacitance+Stray)).
	Resonance   unit.Frequency
	Capacitance unit.Capacitance
	// Stray is wiring and device capacitance across the coil; zero for none.
	Stray unit.Capacitance
	// Frequency is the operating frequency for L at f, Q and the SRF check.
	// Zero means Resonance (zero too for a plain Inductance target: then L
	// is the low-frequency value, and Q and the SRF do not rank).
	Frequency unit.Frequency
	// Tolerance is the fraction the predicted value may differ from the
	// target (the search hits it to 1e-5; the band is the acceptance test
	// and the builder's trim goal), from MinTolerance to 0.5. Zero means
	// DefaultTolerance.
	Tolerance float64
}

// Support is what the wire is wound on: a mandrel the coil is slid off
// (springback applies), or a former it stays on.
type Support struct {
	Name     string
	OnFormer bool
	Diameter unit.Length // outside diameter of the rod or tube
	// Springback is the fractional growth of the bore once released, for
	// every wire on this support unless Constraints.Calibrations has one
	// for the pair. Zero for none (formers: the coil stays put).
	Springback float64
	// SpringbackNote says where Springback came from, e.g. a saved
	// calibration's note; "" when none.
	SpringbackNote string
}

// WireOption is a wire the search may use.
type WireOption struct {
	Name      string
	Diameter  unit.Length // bare conductor
	Overall   unit.Length // over the insulation; zero means bare (= Diameter)
	Conductor coil.Conductor
}

// SpringbackCalibration is a measured springback for one support and wire,
// by name (Support.Name, WireOption.Name). It overrides Support.Springback
// for that pair.
type SpringbackCalibration struct {
	Support, Wire string
	Springback    float64
	Note          string
}

// Preference shifts the ranking weights (see Score).
type Preference int

const (
	PreferBalanced Preference = iota // the default weights
	PreferQ                          // Q first
	PreferSmall                      // small outside volume first
	PreferEasy                       // easy winding first
)

func (p Preference) String() string {
	switch p {
	case PreferQ:
		return "q"
	case PreferSmall:
		return "small"
	case PreferEasy:
		return "easy"
	}
	return "balanced"
}

// FreeDiameter lets the search choose the support diameter freely between
// Min and Max (a rod the builder turns, buys or finds), instead of taking it
// from the stock. The result is rounded to 0.1 mm.
type FreeDiameter struct {
	OnFormer bool        // the coil stays on it (else slid off: self-supporting)
	Min, Max unit.Length // zero: 2 mm and 50 mm (Max also ≤ MaxDiameter)
}

// Constraints are what the builder has and will accept. Every zero value
// means "no limit" or the default stated beside it.
type Constraints struct {
	// Supports and Wires are the stock to choose from. Empty Supports is
	// allowed only with FreeDiameter.
	Supports []Support
	Wires    []WireOption
	// Calibrations override the springback of (support, wire) pairs.
	Calibrations []SpringbackCalibration
	// FreeDiameter, when not nil, adds coils on a support of any diameter.
	FreeDiameter *FreeDiameter

	LeadLength  unit.Length      // each of the two leads; fixed, it adds inductance
	Temperature unit.Temperature // conductor temperature; zero means 20 °C

	MaxLength     unit.Length // outside winding length (calipers); zero: none
	MaxDiameter   unit.Length // outside diameter over the wire; zero: none
	MaxWireLength unit.Length // wire to cut, leads and allowance included; zero: none
	// MinSRFRatio is the least SRF/f at the operating frequency. Zero means
	// DefaultSRFRatio (3, common practice); it must be at least 1.2.
	MinSRFRatio float64
	// MinWire and MaxWire bound the bare wire diameter, on top of the
	// stiffness and bending rules (see WireSuits). Zero: no extra bound.
	MinWire, MaxWire unit.Length
	// MinTurns is the fewest turns, at least 2; zero means DefaultMinTurns.
	MinTurns float64
	// TrimMargin is how far inside the squeeze/spread window the target
	// must sit: close-wound must give at least (1+m)·target and the
	// loosest pitch at most (1−m)·target. Zero means DefaultTrimMargin.
	TrimMargin float64
	// MinQ, when positive, is the least unloaded Q at the operating
	// frequency: a coil below it is not listed (nor on the Pareto front),
	// and the search prunes what its Q bound shows cannot reach it, so the
	// list fills from the coils that do. It needs an operating frequency.
	MinQ float64

	Prefer Preference
	Top    int // candidates returned; zero means DefaultTop
}

// Defaults for the zero values of Target and Constraints.
const (
	DefaultTolerance = 0.02
	// MinTolerance: a tighter band means nothing on the bench (the model
	// and the meter are good to a few per cent) and is below what the
	// pitch solve resolves.
	MinTolerance = 1e-4
	// DefaultSRFRatio: keep the SRF at least three times the operating
	// frequency (common practice), where L and Q are still close to their
	// low-frequency values.
	DefaultSRFRatio = 3.0
	// DefaultTrimMargin: 5 % each way covers the usual gap between a
	// prediction and the coil on the bench (springback not yet calibrated,
	// lead length, wire tolerance), so the builder can trim onto the target
	// by squeezing or spreading instead of rewinding.
	DefaultTrimMargin = 0.05
	// DefaultMinTurns: fewer than two turns cannot be trimmed by squeezing
	// or spreading (common practice: use a hairpin or strip line instead).
	DefaultMinTurns = 2.0
	DefaultTop      = 5
	// MaxTop bounds Constraints.Top.
	MaxTop = 100
)

// Candidate is one coil the search proposes.
type Candidate struct {
	Support Support // as used: Springback is the one applied to this wire
	// SpringbackSource is coil.SpringbackCalibration
	// (Constraints.Calibrations), coil.SpringbackGiven (Support.Springback),
	// coil.SpringbackNone (a mandrel with no springback known: 0 assumed) or
	// coil.SpringbackOnFormer.
	SpringbackSource coil.SpringbackSource
	Wire             WireOption
	// Prediction is the full model record at the operating frequency;
	// Prediction.Geometry is the coil to wind.
	Prediction coil.Prediction
	// Matched is the value compared with Result.Required: the terminal L
	// at f for an Inductance target, the effective L at the resonance for
	// a Resonance target.
	Matched unit.Inductance
	Score   float64
	Why     string
	// TrimMin and TrimMax are the terminal L at f at the loosest and
	// tightest sensible pitch (coil.Window): what squeezing and spreading reach.
	TrimMin, TrimMax unit.Inductance
	// TuneLow and TuneHigh, for a Resonance target, are the resonances with
	// the target's capacitance at the tightest and loosest pitch.
	TuneLow, TuneHigh unit.Frequency
	// TrimLengthPerPercent is the outside length change per 1 % of L.
	TrimLengthPerPercent unit.Length
	// Free is true for a coil on a free-diameter support.
	Free bool
	// Band, for a band design (SearchBand), is where the trimmer sits at
	// the band edges; nil otherwise.
	Band *BandFit
	// Tapped, for a tapped design (see tapped.go), is the tap and its
	// alternatives; nil otherwise.
	Tapped *TapFit
}

// Result is what Design returns.
type Result struct {
	// Required is the value every candidate's Matched hits: the terminal
	// L, or for a Resonance target the effective L at the resonance.
	Required unit.Inductance
	// Effective is true when Required is an effective inductance
	// (Resonance target).
	Effective bool
	// Frequency is the operating frequency used for Q and the SRF check
	// (zero when none).
	Frequency unit.Frequency
	Tolerance float64
	// Candidates, best first: at most one per support and wire, and no two
	// of the same kind (mandrel or former) within 7 % of each other in both
	// support and wire diameter (nearDuplicate).
	Candidates []Candidate
	// Pareto is the Q-versus-size front, smallest first: coils that no
	// other beats on both Q (higher) and outside volume (smaller), thinned
	// so that Q rises by at least 5 % from one to the next. Every coil the
	// stock allows has a point here of no larger volume and at least
	// 1/(1.12·1.05) ≈ 0.85 of its Q (the search skips coils within 12 %
	// of the front). Empty without a frequency.
	Pareto   []Candidate
	Warnings []string
	Stats    Stats
	// Band, for a band design (SearchBand), describes the band and the
	// inductance window; nil otherwise.
	Band *BandInfo
	// Tap, for a tapped design, is the impedance goal; nil otherwise.
	Tap *TapGoalInfo
}

// Stats describe the work the search did; tests and benchmarks use them.
type Stats struct {
	Pairs       int // support × wire pairs after the wire rules
	Bounded     int // pairs whose bound was computed
	Refined     int // pairs whose pitch-band bounds were computed
	Searched    int // pairs opened (their turns range found)
	Nodes       int // branch-and-bound nodes queued
	Coils       int // solved coils (a pitch found for given turns)
	Evaluations int // model evaluations
	// BoundEvaluations counts the bounds' current-sheet evaluations (a
	// Nagaoka coefficient each, about a third of a model evaluation).
	BoundEvaluations int
}

// InfeasibleError says why no coil meets a valid request. It wraps
// ErrInfeasible.
type InfeasibleError struct {
	// Constraint is the one that binds, in snake_case: "max_length",
	// "max_diameter", "min_srf_ratio", "max_wire_length", "target_too_small",
	// "target_too_large", "wire_rules", "trim_margin", "stock".
	Constraint string
	// Message says what binds and what is nearest, in a builder's words.
	Message string
	// Nearest is the nearest coil's value of the binding quantity, SI:
	// its outside length, outside diameter or wire length (m), its SRF
	// (Hz), or the least inductance the stock reaches (H, target too
	// small). Zero when there is none to give.
	Nearest float64
}

func (e *InfeasibleError) Error() string { return e.Message }
func (e *InfeasibleError) Unwrap() error { return coil.ErrInfeasible }

// Self-supporting and hand-winding wire rules (common practice).
const (
	// SelfSupportMinWire: a coil slid off a mandrel keeps its shape only
	// if the wire is at least 0.6 mm …
	SelfSupportMinWire = 0.6e-3
	// SelfSupportWireRatio: … and at least 1/15 of the mandrel diameter
	// (1 mm on 15 mm, 14 AWG on 25 mm).
	SelfSupportWireRatio = 1.0 / 15
	// HandMinWire: finer wire breaks when wound by hand on a tube.
	HandMinWire = 0.2e-3
	// HandMaxWire: thicker than 6 AWG (4.2 mm) needs a bending jig.
	HandMaxWire = 4.2e-3
	// BendRatio: the support must be at least twice the wire diameter, or
	// the wire will not bend round it evenly.
	BendRatio = 2.0
)

// WireSuits reports whether wire w may be wound on support s under the
// rules above and the constraint bounds, and if not, why.
func WireSuits(s Support, w WireOption, c *Constraints) (bool, string) {
	r := wireRule(s, w, c)
	if r == ruleOK {
		return true, ""
	}
	return false, r.reason(s)
}

// rule is the outcome of the wire rules, without a message (the search
// checks thousands of pairs; the words are made only when needed).
type rule int

const (
	ruleOK rule = iota
	ruleSupportRange
	ruleInsulation
	ruleMinWire
	ruleMaxWire
	ruleHandMin
	ruleHandMax
	ruleBend
	ruleStiffAbs
	ruleStiffRatio
)

func wireRule(s Support, w WireOption, c *Constraints) rule {
	d := float64(w.Diameter)
	df := float64(s.Diameter)
	do := float64(w.Overall)
	switch {
	case df < coil.MinFormerDiameter || df > coil.MaxFormerDiameter:
		return ruleSupportRange
	case do > 2*d+1e-3:
		return ruleInsulation
	case c.MinWire > 0 && d < float64(c.MinWire)*(1-1e-9):
		return ruleMinWire
	case c.MaxWire > 0 && d > float64(c.MaxWire)*(1+1e-9):
		return ruleMaxWire
	case d < HandMinWire:
		return ruleHandMin
	case d > HandMaxWire:
		return ruleHandMax
	case df < BendRatio*d*(1-1e-9):
		return ruleBend
	case !s.OnFormer && d < SelfSupportMinWire*(1-1e-9):
		return ruleStiffAbs
	case !s.OnFormer && d < SelfSupportWireRatio*df*(1-1e-9):
		return ruleStiffRatio
	}
	return ruleOK
}

func (r rule) reason(s Support) string {
	df := float64(s.Diameter)
	switch r {
	case ruleSupportRange:
		return fmt.Sprintf("supports outside %s … %s are outside the model", quantity.FormatMillimetres(coil.MinFormerDiameter), quantity.FormatMillimetres(coil.MaxFormerDiameter))
	case ruleInsulation:
		return "insulation too thick for the model"
	case ruleMinWire:
		return "thinner than the minimum wire"
	case ruleMaxWire:
		return "thicker than the maximum wire"
	case ruleHandMin:
		return fmt.Sprintf("finer than %s breaks when wound by hand", quantity.FormatMillimetres(HandMinWire))
	case ruleHandMax:
		return fmt.Sprintf("thicker than %s needs a bending jig", quantity.FormatMillimetres(HandMaxWire))
	case ruleBend:
		return "the support is less than twice the wire diameter"
	case ruleStiffAbs:
		return fmt.Sprintf("a self-supporting coil needs wire of at least %s", quantity.FormatMillimetres(SelfSupportMinWire))
	case ruleStiffRatio:
		return fmt.Sprintf("a self-supporting coil on %s needs wire of at least %s (1/15 of the diameter)", quantity.FormatMillimetres(df), quantity.FormatMillimetres(SelfSupportWireRatio*df))
	}
	return ""
}

// settings are the resolved defaults of a search.
type settings struct {
	t         Target
	c         Constraints
	required  float64 // H
	effective bool    // match the effective L at matchF
	matchF    float64 // frequency the matched value is evaluated at
	opF       float64 // operating frequency (Q, SRF)
	tol       float64
	margin    float64
	srfRatio  float64
	minTurns  float64
	top       int
}

func resolve(t Target, c Constraints) (settings, error) {
	s := settings{t: t, c: c}
	bad := func(v float64) bool { return !coil.Finite(v) || v < 0 }
	switch {
	case bad(float64(t.Inductance)), bad(float64(t.Resonance)), bad(float64(t.Capacitance)),
		bad(float64(t.Stray)), bad(float64(t.Frequency)), bad(t.Tolerance):
		return s, coil.InputErrorf("target", "inductance, resonance, capacitance, stray, frequency and tolerance must be finite and not negative")
	case t.Inductance > 0 && (t.Resonance > 0 || t.Capacitance > 0):
		return s, coil.InputErrorf("inductance", "give an inductance, or a resonance with a capacitance, not both")
	case t.Inductance == 0 && (t.Resonance == 0 || t.Capacitance == 0):
		if t.Capacitance > 0 {
			return s, coil.InputErrorf("resonance", "a capacitance needs the frequency it must resonate at")
		}
		if t.Resonance > 0 {
			return s, coil.InputErrorf("capacitance", "a resonance needs the capacitance it resonates with")
		}
		return s, coil.InputErrorf("inductance", "give the inductance wanted, or a resonance with a capacitance")
	case t.Frequency > coil.MaxFrequency || t.Resonance > coil.MaxFrequency:
		return s, coil.InputErrorf("frequency", "must be at most 10 GHz")
	case t.Tolerance > 0.5:
		return s, coil.InputErrorf("tolerance", "%.3g %% is too loose; use at most 50 %%", t.Tolerance*100)
	case t.Tolerance > 0 && t.Tolerance < MinTolerance:
		return s, coil.InputErrorf("tolerance", "%.3g %% is tighter than any coil can be wound or measured; use at least %g %%", t.Tolerance*100, MinTolerance*100)
	}
	s.tol = t.Tolerance
	if s.tol == 0 {
		s.tol = DefaultTolerance
	}
	if t.Inductance > 0 {
		s.required = float64(t.Inductance)
		s.matchF = float64(t.Frequency)
		s.opF = float64(t.Frequency)
		if !(s.required >= 1e-12 && s.required <= 1) {
			return s, coil.InputErrorf("inductance", "%.3g H is outside 1 pH … 1 H", s.required)
		}
	} else {
		s.effective = true
		s.matchF = float64(t.Resonance)
		s.opF = float64(t.Frequency)
		if s.opF == 0 {
			s.opF = s.matchF
		}
		s.required = float64(coil.InductanceForResonance(t.Resonance, t.Capacitance+t.Stray))
		if !(s.required >= 1e-12 && s.required <= 1) {
			if alone := float64(coil.InductanceForResonance(t.Resonance, t.Capacitance)); t.Stray != 0 && alone >= 1e-12 && alone <= 1 {
				return s, coil.InputErrorf("stray", "%s of stray capacitance makes resonating at %s need %.3g H, outside 1 pH … 1 H; give the wiring's few pF, e.g. 2pF",
					quantity.FormatCapacitance(float64(t.Stray)), quantity.FormatFrequency(s.matchF), s.required)
			}
			return s, coil.InputErrorf("capacitance", "resonating at %s needs %.3g H, outside 1 pH … 1 H", quantity.FormatFrequency(s.matchF), s.required)
		}
	}
	bl := func(v unit.Length) bool { return !coil.Finite(float64(v)) || v < 0 }
	switch {
	case bl(c.LeadLength) || float64(c.LeadLength) > coil.MaxLeadLength:
		return s, coil.InputErrorf("lead_length", "must be between 0 and 1 m, e.g. 5mm")
	case bl(c.MaxLength):
		return s, coil.InputErrorf("max_length", "must be a positive length, e.g. 15mm (zero means no limit)")
	case bl(c.MaxDiameter):
		return s, coil.InputErrorf("max_diameter", "must be a positive length, e.g. 20mm (zero means no limit)")
	case bl(c.MaxWireLength):
		return s, coil.InputErrorf("max_wire_length", "must be a positive length, e.g. 1m (zero means no limit)")
	case bl(c.MinWire):
		return s, coil.InputErrorf("min_wire", "must be a positive length, e.g. 0.5mm (zero means no limit)")
	case bl(c.MaxWire):
		return s, coil.InputErrorf("max_wire", "must be a positive length, e.g. 2mm (zero means no limit)")
	case c.MinWire > 0 && c.MaxWire > 0 && c.MinWire > c.MaxWire:
		return s, coil.InputErrorf("min_wire", "%s is more than the maximum wire %s", quantity.FormatMillimetres(float64(c.MinWire)), quantity.FormatMillimetres(float64(c.MaxWire)))
	case !coil.Finite(c.MinSRFRatio) || c.MinSRFRatio < 0 || (c.MinSRFRatio > 0 && c.MinSRFRatio < 1.2) || c.MinSRFRatio > 100:
		return s, coil.InputErrorf("min_srf_ratio", "%g is outside 1.2 … 100 (the model needs the SRF well above f; 3 is common practice)", c.MinSRFRatio)
	case !coil.Finite(c.TrimMargin) || c.TrimMargin < 0 || c.TrimMargin > 0.3:
		return s, coil.InputErrorf("trim_margin", "%.3g %% is outside 0 … 30 %%", c.TrimMargin*100)
	case !coil.Finite(c.MinTurns) || c.MinTurns < 0 || (c.MinTurns > 0 && c.MinTurns < 2) || c.MinTurns > coil.MaxTurns:
		return s, coil.InputErrorf("min_turns", "%g is outside 2 … %d: fewer than two turns cannot be trimmed by squeezing or spreading", c.MinTurns, coil.MaxTurns)
	case !coil.Finite(c.MinQ) || c.MinQ < 0 || c.MinQ > 1e5:
		return s, coil.InputErrorf("min_q", "%g is outside 0 … 100000", c.MinQ)
	case c.MinQ > 0 && s.opF == 0:
		return s, coil.InputErrorf("min_q", "a Q floor needs the frequency it holds at; give the operating frequency")
	case c.Top < 0 || c.Top > MaxTop:
		return s, coil.InputErrorf("top", "%d is outside 1 … %d", c.Top, MaxTop)
	case c.Prefer < PreferBalanced || c.Prefer > PreferEasy:
		return s, coil.InputErrorf("prefer", "unknown preference %d", int(c.Prefer))
	case len(c.Wires) == 0:
		return s, coil.InputErrorf("wires", "no wire to choose from; add wire to the stock")
	case len(c.Supports) == 0 && c.FreeDiameter == nil:
		return s, coil.InputErrorf("supports", "no mandrel or former to choose from; add one to the stock or allow a free diameter")
	}
	if c.Temperature != 0 {
		k := float64(c.Temperature) - 273.15
		if !coil.Finite(k) || k < coil.MinTemperatureC || k > coil.MaxTemperatureC {
			return s, coil.InputErrorf("temperature", "%.4g °C is outside %g … %g °C", k, coil.MinTemperatureC, coil.MaxTemperatureC)
		}
	}
	if fd := c.FreeDiameter; fd != nil {
		if bl(fd.Min) || bl(fd.Max) || (fd.Max > 0 && fd.Min > fd.Max) {
			return s, coil.InputErrorf("free_diameter", "the range %s … %s is not a range", quantity.FormatMillimetres(float64(fd.Min)), quantity.FormatMillimetres(float64(fd.Max)))
		}
	}
	for _, sp := range c.Supports {
		if !coil.Finite(float64(sp.Diameter)) || sp.Diameter <= 0 {
			return s, coil.InputErrorf("supports", "%q: diameter %s is not a diameter", sp.Name, quantity.FormatMillimetres(float64(sp.Diameter)))
		}
		if !coil.Finite(sp.Springback) || sp.Springback < coil.MinSpringback || sp.Springback > coil.MaxSpringback {
			return s, coil.InputErrorf("springback", "%q: %.3g %% is outside %g … %g %%", sp.Name, sp.Springback*100, coil.MinSpringback*100, coil.MaxSpringback*100)
		}
	}
	for _, w := range c.Wires {
		d, do := float64(w.Diameter), float64(w.Overall)
		if !coil.Finite(d) || d <= 0 || !coil.Finite(do) || (do != 0 && do < d) {
			return s, coil.InputErrorf("wires", "%q: diameters %s over %s are not a wire", w.Name, quantity.FormatMillimetres(d), quantity.FormatMillimetres(do))
		}
		if w.Conductor < coil.Copper || w.Conductor > coil.Tinned {
			return s, coil.InputErrorf("wires", "%q: unknown conductor", w.Name)
		}
	}
	for _, cal := range c.Calibrations {
		if !coil.Finite(cal.Springback) || cal.Springback < coil.MinSpringback || cal.Springback > coil.MaxSpringback {
			return s, coil.InputErrorf("springback", "calibration %q on %q: %.3g %% is outside %g … %g %%", cal.Wire, cal.Support, cal.Springback*100, coil.MinSpringback*100, coil.MaxSpringback*100)
		}
	}
	s.margin = c.TrimMargin
	if s.margin == 0 {
		s.margin = DefaultTrimMargin
	}
	s.srfRatio = c.MinSRFRatio
	if s.srfRatio == 0 {
		s.srfRatio = DefaultSRFRatio
	}
	s.minTurns = c.MinTurns
	if s.minTurns == 0 {
		s.minTurns = DefaultMinTurns
	}
	s.minTurns = math.Ceil(s.minTurns*4-1e-9) / 4
	s.top = c.Top
	if s.top == 0 {
		s.top = DefaultTop
	}
	return s, nil
}

// Design searches the stock for coils that meet t under c and returns
// them ranked. Bad input is an *coil.InputError; a valid request that no coil
// meets is an *InfeasibleError (wrapping coil.ErrInfeasible) that says which
// constraint binds and what is nearest.
//
// For every support and suitable wire (WireSuits) the search finds the
// turns, in quarter turns, whose squeeze/spread window holds the target
// with the trim margin, solves the pitch that hits the target exactly for
// each, and scores the coil (see score). A bound on the score of each pair
// and each turn count lets it skip those that can enter neither the top
// list nor the Pareto set, so its cost grows no faster than the stock.
func Search(t Target, c Constraints) (Result, error) {
	s, err := resolve(t, c)
	if err != nil {
		return Result{}, err
	}
	return runSearch(&s)
}
