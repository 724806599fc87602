package coil

import (
	"bufio"
	"bytes"
	"context"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"turnwise/internal/testtools"
)

// The NEC-2 driver: it writes NEC-2 input cards for one bare, perfectly
// conducting helix, runs nec2c (the double-precision C port of NEC-2,
// Burke & Poggio 1981) and finds the helix's first self-resonance from the
// input reactance.
//
// The two mountings are modelled exactly as the model defines them
// (srf.go):
//
//   - grounded: the helix stands on an infinite perfectly conducting
//     ground plane (GE 1, GN 1), axis normal to it, its lower end on the
//     plane and its upper end open. The voltage source is in the first
//     segment, at the plane. The first series resonance there (reactance
//     crossing zero from − to +) is the first natural frequency of the
//     structure with the lower end grounded and the upper end open, which
//     is the pole of the coil's impedance seen from its hot (upper) end.
//   - floating: the same helix in free space, no ground, both ends open.
//     The source is in the middle segment; the first series resonance
//     there is the first natural frequency of the free helix (the mode
//     with its current maximum mid-way), which is the pole of the coil's
//     impedance between its two ends.
//
// No leads, no feed wires, no fixture: a delta-gap source in the winding's
// own wire. Perfect conductor (no LD card): nec2c's finite-conductivity
// loading is not needed for a resonance and its skin-effect
// approximation is poor at small r/δ. The extended thin-wire kernel (EK)
// is used because the segments of a close-wound helix are only a few
// wire radii long.

// necCoil is one reference coil: mean (wire-centre) diameter D, pitch p,
// bare wire diameter d, turns N, all in metres.
type necCoil struct {
	Name     string
	D, P, Wd float64
	N        float64
}

// necSegmentsPerTurn is the segmentation rule: a segment no longer than
// 1.5 pitches (so that it stays comparable with the distance to the
// neighbouring turn) and at least 12 segments per turn; scale multiplies
// it (2 for the convergence check by halving).
func necSegmentsPerTurn(c necCoil, scale int) int {
	n := int(math.Ceil(math.Pi * c.D / (1.5 * c.P)))
	if n < 12 {
		n = 12
	}
	return n * scale
}

// necStub is the height of the helix's lower end above the ground plane
// in the grounded mounting: half a pitch (where the current sheet of
// N·p that the model uses begins), at least one wire diameter so that the
// wire stays clear of its image.
func necStub(c necCoil) float64 { return math.Max(c.P/2, c.Wd) }

// necDeck writes the NEC-2 input for coil c, mounting grounded or
// floating, at the frequencies fs (Hz), with scale times the base
// segmentation.
func necDeck(c necCoil, grounded bool, fs []float64, scale int) (string, int) {
	perTurn := necSegmentsPerTurn(c, scale)
	ns := int(math.Round(c.N * float64(perTurn)))
	var b strings.Builder
	fmt.Fprintf(&b, "CM turnwise self-resonance reference: %s grounded=%v\n", c.Name, grounded)
	fmt.Fprintf(&b, "CE\n")
	a := c.D / 2
	// GH: tag, segments, turn spacing, total length, radii at both ends
	// (x, y), wire radius. The helix starts at (a, 0, 0).
	fmt.Fprintf(&b, "GH 1 %d %.9g %.9g %.9g %.9g %.9g %.9g %.9g\n", ns, c.P, c.N*c.P, a, a, a, a, c.Wd/2)
	tag, src := 1, (ns+1)/2
	if grounded {
		// Lift the helix by z0 and join its lower end to the plane with a
		// straight stub of one segment that carries the source.
		z0 := necStub(c)
		fmt.Fprintf(&b, "GM 0 0 0 0 0 0 0 %.9g 1\n", z0)
		fmt.Fprintf(&b, "GW 2 1 %.9g 0 0 %.9g 0 %.9g %.9g\n", a, a, z0, c.Wd/2)
		fmt.Fprintf(&b, "GE 1\nGN 1\n")
		tag, src = 2, 1
	} else {
		fmt.Fprintf(&b, "GE 0\n")
	}
	fmt.Fprintf(&b, "EK\n")
	fmt.Fprintf(&b, "EX 0 %d %d 0 1.0 0.0\n", tag, src)
	for _, f := range fs {
		fmt.Fprintf(&b, "FR 0 1 0 0 %.12g 0\nXQ\n", f/1e6)
	}
	fmt.Fprintf(&b, "EN\n")
	return b.String(), ns
}

