package spec

import (
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/design"
	"turnwise/forms"
)

// DefaultDesignLeads is assumed when --leads is not given: 10 mm each, a
// short mount on a board or tag strip (common practice). A warning says so.
const DefaultDesignLeads unit.Length = 10e-3

// BandGiven is a --freq or --band flag of the design command: one
// frequency, or a band Lo-Hi (IsBand).
type BandGiven struct {
	Given
	IsBand bool
	Lo, Hi unit.Frequency
}

// SearchFlags is how the design command's flags were given, for the checks
// that need more than their values (SearchOptions holds the values).
type SearchFlags struct {
	MaxLength, MaxDiameter, MaxWireLength Given
	Tolerance, TrimMargin, TrimmerMargin  Given
	TapRatio, TapImpedance, TankImpedance Given
	Leads                                 Given
	MinSRFRatio                           float64
	SRFGiven                              bool // --min-srf-ratio on the command line
	Freq, Band                            BandGiven
	Trimmer                               string // MIN-MAX as typed
}

// ApplyFlags checks the design command's flags against each other, takes
// the band, the trimmer and the SRF ratio into so, and returns the notes
// to print (a default assumed). Errors name the flag (exit 2).
func (so *SearchOptions) ApplyFlags(f SearchFlags) ([]string, error) {
	var notes []string
	for _, l := range []struct {
		name string
		f    Given
		v    unit.Length
		eg   string
	}{{"max-length", f.MaxLength, so.MaxLength, "15mm"}, {"max-diameter", f.MaxDiameter, so.MaxDiameter, "20mm"}, {"max-wire-length", f.MaxWireLength, so.MaxWireLength, "1m"}} {
		if l.f.Set && !(l.v > 0) {
			return nil, Usagef("--%s %s: a limit must be a positive length, e.g. --%s %s (leave the flag out for no limit)", l.name, l.f.Raw, l.name, l.eg)
		}
	}
	switch {
	case so.Top < 1 || so.Top > design.MaxTop:
		return nil, Usagef("--top %d: give a number from 1 to %d", so.Top, design.MaxTop)
	case f.Tolerance.Set && !(so.Tolerance > 0):
		return nil, Usagef("--tolerance %s: give a positive percentage, e.g. 2%%", f.Tolerance.Raw)
	case f.TrimMargin.Set && !(so.TrimMargin > 0):
		return nil, Usagef("--trim-margin %s: give a positive percentage, e.g. 5%%", f.TrimMargin.Raw)
	case math.IsNaN(f.MinSRFRatio) || math.IsInf(f.MinSRFRatio, 0) || f.SRFGiven && f.MinSRFRatio == 0:
		return nil, Usagef("--min-srf-ratio %g: give a ratio from 1.2 to 100, such as 3 (common practice)", f.MinSRFRatio)
	}
	if f.SRFGiven {
		so.MinSRFRatio = f.MinSRFRatio
	}
	band := f.Band
	if f.Freq.IsBand {
		if f.Band.Set {
			return nil, Usagef("--freq %s is a band and --band is given too; give the band once", f.Freq.Raw)
		}
		band, so.Freq = f.Freq, 0
	}
	if band.Set {
		if !band.IsBand {
			return nil, Usagef("--band %s: give the band as LOW-HIGH, e.g. 144-146MHz", band.Raw)
		}
		so.BandLow, so.BandHigh = band.Lo, band.Hi
	}
	if f.Trimmer != "" {
		lo, hi, err := forms.ParseCapacitanceRange(f.Trimmer)
		if err != nil {
			return nil, &FlagError{Flag: "trimmer", Err: err}
		}
		if !(hi > lo) {
			return nil, Usagef("--trimmer %s: give the trimmer's range as MIN-MAX with MIN below MAX, e.g. 2-10pF", f.Trimmer)
		}
		if !band.Set {
			return nil, Usagef("--trimmer tunes a band: give --band LOW-HIGH, e.g. --band 144-146MHz")
		}
		so.TrimMin, so.TrimMax = lo, hi
	}
	if f.TrimmerMargin.Set && !(so.TrimmerMargin > 0 && so.TrimmerMargin < 0.5) {
		return nil, Usagef("--trimmer-margin %s: give a percentage above 0 and below 50, e.g. 10%%", f.TrimmerMargin.Raw)
	}
	for _, q := range []struct {
		name string
		v    float64
	}{{"min-q", so.MinQ}, {"tank-q", so.TankQ}, {"loaded-q", so.LoadedQ}} {
		if math.IsNaN(q.v) || math.IsInf(q.v, 0) || q.v < 0 || q.v > 1e5 {
			return nil, Usagef("--%s %g: give a Q from 1 to 100000, e.g. 150", q.name, q.v)
		}
	}
	switch {
	case f.TapRatio.Set && f.TapImpedance.Set:
		return nil, Usagef("give --tap-ratio or --tap-impedance, not both")
	case (so.TankQ > 0 || f.TankImpedance.Set || so.LoadedQ > 0) && !f.TapImpedance.Set:
		return nil, Usagef("--tank-q, --tank-impedance and --loaded-q say how the tap load is worked out: add --tap-impedance, e.g. 50ohm")
	case so.TankQ > 0 && f.TankImpedance.Set:
		return nil, Usagef("give the tank's --tank-q or its --tank-impedance, not both")
	}
	if !f.Leads.Set {
		so.Leads = DefaultDesignLeads
		notes = append(notes, "--leads not given: 10 mm each assumed; at VHF leads are often 10–20 % of the inductance, so give the real length")
	}
	return notes, nil
}
