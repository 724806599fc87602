package coil

import (
	"math"
	"sync"
)

// A lower bound on the equivalent self-capacitance, for searches that
// prune by the self-resonance (the design search): SRF = 1/(2π√(L·C_s)),
// so a least C_s and a least L give a greatest SRF.
//
// The helical-line model (HelixSRF) has no closed-form minimum over the
// turns and the pitch, but its equivalent C_s (one end grounded,
// Core.SelfResonance) is proportional to the mean diameter at fixed N,
// l/D and p/d (every length in it scales together), so C_s/D depends on
// three shape numbers only. The bound is tabulated once, on first use:
// for each quarter decade of l/D from 10⁻³ to 10³, the least C_s/D over a
// grid of l/D (5 points in the band, ends included), N (1 … MaxTurns) and
// p/d (1 … 12), times srfBoundSafety for the grid's gaps. The test
// (TestSelfCapacitanceMinOverHolds) checks it against the model at random
// shapes between the grid points.

const (
	srfBoundDecades = 3 // l/D from 10^-3 to 10^3
	srfBoundPerDec  = 4 // bands per decade
	srfBoundBands   = 2 * srfBoundDecades * srfBoundPerDec
	srfBoundSafety  = 0.9
)

var (
	srfBoundOnce  sync.Once
	srfBoundTable [srfBoundBands]float64
)

// srfBandEdge is the lower l/D of band k.
func srfBandEdge(k int) float64 {
	return math.Pow(10, float64(k-srfBoundDecades*srfBoundPerDec)/srfBoundPerDec)
}

func buildSRFBound() {
	turns := []float64{1, 1.25, 1.5, 2, 2.5, 3, 4, 5, 7, 10, 14, 20, 30, 50, 80, 130, 200, 400, 1000, 3000, MaxTurns}
	for k := range srfBoundTable {
		lo, hi := srfBandEdge(k), srfBandEdge(k+1)
		m := math.Inf(1)
		for i := range 5 {
			ld := lo * math.Pow(hi/lo, float64(i)/4)
			for _, n := range turns {
				for j := range 14 {
					pd := math.Pow(12, float64(j)/13)
					m = math.Min(m, selfCapacitancePerD(n, ld, pd))
				}
			}
		}
		srfBoundTable[k] = srfBoundSafety * m
	}
}

// selfCapacitancePerD is the model's equivalent grounded C_s divided by
// the mean diameter for N turns, l/D and p/d (+Inf where the wire would
// not fit inside the coil).
func selfCapacitancePerD(n, ld, pd float64) float64 {
	const dm = 1.0
	pitch := ld * dm / n
	d := pitch / pd
	if d >= dm {
		return math.Inf(1)
	}
	c := NewCore(n, pitch, d, dm, RosaMutual(n))
	cs, _, _ := c.SelfResonance()
	return cs / dm
}

// SelfCapacitanceMinOver is a lower bound on the equivalent self-capacitance
// per metre of mean diameter (F/m) of any coil of the model with l/D in
// [a, b] (b may be +Inf), one end grounded. Outside 10⁻³ … 10³ it returns 0
// (no bound).
func SelfCapacitanceMinOver(a, b float64) float64 {
	if !(a >= srfBandEdge(0)) || !(b <= srfBandEdge(srfBoundBands)) {
		return 0
	}
	srfBoundOnce.Do(buildSRFBound)
	ka := int(math.Floor((math.Log10(a) + srfBoundDecades) * srfBoundPerDec))
	kb := int(math.Floor((math.Log10(b) + srfBoundDecades) * srfBoundPerDec))
	ka = min(max(ka, 0), srfBoundBands-1)
	kb = min(max(kb, 0), srfBoundBands-1)
	m := math.Inf(1)
	for k := ka; k <= kb; k++ {
		m = math.Min(m, srfBoundTable[k])
	}
	return m
}
