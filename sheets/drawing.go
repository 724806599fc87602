package sheets

import (
	"fmt"
	"math"
	"strings"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"github.com/jung-kurt/gofpdf"
)

// The side view: the helix at true pitch seen from the side, cold end on
// the left, with its leads, the bore, the dimensions a builder checks with
// calipers, turn counts from the cold end and the tap.

// scales are the drawing scales tried in turn; 1 is full size. These are
// the only true scales a page uses: a coil that does not fit at 1:10 is
// drawn as a schematic marked NOT TO SCALE.
var scales = []float64{1, 0.5, 0.2, 0.1}

// detailScales are the enlargements tried for the detail of a small coil.
var detailScales = []float64{5, 4, 3, 2}

// smallCoil is the outside diameter under which a 1:1 view is too small to
// read (arrows vanish, turns blur) and an enlarged detail is added, mm.
const smallCoil = 10.0

// Space around the coil body, mm on paper.
const (
	viewTop     = 9.0  // turn numbers and the pitch dimension
	viewBottom  = 13.5 // outside-length dimension and end labels
	tapLabelH   = 5.5  // the tap's label, above or below
	viewSide    = 21.0 // vertical dimensions and their labels, each side
	maxLeadDraw = 14.0 // longer leads are drawn broken
)

// view is the side view's geometry. Sizes are true millimetres; positions
// are on the page.
type view struct {
	sc               float64 // paper mm per true mm
	n                float64 // turns
	p, do, dm        float64 // pitch, wire overall diameter, mean diameter
	id, od           float64 // bore and outside diameter
	lout             float64 // outside length (N−1)·p + d_o
	lead, leadDrawn  float64 // lead length: true, and on paper
	x0, ya           float64 // left edge of the first crossing; axis
	thetaEnd         float64 // 2πN
	tap              float64 // turns from the cold end; 0 for none
	schematic        bool    // sc is not a true scale: NOT TO SCALE
	detail           bool    // an enlarged detail beside the true-size view
	leftW, totalW    float64
	height, topSpace float64
}

func newView(c *Coil) *view {
	p := c.Prediction
	g := p.Geometry
	do := float64(g.WireOverall)
	if do == 0 {
		do = float64(g.WireDiameter)
	}
	v := &view{
		n:        g.Turns,
		p:        float64(g.Pitch) * 1e3,
		do:       do * 1e3,
		dm:       float64(p.MeanDiameter) * 1e3,
		id:       float64(p.InsideDiameter) * 1e3,
		od:       float64(p.OutsideDiameter) * 1e3,
		lout:     float64(p.WindingLength) * 1e3,
		lead:     float64(g.LeadLength) * 1e3,
		thetaEnd: 2 * math.Pi * g.Turns,
	}
	if c.Tap != nil {
		v.tap = c.Tap.Turns
	}
	return v
}

// setScale sizes the view at scale sc.
func (v *view) setScale(sc float64) {
	v.sc = sc
	v.leadDrawn = math.Min(v.lead*sc, maxLeadDraw)
	body := (v.n*v.p + v.do) * sc
	v.leftW = viewSide + v.leadDrawn
	v.totalW = 2*viewSide + 2*v.leadDrawn + body
	v.topSpace = viewTop
	bottom := viewBottom
	if v.tap > 0 {
		if v.tapOnTop() {
			v.topSpace += tapLabelH
		} else {
			bottom += tapLabelH - 2.5
		}
	}
	v.height = v.topSpace + v.od*sc + bottom
}

// tapOnTop reports whether the tap is on the upper half of the view (at a
// top crossing or on the front), where its label goes above the coil.
func (v *view) tapOnTop() bool { return math.Cos(2*math.Pi*v.tap) > -0.5 }

func (v *view) x(theta float64) float64 {
	return v.x0 + v.sc*(v.do/2+v.p*theta/(2*math.Pi))
}

func (v *view) y(theta float64) float64 {
	return v.ya - v.sc*(v.dm/2)*math.Cos(theta)
}

// fitScale is the scale at which the view fills a box w wide and h high:
// for a schematic, never one of the true scales.
func (v *view) fitScale(w, h float64) float64 {
	body := v.n*v.p + v.do
	bottom := viewBottom + tapLabelH
	sc := min((w-2*viewSide-2*maxLeadDraw)/body, (h-viewTop-bottom)/v.od)
	return max(sc, 1e-4)
}

// tag names a marked-content sequence; the detail's are its own, so that
// measuring the true-size view finds it alone.
func (v *view) tag(name string) string {
	if v.detail {
		return "TWDetail" + strings.TrimPrefix(name, "TW")
	}
	return name
}

