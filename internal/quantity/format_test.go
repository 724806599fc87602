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
		{"small mm, never µm", LengthFormat{}.Format(5.49e-6), "0.00549 mm"},
		{"75.9 µm in mm", LengthFormat{}.Format(75.9e-6), "0.0759 mm"},
		{"1 µm in mm", LengthFormat{}.Format(1e-6), "0.001 mm"},
		{"m", LengthFormat{}.Format(2.327), "2.327 m"},
		{"in", LengthFormat{Inches: true}.Format(0.0254), "1.000 in"}, // 1 in = 25.4 mm exactly (1959)
		{"small in, never mil", LengthFormat{Inches: true}.Format(0.0254e-3 * 5), "0.005 in"},
		{"8.68 mil in in", LengthFormat{Inches: true}.Format(8.68 * 0.0254e-3), "0.00868 in"}, // 1 mil = 25.4 µm exactly
		{"size as stated", LengthFormat{}.FormatSize(0.315e-3), "0.315 mm"},                   // IEC 60317 R20 size, forms/data/wire.csv
		{"size whole", LengthFormat{}.FormatSize(1e-3), "1.00 mm"},
		{"size 22awg", LengthFormat{}.FormatSize(0.6438e-3), "0.6438 mm"}, // 22 AWG, ASTM B258 (from memory)
		{"size in", LengthFormat{Inches: true}.FormatSize(0.0254e-3 * 40), "0.040 in"},
		{"size 0.315 mm in in", LengthFormat{Inches: true}.FormatSize(0.315e-3), "0.0124 in"},
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
