package sheets

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strings"
	"turnwise/internal/quantity"

	"github.com/jung-kurt/gofpdf"
)

// Layout constants, in millimetres.
const (
	margin     = 12.0 // all four sides
	footerH    = 7.0  // footer band at the bottom of every page
	lineGap    = 1.05 // extra leading between lines of running text
	sectionGap = 4.0  // space above a section heading
	bodySize   = 8.0  // running text, points
	smallSize  = 7.0  // dimensions and table notes, points
)

// ptPerMM converts millimetres to PDF points.
const ptPerMM = 72 / 25.4

// Render writes the build sheets for doc as a PDF to w: a cover page, then a
// page per coil, and a tuning-chart page after each coil with a Span. It
// checks doc first and returns an error naming the field at fault; nothing
// is written then. Output depends only on doc and opt: the PDF's own dates
// are doc.Date, so the same input gives the same bytes.
func Render(w io.Writer, doc Document, opt Options) error {
	if err := check(&doc); err != nil {
		return err
	}
	// The cover lists the page each coil starts on, and the cover itself
	// may take several pages: a first pass finds the pages, the second
	// draws with them. The layout never depends on the page numbers.
	first := newSheet(&doc, opt)
	first.draw()
	s := newSheet(&doc, opt)
	s.pages = first.pages
	s.draw()
	s.pdf.Close()
	if err := s.pdf.Error(); err != nil {
		return fmt.Errorf("sheets: %w", err)
	}
	return s.pdf.Output(w)
}

// draw draws every page and records where each coil starts.
func (s *sheet) draw() {
	s.cover()
	starts := make([]int, len(s.doc.Coils))
	for i := range s.doc.Coils {
		c := &s.doc.Coils[i]
		starts[i] = s.pdf.PageNo() + 1
		s.coilPage(c)
		if c.Span != nil {
			s.spanPage(c)
		}
	}
	for i := range s.doc.Circuits {
		s.circuitPage(&s.doc.Circuits[i], i)
	}
	for i := range s.doc.Couplers {
		s.couplerPage(&s.doc.Couplers[i])
	}
	s.pages = starts
}

// check validates what Render needs and fills defaults.
func check(doc *Document) error {
	switch strings.ToLower(doc.Paper) {
	case "", "a4":
		doc.Paper = "A4"
	case "letter":
		doc.Paper = "Letter"
	default:
		return fmt.Errorf("sheets: paper %q: use A4 or Letter", doc.Paper)
	}
	switch strings.ToLower(doc.Units) {
	case "", "mm":
		doc.Units = "mm"
	case "in":
		doc.Units = "in"
	default:
		return fmt.Errorf("sheets: units %q: use mm or in", doc.Units)
	}
	if doc.Date.IsZero() {
		return errors.New("sheets: Document.Date is required (it is printed and fixes the PDF's dates)")
	}
	if strings.TrimSpace(doc.Title) == "" {
		return errors.New("sheets: Document.Title is empty")
	}
	if len(doc.Coils) == 0 {
		return errors.New("sheets: no coils")
	}
	if doc.Allowance < 0 || doc.Allowance > 1 || !finite(doc.Allowance) {
		return fmt.Errorf("sheets: allowance %g is outside 0 … 1", doc.Allowance)
	}
	for i := range doc.Coils {
		c := &doc.Coils[i]
		g := c.Prediction.Geometry
		if err := g.Validate(); err != nil {
			return fmt.Errorf("sheets: coil %q: %w", c.Name, err)
		}
		if c.Quantity < 0 {
			return fmt.Errorf("sheets: coil %q: quantity %d", c.Name, c.Quantity)
		}
		if c.Quantity == 0 {
			c.Quantity = 1
		}
		if c.Tap != nil && (c.Tap.Turns <= 0 || c.Tap.Turns >= g.Turns || !finite(c.Tap.Turns)) {
			return fmt.Errorf("sheets: coil %q: tap at %g turns is not inside the %g-turn winding", c.Name, c.Tap.Turns, g.Turns)
		}
		if c.Span != nil {
			for _, d := range c.Span.Dial {
				if !finite(float64(d.FLow)) || !finite(float64(d.FHigh)) || !finite(d.Setting) || d.FLow < 0 || d.FHigh < 0 {
					return fmt.Errorf("sheets: coil %q: dial point %+v is not finite and positive", c.Name, d)
				}
			}
		}
	}
	return nil
}

