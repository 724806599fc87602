package forms

import (
	"bytes"
	"errors"
	"math"
	"os"
	"strings"
	"testing"
	"turnwise/internal/quantity"
	"unicode/utf8"
)

// Appending keeps every byte of the file and the new calibration is the one
// in effect: comments survive because nothing is re-encoded.
func TestAppendCalibrationKeepsFile(t *testing.T) {
	t.Parallel()
	src, err := os.ReadFile("../testdata/stock/bench.toml")
	if err != nil {
		t.Fatal(err)
	}
	c := Calibration{Mandrel: "brass rod 6", Wire: "green spool", Springback: 0.0412, Note: `trim: 52.0 nH "measured"`}
	out, err := AppendCalibration(src, "bench.toml", c)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(out, src) {
		t.Fatal("the original text is not kept byte for byte at the start")
	}
	for _, want := range []string{"# DEMO stock file", "# added by turnwise trim --save", `springback = "4.12%"`, `note = "trim: 52.0 nH \"measured\""`} {
		if !bytes.Contains(out, []byte(want)) {
			t.Errorf("result lacks %q", want)
		}
	}
	cat, err := LoadStock(bytes.NewReader(out), "bench.toml")
	if err != nil {
		t.Fatal(err)
	}
	all := Merge(mustBuiltIn(t), cat)
	got, ok := all.Springback("brass rod 6", "green spool")
	if !ok || math.Abs(got.Springback-0.0412) > 1e-12 || got.Note != c.Note {
		t.Errorf("in effect: %+v, %v; want the appended 4.12 %%", got, ok)
	}
	// The earlier entries are still there, superseded.
	if n := len(cat.Calibrations); n != 4 {
		t.Errorf("%d calibrations, want the 3 of the file + 1", n)
	}
}

func mustBuiltIn(t *testing.T) *Catalog {
	t.Helper()
	b, err := BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// A new file gets a header; rows the calibration names can come in the same
// call; CRLF files stay CRLF; a file without a final newline gets one first.
func TestAppendStock(t *testing.T) {
	t.Parallel()
	add := &Catalog{
		Wires:        []Wire{{Name: "1.13mm", Bare: 1.13e-3, Overall: 1.13e-3, Insulation: "none", Conductor: "copper", Source: "given on the command line"}},
		Mandrels:     []Mandrel{{Name: "6.2mm rod", Diameter: 6.2e-3, Kind: "rod", Source: "given on the command line"}},
		Calibrations: []Calibration{{Mandrel: "6.2mm rod", Wire: "1.13mm", Springback: -0.005, Note: "tab\there"}},
	}
	tests := []struct {
		name   string
		src    string
		crlf   bool
		prefix string
	}{
		{"new file", "", false, "# turnwise stock file"},
		{"comment only, no final newline", "# my bench", false, "# my bench\n\n# added"},
		{"crlf", "# mine\r\n[[mandrel]]\r\nname = \"x\"\r\ndiameter = \"5mm\"\r\n", true, "# mine\r\n"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			out, err := AppendStock([]byte(tc.src), "s.toml", add)
			if err != nil {
				t.Fatal(err)
			}
			if !strings.HasPrefix(string(out), tc.prefix) {
				t.Errorf("starts %q, want %q", out[:min(len(out), 40)], tc.prefix)
			}
			bare := strings.Count(string(out), "\n") - strings.Count(string(out), "\r\n")
			if tc.crlf && bare != 0 {
				t.Errorf("%d bare LF in a CRLF file", bare)
			}
			if !tc.crlf && strings.Contains(string(out), "\r") {
				t.Error("CR in an LF file")
			}
			cat, err := LoadStock(bytes.NewReader(out), "s.toml")
			if err != nil {
				t.Fatalf("%v\n%s", err, out)
			}
			all := Merge(mustBuiltIn(t), cat)
			// The rows are found the way commands look them up: by the
			// diameter typed on the command line.
			m, err := all.Mandrel("6.2mm")
			if err != nil || m.Name != "6.2mm rod" {
				t.Errorf("mandrel by diameter: %+v, %v", m, err)
			}
			w, err := all.Wire("1.13mm")
			if err != nil || w.Bare != 1.13e-3 || w.Insulation != "none" {
				t.Errorf("wire: %+v, %v", w, err)
			}
			c, ok := all.Springback("6.2mm", "1.13mm")
			if !ok || c.Springback != -0.005 || c.Note != "tab\there" {
				t.Errorf("calibration: %+v, %v", c, ok)
			}
		})
	}
}

// Refusals: a file that does not load is not edited; a row that clashes
// with the file is refused with the reason; names must exist.
func TestAppendStockRefuses(t *testing.T) {
	t.Parallel()
	cal := Calibration{Mandrel: "6mm drill", Wire: "22awg", Springback: 0.03}
	tests := []struct {
		name string
		src  string
		add  *Catalog
		err  string
	}{
		{"broken file", "[[wire]]\nname = \"a\"\ngauge = 22awg\n", &Catalog{Calibrations: []Calibration{cal}}, "fix this before"},
		{"inline array", "calibration = [{mandrel = \"6mm drill\", wire = \"22awg\", springback = \"1%\"}]\n", &Catalog{Calibrations: []Calibration{cal}}, "inline array"},
		{"duplicate name", "[[mandrel]]\nname = \"rod\"\ndiameter = \"5mm\"\n", &Catalog{Mandrels: []Mandrel{{Name: "rod", Diameter: 6e-3}}}, "already used"},
		{"unknown mandrel", "", &Catalog{Calibrations: []Calibration{{Mandrel: "no such rod", Wire: "22awg", Springback: 0.01}}}, "not found"},
		{"springback out of range", "", &Catalog{Calibrations: []Calibration{{Mandrel: "6mm drill", Wire: "22awg", Springback: 0.9}}}, "outside"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			out, err := AppendStock([]byte(tc.src), "s.toml", tc.add)
			var pe *ParseError
			if !errors.As(err, &pe) || out != nil {
				t.Fatalf("err = %v (out %d bytes), want a *ParseError and no text", err, len(out))
			}
			if !strings.Contains(err.Error(), tc.err) {
				t.Errorf("err %q lacks %q", err, tc.err)
			}
		})
	}
}

func TestSpringbackText(t *testing.T) {
	t.Parallel()
	for _, tc := range []struct {
		in   float64
		want string
	}{{0.0412, "4.12%"}, {-0.00001, "0.00%"}, {-0.025, "-2.50%"}, {0.5, "50.00%"}} {
		got := SpringbackText(tc.in)
		if got != tc.want {
			t.Errorf("%g: %q, want %q", tc.in, got, tc.want)
		}
		if back, err := quantity.ParsePercent(got); err != nil || math.Abs(back-tc.in) > 0.005e-2 {
			t.Errorf("%q reads back as %g, %v", got, back, err)
		}
	}
}

// tomlQuote's output is read back as the same string by the TOML decoder.
func FuzzTOMLQuote(f *testing.F) {
	for _, s := range []string{"plain", `q"uote`, `back\slash`, "new\nline", "tab\t", "\x00\x1f\x7f", "µH ünïcode"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		if !utf8.ValidString(s) {
			return
		}
		src := "[[calibration]]\nmandrel = \"6mm drill\"\nwire = \"22awg\"\nspringback = \"1%\"\nnote = " + tomlQuote(s) + "\n"
		cat, err := LoadStock(strings.NewReader(src), "f.toml")
		if err != nil {
			t.Fatalf("%q: %v", s, err)
		}
		if got := cat.Calibrations[0].Note; got != s {
			t.Fatalf("%q read back as %q", s, got)
		}
	})
}
