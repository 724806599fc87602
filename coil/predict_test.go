package coil

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"gonum.org/v1/gonum/unit"
)

// vhfExample is the coil from the README: 5 turns of 1 mm bare wire on a
// 6 mm mandrel, 8 mm long outside, 5 mm leads.
func vhfExample() Geometry {
	return Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Turns: 5, Pitch: 1.75e-3, LeadLength: 5e-3}
}

func TestValidate(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name      string
		edit      func(g *Geometry)
		wantParam string
	}{
		{"pitch below wire", func(g *Geometry) { g.Pitch = 0.9e-3 }, "pitch"},
		{"pitch below insulated wire", func(g *Geometry) { g.WireOverall = 1.1e-3; g.Pitch = 1.05e-3 }, "pitch"},
		{"negative former", func(g *Geometry) { g.FormerDiameter = -6e-3 }, "former_diameter"},
		{"former of metres", func(g *Geometry) { g.FormerDiameter = 3 }, "former_diameter"},
		{"zero turns", func(g *Geometry) { g.Turns = 0 }, "turns"},
		{"too many turns", func(g *Geometry) { g.Turns = 20000 }, "turns"},
		{"third of a turn", func(g *Geometry) { g.Turns = 5.33 }, "turns"},
		{"NaN turns", func(g *Geometry) { g.Turns = math.NaN() }, "turns"},
		{"zero wire", func(g *Geometry) { g.WireDiameter = 0 }, "wire_diameter"},
		{"insulation thinner than wire", func(g *Geometry) { g.WireOverall = 0.9e-3 }, "wire_overall_diameter"},
		{"negative lead", func(g *Geometry) { g.LeadLength = -1e-3 }, "lead_length"},
		{"springback huge", func(g *Geometry) { g.Springback = 2 }, "springback"},
		{"Inf pitch", func(g *Geometry) { g.Pitch = unit.Length(math.Inf(1)) }, "pitch"},
		{"cold", func(g *Geometry) { g.Temperature = 100 }, "temperature"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			g := vhfExample()
			tc.edit(&g)
			_, err := Predict(g, 145e6)
			var ie *InputError
			if !errors.As(err, &ie) || ie.Param != tc.wantParam {
				t.Fatalf("err = %v, want *InputError for %q", err, tc.wantParam)
			}
		})
	}
	if _, err := Predict(vhfExample(), unit.Frequency(math.NaN())); err == nil {
		t.Error("NaN frequency accepted")
	}
}

func TestPitchForWindingLength(t *testing.T) {
	t.Parallel()
	p, err := PitchForWindingLength(5, 1e-3, 8e-3)
	if err != nil || relErr(float64(p), 1.75e-3) > implTol {
		t.Fatalf("pitch = %v, %v; want 1.75 mm", p, err)
	}
	g := vhfExample()
	g.Pitch = p
	if relErr(float64(g.WindingLength()), 8e-3) > implTol {
		t.Errorf("round trip gives %v", g.WindingLength())
	}
	if _, err := PitchForWindingLength(5, 1e-3, 4e-3); err == nil {
		t.Error("length shorter than close-wound accepted")
	}
	if _, err := PitchForWindingLength(1, 1e-3, 4e-3); err == nil {
		t.Error("a single turn cannot take a length")
	}
}

