package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"math/cmplx"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"turnwise/internal/spec"

	"turnwise/coil/circuit"
)

var couplerFile = filepath.Join("..", "..", "testdata", "circuits", "coupler.toml")

// couplerWithout is the demo coupler's text with each line containing
// one of drop removed (a key taken out) and each of repl's pairs replaced,
// written to a temporary file.
func couplerWithout(t *testing.T, drop []string, repl ...string) string {
	t.Helper()
	b, err := os.ReadFile(couplerFile)
	if err != nil {
		t.Fatal(err)
	}
	var keep []string
lines:
	for _, l := range strings.Split(string(b), "\n") {
		for _, d := range drop {
			if strings.HasPrefix(strings.TrimSpace(l), d) {
				continue lines
			}
		}
		keep = append(keep, l)
	}
	s := strings.Join(keep, "\n")
	s = strings.NewReplacer(repl...).Replace(s)
	path := filepath.Join(t.TempDir(), "coupler.toml")
	if err := os.WriteFile(path, []byte(s), 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

func TestMatchRefusals(t *testing.T) {
	// Checks here: exit codes and flag naming for bad match input (CLI wiring); no reference values.
	t.Setenv("TURNWISE_STOCK", "")
	base := []string{"match", couplerFile, "--freq", "7.1MHz"}
	tests := []struct {
		name string
		args []string
		want []string
	}{
		{"no adjustable capacitor", []string{"match", couplerWithout(t, []string{"range ="}), "--freq", "7.1MHz"}, []string{"range", "no adjustable capacitor"}},
		{"load node that does not exist", []string{"match", couplerWithout(t, nil, `node = "ant"`, `node = "antenna"`), "--freq", "7.1MHz"}, []string{"load: node", `"antenna"`}},
		{"no load table", []string{"match", couplerWithout(t, []string{"[load]", `node = "ant"`}), "--freq", "7.1MHz"}, []string{"load", "[load]"}},
		{"negative power", withArgs(base, "--power", "-100W"), []string{"--power", "zero or positive"}},
		{"power without unit", withArgs(base, "--power", "100"), []string{"--power"}},
		{"no frequency", []string{"match", couplerFile}, []string{"--freq"}},
		{"no circuit", []string{"match", "--freq", "7.1MHz"}, []string{"circuit file"}},
		{"missing circuit", []string{"match", "nope.toml", "--freq", "7.1MHz"}, []string{"nope.toml", "does not exist"}},
		{"bad load-r", withArgs(base, "--load-r", "0-50ohm"), []string{"load-r"}},
		{"reversed load-x", withArgs(base, "--load-x", "100--100ohm"), []string{"--load-x", "smaller value first"}},
		{"load-x not ohms", withArgs(base, "--load-x", "-100-100pF"), []string{"--load-x"}},
		{"swr 1", withArgs(base, "--swr", "1"), []string{"--swr"}},
		{"plot extension", withArgs(base, "--plot", "map.pdf"), []string{"--plot", ".svg or .png"}},
		{"steps", withArgs(base, "--r-steps", "0"), []string{"--r-steps"}},
		{"bad band", withArgs(base, "--band", "40m=7.2-7.0MHz"), []string{"--band"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			checkRefusal(t, tc.args, exitBadInput, tc.want...)
		})
	}
}

// matchJSON is the part of the JSON document the tests read.
type matchJSON struct {
	SWRLimit    float64 `json:"swr_limit"`
	Power       float64 `json:"power"`
	Frequencies []struct {
		Frequency float64 `json:"frequency"`
		Band      string  `json:"band"`
		Coverage  float64 `json:"coverage"`
		Points    []struct {
			LoadR      float64            `json:"load_r"`
			LoadX      float64            `json:"load_x"`
			Matched    bool               `json:"matched"`
			SWR        float64            `json:"swr"`
			Settings   map[string]float64 `json:"settings"`
			Efficiency *float64           `json:"efficiency"`
			Stress     map[string]struct {
				VPeak float64 `json:"v_peak"`
				IRMS  float64 `json:"i_rms"`
			} `json:"stress"`
		} `json:"points"`
	} `json:"frequencies"`
	Cautions []string `json:"cautions"`
	Warnings []string `json:"warnings"`
}

// The JSON carries the keys; every matched point's settings, put
// back into a circuit solver built from the same circuit file with the
// load added, give the SWR the JSON claims; coverage counts the matched
// points; stress and cautions come with --power only.
func TestMatchJSON(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, "match", couplerFile, "--band", "40m=7.0-7.2MHz", "--freq", "14.2MHz",
		"--r-steps", "5", "--x-steps", "5", "--power", "100W", "--json")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	for _, key := range []string{`"frequencies"`, `"frequency"`, `"coverage"`, `"points"`, `"load_r"`, `"load_x"`, `"matched"`,
		`"swr"`, `"settings"`, `"efficiency"`, `"stress"`, `"v_peak"`, `"i_rms"`, `"warnings"`, `"cautions"`} {
		if !strings.Contains(out, key) {
			t.Errorf("JSON lacks %s", key)
		}
	}
	for _, bad := range []string{"NaN", "Inf"} {
		if strings.Contains(out, bad) {
			t.Errorf("JSON has %s", bad)
		}
	}
	var doc matchJSON
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Frequencies) != 2 || doc.Frequencies[0].Band != "40m" || math.Abs(doc.Frequencies[0].Frequency-7.1e6) > 1 { // hand: band centre of the --band given above, (7.0+7.2)/2 MHz
		t.Fatalf("frequencies %+v", doc.Frequencies)
	}
	if len(doc.Cautions) == 0 {
		t.Error("no cautions with --power")
	}
	so := newStockOptions()
	cat, err := so.load()
	if err != nil {
		t.Fatal(err)
	}
	c, err := spec.LoadCircuitFile(couplerFile)
	if err != nil {
		t.Fatal(err)
	}
	m, err := spec.BuildCircuit(c, cat, so.path, so.use.v, false)
	if err != nil {
		t.Fatal(err)
	}
	ant := -1
	for i, n := range m.Net.Nodes {
		if n == "ant" {
			ant = i
		}
	}
	checked := 0
	for _, fr := range doc.Frequencies {
		matched := 0
		for _, p := range fr.Points {
			if !p.Matched {
				if p.Efficiency != nil || len(p.Settings) != 0 {
					t.Errorf("unmatched point %g%+gj has settings or efficiency", p.LoadR, p.LoadX)
				}
				continue
			}
			matched++
			if p.SWR > doc.SWRLimit || *p.Efficiency <= 0 || *p.Efficiency > 1 || len(p.Stress) == 0 {
				t.Errorf("matched point %g%+gj: swr %g, efficiency %v, %d stress rows", p.LoadR, p.LoadX, p.SWR, *p.Efficiency, len(p.Stress))
			}
			net := *m.Net
			net.Parts = append([]circuit.Part(nil), m.Net.Parts...)
			for name, cap := range p.Settings {
				i := m.PartIndex(name)
				if i < 0 {
					t.Fatalf("setting for unknown part %q", name)
				}
				net.Parts[i].Value = cap
			}
			net.Parts = append(net.Parts, circuit.Part{Name: "zl", Kind: circuit.Impedance, A: ant, B: circuit.Ground, Z: complex(p.LoadR, p.LoadX), TapNode: -1})
			sv, err := circuit.NewSolver(&net)
			if err != nil {
				t.Fatal(err)
			}
			r, err := sv.Response(fr.Frequency)
			if err != nil {
				t.Fatal(err)
			}
			g := cmplx.Abs(r.S[0][0])
			swr := (1 + g) / (1 - g)                                             // SWR from |Γ|, the standard definition (common practice)
			if swr > doc.SWRLimit*(1+1e-9) || math.Abs(swr-p.SWR) > 1e-6*p.SWR { // the JSON's SWR, re-solved (implTol; JSON keeps full precision)
				t.Errorf("%g Hz, load %g%+gj: solver SWR %g, JSON %g", fr.Frequency, p.LoadR, p.LoadX, swr, p.SWR)
			}
			checked++
		}
		if got := float64(matched) / float64(len(fr.Points)); math.Abs(got-fr.Coverage) > 1e-12 {
			t.Errorf("coverage %g, matched share %g", fr.Coverage, got)
		}
	}
	if checked == 0 {
		t.Fatal("no matched point on the demo coupler")
	}

	// Without --power: no stress, no cautions.
	out, _, code = runCLI(t, "match", couplerFile, "--freq", "7.1MHz", "--r-steps", "3", "--x-steps", "3", "--json")
	if code != exitOK || strings.Contains(out, `"cautions"`) || strings.Contains(out, `"stress"`) {
		t.Errorf("without --power: exit %d, cautions or stress in the output", code)
	}
}

