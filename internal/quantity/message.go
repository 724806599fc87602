package quantity

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode"
)

// Messages (errors, warnings, advice) print numbers a little more loosely
// than tables: four significant figures with trailing zeros dropped, so a
// sentence reads "145 MHz", not "145.0 MHz". They share FormatEng's
// choice of prefix.

// FormatShort prints v with an SI prefix and at most four significant
// figures, trailing zeros dropped: FormatShort(1.45e8, "Hz") = "145 MHz".
func FormatShort(v float64, unitSym string) string {
	s := FormatEng(v, unitSym, 4)
	num, rest, ok := strings.Cut(s, " ")
	if !ok || !strings.Contains(num, ".") {
		return s
	}
	num = strings.TrimRight(strings.TrimRight(num, "0"), ".")
	return num + " " + rest
}

// FormatFrequency prints a frequency for a message: "7.05 MHz".
func FormatFrequency(f float64) string { return FormatShort(f, "Hz") }

// FormatInductance prints an inductance for a message: "48 nH".
func FormatInductance(h float64) string { return FormatShort(h, "H") }

// FormatCapacitanceShort prints a capacitance for a message, in pF below
// 1 nF as FormatCapacitance does: "4.7 pF", "0.5 pF", "2.2 nF".
func FormatCapacitanceShort(c float64) string {
	if c > 0 && c < 1e-9 {
		return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.4f", roundSig(c*1e12, 4)), "0"), ".") + " pF"
	}
	return FormatShort(c, "F")
}

// FormatMillimetres prints a length in millimetres for a message: "4.5 mm".
func FormatMillimetres(m float64) string {
	return strings.TrimRight(strings.TrimRight(fmt.Sprintf("%.6f", roundSig(m*1e3, 4)), "0"), ".") + " mm"
}

// roundSig rounds x to sig significant figures.
func roundSig(x float64, sig int) float64 {
	if x == 0 || math.IsNaN(x) || math.IsInf(x, 0) {
		return x
	}
	p := math.Pow(10, float64(sig-1-int(math.Floor(math.Log10(math.Abs(x))))))
	return math.Round(x*p) / p
}

// maxEcho is how much of one word of the user's input an error repeats.
const maxEcho = 80

// Clip shortens an echoed input longer than maxEcho characters to its
// first 50 and last 29 around "…": a long path keeps its file name.
func Clip(s string) string {
	r := []rune(s)
	if len(r) <= maxEcho {
		return s
	}
	return string(r[:50]) + "…" + string(r[len(r)-29:])
}

// ClipMessage keeps an error to one readable line: every run of more than
// maxEcho characters without a space (a pasted name, a whole file) is
// clipped, control characters are escaped and line breaks become "; ".
func ClipMessage(msg string) string {
	var b strings.Builder
	var word []rune
	flush := func() {
		b.WriteString(Clip(string(word)))
		word = word[:0]
	}
	for _, r := range strings.TrimRight(msg, "\n") {
		switch {
		case r == '\n':
			flush()
			b.WriteString("; ")
		case r == ' ' || r == '\t':
			flush()
			b.WriteRune(' ')
		case unicode.IsControl(r):
			word = append(word, []rune(strings.Trim(strconv.QuoteRune(r), "'"))...)
		default:
			word = append(word, r)
		}
	}
	flush()
	return b.String()
}
