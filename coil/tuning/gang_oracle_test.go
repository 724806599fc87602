package tuning

import (
	"fmt"
	"math"
	"math/rand/v2"
	"sort"
	"testing"

	"gonum.org/v1/gonum/mat"
	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
)

// eigenResonances is the solution TwoNodeResonances replaced, kept as its
// test oracle: Γ built with gonum/mat and the pencil reduced to the
// ordinary symmetric eigenproblem solved by EigenSym.
//
// Nodes v = (v_top, v_tap); the bottom section carries i_b from ground to
// the tap, the top section i_a from the tap to the top, with branch
// voltages u = (v_tap, v_top − v_tap) = A·v. With the inductance matrix
// Λ = [[L_b, M], [M, L_a]] the nodal equations are C·v̈ + Γ·v = 0 with
// Γ = Aᵀ·Λ⁻¹·A and C = diag(cTop, cTap), so the resonances satisfy
//
//	Γ·x = ω²·C·x
//
// a symmetric-definite generalized eigenproblem, reduced to the ordinary
// symmetric one C^(−½)·Γ·C^(−½) and solved with gonum/mat's EigenSym.
// When cTap is zero the tap node has no capacitance and is eliminated
// (Schur complement): one resonance, of the whole coil with cTop. A tap at
// an end (L_a or L_b zero) leaves one tank, 1/(2π·√(L·C)), taken from
// singleTank (there Λ is singular and the pencil has no second route).
func eigenResonances(s coil.Sections, cTop, cTap unit.Capacitance) (Resonances, error) {
	la, lb, m := float64(s.LA), float64(s.LB), float64(s.M)
	ct, cb := float64(cTop), float64(cTap)
	switch {
	case !coil.Finite(ct) || !coil.Finite(cb) || ct < 0 || cb < 0:
		return Resonances{}, coil.InputErrorf("capacitance", "node capacitances must be zero or positive")
	case !coil.Finite(la) || !coil.Finite(lb) || !coil.Finite(m) || la < 0 || lb < 0:
		return Resonances{}, coil.InputErrorf("sections", "section inductances must be zero or positive")
	}
	switch {
	case la == 0: // tap at the top: both sections' capacitance across the whole coil
		return singleTank(lb, ct+cb)
	case lb == 0: // tap at ground: section B is shorted
		return singleTank(la, ct)
	}
	det := la*lb - m*m
	if !(det > 0) {
		return Resonances{}, coil.InputErrorf("sections", "coupling k = %.6g is not below 1: the sections are not a physical pair", m/math.Sqrt(la*lb))
	}
	// Λ⁻¹ (order i_b, i_a) and Γ = Aᵀ Λ⁻¹ A with A = [[0,1],[1,−1]].
	inv := mat.NewDense(2, 2, []float64{la / det, -m / det, -m / det, lb / det})
	a := mat.NewDense(2, 2, []float64{0, 1, 1, -1})
	var tmp, gamma mat.Dense
	tmp.Mul(inv, a)
	gamma.Mul(a.T(), &tmp)
	if ct == 0 && cb == 0 {
		return Resonances{}, coil.InputErrorf("capacitance", "the circuit has no capacitance: no resonance")
	}
	if cb == 0 || ct == 0 {
		// Eliminate the node without capacitance: Γ_eff = Γ_kk − Γ_kj²/Γ_jj.
		k, j := 0, 1
		c := ct
		if ct == 0 {
			k, j, c = 1, 0, cb
		}
		g := gamma.At(k, k) - gamma.At(k, j)*gamma.At(k, j)/gamma.At(j, j)
		return Resonances{Low: unit.Frequency(math.Sqrt(g/c) / twoPi)}, nil
	}
	st, sb := 1/math.Sqrt(ct), 1/math.Sqrt(cb)
	w := mat.NewSymDense(2, []float64{
		gamma.At(0, 0) * st * st, gamma.At(0, 1) * st * sb,
		gamma.At(1, 0) * sb * st, gamma.At(1, 1) * sb * sb,
	})
	var eig mat.EigenSym
	if !eig.Factorize(w, false) {
		return Resonances{}, fmt.Errorf("tuning: two-gang eigenproblem did not converge")
	}
	vals := eig.Values(nil)
	sort.Float64s(vals)
	if !(vals[0] > 0) {
		return Resonances{}, fmt.Errorf("tuning: two-gang eigenproblem gave a non-positive ω² (%g)", vals[0])
	}
	return Resonances{
		Low:  unit.Frequency(math.Sqrt(vals[0]) / twoPi),
		High: unit.Frequency(math.Sqrt(vals[1]) / twoPi),
	}, nil
}

