package coil

// Medhurst's proximity factor Φ (Medhurst 1947, Table 4): the
// high-frequency resistance of a single-layer solenoid divided by that of
// the same length of straight, isolated wire, as a function of l/D and the
// ratio of wire diameter to pitch d/p. Values as recalled from memory (not
// re-read from the paper); they are the largest single uncertainty in Q.
var proximityLD = [...]float64{0, 0.2, 0.4, 0.6, 0.8, 1.0, 2.0, 4.0, 6.0, 8.0, 10.0}

// proximityInf is the column for an infinitely long coil (l/D → ∞).
var proximityInf = [...]float64{1.05, 1.17, 1.38, 1.65, 1.93, 2.22, 2.51, 2.81, 3.11, 3.41}

// proximityDP are the rows, d/p = 0.1 … 1.0.
var proximityDP = [...]float64{0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0}

var proximityPhi = [...][len(proximityLD)]float64{
	{1.02, 1.02, 1.03, 1.03, 1.03, 1.03, 1.04, 1.04, 1.04, 1.04, 1.04}, // d/p = 0.1
	{1.07, 1.08, 1.08, 1.10, 1.10, 1.11, 1.13, 1.14, 1.15, 1.16, 1.16},
	{1.16, 1.18, 1.21, 1.22, 1.24, 1.26, 1.30, 1.33, 1.35, 1.36, 1.37},
	{1.20, 1.29, 1.33, 1.38, 1.42, 1.45, 1.50, 1.54, 1.57, 1.59, 1.61},
	{1.44, 1.48, 1.54, 1.60, 1.64, 1.67, 1.72, 1.78, 1.81, 1.84, 1.86},
	{1.74, 1.77, 1.83, 1.89, 1.92, 1.94, 1.91, 1.92, 1.99, 2.03, 2.08},
	{2.12, 2.20, 2.28, 2.38, 2.44, 2.47, 2.32, 2.27, 2.29, 2.34, 2.37},
	{2.74, 2.83, 2.97, 3.10, 3.20, 3.17, 2.74, 2.60, 2.60, 2.62, 2.65},
	{3.73, 3.84, 3.99, 4.11, 4.17, 4.10, 3.36, 3.05, 2.92, 2.90, 2.93},
	{5.31, 5.45, 5.65, 5.80, 5.80, 5.55, 4.10, 3.54, 3.31, 3.20, 3.23}, // d/p = 1.0
}

// ProximityFactor returns Medhurst's Φ for the given l/D and d/p, by
// bilinear interpolation in his table. Below d/p = 0.1 it falls linearly
// to 1 at d/p = 0; beyond l/D = 10 it moves linearly in D/l towards the
// l/D → ∞ column. It applies once the skin effect is well developed; the
// caller scales the excess Φ − 1 for partial skin effect.
func ProximityFactor(lOverD, dOverP float64) float64 {
	if dOverP > 1 {
		dOverP = 1
	}
	if dOverP <= 0 {
		return 1
	}
	col := func(row int) float64 { // Φ at lOverD for table row
		ld := proximityLD[:]
		v := proximityPhi[row]
		n := len(ld)
		if lOverD >= ld[n-1] {
			u := ld[n-1] / lOverD // D/l relative to the last column: 1 … 0
			return proximityInf[row] + u*(v[n-1]-proximityInf[row])
		}
		i := 0
		for i < n-2 && ld[i+1] <= lOverD {
			i++
		}
		t := (lOverD - ld[i]) / (ld[i+1] - ld[i])
		return v[i] + t*(v[i+1]-v[i])
	}
	if dOverP < proximityDP[0] {
		return 1 + dOverP/proximityDP[0]*(col(0)-1)
	}
	j := int(dOverP*10+1e-9) - 1 // rows are at 0.1 steps
	if j >= len(proximityDP)-1 {
		return col(len(proximityDP) - 1)
	}
	t := (dOverP - proximityDP[j]) / (proximityDP[j+1] - proximityDP[j])
	return col(j) + t*(col(j+1)-col(j))
}
