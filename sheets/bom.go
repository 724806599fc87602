package sheets

import (
	"fmt"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"turnwise/coil"
)

// The bill of materials: batch totals of what the coil pages ask for.

// formerMargin is the former length left at each end of a winding (common
// practice: room to fix the ends and to handle it).
const formerMargin = 10e-3 // m

// wireLine is one kind of wire and what the batch needs of it.
type wireLine struct {
	key, desc string
	uses      []string // "L1 × 3"
	total     float64  // m: the cut lengths as printed on the coil pages × quantities
}

// supportLine is one mandrel or former.
type supportLine struct {
	kind     coil.SupportKind
	name     string
	diameter float64 // m
	uses     []string
	count    int     // coils wound on it
	longest  float64 // m, the longest winding on it
}

// nameW is the most a coil's name takes in the bill of materials, mm.
const nameW = 40.0

func (s *sheet) bomLines() ([]*wireLine, []*supportLine, []string) {
	var wires []*wireLine
	var supports []*supportLine
	var parts []string
	s.font("", bodySize)
	for _, c := range s.doc.Coils {
		p := c.Prediction
		name := s.fit(c.Name, nameW) // a label: a very long name is shortened
		// The same wire is one line however it was described: same bare
		// and overall diameter, same conductor.
		g := p.Geometry
		key := fmt.Sprintf("%.9g|%.9g|%v", float64(g.WireDiameter), float64(g.OverallDiameter()), g.Conductor)
		i := slices.IndexFunc(wires, func(w *wireLine) bool { return w.key == key })
		if i < 0 {
			wires = append(wires, &wireLine{key: key, desc: c.Wire})
			i = len(wires) - 1
		} else if !statesSize(wires[i].desc, float64(g.WireDiameter)) && statesSize(c.Wire, float64(g.WireDiameter)) {
			wires[i].desc = c.Wire // the row's own words, e.g. "0.315mm", over a rounded size
		}
		wires[i].uses = append(wires[i].uses, fmt.Sprintf("%s × %d", name, c.Quantity))
		// The builder cuts what the page prints, so the total adds up by
		// hand from the coil pages.
		wires[i].total += s.u.cutRound(float64(p.WireLength)) * float64(c.Quantity)

		j := slices.IndexFunc(supports, func(m *supportLine) bool { return m.kind == c.Support && m.name == c.SupportName })
		if j < 0 {
			supports = append(supports, &supportLine{kind: c.Support, name: c.SupportName, diameter: float64(p.Geometry.FormerDiameter)})
			j = len(supports) - 1
		}
		supports[j].uses = append(supports[j].uses, name)
		supports[j].count += c.Quantity
		supports[j].longest = max(supports[j].longest, float64(p.WindingLength))

		if sp := c.Span; sp != nil {
			gang := sp.Capacitor
			switch {
			case gang != "":
			case sp.GangB != "" && sp.GangB != sp.GangA:
				gang = "A " + sp.GangA + ", B " + sp.GangB
			default:
				gang = sp.GangA + " per section"
			}
			parts = append(parts, fmt.Sprintf("two-gang variable capacitor, %s, for %s: %d", gang, name, c.Quantity))
		}
	}
	return wires, supports, parts
}

func (s *sheet) billOfMaterials(f *flow, x, w float64) {
	allow := s.doc.Allowance
	if allow == 0 {
		allow = DefaultAllowance
	}
	wires, supports, parts := s.bomLines()

	// Wire.
	t := &table{x: x, cols: []float64{w - 36 - 30 - 52, 52, 30, 36},
		heads:  []string{"wire", "for", "batch total", fmt.Sprintf("have at least (+%.0f %%)", allow*100)},
		styles: []string{"", "", "", ""}}
	f.startTable(t)
	for _, wl := range wires {
		f.tableRow(t, []string{wl.desc, strings.Join(wl.uses, ", "), s.u.cut(wl.total), s.u.stock(wl.total * (1 + allow))})
	}
	f.endTable()
	s.font("", smallSize)
	f.y += 0.6
	f.para(x, w, fmt.Sprintf("Batch total: each coil page's wire to cut × how many to build. Cut lengths include the leads and %s per coil for stripping and soldering. The allowance covers a coil that goes wrong, rounded up; it is common practice, not a rule.", s.u.lead(float64(coil.CutAllowance))))

	// Mandrels and formers.
	f.y += 2.5
	t = &table{x: x, cols: []float64{w - 26 - 60 - 40, 26, 60, 40},
		heads:  []string{"wind on", "diameter", "for", "need"},
		styles: []string{"", "", "", ""}}
	f.startTable(t)
	for _, m := range supports {
		need := "1 to share (the coil slides off)"
		if m.kind == coil.SupportFormer {
			need = fmt.Sprintf("%d, each at least %s long", m.count, s.u.cut(s.u.cutUp(m.longest+2*formerMargin)))
		}
		kind := "mandrel"
		if m.kind == coil.SupportFormer {
			kind = "former"
		}
		f.tableRow(t, []string{m.name + " (" + kind + ")", s.u.of(m.diameter), strings.Join(m.uses, ", "), need})
	}
	f.endTable()
	if len(parts) > 0 {
		f.y += 2.5
		f.need(4.2 + s.lineH())
		s.font("B", smallSize)
		s.text(x, f.y, "other parts")
		f.y += 4.2
		s.font("", bodySize)
		for _, p := range parts {
			f.para(x, w, p)
		}
	}
	s.font("", bodySize)
}

// leadingMM is a description's leading size in millimetres, "0.315mm …".
var leadingMM = regexp.MustCompile(`^\s*(\d+(?:\.\d+)?)\s*mm\b`)

// statesSize reports whether desc begins with the bare diameter d (m)
// exactly, as a stock row names its wire.
func statesSize(desc string, d float64) bool {
	m := leadingMM.FindStringSubmatch(desc)
	if m == nil {
		return false
	}
	v, err := strconv.ParseFloat(m[1], 64)
	return err == nil && math.Abs(v*1e-3-d) < 1e-12
}

// row draws one line of cells in the current font.
func (s *sheet) row(x, y float64, cols []float64, cells []string) {
	for i, c := range cells {
		s.text(x, y, s.fit(c, cols[i]-1.5))
		x += cols[i]
	}
}