// The closed form against the gonum/mat oracle on many random circuits and
// on edge cases. The oracle's smaller eigenvalue carries an absolute error
// of about ε·ω²_high (EigenSym is backward stable), so its relative error
// grows with the spread ω²_high/ω²_low; the two agree to eqTol where the
// spread is below spreadLimit. Every case is also checked without the
// oracle: the roots' sum and product are b/a and 1/a of the quadratic in
// ω² (Vieta), to vietaTol.
func TestTwoNodeResonancesAgainstEigen(t *testing.T) {
	t.Parallel()
	const (
		eqTol       = 1e-12 // the brief's agreement bound
		spreadLimit = 1e3   // ω²_high/ω²_low below which eqTol holds for the oracle
		vietaTol    = 1e-13
	)
	type tcase struct{ la, lb, m, cT, cB float64 }
	cases := []tcase{
		{6.7e-6, 4.5e-6, 1.07e-6, 100e-12, 80e-12}, // the HF example's scale
		{1e-6, 1e-6, 0, 1e-12, 1e-12},              // uncoupled, equal
		{2e-6, 2e-6, 1.999e-6, 50e-12, 50e-12},     // k = 0.9995
		{2e-6, 2e-6, -0.5e-6, 50e-12, 50e-12},      // negative mutual
		{1e-3, 1e-9, 1e-7, 1e-6, 1e-15},            // far apart
		{1e-9, 1e-3, 1e-7, 1e-15, 1e-6},
		{3e-6, 5e-6, 1e-6, 30e-12, 1e-18}, // tiny tap capacitance
		{3e-6, 5e-6, 1e-6, 1e-18, 30e-12}, // tiny top capacitance
	}
	rnd := rand.New(rand.NewPCG(9, 2))
	logU := func(lo, hi float64) float64 {
		return math.Exp(math.Log(lo) + rnd.Float64()*(math.Log(hi)-math.Log(lo)))
	}
	for range 5000 {
		la, lb := logU(1e-9, 1e-3), logU(1e-9, 1e-3)
		k := rnd.Float64() * 0.999
		cases = append(cases, tcase{la, lb, k * math.Sqrt(la*lb), logU(1e-15, 1e-6), logU(1e-15, 1e-6)})
	}
	compared := 0
	for i, tc := range cases {
		s := coil.Sections{LA: unit.Inductance(tc.la), LB: unit.Inductance(tc.lb), M: unit.Inductance(tc.m)}
		got, err := TwoNodeResonances(s, unit.Capacitance(tc.cT), unit.Capacitance(tc.cB))
		if err != nil {
			t.Fatalf("case %d %+v: %v", i, tc, err)
		}
		xl, xh := math.Pow(twoPi*float64(got.Low), 2), math.Pow(twoPi*float64(got.High), 2)
		det := tc.la*tc.lb - tc.m*tc.m
		a := tc.cT * tc.cB * det
		b := (tc.la+tc.lb+2*tc.m)*tc.cT + tc.lb*tc.cB
		if relErr(xl*xh, 1/a) > vietaTol || relErr(xl+xh, b/a) > vietaTol {
			t.Errorf("case %d %+v: ω² %g, %g; product %g want %g, sum %g want %g", i, tc, xl, xh, xl*xh, 1/a, xl+xh, b/a)
		}
		want, err := eigenResonances(s, unit.Capacitance(tc.cT), unit.Capacitance(tc.cB))
		if err != nil {
			continue // the oracle fails where the spread defeats EigenSym; Vieta above still holds
		}
		tol := eqTol
		if spread := xh / xl; spread > spreadLimit {
			tol = 8 * 0x1p-52 * spread // the oracle's own error bound
		}
		compared++
		if relErr(float64(got.Low), float64(want.Low)) > tol || relErr(float64(got.High), float64(want.High)) > tol {
			t.Errorf("case %d %+v: closed form %v, %v; eigen %v, %v (tol %g)", i, tc, got.Low, got.High, want.Low, want.High, tol)
		}
	}
	t.Logf("compared %d of %d cases with the oracle", compared, len(cases))
	if compared < len(cases)*9/10 {
		t.Errorf("compared only %d of %d cases with the oracle", compared, len(cases))
	}
	// The degenerate circuits take the same branch in both.
	for _, tc := range []tcase{{3e-6, 5e-6, 1e-6, 30e-12, 0}, {3e-6, 5e-6, 1e-6, 0, 30e-12}, {0, 5e-6, 0, 30e-12, 20e-12}, {3e-6, 0, 0, 30e-12, 20e-12}} {
		s := coil.Sections{LA: unit.Inductance(tc.la), LB: unit.Inductance(tc.lb), M: unit.Inductance(tc.m)}
		got, err1 := TwoNodeResonances(s, unit.Capacitance(tc.cT), unit.Capacitance(tc.cB))
		want, err2 := eigenResonances(s, unit.Capacitance(tc.cT), unit.Capacitance(tc.cB))
		if err1 != nil || err2 != nil || got.High != 0 || want.High != 0 || relErr(float64(got.Low), float64(want.Low)) > eqTol {
			t.Errorf("%+v: closed form %+v (%v), eigen %+v (%v)", tc, got, err1, want, err2)
		}
	}
}

// TestTwoNodeResonancesAllocs holds the closed form to no allocation.
func TestTwoNodeResonancesAllocs(t *testing.T) {
	s := coil.Sections{LA: 6.7e-6, LB: 4.5e-6, M: 1.07e-6}
	if n := testing.AllocsPerRun(100, func() { sinkRes, _ = TwoNodeResonances(s, 120e-12, 100e-12) }); n != 0 {
		t.Errorf("%g allocations per call, want 0", n)
	}
}

// BenchmarkTwoNodeResonancesEigen is the gonum/mat oracle on the same
// circuit as BenchmarkTwoNodeResonances, for the ratio in one run.
func BenchmarkTwoNodeResonancesEigen(b *testing.B) {
	s, err := coil.Tap(hfTapExample(), 17, 5e6)
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		r, err := eigenResonances(s, 120e-12, 100e-12)
		if err != nil {
			b.Fatal(err)
		}
		sinkRes = r
	}
}
