package sweepfile

import (
	"bytes"
	"errors"
	"math"
	"math/cmplx"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/sweep"
	"turnwise/forms/touchstone"
)

// coilZ is an invented coil: 60 nH, 0.5 pF across it, 0.2 ohm loss.
func coilZ(f float64) complex128 {
	w := 2 * math.Pi * f
	zl := complex(0.2, w*60e-9)
	return zl / (1 + zl*complex(0, w*0.5e-12))
}

func writeS1P(t *testing.T, dir, name string, z func(float64) complex128) string {
	t.Helper()
	d := touchstone.Data{Ports: 1, Param: touchstone.S, Z0: 50}
	for i := range 200 {
		f := 1e6 + float64(i)*4e6
		v := z(f)
		d.Points = append(d.Points, touchstone.Point{Frequency: f, M: [2][2]complex128{{(v - 50) / (v + 50)}}})
	}
	var b bytes.Buffer
	if err := touchstone.Write(&b, d, []string{"test sweep"}); err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(dir, name)
	if err := os.WriteFile(path, b.Bytes(), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

func TestLoad(t *testing.T) {
	dir := t.TempDir()
	jig := func(dut func(float64) complex128) func(float64) complex128 { // invented jig: 2 nH, 0.3 pF
		return func(f float64) complex128 {
			w := 2 * math.Pi * f
			y := complex(0, w*0.3e-12)
			if dut != nil {
				y += 1 / dut(f)
			}
			return complex(0, w*2e-9) + 1/y
		}
	}
	sw := writeS1P(t, dir, "coil.s1p", jig(coilZ))
	open := writeS1P(t, dir, "open.s1p", jig(nil))
	short := writeS1P(t, dir, "short.s1p", func(f float64) complex128 { return complex(0, 2*math.Pi*f*2e-9) })
	got, err := Load(Files{Sweep: sw, Open: open, Short: short, Fixture: sweep.Reflection})
	if err != nil {
		t.Fatal(err)
	}
	if !got.Corrected || got.Ports != 1 || got.Z0 != 50 || len(got.Points) != 200 {
		t.Fatalf("got %+v", got)
	}
	for _, p := range got.Points {
		if want := coilZ(p.Frequency); cmplx.Abs(p.Z-want) > 1e-6*cmplx.Abs(want) {
			t.Fatalf("at %g Hz: %v, want %v", p.Frequency, p.Z, want)
		}
	}

	t.Run("malformed file names its line", func(t *testing.T) {
		bad := filepath.Join(dir, "bad.s1p")
		os.WriteFile(bad, []byte("# MHz S RI R 50\n1 0 0\n0.5 0 0\n"), 0o644)
		_, err := Load(Files{Sweep: bad, Fixture: sweep.Reflection})
		var pe *touchstone.ParseError
		if !errors.As(err, &pe) || pe.Line != 3 || !strings.Contains(err.Error(), "bad.s1p") {
			t.Errorf("got %v", err)
		}
	})
	t.Run("open without short", func(t *testing.T) {
		_, err := Load(Files{Sweep: sw, Open: open, Fixture: sweep.Reflection})
		var ie *coil.InputError
		if !errors.As(err, &ie) {
			t.Errorf("got %v", err)
		}
	})
	t.Run("a missing file carries its role", func(t *testing.T) {
		gone := filepath.Join(dir, "gone.s1p")
		for _, tc := range []struct {
			role string
			f    Files
		}{
			{"sweep", Files{Sweep: gone, Fixture: sweep.Reflection}},
			{"open", Files{Sweep: sw, Open: gone, Short: short, Fixture: sweep.Reflection}},
			{"short", Files{Sweep: sw, Open: open, Short: gone, Fixture: sweep.Reflection}},
		} {
			_, err := Load(tc.f)
			ie, ok := errors.AsType[*coil.InputError](err)
			if !ok || ie.Param != tc.role || !strings.Contains(ie.Reason, "gone.s1p") || !strings.Contains(ie.Reason, "does not exist") {
				t.Errorf("%s: got %v", tc.role, err)
			}
		}
	})
	t.Run("series fixture on a one-port file", func(t *testing.T) {
		_, err := Load(Files{Sweep: sw, Fixture: sweep.Series})
		var ie *coil.InputError
		if !errors.As(err, &ie) || ie.Param != "fixture" {
			t.Errorf("got %v", err)
		}
	})
}

func TestPlot(t *testing.T) {
	var pts []sweep.Point
	for i := range 50 {
		f := 1e6 + float64(i)*10e6
		pts = append(pts, sweep.Point{Frequency: f, Z: coilZ(f), Sens: 1})
	}
	for _, format := range []string{"svg", "png"} {
		var b bytes.Buffer
		if err := Plot(&b, format, "test", pts, []Curve{{"fit", coilZ}}); err != nil {
			t.Fatal(err)
		}
		head := b.String()
		if len(head) > 200 {
			head = head[:200]
		}
		if format == "svg" && !strings.Contains(b.String(), "<svg") || format == "png" && !strings.HasPrefix(head, "\x89PNG") {
			t.Errorf("%s: not an image: %q", format, head)
		}
	}
	if _, err := PlotFormat("x.pdf"); err == nil {
		t.Error("pdf accepted")
	}
}

// Fit picks the fixture from the extension when none is named, reads the
// named one, and refuses an unknown one with Param "fixture"; the fitted L
// is the invented coil's.
func TestFitRequest(t *testing.T) {
	dir := t.TempDir()
	file := writeS1P(t, dir, "c.s1p", coilZ)
	for _, tc := range []struct {
		name, fixture string
		want          sweep.Fixture
		param         string
	}{
		{"default for .s1p", "", sweep.Reflection, ""},
		{"named", "reflection", sweep.Reflection, ""},
		{"unknown", "sideways", 0, "fixture"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, fx, fit, err := Fit(Request{File: file, Fixture: tc.fixture})
			if tc.param != "" {
				var ie *coil.InputError
				if !errors.As(err, &ie) || ie.Param != tc.param {
					t.Fatalf("error %v, want *coil.InputError for %q", err, tc.param)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			if fx != tc.want {
				t.Errorf("fixture %v, want %v", fx, tc.want)
			}
			if got := fit.InductanceLow.Value; math.Abs(got/60e-9-1) > 0.01 { // coilZ's 60 nH (invented), 1 % fit tolerance
				t.Errorf("L %g H, want 60 nH within 1 %%", got)
			}
		})
	}
}

// ModelZ is the series equivalent coil.ModelAt gives, recomputed here from
// its parts: below the self-resonance its reactance is inductive and well
// below it Im Z/ω is the model's L within the self-capacitance's share.
func TestModelZ(t *testing.T) {
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 2e-3, LeadLength: 5e-3}
	f := 10e6
	m, err := coil.ModelAt(g, unit.Frequency(f))
	if err != nil {
		t.Fatal(err)
	}
	z := ModelZ(g, f)
	w := 2 * math.Pi * f
	l := imag(z) / w
	want := float64(m.L) + float64(m.LLeads)
	if math.Abs(l/want-1) > 0.01 { // the self-capacitance raises L by about (f/SRF)², far under 1 % at 10 MHz
		t.Errorf("Im Z/ω = %g H, want %g H within 1 %%", l, want)
	}
	if real(z) <= 0 || cmplx.IsNaN(z) {
		t.Errorf("Z = %v: want a finite positive loss", z)
	}
}
