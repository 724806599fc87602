package quantity

import "testing"

func TestMessageFormats(t *testing.T) {
	cases := []struct {
		name string
		got  string
		want string
	}{
		{"frequency whole", FormatFrequency(145e6), "145 MHz"},
		{"frequency four figures", FormatFrequency(7.0512e6), "7.051 MHz"},
		{"frequency Hz", FormatFrequency(50), "50 Hz"},
		{"inductance", FormatInductance(48e-9), "48 nH"},
		{"inductance µH", FormatInductance(2.2782e-6), "2.278 µH"},
		{"capacitance pF", FormatCapacitanceShort(4.7e-12), "4.7 pF"},
		{"capacitance sub-pF", FormatCapacitanceShort(0.5e-12), "0.5 pF"},
		{"capacitance nF", FormatCapacitanceShort(2.2e-9), "2.2 nF"},
		{"length", FormatMillimetres(4.5e-3), "4.5 mm"},
		{"length rounding", FormatMillimetres(15.256e-3), "15.26 mm"},
		{"not finite", FormatFrequency(1 / zero()), "n/a"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			if c.got != c.want {
				t.Errorf("got %q, want %q", c.got, c.want)
			}
		})
	}
}

func zero() float64 { return 0 }
