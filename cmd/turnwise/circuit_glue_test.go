package main

import (
	"errors"
	"strings"
	"testing"

	"turnwise/coil/circuit"
	"turnwise/forms"
)

func loadDemoCircuit(t *testing.T, path string) *circuitModel {
	t.Helper()
	c, err := loadCircuitFile(path)
	if err != nil {
		t.Fatal(err)
	}
	so := newStockOptions()
	cat, err := so.load()
	if err != nil {
		t.Fatal(err)
	}
	m, err := buildCircuit(c, cat, so, false)
	if err != nil {
		t.Fatal(err)
	}
	return m
}

func TestBuildCircuitFrontEnd(t *testing.T) {
	m := loadDemoCircuit(t, "../../testdata/circuits/frontend.toml")
	if got := len(m.Net.Parts); got != 4 {
		t.Fatalf("%d parts, want 4", got)
	}
	if i := m.PartIndex("L1"); i < 0 || m.Net.Parts[i].Kind != circuit.Wound || m.Net.Parts[i].Coil.Turns != 35 {
		t.Fatalf("L1 not a 35-turn wound coil: %+v", m.Net.Parts)
	}
	if m.Mounting[m.PartIndex("L2")] != "floating" {
		t.Errorf("L2 mounting %q, want floating", m.Mounting[m.PartIndex("L2")])
	}
	if _, err := circuit.NewSolver(m.Net); err != nil {
		t.Fatal(err)
	}
}

func TestBuildCircuitErrors(t *testing.T) {
	for _, tc := range []struct {
		name, file, want string
		line             int
	}{
		{"unknown wire", `
[[coil]]
name = "L1"
from = "a"
to = "gnd"
mandrel = "6mm"
wire = "unobtainium"
turns = 5
leads = "5mm"
[[capacitor]]
name = "C1"
from = "a"
to = "gnd"
value = "10pF"
[[port]]
node = "a"
`, `coil "L1": wire`, 7},
		{"tap beyond winding", `
[[coil]]
name = "L1"
from = "a"
to = "gnd"
mandrel = "6mm"
wire = "1mm"
turns = 5
leads = "5mm"
tap = 1
tap_node = "t"
[[capacitor]]
name = "C1"
from = "t"
to = "gnd"
value = "10pF"
[[resistor]]
name = "R1"
from = "a"
to = "gnd"
value = "1kohm"
[[port]]
node = "a"
`, "", 0},
		{"job file missing", `
[[coil]]
name = "L1"
from = "a"
to = "gnd"
job = "nowhere.toml"
coil = "L1"
[[capacitor]]
name = "C1"
from = "a"
to = "gnd"
value = "10pF"
[[port]]
node = "a"
`, `coil "L1": job`, 6},
	} {
		t.Run(tc.name, func(t *testing.T) {
			c, err := forms.LoadCircuit(strings.NewReader(tc.file), "x.toml")
			if err != nil {
				t.Fatal(err)
			}
			so := newStockOptions()
			cat, _ := so.load()
			_, err = buildCircuit(c, cat, so, false)
			if tc.want == "" {
				if err != nil {
					t.Fatalf("unexpected error %v", err)
				}
				return
			}
			var pe *forms.ParseError
			if !errors.As(err, &pe) || pe.Kind != "circuit" || pe.Line != tc.line || !strings.Contains(pe.Field, tc.want) {
				t.Fatalf("error %v (%#v), want circuit line %d field %q", err, pe, tc.line, tc.want)
			}
			if exitCode(err) != exitBadInput {
				t.Errorf("exit %d, want 2", exitCode(err))
			}
		})
	}
}

func TestBuildCircuitJobReference(t *testing.T) {
	c, err := forms.LoadCircuit(strings.NewReader(`
[[coil]]
name = "L1"
from = "a"
to = "gnd"
job = "club-night.toml"
coil = "L1 filter input"
[[capacitor]]
name = "C1"
from = "a"
to = "gnd"
value = "15pF"
[[port]]
node = "a"
`), "../../testdata/x.toml")
	if err != nil {
		t.Fatal(err)
	}
	so := newStockOptions()
	cat, _ := so.load()
	m, err := buildCircuit(c, cat, so, false)
	if err != nil {
		t.Fatal(err)
	}
	if g := m.Net.Parts[0].Coil; g.Turns != 5 || g.LeadLength < 3.9e-3 || g.LeadLength > 4.1e-3 {
		t.Fatalf("job coil resolved to %+v, want 5 turns with 4 mm leads (club-night.toml)", g)
	}
}
