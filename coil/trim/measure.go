package trim

import (
	"math"
	"slices"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// MeasurementKind is how a built coil was measured.
type MeasurementKind int

const (
	// MeasureDirect is an inductance meter's reading.
	MeasureDirect MeasurementKind = iota + 1
	// MeasureResonance is one resonance with a known capacitor across the
	// coil in a test fixture (grid-dip meter, signal generator and probe).
	MeasureResonance
	// MeasureInCircuit is the resonance of the coil in the circuit it was
	// designed for, with that circuit's capacitance.
	MeasureInCircuit
	// MeasureTwoCapacitor is two or more resonances with different known
	// capacitors, which give both L and the total capacitance already
	// across the coil (fixture stray plus the coil's self-capacitance).
	MeasureTwoCapacitor
	// MeasureSweep is a network analyser's sweep fitted with the coil's
	// equivalent model (package coil/sweep): the fitted inductance at a
	// frequency, its uncertainty and the capacitance across the coil.
	MeasureSweep
)

// String is the name used in JSON: direct, resonance, in_circuit,
// two_capacitor.
func (k MeasurementKind) String() string {
	switch k {
	case MeasureDirect:
		return "direct"
	case MeasureResonance:
		return "resonance"
	case MeasureInCircuit:
		return "in_circuit"
	case MeasureTwoCapacitor:
		return "two_capacitor"
	case MeasureSweep:
		return "sweep"
	}
	return "unknown"
}

// Resonance is one reading: the coil resonated at Frequency with
// Capacitance across its terminals.
type Resonance struct {
	Frequency   unit.Frequency
	Capacitance unit.Capacitance
}

// Measurement is what the builder read, with the accuracy of each
// instrument. Tolerances are bands (a part's tolerance class, a meter's
// stated accuracy), combined root-sum-square as independent errors; zero
// means exact.
type Measurement struct {
	Kind MeasurementKind

	// Inductance is the meter's reading (MeasureDirect).
	Inductance unit.Inductance
	// TestFrequency is the meter's test frequency; zero when it is low
	// (kHz) or unknown. A reading at a stated frequency includes the
	// coil's self-capacitance, as the effective inductance does.
	TestFrequency unit.Frequency
	// FixtureInductance is subtracted from the reading: the meter's reading
	// with its clips shorted together (common practice).
	FixtureInductance unit.Inductance
	// MeterTolerance is the meter's relative accuracy.
	MeterTolerance float64

	// Resonances: one for MeasureResonance and MeasureInCircuit, two or
	// more with at least two different capacitors for MeasureTwoCapacitor.
	Resonances []Resonance
	// Stray is capacitance across the coil besides the known capacitor:
	// fixture wiring, a probe, a dip meter's loop. For MeasureTwoCapacitor
	// it is not needed (the method measures it together with the
	// self-capacitance); when given it is subtracted from the measured
	// total to compare the coil's self-capacitance with Medhurst's.
	Stray unit.Capacitance
	// StrayTolerance is the uncertainty of Stray in farads.
	StrayTolerance unit.Capacitance
	// CapacitorTolerance is the known capacitors' relative tolerance;
	// CapacitorToleranceAbs, when set, is an absolute one (small
	// capacitors are specified as ±0.25 pF, ±0.5 pF) and the larger of the
	// two applies to each capacitor.
	CapacitorTolerance    float64
	CapacitorToleranceAbs unit.Capacitance
	// FrequencyTolerance is the frequency reading's relative accuracy.
	FrequencyTolerance float64

	// Sweep is the fitted sweep (MeasureSweep).
	Sweep SweepFit

	// FixtureLeadLength is extra straight wire on each lead between the
	// coil's solder points and the instrument during the measurement; the
	// model adds it to the leads when it compares.
	FixtureLeadLength unit.Length
}

// SweepFit is what a fitted sweep says (MeasureSweep): the equivalent
// model's L — the terminal inductance without the self-capacitance, as
// the two-capacitor line gives it — at Frequency, with its relative
// uncertainty, and the capacitance the fit puts across the coil
// (self-capacitance plus whatever stray the fixture correction left).
type SweepFit struct {
	Inductance             unit.Inductance
	Uncertainty            float64
	Frequency              unit.Frequency
	Capacitance            unit.Capacitance
	CapacitanceUncertainty unit.Capacitance
	// Residual is the fit's rms residual (in S units).
	Residual float64
}

// Reading is a measurement reduced to one inductance with its uncertainty.
type Reading struct {
	Kind MeasurementKind
	// Inductance is what the measurement says about the coil: the meter's
	// reading less the fixture, 1/(ω²C) for a resonance, or the slope of
	// the two-capacitor line.
	Inductance unit.Inductance
	// Uncertainty is relative, from the instrument tolerances.
	Uncertainty float64
	// Frequency is where the reading applies; zero for a low-frequency
	// meter reading. For the two-capacitor method it is the geometric
	// mean of the resonances.
	Frequency unit.Frequency
	// Effective reports that Inductance includes the coil's
	// self-capacitance (the apparent inductance at Frequency, as a meter
	// or a single resonance sees it). The two-capacitor method measures
	// the self-capacitance separately, so its inductance is the terminal
	// inductance without it.
	Effective bool
	// Capacitance is the total capacitance the coil resonated with in a
	// single-resonance reading: the known capacitor plus Stray.
	Capacitance unit.Capacitance
	// TotalStray (MeasureTwoCapacitor) is the capacitance already across
	// the coil: fixture stray plus the coil's self-capacitance, with its
	// uncertainty in farads.
	TotalStray            unit.Capacitance
	TotalStrayUncertainty unit.Capacitance
	// StrayUncertaintyOnePercent and UncertaintyOnePercent (two-capacitor
	// method, when TotalStrayUncertainty exceeds |TotalStray|) are what
	// 1 % capacitors would give from the same readings; zero otherwise.
	StrayUncertaintyOnePercent unit.Capacitance
	UncertaintyOnePercent      float64
	// FitResidual (MeasureTwoCapacitor, three or more resonances) is the
	// rms relative deviation of the resonances from the fitted line.
	FitResidual float64
}

// Reduce turns the measurement into an inductance. Inconsistent or
// impossible readings return an *InputError naming the field:
// "measured_inductance", "fixture_inductance", "resonance", "stray",
// "tolerance".
func (m Measurement) Reduce() (Reading, error) {
	if err := m.validateTolerances(); err != nil {
		return Reading{}, err
	}
	switch m.Kind {
	case MeasureDirect:
		return m.reduceDirect()
	case MeasureResonance, MeasureInCircuit:
		return m.reduceResonance()
	case MeasureTwoCapacitor:
		return m.reduceLine()
	case MeasureSweep:
		return m.reduceSweep()
	}
	return Reading{}, inputErrorf("measurement", "no measurement given: give an inductance reading or a resonance")
}

func (m *Measurement) validateTolerances() error {
	// The stray first: its tolerance follows from it in the command.
	if !finite(float64(m.Stray)) || m.Stray < 0 || m.Stray > 1e-6 {
		return inputErrorf("stray", "must be zero or a small positive capacitance, e.g. 2pF")
	}
	for _, t := range []struct {
		name string
		v    float64
		max  float64
	}{
		{"meter", m.MeterTolerance, 0.5},
		{"capacitor", m.CapacitorTolerance, 0.5},
		{"frequency", m.FrequencyTolerance, 0.2},
	} {
		if !finite(t.v) || t.v < 0 || t.v > t.max {
			return inputErrorf("tolerance", "%s tolerance %.3g %% is outside 0 … %g %%", t.name, t.v*100, t.max*100)
		}
	}
	for _, c := range []struct {
		name string
		v    unit.Capacitance
	}{{"capacitor", m.CapacitorToleranceAbs}, {"stray", m.StrayTolerance}} {
		if !finite(float64(c.v)) || c.v < 0 || c.v > 1e-6 {
			return inputErrorf("tolerance", "%s tolerance %s is not a sensible capacitance", c.name, quantity.FormatCapacitanceShort(float64(c.v)))
		}
	}
	if fl := float64(m.FixtureLeadLength); !finite(fl) || fl < 0 || fl > coil.MaxLeadLength {
		return inputErrorf("fixture_lead_length", "must be zero or a length up to %s", quantity.FormatMillimetres(coil.MaxLeadLength))
	}
	return nil
}

// capSigma is the uncertainty of one known capacitor.
func (m *Measurement) capSigma(c float64) float64 {
	return math.Max(m.CapacitorTolerance*c, float64(m.CapacitorToleranceAbs))
}

func (m *Measurement) reduceDirect() (Reading, error) {
	l, fix := float64(m.Inductance), float64(m.FixtureInductance)
	switch {
	case !finite(l) || l <= 0:
		return Reading{}, inputErrorf("measured_inductance", "must be a positive inductance, e.g. 52nH")
	case l > 1:
		return Reading{}, inputErrorf("measured_inductance", "%s is not the reading of a single-layer air coil; check the unit (nH, uH)", quantity.FormatInductance(l))
	case !finite(fix) || fix < 0:
		return Reading{}, inputErrorf("fixture_inductance", "must be zero or positive: the meter's reading with its clips shorted")
	case fix >= l:
		return Reading{}, inputErrorf("fixture_inductance", "%s is not less than the reading %s: the fixture allowance is the meter's reading with its clips shorted together, well below the coil's",
			quantity.FormatInductance(fix), quantity.FormatInductance(l))
	}
	if f := float64(m.TestFrequency); !finite(f) || f < 0 || f > coil.MaxFrequency {
		return Reading{}, inputErrorf("test_frequency", "must be between 0 and 10 GHz, e.g. 1MHz")
	}
	net := l - fix
	return Reading{
		Kind:        MeasureDirect,
		Inductance:  unit.Inductance(net),
		Uncertainty: m.MeterTolerance * l / net,
		Frequency:   m.TestFrequency,
		Effective:   m.TestFrequency > 0,
	}, nil
}

func (m *Measurement) checkResonance(i int, r Resonance) error {
	f, c := float64(r.Frequency), float64(r.Capacitance)
	switch {
	case !finite(f) || f <= 0 || f > coil.MaxFrequency:
		return inputErrorf("resonance", "reading %d: the frequency must be between 0 and 10 GHz, e.g. 9.81MHz", i+1)
	case !finite(c) || c <= 0 || c > 1e-3:
		return inputErrorf("resonance", "reading %d: the capacitance must be positive, e.g. 100pF", i+1)
	}
	return nil
}

func (m *Measurement) reduceResonance() (Reading, error) {
	if len(m.Resonances) != 1 {
		return Reading{}, inputErrorf("resonance", "a single-resonance measurement takes one reading, got %d", len(m.Resonances))
	}
	r := m.Resonances[0]
	if err := m.checkResonance(0, r); err != nil {
		return Reading{}, err
	}
	f := float64(r.Frequency)
	c := float64(r.Capacitance) + float64(m.Stray)
	sc := math.Hypot(m.capSigma(float64(r.Capacitance)), float64(m.StrayTolerance))
	w := twoPi * f
	return Reading{
		Kind:        m.Kind,
		Inductance:  unit.Inductance(1 / (w * w * c)),
		Uncertainty: math.Hypot(2*m.FrequencyTolerance, sc/c),
		Frequency:   r.Frequency,
		Effective:   true,
		Capacitance: unit.Capacitance(c),
	}, nil
}

// reduceLine is the two-capacitor method. At resonance with a known C and
// a fixed unknown C0 already across the coil (fixture stray and the coil's
// self-capacitance),
//
//	1/ω² = L·C + L·C0,
//
// a straight line in C: its slope is L and its intercept on the C axis is
// −C0. Two readings give both; more are fitted by least squares. The
// method is common practice for measuring a coil's self-capacitance
// (described, from memory, in F. E. Terman, Radio Engineers' Handbook,
// McGraw-Hill, 1943, under the distributed capacitance of coils).
func (m *Measurement) reduceLine() (Reading, error) {
	rs := m.Resonances
	if len(rs) < 2 {
		return Reading{}, inputErrorf("resonance", "the two-capacitor method needs two readings with different capacitors, got %d", len(rs))
	}
	for i, r := range rs {
		if err := m.checkResonance(i, r); err != nil {
			return Reading{}, err
		}
	}
	// A larger capacitor always tunes lower: any pair that does not is a
	// reading paired with the wrong capacitor, or a wrong value.
	distinct := false
	for i := range rs {
		for j := range rs {
			ci, cj := rs[i].Capacitance, rs[j].Capacitance
			if ci < cj {
				distinct = true
				if rs[i].Frequency <= rs[j].Frequency {
					return Reading{}, inputErrorf("resonance", "the larger capacitor (%s) gave the same or a higher resonance (%s) than the smaller one (%s at %s); a larger capacitor always tunes lower: check which reading goes with which capacitor",
						quantity.FormatCapacitanceShort(float64(cj)), quantity.FormatFrequency(float64(rs[j].Frequency)), quantity.FormatCapacitanceShort(float64(ci)), quantity.FormatFrequency(float64(rs[i].Frequency)))
				}
			}
		}
	}
	if !distinct {
		return Reading{}, inputErrorf("resonance", "all readings use the same capacitance (%s); the method needs two different capacitors, ideally 1:4 apart",
			quantity.FormatCapacitanceShort(float64(rs[0].Capacitance)))
	}
	l, c0, resid := fitLine(rs)

	// Uncertainty: first-order propagation, each input's sensitivity (from
	// a small relative step) times its tolerance, added root-sum-square as
	// independent errors. A step of a whole tolerance would give a secant
	// instead, several percent low for a 5 % capacitor.
	uC0, uL := m.lineSigma(rs, l, c0)
	if uL > maxLineUncertainty {
		return Reading{}, inputErrorf("resonance", "the readings cannot fix L: ±%.0f %% from the capacitor and frequency tolerances; use capacitors further apart (ideally 1:4) or closer tolerances (--cap-tol)", uL*100)
	}
	if c0 < -(uC0 + 0.1e-12) {
		return Reading{}, inputErrorf("resonance", "the readings imply a negative capacitance across the coil (%s ± %s); a frequency or a capacitor value is off: measure the capacitors and read the resonances again",
			quantity.FormatCapacitanceShort(c0), quantity.FormatCapacitanceShort(uC0))
	}
	for _, r := range rs {
		if float64(r.Capacitance)+c0 <= 0 {
			return Reading{}, inputErrorf("resonance", "the readings are inconsistent: the fitted stray (%s) cancels the %s capacitor", quantity.FormatCapacitanceShort(c0), quantity.FormatCapacitanceShort(float64(r.Capacitance)))
		}
	}
	logSum := 0.0
	for _, r := range rs {
		logSum += math.Log(float64(r.Frequency))
	}
	// When the tolerances swamp the stray itself, say what 1 % capacitors
	// (a common class) would give from the same readings.
	var uC1, uL1 float64
	if uC0 > math.Abs(c0) && (m.CapacitorTolerance > OnePercent || m.CapacitorToleranceAbs > 0) {
		m1 := *m
		m1.CapacitorTolerance, m1.CapacitorToleranceAbs = OnePercent, 0
		uC1, uL1 = m1.lineSigma(rs, l, c0)
	}
	return Reading{
		StrayUncertaintyOnePercent: unit.Capacitance(uC1),
		UncertaintyOnePercent:      uL1,
		Kind:                       MeasureTwoCapacitor,
		Inductance:                 unit.Inductance(l),
		Uncertainty:                uL,
		Frequency:                  unit.Frequency(math.Exp(logSum / float64(len(rs)))),
		Effective:                  false,
		TotalStray:                 unit.Capacitance(c0),
		TotalStrayUncertainty:      unit.Capacitance(uC0),
		FitResidual:                resid,
	}, nil
}

// OnePercent is the capacitor tolerance the two-capacitor method's advice
// computes with when the given tolerance cannot fix the stray: 1 % silver
// mica and C0G parts are common stock (common practice).
const OnePercent = 0.01

// lineSigma propagates the capacitor and frequency tolerances through the
// two-capacitor line fitted to rs (l, c0): first-order, each input's
// sensitivity (from a small relative step) times its tolerance, added
// root-sum-square as independent errors. A step of a whole tolerance would
// give a secant instead, several percent low for a 5 % capacitor. It
// returns the stray's standard uncertainty (F) and L's relative one.
func (m *Measurement) lineSigma(rs []Resonance, l, c0 float64) (uC0, uL float64) {
	const step = 1e-6
	var varL, varC0 float64
	work := slices.Clone(rs)
	add := func(i int, sigmaPerStep float64) {
		l1, c1, _ := fitLine(work)
		varL += sq((l1 - l) * sigmaPerStep)
		varC0 += sq((c1 - c0) * sigmaPerStep)
		work[i] = rs[i]
	}
	for i, r := range rs {
		c := float64(r.Capacitance)
		work[i].Capacitance = r.Capacitance * (1 + step)
		add(i, m.capSigma(c)/(step*c))
		work[i].Frequency = r.Frequency * (1 + step)
		add(i, m.FrequencyTolerance/step)
	}
	return math.Sqrt(varC0), math.Sqrt(varL) / l
}

// maxLineUncertainty is the largest relative uncertainty of L from the
// two-capacitor line that is still a reading: beyond it the capacitors are
// too close together for their tolerances (the same bound as a meter's).
const maxLineUncertainty = 0.5

func sq(x float64) float64 { return x * x }

// fitLine fits 1/ω² = L·C + L·C0 by least squares and returns L, C0 and
// the rms relative frequency residual (zero for two readings).
func fitLine(rs []Resonance) (l, c0, resid float64) {
	n := float64(len(rs))
	var sx, sy float64
	for _, r := range rs {
		w := twoPi * float64(r.Frequency)
		sx += float64(r.Capacitance)
		sy += 1 / (w * w)
	}
	mx, my := sx/n, sy/n
	var sxx, sxy float64
	for _, r := range rs {
		w := twoPi * float64(r.Frequency)
		dx := float64(r.Capacitance) - mx
		sxx += dx * dx
		sxy += dx * (1/(w*w) - my)
	}
	l = sxy / sxx
	b := my - l*mx
	c0 = b / l
	if len(rs) > 2 {
		var ss float64
		for _, r := range rs {
			w := twoPi * float64(r.Frequency)
			y := 1 / (w * w)
			fit := l * (float64(r.Capacitance) + c0)
			// y ∝ 1/f², so a relative error e in y is e/2 in frequency.
			e := (y/fit - 1) / 2
			ss += e * e
		}
		resid = math.Sqrt(ss / n)
	}
	return l, c0, resid
}

// maxSweepUncertainty is the largest relative uncertainty of a fitted L
// that is still a reading (the same bound as the two-capacitor line's).
const maxSweepUncertainty = maxLineUncertainty

func (m *Measurement) reduceSweep() (Reading, error) {
	s := m.Sweep
	l, f := float64(s.Inductance), float64(s.Frequency)
	switch {
	case !finite(l) || l <= 0 || l > 1:
		return Reading{}, inputErrorf("sweep", "the fitted inductance %s is not a coil's", quantity.FormatInductance(l))
	case !finite(f) || f < 0 || f > coil.MaxFrequency:
		return Reading{}, inputErrorf("sweep", "the fit's frequency must be between 0 and 10 GHz")
	case !finite(s.Uncertainty) || s.Uncertainty < 0:
		return Reading{}, inputErrorf("sweep", "the fit's uncertainty must be zero or positive")
	case s.Uncertainty > maxSweepUncertainty:
		return Reading{}, inputErrorf("sweep", "the sweep cannot fix L: ±%.0f %%; sweep wider or with less noise", s.Uncertainty*100)
	case !finite(float64(s.Capacitance)) || s.Capacitance < 0 || s.Capacitance > 1e-6:
		return Reading{}, inputErrorf("sweep", "the fitted capacitance must be a small positive capacitance")
	}
	return Reading{
		Kind:                  MeasureSweep,
		Inductance:            s.Inductance,
		Uncertainty:           s.Uncertainty,
		Frequency:             s.Frequency,
		Effective:             false,
		TotalStray:            s.Capacitance,
		TotalStrayUncertainty: s.CapacitanceUncertainty,
		FitResidual:           s.Residual,
	}, nil
}
