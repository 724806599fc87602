package trim

import (
	"testing"

	"gonum.org/v1/gonum/unit"
)

var (
	sinkCal  Calibration
	sinkCorr Correction
)

// BenchmarkCalibrate is one calibration from a resonance: the springback
// bisection and its uncertainty band, each step a full Predict. Compare
// with BenchmarkPredict in the same run.
func BenchmarkCalibrate(b *testing.B) {
	g := vhfExample()
	m := Measurement{Kind: MeasureResonance, Resonances: []Resonance{{101.5e6, 22e-12}}, Stray: 1.5e-12,
		StrayTolerance: 0.75e-12, CapacitorTolerance: 0.05, FrequencyTolerance: 0.001}
	for b.Loop() {
		c, err := Calibrate(g, m)
		if err != nil {
			b.Fatal(err)
		}
		sinkCal = c
	}
}

// BenchmarkCorrectTurns is a correction that overflows the window: the
// quarter-turn search, the pitch bisection and the length rounding.
func BenchmarkCorrectTurns(b *testing.B) {
	g := vhfExample()
	t := Target{Inductance: 130e-9, Frequency: 145e6}
	opt := CorrectOptions{Tolerance: 0.005, LengthSteps: []unit.Length{0.1e-3, 0.05e-3, 0.02e-3, 0.01e-3}}
	for b.Loop() {
		c, err := Correct(g, t, opt)
		if err != nil {
			b.Fatal(err)
		}
		sinkCorr = c
	}
}
