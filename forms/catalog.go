package forms

import (
	"slices"

	"gonum.org/v1/gonum/unit"
)

// OriginBuiltIn is the Origin of rows that ship with turnwise.
const OriginBuiltIn = "built-in"

// Wire is one winding wire.
//
// Built-in rule: every AWG, SWG and metric size appears once, as copper of the
// bare size, with Insulation "grade1" and Overall from the enamel table where
// the table covers the size (0.05 mm to 3.15 mm), else Insulation "none" and
// Overall equal to Bare. A few bare tinned and silver-plated sizes used for
// VHF coils are listed by name ("1.00mm silver-plated"). A different build is
// chosen per use with ParseInsulation, or per spool in the stock file.
type Wire struct {
	Name       string      // lookup key: "22awg", "18swg", "1.00mm", or the user's own name
	System     string      // "awg", "swg", "metric", "user"
	Bare       unit.Length // conductor diameter
	Overall    unit.Length // diameter over the insulation; equals Bare for bare wire, never less
	Insulation string      // "none", "grade1", "grade2", "grade3" (IEC 60317 enamel grades), or "custom"
	Conductor  string      // "copper", "tinned", "silver-plated"
	Source     string      // where the numbers come from
	Origin     string      // OriginBuiltIn or the stock file name
}

// Mandrel is a rod the coil is wound on and then slid off, so it springs open.
// The coil it leaves is self-supporting: its Material is MaterialNone.
type Mandrel struct {
	Name     string
	Diameter unit.Length
	Kind     string // "metric drill", "inch drill", "user", ...
	Source   string
	Origin   string
	Material string // MaterialNone: the coil comes off it
}

// Former is a tube the coil is wound on and left on.
type Former struct {
	Name     string
	Diameter unit.Length // outside diameter
	Kind     string      // "PVC sch 40", "PVC EN 1452", "user"
	Source   string
	Origin   string

	// Material is a row of the materials table ("rigid pvc"), or "user"
	// when a stock file gives the coefficient alone. Expansion is its
	// linear expansion coefficient per kelvin, ExpansionLow and
	// ExpansionHigh the class's spread, and ExpansionSource where they
	// come from. A coil wound tight on the former follows it.
	Material        string
	Expansion       float64
	ExpansionLow    float64
	ExpansionHigh   float64
	ExpansionSource string
}

// MaterialNone is the material of a self-supporting coil (wound on a
// mandrel and slid off): it follows the wire's own expansion.
const MaterialNone = "none"

// Material is one row of the materials table: a linear expansion
// coefficient per kelvin near room temperature, with its class spread.
type Material struct {
	Name      string
	Expansion float64 // per kelvin: 70e-6 for 70 ppm/K
	Low, High float64 // the class's spread, per kelvin
	Source    string
	Origin    string
}

// Calibration is a measured springback for one mandrel (or former) and wire.
type Calibration struct {
	Mandrel    string  // mandrel or former name, as in the catalog
	Wire       string  // wire name, as in the catalog
	Springback float64 // fraction: the coil's wire-centre diameter is D_f·(1+s) + d_o
	Note       string  // free text, e.g. "trim 2026-12-01: measured 52 nH"
	Line       int     // line in the stock file, 0 for built-in
	Origin     string  // the stock file name
}

// Catalog holds the wires, mandrels, formers and calibrations one can wind with.
type Catalog struct {
	Wires        []Wire
	Mandrels     []Mandrel
	Formers      []Former
	Calibrations []Calibration
	Materials    []Material
}

// conductors are the Conductor values, with the spellings accepted for each.
var conductors = map[string]string{
	"copper":        "copper",
	"tinned":        "tinned",
	"tinned copper": "tinned",
	"silver-plated": "silver-plated",
	"silver plated": "silver-plated",
	"silver":        "silver-plated",
}

// BuiltIn returns the catalog that ships with turnwise, parsed once from the
// embedded data files. Each call returns a fresh copy, so callers may modify
// it without affecting other callers. The error is non-nil only if the
// embedded data is broken, which the package tests rule out.
func BuiltIn() (*Catalog, error) {
	d := loadBuiltin()
	if d.err != nil {
		return nil, d.err
	}
	return d.cat.clone(), nil
}

func (c *Catalog) clone() *Catalog {
	return &Catalog{
		Wires:        slices.Clone(c.Wires),
		Mandrels:     slices.Clone(c.Mandrels),
		Formers:      slices.Clone(c.Formers),
		Calibrations: slices.Clone(c.Calibrations),
		Materials:    slices.Clone(c.Materials),
	}
}

// Merge combines catalogs. A row of a later catalog replaces, in place, the
// row of an earlier one with the same name (case and spacing ignored), so
// Merge(builtIn, stock) lets the user's stock override the built-in rows.
// Rows are otherwise kept in order; calibrations are all kept, later ones
// after earlier ones. Nil catalogs are skipped. The inputs are not modified.
func Merge(cs ...*Catalog) *Catalog {
	out := &Catalog{}
	wires := map[string]int{}
	mandrels := map[string]int{}
	formers := map[string]int{}
	materials := map[string]int{}
	for _, c := range cs {
		if c == nil {
			continue
		}
		for _, w := range c.Wires {
			out.Wires = mergeRow(out.Wires, wires, w.Name, w)
		}
		for _, m := range c.Mandrels {
			out.Mandrels = mergeRow(out.Mandrels, mandrels, m.Name, m)
		}
		for _, f := range c.Formers {
			out.Formers = mergeRow(out.Formers, formers, f.Name, f)
		}
		for _, m := range c.Materials {
			out.Materials = mergeRow(out.Materials, materials, m.Name, m)
		}
		out.Calibrations = append(out.Calibrations, c.Calibrations...)
	}
	return out
}

func mergeRow[T any](rows []T, index map[string]int, name string, row T) []T {
	k := nameKey(name)
	if i, ok := index[k]; ok {
		rows[i] = row
		return rows
	}
	index[k] = len(rows)
	return append(rows, row)
}
