package sheets

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"
	"turnwise/internal/quantity"
	"unicode"

	"github.com/jung-kurt/gofpdf"
)

// The tuning-chart page of a coil on a two-gang capacitor: both ranges
// across the dial on a log-frequency axis, the wanted bands hatched, and
// the harmonic coincidences marked.

func (s *sheet) spanPage(c *Coil) {
	sp := c.Span
	x, w, y := s.titledPage(c.Name + ": tuning chart")
	tapTurns := "the tap"
	if c.Tap != nil {
		tapTurns = "the tap (" + quantity.FormatTurns(c.Tap.Turns) + " turns from the cold end)"
	}
	desc := fmt.Sprintf("Two-gang capacitor on one shaft: section A (%s) across the whole coil, section B (%s) from %s to ground. Law: %s. Every dial setting tunes two frequencies at once, a low range and a high range.",
		sp.GangA, cmp.Or(sp.GangB, sp.GangA), tapTurns, cmp.Or(sp.Law, "as given"))
	y = s.para(x, y, w, desc)

	y = s.heading(x, y+sectionGap, w, "Both ranges across the dial")
	chartH := math.Min(105, s.bottom()-y-95)
	y = s.spanChart(x, y+1, w, chartH, sp)

	// Dial table and findings side by side.
	top := y + sectionGap
	tw := 70.0
	yl := s.heading(x, top, tw, "Dial scale")
	s.dialTable(x, yl, tw, sp)
	rx, rw := x+tw+6, w-tw-6
	yr := s.heading(rx, top, rw, "What the chart says")
	s.font("", bodySize)
	f := s.newFlow(yr, c.Name+": tuning chart")
	f.bullets(rx, rw, s.spanFindings(sp))
}

// minBandH is the least height a band is drawn with, mm: wider than a
// grid line, so none hides under one.
const minBandH = 1.2

// freqAxis maps frequency to the chart's y on a log scale.
type freqAxis struct {
	lo, hi   float64 // Hz
	top, bot float64 // mm
}

func (a freqAxis) y(f float64) float64 {
	t := (math.Log(f) - math.Log(a.lo)) / (math.Log(a.hi) - math.Log(a.lo))
	return a.bot - t*(a.bot-a.top)
}

