package sheets

import (
	"bytes"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/internal/testtools"
)

// manyCoils is a job of n coils on three wires and two supports, with
// names that are easy to find in the text: "C0001", "C0002", …
func manyCoils(t testing.TB, n int) []Coil {
	t.Helper()
	wires := []struct {
		d, o float64
		desc string
	}{
		{1e-3, 0, "1.00mm silver-plated bare wire"},
		{0.6e-3, 0.65e-3, "0.60mm copper wire, grade 1 enamel (0.65 mm overall)"},
		{0.315e-3, 0.35e-3, "0.315mm copper wire, grade 1 enamel (0.35 mm overall)"},
	}
	preds := map[int]coil.Prediction{}
	out := make([]Coil, n)
	for i := range out {
		k := i % 6
		p, ok := preds[k]
		if !ok {
			w := wires[k%3]
			do := max(w.d, w.o)
			g := coil.Geometry{FormerDiameter: unit.Length(float64(6+2*k) * 1e-3), WireDiameter: unit.Length(w.d), WireOverall: unit.Length(w.o),
				Turns: float64(4 + k), Pitch: unit.Length(2 * do), LeadLength: 5e-3}
			p = predicted(t, g, 0)
			preds[k] = p
		}
		w := wires[k%3]
		sup, name := "mandrel", "6mm drill"
		if k >= 3 {
			sup, name = "former", "pvc 12mm"
		}
		out[i] = Coil{Name: fmt.Sprintf("C%04d", i+1), Quantity: 1 + i%3, Wire: w.desc, WireKey: w.desc,
			Support: coil.SupportKind(sup), SupportName: name, Prediction: p}
	}
	return out
}

// pdfWords are the words pdftotext -bbox finds, per page.
type pdfWord struct {
	x0, y0, x1, y1 float64
	text           string
}

func readBack(t *testing.T, pdf []byte) (pages int, text []string, words [][]pdfWord) {
	t.Helper()
	pdfinfo := testtools.Need(t, "pdfinfo", "poppler-utils")
	pdftotext := testtools.Need(t, "pdftotext", "poppler-utils")
	file := filepath.Join(t.TempDir(), "s.pdf")
	if err := os.WriteFile(file, pdf, 0o644); err != nil {
		t.Fatal(err)
	}
	info, err := exec.Command(pdfinfo, file).Output()
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`Pages:\s+(\d+)`).FindSubmatch(info)
	if m == nil {
		t.Fatalf("pdfinfo: no page count:\n%s", info)
	}
	pages, _ = strconv.Atoi(string(m[1]))
	raw, err := exec.Command(pdftotext, "-raw", file, "-").Output()
	if err != nil {
		t.Fatal(err)
	}
	text = strings.Split(string(raw), "\f")[:pages]
	bbox, err := exec.Command(pdftotext, "-bbox", file, "-").Output()
	if err != nil {
		t.Fatal(err)
	}
	re := regexp.MustCompile(`<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)</word>`)
	for _, pg := range strings.Split(string(bbox), "<page ")[1:] {
		var ws []pdfWord
		for _, m := range re.FindAllStringSubmatch(pg, -1) {
			var b [4]float64
			for i := range b {
				b[i], _ = strconv.ParseFloat(m[i+1], 64)
			}
			ws = append(ws, pdfWord{b[0], b[1], b[2], b[3], m[5]})
		}
		words = append(words, ws)
	}
	if len(words) != pages {
		t.Fatalf("pdftotext -bbox found %d pages, pdfinfo %d", len(words), pages)
	}
	return pages, text, words
}

