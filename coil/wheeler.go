package coil

// Wheeler returns Wheeler's long-coil inductance and whether the geometry is
// inside the range where he states about 1 % accuracy (l > 0.8·a, a the
// radius). Wheeler 1928, with a and l in inches and L in µH:
//
//	L = a²·N² / (9a + 10l)
//
// The model never uses it; it is printed as a cross-check.
func Wheeler(n, diameterM, lengthM float64) (henry float64, valid bool) {
	const inch = 0.0254
	a := diameterM / 2 / inch
	l := lengthM / inch
	return a * a * n * n / (9*a + 10*l) * 1e-6, lengthM > 0.8*diameterM/2
}
