package forms

import (
	"errors"
	"math"
	"os"
	"strings"
	"testing"
	"turnwise/internal/quantity"

	"github.com/BurntSushi/toml"
)

func TestLoadStockErrors(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name  string
		in    string
		line  int
		field string // ParseError.Field
		err   string // substring of Error()
	}{
		{
			name: "bad toml",
			in:   "[[wire]]\nname = \"a\"\ngauge = 22awg\n",
			line: 3, err: "not valid TOML",
		},
		{
			name: "unknown key",
			in:   "[[wire]]\nname = \"a\"\ngauge = \"22awg\"\ncolour = \"red\"\n",
			line: 4, field: `wire "a"`, err: `unknown key "colour"; [[wire]] takes name, gauge, bare`,
		},
		{
			name: "misspelt key",
			in:   "[[wire]]\nname = \"a\"\nguage = \"22awg\"\n",
			line: 3, err: `unknown key "guage"; did you mean gauge?`,
		},
		{
			name: "unknown key in the middle entry",
			in: "[[wire]]\nname = \"a\"\ngauge = \"22awg\"\n\n" +
				"[[wire]]\nname = \"b\"\ngauge = \"24awg\"\nspool = 1\n\n" +
				"[[wire]]\nname = \"c\"\ngauge = \"26awg\"\n",
			line: 8, field: `wire "b"`, err: `unknown key "spool"`,
		},
		{
			name: "unknown key after multi-line string",
			in:   "[[calibration]]\nnote = \"\"\"\nline one\nline two\n\"\"\"\nmandrel = \"6mm drill\"\nwire = \"22awg\"\nspringback = \"1%\"\ncolor = 1\n",
			line: 9, err: `unknown key "color"`,
		},
		{
			name: "unknown section",
			in:   "# my bench\n\nwires = 1\n",
			line: 3, err: `unknown key "wires"; a stock file holds [[wire]], [[mandrel]], [[former]] and [[calibration]] sections; did you mean [[wire]]?`,
		},
		{
			name: "single brackets",
			in:   "[wire]\nname = \"a\"\n",
			line: 1, field: "wire", err: "double brackets",
		},
		{
			name: "decimal comma",
			in:   "# bench\n[[wire]]\nname = \"green spool\"\nbare = \"0,64mm\"\n",
			line: 4, field: `wire "green spool": bare`,
			err: `stock "test.toml": line 4: wire "green spool": bare: length "0,64mm": use a decimal point, not a comma: 0.64mm`,
		},
		{
			name: "missing unit",
			in:   "[[mandrel]]\nname = \"rod\"\ndiameter = \"6\"\n",
			line: 3, err: `length "6": add a unit`,
		},
		{
			name: "number instead of text",
			in:   "[[mandrel]]\nname = \"rod\"\ndiameter = 6\n",
			line: 3, err: `diameter: is a number; write it in quotes, e.g. diameter = "6mm"`,
		},
		{
			name: "wrong dimension",
			in:   "[[former]]\nname = \"tube\"\ndiameter = \"20nH\"\n",
			line: 3, err: "that is an inductance",
		},
		{
			name: "duplicate wire name",
			in:   "[[wire]]\nname = \"Green\"\ngauge = \"22awg\"\n[[wire]]\nname = \"green\"\ngauge = \"24awg\"\n",
			line: 5, field: `wire "green": name`, err: "already used on line 2",
		},
		{
			name: "mandrel and former share names",
			in:   "[[mandrel]]\nname = \"tube\"\ndiameter = \"6mm\"\n[[former]]\nname = \"tube\"\ndiameter = \"20mm\"\n",
			line: 5, err: "already used on line 2",
		},
		{
			name: "former before mandrel with the same name",
			in:   "[[former]]\nname = \"tube\"\ndiameter = \"20mm\"\n[[mandrel]]\nname = \"Tube\"\ndiameter = \"6mm\"\n",
			line: 5, field: `mandrel "Tube": name`, err: "already used on line 2",
		},
		{
			name: "unknown calibration mandrel",
			in: "[[mandrel]]\nname = \"brass rod 6\"\ndiameter = \"6mm\"\n\n" +
				"[[calibration]]\nmandrel = \"brass rod 7\"\nwire = \"22awg\"\nspringback = \"3%\"\n",
			line: 6, field: "calibration #1: mandrel", err: `mandrel or former "brass rod 7" not found; did you mean brass rod 6?`,
		},
		{
			name: "unknown calibration wire",
			in:   "[[calibration]]\nmandrel = \"6mm drill\"\nwire = \"green spool\"\nspringback = \"3%\"\n",
			line: 3, err: `wire "green spool" not found`,
		},
		{
			name: "calibration naming a broken wire reports the wire",
			in: "[[calibration]]\nmandrel = \"6mm drill\"\nwire = \"green\"\nspringback = \"3%\"\n" +
				"[[wire]]\nname = \"green\"\ngauge = \"99awg\"\n",
			line: 7, err: "AWG runs from 0000 to 56",
		},
		{
			name: "first problem in the file wins",
			in: "[[calibration]]\nmandrel = \"6mm drill\"\nwire = \"22awg\"\nspringback = \"90%\"\n" +
				"[[wire]]\nname = \"green\"\ngauge = \"99awg\"\n",
			line: 4, err: "90% is outside -20% to 50%",
		},
		{
			name: "springback as a number",
			in:   "[[calibration]]\nmandrel = \"6mm drill\"\nwire = \"22awg\"\nspringback = 0.03\n",
			line: 4, err: `write it as text with a percent sign, e.g. springback = "3.1%"`,
		},
		{
			name: "springback too negative",
			in:   "[[calibration]]\nmandrel = \"6mm drill\"\nwire = \"22awg\"\nspringback = \"-25%\"\n",
			line: 4, err: "-25% is outside",
		},
		{
			name: "springback missing",
			in:   "\n[[calibration]]\nmandrel = \"6mm drill\"\nwire = \"22awg\"\n",
			line: 2, err: `add springback = "3.1%"`,
		},
		{
			name: "wire too thick",
			in:   "[[wire]]\nname = \"bus bar\"\nbare = \"15mm\"\n",
			line: 3, err: "15mm is outside 0.02mm to 12mm",
		},
		{
			name: "gauge too thick",
			in:   "[[wire]]\nname = \"cable\"\ngauge = \"7/0swg\"\n",
			line: 3, err: "is outside 0.02mm to 12mm",
		},
		{
			name: "mandrel too thin",
			in:   "[[mandrel]]\nname = \"needle\"\ndiameter = \"0.1mm\"\n",
			line: 3, err: "0.1mm is outside 0.5mm to 1000mm",
		},
		{
			name: "former too big",
			in:   "[[former]]\nname = \"barrel\"\ndiameter = \"2m\"\n",
			line: 3, err: "is outside 0.5mm to 1000mm",
		},
		{
			name: "gauge and bare",
			in:   "[[wire]]\nname = \"a\"\ngauge = \"22awg\"\nbare = \"0.64mm\"\n",
			line: 4, err: "give gauge or bare, not both",
		},
		{
			name: "neither gauge nor bare",
			in:   "\n\n[[wire]]\nname = \"a\"\n",
			line: 3, field: `wire "a"`, err: `add gauge = "22awg" or bare = "0.64mm"`,
		},
		{
			name: "missing name",
			in:   "[[mandrel]]\ndiameter = \"6mm\"\n",
			line: 1, field: "mandrel #1", err: `add name = "my mandrel"`,
		},
		{
			name: "not a gauge",
			in:   "[[wire]]\nname = \"a\"\ngauge = \"0.64mm\"\n",
			line: 3, err: `"0.64mm" is not a gauge; use e.g. 22awg or 18swg, or write bare = "0.64mm"`,
		},
		{
			name: "insulation thinner than wire",
			in:   "[[wire]]\nname = \"a\"\nbare = \"1mm\"\ninsulation = \"0.9mm\"\n",
			line: 4, err: "less than the bare 1mm",
		},
		{
			name: "insulation grade3 not tabulated",
			in:   "[[wire]]\nname = \"a\"\nbare = \"1mm\"\ninsulation = \"grade3\"\n",
			line: 4, err: "give the measured overall diameter",
		},
		{
			name: "unknown conductor",
			in:   "[[wire]]\nname = \"a\"\nbare = \"1mm\"\nconductor = \"gold\"\n",
			line: 4, err: `"gold": use copper, tinned or silver-plated`,
		},
		{
			name: "inline array of tables",
			in:   "wire = [\n  {name = \"a\", gauge = \"22awg\"},\n  {name = \"b\", gauge = \"99awg\"},\n]\n",
			line: 3, field: `wire "b": gauge`, err: "AWG runs from",
		},
		{
			name: "quoted keys",
			in:   "[[wire]]\n\"name\" = \"a\"\n'gauge' = \"22awg\"\n\"odd key\" = 1\n",
			line: 4, err: `unknown key "odd key"`,
		},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			c, err := LoadStock(strings.NewReader(tc.in), "test.toml")
			if err == nil {
				t.Fatalf("LoadStock = %+v, want an error", c)
			}
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %T %v, want *ParseError", err, err)
			}
			if pe.Line != tc.line || pe.File != "test.toml" {
				t.Errorf("error at %q line %d, want line %d: %v", pe.File, pe.Line, tc.line, err)
			}
			if tc.field != "" && pe.Field != tc.field {
				t.Errorf("field %q, want %q: %v", pe.Field, tc.field, err)
			}
			if !strings.Contains(err.Error(), tc.err) {
				t.Errorf("error %q, want it to contain %q", err, tc.err)
			}
		})
	}
}

