package forms

import (
	"errors"
	"math"
	"strings"
	"testing"
)

func builtIn(t *testing.T) *Catalog {
	t.Helper()
	c, err := BuiltIn()
	if err != nil {
		t.Fatalf("BuiltIn: %v", err)
	}
	return c
}

func TestBuiltInRows(t *testing.T) {
	t.Parallel()
	c := builtIn(t)
	count := func(kind string) int {
		n := 0
		for _, m := range c.Mandrels {
			if m.Kind == kind {
				n++
			}
		}
		return n
	}
	systems := map[string]int{}
	for _, w := range c.Wires {
		systems[w.System]++
	}
	counts := []struct {
		name      string
		got, want int
	}{
		{name: "metric drills 1-20 mm by 0.5", got: count("metric drill"), want: 39},
		{name: "inch drills 1/16-3/4 by 1/64", got: count("inch drill"), want: 45},
		{name: "AWG 0000-40", got: systems["awg"], want: 44},
		{name: "SWG 7/0-50", got: systems["swg"], want: 57},
		{name: "formers", got: len(c.Formers), want: 15 + 15 + 8}, // sch 40, EN 1452, rod and tube of other materials
	}
	for _, tc := range counts {
		if tc.got != tc.want {
			t.Errorf("%s: %d rows, want %d", tc.name, tc.got, tc.want)
		}
	}
	names := map[string]string{}
	unique := func(kind, name string) {
		k := kind + nameKey(name)
		if prev, dup := names[k]; dup {
			t.Errorf("%s %q: duplicate of %q", kind, name, prev)
		}
		names[k] = name
	}
	finite := func(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) && x > 0 }
	for _, w := range c.Wires {
		unique("wire", w.Name)
		if w.Source == "" || w.Origin != OriginBuiltIn {
			t.Errorf("wire %q: source %q origin %q", w.Name, w.Source, w.Origin)
		}
		if !finite(float64(w.Bare)) || w.Overall < w.Bare {
			t.Errorf("wire %q: bare %v overall %v", w.Name, w.Bare, w.Overall)
		}
		if _, ok := conductors[w.Conductor]; !ok {
			t.Errorf("wire %q: conductor %q", w.Name, w.Conductor)
		}
	}
	for _, m := range c.Mandrels {
		unique("holder", m.Name)
		if m.Source == "" || m.Origin != OriginBuiltIn || !finite(float64(m.Diameter)) {
			t.Errorf("mandrel %+v", m)
		}
	}
	for _, f := range c.Formers {
		unique("holder", f.Name)
		if f.Source == "" || f.Origin != OriginBuiltIn || !finite(float64(f.Diameter)) {
			t.Errorf("former %+v", f)
		}
	}
}

func TestBuiltInIsACopy(t *testing.T) {
	t.Parallel()
	a := builtIn(t)
	a.Wires[0].Name = "changed"
	a.Mandrels = nil
	b := builtIn(t)
	if b.Wires[0].Name == "changed" || len(b.Mandrels) == 0 {
		t.Error("BuiltIn shares rows between calls")
	}
}

func TestBuiltInValues(t *testing.T) {
	t.Parallel()
	c := builtIn(t)
	cases := []struct {
		name string
		got  func() (float64, error)
		want float64 // m
	}{
		{name: "pvc 1/2in sch40 OD", got: formerDia(c, "pvc 1/2in sch40"), want: 0.840 * inchM},     // ASTM D1785 (from memory)
		{name: "pvc 1-1/4in sch40 OD", got: formerDia(c, "pvc 1-1/4in sch40"), want: 1.660 * inchM}, // ASTM D1785 (from memory)
		{name: "pvc 4in sch40 OD", got: formerDia(c, "pvc 4in sch40"), want: 4.500 * inchM},         // ASTM D1785 (from memory)
		{name: "pvc 20mm OD", got: formerDia(c, "pvc 20mm"), want: 20e-3},                           // EN 1452-2 (from memory)
		{name: "1/4in drill", got: mandrelDia(c, "1/4in drill"), want: 0.25 * inchM},                // ASME B94.11M nominal size
		{name: "6.5mm drill", got: mandrelDia(c, "6.5mm drill"), want: 6.5e-3},                      // ISO 235 nominal size
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, err := tc.got()
			if err != nil {
				t.Fatal(err)
			}
			if !closeRel(got, tc.want, implTol) {
				t.Errorf("got %.6g m, want %.6g m", got, tc.want)
			}
		})
	}
}

func formerDia(c *Catalog, name string) func() (float64, error) {
	return func() (float64, error) { f, err := c.Former(name); return float64(f.Diameter), err }
}

func mandrelDia(c *Catalog, name string) func() (float64, error) {
	return func() (float64, error) { m, err := c.Mandrel(name); return float64(m.Diameter), err }
}