// The README's VHF coil: every number finite, and the pieces add up.
func TestPredictVHFExample(t *testing.T) {
	t.Parallel()
	p, err := Predict(vhfExample(), 145e6)
	if err != nil {
		t.Fatal(err)
	}
	if !p.allFinite() {
		t.Fatalf("non-finite value in %+v", p)
	}
	sum := float64(p.InductanceCoilAtF + p.InductanceLeads)
	if relErr(float64(p.Inductance), sum) > implTol {
		t.Errorf("terminal L %g != coil %g + leads %g", float64(p.Inductance), float64(p.InductanceCoilAtF), float64(p.InductanceLeads))
	}
	// Skin effect removes most of the internal inductance at 145 MHz: the
	// drop is μ0·ℓ·(1−φ)/8π for ℓ the helix's wire, μ0·a·N·sec ψ·(1−φ)/4,
	// several percent of this short coil.
	drop := float64(p.InductanceCoil - p.InductanceCoilAtF)
	a := float64(p.MeanDiameter) / 2
	sec := float64(p.HelixWire) / (5 * math.Pi * 2 * a)
	if relErr(drop, Mu0*a*5*sec*(1-p.InternalFraction)/4) > implTol {
		t.Errorf("internal-inductance drop %g H", drop)
	}
	if frac := drop / float64(p.InductanceCoil); frac < 0.03 || frac > 0.10 {
		t.Errorf("VHF drop is %.1f %% of L, expected several percent", frac*100)
	}
	// Wheeler agrees with the current sheet within his 1 % here (l > 0.8a).
	if !p.WheelerValid || relErr(float64(p.InductanceWheeler), float64(p.InductanceSheet)) > 0.01 {
		t.Errorf("Wheeler %g vs sheet %g", float64(p.InductanceWheeler), float64(p.InductanceSheet))
	}
	// Q = ωL_eff/R_ac by construction.
	if relErr(p.Q, 2*math.Pi*145e6*float64(p.InductanceEffective)/float64(p.RAC)) > implTol {
		t.Error("Q is not ωL_eff/R_ac")
	}
	// p = 1.75 mm on D ≈ 7 mm is steep but inside the helix correction's
	// validated p ≤ D (TestInductanceHelixGrid): no warning.
	if p.Flags != 0 || len(p.Warnings()) != 0 {
		t.Errorf("warnings %v, want none", p.Warnings())
	}
}

// Rosa's correction changes sign with spacing: thin, widely spaced wire
// has more inductance than the current sheet, close-wound thick wire less
// (Grover 1946, ch. 16).
func TestRoundWireVsSheet(t *testing.T) {
	t.Parallel()
	thin := Geometry{FormerDiameter: 20e-3, WireDiameter: 0.2e-3, Turns: 10, Pitch: 2e-3}
	thick := Geometry{FormerDiameter: 20e-3, WireDiameter: 2e-3, Turns: 10, Pitch: 2e-3}
	pThin, err := Predict(thin, 0)
	if err != nil {
		t.Fatal(err)
	}
	pThick, err := Predict(thick, 0)
	if err != nil {
		t.Fatal(err)
	}
	if !(pThin.InductanceCoil > pThin.InductanceSheet) {
		t.Errorf("thin spaced wire: coil %g ≤ sheet %g", float64(pThin.InductanceCoil), float64(pThin.InductanceSheet))
	}
	if !(pThick.InductanceCoil < pThick.InductanceSheet) {
		t.Errorf("close-wound thick wire: coil %g ≥ sheet %g", float64(pThick.InductanceCoil), float64(pThick.InductanceSheet))
	}
}

func TestPredictProperties(t *testing.T) {
	t.Parallel()
	base := Geometry{FormerDiameter: 12e-3, WireDiameter: 0.8e-3, WireOverall: 0.85e-3, Turns: 8, Pitch: 1.2e-3, LeadLength: 10e-3}
	l := func(g Geometry, f unit.Frequency) float64 {
		p, err := Predict(g, f)
		if err != nil {
			t.Fatal(err)
		}
		return float64(p.Inductance)
	}
	// L rises with N at fixed pitch, in quarter turns.
	prev := 0.0
	for n := 1.0; n <= 40; n += 0.25 {
		g := base
		g.Turns = n
		if v := l(g, 0); v <= prev {
			t.Fatalf("L not rising with N at %g turns", n)
		} else {
			prev = v
		}
	}
	// L falls as the same turns are spread.
	prev = math.Inf(1)
	for p := 0.85e-3; p < 5e-3; p += 0.1e-3 {
		g := base
		g.Pitch = unit.Length(p)
		if v := l(g, 0); v >= prev {
			t.Fatalf("L not falling with pitch at %g m", p)
		} else {
			prev = v
		}
	}
	// Scaling every length by k scales the DC inductance by k.
	for _, k := range []float64{0.5, 3, 10} {
		g := base
		g.FormerDiameter *= unit.Length(k)
		g.WireDiameter *= unit.Length(k)
		g.WireOverall *= unit.Length(k)
		g.Pitch *= unit.Length(k)
		g.LeadLength *= unit.Length(k)
		if relErr(l(g, 0), k*l(base, 0)) > 1e-12 {
			t.Errorf("scale %g: L %g, want %g", k, l(g, 0), k*l(base, 0))
		}
	}
	// A long coil approaches μ0·N²·π·r²/ℓ.
	long := Geometry{FormerDiameter: 10e-3, WireDiameter: 0.3e-3, Turns: 3000, Pitch: 0.3e-3}
	pl, err := Predict(long, 0)
	if err != nil {
		t.Fatal(err)
	}
	a := float64(pl.MeanDiameter) / 2
	want := Mu0 * 3000 * 3000 * math.Pi * a * a / float64(pl.SheetLength)
	if relErr(float64(pl.InductanceSheet), want) > 0.005 {
		t.Errorf("long coil: %g vs %g", float64(pl.InductanceSheet), want)
	}
}

