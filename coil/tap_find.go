package coil

import (
	"fmt"
	"math"
	"sort"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// TapGoal says what a tap is chosen for.
type TapGoal int

const (
	// GoalVoltageRatio: the unloaded voltage at the tap as a fraction of
	// the voltage across the coil, (L_b + M)/L, between 0 and 1.
	GoalVoltageRatio TapGoal = iota
	// GoalImpedanceRatio: the impedance at the tap as a fraction of the
	// impedance across the tuned coil, taken as the voltage ratio squared
	// (see Sections.ImpedanceRatio for when that holds).
	GoalImpedanceRatio
	// GoalBottomInductance: the inductance of the section below the tap,
	// L_b, in henries.
	GoalBottomInductance
)

func (g TapGoal) String() string {
	switch g {
	case GoalImpedanceRatio:
		return "impedance ratio"
	case GoalBottomInductance:
		return "bottom-section inductance"
	}
	return "voltage ratio"
}

// Value returns the quantity the goal is about for sections s.
func (g TapGoal) Value(s Sections) float64 {
	switch g {
	case GoalImpedanceRatio:
		return s.ImpedanceRatio()
	case GoalBottomInductance:
		return float64(s.LB)
	}
	return s.Ratio
}

// TapChoice is one quarter-turn tap and how close it comes to a goal.
type TapChoice struct {
	Sections
	Achieved float64 // the goal's quantity at this tap (ratio, or henries)
	Error    float64 // (Achieved − target)/target
}

// FindTap returns the quarter-turn taps of g nearest to target for goal,
// at frequency f: the tap just below and the tap just above the target
// (one of them when the target is at or beyond an end), nearest first.
// Every quarter-turn tap on the winding (not the terminals) is evaluated,
// so the answer does not rely on the goal rising monotonically with the
// tap. A bottom-section inductance at or above the whole coil's is an
// error wrapping ErrInfeasible that names the nearest tap (the choices
// are returned with it). A ratio beyond every tap on the winding is not an
// error: the one choice returned is the end tap, and its Error says how
// far it misses.
func FindTap(g Geometry, f unit.Frequency, goal TapGoal, target float64) ([]TapChoice, error) {
	if err := g.Validate(); err != nil {
		return nil, err
	}
	if !finite(float64(f)) || f < 0 || f > MaxFrequency {
		return nil, inputErrorf("frequency", "must be between 0 and 10 GHz, e.g. 7MHz")
	}
	switch goal {
	case GoalVoltageRatio, GoalImpedanceRatio:
		if !finite(target) || target <= 0 || target >= 1 {
			return nil, inputErrorf("target", "a %s must be between 0 and 1 (exclusive), e.g. 0.2 or 1:5", goal)
		}
	case GoalBottomInductance:
		if !finite(target) || target <= 0 {
			return nil, inputErrorf("target", "the bottom-section inductance must be positive, e.g. 0.5uH")
		}
	default:
		return nil, inputErrorf("target", "unknown tap goal %d", int(goal))
	}
	if g.Turns < 0.5 {
		return nil, inputErrorf("turns", "a coil needs at least half a turn to take a tap")
	}
	steps := int(math.Round(g.Turns * 4))
	all := make([]TapChoice, 0, steps-1)
	for i := 1; i < steps; i++ {
		s := sections(&g, float64(i)/4, float64(f))
		v := goal.Value(s)
		all = append(all, TapChoice{Sections: s, Achieved: v, Error: (v - target) / target})
	}
	if len(all) == 0 {
		return nil, inputErrorf("turns", "a coil of %g turns has no quarter-turn tap on its winding", g.Turns)
	}
	// Nearest below and nearest above the target.
	below, above := -1, -1
	for i, c := range all {
		switch {
		case c.Achieved <= target && (below < 0 || c.Achieved > all[below].Achieved):
			below = i
		case c.Achieved > target && (above < 0 || c.Achieved < all[above].Achieved):
			above = i
		}
	}
	var out []TapChoice
	for _, i := range []int{below, above} {
		if i >= 0 {
			out = append(out, all[i])
		}
	}
	sort.SliceStable(out, func(i, j int) bool { return math.Abs(out[i].Error) < math.Abs(out[j].Error) })
	if goal == GoalBottomInductance && target >= float64(all[0].L) {
		best := out[0]
		return out, fmt.Errorf("%w: a bottom section of %s needs more than the whole coil's %s; the nearest tap, %g turns from the cold end, gives %s",
			ErrInfeasible, goalString(goal, target), goalString(goal, float64(best.L)), best.TapTurns, goalString(goal, best.Achieved))
	}
	return out, nil
}

func goalString(g TapGoal, v float64) string {
	if g == GoalBottomInductance {
		return quantity.FormatInductance(v)
	}
	return fmt.Sprintf("%.4g", v)
}
