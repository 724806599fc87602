package main

import (
	"math"
	"testing"
)

// vhfJSON runs predict --json on the VHF coil with more flags.
func vhfJSON(t *testing.T, more ...string) map[string]any {
	t.Helper()
	return predictJSON(t, withArgs(vhfArgs, more...))
}

// --temp sets the conductor temperature: copper's resistance grows by
// α·ΔT, the a.c. resistance of a wire far thicker than the skin depth by
// √(1 + α·ΔT) (R_ac ∝ ρ/δ ∝ √ρ), and the same temperature in any unit gives
// the same coil.
func TestTempFlag(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	const alpha = 0.00393 // 1/K, annealed copper at 20 °C (IEC 60028 / IACS, from memory)
	room := vhfJSON(t)
	if got := num(t, room, "temperature"); math.Abs(got-293.15) > 1e-9 { // 20 °C = 293.15 K (SI definition of °C)
		t.Errorf("default temperature %g K, want 293.15 K (20 °C)", got)
	}
	tests := []struct {
		name    string
		temp    string
		kelvin  float64 // the same temperature in K, by hand
		deltaC  float64 // above 20 °C
		explain string
	}{
		{"celsius", "80C", 353.15, 60, "80 °C + 273.15 (SI definition of °C)"},
		{"fahrenheit", "176F", 353.15, 60, "(176 − 32)·5/9 = 80 °C (definition of °F)"},
		{"kelvin", "353.15K", 353.15, 60, "as given"},
		{"cold", "-40C", 233.15, -60, "−40 °C + 273.15"},
		{"room spelled out", "68F", 293.15, 0, "(68 − 32)·5/9 = 20 °C"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			hot := vhfJSON(t, "--temp", tc.temp)
			if got := num(t, hot, "temperature"); math.Abs(got-tc.kelvin) > 1e-9 {
				t.Errorf("temperature %g K, want %g K (%s)", got, tc.kelvin, tc.explain)
			}
			wantDC := 1 + alpha*tc.deltaC
			if got := num(t, hot, "r_dc") / num(t, room, "r_dc"); math.Abs(got/wantDC-1) > 1e-9 {
				t.Errorf("r_dc grew ×%.6f, want 1 + α·ΔT = %.6f", got, wantDC)
			}
			// Skin depth at 145 MHz is about 6 µm against a 1 mm wire: the
			// terms beyond √ρ are of order δ/d ≈ 0.6 %, and mostly cancel in
			// the ratio; 0.5 % allows them.
			wantAC := math.Sqrt(wantDC)
			if got := num(t, hot, "r_ac") / num(t, room, "r_ac"); math.Abs(got/wantAC-1) > 5e-3 {
				t.Errorf("r_ac grew ×%.5f, want √(1 + α·ΔT) = %.5f", got, wantAC)
			}
			// The inductance barely moves (only the skin effect's internal
			// inductance depends on ρ): within 0.1 %.
			if got := num(t, hot, "inductance") / num(t, room, "inductance"); math.Abs(got-1) > 1e-3 {
				t.Errorf("inductance moved ×%.5f with temperature", got)
			}
			if tc.deltaC > 0 && num(t, hot, "q") >= num(t, room, "q") {
				t.Errorf("Q %.1f at %s is not below Q %.1f at 20 °C", num(t, hot, "q"), tc.temp, num(t, room, "q"))
			}
		})
	}
}

// A bad --temp is refused with exit 2 naming the flag, on every command
// that takes it.
func TestTempFlagBadInput(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	commands := map[string][]string{
		"predict": vhfArgs,
		"design":  designVHFArgs,
		"tap":     withArgs(tapHFArgs, "--impedance-ratio", "1:50"),
	}
	tests := []struct {
		name, value string
	}{
		{"above range", "300C"},  // coil.MaxTemperatureC is 250 °C
		{"below range", "-100C"}, // coil.MinTemperatureC is −60 °C
		{"below absolute zero", "-5K"},
		{"no unit", "80"},
		{"a word", "hot"},
		{"a length", "80mm"},
	}
	for cmd, base := range commands {
		for _, tc := range tests {
			t.Run(cmd+" "+tc.name, func(t *testing.T) {
				checkRefusal(t, withArgs(base, "--temp", tc.value), exitBadInput, "--temp")
			})
		}
	}
}
