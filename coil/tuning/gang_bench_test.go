package tuning

import (
	"testing"
	"turnwise/coil"
)

var (
	sinkRes   Resonances
	sinkSpan  Span
	sinkPlan  TapPlan
	sinkRatio float64
)

// BenchmarkTwoNodeResonances is one dial setting: Γ built with gonum/mat
// and the 2×2 symmetric eigenproblem. Compare with BenchmarkEllipticPair.
func BenchmarkTwoNodeResonances(b *testing.B) {
	s, err := coil.Tap(hfTapExample(), 17, 5e6)
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		r, err := TwoNodeResonances(s, 120e-12, 100e-12)
		if err != nil {
			b.Fatal(err)
		}
		sinkRes = r
	}
}

// BenchmarkTap is one set of sections: three evaluations of the model.
func BenchmarkTap(b *testing.B) {
	g := hfTapExample()
	for b.Loop() {
		s, err := coil.Tap(g, 17, 5e6)
		if err != nil {
			b.Fatal(err)
		}
		sinkRatio = s.Ratio
	}
}

// BenchmarkSolveSpan is the whole span of the HF example with three
// bands: 11 rows, band edges by bisection, the coincidence scan.
func BenchmarkSolveSpan(b *testing.B) {
	spec := Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands}
	for b.Loop() {
		sp, err := Solve(spec)
		if err != nil {
			b.Fatal(err)
		}
		sinkSpan = sp
	}
}

// BenchmarkSolveSpanThird is BenchmarkSolveSpan checking harmonics up to
// the 3rd only, the work the span solver did before coincidences of any
// order: the like-for-like figure against the gonum/mat-based solver.
func BenchmarkSolveSpanThird(b *testing.B) {
	spec := Spec{Geometry: hfTapExample(), TapTurns: 17, A: hfGang(), B: hfGang(), Bands: hfBands, MaxHarmonic: 3}
	for b.Loop() {
		sp, err := Solve(spec)
		if err != nil {
			b.Fatal(err)
		}
		sinkSpan = sp
	}
}

// BenchmarkChooseTap tries all 159 quarter-turn taps of the HF example.
func BenchmarkChooseTap(b *testing.B) {
	spec := Spec{Geometry: hfTapExample(), A: hfGang(), B: hfGang(), Bands: hfBands}
	for b.Loop() {
		p, err := ChooseTap(spec, TapSearch{})
		if err != nil {
			b.Fatal(err)
		}
		sinkPlan = p
	}
}
