package thermal

import (
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
)

// CopperExpansion is copper's linear expansion coefficient near room
// temperature, per kelvin: 16.5e-6 (CRC Handbook of Chemistry and Physics,
// thermal expansion of the elements, Cu at 20–25 °C; from memory). The
// materials table in forms carries the same value with its source.
const CopperExpansion = 16.5e-6

// Step is the temperature step of the central differences, in kelvin.
// The model is smooth in temperature; the step's truncation error
// (O(Step²) relative to the derivative's own scale) is far below the
// coefficients' material spread, and it is large enough that rounding
// (1e-16/(α·Step)) stays below 1e-10.
const Step = 1.0

// PitchFollows says which material sets the pitch of a coil wound on a
// former: the former's surface carries the turns apart as it expands
// (PitchFollowsFormer, the default), or the turns keep their spacing as
// the wire does (PitchFollowsWire). A self-supporting coil and a
// close-wound one follow the wire whatever is chosen: touching turns hold
// one another apart.
type PitchFollows int

const (
	PitchFollowsFormer PitchFollows = iota
	PitchFollowsWire
)

func (p PitchFollows) String() string {
	if p == PitchFollowsWire {
		return "wire"
	}
	return "former"
}

// ParsePitchFollows reads "former" or "wire".
func ParsePitchFollows(s string) (PitchFollows, error) {
	switch s {
	case "", "former":
		return PitchFollowsFormer, nil
	case "wire":
		return PitchFollowsWire, nil
	}
	return 0, coil.InputErrorf("pitch_follows", "%q: use wire or former", s)
}

// Support is what sets a coil's dimensions as the temperature changes.
type Support struct {
	// SelfSupporting is a coil slid off a mandrel: every dimension follows
	// the wire.
	SelfSupporting bool
	// Former is the former's linear expansion coefficient per kelvin
	// (ignored when SelfSupporting); FormerLow and FormerHigh its class
	// spread (zero: no spread stated).
	Former, FormerLow, FormerHigh float64
	// Wire is the conductor's coefficient; zero means CopperExpansion.
	Wire float64
	// Pitch says what sets the pitch on a former.
	Pitch PitchFollows
}

func (s Support) wire() float64 {
	if s.Wire == 0 {
		return CopperExpansion
	}
	return s.Wire
}

// closeWound reports turns touching: the pitch is the wire's overall
// diameter (to a part in a million).
func closeWound(g *coil.Geometry) bool {
	return float64(g.Pitch) <= float64(g.OverallDiameter())*(1+1e-6)
}

// PitchRule names the material that sets g's pitch under s.
func (s Support) PitchRule(g coil.Geometry) string {
	switch {
	case s.SelfSupporting:
		return "wire (self-supporting)"
	case closeWound(&g):
		return "wire (close-wound: the turns touch)"
	case s.Pitch == PitchFollowsWire:
		return "wire"
	}
	return "former"
}

// At returns g as it is dT kelvin away from its own temperature (zero
// means 20 °C): the wire (diameter, insulation, leads) scales with the
// wire's coefficient; the bore with the former's, or the wire's for a
// self-supporting coil; the pitch as PitchRule says. The wire-centre
// diameter D = D_f·(1+s) + d_o thus follows the former through D_f and the
// wire through d_o. The conductor's temperature moves by dT, so its
// resistivity (IACS, 0.00393/K) and skin depth follow.
func (s Support) At(g coil.Geometry, dT float64) coil.Geometry {
	aw := s.wire()
	af := s.Former
	if s.SelfSupporting {
		af = aw
	}
	wire, former := 1+aw*dT, 1+af*dT
	out := g
	out.FormerDiameter = unit.Length(float64(g.FormerDiameter) * former)
	out.WireDiameter = unit.Length(float64(g.WireDiameter) * wire)
	out.WireOverall = unit.Length(float64(g.WireOverall) * wire)
	out.LeadLength = unit.Length(float64(g.LeadLength) * wire)
	pitch := former
	if s.SelfSupporting || s.Pitch == PitchFollowsWire || closeWound(&g) {
		pitch = wire
	}
	out.Pitch = unit.Length(float64(g.Pitch) * pitch)
	out.Temperature = unit.Temperature(kelvin(g.Temperature) + dT)
	return out
}

