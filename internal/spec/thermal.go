package spec

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/coil/thermal"
	"turnwise/forms"
	"turnwise/internal/quantity"
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
// its tank capacitor (a design target's cap, or a fixed winding's
// tank-cap), that tank's drift with the cap-tempco class (C0G when not
// given) over the job's temp-range. A design target's tank resonates at
// its freq; a fixed winding's at the frequency TankResonance finds. nil
// when the former's material is unknown. A cap-tempco that is not a class
// nor a coefficient is an error at its line, as is a tank-cap the winding
// cannot resonate with.
func SheetThermal(job *forms.Job, jc *forms.JobCoil, cat *forms.Catalog, s Spec, p coil.Prediction) (*sheets.Thermal, error) {
	s.Geometry = p.Geometry
	k, ok, _ := Tempco(cat, s, p.Frequency, thermal.PitchFollowsFormer)
	if !ok {
		return nil, nil
	}
	th := &sheets.Thermal{Tempco: k.Inductance, Spread: k.Spread, PitchRule: k.PitchRule}
	var capacitance unit.Capacitance
	f := p.Frequency
	switch {
	case jc.Target != nil && jc.Target.Cap != nil && p.Frequency > 0:
		capacitance = *jc.Target.Cap
	case jc.Target == nil && jc.TankCap != nil:
		capacitance = *jc.TankCap
		var err error
		if f, err = TankResonance(p.Geometry, capacitance); err != nil {
			return nil, JobFieldError(job, jc, "tank-cap", err)
		}
		if k, ok, _ = Tempco(cat, s, f, thermal.PitchFollowsFormer); !ok {
			return th, nil
		}
	default:
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
	d := thermal.TankDrift(float64(f), k.Effective, k.Spread, class)
	low, high := float64(job.TempLow), float64(job.TempHigh)
	if !(high > low) {
		low, high = forms.DefaultTempLow, forms.DefaultTempHigh
	}
	sh := thermal.TankShift(d, k.Effective, class, 293.15, low, high)
	th.Tank = &sheets.TankDrift{Capacitance: capacitance, Class: class.Code, Frequency: f,
		PerK: d.PerK, Uncertainty: d.Uncertainty, LowTemp: unit.Temperature(low), HighTemp: unit.Temperature(high),
		ShiftHz: sh.Hz, ShiftUncertainty: sh.Uncertainty}
	return th, nil
}

// TankResonance is the frequency at which winding g resonates with an
// external capacitor c: the root of 4π²f²·L_eff(f)·c = 1, with L_eff the
// apparent inductance at f (self-capacitance and leads included), found by
// bisection on log f below 90 % of the winding's self-resonance, where L_eff grows
// with f.
func TankResonance(g coil.Geometry, c unit.Capacitance) (unit.Frequency, error) {
	if !(c > 0) {
		return 0, fmt.Errorf("%s: the tank capacitor must be positive", quantity.FormatCapacitance(float64(c)))
	}
	p0, err := coil.Predict(g, 0)
	if err != nil {
		return 0, err
	}
	miss := func(f float64) (float64, error) {
		p, err := coil.Predict(g, unit.Frequency(f))
		if err != nil {
			return 0, err
		}
		return 4*math.Pi*math.Pi*f*f*float64(p.InductanceEffective)*float64(c) - 1, nil
	}
	hi := 0.9 * float64(p0.SRF) * (1 - 1e-9) // the model's limit for a usable inductor
	lo := 1 / (2 * math.Pi * math.Sqrt(float64(p0.InductanceCoil)*float64(c))) / 100
	if !(hi > lo) || !(lo > 0) {
		return 0, fmt.Errorf("%s is too small for this winding: it would resonate near or above the winding's self-resonance (%s)",
			quantity.FormatCapacitance(float64(c)), quantity.FormatEng(float64(p0.SRF), "Hz", 3))
	}
	mlo, err := miss(lo)
	if err != nil {
		return 0, err
	}
	mhi, err := miss(hi)
	if err != nil {
		return 0, err
	}
	if mlo >= 0 || mhi <= 0 {
		return 0, fmt.Errorf("%s is too small for this winding: it would resonate above 90 %% of its self-resonance (%s); use a larger capacitor",
			quantity.FormatCapacitance(float64(c)), quantity.FormatEng(float64(p0.SRF), "Hz", 3))
	}
	for i := 0; i < 100 && hi/lo-1 > 1e-12; i++ {
		mid := math.Sqrt(lo * hi)
		m, err := miss(mid)
		if err != nil {
			return 0, err
		}
		if m < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return unit.Frequency(math.Sqrt(lo * hi)), nil
}