func TestLoadStockSyntaxErrorUnwraps(t *testing.T) {
	t.Parallel()
	_, err := LoadStock(strings.NewReader("a = \n"), "x.toml")
	var te toml.ParseError
	if !errors.As(err, &te) {
		t.Errorf("error %v does not unwrap to toml.ParseError", err)
	}
	var qe *quantity.Error
	_, err = LoadStock(strings.NewReader("[[mandrel]]\nname = \"r\"\ndiameter = \"6\"\n"), "x.toml")
	if !errors.As(err, &qe) || qe.Want != "length" {
		t.Errorf("error %v does not unwrap to a length *quantity.Error", err)
	}
}

func TestLoadStockDemo(t *testing.T) {
	t.Parallel()
	f, err := os.Open("../testdata/stock/bench.toml")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	stock, err := LoadStock(f, "bench.toml")
	if err != nil {
		t.Fatal(err)
	}
	if len(stock.Wires) != 4 || len(stock.Mandrels) != 2 || len(stock.Formers) != 2 || len(stock.Calibrations) != 3 {
		t.Fatalf("rows: %d wires, %d mandrels, %d formers, %d calibrations", len(stock.Wires), len(stock.Mandrels), len(stock.Formers), len(stock.Calibrations))
	}
	for _, w := range stock.Wires {
		if w.Origin != "bench.toml" || w.System != "user" || w.Overall < w.Bare || w.Source == "" {
			t.Errorf("wire %+v", w)
		}
	}
	all := Merge(builtIn(t), stock)
	// Springback values are the demo file's invented numbers.
	const sbTol = 1e-12
	cases := []struct {
		name          string
		mandrel, wire string
		want          float64
	}{
		{name: "later entry wins", mandrel: "brass rod 6", wire: "green spool", want: 0.028},
		{name: "built-in names", mandrel: "6mm drill", wire: "18 SWG", want: 0.04},
	}
	for _, tc := range cases {
		cal, ok := all.Springback(tc.mandrel, tc.wire)
		if !ok || math.Abs(cal.Springback-tc.want) > sbTol {
			t.Errorf("%s: Springback = %+v, %v; want %v", tc.name, cal, ok, tc.want)
		}
	}
	if w, err := all.Wire("hookup blue"); err != nil || w.Insulation != "custom" || !closeRel(float64(w.Overall), 1.4e-3, implTol) {
		t.Errorf("hookup blue = %+v, %v", w, err)
	}
	if m, err := all.Mandrel("3/8in"); err != nil || m.Name != "pen barrel" {
		t.Errorf("Mandrel(3/8in) = %+v, %v; want the user's pen barrel over the built-in drill", m, err)
	}
}

