package forms

import (
	"math"
	"strings"
	"testing"
)

const inchM = 0.0254 // m per inch, exact (international inch, 1959)

// awgTableTol is half the last digit of the ASTM B258 table, which lists
// diameters rounded to 0.1 mil (0.0001 in).
const awgTableTol = 0.00005 * inchM

func TestAWGDiameterTable(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name   string
		n      int
		wantIn float64
		tol    float64 // m
	}{
		{name: "0000 exact", n: -3, wantIn: 0.4600, tol: implTol * 0.46 * inchM}, // ASTM B258 definition: 0000 AWG = 0.4600 in
		{name: "36 exact", n: 36, wantIn: 0.0050, tol: implTol * 0.005 * inchM},  // ASTM B258 definition: 36 AWG = 0.0050 in
		{name: "000", n: -2, wantIn: 0.4096, tol: awgTableTol},                   // ASTM B258 table (from memory)
		{name: "00", n: -1, wantIn: 0.3648, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "0", n: 0, wantIn: 0.3249, tol: awgTableTol},                      // ASTM B258 table (from memory)
		{name: "10", n: 10, wantIn: 0.1019, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "12", n: 12, wantIn: 0.0808, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "14", n: 14, wantIn: 0.0641, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "18", n: 18, wantIn: 0.0403, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "20", n: 20, wantIn: 0.0320, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "22", n: 22, wantIn: 0.0253, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "24", n: 24, wantIn: 0.0201, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "30", n: 30, wantIn: 0.0100, tol: awgTableTol},                    // ASTM B258 table (from memory)
		{name: "40", n: 40, wantIn: 0.0031, tol: awgTableTol},                    // ASTM B258 table (from memory)
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, err := AWGDiameter(tc.n)
			if err != nil {
				t.Fatal(err)
			}
			if want := tc.wantIn * inchM; math.Abs(float64(got)-want) > tc.tol {
				t.Errorf("AWGDiameter(%d) = %.6f in, want %.4f in ± %.2g in", tc.n, float64(got)/inchM, tc.wantIn, tc.tol/inchM)
			}
		})
	}
}

func TestAWGDiameterRange(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		n    int
		ok   bool
	}{
		{name: "below 0000", n: -4},
		{name: "0000", n: -3, ok: true},
		{name: "56", n: 56, ok: true},
		{name: "57", n: 57},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			_, err := AWGDiameter(tc.n)
			if (err == nil) != tc.ok {
				t.Errorf("AWGDiameter(%d) error = %v, want ok %v", tc.n, err, tc.ok)
			}
		})
	}
	// Each gauge step is the 39th root of 92 (property of the definition).
	ratio := math.Pow(92, 1.0/39)
	for n := -3; n < 56; n++ {
		a, _ := AWGDiameter(n)
		b, _ := AWGDiameter(n + 1)
		if !closeRel(float64(a/b), ratio, implTol) {
			t.Fatalf("d(%d)/d(%d) = %v, want %v", n, n+1, a/b, ratio)
		}
	}
}

func TestSWGDiameter(t *testing.T) {
	t.Parallel()
	// The SWG defines each size as an exact decimal inch value; the table is
	// also the source of data/swg.csv, so this guards against typing slips.
	cases := []struct {
		name   string
		n      int
		wantIn float64
	}{
		{name: "7/0", n: -6, wantIn: 0.500}, // BS 3737 (from memory)
		{name: "4/0", n: -3, wantIn: 0.400}, // BS 3737 (from memory)
		{name: "0", n: 0, wantIn: 0.324},    // BS 3737 (from memory)
		{name: "10", n: 10, wantIn: 0.128},  // BS 3737 (from memory)
		{name: "14", n: 14, wantIn: 0.080},  // BS 3737 (from memory)
		{name: "18", n: 18, wantIn: 0.048},  // BS 3737 (from memory)
		{name: "22", n: 22, wantIn: 0.028},  // BS 3737 (from memory)
		{name: "26", n: 26, wantIn: 0.018},  // BS 3737 (from memory)
		{name: "30", n: 30, wantIn: 0.0124}, // BS 3737 (from memory)
		{name: "36", n: 36, wantIn: 0.0076}, // BS 3737 (from memory)
		{name: "40", n: 40, wantIn: 0.0048}, // BS 3737 (from memory)
		{name: "47", n: 47, wantIn: 0.0020}, // BS 3737 (from memory)
		{name: "50", n: 50, wantIn: 0.0010}, // BS 3737 (from memory)
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, err := SWGDiameter(tc.n)
			if err != nil {
				t.Fatal(err)
			}
			if !closeRel(float64(got), tc.wantIn*inchM, implTol) {
				t.Errorf("SWGDiameter(%d) = %.6f in, want %.4f in", tc.n, float64(got)/inchM, tc.wantIn)
			}
		})
	}
	for _, n := range []int{-7, 51} {
		if _, err := SWGDiameter(n); err == nil {
			t.Errorf("SWGDiameter(%d): no error", n)
		}
	}
	// The gauge gets thinner with every step (property of any wire gauge).
	for n := -6; n < 50; n++ {
		a, _ := SWGDiameter(n)
		b, _ := SWGDiameter(n + 1)
		if !(a > b) {
			t.Errorf("SWG %d (%v) not thicker than %d (%v)", n, a, n+1, b)
		}
	}
}

