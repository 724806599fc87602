package report

import (
	"fmt"
	"io"
	"text/tabwriter"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/thermal"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

// DriftRecord is one resonance's drift in JSON (span's points, circuit's
// resonances): hz_per_k and ppm_per_k
// (the JSON's one ppm field, named so), its uncertainty (root sum square
// of the parts' class tolerances) in ppm/K, and with a temperature range
// the shift from its low end to its high end.
type DriftRecord struct {
	Frequency          float64      `json:"frequency"`
	HzPerK             float64      `json:"hz_per_k"`
	PPMPerK            float64      `json:"ppm_per_k"`
	UncertaintyPPMPerK float64      `json:"uncertainty_ppm_per_k"`
	WorstCasePPMPerK   float64      `json:"worst_case_ppm_per_k"`
	Shift              *shiftRecord `json:"shift,omitempty"`
}

// shiftRecord is a resonance's move over a temperature range (kelvin, Hz).
type shiftRecord struct {
	LowTemperature  float64 `json:"low_temperature"`
	HighTemperature float64 `json:"high_temperature"`
	FrequencyLow    float64 `json:"frequency_at_low"`
	FrequencyHigh   float64 `json:"frequency_at_high"`
	Hz              float64 `json:"hz"`
	Relative        float64 `json:"relative"`
	UncertaintyHz   float64 `json:"uncertainty_hz"`
}

// NewDriftRecord is the record of d, with its shift over a range when sh
// is not nil.
func NewDriftRecord(d thermal.Drift, sh *thermal.Shift) DriftRecord {
	r := DriftRecord{Frequency: d.Frequency, HzPerK: d.HzPerK, PPMPerK: d.PerK * 1e6,
		UncertaintyPPMPerK: d.Uncertainty * 1e6, WorstCasePPMPerK: d.WorstCase * 1e6}
	if sh != nil {
		r.Shift = &shiftRecord{sh.Low, sh.High, sh.FLow, sh.FHigh, sh.Hz, sh.Relative, sh.Uncertainty}
	}
	return r
}

// spanDriftRecord is span's "drift" object.
type spanDriftRecord struct {
	GangTempco        string           `json:"gang_tempco"`
	GangTempcoPerK    float64          `json:"gang_tempco_per_k"`
	GangTolerancePerK float64          `json:"gang_tempco_tolerance_per_k"`
	PitchFollows      string           `json:"pitch_follows"`
	Points            []spanDriftPoint `json:"points"`
}

type spanDriftPoint struct {
	Setting float64      `json:"setting"`
	Low     DriftRecord  `json:"low"`
	High    *DriftRecord `json:"high,omitempty"`
}

func newSpanDriftRecord(d *spec.SpanDrift) *spanDriftRecord {
	if d == nil {
		return nil
	}
	g := d.Settings.Gang
	r := &spanDriftRecord{GangTempco: g.Code, GangTempcoPerK: g.Nominal, GangTolerancePerK: g.Tolerance,
		PitchFollows: d.PitchRule, Points: []spanDriftPoint{}}
	for _, p := range d.Points {
		pt := spanDriftPoint{Setting: p.Setting, Low: NewDriftRecord(p.Low, p.LowShift)}
		if p.High.Frequency > 0 {
			h := NewDriftRecord(p.High, p.HighShift)
			pt.High = &h
		}
		r.Points = append(r.Points, pt)
	}
	return r
}

// driftText is one resonance's drift in a table: "-310 Hz/K (-35.4 ±
// 24.4 ppm/K)", and over a range "; -9.3 kHz ± 6.4 kHz from 10 °C to 40 °C".
func driftText(d thermal.Drift, sh *thermal.Shift) string {
	s := fmt.Sprintf("%s/K (%s ± %.2g)", quantity.FormatEng(d.HzPerK, "Hz", 3), quantity.FormatPPMPerK(d.PerK, 3), d.Uncertainty*1e6)
	if sh != nil {
		s += fmt.Sprintf("; %s ± %s from %s to %s", quantity.FormatEng(sh.Hz, "Hz", 3), quantity.FormatEng(sh.Uncertainty, "Hz", 2),
			celsius(sh.Low), celsius(sh.High))
	}
	return s
}

// celsius prints a temperature in kelvin as "10 °C".
func celsius(k float64) string { return fmt.Sprintf("%.3g °C", k-273.15) }

// writeSpanDrift prints span's TEMPERATURE DRIFT block.
func writeSpanDrift(w io.Writer, d *spec.SpanDrift) error {
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	g := d.Settings.Gang
	fmt.Fprintf(tw, "\nTEMPERATURE DRIFT (gang %s %s ± %.3g; coil pitch follows %s)\n", g.Code,
		quantity.FormatPPMPerK(g.Nominal, 3), g.Tolerance*1e6, d.PitchRule)
	for _, p := range d.Points {
		fmt.Fprintf(tw, "  dial %s\tlow %s\t%s\n", dialPct(p.Setting), hz(unit.Frequency(p.Low.Frequency)), driftText(p.Low, p.LowShift))
		if p.High.Frequency > 0 {
			fmt.Fprintf(tw, "  \thigh %s\t%s\n", hz(unit.Frequency(p.High.Frequency)), driftText(p.High, p.HighShift))
		}
	}
	fmt.Fprintln(tw, "  (± carries the gang's class tolerance and the former's spread, root sum square)")
	return tw.Flush()
}
