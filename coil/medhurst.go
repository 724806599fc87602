package coil

import "math"

// Medhurst's self-capacitance of a single-layer solenoid (Medhurst 1947,
// Table 1): C = H·D with D the coil diameter in cm and H in pF/cm, a
// function of l/D alone. The table below is Medhurst's, as recalled from
// memory (not re-read from the paper); testdata/SOURCES.md says so too.
// Medhurst measured coils with one end grounded; his figures are for that
// mounting.
var medhurstLD = [...]float64{
	0.10, 0.15, 0.20, 0.25, 0.30, 0.35, 0.40, 0.45, 0.50, 0.60, 0.70, 0.80,
	0.90, 1.0, 1.1, 1.2, 1.3, 1.4, 1.5, 1.6, 1.7, 1.8, 1.9, 2.0,
	2.5, 3.0, 3.5, 4.0, 4.5, 5.0, 6.0, 7.0, 8.0, 9.0, 10,
	15, 20, 25, 30, 40, 50,
}

var medhurstH = [...]float64{ // pF/cm
	0.96, 0.79, 0.70, 0.64, 0.60, 0.57, 0.54, 0.52, 0.50, 0.48, 0.47, 0.46,
	0.46, 0.46, 0.44, 0.44, 0.44, 0.45, 0.46, 0.46, 0.47, 0.48, 0.49, 0.50,
	0.56, 0.61, 0.67, 0.72, 0.77, 0.81, 0.92, 1.01, 1.12, 1.22, 1.32,
	1.86, 2.36, 2.90, 3.40, 4.60, 5.80,
}

// medhurstLnLD caches ln(l/D) of the table rows for the interpolation.
var medhurstLnLD = func() (v [len(medhurstLD)]float64) {
	for i, x := range medhurstLD {
		v[i] = math.Log(x)
	}
	return v
}()

// MedhurstH returns Medhurst's H (pF per cm of diameter) for a coil of
// length-to-diameter ratio lOverD, and whether lOverD is inside his table
// (0.1 … 50). Inside, it interpolates linearly in ln(l/D). Outside it
// extends the end of the table along H ∝ (l/D)^(−1/2) for short coils and
// H ∝ l/D for long ones, the asymptotic trends of his data; such values
// are estimates.
func MedhurstH(lOverD float64) (h float64, inTable bool) {
	ld := medhurstLD[:]
	hh := medhurstH[:]
	n := len(ld)
	switch {
	case lOverD < ld[0]:
		return hh[0] * math.Sqrt(ld[0]/lOverD), false
	case lOverD > ld[n-1]:
		return hh[n-1] * lOverD / ld[n-1], false
	}
	// Binary search for the interval.
	lo, hi := 0, n-1
	for hi-lo > 1 {
		mid := (lo + hi) / 2
		if ld[mid] <= lOverD {
			lo = mid
		} else {
			hi = mid
		}
	}
	t := (math.Log(lOverD) - medhurstLnLD[lo]) / (medhurstLnLD[hi] - medhurstLnLD[lo])
	return hh[lo] + t*(hh[hi]-hh[lo]), true
}

// SelfCapacitance is Medhurst's C = H·D in farads for a coil of mean
// diameter diameterM and length lengthM (Rosa's sheet length).
func SelfCapacitance(diameterM, lengthM float64) (farad float64, inTable bool) {
	h, in := MedhurstH(lengthM / diameterM)
	return h * 1e-12 * diameterM * 100, in
}