func TestParseGauge(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name    string
		in      string
		ok      bool
		err     string // substring when the gauge does not exist
		want    string // Name
		system  string
		ins     string
		bareIn  float64 // 0 to skip
		bareTol float64
	}{
		{name: "awg suffix", in: "22awg", ok: true, want: "22awg", system: "awg", ins: "grade1", bareIn: 0.0253, bareTol: awgTableTol}, // ASTM B258 table (from memory)
		{name: "spaced upper", in: "22 AWG", ok: true, want: "22awg", system: "awg", ins: "grade1"},
		{name: "prefix", in: "awg22", ok: true, want: "22awg", system: "awg", ins: "grade1"},
		{name: "prefix hash", in: "AWG #22", ok: true, want: "22awg", system: "awg", ins: "grade1"},
		{name: "zeros", in: "0000awg", ok: true, want: "0000awg", system: "awg", ins: "none", bareIn: 0.46, bareTol: implTol * 0.46 * inchM}, // ASTM B258: 0000 = 0.4600 in
		{name: "slash zero", in: "4/0awg", ok: true, want: "0000awg", system: "awg", ins: "none"},
		{name: "one slash zero", in: "1/0 awg", ok: true, want: "0awg", system: "awg", ins: "none"},
		{name: "8 awg beyond enamel table", in: "8awg", ok: true, want: "8awg", system: "awg", ins: "none"},
		{name: "9 awg inside enamel table", in: "9awg", ok: true, want: "9awg", system: "awg", ins: "grade1"},
		{name: "swg", in: "18swg", ok: true, want: "18swg", system: "swg", ins: "grade1", bareIn: 0.048, bareTol: implTol * 0.048 * inchM}, // BS 3737 (from memory)
		{name: "swg 7/0", in: "7/0 SWG", ok: true, want: "7/0swg", system: "swg", ins: "none"},
		{name: "swg zeros", in: "0000000swg", ok: true, want: "7/0swg", system: "swg", ins: "none"},
		{name: "swg 0", in: "0swg", ok: true, want: "0swg", system: "swg", ins: "none"},
		{name: "60awg", in: "60awg", ok: true, err: "AWG runs from 0000 to 56"},
		{name: "51swg", in: "51swg", ok: true, err: "SWG runs from 7/0 to 50"},
		{name: "5/0awg", in: "5/0awg", ok: true, err: "AWG runs from 0000"},
		{name: "8/0swg", in: "8/0swg", ok: true, err: "SWG runs from 7/0"},
		{name: "half gauge", in: "22.5awg", ok: true, err: "whole numbers"},
		{name: "no number", in: "awg", ok: true, err: "add the gauge number"},
		{name: "zero slash zero", in: "0/0awg", ok: true, err: "n/0 needs n of 1 or more"},
		{name: "metric", in: "1.00mm"},
		{name: "own name", in: "green spool"},
		{name: "number", in: "22"},
		{name: "empty", in: ""},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			w, ok, err := ParseGauge(tc.in)
			if ok != tc.ok {
				t.Fatalf("ParseGauge(%q) ok = %v, want %v (err %v)", tc.in, ok, tc.ok, err)
			}
			if tc.err != "" {
				if err == nil || !strings.Contains(err.Error(), tc.err) {
					t.Fatalf("ParseGauge(%q) error = %v, want %q", tc.in, err, tc.err)
				}
				return
			}
			if err != nil {
				t.Fatalf("ParseGauge(%q): %v", tc.in, err)
			}
			if !ok {
				return
			}
			if w.Name != tc.want || w.System != tc.system || w.Insulation != tc.ins || w.Conductor != "copper" {
				t.Errorf("ParseGauge(%q) = %+v, want name %q system %q insulation %q", tc.in, w, tc.want, tc.system, tc.ins)
			}
			if sameSize := closeRel(float64(w.Overall), float64(w.Bare), implTol); w.Overall < w.Bare || (w.Insulation == "none") != sameSize {
				t.Errorf("ParseGauge(%q): overall %v vs bare %v with insulation %q", tc.in, w.Overall, w.Bare, w.Insulation)
			}
			if tc.bareIn > 0 && math.Abs(float64(w.Bare)-tc.bareIn*inchM) > tc.bareTol {
				t.Errorf("ParseGauge(%q) bare = %.5f in, want %.4f in", tc.in, float64(w.Bare)/inchM, tc.bareIn)
			}
		})
	}
}
