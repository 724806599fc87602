package match

import (
	"context"
	"math"
	"testing"

	"turnwise/coil/circuit"
)

// A tapped coil's stress rows: each section's dissipation is its own
// I²R, never negative (the mutual inductance moves power between the
// sections, so ½·Re(V·I*) across one section is not its loss), the two
// sections add up to the whole coil, and the whole coil's dissipation at
// the stated power equals the circuit solver's loss of the wound coil
// (State.PartLoss on the unlumped network) scaled by P over the power
// the solver's state delivers (the sum of every part's loss, energy
// conservation).
func TestSectionStressIsI2R(t *testing.T) {
	const f, power = 7.1e6, 100.0
	s := tappedCoupler(8)
	res, err := Map(context.Background(), s, Options{Frequencies: []float64{f}, Power: power})
	if err != nil {
		t.Fatal(err)
	}
	checked := 0
	for _, pt := range res.Frequencies[0].Points {
		if !pt.Matched {
			continue
		}
		t.Run(loadString(pt.LoadR, pt.LoadX), func(t *testing.T) {
			by := map[string]PartStress{}
			for _, st := range pt.Stress {
				by[st.Part] = st
			}
			whole, top, bot := by["L1"], by["L1 top"], by["L1 bottom"]
			if top.Dissipation < 0 || bot.Dissipation < 0 {
				t.Fatalf("negative section dissipation: top %g W, bottom %g W", top.Dissipation, bot.Dissipation)
			}
			if relErr(top.Dissipation+bot.Dissipation, whole.Dissipation) > implTol { // sum of the sections
				t.Errorf("sections %g + %g W, whole %g W", top.Dissipation, bot.Dissipation, whole.Dissipation)
			}
			// Independent route: the circuit solver on the wound coil.
			net := s.Network
			net.Parts = append([]circuit.Part(nil), net.Parts...)
			for _, st := range pt.Settings {
				for i := range net.Parts {
					if net.Parts[i].Name == st.Part {
						net.Parts[i].Value = st.Capacitance
					}
				}
			}
			net.Parts = append(net.Parts, circuit.Part{Name: "zl", Kind: circuit.Impedance, A: 3, B: 0, Z: complex(pt.LoadR, pt.LoadX), TapNode: -1})
			sv, err := circuit.NewSolver(&net)
			if err != nil {
				t.Fatal(err)
			}
			state, err := sv.Drive(f, 1)
			if err != nil {
				t.Fatal(err)
			}
			pin := 0.0
			for i := range net.Parts {
				pin += state.PartLoss(i)
			}
			want := state.PartLoss(1) * power / pin
			if relErr(whole.Dissipation, want) > 1e-6 { // lumped copy against the wound coil (TestFastMatchesSolver's tolerance class)
				t.Errorf("L1 dissipates %g W, circuit solver %g W", whole.Dissipation, want)
			}
			if math.IsNaN(whole.VPeak) || whole.VPeak <= 0 {
				t.Errorf("L1 peak voltage %g", whole.VPeak)
			}
		})
		checked++
	}
	if checked == 0 {
		t.Fatal("no matched point to check")
	}
}
