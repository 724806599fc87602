package quantity

import (
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"

	"gonum.org/v1/gonum/unit"
)

// Error reports a quantity string that could not be read.
type Error struct {
	Input  string // the text as given
	Want   string // "length", "inductance", "capacitance", "frequency", "percentage", "temperature"
	Reason string // what is wrong and how to fix it
	Err    error  // the cause Reason was written from, if any (errors.Is/As see it)
}

func (e *Error) Error() string {
	return fmt.Sprintf("%s %q: %s", e.Want, e.Input, e.Reason)
}

func (e *Error) Unwrap() error { return e.Err }

// A base is one unit symbol and the SI prefixes that make sense with it.
type base struct {
	symbol   string   // as printed in hints
	names    []string // spellings, matched without regard to case
	factor   float64  // SI value of one unit
	prefixes string   // canonical prefix letters allowed: "pnumcMkG"
}

// A dimension is everything ParseX needs to read and explain one kind of quantity.
type dimension struct {
	want    string // "length"
	article string // "a length"
	eg      string // examples shown with most errors: "4.5mm or 0.18in"
	such    string // shown when the unit has the wrong dimension
	units   string // shown when the unit is unknown
	bases   []base
	// mIsMega reads a lowercase m prefix as mega: nobody means millihertz.
	mIsMega bool
	// convert, when set, replaces the plain scaling: temperature scales are affine.
	convert func(v float64, b *base) float64
}

const Inch = 0.0254 // m, exact by definition (1959 international Inch)

var (
	lengthDim = &dimension{
		want: "length", article: "a length",
		eg:    "4.5mm or 0.18in",
		such:  "4.5mm",
		units: "mm, cm, m, um, in, mil or thou",
		bases: []base{
			{symbol: "m", names: []string{"m"}, factor: 1, prefixes: "numc"},
			{symbol: "in", names: []string{"in", "Inch", "inches", `"`, "″"}, factor: Inch},
			{symbol: "mil", names: []string{"mil", "mils", "thou"}, factor: Inch / 1000},
		},
	}
	inductanceDim = &dimension{
		want: "inductance", article: "an inductance",
		eg:    "48nH or 0.048uH",
		such:  "48nH",
		units: "pH, nH, uH, mH or H",
		bases: []base{{symbol: "H", names: []string{"h"}, factor: 1, prefixes: "pnum"}},
	}
	capacitanceDim = &dimension{
		want: "capacitance", article: "a capacitance",
		eg:    "25pF or 0.1uF",
		such:  "25pF",
		units: "pF, nF, uF or F",
		bases: []base{{symbol: "F", names: []string{"f"}, factor: 1, prefixes: "pnu"}},
	}
	frequencyDim = &dimension{
		want: "frequency", article: "a frequency",
		eg:      "145MHz or 455kHz",
		such:    "7.1MHz",
		units:   "Hz, kHz, MHz or GHz",
		bases:   []base{{symbol: "Hz", names: []string{"hz"}, factor: 1, prefixes: "kMG"}},
		mIsMega: true,
	}
	temperatureDim = &dimension{
		want: "temperature", article: "a temperature",
		eg:    "20C, 68F or 293K",
		such:  "20C",
		units: "C, F or K",
		bases: []base{
			{symbol: "C", names: []string{"c", "°c", "℃", "degc"}, factor: 1},
			{symbol: "F", names: []string{"f", "°f", "℉", "degf"}, factor: 1},
			{symbol: "K", names: []string{"k"}, factor: 1},
		},
		convert: func(v float64, b *base) float64 {
			switch b.symbol {
			case "C":
				return v + 273.15
			case "F":
				return (v-32)*5/9 + 273.15
			}
			return v
		},
	}
	dimensions = []*dimension{lengthDim, inductanceDim, capacitanceDim, frequencyDim, temperatureDim, resistanceDim, voltageDim}
)

