package main

import (
	"encoding/json"
	"math"
	"math/cmplx"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"turnwise/internal/testtools"
)

type circuitOut struct {
	Resonances []struct {
		Frequency, Q, Impedance float64
		Kind                    string
	} `json:"resonances"`
	Sweep     []map[string]float64 `json:"sweep"`
	Rejection []struct {
		Frequency, DB float64
		S21DB         float64 `json:"s21_db"`
	}
	Products []struct {
		Frequency, DB float64
		Image, Wanted bool
	}
	Bands []struct {
		Name      string
		Resonance float64
		Strays    []struct {
			Part string
			Self bool `json:"self_resonance"`
		}
	}
	Warnings []string
}

func writeTemp(t *testing.T, name, text string) string {
	t.Helper()
	p := filepath.Join(t.TempDir(), name)
	if err := os.WriteFile(p, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

func circuitJSONRun(t *testing.T, args ...string) circuitOut {
	t.Helper()
	out, errOut, code := runCLI(t, append([]string{"circuit", "--json"}, args...)...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var r circuitOut
	if err := json.Unmarshal([]byte(out), &r); err != nil {
		t.Fatal(err)
	}
	return r
}

// An ideal tank, L = 1 µH ∥ C tuned to 145 MHz ∥ R = 5 kΩ, ahead of a mixer
// with LO 116 MHz and IF 29 MHz: the image is 116 − 29 = 87 MHz and its
// rejection is |Z(145 MHz)|/|Z(87 MHz)| with Z = 1/(1/R + jωC + 1/(jωL))
// (image arithmetic and tank admittance by hand).
func TestCircuitConverterImage(t *testing.T) {
	l, r := 100e-9, 5e3
	c := 1 / (math.Pow(2*math.Pi*145e6, 2) * l)
	file := writeTemp(t, "conv.toml", `title = "ideal converter tank"
[[inductor]]
name = "L1"
from = "tank"
to = "gnd"
value = "100nH"
[[capacitor]]
name = "C1"
from = "tank"
to = "gnd"
value = "`+strings.TrimSpace(formatPF(c))+`"
[[resistor]]
name = "R1"
from = "tank"
to = "gnd"
value = "5kohm"
[[port]]
node = "tank"
`)
	out := circuitJSONRun(t, file, "--lo", "116MHz", "--if", "29MHz")
	z := func(f float64) float64 {
		w := 2 * math.Pi * f
		return cmplx.Abs(1 / complex(1/r, w*c-1/(w*l)))
	}
	want := 20 * math.Log10(z(145e6)/z(87e6))
	var image, wanted bool
	for _, p := range out.Products {
		if p.Image {
			image = true
			if math.Abs(p.Frequency-87e6) > 1 {
				t.Errorf("image at %g Hz, want 87 MHz (116 − 29, by hand)", p.Frequency)
			}
			if math.Abs(p.DB-want) > 1e-6 {
				t.Errorf("image rejection %.6f dB, hand %.6f dB", p.DB, want)
			}
		}
		wanted = wanted || (p.Wanted && math.Abs(p.Frequency-145e6) < 1)
	}
	if !image || !wanted {
		t.Fatalf("products %+v lack the image or the wanted 145 MHz", out.Products)
	}
	if len(out.Resonances) != 1 || math.Abs(out.Resonances[0].Frequency-145e6) > 145e6*1e-6 {
		t.Fatalf("resonances %+v, want one at 145 MHz", out.Resonances)
	}
	// Q of a parallel RLC: R/(ωL) (any circuit text, from memory).
	if q := r / (2 * math.Pi * 145e6 * l); math.Abs(out.Resonances[0].Q-q) > 1e-4*q {
		t.Errorf("Q %g, hand R/(ωL) = %g", out.Resonances[0].Q, q)
	}
}

func formatPF(c float64) string {
	return strings.TrimRight(strings.TrimRight(ftoa(c*1e12), "0"), ".") + "pF"
}

func ftoa(x float64) string { return strconvFormat(x) }

// A series trap: L ∥ C (tuned to 7.1 MHz, inductor with series r) in a
// 50 Ω line. At f0 the tank is R_p = (ωL)²/r + r ... exactly
// Z = (r + jωL)·(1/(jωC)) / (r + jωL + 1/(jωC)), and
// S21 = 2·Z0/(2·Z0 + Z) (two-port in series with the line, by hand).
func TestCircuitTrapNotch(t *testing.T) {
	l, r := 2.5e-6, 0.5
	c := 1 / (math.Pow(2*math.Pi*7.1e6, 2) * l)
	file := writeTemp(t, "trap.toml", `[[inductor]]
name = "L1"
from = "in"
to = "out"
value = "2.5uH"
esr = "0.5ohm"
[[capacitor]]
name = "C1"
from = "in"
to = "out"
value = "`+formatPF(c)+`"
[[resistor]]
name = "Rdrain"
from = "in"
to = "gnd"
value = "1Mohm"
[[port]]
node = "in"
[[port]]
node = "out"
`)
	out := circuitJSONRun(t, file, "--at", "7.1MHz", "--from", "1MHz", "--to", "30MHz")
	w := 2 * math.Pi * 7.1e6
	zl, zc := complex(r, w*l), complex(0, -1/(w*c))
	zt := zl * zc / (zl + zc)
	// The 1 MΩ drain at the input barely matters (< 1e-4 dB); included.
	zin := 1 / (1/(zt+50) + 1/1e6)
	vin := zin / (zin + 50) // EMF 1 behind 50 Ω
	s21 := 2 * vin * 50 / (zt + 50)
	notch := -20 * math.Log10(cmplx.Abs(s21))
	if len(out.Rejection) != 1 {
		t.Fatalf("rejection %+v", out.Rejection)
	}
	if got := -out.Rejection[0].S21DB; math.Abs(got-notch) > 1e-6 {
		t.Errorf("notch %.4f dB, hand %.4f dB", got, notch)
	}
	if notch < 30 {
		t.Errorf("hand notch %.1f dB is shallow; check the test", notch)
	}
}

// A 2.5 µH coil whose own self-resonance the model puts near 149 MHz
// (grounded) is flagged when the network serves 144–146 MHz.
func TestCircuitStraySelfResonance(t *testing.T) {
	file := writeTemp(t, "stray.toml", `[[coil]]
name = "Lbig"
from = "top"
to = "gnd"
former = "10mm"
wire = "0.5mm"
turns = 20
pitch = "0.6mm"
leads = "10mm"
[[capacitor]]
name = "C1"
from = "top"
to = "gnd"
value = "470pF"
[[port]]
node = "top"
`)
	out := circuitJSONRun(t, file, "--band", "2m=144-146MHz", "--band", "80m=3.5-3.8MHz")
	found := false
	for _, b := range out.Bands {
		for _, s := range b.Strays {
			if b.Name == "2m" && s.Part == "Lbig" && s.Self {
				found = true
			}
		}
	}
	if !found {
		t.Fatalf("no self-resonance stray for Lbig in 2m: %+v %v", out.Bands, out.Warnings)
	}
	warned := false
	for _, w := range out.Warnings {
		warned = warned || (strings.Contains(w, "Lbig") && strings.Contains(w, "2m"))
	}
	if !warned {
		t.Errorf("warnings %q do not name Lbig in 2m", out.Warnings)
	}
}

// 10 µH with 180 pF resonates near 3.7 MHz (common practice).
func TestCircuitHFTank(t *testing.T) {
	file := writeTemp(t, "hf.toml", "[[inductor]]\nname = \"L\"\nfrom = \"a\"\nto = \"gnd\"\nvalue = \"10uH\"\nq = 200\nq_at = \"3.7MHz\"\n[[capacitor]]\nname = \"C\"\nfrom = \"a\"\nto = \"gnd\"\nvalue = \"180pF\"\n[[port]]\nnode = \"a\"\n")
	out := circuitJSONRun(t, file)
	if len(out.Resonances) != 1 || out.Resonances[0].Frequency < 3.6e6 || out.Resonances[0].Frequency > 3.85e6 {
		t.Fatalf("resonances %+v, want one near 3.7 MHz", out.Resonances)
	}
	// Q 200 at 3.7 MHz is a constant series r = ωL/200 there, so at the
	// tank's f0 the Q is 200·f0/3.7 MHz (series-loss tank, by hand).
	f0 := 1 / (2 * math.Pi * math.Sqrt(10e-6*180e-12))
	if q, want := out.Resonances[0].Q, 200*f0/3.7e6; math.Abs(q-want) > 1e-3*want {
		t.Errorf("Q %g, want %g", q, want)
	}
}

// Bad files exit 2 naming the line and key, and write nothing.
func TestCircuitBadFileWritesNothing(t *testing.T) {
	dir := t.TempDir()
	for _, tc := range []struct{ name, text, want string }{
		{"unknown key", "[[capacitor]]\nname = \"C\"\nfrom = \"a\"\nto = \"gnd\"\nvalue = \"1pF\"\ncolour = \"red\"\n[[port]]\nnode = \"a\"\n", `line 6`},
		{"dangling node", "[[capacitor]]\nname = \"C\"\nfrom = \"a\"\nto = \"gnd\"\nvalue = \"1pF\"\n[[capacitor]]\nname = \"C2\"\nfrom = \"a\"\nto = \"b\"\nvalue = \"1pF\"\n[[port]]\nnode = \"a\"\n", `line 9: capacitor "C2": to`},
		{"port on gnd", "[[capacitor]]\nname = \"C\"\nfrom = \"a\"\nto = \"gnd\"\nvalue = \"1pF\"\n[[port]]\nnode = \"gnd\"\n", `line 7: port 1: node`},
		{"shorted", "[[capacitor]]\nname = \"C\"\nfrom = \"a\"\nto = \"a\"\nvalue = \"1pF\"\n[[port]]\nnode = \"a\"\n", `line 4: capacitor "C": to`},
	} {
		t.Run(tc.name, func(t *testing.T) {
			file := writeTemp(t, "bad.toml", tc.text)
			plot, ts, sp := filepath.Join(dir, "p.svg"), filepath.Join(dir, "t.s1p"), filepath.Join(dir, "n.cir")
			_, errOut, code := runCLI(t, "circuit", file, "--plot", plot, "--touchstone", ts, "--spice", sp)
			if code != 2 || !strings.Contains(errOut, tc.want) {
				t.Fatalf("exit %d, stderr %q; want 2 and %q", code, errOut, tc.want)
			}
			entries, _ := os.ReadDir(dir)
			if len(entries) != 0 {
				t.Fatalf("wrote %v", entries)
			}
		})
	}
}

// The demo files run and write every output.
func TestCircuitDemos(t *testing.T) {
	dir := t.TempDir()
	for _, tc := range []struct {
		file string
		args []string
		ext  string
	}{
		{"frontend.toml", []string{"--band", "80m=3.5-3.8MHz", "--band", "2m=144-146MHz"}, ".s1p"},
		{"trap.toml", []string{"--at", "7.1MHz"}, ".s2p"},
		{"converter.toml", []string{"--lo", "116MHz", "--if", "29MHz"}, ".s1p"},
		{"filter137.toml", []string{"--band", "137-138MHz"}, ".s2p"},
	} {
		t.Run(tc.file, func(t *testing.T) {
			base := filepath.Join(dir, strings.TrimSuffix(tc.file, ".toml"))
			args := append([]string{"circuit", "../../testdata/circuits/" + tc.file, "--plot", base + ".png",
				"--touchstone", base + tc.ext, "--spice", base + ".cir"}, tc.args...)
			out, errOut, code := runCLI(t, args...)
			if code != 0 {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			t.Log(out)
			for _, ext := range []string{".png", tc.ext, ".cir"} {
				if st, err := os.Stat(base + ext); err != nil || st.Size() == 0 {
					t.Errorf("%s%s not written: %v", base, ext, err)
				}
			}
		})
	}
}

func strconvFormat(x float64) string { return strconv.FormatFloat(x, 'f', 9, 64) }

// A job file that names a circuit gets a circuit page on its build sheet.
func TestSheetCircuitPage(t *testing.T) {
	pdftotext := testtools.Need(t, "pdftotext", "poppler-utils")
	dir := t.TempDir()
	abs, err := filepath.Abs("../../testdata/circuits/filter137.toml")
	if err != nil {
		t.Fatal(err)
	}
	job := filepath.Join(dir, "job.toml")
	text := "title = \"circuit night\"\ndate = 2026-03-14\ncircuit = \"" + abs + "\"\n[[coil]]\nname = \"L1\"\nmandrel = \"6mm drill\"\nwire = \"1mm\"\nturns = 5\nlength = \"10mm\"\nleads = \"4mm\"\n"
	if err := os.WriteFile(job, []byte(text), 0o644); err != nil {
		t.Fatal(err)
	}
	pdf := filepath.Join(dir, "out.pdf")
	if _, errOut, code := runCLI(t, "sheet", job, "-o", pdf); code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	out, err := exec.Command(pdftotext, pdf, "-").Output()
	if err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"Circuit: 137 MHz three-coil band-pass filter", "Resonances at port 1", "Bands", "137 MHz"} {
		if !strings.Contains(strings.ToLower(string(out)), strings.ToLower(want)) {
			t.Errorf("the sheet does not show %q", want)
		}
	}
}