// necRun runs nec2c on deck in a temporary directory and returns the
// input impedance at each frequency, in order.
func necRun(ctx context.Context, nec, dir, deck string) ([]complex128, error) {
	tmp, err := os.MkdirTemp(dir, "nec")
	if err != nil {
		return nil, err
	}
	defer os.RemoveAll(tmp)
	in := filepath.Join(tmp, "in.nec")
	out := filepath.Join(tmp, "out.txt")
	if err := os.WriteFile(in, []byte(deck), 0o644); err != nil {
		return nil, err
	}
	cmd := exec.CommandContext(ctx, nec, "-i", in, "-o", out)
	if msg, err := cmd.CombinedOutput(); err != nil {
		return nil, fmt.Errorf("nec2c: %v: %s", err, msg)
	}
	txt, err := os.ReadFile(out)
	if err != nil {
		return nil, err
	}
	return necParse(txt)
}

// necParse reads every "ANTENNA INPUT PARAMETERS" block's impedance.
func necParse(txt []byte) ([]complex128, error) {
	var zs []complex128
	sc := bufio.NewScanner(bytes.NewReader(txt))
	sc.Buffer(make([]byte, 1<<20), 1<<20)
	want := -1
	for sc.Scan() {
		line := sc.Text()
		if strings.Contains(line, "ANTENNA INPUT PARAMETERS") {
			want = 3 // two header lines, then the data line
			continue
		}
		if want > 0 {
			want--
			if want == 0 {
				f := strings.Fields(line)
				if len(f) < 8 {
					return nil, fmt.Errorf("nec2c output: short input-parameter line %q", line)
				}
				re, err1 := strconv.ParseFloat(f[6], 64)
				im, err2 := strconv.ParseFloat(f[7], 64)
				if err1 != nil || err2 != nil {
					return nil, fmt.Errorf("nec2c output: bad impedance in %q", line)
				}
				zs = append(zs, complex(re, im))
				want = -1
			}
		}
	}
	return zs, sc.Err()
}

// necResonance finds the first frequency above fLo where the input
// reactance crosses zero from − to +: a log sweep upward from fLo in steps
// of ratio step until the crossing is bracketed, then regula falsi
// (Illinois) to a relative width of 2e-5. It returns the frequency, the
// number of segments and the number of frequencies computed.
func necResonance(ctx context.Context, nec, dir string, c necCoil, grounded bool, fLo float64, scale int) (float64, int, int, error) {
	const step = 1.08
	const chunk = 8
	var ns, calls int
	x := func(fs []float64) ([]float64, error) {
		deck, n := necDeck(c, grounded, fs, scale)
		ns = n
		zs, err := necRun(ctx, nec, dir, deck)
		if err != nil {
			return nil, err
		}
		if len(zs) != len(fs) {
			return nil, fmt.Errorf("nec2c returned %d impedances for %d frequencies", len(zs), len(fs))
		}
		calls += len(fs)
		xs := make([]float64, len(fs))
		for i, z := range zs {
			xs[i] = imag(z)
		}
		return xs, nil
	}
	// Start below the first resonance: the reactance must be negative.
	f0 := fLo
	for range 10 {
		xs, err := x([]float64{f0})
		if err != nil {
			return 0, ns, calls, err
		}
		if xs[0] < 0 {
			break
		}
		f0 /= 2
	}
	var a, b, xa, xb float64
	found := false
	for k := 0; k < 12 && !found; k++ {
		fs := make([]float64, chunk+1)
		for i := range fs {
			fs[i] = f0 * math.Pow(step, float64(i))
		}
		xs, err := x(fs)
		if err != nil {
			return 0, ns, calls, err
		}
		for i := 1; i < len(fs); i++ {
			if xs[i-1] < 0 && xs[i] >= 0 {
				a, b, xa, xb = fs[i-1], fs[i], xs[i-1], xs[i]
				found = true
				break
			}
		}
		f0 = fs[chunk]
	}
	if !found {
		return 0, ns, calls, fmt.Errorf("%s: no series resonance found above %.4g Hz", c.Name, fLo)
	}
	side := 0
	for b/a-1 > 2e-5 {
		m := b - xb*(b-a)/(xb-xa)
		xs, err := x([]float64{m})
		if err != nil {
			return 0, ns, calls, err
		}
		xm := xs[0]
		if xm < 0 {
			a, xa = m, xm
			if side == -1 {
				xb /= 2
			}
			side = -1
		} else {
			b, xb = m, xm
			if side == 1 {
				xa /= 2
			}
			side = 1
		}
		if calls > 200 {
			break
		}
	}
	return a - xa*(b-a)/(xb-xa), ns, calls, nil
}

