package coil

import "math"

// Steep pitch: the helix beyond Rosa's rings.
//
// Rosa's corrections (rosa.go) treat the winding as N rings of round wire
// on a current sheet of length N·p. The wire is a helix: it carries an
// axial current besides the azimuthal one, it is longer than the rings by
// sec ψ (ψ = atan(p/πD), the pitch angle) and its turns meet at helical,
// not axial, distances. The difference from the Neumann integral of the
// helix's centre line (the reference, helix_neumann_test.go) is
//
//	ΔL = μ0·a·N·[(sec ψ − 1)·ln(p/d) + T_ax + R(N, p/D)] + μ0·g/2π
//
// term by term:
//   - (sec ψ − 1)·ln(p/d): the round wire's self term follows the wire's
//     length (μ0·ℓ/2π per unit of ln(1/r)), the rings' follows N·πD;
//   - μ0·g/2π, g = (d/2)·e^(−1/4): the ends of the wire (the straight
//     wire's μ0/2π·[ℓ·asinh(ℓ/g) − √(ℓ² + g²) + g], Grover 1946, ch. 5);
//   - T_ax = [l·asinh(l/a) − √(l² + a²) + a]/(2π·a·N): the axial current,
//     a tube of radius a and length l = N·p carrying the coil's current
//     along its axis (the same straight-conductor formula with g = a);
//     the azimuthal and axial parts of a sheet helix have no mutual
//     inductance (their directions are orthogonal at every pair of points);
//   - R: what is left, the discrete turns' helical geometry. It depends on
//     N and p/D only (to 1e-3 over p/d 1.05 … 10), is 0 at p = 0 and of the
//     order of −0.1·p/D; helixPitchTable holds it, made from the integral
//     itself (helixpitch_gen_test.go, tag helixtable), and it is read by
//     bilinear interpolation in ln N and p/D.
//
// The whole model is within 0.2 % of the integral for N 1 … 100 and p/D up
// to 1 (TestInductanceHelixGrid); beyond p = D the table is held at its
// edge and the steep-pitch warning is set.

// The table's rows are N = 1, 1¼, … 16 (quarter turns: between whole
// turns the helix's last partial turn lies beside the first, which the
// rings' smooth k_m does not follow) and then whole turns about a quarter
// octave apart to 128 (helixRowN); its columns are uniform in √(p/D) (R
// has a logarithmic slope at p → 0 for partial turns) up to p/D = 1.2544.
const (
	helixTableN     = 73    // rows
	helixTableP     = 41    // columns
	helixQuarterMax = 16    // quarter-turn rows end here (row 60)
	helixTableDS    = 0.028 // column step in √(p/D)
	helixTableMaxN  = 128
	helixValidPD    = 1.0 // p/D checked against the integral
)

// helixRowN is N of each row.
var helixRowN = [helixTableN]float64{
	1, 1.25, 1.5, 1.75, 2, 2.25, 2.5, 2.75, 3, 3.25, 3.5, 3.75, 4, 4.25, 4.5, 4.75,
	5, 5.25, 5.5, 5.75, 6, 6.25, 6.5, 6.75, 7, 7.25, 7.5, 7.75, 8, 8.25, 8.5, 8.75,
	9, 9.25, 9.5, 9.75, 10, 10.25, 10.5, 10.75, 11, 11.25, 11.5, 11.75, 12, 12.25, 12.5, 12.75,
	13, 13.25, 13.5, 13.75, 14, 14.25, 14.5, 14.75, 15, 15.25, 15.5, 15.75, 16,
	19, 23, 27, 32, 38, 45, 54, 64, 76, 91, 108, 128,
}

// helixPitchR is R(N, p/D) from the table: linear in N between rows,
// linear in √(p/D) between columns, held at the table's edges.
func helixPitchR(n, pD float64) float64 {
	n = clamp(n, 1, helixTableMaxN)
	var i int
	if n < helixQuarterMax {
		i = int((n - 1) * 4)
	} else {
		i = 4 * (helixQuarterMax - 1)
		for i < helixTableN-2 && helixRowN[i+1] <= n {
			i++
		}
	}
	i = min(i, helixTableN-2)
	fx := (n - helixRowN[i]) / (helixRowN[i+1] - helixRowN[i])
	y := math.Sqrt(clamp(pD, 0, 1.5)) / helixTableDS
	j := min(int(y), helixTableP-2)
	fy := math.Min(y-float64(j), 1)
	r0, r1 := &helixPitchTable[i], &helixPitchTable[i+1]
	a := float64(r0[j]) + fy*float64(r0[j+1]-r0[j])
	b := float64(r1[j]) + fy*float64(r1[j+1]-r1[j])
	return a + fx*(b-a)
}

// helixTube is T_ax: the inductance of the axial current, a tube of radius
// a and length l, per μ0·a·N.
func helixTube(l, a, n float64) float64 {
	return (l*math.Asinh(l/a) - math.Hypot(l, a) + a) / (2 * math.Pi * a * n)
}

// HelixPitchCorrection is ΔL, what the helix of n turns at pitch, bare wire
// diameter d and mean diameter dm adds to Rosa's ring model at DC (H),
// and sec ψ, the wire's length per turn over πD.
func HelixPitchCorrection(n, pitch, d, dm float64) (dl, secPsi float64) {
	a := dm / 2
	t := pitch / (math.Pi * dm)
	secPsi = math.Sqrt(1 + t*t)
	g := d / 2 * math.Exp(-0.25)
	k := (secPsi-1)*math.Log(pitch/d) + helixTube(n*pitch, a, n) + helixPitchR(n, pitch/dm)
	return Mu0*a*n*k + Mu0*g/(2*math.Pi), secPsi
}

// HelixPitchMax is HelixPitchCorrection at pitch alone, for bounds.
func HelixPitchMax(n, pitch, d, dm float64) float64 {
	dl, _ := HelixPitchCorrection(n, pitch, d, dm)
	return dl
}
