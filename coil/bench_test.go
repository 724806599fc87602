package coil

import (
	"testing"

	"gonum.org/v1/gonum/mathext"
)

var (
	sinkF float64
	sinkP Prediction
)

// BenchmarkEllipticPair is the yardstick: one CompleteK and one CompleteE,
// the irreducible core of the exact Nagaoka coefficient.
func BenchmarkEllipticPair(b *testing.B) {
	m := 0.3
	for b.Loop() {
		sinkF += mathext.CompleteK(m) + mathext.CompleteE(m)
		m += 1e-12
	}
}

// BenchmarkPredict is one full evaluation of the README's VHF coil at
// 145 MHz: sheet, Rosa, leads, skin, Medhurst, SRF, losses, Q.
func BenchmarkPredict(b *testing.B) {
	g := vhfExample()
	for b.Loop() {
		p, err := Predict(g, 145e6)
		if err != nil {
			b.Fatal(err)
		}
		sinkP = p
		g.Pitch += 1e-12
	}
}

// BenchmarkPredictHF is the same for an HF coil whose wire sits in the
// tabulated skin-effect region (r/δ ≈ 8).
func BenchmarkPredictHF(b *testing.B) {
	g := Geometry{FormerDiameter: 25e-3, WireDiameter: 0.5e-3, WireOverall: 0.55e-3, Turns: 30, Pitch: 0.6e-3, LeadLength: 20e-3}
	for b.Loop() {
		p, err := Predict(g, 3.7e6)
		if err != nil {
			b.Fatal(err)
		}
		sinkP = p
		g.Pitch += 1e-12
	}
}

// BenchmarkNagaoka is the coefficient alone (pair plus the algebra).
func BenchmarkNagaoka(b *testing.B) {
	ld := 1.3
	for b.Loop() {
		sinkF += Nagaoka(ld)
		ld += 1e-12
	}
}
