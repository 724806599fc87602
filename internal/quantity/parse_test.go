package quantity

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// implTol compares a parsed value with the same value computed by hand in
// SI: only rounding in the last bits may differ.
const implTol = 1e-12

func closeRel(got, want, tol float64) bool {
	if want == 0 {
		return math.Abs(got) <= tol
	}
	return math.Abs(got-want) <= tol*math.Abs(want)
}

type quantityCase struct {
	name string
	in   string
	want float64 // SI; unused when err is set
	err  string  // substring of the error, "" for success
}

func runQuantityCases(t *testing.T, want string, parse func(string) (float64, error), cases []quantityCase) {
	t.Helper()
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, err := parse(tc.in)
			if tc.err != "" {
				if err == nil {
					t.Fatalf("parse(%q) = %g, want error containing %q", tc.in, got, tc.err)
				}
				var qe *Error
				if !errors.As(err, &qe) {
					t.Fatalf("parse(%q) error %T, want *Error", tc.in, err)
				}
				if qe.Want != want || qe.Input != tc.in {
					t.Errorf("Error = %+v, want Want %q Input %q", qe, want, tc.in)
				}
				if !strings.Contains(err.Error(), tc.err) {
					t.Errorf("parse(%q) error %q, want it to contain %q", tc.in, err, tc.err)
				}
				return
			}
			if err != nil {
				t.Fatalf("parse(%q): %v", tc.in, err)
			}
			if !closeRel(got, tc.want, implTol) {
				t.Errorf("parse(%q) = %.15g, want %.15g", tc.in, got, tc.want)
			}
		})
	}
}

func TestParseLength(t *testing.T) {
	t.Parallel()
	// 1 in = 25.4 mm exactly (international inch, 1959).
	runQuantityCases(t, "length", func(s string) (float64, error) { l, err := ParseLength(s); return float64(l), err }, []quantityCase{
		{name: "mm", in: "4.5mm", want: 4.5e-3},
		{name: "space", in: "4.5 mm", want: 4.5e-3},
		{name: "padded", in: "  4.5mm\t", want: 4.5e-3},
		{name: "inch", in: "0.177in", want: 0.177 * 0.0254},
		{name: "inch mark", in: `0.177"`, want: 0.177 * 0.0254},
		{name: "inch word", in: "2 inches", want: 2 * 0.0254},
		{name: "cm", in: "1cm", want: 0.01},
		{name: "m", in: "2m", want: 2},
		{name: "um", in: "250um", want: 250e-6},
		{name: "micro sign", in: "250µm", want: 250e-6},
		{name: "greek mu", in: "250μm", want: 250e-6},
		{name: "mil", in: "10mil", want: 10 * 0.0254e-3},
		{name: "thou", in: "10thou", want: 10 * 0.0254e-3},
		{name: "upper case inch", in: "0.25IN", want: 0.25 * 0.0254},
		{name: "fraction", in: "1/4in", want: 0.25 * 0.0254},
		{name: "mixed fraction", in: "1-1/4in", want: 1.25 * 0.0254},
		{name: "mixed fraction space", in: "1 1/4 in", want: 1.25 * 0.0254},
		{name: "exponent", in: "1e-3m", want: 1e-3},
		{name: "leading dot", in: ".5mm", want: 0.5e-3},
		{name: "negative kept", in: "-1mm", want: -1e-3},
		{name: "bare number", in: "4.5", err: `length "4.5": add a unit, e.g. 4.5mm or 0.18in`},
		{name: "empty", in: "", err: "empty; give a length, e.g. 4.5mm"},
		{name: "blank", in: "   ", err: "empty"},
		{name: "garbage", in: "abc", err: "does not start with a number; give a length, e.g. 4.5mm or 0.18in"},
		{name: "nan", in: "NaN", err: "not a finite number"},
		{name: "nan unit", in: "nanmm", err: "not a finite number"},
		{name: "inf", in: "Infmm", err: "not a finite number"},
		{name: "overflow", in: "1e999mm", err: "not a finite number"},
		{name: "inductance", in: "48nH", err: "that is an inductance; expected a length such as 4.5mm"},
		{name: "frequency", in: "7MHz", err: "that is a frequency"},
		{name: "percent", in: "3%", err: "that is a percentage"},
		{name: "unknown unit", in: "4furlong", err: `unknown unit "furlong"`},
		{name: "mega metre", in: "4.5MM", err: "M means mega; for milli write mm"},
		{name: "decimal comma", in: "0,64mm", err: "use a decimal point, not a comma: 0.64mm"},
		{name: "zero denominator", in: "1/0in", err: "zero denominator"},
		{name: "prefix on inch", in: "3kin", err: `prefix "k" makes no sense for a length`},
	})
}