func finite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// sheet is the document being drawn.
type sheet struct {
	pdf  *gofpdf.Fpdf
	tr   func(string) string
	doc  *Document
	w, h float64 // page size, mm
	u    lengths

	pages  []int            // the page each coil starts on, from the first pass
	style  string           // the current font style
	size   float64          // and size, points
	glyphW map[glyphKey]int // glyph widths by style and rune
}

func newSheet(doc *Document, opt Options) *sheet {
	pdf := gofpdf.New("P", "mm", doc.Paper, "")
	pdf.SetCompression(!opt.Uncompressed)
	pdf.SetCatalogSort(true)
	pdf.SetCreationDate(doc.Date)
	pdf.SetModificationDate(doc.Date)
	pdf.SetProducer("turnwise", true)
	pdf.SetCreator("turnwise sheet", true)
	pdf.SetTitle(doc.Title, true)
	pdf.SetMargins(margin, margin, margin)
	pdf.SetAutoPageBreak(false, 0)
	pdf.AliasNbPages("{nb}")
	pdf.SetLineJoinStyle("round")
	w, h := pdf.GetPageSize()
	s := &sheet{pdf: pdf, tr: pdf.UnicodeTranslatorFromDescriptor(""), doc: doc, w: w, h: h, u: lengths{inches: doc.Units == "in"}, glyphW: map[glyphKey]int{}}
	pdf.SetFooterFunc(s.footer)
	return s
}

// contentW is the width between the margins.
func (s *sheet) contentW() float64 { return s.w - 2*margin }

// bottom is the lowest y content may use.
func (s *sheet) bottom() float64 { return s.h - margin - footerH }

func (s *sheet) footer() {
	s.black()
	s.pdf.SetLineWidth(0.2)
	y := s.h - margin - footerH + 2
	s.pdf.Line(margin, y, s.w-margin, y)
	s.font("", smallSize)
	left := "turnwise build sheet · " + s.doc.Title + " · " + s.doc.Date.Format("2 January 2006")
	if s.doc.Source != "" {
		left += " · " + s.doc.Source
	}
	s.text(margin, y+4, s.fit(left, s.contentW()-30))
	s.textRight(s.w-margin, y+4, fmt.Sprintf("page %d of {nb}", s.pdf.PageNo()))
}

// --- text helpers -------------------------------------------------------

func (s *sheet) font(style string, size float64) {
	s.style, s.size = style, size
	s.pdf.SetFont("Helvetica", style, size)
}

func (s *sheet) black() {
	s.pdf.SetDrawColor(0, 0, 0)
	s.pdf.SetFillColor(0, 0, 0)
	s.pdf.SetTextColor(0, 0, 0)
}

// enc converts UTF-8 to the core font's Windows-1252.
func (s *sheet) enc(str string) string { return s.tr(latin.Replace(str)) }

func (s *sheet) width(str string) float64 { return s.pdf.GetStringWidth(s.enc(str)) }

// text draws str with its baseline at y.
func (s *sheet) text(x, y float64, str string) { s.pdf.Text(x, y, s.enc(str)) }

func (s *sheet) textRight(x, y float64, str string) { s.text(x-s.width(str), y, str) }

func (s *sheet) textCenter(x, y float64, str string) { s.text(x-s.width(str)/2, y, str) }

