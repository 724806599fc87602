package sheets

import (
	"bytes"
	"fmt"
	"image"
	"image/png"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"
	"turnwise/internal/quantity"

	"turnwise/coil"
	"turnwise/internal/testtools"

	"gonum.org/v1/gonum/unit"
)

// Tolerances.
const (
	// implTol: gofpdf writes coordinates rounded to 0.01 pt, so a distance
	// between two written coordinates is within 0.01 pt of the exact one.
	implTol = 0.0101 // pt
)

// Page sizes in PDF points; the point is 1/72 in (ISO 32000-1, default user space unit, from memory).
var pageSizes = map[string][2]float64{
	"A4":     {210 / 25.4 * 72, 297 / 25.4 * 72}, // ISO 216 A4, 210 × 297 mm (from memory)
	"Letter": {8.5 * 72, 11 * 72},                // ANSI/ASME Y14.1 Letter, 8.5 × 11 in (from memory)
}

// The sheets match the golden PDFs in testdata by what they show, never by
// their bytes (a CPU that fuses multiply-adds writes some coordinates 0.01 pt
// apart and breaks a rounding tie in the text the other way): the page count
// and size (pdfinfo), the text of every page (pdftotext; a printed number
// may be one unit off in its last digit), and every measured drawing (the
// marked-content paths, point by point within two steps of the 0.01 pt
// gofpdf writes to). go test ./sheets -update rewrites the goldens; look at
// them before committing.
func TestRenderGolden(t *testing.T) {
	for _, paper := range []string{"A4", "Letter"} {
		t.Run(paper, func(t *testing.T) {
			got := render(t, testDoc(t, paper), Options{Uncompressed: true})
			path := goldenPath("sheets-" + strings.ToLower(paper) + ".pdf")
			if *update {
				if err := os.WriteFile(path, got, 0o644); err != nil {
					t.Fatal(err)
				}
				return
			}
			want, err := os.ReadFile(path)
			if err != nil {
				t.Fatalf("golden %s missing (run go test ./sheets -update): %v", path, err)
			}
			hint := fmt.Sprintf("; if the change is intended run go test ./sheets -update and look at %s", path)
			sameMeasurements(t, pageStreams(got), pageStreams(want), hint)

			pdfinfo := testtools.Need(t, "pdfinfo", "poppler-utils")
			pdftotext := testtools.Need(t, "pdftotext", "poppler-utils")
			file := filepath.Join(t.TempDir(), "got.pdf")
			if err := os.WriteFile(file, got, 0o644); err != nil {
				t.Fatal(err)
			}
			pages := regexp.MustCompile(`(?m)^(Pages|Page size):.*$`)
			infoGot, err := exec.Command(pdfinfo, file).Output()
			if err != nil {
				t.Fatal(err)
			}
			infoWant, err := exec.Command(pdfinfo, path).Output()
			if err != nil {
				t.Fatal(err)
			}
			if g, w := pages.FindAll(infoGot, -1), pages.FindAll(infoWant, -1); len(w) != 2 || !bytes.Equal(bytes.Join(g, nil), bytes.Join(w, nil)) {
				t.Errorf("pdfinfo: got %q, want %q%s", g, w, hint)
			}
			textGot, err := exec.Command(pdftotext, "-raw", file, "-").Output()
			if err != nil {
				t.Fatal(err)
			}
			textWant, err := exec.Command(pdftotext, "-raw", path, "-").Output()
			if err != nil {
				t.Fatal(err)
			}
			if err := testtools.SameText(string(textGot), string(textWant)); err != nil {
				t.Errorf("text differs from the golden: %v%s", err, hint)
			}
		})
	}
}

