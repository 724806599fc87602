package thermal

import (
	"math"

	"turnwise/coil"
	"turnwise/coil/circuit"
)

// PartCoefficient is how one part of a circuit.Network changes with
// temperature. For a capacitor, inductor or resistor Class holds its
// coefficient on Value; for a wound coil Support says what its
// dimensions follow (its coefficient comes from the model).
type PartCoefficient struct {
	Class   Class
	Support *Support
}

// ResonanceDrift is the drift of one resonance of a network.
type ResonanceDrift struct {
	Resonance circuit.Resonance
	Drift
	// Sensitivity is, per part, d ln f / d ln Value for lumped parts
	// (zero for wound coils, resistors and impedances): what
	// Compensate needs.
	Sensitivity []float64
}

// at returns a copy of net with every part dT kelvin from the reference:
// values scaled by (1 + τ·dT) and wound coils' geometry moved by their
// support. extra adds to part i's coefficient (for tolerance runs).
func at(net *circuit.Network, coefs []PartCoefficient, dT float64, extraPart int, extra float64) *circuit.Network {
	out := *net
	out.Parts = append([]circuit.Part(nil), net.Parts...)
	for i := range out.Parts {
		p := &out.Parts[i]
		var c PartCoefficient
		if i < len(coefs) {
			c = coefs[i]
		}
		tau := c.Class.Nominal
		if i == extraPart {
			tau += extra
		}
		switch p.Kind {
		case circuit.Wound:
			s := Support{SelfSupporting: true}
			if c.Support != nil {
				s = *c.Support
			}
			g := s.At(*p.Coil, dT)
			if i == extraPart {
				// The coil's own spread: its former's class range.
				s.Former += extra
				g = s.At(*p.Coil, dT)
			}
			p.Coil = &g
		case circuit.Capacitor, circuit.Inductor, circuit.Resistor:
			p.Value *= 1 + tau*dT
		}
	}
	return &out
}

// naturalAt finds the lossless natural frequency of net nearest f: with
// port 1 open for a parallel resonance, shorted for a series one.
func naturalAt(net *circuit.Network, r circuit.Resonance) (float64, error) {
	s, err := circuit.NewSolver(net)
	if err != nil {
		return 0, err
	}
	ms, err := s.NaturalFrequencies(math.Min(2*r.Natural, coil.MaxFrequency), r.Kind == circuit.Series)
	if err != nil {
		return 0, err
	}
	best, bd := 0.0, math.Inf(1)
	for _, m := range ms {
		if d := math.Abs(m.Frequency - r.Natural); d < bd {
			best, bd = m.Frequency, d
		}
	}
	if best == 0 {
		return 0, coil.InputErrorf("circuit", "the resonance near %.6g Hz vanished when the parts moved with temperature", r.Natural)
	}
	return best, nil
}

// NetworkDrift computes the drift of every resonance of net below fMax by
// moving every part with its coefficient (coefs parallels net.Parts) and
// finding the natural frequencies again through circuit.Solver: a
// central difference of ±Step kelvin. Each part's tolerance is carried to
// the drift by a run with that part alone at its coefficient plus its
// tolerance (a wound coil: its former's class spread).
func NetworkDrift(net *circuit.Network, coefs []PartCoefficient, fMax float64) ([]ResonanceDrift, error) {
	s, err := circuit.NewSolver(net)
	if err != nil {
		return nil, err
	}
	rs, err := s.Resonances(fMax)
	if err != nil {
		return nil, err
	}
	return ResonancesDrift(net, coefs, rs)
}

// ResonancesDrift is NetworkDrift for resonances already found (by
// Solver.Resonances on the same network), in their order.
func ResonancesDrift(net *circuit.Network, coefs []PartCoefficient, rs []circuit.Resonance) ([]ResonanceDrift, error) {
	perK := func(r circuit.Resonance, part int, extra float64) (float64, error) {
		lo, err := naturalAt(at(net, coefs, -Step, part, extra), r)
		if err != nil {
			return 0, err
		}
		hi, err := naturalAt(at(net, coefs, Step, part, extra), r)
		if err != nil {
			return 0, err
		}
		return (hi - lo) / (2 * Step * r.Natural), nil
	}
	var out []ResonanceDrift
	for _, r := range rs {
		d, err := perK(r, -1, 0)
		if err != nil {
			return nil, err
		}
		rd := ResonanceDrift{Resonance: r, Sensitivity: make([]float64, len(net.Parts))}
		rd.Frequency, rd.PerK, rd.HzPerK = r.Natural, d, d*r.Natural
		var sumSq, sum float64
		for i, p := range net.Parts {
			var c PartCoefficient
			if i < len(coefs) {
				c = coefs[i]
			}
			tol := c.Class.Tolerance
			if p.Kind == circuit.Wound && c.Support != nil && !c.Support.SelfSupporting {
				tol = (c.Support.FormerHigh - c.Support.FormerLow) / 2
			}
			switch p.Kind {
			case circuit.Capacitor, circuit.Inductor:
				// d ln f/d ln Value from a 1e-6 relative step of this value.
				sens, err := sensitivity(net, r, i)
				if err != nil {
					return nil, err
				}
				rd.Sensitivity[i] = sens
				u := math.Abs(sens) * tol
				sumSq += u * u
				sum += u
			case circuit.Wound:
				if tol == 0 {
					continue
				}
				dd, err := perK(r, i, tol)
				if err != nil {
					return nil, err
				}
				u := math.Abs(dd - d)
				sumSq += u * u
				sum += u
			}
		}
		rd.Uncertainty, rd.WorstCase = math.Sqrt(sumSq), sum
		out = append(out, rd)
	}
	return out, nil
}

// sensitivity is d ln f / d ln Value of part i at resonance r, by a
// central difference of ±1e-6 relative.
func sensitivity(net *circuit.Network, r circuit.Resonance, i int) (float64, error) {
	const h = 1e-6
	step := func(k float64) (float64, error) {
		n := *net
		n.Parts = append([]circuit.Part(nil), net.Parts...)
		n.Parts[i].Value *= 1 + k
		return naturalAt(&n, r)
	}
	lo, err := step(-h)
	if err != nil {
		return 0, err
	}
	hi, err := step(h)
	if err != nil {
		return 0, err
	}
	return (hi - lo) / (2 * h * r.Natural), nil
}

// NetworkShift is a resonance's move between temperatures low and high
// (kelvin) given the reference ref at which net's values hold, found by
// solving the network at each end.
func NetworkShift(net *circuit.Network, coefs []PartCoefficient, d ResonanceDrift, ref, low, high float64) (Shift, error) {
	fl, err := naturalAt(at(net, coefs, low-ref, -1, 0), d.Resonance)
	if err != nil {
		return Shift{}, err
	}
	fh, err := naturalAt(at(net, coefs, high-ref, -1, 0), d.Resonance)
	if err != nil {
		return Shift{}, err
	}
	s := Shift{Low: low, High: high, FLow: fl, FHigh: fh, Hz: fh - fl}
	s.Relative = s.Hz / d.Frequency
	s.Uncertainty = math.Abs(high-low) * d.Frequency * d.Uncertainty
	return s, nil
}
