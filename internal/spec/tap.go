package spec

import (
	"errors"
	"fmt"
	"math"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Tap plans: which tap a goal asks for (a voltage ratio, an impedance
// ratio, a bottom inductance, or a tap at given turns), and what to use
// when no quarter-turn tap meets an impedance ratio.

// TapGoalInput is the one goal of `turnwise tap`: the set field and its
// value.
type TapGoalInput struct {
	Ratio, ImpedanceRatio  float64
	BottomL                unit.Inductance
	At                     float64 // turns from the cold end
	RatioSet, ImpedanceSet bool
	BottomLSet, AtSet      bool
}

// TapPlan is the tap (or taps) a goal gives.
type TapPlan struct {
	Goal    coil.TapGoal
	GoalKey string // the JSON goal: at, voltage_ratio, impedance_ratio, bottom_inductance
	Target  float64
	Choices []coil.TapChoice
	// Found is nil when a tap meets the goal; else why not (Choices then
	// holds the nearest).
	Found error
	// Advice says what to use when no tap meets an impedance ratio.
	Advice []string
}

// PlanTap finds the tap for a goal on the coil g at f. Errors name the
// flag (--at, --freq, or the goal's).
func PlanTap(g coil.Geometry, f unit.Frequency, in TapGoalInput) (TapPlan, error) {
	pl := TapPlan{GoalKey: "at"}
	goalFlag := "at"
	switch {
	case in.RatioSet:
		pl.Goal, pl.Target, pl.GoalKey, goalFlag = coil.GoalVoltageRatio, in.Ratio, "voltage_ratio", "ratio"
	case in.ImpedanceSet:
		pl.Goal, pl.Target, pl.GoalKey, goalFlag = coil.GoalImpedanceRatio, in.ImpedanceRatio, "impedance_ratio", "impedance-ratio"
	case in.BottomLSet:
		pl.Goal, pl.Target, pl.GoalKey, goalFlag = coil.GoalBottomInductance, float64(in.BottomL), "bottom_inductance", "bottom-l"
	}
	if in.AtSet {
		s, err := coil.Tap(g, in.At, f)
		if err != nil {
			return pl, tapFlagError(err, goalFlag)
		}
		pl.Target = in.At
		pl.Choices = []coil.TapChoice{{Sections: s}}
		return pl, nil
	}
	pl.Choices, pl.Found = coil.FindTap(g, f, pl.Goal, pl.Target)
	if pl.Found != nil && len(pl.Choices) == 0 {
		return pl, tapFlagError(pl.Found, goalFlag)
	}
	if pl.Goal == coil.GoalImpedanceRatio && len(pl.Choices) > 0 && math.Abs(pl.Choices[0].Error) > coil.TapRatioTolerance {
		pl.Advice = append(pl.Advice, ratioMissAdvice(g, f, pl.Target, pl.Choices[0].Error))
	}
	return pl, nil
}

// TapLoadError names the flag of a coil.TapForLoad refusal.
func TapLoadError(err error) error {
	err, _ = withFlag(err, map[string]string{"loaded_q": "loaded-q", "tank_q": "tank-q", "tank_impedance": "tank-impedance", "frequency": "freq", "source": "source"})
	return err
}

// ratioMissAdvice says what to use when no quarter-turn tap is within
// ±10 % of an impedance ratio: a capacitive divider (with the values, at
// a frequency) or a link winding (sized by --source).
func ratioMissAdvice(g coil.Geometry, f unit.Frequency, ratio, miss float64) string {
	msg := fmt.Sprintf("no quarter-turn tap is within ±%.0f %% of the impedance ratio %.4g (the nearest misses by %+.0f %%): use a link winding over the cold end (run with --source 50ohm and --freq to size it) or a capacitive divider",
		coil.TapRatioTolerance*100, ratio, miss*100)
	if f > 0 {
		if p, err := coil.Predict(g, f); err == nil && p.InductanceEffective > 0 {
			w := 2 * math.Pi * float64(f)
			d := coil.NewDivider(unit.Capacitance(1/(w*w*float64(p.InductanceEffective))), ratio)
			msg += fmt.Sprintf(": the tank's %s as %s (top to tap node) in series with %s (tap node to ground)",
				quantity.FormatCapacitance(float64(d.Tank)), quantity.FormatCapacitance(float64(d.C1)), quantity.FormatCapacitance(float64(d.C2)))
		}
	}
	return msg
}

// tapFlagError names the flag of a tap error; goalFlag is the flag that
// gave the target.
func tapFlagError(err error, goalFlag string) error {
	var ie *coil.InputError
	if !errors.As(err, &ie) {
		return err
	}
	switch ie.Param {
	case "tap_turns":
		return &FlagError{Flag: "at", Err: err}
	case "frequency":
		return &FlagError{Flag: "freq", Err: err}
	case "target":
		return &FlagError{Flag: goalFlag, Err: err}
	}
	return err
}

// CheckTapLoad checks the tank flags of a tap for a load: the frequency
// is needed, the tank's Q and impedance exclude each other, and each Q is
// 0 (not given) to 100000.
func CheckTapLoad(freqSet bool, tankQ float64, tankRSet bool, loadedQ float64) error {
	switch {
	case !freqSet:
		return Usagef("a tap for a load needs the tank's frequency: add --freq, e.g. --freq 7.1MHz")
	case tankQ != 0 && tankRSet:
		return Usagef("give the tank's --tank-q or its --tank-impedance, not both")
	}
	for _, q := range []struct {
		name string
		v    float64
	}{{"tank-q", tankQ}, {"loaded-q", loadedQ}} {
		if math.IsNaN(q.v) || math.IsInf(q.v, 0) || q.v < 0 || q.v > 1e5 {
			return Usagef("--%s %g: give a Q from 1 to 100000, e.g. 100", q.name, q.v)
		}
	}
	return nil
}
