package main

import (
	"encoding/json"
	"math"
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
