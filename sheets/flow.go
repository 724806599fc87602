package sheets

import "strings"

// Pagination. Every block that can grow (the cover's coil list, the bill
// of materials, the job's notes, a coil's notes, a chart's findings) is
// placed by a flow: before a line or a block is drawn it checks the room
// left above the footer line and, when there is none, starts a
// continuation page with the same heading and the table's column heads
// again. Nothing is drawn below the footer line and nothing is dropped.

// flow places lines down the page, starting continuation pages.
type flow struct {
	s       *sheet
	y       float64 // baseline of the next line
	bottom  float64 // lowest baseline on this page
	title   string  // what a continuation page says it continues
	onBreak func()  // redraws what a continuation page repeats (table heads)
}

func (s *sheet) newFlow(y float64, title string) *flow {
	return &flow{s: s, y: y, bottom: s.bottom(), title: title}
}

// need starts a new page unless a block of height h (its first baseline
// at f.y) fits above the footer line.
func (f *flow) need(h float64) {
	if f.y+h-f.s.lineH() > f.bottom+1e-9 {
		f.newPage()
	}
}

// needBox starts a new page unless a box of height h drawn from f.y down
// ends above the footer line.
func (f *flow) needBox(h float64) {
	if f.y+h > f.bottom+1e-9 {
		f.newPage()
	}
}

// newPage starts a continuation page and restores the font.
func (f *flow) newPage() {
	s := f.s
	style, size := s.style, s.size
	s.pdf.AddPage()
	s.black()
	y := margin + 6
	s.font("B", 9)
	date := s.doc.Date.Format("2 January 2006")
	s.text(margin, y, s.fit(strings.ToUpper(f.title)+", CONTINUED", s.contentW()-s.width(date)-6))
	s.font("", 9)
	s.textRight(s.w-margin, y, date)
	f.y = y + 8
	f.bottom = s.bottom()
	if f.onBreak != nil {
		f.onBreak()
	}
	s.font(style, size)
}

// lines draws lines at x, one baseline apart, breaking pages between them.
func (f *flow) lines(x float64, ls []string) {
	lh := f.s.lineH()
	for _, l := range ls {
		f.need(lh)
		f.s.text(x, f.y, l)
		f.y += lh
	}
}

// para draws str wrapped to w.
func (f *flow) para(x, w float64, str string) { f.lines(x, f.s.wrap(str, w)) }

// heading draws a section title, kept with the first line below it.
func (f *flow) heading(x, w float64, title string) {
	f.need(5 + 2*f.s.lineH())
	f.y = f.s.heading(x, f.y, w, title)
}

// bullets draws a list with hanging indents.
func (f *flow) bullets(x, w float64, items []string) {
	s := f.s
	for _, it := range items {
		ls := s.wrap(it, w-3.5)
		f.need(s.lineH())
		s.text(x, f.y, "•")
		f.lines(x+3.5, ls)
		f.y += 0.6
	}
}

// table is a table's columns: widths, heads and each cell's font style.
type table struct {
	x      float64
	cols   []float64
	heads  []string
	styles []string
}

// head draws the column heads.
func (f *flow) head(t *table) {
	s := f.s
	style, size := s.style, s.size
	s.font("B", smallSize)
	s.row(t.x, f.y, t.cols, t.heads)
	f.y += 4.2
	s.font(style, size)
}

// startTable draws the heads and repeats them on continuation pages.
func (f *flow) startTable(t *table) {
	f.need(4.2 + f.s.lineH())
	f.head(t)
	f.onBreak = func() { f.head(t) }
}

func (f *flow) endTable() { f.onBreak = nil }

// tableRow draws one row, every cell wrapped in its column in full. A
// row that fits on a page is kept together; a taller one is split
// between lines.
func (f *flow) tableRow(t *table, cells []string) {
	s := f.s
	s.font("", bodySize)
	lh := s.lineH()
	lines := make([][]string, len(cells))
	tallest := 1
	for i, c := range cells {
		s.font(t.styles[i], bodySize)
		lines[i] = s.wrap(c, t.cols[i]-1.5)
		tallest = max(tallest, len(lines[i]))
	}
	room := s.bottom() - (margin + 14 + 4.2)
	f.need(min(float64(tallest)*lh, room))
	for j := 0; j < tallest; j++ {
		f.need(lh)
		x := t.x
		for i := range cells {
			if j < len(lines[i]) {
				s.font(t.styles[i], bodySize)
				s.text(x, f.y, lines[i][j])
			}
			x += t.cols[i]
		}
		f.y += lh
	}
	f.y += 0.4
	s.font("", bodySize)
}
