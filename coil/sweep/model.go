package sweep

import "math"

// Model is the coil's equivalent circuit: the winding L with the loss
// R(f) = RDC + RSkin·√f in series, shunted by the self-capacitance C, all
// behind a series lead inductance LLead of the fixture (zero when it is
// not fitted).
type Model struct {
	L     float64 // H
	C     float64 // F
	RDC   float64 // ohm
	RSkin float64 // ohm/√Hz
	LLead float64 // H
}

// Coil is the coil's own impedance at f (no fixture lead).
func (m Model) Coil(f float64) complex128 {
	w := 2 * math.Pi * f
	zl := complex(m.RDC+m.RSkin*math.Sqrt(f), w*m.L)
	return zl / (1 + zl*complex(0, w*m.C))
}

// Z is the impedance the fixture presents at f: the coil and the lead.
func (m Model) Z(f float64) complex128 {
	return m.Coil(f) + complex(0, 2*math.Pi*f*m.LLead)
}

// SRF is the parallel self-resonance of the coil, 1/(2π√(LC)).
func (m Model) SRF() float64 { return 1 / (2 * math.Pi * math.Sqrt(m.L*m.C)) }

// InductanceAt is the coil's apparent inductance Im Z/ω at f (the
// self-capacitance included).
func (m Model) InductanceAt(f float64) float64 { return imag(m.Coil(f)) / (2 * math.Pi * f) }

// QAt is the coil's Q at f, Im Z/Re Z.
func (m Model) QAt(f float64) float64 {
	z := m.Coil(f)
	return imag(z) / real(z)
}

// R is the series loss at f.
func (m Model) R(f float64) float64 { return m.RDC + m.RSkin*math.Sqrt(f) }