// sameMeasurements compares the marked-content drawings of two renders
// page by page: the same tags, paths, paint operators and point counts,
// every point within 2·implTol (each of two builds rounds to 0.01 pt).
func sameMeasurements(t *testing.T, got, want []string, hint string) {
	t.Helper()
	if len(got) != len(want) {
		t.Fatalf("%d pages, want %d%s", len(got), len(want), hint)
	}
	tags := regexp.MustCompile(`/(TW\w+) BMC`)
	for page := range want {
		seen := map[string]bool{}
		for _, m := range append(tags.FindAllStringSubmatch(want[page], -1), tags.FindAllStringSubmatch(got[page], -1)...) {
			tag := m[1]
			if seen[tag] {
				continue
			}
			seen[tag] = true
			pg, pw := markedPaths(t, got[page], tag), markedPaths(t, want[page], tag)
			where := fmt.Sprintf("page %d %s", page+1, tag)
			if len(pg) != len(pw) {
				t.Errorf("%s: drawn %d times, want %d%s", where, len(pg), len(pw), hint)
				continue
			}
			for i := range pw {
				if len(pg[i]) != len(pw[i]) {
					t.Errorf("%s #%d: %d paths, want %d%s", where, i, len(pg[i]), len(pw[i]), hint)
					continue
				}
				for j, w := range pw[i] {
					g := pg[i][j]
					if g.paint != w.paint || len(g.pts) != len(w.pts) || len(g.rects) != len(w.rects) {
						t.Errorf("%s #%d path %d: painted %q with %d points, want %q with %d%s", where, i, j, g.paint, len(g.pts), w.paint, len(w.pts), hint)
						continue
					}
					for k := range w.pts {
						if math.Abs(g.pts[k][0]-w.pts[k][0]) > 2*implTol || math.Abs(g.pts[k][1]-w.pts[k][1]) > 2*implTol {
							t.Errorf("%s #%d path %d point %d: %v pt, want %v pt%s", where, i, j, k, g.pts[k], w.pts[k], hint)
							break
						}
					}
				}
			}
		}
	}
}

// The same input gives the same bytes, compressed or not.
func TestRenderDeterministic(t *testing.T) {
	t.Parallel()
	for _, opt := range []Options{{}, {Uncompressed: true}} {
		a := render(t, testDoc(t, "A4"), opt)
		b := render(t, testDoc(t, "A4"), opt)
		if !bytes.Equal(a, b) {
			t.Errorf("options %+v: two renders differ", opt)
		}
	}
}

