package coil

import (
	"math"
	"os"
	"testing"

	"gonum.org/v1/gonum/optimize"
)

func TestSRFFit(t *testing.T) {
	path := os.Getenv("SRF_FIT")
	if path == "" {
		t.Skip()
	}
	rows := readNECTable(t, path)
	obj := func(x []float64) float64 {
		srfEndGrounded, srfEndFloating, srfTurnToTurn = x[0], x[1], x[2]
		copy(srfCorrGrounded[:], x[3:9])
		copy(srfCorrFloating[:], x[9:15])
		var s float64
		for _, g := range []bool{true, false} {
			for _, r := range rows {
				c := r.C
				ref := r.ref(g)
				e := math.Log(HelixSRF(c.N, c.P, c.Wd, c.D, RosaMutual(c.N), g) / ref)
				s += e * e
			}
		}
		return s
	}
	x0 := make([]float64, 15)
	x0[0], x0[1], x0[2] = -0.14, 0.08, 0.46
	var res *optimize.Result
	var err error
	for range 3 {
		res, err = optimize.Minimize(optimize.Problem{Func: obj}, x0, nil, &optimize.NelderMead{})
		copy(x0, res.X)
	}
	if err != nil {
		t.Log(err)
	}
	obj(res.X)
	t.Logf("x=%#v", res.X)
	for _, g := range []bool{true, false} {
		for _, r := range rows {
			c := r.C
			ref := r.ref(g)
			t.Logf("%-22s %+.2f%%", c.Name, 100*(HelixSRF(c.N, c.P, c.Wd, c.D, RosaMutual(c.N), g)/ref-1))
		}
	}
}
