package sheets

import (
	"fmt"
	"math"
	"strings"
	"turnwise/internal/quantity"

	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// Heights of the fixed blocks of a coil page, mm.
const (
	checkBlockH = 21.5 // scale bar, pitch template and the instruction
	logRowH     = 7.0
	minLogRows  = 2
	maxLogRows  = 4
	minDrawH    = 40.0 // the least height kept for the side view
)

// coilPage draws one coil's page. The side view gets the height the text
// blocks leave; the measurement log gives up rows before the drawing
// gives up full size.
func (s *sheet) coilPage(c *Coil) {
	s.pdf.AddPage()
	s.black()
	x, w := margin, s.contentW()
	y := s.coilHeader(c, margin+6, x, w)

	gap := 5.0
	leftW := w*0.47 - gap/2
	rightW := w - leftW - gap
	steps := s.windingSteps(c)
	values := s.predictedRows(c)
	trim := s.trimText(c)
	s.font("", bodySize)
	stepsH := 5 + s.stepsHeight(leftW, steps)
	valuesH := 5 + s.rowsHeight(rightW, valueLabelW, values) + 7 + s.paraHeight(rightW, trim)
	colsH := math.Max(stepsH, valuesH)
	cautions := s.cautionItems(c)
	cautH := s.cautionHeight(w, cautions)
	logH := func(rows int) float64 { return 8 + float64(rows+1)*logRowH }

	// The coil's notes, as many lines as leave the drawing room; the rest
	// continue on the next page.
	var rest []string
	if strings.TrimSpace(c.Notes) != "" {
		s.font("I", bodySize)
		lh := s.lineH()
		lines := s.wrap(c.Notes, w)
		room := s.bottom() - y - 4 - colsH - checkBlockH - logH(minLogRows) - cautH - 4*sectionGap - minDrawH
		k := len(lines)
		if float64(k)*lh > room {
			k = max(0, int(room/lh)-1)
			rest = lines[k:]
			lines = append(lines[:k:k], "(the notes continue after this page)")
		}
		y += 0.5
		for _, l := range lines {
			s.text(x, y, l)
			y += lh
		}
		s.font("", bodySize)
	}
	y += 4
	avail := func(rows int) float64 {
		return s.bottom() - y - 4 - colsH - checkBlockH - logH(rows) - cautH - 4*sectionGap
	}
	// The largest true scale that fits, giving up log rows before scale;
	// past 1:10, a schematic.
	v := newView(c)
	rows, fits := maxLogRows, false
	for _, sc := range scales {
		v.setScale(sc)
		for rows = maxLogRows; rows >= minLogRows; rows-- {
			if v.totalW <= w && v.height <= avail(rows) {
				fits = true
				break
			}
		}
		if fits {
			break
		}
	}
	if !fits {
		rows = minLogRows
		v.setScale(v.fitScale(w, math.Max(avail(rows), minDrawH)))
		v.schematic = true
	}
	// A small coil at 1:1 gets an enlarged detail beside it.
	var dv *view
	if v.sc == 1 && !v.schematic && v.od < smallCoil {
		for _, k := range detailScales {
			d := newView(c)
			d.detail = true
			d.setScale(k)
			if v.totalW+d.totalW+4 > w {
				continue
			}
			for r := rows; r >= minLogRows; r-- {
				if d.height <= avail(r) {
					dv, rows = d, r
					break
				}
			}
			if dv != nil {
				break
			}
		}
	}
	drawH := math.Max(v.height, avail(rows))

	// Side view.
	s.font("B", 9)
	title := "SIDE VIEW, " + strings.ToUpper(v.scaleLabel())
	s.text(x, y, title)
	tw := s.width(title)
	s.font("", smallSize)
	switch {
	case v.schematic:
		s.text(x+tw+3, y, s.fit("too large for this page even at 1:10: the drawing shows the parts, every number is true size", w-tw-3))
	case dv != nil:
		s.text(x+tw+3, y, "left: hold the finished coil against it; measure the 50 mm bar first")
	case v.sc == 1:
		s.text(x+tw+3, y, "hold the finished coil against it; measure the 50 mm bar first")
	default:
		s.text(x+tw+3, y, "the coil is too large to draw full size here; every number is true size")
	}
	s.pdf.SetLineWidth(0.35)
	s.pdf.Line(x, y+1.2, x+w, y+1.2)
	if dv == nil {
		s.sideView(v, c, x, y+4+(drawH-v.height)/2, w)
	} else {
		lw := v.totalW + 2
		s.sideView(v, c, x, y+4+(drawH-v.height)/2, lw)
		dx, dw := x+lw+2, w-lw-2
		s.pdf.SetLineWidth(0.3)
		s.dashed(2, 1)
		s.pdf.Rect(dx, y+2.5, dw, drawH+1, "D")
		s.dashed()
		s.sideView(dv, c, dx, y+4+(drawH-dv.height)/2, dw)
		s.font("B", smallSize)
		label := fmt.Sprintf("DETAIL %.0f:1, NOT FULL SIZE", dv.sc)
		s.pdf.SetFillColor(255, 255, 255)
		lwd := s.width(label) + 2
		s.pdf.Rect(dx+dw-lwd-1, y+2.6, lwd, 3.6, "F")
		s.black()
		s.text(dx+dw-lwd, y+5.4, label)
	}
	y += 4 + drawH

	// Steps and predicted values side by side.
	top := y + sectionGap
	yl := s.heading(x, top, leftW, "How to wind it")
	s.drawSteps(x, yl, leftW, steps)
	yr := s.heading(x+leftW+gap, top, rightW, "What it should measure")
	yr = s.rows(x+leftW+gap, yr, valueLabelW, rightW, values)
	yr = s.heading(x+leftW+gap, yr+2, rightW, "Trim")
	s.para(x+leftW+gap, yr, rightW, trim)
	y = top + colsH

	y = s.checkBlock(x, y+sectionGap, w, c)
	y = s.measurementLog(x, y+sectionGap, w, rows)
	s.cautionBox(x, y+sectionGap, w, cautions, c.HighVoltage)

	if len(rest) > 0 {
		f := s.newFlow(0, c.Name+": notes")
		f.newPage()
		s.font("I", bodySize)
		f.lines(x, rest)
		s.font("", bodySize)
	}
}

// valueLabelW is the label column of the predicted values.
const valueLabelW = 33.0

func (s *sheet) coilHeader(c *Coil, y, x, w float64) float64 {
	s.font("B", 17)
	s.text(x, y, s.fit(c.Name, w-45))
	q := fmt.Sprintf("BUILD × %d", c.Quantity)
	s.font("B", 11)
	qw := s.width(q) + 6
	s.pdf.SetLineWidth(0.5)
	s.pdf.Rect(x+w-qw, y-6, qw, 8, "D")
	s.text(x+w-qw+3, y-0.6, q)
	y += 6.5
	g := c.Prediction.Geometry
	how := "slide it off the mandrel: self-supporting"
	if c.Support == coil.SupportFormer {
		how = "it stays on the former"
	}
	s.font("", 10)
	on := " on the "
	if strings.Contains(c.Wire, ",") {
		on = ", on the "
	}
	y = s.para(x, y, w, fmt.Sprintf("%s of %s%s%s (%s)", quantity.FormatTurnsWord(g.Turns), c.Wire, on, c.SupportName, how)) - 0.5
	if c.Target != nil {
		s.font("", bodySize)
		t := "Designed to " + c.Target.Description
		if c.Target.Rank > 0 {
			t += fmt.Sprintf(" (design search, candidate #%d", c.Target.Rank)
			if c.Target.Why != "" {
				t += ": " + c.Target.Why
			}
			t += ")"
		}
		y = s.para(x, y+0.5, w, t)
	}
	s.font("", bodySize)
	return y
}

// windingSteps are the instructions, in order. Lengths to cut are to the
// millimetre; lengths to check with calipers keep predict's precision.
func (s *sheet) windingSteps(c *Coil) []string {
	p := c.Prediction
	g := p.Geometry
	u := s.u
	lead := u.lead(float64(g.LeadLength))
	enamel := float64(g.WireOverall) > float64(g.WireDiameter)*1.0001
	st := []string{fmt.Sprintf("Cut %s of wire: the winding %s, two leads of %s and %s to strip and solder.",
		u.cut(float64(p.WireLength)), u.cut(float64(p.HelixWire)), lead, u.lead(float64(coil.CutAllowance)))}
	if enamel {
		st = append(st, fmt.Sprintf("Strip %s of enamel at each end (scrape, or a solder pot for solderable enamel) and tin the ends.", u.lead(float64(coil.CutAllowance)/2)))
	}
	if c.Support == coil.SupportFormer {
		st = append(st, fmt.Sprintf("Fix the cold end on the %s (two small holes, or tape), leaving %s of lead plus the strip allowance.", c.SupportName, lead))
	} else {
		st = append(st, fmt.Sprintf("Clamp the %s in a vice by its tip, plain shank out. Leave %s of lead plus the strip allowance at the cold end.", c.SupportName, lead))
	}
	// A tap on touching turns cannot be soldered afterwards without
	// bridging its neighbours: it is made while winding, as a loop.
	loopTap := c.Tap != nil && c.CloseWound
	switch {
	case c.CloseWound && loopTap:
		st = append(st, fmt.Sprintf("Wind %s close together, each turn touching the last, pulled snug. At %s from the cold end, twist a small loop of wire out for the tap, then carry on.",
			quantity.FormatTurnsWord(g.Turns), quantity.FormatTurnsWord(c.Tap.Turns)))
	case c.CloseWound:
		st = append(st, fmt.Sprintf("Wind %s close together, each turn touching the last, pulled snug.", quantity.FormatTurnsWord(g.Turns)))
	default:
		st = append(st, fmt.Sprintf("Wind %s, pulled snug, the same way round as the drawing. Count them on the top, as its numbers do.", quantity.FormatTurnsWord(g.Turns)))
	}
	if c.Support != coil.SupportFormer {
		bore := u.of(float64(p.InsideDiameter))
		switch {
		case c.SpringbackSource == coil.SpringbackCalibration:
			st = append(st, fmt.Sprintf("Slide the coil off; your calibration says the bore opens %s. Expect a bore of %s.", quantity.FormatPercent(g.Springback), bore))
		case g.Springback != 0:
			st = append(st, fmt.Sprintf("Slide the coil off; the bore should open by %s. Expect a bore of %s.", quantity.FormatPercent(g.Springback), bore))
		default:
			st = append(st, fmt.Sprintf("Slide the coil off and measure the bore. This sheet assumes it stays %s; a coil that springs open measures more L (turnwise trim --save learns your springback).", bore))
		}
	}
	if c.CloseWound {
		st = append(st, fmt.Sprintf("Check the outside length: %s over the turns.", u.of(float64(p.WindingLength))))
	} else {
		st = append(st, fmt.Sprintf("Set the pitch to %s with the cut-out template and the outside length to %s with calipers; keep the gaps even.",
			u.of(float64(g.Pitch)), u.of(float64(p.WindingLength))))
	}
	if t := c.Tap; t != nil {
		var tap string
		switch {
		case loopTap:
			tap = fmt.Sprintf("Check the tap loop is %s from the cold end (ringed on the drawing). Scrape and tin it, then solder the tap lead to it.", quantity.FormatTurnsWord(t.Turns))
		case enamel:
			tap = fmt.Sprintf("Count %s from the cold end (ringed on the drawing). Scrape %s of enamel there and solder a short tap lead, hot and quick.", quantity.FormatTurnsWord(t.Turns), u.lead(2e-3))
		default:
			tap = fmt.Sprintf("Count %s from the cold end (ringed on the drawing). Clean the wire there and solder a short tap lead, hot and quick.", quantity.FormatTurnsWord(t.Turns))
		}
		if t.Purpose != "" {
			tap += " " + t.Purpose
		}
		st = append(st, tap)
	}
	st = append(st, fmt.Sprintf("Cut each lead to %s from the winding, solder in, then measure and log below.", lead))
	return st
}

func (s *sheet) stepsHeight(w float64, steps []string) float64 {
	h := 0.0
	for _, st := range steps {
		h += s.paraHeight(w-5, st) + 0.8
	}
	return h
}

func (s *sheet) drawSteps(x, y, w float64, steps []string) float64 {
	for i, st := range steps {
		s.font("B", bodySize)
		s.text(x, y, fmt.Sprintf("%d.", i+1))
		s.font("", bodySize)
		y = s.para(x+5, y, w-5, st) + 0.8
	}
	return y
}

// predictedRows are the model's numbers for the page, with the precision
// of predict's table.
func (s *sheet) predictedRows(c *Coil) [][2]string {
	p := c.Prediction
	f := float64(p.Frequency)
	var r [][2]string
	if t := c.Target; t != nil && t.Inductance > 0 {
		label := "target L"
		if t.Effective {
			label = "target, effective L"
		}
		v := quantity.FormatEng(float64(t.Inductance), "H", 3)
		if t.Tolerance > 0 {
			v += fmt.Sprintf(" ± %.3g %%", t.Tolerance*100)
		}
		r = append(r, [2]string{label, v})
	}
	if t := c.Target; t != nil && t.Band != nil {
		r = append(r, bandRows(t.Band)...)
	}
	if f > 0 {
		r = append(r,
			[2]string{"L at the terminals", fmt.Sprintf("%s at %s", quantity.FormatEng(float64(p.Inductance), "H", 3), hz(f))},
			[2]string{"  coil + leads", fmt.Sprintf("%s + %s", quantity.FormatEng(float64(p.InductanceCoilAtF), "H", 3), quantity.FormatEng(float64(p.InductanceLeads), "H", 3))},
			[2]string{"L effective at f", quantity.FormatEng(float64(p.InductanceEffective), "H", 3) + " (self-C included)"},
		)
		if c.LowFrequency > 0 {
			r = append(r, [2]string{"on an L meter", quantity.FormatEng(float64(c.LowFrequency), "H", 3) + " (low frequency)"})
		}
	} else {
		r = append(r,
			[2]string{"L at the terminals", quantity.FormatEng(float64(p.Inductance), "H", 3) + " (low frequency)"},
			[2]string{"  coil + leads", fmt.Sprintf("%s + %s", quantity.FormatEng(float64(p.InductanceCoil), "H", 3), quantity.FormatEng(float64(p.InductanceLeads), "H", 3))},
		)
	}
	r = append(r,
		[2]string{"self-resonance", fmt.Sprintf("%s ± %.0f %%, %s (this page assumes it)", quantity.FormatEng(float64(p.SRFUsed()), "Hz", 3), p.SRFUsedUncertainty()*100, p.SRFMounting.Description())},
		[2]string{"self-capacitance", quantity.FormatCapacitance(float64(p.SelfCapacitance))},
	)
	if f > 0 {
		r = append(r, [2]string{"Q at " + hz(f), fmt.Sprintf("%.0f (likely %.0f … %.0f)", p.Q, p.QMin, p.QMax)})
	}
	r = append(r, [2]string{"wire to cut", s.u.cut(float64(p.WireLength))})
	r = append(r, thermalRows(c.Thermal)...)
	if t := c.Tap; t != nil {
		v := quantity.FormatTurnsWord(t.Turns) + " from the cold end"
		r = append(r, [2]string{"tap", v})
		if t.Ratio > 0 {
			r = append(r, [2]string{"  voltage at the tap", fmt.Sprintf("%.3g × the coil's (unloaded)", t.Ratio)})
		}
		if t.LBelow > 0 {
			r = append(r, [2]string{"  sections", fmt.Sprintf("below %s, above %s", quantity.FormatEng(float64(t.LBelow), "H", 3), quantity.FormatEng(float64(t.LAbove), "H", 3))},
				[2]string{"  coupling", fmt.Sprintf("M %s, k %.3f", quantity.FormatEng(float64(t.Mutual), "H", 3), t.Coupling)})
		}
	}
	return r
}

func (s *sheet) rowsHeight(w, labelW float64, rows [][2]string) float64 {
	h := 0.0
	for _, r := range rows {
		s.font("B", bodySize)
		h += float64(len(s.wrap(r[1], w-labelW))) * s.lineH()
	}
	s.font("", bodySize)
	return h
}

func (s *sheet) trimText(c *Coil) string {
	var b strings.Builder
	if c.TrimPerPercent > 0 {
		fmt.Fprintf(&b, "1 %% of L = %s of outside length. ", s.u.of(float64(c.TrimPerPercent)))
	}
	b.WriteString("Squeeze the turns (shorter) to raise L, spread them (longer) to lower it. ")
	if c.TrimLeast > 0 && c.TrimMost > 0 {
		fmt.Fprintf(&b, "Reach: %s spread to 3 wire diameters … %s close-wound; beyond that, change the turns by ¼. ",
			quantity.FormatEng(float64(c.TrimLeast), "H", 3), quantity.FormatEng(float64(c.TrimMost), "H", 3))
	}
	b.WriteString("turnwise trim turns a measurement into the change.")
	return b.String()
}

// checkBlock draws the 50 mm scale-check bar, the cut-out pitch template
// beside it, and the instruction to measure the bar.
func (s *sheet) checkBlock(x, y, w float64, c *Coil) float64 {
	pdf := s.pdf
	const barL, barH = 50.0, 3.0
	by := y + 3
	s.black()
	for i := 0; i < 5; i += 2 {
		pdf.Rect(x+float64(i)*10, by, 10, barH, "F")
	}
	pdf.SetLineWidth(0.25)
	s.marked("TWScaleBar", func() { pdf.Rect(x, by, barL, barH, "D") })
	s.font("", 6)
	for i := 0; i <= 5; i++ {
		xx := x + float64(i)*10
		pdf.SetLineWidth(0.2)
		pdf.Line(xx, by+barH, xx, by+barH+1.4)
		switch i {
		case 0:
			s.text(xx, by+barH+3.8, "0") // not past the margin
		case 5:
			s.textCenter(xx, by+barH+3.8, "50 mm")
		default:
			s.textCenter(xx, by+barH+3.8, fmt.Sprint(i*10))
		}
	}
	s.font("B", 6)
	s.text(x, y+0.8, "SCALE CHECK")

	s.pitchTemplate(x+barL+8, y, w-barL-8, c)

	ty := y + 16
	s.font("B", 9)
	head := "Measure the 50 mm bar first."
	if s.u.inches {
		head = "Measure the 50 mm (1.97 in) bar first."
	}
	s.text(x, ty, head)
	hw := s.width(head) + 2
	s.font("", bodySize)
	s.para(x+hw, ty, w-hw,
		"If it is not exactly 50 mm, print again at 100 % (\"actual size\", not \"fit to page\"): until then the drawing and the template are wrong.")
	return y + checkBlockH
}

// pitchTemplate draws a cut-out strip with a mark at every turn, at 1:1.
func (s *sheet) pitchTemplate(x, y, w float64, c *Coil) {
	pdf := s.pdf
	g := c.Prediction.Geometry
	p := float64(g.Pitch) * 1e3
	const stripH = 12.5
	pdf.SetLineWidth(0.25)
	s.dashed(1.5, 1)
	pdf.Rect(x, y, w, stripH, "D")
	s.dashed()

	x0 := x + 4
	maxK := int(math.Floor(g.Turns + 1e-9))
	if lim := int(math.Floor((w - 8) / p)); maxK > lim {
		maxK = lim
	}
	step := labelStep(p, 3.6)
	tickTop := y + 3.6
	s.marked("TWPitchTemplate", func() {
		pdf.SetLineWidth(0.2)
		for k := 0; k <= maxK; k++ {
			l := 2.6
			if k%step == 0 {
				l = 4
			}
			xx := x0 + float64(k)*p
			pdf.Line(xx, tickTop, xx, tickTop+l)
		}
	})
	s.font("", 5.5)
	for k := 0; k <= maxK; k += step {
		s.textCenter(x0+float64(k)*p, tickTop-0.8, fmt.Sprint(k))
	}
	s.font("B", smallSize)
	label := "PITCH TEMPLATE " + s.u.of(p/1e3)
	s.text(x0, y+stripH-1.6, label)
	lw := s.width(label) + 3
	s.font("", smallSize)
	s.text(x0+lw, y+stripH-1.6, s.fit("cut out on the dashed line; lay it along the coil, one turn on each mark", w-lw-8))
}

// measurementLog draws a table with blank rows for the builder.
func (s *sheet) measurementLog(x, y, w float64, rows int) float64 {
	y = s.heading(x, y, w, "Measurement log")
	s.font("", smallSize)
	s.text(x, y-0.8, "Measure at the terminals with the leads as fitted. Write the method: L meter, or resonance with a known C (and that C).")
	y += 1
	cols := []struct {
		title string
		w     float64
	}{{"date, by", 24}, {"outside length", 24}, {"measured (L, or f with C)", 48}, {"change made", 44}, {"result", w - 24 - 24 - 48 - 44}}
	pdf := s.pdf
	pdf.SetLineWidth(0.25)
	pdf.Rect(x, y, w, float64(rows+1)*logRowH, "D")
	pdf.SetLineWidth(0.15)
	for i := 1; i <= rows; i++ {
		pdf.Line(x, y+float64(i)*logRowH, x+w, y+float64(i)*logRowH)
	}
	cx := x
	s.font("B", smallSize)
	for i, c := range cols {
		if i > 0 {
			pdf.Line(cx, y, cx, y+float64(rows+1)*logRowH)
		}
		s.text(cx+1.2, y+4.2, c.title)
		cx += c.w
	}
	s.font("", bodySize)
	return y + float64(rows+1)*logRowH
}

// Cautions: short, and deferring to local rules.
func (s *sheet) cautionItems(c *Coil) []string {
	items := []string{
		"Soldering irons and solder pots run near 350 °C: use a stand, keep leads clear, wash hands after handling solder.",
		"Stripping enamel by flame, solder pot or chemical stripper burns and gives off fumes: ventilate, wear eye protection.",
	}
	rf := "In a transmitter tank or antenna coupler this coil carries high RF voltage and current: RF burns and arcing. Never touch it powered; use capacitors rated for the voltage; follow local regulations and licensed practice."
	if c.HighVoltage {
		items = append([]string{rf}, items...)
	} else {
		items = append(items, "For anything that transmits: RF burns and high voltage on tank and coupler coils; follow local regulations and licensed practice.")
	}
	for _, w := range c.Warnings {
		items = append(items, "Model: "+w)
	}
	return items
}

func (s *sheet) cautionHeight(w float64, items []string) float64 {
	s.font("", smallSize)
	h := 7.5
	for _, it := range items {
		h += s.paraHeight(w-10, it) + 0.4
	}
	return h + 1
}

// cautionBox draws the boxed cautions; items nil means the generic set.
func (s *sheet) cautionBox(x, y, w float64, items []string, hv bool) float64 {
	if items == nil {
		items = s.cautionItems(&Coil{HighVoltage: hv})
	}
	h := s.cautionHeight(w, items)
	pdf := s.pdf
	s.black()
	pdf.SetLineWidth(0.6)
	pdf.Rect(x, y, w, h, "D")
	s.font("B", 9)
	s.text(x+3, y+5, "CAUTION")
	s.font("", smallSize)
	yy := y + 9.2
	for _, it := range items {
		s.text(x+3, yy, "•")
		yy = s.para(x+6, yy, w-10, it) + 0.4
	}
	return y + h
}

// thermalRows state the coil's temperature coefficient and its tank's
// drift over the workshop's range, in ppm/K.
func thermalRows(t *Thermal) [][2]string {
	if t == nil {
		return nil
	}
	v := quantity.FormatPPMPerK(t.Tempco, 3)
	if t.Spread > 0 {
		v += fmt.Sprintf(" ± %.2g", t.Spread*1e6)
	}
	r := [][2]string{{"tempco of L", v + " (pitch follows " + t.PitchRule + ")"}}
	if k := t.Tank; k != nil {
		r = append(r, [2]string{"tank drift", fmt.Sprintf("with %s %s at %s: %s ± %.2g, %s ± %s from %.3g °C to %.3g °C",
			quantity.FormatCapacitance(float64(k.Capacitance)), k.Class, hz(float64(k.Frequency)),
			quantity.FormatPPMPerK(k.PerK, 3), k.Uncertainty*1e6,
			quantity.FormatEng(k.ShiftHz, "Hz", 3), quantity.FormatEng(k.ShiftUncertainty, "Hz", 2),
			float64(k.LowTemp)-273.15, float64(k.HighTemp)-273.15)})
	}
	return r
}

// bandRows state a band design: the band, the trimmer and what it is
// across, and its settings at the two band edges.
func bandRows(b *TargetBand) [][2]string {
	pf := func(c unit.Capacitance) string { return quantity.FormatCapacitance(float64(c)) }
	trim := fmt.Sprintf("%s … %s in parallel", pf(b.TrimMin), pf(b.TrimMax))
	switch {
	case b.Fixed > 0 && b.Stray > 0:
		trim += fmt.Sprintf(" with %s + %s stray", pf(b.Fixed), pf(b.Stray))
	case b.Fixed > 0:
		trim += " with " + pf(b.Fixed)
	case b.Stray > 0:
		trim += fmt.Sprintf(" with %s stray", pf(b.Stray))
	}
	return [][2]string{
		{"band", fmt.Sprintf("%s … %s", hz(float64(b.Low)), hz(float64(b.High)))},
		{"trimmer", trim},
		{"  set at " + hz(float64(b.Low)), pf(b.TrimmerLow) + " (band's low edge)"},
		{"  set at " + hz(float64(b.High)), pf(b.TrimmerHigh) + " (band's high edge)"},
	}
}