// The scale bar, the wire of the side view, the outside-length dimension
// and the pitch template measure what the model says, in PDF units.
func TestFullSize(t *testing.T) {
	t.Parallel()
	const ptPerMM = 72 / 25.4 // the PDF point is 1/72 in; 1 in = 25.4 mm (international inch)
	for _, paper := range []string{"A4", "Letter"} {
		doc := testDoc(t, paper)
		pdf := render(t, doc, Options{Uncompressed: true})
		streams := pageStreams(pdf)
		if want := 1 + len(doc.Coils) + 1; len(streams) != want {
			t.Fatalf("%s: %d content streams, want %d pages", paper, len(streams), want)
		}
		mb := regexp.MustCompile(`/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]`).FindSubmatch(pdf)
		if mb == nil {
			t.Fatalf("%s: no MediaBox", paper)
		}
		w, _ := strconv.ParseFloat(string(mb[1]), 64)
		h, _ := strconv.ParseFloat(string(mb[2]), 64)
		if math.Abs(w-pageSizes[paper][0]) > implTol || math.Abs(h-pageSizes[paper][1]) > implTol {
			t.Errorf("%s: MediaBox %g × %g pt, want %.2f × %.2f", paper, w, h, pageSizes[paper][0], pageSizes[paper][1])
		}
		page := 1 // the cover is page 0
		for _, c := range doc.Coils {
			s := streams[page]
			name := fmt.Sprintf("%s %s", paper, c.Name)
			g := c.Prediction.Geometry
			do := float64(g.WireOverall)
			if do == 0 {
				do = float64(g.WireDiameter)
			}

			bars := markedPaths(t, s, "TWScaleBar")
			if len(bars) != 1 || len(bars[0]) != 1 || len(bars[0][0].rects) != 1 {
				t.Fatalf("%s: scale bar not found once", name)
			}
			if bw := bars[0][0].rects[0][2]; math.Abs(bw-50*ptPerMM) > implTol {
				t.Errorf("%s: scale bar is %.3f pt, want 50 mm = %.3f pt", name, bw, 50*ptPerMM)
			}

			dots := markedPaths(t, s, "TWWireDots")
			if len(dots) != 1 {
				t.Fatalf("%s: wire dots not found once", name)
			}
			var xs, ys []float64
			top := math.Inf(-1)
			for _, d := range dots[0] {
				x0, y0, x1, y1 := d.bbox()
				if math.Abs((x1-x0)-do*1e3*ptPerMM) > implTol || math.Abs((y1-y0)-do*1e3*ptPerMM) > implTol {
					t.Errorf("%s: a wire dot is %.3f × %.3f pt, want the wire's %.3f pt", name, x1-x0, y1-y0, do*1e3*ptPerMM)
				}
				xs, ys = append(xs, (x0+x1)/2), append(ys, (y0+y1)/2)
				top = max(top, (y0+y1)/2)
			}
			// Vertical extent: the outside diameter.
			lo, hi := math.Inf(1), math.Inf(-1)
			for _, d := range dots[0] {
				_, y0, _, y1 := d.bbox()
				lo, hi = min(lo, y0), max(hi, y1)
			}
			if od := float64(c.Prediction.OutsideDiameter) * 1e3 * ptPerMM; math.Abs((hi-lo)-od) > 2*implTol {
				t.Errorf("%s: drawing is %.3f pt high, want the outside diameter %.3f pt", name, hi-lo, od)
			}
			// Top crossings are one pitch apart.
			var topX []float64
			for i := range xs {
				if math.Abs(ys[i]-top) < 0.1 {
					topX = append(topX, xs[i])
				}
			}
			if len(topX) < int(g.Turns) {
				t.Fatalf("%s: %d top crossings for %g turns", name, len(topX), g.Turns)
			}
			p := float64(g.Pitch) * 1e3 * ptPerMM
			for i := 1; i < len(topX); i++ {
				if math.Abs(topX[i]-topX[i-1]-p) > implTol {
					t.Errorf("%s: crossings %d and %d are %.3f pt apart, want the pitch %.3f pt", name, i-1, i, topX[i]-topX[i-1], p)
					break
				}
			}
			// For whole turns the bottom row spans the outside length.
			lout := float64(c.Prediction.WindingLength) * 1e3 * ptPerMM
			if g.Turns == math.Floor(g.Turns) {
				bx0, bx1 := math.Inf(1), math.Inf(-1)
				for _, d := range dots[0] {
					x0, y0, x1, y1 := d.bbox()
					if math.Abs((y0+y1)/2-lo-do*1e3*ptPerMM/2) < 0.1 {
						bx0, bx1 = min(bx0, x0), max(bx1, x1)
					}
				}
				if math.Abs((bx1-bx0)-lout) > implTol {
					t.Errorf("%s: bottom row spans %.3f pt, want the outside length %.3f pt", name, bx1-bx0, lout)
				}
			}
			dims := markedPaths(t, s, "TWLengthDim")
			if len(dims) != 1 || len(dims[0]) != 1 {
				t.Fatalf("%s: length dimension not found once", name)
			}
			if x0, _, x1, _ := dims[0][0].bbox(); math.Abs((x1-x0)-lout) > implTol {
				t.Errorf("%s: length dimension %.3f pt, want %.3f pt", name, x1-x0, lout)
			}
			tmpl := markedPaths(t, s, "TWPitchTemplate")
			if len(tmpl) != 1 || len(tmpl[0]) < 2 {
				t.Fatalf("%s: pitch template not found", name)
			}
			for i := 1; i < len(tmpl[0]); i++ {
				a, _, _, _ := tmpl[0][i-1].bbox()
				b, _, _, _ := tmpl[0][i].bbox()
				if math.Abs(b-a-p) > implTol {
					t.Errorf("%s: template marks %d and %d are %.3f pt apart, want %.3f pt", name, i-1, i, b-a, p)
					break
				}
			}
			page++
			if c.Span != nil {
				page++
			}
		}
	}
}

