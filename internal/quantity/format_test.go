package quantity

import "testing"

func TestFormat(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name, got, want string
	}{
		{"nH", FormatEng(4.8e-8, "H", 3), "48.0 nH"},
		{"MHz", FormatEng(145e6, "Hz", 4), "145.0 MHz"},
		{"zero", FormatEng(0, "H", 3), "0 H"},
		{"pF", FormatCapacitance(3.08e-13), "0.308 pF"},
		{"nF", FormatCapacitance(4.7e-9), "4.70 nF"},
		{"mm", LengthFormat{}.Format(8e-3), "8.00 mm"},
		{"µm", LengthFormat{}.Format(5.49e-6), "5.5 µm"},
		{"m", LengthFormat{}.Format(2.327), "2.327 m"},
		{"in", LengthFormat{Inches: true}.Format(0.0254), "1.000 in"}, // 1 in = 25.4 mm exactly (1959)
		{"mil", LengthFormat{Inches: true}.Format(0.0254e-3 * 5), "5.00 mil"},
		{"cut mm", LengthFormat{}.FormatCut(138.53e-3), "139 mm"},
		{"cut m", LengthFormat{}.FormatCut(2.32684), "2.327 m"},
		{"cut in", LengthFormat{Inches: true}.FormatCut(138.53e-3), "5.45 in"},
		{"turns", FormatTurns(5.25), "5¼"},
		{"half", FormatTurns(8.5), "8½"},
		{"quarter", FormatTurns(0.25), "¼"},
		{"none", FormatTurns(0), "0"},
		{"word quarter", FormatTurnsWord(0.75), "¾ turn"},
		{"word one", FormatTurnsWord(1), "1 turn"},
		{"word many", FormatTurnsWord(5.25), "5¼ turns"},
		{"percent", FormatPercent(0.031), "3.1 %"},
	}
	for _, tc := range tests {
		if tc.got != tc.want {
			t.Errorf("%s: got %q, want %q", tc.name, tc.got, tc.want)
		}
	}
}
