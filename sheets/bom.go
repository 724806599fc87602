package sheets

import (
	"fmt"
	"slices"
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

func (s *sheet) bomLines() ([]*wireLine, []*supportLine, []string) {
	var wires []*wireLine
	var supports []*supportLine
	var parts []string
	for _, c := range s.doc.Coils {
		p := c.Prediction
		key := shortWire(c)
		i := slices.IndexFunc(wires, func(w *wireLine) bool { return w.key == key })
		if i < 0 {
			wires = append(wires, &wireLine{key: key, desc: c.Wire})
			i = len(wires) - 1
		}
		wires[i].uses = append(wires[i].uses, fmt.Sprintf("%s × %d", c.Name, c.Quantity))
		// The builder cuts what the page prints, so the total adds up by
		// hand from the coil pages.
		wires[i].total += s.u.cutRound(float64(p.WireLength)) * float64(c.Quantity)

		j := slices.IndexFunc(supports, func(m *supportLine) bool { return m.kind == c.Support && m.name == c.SupportName })
		if j < 0 {
			supports = append(supports, &supportLine{kind: c.Support, name: c.SupportName, diameter: float64(p.Geometry.FormerDiameter)})
			j = len(supports) - 1
		}
		supports[j].uses = append(supports[j].uses, c.Name)
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
			parts = append(parts, fmt.Sprintf("two-gang variable capacitor, %s, for %s: %d", gang, c.Name, c.Quantity))
		}
	}
	return wires, supports, parts
}

func (s *sheet) billOfMaterials(x, y, w float64) float64 {
	allow := s.doc.Allowance
	if allow == 0 {
		allow = DefaultAllowance
	}
	wires, supports, parts := s.bomLines()

	// Wire.
	s.font("B", smallSize)
	cols := []float64{w - 36 - 30 - 52, 52, 30, 36}
	heads := []string{"wire", "for", "batch total", fmt.Sprintf("have at least (+%.0f %%)", allow*100)}
	s.row(x, y, cols, heads)
	y += 4.2
	for _, wl := range wires {
		s.font("", bodySize)
		cells := []string{wl.desc, strings.Join(wl.uses, ", "), s.u.cut(wl.total), s.u.stock(wl.total * (1 + allow))}
		y = s.wrappedRow(x, y, cols, cells, 3)
	}
	s.font("", smallSize)
	y = s.para(x, y+0.6, w, fmt.Sprintf("Batch total: each coil page's wire to cut × how many to build. Cut lengths include the leads and %s per coil for stripping and soldering. The allowance covers a coil that goes wrong, rounded up; it is common practice, not a rule.", s.u.lead(float64(coil.CutAllowance))))

	// Mandrels and formers.
	y += 2.5
	s.font("B", smallSize)
	cols = []float64{w - 26 - 60 - 40, 26, 60, 40}
	s.row(x, y, cols, []string{"wind on", "diameter", "for", "need"})
	y += 4.2
	for _, m := range supports {
		s.font("", bodySize)
		need := "1 to share (the coil slides off)"
		if m.kind == coil.SupportFormer {
			need = fmt.Sprintf("%d, each at least %s long", m.count, s.u.cut(s.u.cutUp(m.longest+2*formerMargin)))
		}
		kind := "mandrel"
		if m.kind == coil.SupportFormer {
			kind = "former"
		}
		cells := []string{m.name + " (" + kind + ")", s.u.of(m.diameter), strings.Join(m.uses, ", "), need}
		y = s.wrappedRow(x, y, cols, cells, 3)
	}
	if len(parts) > 0 {
		y += 2.5
		s.font("B", smallSize)
		s.text(x, y, "other parts")
		y += 4.2
		s.font("", bodySize)
		for _, p := range parts {
			y = s.para(x, y, w, p)
		}
	}
	s.font("", bodySize)
	return y
}

// row draws one line of cells in the current font.
func (s *sheet) row(x, y float64, cols []float64, cells []string) {
	for i, c := range cells {
		s.text(x, y, s.fit(c, cols[i]-1.5))
		x += cols[i]
	}
}

// wrappedRow draws cells, wrapping each in its column up to maxLines
// lines, and returns the y below the tallest.
func (s *sheet) wrappedRow(x, y float64, cols []float64, cells []string, maxLines int) float64 {
	lh := s.lineH()
	tallest := 1
	for i, c := range cells {
		lines := s.wrap(c, cols[i]-1.5)
		if len(lines) > maxLines {
			lines = lines[:maxLines]
			lines[maxLines-1] = s.fit(lines[maxLines-1]+" …", cols[i]-1.5)
		}
		for j, l := range lines {
			s.text(x, y+float64(j)*lh, l)
		}
		tallest = max(tallest, len(lines))
		x += cols[i]
	}
	return y + float64(tallest)*lh + 0.4
}
