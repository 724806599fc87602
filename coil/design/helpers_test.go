package design

import (
	"math"
	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// implTol: code against an independent calculation of the same formula.
const implTol = 1e-9

func relErr(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

// bruteStock is the small stock and the cases the brute-force tests search.
func bruteStock() ([]Support, []WireOption, []designCase) {
	sups := []Support{
		{Name: "4mm", Diameter: 4e-3}, {Name: "6mm", Diameter: 6e-3}, {Name: "8mm", Diameter: 8e-3},
		{Name: "tube 12", Diameter: 12e-3, OnFormer: true}, {Name: "tube 20", Diameter: 20e-3, OnFormer: true},
	}
	wires := []WireOption{
		{Name: "0.63", Diameter: 0.63e-3, Overall: 0.68e-3}, {Name: "0.8", Diameter: 0.8e-3, Overall: 0.86e-3},
		{Name: "1.0", Diameter: 1e-3, Overall: 1.06e-3}, {Name: "1.25", Diameter: 1.25e-3, Overall: 1.32e-3},
		{Name: "1.0 silver", Diameter: 1e-3, Conductor: coil.SilverPlated}, {Name: "0.4", Diameter: 0.4e-3, Overall: 0.44e-3},
	}
	cases := []designCase{
		{"vhf", Target{Resonance: 145e6, Capacitance: 22e-12}, Constraints{LeadLength: 5e-3, MaxLength: 15e-3}},
		{"vhf small", Target{Inductance: 80e-9, Frequency: 100e6}, Constraints{LeadLength: 5e-3, Prefer: PreferSmall}},
		{"hf", Target{Inductance: 2e-6, Frequency: 10e6}, Constraints{LeadLength: 10e-3, MaxDiameter: 22e-3}},
	}
	return sups, wires, cases
}

// bruteForce walks a fine grid over every suitable pair of c's stock, every
// quarter turn from s.minTurns to 80 and steps pitches per turn count
// (close winding … coil.LoosestPitchFactor), and calls visit with each coil
// that meets the target to 0.25 % and the length, diameter and SRF limits.
func bruteForce(tt Target, c *Constraints, s settings, steps int, visit func(p coil.Prediction, g coil.Geometry, sp Support, w WireOption)) {
	for _, sp := range c.Supports {
		for _, w := range c.Wires {
			if ok, _ := WireSuits(sp, w, c); !ok {
				continue
			}
			do := float64(w.Overall)
			if do == 0 {
				do = float64(w.Diameter)
			}
			for n := s.minTurns; n <= 80; n += 0.25 {
				g := coil.Geometry{FormerDiameter: sp.Diameter, WireDiameter: w.Diameter, WireOverall: w.Overall,
					Conductor: w.Conductor, Turns: n, LeadLength: c.LeadLength}
				g.Pitch = unit.Length(do)
				if matchedValue(tt, g) < s.required*(1+s.margin) {
					continue
				}
				g.Pitch = unit.Length(coil.LoosestPitchFactor * do)
				if matchedValue(tt, g) > s.required*(1-s.margin) {
					break
				}
				for k := 0; k <= steps; k++ {
					g.Pitch = unit.Length(do * math.Pow(coil.LoosestPitchFactor, float64(k)/float64(steps)))
					if math.Abs(matchedValue(tt, g)/s.required-1) > 0.0025 {
						continue
					}
					var p coil.Prediction
					coil.Evaluate(&p, &g, s.opF)
					if c.MaxLength > 0 && p.WindingLength > c.MaxLength || c.MaxDiameter > 0 && p.OutsideDiameter > c.MaxDiameter ||
						float64(p.SRF) < s.srfRatio*s.opF {
						continue
					}
					visit(p, g, sp, w)
				}
			}
		}
	}
}