// Text is measured in glyph units summed rune by rune (the core fonts have
// no kerning, so this is exactly what gofpdf measures), which keeps fitting
// and wrapping linear in the length of the text: a 200 KB title or a
// 3,000-character word costs one pass, not one measurement per character.

// glyphs returns the width of each rune of str in the current font, in
// thousandths of the font size.
func (s *sheet) glyphs(str string) []int {
	out := make([]int, 0, len(str))
	for _, r := range str {
		k := glyphKey{s.style, r}
		w, ok := s.glyphW[k]
		if !ok {
			w = s.pdf.GetStringSymbolWidth(s.enc(string(r)))
			s.glyphW[k] = w
		}
		out = append(out, w)
	}
	return out
}

type glyphKey struct {
	style string
	r     rune
}

// units converts a width in mm to glyph units at the current font size.
func (s *sheet) units(w float64) float64 {
	_, size := s.pdf.GetFontSize() // in mm, the document's unit
	if size <= 0 {
		return 0
	}
	return w * 1000 / size
}

// fit shortens str with an ellipsis to fit w.
func (s *sheet) fit(str string, w float64) string {
	g := s.glyphs(str)
	limit := s.units(w)
	total := 0
	for _, x := range g {
		total += x
	}
	if float64(total) <= limit {
		return str
	}
	limit -= float64(s.glyphs("…")[0])
	r := []rune(str)
	n, sum := 0, 0
	for n < len(r)-1 && float64(sum+g[n]) <= limit {
		sum += g[n]
		n++
	}
	return string(r[:max(n, 1)]) + "…"
}

// lineH is the baseline-to-baseline distance for the current font size.
func (s *sheet) lineH() float64 {
	pt, _ := s.pdf.GetFontSize()
	return pt/ptPerMM + lineGap
}

// wrap splits str into lines no wider than w in the current font. A word
// wider than w is broken between characters, so nothing runs off the
// right edge and nothing is dropped.
func (s *sheet) wrap(str string, w float64) []string {
	var out []string
	limit := s.units(w)
	space := float64(s.glyphs(" ")[0])
	for _, para := range strings.Split(str, "\n") {
		words := strings.Fields(para)
		if len(words) == 0 {
			out = append(out, "")
			continue
		}
		var line []rune
		lineW := 0.0
		for _, wd := range words {
			r := []rune(wd)
			g := s.glyphs(wd)
			ww := 0.0
			for _, x := range g {
				ww += float64(x)
			}
			if len(line) > 0 && lineW+space+ww <= limit {
				line = append(append(line, ' '), r...)
				lineW += space + ww
				continue
			}
			if len(line) > 0 {
				out = append(out, string(line))
				line, lineW = nil, 0
			}
			// Hard-break a word wider than the line.
			start, acc := 0, 0.0
			for i := range r {
				if acc+float64(g[i]) > limit && i > start {
					out = append(out, string(r[start:i]))
					start, acc = i, 0
				}
				acc += float64(g[i])
			}
			line, lineW = append(line, r[start:]...), acc
		}
		out = append(out, string(line))
	}
	return out
}

// para draws str wrapped to w with its first baseline at y and returns the
// y below the last line.
func (s *sheet) para(x, y, w float64, str string) float64 {
	lh := s.lineH()
	for _, l := range s.wrap(str, w) {
		s.text(x, y, l)
		y += lh
	}
	return y
}

// paraHeight is the height para would use.
func (s *sheet) paraHeight(w float64, str string) float64 {
	return float64(len(s.wrap(str, w))) * s.lineH()
}

// heading draws a section title with a rule under it and returns the y of
// the first baseline below.
func (s *sheet) heading(x, y, w float64, title string) float64 {
	s.black()
	s.font("B", 9)
	s.text(x, y, strings.ToUpper(title))
	s.pdf.SetLineWidth(0.35)
	s.pdf.Line(x, y+1.2, x+w, y+1.2)
	s.font("", bodySize)
	return y + 5
}

