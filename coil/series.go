package coil

import "gonum.org/v1/gonum/unit"

// SeriesModel is a wound coil as a network solver sees it at one
// frequency: the winding (L, R) shunted by its self-capacitance, in series
// with the two straight leads (LLeads, RLeads), the same arrangement
// Predict uses for the effective inductance. The solver places the
// self-capacitance itself, so L and R exclude the self-resonance transform
// that Prediction.InductanceEffective and Prediction.RAC apply.
type SeriesModel struct {
	Frequency       unit.Frequency
	L               unit.Inductance  // winding at f
	R               unit.Resistance  // winding at f: skin, proximity, radiation
	LLeads          unit.Inductance  // both leads at f
	RLeads          unit.Resistance  // both leads at f
	SelfCapacitance unit.Capacitance // equivalent, across the winding: resonates L at the mounting's SRF
}

// ModelAt evaluates g at f for a network solver. Unlike Predict it does
// not refuse frequencies near or above the self-resonance: there the
// network, with the self-capacitance in place, shows the resonance itself.
func ModelAt(g Geometry, f unit.Frequency) (SeriesModel, error) {
	return ModelAtMounted(g, f, Grounded)
}

// ModelAtMounted is ModelAt for a coil mounted as m: the self-capacitance
// is the one that puts the winding's resonance at m's SRF.
func ModelAtMounted(g Geometry, f unit.Frequency, m Mounting) (SeriesModel, error) {
	if m != Grounded && m != Floating {
		return SeriesModel{}, inputErrorf("mounting", "unknown mounting %d", int(m))
	}
	if err := g.Validate(); err != nil {
		return SeriesModel{}, err
	}
	if !finite(float64(f)) || f < 0 || f > MaxFrequency {
		return SeriesModel{}, inputErrorf("frequency", "must be between 0 and 10 GHz, e.g. 145MHz")
	}
	var p Prediction
	evaluate(&p, &g, float64(f), m)
	return seriesModel(&p), nil
}

// seriesModel undoes nothing: it rebuilds the series resistance from the
// parts evaluate keeps (R_dc over the wire, skin and proximity factors,
// radiation) so that no loss formula is written twice.
func seriesModel(p *Prediction) SeriesModel {
	m := SeriesModel{Frequency: p.Frequency, L: p.InductanceCoilAtF, LLeads: p.InductanceLeads,
		SelfCapacitance: p.SelfCapacitance}
	helix := float64(p.HelixWire)
	leads := 2 * float64(p.Geometry.LeadLength)
	rPerM := float64(p.RDC) / (helix + leads)
	if p.Frequency == 0 {
		m.R, m.RLeads = unit.Resistance(rPerM*helix), unit.Resistance(rPerM*leads)
		return m
	}
	m.R = unit.Resistance(rPerM*p.SkinFactor*helix*p.ProximityFactor + float64(p.RRadiation))
	m.RLeads = unit.Resistance(rPerM * p.SkinFactor * leads)
	return m
}