// ParseLength reads a length such as "4.5mm", "0.177in", `0.177"`, "1cm",
// "2m", "250um", "250µm", "10mil" or "10thou", and simple fractions of any
// unit: "1/4in", "1-1/4in". A bare number is refused: the unit is never guessed.
func ParseLength(s string) (unit.Length, error) {
	v, err := lengthDim.parse(s)
	return unit.Length(v), err
}

// ParseInductance reads an inductance such as "48nH", "0.048uH", "0.048µH",
// "1.2mH", "1H" or "500pH".
func ParseInductance(s string) (unit.Inductance, error) {
	v, err := inductanceDim.parse(s)
	return unit.Inductance(v), err
}

// ParseCapacitance reads a capacitance such as "25pF", "0.1uF", "4.7nF" or "1F".
// "mF" and "MF" are refused: old parts lists wrote MF or mfd for microfarads.
func ParseCapacitance(s string) (unit.Capacitance, error) {
	v, err := capacitanceDim.parse(s)
	return unit.Capacitance(v), err
}

// ParseFrequency reads a frequency such as "145MHz", "7.1MHz", "455kHz",
// "1GHz" or "50Hz". Case is ignored: "mhz" is megahertz.
func ParseFrequency(s string) (unit.Frequency, error) {
	v, err := frequencyDim.parse(s)
	return unit.Frequency(v), err
}

// ParseTemperature reads a temperature in Celsius, Fahrenheit or kelvin
// ("20C", "20°C", "68F", "293K") and returns it in kelvin.
func ParseTemperature(s string) (unit.Temperature, error) {
	v, err := temperatureDim.parse(s)
	return unit.Temperature(v), err
}

// ParsePercent reads a percentage, with or without the sign: "3", "3%" and
// "-2.5%" give 0.03, 0.03 and -0.025. A bare number is a percentage too.
func ParsePercent(s string) (float64, error) {
	fail := func(reason string) (float64, error) {
		return 0, &Error{Input: s, Want: "percentage", Reason: reason}
	}
	t := strings.TrimSpace(s)
	if t == "" {
		return fail("empty; give a percentage, e.g. 3%")
	}
	t = strings.TrimSpace(strings.TrimSuffix(t, "%"))
	v, rest, reason := splitNumber(t)
	if reason == noNumber {
		return fail(noNumber + "; give a percentage, e.g. 3%")
	}
	if reason != "" {
		return fail(reason)
	}
	if rest != "" {
		return fail(fmt.Sprintf("unexpected %q after the number; write a percentage, e.g. 3%%", rest))
	}
	v /= 100
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return fail("not a finite number")
	}
	return v, nil
}

// parse reads a number and a unit of dimension d and returns the SI value.
func (d *dimension) parse(s string) (float64, error) {
	fail := func(reason string) (float64, error) {
		return 0, &Error{Input: s, Want: d.want, Reason: reason}
	}
	t := strings.TrimSpace(s)
	if t == "" {
		return fail(fmt.Sprintf("empty; give %s, e.g. %s", d.article, d.eg))
	}
	v, u, reason := splitNumber(t)
	if reason == noNumber {
		return fail(fmt.Sprintf("%s; give %s, e.g. %s", noNumber, d.article, d.eg))
	}
	if reason != "" {
		return fail(reason)
	}
	if u == "" {
		return fail("add a unit, e.g. " + d.eg)
	}
	b, scale, reason := d.unit(u)
	if reason != "" {
		return fail(reason)
	}
	if d.convert != nil {
		v = d.convert(v*scale, b)
	} else {
		v *= scale * b.factor
	}
	if math.IsInf(v, 0) || math.IsNaN(v) {
		return fail("not a finite number")
	}
	return v, nil
}

// unit finds u among d's units. It returns the base, the prefix scale, or a
// reason that names what u is when it belongs to another dimension.
func (d *dimension) unit(u string) (*base, float64, string) {
	b, scale, reason := d.match(u)
	if b != nil {
		return b, scale, ""
	}
	if u == "%" {
		return nil, 0, fmt.Sprintf("that is a percentage; expected %s such as %s", d.article, d.such)
	}
	for _, other := range dimensions {
		if other == d {
			continue
		}
		if ob, _, _ := other.match(u); ob != nil {
			return nil, 0, fmt.Sprintf("that is %s; expected %s such as %s", other.article, d.article, d.such)
		}
	}
	if reason != "" {
		return nil, 0, reason
	}
	return nil, 0, fmt.Sprintf("unknown unit %q; use %s", u, d.units)
}

