package sheets

import (
	"time"

	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// Document is a batch of build sheets.
type Document struct {
	Title  string
	Date   time.Time // printed on every page and used as the PDF's dates
	Paper  string    // "A4" (default) or "Letter"
	Units  string    // display units: "mm" (default) or "in"
	Source string    // where the job came from, e.g. the job file's name; may be empty
	Notes  string    // the organiser's notes, printed on the cover

	// Allowance is the fraction added to the batch's total wire for
	// mistakes and trimming; zero means DefaultAllowance.
	Allowance float64

	Coils []Coil

	// Circuits are the networks the coils go into: a page each, after
	// the coils (sheets/circuitpage.go).
	Circuits []Circuit

	// Couplers get a match map page each, after the coils (couplerpage.go).
	Couplers []Coupler
}

// DefaultAllowance is added to the batch's wire total: one coil in ten
// goes wrong on a build night (common practice).
const DefaultAllowance = 0.10

// Coil is one coil to build and everything its page shows.
type Coil struct {
	Name     string
	Quantity int // how many to build; zero counts as one
	Notes    string

	// Wire says what the wire is in a builder's words, e.g. "1.00mm
	// silver-plated bare silver-plated wire"; WireKey groups the bill of
	// materials (two coils with the same key share a spool).
	Wire    string
	WireKey string

	Support     coil.SupportKind // slid off a mandrel (self-supporting) or stays on a former
	SupportName string           // "6mm drill", "pvc 25mm"

	// SpringbackSource says where the springback came from; the note is
	// the calibration's own.
	SpringbackSource coil.SpringbackSource
	SpringbackNote   string
	CloseWound       bool

	// Prediction is the model's answer for the coil as wound, at the
	// operating frequency (zero for none).
	Prediction coil.Prediction
	// LowFrequency is the terminal inductance at low frequency, what an
	// inductance meter reads (Predict with no frequency); zero hides it.
	LowFrequency unit.Inductance

	// TrimPerPercent is the change of outside length that changes the
	// terminal inductance by 1 % (coil.LengthPerPercent); zero hides it.
	TrimPerPercent unit.Length
	// TrimLeast and TrimMost bound the inductance reachable by spreading
	// (to the loosest sensible pitch) and squeezing (close-wound) with the
	// turns held (coil.Window); zero hides them.
	TrimLeast, TrimMost unit.Inductance

	Target *Target // nil for a fixed winding
	Tap    *Tap    // nil when untapped
	Span   *Span   // nil unless a two-gang capacitor tunes it

	// Thermal is the coil's temperature coefficient and, when the job
	// gives its tank capacitor, the tank's drift; nil hides them (a former
	// of unknown material).
	Thermal *Thermal

	// Warnings from the model and the glue, printed in the cautions box.
	Warnings []string
	// HighVoltage marks a tank or coupler coil: the cautions box leads
	// with RF voltage and burns.
	HighVoltage bool
}

// Target is what the design search was asked for.
type Target struct {
	Description string          // e.g. "resonate with 22 pF at 137.5 MHz"
	Inductance  unit.Inductance // the terminal L at f, or the effective L when Effective
	Effective   bool            // Inductance is the effective inductance at f
	Tolerance   float64         // fraction
	Rank        int             // 1 for the best candidate
	Why         string          // the search's one-line reason
	Band        *TargetBand     // a band tuned by a trimmer; nil otherwise
}

// TargetBand is a band design: the coil, with Fixed + Stray and a trimmer
// TrimMin … TrimMax in parallel, tunes Low … High; TrimmerLow and
// TrimmerHigh are the trimmer's settings at the two edges.
type TargetBand struct {
	Low, High               unit.Frequency
	Fixed, Stray            unit.Capacitance
	TrimMin, TrimMax        unit.Capacitance
	TrimmerLow, TrimmerHigh unit.Capacitance
}

// Tap is a tap on the coil, counted from the cold (ground) end.
type Tap struct {
	Turns    float64         // from the cold end, in quarter turns
	Ratio    float64         // unloaded voltage ratio at the tap, (L_b + M)/L
	LBelow   unit.Inductance // section from the cold end to the tap
	LAbove   unit.Inductance // section from the tap to the hot end
	Mutual   unit.Inductance
	Coupling float64 // k
	Purpose  string  // a sentence on why the tap is where it is, ending the tap step; may be empty
}

// Span is a two-gang capacitor tuning the coil: section A across the whole
// coil, section B from the tap to ground.
type Span struct {
	GangA, GangB string // e.g. "12 pF–365 pF + stray 6 pF": each section as the circuit sees it
	Capacitor    string // the part to buy, e.g. "12 pF–365 pF per section"; empty: from GangA and GangB
	Law          string // e.g. "straight-line capacitance"
	Dial         []DialPoint
	Bands        []Band
	Coincidences []Coincidence
	Overlap      unit.Frequency // by which the ranges overlap; negative for a gap
	Notes        []string
}

// DialPoint is both resonances at one dial setting.
type DialPoint struct {
	Setting     float64        // 0 plates fully open … 1 fully meshed
	FLow, FHigh unit.Frequency // FHigh zero when there is no high range
}

// Band is a band the builder wants to tune.
type Band struct {
	Low, High unit.Frequency
	Label     string // e.g. "80m"; may be empty
	// Range is the range that holds the whole band: "low", "high", "both",
	// or "part" when only some of it is reached, "none" when none is.
	Range string
	// DialLow and DialHigh are the settings tuning the band's edges on
	// that range (the low range's when both).
	DialLow, DialHigh float64
	// Ranges are every range that reaches the band, as the span command
	// lists them; when given, the chart page prints each stretch of the
	// dial, not only DialLow … DialHigh.
	Ranges []BandRange
}

// BandRange is where a band sits on one range.
type BandRange struct {
	Range             string  // "low" or "high"
	DialLow, DialHigh float64 // settings tuning the band's low and high edge
	Whole             bool    // the whole band is on this range
}

// Coincidence is a dial setting where a harmonic of the low range falls in
// the high range's passband.
type Coincidence struct {
	Setting     float64 // 0 … 1
	Order       int     // 2 or 3
	Band        string  // the listed band the low range is in; may be empty
	FLow, FHigh unit.Frequency
	// Depth is how far the harmonic is from the high range's peak in
	// half-passbands: 0 on the peak, 1 at the −3 dB edge.
	Depth float64
}

// Options control the output, not the content.
type Options struct {
	// Uncompressed writes page content as plain text: larger files, for
	// tests and for reading the PDF by eye.
	Uncompressed bool
}

// Thermal is what the coil page states about temperature.
type Thermal struct {
	// Tempco is d ln L/dT of the inductance at the terminals at the
	// operating frequency (low frequency when none), per kelvin; Spread is
	// its uncertainty from the former's class spread.
	Tempco, Spread float64
	PitchRule      string // what sets the pitch: "former", "wire (self-supporting)" …
	Tank           *TankDrift
}

// TankDrift is the drift of the coil's tank with the job's capacitor.
type TankDrift struct {
	Capacitance unit.Capacitance
	Class       string // "C0G", "N750", "air" …
	Frequency   unit.Frequency
	PerK        float64 // d ln f/dT per kelvin
	Uncertainty float64 // per kelvin, root sum square of the classes' tolerances
	// Over the workshop's range LowTemp … HighTemp (kelvin): the shift
	// from its low end to its high end, Hz, and that shift's uncertainty.
	LowTemp, HighTemp         unit.Temperature
	ShiftHz, ShiftUncertainty float64
}
