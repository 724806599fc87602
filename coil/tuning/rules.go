package tuning

import (
	"fmt"
	"strings"
)

// DialConvention says which way the dial runs, for output that shows
// settings.
const DialConvention = "setting 0 = plates fully open (top of both ranges), 1 = fully meshed"

// PassbandRule states how the high range's passband is taken for a loaded
// Q (zero: from the coil model, see Spec.LoadedQ), so that a reader knows
// what "inside the passband" means.
func PassbandRule(loadedQ float64) string {
	if loadedQ > 0 {
		return fmt.Sprintf("passband = f/Q with the loaded Q you gave (%g)", loadedQ)
	}
	return "passband = f/Q, Q = half the coil model's Q at f (a tank matched to its load; common practice)"
}

// ParseLaw reads a capacitor law by name: "slc" (also empty), "slf" or
// "slw", in any case. ok is false for anything else, which a caller may
// take as the name of a measured table (LawTable).
func ParseLaw(s string) (law Law, ok bool) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "slc":
		return LawSLC, true
	case "slf":
		return LawSLF, true
	case "slw":
		return LawSLW, true
	}
	return LawTable, false
}

// OverlapFraction is the overlap of the ranges as a fraction of the
// bottom of the high range, the measure the margin applies to (negative
// for a gap); zero without a high range.
func (sp *Span) OverlapFraction() float64 {
	if !sp.HasHigh {
		return 0
	}
	return float64(sp.Overlap) / float64(sp.High.Min)
}

// Placement is where a listed band lies on the two ranges.
type Placement int

const (
	// PlacedNone: neither range reaches the band.
	PlacedNone Placement = iota
	// PlacedLow: the low range holds the whole band (the high range does not).
	PlacedLow
	// PlacedHigh: the high range holds the whole band (the low range does not).
	PlacedHigh
	// PlacedBoth: each range holds the whole band.
	PlacedBoth
	// PlacedPart: some range reaches part of the band, none all of it.
	PlacedPart
)

func (p Placement) String() string {
	switch p {
	case PlacedLow:
		return "low"
	case PlacedHigh:
		return "high"
	case PlacedBoth:
		return "both"
	case PlacedPart:
		return "part"
	}
	return "none"
}

// Placement says where the band lies and on which range its dial settings
// are best read: the first range holding all of it (the low range when
// both do), else the first reaching part of it. on is the zero value for
// PlacedNone.
func (bc *BandCoverage) Placement() (p Placement, on BandOnRange) {
	var whole []BandOnRange
	for _, r := range bc.Ranges {
		if r.Whole {
			whole = append(whole, r)
		}
	}
	switch {
	case len(whole) >= 2:
		return PlacedBoth, whole[0]
	case len(whole) == 1 && whole[0].Range == "high":
		return PlacedHigh, whole[0]
	case len(whole) == 1:
		return PlacedLow, whole[0]
	case len(bc.Ranges) > 0:
		return PlacedPart, bc.Ranges[0]
	}
	return PlacedNone, BandOnRange{}
}

// TightAtEnd reports whether a band held by a range sits closer to the
// range's end than margin (a fraction, e.g. Span.Margin): tuned there,
// capacitor and coil tolerances may push the band edge off the dial.
func (on BandOnRange) TightAtEnd(margin float64) bool { return on.Whole && on.Margin < margin }

// Stretch reports whether a coincidence covers a stretch of the dial
// wider than 0.1 % rather than one point.
func (co Coincidence) Stretch() bool { return co.SettingTo-co.SettingFrom > 0.001 }
