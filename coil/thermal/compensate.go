package thermal

import (
	"math"
	"turnwise/coil"
)

// E12 is the IEC 60063 E12 series of preferred values, one decade.
var E12 = [12]float64{1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2}

// Part is one capacitor of a compensation split.
type Part struct {
	Value float64 // F, an E12 value
	Class Class
}

// Split is a fixed capacitance made of two capacitors of standard classes
// in parallel, chosen so that their combined coefficient cancels the rest
// of the circuit's drift.
type Split struct {
	A, B Part // B.Value is zero when one capacitor suffices
	// Total is A+B; ValueError is (Total − wanted)/wanted.
	Total, ValueError float64
	// Coefficient is the pair's combined coefficient per kelvin,
	// (A·τ_A + B·τ_B)/(A+B); Target the one that cancels the drift.
	Coefficient, Target float64
	// Residual is d ln f / dT left with the split in place;
	// Uncertainty the classes' tolerances carried to it (root sum square),
	// WorstCase their sum.
	Residual, Uncertainty, WorstCase float64
	// WithinTolerance is |Residual| ≤ Uncertainty: the split cancels the
	// drift as well as the classes' tolerances allow.
	WithinTolerance bool
}

// CompensateOptions bound the search.
type CompensateOptions struct {
	// MaxValueError is the largest |Total/wanted − 1| accepted; zero means
	// 0.05 (a trimmer or the coil's pitch takes up the rest).
	MaxValueError float64
	// Classes to combine by name; nil means CompensationClasses.
	Classes []string
}

// Compensate splits capacitance c into two capacitors of standard classes
// and E12 values whose combined coefficient brings the resonance's drift
// to zero. sensitivity is d ln f / d ln C for this capacitor (−½ in a
// simple tank) and target the coefficient that cancels the rest of the
// circuit (−τ_L in a simple tank). It minimises |Residual| in ppm/K plus
// half the value error in percent (our weighting: a percent of value
// costs a trimmer turn, a ppm/K costs drift), and refuses when no pair
// comes within MaxValueError.
func Compensate(c, sensitivity, target float64, opt CompensateOptions) (Split, error) {
	if !(c > 0) || math.IsInf(c, 0) {
		return Split{}, coil.InputErrorf("capacitance", "must be a positive capacitance to split")
	}
	if !(sensitivity < 0) || math.IsInf(sensitivity, 0) {
		return Split{}, coil.InputErrorf("sensitivity", "the capacitor does not set the resonance (d ln f/d ln C = %g): nothing to compensate with it", sensitivity)
	}
	maxErr := opt.MaxValueError
	if maxErr == 0 {
		maxErr = 0.05
	}
	names := opt.Classes
	if names == nil {
		names = CompensationClasses
	}
	var cls []Class
	for _, n := range names {
		k, err := ParseClass(n)
		if err != nil {
			return Split{}, err
		}
		cls = append(cls, k)
	}
	values := e12Upto(c * (1 + maxErr))
	best, bestScore := Split{}, math.Inf(1)
	consider := func(a, b Part) {
		total := a.Value + b.Value
		verr := total/c - 1
		if math.Abs(verr) > maxErr {
			return
		}
		s := evaluateSplit(a, b, sensitivity, target)
		s.Total, s.ValueError = total, verr
		score := math.Abs(s.Residual)*1e6 + 0.5*math.Abs(verr)*100
		if score < bestScore {
			best, bestScore = s, score
		}
	}
	for i, ka := range cls {
		for _, va := range values {
			consider(Part{va, ka}, Part{0, ka})
			for _, kb := range cls[i+1:] {
				for _, vb := range values {
					consider(Part{va, ka}, Part{vb, kb})
				}
			}
		}
	}
	if math.IsInf(bestScore, 1) {
		return Split{}, coil.InputErrorf("capacitance", "no two E12 values make %.4g pF within %.3g %%", c*1e12, maxErr*100)
	}
	best.Target = target
	return best, nil
}

// evaluateSplit puts a and b back into the drift: the pair's coefficient
// replaces the target's capacitor.
func evaluateSplit(a, b Part, sensitivity, target float64) Split {
	total := a.Value + b.Value
	coef := (a.Value*a.Class.Nominal + b.Value*b.Class.Nominal) / total
	ua := a.Value * a.Class.Tolerance / total
	ub := b.Value * b.Class.Tolerance / total
	s := Split{A: a, B: b, Coefficient: coef}
	s.Residual = sensitivity * (coef - target)
	s.Uncertainty = math.Abs(sensitivity) * math.Hypot(ua, ub)
	s.WorstCase = math.Abs(sensitivity) * (ua + ub)
	s.WithinTolerance = math.Abs(s.Residual) <= s.Uncertainty
	return s
}

// e12Upto lists the E12 values from 0.1 pF up to max, ascending.
func e12Upto(max float64) []float64 {
	var out []float64
	for e := -13; math.Pow10(e) <= max; e++ {
		for _, m := range E12 {
			// Two-digit mantissa over an exact power of ten: 56/1e12, not 5.6·1e-11.
			v := math.Round(m*10) / math.Pow10(1-e)
			if v <= max*(1+1e-12) {
				out = append(out, v)
			}
		}
	}
	return out
}
