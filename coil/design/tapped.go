package design

import (
	"math"
	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// Tapped designs: every candidate of a search gets its tap for an
// impedance ratio, or for a source resistance and a loaded Q by the rule
// in coil/loading.go (a tap of voltage ratio n loads the tank with
// R_s/n²), with a link winding and a capacitive divider as alternatives
// when no quarter-turn tap is within coil.TapRatioTolerance.

// TapGoalInfo is what the tap of a tapped design is for: an impedance
// ratio (Ratio), or a load (Load) whose ratio follows from the tank.
type TapGoalInfo struct {
	Ratio float64
	Load  *coil.LoadGoal
}

// TapFit is a candidate's tap: Plan.Taps nearest first, Plan.Within
// when the nearest is within the tolerance, and the alternatives.
type TapFit struct {
	Plan coil.LoadPlan
}

// AddTaps works out the tap of every candidate (and Pareto point) of r
// for goal at frequency f.
func AddTaps(r Result, goal TapGoalInfo, f unit.Frequency) (Result, error) {
	switch {
	case goal.Load == nil && !(goal.Ratio > 0 && goal.Ratio < 1):
		return r, coil.InputErrorf("tap_ratio", "give an impedance ratio between 0 and 1, e.g. 1:50, or the impedance at the tap")
	case !(f > 0):
		return r, coil.InputErrorf("frequency", "a tapped design needs the operating frequency")
	}
	r.Tap = &goal
	fit := func(c *Candidate) error {
		g := c.Prediction.Geometry
		if goal.Load != nil {
			l := *goal.Load
			l.Frequency = f
			p, err := coil.TapForLoad(g, l)
			if err != nil {
				return err
			}
			c.Tapped = &TapFit{Plan: p}
			return nil
		}
		tcs, err := coil.FindTap(g, f, coil.GoalImpedanceRatio, goal.Ratio)
		if err != nil && len(tcs) == 0 {
			return err
		}
		p := coil.LoadPlan{Frequency: f, WantRatio: goal.Ratio}
		for _, tc := range tcs {
			p.Taps = append(p.Taps, coil.LoadChoice{TapChoice: tc})
		}
		p.Within = len(p.Taps) > 0 && math.Abs(p.Taps[0].Error) <= coil.TapRatioTolerance
		if pr, err := coil.Predict(g, f); err == nil {
			w := 2 * math.Pi * float64(f)
			d := coil.NewDivider(unit.Capacitance(1/(w*w*float64(pr.InductanceEffective))), goal.Ratio)
			p.Divider = &d
		}
		c.Tapped = &TapFit{Plan: p}
		return nil
	}
	for i := range r.Candidates {
		if err := fit(&r.Candidates[i]); err != nil {
			return r, err
		}
	}
	for i := range r.Pareto {
		if err := fit(&r.Pareto[i]); err != nil {
			return r, err
		}
	}
	return r, nil
}
