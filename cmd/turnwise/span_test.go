package main

import (
	"encoding/json"
	"math"
	"path/filepath"
	"strings"
	"testing"

	"turnwise/coil"
	"turnwise/coil/tuning"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// spanArgs is the invented HF example: 40 turns of 0.5 mm grade 1 wire on
// a 20 mm PVC former at 1 mm pitch, a 15–365 pF two-gang capacitor with
// 5 pF of wiring at each node, and three listening bands.
var spanArgs = []string{"span", "--former", "pvc 20mm", "--wire", "0.5mm", "--insulation", "grade1", "--turns", "40",
	"--pitch", "1mm", "--leads", "20mm", "--gang", "15-365pF", "--stray-a", "5pF", "--stray-b", "5pF"} // 15-365 pF: a usual broadcast two-gang capacitor (from memory); the rest invented

var spanBandFile = filepath.Join("..", "..", "testdata", "span", "hf-listening.txt")

func TestSpanGolden(t *testing.T) {
	// Checks here: CLI wiring and exit codes; the golden files are regression pins (turnwise's own output, not a reference).
	t.Setenv("TURNWISE_STOCK", "")
	tests := []struct {
		name   string
		args   []string
		code   int
		golden string
	}{
		{"tap 17 with bands and chart", withArgs(spanArgs, "--tap", "17", "--bands", spanBandFile, "--chart"), exitOK, "span_example.txt"},
		{"tap 17 json", withArgs(spanArgs, "--tap", "17", "--bands", spanBandFile, "--json"), exitOK, "span_example.json"},
		{"choose tap", withArgs(spanArgs, "--bands", spanBandFile, "--choose-tap"), exitOK, "span_choose.txt"},
		{"choose tap impossible", withArgs(spanArgs, "--band", "160m=1.81-2MHz", "--band", "20m=14-14.35MHz", "--band", "10m=28-29.7MHz", "--choose-tap"), exitInfeasible, "span_infeasible.txt"}, // amateur band edges, ITU Region 1 (from memory)
		{"measured law", []string{"span", "--former", "pvc 20mm", "--wire", "0.5mm", "--insulation", "grade1", "--turns", "40", "--pitch", "1mm", "--leads", "20mm",
			"--tap", "11", "--law", filepath.Join("..", "..", "testdata", "span", "gang-measured.txt"), "--trim-b", "3pF", "--steps", "6"}, exitOK, "span_measured.txt"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			out, errOut, code := runCLI(t, tc.args...)
			if code != tc.code {
				t.Fatalf("exit %d, want %d: %s", code, tc.code, errOut)
			}
			checkGolden(t, tc.golden, out)
		})
	}
}

