package main

import (
	"encoding/json"
	"math"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// The two-capacitor method with default 5 % capacitors: the JSON carries
// what 1 % parts would give, the same numbers the table prints (issue 10).
// The table's figure is three significant digits, so the two agree within
// half a unit of its last digit.
func TestTwoCapacitorOnePercentJSON(t *testing.T) {
	t.Parallel()
	args := []string{"trim", "--former", "25mm", "--wire", "22awg", "--turns", "30", "--leads", "20mm", "--freq", "3.7MHz",
		"--resonance", "2.0MHz@330pF", "--resonance", "0.9435MHz@1.5nF"}
	table, errOut, code := runCLI(t, args...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	m := regexp.MustCompile(`1 % capacitors would give ± ([0-9.]+) pF \(and L ± ([0-9.]+) %\)`).FindStringSubmatch(table)
	if m == nil {
		t.Fatalf("no 1 %% advice in the table:\n%s", table)
	}
	wantC, _ := strconv.ParseFloat(m[1], 64)
	wantL, _ := strconv.ParseFloat(m[2], 64)

	out, errOut, code := runCLI(t, append(args, "--json")...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Stray       *float64 `json:"stray_capacitance"`
		StrayU      *float64 `json:"stray_capacitance_uncertainty"`
		LU          *float64 `json:"measured_inductance_uncertainty"`
		OnePercentU *struct {
			Capacitance        *float64 `json:"capacitance"`
			InductanceFraction *float64 `json:"inductance_fraction"`
		} `json:"one_percent_uncertainty"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	// The existing keys stay.
	if doc.Stray == nil || doc.StrayU == nil || doc.LU == nil || *doc.StrayU <= math.Abs(*doc.Stray) {
		t.Fatalf("stray_capacitance(_uncertainty) missing or not swamped: %s", out)
	}
	u := doc.OnePercentU
	if u == nil || u.Capacitance == nil || u.InductanceFraction == nil {
		t.Fatalf("no one_percent_uncertainty {capacitance, inductance_fraction}:\n%s", out)
	}
	if got := *u.Capacitance * 1e12; math.Abs(got-wantC) > 0.051*math.Max(1, wantC/10) {
		t.Errorf("one_percent_uncertainty.capacitance %.4g pF, table says ± %s pF", got, m[1])
	}
	if got := *u.InductanceFraction * 100; math.Abs(got-wantL) > 0.051 {
		t.Errorf("one_percent_uncertainty.inductance_fraction %.4g %%, table says ± %s %%", got, m[2])
	}
	// Tighter than the 5 % figures it stands beside.
	if *u.Capacitance >= *doc.StrayU || *u.InductanceFraction >= *doc.LU {
		t.Errorf("1 %% figures (%g F, %g) not below the 5 %% ones (%g F, %g)", *u.Capacitance, *u.InductanceFraction, *doc.StrayU, *doc.LU)
	}

	// 1 % parts already: no key.
	out, _, _ = runCLI(t, append(args, "--cap-tol", "1%", "--json")...)
	if strings.Contains(out, "one_percent_uncertainty") {
		t.Errorf("one_percent_uncertainty with 1 %% parts:\n%s", out)
	}
}

// A missing jig file is blamed on the flag that named it, --open or
// --short, in fit and in trim --sweep; exit 2 (issue 10).
func TestMissingJigFileNamesFlag(t *testing.T) {
	t.Parallel()
	dir := filepath.Join("..", "..", "testdata", "sweep")
	sw, open, short := filepath.Join(dir, "l1-as-wound.s1p"), filepath.Join(dir, "jig-open.s1p"), filepath.Join(dir, "jig-short.s1p")
	missing := filepath.Join(t.TempDir(), "gone.s1p")
	trimArgs := []string{"trim", "--sweep", sw, "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "10mm", "--leads", "4mm"}
	tests := []struct {
		name string
		args []string
		want string
	}{
		{"fit open", []string{"fit", sw, "--open", missing, "--short", short}, "--open: "},
		{"fit short", []string{"fit", sw, "--open", open, "--short", missing}, "--short: "},
		{"trim open", append(append([]string{}, trimArgs...), "--open", missing, "--short", short), "--open: "},
		{"trim short", append(append([]string{}, trimArgs...), "--open", open, "--short", missing), "--short: "},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			out, errOut, code := runCLI(t, tc.args...)
			if code != exitBadInput {
				t.Errorf("exit %d, want %d", code, exitBadInput)
			}
			if out != "" {
				t.Errorf("stdout not empty: %q", out)
			}
			line := strings.TrimSpace(errOut)
			if !strings.HasPrefix(line, "turnwise: "+tc.want) || !strings.Contains(line, "gone.s1p") || !strings.Contains(line, "does not exist") {
				t.Errorf("error %q does not name %s and the file", line, strings.TrimSuffix(tc.want, ": "))
			}
			if strings.Contains(line, "sweep file") {
				t.Errorf("error %q calls the jig file the sweep file", line)
			}
		})
	}
}