// scaleLabel says how the view is drawn.
func (v *view) scaleLabel() string {
	switch {
	case v.schematic:
		return "NOT TO SCALE: schematic"
	case v.sc == 1:
		return "full size, 1:1"
	case v.sc > 1:
		return fmt.Sprintf("ENLARGED %.0f:1, NOT FULL SIZE", v.sc)
	}
	return fmt.Sprintf("NOT FULL SIZE: drawn at 1:%.0f", 1/v.sc)
}

// sideView draws the view with its top-left corner at (x, y) in a box of
// width w (the view is centred in it).
func (s *sheet) sideView(v *view, c *Coil, x, y, w float64) {
	pdf := s.pdf
	v.x0 = x + (w-v.totalW)/2 + v.leftW
	v.ya = y + v.topSpace + v.od*v.sc/2
	top := v.ya - v.od*v.sc/2
	bot := v.ya + v.od*v.sc/2
	xStart, xEnd := v.x(0), v.x(v.thetaEnd)
	s.black()

	// Axis and bore (the mandrel or former) behind the wire.
	pdf.SetLineWidth(0.15)
	s.dashed(3, 1, 0.6, 1)
	pdf.Line(xStart-5, v.ya, xEnd+5, v.ya)
	idT, idB := v.ya-v.id*v.sc/2, v.ya+v.id*v.sc/2
	if c.Support == coil.SupportFormer {
		// The former: a tube running on past the winding, solid.
		s.dashed()
		ext := math.Min(10, v.leadDrawn+2)
		pdf.SetLineWidth(0.3)
		pdf.Rect(xStart-ext, idT, xEnd-xStart+2*ext, idB-idT, "D")
		pdf.SetLineWidth(0.15)
	} else {
		s.dashed(1.2, 0.8)
		pdf.Line(xStart-3, idT, xEnd+3, idT)
		pdf.Line(xStart-3, idB, xEnd+3, idB)
		s.dashed()
	}

	// Back halves of the turns: hidden, dashed.
	pdf.SetLineWidth(0.25)
	s.dashed(0.8, 0.6)
	for k := 0.0; 2*math.Pi*k+math.Pi < v.thetaEnd; k++ {
		s.helix(v, 2*math.Pi*k+math.Pi, math.Min(2*math.Pi*(k+1), v.thetaEnd))
	}
	s.dashed()

	// Leads: straight out along the axis from each end, at their true
	// length unless longer than maxLeadDraw.
	wire := v.do * v.sc
	pdf.SetLineCapStyle("butt")
	pdf.SetLineWidth(wire)
	yS, yE := v.y(0), v.y(v.thetaEnd)
	pdf.Line(xStart-v.leadDrawn, yS, xStart, yS)
	pdf.Line(xEnd, yE, xEnd+v.leadDrawn, yE)
	if v.lead*v.sc > maxLeadDraw+1e-9 {
		s.breakMark(xStart-v.leadDrawn/2, yS, wire)
		s.breakMark(xEnd+v.leadDrawn/2, yE, wire)
	}

	// Front halves: solid, the wire's full overall diameter.
	tube := wire >= 0.5
	outline := math.Min(0.225, 0.28*wire)
	pdf.SetLineCapStyle("round")
	front := func(width float64) {
		pdf.SetLineWidth(width)
		for k := 0.0; 2*math.Pi*k < v.thetaEnd; k++ {
			s.helix(v, 2*math.Pi*k, math.Min(2*math.Pi*k+math.Pi, v.thetaEnd))
		}
	}
	front(wire)
	// Where the wire crosses the silhouette, and its two ends.
	var dots []float64
	for k := 0.0; k*math.Pi <= v.thetaEnd+1e-9; k++ {
		dots = append(dots, k*math.Pi)
	}
	if math.Abs(dots[len(dots)-1]-v.thetaEnd) > 1e-9 {
		dots = append(dots, v.thetaEnd)
	}
	s.marked(v.tag("TWWireDots"), func() {
		for _, th := range dots {
			s.disc(v.x(th), v.y(th), wire/2)
		}
	})
	if tube {
		// Outline the wire so that touching turns stay countable.
		pdf.SetDrawColor(255, 255, 255)
		pdf.SetFillColor(255, 255, 255)
		front(wire - 2*outline)
		for _, th := range dots {
			s.disc(v.x(th), v.y(th), wire/2-outline)
		}
		s.black()
	}
	pdf.SetLineCapStyle("butt")

	s.turnNumbers(v, top)
	s.pitchDim(v, top)
	s.verticalDims(v, xStart-v.leadDrawn-4, xEnd+v.leadDrawn+4)

	// Outside length, centred on the winding.
	xc := v.x(math.Pi * v.n)
	xa, xb := xc-v.lout*v.sc/2, xc+v.lout*v.sc/2
	yd := bot + 5
	pdf.SetLineWidth(0.15)
	pdf.Line(xa, bot+0.8, xa, yd+1.2)
	pdf.Line(xb, bot+0.8, xb, yd+1.2)
	s.marked(v.tag("TWLengthDim"), func() { pdf.SetLineWidth(0.2); pdf.Line(xa, yd, xb, yd) })
	s.arrow(xa, yd, xb, yd, v.lout*v.sc > 4.5)
	s.font("B", smallSize+0.5)
	s.textCenter(xc, yd+4, "outside length "+s.u.of(v.lout/1e3))
	s.font("", smallSize)
	s.textCenter(xc, yd+7.2, "over the turns, as calipers measure it")

	// Ends and leads, under the coil beside the length dimension.
	leadText := "lead " + s.u.lead(v.lead/1e3)
	if v.lead*v.sc > maxLeadDraw+1e-9 {
		leadText += ", drawn short"
	}
	s.font("B", smallSize)
	s.textRight(xa-1.5, bot+3.4, "COLD END (ground)")
	s.text(xb+1.5, bot+3.4, "HOT END")
	s.font("", smallSize)
	s.textRight(xa-1.5, bot+6.4, leadText)
	s.text(xb+1.5, bot+6.4, leadText)

	if v.tap > 0 {
		s.tapMark(v, c, top, bot)
	}
}