// The table names every frequency, prints the cautions with --power, and
// --plot writes an SVG or PNG file atomically.
func TestMatchTableAndPlot(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	for _, ext := range []string{"svg", "png"} {
		t.Run(ext, func(t *testing.T) {
			path := filepath.Join(dir, "map."+ext)
			out, errOut, code := runCLI(t, "match", couplerFile, "--freq", "3.6MHz", "--freq", "14.2MHz", "--r-steps", "4", "--x-steps", "4",
				"--power", "100W", "--plot", path)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, errOut)
			}
			for _, want := range []string{"3.6 MHz", "14.2 MHz", "CAUTION", "RF burns", "local regulations", "Heating rule", "V peak"} {
				if !strings.Contains(out, want) {
					t.Errorf("table lacks %q", want)
				}
			}
			b, err := os.ReadFile(path)
			if err != nil {
				t.Fatal(err)
			}
			magic := map[string][]byte{"svg": []byte("<svg"), "png": []byte("\x89PNG")}[ext] // SVG root element (W3C SVG) and PNG signature (RFC 2083)
			if !bytes.Contains(b[:min(len(b), 512)], magic) {
				t.Errorf("%s does not look like %s", path, ext)
			}
			if ext == "svg" && !bytes.Contains(b, []byte("14.2 MHz")) {
				t.Error("SVG lacks the frequency title")
			}
			left, _ := filepath.Glob(filepath.Join(dir, ".*tmp*"))
			if len(left) > 0 {
				t.Errorf("temporary files left: %v", left)
			}
		})
	}
}

