package spec

import (
	"errors"
	"fmt"
	"os"
	"strings"

	"turnwise/coil/thermal"
	"turnwise/coil/tuning"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

// LoadBandFlags reads the bands of --band flags (LOW-HIGH or
// NAME=LOW-HIGH) and of a --bands file (one per line), in that order.
func LoadBandFlags(bands []string, file string) ([]forms.Band, error) {
	var out []forms.Band
	for _, s := range bands {
		b, err := forms.ParseBand(s)
		if err != nil {
			return nil, &FlagError{Flag: "band", Err: err}
		}
		out = append(out, b)
	}
	if file == "" {
		return out, nil
	}
	f, err := os.Open(file)
	if err != nil {
		if errors.Is(err, os.ErrNotExist) {
			return nil, Usagef("--bands: %q does not exist; check the path", file)
		}
		return nil, fmt.Errorf("--bands: %w", err)
	}
	defer f.Close()
	list, err := forms.LoadBands(f, file)
	if err != nil {
		return nil, err
	}
	return append(out, list...), nil
}

// SpanFlags are the span command's flags that SpanSettings takes as text
// or checks beyond their values.
type SpanFlags struct {
	Gang, GangB      string // MIN-MAX per section as typed
	Bands            []string
	BandsFile        string
	Margin, Spread   Given
	MarginV, SpreadV float64 // the fractions --margin and --bandspread gave
}

// ApplyFlags checks the span command's flags and takes the gang, the bands,
// the margin and the bandspread into s. Errors name the flag (exit 2).
func (s *SpanSettings) ApplyFlags(f SpanFlags) error {
	if s.MaxHarmonic < 2 || s.MaxHarmonic > tuning.MaxHarmonicLimit {
		return Usagef("--max-harmonic %d: give 2 to %d (5 checks the 2nd to the 5th)", s.MaxHarmonic, tuning.MaxHarmonicLimit)
	}
	if f.Spread.Set {
		if !(f.SpreadV > 0) || f.SpreadV > 0.5 {
			return Usagef("--bandspread %s: give a share of the dial above 0 and at most 50 %%, e.g. 3%%", f.Spread.Raw)
		}
		s.Bandspread = f.SpreadV
	}
	if s.Steps < 2 || s.Steps > 1001 {
		// One rule for every value: 0 is not "the default", it is refused
		// like 1 (the default, 11, applies when the flag is left out).
		return Usagef("--steps %d: give 2 to 1001 dial rows (default 11)", s.Steps)
	}
	if f.Margin.Set {
		if f.MarginV <= 0 {
			return Usagef("--margin must be above 0 %%, e.g. 3%%")
		}
		s.Margin = f.MarginV
	}
	if f.Gang != "" {
		lo, hi, err := forms.ParseCapacitanceRange(f.Gang)
		if err != nil {
			return &FlagError{Flag: "gang", Err: err}
		}
		if hi == 0 {
			return Usagef("--gang %s leaves section A, across the whole coil, without a capacitor; give the capacitor's minimum and maximum per section, e.g. --gang 15-365pF", f.Gang)
		}
		s.GangA = [2]float64{float64(lo), float64(hi)}
	}
	if f.GangB != "" {
		lo, hi, err := forms.ParseCapacitanceRange(f.GangB)
		if err != nil {
			return &FlagError{Flag: "gang-b", Err: err}
		}
		s.GangB, s.GangBSet = [2]float64{float64(lo), float64(hi)}, true
	}
	bands, err := LoadBandFlags(f.Bands, f.BandsFile)
	if err != nil {
		return err
	}
	for _, b := range bands {
		s.Bands = append(s.Bands, tuning.Band{Name: b.Name, Low: b.Low, High: b.High})
	}
	return nil
}

// ParseSpanDrift reads span's --drift-at (dial settings in percent,
// comma-separated, or none: use false) and --gang-tempco; pitch is
// --pitch-follows.
func ParseSpanDrift(driftAt, gangTC, pitch string) (ds SpanDriftSettings, use bool, err error) {
	if strings.EqualFold(strings.TrimSpace(driftAt), "none") {
		return ds, false, nil
	}
	for _, f := range strings.Split(driftAt, ",") {
		v, err := quantity.ParsePercent(strings.TrimSpace(f))
		if err != nil || v < 0 || v > 1 {
			return ds, false, Usagef("--drift-at %s: give dial settings from 0 to 100 (percent), comma-separated, e.g. 0,50,100, or none", driftAt)
		}
		ds.Settings = append(ds.Settings, v)
	}
	if ds.Gang, err = thermal.ParseClass(gangTC); err != nil {
		return ds, false, &FlagError{Flag: "gang-tempco", Err: err}
	}
	ds.Pitch, _ = thermal.ParsePitchFollows(pitch)
	return ds, true, nil
}