// helix strokes the wire's centre line from angle a to b.
func (s *sheet) helix(v *view, a, b float64) {
	if b <= a {
		return
	}
	steps := max(2, int(math.Ceil((b-a)/(math.Pi/32))))
	s.pdf.MoveTo(v.x(a), v.y(a))
	for i := 1; i <= steps; i++ {
		th := a + (b-a)*float64(i)/float64(steps)
		s.pdf.LineTo(v.x(th), v.y(th))
	}
	s.pdf.DrawPath("D")
}

// disc fills a circle from four Bézier quarters, so that the path's extreme
// points are exactly the circle's.
func (s *sheet) disc(cx, cy, r float64) {
	const kappa = 0.5522847498 // 4(√2−1)/3: a cubic Bézier quarter circle
	k := kappa * r
	pdf := s.pdf
	pdf.MoveTo(cx+r, cy)
	pdf.CurveBezierCubicTo(cx+r, cy+k, cx+k, cy+r, cx, cy+r)
	pdf.CurveBezierCubicTo(cx-k, cy+r, cx-r, cy+k, cx-r, cy)
	pdf.CurveBezierCubicTo(cx-r, cy-k, cx-k, cy-r, cx, cy-r)
	pdf.CurveBezierCubicTo(cx+k, cy-r, cx+r, cy-k, cx+r, cy)
	pdf.ClosePath()
	pdf.DrawPath("F")
}

// breakMark draws the two slashes of a shortened lead.
func (s *sheet) breakMark(x, y, wire float64) {
	pdf := s.pdf
	pdf.SetFillColor(255, 255, 255)
	pdf.Rect(x-0.6, y-wire/2-0.3, 1.2, wire+0.6, "F")
	s.black()
	pdf.SetLineWidth(0.2)
	h := wire/2 + 1.2
	pdf.Line(x-1.1, y+h, x-0.1, y-h)
	pdf.Line(x+0.1, y+h, x+1.1, y-h)
	pdf.SetLineWidth(wire)
}

// labelStep is how many turns apart labels must be to stay legible.
func labelStep(pitchOnPaper, minGap float64) int {
	for _, k := range []int{1, 2, 5, 10, 20, 50, 100, 200, 500, 1000} {
		if float64(k)*pitchOnPaper >= minGap {
			return k
		}
	}
	return 2000
}

// turnNumbers counts turns from the cold end over the top crossings.
func (s *sheet) turnNumbers(v *view, top float64) {
	s.font("", 6)
	step := labelStep(v.p*v.sc, 3.6)
	y := top - 1.6
	last := -1.0
	clear := func(x float64) bool { return v.tap == 0 || math.Abs(x-v.x(2*math.Pi*v.tap)) > 1.6 }
	for k := 0; float64(k) <= v.n+1e-9; k += step {
		if x := v.x(2 * math.Pi * float64(k)); clear(x) {
			s.textCenter(x, y, fmt.Sprint(k))
		}
		last = float64(k)
	}
	if whole := math.Floor(v.n + 1e-9); whole > last && (whole-last)*v.p*v.sc >= 3.6 && clear(v.x(2*math.Pi*whole)) {
		s.textCenter(v.x(2*math.Pi*whole), y, fmt.Sprint(whole))
	}
	s.textRight(v.x(0)-2.5, y, "turns")
}