// checkInside fails for a word below the footer rule (other than the
// footer's own line), or outside the side margins.
func checkInside(t *testing.T, paper string, words [][]pdfWord) {
	t.Helper()
	const ptmm = 72 / 25.4
	pw, ph := pageSizes[paper][0], pageSizes[paper][1]
	rule := ph - (margin+footerH-2)*ptmm // the footer rule, pt from the top
	const slack = 1.0                    // pt: glyph side bearings
	for p, ws := range words {
		footY := math.NaN()
		for _, w := range ws {
			if w.text == "page" && w.y0 > rule {
				footY = w.y0
			}
		}
		for _, w := range ws {
			if w.x0 < margin*ptmm-slack || w.x1 > pw-margin*ptmm+slack {
				t.Errorf("page %d: word %q at x %.1f … %.1f pt runs past the side margins", p+1, w.text, w.x0, w.x1)
			}
			if w.y1 > rule && !(math.Abs(w.y0-footY) < 0.5) {
				t.Errorf("page %d: word %q at y %.1f … %.1f pt is below the footer rule at %.1f pt", p+1, w.text, w.y0, w.y1, rule)
			}
			if w.y1 > ph-margin*ptmm+slack {
				t.Errorf("page %d: word %q at y %.1f pt is in the bottom margin", p+1, w.text, w.y1)
			}
		}
	}
}

// Jobs of 1, 15, 60 and 500 coils read back: every coil on the cover's
// list and on its own page, the bill of materials, a caution on the
// cover's first page and on every coil page, nothing below the footer
// line, and as many pages as the cover, the coils and the notes take.
func TestPaginatedJobs(t *testing.T) {
	t.Parallel()
	for _, n := range []int{1, 15, 60, 500} {
		t.Run(fmt.Sprint(n), func(t *testing.T) {
			if n == 500 && testing.Short() {
				t.Skip("500 coils: skipped with -short")
			}
			t.Parallel()
			doc := Document{Title: fmt.Sprintf("Club night, %d coils", n), Date: testDate, Source: "job.toml",
				Notes: "Bring your own iron.", Coils: manyCoils(t, n)}
			pdf := render(t, doc, Options{})
			pages, text, words := readBack(t, pdf)
			flat := func(s string) string { return strings.Join(strings.Fields(s), " ") }

			// The cover: its pages are those before the first coil page.
			first := -1
			for p := range text {
				if strings.Contains(text[p], "BUILD × ") {
					first = p
					break
				}
			}
			if first < 1 {
				t.Fatalf("no coil page found")
			}
			cover := flat(strings.Join(text[:first], " "))
			if want := first + n; pages != want {
				t.Errorf("%d pages, want %d cover pages + %d coil pages = %d", pages, first, n, want)
			}
			if max := 2 + n/25; first > max { // a coil row is about 4 mm, some 60 rows to an A4 page (layout bound)
				t.Errorf("the cover takes %d pages for %d coils, more than %d", first, n, max)
			}
			if !strings.Contains(flat(text[0]), "CAUTION") {
				t.Errorf("the cover's first page has no caution")
			}
			if !strings.Contains(flat(text[0]), "Before you start") && !strings.Contains(flat(text[0]), "BEFORE YOU START") {
				t.Errorf("the cover's first page has no \"Before you start\"")
			}
			wants := []string{"BILL OF MATERIALS", "1.00mm silver-plated bare wire", "6mm drill (mandrel)", "Bring your own iron."}
			if n > 5 {
				wants = append(wants, "0.315mm copper wire", "pvc 12mm (former)")
			}
			for _, want := range wants {
				if !strings.Contains(cover, want) {
					t.Errorf("the cover lacks %q", want)
				}
			}
			listed := regexp.MustCompile(`\bC(\d{4})\b`).FindAllStringSubmatch(cover, -1)
			seen := map[string]int{}
			for _, m := range listed {
				seen[m[1]]++
			}
			for i := 1; i <= n; i++ {
				id := fmt.Sprintf("%04d", i)
				// Once in the coil list, once in the wire's "for" cell and
				// once in the support's.
				if seen[id] < 3 {
					t.Errorf("coil C%s appears %d times on the cover, want 3 (list, wire, support)", id, seen[id])
				}
			}
			for p := first; p < pages; p++ {
				pg := flat(text[p])
				if want := fmt.Sprintf("C%04d", p-first+1); !strings.HasPrefix(pg, want) {
					t.Errorf("page %d does not start with coil %s: %.40q", p+1, want, pg)
				}
				if !strings.Contains(pg, "CAUTION") {
					t.Errorf("coil page %d has no caution", p+1)
				}
			}
			checkInside(t, "A4", words)
		})
	}
}

