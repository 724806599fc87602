package spec

import (
	"fmt"
	"math"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/circuit"
	"turnwise/coil/thermal"
	"turnwise/forms"
)

// CircuitThermalSettings are circuit's temperature options.
type CircuitThermalSettings struct {
	Pitch      thermal.PitchFollows
	Low, High  unit.Temperature // kelvin; both zero: no range
	Compensate bool             // propose a split of each tank's fixed capacitor
}

// CircuitDrift is the temperature behaviour of a circuit's resonances,
// each slice parallel to the resonances it was computed for.
type CircuitDrift struct {
	Drifts   []thermal.ResonanceDrift
	Shifts   []*thermal.Shift // nil without a range
	Splits   []*CircuitSplit  // nil without --compensate, or no fixed capacitor sets it
	Classes  []thermal.Class  // per part: the class each lumped part was taken at
	Warnings []string
}

// CircuitSplit is a proposed compensation of one resonance: capacitor
// Part (fixed, of value Value) replaced by Split's two capacitors. The
// residual drift and its uncertainty carry the rest of the circuit's
// tolerances too.
type CircuitSplit struct {
	Part        string
	Value       float64
	Split       thermal.Split
	Residual    float64 // d ln f/dT with the split in place
	Uncertainty float64 // root sum square: the split's classes and every other part
}

// CircuitThermal computes the drift of resonances rs of net (found by
// Solver.Resonances): every wound coil moves with its support (coils
// parallels net.Parts for wound parts; their formers' materials looked up
// in cat), every capacitor with its class (lumped parallels net.Parts;
// a capacitor without a tempco is taken as 0 ppm/K with a warning),
// inductors and resistors given by value are held. A coil on a former of
// unknown material leaves no drift, with a warning (nil result).
func CircuitThermal(cat *forms.Catalog, net *circuit.Network, coils map[int]Spec, lumped []*forms.CircuitPart,
	rs []circuit.Resonance, set CircuitThermalSettings) (*CircuitDrift, error) {
	out := &CircuitDrift{Classes: make([]thermal.Class, len(net.Parts))}
	coefs := make([]thermal.PartCoefficient, len(net.Parts))
	var noTempco []string
	for i, p := range net.Parts {
		switch p.Kind {
		case circuit.Wound:
			sup, ok, why := ThermalSupport(cat, coils[i], set.Pitch)
			if !ok {
				out.Warnings = append(out.Warnings, fmt.Sprintf("coil %s: %s; no drift computed", p.Name, why))
				return out, nil
			}
			coefs[i].Support = &sup
		case circuit.Capacitor:
			var lp *forms.CircuitPart
			if i < len(lumped) {
				lp = lumped[i]
			}
			if lp == nil || !lp.HasTempco {
				noTempco = append(noTempco, p.Name)
				out.Classes[i] = thermal.Class{Code: "unstated"}
				continue
			}
			k, err := thermal.ParseClass(lp.TempcoRaw)
			if err != nil {
				k = thermal.Class{Code: lp.TempcoRaw, Nominal: lp.Tempco, Source: "given"}
			}
			coefs[i].Class, out.Classes[i] = k, k
		}
	}
	if len(noTempco) > 0 {
		out.Warnings = append(out.Warnings, fmt.Sprintf("capacitor(s) %v state no tempco: taken as 0 ppm/K without tolerance; add tempco = \"C0G\" (or the class you fit) to the circuit file", noTempco))
	}
	ds, err := thermal.ResonancesDrift(net, coefs, rs)
	if err != nil {
		return nil, err
	}
	out.Drifts = ds
	out.Shifts = make([]*thermal.Shift, len(ds))
	out.Splits = make([]*CircuitSplit, len(ds))
	for j, d := range ds {
		if set.High > set.Low {
			sh, err := thermal.NetworkShift(net, coefs, d, 293.15, float64(set.Low), float64(set.High))
			if err != nil {
				return nil, err
			}
			out.Shifts[j] = &sh
		}
		if set.Compensate {
			out.Splits[j] = compensateResonance(net, lumped, coefs, d)
		}
	}
	return out, nil
}

// compensateResonance splits the fixed capacitor that most sets resonance
// d (the largest |d ln f/d ln C| of at least 0.05), or returns nil.
func compensateResonance(net *circuit.Network, lumped []*forms.CircuitPart, coefs []thermal.PartCoefficient, d thermal.ResonanceDrift) *CircuitSplit {
	best, bs := -1, 0.05
	for i, p := range net.Parts {
		if p.Kind != circuit.Capacitor || (i < len(lumped) && lumped[i] != nil && lumped[i].Adjustable()) {
			continue
		}
		if s := math.Abs(d.Sensitivity[i]); s >= bs {
			best, bs = i, s
		}
	}
	if best < 0 {
		return nil
	}
	sens := d.Sensitivity[best]
	tau := coefs[best].Class.Nominal
	// The coefficient that, in this capacitor, brings the drift to zero.
	target := tau - d.PerK/sens
	sp, err := thermal.Compensate(net.Parts[best].Value, sens, target, thermal.CompensateOptions{})
	if err != nil {
		return nil
	}
	// The rest's uncertainty: the drift's without this capacitor's share.
	own := math.Abs(sens) * coefs[best].Class.Tolerance
	rest := math.Sqrt(math.Max(0, d.Uncertainty*d.Uncertainty-own*own))
	return &CircuitSplit{Part: net.Parts[best].Name, Value: net.Parts[best].Value, Split: sp,
		Residual: sp.Residual, Uncertainty: math.Hypot(rest, sp.Uncertainty)}
}
