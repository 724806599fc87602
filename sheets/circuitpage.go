package sheets

import (
	"bytes"
	"fmt"
	"image/color"
	"io"
	"math"
	"strings"

	"github.com/jung-kurt/gofpdf"
	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"

	"turnwise/internal/quantity"
)

// Circuit is a network's response and what it means, for a page of the
// build sheet and for `turnwise circuit --plot`.
type Circuit struct {
	Title  string
	Source string // the circuit file
	// TwoPort: Values are |S21| in dB; else |Z| at port 1 in ohms.
	TwoPort    bool
	Freqs      []float64 // Hz, ascending
	Values     []float64
	LogX       bool
	Resonances []CircuitResonance
	Bands      []CircuitBand
	Warnings   []string
}

// CircuitResonance is one resonance seen at port 1.
type CircuitResonance struct {
	Frequency float64
	Kind      string // "parallel" or "series"
	Q         float64
	Impedance float64 // |Z| at port 1, ohms
	Part      string
}

// CircuitBand is a band and the resonance that serves it.
type CircuitBand struct {
	Name      string
	Low, High float64
	Serving   float64 // 0 when no resonance serves it
	Offset    float64 // (Serving − centre)/centre
}

var (
	bandFill  = color.RGBA{R: 200, G: 220, B: 245, A: 255}
	resColour = color.RGBA{R: 200, G: 60, B: 40, A: 255}
)

// freqTicks labels a frequency axis as a builder reads it ("145 MHz"), not
// in the plot library's exponent form ("1.45e+08").
type freqTicks struct{ plot.Ticker }

func (t freqTicks) Ticks(min, max float64) []plot.Tick {
	ts := t.Ticker.Ticks(min, max)
	for i := range ts {
		if ts[i].Label != "" {
			ts[i].Label = quantity.FormatShort(ts[i].Value, "Hz")
		}
	}
	return ts
}

// PlotCircuit draws the response (|Z| or |S21| against frequency) with the
// bands shaded and the resonances marked, as "svg" or "png" of the given
// size in millimetres.
func PlotCircuit(w io.Writer, c *Circuit, format string, widthMM, heightMM float64) error {
	if len(c.Freqs) < 2 || len(c.Freqs) != len(c.Values) {
		return fmt.Errorf("sheets: a response plot needs at least two points")
	}
	p := plot.New()
	p.Title.Text = c.Title
	p.X.Label.Text = "frequency"
	p.X.Tick.Marker = freqTicks{plot.DefaultTicks{}}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, v := range c.Values {
		if !finite(v) {
			return fmt.Errorf("sheets: the response holds a value that is not finite")
		}
		lo, hi = math.Min(lo, v), math.Max(hi, v)
	}
	if c.TwoPort {
		p.Y.Label.Text = "|S21| (dB)"
		if hi-lo < 1 {
			lo, hi = lo-0.5, hi+0.5
		}
	} else {
		p.Y.Label.Text = "|Z| at port 1 (ohm)"
		p.Y.Scale = plot.LogScale{}
		p.Y.Tick.Marker = plot.LogTicks{Prec: -1}
		lo, hi = math.Max(lo, 1e-6), math.Max(hi, 1e-5)
		if hi/lo < 10 {
			lo, hi = lo/3, hi*3
		}
	}
	if c.LogX {
		p.X.Scale = plot.LogScale{}
		p.X.Tick.Marker = freqTicks{plot.LogTicks{Prec: -1}}
	}
	fmin, fmax := c.Freqs[0], c.Freqs[len(c.Freqs)-1]
	for _, b := range c.Bands {
		l, h := math.Max(b.Low, fmin), math.Min(b.High, fmax)
		if !(h > l) {
			continue
		}
		poly, err := plotter.NewPolygon(plotter.XYs{{X: l, Y: lo}, {X: h, Y: lo}, {X: h, Y: hi}, {X: l, Y: hi}})
		if err != nil {
			return err
		}
		poly.Color = bandFill
		poly.LineStyle.Width = 0
		p.Add(poly)
	}
	xy := make(plotter.XYs, len(c.Freqs))
	for i := range xy {
		xy[i].X, xy[i].Y = c.Freqs[i], c.Values[i]
	}
	line, err := plotter.NewLine(xy)
	if err != nil {
		return err
	}
	line.Width = vg.Points(1.2)
	p.Add(line)
	for _, r := range c.Resonances {
		if r.Frequency < fmin || r.Frequency > fmax {
			continue
		}
		m, err := plotter.NewLine(plotter.XYs{{X: r.Frequency, Y: lo}, {X: r.Frequency, Y: hi}})
		if err != nil {
			return err
		}
		m.Color = resColour
		m.Dashes = []vg.Length{vg.Points(3), vg.Points(2)}
		m.Width = vg.Points(0.6)
		p.Add(m)
	}
	p.X.Min, p.X.Max = fmin, fmax
	p.Y.Min, p.Y.Max = lo, hi
	p.Add(plotter.NewGrid())
	wt, err := p.WriterTo(vg.Length(widthMM)*vg.Millimeter, vg.Length(heightMM)*vg.Millimeter, format)
	if err != nil {
		return fmt.Errorf("sheets: %w", err)
	}
	_, err = wt.WriteTo(w)
	return err
}

