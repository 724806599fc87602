package spec

import (
	"math"
	"os"
	"path/filepath"
	"testing"
	"turnwise/forms"
)

// The glue: catalog rows become supports and wires, pinned rows take the
// flags' insulation, and saved calibrations reach the pairs they name
// (the latest one for a pair).
func TestDesignGlue(t *testing.T) {
	f, err := os.Open(filepath.Join("..", "..", "testdata", "stock", "bench.toml"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	mine, err := forms.LoadStock(f, "bench.toml")
	if err != nil {
		t.Fatal(err)
	}
	builtin, err := forms.BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	cat := forms.Merge(builtin, mine)

	c, err := searchConstraints(cat, &SearchOptions{Support: "mandrel"})
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Supports) != len(cat.Mandrels) || len(c.Wires) != len(cat.Wires) {
		t.Errorf("%d supports, %d wires; catalog has %d mandrels, %d wires", len(c.Supports), len(c.Wires), len(cat.Mandrels), len(cat.Wires))
	}
	for _, s := range c.Supports {
		if s.OnFormer {
			t.Errorf("former %s among mandrels", s.Name)
		}
	}
	want := map[[2]string]float64{
		{"brass rod 6", "green spool"}: 0.028, // bench.toml, the later of its two (invented demo data)
		{"6mm drill", "18swg"}:         0.04,  // bench.toml (invented demo data)
	}
	got := map[[2]string]float64{}
	for _, cal := range c.Calibrations {
		got[[2]string{cal.Support, cal.Wire}] = cal.Springback
	}
	for k, v := range want {
		if math.Abs(got[k]-v) > 1e-12 {
			t.Errorf("calibration %v = %v, want %v (all: %v)", k, got[k], v, got)
		}
	}

	c, err = searchConstraints(cat, &SearchOptions{Former: "pvc 20mm", Wires: []string{"22awg", "1mm"}, Insulation: "grade2"})
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Supports) != 1 || !c.Supports[0].OnFormer || c.Supports[0].Diameter != 20e-3 {
		t.Errorf("supports %+v", c.Supports)
	}
	if len(c.Wires) != 2 || !(c.Wires[0].Overall > c.Wires[0].Diameter) || !(c.Wires[1].Overall > c.Wires[1].Diameter) {
		t.Errorf("pinned wires %+v lack grade 2 enamel", c.Wires)
	}

	v := 0.03
	c, err = searchConstraints(cat, &SearchOptions{Mandrel: "6mm", Springback: &v})
	if err != nil {
		t.Fatal(err)
	}
	if c.Supports[0].Springback != 0.03 || c.Calibrations != nil {
		t.Errorf("--springback did not override: %+v, %v", c.Supports[0], c.Calibrations)
	}

	tg, err := searchTarget(&SearchOptions{Capacitance: 22e-12, Stray: 3e-12, Freq: 145e6})
	if err != nil || tg.Resonance != 145e6 || tg.Capacitance != 22e-12 || tg.Stray != 3e-12 || tg.Inductance != 0 {
		t.Errorf("target %+v, %v", tg, err)
	}
}