func TestMatchChooseTap(t *testing.T) {
	if testing.Short() {
		t.Skip("maps every quarter-turn tap")
	}
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, "match", couplerFile, "--freq", "7.1MHz", "--freq", "14.2MHz", "--r-steps", "4", "--x-steps", "4", "--choose-tap", "--taps", "3")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	if !strings.Contains(out, "Tap of L1 by matched share") || strings.Count(out, " turns  ") < 3 {
		t.Errorf("no tap ranking:\n%s", out)
	}
}

// The demo job's coupler page shows, per band, the coverage `turnwise
// match --json` gives for the same circuit, bands and power, with the
// stress table and the cautions.
func TestSheetCouplerPage(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	file := filepath.Join(t.TempDir(), "demo.pdf")
	if _, stderr, code := runCLI(t, "sheet", demoJob, "-o", file); code != exitOK {
		t.Fatalf("sheet: %s", stderr)
	}
	text := pageText(t, file, 8)
	args := []string{"match", couplerFile, "--power", "100W", "--json"}
	job, _ := loadDemo(t)
	if job.Coupler == nil || len(job.Coupler.Bands) == 0 {
		t.Fatal("the demo job has no [coupler] with bands")
	}
	for _, b := range job.Coupler.Bands {
		args = append(args, "--band", fmt.Sprintf("%s=%gMHz-%gMHz", b.Name, float64(b.Low)/1e6, float64(b.High)/1e6))
	}
	out, errOut, code := runCLI(t, args...)
	if code != exitOK {
		t.Fatalf("match: %s", errOut)
	}
	var doc matchJSON
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	for _, fr := range doc.Frequencies {
		matched := 0
		for _, p := range fr.Points {
			if p.Matched {
				matched++
			}
		}
		want := fmt.Sprintf("(%s): ", fr.Band)
		want2 := fmt.Sprintf("matched (%d of %d)", matched, len(fr.Points))
		i := strings.Index(text, want)
		if i < 0 || !strings.Contains(text[i:min(len(text), i+80)], want2) {
			t.Errorf("coupler page lacks %q … %q", want, want2)
		}
	}
	for _, w := range []string{"match map", "WORST STRESS PER PART", "CAUTION", "RF burns", "local regulations", "Heating rule"} {
		if !strings.Contains(text, w) {
			t.Errorf("coupler page lacks %q", w)
		}
	}
}