// Long notes are all printed, continued on new pages; a 3,000-character
// word is broken across lines and never runs off the right edge.
func TestLongTextKept(t *testing.T) {
	t.Parallel()
	var words []string
	for i := range 2500 {
		words = append(words, fmt.Sprintf("w%d", i))
	}
	long := strings.Join(words, " ")
	word := strings.Repeat("x", 2999) + "Z"
	c := manyCoils(t, 2)
	c[0].Notes = long
	c[1].Notes = "see " + word + " end"
	doc := Document{Title: "Notes test", Date: testDate, Notes: long + " " + word, Coils: c}
	pdf := render(t, doc, Options{})
	pages, text, bbox := readBack(t, pdf)
	all := strings.Join(text, " ")
	joined := strings.Join(strings.Fields(all), " ")
	// The job's notes once, coil C0001's once.
	count := map[string]int{}
	for _, f := range strings.Fields(joined) {
		count[f]++
	}
	for i := range 2500 {
		if got := count[fmt.Sprintf("w%d", i)]; got != 2 {
			t.Fatalf("note word w%d printed %d times, want 2 (job notes, coil notes)", i, got)
		}
	}
	// The long word, broken into lines, adds up to the whole word twice.
	xs := strings.Count(strings.ReplaceAll(all, "\n", ""), strings.Repeat("x", 50))
	if got := strings.Count(all, "x"); got < 2*2999 || xs == 0 {
		t.Errorf("the long word's letters: %d, want at least %d", got, 2*2999)
	}
	if got := strings.Count(all, "xZ"); got != 2 {
		t.Errorf("the long word's last letter printed %d times, want 2:\n%s", got, regexp.MustCompile(`.*Z.*`).FindAllString(all, -1))
	}
	if pages < 5 {
		t.Errorf("%d pages: the notes were not continued", pages)
	}
	checkInside(t, "A4", bbox)
}

// Fitting a long title or coil name is linear: a 200 KB title and a 200 KB
// coil name render in well under a second (they took minutes when every
// character removed was measured again).
func TestLongTitleFast(t *testing.T) {
	t.Parallel()
	big := strings.Repeat("Long title ", 200_000/11)
	c := manyCoils(t, 1)
	c[0].Name = strings.Repeat("N", 200_000)
	doc := Document{Title: big, Date: testDate, Coils: c}
	start := time.Now()
	pdf := render(t, doc, Options{})
	if d := time.Since(start); d > 2*time.Second { // generous: about 0.1 s here, minutes before
		t.Errorf("a 200 KB title and name took %v to render", d)
	}
	_, text, words := readBack(t, pdf)
	if !strings.Contains(text[0], "Long title Long title") || !strings.Contains(text[0], "…") {
		t.Errorf("the cover does not show the title shortened with an ellipsis")
	}
	checkInside(t, "A4", words)
}

