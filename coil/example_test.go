package coil_test

import (
	"fmt"

	"turnwise/coil"
)

// A 5-turn VHF coil of 1 mm bare copper on a 6 mm mandrel, squeezed to
// 8 mm outside length, with 5 mm leads, at 145 MHz.
func ExamplePredict() {
	g := coil.Geometry{
		FormerDiameter: 6e-3,
		WireDiameter:   1e-3,
		Turns:          5,
		LeadLength:     5e-3,
	}
	pitch, err := coil.PitchForWindingLength(g.Turns, g.WireDiameter, 8e-3)
	if err != nil {
		fmt.Println(err)
		return
	}
	g.Pitch = pitch
	p, err := coil.Predict(g, 145e6)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("L at the terminals: %.3g nH\n", float64(p.Inductance)*1e9)
	fmt.Printf("SRF (one end grounded): %.3g MHz\n", float64(p.SRF)/1e6)
	fmt.Printf("Q: %.0f (%.0f … %.0f)\n", p.Q, p.QMin, p.QMax)
	// Output:
	// L at the terminals: 96.4 nH
	// SRF (one end grounded): 962 MHz
	// Q: 401 (281 … 441)
}

// The pitch a builder must set is checked before anything is computed.
func ExamplePredict_badPitch() {
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 0.8e-3}
	_, err := coil.Predict(g, 0)
	fmt.Println(err)
	// Output:
	// pitch: 0.8 mm is less than the wire's overall diameter 1 mm; use a pitch of at least 1 mm
}
