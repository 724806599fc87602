package trim_test

import (
	"fmt"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/trim"
)

// A coil meant to be 101.5 nH (the model's value for 5 turns of 1 mm wire
// on a 6 mm mandrel, 8 mm long, 5 mm leads) reads 106 nH on a meter: the
// wire sprang open off the mandrel. Calibrate finds by how much; Correct
// says how far to spread it.
func ExampleCalibrate() {
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 1.75e-3, LeadLength: 5e-3}
	m := trim.Measurement{Kind: trim.MeasureDirect, Inductance: 106e-9, MeterTolerance: 0.02}
	cal, err := trim.Calibrate(g, m)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("springback %.3g %% (%.3g … %.3g %%), wire-centre diameter %.3g mm\n",
		cal.Springback*100, cal.SpringbackLow*100, cal.SpringbackHigh*100, float64(cal.EffectiveDiameter)*1e3)

	c, err := trim.Correct(cal.Geometry, trim.Target{Inductance: 101.5e-9},
		trim.CorrectOptions{Tolerance: 0.005, LengthSteps: []unit.Length{0.1e-3}})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s from %.1f mm to %.1f mm: %.4g nH\n", c.Action, float64(c.LengthBefore)*1e3, float64(c.LengthAfter)*1e3, float64(c.After)*1e9)
	// Output:
	// springback 2.53 % (1.08 … 3.96 %), wire-centre diameter 7.15 mm
	// spread from 8.0 mm to 8.7 mm: 101.2 nH
}

// The two-capacitor method: two resonances give L and the capacitance
// already across the coil.
func ExampleMeasurement_Reduce() {
	m := trim.Measurement{
		Kind:               trim.MeasureTwoCapacitor,
		Resonances:         []trim.Resonance{{Frequency: 10e6, Capacitance: 100e-12}, {Frequency: 5.2e6, Capacitance: 400e-12}},
		CapacitorTolerance: 0.01,
		FrequencyTolerance: 0.001,
	}
	r, err := m.Reduce()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("L = %.4g µH ± %.2g %%, C0 = %.3g pF ± %.2g pF\n", float64(r.Inductance)*1e6, r.Uncertainty*100,
		float64(r.TotalStray)*1e12, float64(r.TotalStrayUncertainty)*1e12)
	// Output:
	// L = 2.278 µH ± 1.4 %, C0 = 11.2 pF ± 2.1 pF
}
