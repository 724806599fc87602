package tuning

import (
	"bufio"
	"context"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/internal/testtools"
)

// ngspiceResonances runs an AC analysis of the two-gang circuit in
// ngspice: the bottom section L1 from the tap to ground, the top section
// L2 from the top to the tap, coupled by a K element, cTop and cTap to
// ground, and a 1 A AC current source into the top node. The resonances
// are the frequencies where the input admittance Y = 1/V(top) crosses zero
// from below (Foster: Im Y rises between its poles, so a zero crossing
// upwards is a parallel resonance and a jump downwards is a pole), found by
// linear interpolation between sweep points.
func ngspiceResonances(t *testing.T, ngspice string, s coil.Sections, cTop, cTap, fMin, fMax float64) []float64 {
	t.Helper()
	dir := t.TempDir()
	out := filepath.Join(dir, "y.txt")
	k := float64(s.M) / math.Sqrt(float64(s.LA)*float64(s.LB))
	netlist := fmt.Sprintf(`* turnwise two-gang cross-check
L1 tap 0 %.15g
L2 top tap %.15g
K1 L1 L2 %.15g
CT top 0 %.15g
CB tap 0 %.15g
I1 0 top DC 0 AC 1
.control
ac dec 20000 %.15g %.15g
let y = 1/v(top)
wrdata %s imag(y)
quit 0
.endc
.end
`, float64(s.LB), float64(s.LA), k, cTop, cTap, fMin, fMax, out)
	cir := filepath.Join(dir, "gang.cir")
	if err := os.WriteFile(cir, []byte(netlist), 0o644); err != nil {
		t.Fatal(err)
	}
	ctx, cancel := context.WithTimeout(context.Background(), 2*time.Minute)
	defer cancel()
	cmd := exec.CommandContext(ctx, ngspice, "-b", cir)
	cmd.Dir = dir
	log, err := cmd.CombinedOutput()
	if err != nil {
		t.Fatalf("ngspice -b: %v\n%s", err, log)
	}
	f, err := os.Open(out)
	if err != nil {
		t.Fatalf("ngspice wrote no data: %v\n%s", err, log)
	}
	defer f.Close()
	var freq, imY []float64
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		fields := strings.Fields(sc.Text())
		if len(fields) < 2 {
			continue
		}
		x, err1 := strconv.ParseFloat(fields[0], 64)
		y, err2 := strconv.ParseFloat(fields[1], 64)
		if err1 != nil || err2 != nil {
			t.Fatalf("ngspice data line %q", sc.Text())
		}
		freq, imY = append(freq, x), append(imY, y)
	}
	if len(freq) < 100 {
		t.Fatalf("ngspice gave %d points\n%s", len(freq), log)
	}
	var res []float64
	for i := 1; i < len(freq); i++ {
		if imY[i-1] < 0 && imY[i] >= 0 {
			w := -imY[i-1] / (imY[i] - imY[i-1])
			res = append(res, freq[i-1]+w*(freq[i]-freq[i-1]))
		}
	}
	return res
}

// The eigen solution against ngspice's AC analysis of the same coupled
// circuit, at several dial settings of the invented HF example (40 turns,
// tap at 17, 15–365 pF two-gang with 5 pF strays): both resonances agree
// within ngspiceTol, the 0.1 %.
func TestTwoGangAgainstNgspice(t *testing.T) {
	ngspice := testtools.Need(t, "ngspice", "ngspice")
	const ngspiceTol = 1e-3 // the acceptance bound
	gang := GangSection{Min: 15e-12, Max: 365e-12, Stray: 5e-12}
	c, err := newSpanCircuit(Spec{Geometry: hfTapExample(), TapTurns: 17, A: gang, B: gang})
	if err != nil {
		t.Fatal(err)
	}
	worst := 0.0
	for _, x := range []float64{0, 0.1, 0.35, 0.6, 1} {
		r, err := c.at(x)
		if err != nil {
			t.Fatal(err)
		}
		got := ngspiceResonances(t, ngspice, c.sec, float64(r.CTop), float64(r.CTap), 0.5*float64(r.FLow), 2*float64(r.FHigh))
		if len(got) != 2 {
			t.Fatalf("dial %g: ngspice found %d resonances %v; eigen %v, %v", x, len(got), got, r.FLow, r.FHigh)
		}
		for i, want := range []float64{float64(r.FLow), float64(r.FHigh)} {
			e := relErr(got[i], want)
			worst = math.Max(worst, e)
			if e > ngspiceTol {
				t.Errorf("dial %g resonance %d: ngspice %.7g Hz, eigen %.7g Hz (rel %.2g)", x, i+1, got[i], want, e)
			}
		}
	}
	t.Logf("largest difference from ngspice: %.2g relative", worst)
}

// A second circuit with unequal sections (B larger, at the tap) and a
// loose, low tap, where the two modes are far apart.
func TestTwoGangAgainstNgspiceUnequal(t *testing.T) {
	ngspice := testtools.Need(t, "ngspice", "ngspice")
	const ngspiceTol = 1e-3
	s, err := coil.Tap(coil.Geometry{FormerDiameter: 25e-3, WireDiameter: 0.8e-3, Turns: 20, Pitch: 1.6e-3, LeadLength: 20e-3}, 3.5, 4e6)
	if err != nil {
		t.Fatal(err)
	}
	for _, cs := range [][2]float64{{30e-12, 400e-12}, {250e-12, 47e-12}} {
		r, err := TwoNodeResonances(s, unit.Capacitance(cs[0]), unit.Capacitance(cs[1]))
		if err != nil {
			t.Fatal(err)
		}
		got := ngspiceResonances(t, ngspice, s, cs[0], cs[1], 0.5*float64(r.Low), 2*float64(r.High))
		if len(got) != 2 {
			t.Fatalf("%v: ngspice found %v; eigen %+v", cs, got, r)
		}
		if relErr(got[0], float64(r.Low)) > ngspiceTol || relErr(got[1], float64(r.High)) > ngspiceTol {
			t.Errorf("%v: ngspice %v, eigen %v %v", cs, got, r.Low, r.High)
		}
	}
}
