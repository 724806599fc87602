package coil

import (
	"fmt"
	"math"
	"sort"

	"gonum.org/v1/gonum/unit"
)

// How a tap loads a tank, and how to reach a loaded Q.
//
// The rule (F. E. Terman, Radio Engineers' Handbook, McGraw-Hill, 1943,
// sec. 3, from memory): a resistance R_s connected at a tap whose
// unloaded voltage ratio is n (the tap's voltage over the whole coil's)
// loads the tank as R_s/n² across the whole coil. With the tank's own
// parallel resistance R_p = Q_u·X (X = ωL_eff, Q_u the unloaded Q),
//
//	R = R_p ∥ R_s/n²,   Q_L = R/X,   bandwidth = f/Q_L
//
// so a wanted Q_L needs R_s/n² = 1/(1/(Q_L·X) − 1/R_p), i.e. an
// impedance ratio n² = R_s·(1/(Q_L·X) − 1/R_p). Matched (as much power
// into the tank as the source gives) is R_s/n² = R_p: Q_L = Q_u/2.
//
// A quarter-turn tap is accepted when its impedance ratio n² is within
// TapRatioTolerance of the wanted one (±10 %: the loaded Q then moves by
// at most about 5 %, inside what the tank's trimmer and the builder's
// measurement settle; common practice). When no tap is, two alternatives
// are given: a link winding over the cold end (see LinkOver; the source R_s
// in the link reflects (ωM)²·R_s/(R_s² + (ωL_link)²) in series with the
// coil) and a capacitive divider (the tank capacitance C split into C_1
// from the top to the tap node and C_2 from there to ground, the source
// across C_2: n = C_1/(C_1+C_2), so C_1 = C/(1−n), C_2 = C/n; it holds
// while ωC_2·R_s ≫ 1, checked).

// TapRatioTolerance is how far the impedance ratio of a quarter-turn tap
// may be from the wanted one: ±10 %.
const TapRatioTolerance = 0.10

// LoadedQ is the loaded Q of a tank of reactance x and parallel
// resistance rp with a resistance rs at a tap of voltage ratio n.
func LoadedQ(x, rp, rs, n float64) float64 {
	rl := rs / (n * n)
	return rp * rl / (rp + rl) / x
}

// LoadGoal is what a tap (or link) must do.
type LoadGoal struct {
	Frequency unit.Frequency
	// Source is the resistance connected at the tap (a 50 Ω antenna or
	// transmitter, an amplifier's input).
	Source unit.Resistance
	// TankImpedance is the tank's own parallel resistance at resonance;
	// zero: Q_u·ωL_eff with TankQ or the coil model's Q.
	TankImpedance unit.Resistance
	// TankQ is the unloaded Q; zero: the coil model's Q at Frequency
	// (ignored when TankImpedance is given).
	TankQ float64
	// LoadedQ is the loaded Q wanted; zero: matched, Q_u/2.
	LoadedQ float64
	// LinkWire is the overall diameter of the link wire; zero: 1.2 mm
	// (insulated hook-up wire, common practice).
	LinkWire unit.Length
}

// LoadChoice is one quarter-turn tap and what it gives.
type LoadChoice struct {
	TapChoice
	LoadedQ   float64
	Bandwidth unit.Frequency
}

// LinkChoice is a link winding and what it gives.
type LinkChoice struct {
	Link
	// Reflected is the series resistance the loaded link puts into the
	// coil; LoadedQ and Bandwidth what results.
	Reflected unit.Resistance
	LoadedQ   float64
	Bandwidth unit.Frequency
	// SeriesCap, when the link's reactance is more than a fifth of the
	// source resistance, is the capacitor in series with the link that
	// tunes it out at the frequency (zero otherwise).
	SeriesCap unit.Capacitance
}

// Divider is a capacitive tap.
type Divider struct {
	Tank   unit.Capacitance // the whole tank capacitance it replaces
	C1, C2 unit.Capacitance // top to tap node, tap node to ground
	Ratio  float64          // n = C1/(C1+C2)
	// QC2 is ω·C2·R_s; the rule needs it well above 1 (5 or more).
	QC2 float64
}