// necReference returns the reference coils: 37 of our own choosing, spanning
// l/D 0.3 … 10, p/d 1.1 … 10, D 3 … 50 mm, N 2 … 60. Names give N, l/D,
// p/d.
func necReference() []necCoil {
	mk := func(dmm, ld, pd, n float64) necCoil {
		D := dmm * 1e-3
		p := ld * D / n
		return necCoil{Name: fmt.Sprintf("D%g-N%g-lD%g-pd%g", dmm, n, ld, pd), D: D, P: p, Wd: p / pd, N: n}
	}
	return []necCoil{
		mk(50, 0.3, 1.1, 4),
		mk(20, 0.3, 3, 2),
		mk(10, 0.3, 1.5, 3),
		mk(30, 0.5, 2, 5),
		mk(8, 0.6, 1.2, 6),
		mk(6, 1, 1.5, 5),
		mk(12, 1, 4, 4),
		mk(25, 1, 1.1, 12),
		mk(4, 1.5, 1.3, 8),
		mk(10, 1.5, 10, 3),
		mk(16, 2, 2, 10),
		mk(40, 2, 1.1, 20),
		mk(5, 3, 2.5, 12),
		mk(20, 3, 6, 6),
		mk(10, 4, 1.5, 30),
		mk(8, 5, 3, 20),
		mk(30, 6, 1.2, 40),
		mk(6, 8, 4, 24),
		mk(12, 10, 1.5, 60),
		mk(4, 10, 8, 16),
		mk(40, 0.3, 10, 2),
		mk(15, 0.8, 2, 8),
		mk(6, 2.5, 1.2, 25),
		mk(25, 5, 6, 10),
		mk(10, 7, 2, 40),
		mk(20, 10, 3, 50),
		// Added near the held-out worst corners (long steep grounded,
		// short few-turn floating); TestNECTableAppend computed them.
		mk(5, 10, 10, 12),
		mk(8, 8, 6, 12),
		mk(30, 0.3, 6, 2),
		mk(15, 0.4, 4, 3),
		mk(50, 0.3, 10, 3),
		mk(25, 0.5, 8, 3),
		// A second round: an out-of-sample check of the refitted model.
		mk(40, 0.3, 1.5, 3),
		mk(12, 0.3, 2, 2),
		mk(20, 0.4, 6, 2),
		mk(6, 0.6, 8, 3),
		mk(3, 9, 5, 20),
	}
}

// necCISubset is the few coils CI runs through nec2c on every test run.
func necCISubset() []necCoil {
	all := necReference()
	return []necCoil{all[1], all[6], all[9]}
}

// necStartFrequency is a safe lower start for the sweep: 0.55 of the
// grounded estimate by Medhurst's self-capacitance.
func necStartFrequency(c necCoil) float64 {
	core := NewCore(c.N, c.P, c.Wd, c.D, RosaMutual(c.N))
	_, srf, _ := core.SelfResonance()
	return 0.55 * srf
}

func necTool(t *testing.T) string {
	t.Helper()
	return testtools.Need(t, "nec2c", "nec2c")
}
