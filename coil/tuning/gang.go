package tuning

import (
	"fmt"
	"math"
	"sort"
	"turnwise/coil"

	"gonum.org/v1/gonum/unit"
)

// twoPi saves a multiply in hot paths.
const twoPi = 2 * math.Pi

// Law is how a variable capacitor's capacitance follows its rotation.
type Law int

const (
	// LawSLC, straight-line capacitance: C rises evenly with rotation.
	LawSLC Law = iota
	// LawSLF, straight-line frequency: 1/√C falls evenly with rotation,
	// so the frequency of an LC tank does too.
	LawSLF
	// LawSLW, straight-line wavelength: √C rises evenly with rotation.
	LawSLW
	// LawTable: the capacitance measured at a few settings, linearly
	// interpolated between them (GangSection.Table).
	LawTable
)

func (l Law) String() string {
	switch l {
	case LawSLF:
		return "slf"
	case LawSLW:
		return "slw"
	case LawTable:
		return "table"
	}
	return "slc"
}

// GangPoint is one measured point of a capacitor section: its capacitance
// at a dial setting (0 plates open … 1 fully meshed).
type GangPoint struct {
	Setting     float64
	Capacitance unit.Capacitance
}

// GangSection is one section of a variable capacitor as wired into the
// circuit. The dial setting runs from 0, plates fully open (minimum
// capacitance: the top of each range), to 1, plates fully meshed (maximum:
// the bottom of each range).
//
// The SLF and SLW laws are defined on the section's own capacitance from
// Min to Max; with a trimmer, strays and the coil's self-capacitance
// added, the frequency is no longer exactly straight against rotation,
// as on a real dial.
type GangSection struct {
	Min, Max unit.Capacitance // plates open, fully meshed; equal for a fixed capacitor
	Law      Law
	// Table holds the measured points for LawTable: settings from 0 to 1
	// in rising order, capacitance never falling. Min and Max are then
	// the first and last capacitance.
	Table   []GangPoint
	Trimmer unit.Capacitance // in parallel, fixed
	Stray   unit.Capacitance // wiring and socket capacitance to ground at this section's node
}

// Validate reports a section the solver cannot use; param prefixes the
// field names ("gang_a", "gang_b").
func (s *GangSection) Validate(param string) error {
	lo, hi := float64(s.Min), float64(s.Max)
	if s.Law == LawTable {
		if len(s.Table) < 2 {
			return coil.InputErrorf(param+"_table", "a measured law needs at least two points (plates open and fully meshed)")
		}
		t := s.Table
		if t[0].Setting != 0 || t[len(t)-1].Setting != 1 {
			return coil.InputErrorf(param+"_table", "the measured points must start at 0 %% (plates open) and end at 100 %% (fully meshed)")
		}
		for i, p := range t {
			c := float64(p.Capacitance)
			if !coil.Finite(p.Setting) || !coil.Finite(c) || c < 0 || c > 1e-6 {
				return coil.InputErrorf(param+"_table", "point %d: capacitance must be between 0 and 1 µF", i+1)
			}
			if i > 0 && p.Setting <= t[i-1].Setting {
				return coil.InputErrorf(param+"_table", "point %d: settings must rise (%.4g %% follows %.4g %%)", i+1, p.Setting*100, t[i-1].Setting*100)
			}
			if i > 0 && c < float64(t[i-1].Capacitance) {
				return coil.InputErrorf(param+"_table", "point %d: capacitance falls from %.4g pF to %.4g pF; it must rise as the plates mesh", i+1, float64(t[i-1].Capacitance)*1e12, c*1e12)
			}
		}
		lo, hi = float64(t[0].Capacitance), float64(t[len(t)-1].Capacitance)
	} else if s.Law < LawSLC || s.Law > LawSLW {
		return coil.InputErrorf(param+"_law", "unknown law %d", int(s.Law))
	}
	switch {
	case !coil.Finite(lo) || !coil.Finite(hi) || lo < 0 || hi < 0:
		return coil.InputErrorf(param, "capacitance must be zero or positive, e.g. 15-365pF")
	case hi < lo:
		return coil.InputErrorf(param, "maximum %.4g pF is below the minimum %.4g pF; give MIN-MAX", hi*1e12, lo*1e12)
	case hi > 1e-6:
		return coil.InputErrorf(param, "%.4g pF is more than 1 µF; a tuning capacitor is pF to nF", hi*1e12)
	case (s.Law == LawSLF || s.Law == LawSLW) && lo == 0 && hi > 0:
		return coil.InputErrorf(param, "the %s law needs a minimum above 0 pF (every capacitor has one; e.g. 12-365pF)", s.Law)
	}
	for _, x := range []struct {
		name string
		v    unit.Capacitance
	}{{"trimmer", s.Trimmer}, {"stray", s.Stray}} {
		if v := float64(x.v); !coil.Finite(v) || v < 0 || v > 1e-6 {
			return coil.InputErrorf(param+"_"+x.name, "must be between 0 and 1 µF, e.g. 5pF")
		}
	}
	return nil
}