// pitchDim marks one pitch between two top crossings near the middle.
func (s *sheet) pitchDim(v *view, top float64) {
	if v.n < 1 {
		return
	}
	k := math.Floor((v.n - 1) / 2)
	x1, x2 := v.x(2*math.Pi*k), v.x(2*math.Pi*(k+1))
	y := top - 6.5
	pdf := s.pdf
	pdf.SetLineWidth(0.15)
	pdf.Line(x1, y-1.2, x1, top-4)
	pdf.Line(x2, y-1.2, x2, top-4)
	if x2-x1 > 4.5 {
		s.arrow(x1, y, x2, y, true)
	} else {
		s.arrow(x1-3, y, x1, y, false)
		s.arrow(x2, y, x2+3, y, false)
		pdf.Line(x1, y, x2, y)
	}
	s.font("", smallSize)
	label := "pitch " + s.u.of(v.p/1e3)
	if math.Abs(v.p-v.do) < 1e-6 {
		label += " (close-wound)"
	}
	s.text(x2+3.5, y+0.9, label)
}

// verticalDims shows the outside diameter on the left and the bore on the
// right, outside the leads.
func (s *sheet) verticalDims(v *view, xl, xr float64) {
	pdf := s.pdf
	odT, odB := v.ya-v.od*v.sc/2, v.ya+v.od*v.sc/2
	idT, idB := v.ya-v.id*v.sc/2, v.ya+v.id*v.sc/2
	pdf.SetLineWidth(0.15)
	s.dashed(0.5, 0.5)
	pdf.Line(xl-1, odT, v.x(0)-v.do*v.sc/2-0.5, odT)
	pdf.Line(xl-1, odB, v.x(math.Pi)-v.do*v.sc/2-0.5, odB)
	pdf.Line(v.x(v.thetaEnd)+3.2, idT, xr+1, idT)
	pdf.Line(v.x(v.thetaEnd)+3.2, idB, xr+1, idB)
	s.dashed()
	s.arrow(xl, odT, xl, odB, v.od*v.sc > 4.5)
	s.arrow(xr, idT, xr, idB, v.id*v.sc > 4.5)
	s.font("B", smallSize)
	s.textRight(xl-1.5, v.ya-0.5, "outside dia.")
	s.textRight(xl-1.5, v.ya+2.7, s.u.of(v.od/1e3))
	s.text(xr+1.5, v.ya-0.5, "bore")
	s.text(xr+1.5, v.ya+2.7, s.u.of(v.id/1e3))
}

// tapMark rings the tap on the drawing and labels it.
func (s *sheet) tapMark(v *view, c *Coil, top, bot float64) {
	th := 2 * math.Pi * v.tap
	x, y := v.x(th), v.y(th)
	pdf := s.pdf
	r := v.do*v.sc/2 + 1.3
	pdf.SetLineWidth(0.45)
	pdf.Circle(x, y, r, "D")
	s.font("B", smallSize+0.5)
	label := "TAP: " + quantity.FormatTurnsWord(v.tap) + " from the cold end"
	onTop := v.tapOnTop()
	var ly float64
	if onTop {
		ly = top - 11
		s.arrow(x, ly+1, x, y-r, false)
		s.pdf.Polygon([]gofpdf.PointType{{X: x, Y: y - r}, {X: x - 0.7, Y: y - r - 1.8}, {X: x + 0.7, Y: y - r - 1.8}}, "F")
	} else {
		ly = bot + 15.5
		s.arrow(x, ly-3.2, x, y+r, false)
		s.pdf.Polygon([]gofpdf.PointType{{X: x, Y: y + r}, {X: x - 0.7, Y: y + r + 1.8}, {X: x + 0.7, Y: y + r + 1.8}}, "F")
	}
	tw := s.width(label)
	lx := math.Min(math.Max(x-tw/2, margin), s.w-margin-tw)
	pdf.SetFillColor(255, 255, 255)
	pdf.Rect(lx-0.8, ly-2.8, tw+1.6, 3.8, "F")
	s.black()
	s.text(lx, ly, label)
}
