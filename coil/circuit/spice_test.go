package circuit

import (
	"bufio"
	"bytes"
	"context"
	"math"
	"math/cmplx"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"turnwise/internal/testtools"
)

// Ideal-part networks for the cross-check with ngspice.

// dualResonance is the HF+VHF idea with ideal parts: 10 µH ∥ 180 pF (80 m)
// in series with 49 nH ∥ 25 pF (2 m), port 1 at the top.
func dualResonance() *Network {
	return &Network{
		Nodes: []string{"gnd", "ant", "mid"},
		Parts: []Part{
			{Name: "L1", Kind: Inductor, A: 2, B: 0, Value: 10e-6, ESR: 1.5},
			{Name: "C1", Kind: Capacitor, A: 2, B: 0, Value: 180e-12, Q: 1000, QFrequency: 3.7e6},
			{Name: "L2", Kind: Inductor, A: 1, B: 2, Value: 49e-9, ESR: 0.2},
			{Name: "C2", Kind: Capacitor, A: 1, B: 2, Value: 25e-12},
			{Name: "R1", Kind: Resistor, A: 1, B: 0, Value: 20e3},
		},
		Ports: []Port{{Node: 1, Z0: 50}},
	}
}

// trapNet is a parallel tank in series with a 50 Ω line: it notches 7.1 MHz.
func trapNet() *Network {
	return &Network{
		Nodes: []string{"gnd", "in", "out"},
		Parts: []Part{
			{Name: "L1", Kind: Inductor, A: 1, B: 2, Value: 2.5e-6, ESR: 0.5},
			{Name: "C1", Kind: Capacitor, A: 1, B: 2, Value: 1 / (math.Pow(2*math.Pi*7.1e6, 2) * 2.5e-6)},
			{Name: "Rbleed", Kind: Resistor, A: 1, B: 0, Value: 100e3}, // static drain
		},
		Ports: []Port{{Node: 1, Z0: 50}, {Node: 2, Z0: 50}},
	}
}

// filter3 is three 137.5 MHz resonators coupled by small capacitors, with
// a coupling k between the outer inductors, input and output at 50 Ω.
func filter3() *Network {
	l := 60e-9
	c := 1 / (math.Pow(2*math.Pi*137.5e6, 2) * l)
	return &Network{
		Nodes: []string{"gnd", "a", "b", "c"},
		Parts: []Part{
			{Name: "L1", Kind: Inductor, A: 1, B: 0, Value: l, Q: 150, QFrequency: 137.5e6},
			{Name: "C1", Kind: Capacitor, A: 1, B: 0, Value: c - 1e-12},
			{Name: "L2", Kind: Inductor, A: 2, B: 0, Value: l, Q: 150, QFrequency: 137.5e6},
			{Name: "C2", Kind: Capacitor, A: 2, B: 0, Value: c - 2e-12},
			{Name: "L3", Kind: Inductor, A: 3, B: 0, Value: l, Q: 150, QFrequency: 137.5e6},
			{Name: "C3", Kind: Capacitor, A: 3, B: 0, Value: c - 1e-12},
			{Name: "Ck1", Kind: Capacitor, A: 1, B: 2, Value: 1e-12},
			{Name: "Ck2", Kind: Capacitor, A: 2, B: 3, Value: 1e-12},
		},
		Couplings: []Coupling{{Name: "K13", P: 0, Q: 4, K: 0.01}},
		Ports:     []Port{{Node: 1, Z0: 1000}, {Node: 3, Z0: 1000}},
	}
}