// Well below self-resonance, with the skin effect developed, R_ac ∝ √f and
// so Q ∝ √f (common practice; Terman 1943).
func TestQScalesWithRootF(t *testing.T) {
	t.Parallel()
	g := Geometry{FormerDiameter: 25e-3, WireDiameter: 1e-3, Turns: 10, Pitch: 2e-3}
	p1, err := Predict(g, 2e6)
	if err != nil {
		t.Fatal(err)
	}
	p4, err := Predict(g, 8e6)
	if err != nil {
		t.Fatal(err)
	}
	if r := p4.Q / p1.Q; math.Abs(r-2) > 0.15 {
		t.Errorf("Q(8 MHz)/Q(2 MHz) = %.3f, want about 2", r)
	}
	if !(p1.QMin < p1.Q && p1.Q < p1.QMax) {
		t.Error("Q band does not bracket Q")
	}
}

// DC resistance against the copper wire tables: 18 AWG (1.0237 mm) is
// 20.95 Ω/km at 20 °C (NBS Copper Wire Tables, Handbook 100, 1966, from
// memory; IACS resistivity), and 1.3144× that at 100 °C (α = 0.00393).
func TestDCResistance(t *testing.T) {
	t.Parallel()
	g := Geometry{FormerDiameter: 1, WireDiameter: 1.0237e-3, Turns: 1, Pitch: 2e-3}
	g.FormerDiameter = unit.Length(1/math.Pi - 1.0237e-3) // one turn ≈ 1 m of wire
	p, err := Predict(g, 0)
	if err != nil {
		t.Fatal(err)
	}
	perM := float64(p.RDC) / float64(p.HelixWire)
	if relErr(perM, 20.95e-3) > 0.001 {
		t.Errorf("18 AWG: %.5g Ω/m, want 0.02095", perM)
	}
	g.Temperature = 373.15
	p100, err := Predict(g, 0)
	if err != nil {
		t.Fatal(err)
	}
	if relErr(float64(p100.RDC)/float64(p.RDC), 1+0.00393*80) > implTol {
		t.Errorf("temperature coefficient: ratio %g", float64(p100.RDC)/float64(p.RDC))
	}
}

func TestNearSRF(t *testing.T) {
	t.Parallel()
	// A big coil at a frequency above a third of its SRF warns; above
	// 90 % of it, Predict refuses.
	g := Geometry{FormerDiameter: 50e-3, WireDiameter: 0.5e-3, Turns: 40, Pitch: 1e-3}
	p0, err := Predict(g, 0)
	if err != nil {
		t.Fatal(err)
	}
	srf := float64(p0.SRF)
	p, err := Predict(g, unit.Frequency(srf*0.5))
	if err != nil {
		t.Fatal(err)
	}
	if p.Flags&FlagNearSRF == 0 || len(p.Warnings()) == 0 {
		t.Error("no warning at SRF/2")
	}
	if !(p.InductanceEffective > p.Inductance) || !(p.Q > 0) {
		t.Error("effective inductance should exceed L below SRF, Q stay positive")
	}
	var ie *InputError
	if _, err := Predict(g, unit.Frequency(srf*0.95)); !errors.As(err, &ie) || ie.Param != "frequency" {
		t.Errorf("at 0.95·SRF: err = %v", err)
	}
}

