package match

import (
	"context"
	"sort"

	"turnwise/coil/circuit"
)

// TapCoverage is one tap's share of the load grid matched over the
// frequencies.
type TapCoverage struct {
	TapTurns     float64   // from the cold end
	Coverage     float64   // mean over the frequencies, 0…1
	PerFrequency []float64 // in Options.Frequencies order
}

// ChooseTap maps the grid for every quarter-turn tap of the tapped coil
// named coilName (from ¼ turn to N − ¼) and returns the best keep taps,
// highest mean coverage first (ties: the tap nearer the cold end, the
// lower voltage at the tap). Stress is not computed.
func ChooseTap(ctx context.Context, setup Setup, opts Options, coilName string, keep int) ([]TapCoverage, error) {
	opts.Power = 0
	if err := opts.normalise(); err != nil {
		return nil, err
	}
	idx := -1
	for i, p := range setup.Network.Parts {
		if p.Name == coilName {
			idx = i
		}
	}
	if idx < 0 || setup.Network.Parts[idx].Kind != circuit.Wound || setup.Network.Parts[idx].TapNode < 0 {
		return nil, inputErr("choose-tap", "%q is not a tapped coil of the circuit: give a coil with tap and tap_node", coilName)
	}
	if keep < 1 {
		keep = 1
	}
	parts := append([]circuit.Part(nil), setup.Network.Parts...)
	setup.Network.Parts = parts
	limit := gammaFor(opts.SWR)
	var out []TapCoverage
	n := parts[idx].Coil.Turns
	for q := 1; float64(q)/4 < n; q++ {
		parts[idx].TapTurns = float64(q) / 4
		p, err := setup.prepare()
		if err != nil {
			return nil, err
		}
		tc := TapCoverage{TapTurns: parts[idx].TapTurns}
		for _, f := range opts.Frequencies {
			e, err := newEngine(p, f)
			if err != nil {
				return nil, err
			}
			matched := 0
			for i := range opts.Grid.NR {
				for j := range opts.Grid.NX {
					if err := ctx.Err(); err != nil {
						return nil, err
					}
					e.setLoad(complex(opts.Grid.R(i), opts.Grid.X(j)))
					for _, c := range e.search(limit, true) {
						if c.gamma <= limit && e.solverGamma(c.u) <= limit {
							matched++
							break
						}
					}
				}
			}
			cov := float64(matched) / float64(opts.Grid.NR*opts.Grid.NX)
			tc.PerFrequency = append(tc.PerFrequency, cov)
			tc.Coverage += cov / float64(len(opts.Frequencies))
		}
		out = append(out, tc)
	}
	sort.SliceStable(out, func(a, b int) bool { return out[a].Coverage > out[b].Coverage })
	if len(out) > keep {
		out = out[:keep]
	}
	return out, nil
}
