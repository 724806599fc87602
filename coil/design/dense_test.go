package design_test

import (
	"slices"
	"strings"
	"testing"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/design"
)

func hasDenseWarning(r design.Result) bool {
	return slices.ContainsFunc(r.Warnings, func(w string) bool { return strings.HasPrefix(w, "dense stock") })
}

// A dense stock (four distinct copies of the built-in one, 0.2 % apart)
// with a near-duplicate of every row added after it (0.05 % larger) gives
// the same ranked list and Pareto set as without: the added rows are
// within the thinning step of a row listed before them.
func TestDesignDenseStockIgnoresAddedNearDuplicates(t *testing.T) {
	sups, wires := builtInStock(t)
	sups, wires = scaled(sups, wires, 4, true, false)
	s2, w2 := slices.Clone(sups), slices.Clone(wires)
	for _, s := range sups {
		s.Name += " dup"
		s.Diameter = unit.Length(float64(s.Diameter) * 1.0005)
		s2 = append(s2, s)
	}
	for _, w := range wires {
		w.Name += " dup"
		w.Diameter = unit.Length(float64(w.Diameter) * 1.0005)
		w.Overall = unit.Length(float64(w.Overall) * 1.0005)
		w2 = append(w2, w)
	}
	for _, tc := range []struct {
		name string
		mk   func([]design.Support, []design.WireOption) (design.Target, design.Constraints)
	}{{"hf", hfDesign}, {"vhf", vhfDesign}} {
		t.Run(tc.name, func(t *testing.T) {
			ta, ca := tc.mk(sups, wires)
			a, err := design.Search(ta, ca)
			if err != nil {
				t.Fatal(err)
			}
			tb, cb := tc.mk(s2, w2)
			b, err := design.Search(tb, cb)
			if err != nil {
				t.Fatal(err)
			}
			if !hasDenseWarning(a) || !hasDenseWarning(b) {
				t.Errorf("dense stock not reported: %q / %q", a.Warnings, b.Warnings)
			}
			same := func(what string, x, y []design.Candidate) {
				if len(x) != len(y) {
					t.Fatalf("%s: %d vs %d coils", what, len(x), len(y))
				}
				for i := range x {
					if x[i].Support.Name != y[i].Support.Name || x[i].Wire.Name != y[i].Wire.Name ||
						x[i].Prediction.Geometry.Turns != y[i].Prediction.Geometry.Turns {
						t.Errorf("%s #%d: %s / %s vs %s / %s", what, i+1, x[i].Support.Name, x[i].Wire.Name, y[i].Support.Name, y[i].Wire.Name)
					}
					// Same rows, same arithmetic: equal to rounding (1e-12, implementation tolerance).
					if d := x[i].Score - y[i].Score; d > 1e-12 || d < -1e-12 {
						t.Errorf("%s #%d: score %.15g vs %.15g", what, i+1, x[i].Score, y[i].Score)
					}
				}
			}
			same("candidates", a.Candidates, b.Candidates)
			same("pareto", a.Pareto, b.Pareto)
		})
	}
}

// The built-in stock is below the density cap: nothing is thinned, every
// row is searched (the goldens in testdata/golden pin its results).
func TestDesignBuiltInStockNotThinned(t *testing.T) {
	sups, wires := builtInStock(t)
	for _, mk := range []func([]design.Support, []design.WireOption) (design.Target, design.Constraints){hfDesign, vhfDesign} {
		tg, c := mk(sups, wires)
		r, err := design.Search(tg, c)
		if err != nil {
			t.Fatal(err)
		}
		if hasDenseWarning(r) {
			t.Errorf("built-in stock thinned: %q", r.Warnings)
		}
	}
}