// rows draws label/value pairs in two columns and returns the y below.
func (s *sheet) rows(x, y, labelW, w float64, rows [][2]string) float64 {
	lh := s.lineH()
	for _, r := range rows {
		s.font("", bodySize)
		s.text(x, y, s.fit(r[0], labelW-1))
		s.font("B", bodySize)
		lines := s.wrap(r[1], w-labelW)
		for i, l := range lines {
			if i > 0 {
				s.font("", bodySize)
			}
			s.text(x+labelW, y, l)
			y += lh
		}
	}
	s.font("", bodySize)
	return y
}

// marked brackets drawing in a PDF marked-content sequence: readers ignore
// it, and tests find the scale bar and the drawing by it.
func (s *sheet) marked(tag string, draw func()) {
	s.pdf.RawWriteStr("/" + tag + " BMC")
	draw()
	s.pdf.RawWriteStr("EMC")
}

// arrow draws a dimension line from (x1,y1) to (x2,y2) with arrowheads at
// both ends.
func (s *sheet) arrow(x1, y1, x2, y2 float64, heads bool) {
	s.pdf.SetLineWidth(0.2)
	s.pdf.Line(x1, y1, x2, y2)
	if !heads {
		return
	}
	const hl, hw = 1.6, 0.55 // head length and half-width, mm
	dx, dy := x2-x1, y2-y1
	l := math.Hypot(dx, dy)
	if l == 0 {
		return
	}
	ux, uy := dx/l, dy/l
	head := func(x, y, sx, sy float64) {
		s.pdf.Polygon([]gofpdf.PointType{
			{X: x, Y: y},
			{X: x + sx*hl - sy*hw, Y: y + sy*hl + sx*hw},
			{X: x + sx*hl + sy*hw, Y: y + sy*hl - sx*hw},
		}, "F")
	}
	head(x1, y1, ux, uy)
	head(x2, y2, -ux, -uy)
}

// dashed sets a dash pattern; nil restores solid lines.
func (s *sheet) dashed(pattern ...float64) {
	if pattern == nil {
		pattern = []float64{}
	}
	s.pdf.SetDashPattern(pattern, 0)
}

// --- cover page ------------------------------------------------------------

// coverTitleLines is how many lines of the title the cover prints; a
// longer title ends with an ellipsis (it is whole in the PDF's metadata).
const coverTitleLines = 3

