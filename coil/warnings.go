package coil

import (
	"fmt"
	"math"
	"turnwise/internal/quantity"
)

// Warnings words the prediction's flags for a builder, most important
// first, with lengths in millimetres. Informational flags (Wheeler's range)
// are not included.
func (p *Prediction) Warnings() []string { return p.WarningsIn(quantity.LengthFormat{}) }

// WarningsIn is Warnings with lengths in lf's display unit, so that a run
// in inches never prints a millimetre.
func (p *Prediction) WarningsIn(lf quantity.LengthFormat) []string {
	var w []string
	f := float64(p.Frequency)
	if p.Flags&FlagNearSRF != 0 {
		w = append(w, fmt.Sprintf("operating frequency %s is above a third of the self-resonance (SRF %s, %s; SRF/3 is the common-practice limit): L and Q depend strongly on stray capacitance; prefer fewer turns or a smaller coil",
			quantity.FormatFrequency(f), quantity.FormatFrequency(float64(p.SRFUsed())), p.SRFMounting.Description()))
	}
	if p.Flags&FlagLongWire != 0 {
		lambda := SpeedOfLight / f
		w = append(w, fmt.Sprintf("the winding's wire (%s) is longer than a tenth of a wavelength (%s) at %s: the lumped model is only a guide",
			lf.Format(float64(p.HelixWire)), lf.Format(lambda/10), quantity.FormatFrequency(f)))
	}
	if p.Flags&FlagMedhurstExtrap != 0 {
		ld := float64(p.SheetLength) / float64(p.MeanDiameter)
		w = append(w, fmt.Sprintf("length/diameter %.3g is outside Medhurst's table (0.1 … 50): self-capacitance and SRF are extrapolated", ld))
	}
	if p.Flags&FlagSRFOutsideValidation != 0 {
		ld := float64(p.SheetLength) / float64(p.MeanDiameter)
		pd := float64(p.Geometry.Pitch) / float64(p.Geometry.WireDiameter)
		w = append(w, fmt.Sprintf("length/diameter %.3g or pitch/wire %.3g is outside the range the self-resonance model was checked over (0.3 … 10, 1.05 … 10): SRF is extrapolated (±%.0f %%)", ld, pd, p.SRFUncertainty*100))
	}
	if p.Flags&FlagNagaokaRange != 0 {
		ld := float64(p.SheetLength) / float64(p.MeanDiameter)
		w = append(w, fmt.Sprintf("length/diameter %.3g is outside 0.01 … 100: an unusual shape for a single-layer coil; check the geometry", ld))
	}
	if p.Flags&FlagSteepPitch != 0 {
		w = append(w, fmt.Sprintf("pitch %s is more than the coil diameter: the inductance's helix correction was checked against a helix integral only up to p = D (within 0.2 %%) and is extrapolated beyond; measure and trim",
			lf.Format(float64(p.Geometry.Pitch))))
	}
	if p.Flags&FlagTinned != 0 && f > 0 {
		w = append(w, fmt.Sprintf("tinned wire: the %s tin plating (override with --plating) raises RF resistance and Q includes it; silver-plated or bare copper is better at VHF",
			lf.Format(tinMicrons(p.Geometry)*1e-6)))
	}
	return w
}

// WavelengthFraction is the winding's wire length as a fraction of the
// free-space wavelength at f.
func (p *Prediction) WavelengthFraction() float64 {
	if p.Frequency <= 0 {
		return 0
	}
	return float64(p.HelixWire) * float64(p.Frequency) / SpeedOfLight
}

// allFinite reports whether every float in p is finite; Predict's tests
// use it, and callers may too before printing.
func (p *Prediction) allFinite() bool {
	for _, v := range []float64{
		float64(p.MeanDiameter), float64(p.InsideDiameter), float64(p.OutsideDiameter),
		float64(p.SheetLength), float64(p.WindingLength), float64(p.HelixWire), float64(p.WireLength),
		float64(p.CopperMass), p.Nagaoka, p.SelfCorrection, p.MutualCorrection, p.InternalFraction,
		float64(p.InductanceSheet), float64(p.InductanceCoil), float64(p.InductanceCoilAtF),
		float64(p.InductanceLeads), float64(p.Inductance), float64(p.InductanceWheeler),
		float64(p.InductanceEffective), float64(p.SelfCapacitance), float64(p.SRF), float64(p.SRFMin),
		float64(p.SRFMax), float64(p.SRFFloatingMin), float64(p.SRFFloatingMax), float64(p.SRFFloating), p.SRFUncertainty, float64(p.RDC),
		float64(p.SkinDepth), p.SkinFactor, p.ProximityFactor, float64(p.RRadiation), float64(p.RAC),
		p.Q, p.QMin, p.QMax,
	} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// tinMicrons is the tin plating the prediction assumed, in µm.
func tinMicrons(g Geometry) float64 {
	t := float64(g.Plating)
	if t == 0 {
		t = g.Conductor.TypicalPlating()
	}
	return t * 1e6
}
