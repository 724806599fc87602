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
