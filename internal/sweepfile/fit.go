package sweepfile

import (
	"fmt"
	"io"
	"math"
	"math/cmplx"
	"strings"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/sweep"
	"turnwise/internal/quantity"
)

// Request is a sweep file to fit and how: what `turnwise fit` and
// `turnwise trim --sweep` take from their flags.
type Request struct {
	File        string
	Fixture     string // reflection, series or shunt; "": reflection for .s1p, series for .s2p
	Open, Short string // the jig's open and short sweeps (both or neither)
	FMin, FMax  float64
	Frequency   float64 // where L and Q are given; 0: the lowest frequency fitted
	Lead        bool    // also fit a series lead inductance of the fixture
}

// Fit reads the request's files and fits the equivalent model. Bad input is
// a *coil.InputError (Param "fixture", "open", "short", "freq",
// "fit_range", ...) or the file's own error.
func Fit(r Request) (Loaded, sweep.Fixture, *sweep.Fit, error) {
	var fx sweep.Fixture
	var err error
	switch {
	case r.Fixture != "":
		if fx, err = sweep.ParseFixture(r.Fixture); err != nil {
			return Loaded{}, 0, nil, err
		}
	case strings.HasSuffix(strings.ToLower(r.File), ".s2p"):
		fx = sweep.Series
	default:
		fx = sweep.Reflection
	}
	ld, err := Load(Files{Sweep: r.File, Open: r.Open, Short: r.Short, Fixture: fx})
	if err != nil {
		return ld, fx, nil, err
	}
	fit, err := sweep.FitModel(ld.Points, sweep.Options{FMin: r.FMin, FMax: r.FMax, Frequency: r.Frequency, LeadInductance: r.Lead})
	if err != nil {
		return ld, fx, nil, err
	}
	return ld, fx, fit, nil
}

// PlotFit draws the sweep with the fit over it and, when asWound is not
// nil, the model of the coil as wound (ModelZ); file names the sweep in
// the title.
func PlotFit(w io.Writer, format, file string, ld Loaded, fit *sweep.Fit, asWound *coil.Geometry) error {
	curves := []Curve{{Name: "fit", Z: fit.Model.Coil}}
	if asWound != nil {
		g := *asWound
		curves = append(curves, Curve{Name: "model as wound", Z: func(f float64) complex128 { return ModelZ(g, f) }})
	}
	title := fmt.Sprintf("%s: L %s, SRF %s", file, quantity.FormatInductance(fit.InductanceLow.Value), quantity.FormatFrequency(fit.SRF.Value))
	return Plot(w, format, title, ld.Points, curves)
}

// ModelZ is the impedance of the model of g at f: the winding with its
// self-capacitance behind the leads (coil.ModelAt); NaN where it has none.
func ModelZ(g coil.Geometry, f float64) complex128 {
	m, err := coil.ModelAt(g, unit.Frequency(f))
	if err != nil {
		return cmplx.NaN()
	}
	w := 2 * math.Pi * f
	zl := complex(float64(m.R), w*float64(m.L))
	zc := zl / (1 + zl*complex(0, w*float64(m.SelfCapacitance)))
	return zc + complex(float64(m.RLeads), w*float64(m.LLeads))
}
