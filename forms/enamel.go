package forms

import (
	"fmt"
	"math"
	"strings"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// enamelSourceFor names the table column used for grade ("grade2").
func enamelSourceFor(grade string) string {
	return "IEC 60317-0-1 " + strings.Replace(grade, "grade", "grade ", 1) + " maximum (from memory)"
}

// EnamelOverall returns the overall diameter of enamelled round copper wire of
// bare diameter bare and enamel grade "none", "grade1" or "grade2", using the
// maximum overall diameters of IEC 60317-0-1 (data/enamel.csv, from memory).
// Between tabulated nominal sizes it interpolates the build (overall minus
// bare) linearly. It returns an error for diameters outside the table and for
// "grade3", which the table does not carry.
func EnamelOverall(bare unit.Length, grade string) (unit.Length, error) {
	d := loadBuiltin()
	if d.err != nil {
		return 0, d.err
	}
	return d.enamelOverall(bare, grade)
}

func (d *builtinData) enamelOverall(bare unit.Length, grade string) (unit.Length, error) {
	if math.IsNaN(float64(bare)) || math.IsInf(float64(bare), 0) || bare <= 0 {
		return 0, fmt.Errorf("bare diameter %s: must be a positive length", mm(bare))
	}
	var col func(enamelRow) unit.Length
	switch grade {
	case "none":
		return bare, nil
	case "grade1":
		col = func(r enamelRow) unit.Length { return r.grade1 }
	case "grade2":
		col = func(r enamelRow) unit.Length { return r.grade2 }
	case "grade3":
		return 0, fmt.Errorf("enamel grade3 is not in the built-in table; give the measured overall diameter instead, e.g. %s", mm(bare*1.1))
	default:
		return 0, fmt.Errorf("enamel grade %q: use none, grade1, grade2 or grade3", grade)
	}
	t := d.enamel
	// Tabulated values have three decimals in mm; allow for the conversion.
	const edgeTol = 1e-9
	first, last := t[0].nominal, t[len(t)-1].nominal
	if float64(bare) < float64(first)*(1-edgeTol) || float64(bare) > float64(last)*(1+edgeTol) {
		return 0, fmt.Errorf("bare diameter %s is outside the enamel table (%s to %s); give the overall diameter instead", mm(bare), mm(first), mm(last))
	}
	bare = max(first, min(last, bare))
	for i := 1; i < len(t); i++ {
		lo, hi := t[i-1], t[i]
		if bare > hi.nominal {
			continue
		}
		f := float64((bare - lo.nominal) / (hi.nominal - lo.nominal))
		build := float64(col(lo)-lo.nominal) + f*float64((col(hi)-hi.nominal)-(col(lo)-lo.nominal))
		return bare + unit.Length(build), nil
	}
	return 0, fmt.Errorf("bare diameter %s is outside the enamel table", mm(bare))
}

// ParseInsulation reads how a wire of bare diameter bare is insulated and
// returns its overall diameter and the Insulation label. s is one of
//
//	none, bare                   uninsulated ("none")
//	grade1, g1, single           IEC 60317 grade 1 enamel ("grade1")
//	grade2, g2, heavy            IEC 60317 grade 2 enamel ("grade2")
//	grade3, g3                   grade 3 ("grade3"; the table lacks it, so this errs)
//	an overall diameter "1.06mm" measured over the insulation ("custom"), >= bare
func ParseInsulation(s string, bare unit.Length) (overall unit.Length, insulation string, err error) {
	key := strings.Join(strings.Fields(strings.ToLower(s)), "")
	grade := ""
	switch key {
	case "none", "bare":
		grade = "none"
	case "grade1", "g1", "single":
		grade = "grade1"
	case "grade2", "g2", "heavy":
		grade = "grade2"
	case "grade3", "g3":
		grade = "grade3"
	}
	if grade != "" {
		o, err := EnamelOverall(bare, grade)
		if err != nil {
			return 0, "", fmt.Errorf("insulation %q: %w", s, err)
		}
		return o, grade, nil
	}
	o, err := quantity.ParseLength(s)
	if err != nil {
		if strings.TrimSpace(s) == "" || !startsWithDigit(s) {
			return 0, "", fmt.Errorf("insulation %q: use none, grade1, grade2, grade3 or the overall diameter, e.g. %s", s, mm(bare*1.1))
		}
		return 0, "", fmt.Errorf("insulation: %w", err)
	}
	// A measured overall equal to the bare size within rounding is bare wire.
	const sameTol = 1e-9
	switch {
	case float64(o) < float64(bare)*(1-sameTol):
		return 0, "", fmt.Errorf("insulation %q: the overall diameter is less than the bare %s; give the diameter over the insulation", s, mm(bare))
	case float64(o) <= float64(bare)*(1+sameTol):
		return bare, "none", nil
	}
	return o, "custom", nil
}

func startsWithDigit(s string) bool {
	t := strings.TrimLeft(strings.TrimSpace(s), "+-.")
	return t != "" && t[0] >= '0' && t[0] <= '9'
}

// mm formats a length for messages: "0.6438mm".
func mm(l unit.Length) string {
	return fmt.Sprintf("%.4gmm", float64(l)*1e3)
}
