package design

import (
	"fmt"
	"math"
	"turnwise/coil"

	"gonum.org/v1/gonum/optimize"
	"gonum.org/v1/gonum/unit"
)

// Free diameter: the support diameter becomes a continuous variable. For
// each suitable wire the objective is the best score over the turns at
// that diameter (walkPair), which is piecewise smooth in the diameter. A
// coarse log-spaced scan finds the best region; gonum's Nelder–Mead then
// refines it on the reparameterised variable
//
//	D = D_lo·(D_hi/D_lo)^σ(u),   σ(u) = 1/(1+e^(−u)),
//
// which keeps D inside its bounds without constraints. The optimum is
// rounded to 0.1 mm (a rod one can buy or turn) and the neighbouring
// 0.1 mm steps are compared; the best becomes a candidate like any stock
// support. If the optimiser fails, the scan's best is used.

const (
	freeDefaultMin = 2e-3
	freeDefaultMax = 50e-3
	freeScan       = 10
	freeRound      = 0.1e-3
)

func (x *search) searchFree() {
	s := x.s
	fd := s.c.FreeDiameter
	lo, hi := float64(fd.Min), float64(fd.Max)
	if lo == 0 {
		lo = freeDefaultMin
	}
	if hi == 0 {
		hi = freeDefaultMax
	}
	for wi, w := range s.c.Wires {
		dw := &x.wires[wi]
		wlo, whi := math.Max(lo, BendRatio*float64(w.Diameter)), hi
		if !fd.OnFormer {
			whi = math.Min(whi, float64(w.Diameter)/SelfSupportWireRatio)
		}
		if s.c.MaxDiameter > 0 && x.relax != "max_diameter" {
			whi = math.Min(whi, float64(s.c.MaxDiameter)-2*dw.do)
		}
		wlo = math.Max(wlo, coil.MinFormerDiameter)
		if !(whi > wlo) {
			continue
		}
		if ok, _ := WireSuits(x.freeSupport(wlo, fd.OnFormer), w, &s.c); !ok {
			continue
		}
		value := func(d float64) (found, bool) {
			sup := x.freeSupport(d, fd.OnFormer)
			pv := x.newPairValue(-1, &sup, wi)
			p := &pv
			x.bound(p)
			if p.nLB == 0 {
				return found{}, false
			}
			return x.walkPair(p, false)
		}
		// Scan.
		bestT, bestS := -1.0, math.Inf(-1)
		for i := range freeScan {
			t := (float64(i) + 0.5) / freeScan
			if co, ok := value(wlo * math.Pow(whi/wlo, t)); ok && co.score > bestS {
				bestT, bestS = t, co.score
			}
		}
		if bestT < 0 {
			continue
		}
		// Refine.
		dOf := func(u float64) float64 { return wlo * math.Pow(whi/wlo, 1/(1+math.Exp(-u))) }
		prob := optimize.Problem{Func: func(v []float64) float64 {
			if co, ok := value(dOf(v[0])); ok {
				return -co.score
			}
			return 1e3 // no coil at this diameter
		}}
		settings := &optimize.Settings{
			FuncEvaluations: 40,
			Converger:       &optimize.FunctionConverge{Absolute: 1e-3, Iterations: 6},
		}
		dBest := wlo * math.Pow(whi/wlo, bestT)
		u0 := math.Log(bestT / (1 - bestT))
		res, err := optimize.Minimize(prob, []float64{u0}, settings, &optimize.NelderMead{SimplexSize: 0.5})
		if err == nil && res.Status.Err() == nil && res.F < -bestS {
			dBest = dOf(res.X[0])
		}
		// Round and compare the neighbours.
		dr := math.Round(dBest/freeRound) * freeRound
		var pick *pair
		pickS := math.Inf(-1)
		for _, d := range []float64{dr - freeRound, dr, dr + freeRound} {
			if d < wlo-1e-12 || d > whi+1e-12 {
				continue
			}
			sup := x.freeSupport(d, fd.OnFormer)
			pv := x.newPairValue(-1, &sup, wi)
			p := &pv
			x.bound(p)
			if p.nLB == 0 {
				continue
			}
			if co, ok := x.walkPair(p, false); ok && co.score > pickS {
				pick, pickS = p, co.score
			}
		}
		if pick != nil {
			pick.idx = len(x.pairs)
			x.pairs = append(x.pairs, pick)
			x.pairScore = append(x.pairScore, math.Inf(-1))
			x.pairCoil = append(x.pairCoil, -1)
			x.drain([]*pair{pick})
		}
	}
}

func (x *search) freeSupport(d float64, onFormer bool) Support {
	d = math.Round(d*1e7) / 1e7
	kind := "rod"
	if onFormer {
		kind = "former"
	}
	return Support{Name: fmt.Sprintf("%.1f mm %s (free diameter)", d*1e3, kind), OnFormer: onFormer, Diameter: unit.Length(d)}
}