// NewDivider splits a tank capacitance into a capacitive tap with the
// voltage ratio √impedanceRatio: C1 = C/(1−n) from the top to the tap node
// and C2 = C/n from the tap node to ground, in series C again. QC2 is left
// for the caller, who knows the source.
func NewDivider(tank unit.Capacitance, impedanceRatio float64) Divider {
	n := math.Sqrt(impedanceRatio)
	return Divider{Tank: tank, C1: tank / unit.Capacitance(1-n), C2: tank / unit.Capacitance(n), Ratio: n}
}

// LoadPlan is TapForLoad's answer.
type LoadPlan struct {
	Frequency   unit.Frequency
	X           unit.Resistance // ωL_eff
	TankQ       float64         // unloaded
	TankR       unit.Resistance // R_p
	WantLoadedQ float64
	// WantRatio is the impedance ratio n² the rule asks for.
	WantRatio float64
	// Taps are the nearest quarter-turn taps, nearest first.
	Taps []LoadChoice
	// Within is true when Taps[0] is within TapRatioTolerance.
	Within bool
	// Link and Divider are the alternatives (always computed).
	Link    *LinkChoice
	Divider *Divider
}

// TapForLoad finds where to connect goal.Source on g for the loaded Q
// wanted, by the rule above, and the link and divider alternatives.
func TapForLoad(g Geometry, goal LoadGoal) (LoadPlan, error) {
	f := float64(goal.Frequency)
	rs := float64(goal.Source)
	switch {
	case !finite(f) || f <= 0 || f > MaxFrequency:
		return LoadPlan{}, inputErrorf("frequency", "the tank's frequency is needed, e.g. 7.1MHz")
	case !finite(rs) || rs <= 0 || rs > 1e6:
		return LoadPlan{}, inputErrorf("source", "give the resistance at the tap, e.g. 50ohm")
	case !finite(float64(goal.TankImpedance)) || goal.TankImpedance < 0:
		return LoadPlan{}, inputErrorf("tank_impedance", "must be positive, e.g. 20kohm")
	case !finite(goal.TankQ) || goal.TankQ < 0 || goal.TankQ > 1e5:
		return LoadPlan{}, inputErrorf("tank_q", "must be between 1 and 100000")
	case !finite(goal.LoadedQ) || goal.LoadedQ < 0 || goal.LoadedQ > 1e5:
		return LoadPlan{}, inputErrorf("loaded_q", "must be between 1 and 100000")
	}
	p, err := Predict(g, goal.Frequency)
	if err != nil {
		return LoadPlan{}, err
	}
	w := 2 * math.Pi * f
	x := w * float64(p.InductanceEffective)
	plan := LoadPlan{Frequency: goal.Frequency, X: unit.Resistance(x)}
	switch {
	case goal.TankImpedance > 0:
		plan.TankR = goal.TankImpedance
		plan.TankQ = float64(goal.TankImpedance) / x
	case goal.TankQ > 0:
		plan.TankQ = goal.TankQ
		plan.TankR = unit.Resistance(goal.TankQ * x)
	default:
		plan.TankQ = p.Q
		plan.TankR = unit.Resistance(p.Q * x)
	}
	rp := float64(plan.TankR)
	plan.WantLoadedQ = goal.LoadedQ
	if plan.WantLoadedQ == 0 {
		plan.WantLoadedQ = plan.TankQ / 2
	}
	if plan.WantLoadedQ >= plan.TankQ {
		return plan, inputErrorf("loaded_q", "%.4g is not below the tank's unloaded Q %.4g: a load can only lower Q", plan.WantLoadedQ, plan.TankQ)
	}
	plan.WantRatio = rs * (1/(plan.WantLoadedQ*x) - 1/rp)
	choice := func(tc TapChoice) LoadChoice {
		ql := LoadedQ(x, rp, rs, tc.Ratio)
		return LoadChoice{TapChoice: tc, LoadedQ: ql, Bandwidth: unit.Frequency(f / ql)}
	}
	if plan.WantRatio < 1 {
		tcs, err := FindTap(g, goal.Frequency, GoalImpedanceRatio, plan.WantRatio)
		if err != nil && len(tcs) == 0 {
			return plan, err
		}
		for _, tc := range tcs {
			plan.Taps = append(plan.Taps, choice(tc))
		}
		sort.SliceStable(plan.Taps, func(i, j int) bool { return math.Abs(plan.Taps[i].Error) < math.Abs(plan.Taps[j].Error) })
		plan.Within = len(plan.Taps) > 0 && math.Abs(plan.Taps[0].Error) <= TapRatioTolerance
	}
	// The link: the whole number of turns whose loaded Q is nearest
	// (in ratio) to the wanted one.
	wire := goal.LinkWire
	if wire == 0 {
		wire = 1.2e-3
	}
	maxLink := math.Min(math.Max(1, math.Floor(g.Turns)), 12)
	linkAt := func(n float64, off unit.Length) (LinkChoice, error) {
		l, err := LinkOverAt(g, n, wire, off)
		if err != nil {
			return LinkChoice{}, err
		}
		wm, xl := w*float64(l.M), w*float64(l.L)
		rr := wm * wm * rs / (rs*rs + xl*xl)
		ql := x / (x/plan.TankQ + rr)
		lc := LinkChoice{Link: l, Reflected: unit.Resistance(rr), LoadedQ: ql, Bandwidth: unit.Frequency(f / ql)}
		if xl > rs/5 {
			lc.SeriesCap = unit.Capacitance(1 / (w * xl))
		}
		return lc, nil
	}
	for n := 1.0; n <= maxLink; n++ {
		lc, err := linkAt(n, 0)
		if err != nil {
			return plan, err
		}
		ql := lc.LoadedQ
		if plan.Link == nil || math.Abs(math.Log(ql/plan.WantLoadedQ)) < math.Abs(math.Log(plan.Link.LoadedQ/plan.WantLoadedQ)) {
			c := lc
			plan.Link = &c
		}
	}
	// One turn directly over the cold end still loads too heavily: move
	// it along the axis, away from the coil, until the loaded Q is the
	// one wanted (bisection on the offset; coupling falls monotonically).
	if l := plan.Link; l != nil && l.Turns == 1 && l.LoadedQ < plan.WantLoadedQ/(1+TapRatioTolerance/2) {
		lo, hi := 0.0, 4*float64(g.FormerDiameter)+float64(g.Pitch)*g.Turns
		for range 50 {
			mid := (lo + hi) / 2
			lc, err := linkAt(1, unit.Length(mid))
			if err != nil {
				return plan, err
			}
			if lc.LoadedQ < plan.WantLoadedQ {
				lo = mid
			} else {
				hi = mid
			}
		}
		if lc, err := linkAt(1, unit.Length(hi)); err == nil {
			plan.Link = &lc
		}
	}
	// The divider: the tank capacitance that resonates L_eff at f.
	if plan.WantRatio < 1 {
		d := NewDivider(unit.Capacitance(1/(w*x)), plan.WantRatio)
		d.QC2 = w * float64(d.C2) * rs
		plan.Divider = &d
	}
	return plan, nil
}

// Advice words the alternatives when no tap is within the tolerance.
func (p LoadPlan) Advice() []string {
	var out []string
	if p.WantRatio >= 1 {
		out = append(out, fmt.Sprintf("the source, %.4g× the tank's impedance at the loaded Q wanted, needs no step-down: connect it across the whole coil or use a link", p.WantRatio))
	}
	if !p.Within && len(p.Taps) > 0 {
		out = append(out, fmt.Sprintf("no quarter-turn tap is within ±%.0f %% of the impedance ratio %.4g (the nearest misses by %+.0f %%)", TapRatioTolerance*100, p.WantRatio, p.Taps[0].Error*100))
	}
	return out
}
