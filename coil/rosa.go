package coil

import "math"

// RosaSelf is Rosa's self-inductance correction k_s (his A) for round wire
// of bare diameter d at pitch p, with φ the fraction of the wire's DC
// internal inductance still present (1 at DC, → 0 as skin effect develops):
//
//	k_s = 3/2 − φ/4 − ln(2p/d)
//
// At DC this is Rosa's 5/4 − ln(2p/d) (Rosa 1906; Grover 1946, eq. 145).
// The 1/4 is the internal inductance μ0/8π per metre of wire: a turn of
// round wire has geometric mean distance r·e^(−1/4) from itself at DC and r
// with all current on its surface.
func RosaSelf(pitchM, wireM, phi float64) float64 {
	return 1.5 - phi/4 - math.Log(2*pitchM/wireM)
}

// RosaMutual is Rosa's mutual-inductance correction k_m (his B) for n turns,
// from its asymptotic series in 1/n (derived from the Euler–Maclaurin form of
// the direct sum; see RosaMutualSum):
//
//	k_m = ln(2π) − 3/2 − ln(n)/(6n) − 0.33084236/n − 1/(120n³)
//	      + 1/(504n⁵) − 0.0011923/n⁷ + 0.0005068/n⁹
//
// The series agrees with the direct sum to better than 1e-4 absolute at
// n = 1 and 1e-8 from n = 3 (tested). Valid for n ≥ 1; non-integer n
// (quarter turns) interpolate smoothly.
func RosaMutual(n float64) float64 {
	const c0 = 0.33787706640934533 // ln(2π) − 3/2
	in := 1 / n
	in2 := in * in
	in3 := in2 * in
	series := in3 * (-1.0/120 + in2*(1.0/504+in2*(-0.0011923+in2*0.0005068)))
	return c0 - math.Log(n)*in/6 - 0.33084236*in + series
}

// RosaMutualSum is the exact k_m for an integer number of turns n: the
// difference, over all pairs of turns, between the mutual inductance of
// two thin rings at axial distance j·p and that of the two current-sheet
// bands of width p they stand for, divided by μ0·a·n (Rosa 1906, 1908):
//
//	k_m = (2/n) Σ_{j=1}^{n−1} (n−j)·[ ln j − ln(g_j/p) ]
//
// where g_j is the geometric mean distance of two collinear segments of
// length p whose centres are j·p apart:
//
//	ln(g_j/p) = ½[(j+1)²ln(j+1) + (j−1)²ln(j−1) − 2j²ln j] − 3/2.
//
// It costs O(n); RosaMutual is the O(1) form used by the model.
func RosaMutualSum(n int) float64 {
	if n < 2 {
		return 0
	}
	xlnx := func(x float64) float64 {
		if x == 0 {
			return 0
		}
		return x * x * math.Log(x)
	}
	var s float64
	for j := 1; j < n; j++ {
		fj := float64(j)
		lnG := 0.5*(xlnx(fj+1)+xlnx(fj-1)-2*xlnx(fj)) - 1.5
		s += float64(n-j) * (math.Log(fj) - lnG)
	}
	return 2 * s / float64(n)
}
