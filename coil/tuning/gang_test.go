package tuning

import (
	"errors"
	"math"
	"testing"
	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// closedFormModes solves det(Γ − ω²C) = 0 for the two-node circuit by the
// quadratic formula, written out from the circuit equations independently
// of TwoNodeResonances: with node voltages (v_top, v_tap),
//
//	Γ = 1/Δ · [[L_b, −(L_b + M)], [−(L_b + M), L_a + L_b + 2M]],  Δ = L_a·L_b − M²
//
// (the bottom section from ground to the tap, the top section from the tap
// to the top) and ω² are the roots of
// cT·cB·x² − (Γ11·cB + Γ22·cT)·x + det Γ = 0.
func closedFormModes(la, lb, m, cT, cB float64) (lo, hi float64) {
	d := la*lb - m*m
	g11, g12, g22 := lb/d, -(lb+m)/d, (la+lb+2*m)/d
	a := cT * cB
	b := -(g11*cB + g22*cT)
	c := g11*g22 - g12*g12
	disc := math.Sqrt(b*b - 4*a*c)
	x1, x2 := (-b-disc)/(2*a), (-b+disc)/(2*a)
	return math.Sqrt(x1) / twoPi, math.Sqrt(x2) / twoPi
}

func TestTwoNodeResonancesClosedForm(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name              string
		la, lb, m, cT, cB float64
	}{
		{"HF tap", 6.7e-6, 4.5e-6, 1.07e-6, 100e-12, 80e-12},
		{"loose", 10e-6, 1e-6, 0.05e-6, 20e-12, 365e-12},
		{"tight", 2e-6, 2e-6, 1.9e-6, 50e-12, 50e-12},
		{"uncoupled", 3e-6, 5e-6, 0, 30e-12, 200e-12},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			s := coil.Sections{LA: unit.Inductance(tc.la), LB: unit.Inductance(tc.lb), M: unit.Inductance(tc.m)}
			r, err := TwoNodeResonances(s, unit.Capacitance(tc.cT), unit.Capacitance(tc.cB))
			if err != nil {
				t.Fatal(err)
			}
			lo, hi := closedFormModes(tc.la, tc.lb, tc.m, tc.cT, tc.cB)
			if relErr(float64(r.Low), lo) > implTol || relErr(float64(r.High), hi) > implTol {
				t.Errorf("eigen %v, %v; closed form %g, %g", r.Low, r.High, lo, hi)
			}
		})
	}
}

// Symmetric case by hand: equal uncoupled sections with equal capacitance
// at both nodes. Γ = (1/L')·[[1, −1], [−1, 2]], eigenvalues (3 ± √5)/2 per
// L'C, so the frequencies are in the ratio (3 + √5)/2 = φ² ≈ 2.618, and
// the low one is 1/(2π√(L'C)) · √((3 − √5)/2).
func TestTwoNodeResonancesSymmetric(t *testing.T) {
	t.Parallel()
	const l, c = 4e-6, 100e-12
	s := coil.Sections{LA: l, LB: l}
	r, err := TwoNodeResonances(s, c, c)
	if err != nil {
		t.Fatal(err)
	}
	f0 := 1 / (twoPi * math.Sqrt(l*c))
	if relErr(float64(r.Low), f0*math.Sqrt((3-math.Sqrt(5))/2)) > implTol {
		t.Errorf("low %v, want %g", r.Low, f0*math.Sqrt((3-math.Sqrt(5))/2))
	}
	if relErr(float64(r.High/r.Low), (3+math.Sqrt(5))/2) > implTol {
		t.Errorf("ratio %g, want φ² = %g", float64(r.High/r.Low), (3+math.Sqrt(5))/2)
	}
}

// Limits: section B at zero is the single tank of the whole coil with
// section A; a tap at the top puts both sections across the whole coil; a
// tap at ground shorts section B.
func TestTwoNodeResonancesLimits(t *testing.T) {
	t.Parallel()
	g := hfTapExample()
	mid, _ := coil.Tap(g, 17, 5e6)
	r, err := TwoNodeResonances(mid, 120e-12, 0)
	if err != nil {
		t.Fatal(err)
	}
	if want := coil.ResonantFrequency(mid.L, 120e-12); r.High != 0 || relErr(float64(r.Low), float64(want)) > implTol {
		t.Errorf("B at zero: %+v, want one resonance %v", r, want)
	}
	top, _ := coil.Tap(g, g.Turns, 5e6)
	r, err = TwoNodeResonances(top, 120e-12, 80e-12)
	if err != nil {
		t.Fatal(err)
	}
	if want := coil.ResonantFrequency(top.L, 200e-12); r.High != 0 || relErr(float64(r.Low), float64(want)) > implTol {
		t.Errorf("tap at the top: %+v, want %v", r, want)
	}
	cold, _ := coil.Tap(g, 0, 5e6)
	r, err = TwoNodeResonances(cold, 120e-12, 80e-12)
	if err != nil {
		t.Fatal(err)
	}
	if want := coil.ResonantFrequency(cold.L, 120e-12); r.High != 0 || relErr(float64(r.Low), float64(want)) > implTol {
		t.Errorf("tap at ground: %+v, want %v", r, want)
	}
	// Approaching the limits continuously: a tiny capacitance at the tap
	// sends the high mode up and leaves the low one at the single tank.
	r, _ = TwoNodeResonances(mid, 120e-12, 1e-18)
	if want := coil.ResonantFrequency(mid.L, 120e-12); relErr(float64(r.Low), float64(want)) > 1e-5 || r.High < 100*r.Low {
		t.Errorf("tiny C at the tap: %+v, single tank %v", r, want)
	}
	if _, err := TwoNodeResonances(coil.Sections{LA: 1e-6, LB: 1e-6, M: 1e-6}, 1e-12, 1e-12); err == nil {
		t.Error("k = 1 accepted")
	}
	if _, err := TwoNodeResonances(mid, 0, 0); err == nil {
		t.Error("no capacitance accepted")
	}
}

