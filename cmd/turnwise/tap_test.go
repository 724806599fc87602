package main

import (
	"encoding/json"
	"math"
	"strings"
	"testing"
	"turnwise/internal/report"
)

var tapHFArgs = []string{"tap", "--former", "pvc 20mm", "--wire", "0.5mm", "--insulation", "grade1", "--turns", "40", "--pitch", "1mm", "--leads", "20mm", "--freq", "7.1MHz"}

func TestTapGolden(t *testing.T) {
	// Checks here: CLI wiring and exit codes; the golden files are regression pins (turnwise's own output, not a reference).
	t.Setenv("TURNWISE_STOCK", "")
	tests := []struct {
		name   string
		args   []string
		golden string
	}{
		{"impedance 1:50", withArgs(tapHFArgs, "--impedance-ratio", "1:50"), "tap_impedance.txt"},
		{"vhf ratio json", []string{"tap", "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm", "--ratio", "0.25", "--freq", "145MHz", "--json"}, "tap_vhf.json"},
		{"bottom L", withArgs(tapHFArgs, "--bottom-l", "2uH"), "tap_bottom.txt"},
		{"at a tap", withArgs(tapHFArgs, "--at", "17", "--units", "in"), "tap_at.txt"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) { checkGoldenRun(t, tc.args, tc.golden) })
	}
}

func TestTapJSONKeys(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(tapHFArgs, "--ratio", "20%", "--json")...)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc map[string]any
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"tap_turns", "tap_position", "l_a", "l_b", "m", "k", "ratio"} {
		v, ok := doc[k].(float64)
		if !ok || !(v > 0) || math.IsInf(v, 0) {
			t.Errorf("%s = %v", k, doc[k])
		}
	}
	if r := doc["ratio"].(float64); math.Abs(r-0.2) > 0.02 { // the --ratio 20% asked above, within a quarter-turn's step: internal consistency
		t.Errorf("ratio %v for a 0.2 target", r)
	}
	if doc["schema"] != float64(report.SchemaVersion) || doc["goal"] != "voltage_ratio" {
		t.Errorf("schema %v goal %v", doc["schema"], doc["goal"])
	}
	if ch, ok := doc["choices"].([]any); !ok || len(ch) != 2 {
		t.Errorf("choices %v", doc["choices"])
	}
}

func TestTapBadInput(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	tests := []struct {
		name     string
		args     []string
		wantCode int
		wantText string
	}{
		{"no goal", withArgs(tapHFArgs), exitBadInput, "--ratio"},
		{"two goals", withArgs(tapHFArgs, "--ratio", "0.2", "--bottom-l", "1uH"), exitBadInput, "exactly one"},
		{"ratio above one", withArgs(tapHFArgs, "--ratio", "2"), exitBadInput, "--ratio"},
		{"tap beyond", withArgs(tapHFArgs, "--at", "50"), exitBadInput, "--at"},
		{"tap third", withArgs(tapHFArgs, "--at", "2.3"), exitBadInput, "--at"},
		{"bottom L not L", withArgs(tapHFArgs, "--bottom-l", "5pF"), exitBadInput, "--bottom-l"},
		{"bottom L beyond coil", withArgs(tapHFArgs, "--bottom-l", "1mH"), exitInfeasible, "whole coil"},
		{"bottom L negative", withArgs(tapHFArgs, "--bottom-l", "-1uH"), exitBadInput, "--bottom-l"},
		{"bottom L huge", withArgs(tapHFArgs, "--bottom-l", "1H"), exitInfeasible, "1 H needs more"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) { checkRefusalMessage(t, tc.args, tc.wantCode, tc.wantText) })
	}
}

// The ends of the winding: a tap at the cold terminal has no 1:N ratio
// (no Inf printed), and a target below what the first quarter turn gives
// is answered with that tap and a warning, its miss as a factor.
func TestTapEnds(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out, errOut, code := runCLI(t, withArgs(tapHFArgs, "--at", "0")...)
	if code != exitOK || strings.Contains(out, "Inf") || !strings.Contains(out, "(cold end)") {
		t.Errorf("--at 0: exit %d\n%s\n%s", code, out, errOut)
	}
	out, errOut, code = runCLI(t, withArgs(tapHFArgs, "--ratio", "1e-6")...)
	if code != exitOK || !strings.Contains(errOut, "no quarter-turn tap on the winding reaches the target") || !strings.Contains(out, "× target") {
		t.Errorf("--ratio 1e-6: exit %d\n%s\n%s", code, out, errOut)
	}
}
