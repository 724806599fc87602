package coil

import "math"

// Bounds on the model's tables over a span of l/D, for searches that prune
// by them (the design search). They read the same tables as MedhurstH and
// ProximityFactor and interpolate them the same way.

// MedhurstHMinOver is the least MedhurstH over l/D in [a, b] (b may be
// +Inf): H is piecewise linear in ln(l/D) between the table's rows, falls
// before the table and rises after it, so the least is at an end or a row.
func MedhurstHMinOver(a, b float64) float64 {
	m, _ := MedhurstH(a)
	if !math.IsInf(b, 1) {
		hb, _ := MedhurstH(b)
		m = math.Min(m, hb)
	}
	for i, ld := range medhurstLD {
		if ld > a && ld < b {
			m = math.Min(m, medhurstH[i])
		}
	}
	return m
}

// ProximityRow is Medhurst's Φ at one spacing d/p as a function of l/D: the
// table's columns interpolated in d/p as ProximityFactor does, so that
// bounds over a span of l/D cost a few comparisons.
type ProximityRow struct {
	col    [len(proximityLD)]float64
	inf    float64                   // the l/D → ∞ limit
	sufMin [len(proximityLD)]float64 // least of col[i:] and inf
}

func NewProximityRow(dOverP float64) ProximityRow {
	var r ProximityRow
	last := len(proximityDP) - 1
	switch {
	case dOverP <= 0:
		for i := range r.col {
			r.col[i] = 1
		}
		r.inf = 1
	case dOverP < proximityDP[0]:
		f := dOverP / proximityDP[0]
		for i := range r.col {
			r.col[i] = 1 + f*(proximityPhi[0][i]-1)
		}
		r.inf = 1 + f*(proximityInf[0]-1)
	default:
		if dOverP > 1 {
			dOverP = 1
		}
		j := int(dOverP*10+1e-9) - 1
		if j >= last {
			r.col = proximityPhi[last]
			r.inf = proximityInf[last]
			break
		}
		t := (dOverP - proximityDP[j]) / (proximityDP[j+1] - proximityDP[j])
		for i := range r.col {
			r.col[i] = proximityPhi[j][i] + t*(proximityPhi[j+1][i]-proximityPhi[j][i])
		}
		r.inf = proximityInf[j] + t*(proximityInf[j+1]-proximityInf[j])
	}
	m := r.inf
	for i := len(r.col) - 1; i >= 0; i-- {
		m = math.Min(m, r.col[i])
		r.sufMin[i] = m
	}
	return r
}

// At is Φ at l/D, interpolated as ProximityFactor does.
func (r *ProximityRow) At(ld float64) float64 {
	n := len(proximityLD)
	if ld >= proximityLD[n-1] {
		u := proximityLD[n-1] / ld // 1 … 0 (+Inf gives the limit)
		return r.inf + u*(r.col[n-1]-r.inf)
	}
	i := 0
	for i < n-2 && proximityLD[i+1] <= ld {
		i++
	}
	t := (ld - proximityLD[i]) / (proximityLD[i+1] - proximityLD[i])
	return r.col[i] + t*(r.col[i+1]-r.col[i])
}

// MinOver is the least Φ over l/D in [a, b] (b may be +Inf): Φ is
// piecewise linear between the columns and monotone beyond the last, so
// the least is at an end or a column.
func (r *ProximityRow) MinOver(a, b float64) float64 {
	m := math.Min(r.At(a), r.At(b))
	for i, ld := range proximityLD {
		if ld > a {
			if math.IsInf(b, 1) {
				return math.Min(m, r.sufMin[i])
			}
			if ld < b {
				m = math.Min(m, r.col[i])
			}
		}
	}
	return m
}

// ProximityMinOver is the least ProximityFactor over l/D in [ldA, ldB] at
// spacing dOverP.
func ProximityMinOver(ldA, ldB, dOverP float64) float64 {
	r := NewProximityRow(dOverP)
	return r.MinOver(ldA, ldB)
}

// ProximityMin is a lower bound on ProximityFactor(l/D, d/p) over every
// l/D, for spacing dOverP or closer: Φ rises with d/p in every column of
// Medhurst's table, and the interpolation keeps that order.
func ProximityMin(dOverP float64) float64 {
	r := NewProximityRow(dOverP)
	return r.sufMin[0]
}