// spanChart draws the chart and returns the y below its labels.
func (s *sheet) spanChart(x, y, w, h float64, sp *Span) float64 {
	pdf := s.pdf
	left, right := x+16, x+w-30
	ax := freqAxis{top: y + 2, bot: y + h}
	lo, hi := math.Inf(1), 0.0
	for _, d := range sp.Dial {
		for _, f := range []float64{float64(d.FLow), float64(d.FHigh)} {
			if f > 0 {
				lo, hi = math.Min(lo, f), math.Max(hi, f)
			}
		}
	}
	for _, b := range sp.Bands {
		lo, hi = math.Min(lo, float64(b.Low)), math.Max(hi, float64(b.High))
	}
	if !(hi > lo) {
		lo, hi = 1e6, 10e6
	}
	ax.lo, ax.hi = lo/1.08, hi*1.08
	xOf := func(setting float64) float64 { return left + setting*(right-left) }

	// Frame and grid.
	s.black()
	pdf.SetLineWidth(0.3)
	pdf.Rect(left, ax.top, right-left, ax.bot-ax.top, "D")
	s.font("", 6.5)
	pdf.SetLineWidth(0.1)
	for _, f := range gridFreqs(ax.lo, ax.hi) {
		yy := ax.y(f)
		s.dashed(0.4, 0.8)
		pdf.Line(left, yy, right, yy)
		s.dashed()
		s.textRight(left-1.2, yy+0.9, quantity.FormatEng(f, "Hz", 2))
	}
	for i := 0; i <= 10; i++ {
		xx := xOf(float64(i) / 10)
		pdf.Line(xx, ax.bot, xx, ax.bot+1.2)
		s.textCenter(xx, ax.bot+3.8, fmt.Sprintf("%d", i*10))
	}
	s.textCenter((left+right)/2, ax.bot+7.2, "dial setting, % of rotation: 0 = plates fully open (least capacitance), 100 = fully meshed")

	// Bands: hatched, clipped to the plot, drawn over the grid and edged.
	pdf.ClipRect(left, ax.top, right-left, ax.bot-ax.top, false)
	for _, b := range sp.Bands {
		y1, y2 := ax.y(float64(b.High)), ax.y(float64(b.Low))
		if y2-y1 < minBandH { // a narrow band stays visible above a grid line
			m := (y1 + y2) / 2
			y1, y2 = m-minBandH/2, m+minBandH/2
		}
		pdf.SetFillColor(215, 215, 215)
		pdf.Rect(left, y1, right-left, y2-y1, "F")
		pdf.SetDrawColor(90, 90, 90)
		pdf.SetLineWidth(0.15)
		for xx := left - (y2 - y1); xx < right; xx += 2.2 {
			pdf.Line(xx, y2, xx+(y2-y1), y1)
		}
		s.black()
		pdf.SetLineWidth(0.2)
		pdf.Line(left, y1, right, y1)
		pdf.Line(left, y2, right, y2)
	}
	pdf.ClipEnd()

	// The two ranges.
	curve := func(get func(DialPoint) float64) {
		first := true
		for _, d := range sp.Dial {
			f := get(d)
			if f <= 0 {
				continue
			}
			if first {
				pdf.MoveTo(xOf(d.Setting), ax.y(f))
				first = false
			} else {
				pdf.LineTo(xOf(d.Setting), ax.y(f))
			}
		}
		if !first {
			pdf.DrawPath("D")
		}
	}
	pdf.SetLineWidth(0.7)
	curve(func(d DialPoint) float64 { return float64(d.FLow) })
	s.dashed(2.2, 1.2)
	curve(func(d DialPoint) float64 { return float64(d.FHigh) })
	s.dashed()

	// Band labels at the right edge.
	s.font("", 6.5)
	for _, b := range sp.Bands {
		l := cmp.Or(b.Label, quantity.FormatEng(float64(b.Low), "Hz", 3)+"–"+quantity.FormatEng(float64(b.High), "Hz", 3))
		s.text(right+1.5, (ax.y(float64(b.Low))+ax.y(float64(b.High)))/2+0.9, s.fit(l, x+w-right-2))
	}
	// Coincidences: the harmonic on the high range, joined to its
	// fundamental on the low range.
	for _, c := range sp.Coincidences {
		xx := xOf(c.Setting)
		pdf.SetLineWidth(0.25)
		s.dashed(0.5, 0.5)
		pdf.Line(xx, ax.y(float64(c.FLow)), xx, ax.y(float64(c.Order)*float64(c.FLow)))
		s.dashed()
		pdf.SetLineWidth(0.35)
		pdf.Circle(xx, ax.y(float64(c.FLow)), 1.2, "D")
		sq := ax.y(float64(c.Order) * float64(c.FLow))
		pdf.Polygon([]gofpdf.PointType{{X: xx, Y: sq - 1.7}, {X: xx + 1.5, Y: sq + 1}, {X: xx - 1.5, Y: sq + 1}}, "F")
		s.font("B", 6.5)
		s.text(xx+2, sq-1.5, fmt.Sprintf("%d×", c.Order))
	}

	// Legend.
	ly := ax.bot + 12
	pdf.SetLineWidth(0.7)
	pdf.Line(left, ly-1, left+10, ly-1)
	s.font("", smallSize)
	s.text(left+12, ly, "low range (section A and B together)")
	s.dashed(2.2, 1.2)
	pdf.Line(left+70, ly-1, left+80, ly-1)
	s.dashed()
	s.text(left+82, ly, "high range")
	pdf.SetFillColor(215, 215, 215)
	pdf.Rect(left+104, ly-2.8, 8, 3.2, "F")
	s.black()
	s.text(left+114, ly, "wanted band")
	pdf.Polygon([]gofpdf.PointType{{X: left + 136, Y: ly - 2.7}, {X: left + 137.5, Y: ly}, {X: left + 134.5, Y: ly}}, "F")
	s.text(left+139, ly, "harmonic coincidence")
	return ly + 2
}

// gridFreqs returns 1-2-5 grid lines inside lo … hi.
func gridFreqs(lo, hi float64) []float64 {
	var out []float64
	for e := math.Floor(math.Log10(lo)); e <= math.Ceil(math.Log10(hi)); e++ {
		for _, m := range []float64{1, 2, 5} {
			f := m * math.Pow(10, e)
			if f >= lo && f <= hi {
				out = append(out, f)
			}
		}
	}
	if len(out) < 4 { // a narrow chart: 1-1.5-2-3-5-7
		out = out[:0]
		for e := math.Floor(math.Log10(lo)); e <= math.Ceil(math.Log10(hi)); e++ {
			for _, m := range []float64{1, 1.5, 2, 3, 5, 7} {
				f := m * math.Pow(10, e)
				if f >= lo && f <= hi {
					out = append(out, f)
				}
			}
		}
	}
	return out
}

