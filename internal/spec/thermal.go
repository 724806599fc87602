package spec

import (
	"fmt"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/coil/thermal"
	"turnwise/forms"
	"turnwise/sheets"
)

// ThermalSupport says what a resolved coil's dimensions follow with
// temperature: a coil off a mandrel follows the wire; one on a former
// follows the former's material from the catalog (the built-in materials
// table, or a stock file's material/expansion keys); the wire's
// coefficient is the catalog's copper row. ok is false, with the reason,
// when a former's material is unknown.
func ThermalSupport(cat *forms.Catalog, s Spec, pitch thermal.PitchFollows) (sup thermal.Support, ok bool, why string) {
	sup.Pitch = pitch
	sup.Wire = thermal.CopperExpansion
	if cat != nil {
		if cu, err := cat.Material("copper"); err == nil {
			sup.Wire = cu.Expansion
		}
	}
	if s.SupportKind != coil.SupportFormer {
		sup.SelfSupporting = true
		return sup, true, ""
	}
	if cat == nil {
		return sup, false, fmt.Sprintf("the material of former %q is unknown, so no temperature coefficient", s.SupportName)
	}
	f, err := cat.Former(s.SupportName)
	if err != nil || f.Material == "" || f.Expansion == 0 {
		return sup, false, fmt.Sprintf("the material of former %q is unknown, so no temperature coefficient: use a catalog former, or give material or expansion for it in your stock file", s.SupportName)
	}
	sup.Former, sup.FormerLow, sup.FormerHigh = f.Expansion, f.ExpansionLow, f.ExpansionHigh
	return sup, true, ""
}

// Tempco computes the temperature coefficients of a resolved coil at f.
// ok is false, with a warning to show, when they cannot be given (a former
// of unknown material, or a model refusal).
func Tempco(cat *forms.Catalog, s Spec, f unit.Frequency, pitch thermal.PitchFollows) (c thermal.Coefficients, ok bool, warning string) {
	sup, ok, why := ThermalSupport(cat, s, pitch)
	if !ok {
		return c, false, why
	}
	c, err := thermal.Tempco(s.Geometry, f, sup)
	if err != nil {
		return c, false, "no temperature coefficient: " + err.Error()
	}
	return c, true, ""
}

// CandidateTempco is Tempco for a design candidate, through the same Spec
// FromCandidate gives it (rows from WireRows).
func CandidateTempco(cat *forms.Catalog, rows map[string]forms.Wire, c design.Candidate, f unit.Frequency, pitch thermal.PitchFollows) (thermal.Coefficients, bool, string) {
	return Tempco(cat, FromCandidate(rows, c), f, pitch)
}

// SheetThermal is the coil page's temperature data: the tempco of the
// terminal inductance at the coil's frequency and, when the job coil names
// its tank capacitor (a design target's cap), that tank's drift with the
// cap-tempco class (C0G when not given) over the job's temp-range. nil
// when the former's material is unknown. A cap-tempco that is not a class
// nor a coefficient is an error at its line.
func SheetThermal(job *forms.Job, jc *forms.JobCoil, cat *forms.Catalog, s Spec, p coil.Prediction) (*sheets.Thermal, error) {
	s.Geometry = p.Geometry
	k, ok, _ := Tempco(cat, s, p.Frequency, thermal.PitchFollowsFormer)
	if !ok {
		return nil, nil
	}
	th := &sheets.Thermal{Tempco: k.Inductance, Spread: k.Spread, PitchRule: k.PitchRule}
	if jc.Target == nil || jc.Target.Cap == nil || !(p.Frequency > 0) {
		return th, nil
	}
	class := thermal.Class{Code: "C0G", Tolerance: 30e-6}
	if jc.CapTempco != "" {
		var err error
		if class, err = thermal.ParseClass(jc.CapTempco); err != nil {
			return nil, JobFieldError(job, jc, "cap-tempco", err)
		}
	} else if c0g, err := thermal.ParseClass("C0G"); err == nil {
		class = c0g
	}
	// The tank sees the effective inductance at f (self-capacitance included).
	d := thermal.TankDrift(float64(p.Frequency), k.Effective, k.Spread, class)
	low, high := float64(job.TempLow), float64(job.TempHigh)
	if !(high > low) {
		low, high = forms.DefaultTempLow, forms.DefaultTempHigh
	}
	sh := thermal.TankShift(d, k.Effective, class, 293.15, low, high)
	th.Tank = &sheets.TankDrift{Capacitance: *jc.Target.Cap, Class: class.Code, Frequency: p.Frequency,
		PerK: d.PerK, Uncertainty: d.Uncertainty, LowTemp: unit.Temperature(low), HighTemp: unit.Temperature(high),
		ShiftHz: sh.Hz, ShiftUncertainty: sh.Uncertainty}
	return th, nil
}
