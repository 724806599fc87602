package match

import (
	"math"
	"math/cmplx"
)

// gammaC is the complex reflection at dial positions u from the reduced
// network; ok false where the equations are singular.
func (e *engine) gammaC(u []float64) (complex128, bool) {
	e.evals++
	for k := range e.values {
		e.values[k] = e.capacitance(k, u[k])
	}
	z, ok := e.fast.zin(e.values, e.z)
	if !ok {
		return 0, false
	}
	z0 := complex(e.fast.z0, 0)
	g := (z - z0) / (z + z0)
	if cmplx.IsNaN(g) || cmplx.IsInf(g) {
		return 0, false
	}
	return g, true
}

// levenberg drives Γ(u) = 0 by a projected Levenberg–Marquardt
// iteration (Nocedal and Wright, Numerical Optimization, §10.3) on the
// residual (Re Γ, Im Γ) over the dial box [0, 1]^d, with a forward
// difference Jacobian. It returns the best point it visited: from a start
// in a match's basin it converges quadratically to |Γ| < gammaStop in a
// handful of iterations; a minimum on the box's edge or with |Γ| > 0
// (an unmatchable load) it approaches as a damped Gauss–Newton would.
func (e *engine) levenberg(u0 []float64) candidate {
	d := len(u0)
	u := append([]float64(nil), u0...)
	g, ok := e.gammaC(u)
	if !ok {
		return candidate{u: u, gamma: 1}
	}
	lambda := 1e-3
	jr := make([]float64, 2*d) // Jacobian, row-major 2×d
	trial := make([]float64, d)
	a := make([]float64, d*d)
	b := make([]float64, d)
	for iter := 0; iter < 40 && cmplx.Abs(g) >= gammaStop; iter++ {
		for k := range d {
			h := 1e-6
			if u[k]+h > 1 {
				h = -h
			}
			copy(trial, u)
			trial[k] += h
			gk, ok := e.gammaC(trial)
			if !ok {
				return candidate{u: u, gamma: cmplx.Abs(g)}
			}
			dg := (gk - g) / complex(h, 0)
			jr[k], jr[d+k] = real(dg), imag(dg)
		}
		improved := false
		for try := 0; try < 8; try++ {
			// (JᵀJ + λ·diag(JᵀJ)) δ = −Jᵀr
			for i := range d {
				for j := range d {
					a[i*d+j] = jr[i]*jr[j] + jr[d+i]*jr[d+j]
				}
				b[i] = -(jr[i]*real(g) + jr[d+i]*imag(g))
			}
			for i := range d {
				a[i*d+i] += lambda*a[i*d+i] + 1e-12
			}
			delta, ok := solveSmall(append([]float64(nil), a...), b, d)
			if !ok {
				break
			}
			// Active set: a dial at a stop whose step points past it is
			// held there and the others solved for again.
			held := false
			for k := range d {
				if (u[k] <= 0 && delta[k] < 0) || (u[k] >= 1 && delta[k] > 0) {
					for j := range d {
						a[k*d+j], a[j*d+k] = 0, 0
					}
					a[k*d+k], b[k] = 1, 0
					held = true
				}
			}
			if held {
				if delta, ok = solveSmall(a, b, d); !ok {
					break
				}
			}
			for k := range d {
				trial[k] = math.Min(1, math.Max(0, u[k]+delta[k]))
			}
			gt, ok := e.gammaC(trial)
			if ok && cmplx.Abs(gt) < cmplx.Abs(g) {
				copy(u, trial)
				g = gt
				lambda = math.Max(lambda/4, 1e-9)
				improved = true
				break
			}
			lambda *= 8
		}
		if !improved {
			break
		}
	}
	return candidate{u: u, gamma: cmplx.Abs(g)}
}

// solveSmall solves the d×d system a·x = b (a overwritten; b kept).
func solveSmall(a, b []float64, d int) ([]float64, bool) {
	x := append([]float64(nil), b...)
	if !gaussSolve(a, x, d, math.Abs) {
		return nil, false
	}
	for _, v := range x {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, false
		}
	}
	return x, true
}
