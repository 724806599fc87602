package coil

import (
	"math"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Conductor is the wire's surface metal. Silver-plated and tinned copper
// are modelled as a plating on a copper core (plating.go): the plating
// carries the RF current where it is comparable to a skin depth.
type Conductor int

const (
	Copper Conductor = iota
	SilverPlated
	Tinned
)

func (c Conductor) String() string {
	switch c {
	case SilverPlated:
		return "silver-plated"
	case Tinned:
		return "tinned"
	default:
		return "copper"
	}
}

// ParseConductor maps "copper", "silver-plated" (or "silver") and
// "tinned" to a Conductor.
func ParseConductor(s string) (Conductor, error) {
	switch s {
	case "", "copper", "bare", "enamelled", "enameled":
		return Copper, nil
	case "silver-plated", "silver", "silverplated":
		return SilverPlated, nil
	case "tinned", "tin":
		return Tinned, nil
	}
	return Copper, inputErrorf("conductor", "%q is not a conductor: use copper, silver-plated or tinned", s)
}

// Geometry is a coil as wound. The zero value is not valid: at least
// FormerDiameter, WireDiameter, Turns and Pitch must be set.
type Geometry struct {
	// FormerDiameter is the outside diameter of the mandrel or former the
	// wire is wound on.
	FormerDiameter unit.Length
	// Springback is the fractional growth of the inside diameter when a
	// coil wound on a bare mandrel is released (0 for a coil left on its
	// former; typically 0–0.1). Range −0.2 … 0.5.
	Springback float64
	// WireDiameter is the bare conductor diameter d.
	WireDiameter unit.Length
	// WireOverall is the diameter over insulation d_o. Zero means bare
	// wire (d_o = d).
	WireOverall unit.Length
	// Conductor is the surface metal; the zero value is copper.
	Conductor Conductor
	// Plating is the thickness of a silver-plated or tinned wire's plating;
	// zero means the conductor's typical plating (TypicalPlating). It must
	// be zero for bare copper.
	Plating unit.Length
	// Temperature of the conductor; zero means 20 °C.
	Temperature unit.Temperature
	// Turns is N, a multiple of 1/4, from 1 to MaxTurns.
	Turns float64
	// Pitch is the axial distance between turn centres, p ≥ d_o.
	Pitch unit.Length
	// LeadLength is the length of each of the two straight leads from the
	// winding to the solder joint; zero is allowed.
	LeadLength unit.Length
}

// Limits of physical sense. Inputs outside them are refused, not clamped.
const (
	MaxTurns          = 10000
	MinWireDiameter   = 0.02e-3 // m, about 52 AWG
	MaxWireDiameter   = 12e-3   // m, above 0000 AWG
	MinFormerDiameter = 0.5e-3  // m
	MaxFormerDiameter = 1.0     // m
	MaxPitch          = 0.1     // m
	MaxLeadLength     = 1.0     // m
	MinSpringback     = -0.2
	MaxSpringback     = 0.5
	MinTemperatureC   = -60.0
	MaxTemperatureC   = 250.0
	MaxFrequency      = 10e9 // Hz
)

// OverallDiameter is d_o, the wire's diameter over its insulation: the
// bare diameter when WireOverall is zero.
func (g *Geometry) OverallDiameter() unit.Length { return unit.Length(g.overall()) }

// overall is OverallDiameter as a float64, for the formulas.
func (g *Geometry) overall() float64 {
	if g.WireOverall == 0 {
		return float64(g.WireDiameter)
	}
	return float64(g.WireOverall)
}

// Finite reports whether x is neither NaN nor infinite.
func Finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

func finite(x float64) bool { return Finite(x) }

// Validate reports the first input the model cannot accept.
func (g *Geometry) Validate() error {
	d, do := float64(g.WireDiameter), float64(g.WireOverall)
	df, p, n := float64(g.FormerDiameter), float64(g.Pitch), g.Turns
	switch {
	case !finite(df) || df <= 0:
		return inputErrorf("former_diameter", "must be a positive length, e.g. 6mm")
	case df < MinFormerDiameter || df > MaxFormerDiameter:
		return inputErrorf("former_diameter", "%s is outside %s … %s", quantity.FormatMillimetres(df), quantity.FormatMillimetres(MinFormerDiameter), quantity.FormatMillimetres(MaxFormerDiameter))
	case !finite(g.Springback) || g.Springback < MinSpringback || g.Springback > MaxSpringback:
		return inputErrorf("springback", "%.3g %% is outside %g … %g %%", g.Springback*100, MinSpringback*100, MaxSpringback*100)
	case !finite(d) || d <= 0:
		return inputErrorf("wire_diameter", "must be a positive length, e.g. 1mm or 18awg")
	case d < MinWireDiameter || d > MaxWireDiameter:
		return inputErrorf("wire_diameter", "%s is outside %s … %s", quantity.FormatMillimetres(d), quantity.FormatMillimetres(MinWireDiameter), quantity.FormatMillimetres(MaxWireDiameter))
	case !finite(do) || do < 0:
		return inputErrorf("wire_overall_diameter", "must be a positive length or zero for bare wire")
	case do != 0 && do < d:
		return inputErrorf("wire_overall_diameter", "%s is less than the bare diameter %s; give the diameter over the insulation", quantity.FormatMillimetres(do), quantity.FormatMillimetres(d))
	case do > 2*d+1e-3:
		return inputErrorf("wire_overall_diameter", "%s is implausibly thick insulation on %s wire", quantity.FormatMillimetres(do), quantity.FormatMillimetres(d))
	case !finite(n) || n < 1:
		return inputErrorf("turns", "must be at least 1 (got %g)", n)
	case n > MaxTurns:
		return inputErrorf("turns", "%g is more than %d turns; a single-layer air coil that long is outside this model", n, MaxTurns)
	case math.Abs(n*4-math.Round(n*4)) > 1e-9:
		return inputErrorf("turns", "%g is not a whole number of quarter turns; use e.g. %g", n, math.Round(n*4)/4)
	case !finite(p) || p <= 0:
		return inputErrorf("pitch", "must be a positive length, e.g. 1.5mm")
	case p < g.overall()*(1-1e-9):
		return inputErrorf("pitch", "%s is less than the wire's overall diameter %s; use a pitch of at least %s", quantity.FormatMillimetres(p), quantity.FormatMillimetres(g.overall()), quantity.FormatMillimetres(g.overall()))
	case p > MaxPitch:
		return inputErrorf("pitch", "%s is more than %s", quantity.FormatMillimetres(p), quantity.FormatMillimetres(MaxPitch))
	case !finite(float64(g.LeadLength)) || g.LeadLength < 0:
		return inputErrorf("lead_length", "must be zero or a positive length, e.g. 5mm")
	case float64(g.LeadLength) > MaxLeadLength:
		return inputErrorf("lead_length", "%s is more than %s", quantity.FormatMillimetres(float64(g.LeadLength)), quantity.FormatMillimetres(MaxLeadLength))
	case !finite(float64(g.Temperature)) || g.Temperature < 0:
		return inputErrorf("temperature", "must be an absolute temperature")
	}
	if g.Temperature != 0 {
		c := float64(g.Temperature) - 273.15
		if c < MinTemperatureC || c > MaxTemperatureC {
			return inputErrorf("temperature", "%.4g °C is outside %g … %g °C", c, MinTemperatureC, MaxTemperatureC)
		}
	}
	if g.Conductor < Copper || g.Conductor > Tinned {
		return inputErrorf("conductor", "unknown conductor %d", int(g.Conductor))
	}
	switch t := float64(g.Plating); {
	case !finite(t) || t < 0:
		return inputErrorf("plating", "must be a positive thickness, e.g. 1um")
	case t > 0 && g.Conductor == Copper:
		return inputErrorf("plating", "bare copper has no plating; give --conductor tinned or silver-plated, or leave the plating out")
	case t > MaxPlating || t > d/4:
		return inputErrorf("plating", "%s is thicker than the model accepts (at most %s and a quarter of the wire diameter)", quantity.FormatMillimetres(t), quantity.FormatMillimetres(math.Min(MaxPlating, d/4)))
	}
	return nil
}

// ValidateTurns reports whether n is a number of turns the model accepts,
// with Validate's message.
func ValidateTurns(n float64) error {
	switch {
	case !finite(n) || n < 1:
		return inputErrorf("turns", "must be at least 1 (got %g)", n)
	case n > MaxTurns:
		return inputErrorf("turns", "%g is more than %d turns; a single-layer air coil that long is outside this model", n, MaxTurns)
	}
	return nil
}

// MeanDiameter is the wire-centre diameter D = D_f·(1+s) + d_o.
func (g *Geometry) MeanDiameter() unit.Length {
	return unit.Length(float64(g.FormerDiameter)*(1+g.Springback) + g.overall())
}

// InsideDiameter is the bore of the finished coil, D_f·(1+s).
func (g *Geometry) InsideDiameter() unit.Length {
	return unit.Length(float64(g.FormerDiameter) * (1 + g.Springback))
}

// OutsideDiameter is the coil's overall diameter, D_f·(1+s) + 2·d_o.
func (g *Geometry) OutsideDiameter() unit.Length {
	return unit.Length(float64(g.FormerDiameter)*(1+g.Springback) + 2*g.overall())
}

// SheetLength is Rosa's current-sheet length l = N·p.
func (g *Geometry) SheetLength() unit.Length { return unit.Length(g.Turns * float64(g.Pitch)) }

// WindingLength is the outside length over the winding, the one a builder
// measures with calipers: (N−1)·p + d_o.
func (g *Geometry) WindingLength() unit.Length {
	return unit.Length((g.Turns-1)*float64(g.Pitch) + g.overall())
}

// PitchForWindingLength returns the pitch that gives an outside winding
// length of length with n turns of wire of overall diameter overall. It
// needs n > 1: a single turn has no pitch to set.
func PitchForWindingLength(n float64, overall, length unit.Length) (unit.Length, error) {
	if !finite(n) || n <= 1 {
		return 0, inputErrorf("turns", "an outside length sets the pitch only for more than one turn; give the pitch instead")
	}
	if !finite(float64(length)) || length <= 0 {
		return 0, inputErrorf("winding_length", "must be a positive length, e.g. 8mm")
	}
	p := (float64(length) - float64(overall)) / (n - 1)
	if p < float64(overall)*(1-1e-9) {
		minLen := (n-1)*float64(overall) + float64(overall)
		return 0, inputErrorf("winding_length", "%s is shorter than %g close-wound turns (%s); use at least %s or fewer turns",
			quantity.FormatMillimetres(float64(length)), n, quantity.FormatMillimetres(minLen), quantity.FormatMillimetres(minLen))
	}
	return unit.Length(p), nil
}
