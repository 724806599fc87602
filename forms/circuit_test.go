package forms

import (
	"errors"
	"math"
	"strings"
	"testing"
)

const goodCircuit = `title = "trap"
[[capacitor]]
name = "C1"
from = "in"
to = "out"
value = "100pF"
q = 500
q_at = "7MHz"
tempco = "N750"
rating = "1kV"
range = "10pF-250pF"

[[inductor]]
name = "L1"
from = "in"
to = "out"
value = "5uH"
esr = "0.5ohm"

[[resistor]]
name = "R1"
from = "out"
to = "gnd"
value = "50ohm"

[[inductor]]
name = "L2"
from = "in"
to = "gnd"
value = "1uH"

[[coupling]]
name = "K1"
parts = ["L1", "L2"]
k = 0.1

[[port]]
node = "in"

[[port]]
node = "out"
z0 = "75ohm"

[load]
node = "out"
`

func TestLoadCircuit(t *testing.T) {
	c, err := LoadCircuit(strings.NewReader(goodCircuit), "trap.toml")
	if err != nil {
		t.Fatal(err)
	}
	if c.Title != "trap" || len(c.Capacitors) != 1 || len(c.Inductors) != 2 || len(c.Resistors) != 1 || len(c.Ports) != 2 {
		t.Fatalf("read %+v", c)
	}
	cp := c.Capacitors[0]
	close := func(a, b float64) bool { return math.Abs(a-b) <= 1e-12*math.Abs(b) }
	if !close(cp.Value, 100e-12) || cp.Q != 500 || !close(cp.QAt, 7e6) || !close(cp.Tempco, -750e-6) ||
		!close(cp.Rating, 1000) || !close(cp.Min, 10e-12) || !close(cp.Max, 250e-12) {
		t.Errorf("capacitor %+v", cp)
	}
	if !close(c.Inductors[0].ESR, 0.5) || c.Ports[0].Z0 != 50 || c.Ports[1].Z0 != 75 || c.Load == nil || c.Load.Node != "out" {
		t.Errorf("inductor/ports/load: %+v %+v %+v", c.Inductors[0], c.Ports, c.Load)
	}
	if c.Couplings[0].K != 0.1 || c.Couplings[0].Parts != [2]string{"L1", "L2"} {
		t.Errorf("coupling %+v", c.Couplings[0])
	}
	if got := cp.KeyLine("tempco"); got != 9 {
		t.Errorf("tempco line %d, want 9", got)
	}
}

func TestLoadCircuitErrors(t *testing.T) {
	swap := func(old, new string) string {
		if !strings.Contains(goodCircuit, old) {
			panic(old)
		}
		return strings.Replace(goodCircuit, old, new, 1)
	}
	for _, tc := range []struct {
		name, file, field string
		line              int
	}{
		{"unknown key", swap("rating =", "ratting ="), `capacitor "C1"`, 10},
		{"unknown top key", "colour = 1\n" + goodCircuit, "", 1},
		{"bad value", swap(`value = "100pF"`, `value = "100pH"`), "value", 6},
		{"shorted part", swap(`to = "out"
value = "100pF"`, `to = "in"
value = "100pF"`), "to", 5},
		{"port on ground", swap(`node = "in"`, `node = "gnd"`), "node", 38},
		{"node used once", swap(`name = "L2"
from = "in"`, `name = "L2"
from = "dangle"`), "from", 28},
		{"floating island", goodCircuit + "[[capacitor]]\nname = \"C9\"\nfrom = \"x\"\nto = \"y\"\nvalue = \"1pF\"\n[[capacitor]]\nname = \"C8\"\nfrom = \"x\"\nto = \"y\"\nvalue = \"1pF\"\n", "from", 48},
		{"q without q_at", swap("q_at = \"7MHz\"\n", ""), "q", 7},
		{"q and esr", swap(`esr = "0.5ohm"`, "esr = \"0.5ohm\"\nq = 50\nq_at = \"7MHz\""), "esr", 18},
		{"bad tempco", swap(`"N750"`, `"hot"`), "tempco", 9},
		{"value outside range", swap(`"10pF-250pF"`, `"10pF-50pF"`), "value", 6},
		{"coupling to resistor", swap(`["L1", "L2"]`, `["L1", "R1"]`), "parts", 34},
		{"coupling k", swap("k = 0.1", "k = 1.5"), "k", 35},
		{"duplicate name", swap(`name = "L2"`, `name = "L1"`), "name", 27},
		{"no port", strings.Split(goodCircuit, "[[port]]")[0], "", 1},
		{"syntax", swap(`value = "5uH"`, `value = "5uH`), "", 17},
		{"coil without turns", "[[coil]]\nname = \"L\"\nfrom = \"a\"\nto = \"gnd\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nleads = \"5mm\"\n[[port]]\nnode = \"a\"\n", "", 1},
		{"tap node missing", "[[coil]]\nname = \"L\"\nfrom = \"a\"\nto = \"gnd\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = 5\nleads = \"5mm\"\ntap = 1\n[[port]]\nnode = \"a\"\n", "", 1},
		{"tap outside", "[[coil]]\nname = \"L\"\nfrom = \"a\"\nto = \"gnd\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = 5\nleads = \"5mm\"\ntap = 6\ntap_node = \"t\"\n[[port]]\nnode = \"a\"\n", "tap", 9},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := LoadCircuit(strings.NewReader(tc.file), "c.toml")
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v, want *ParseError", err)
			}
			if pe.Kind != "circuit" || pe.Line != tc.line || (tc.field != "" && !strings.HasSuffix(pe.Field, tc.field)) {
				t.Fatalf("got %q (line %d, field %q), want line %d field %q", err, pe.Line, pe.Field, tc.line, tc.field)
			}
		})
	}
}

func TestParseTempco(t *testing.T) {
	for in, want := range map[string]float64{"NP0": 0, "C0G": 0, "N750": -750e-6, "P100": 100e-6, "-750ppm/K": -750e-6, "+30 ppm/C": 30e-6} {
		got, err := ParseTempco(in)
		if err != nil || math.Abs(got-want) > 1e-15 {
			t.Errorf("ParseTempco(%q) = %g, %v; want %g (EIA class-1 code, common practice)", in, got, err, want)
		}
	}
	if _, err := ParseTempco("X7R"); err == nil {
		t.Error("X7R accepted as a class-1 tempco")
	}
}