// Poppler reads the PDF: page count and size, text of every coil page,
// words inside the page, and a rendered page that is not blank.
func TestPopplerReads(t *testing.T) {
	t.Parallel()
	pdfinfo := testtools.Need(t, "pdfinfo", "poppler-utils")
	pdftotext := testtools.Need(t, "pdftotext", "poppler-utils")
	pdftoppm := testtools.Need(t, "pdftoppm", "poppler-utils")
	for _, paper := range []string{"A4", "Letter"} {
		t.Run(paper, func(t *testing.T) {
			t.Parallel()
			dir := t.TempDir()
			file := filepath.Join(dir, "s.pdf")
			doc := testDoc(t, paper)
			if err := os.WriteFile(file, render(t, doc, Options{}), 0o644); err != nil {
				t.Fatal(err)
			}
			info, err := exec.Command(pdfinfo, file).Output()
			if err != nil {
				t.Fatal(err)
			}
			if !regexp.MustCompile(`Pages:\s+4\n`).Match(info) {
				t.Errorf("pdfinfo: want 4 pages (cover, two coils, one chart):\n%s", info)
			}
			size := fmt.Sprintf("%.2f x %.2f pts", pageSizes[paper][0], pageSizes[paper][1])
			if paper == "Letter" {
				size = "612 x 792 pts"
			}
			if !strings.Contains(string(info), size) {
				t.Errorf("pdfinfo: page size is not %s:\n%s", size, info)
			}
			text := func(page int) string {
				out, err := exec.Command(pdftotext, "-f", fmt.Sprint(page), "-l", fmt.Sprint(page), "-raw", file, "-").Output()
				if err != nil {
					t.Fatal(err)
				}
				return strings.Join(strings.Fields(string(out)), " ")
			}
			v := doc.Coils[0].Prediction
			p2 := text(2)
			for _, want := range []string{
				"L1 input", "BUILD × 3", "5 turns", "TAP: 1 turn from the cold end", "pitch 2.25 mm",
				"outside length " + fmt.Sprintf("%.2f mm", float64(v.WindingLength)*1e3),
				quantity.FormatEng(float64(v.Inductance), "H", 3) + " at 137.5 MHz", // µ and friends survive the encoding
				"Measure the 50 mm bar first", "CAUTION",
			} {
				if !strings.Contains(p2, want) {
					t.Errorf("page 2 lacks %q:\n%s", want, p2)
				}
			}
			p3 := text(3)
			for _, want := range []string{"HF front end", "28¼ turns", quantity.FormatEng(float64(doc.Coils[1].Prediction.Inductance), "H", 3), "µH", "an invented warning"} {
				if !strings.Contains(p3, want) {
					t.Errorf("page 3 lacks %q:\n%s", want, p3)
				}
			}
			p4 := text(4)
			for _, want := range []string{"tuning chart", "80m", "2nd harmonic", "7.200 MHz"} {
				if !strings.Contains(p4, want) {
					t.Errorf("page 4 lacks %q:\n%s", want, p4)
				}
			}

			// Every word lies inside the page margins.
			bbox, err := exec.Command(pdftotext, "-bbox", file, "-").Output()
			if err != nil {
				t.Fatal(err)
			}
			re := regexp.MustCompile(`<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)</word>`)
			const marginPt = 12*72/25.4 - 1 // the 12 mm margin, less 1 pt for glyph side bearings
			for _, m := range re.FindAllStringSubmatch(string(bbox), -1) {
				var b [4]float64
				for i := range b {
					b[i], _ = strconv.ParseFloat(m[i+1], 64)
				}
				if b[0] < marginPt || b[2] > pageSizes[paper][0]-marginPt || b[1] < marginPt || b[3] > pageSizes[paper][1]-marginPt {
					t.Errorf("word %q at %v is outside the margins", m[5], b)
				}
			}

			// A rendered coil page is not blank.
			if out, err := exec.Command(pdftoppm, "-r", "40", "-f", "2", "-l", "2", "-png", file, filepath.Join(dir, "p")).CombinedOutput(); err != nil {
				t.Fatalf("pdftoppm: %v\n%s", err, out)
			}
			pngs, _ := filepath.Glob(filepath.Join(dir, "p*.png"))
			if len(pngs) != 1 {
				t.Fatalf("pdftoppm wrote %v", pngs)
			}
			f, err := os.Open(pngs[0])
			if err != nil {
				t.Fatal(err)
			}
			defer f.Close()
			img, err := png.Decode(f)
			if err != nil {
				t.Fatal(err)
			}
			if dark := darkFraction(img); dark < 0.02 || dark > 0.5 {
				t.Errorf("rendered page 2 is %.1f %% dark: blank or a mess", dark*100)
			}
		})
	}
}