func TestStockTemplateLoads(t *testing.T) {
	t.Parallel()
	tmpl := StockTemplate()
	c, err := LoadStock(strings.NewReader(tmpl), "template")
	if err != nil {
		t.Fatalf("template does not load: %v", err)
	}
	if len(c.Wires) == 0 || len(c.Mandrels) == 0 || len(c.Formers) == 0 || len(c.Calibrations) == 0 {
		t.Errorf("template lacks a section: %+v", c)
	}
	for _, k := range stockSections {
		for _, key := range stockKeys[k] {
			if !strings.Contains(tmpl, "\n"+key+" = ") {
				t.Errorf("template does not show key %q of [[%s]]", key, k)
			}
		}
	}
}

func TestLoadStockEmpty(t *testing.T) {
	t.Parallel()
	c, err := LoadStock(strings.NewReader("# nothing yet\n"), "empty.toml")
	if err != nil || len(c.Wires)+len(c.Mandrels)+len(c.Formers)+len(c.Calibrations) != 0 {
		t.Errorf("LoadStock(empty) = %+v, %v", c, err)
	}
}

// FuzzLoadStock checks that LoadStock never panics, that errors are
// *ParseError, and that accepted wires obey the catalog invariants.
func FuzzLoadStock(f *testing.F) {
	f.Add(StockTemplate())
	if b, err := os.ReadFile("../testdata/stock/bench.toml"); err == nil {
		f.Add(string(b))
	}
	for _, s := range []string{
		"",
		"[[wire]]\nname = \"a\"\nbare = \"0,64mm\"\n",
		"wire = [{name = \"a\", gauge = \"22awg\"}]\n",
		"[[calibration]]\nmandrel = \"6mm\"\nwire = \"22awg\"\nspringback = \"3%\"\n",
		"a = [[[[1]]]]\n",
		"x = \"\"\"\n\"\"\"\"\n[[mandrel]]\nname='q'\ndiameter='1/4in'\n",
		"[wire.x]\n",
		"\ufeff[[former]]\nname = \"t\"\ndiameter = \"20mm\"\n",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		c, err := LoadStock(strings.NewReader(s), "fuzz.toml")
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %T, want *ParseError", err)
			}
			return
		}
		for _, w := range c.Wires {
			if !(w.Bare > 0) || w.Overall < w.Bare || math.IsInf(float64(w.Overall), 0) {
				t.Fatalf("wire %+v breaks the invariants", w)
			}
		}
		for _, cal := range c.Calibrations {
			if math.IsNaN(cal.Springback) || math.IsInf(cal.Springback, 0) {
				t.Fatalf("calibration %+v not finite", cal)
			}
		}
	})
}
