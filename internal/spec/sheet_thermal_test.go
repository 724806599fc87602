package spec

import (
	"math"
	"strings"
	"testing"

	"turnwise/coil/thermal"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

const thermalJob = `title = "drift check"
temp-range = "10C-40C"

[[coil]]
name = "T1"
cap = "100pF"
freq = "7MHz"
leads = "10mm"
former = "pvc 20mm"
wire = "0.5mm"
cap-tempco = "N150"

[[coil]]
name = "T2"
former = "pvc 20mm"
wire = "0.5mm"
turns = 10
pitch = "1mm"
leads = "10mm"
`

// The coil page's thermal data: the tempco of the coil and, for a coil
// whose job names its capacitor, the tank's drift −½(τ_L + τ_C) with the
// cap-tempco class (N150: −150 ppm/K, IEC 60384-8 from memory) over the
// job's temp-range; a fixed winding without a capacitor gets the tempco
// only; a bad cap-tempco is refused at its line.
func TestSheetThermal(t *testing.T) {
	t.Parallel()
	job, err := forms.LoadJob(strings.NewReader(thermalJob), "drift.toml")
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(float64(job.TempLow)-283.15) > 1e-9 || math.Abs(float64(job.TempHigh)-313.15) > 1e-9 {
		t.Fatalf("temp-range %v … %v, want 283.15 … 313.15 K", job.TempLow, job.TempHigh)
	}
	cat, err := forms.BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	c, _, err := JobSheetCoil(job, &job.Coils[0], cat, quantity.LengthFormat{})
	if err != nil {
		t.Fatal(err)
	}
	th := c.Thermal
	if th == nil || th.Tank == nil {
		t.Fatalf("thermal %+v: want a tank drift", th)
	}
	s, _, _, err := DesignJobCoil(job, &job.Coils[0], cat)
	if err != nil {
		t.Fatal(err)
	}
	k, ok, _ := Tempco(cat, s, c.Prediction.Frequency, thermal.PitchFollowsFormer)
	if !ok {
		t.Fatal("no tempco for a PVC former")
	}
	want := -0.5 * (k.Effective - 150e-6)
	if math.Abs(th.Tank.PerK-want) > 1e-12 || th.Tank.Class != "N150" {
		t.Errorf("tank %+v: want %s at %.4g ppm/K", th.Tank, "N150", want*1e6)
	}
	if lin := th.Tank.PerK * 30 * float64(th.Tank.Frequency); math.Abs(th.Tank.ShiftHz-lin) > 0.01*math.Abs(lin) {
		t.Errorf("shift %.1f Hz over 30 K, want about %.1f", th.Tank.ShiftHz, lin)
	}
	c2, _, err := JobSheetCoil(job, &job.Coils[1], cat, quantity.LengthFormat{})
	if err != nil || c2.Thermal == nil || c2.Thermal.Tank != nil || !(c2.Thermal.Tempco > 30e-6) {
		t.Errorf("fixed coil on PVC: %v, %+v: want a tempco above 30 ppm/K and no tank", err, c2.Thermal)
	}
	bad := strings.Replace(thermalJob, `cap-tempco = "N150"`, `cap-tempco = "hot"`, 1)
	if _, err := forms.LoadJob(strings.NewReader(bad), "bad.toml"); err == nil || !strings.Contains(err.Error(), "cap-tempco") || !strings.Contains(err.Error(), "line 11") {
		t.Errorf("bad cap-tempco: %v", err)
	}
}
