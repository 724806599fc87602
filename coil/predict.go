package coil

import (
	"math"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// CutAllowance is added to the wire length to cut: 10 mm at each end for
// stripping and soldering (common practice).
const CutAllowance unit.Length = 20e-3

// Bands on the model's estimates, as fractions of the nominal value.
const (
	// QMinFactor, QMaxFactor: a built coil's Q is usually below the
	// estimate (solder joints, surface finish, former dielectric, nearby
	// metal) and rarely far above it; Medhurst's table itself is recalled
	// from memory.
	QMinFactor = 0.70
	QMaxFactor = 1.10
)

// Flags mark conditions worth a warning; Prediction.Warnings words them.
type Flags uint16

const (
	FlagNearSRF              Flags = 1 << iota // f > SRF/3
	FlagLongWire                               // wire in the winding longer than λ/10
	FlagMedhurstExtrap                         // l/D outside Medhurst's table
	FlagNagaokaRange                           // l/D outside 0.01 … 100
	FlagTinned                                 // tinned wire at RF
	FlagSteepPitch                             // pitch more than the diameter: beyond the helix correction's validated range
	FlagWheelerOutOfRange                      // Wheeler's formula outside its range (informational)
	FlagSRFOutsideValidation                   // l/D or p/d outside the SRF model's validated range
)

// Prediction is everything the model says about one coil. Inductances are
// low-frequency values unless the name says "at f"; when Frequency is zero
// the "at f" values equal the low-frequency ones and R_ac, Q are zero.
type Prediction struct {
	Geometry  Geometry
	Frequency unit.Frequency

	// Build numbers.
	MeanDiameter    unit.Length // wire-centre diameter D
	InsideDiameter  unit.Length
	OutsideDiameter unit.Length
	SheetLength     unit.Length // Rosa's l = N·p
	WindingLength   unit.Length // outside length (N−1)·p + d_o
	HelixWire       unit.Length // wire in the winding
	WireLength      unit.Length // to cut: winding + both leads + CutAllowance
	CopperMass      unit.Mass   // of the cut length

	// Inductance.
	Nagaoka             float64         // K_N(l/D)
	SelfCorrection      float64         // k_s at DC
	MutualCorrection    float64         // k_m
	InternalFraction    float64         // φ at f (1 at DC)
	InductanceSheet     unit.Inductance // current sheet
	InductanceCoil      unit.Inductance // helix alone, low frequency
	InductanceCoilAtF   unit.Inductance // helix alone at f
	InductanceLeads     unit.Inductance // both leads at f
	Inductance          unit.Inductance // at the terminals at f: coil + leads
	InductanceWheeler   unit.Inductance // cross-check only
	WheelerValid        bool
	InductanceEffective unit.Inductance // apparent at f, self-capacitance included

	// Self-resonance, one end grounded.
	SelfCapacitance unit.Capacitance
	SRF             unit.Frequency
	SRFMin, SRFMax  unit.Frequency // band of the estimate
	SRFFloatingMin  unit.Frequency // both ends floating
	SRFFloatingMax  unit.Frequency

	// Self-resonance of both mountings from the helical-line model
	// (srf.go): SRF above is one end grounded, SRFFloating both ends
	// floating; SRFUncertainty is the relative uncertainty of either, from
	// the validation against NEC-2 (SRFMin … SRFMax and SRFFloatingMin …
	// SRFFloatingMax are value·(1 ∓ SRFUncertainty)). SRFMounting is the one
	// that feeds InductanceEffective, RAC and Q.
	SRFFloating    unit.Frequency
	SRFUncertainty float64
	SRFMounting    Mounting
	// SRFFloatingUncertainty is SRFUncertainty for SRFFloating.
	SRFFloatingUncertainty float64

	// Loss at f.
	RDC             unit.Resistance // winding + leads at the conductor temperature
	SkinDepth       unit.Length
	SkinFactor      float64 // R_ac/R_dc of isolated straight wire
	ProximityFactor float64 // Medhurst's Φ scaled for partial skin effect
	RRadiation      unit.Resistance
	RAC             unit.Resistance // effective series resistance at the terminals
	Q, QMin, QMax   float64

	Flags Flags
}

// Predict evaluates the model for g at operating frequency f (zero for
// none). It returns an *InputError for a geometry it cannot accept or when
// f is within 10 % of, or above, the self-resonance.
func Predict(g Geometry, f unit.Frequency) (Prediction, error) {
	return PredictMounted(g, f, Grounded)
}

// SRFUsedUncertainty is the relative uncertainty of SRFUsed.
func (p *Prediction) SRFUsedUncertainty() float64 {
	if p.SRFMounting == Floating {
		return p.SRFFloatingUncertainty
	}
	return p.SRFUncertainty
}

// SRFUsed is the self-resonance of the prediction's mounting.
func (p *Prediction) SRFUsed() unit.Frequency {
	if p.SRFMounting == Floating {
		return p.SRFFloating
	}
	return p.SRF
}

// PredictMounted is Predict for a coil mounted as m: m's self-resonance
// feeds the effective inductance, the loss and the refusal above 90 %% of
// the self-resonance.
func PredictMounted(g Geometry, f unit.Frequency, m Mounting) (Prediction, error) {
	var p Prediction
	if m != Grounded && m != Floating {
		return p, inputErrorf("mounting", "unknown mounting %d", int(m))
	}
	if err := g.Validate(); err != nil {
		return p, err
	}
	if !finite(float64(f)) || f < 0 || f > MaxFrequency {
		return p, inputErrorf("frequency", "must be between 0 and 10 GHz, e.g. 145MHz")
	}
	evaluate(&p, &g, float64(f), m)
	if f > 0 && float64(f) > 0.9*float64(p.SRFUsed()) {
		return p, inputErrorf("frequency", "%s is above 90 %% of the self-resonance %s (%s): the coil is not a usable inductor there; use fewer turns, a smaller diameter or a wider pitch",
			quantity.FormatFrequency(float64(f)), quantity.FormatFrequency(float64(p.SRFUsed())), m.Description())
	}
	return p, nil
}

// Evaluate fills p for a geometry that has passed Validate, at frequency
// f (zero for none), without Predict's checks of the frequency: callers
// that need the model near or past the self-resonance (the design search's
// tuning range) use it. It allocates nothing.
func Evaluate(p *Prediction, g *Geometry, f float64) { evaluate(p, g, f, Grounded) }

// evaluate fills p for a validated geometry. It allocates nothing.
func evaluate(p *Prediction, g *Geometry, f float64, m Mounting) {
	p.Geometry = *g
	p.Frequency = unit.Frequency(f)
	n := g.Turns
	d := float64(g.WireDiameter)
	r := d / 2
	do := g.overall()
	pitch := float64(g.Pitch)
	lead := float64(g.LeadLength)
	inside := float64(g.FormerDiameter) * (1 + g.Springback)
	dm := inside + do
	c := NewCore(n, pitch, d, dm, RosaMutual(n))
	ld := c.LD

	p.MeanDiameter = unit.Length(dm)
	p.InsideDiameter = unit.Length(inside)
	p.OutsideDiameter = unit.Length(inside + 2*do)
	p.SheetLength = unit.Length(c.L)
	p.WindingLength = unit.Length((n-1)*pitch + do)
	helix := c.Helix()
	p.HelixWire = unit.Length(helix)
	cut := helix + 2*lead + float64(CutAllowance)
	p.WireLength = unit.Length(cut)
	p.CopperMass = unit.Mass(CopperDensity * math.Pi * r * r * cut)

	// Inductance at DC.
	p.Nagaoka = c.Kn
	p.SelfCorrection = c.KsDC
	p.MutualCorrection = c.Km
	p.InductanceSheet = unit.Inductance(c.Ls)
	p.InductanceCoil = unit.Inductance(c.LCoilDC)
	lw, valid := Wheeler(n, dm, c.L)
	p.InductanceWheeler = unit.Inductance(lw)
	p.WheelerValid = valid

	// Self-resonance of both mountings; the equivalent self-capacitance is
	// the mounting's: the C across the winding that resonates it at that
	// mounting's SRF.
	rho := CopperResistivity(g.Temperature)
	cs, srfG, inTable := c.SelfResonance()
	srfF := c.FloatingResonance()
	u, uf := SRFUncertainty, SRFFloatingUncertainty
	if !inTable {
		u, uf = SRFUncertaintyOutside, SRFUncertaintyOutside
	}
	p.SRFFloatingUncertainty = uf
	p.SRF, p.SRFFloating, p.SRFUncertainty, p.SRFMounting = unit.Frequency(srfG), unit.Frequency(srfF), u, m
	p.SRFMin, p.SRFMax = unit.Frequency(srfG*(1-u)), unit.Frequency(srfG*(1+u))
	p.SRFFloatingMin, p.SRFFloatingMax = unit.Frequency(srfF*(1-uf)), unit.Frequency(srfF*(1+uf))
	srf := srfG
	if m == Floating {
		srf = srfF
		cs *= (srfG / srfF) * (srfG / srfF) // the same winding L resonates at srfF
	}
	p.SelfCapacitance = unit.Capacitance(cs)

	w := NewWireAt(r, rho, lead, f)
	w.Plate(PlatingRatio(g.Conductor, float64(g.Plating), rho, f))
	p.RDC = unit.Resistance(w.RdcPerM * (helix + 2*lead))

	var flags Flags
	if !inTable {
		flags |= FlagSRFOutsideValidation
	}
	if ld < 0.01 || ld > 100 {
		flags |= FlagNagaokaRange
	}
	if pitch > helixValidPD*dm*(1+1e-9) {
		flags |= FlagSteepPitch
	}
	if !valid {
		flags |= FlagWheelerOutOfRange
	}

	p.InternalFraction = w.Phi
	lCoil := c.CoilAt(&w)
	p.InductanceCoilAtF = unit.Inductance(lCoil)
	p.InductanceLeads = unit.Inductance(w.Leads)
	p.Inductance = unit.Inductance(lCoil + w.Leads)
	if f == 0 {
		p.InductanceEffective = p.Inductance
		p.Flags = flags
		return
	}

	loss := c.LossAt(&w, helix, srf)
	p.InductanceEffective = unit.Inductance(loss.LEff)
	p.SkinDepth = unit.Length(w.Delta)
	p.SkinFactor = w.Fs
	p.ProximityFactor = loss.Proximity
	p.RRadiation = unit.Resistance(loss.RRadiation)
	p.RAC = unit.Resistance(loss.REff)
	p.Q, p.QMin = loss.Q, loss.Q*QMinFactor
	p.QMax = qMaxCapped(loss.Q, c.QCeiling(&w, helix, srf))

	if f > srf/3 {
		flags |= FlagNearSRF
	}
	if helix > w.Lambda/10 {
		flags |= FlagLongWire
	}
	if g.Conductor == Tinned {
		flags |= FlagTinned
	}
	p.Flags = flags
}
