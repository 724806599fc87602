package sheets

import (
	"bytes"
	"fmt"
	"image"
	_ "image/png" // the map plot arrives as PNG
	"math"

	"github.com/jung-kurt/gofpdf"
)

// The coupler page: which loads a coupler matches at each band (the
// match map plot), its capacitor settings and efficiency in words, the
// worst stress per part at the stated power, and the cautions.

// Coupler is what a coupler page shows; the caller maps it (coil/match)
// and renders the plot.
type Coupler struct {
	Name    string   // the coupler's title
	Source  string   // the circuit file, as the job names it
	About   string   // what was mapped: grid, SWR limit, power
	Summary []string // one line per frequency: coverage, settings, efficiency
	PlotPNG []byte   // the matched region per frequency, PNG
	// Stress is the worst-case table at the stated power: a header row
	// then one row per part (empty without a power).
	Stress   [][]string
	HeatRule string
	Warnings []string
	Cautions []string // shown boxed; a power was given when non-empty
}

// couplerPage draws one coupler page (continuation pages if its lists
// run long).
func (s *sheet) couplerPage(c *Coupler) {
	x, w, y := s.titledPage(c.Name + ": match map")
	if c.About != "" {
		y = s.para(x, y, w, c.About)
	}
	if len(c.PlotPNG) > 0 {
		if cfg, _, err := image.DecodeConfig(bytes.NewReader(c.PlotPNG)); err == nil && cfg.Width > 0 {
			name := fmt.Sprintf("coupler-map-%p", c)
			opt := gofpdf.ImageOptions{ImageType: "PNG"}
			s.pdf.RegisterImageOptionsReader(name, opt, bytes.NewReader(c.PlotPNG))
			h := w * float64(cfg.Height) / float64(cfg.Width)
			pw := w
			if maxH := 0.45 * (s.bottom() - y); h > maxH {
				pw, h = w*maxH/h, maxH
			}
			s.pdf.ImageOptions(name, x+(w-pw)/2, y+1, pw, h, false, opt, 0, "")
			y += h + 3
			s.font("", smallSize)
			y = s.para(x, y, w, "Green dots: loads the coupler brings to SWR at or below the limit at the port, every one re-solved at the settings found; grey crosses: none found (not proven impossible).")
		}
	}
	f := s.newFlow(y, c.Name+": match map")
	s.font("", bodySize)
	f.y += sectionGap
	f.heading(x, w, "Coverage, settings and efficiency")
	f.bullets(x, w, c.Summary)
	if len(c.Stress) > 1 {
		f.y += sectionGap
		f.heading(x, w, "Worst stress per part")
		cols := []float64{22, 20, 20, 18, 22, 40, w - 142}
		head := c.Stress[0]
		s.font("B", smallSize)
		s.row(x, f.y, cols, head)
		f.y += s.lineH()
		f.onBreak = func() {
			s.font("B", smallSize)
			s.row(x, f.y, cols, head)
			f.y += s.lineH()
		}
		for _, r := range c.Stress[1:] {
			s.font("", smallSize)
			f.need(s.lineH())
			s.font("", smallSize)
			s.row(x, f.y, cols, r)
			f.y += s.lineH()
		}
		f.onBreak = nil
		s.font("", bodySize)
	}
	if c.HeatRule != "" || len(c.Warnings) > 0 {
		var notes []string
		if c.HeatRule != "" {
			notes = append(notes, "Heating rule: "+c.HeatRule+".")
		}
		notes = append(notes, c.Warnings...)
		f.y += sectionGap / 2
		f.bullets(x, w, notes)
	}
	if len(c.Cautions) > 0 {
		h := s.cautionHeight(w, c.Cautions)
		f.y += sectionGap
		f.needBox(math.Min(h, s.bottom()-margin))
		f.y = s.cautionBox(x, f.y, w, c.Cautions, true) + 2
	}
}