func TestGangLaws(t *testing.T) {
	t.Parallel()
	const lo, hi = 15e-12, 365e-12
	for _, law := range []Law{LawSLC, LawSLF, LawSLW} {
		s := GangSection{Min: lo, Max: hi, Law: law}
		if err := s.Validate("gang_a"); err != nil {
			t.Fatal(err)
		}
		if relErr(float64(s.Capacitance(0)), lo) > implTol || relErr(float64(s.Capacitance(1)), hi) > implTol {
			t.Errorf("%s: ends %v, %v", law, s.Capacitance(0), s.Capacitance(1))
		}
		// The law's straight quantity is linear in the setting.
		straight := func(c float64) float64 {
			switch law {
			case LawSLF:
				return 1 / math.Sqrt(c)
			case LawSLW:
				return math.Sqrt(c)
			}
			return c
		}
		for _, x := range []float64{0.1, 0.37, 0.5, 0.9} {
			want := straight(lo) + x*(straight(hi)-straight(lo))
			if got := straight(float64(s.Capacitance(x))); relErr(got, want) > implTol {
				t.Errorf("%s at %g: %g, want %g", law, x, got, want)
			}
		}
	}
	fixed := GangSection{Min: 47e-12, Max: 47e-12, Law: LawSLF, Trimmer: 3e-12, Stray: 2e-12}
	if err := fixed.Validate("gang_b"); err != nil || fixed.Capacitance(0.4) != 47e-12 || relErr(float64(fixed.Total(0.4)), 52e-12) > implTol {
		t.Errorf("fixed capacitor: %v %v %v", err, fixed.Capacitance(0.4), fixed.Total(0.4))
	}
	table := GangSection{Law: LawTable, Table: []GangPoint{{0, 16e-12}, {0.5, 150e-12}, {1, 370e-12}}}
	if err := table.Validate("gang_a"); err != nil {
		t.Fatal(err)
	}
	if got := float64(table.Capacitance(0.25)); relErr(got, 83e-12) > implTol {
		t.Errorf("table at 25 %%: %g, want 83 pF (linear between 16 and 150)", got)
	}
	if got := float64(table.Capacitance(0.75)); relErr(got, 260e-12) > implTol {
		t.Errorf("table at 75 %%: %g, want 260 pF", got)
	}
}

func TestGangValidate(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name  string
		s     GangSection
		param string
	}{
		{"max below min", GangSection{Min: 100e-12, Max: 10e-12}, "gang_a"},
		{"negative", GangSection{Min: -1e-12, Max: 10e-12}, "gang_a"},
		{"NaN", GangSection{Min: unit.Capacitance(math.NaN()), Max: 10e-12}, "gang_a"},
		{"farads", GangSection{Min: 1e-12, Max: 1}, "gang_a"},
		{"slf from zero", GangSection{Min: 0, Max: 100e-12, Law: LawSLF}, "gang_a"},
		{"negative trimmer", GangSection{Min: 1e-12, Max: 10e-12, Trimmer: -1e-12}, "gang_a_trimmer"},
		{"table of one", GangSection{Law: LawTable, Table: []GangPoint{{0, 1e-12}}}, "gang_a_table"},
		{"table falling", GangSection{Law: LawTable, Table: []GangPoint{{0, 10e-12}, {1, 5e-12}}}, "gang_a_table"},
		{"table not to 100", GangSection{Law: LawTable, Table: []GangPoint{{0, 10e-12}, {0.9, 50e-12}}}, "gang_a_table"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			err := tc.s.Validate("gang_a")
			var ie *coil.InputError
			if !errors.As(err, &ie) || ie.Param != tc.param {
				t.Errorf("err = %v, want coil.InputError %s", err, tc.param)
			}
		})
	}
}
