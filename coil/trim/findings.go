package trim

import (
	"math"

	"turnwise/coil"
)

// FindingKind is one thing a trim's result tells the builder beyond the
// instruction: a reading to distrust, a change that may not be needed.
type FindingKind int

const (
	// SpringbackUnusual: the springback fitted for a coil slid off a
	// mandrel lies outside MandrelSpringbackMin … MandrelSpringbackMax.
	// Value is the springback.
	SpringbackUnusual FindingKind = iota + 1
	// SpringbackOnFormer: a coil left on its former fitted a springback
	// larger than FormerSpringbackMax in size; it stands for model and
	// measurement error. Value is the springback.
	SpringbackOnFormer
	// MissWithinUncertainty: the coil misses the target by less than the
	// reading's own uncertainty, yet a change is proposed. Value is the
	// miss, Limit the uncertainty (both relative).
	MissWithinUncertainty
	// NoStray: one resonance with a test capacitor and no fixture stray
	// given; 0 F was assumed.
	NoStray
	// NegativeStray: the two-capacitor line put a slightly negative
	// capacitance across the coil, within its uncertainty. Value is the
	// capacitance, Limit its uncertainty, in farads.
	NegativeStray
	// Scatter: three or more resonances scatter about the fitted line by
	// more than the frequency readings' accuracy allows. Value is the rms
	// relative residual.
	Scatter
	// HighReadingFrequency: the reading was taken above
	// 1/ReadingSRFFraction of the coil's self-resonance, where it leans on
	// the self-capacitance estimate. Value is the reading's frequency and
	// Limit the self-resonance, in hertz.
	HighReadingFrequency
	// SectionDeparts: a tapped coil's section reads further from the rest
	// of the coil than the two readings' uncertainties allow. Section says
	// which; Value is the section's reading against the rest of the coil
	// (reading/model − 1).
	SectionDeparts
	// TapOutOfReach: no quarter-turn tap gives the wanted ratio; the plan
	// names the nearest (Result.Tap).
	TapOutOfReach
	// NewWinding: the correction adds turns, so a new coil is wound. Value
	// is the wire length to cut in metres (Result.After.WireLength).
	NewWinding
)

// Section names a section of a tapped coil.
type Section int

const (
	// Bottom is the section from the cold end to the tap.
	Bottom Section = iota + 1
	// Top is the section from the tap to the hot end.
	Top
)

// Finding is one FindingKind with its numbers.
type Finding struct {
	Kind         FindingKind
	Value, Limit float64
	Section      Section // SectionDeparts only
}

// The thresholds behind the findings.
const (
	// MandrelSpringbackMin and MandrelSpringbackMax bound the springback
	// usual for wire released from a mandrel: a few percent (common
	// practice); outside them the coil description or the fixture is more
	// likely wrong than the wire.
	MandrelSpringbackMin = -0.02
	MandrelSpringbackMax = 0.15
	// FormerSpringbackMax bounds the apparent springback of a coil left on
	// its former, which does not spring back at all.
	FormerSpringbackMax = 0.03
	// ScatterFloor is the least rms scatter about the two-capacitor line
	// worth a finding, whatever the stated frequency accuracy; beyond it,
	// scatter counts when it exceeds ScatterFactor times that accuracy.
	ScatterFloor  = 0.002
	ScatterFactor = 3
	// ReadingSRFFraction: a reading above SRF/ReadingSRFFraction depends
	// noticeably on the self-capacitance estimate.
	ReadingSRFFraction = 3
)

// findings collects what the builder should know, most important first.
func findings(req Request, res *Result) []Finding {
	var out []Finding
	add := func(f Finding, ok bool) {
		if ok {
			out = append(out, f)
		}
	}
	cal, r := res.Calibration, res.Calibration.Reading
	add(springbackFinding(cal.Springback, req.OnFormer))
	add(missFinding(res.Correction.Action, res.Miss, r.Uncertainty))
	add(Finding{Kind: NoStray}, req.Measurement.Kind == MeasureResonance && req.Measurement.Stray == 0)
	add(Finding{Kind: NegativeStray, Value: float64(r.TotalStray), Limit: float64(r.TotalStrayUncertainty)},
		r.Kind == MeasureTwoCapacitor && r.TotalStray < 0)
	add(Finding{Kind: Scatter, Value: r.FitResidual},
		r.Kind == MeasureTwoCapacitor && scatters(r.FitResidual, req.Measurement.FrequencyTolerance))
	if f := float64(r.Frequency); f > 0 {
		if p, err := coil.Predict(cal.Geometry, r.Frequency); err == nil {
			add(Finding{Kind: HighReadingFrequency, Value: f, Limit: float64(p.SRF)}, f > float64(p.SRF)/ReadingSRFFraction)
		}
	}
	if t := res.Tap; t != nil && t.Sections != nil {
		for _, s := range []struct {
			which Section
			fit   *SectionFit
		}{{Bottom, t.Sections.Bottom}, {Top, t.Sections.Top}} {
			add(sectionFinding(s.which, s.fit, r.Uncertainty))
		}
	}
	if t := res.Tap; t != nil {
		add(Finding{Kind: TapOutOfReach}, t.OutOfReach)
	}
	add(Finding{Kind: NewWinding, Value: float64(res.After.WireLength)}, res.Correction.Action == ActionAddTurns)
	return out
}

// springbackFinding judges a fitted springback s for its support.
func springbackFinding(s float64, onFormer bool) (Finding, bool) {
	switch {
	case !onFormer && (s < MandrelSpringbackMin || s > MandrelSpringbackMax):
		return Finding{Kind: SpringbackUnusual, Value: s}, true
	case onFormer && math.Abs(s) > FormerSpringbackMax:
		return Finding{Kind: SpringbackOnFormer, Value: s}, true
	}
	return Finding{}, false
}

// missFinding flags a proposed change smaller than the reading's own
// uncertainty u.
func missFinding(a Action, miss, u float64) (Finding, bool) {
	return Finding{Kind: MissWithinUncertainty, Value: miss, Limit: u}, a != ActionNone && math.Abs(miss) < u
}

// scatters reports an rms scatter about the two-capacitor line beyond what
// the frequency accuracy freqTol explains.
func scatters(resid, freqTol float64) bool {
	return resid > ScatterFactor*freqTol && resid > ScatterFloor
}

// sectionFinding flags a section whose residual against the whole-coil
// calibration exceeds the root-sum-square of its reading's uncertainty and
// the whole coil's, u.
func sectionFinding(which Section, fit *SectionFit, u float64) (Finding, bool) {
	if fit == nil {
		return Finding{}, false
	}
	dep := -fit.Residual / (1 + fit.Residual)
	return Finding{Kind: SectionDeparts, Section: which, Value: dep}, math.Abs(fit.Residual) > math.Hypot(fit.Reading.Uncertainty, u)
}