// dialTable lists both frequencies at every tenth of the dial, taken from
// the nearest computed setting.
func (s *sheet) dialTable(x, y, w float64, sp *Span) float64 {
	s.font("B", smallSize)
	cols := []float64{16, (w - 16) / 2, (w - 16) / 2}
	s.row(x, y, cols, []string{"dial", "low range", "high range"})
	y += 4
	s.font("", bodySize)
	for i := 0; i <= 10; i++ {
		want := float64(i) / 10
		j := slices.IndexFunc(sp.Dial, func(d DialPoint) bool { return math.Abs(d.Setting-want) < 1e-9 })
		if j < 0 {
			best := math.Inf(1)
			for k, d := range sp.Dial {
				if dd := math.Abs(d.Setting - want); dd < best {
					best, j = dd, k
				}
			}
		}
		if j < 0 {
			break
		}
		d := sp.Dial[j]
		s.row(x, y, cols, []string{fmt.Sprintf("%.0f %%", d.Setting*100), hz(float64(d.FLow)), hz(float64(d.FHigh))})
		y += s.lineH()
	}
	return y
}

// spanFindings words the overlap, the bands and the coincidences.
func (s *sheet) spanFindings(sp *Span) []string {
	var out []string
	if sp.Overlap >= 0 {
		out = append(out, fmt.Sprintf("The two ranges overlap by %s: no gap in coverage.", hz(float64(sp.Overlap))))
	} else {
		out = append(out, fmt.Sprintf("Gap of %s between the top of the low range and the bottom of the high range: frequencies there cannot be tuned.", hz(float64(-sp.Overlap))))
	}
	for _, b := range sp.Bands {
		name := cmp.Or(b.Label, quantity.FormatEng(float64(b.Low), "Hz", 3)+" – "+quantity.FormatEng(float64(b.High), "Hz", 3))
		if len(b.Ranges) > 0 {
			var parts []string
			for _, r := range b.Ranges {
				p := fmt.Sprintf("%s range, dial %s", r.Range, dialStretch(r.DialLow, r.DialHigh))
				if !r.Whole {
					p = fmt.Sprintf("%s range reaches only part of it, dial %s", r.Range, dialStretch(r.DialLow, r.DialHigh))
				}
				parts = append(parts, p)
			}
			out = append(out, name+": "+strings.Join(parts, "; ")+".")
			continue
		}
		switch b.Range {
		case "low", "high", "both":
			r := b.Range + " range"
			if b.Range == "both" {
				r = "both ranges (dial for the low one)"
			}
			out = append(out, fmt.Sprintf("%s: %s, dial %s.", name, r, dialStretch(b.DialLow, b.DialHigh)))
		case "part":
			out = append(out, fmt.Sprintf("%s: only partly reached (dial %s); trim the capacitor or move the tap.", name, dialStretch(b.DialLow, b.DialHigh)))
		default:
			out = append(out, name+": NOT reached by either range.")
		}
	}
	if len(sp.Coincidences) == 0 {
		out = append(out, "No harmonic coincidence (2nd or 3rd harmonic of the low range inside the high range's passband) falls in a listed band.")
	}
	for _, c := range sp.Coincidences {
		in := ""
		if c.Band != "" {
			in = " (in " + c.Band + ")"
		}
		out = append(out, fmt.Sprintf("At dial %.0f %%: the low range is at %s%s and its %s harmonic, %s, falls in the high range's passband (tuned to %s; %.2f of the way from the peak to the -3 dB edge). A receiver with a harmonic-rich oscillator hears both.",
			c.Setting*100, hz(float64(c.FLow)), in, ordinal(c.Order), hz(float64(c.Order)*float64(c.FLow)), hz(float64(c.FHigh)), c.Depth))
	}
	for _, n := range sp.Notes {
		out = append(out, sentence(n))
	}
	return out
}

// dialStretch prints a stretch of the dial, lower setting first, with as
// many decimals (one to three) as make its two ends differ.
func dialStretch(a, b float64) string {
	lo, hi := min(a, b), max(a, b)
	for d := 1; d <= 3; d++ {
		l, h := fmt.Sprintf("%.*f %%", d, lo*100), fmt.Sprintf("%.*f %%", d, hi*100)
		if l != h {
			return l + " to " + h
		}
	}
	return fmt.Sprintf("%.3f %%", lo*100)
}

// sentence capitalises the first letter and ends with a full stop.
func sentence(t string) string {
	t = strings.TrimSpace(t)
	if t == "" {
		return t
	}
	r := []rune(t)
	r[0] = unicode.ToUpper(r[0])
	t = string(r)
	if !strings.HasSuffix(t, ".") {
		t += "."
	}
	return t
}

func ordinal(n int) string {
	switch n {
	case 2:
		return "2nd"
	case 3:
		return "3rd"
	}
	return fmt.Sprintf("%dth", n)
}