// circuitPage draws a circuit's page: the response, its resonances and
// the band table.
func (s *sheet) circuitPage(c *Circuit, n int) {
	x, w, y := s.titledPage("Circuit: " + c.Title)
	desc := "The network the coils go into, computed with each coil's own model (L and loss at each frequency, self-capacitance). Shaded: the bands; dashed: the resonances."
	if c.Source != "" {
		desc = "From " + c.Source + ". " + desc
	}
	y = s.para(x, y, w, desc)
	y = s.heading(x, y+sectionGap, w, "Response")
	h := math.Min(95, s.bottom()-y-70)
	var png bytes.Buffer
	if err := PlotCircuit(&png, c, "png", w, h); err != nil {
		s.pdf.SetError(err)
		return
	}
	name := fmt.Sprintf("circuit-%d", n)
	s.pdf.RegisterImageOptionsReader(name, gofpdfPNG(), &png)
	s.pdf.ImageOptions(name, x, y+1, w, h, false, gofpdfPNG(), 0, "")
	y += h + 3

	tw := w/2 - 3
	yl := s.heading(x, y, tw, "Resonances at port 1")
	rows := [][2]string{}
	for _, r := range c.Resonances {
		q := "-"
		if r.Q > 0 {
			q = fmt.Sprintf("%.3g", r.Q)
		}
		rows = append(rows, [2]string{hz(r.Frequency), fmt.Sprintf("%s, Q %s, |Z| %s (%s)", r.Kind, q, quantity.FormatEng(r.Impedance, "ohm", 3), r.Part)})
	}
	if len(rows) == 0 {
		rows = append(rows, [2]string{"none", "below the sweep's top"})
	}
	s.font("", bodySize)
	s.rows(x, yl, 24, tw, rows)
	rx := x + tw + 6
	yr := s.heading(rx, y, tw, "Bands")
	rows = rows[:0]
	for _, b := range c.Bands {
		v := "no resonance serves it"
		if b.Serving > 0 {
			v = fmt.Sprintf("%s (%+.2g %% off centre)", hz(b.Serving), b.Offset*100)
		}
		rows = append(rows, [2]string{cmpOr(b.Name, hz(b.Low)+"-"+hz(b.High)), v})
	}
	if len(rows) == 0 {
		rows = append(rows, [2]string{"none", "no bands given"})
	}
	yr = s.rows(rx, yr, 24, tw, rows)
	if len(c.Warnings) > 0 {
		yr = s.heading(rx, yr+sectionGap, tw, "Warnings")
		s.bullets(rx, yr, tw, c.Warnings)
	}
}

func cmpOr(a, b string) string {
	if strings.TrimSpace(a) != "" {
		return a
	}
	return b
}

func gofpdfPNG() gofpdf.ImageOptions { return gofpdf.ImageOptions{ImageType: "PNG"} }
