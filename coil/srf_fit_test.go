//go:build srffit

package coil

import (
	"math"
	"path/filepath"
	"sync"
	"testing"

	"gonum.org/v1/gonum/optimize"
)

// The calibration of the self-resonance model against the NEC-2 table,
// behind the srffit build tag (it runs Nelder–Mead many times):
//
//	go test -tags srffit -run 'TestSRFFit|TestSRFHeldOut' -v ./coil
//
// TestSRFFit fits the 15 constants (srfParams) to all coils of
// testdata/nec/srf.csv and prints them for srfFitted. TestSRFHeldOut is the
// honest check: leave-one-out, each coil predicted by constants fitted to
// the other 25, both starting from the same neutral point; its worst cases
// set SRFUncertainty and SRFFloatingUncertainty.

func srfFromX(x []float64) srfParams {
	var q srfParams
	q.EndGrounded, q.EndFloating, q.TurnToTurn = x[0], x[1], x[2]
	copy(q.CorrGrounded[:], x[3:9])
	copy(q.CorrFloating[:], x[9:15])
	return q
}

// srfFitRows fits the constants to rows by least squares of the log error
// of both mountings, from a neutral start (end corrections and
// turn-to-turn factor of the physical model's order, no log correction).
func srfFitRows(rows []necRow) srfParams {
	obj := func(x []float64) float64 {
		q := srfFromX(x)
		var s float64
		for _, g := range []bool{true, false} {
			for _, r := range rows {
				c := r.C
				e := math.Log(q.srf(c.N, c.P, c.Wd, c.D, RosaMutual(c.N), g) / r.ref(g))
				s += e * e
			}
		}
		return s
	}
	x0 := make([]float64, 15)
	x0[0], x0[1], x0[2] = 0.14, 0.1, 0
	for range 4 {
		res, err := optimize.Minimize(optimize.Problem{Func: obj}, x0, &optimize.Settings{MajorIterations: 20000}, &optimize.NelderMead{})
		if res == nil {
			panic(err)
		}
		copy(x0, res.X)
	}
	return srfFromX(x0)
}

func TestSRFFit(t *testing.T) {
	rows := readNECTable(t, filepath.Join("..", "testdata", "nec", "srf.csv"))
	q := srfFitRows(rows)
	t.Logf("srfParams=%#v", q)
	for _, g := range []bool{true, false} {
		lo, hi := 0.0, 0.0
		for _, r := range rows {
			c := r.C
			e := q.srf(c.N, c.P, c.Wd, c.D, RosaMutual(c.N), g)/r.ref(g) - 1
			lo, hi = math.Min(lo, e), math.Max(hi, e)
		}
		t.Logf("grounded=%v in-sample %+.2f %% … %+.2f %%", g, lo*100, hi*100)
	}
}

func TestSRFHeldOut(t *testing.T) {
	rows := readNECTable(t, filepath.Join("..", "testdata", "nec", "srf.csv"))
	errs := make([][2]float64, len(rows))
	var wg sync.WaitGroup
	for i := range rows {
		wg.Add(1)
		go func() {
			defer wg.Done()
			train := append(append([]necRow(nil), rows[:i]...), rows[i+1:]...)
			q := srfFitRows(train)
			c := rows[i].C
			for k, g := range []bool{true, false} {
				errs[i][k] = q.srf(c.N, c.P, c.Wd, c.D, RosaMutual(c.N), g)/rows[i].ref(g) - 1
			}
		}()
	}
	wg.Wait()
	var lo, hi [2]float64
	for i, r := range rows {
		t.Logf("%-22s held out: grounded %+.2f %%, floating %+.2f %%", r.C.Name, errs[i][0]*100, errs[i][1]*100)
		for k := range 2 {
			lo[k], hi[k] = math.Min(lo[k], errs[i][k]), math.Max(hi[k], errs[i][k])
		}
	}
	t.Logf("leave-one-out worst: grounded %+.2f %% … %+.2f %%, floating %+.2f %% … %+.2f %%", lo[0]*100, hi[0]*100, lo[1]*100, hi[1]*100)
	for k, u := range []float64{SRFUncertainty, SRFFloatingUncertainty} {
		if w := math.Max(-lo[k], hi[k]); w > u {
			t.Errorf("mounting %d: held-out worst %.2f %% exceeds the stated uncertainty %.0f %%", k, w*100, u*100)
		}
	}
}
