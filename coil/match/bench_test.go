package match

import (
	"context"
	"testing"

	"turnwise/coil/circuit"
)

// demoFrequencies are the five bands the benchmark maps.
var demoFrequencies = []float64{3.6e6, 7.1e6, 10.12e6, 14.2e6, 21.2e6}

// BenchmarkMapDemo is a full map (default grid, five frequencies, 100 W
// stress) of the demo coupler. Quote it as a ratio to BenchmarkSweepDemo.
func BenchmarkMapDemo(b *testing.B) {
	s := tappedCoupler(8)
	for b.Loop() {
		if _, err := Map(context.Background(), s, Options{Frequencies: demoFrequencies, Power: 100}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSweepDemo is one 1001-point sweep of the same network (the
// load a 50 Ω resistor, the capacitors at their nominal settings), 1 to
// 30 MHz, as the circuit command sweeps: Response at each frequency.
func BenchmarkSweepDemo(b *testing.B) {
	s := tappedCoupler(8)
	net := s.Network
	net.Parts = append(append([]circuit.Part(nil), net.Parts...),
		circuit.Part{Name: "load", Kind: circuit.Impedance, A: 3, B: 0, Z: 50, TapNode: -1})
	sv, err := circuit.NewSolver(&net)
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		for i := range 1001 {
			f := 1e6 + 29e6*float64(i)/1000
			if _, err := sv.Response(f); err != nil {
				b.Fatal(err)
			}
		}
	}
}
