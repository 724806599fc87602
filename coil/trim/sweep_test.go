package trim

import (
	"errors"
	"math"
	"testing"

	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// A sweep reading of a coil that sprang back more than assumed: Plan
// calibrates on it, and the correction, applied to the coil as really
// built, lands on the target (re-predicted by the model, not by Plan).
func TestPlanSweepLandsOnTarget(t *testing.T) {
	t.Parallel()
	spec := vhfExample()
	built := spec
	built.Springback = 0.06 // the coil as wound (invented)
	const f = 137.5e6
	truth, err := coil.Predict(built, f)
	if err != nil {
		t.Fatal(err)
	}
	target := unit.Inductance(0.97 * float64(truth.Inductance))
	res, err := Plan(Request{
		Geometry:  spec,
		Frequency: f,
		Measurement: Measurement{Kind: MeasureSweep, Sweep: SweepFit{
			Inductance: truth.Inductance, Uncertainty: 0.002, Frequency: f,
			Capacitance: truth.SelfCapacitance, CapacitanceUncertainty: 0.05e-12,
		}},
		Aim:         Aim{Source: TargetGiven, Inductance: target},
		Tolerance:   0.01,
		LengthSteps: LengthSteps(false),
	})
	if err != nil {
		t.Fatal(err)
	}
	if relErr(res.Calibration.Springback, 0.06) > 1e-3 {
		t.Errorf("fitted springback %g, want 0.06", res.Calibration.Springback)
	}
	after := res.Correction.Geometry
	after.Springback = built.Springback
	p, err := coil.Predict(after, f)
	if err != nil {
		t.Fatal(err)
	}
	if miss := relErr(float64(p.Inductance), float64(target)); miss > 0.01 {
		t.Errorf("corrected coil re-predicted %.4g H, target %.4g H: %.2g %% off", float64(p.Inductance), float64(target), miss*100)
	}
	if res.Calibration.MeasuredSelfCapacitance != truth.SelfCapacitance {
		t.Errorf("measured self-capacitance %g, want the fit's %g", res.Calibration.MeasuredSelfCapacitance, truth.SelfCapacitance)
	}
	if res.Next.Inductance <= 0 {
		t.Error("no expected next reading")
	}
}

func TestReduceSweepRefuses(t *testing.T) {
	t.Parallel()
	for _, s := range []SweepFit{
		{Inductance: 0, Frequency: 1e6},
		{Inductance: 50e-9, Frequency: -1},
		{Inductance: 50e-9, Frequency: 1e6, Uncertainty: 0.9},
		{Inductance: 50e-9, Frequency: 1e6, Uncertainty: math.NaN()},
		{Inductance: 50e-9, Frequency: 1e6, Capacitance: -1e-12},
	} {
		_, err := Measurement{Kind: MeasureSweep, Sweep: s}.Reduce()
		var ie *coil.InputError
		if !errors.As(err, &ie) || ie.Param != "sweep" {
			t.Errorf("%+v: got %v", s, err)
		}
	}
}