// The JSON keys are present, finite and consistent.
func TestSpanJSONKeys(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(spanArgs, "--tap", "17", "--bands", spanBandFile, "--json")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Schema   int                `json:"schema"`
		Sections map[string]float64 `json:"sections"`
		Dial     []map[string]float64
		Overlap  *float64         `json:"overlap"`
		Bands    []map[string]any `json:"bands"`
		Coinc    []map[string]any `json:"coincidences"`
		Warnings []string         `json:"warnings"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if doc.Schema != report.SchemaVersion || doc.Overlap == nil || doc.Warnings == nil {
		t.Fatalf("schema %d overlap %v warnings %v", doc.Schema, doc.Overlap, doc.Warnings)
	}
	for _, k := range []string{"l_a", "l_b", "m", "k", "ratio"} {
		if v, ok := doc.Sections[k]; !ok || !(v > 0) || math.IsInf(v, 0) {
			t.Errorf("sections.%s = %v", k, v)
		}
	}
	if len(doc.Dial) != 11 { // span's default --steps: internal consistency
		t.Fatalf("%d dial rows", len(doc.Dial))
	}
	for _, r := range doc.Dial {
		for _, k := range []string{"setting", "c_a", "c_b", "f_low", "f_high"} {
			if _, ok := r[k]; !ok {
				t.Errorf("dial row lacks %s", k)
			}
		}
		if r["setting"] < 0 || r["setting"] > 1 || !(r["f_high"] > r["f_low"]) {
			t.Errorf("dial row %v", r)
		}
	}
	if len(doc.Bands) != 3 || len(doc.Coinc) == 0 {
		t.Fatalf("bands %d coincidences %d", len(doc.Bands), len(doc.Coinc))
	}
	for _, c := range doc.Coinc {
		for _, k := range []string{"setting", "order", "f_low", "f_high", "offset"} {
			if _, ok := c[k]; !ok {
				t.Errorf("coincidence lacks %s", k)
			}
		}
	}
}

// The glue the build sheet uses gives what the command prints.
func TestBuildSpanGlue(t *testing.T) {
	g := coil.Geometry{FormerDiameter: 20e-3, WireDiameter: 0.5e-3, WireOverall: 0.5e-3 * 1.08, Turns: 40, Pitch: 1e-3, LeadLength: 20e-3} // overall 0.54 mm ≈ grade 1 max 0.544 mm, IEC 60317-0-1 (from memory, forms/data/enamel.csv); only compared with itself
	set := spec.SpanSettings{GangA: [2]float64{15e-12, 365e-12}, StrayA: 5e-12, StrayB: 5e-12,
		Bands:     []tuning.Band{{Name: "80m", Low: 3.5e6, High: 3.8e6}, {Name: "40m", Low: 7e6, High: 7.2e6}, {Name: "31m", Low: 9.4e6, High: 9.9e6}}, // 80 m and 40 m amateur (ITU Region 1) and 31 m broadcast band edges (from memory)
		ChooseTap: true}
	out, err := spec.BuildSpan(g, set)
	if err != nil {
		t.Fatal(err)
	}
	if out.Plan == nil || !out.Plan.Feasible || out.Span.Sections.TapTurns != out.Plan.TapTurns {
		t.Fatalf("plan %+v", out.Plan)
	}
	set.ChooseTap, set.Tap = false, 17
	out, err = spec.BuildSpan(g, set)
	if err != nil || out.Plan != nil || out.Span.Sections.TapTurns != 17 || len(out.Span.Coincidences) == 0 {
		t.Fatalf("tap 17: %v %+v", err, out.Span.Coincidences)
	}
	set.Law = "slw"
	set.GangA = [2]float64{}
	if _, err := spec.BuildSpan(g, set); exitCode(err) != exitBadInput {
		t.Errorf("no gang: %v", err)
	}
}

func TestSpanBadInput(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	base := withArgs(spanArgs, "--tap", "17")
	tests := []struct {
		name     string
		override []string
		wantFlag string
	}{
		{"no tap", []string{"--tap", "x"}, "--tap"},
		{"tap beyond", []string{"--tap", "41"}, "--tap"},
		{"tap third", []string{"--tap", "3.3"}, "--tap"},
		{"gang upside down", []string{"--gang", "365-15pF"}, "--gang"},
		{"gang zero", []string{"--gang", "0-0pF"}, "--gang 0-0pF leaves section A"},
		{"law unknown with gang", []string{"--law", "slx"}, "neither slc, slf, slw nor an existing table file"},
		{"gang no unit", []string{"--gang", "15-365"}, "--gang"},
		{"gang-b nonsense", []string{"--gang-b", "big"}, "--gang-b"},
		{"band upside down", []string{"--band", "3.8-3.5MHz"}, "--band"},
		{"band no dash", []string{"--band", "3.5MHz"}, "--band"},
		{"missing band file", []string{"--bands", "/nonexistent/bands.txt"}, "--bands"},
		{"law unknown", []string{"--law", "log"}, "--law"},
		{"steps", []string{"--steps", "1"}, "--steps"},
		{"loaded q", []string{"--loaded-q", "-5"}, "--loaded-q"},
		{"trim negative", []string{"--trim-a", "-5pF"}, "--trim-a"},
		{"vary pitch alone", []string{"--vary-pitch", "true"}, "--vary-pitch"},
		{"choose without bands", []string{"--choose-tap", "true"}, "--band"},
		{"wire", []string{"--wire", "48nH"}, "--wire"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			args := replaceFlags(base, tc.override)
			switch tc.name {
			case "no tap":
				args = withArgs(spanArgs)
			case "choose without bands":
				args = withArgs(spanArgs, "--choose-tap")
			case "vary pitch alone":
				args = withArgs(base, "--vary-pitch")
			}
			checkRefusal(t, args, exitBadInput, tc.wantFlag)
		})
	}
}

// Where the harmonic crosses the high range's peak the offset is only the
// bisection's rounding: the table says "on the peak" instead of printing
// a distance in nanohertz. The SLF law keeps f_high/f_low near 3 over a
// long stretch of the dial, so the example's crossing is found there.
func TestSpanCoincidenceOnPeakWording(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(spanArgs, "--tap", "17", "--law", "slf")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	if !strings.Contains(out, "is on the high range's peak") || !strings.Contains(errOut, "is on the high range's peak") {
		t.Errorf("no on-peak coincidence in the table or warnings:\n%s\n%s", out, errOut)
	}
	for _, silly := range []string{"nHz", "pHz", "e-0"} {
		if strings.Contains(out+errOut, silly) {
			t.Errorf("output prints %q:\n%s\n%s", silly, out, errOut)
		}
	}
}
