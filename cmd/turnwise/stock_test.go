package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"turnwise/internal/report"
)

// benchStock is the demo stock file of the examples.
var benchStock = filepath.Join("..", "..", "testdata", "stock", "bench.toml")

func stockDoc(t *testing.T, args ...string) report.StockRecord {
	t.Helper()
	out, errOut, code := runCLI(t, append([]string{"stock", "--json"}, args...)...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc report.StockRecord
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	return doc
}

// The built-in catalogs as JSON: every row finite, positive and sourced,
// and a few rows checked against their standards.
func TestStockJSON(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	doc := stockDoc(t)
	if doc.Schema != report.SchemaVersion {
		t.Errorf("schema %d", doc.Schema)
	}
	if len(doc.Wires) == 0 || len(doc.Mandrels) == 0 || len(doc.Formers) == 0 {
		t.Fatalf("%d wires, %d mandrels, %d formers", len(doc.Wires), len(doc.Mandrels), len(doc.Formers))
	}
	if len(doc.Calibrations) != 0 {
		t.Errorf("built-in stock has %d calibrations, want none", len(doc.Calibrations))
	}
	ok := func(v float64) bool { return v > 0 && !math.IsInf(v, 0) && !math.IsNaN(v) }
	wires := map[string]report.WireRecord{}
	for _, w := range doc.Wires {
		wires[w.Name] = w
		if !ok(w.Bare) || !ok(w.Overall) || w.Overall < w.Bare || w.Source == "" || w.Origin != "built-in" {
			t.Errorf("wire row %+v", w)
		}
	}
	supports := map[string]report.SupportRecord{}
	for _, s := range append(append([]report.SupportRecord{}, doc.Mandrels...), doc.Formers...) {
		supports[s.Name] = s
		if !ok(s.Diameter) || s.Source == "" || s.Origin != "built-in" {
			t.Errorf("support row %+v", s)
		}
	}
	const inch = 25.4e-3 // m, international inch (1959 agreement)
	tests := []struct {
		name string
		got  float64
		want float64
	}{
		{"22awg bare", wires["22awg"].Bare, 0.005 * inch * math.Pow(92, 14.0/39)}, // ASTM B258 definition
		{"18swg bare", wires["18swg"].Bare, 0.048 * inch},                         // BS 3737: 18 SWG = 0.048 in (from memory)
		{"0.56mm bare", wires["0.56mm"].Bare, 0.56e-3},                            // IEC 60317-0-1 nominal, R20 (from memory)
		{"6mm drill", supports["6mm drill"].Diameter, 6e-3},                       // ISO 235 nominal diameter
		{"pvc 1/4in sch40", supports["pvc 1/4in sch40"].Diameter, 0.540 * inch},   // ASTM D1785: 1/4 in sch 40 OD 0.540 in (from memory)
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			if math.Abs(tc.got/tc.want-1) > 1e-12 {
				t.Errorf("%.9g m, want %.9g m", tc.got, tc.want)
			}
		})
	}
}

// --kind keeps one catalog; the others are left out of the JSON.
func TestStockKind(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	all := stockDoc(t)
	tests := []struct {
		kind                        string
		wires, mandrels, formers, c int
	}{
		{"wire", len(all.Wires), 0, 0, 0},
		{"mandrel", 0, len(all.Mandrels), 0, 0},
		{"former", 0, 0, len(all.Formers), 0},
		{"calibration", 0, 0, 0, 0},
	}
	for _, tc := range tests {
		t.Run(tc.kind, func(t *testing.T) {
			d := stockDoc(t, "--kind", tc.kind)
			if len(d.Wires) != tc.wires || len(d.Mandrels) != tc.mandrels || len(d.Formers) != tc.formers || len(d.Calibrations) != tc.c {
				t.Errorf("%d wires, %d mandrels, %d formers, %d calibrations; want %d, %d, %d, %d",
					len(d.Wires), len(d.Mandrels), len(d.Formers), len(d.Calibrations), tc.wires, tc.mandrels, tc.formers, tc.c)
			}
		})
	}
}