func BenchmarkLongTitle(b *testing.B) {
	doc := Document{Title: strings.Repeat("Long title ", 200_000/11), Date: testDate, Coils: manyCoils(b, 1)}
	var buf bytes.Buffer
	for b.Loop() {
		buf.Reset()
		if err := Render(&buf, doc, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// Drawings use only the promised scales: 1:1, 1:2, 1:5, 1:10; a coil too
// large even for 1:10 is a schematic marked NOT TO SCALE; a coil under
// 10 mm across gets an enlarged detail marked NOT FULL SIZE beside the
// true-size view.
func TestDrawingScales(t *testing.T) {
	t.Parallel()
	long := coil.Geometry{FormerDiameter: 110e-3, WireDiameter: 2e-3, Turns: 460, Pitch: 5e-3, LeadLength: 50e-3} // 2.3 m long
	doc := Document{Title: "Scales", Date: testDate, Coils: []Coil{
		{Name: "Long", Support: "former", SupportName: "pipe", Prediction: predicted(t, long, 0)},
		vhfCoil(t),
	}}
	pdf := render(t, doc, Options{Uncompressed: true})
	st := pageStreams(pdf)
	if !strings.Contains(st[1], "(SIDE VIEW, NOT TO SCALE: SCHEMATIC)") || !strings.Contains(st[1], "even at 1:10") {
		t.Error("the 2.3 m coil is not marked NOT TO SCALE")
	}
	if regexp.MustCompile(`1:(20|50)\b`).MatchString(st[1]) {
		t.Error("the 2.3 m coil is drawn at a scale the README does not promise")
	}
	if !strings.Contains(st[2], "(SIDE VIEW, FULL SIZE, 1:1)") || !strings.Contains(st[2], "(DETAIL 4:1, NOT FULL SIZE)") {
		t.Error("the small coil lacks its true-size view or its marked detail")
	}
	const ptmm = 72 / 25.4
	do := float64(doc.Coils[1].Prediction.Geometry.WireDiameter) * 1e3 * ptmm
	for tag, k := range map[string]float64{"TWWireDots": 1, "TWDetailWireDots": 4} {
		dots := markedPaths(t, st[2], tag)
		if len(dots) != 1 || len(dots[0]) == 0 {
			t.Fatalf("%s not drawn once", tag)
		}
		x0, _, x1, _ := dots[0][0].bbox()
		if math.Abs((x1-x0)-k*do) > implTol*k {
			t.Errorf("%s: the wire is %.3f pt across, want %g × %.3f pt", tag, x1-x0, k, do)
		}
	}
}

// The chart page prints every stretch of the dial a band is on, as the
// span command does, with ends that differ, and no band is thinner than a
// grid line.
func TestSpanFindings(t *testing.T) {
	t.Parallel()
	sp := &Span{Bands: []Band{
		// The cramped spot at the low range's end and the usable stretch on the high range (invented layout data).
		{Label: "20m", Low: 14.0e6, High: 14.35e6, Range: "both", DialLow: 0.012, DialHigh: 0.009,
			Ranges: []BandRange{{Range: "low", DialLow: 0.012, DialHigh: 0.009, Whole: true}, {Range: "high", DialLow: 0.62, DialHigh: 0.55, Whole: true}}},
		{Label: "30m", Low: 10.1e6, High: 10.15e6, Range: "low", DialLow: 0.0502, DialHigh: 0.0498},
	}}
	s := newSheet(&Document{Date: testDate, Title: "x"}, Options{})
	got := strings.Join(s.spanFindings(sp), "\n")
	for _, want := range []string{
		"20m: low range, dial 0.9 % to 1.2 %; high range, dial 55.0 % to 62.0 %.",
		"30m: low range, dial 4.98 % to 5.02 %.",
	} {
		if !strings.Contains(got, want) {
			t.Errorf("findings lack %q:\n%s", want, got)
		}
	}
	if minBandH <= 0.1*2 { // the grid line is 0.1 mm wide (spanChart)
		t.Errorf("a band %g mm high can hide under a grid line", minBandH)
	}
}

// The same wire described two ways is one line of the bill of materials,
// printed as its stock row states it.
func TestBOMMergesWire(t *testing.T) {
	t.Parallel()
	c := manyCoils(t, 4) // C0001 and C0004 share the 1 mm wire, C0002 the 0.60 mm one, C0003 the 0.315 mm one
	c[3].Wire, c[3].WireKey = "1.0 mm bare silver-plated wire", "1.0 mm bare silver-plated wire"
	c[2].Wire, c[2].WireKey = "0.32 mm copper wire, grade 1 enamel (0.35 mm overall)", "0.32 mm copper wire, grade 1 enamel (0.35 mm overall)"
	extra := c[2]
	extra.Name = "C0005"
	extra.Wire, extra.WireKey = "0.315mm copper wire, grade 1 enamel (0.35 mm overall)", "0.315mm copper wire, grade 1 enamel (0.35 mm overall)"
	c = append(c, extra)
	doc := Document{Title: "merge", Date: testDate, Coils: c}
	if err := check(&doc); err != nil {
		t.Fatal(err)
	}
	wires, _, _ := newSheet(&doc, Options{}).bomLines()
	if len(wires) != 3 {
		t.Fatalf("%d wire lines, want 3", len(wires))
	}
	for _, w := range wires {
		if strings.HasPrefix(w.desc, "0.32 mm") || strings.HasPrefix(w.desc, "1.0 mm") {
			t.Errorf("wire printed as %q, not as its row states it", w.desc)
		}
	}
	if got := strings.Join(wires[0].uses, ", "); got != "C0001 × 1, C0004 × 1" {
		t.Errorf("1 mm wire for %q", got)
	}
}