func TestLeadInductance(t *testing.T) {
	t.Parallel()
	// For ℓ ≫ r: (μ0/2π)·ℓ·(ln(2ℓ/r) − 3/4) (Rosa 1908; Grover 1946 eq. 7).
	l, r := 0.1, 0.5e-3
	want := Mu0 / (2 * math.Pi) * l * (math.Log(2*l/r) - 0.75)
	if got := LeadInductance(l, r, 1); relErr(got, want) > 2*r/l {
		t.Errorf("lead: %g, want %g", got, want)
	}
	if LeadInductance(0, r, 1) != 0 {
		t.Error("zero-length lead has inductance")
	}
	// Short leads stay positive where the long-wire formula goes negative.
	if v := LeadInductance(0.3e-3, r, 0); !(v > 0) {
		t.Errorf("short lead: %g", v)
	}
}

// No input inside the accepted ranges yields a non-finite number.
func TestPredictAlwaysFinite(t *testing.T) {
	t.Parallel()
	rng := rand.New(rand.NewPCG(1, 2))
	logU := func(lo, hi float64) float64 { return lo * math.Pow(hi/lo, rng.Float64()) }
	for i := range 20000 {
		d := logU(MinWireDiameter, 5e-3)
		do := d * (1 + 0.2*rng.Float64())
		g := Geometry{
			FormerDiameter: unit.Length(logU(MinFormerDiameter, 0.5)),
			WireDiameter:   unit.Length(d),
			WireOverall:    unit.Length(do),
			Turns:          math.Round(logU(1, 3000)*4) / 4,
			Pitch:          unit.Length(do * logU(1, 10)),
			LeadLength:     unit.Length(logU(1e-4, 0.3)),
			Springback:     0.1 * rng.Float64(),
			Conductor:      Conductor(rng.IntN(3)),
		}
		if g.Pitch > MaxPitch {
			g.Pitch = MaxPitch
		}
		f := unit.Frequency(logU(1e3, 3e9))
		p, err := Predict(g, f)
		if err != nil {
			var ie *InputError
			if !errors.As(err, &ie) {
				t.Fatalf("case %d: unexpected error type %v", i, err)
			}
			continue
		}
		if !p.allFinite() || p.Inductance <= 0 || p.Q <= 0 {
			t.Fatalf("case %d: %+v", i, p)
		}
	}
}

// Squeezing by LengthPerPercent raises L by about 1 % (the definition,
// checked by re-evaluating the model).
func TestLengthPerPercent(t *testing.T) {
	t.Parallel()
	g := vhfExample()
	dl, err := LengthPerPercent(g, 145e6)
	if err != nil || dl <= 0 {
		t.Fatalf("LengthPerPercent = %v, %v", dl, err)
	}
	p0, _ := Predict(g, 145e6)
	g2 := g
	g2.Pitch -= unit.Length(float64(dl) / (g.Turns - 1))
	p1, err := Predict(g2, 145e6)
	if err != nil {
		t.Fatal(err)
	}
	if r := float64(p1.Inductance)/float64(p0.Inductance) - 1; math.Abs(r-0.01) > 0.0005 {
		t.Errorf("squeezing %.3g mm changed L by %.3f %%, want about 1 %%", float64(dl)*1e3, r*100)
	}
}

// The trim window brackets the coil as wound, and squeezing raises L.
func TestWindow(t *testing.T) {
	t.Parallel()
	g := vhfExample()
	least, most, err := Window(g, 145e6)
	if err != nil {
		t.Fatal(err)
	}
	p, _ := Predict(g, 145e6)
	if !(least < p.Inductance && p.Inductance < most) {
		t.Errorf("window %g … %g does not bracket %g", float64(least), float64(most), float64(p.Inductance))
	}
}
