package quantity

import (
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/unit"
)

// ParsePerKelvin reads a temperature coefficient: "-750ppm/K", "+70 ppm/K",
// "70ppm/°C", "16.5e-6/K" or "0.00393/K". A kelvin and a degree Celsius are
// the same step, so /C and /°C are accepted. The result is per kelvin
// (70 ppm/K is 70e-6). A bare number is refused: ppm or not is never guessed.
func ParsePerKelvin(s string) (float64, error) {
	bad := func(reason string) error {
		return &Error{Input: s, Want: "temperature coefficient", Reason: reason}
	}
	t := strings.TrimSpace(s)
	if t == "" {
		return 0, bad("is empty; give e.g. -750ppm/K or 16.5e-6/K")
	}
	v, rest, why := splitNumber(t)
	if why != "" {
		return 0, bad(why + "; give e.g. -750ppm/K or 16.5e-6/K")
	}
	u := strings.ToLower(strings.ReplaceAll(rest, " ", ""))
	scale := 1.0
	if strings.HasPrefix(u, "ppm") {
		scale, u = 1e-6, u[3:]
	}
	switch u {
	case "/k", "/c", "/°c", "/degc", "/℃":
	case "":
		return 0, bad("needs its unit: write ppm/K (e.g. -750ppm/K) or /K (e.g. 16.5e-6/K)")
	default:
		return 0, bad(fmt.Sprintf("unit %q is not ppm/K or /K", rest))
	}
	x := v * scale
	if math.Abs(x) > 0.1 {
		return 0, bad("is more than 10 % per kelvin; check the ppm")
	}
	return x, nil
}

// FormatPPMPerK prints a per-kelvin coefficient as ppm/K with sig
// significant figures and an explicit sign: "+375 ppm/K", "-1.2 ppm/K".
func FormatPPMPerK(x float64, sig int) string {
	ppm := roundSig(x*1e6, sig)
	if ppm == 0 {
		return "0 ppm/K"
	}
	dec := max(0, sig-1-int(math.Floor(math.Log10(math.Abs(ppm)))))
	return fmt.Sprintf("%+.*f ppm/K", dec, ppm)
}

// ParseTemperatureRange reads a range of temperatures written as two
// temperatures joined by a hyphen, "10C-40C", "-10C-40C", "50F-104F" or
// "283K-313K" (also "10C..40C" and "10C to 40C"), and returns its ends in
// kelvin, low first. The ends must differ and each carries its unit.
func ParseTemperatureRange(s string) (low, high unit.Temperature, err error) {
	bad := func(reason string) error {
		return &Error{Input: s, Want: "temperature range", Reason: reason + "; give e.g. 10C-40C"}
	}
	t := strings.TrimSpace(s)
	var a, b string
	switch {
	case strings.Contains(t, ".."):
		a, b, _ = strings.Cut(t, "..")
	case strings.Contains(strings.ToLower(t), " to "):
		i := strings.Index(strings.ToLower(t), " to ")
		a, b = t[:i], t[i+4:]
	default:
		// The separating hyphen follows a unit letter; a leading one is a sign.
		i := -1
		for j := 1; j < len(t); j++ {
			if t[j] == '-' && !strings.ContainsRune("0123456789.eE+- ", rune(t[j-1])) {
				i = j
				break
			}
		}
		if i < 0 {
			return 0, 0, bad("is not two temperatures joined by a hyphen")
		}
		a, b = t[:i], t[i+1:]
	}
	lo, err := ParseTemperature(strings.TrimSpace(a))
	if err != nil {
		return 0, 0, bad(fmt.Sprintf("its low end: %v", err))
	}
	hi, err := ParseTemperature(strings.TrimSpace(b))
	if err != nil {
		return 0, 0, bad(fmt.Sprintf("its high end: %v", err))
	}
	if lo > hi {
		lo, hi = hi, lo
	}
	if hi-lo < 1e-9 {
		return 0, 0, bad("has equal ends")
	}
	if lo <= 0 {
		return 0, 0, bad("goes below absolute zero")
	}
	return lo, hi, nil
}
