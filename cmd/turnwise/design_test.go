package main

import (
	"encoding/json"
	"math"
	"path/filepath"
	"strings"
	"testing"

	"turnwise/coil"
	"turnwise/forms"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// The acceptance lines, as goldens.
var (
	designVHFArgs = []string{"design", "--freq", "145MHz", "--cap", "22pF", "--leads", "5mm", "--max-length", "15mm"}
	designHFArgs  = []string{"design", "--inductance", "4.7uH", "--freq", "7MHz"}
)

func TestDesignGolden(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	tests := []struct {
		name   string
		args   []string
		golden string
	}{
		{"vhf table", designVHFArgs, "design_vhf.txt"},
		{"vhf json", withArgs(designVHFArgs, "--json"), "design_vhf.json"},
		{"hf table", designHFArgs, "design_hf.txt"},
		{"hf mandrel inches", []string{"design", "--inductance", "1.2uH", "--freq", "14MHz", "--leads", "10mm", "--support", "mandrel",
			"--prefer", "q", "--top", "3", "--units", "in"}, "design_hf_mandrel_in.txt"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) { checkGoldenRun(t, tc.args, tc.golden) })
	}
}

// The HF target finds formers from the pipe catalog, not only drills.
func TestDesignHFUsesFormers(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(designHFArgs, "--json")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Candidates []struct {
			Support     string `json:"support"`
			SupportName string `json:"support_name"`
		} `json:"candidates"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	formers := 0
	for _, c := range doc.Candidates {
		if c.Support == "former" && strings.HasPrefix(c.SupportName, "pvc") {
			formers++
		}
	}
	if formers == 0 {
		t.Errorf("no pipe former among %+v", doc.Candidates)
	}
}

// Every key the issue names is present, finite and in SI.
func TestDesignJSONKeys(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(designVHFArgs, "--json")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if doc["schema"] != float64(report.SchemaVersion) {
		t.Error("schema missing")
	}
	for _, k := range []string{"target", "candidates", "pareto", "warnings"} {
		if _, ok := doc[k]; !ok {
			t.Errorf("key %q missing", k)
		}
	}
	target := doc["target"].(map[string]any)
	if r := target["required_inductance"].(float64); math.Abs(r-54.76e-9) > 0.01e-9 { // 1/((2π·145 MHz)²·22 pF), coil/lc.go
		t.Errorf("required_inductance %g", r)
	}
	cands := doc["candidates"].([]any)
	if len(cands) != 5 {
		t.Fatalf("%d candidates, want 5", len(cands))
	}
	for _, c := range cands {
		m := c.(map[string]any)
		for _, k := range []string{"turns", "pitch", "winding_length", "lead_length", "inductance", "inductance_effective",
			"q", "srf", "score", "trim_min", "trim_max", "matched_inductance", "tune_low", "tune_high", "former_diameter"} {
			v, ok := m[k].(float64)
			if !ok || math.IsNaN(v) || math.IsInf(v, 0) {
				t.Errorf("candidate key %q = %v", k, m[k])
			}
		}
		if m["why"] == "" {
			t.Error("empty why")
		}
		if lo, hi := m["trim_min"].(float64), m["trim_max"].(float64); !(lo < m["inductance"].(float64) && m["inductance"].(float64) < hi) {
			t.Errorf("terminal L outside its trim window %g … %g", lo, hi)
		}
		if v := m["winding_length"].(float64); v > 15e-3 {
			t.Errorf("winding_length %g over --max-length", v)
		}
	}
}

// An impossible target explains itself and exits 3, naming the flag.
func TestDesignInfeasibleExit(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	tests := []struct {
		name string
		args []string
		want []string
	}{
		{"too short", []string{"design", "--inductance", "480nH", "--freq", "30MHz", "--leads", "5mm", "--mandrel", "6mm", "--wire", "1mm", "--max-length", "5mm"},
			[]string{"--max-length", "shortest", "allow"}},
		{"leads alone", []string{"design", "--inductance", "1nH", "--freq", "145MHz", "--leads", "5mm"}, []string{"leads alone"}},
		{"srf", []string{"design", "--inductance", "10uH", "--freq", "30MHz", "--leads", "5mm", "--min-srf-ratio", "10"}, []string{"--min-srf-ratio", "self-resonance"}},
		{"too slim", []string{"design", "--inductance", "48nH", "--freq", "145MHz", "--leads", "5mm", "--max-diameter", "2mm"}, []string{"--max-diameter", "slimmest"}},
		{"past its own resonance", []string{"design", "--freq", "10GHz", "--cap", "0.01pF", "--leads", "0mm"}, []string{"self-resonance", "--min-srf-ratio"}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) { checkRefusal(t, tc.args, exitInfeasible, tc.want...) })
	}
	_, errOut, _ := runCLI(t, tests[0].args...)
	checkGolden(t, "design_infeasible.txt", errOut)
}

// Bad flags: one line naming the flag, exit 2.
func TestDesignBadInput(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	base := []string{"design", "--inductance", "48nH", "--freq", "145MHz", "--leads", "5mm"}
	tests := []struct {
		name     string
		override []string
		wantFlag string
	}{
		{"no target", []string{"--inductance", "0nH"}, "--inductance"},
		{"bad inductance", []string{"--inductance", "abc"}, "--inductance"},
		{"cap and inductance", []string{"--cap", "22pF"}, "--inductance"},
		{"negative leads", []string{"--leads", "-5mm"}, "--leads"},
		{"top zero", []string{"--top", "0"}, "--top"},
		{"prefer", []string{"--prefer", "fast"}, "--prefer"},
		{"support", []string{"--support", "rod"}, "--support"},
		{"srf ratio", []string{"--min-srf-ratio", "1"}, "--min-srf-ratio"},
		{"min wire", []string{"--min-wire", "thick"}, "--min-wire"},
		{"min above max", []string{"--min-wire", "2mm", "--max-wire", "1mm"}, "--min-wire"},
		{"unknown wire", []string{"--wire", "unobtainium"}, "--wire"},
		{"mandrel and former", []string{"--mandrel", "6mm", "--former", "20mm"}, "--mandrel"},
		{"insulation without wire", []string{"--insulation", "grade2"}, "--insulation"},
		{"tolerance", []string{"--tolerance", "90%"}, "--tolerance"},
		{"missing stock", []string{"--stock", "/nonexistent/stock.toml"}, "--stock"},
		{"positional", []string{"extra"}, "no arguments"},
		// Review of issue 3: these were exit 1, a message naming no flag or
		// the wrong one, or a silent default.
		{"negative inductance", []string{"--inductance", "-5nH"}, "--inductance"},
		{"negative freq", []string{"--freq", "-1MHz"}, "--freq"},
		{"tolerance too tight", []string{"--tolerance", "1e-9%"}, "--tolerance"},
		{"zero srf ratio", []string{"--min-srf-ratio", "0"}, "--min-srf-ratio"},
		{"zero mandrel", []string{"--mandrel", "0mm"}, "--mandrel"},
		{"negative former", []string{"--former", "-3mm"}, "--former"},
		{"springback range", []string{"--springback", "200%"}, "--springback"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			checkRefusal(t, replaceFlags(base, tc.override), exitBadInput, tc.wantFlag)
		})
	}
}

// With a saved calibration the design on that mandrel and wire uses it and
// says so (what `trim --save` promises).
func TestDesignUsesCalibration(t *testing.T) {
	stock := filepath.Join("..", "..", "testdata", "stock", "bench.toml")
	out, errOut, code := runCLI(t, "design", "--stock", stock, "--mandrel", "6mm drill", "--wire", "18swg",
		"--inductance", "60nH", "--freq", "145MHz", "--leads", "5mm", "--json")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Candidates []struct {
			Springback       float64 `json:"springback"`
			SpringbackSource string  `json:"springback_source"`
			Note             string  `json:"springback_note"`
		} `json:"candidates"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Candidates) == 0 {
		t.Fatal("no candidate")
	}
	c := doc.Candidates[0]
	if c.Springback != 0.04 || c.SpringbackSource != "calibration" || !strings.Contains(c.Note, "demo") {
		t.Errorf("candidate springback %+v", c)
	}
	table, _, _ := runCLI(t, "design", "--stock", stock, "--mandrel", "6mm drill", "--wire", "18swg",
		"--inductance", "60nH", "--freq", "145MHz", "--leads", "5mm")
	if !strings.Contains(table, "springback 4 % from your calibration") {
		t.Errorf("table does not say it used the calibration:\n%s", table)
	}
}

// The glue's errors carry the exit codes the sheet command relies on.
func TestDesignSearchErrors(t *testing.T) {
	cat, err := forms.BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	_, err = spec.Search(cat, &spec.SearchOptions{Inductance: 1e-9, Freq: 145e6, Leads: 5e-3})
	if exitCode(err) != exitInfeasible {
		t.Errorf("infeasible: exit %d (%v)", exitCode(err), err)
	}
	_, err = spec.Search(cat, &spec.SearchOptions{Inductance: 48e-9, Freq: 145e6, Leads: 5e-3, MinSRFRatio: 1.1})
	if exitCode(err) != exitBadInput || !strings.Contains(err.Error(), "--min-srf-ratio") {
		t.Errorf("bad ratio: exit %d (%v)", exitCode(err), err)
	}
	res, err := spec.Search(cat, &spec.SearchOptions{Inductance: 48e-9, Freq: 145e6, Leads: 5e-3, Top: 1})
	if err != nil || len(res.Candidates) != 1 {
		t.Fatalf("top 1: %v, %d candidates", err, len(res.Candidates))
	}
	if _, err := coil.Predict(res.Candidates[0].Prediction.Geometry, 145e6); err != nil {
		t.Error(err)
	}
}