// Capacitance is the section's own capacitance at a dial setting from 0
// (plates open) to 1 (fully meshed); settings outside are clamped.
func (s *GangSection) Capacitance(setting float64) unit.Capacitance {
	x := math.Min(math.Max(setting, 0), 1)
	lo, hi := float64(s.Min), float64(s.Max)
	switch s.Law {
	case LawSLF:
		if lo == hi {
			return s.Min
		}
		u := 1/math.Sqrt(lo) - x*(1/math.Sqrt(lo)-1/math.Sqrt(hi))
		return unit.Capacitance(1 / (u * u))
	case LawSLW:
		u := math.Sqrt(lo) + x*(math.Sqrt(hi)-math.Sqrt(lo))
		return unit.Capacitance(u * u)
	case LawTable:
		t := s.Table
		i := sort.Search(len(t), func(i int) bool { return t[i].Setting >= x })
		switch {
		case i == 0:
			return t[0].Capacitance
		case i >= len(t):
			return t[len(t)-1].Capacitance
		}
		a, b := t[i-1], t[i]
		w := (x - a.Setting) / (b.Setting - a.Setting)
		return unit.Capacitance(float64(a.Capacitance) + w*float64(b.Capacitance-a.Capacitance))
	}
	return unit.Capacitance(lo + x*(hi-lo))
}

// Total is the capacitance the section puts on its node at a setting:
// its own, the trimmer and the stray.
func (s *GangSection) Total(setting float64) unit.Capacitance {
	return s.Capacitance(setting) + s.Trimmer + s.Stray
}

// Resonances are the natural frequencies of the two-gang circuit at one
// dial setting. High is zero when the circuit has only one (a section at
// zero capacitance, or a tap at an end of the coil).
type Resonances struct {
	Low, High unit.Frequency
}

// TwoNodeResonances solves the tapped coil with capacitance cTop from the
// top of the coil to ground and cTap from the tap to ground (everything at
// each node: gang section, trimmer, stray, and at the top the coil's
// self-capacitance).
//
// Nodes v = (v_top, v_tap); the bottom section carries i_b from ground to
// the tap, the top section i_a from the tap to the top, with branch
// voltages u = (v_tap, v_top − v_tap) = A·v. With the inductance matrix
// Λ = [[L_b, M], [M, L_a]] the nodal equations are C·v̈ + Γ·v = 0 with
// Γ = Aᵀ·Λ⁻¹·A and C = diag(cTop, cTap), so the resonances satisfy the
// symmetric-definite generalized eigenproblem Γ·x = ω²·C·x. Written out,
//
//	Γ = 1/Δ · [[L_b, −(L_b + M)], [−(L_b + M), L]],  Δ = L_a·L_b − M²,  L = L_a + L_b + 2M
//
// and det Γ = 1/Δ, so det(Γ − ω²·C) = 0 is, multiplied by Δ, the quadratic
//
//	a·x² − b·x + 1 = 0,   x = ω²,   a = cTop·cTap·Δ,   b = L·cTop + L_b·cTap
//
// whose discriminant is a sum of squares, free of cancellation:
//
//	b² − 4a = (L·cTop − L_b·cTap)² + 4·cTop·cTap·(L_b + M)²
//
// With q = (b + √(b² − 4a))/2 (no cancellation, b > 0) the roots are
// ω²_low = 1/q and ω²_high = q/a (Press et al. 2007, §5.6). It allocates
// nothing; the tests hold it to gonum/mat's EigenSym on the same pencil.
//
// When cTap is zero the tap node has no capacitance: a = 0 and the one
// resonance is the whole coil's with cTop (1/q = 1/(L·cTop)); when cTop is
// zero, the bottom section's with cTap. A tap at an end (L_a or L_b zero)
// leaves one tank as well.
func TwoNodeResonances(s coil.Sections, cTop, cTap unit.Capacitance) (Resonances, error) {
	la, lb, m := float64(s.LA), float64(s.LB), float64(s.M)
	ct, cb := float64(cTop), float64(cTap)
	switch {
	case !coil.Finite(ct) || !coil.Finite(cb) || ct < 0 || cb < 0:
		return Resonances{}, coil.InputErrorf("capacitance", "node capacitances must be zero or positive")
	case !coil.Finite(la) || !coil.Finite(lb) || !coil.Finite(m) || la < 0 || lb < 0:
		return Resonances{}, coil.InputErrorf("sections", "section inductances must be zero or positive")
	}
	switch {
	case la == 0: // tap at the top: both sections' capacitance across the whole coil
		return singleTank(lb, ct+cb)
	case lb == 0: // tap at ground: section B is shorted
		return singleTank(la, ct)
	}
	det := la*lb - m*m
	if !(det > 0) {
		return Resonances{}, coil.InputErrorf("sections", "coupling k = %.6g is not below 1: the sections are not a physical pair", m/math.Sqrt(la*lb))
	}
	if ct == 0 && cb == 0 {
		return Resonances{}, coil.InputErrorf("capacitance", "the circuit has no capacitance: no resonance")
	}
	l := la + lb + 2*m
	b := l*ct + lb*cb
	q := (b + math.Hypot(l*ct-lb*cb, 2*(lb+m)*math.Sqrt(ct*cb))) / 2
	if !(q > 0) || math.IsInf(q, 0) {
		return Resonances{}, fmt.Errorf("tuning: two-node circuit gave no positive ω² (q = %g)", q)
	}
	r := Resonances{Low: unit.Frequency(1 / (twoPi * math.Sqrt(q)))}
	if a := ct * cb * det; a > 0 {
		r.High = unit.Frequency(math.Sqrt(q/a) / twoPi)
	}
	return r, nil
}

// singleTank is the one resonance of inductance l with capacitance c.
func singleTank(l, c float64) (Resonances, error) {
	if l <= 0 || c <= 0 {
		return Resonances{}, coil.InputErrorf("capacitance", "the circuit has no capacitance across its inductance: no resonance")
	}
	return Resonances{Low: unit.Frequency(1 / (twoPi * math.Sqrt(l*c)))}, nil
}
