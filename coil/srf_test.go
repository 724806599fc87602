package coil

import (
	"context"
	"math"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// TestSRFAgainstNEC checks the model against the committed NEC-2 table
// (testdata/nec/srf.csv, made by TestNECTable under the necfull tag):
// every reference coil within the in-sample worst case of the fitted
// constants (a regression guard on srfFitted; the stated uncertainty is the
// larger held-out one, srf_fit_test.go).
func TestSRFAgainstNEC(t *testing.T) {
	rows := readNECTable(t, filepath.Join("..", "testdata", "nec", "srf.csv"))
	if len(rows) < 15 {
		t.Fatalf("%d reference coils, want at least 15", len(rows))
	}
	for _, r := range rows {
		t.Run(r.C.Name, func(t *testing.T) {
			c := r.C
			for _, tc := range []struct {
				grounded bool
				tol      float64
			}{{true, 0.035}, {false, 0.06}} { // in-sample worst +3.05 %, +5.20 % (TestSRFFit)
				got := HelixSRF(c.N, c.P, c.Wd, c.D, RosaMutual(c.N), tc.grounded)
				if e := relErr(got, r.ref(tc.grounded)); e > tc.tol {
					t.Errorf("grounded=%v: model %.5g Hz, NEC-2 %.5g Hz (testdata/nec/srf.csv): %.2f %% > %.0f %%",
						tc.grounded, got, r.ref(tc.grounded), e*100, tc.tol*100)
				}
			}
		})
	}
}

// TestSRFNECLive runs nec2c on CI's small subset and checks both the
// committed table (the driver still reproduces it) and the model.
func TestSRFNECLive(t *testing.T) {
	if testing.Short() {
		t.Skip("runs nec2c")
	}
	nec := necTool(t)
	rows := readNECTable(t, filepath.Join("..", "testdata", "nec", "srf.csv"))
	byName := map[string]necRow{}
	for _, r := range rows {
		byName[r.C.Name] = r
	}
	for _, c := range necCISubset() {
		for _, g := range []bool{true, false} {
			f, _, _, err := necResonance(context.Background(), nec, t.TempDir(), c, g, necStartFrequency(c), 1)
			if err != nil {
				t.Fatal(err)
			}
			want := byName[c.Name].Free
			if g {
				want = byName[c.Name].Grounded
			}
			if e := relErr(f, want); e > 1e-3 {
				t.Errorf("%s grounded=%v: nec2c now gives %.6g Hz, table %.6g Hz", c.Name, g, f, want)
			}
		}
	}
}

// TestBessel checks the polynomial Bessel functions against their
// integral representations by quadrature (Abramowitz & Stegun 9.6.19,
// 9.6.24).
func TestBessel(t *testing.T) {
	for _, x := range []float64{0.05, 0.3, 1, 1.9, 2.1, 3.7, 3.8, 6, 12} {
		i0 := quadInt(func(th float64) float64 { return expCos(x, th, 0) }, 0, 3.141592653589793) / 3.141592653589793
		i1 := quadInt(func(th float64) float64 { return expCos(x, th, 1) }, 0, 3.141592653589793) / 3.141592653589793
		k0 := quadInt(func(u float64) float64 { return expCosh(x, u, 0) }, 0, 30)
		k1 := quadInt(func(u float64) float64 { return expCosh(x, u, 1) }, 0, 30)
		for _, c := range []struct {
			name      string
			got, want float64
		}{{"I0", besselI0(x), i0}, {"I1", besselI1(x), i1}, {"K0", besselK0(x), k0}, {"K1", besselK1(x), k1}} {
			if e := relErr(c.got, c.want); e > 1e-6 {
				t.Errorf("%s(%g) = %.9g, quadrature %.9g (rel %.2g)", c.name, x, c.got, c.want, e)
			}
		}
	}
}

func expCos(x, th float64, n int) float64 {
	return math.Exp(x*math.Cos(th)) * math.Cos(float64(n)*th)
}

func expCosh(x, u float64, n int) float64 {
	return math.Exp(-x*math.Cosh(u)) * math.Cosh(float64(n)*u)
}

func quadInt(f func(float64) float64, a, b float64) float64 {
	return quad.Fixed(f, a, b, 400, nil, 0)
}
