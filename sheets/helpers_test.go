package sheets

import (
	"bytes"
	"flag"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"time"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
)

var update = flag.Bool("update", false, "rewrite the golden PDFs in testdata")

var testDate = time.Date(2026, 3, 14, 0, 0, 0, 0, time.UTC)

// predicted evaluates the model for a test coil.
func predicted(t testing.TB, g coil.Geometry, f unit.Frequency) coil.Prediction {
	t.Helper()
	p, err := coil.Predict(g, f)
	if err != nil {
		t.Fatal(err)
	}
	return p
}

// vhfCoil is 5 turns of 1 mm bare wire on a 6 mm mandrel, 10 mm long,
// tapped one turn up: whole turns, so the bottom row of crossings spans
// the outside length exactly.
func vhfCoil(t testing.TB) Coil {
	g := coil.Geometry{FormerDiameter: 6e-3, WireDiameter: 1e-3, Conductor: coil.SilverPlated, Turns: 5, Pitch: 2.25e-3, LeadLength: 4e-3}
	p := predicted(t, g, 137.5e6)
	dl, err := coil.LengthPerPercent(g, 137.5e6)
	if err != nil {
		t.Fatal(err)
	}
	least, most, err := coil.Window(g, 137.5e6)
	if err != nil {
		t.Fatal(err)
	}
	s, err := coil.Tap(g, 1, 137.5e6)
	if err != nil {
		t.Fatal(err)
	}
	return Coil{
		Name: "L1 input", Quantity: 3, Notes: "Tap for 50 ohm.",
		Wire: "1.00mm silver-plated bare wire", WireKey: "1.00mm silver-plated bare wire",
		Support: "mandrel", SupportName: "6mm drill", SpringbackSource: "none",
		Prediction: p, TrimPerPercent: dl, TrimLeast: least, TrimMost: most,
		Tap: &Tap{Turns: s.TapTurns, Ratio: s.Ratio,
			LBelow: s.LB, LAbove: s.LA, Mutual: s.M, Coupling: s.K},
	}
}

// hfCoil is a close-wound enamelled coil on a former with a made-up
// two-gang chart holding one coincidence. The chart data are invented for
// the layout test; they are not a solution of the circuit.
func hfCoil(t testing.TB) Coil {
	g := coil.Geometry{FormerDiameter: 25e-3, WireDiameter: 0.5e-3, WireOverall: 0.54e-3, Turns: 28.25, Pitch: 0.54e-3, LeadLength: 30e-3}
	p := predicted(t, g, 5e6)
	var dial []DialPoint
	for i := 0; i <= 100; i++ {
		x := float64(i) / 100
		fl := 8.1e6 / (1 + 3.4*x)
		dial = append(dial, DialPoint{Setting: x, FLow: unit.Frequency(fl), FHigh: unit.Frequency(4.1 * fl)})
	}
	return Coil{
		Name: "HF front end", Quantity: 2, Wire: "0.50 mm copper wire, grade 1 enamel (0.54 mm overall)",
		Support: "former", SupportName: "pvc 25mm", CloseWound: true, Prediction: p,
		Tap: &Tap{Turns: 8.75},
		Span: &Span{
			GangA: "12 pF–365 pF", GangB: "12 pF–365 pF", Law: "straight-line capacitance",
			Dial:         dial,
			Bands:        []Band{{Low: 3.5e6, High: 3.8e6, Label: "80m", Range: "low", DialLow: 0.34, DialHigh: 0.39}},
			Coincidences: []Coincidence{{Setting: 0.37, Order: 2, Band: "80m", FLow: 3.6e6, FHigh: 7.25e6, Depth: 0.4}},
			Overlap:      945e3,
		},
		Warnings: []string{"an invented warning to show the box"},
	}
}

func testDoc(t testing.TB, paper string) Document {
	return Document{
		Title: "Test bench", Date: testDate, Paper: paper, Source: "test.toml",
		Notes: "Two coils for the layout tests.",
		Coils: []Coil{vhfCoil(t), hfCoil(t)},
	}
}

func render(t testing.TB, doc Document, opt Options) []byte {
	t.Helper()
	var b bytes.Buffer
	if err := Render(&b, doc, opt); err != nil {
		t.Fatal(err)
	}
	return b.Bytes()
}

// --- a small reader for gofpdf's uncompressed content streams ------------

// pageStreams returns each page's content stream, in page order. The test
// documents use core fonts and no images, so every stream is a page's.
func pageStreams(pdf []byte) []string {
	var out []string
	re := regexp.MustCompile(`(?s)stream\n(.*?)\nendstream`)
	for _, m := range re.FindAllSubmatch(pdf, -1) {
		out = append(out, string(m[1]))
	}
	return out
}

// path is one painted path: its points in PDF units and how it was painted.
type path struct {
	pts   [][2]float64
	paint string
	rects [][4]float64 // x, y, w, h of re operators
}

func (p path) bbox() (x0, y0, x1, y1 float64) {
	x0, y0, x1, y1 = 1e9, 1e9, -1e9, -1e9
	for _, q := range p.pts {
		x0, y0, x1, y1 = min(x0, q[0]), min(y0, q[1]), max(x1, q[0]), max(y1, q[1])
	}
	return
}

// markedPaths returns, for each occurrence of the marked-content tag in
// stream, the paths painted inside it.
func markedPaths(t *testing.T, stream, tag string) [][]path {
	t.Helper()
	var out [][]path
	for _, chunk := range strings.Split(stream, "/"+tag+" BMC")[1:] {
		end := strings.Index(chunk, "EMC")
		if end < 0 {
			t.Fatalf("%s: no EMC", tag)
		}
		out = append(out, parsePaths(t, chunk[:end]))
	}
	return out
}

func parsePaths(t *testing.T, ops string) []path {
	t.Helper()
	var paths []path
	var cur path
	var nums []float64
	for _, tok := range strings.Fields(ops) {
		if v, err := strconv.ParseFloat(tok, 64); err == nil {
			nums = append(nums, v)
			continue
		}
		switch tok {
		case "m", "l":
			cur.pts = append(cur.pts, [2]float64{nums[0], nums[1]})
		case "c":
			for i := 0; i+1 < len(nums); i += 2 {
				cur.pts = append(cur.pts, [2]float64{nums[i], nums[i+1]})
			}
		case "re":
			cur.rects = append(cur.rects, [4]float64{nums[0], nums[1], nums[2], nums[3]})
			cur.pts = append(cur.pts, [2]float64{nums[0], nums[1]}, [2]float64{nums[0] + nums[2], nums[1] + nums[3]})
		case "S", "f", "B", "f*", "B*", "s", "b":
			cur.paint = tok
			paths = append(paths, cur)
			cur = path{}
		}
		nums = nums[:0]
	}
	return paths
}

// goldenPath is where a golden PDF lives.
func goldenPath(name string) string { return filepath.Join("testdata", name) }
