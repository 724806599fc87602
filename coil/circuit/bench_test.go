package circuit

import (
	"bytes"
	"context"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"turnwise/internal/testtools"
)

// tenParts is a 10-part network: the three-resonator filter with two
// more parts (a series input inductor and a load resistor).
func tenParts() *Network {
	n := filter3()
	n.Nodes = append(n.Nodes, "src")
	n.Parts = append(n.Parts,
		Part{Name: "Lin", Kind: Inductor, A: 4, B: 1, Value: 20e-9, ESR: 0.1},
		Part{Name: "Rload", Kind: Resistor, A: 3, B: 0, Value: 5e3})
	n.Ports[0].Node = 4
	return n
}

// BenchmarkSweep1001 is a 1001-point sweep of a 10-part network.
func BenchmarkSweep1001(b *testing.B) {
	s, err := NewSolver(tenParts())
	if err != nil {
		b.Fatal(err)
	}
	fs, _ := Frequencies(100e6, 180e6, 1001, false)
	b.ResetTimer()
	for range b.N {
		if _, err := s.Sweep(fs); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkNgspiceSweep1001 is the same sweep as an ngspice batch run,
// timed as a whole process (start, parse, solve, write).
func BenchmarkNgspiceSweep1001(b *testing.B) {
	bin := testtools.Need(b, "ngspice", "ngspice")
	s, err := NewSolver(tenParts())
	if err != nil {
		b.Fatal(err)
	}
	var buf bytes.Buffer
	if err := s.WriteSpice(&buf, SpiceOptions{At: 137e6, From: 100e6, To: 180e6, Points: 1001}); err != nil {
		b.Fatal(err)
	}
	dir := b.TempDir()
	out := filepath.Join(dir, "out.txt")
	text := strings.Replace(buf.String(), ".end\n", ".control\nrun\nwrdata "+out+" vr(n_a) vi(n_a) vr(n_c) vi(n_c)\nquit 0\n.endc\n.end\n", 1)
	cir := filepath.Join(dir, "net.cir")
	if err := os.WriteFile(cir, []byte(text), 0o644); err != nil {
		b.Fatal(err)
	}
	b.ResetTimer()
	for range b.N {
		if err := exec.CommandContext(context.Background(), bin, "-b", cir).Run(); err != nil {
			b.Fatal(err)
		}
	}
}