// The table: one section per catalog, lengths in the chosen unit.
func TestStockTable(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	tests := []struct {
		name string
		args []string
		want []*regexp.Regexp
		not  []string
	}{
		{"all", nil, []*regexp.Regexp{
			regexp.MustCompile(`(?m)^WIRE +bare +overall +insulation +conductor +source$`),
			regexp.MustCompile(`(?m)^22awg +0\.64 mm +0\.69 mm +grade1 +copper +ASTM B258`),
			regexp.MustCompile(`(?m)^MANDREL +diameter +kind +source$`),
			regexp.MustCompile(`(?m)^6mm drill +6\.00 mm +metric drill +ISO 235`),
			regexp.MustCompile(`(?m)^FORMER +outside dia\. +kind +source$`),
		}, []string{"CALIBRATION", "["}},
		// 6 mm = 0.236 in (6/25.4, international inch).
		{"mandrels in inches", []string{"--kind", "mandrel", "--units", "in"}, []*regexp.Regexp{
			regexp.MustCompile(`(?m)^6mm drill +0\.236 in +metric drill`),
		}, []string{"WIRE", "FORMER", " mm "}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			out, errOut, code := runCLI(t, append([]string{"stock"}, tc.args...)...)
			if code != exitOK || errOut != "" {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			for _, re := range tc.want {
				if !re.MatchString(out) {
					t.Errorf("table lacks %s:\n%s", re, out[:min(len(out), 2000)])
				}
			}
			for _, s := range tc.not {
				if strings.Contains(out, s) {
					t.Errorf("table shows %q", s)
				}
			}
		})
	}
}

// A user's stock file: its rows carry the file as their origin, and its
// calibrations are listed; TURNWISE_STOCK works like --stock.
func TestStockUserFile(t *testing.T) {
	for _, viaEnv := range []bool{false, true} {
		name := "flag"
		if viaEnv {
			name = "env"
		}
		t.Run(name, func(t *testing.T) {
			args := []string{"--use", "mine"}
			if viaEnv {
				t.Setenv("TURNWISE_STOCK", benchStock)
			} else {
				t.Setenv("TURNWISE_STOCK", "")
				args = append(args, "--stock", benchStock)
			}
			doc := stockDoc(t, args...)
			// bench.toml holds 4 wires, 2 mandrels, 2 formers and 3 calibrations.
			if len(doc.Wires) != 4 || len(doc.Mandrels) != 2 || len(doc.Formers) != 2 || len(doc.Calibrations) != 3 {
				t.Fatalf("%d wires, %d mandrels, %d formers, %d calibrations; want 4, 2, 2, 3",
					len(doc.Wires), len(doc.Mandrels), len(doc.Formers), len(doc.Calibrations))
			}
			for _, w := range doc.Wires {
				if w.Origin != benchStock {
					t.Errorf("wire %q origin %q, want the file", w.Name, w.Origin)
				}
			}
			if m := doc.Mandrels[1]; m.Name != "pen barrel" || math.Abs(m.Diameter-0.375*25.4e-3) > 1e-15 { // "0.375in" in bench.toml
				t.Errorf("mandrel %+v", m)
			}
			if c := doc.Calibrations[0]; c.Mandrel != "brass rod 6" || c.Wire != "green spool" || math.Abs(c.Springback-0.031) > 1e-15 { // "3.1%" in bench.toml
				t.Errorf("calibration %+v", c)
			}
			out, errOut, code := runCLI(t, append([]string{"stock"}, args...)...)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			for _, want := range []string{"CALIBRATION", "brass rod 6  green spool  3.1 %", "[" + benchStock + "]"} {
				if !strings.Contains(out, want) {
					t.Errorf("table lacks %q:\n%s", want, out)
				}
			}
		})
	}
}

// --template prints a stock file that turnwise reads back, with the rows
// it shows as examples.
func TestStockTemplate(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	tmpl, errOut, code := runCLI(t, "stock", "--template")
	if code != exitOK || errOut != "" {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	file := filepath.Join(t.TempDir(), "stock.toml")
	if err := os.WriteFile(file, []byte(tmpl), 0o644); err != nil {
		t.Fatal(err)
	}
	doc := stockDoc(t, "--stock", file, "--use", "mine")
	names := map[string]bool{}
	for _, w := range doc.Wires {
		names[w.Name] = true
	}
	for _, m := range doc.Mandrels {
		names[m.Name] = true
	}
	for _, want := range []string{"green spool", "silver 1.2", "brass rod 6"} {
		if !names[want] {
			t.Errorf("the template's row %q did not load (got %v)", want, names)
		}
	}
}

func TestStockBadInput(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	tests := []struct {
		name string
		args []string
		want string
	}{
		{"kind", []string{"--kind", "spools"}, "--kind"},
		{"units", []string{"--units", "furlong"}, "--units"},
		{"missing file", []string{"--stock", "/nonexistent/stock.toml"}, "--stock"},
		{"mine without a file", []string{"--use", "mine"}, "--use"},
		{"positional", []string{"wire"}, "no arguments"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			checkRefusal(t, append([]string{"stock"}, tc.args...), exitBadInput, tc.want)
		})
	}
}