func TestParseInductance(t *testing.T) {
	t.Parallel()
	runQuantityCases(t, "inductance", func(s string) (float64, error) { l, err := ParseInductance(s); return float64(l), err }, []quantityCase{
		{name: "nH", in: "48nH", want: 48e-9},
		{name: "uH", in: "0.048uH", want: 48e-9},
		{name: "micro sign", in: "0.048µH", want: 48e-9},
		{name: "greek mu", in: "0.048μH", want: 48e-9},
		{name: "mH", in: "1.2mH", want: 1.2e-3},
		{name: "H", in: "1H", want: 1},
		{name: "pH", in: "500pH", want: 500e-12},
		{name: "lower case", in: "48nh", want: 48e-9},
		{name: "upper case", in: "48NH", want: 48e-9},
		{name: "space", in: "4.7 uH", want: 4.7e-6},
		{name: "mega", in: "1MH", err: "M means mega; for milli write mH"},
		{name: "bare number", in: "48", err: "add a unit, e.g. 48nH"},
		{name: "capacitance", in: "25pF", err: "that is a capacitance; expected an inductance"},
		{name: "length", in: "4.5mm", err: "that is a length"},
	})
}

func TestParseCapacitance(t *testing.T) {
	t.Parallel()
	runQuantityCases(t, "capacitance", func(s string) (float64, error) { c, err := ParseCapacitance(s); return float64(c), err }, []quantityCase{
		{name: "pF", in: "25pF", want: 25e-12},
		{name: "uF", in: "0.1uF", want: 0.1e-6},
		{name: "micro sign", in: "0.1µF", want: 0.1e-6},
		{name: "nF", in: "4.7nF", want: 4.7e-9},
		{name: "F", in: "1F", want: 1},
		{name: "lower case", in: "25pf", want: 25e-12},
		{name: "old MF", in: "1MF", err: "makes no sense for a capacitance"},
		{name: "mF", in: "1mF", err: "makes no sense for a capacitance"},
		{name: "inductance", in: "48nH", err: "that is an inductance"},
		{name: "bare", in: "25", err: "add a unit, e.g. 25pF"},
	})
}

func TestParseFrequency(t *testing.T) {
	t.Parallel()
	runQuantityCases(t, "frequency", func(s string) (float64, error) { f, err := ParseFrequency(s); return float64(f), err }, []quantityCase{
		{name: "MHz", in: "145MHz", want: 145e6},
		{name: "decimal MHz", in: "7.1MHz", want: 7.1e6},
		{name: "kHz", in: "455kHz", want: 455e3},
		{name: "GHz", in: "1GHz", want: 1e9},
		{name: "Hz", in: "50Hz", want: 50},
		{name: "lower mhz", in: "7.1mhz", want: 7.1e6},
		{name: "lower khz", in: "455khz", want: 455e3},
		{name: "lower ghz", in: "1ghz", want: 1e9},
		{name: "KHz", in: "455KHz", want: 455e3},
		{name: "upper", in: "145MHZ", want: 145e6},
		{name: "bare", in: "145", err: "add a unit, e.g. 145MHz"},
		{name: "length", in: "145mm", err: "that is a length; expected a frequency such as 7.1MHz"},
		{name: "nano hertz", in: "5nHz", err: "makes no sense for a frequency"},
		{name: "overflow after scale", in: "1e308GHz", err: "not a finite number"},
	})
}