// match splits u into prefix and base. A prefix letter's case is ignored
// except for m and M, which differ (milli, mega).
func (d *dimension) match(u string) (*base, float64, string) {
	var reason string
	for i := range d.bases {
		b := &d.bases[i]
		for _, name := range b.names {
			if len(u) < len(name) || !strings.EqualFold(u[len(u)-len(name):], name) {
				continue
			}
			p := u[:len(u)-len(name)]
			if p == "" {
				return b, 1, ""
			}
			letter, scale, ok := prefix(p, d.mIsMega)
			if !ok {
				continue
			}
			if !strings.ContainsRune(b.prefixes, letter) {
				reason = fmt.Sprintf("prefix %q makes no sense for %s; use %s", p, d.article, d.units)
				if p == "M" && strings.ContainsRune(b.prefixes, 'm') {
					reason = fmt.Sprintf("M means mega; for milli write m%s", b.symbol)
				}
				continue
			}
			return b, scale, ""
		}
	}
	return nil, 0, reason
}

// prefix maps an SI prefix to its canonical letter and scale.
func prefix(p string, mIsMega bool) (rune, float64, bool) {
	switch p {
	case "p", "P":
		return 'p', 1e-12, true
	case "n", "N":
		return 'n', 1e-9, true
	case "u", "U", "µ", "μ": // U+00B5 micro sign and U+03BC Greek mu
		return 'u', 1e-6, true
	case "m":
		if mIsMega {
			return 'M', 1e6, true
		}
		return 'm', 1e-3, true
	case "c", "C":
		return 'c', 1e-2, true
	case "k", "K":
		return 'k', 1e3, true
	case "M":
		return 'M', 1e6, true
	case "G", "g":
		return 'G', 1e9, true
	}
	return 0, 0, false
}

const noNumber = "does not start with a number"

var (
	// Mixed or plain fractions: "1-1/4", "1 1/4", "3/4".
	fractionRE = regexp.MustCompile(`^([+-]?)(?:(\d+)[- ])?(\d+)/(\d+)`)
	decimalRE  = regexp.MustCompile(`^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?`)
)

// splitNumber reads the leading number of t and returns it with the trimmed
// rest, or a reason the number could not be read.
func splitNumber(t string) (float64, string, string) {
	if m := fractionRE.FindStringSubmatch(t); m != nil {
		whole := 0.0
		if m[2] != "" {
			whole, _ = strconv.ParseFloat(m[2], 64)
		}
		num, _ := strconv.ParseFloat(m[3], 64)
		den, _ := strconv.ParseFloat(m[4], 64)
		if den == 0 {
			return 0, "", "the fraction has a zero denominator"
		}
		v := whole + num/den
		if m[1] == "-" {
			v = -v
		}
		if math.IsInf(v, 0) || math.IsNaN(v) {
			return 0, "", "not a finite number"
		}
		return v, strings.TrimSpace(t[len(m[0]):]), ""
	}
	num := decimalRE.FindString(t)
	if num == "" {
		lower := strings.ToLower(strings.TrimLeft(t, "+-"))
		if strings.HasPrefix(lower, "nan") || strings.HasPrefix(lower, "inf") {
			return 0, "", "not a finite number"
		}
		return 0, "", noNumber
	}
	rest := t[len(num):]
	if len(rest) > 1 && rest[0] == ',' && rest[1] >= '0' && rest[1] <= '9' {
		return 0, "", fmt.Sprintf("use a decimal point, not a comma: %s", strings.Replace(t, ",", ".", 1))
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, "", "not a finite number"
	}
	return v, strings.TrimSpace(rest), ""
}