// ngspiceAC runs the netlist's .ac analysis and returns, per frequency,
// the voltages of the listed nodes.
func ngspiceAC(t testing.TB, netlist []byte, nodes []string) ([]float64, [][]complex128) {
	t.Helper()
	bin := testtools.Need(t, "ngspice", "ngspice")
	dir := t.TempDir()
	out := filepath.Join(dir, "out.txt")
	var vecs []string
	for _, n := range nodes {
		vecs = append(vecs, "vr("+n+")", "vi("+n+")")
	}
	ctl := ".control\nset wr_singlescale\noption numdgt=15\nrun\nwrdata " + out + " " + strings.Join(vecs, " ") + "\nquit 0\n.endc\n.end\n"
	text := strings.Replace(string(netlist), ".end\n", ctl, 1)
	cir := filepath.Join(dir, "net.cir")
	if err := os.WriteFile(cir, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithTimeout(context.Background(), 60*time.Second)
	defer cancel()
	if b, err := exec.CommandContext(ctx, bin, "-b", cir).CombinedOutput(); err != nil {
		t.Fatalf("ngspice: %v\n%s", err, b)
	}
	return readWrdata(t, out, len(nodes))
}

func readWrdata(t testing.TB, path string, n int) ([]float64, [][]complex128) {
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var freqs []float64
	var vals [][]complex128
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		fs := strings.Fields(sc.Text())
		if len(fs) != 1+2*n {
			continue
		}
		x := make([]float64, len(fs))
		ok := true
		for i, s := range fs {
			v, err := strconv.ParseFloat(s, 64)
			if err != nil {
				ok = false
				break
			}
			x[i] = v
		}
		if !ok {
			continue
		}
		freqs = append(freqs, x[0])
		row := make([]complex128, n)
		for k := range row {
			row[k] = complex(x[1+2*k], x[2+2*k])
		}
		vals = append(vals, row)
	}
	if len(freqs) == 0 {
		t.Fatalf("no data in %s", path)
	}
	return freqs, vals
}

// spiceNode is the node's name in the netlist.
func spiceNode(netlist []byte, node string) string { return "n_" + node }

// TestNgspiceAgrees compares |Z| (one port) or S11 and S21 (two ports) at
// every sweep point with ngspice's AC analysis of the exported netlist
// (ngspice, an independent circuit simulator).
func TestNgspiceAgrees(t *testing.T) {
	for _, tc := range []struct {
		name     string
		net      *Network
		from, to float64
	}{
		{"dual resonance", dualResonance(), 1e6, 300e6},
		{"trap", trapNet(), 1e6, 30e6},
		{"three-resonator filter", filter3(), 100e6, 180e6},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s, err := NewSolver(tc.net)
			if err != nil {
				t.Fatal(err)
			}
			var buf bytes.Buffer
			if err := s.WriteSpice(&buf, SpiceOptions{Title: tc.name, At: tc.from, From: tc.from, To: tc.to, Points: 401}); err != nil {
				t.Fatal(err)
			}
			p1 := tc.net.Nodes[tc.net.Ports[0].Node]
			nodes := []string{spiceNode(buf.Bytes(), p1)}
			if len(tc.net.Ports) == 2 {
				nodes = append(nodes, spiceNode(buf.Bytes(), tc.net.Nodes[tc.net.Ports[1].Node]))
			}
			freqs, vals := ngspiceAC(t, buf.Bytes(), nodes)
			if len(freqs) != 401 {
				t.Fatalf("ngspice gave %d points, want 401", len(freqs))
			}
			worst := 0.0
			for i, f := range freqs {
				r, err := s.Response(f)
				if err != nil {
					t.Fatal(err)
				}
				if len(tc.net.Ports) == 1 {
					worst = math.Max(worst, rel(cmplx.Abs(r.Zin), cmplx.Abs(vals[i][0])))
					continue
				}
				z01, z02 := tc.net.Ports[0].Z0, tc.net.Ports[1].Z0
				s21 := vals[i][1] * complex(math.Sqrt(z01/z02), 0)
				s11 := vals[i][0] - 1
				worst = math.Max(worst, cmplx.Abs(r.S[1][0]-s21)/cmplx.Abs(s21))
				worst = math.Max(worst, cmplx.Abs(r.S[0][0]-s11)/math.Max(cmplx.Abs(s11), 1e-3))
			}
			t.Logf("%s: worst relative difference from ngspice over %d points: %.2g", tc.name, len(freqs), worst)
			if worst > 1e-6 {
				t.Errorf("worst relative difference %.3g, want ≤ 1e-6 (ngspice AC analysis)", worst)
			}
		})
	}
}
