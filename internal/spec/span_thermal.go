package spec

import (
	"gonum.org/v1/gonum/unit"

	"turnwise/coil/thermal"
	"turnwise/coil/tuning"
	"turnwise/forms"
)

// SpanDriftSettings are the temperature options of span (and of a job
// coil with a gang): where on the dial, the gang's class, what the pitch
// follows, and an optional temperature range.
type SpanDriftSettings struct {
	Settings  []float64 // dial fractions 0 … 1
	Gang      thermal.Class
	Pitch     thermal.PitchFollows
	Low, High unit.Temperature // kelvin; both zero: no range
}

// SpanDriftPoint is the drift of both ranges at one dial setting, and
// their shift over the range when one was given (nil otherwise; HighShift
// also nil without a high range).
type SpanDriftPoint struct {
	thermal.DialDrift
	LowShift, HighShift *thermal.Shift
}

// SpanDrift is the drift of a span's two ranges at chosen dial settings.
type SpanDrift struct {
	Settings SpanDriftSettings
	Points   []SpanDriftPoint
	// PitchRule names what sets the coil's pitch (thermal.Support.PitchRule).
	PitchRule string
}

// BuildSpanDrift computes the drift of out (from BuildSpan with set) for
// the coil s at ds's dial settings. ok is false, with a warning, when the
// former's material is unknown; err is a bad setting or a model refusal.
func BuildSpanDrift(cat *forms.Catalog, s Spec, set SpanSettings, out SpanOutcome, ds SpanDriftSettings) (d *SpanDrift, warning string, err error) {
	a, b, err := GangFromSettings(set)
	if err != nil {
		return nil, "", err
	}
	s.Geometry = out.Geometry
	sup, ok, why := ThermalSupport(cat, s, ds.Pitch)
	if !ok {
		return nil, why, nil
	}
	ts := tuning.Spec{Geometry: out.Geometry, TapTurns: out.Span.Sections.TapTurns, A: a, B: b}
	pts, err := thermal.SpanDrift(ts, sup, ds.Gang, ds.Settings)
	if err != nil {
		return nil, "", &FlagError{Flag: "drift-at", Err: err}
	}
	d = &SpanDrift{Settings: ds, PitchRule: sup.PitchRule(out.Geometry)}
	for _, p := range pts {
		pt := SpanDriftPoint{DialDrift: p}
		if ds.High > ds.Low {
			lo, hi, err := thermal.SpanShift(ts, sup, ds.Gang, p, float64(ds.Low), float64(ds.High))
			if err != nil {
				return nil, "", &FlagError{Flag: "temp-range", Err: err}
			}
			pt.LowShift = &lo
			if p.High.Frequency > 0 {
				pt.HighShift = &hi
			}
		}
		d.Points = append(d.Points, pt)
	}
	return d, "", nil
}

// AddSpanDrift reads span's temperature flags (--drift-at, --gang-tempco,
// --pitch-follows; tempRange is --temp-range when given) and, unless
// --drift-at is none, adds the drift of both ranges to out, or the reason
// it cannot as a warning.
func AddSpanDrift(cat *forms.Catalog, s Spec, set SpanSettings, out *SpanOutcome, driftAt, gangTC, pitch string, tempRange *TempRange) error {
	ds, use, err := ParseSpanDrift(driftAt, gangTC, pitch)
	if err != nil || !use {
		return err
	}
	if tempRange != nil {
		ds.Low, ds.High = tempRange.Low, tempRange.High
	}
	d, warn, err := BuildSpanDrift(cat, s, set, *out, ds)
	if err != nil {
		return err
	}
	out.Drift = d
	if warn != "" {
		out.Span.Warnings = append(out.Span.Warnings, warn)
	}
	return nil
}
