package sweepfile

import (
	"fmt"
	"io"
	"math"
	"math/cmplx"
	"path/filepath"
	"strings"

	"gonum.org/v1/plot"
	"gonum.org/v1/plot/plotter"
	"gonum.org/v1/plot/vg"
	"gonum.org/v1/plot/vg/draw"
	"gonum.org/v1/plot/vg/vgimg"
	"gonum.org/v1/plot/vg/vgsvg"

	"turnwise/coil/sweep"
)

// Curve is a model drawn over the measurement: Z(f) of the coil.
type Curve struct {
	Name string
	Z    func(f float64) complex128
}

// PlotFormat is the image format for a file name: "svg" or "png", or an
// error naming the flag's fix.
func PlotFormat(name string) (string, error) {
	switch ext := strings.ToLower(filepath.Ext(name)); ext {
	case ".svg", ".png":
		return ext[1:], nil
	}
	return "", fmt.Errorf("%q: the plot is written as .svg or .png", name)
}

// Plot draws the measured |Z| and Q against frequency with the curves
// over them, two panels, and writes the image in format ("svg" or "png").
func Plot(w io.Writer, format, title string, pts []sweep.Point, curves []Curve) error {
	top, bottom := plot.New(), plot.New()
	top.Title.Text = title
	top.Y.Label.Text = "|Z| (ohm)"
	top.Y.Scale, top.Y.Tick.Marker = plot.LogScale{}, plot.LogTicks{Prec: -1}
	bottom.X.Label.Text = "frequency (MHz)"
	bottom.Y.Label.Text = "Q"
	for _, p := range []*plot.Plot{top, bottom} {
		p.Add(plotter.NewGrid())
		p.Legend.Top = true
	}
	fmax := 0.0
	var mz, mq plotter.XYs
	for _, p := range pts {
		mz, mq = appendZQ(mz, mq, p.Frequency, p.Z)
		fmax = math.Max(fmax, p.Frequency)
	}
	for i, set := range []struct {
		p  *plot.Plot
		xy plotter.XYs
	}{{top, mz}, {bottom, mq}} {
		if len(set.xy) == 0 {
			continue
		}
		s, err := plotter.NewScatter(set.xy)
		if err != nil {
			return err
		}
		s.GlyphStyle.Radius = vg.Points(1.2)
		set.p.Add(s)
		if i == 0 {
			set.p.Legend.Add("measured", s)
		}
	}
	colours := [][3]uint8{{200, 30, 30}, {30, 90, 200}, {20, 140, 60}}
	for k, c := range curves {
		var cz, cq plotter.XYs
		fmin := pts[0].Frequency
		for i := range 400 {
			f := fmin * math.Pow(fmax/fmin, float64(i)/399)
			cz, cq = appendZQ(cz, cq, f, c.Z(f))
		}
		for i, set := range []struct {
			p  *plot.Plot
			xy plotter.XYs
		}{{top, cz}, {bottom, cq}} {
			if len(set.xy) < 2 {
				continue
			}
			l, err := plotter.NewLine(set.xy)
			if err != nil {
				return err
			}
			col := colours[k%len(colours)]
			l.LineStyle.Color = rgb(col)
			l.LineStyle.Width = vg.Points(1.2)
			if k > 0 {
				l.LineStyle.Dashes = []vg.Length{vg.Points(4), vg.Points(2)}
			}
			set.p.Add(l)
			if i == 0 {
				set.p.Legend.Add(c.Name, l)
			}
		}
	}
	width, height := 16*vg.Centimeter, 14*vg.Centimeter
	var dc vg.CanvasWriterTo
	switch format {
	case "svg":
		dc = vgsvg.New(width, height)
	case "png":
		dc = vgimg.PngCanvas{Canvas: vgimg.New(width, height)}
	default:
		return fmt.Errorf("plot format %q: svg or png", format)
	}
	tiles := draw.Tiles{Rows: 2, Cols: 1, PadTop: vg.Points(4), PadBottom: vg.Points(4), PadLeft: vg.Points(4), PadRight: vg.Points(8), PadY: vg.Points(6)}
	cs := plot.Align([][]*plot.Plot{{top}, {bottom}}, tiles, draw.New(dc))
	top.Draw(cs[0][0])
	bottom.Draw(cs[1][0])
	_, err := dc.WriteTo(w)
	return err
}

// appendZQ adds |z| and Q = X/R at f (plotted in MHz) to zs and qs, each
// only where it can be drawn: |z| finite and positive for the log axis, Q
// positive and below 1e5.
func appendZQ(zs, qs plotter.XYs, f float64, z complex128) (plotter.XYs, plotter.XYs) {
	x := f / 1e6
	if a := cmplx.Abs(z); a > 0 && !math.IsInf(a, 0) {
		zs = append(zs, plotter.XY{X: x, Y: a})
	}
	if q := imag(z) / real(z); real(z) > 0 && q > 0 && q < 1e5 {
		qs = append(qs, plotter.XY{X: x, Y: q})
	}
	return zs, qs
}
