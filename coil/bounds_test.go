package coil

import (
	"math"
	"math/rand/v2"
	"testing"
)

// ProximityRow reproduces ProximityFactor, and its minima bound it.
func TestProximityRow(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(1, 2))
	for range 2000 {
		dp := rng.Float64() * 1.1
		ld := math.Exp(rng.Float64()*8 - 4)
		r := NewProximityRow(dp)
		if got, want := r.At(ld), ProximityFactor(ld, dp); relErr(got, want) > implTol {
			t.Fatalf("row at(%g, %g) = %g, ProximityFactor %g", ld, dp, got, want)
		}
		a, b := ld, ld*math.Exp(rng.Float64()*3)
		m := r.MinOver(a, b)
		for k := 0; k <= 50; k++ {
			x := a * math.Pow(b/a, float64(k)/50)
			if ProximityFactor(x, dp) < m*(1-1e-12) {
				t.Fatalf("minOver(%g, %g) = %g above Φ(%g) = %g", a, b, m, x, ProximityFactor(x, dp))
			}
			if ProximityFactor(x, dp*(1+rng.Float64())) < ProximityFactor(x, dp)*(1-1e-12) && dp < 1 {
				t.Fatalf("Φ falls as d/p rises at l/D %g", x)
			}
		}
		if ProximityMin(dp) > ProximityFactor(ld, dp)*(1+1e-12) {
			t.Fatal("ProximityMin above a value")
		}
		if m2 := MedhurstHMinOver(a, b); m2 > math.Min(first(MedhurstH(a)), first(MedhurstH(b))) {
			t.Fatal("MedhurstHMinOver above an end")
		}
	}
}

func first(v float64, _ bool) float64 { return v }

// TestSelfCapacitanceMinOverHolds samples the model's equivalent
// self-capacitance at random shapes (N, l/D, p/d off the bound's grid) and
// checks that SelfCapacitanceMinOver never exceeds it, over single points
// and spans.
func TestSelfCapacitanceMinOverHolds(t *testing.T) {
	rng := rand.New(rand.NewPCG(15, 3))
	for range 20000 {
		n := math.Round(math.Exp(rng.Float64()*math.Log(MaxTurns))*4) / 4
		if n < 1 {
			n = 1
		}
		ld := math.Exp((rng.Float64()*2 - 1) * math.Log(1e3) * 0.999)
		pd := math.Exp(rng.Float64() * math.Log(12))
		cs := selfCapacitancePerD(n, ld, pd)
		lo := ld / math.Exp(rng.Float64())
		hi := ld * math.Exp(rng.Float64())
		for _, span := range [][2]float64{{ld, ld}, {lo, hi}, {lo, ld}} {
			if b := SelfCapacitanceMinOver(span[0], span[1]); b > cs {
				t.Fatalf("N %g, l/D %g, p/d %g: C_s/D %.4g below the bound %.4g over [%g, %g]", n, ld, pd, cs, b, span[0], span[1])
			}
		}
	}
	if SelfCapacitanceMinOver(1, 1) <= 0 {
		t.Fatal("no bound at l/D = 1")
	}
}
