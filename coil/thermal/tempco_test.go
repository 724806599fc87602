package thermal

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
)

func rel(got, want float64) float64 {
	if want == 0 {
		return math.Abs(got)
	}
	return math.Abs(got/want - 1)
}

// Our own demo coils: a 10-turn coil of 1 mm wire on a 20 mm PVC former
// (or the same coil slid off a 20 mm mandrel), leads 10 mm.
func demoCoil() coil.Geometry {
	return coil.Geometry{FormerDiameter: 20e-3, WireDiameter: 1e-3, WireOverall: 1.05e-3,
		Turns: 10, Pitch: 2e-3, LeadLength: 10e-3}
}

const pvc = 70e-6 // rigid PVC, forms/data/materials.csv (plastics handbook class value, from memory)

// A coil whose every dimension scales by (1+αΔT) has its low-frequency
// inductance scaled by the same factor (L is homogeneous of degree one in
// length: dimensional analysis), so the self-supporting coil's coefficient
// is copper's exactly.
func TestSelfSupportingIsCopper(t *testing.T) {
	t.Parallel()
	geoms := map[string]coil.Geometry{
		"demo":        demoCoil(),
		"close-wound": {FormerDiameter: 6e-3, WireDiameter: 0.5e-3, Turns: 25, Pitch: 0.5e-3},
		"one turn":    {FormerDiameter: 30e-3, WireDiameter: 2e-3, Turns: 1, Pitch: 3e-3, LeadLength: 20e-3},
		"springback":  {FormerDiameter: 8e-3, Springback: 0.04, WireDiameter: 1.2e-3, Turns: 6.25, Pitch: 2.5e-3, Temperature: 330},
	}
	for name, g := range geoms {
		t.Run(name, func(t *testing.T) {
			for _, f := range []float64{0, 14e6} {
				c, err := Tempco(g, unit.Frequency(f), Support{SelfSupporting: true})
				if err != nil {
					t.Fatal(err)
				}
				if e := rel(c.LowFrequency, CopperExpansion); e > 1e-9 { // dimensional analysis: exact
					t.Errorf("f=%g: tempco_low_frequency %.12g, want copper %.12g (rel %.2g)", f, c.LowFrequency, CopperExpansion, e)
				}
				if f == 0 && rel(c.Inductance, CopperExpansion) > 1e-9 { // leads scale too: exact at DC
					t.Errorf("DC terminal tempco %.12g, want %.12g", c.Inductance, CopperExpansion)
				}
			}
		})
	}
}

// On a former that expands more than copper the coil's coefficient is
// larger than copper's and smaller than the former's (the wire's own
// diameter and the Rosa correction follow copper).
func TestFormerRaisesTempco(t *testing.T) {
	t.Parallel()
	g := demoCoil()
	self, err := Tempco(g, 0, Support{SelfSupporting: true})
	if err != nil {
		t.Fatal(err)
	}
	for _, pf := range []PitchFollows{PitchFollowsFormer, PitchFollowsWire} {
		t.Run(pf.String(), func(t *testing.T) {
			on, err := Tempco(g, 0, Support{Former: pvc, FormerLow: 50e-6, FormerHigh: 80e-6, Pitch: pf})
			if err != nil {
				t.Fatal(err)
			}
			if !(on.LowFrequency > self.LowFrequency && on.LowFrequency < pvc*1.5) {
				t.Errorf("on PVC %.4g /K, self-supporting %.4g /K", on.LowFrequency, self.LowFrequency)
			}
			if !(on.Spread > 0) {
				t.Errorf("no spread from the PVC class range")
			}
			t.Logf("pitch follows %s: PVC %.2f ppm/K ± %.2f, copper %.2f ppm/K", pf, on.LowFrequency*1e6, on.Spread*1e6, self.LowFrequency*1e6)
		})
	}
}

// Independent route for the former case: by Euler's theorem on a function
// homogeneous of degree one, L's log-derivatives in its lengths sum to 1,
// and the temperature coefficient is their sum weighted by each length's
// own coefficient. Each log-derivative here is a separate difference of
// the model in that length alone.
func TestTempcoIsWeightedSumOfExponents(t *testing.T) {
	t.Parallel()
	g := demoCoil()
	lf := func(g coil.Geometry) float64 {
		var p coil.Prediction
		coil.Evaluate(&p, &g, 0)
		return float64(p.InductanceCoil)
	}
	const h = 1e-5
	expo := func(set func(g *coil.Geometry, k float64)) float64 {
		a, b := g, g
		set(&a, 1-h)
		set(&b, 1+h)
		return (math.Log(lf(b)) - math.Log(lf(a))) / (2 * h)
	}
	eBore := expo(func(x *coil.Geometry, k float64) { x.FormerDiameter *= unit.Length(k) })
	eWire := expo(func(x *coil.Geometry, k float64) {
		x.WireDiameter *= unit.Length(k)
		x.WireOverall *= unit.Length(k)
	})
	ePitch := expo(func(x *coil.Geometry, k float64) { x.Pitch *= unit.Length(k) })
	if s := eBore + eWire + ePitch; math.Abs(s-1) > 1e-7 { // Euler: degree one
		t.Errorf("exponents sum to %.10g, want 1", s)
	}
	for _, pf := range []PitchFollows{PitchFollowsFormer, PitchFollowsWire} {
		ap := pvc
		if pf == PitchFollowsWire {
			ap = CopperExpansion
		}
		want := eBore*pvc + eWire*CopperExpansion + ePitch*ap
		c, err := Tempco(g, 0, Support{Former: pvc, Pitch: pf})
		if err != nil {
			t.Fatal(err)
		}
		if rel(c.LowFrequency, want) > 1e-5 {
			t.Errorf("%s: tempco %.8g, weighted exponents %.8g", pf, c.LowFrequency, want)
		}
	}
}

