package forms

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"regexp"
	"strings"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Band is a named range of frequencies a builder wants to tune, e.g. an
// amateur or broadcast band.
type Band struct {
	Name      string
	Low, High unit.Frequency
}

// ParseBand reads a band as written on the command line or in a band
// file: "3.5-3.8MHz", "3.5MHz-3.8MHz", "7000-7200kHz", optionally named
// with "NAME=": "80m=3.5-3.8MHz". A unit given only after the upper edge
// applies to both. The lower edge must be below the upper one.
func ParseBand(s string) (Band, error) {
	var b Band
	t := strings.TrimSpace(s)
	if name, rest, ok := strings.Cut(t, "="); ok {
		b.Name, t = strings.TrimSpace(name), strings.TrimSpace(rest)
		if b.Name == "" {
			return b, &quantity.Error{Input: s, Want: "band", Reason: "empty name before '='; write e.g. 80m=3.5-3.8MHz"}
		}
	}
	lo, hi, err := parseEdges(t, quantity.ParseFrequency)
	if err != nil {
		return b, &quantity.Error{Input: s, Want: "band", Reason: err.Error() + "; write LOW-HIGH, e.g. 3.5-3.8MHz or 80m=3.5-3.8MHz", Err: err}
	}
	if lo <= 0 {
		return b, &quantity.Error{Input: s, Want: "band", Reason: "frequencies must be positive, e.g. 3.5-3.8MHz"}
	}
	if hi <= lo {
		return b, &quantity.Error{Input: s, Want: "band", Reason: "the lower edge must come first and be below the upper one, e.g. 3.5-3.8MHz"}
	}
	b.Low, b.High = unit.Frequency(lo), unit.Frequency(hi)
	return b, nil
}

// ParseCapacitanceRange reads a variable capacitor section as MIN-MAX,
// "12-365pF" or "12pF-365pF"; MIN equal to MAX ("47-47pF") is a fixed
// capacitor, and a single value ("47pF") is read as one too.
func ParseCapacitanceRange(s string) (lo, hi unit.Capacitance, err error) {
	t := strings.TrimSpace(s)
	if !strings.Contains(strings.TrimLeft(t, "+-"), "-") {
		c, err := quantity.ParseCapacitance(t)
		if err != nil {
			return 0, 0, err
		}
		return c, c, rangeCheck(s, float64(c), float64(c))
	}
	l, h, err := parseEdges(t, quantity.ParseCapacitance)
	if err != nil {
		return 0, 0, &quantity.Error{Input: s, Want: "capacitance range", Reason: err.Error() + "; write MIN-MAX, e.g. 12-365pF", Err: err}
	}
	return unit.Capacitance(l), unit.Capacitance(h), rangeCheck(s, l, h)
}

func rangeCheck(s string, lo, hi float64) error {
	switch {
	case lo < 0:
		return &quantity.Error{Input: s, Want: "capacitance range", Reason: "capacitance cannot be negative; write MIN-MAX, e.g. 12-365pF"}
	case hi < lo:
		return &quantity.Error{Input: s, Want: "capacitance range", Reason: "the minimum comes first, e.g. 12-365pF"}
	}
	return nil
}

// unitTail is the unit after a number: "MHz" in "3.8MHz".
var unitTail = regexp.MustCompile(`^\s*[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?\s*`)

// parseEdges splits "LO-HI" at the dash between the two numbers and
// parses both with parse, lending HI's unit to a bare LO.
func parseEdges[T ~float64](t string, parse func(string) (T, error)) (float64, float64, error) {
	head := unitTail.FindString(t)
	if head == "" {
		return 0, 0, fmt.Errorf("no number")
	}
	i := strings.Index(t[len(head):], "-")
	if i < 0 {
		return 0, 0, fmt.Errorf("no dash between the two ends")
	}
	i += len(head)
	loS, hiS := strings.TrimSpace(t[:i]), strings.TrimSpace(t[i+1:])
	hi, err := parse(hiS)
	if err != nil {
		return 0, 0, &edgeError{"upper", hiS, err}
	}
	if m := unitTail.FindString(loS); len(m) == len(loS) {
		loS += hiS[len(unitTail.FindString(hiS)):]
	}
	lo, err := parse(loS)
	if err != nil {
		return 0, 0, &edgeError{"lower", loS, err}
	}
	return float64(lo), float64(hi), nil
}

// edgeError is one end of a range that does not parse. It prints the
// reason alone (the range's own error already quotes the input) and
// unwraps to the cause.
type edgeError struct {
	end, text string
	err       error
}

func (e *edgeError) Error() string {
	return fmt.Sprintf("%s end %q: %s", e.end, e.text, reasonOf(e.err))
}
func (e *edgeError) Unwrap() error { return e.err }

func reasonOf(err error) string {
	if qe, ok := errors.AsType[*quantity.Error](err); ok {
		return qe.Reason
	}
	return err.Error()
}

// maxBandLines bounds a band file: more is not a band list.
const maxBandLines = 10000

// LoadBands reads a band file: one band per line, its name first and the
// range last ("80m 3.5-3.8MHz", "31m broadcast 9.4-9.9MHz"), or the
// range alone, or the flag's form "80m=3.5-3.8MHz". Blank lines and
// everything after '#' are ignored. file names the source in errors,
// which are *ParseError with the line number.
func LoadBands(r io.Reader, file string) ([]Band, error) {
	sc := bufio.NewScanner(r)
	var out []Band
	line := 0
	for sc.Scan() {
		line++
		if line > maxBandLines {
			return nil, &ParseError{Kind: "band file", File: file, Line: line, Err: fmt.Errorf("more than %d lines; is this the right file?", maxBandLines)}
		}
		text, _, _ := strings.Cut(sc.Text(), "#")
		text = strings.TrimSpace(text)
		if text == "" {
			continue
		}
		var b Band
		var err error
		if strings.Contains(text, "=") {
			b, err = ParseBand(text)
		} else {
			fields := strings.Fields(text)
			b, err = ParseBand(fields[len(fields)-1])
			b.Name = strings.Join(fields[:len(fields)-1], " ")
		}
		if err != nil {
			return nil, &ParseError{Kind: "band file", File: file, Line: line, Err: err}
		}
		out = append(out, b)
	}
	if err := sc.Err(); err != nil {
		return nil, &ParseError{Kind: "band file", File: file, Line: line, Err: err}
	}
	if len(out) == 0 {
		return nil, &ParseError{Kind: "band file", File: file, Err: fmt.Errorf("no bands; write one per line, e.g. 80m 3.5-3.8MHz")}
	}
	return out, nil
}

// ParseInductanceRange reads an inductance window as MIN-MAX, "90-110nH"
// or "90nH-110nH"; MIN must be below MAX.
func ParseInductanceRange(s string) (lo, hi unit.Inductance, err error) {
	l, h, err := parseEdges(strings.TrimSpace(s), quantity.ParseInductance)
	if err != nil {
		return 0, 0, &quantity.Error{Input: s, Want: "inductance window", Reason: err.Error() + "; write MIN-MAX, e.g. 90-110nH", Err: err}
	}
	if !(l > 0 && h > l) {
		return 0, 0, &quantity.Error{Input: s, Want: "inductance window", Reason: "give a positive MIN below MAX, e.g. 90-110nH"}
	}
	return unit.Inductance(l), unit.Inductance(h), nil
}
