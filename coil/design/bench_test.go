package design_test

import (
	"fmt"
	"testing"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/forms"
	"turnwise/internal/spec"
)

// builtInStock converts the built-in catalog into the search's lists
// through the same glue the commands use.
func builtInStock(tb testing.TB) ([]design.Support, []design.WireOption) {
	cat, err := forms.BuiltIn()
	if err != nil {
		tb.Fatal(err)
	}
	sups, wires, err := spec.SearchLists(cat, &spec.SearchOptions{})
	if err != nil {
		tb.Fatal(err)
	}
	return sups, wires
}

var (
	sinkResult design.Result
	sinkPred   coil.Prediction
)

// The two targets of the acceptance lines.
func vhfDesign(sups []design.Support, wires []design.WireOption) (design.Target, design.Constraints) {
	return design.Target{Resonance: 145e6, Capacitance: 22e-12},
		design.Constraints{Supports: sups, Wires: wires, LeadLength: 5e-3, MaxLength: 15e-3}
}

func hfDesign(sups []design.Support, wires []design.WireOption) (design.Target, design.Constraints) {
	return design.Target{Inductance: 4.7e-6, Frequency: 7e6},
		design.Constraints{Supports: sups, Wires: wires, LeadLength: 10e-3}
}

// BenchmarkDesignYardstick is one coil.Predict of a representative coil
// (the README's VHF coil at 145 MHz): the unit the search's cost is quoted
// in, measured in the same run.
func BenchmarkDesignYardstick(b *testing.B) {
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 1.75e-3, LeadLength: 5e-3}
	for b.Loop() {
		p, err := coil.Predict(g, 145e6)
		if err != nil {
			b.Fatal(err)
		}
		sinkPred = p
		g.Pitch += unit.Length(1e-12)
	}
}

func benchDesign(b *testing.B, t design.Target, c design.Constraints) {
	b.Helper()
	var res design.Result
	for b.Loop() {
		var err error
		res, err = design.Search(t, c)
		if err != nil {
			b.Fatal(err)
		}
	}
	sinkResult = res
	b.ReportMetric(float64(res.Stats.Evaluations), "evals/op")
	b.ReportMetric(float64(res.Stats.Coils), "coils/op")
	b.ReportMetric(float64(res.Stats.Pairs), "pairs/op")
}

// BenchmarkDesignVHF and BenchmarkDesignHF search the whole built-in stock.
func BenchmarkDesignVHF(b *testing.B) {
	t, c := vhfDesign(builtInStock(b))
	benchDesign(b, t, c)
}

func BenchmarkDesignHF(b *testing.B) {
	t, c := hfDesign(builtInStock(b))
	benchDesign(b, t, c)
}

// scaled returns k copies of the stock. Exact copies repeat every row
// under a new name: physically the same stock, searched once. Distinct
// copies scale copy i's diameters by 1 + 0.2 %·i, so that every row is new
// work, as a larger real stock would be. supportsOnly copies the supports
// alone, so that the pairs grow k-fold rather than k²-fold.
func scaled(sups []design.Support, wires []design.WireOption, k int, distinct, supportsOnly bool) ([]design.Support, []design.WireOption) {
	var s2 []design.Support
	var w2 []design.WireOption
	for i := range k {
		f := 1.0
		if distinct {
			f = 1 + 0.002*float64(i)
		}
		for _, s := range sups {
			s.Name = fmt.Sprintf("%s #%d", s.Name, i)
			s.Diameter = unit.Length(float64(s.Diameter) * f)
			s2 = append(s2, s)
		}
		if supportsOnly && i > 0 {
			continue
		}
		for _, w := range wires {
			w.Name = fmt.Sprintf("%s #%d", w.Name, i)
			w.Diameter = unit.Length(float64(w.Diameter) * f)
			w.Overall = unit.Length(float64(w.Overall) * f)
			w2 = append(w2, w)
		}
	}
	return s2, w2
}

// BenchmarkDesignStock runs the HF search on 1×, 4× and 16× the built-in
// stock: exact copies of every row; distinct copies of the supports (pairs
// grow k-fold); distinct copies of every row (pairs grow k²-fold; 16× only
// without -short).
func BenchmarkDesignStock(b *testing.B) {
	sups, wires := builtInStock(b)
	for _, v := range []struct {
		name                   string
		distinct, supportsOnly bool
	}{{"exact", false, false}, {"supports", true, true}, {"distinct", true, false}} {
		for _, k := range []int{1, 4, 16} {
			if v.name == "distinct" && k == 16 && testing.Short() {
				continue
			}
			b.Run(fmt.Sprintf("%s-%dx", v.name, k), func(b *testing.B) {
				t, c := hfDesign(scaled(sups, wires, k, v.distinct, v.supportsOnly))
				benchDesign(b, t, c)
			})
		}
	}
}