func TestCatalogLookup(t *testing.T) {
	t.Parallel()
	c := builtIn(t)
	cases := []struct {
		name   string
		lookup func(string) (string, error)
		in     string
		want   string // row name, or error substring when wantErr
		isErr  bool
	}{
		{name: "wire exact", lookup: wireName(c), in: "22awg", want: "22awg"},
		{name: "wire case", lookup: wireName(c), in: "22AWG", want: "22awg"},
		{name: "wire gauge form", lookup: wireName(c), in: "22 AWG", want: "22awg"},
		{name: "wire gauge prefix", lookup: wireName(c), in: "awg 22", want: "22awg"},
		{name: "wire 4/0", lookup: wireName(c), in: "4/0 awg", want: "0000awg"},
		{name: "wire swg", lookup: wireName(c), in: "SWG18", want: "18swg"},
		{name: "wire gauge outside catalog", lookup: wireName(c), in: "44awg", want: "44awg"},
		{name: "wire metric", lookup: wireName(c), in: "1mm", want: "1.00mm"},
		{name: "wire metric spaced", lookup: wireName(c), in: "0.5 mm", want: "0.50mm"},
		{name: "wire metric inch", lookup: wireName(c), in: "0.0394in", want: "0.0394in", isErr: true},
		{name: "wire plated", lookup: wireName(c), in: "1mm silver-plated", want: "1.00mm silver-plated"},
		{name: "wire tinned spaced", lookup: wireName(c), in: "1.0 mm  Tinned", want: "1.00mm tinned"},
		{name: "wire no such gauge", lookup: wireName(c), in: "60awg", want: "AWG runs from 0000 to 56", isErr: true},
		{name: "wire typo", lookup: wireName(c), in: "22agw", want: "did you mean 22awg?", isErr: true},
		{name: "wire near size", lookup: wireName(c), in: "0.97mm", want: "did you mean 0.95mm or 1.00mm?", isErr: true},
		{name: "wire unknown", lookup: wireName(c), in: "unobtainium", want: "list the catalog with turnwise stock", isErr: true},
		{name: "mandrel exact", lookup: mandrelName(c), in: "6mm drill", want: "6mm drill"},
		{name: "mandrel case and spaces", lookup: mandrelName(c), in: " 6MM   Drill ", want: "6mm drill"},
		{name: "mandrel size written otherwise", lookup: mandrelName(c), in: "6.0mm drill", want: "6mm drill"},
		{name: "mandrel diameter", lookup: mandrelName(c), in: "6mm", want: "6mm drill"},
		{name: "mandrel inch", lookup: mandrelName(c), in: "1/4in", want: "1/4in drill"},
		{name: "mandrel inch decimal", lookup: mandrelName(c), in: "0.25in", want: "1/4in drill"},
		{name: "mandrel inch in mm", lookup: mandrelName(c), in: "6.35mm", want: "1/4in drill"},
		{name: "mandrel near", lookup: mandrelName(c), in: "6.2mm", want: "did you mean 6mm drill or 1/4in drill?", isErr: true},
		{name: "mandrel typo", lookup: mandrelName(c), in: "6mm dril", want: "did you mean 6mm drill", isErr: true},
		{name: "former exact", lookup: formerName(c), in: "pvc 20mm", want: "pvc 20mm"},
		{name: "former diameter", lookup: formerName(c), in: "20mm", want: "pvc 20mm"},
		{name: "former inch OD", lookup: formerName(c), in: "0.840in", want: "pvc 1/2in sch40"},
		{name: "former typo", lookup: formerName(c), in: "pvc 1/2in sch 40", want: "did you mean pvc 1/2in sch40", isErr: true},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			got, err := tc.lookup(tc.in)
			if tc.isErr {
				if err == nil || !strings.Contains(err.Error(), tc.want) {
					t.Fatalf("lookup(%q) = %q, %v; want error containing %q", tc.in, got, err, tc.want)
				}
				return
			}
			if err != nil {
				t.Fatalf("lookup(%q): %v", tc.in, err)
			}
			if got != tc.want {
				t.Errorf("lookup(%q) = %q, want %q", tc.in, got, tc.want)
			}
		})
	}
}

func wireName(c *Catalog) func(string) (string, error) {
	return func(s string) (string, error) { w, err := c.Wire(s); return w.Name, err }
}

func mandrelName(c *Catalog) func(string) (string, error) {
	return func(s string) (string, error) { m, err := c.Mandrel(s); return m.Name, err }
}

func formerName(c *Catalog) func(string) (string, error) {
	return func(s string) (string, error) { f, err := c.Former(s); return f.Name, err }
}

func TestLookupErrorIsNotFound(t *testing.T) {
	t.Parallel()
	c := builtIn(t)
	_, err := c.Mandrel("broomstick")
	var le *LookupError
	if !errors.Is(err, ErrNotFound) || !errors.As(err, &le) || le.Kind != "mandrel" {
		t.Errorf("Mandrel(broomstick) error = %#v, want *LookupError matching ErrNotFound", err)
	}
	// A gauge that does not exist is bad input, not a missing row.
	if _, err := c.Wire("60awg"); errors.Is(err, ErrNotFound) {
		t.Errorf("Wire(60awg) error %v should not be ErrNotFound", err)
	}
}