func TestParseTemperature(t *testing.T) {
	t.Parallel()
	// 0 °C = 273.15 K (definition of the Celsius scale); °F = °C·9/5 + 32.
	runQuantityCases(t, "temperature", func(s string) (float64, error) { k, err := ParseTemperature(s); return float64(k), err }, []quantityCase{
		{name: "C", in: "20C", want: 293.15},
		{name: "degree C", in: "20°C", want: 293.15},
		{name: "degree space", in: "20 °C", want: 293.15},
		{name: "F", in: "68F", want: 293.15},
		{name: "degree F", in: "68°F", want: 293.15},
		{name: "K", in: "293K", want: 293},
		{name: "negative", in: "-40C", want: 233.15},
		{name: "lower", in: "20c", want: 293.15},
		{name: "bare", in: "20", err: "add a unit, e.g. 20C"},
		{name: "milli kelvin", in: "20mK", err: "makes no sense"},
		{name: "length", in: "20mm", err: "that is a length"},
	})
}

func TestParsePercent(t *testing.T) {
	t.Parallel()
	runQuantityCases(t, "percentage", ParsePercent, []quantityCase{
		{name: "bare", in: "3", want: 0.03},
		{name: "sign", in: "3%", want: 0.03},
		{name: "negative", in: "-2.5%", want: -0.025},
		{name: "space", in: "3.1 %", want: 0.031},
		{name: "zero", in: "0%", want: 0},
		{name: "empty", in: "", err: "empty"},
		{name: "nan", in: "NaN%", err: "not a finite number"},
		{name: "inf", in: "inf", err: "not a finite number"},
		{name: "overflow", in: "1e999%", err: "not a finite number"},
		{name: "unit", in: "3mm", err: `unexpected "mm"`},
		{name: "comma", in: "3,1%", err: "decimal point"},
	})
}

// FuzzParseLength checks that ParseLength never panics, never returns a
// non-finite value and always returns a *Error on failure.
func FuzzParseLength(f *testing.F) {
	for _, s := range []string{"4.5mm", "0.177in", `0.177"`, "1-1/4in", "250µm", "10mil", "1e308in", "NaN", "48nH", "0,5mm", "1/0in", "", " ", "-0m", "9999999999999999999999/1in"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		l, err := ParseLength(s)
		if err != nil {
			var qe *Error
			if !errors.As(err, &qe) {
				t.Fatalf("ParseLength(%q) error %T, want *Error", s, err)
			}
			return
		}
		if math.IsNaN(float64(l)) || math.IsInf(float64(l), 0) {
			t.Fatalf("ParseLength(%q) = %v, not finite", s, l)
		}
	})
}

func TestParseResistanceVoltage(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want float64
		volt bool
	}{
		{"50ohm", 50, false},
		{"0.05 ohm", 0.05, false},
		{"4.7kohm", 4700, false},
		{"50Ω", 50, false},
		{"100mohm", 0.1, false},
		{"1kV", 1000, true},
		{"500V", 500, true},
	} {
		t.Run(tc.in, func(t *testing.T) {
			parse := ParseResistance
			if tc.volt {
				parse = ParseVoltage
			}
			got, err := parse(tc.in)
			if err != nil || math.Abs(got-tc.want) > 1e-12*tc.want {
				t.Fatalf("%q = %g, %v; want %g", tc.in, got, err, tc.want)
			}
		})
	}
	for _, bad := range []string{"50", "50pF", "ohm", "1MV"} {
		if _, err := ParseResistance(bad); err == nil {
			t.Errorf("ParseResistance(%q) accepted", bad)
		}
	}
}