// cover draws the cover: the title, "Before you start" and the cautions on
// its first page whatever the size of the job, then the job's notes, the
// coil list and the bill of materials, continued on as many pages as they
// take.
func (s *sheet) cover() {
	d := s.doc
	s.pdf.AddPage()
	s.black()
	x, w := margin, s.contentW()
	y := margin + 6
	s.font("", 9)
	s.text(x, y, "BUILD SHEETS")
	s.textRight(x+w, y, d.Date.Format("2 January 2006"))
	y += 9
	s.font("B", 20)
	title := s.wrap(d.Title, w)
	if len(title) > coverTitleLines {
		title[coverTitleLines-1] = s.fit(title[coverTitleLines-1]+" "+title[coverTitleLines], w)
		title = title[:coverTitleLines]
	}
	for _, l := range title {
		s.text(x, y, l)
		y += 8.5
	}
	total := 0
	for _, c := range d.Coils {
		total += c.Quantity
	}
	sub := fmt.Sprintf("%d %s to wind, %d in all", len(d.Coils), plural(len(d.Coils), "design", "designs"), total)
	if d.Source != "" {
		sub += " · from " + d.Source
	}
	s.font("", 10)
	s.text(x, y, s.fit(sub, w))
	y += 5

	before := []string{
		"Print at 100 % (\"actual size\"), never \"fit to page\". On every coil page, measure the 50 mm scale-check bar with a ruler before trusting the drawing or the pitch template.",
		"Each coil page gives the wire to cut, what to wind it on, the winding steps, what it should measure, and a log for what it did measure. Squeeze the turns to raise the inductance, spread them to lower it.",
		"Lengths are in " + map[bool]string{true: "inches", false: "millimetres"}[s.u.inches] + ". Resistance is written \"ohm\".",
	}
	hv := anyHighVoltage(d.Coils)
	s.font("", bodySize)
	beforeH := sectionGap + 5
	for _, it := range before {
		beforeH += s.paraHeight(w-3.5, it) + 0.6
	}
	cautH := s.cautionHeight(w, s.cautionItems(&Coil{HighVoltage: hv}))
	notes := strings.TrimSpace(d.Notes) != ""
	// Short notes go under the title; long ones after the cautions, so
	// that the cautions are always on the cover's first page.
	if notes && y+2+s.paraHeight(w, d.Notes)+beforeH+sectionGap+cautH <= s.bottom() {
		y = s.para(x, y+2, w, d.Notes)
		notes = false
	}
	f := s.newFlow(y+sectionGap+2, d.Title+": cover")
	f.heading(x, w, "Before you start")
	s.font("", bodySize)
	f.bullets(x, w, before)
	f.needBox(sectionGap + cautH)
	f.y = s.cautionBox(x, f.y+sectionGap, w, nil, hv)

	if notes {
		f.y += sectionGap + 4
		f.heading(x, w, "Notes")
		s.font("", bodySize)
		f.para(x, w, d.Notes)
	}
	f.y += sectionGap + 2
	f.heading(x, w, "Coils in this job")
	s.coilTable(f, x, w)

	f.y += sectionGap
	f.heading(x, w, "Bill of materials")
	s.billOfMaterials(f, x, w)
}

func anyHighVoltage(cs []Coil) bool {
	for _, c := range cs {
		if c.HighVoltage {
			return true
		}
	}
	return false
}

// bullets draws a list with hanging indents and returns the y below.
func (s *sheet) bullets(x, y, w float64, items []string) float64 {
	for _, it := range items {
		s.text(x, y, "•")
		y = s.para(x+3.5, y, w-3.5, it) + 0.6
	}
	return y
}

func (s *sheet) coilTable(f *flow, x, w float64) {
	t := &table{x: x, cols: []float64{10, 30, 11, w - 10 - 30 - 11 - 38, 38},
		heads:  []string{"page", "coil", "build", "winding", "inductance"},
		styles: []string{"", "B", "", "", ""}}
	f.startTable(t)
	for i, c := range s.doc.Coils {
		p := c.Prediction
		g := p.Geometry
		what := fmt.Sprintf("%s of %s on %s", quantity.FormatTurnsWord(g.Turns), shortWire(c), c.SupportName)
		if c.Tap != nil {
			what += ", tap " + quantity.FormatTurns(c.Tap.Turns)
		}
		if c.Span != nil {
			what += ", two-gang"
		}
		ind := quantity.FormatEng(float64(p.Inductance), "H", 3)
		if p.Frequency > 0 {
			ind += " at " + hz(float64(p.Frequency))
		}
		page := "?"
		if i < len(s.pages) {
			page = fmt.Sprint(s.pages[i])
		}
		s.font("B", bodySize)
		name := s.fit(c.Name, t.cols[1]-1.5)
		f.tableRow(t, []string{page, name, fmt.Sprintf("× %d", c.Quantity), what, ind})
	}
	f.endTable()
}

// shortWire is the wire's name without the description's tail.
func shortWire(c Coil) string {
	if c.WireKey != "" {
		return c.WireKey
	}
	return c.Wire
}

// titledPage starts a page with title in bold across the content width
// and returns where the body starts: x, the width and y.
func (s *sheet) titledPage(title string) (x, w, y float64) {
	s.pdf.AddPage()
	s.black()
	x, w = margin, s.contentW()
	y = margin + 6
	s.font("B", 17)
	s.text(x, y, s.fit(title, w))
	s.font("", bodySize)
	return x, w, y + 6.5
}
