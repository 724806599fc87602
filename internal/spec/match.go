package spec

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"turnwise/coil/circuit"
	"turnwise/coil/match"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

// Couplers: a circuit file and the network built from it become a
// match.Setup (the capacitors with a range are the ones the search turns,
// [load] node is where the antenna connects, rating = keys are compared
// with the peak voltage). The match and sheet commands use these.

// MatchSetup builds the coupler a circuit file describes. net is the
// network built from c (part names as in the file). A file without a
// [load] table or without a capacitor that has a range is refused at the
// key to add (*forms.ParseError, exit 2).
func MatchSetup(c *forms.Circuit, net *circuit.Network) (match.Setup, error) {
	s := match.Setup{Network: *net, Ratings: map[string]float64{}}
	fail := func(field string, err error) error {
		return &forms.ParseError{Kind: "circuit", File: c.File, Line: 0, Field: field, Err: err}
	}
	if c.Load == nil {
		return s, fail("load", errors.New(`no [load] table: add one naming the node the antenna connects to, e.g. [load] node = "ant"`))
	}
	s.LoadNode = c.Load.Node
	for i := range c.Capacitors {
		p := &c.Capacitors[i]
		if p.Adjustable() {
			s.Adjustable = append(s.Adjustable, match.Adjustable{Part: p.Name, Min: p.Min, Max: p.Max})
		}
		if p.Rating > 0 {
			s.Ratings[p.Name] = p.Rating
		}
	}
	if len(s.Adjustable) == 0 {
		return s, fail("range", errors.New(`no adjustable capacitor: give at least one [[capacitor]] a range, e.g. range = "10pF-250pF"`))
	}
	return s, nil
}

// ParseOhmRange reads a range of resistance or reactance written
// MIN-MAX with one unit, e.g. "5-2000ohm", "-1000-1000ohm",
// "-500--100ohm" or "5ohm-2kohm", and returns ohms. A single value is a
// range of one. The unit of the maximum applies to a bare minimum.
func ParseOhmRange(s string) (lo, hi float64, err error) {
	t := strings.TrimSpace(s)
	cut := -1
	for i := 1; i < len(t); i++ {
		if t[i] != '-' {
			continue
		}
		prev := t[i-1]
		if prev == '-' || prev == 'e' || prev == 'E' || prev == ' ' && strings.TrimSpace(t[:i]) == "" {
			continue
		}
		cut = i
		break
	}
	if cut < 0 {
		v, err := parseSignedOhms(t, "")
		return v, v, err
	}
	a, b := strings.TrimSpace(t[:cut]), strings.TrimSpace(t[cut+1:])
	suffix := strings.TrimLeft(b, "+-0123456789.eE ")
	if lo, err = parseSignedOhms(a, suffix); err != nil {
		return 0, 0, err
	}
	if hi, err = parseSignedOhms(b, ""); err != nil {
		return 0, 0, err
	}
	if hi < lo {
		return 0, 0, fmt.Errorf("%q runs from %g Ω down to %g Ω; write the smaller value first", s, lo, hi)
	}
	return lo, hi, nil
}

// parseSignedOhms reads one value in ohms, giving a bare number the
// suffix.
func parseSignedOhms(s, suffix string) (float64, error) {
	if s == "" {
		return 0, errors.New("empty; write MIN-MAX with a unit, e.g. 5-2000ohm")
	}
	if last := s[len(s)-1]; last >= '0' && last <= '9' || last == '.' {
		s += suffix
	}
	neg := strings.HasPrefix(s, "-")
	v, err := quantity.ParseResistance(strings.TrimPrefix(s, "-"))
	if err != nil {
		return 0, err
	}
	if neg {
		v = -v
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, errors.New("not a finite number")
	}
	return v, nil
}
