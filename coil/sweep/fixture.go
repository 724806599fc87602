package sweep

import (
	"fmt"
	"math"
	"math/cmplx"
	"strings"

	"turnwise/coil"
	"turnwise/internal/quantity"
)

// Fixture is how the coil was connected to the analyser.
type Fixture int

const (
	// Reflection is one port with the coil from the port to ground.
	Reflection Fixture = iota + 1
	// Series is two ports with the coil in series between them.
	Series
	// Shunt is two ports with the coil from the through line to ground.
	Shunt
)

// String is the name in flags and JSON: reflection, series, shunt.
func (f Fixture) String() string {
	switch f {
	case Reflection:
		return "reflection"
	case Series:
		return "series"
	case Shunt:
		return "shunt"
	}
	return "unknown"
}

// ParseFixture reads a fixture name.
func ParseFixture(s string) (Fixture, error) {
	for _, f := range []Fixture{Reflection, Series, Shunt} {
		if strings.EqualFold(s, f.String()) {
			return f, nil
		}
	}
	return 0, &coil.InputError{Param: "fixture", Reason: fmt.Sprintf("%q is not a fixture: reflection (one port, coil to ground), series (two ports, coil between them) or shunt (two ports, coil from the line to ground)", s)}
}

// SPoint is a sweep point: S parameters at a common real reference Z0;
// S[i][j] is S(i+1)(j+1) (only S[0][0] for one port).
type SPoint struct {
	Frequency float64 // Hz
	S         [2][2]complex128
}

// Point is the coil's impedance at one frequency.
type Point struct {
	Frequency float64 // Hz
	Z         complex128
	// Sens is |dS/dZ| of the fixture at this point, 1/ohm: the weight that
	// turns an impedance error into the measured S parameter's.
	Sens float64
}

// Impedance converts a sweep of a ports-port network at reference z0
// (ohms) into the impedance of the coil in fixture fx.
func Impedance(fx Fixture, ports int, z0 float64, pts []SPoint) ([]Point, error) {
	switch {
	case fx == Reflection && ports != 1 && ports != 2:
		return nil, coil.InputErrorf("fixture", "a reflection fixture needs a one- or two-port sweep")
	case (fx == Series || fx == Shunt) && ports != 2:
		return nil, coil.InputErrorf("fixture", "a %s fixture needs a two-port sweep (.s2p); a one-port sweep (.s1p) is a reflection fixture", fx)
	case fx != Reflection && fx != Series && fx != Shunt:
		return nil, coil.InputErrorf("fixture", "no fixture given: reflection, series or shunt")
	}
	if !(z0 > 0) || math.IsInf(z0, 0) {
		return nil, coil.InputErrorf("reference", "reference impedance %g ohm must be positive", z0)
	}
	if len(pts) == 0 {
		return nil, coil.InputErrorf("sweep", "the sweep has no points")
	}
	out := make([]Point, 0, len(pts))
	r := complex(z0, 0)
	for _, p := range pts {
		var z complex128
		var sens float64
		switch fx {
		case Reflection:
			g := p.S[0][0]
			z = r * (1 + g) / (1 - g)
			sens = cmplx.Abs(2 * r / ((z + r) * (z + r)))
		case Series:
			s := p.S[1][0]
			z = 2 * r * (1 - s) / s
			sens = cmplx.Abs(2 * r / ((2*r + z) * (2*r + z)))
		case Shunt:
			s := p.S[1][0]
			z = r * s / (2 * (1 - s))
			sens = cmplx.Abs(2 * r / ((2*z + r) * (2*z + r)))
		}
		if cmplx.IsInf(z) || cmplx.IsNaN(z) || !(p.Frequency > 0) {
			return nil, coil.InputErrorf("sweep", "at %s the %s fixture gives no impedance (S at the edge of the chart); drop the point or check the fixture", fmtHz(p.Frequency), fx)
		}
		out = append(out, Point{Frequency: p.Frequency, Z: z, Sens: sens})
	}
	return out, nil
}

// Correct applies open/short correction: open and short are the jig
// measured alone (open, then with a short where the coil goes), converted
// with the same fixture. Their impedances are interpolated linearly in
// frequency; they must cover the sweep.
func Correct(pts, open, short []Point) ([]Point, error) {
	out := make([]Point, len(pts))
	for i, p := range pts {
		zo, ok1 := interp(open, p.Frequency)
		zs, ok2 := interp(short, p.Frequency)
		if !ok1 {
			return nil, coil.InputErrorf("open", "the open sweep does not cover %s: measure the jig over the coil's range", fmtHz(p.Frequency))
		}
		if !ok2 {
			return nil, coil.InputErrorf("short", "the short sweep does not cover %s: measure the jig over the coil's range", fmtHz(p.Frequency))
		}
		// Yo from the open less the short, kept as an admittance so that an
		// ideal open (Z = ∞) is Yo = 0.
		yo := 1 / (zo - zs)
		if cmplx.IsInf(zo) {
			yo = 0
		}
		d := p.Z - zs
		den := 1 - d*yo
		z := d / den
		if den == 0 || cmplx.IsInf(z) || cmplx.IsNaN(z) {
			return nil, coil.InputErrorf("open", "at %s the coil reads the same as the open jig: the open/short files do not belong to this sweep", fmtHz(p.Frequency))
		}
		out[i] = Point{Frequency: p.Frequency, Z: z, Sens: p.Sens * cmplx.Abs(den*den)}
	}
	return out, nil
}

func interp(pts []Point, f float64) (complex128, bool) {
	n := len(pts)
	if n == 0 {
		return 0, false
	}
	const slack = 1e-9
	if f < pts[0].Frequency*(1-slack) || f > pts[n-1].Frequency*(1+slack) {
		return 0, false
	}
	for i := 1; i < n; i++ {
		if f <= pts[i].Frequency {
			a, b := pts[i-1], pts[i]
			t := (f - a.Frequency) / (b.Frequency - a.Frequency)
			t = math.Max(0, math.Min(1, t))
			return a.Z + complex(t, 0)*(b.Z-a.Z), true
		}
	}
	return pts[n-1].Z, true
}

func fmtHz(f float64) string { return quantity.FormatFrequency(f) }
