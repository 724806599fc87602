package main

import (
	"encoding/json"
	"fmt"
	"math"
	"path/filepath"
	"strings"
	"testing"
)

// predict --json gives tempco_low_frequency equal to copper's expansion
// for a self-supporting coil (dimensional analysis; forms/data/materials.csv
// copper row, CRC Handbook from memory) and a larger one on a PVC former.
func TestPredictTempco(t *testing.T) {
	t.Parallel()
	get := func(args ...string) map[string]any {
		out, errOut, code := runCLI(t, append([]string{"predict", "--json"}, args...)...)
		if code != 0 {
			t.Fatalf("exit %d: %s", code, errOut)
		}
		var m map[string]any
		if err := json.Unmarshal([]byte(out), &m); err != nil {
			t.Fatal(err)
		}
		return m
	}
	self := get("--mandrel", "20mm", "--wire", "1mm", "--turns", "10", "--pitch", "2mm", "--leads", "10mm", "--freq", "14MHz")
	lf, ok := self["tempco_low_frequency"].(float64)
	if !ok || math.Abs(lf/16.5e-6-1) > 1e-9 {
		t.Errorf("self-supporting tempco_low_frequency %v, want 16.5e-6", self["tempco_low_frequency"])
	}
	if q, ok := self["tempco_q"].(float64); !ok || !(q < -1e-3) {
		t.Errorf("tempco_q %v: Q falls about ½·0.00393/K", self["tempco_q"])
	}
	pvc := get("--former", "pvc 20mm", "--wire", "1mm", "--turns", "10", "--pitch", "2mm", "--leads", "10mm", "--pitch-follows", "wire")
	if v, ok := pvc["tempco_low_frequency"].(float64); !ok || !(v > 2*lf) {
		t.Errorf("PVC tempco_low_frequency %v, want well above copper's %g", pvc["tempco_low_frequency"], lf)
	}
	// A former given by diameter only has no material: no tempco, a warning.
	bare := get("--former", "21mm", "--wire", "1mm", "--turns", "10", "--pitch", "2mm", "--leads", "10mm")
	if _, has := bare["tempco_low_frequency"]; has {
		t.Error("tempco for a former of unknown material")
	}
	if w, _ := json.Marshal(bare["warnings"]); !strings.Contains(string(w), "material") {
		t.Errorf("warnings %s: want one about the material", w)
	}
	checkRefusal(t, []string{"predict", "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--leads", "5mm", "--pitch-follows", "glue"}, 2, "pitch-follows")
}

// design gives every candidate its temperature coefficients, computed
// through the same Spec predict builds: a self-supporting candidate has
// copper's expansion at low frequency (dimensional analysis; materials.csv
// copper row, CRC Handbook from memory), a PVC-former one more; the table
// prints them in ppm/K.
func TestDesignTempco(t *testing.T) {
	t.Parallel()
	out, errOut, code := runCLI(t, "design", "--cap", "22pF", "--freq", "145MHz", "--leads", "5mm", "--support", "mandrel", "--top", "2", "--json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Candidates []map[string]any `json:"candidates"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil || len(doc.Candidates) == 0 {
		t.Fatalf("%v: %d candidates", err, len(doc.Candidates))
	}
	for i, c := range doc.Candidates {
		lf, ok := c["tempco_low_frequency"].(float64)
		if !ok || math.Abs(lf/16.5e-6-1) > 1e-9 {
			t.Errorf("candidate %d: tempco_low_frequency %v, want 16.5e-6", i+1, c["tempco_low_frequency"])
		}
		if q, ok := c["tempco_q"].(float64); !ok || !(q < -1e-3) {
			t.Errorf("candidate %d: tempco_q %v, want about -0.002 (Q falls with copper's resistivity)", i+1, c["tempco_q"])
		}
		if tc, ok := c["tempco"].(float64); !ok || !(tc > lf) {
			t.Errorf("candidate %d: tempco at f %v, want above the low-frequency one (the skin term adds)", i+1, c["tempco"])
		}
	}
	out, errOut, code = runCLI(t, "design", "--inductance", "4.7uH", "--freq", "7MHz", "--leads", "10mm", "--former", "pvc 20mm", "--top", "1")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	i := strings.Index(out, "tempco: L +")
	if i < 0 {
		t.Fatalf("no tempco line in the table:\n%s", out)
	}
	var ppm float64
	if _, err := fmt.Sscanf(out[i+len("tempco: L "):], "%g", &ppm); err != nil || !(ppm > 40 && ppm < 90) {
		t.Errorf("PVC-former tempco %g ppm/K (%v), want between copper's 16.5 and PVC's 70 ppm/K class, nearer PVC", ppm, err)
	}
}

