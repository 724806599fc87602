package spec

import (
	"fmt"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/coil/thermal"
	"turnwise/forms"
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