func TestNilCatalog(t *testing.T) {
	t.Parallel()
	var c *Catalog
	if w, err := c.Wire("22awg"); err != nil || w.Name != "22awg" {
		t.Errorf("nil.Wire(22awg) = %+v, %v; want the gauge from its definition", w, err)
	}
	if _, err := c.Mandrel("6mm"); !errors.Is(err, ErrNotFound) {
		t.Errorf("nil.Mandrel: %v", err)
	}
	if _, err := c.Former("20mm"); !errors.Is(err, ErrNotFound) {
		t.Errorf("nil.Former: %v", err)
	}
	if _, ok := c.Springback("6mm", "22awg"); ok {
		t.Error("nil.Springback found a calibration")
	}
}

func TestMerge(t *testing.T) {
	t.Parallel()
	base := &Catalog{
		Wires:    []Wire{{Name: "20awg", Origin: "a"}, {Name: "22awg", Origin: "a"}, {Name: "24awg", Origin: "a"}},
		Mandrels: []Mandrel{{Name: "6mm drill", Origin: "a"}},
		Formers:  []Former{{Name: "pvc 20mm", Origin: "a"}},
		Calibrations: []Calibration{
			{Mandrel: "6mm drill", Wire: "22awg", Springback: 0.01},
		},
	}
	user := &Catalog{
		Wires:        []Wire{{Name: "green spool", Origin: "b"}, {Name: "22AWG", Origin: "b"}},
		Mandrels:     []Mandrel{{Name: "rod", Origin: "b"}},
		Calibrations: []Calibration{{Mandrel: "6mm drill", Wire: "22awg", Springback: 0.02}},
	}
	m := Merge(base, nil, user)
	var got []string
	for _, w := range m.Wires {
		got = append(got, w.Name+"/"+w.Origin)
	}
	want := "20awg/a 22AWG/b 24awg/a green spool/b"
	if strings.Join(got, " ") != want {
		t.Errorf("Merge wires = %q, want %q", strings.Join(got, " "), want)
	}
	if len(m.Mandrels) != 2 || len(m.Formers) != 1 || len(m.Calibrations) != 2 {
		t.Errorf("Merge = %+v", m)
	}
	if base.Wires[1].Origin != "a" {
		t.Error("Merge modified its input")
	}
	if w, err := m.Wire("22 awg"); err != nil || w.Origin != "b" {
		t.Errorf("Wire(22 awg) after Merge = %+v, %v; want the user's row", w, err)
	}
}

func TestSpringback(t *testing.T) {
	t.Parallel()
	c := Merge(builtIn(t), &Catalog{
		Mandrels: []Mandrel{{Name: "brass rod 6", Diameter: 6e-3}},
		Wires:    []Wire{{Name: "green spool", Bare: 0.64e-3, Overall: 0.69e-3}},
		Calibrations: []Calibration{
			{Mandrel: "6mm drill", Wire: "22awg", Springback: 0.02, Line: 10},
			{Mandrel: "6mm drill", Wire: "22awg", Springback: 0.03, Line: 20},
			{Mandrel: "brass rod 6", Wire: "green spool", Springback: 0.05, Line: 30},
			{Mandrel: "pvc 20mm", Wire: "1.00mm", Springback: 0.001, Line: 40},
		},
	})
	cases := []struct {
		name          string
		mandrel, wire string
		ok            bool
		line          int
	}{
		{name: "latest wins", mandrel: "6mm drill", wire: "22awg", ok: true, line: 20},
		{name: "size written otherwise and gauge form", mandrel: "6.0mm drill", wire: "22 AWG", ok: true, line: 20},
		{name: "user names", mandrel: "Brass Rod 6", wire: "green spool", ok: true, line: 30},
		// By diameter the user's rod wins over the built-in drill (last row wins).
		{name: "diameter prefers user row", mandrel: "6mm", wire: "green spool", ok: true, line: 30},
		{name: "diameter is not the drill's name", mandrel: "6mm", wire: "22awg"},
		{name: "former", mandrel: "PVC 20mm", wire: "1mm", ok: true, line: 40},
		{name: "other wire", mandrel: "6mm drill", wire: "24awg"},
		{name: "unknown", mandrel: "broom", wire: "22awg"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			cal, ok := c.Springback(tc.mandrel, tc.wire)
			if ok != tc.ok || cal.Line != tc.line {
				t.Errorf("Springback(%q, %q) = %+v, %v; want line %d, %v", tc.mandrel, tc.wire, cal, ok, tc.line, tc.ok)
			}
		})
	}
}

func TestEditDistance(t *testing.T) {
	t.Parallel()
	cases := []struct {
		name string
		a, b string
		want int
	}{
		{name: "same", a: "awg", b: "awg", want: 0},
		{name: "swap", a: "agw", b: "awg", want: 1},
		{name: "insert", a: "drill", b: "dril", want: 1},
		{name: "empty", a: "", b: "abc", want: 3},
		{name: "unicode", a: "µm", b: "um", want: 1},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			if got := editDistance(tc.a, tc.b); got != tc.want {
				t.Errorf("editDistance(%q, %q) = %d, want %d", tc.a, tc.b, got, tc.want)
			}
		})
	}
}