// span prints both ranges' drift at the chosen dial settings: with a
// self-supporting coil and a gang of copper's coefficient every L and C
// scales with copper, so both ranges fall by α_Cu per kelvin (dimensional
// analysis; the skin term adds a few ppm/K at HF, coil/thermal
// TestSpanDriftScales); over 10 °C … 40 °C the shift is about 30 K times
// the drift; bad flags are refused with exit 2.
func TestSpanDrift(t *testing.T) {
	t.Parallel()
	base := []string{"span", "--mandrel", "20mm", "--wire", "1mm", "--turns", "10", "--pitch", "2mm", "--leads", "10mm",
		"--tap", "4", "--gang", "15-365pF", "--json"}
	out, errOut, code := runCLI(t, append(base, "--gang-tempco", "+16.5ppm/K", "--drift-at", "0,25,100", "--temp-range", "10C-40C")...)
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Drift struct {
			GangTempcoPerK float64 `json:"gang_tempco_per_k"`
			Points         []struct {
				Setting float64 `json:"setting"`
				Low     struct {
					HzPerK  float64 `json:"hz_per_k"`
					PPMPerK float64 `json:"ppm_per_k"`
					Shift   *struct {
						Hz float64 `json:"hz"`
					} `json:"shift"`
				} `json:"low"`
				High *struct {
					PPMPerK float64 `json:"ppm_per_k"`
				} `json:"high"`
			} `json:"points"`
		} `json:"drift"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil {
		t.Fatal(err)
	}
	if len(doc.Drift.Points) != 3 || math.Abs(doc.Drift.Points[1].Setting-0.25) > 1e-12 {
		t.Fatalf("drift points %+v, want 3 at 0, 25 %%, 100 %%", doc.Drift.Points)
	}
	for _, p := range doc.Drift.Points {
		if math.Abs(p.Low.PPMPerK+16.5) > 5 || p.High == nil || math.Abs(p.High.PPMPerK+16.5) > 5 {
			t.Errorf("dial %g: low %.3g, high %+v ppm/K; want about -16.5 (copper scaling)", p.Setting, p.Low.PPMPerK, p.High)
		}
		if p.Low.Shift == nil || math.Abs(p.Low.Shift.Hz-30*p.Low.HzPerK) > 0.01*math.Abs(30*p.Low.HzPerK) {
			t.Errorf("dial %g: shift %+v, want about 30 K × %.4g Hz/K", p.Setting, p.Low.Shift, p.Low.HzPerK)
		}
	}
	// The default gang is air-variable, and the table says so.
	tbl, errOut, code := runCLI(t, base[:len(base)-1]...)
	if code != 0 || !strings.Contains(tbl, "TEMPERATURE DRIFT (gang air +50.0 ppm/K") {
		t.Errorf("exit %d %s: no air-gang drift block in\n%s", code, errOut, tbl)
	}
	checkRefusal(t, append(base, "--drift-at", "150"), 2, "drift-at")
	checkRefusal(t, append(base, "--gang-tempco", "wood"), 2, "gang-tempco")
	checkRefusal(t, append(base, "--temp-range", "10-40"), 2, "temp-range")
}

// circuit gives each resonance its drift and, with --compensate, a split
// of the fixed capacitor into standard classes and E12 values (IEC 60063)
// whose residual drift is within its uncertainty; the demo tank's coil is
// on PVC (materials.csv), its capacitor C0G (IEC 60384-8, from memory).
func TestCircuitDrift(t *testing.T) {
	t.Parallel()
	file := filepath.Join("..", "..", "testdata", "circuits", "vfo-tank.toml")
	out, errOut, code := runCLI(t, "circuit", file, "--temp-range", "15C-35C", "--compensate", "--json")
	if code != 0 {
		t.Fatalf("exit %d: %s", code, errOut)
	}
	var doc struct {
		Resonances []struct {
			Frequency float64 `json:"frequency"`
			Drift     *struct {
				Frequency float64 `json:"frequency"` // the lossless natural frequency
				HzPerK    float64 `json:"hz_per_k"`
				PPMPerK   float64 `json:"ppm_per_k"`
				Shift     *struct {
					Hz float64 `json:"hz"`
				} `json:"shift"`
			} `json:"drift"`
			Compensation *struct {
				Replaces string `json:"replaces"`
				Parts    []struct {
					Value  float64
					Tempco string
				} `json:"parts"`
				ResidualPPMPerK    float64 `json:"residual_ppm_per_k"`
				UncertaintyPPMPerK float64 `json:"uncertainty_ppm_per_k"`
			} `json:"compensation"`
		} `json:"resonances"`
	}
	if err := json.Unmarshal([]byte(out), &doc); err != nil || len(doc.Resonances) == 0 {
		t.Fatalf("%v: %s", err, out)
	}
	r := doc.Resonances[0]
	if r.Drift == nil || !(r.Drift.PPMPerK < -20) || math.Abs(r.Drift.HzPerK-r.Drift.PPMPerK*1e-6*r.Drift.Frequency) > 1e-9*math.Abs(r.Drift.HzPerK) || math.Abs(r.Drift.Frequency/r.Frequency-1) > 0.01 {
		t.Fatalf("drift %+v: want below -20 ppm/K with hz_per_k = ppm_per_k·f", r.Drift)
	}
	if r.Drift.Shift == nil || math.Abs(r.Drift.Shift.Hz-20*r.Drift.HzPerK) > 0.02*math.Abs(20*r.Drift.HzPerK) {
		t.Errorf("shift %+v, want about 20 K × %.4g Hz/K", r.Drift.Shift, r.Drift.HzPerK)
	}
	c := r.Compensation
	if c == nil || c.Replaces != "Cfix" || len(c.Parts) == 0 {
		t.Fatalf("compensation %+v: want a split of Cfix", c)
	}
	if math.Abs(c.ResidualPPMPerK) > 5 || math.Abs(c.ResidualPPMPerK) > c.UncertaintyPPMPerK {
		t.Errorf("residual %.3g ± %.3g ppm/K: want under 5 and within the uncertainty", c.ResidualPPMPerK, c.UncertaintyPPMPerK)
	}
	tbl, errOut, code := runCLI(t, "circuit", file, "--compensate")
	if code != 0 || !strings.Contains(tbl, "TEMPERATURE DRIFT") || !strings.Contains(tbl, "COMPENSATION of Cfix") {
		t.Errorf("exit %d %s: table without drift or compensation:\n%s", code, errOut, tbl)
	}
	checkRefusal(t, []string{"circuit", file, "--temp-range", "hot"}, 2, "temp-range")
}
