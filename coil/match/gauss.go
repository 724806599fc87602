package match

// gaussSolve solves the n×n system a·x = b by Gaussian elimination with
// partial pivoting, in place: x holds b on entry and the solution on exit,
// a is overwritten. abs is the magnitude that chooses the pivot. It
// reports false for a singular (or numerically singular) matrix; the
// caller checks the solution for NaN and Inf where it matters. One
// function serves the real least-squares step (lm.go) and the complex
// nodal solve (fast.go).
func gaussSolve[T float64 | complex128](a, x []T, n int, abs func(T) float64) bool {
	for k := 0; k < n; k++ {
		piv, best := k, abs(a[k*n+k])
		for i := k + 1; i < n; i++ {
			if v := abs(a[i*n+k]); v > best {
				piv, best = i, v
			}
		}
		if !(best > 1e-300) {
			return false
		}
		if piv != k {
			for j := k; j < n; j++ {
				a[k*n+j], a[piv*n+j] = a[piv*n+j], a[k*n+j]
			}
			x[k], x[piv] = x[piv], x[k]
		}
		inv := 1 / a[k*n+k]
		for i := k + 1; i < n; i++ {
			m := a[i*n+k] * inv
			if m == 0 {
				continue
			}
			for j := k + 1; j < n; j++ {
				a[i*n+j] -= m * a[k*n+j]
			}
			x[i] -= m * x[k]
		}
	}
	for i := n - 1; i >= 0; i-- {
		v := x[i]
		for j := i + 1; j < n; j++ {
			v -= a[i*n+j] * x[j]
		}
		x[i] = v / a[i*n+i]
	}
	return true
}