// kelvin is t, with zero read as 20 °C as the coil package does.
func kelvin(t unit.Temperature) float64 {
	if t == 0 {
		return 293.15
	}
	return float64(t)
}

// Coefficients are a coil's temperature coefficients, each d ln X / dT
// per kelvin, from central differences of the full model.
type Coefficients struct {
	// Inductance is of the inductance at the terminals at f (winding and
	// leads, without the self-capacitance's transform): the JSON
	// "tempco".
	Inductance float64
	// LowFrequency is of the winding's low-frequency inductance
	// (Prediction.InductanceCoil): the JSON "tempco_low_frequency". It is
	// exactly the wire's coefficient for a self-supporting coil.
	LowFrequency float64
	// Skin is the part of Inductance that comes from copper's resistivity
	// alone (dimensions held): the internal inductance that survives at f
	// scales with the skin depth, δ ∝ √ρ. Zero at f = 0.
	Skin float64
	// Effective is of the apparent inductance at f with the
	// self-capacitance included (what a tank sees).
	Effective float64
	// Resistance is of the series resistance at the terminals at f; Q is
	// of the Q at f (the JSON "tempco_q"). Both zero at f = 0.
	Resistance, Q float64
	// Spread is half the range of LowFrequency over the former's class
	// spread (FormerLow … FormerHigh): the coefficient's own uncertainty.
	Spread float64
	// PitchRule names what sets the pitch.
	PitchRule string
}

// Tempco computes g's temperature coefficients at frequency f (zero for
// low frequency only) for support s. It refuses what coil.Predict refuses.
func Tempco(g coil.Geometry, f unit.Frequency, s Support) (Coefficients, error) {
	if _, err := coil.Predict(g, f); err != nil {
		return Coefficients{}, err
	}
	if err := s.validate(); err != nil {
		return Coefficients{}, err
	}
	c := tempco(g, float64(f), s)
	c.PitchRule = s.PitchRule(g)
	if !s.SelfSupporting && (s.FormerLow != 0 || s.FormerHigh != 0) {
		lo, hi := s, s
		lo.Former, hi.Former = s.FormerLow, s.FormerHigh
		a, b := tempco(g, float64(f), lo), tempco(g, float64(f), hi)
		c.Spread = math.Abs(b.LowFrequency-a.LowFrequency) / 2
	}
	return c, nil
}

func (s Support) validate() error {
	for _, v := range []struct {
		name string
		x    float64
	}{{"former_expansion", s.Former}, {"former_expansion_low", s.FormerLow},
		{"former_expansion_high", s.FormerHigh}, {"wire_expansion", s.Wire}} {
		if math.IsNaN(v.x) || math.Abs(v.x) > 1e-3 {
			return coil.InputErrorf(v.name, "%g per kelvin is outside ±1000 ppm/K", v.x)
		}
	}
	return nil
}

// tempco is Tempco for a validated geometry and support.
func tempco(g coil.Geometry, f float64, s Support) Coefficients {
	var lo, hi, base coil.Prediction
	glo, ghi := s.At(g, -Step), s.At(g, Step)
	coil.Evaluate(&lo, &glo, f)
	coil.Evaluate(&hi, &ghi, f)
	coil.Evaluate(&base, &g, f)
	dln := func(a, b, c float64) float64 { return (b - a) / (2 * Step * c) }
	var c Coefficients
	c.Inductance = dln(float64(lo.Inductance), float64(hi.Inductance), float64(base.Inductance))
	c.LowFrequency = dln(float64(lo.InductanceCoil), float64(hi.InductanceCoil), float64(base.InductanceCoil))
	c.Effective = dln(float64(lo.InductanceEffective), float64(hi.InductanceEffective), float64(base.InductanceEffective))
	if f == 0 {
		return c
	}
	c.Resistance = dln(float64(lo.RAC), float64(hi.RAC), float64(base.RAC))
	c.Q = dln(lo.Q, hi.Q, base.Q)
	// The resistivity alone: dimensions held, the conductor's temperature moved.
	tlo, thi := g, g
	tlo.Temperature = unit.Temperature(kelvin(g.Temperature) - Step)
	thi.Temperature = unit.Temperature(kelvin(g.Temperature) + Step)
	coil.Evaluate(&lo, &tlo, f)
	coil.Evaluate(&hi, &thi, f)
	c.Skin = dln(float64(lo.Inductance), float64(hi.Inductance), float64(base.Inductance))
	return c
}
