package forms

import (
	"math"
	"strings"
	"testing"
)

// Every coefficient in the catalogs names its source, and every built-in
// former has a material of the table.
func TestMaterialsEachHaveASource(t *testing.T) {
	t.Parallel()
	c, err := BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	if len(c.Materials) < 9 {
		t.Fatalf("%d materials, want the issue's classes (PVC, ABS, PTFE, polystyrene, polyethylene, glass-epoxy, steatite, glass) and copper", len(c.Materials))
	}
	for _, m := range c.Materials {
		if strings.TrimSpace(m.Source) == "" {
			t.Errorf("material %q has no source", m.Name)
		}
		if !(m.Low <= m.Expansion && m.Expansion <= m.High) {
			t.Errorf("material %q: %g not within %g..%g", m.Name, m.Expansion, m.Low, m.High)
		}
	}
	for _, f := range c.Formers {
		if f.Material == "" || f.ExpansionSource == "" || f.Expansion <= 0 {
			t.Errorf("former %q: material %q expansion %g source %q", f.Name, f.Material, f.Expansion, f.ExpansionSource)
		}
	}
	for _, m := range c.Mandrels {
		if m.Material != MaterialNone {
			t.Errorf("mandrel %q: material %q, want %q (self-supporting)", m.Name, m.Material, MaterialNone)
		}
	}
}

func TestMaterialValues(t *testing.T) {
	t.Parallel()
	c, err := BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name      string
		want, tol float64
	}{
		{"copper", 16.5e-6, 0.5e-6},           // CRC Handbook, Cu 16.5e-6/K at 25 C (from memory)
		{"borosilicate glass", 3.3e-6, 1e-12}, // ISO 3585: glass 3.3 is 3.3e-6/K by definition
		{"rigid pvc", 65e-6, 15e-6},           // uPVC 50-80e-6/K, plastics handbook tables (from memory)
		{"ptfe", 130e-6, 30e-6},               // PTFE 100-160e-6/K (from memory)
		{"steatite", 7.5e-6, 1.5e-6},          // IEC 60672-3 C 221 (from memory)
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			m, err := c.Material(tc.name)
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(m.Expansion-tc.want) > tc.tol {
				t.Errorf("%s: %g, want %g ± %g", tc.name, m.Expansion, tc.want, tc.tol)
			}
		})
	}
	pvc, err := c.Former("pvc 20mm")
	if err != nil {
		t.Fatal(err)
	}
	if pvc.Material != "rigid pvc" {
		t.Errorf("pvc 20mm: material %q", pvc.Material)
	}
	if _, err := c.Material("unobtainium"); err == nil {
		t.Error("unknown material: no error")
	}
}

func TestStockFormerMaterial(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name, toml string
		material   string
		expansion  float64
		errPart    string
	}{
		{"material", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\nmaterial = \"PTFE\"\n", "ptfe", 120e-6, ""},
		{"coefficient", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\nexpansion = \"55ppm/K\"\n", "user", 55e-6, ""},
		{"both: coefficient wins", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\nmaterial = \"abs\"\nexpansion = \"80ppm/K\"\n", "abs", 80e-6, ""},
		{"neither", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\n", "", 0, ""},
		{"unknown material", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\nmaterial = \"wood\"\n", "", 0, "not a known material"},
		{"bare number", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\nexpansion = \"70\"\n", "", 0, "ppm/K"},
		{"absurd", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\nexpansion = \"7000ppm/K\"\n", "", 0, "outside"},
		{"not text", "[[former]]\nname = \"t\"\ndiameter = \"10mm\"\nexpansion = 70\n", "", 0, "quotes"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			c, err := LoadStock(strings.NewReader(tc.toml), "s.toml")
			if tc.errPart != "" {
				if err == nil || !strings.Contains(err.Error(), tc.errPart) {
					t.Fatalf("err %v, want one containing %q", err, tc.errPart)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			f := c.Formers[0]
			if f.Material != tc.material || math.Abs(f.Expansion-tc.expansion) > 1e-12 {
				t.Errorf("material %q expansion %g, want %q %g", f.Material, f.Expansion, tc.material, tc.expansion)
			}
		})
	}
}