// At f the internal inductance left in the wire is φ·μ0/(8π) per metre,
// φ ≈ 2/x − 3/(8x³) for x = r/δ large (Hankel asymptotics), and δ ∝ √ρ,
// ρ rising 0.00393/K (IACS). The skin term from the model's difference is
// checked against this analytic derivative.
func TestSkinTermAnalytic(t *testing.T) {
	t.Parallel()
	g := demoCoil()
	for _, f := range []float64{3.5e6, 14e6, 50e6} {
		c, err := Tempco(g, unit.Frequency(f), Support{SelfSupporting: true})
		if err != nil {
			t.Fatal(err)
		}
		p, err := coil.Predict(g, unit.Frequency(f))
		if err != nil {
			t.Fatal(err)
		}
		r := float64(g.WireDiameter) / 2
		rho := coil.CopperResistivity(0)
		x := r / coil.SkinDepth(rho, f)
		dphidx := -2/(x*x) + 9/(8*x*x*x*x)
		alphaRho := coil.CopperTempCoeff // at 20 °C, IACS
		dxdT := -x / 2 * alphaRho
		a := float64(p.MeanDiameter) / 2
		dLdphi := coil.Mu0*a*g.Turns/4 + 2*coil.Mu0*float64(g.LeadLength)/(8*math.Pi)
		want := dLdphi * dphidx * dxdT / float64(p.Inductance)
		if rel(c.Skin, want) > 1e-3 { // asymptotic series error at x ≥ 15 is below 1e-3
			t.Errorf("f=%g: skin term %.6g /K, analytic %.6g /K", f, c.Skin, want)
		}
		// The rest of the terminal coefficient is geometry: copper's, plus
		// the wire's radius growing against a fixed δ (x ∝ r: dx/dT = x·α_Cu).
		geom := CopperExpansion + dLdphi*dphidx*x*CopperExpansion/float64(p.Inductance)
		if rel(c.Inductance-c.Skin, geom) > 1e-4 {
			t.Errorf("f=%g: terminal %.8g − skin %.8g is not the geometric %.8g", f, c.Inductance, c.Skin, geom)
		}
		t.Logf("f=%.3g MHz: x=%.1f tempco %.3f ppm/K of which skin %.3f ppm/K; tempco_q %.0f ppm/K", f/1e6, x, c.Inductance*1e6, c.Skin*1e6, c.Q*1e6)
	}
}

// Q falls as copper's resistance rises: R_ac ∝ √ρ once the skin effect
// is developed, so d ln Q/dT ≈ −½·0.00393/K (IACS) plus small geometric
// terms.
func TestTempcoQ(t *testing.T) {
	t.Parallel()
	c, err := Tempco(demoCoil(), 14e6, Support{SelfSupporting: true})
	if err != nil {
		t.Fatal(err)
	}
	if want := -0.5 * coil.CopperTempCoeff; rel(c.Q, want) > 0.05 {
		t.Errorf("tempco_q %.4g /K, want about %.4g /K", c.Q, want)
	}
	if want := 0.5 * coil.CopperTempCoeff; rel(c.Resistance, want) > 0.05 {
		t.Errorf("resistance tempco %.4g /K, want about %.4g /K", c.Resistance, want)
	}
}

func TestTempcoRefuses(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name string
		g    coil.Geometry
		f    float64
		s    Support
	}{
		{"bad geometry", coil.Geometry{}, 0, Support{}},
		{"above SRF", demoCoil(), 5e9, Support{}},
		{"absurd former", demoCoil(), 0, Support{Former: 0.5}},
		{"NaN", demoCoil(), 0, Support{Former: math.NaN()}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Tempco(tc.g, unit.Frequency(tc.f), tc.s)
			var ie *coil.InputError
			if err == nil || !asInput(err, &ie) {
				t.Errorf("err %v, want a *coil.InputError", err)
			}
		})
	}
	if _, err := ParsePitchFollows("glue"); err == nil {
		t.Error("pitch follows glue: no error")
	}
}
