package touchstone

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"math"
	"strings"
)

// Param is the kind of network parameter a file holds.
type Param byte

const (
	S Param = 'S'
	Y Param = 'Y'
	Z Param = 'Z'
)

// Point is the parameters at one frequency: M[i][j] is N(i+1)(j+1).
type Point struct {
	Frequency float64 // Hz
	M         [2][2]complex128
}

// Data is the content of a one- or two-port file.
type Data struct {
	Ports int     // 1 or 2
	Param Param   // S, Y or Z
	Z0    float64 // reference impedance, ohms
	// Points in ascending frequency. Y and Z values are in siemens and
	// ohms (not normalised).
	Points []Point
}

// ErrData reports data a writer cannot put in a valid file.
var ErrData = errors.New("touchstone: data cannot be written")

// Write writes d as a version 1.1 file with the parameters as
// real/imaginary pairs and frequencies in Hz; Y and Z are written
// normalised to Z0, as version 1.1 prescribes (Read scales them back). Each comment becomes a "!"
// line at the top.
func Write(w io.Writer, d Data, comments []string) error {
	if d.Ports != 1 && d.Ports != 2 {
		return fmt.Errorf("%w: %d ports (1 or 2)", ErrData, d.Ports)
	}
	switch d.Param {
	case S, Y, Z:
	default:
		return fmt.Errorf("%w: parameter %q (S, Y or Z)", ErrData, string(d.Param))
	}
	if !(d.Z0 > 0) || math.IsInf(d.Z0, 0) {
		return fmt.Errorf("%w: reference impedance %g", ErrData, d.Z0)
	}
	bw := bufio.NewWriter(w)
	for _, c := range comments {
		for _, line := range strings.Split(c, "\n") {
			fmt.Fprintf(bw, "! %s\n", line)
		}
	}
	fmt.Fprintf(bw, "# Hz %c RI R %s\n", d.Param, num(d.Z0))
	prev := math.Inf(-1)
	for _, p := range d.Points {
		if !(p.Frequency > prev) || math.IsInf(p.Frequency, 0) {
			return fmt.Errorf("%w: frequencies must ascend and be finite (%g after %g)", ErrData, p.Frequency, prev)
		}
		prev = p.Frequency
		vals := []complex128{p.M[0][0]}
		if d.Ports == 2 {
			vals = []complex128{p.M[0][0], p.M[1][0], p.M[0][1], p.M[1][1]}
		}
		bw.WriteString(num(p.Frequency))
		for _, v := range vals {
			// Version 1.1 normalises Y and Z to the reference impedance.
			switch d.Param {
			case Z:
				v /= complex(d.Z0, 0)
			case Y:
				v *= complex(d.Z0, 0)
			}
			if math.IsNaN(real(v)) || math.IsNaN(imag(v)) || math.IsInf(real(v), 0) || math.IsInf(imag(v), 0) {
				return fmt.Errorf("%w: a value at %g Hz is not finite", ErrData, p.Frequency)
			}
			fmt.Fprintf(bw, " %s %s", num(real(v)), num(imag(v)))
		}
		bw.WriteByte('\n')
	}
	return bw.Flush()
}

// num prints a number with enough digits to read back exactly.
func num(v float64) string { return fmt.Sprintf("%.12g", v) }
