package tuning

import (
	"fmt"
	"math"
)

// Harmonics of any order, and ranges that track an integer ratio.
//
// A coincidence (Coincidence) is a dial stretch where the m-th harmonic of
// the low range falls inside the high range's passband. Across a wide
// dial the ratio f_high/f_low of a two-gang circuit changes little, so a
// ratio sitting close to an integer m makes the m-th harmonic follow the
// high range across a whole stretch of the dial, just outside the passband
// at one setting and inside at the next: a Tracking names that stretch.

// DefaultMaxHarmonic is the highest harmonic order checked when
// Spec.MaxHarmonic is zero: a harmonic-rich mixer or oscillator still
// delivers useful 4th and 5th harmonics (common practice).
const DefaultMaxHarmonic = 5

// MaxHarmonicLimit bounds Spec.MaxHarmonic.
const MaxHarmonicLimit = 20

// TrackingTolerance: a stretch of the dial tracks order m when
// |f_high/(m·f_low) − 1| stays within 2 % along it (common practice: a
// preselector passband and the capacitor's tolerance are of that size).
const TrackingTolerance = 0.02

// TrackingMinStretch is the least share of the dial a tracking stretch
// must span to be reported: 5 %.
const TrackingMinStretch = 0.05

// Tracking is a stretch of the dial, from SettingFrom to SettingTo, along
// which the high range stays within TrackingTolerance of Order times the
// low range. RatioMin and RatioMax are the extremes of f_high/f_low along
// the stretch; Closest is the largest |f_high/(m·f_low) − 1| on it.
type Tracking struct {
	Order                  int
	SettingFrom, SettingTo float64
	RatioMin, RatioMax     float64
	Closest                float64
}

// orders returns the harmonic orders 2 … max checked for spec.
func orders(max int) []int {
	if max == 0 {
		max = DefaultMaxHarmonic
	}
	out := make([]int, 0, max-1)
	for m := 2; m <= max; m++ {
		out = append(out, m)
	}
	return out
}

// tracking scans the whole dial at the scan resolution for stretches where
// f_high/f_low stays near an integer from 2 to max.
func (c *spanCircuit) tracking(max int) ([]Tracking, error) {
	rows, err := c.windowRows(window{from: 0, to: 1})
	if err != nil {
		return nil, err
	}
	var out []Tracking
	for _, m := range orders(max) {
		var cur *Tracking
		flush := func() {
			if cur != nil && cur.SettingTo-cur.SettingFrom >= TrackingMinStretch-1e-12 {
				out = append(out, *cur)
			}
			cur = nil
		}
		for _, r := range rows {
			if !(r.FHigh > 0) || !(r.FLow > 0) {
				flush()
				continue
			}
			ratio := float64(r.FHigh) / float64(r.FLow)
			dev := math.Abs(ratio/float64(m) - 1)
			if dev > TrackingTolerance {
				flush()
				continue
			}
			if cur == nil {
				cur = &Tracking{Order: m, SettingFrom: r.Setting, RatioMin: ratio, RatioMax: ratio}
			}
			cur.SettingTo = r.Setting
			cur.RatioMin = math.Min(cur.RatioMin, ratio)
			cur.RatioMax = math.Max(cur.RatioMax, ratio)
			cur.Closest = math.Max(cur.Closest, dev)
		}
		flush()
	}
	return out, nil
}

// trackingWarning words one tracking stretch.
func trackingWarning(t Tracking) string {
	whole := ""
	if t.SettingFrom <= 1e-9 && t.SettingTo >= 1-1e-9 {
		whole = " (the whole dial)"
	}
	return fmt.Sprintf("from %.1f %% to %.1f %% of the dial%s the high range sits at %.3g–%.3g× the low range, within %.0f %% of %d: the %s harmonic of the low range follows the high range along the whole stretch, within %.1f %%; a strong station there can come through on the other range (retap, or change one section's capacitance, to move the ratio off %d)",
		t.SettingFrom*100, t.SettingTo*100, whole, t.RatioMin, t.RatioMax, TrackingTolerance*100, t.Order, Ordinal(t.Order), t.Closest*100, t.Order)
}

// DefaultBandspread is the least share of the dial a band should take
// before a warning: 3 % (common practice: below that the band is a knife
// edge on a plain dial, and a bandspread capacitor or a slow-motion drive
// is needed).
const DefaultBandspread = 0.03

// bandspreadWarnings says which covered bands take less than share of the
// dial on the range that holds them.
func bandspreadWarnings(sp *Span, share float64) []string {
	var w []string
	for _, b := range sp.Bands {
		for _, r := range b.Ranges {
			if !r.Whole {
				continue
			}
			d := math.Abs(r.SettingAtLow - r.SettingAtHigh)
			if d < share {
				w = append(w, fmt.Sprintf("bandspread: band %s takes only %.2f %% of the dial on the %s range (%.2f %% to %.2f %%), less than %.0f %%: too narrow to tune by hand; add a small bandspread capacitor across the section, or a reduction drive",
					bandWithEdges(b.Band), d*100, r.Range, math.Min(r.SettingAtLow, r.SettingAtHigh)*100, math.Max(r.SettingAtLow, r.SettingAtHigh)*100, share*100))
			}
		}
	}
	return w
}