func darkFraction(img image.Image) float64 {
	b := img.Bounds()
	n, dark := 0, 0
	for y := b.Min.Y; y < b.Max.Y; y++ {
		for x := b.Min.X; x < b.Max.X; x++ {
			r, g, bl, _ := img.At(x, y).RGBA()
			if (r+g+bl)/3 < 0x8000 {
				dark++
			}
			n++
		}
	}
	return float64(dark) / float64(n)
}

// A coil too large for the page is scaled and says so; the scale bar is
// still 50 mm.
func TestLargeCoilScaled(t *testing.T) {
	t.Parallel()
	g := coil.Geometry{FormerDiameter: 110e-3, WireDiameter: 2e-3, Turns: 40, Pitch: 5e-3, LeadLength: 50e-3}
	doc := Document{Title: "Big tank", Date: testDate, Coils: []Coil{{Name: "Tank", Support: "former", SupportName: "pipe", Prediction: predicted(t, g, 3.5e6), HighVoltage: true}}}
	pdf := render(t, doc, Options{Uncompressed: true})
	s := pageStreams(pdf)[1]
	if !strings.Contains(s, "(SIDE VIEW, NOT FULL SIZE: DRAWN AT 1:") {
		t.Error("the scaled view is not labelled NOT FULL SIZE")
	}
	bars := markedPaths(t, s, "TWScaleBar")
	if bw := bars[0][0].rects[0][2]; math.Abs(bw-50*72/25.4) > implTol {
		t.Errorf("scale bar %.3f pt", bw)
	}
	if !strings.Contains(s, "(In a transmitter tank") {
		t.Error("a high-voltage coil's cautions do not lead with RF voltage")
	}
}

func TestRenderErrors(t *testing.T) {
	t.Parallel()
	good := func() Document { return testDoc(t, "A4") }
	cases := []struct {
		name string
		edit func(*Document)
		want string
	}{
		{"paper", func(d *Document) { d.Paper = "A3" }, "paper"},
		{"units", func(d *Document) { d.Units = "cubits" }, "units"},
		{"no date", func(d *Document) { d.Date = time.Time{} }, "Date"},
		{"no title", func(d *Document) { d.Title = " " }, "Title"},
		{"no coils", func(d *Document) { d.Coils = nil }, "no coils"},
		{"bad geometry", func(d *Document) { d.Coils[0].Prediction.Geometry.Turns = 0 }, "turns"},
		{"tap outside", func(d *Document) { d.Coils[0].Tap.Turns = 9 }, "tap"},
		{"NaN dial", func(d *Document) { d.Coils[1].Span.Dial[3].FLow = unit.Frequency(math.NaN()) }, "dial"},
		{"allowance", func(d *Document) { d.Allowance = 2 }, "allowance"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			d := good()
			tc.edit(&d)
			var b bytes.Buffer
			err := Render(&b, d, Options{})
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("error %v, want one about %s", err, tc.want)
			}
			if b.Len() != 0 {
				t.Errorf("%d bytes written despite the error", b.Len())
			}
		})
	}
}

