package report

import (
	"fmt"
	"image/color"
	"io"
	"math"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"

	"turnwise/coil/match"
)

// WriteMatchPlot draws the matched region of the load plane, one panel
// per frequency (R on a logarithmic axis, X linear): a filled dot where a
// load is matched, a small grey cross where it is not. format is "svg" or
// "png".
func WriteMatchPlot(w io.Writer, format string, req MatchRequest, res *match.Result) error {
	n := len(res.Frequencies)
	if n == 0 {
		return fmt.Errorf("match plot: no frequencies")
	}
	cols := min(n, 3)
	rows := (n + cols - 1) / cols
	const panel = 3.2 * vg.Inch
	width, height := vg.Length(cols)*panel, vg.Length(rows)*panel
	var c vg.CanvasWriterTo
	switch format {
	case "svg":
		c = vgsvg.New(width, height)
	case "png":
		c = vgimg.PngCanvas{Canvas: vgimg.NewWith(vgimg.UseWH(width, height), vgimg.UseDPI(110), vgimg.UseBackgroundColor(color.White))}
	default:
		return fmt.Errorf("match plot: format %q: use svg or png", format)
	}
	plots := make([][]*plot.Plot, rows)
	for r := range plots {
		plots[r] = make([]*plot.Plot, cols)
	}
	matchedColor := color.RGBA{R: 0x1b, G: 0x7a, B: 0x3a, A: 0xff}
	missColor := color.RGBA{R: 0xa0, G: 0xa0, B: 0xa0, A: 0xff}
	for i, fm := range res.Frequencies {
		p := plot.New()
		p.Title.Text = fmt.Sprintf("%s: %.0f %% at SWR ≤ %.3g", MatchFrequencyName(fm.Frequency, req.label(i)), 100*fm.Coverage, res.SWR)
		p.X.Label.Text = "load R (Ω)"
		p.Y.Label.Text = "load X (Ω)"
		p.X.Scale = plot.LogScale{}
		p.X.Tick.Marker = plot.LogTicks{Prec: -1}
		var hit, miss plotter.XYs
		for _, pt := range fm.Points {
			if pt.Matched {
				hit = append(hit, plotter.XY{X: pt.LoadR, Y: pt.LoadX})
			} else {
				miss = append(miss, plotter.XY{X: pt.LoadR, Y: pt.LoadX})
			}
		}
		if len(miss) > 0 {
			s, err := plotter.NewScatter(miss)
			if err != nil {
				return err
			}
			s.GlyphStyle = draw.GlyphStyle{Color: missColor, Radius: vg.Points(2), Shape: draw.CrossGlyph{}}
			p.Add(s)
		}
		if len(hit) > 0 {
			s, err := plotter.NewScatter(hit)
			if err != nil {
				return err
			}
			s.GlyphStyle = draw.GlyphStyle{Color: matchedColor, Radius: vg.Points(3.2), Shape: draw.CircleGlyph{}}
			p.Add(s)
		}
		// The axes span the whole grid, matched or not, with a margin.
		g := res.Grid
		p.X.Min, p.X.Max = g.RMin/1.25, g.RMax*1.25
		pad := math.Max(0.05*(g.XMax-g.XMin), 1)
		p.Y.Min, p.Y.Max = g.XMin-pad, g.XMax+pad
		p.Add(plotter.NewGrid())
		plots[i/cols][i%cols] = p
	}
	dc := draw.New(c)
	tiles := draw.Tiles{Rows: rows, Cols: cols, PadX: vg.Millimeter * 2, PadY: vg.Millimeter * 2,
		PadTop: vg.Millimeter * 2, PadBottom: vg.Millimeter * 2, PadLeft: vg.Millimeter * 2, PadRight: vg.Millimeter * 2}
	canvases := plot.Align(plots, tiles, dc)
	for r := range plots {
		for col := range plots[r] {
			if plots[r][col] != nil {
				plots[r][col].Draw(canvases[r][col])
			}
		}
	}
	_, err := c.WriteTo(w)
	return err
}
