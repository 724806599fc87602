package spec

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"turnwise/forms"
)

// One coil, three routes: the design command's candidate (FromCandidate
// over the search's rows), the sheet's job coil with the same target
// (DesignJobCoil), and the same winding written out as a fixed coil, as
// trim --job and predict resolve it (Resolve). All three must describe it
// alike: geometry, support, wire row and conductor, springback source and
// a close-wound pitch. Before one builder they disagreed on the
// springback source word, the conductor of the wire row and close-wound.
func TestOneBuilder(t *testing.T) {
	cat, err := forms.BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	// A demo target of our own (testdata/club-night.toml's L2, without the stray).
	job, err := forms.LoadJob(strings.NewReader(`title = "t"
[[coil]]
name = "L2"
cap = "15pF"
freq = "137.5MHz"
leads = "4mm"
support = "mandrel"
wire = "1.00mm silver-plated"
max-length = "14mm"
`), "t.toml")
	if err != nil {
		t.Fatal(err)
	}
	jc := &job.Coils[0]
	viaSheet, cand, _, err := DesignJobCoil(job, jc, cat)
	if err != nil {
		t.Fatal(err)
	}
	o := &SearchOptions{Capacitance: 15e-12, Freq: 137.5e6, Leads: 4e-3, Support: "mandrel",
		Wires: []string{"1.00mm silver-plated"}, MaxLength: 14e-3, Top: 1}
	res, err := Search(cat, o)
	if err != nil {
		t.Fatal(err)
	}
	viaDesign := FromCandidate(WireRows(cat, o), res.Candidates[0])

	g := cand.Prediction.Geometry
	text := fmt.Sprintf("title = \"t\"\n[[coil]]\nname = \"L2\"\nmandrel = %q\nwire = %q\nturns = %g\nleads = \"4mm\"\nfreq = \"137.5MHz\"\n",
		cand.Support.Name, cand.Wire.Name, g.Turns)
	if !closeWound(g) {
		text += fmt.Sprintf("pitch = \"%.17gmm\"\n", float64(g.Pitch)*1e3)
	}
	fixed, err := forms.LoadJob(strings.NewReader(text), "fixed.toml")
	if err != nil {
		t.Fatal(err)
	}
	viaTrim, err := ResolveJobCoil(fixed, &fixed.Coils[0], cat)
	if err != nil {
		t.Fatal(err)
	}

	for _, tc := range []struct {
		name string
		got  Spec
	}{{"design", viaDesign}, {"trim", viaTrim}} {
		t.Run(tc.name, func(t *testing.T) {
			a, b := viaSheet, tc.got
			if a.SupportKind != b.SupportKind || a.SupportName != b.SupportName || a.SpringbackSource != b.SpringbackSource ||
				a.PitchSource != b.PitchSource || a.Wire.Name != b.Wire.Name || a.Wire.Conductor != b.Wire.Conductor ||
				a.Wire.Insulation != b.Wire.Insulation || a.Geometry.Conductor != b.Geometry.Conductor {
				t.Errorf("sheet %+v\n%s %+v", a, tc.name, b)
			}
			ga, gb := a.Geometry, b.Geometry
			for _, q := range []struct {
				name string
				x, y float64
			}{
				{"former", float64(ga.FormerDiameter), float64(gb.FormerDiameter)},
				{"wire", float64(ga.WireDiameter), float64(gb.WireDiameter)},
				{"overall", float64(ga.OverallDiameter()), float64(gb.OverallDiameter())},
				{"turns", ga.Turns, gb.Turns},
				{"pitch", float64(ga.Pitch), float64(gb.Pitch)},
				{"leads", float64(ga.LeadLength), float64(gb.LeadLength)},
				{"springback", ga.Springback, gb.Springback},
			} {
				if math.Abs(q.x-q.y) > 1e-12*math.Max(math.Abs(q.x), 1e-9) {
					t.Errorf("%s: sheet %g, %s %g", q.name, q.x, tc.name, q.y)
				}
			}
		})
	}
	if viaSheet.SpringbackSource != "none" {
		t.Errorf("springback source %q: a mandrel with no calibration is \"none\" on every route", viaSheet.SpringbackSource)
	}
}