func TestFormat(t *testing.T) {
	t.Parallel()
	cases := []struct{ got, want string }{
		{quantity.FormatEng(4.8e-8, "H", 3), "48.0 nH"},
		{quantity.FormatEng(18.5e-6, "H", 3), "18.5 µH"},
		{quantity.FormatEng(137.5e6, "Hz", 4), "137.5 MHz"},
		{quantity.FormatEng(0, "H", 3), "0 H"},
		{quantity.FormatEng(math.NaN(), "H", 3), "n/a"},
		{quantity.FormatCapacitance(0.323e-12), "0.323 pF"},
		{quantity.FormatTurns(5.25), "5¼"}, {quantity.FormatTurns(5.5), "5½"}, {quantity.FormatTurns(5.75), "5¾"}, {quantity.FormatTurns(5), "5"},
		{quantity.FormatTurnsWord(1), "1 turn"}, {quantity.FormatTurnsWord(1.25), "1¼ turns"}, {quantity.FormatTurnsWord(0.25), "¼ turn"}, {quantity.FormatTurnsWord(0.75), "¾ turn"},
		{lengths{}.of(2.25e-3), "2.25 mm"}, {lengths{inches: true}.of(25.4e-3), "1.000 in"},
		{lengths{}.of(2.327), "2.327 m"},
		// Cut lengths: to the millimetre, half away from zero.
		{lengths{}.cut(138.53e-3), "139 mm"}, {lengths{}.cut(138.5e-3), "139 mm"}, {lengths{}.cut(2.32684), "2.327 m"},
		{lengths{inches: true}.cut(138.53e-3), "5.45 in"}, {lengths{inches: true}.cut(0.5), "19.7 in"},
		{lengths{}.lead(4e-3), "4 mm"}, {lengths{}.lead(4.5e-3), "4.5 mm"}, {lengths{inches: true}.lead(4e-3), "0.16 in"},
		// Stock to have: rounded up, never down.
		{lengths{}.stock(2.6994), "2.70 m"}, {lengths{}.stock(2.70), "2.70 m"}, {lengths{}.stock(0.8412), "850 mm"},
		{lengths{inches: true}.stock(1), "40 in"},
	}
	for _, c := range cases {
		if c.got != c.want {
			t.Errorf("got %q, want %q", c.got, c.want)
		}
	}
}

func BenchmarkRender(b *testing.B) {
	doc := testDoc(b, "A4")
	var buf bytes.Buffer
	for b.Loop() {
		buf.Reset()
		if err := Render(&buf, doc, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkPredictReference is one model evaluation, the yardstick for
// BenchmarkRender in the same run.
func BenchmarkPredictReference(b *testing.B) {
	g := vhfCoil(b).Prediction.Geometry
	for b.Loop() {
		if _, err := coil.Predict(g, 137.5e6); err != nil {
			b.Fatal(err)
		}
	}
}

// The wire to cut is printed to the millimetre, the steps add up, and the
// bill of materials totals what the pages print, so an organiser can check
// it by hand.
func TestCutLengths(t *testing.T) {
	t.Parallel()
	doc := testDoc(t, "A4")
	if err := check(&doc); err != nil {
		t.Fatal(err)
	}
	s := newSheet(&doc, Options{})
	// Helix wire N·√((πD)² + p²), D the wire-centre diameter: an
	// independent route to the model's HelixWire, then rounded by hand.
	helix := func(c Coil) float64 {
		g := c.Prediction.Geometry
		do := float64(g.WireOverall)
		if do == 0 {
			do = float64(g.WireDiameter)
		}
		return g.Turns * math.Hypot(math.Pi*(float64(g.FormerDiameter)+do), float64(g.Pitch))
	}
	vhf := doc.Coils[0]                       // 5 turns at 2.25 mm pitch, 7 mm wire-centre diameter, 4 mm leads
	wantHelix := math.Round(helix(vhf) * 1e3) // 110.53 mm → 111
	wantCut := wantHelix + 2*4 + 20           // leads and coil.CutAllowance, both whole mm
	want := fmt.Sprintf("Cut %.0f mm of wire: the winding %.0f mm, two leads of 4 mm and 20 mm to strip and solder.", wantCut, wantHelix)
	if got := s.windingSteps(&vhf)[0]; got != want {
		t.Errorf("first step\n got %q\nwant %q", got, want)
	}

	wires, _, _ := s.bomLines()
	if len(wires) != 2 {
		t.Fatalf("%d wire lines, want 2", len(wires))
	}
	for i, c := range doc.Coils {
		cut := math.Round((helix(c)+2*float64(c.Prediction.Geometry.LeadLength)+0.020)*1e3) / 1e3
		if got, want := wires[i].total, cut*float64(c.Quantity); math.Abs(got-want) > 1e-9 {
			t.Errorf("%s: batch total %.6f m, want %d × %.3f m = %.6f m", c.Name, got, c.Quantity, cut, want)
		}
	}

}
