package forms

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Gauge numbers: the zero sizes count down, so 0 is 0, 00 (2/0) is -1,
// 0000 (4/0) is -3 and SWG 7/0 is -6.
const (
	awgMin = -3 // 0000, the largest size ASTM B258 tabulates
	awgMax = 56 // the smallest size ASTM B258 tabulates (from memory)
	swgMin = -6 // 7/0
	swgMax = 50
)

const awgSource = "ASTM B258 definition d = 0.005 in · 92^((36 − n)/39)"

// AWGDiameter returns the bare diameter of American Wire Gauge n by the
// defining formula of ASTM B258,
//
//	d = 0.005 in · 92^((36 − n)/39),
//
// so 36 AWG is exactly 0.005 in and 0000 AWG exactly 0.4600 in. The zero
// sizes are negative: 0 is 0, 00 is -1, 000 is -2 and 0000 is -3. n runs from
// -3 to 56, the sizes the standard's table covers.
func AWGDiameter(n int) (unit.Length, error) {
	if n < awgMin || n > awgMax {
		return 0, fmt.Errorf("awg %d: out of range; AWG runs from 0000 (write -3) to %d", n, awgMax)
	}
	return unit.Length(0.005 * quantity.Inch * math.Pow(92, float64(36-n)/39)), nil
}

// SWGDiameter returns the bare diameter of Imperial Standard Wire Gauge n from
// the BS 3737 table. The zero sizes are negative: 0 is 0, 2/0 is -1 and 7/0 is
// -6. n runs from -6 to 50.
func SWGDiameter(n int) (unit.Length, error) {
	if n < swgMin || n > swgMax {
		return 0, fmt.Errorf("swg %d: out of range; SWG runs from 7/0 (write -6) to %d", n, swgMax)
	}
	d := loadBuiltin()
	if d.err != nil {
		return 0, d.err
	}
	return d.swg[n].dia, nil
}

// ParseGauge reads a wire gauge: "22awg", "22 AWG", "awg22", "AWG #22",
// "0000awg", "4/0awg", "18swg", "7/0 swg". ok is false, with a nil error, when
// s does not look like a gauge at all (it neither starts nor ends with awg or
// swg), so callers can try other forms. It returns an error when s looks like
// a gauge that does not exist, such as "60awg" or "51swg".
//
// The wire is bare copper of the gauge's diameter, enamelled to IEC 60317
// grade 1 where the enamel table covers the size, else uninsulated: the same
// rule as the built-in catalog rows.
func ParseGauge(s string) (Wire, bool, error) {
	t := strings.ToLower(strings.TrimSpace(s))
	var system, num string
	switch {
	case len(t) >= 3 && (t[:3] == "awg" || t[:3] == "swg"):
		system, num = t[:3], t[3:]
	case len(t) >= 3 && (t[len(t)-3:] == "awg" || t[len(t)-3:] == "swg"):
		system, num = t[len(t)-3:], t[:len(t)-3]
	default:
		return Wire{}, false, nil
	}
	num = strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(num), "#"))
	fail := func(reason string) (Wire, bool, error) {
		return Wire{}, true, fmt.Errorf("gauge %q: %s", s, reason)
	}
	if num == "" {
		return fail(fmt.Sprintf("add the gauge number, e.g. 22%s", system))
	}
	n, err := gaugeNumber(num)
	if err != nil {
		return fail(fmt.Sprintf("%v, e.g. 22%s or 4/0%s", err, system, system))
	}
	lo, hi, upper := awgMin, awgMax, "AWG"
	if system == "swg" {
		lo, hi, upper = swgMin, swgMax, "SWG"
	}
	if n < lo || n > hi {
		return fail(fmt.Sprintf("%s runs from %s to %s", upper, gaugeLabel(lo), gaugeLabel(hi)))
	}
	d := loadBuiltin()
	if d.err != nil {
		return Wire{}, true, d.err
	}
	w, err := gaugeWire(system, n, d)
	if err != nil {
		return Wire{}, true, err
	}
	return w, true, nil
}

var (
	slashZeroRE = regexp.MustCompile(`^(\d{1,2})/0$`)
	zerosRE     = regexp.MustCompile(`^0+$`)
	digitsRE    = regexp.MustCompile(`^\d{1,4}$`)
)

// gaugeNumber reads "22", "0", "0000" or "4/0" as a gauge number.
func gaugeNumber(s string) (int, error) {
	switch {
	case slashZeroRE.MatchString(s):
		k, _ := strconv.Atoi(strings.TrimSuffix(s, "/0"))
		if k < 1 {
			return 0, errors.New("n/0 needs n of 1 or more")
		}
		return 1 - k, nil
	case zerosRE.MatchString(s):
		return 1 - len(s), nil
	case digitsRE.MatchString(s):
		n, _ := strconv.Atoi(s)
		return n, nil
	}
	return 0, errors.New("gauges are whole numbers or n/0")
}

// gaugeLabel writes gauge n the way the trade does: 22, then 0 to 0000 as
// zeros, and n/0 beyond that (SWG 5/0 to 7/0).
func gaugeLabel(n int) string {
	switch {
	case n > 0:
		return strconv.Itoa(n)
	case n >= awgMin:
		return strings.Repeat("0", 1-n)
	default:
		return fmt.Sprintf("%d/0", 1-n)
	}
}

// gaugeName is the catalog name: "22awg", "0000awg", "18swg", "0swg", "7/0swg".
func gaugeName(system string, n int) string {
	if system == "swg" && n < 0 {
		return fmt.Sprintf("%d/0swg", 1-n)
	}
	return gaugeLabel(n) + system
}

// gaugeWire builds the catalog row for a gauge; d is passed in because this
// runs while the built-in data is being loaded.
func gaugeWire(system string, n int, d *builtinData) (Wire, error) {
	var (
		bare   unit.Length
		source string
	)
	switch system {
	case "awg":
		var err error
		if bare, err = AWGDiameter(n); err != nil {
			return Wire{}, err
		}
		source = awgSource
	case "swg":
		row, ok := d.swg[n]
		if !ok {
			return Wire{}, fmt.Errorf("swg %s: not in the built-in table", gaugeLabel(n))
		}
		bare, source = row.dia, row.source
	default:
		return Wire{}, fmt.Errorf("gauge system %q: use awg or swg", system)
	}
	w := Wire{
		Name:       gaugeName(system, n),
		System:     system,
		Bare:       bare,
		Overall:    bare,
		Insulation: "none",
		Conductor:  "copper",
		Source:     source,
		Origin:     OriginBuiltIn,
	}
	if o, err := d.enamelOverall(bare, "grade1"); err == nil {
		w.Overall, w.Insulation = o, "grade1"
		w.Source += "; overall: " + enamelSourceFor("grade1")
	}
	return w, nil
}
