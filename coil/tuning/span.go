package tuning

import (
	"fmt"
	"math"
	"sort"
	"turnwise/coil"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Band is a range of frequencies the builder wants to tune, e.g. an
// amateur or broadcast band.
type Band struct {
	Name      string
	Low, High unit.Frequency
}

// Spec is a tapped coil on a two-gang capacitor: section A from the
// top of the coil to ground, section B from the tap to ground, one shaft.
type Spec struct {
	Geometry coil.Geometry
	TapTurns float64 // from the cold end, quarter turns
	A, B     GangSection
	// Steps is the number of dial rows reported, from 0 to 100 % of the
	// dial (at least 2; 0 means 11, every 10 %).
	Steps int
	Bands []Band
	// LoadedQ, when positive, is the circuit's loaded Q at every
	// frequency. Zero uses half the coil model's Q at each frequency (see
	// PassbandRule).
	LoadedQ float64
	// Margin is the fraction by which each listed band must sit inside a
	// range's ends and the two ranges must overlap; 0 means DefaultMargin.
	// Only ChooseTap and the coverage verdicts use it.
	Margin float64
	// Mounting is the coil's mounting (zero: one end grounded); its SRF
	// and equivalent self-capacitance are the ones used.
	Mounting coil.Mounting
	// MaxHarmonic is the highest harmonic order checked for coincidences
	// and tracking, 2 … MaxHarmonicLimit; 0 means DefaultMaxHarmonic.
	MaxHarmonic int
	// Bandspread is the least share of the dial a covered band should
	// take before a warning; 0 means DefaultBandspread.
	Bandspread float64
}

// DefaultMargin is the default coverage and overlap margin, 3 %: enough
// for capacitor and coil tolerances that a trimmer can take up (common
// practice).
const DefaultMargin = 0.03

// DialRow is the circuit at one dial setting.
type DialRow struct {
	Setting float64          // 0 plates open … 1 fully meshed
	CA, CB  unit.Capacitance // the gang sections' own capacitance
	CTop    unit.Capacitance // everything from the top of the coil to ground
	CTap    unit.Capacitance // everything from the tap to ground
	FLow    unit.Frequency
	FHigh   unit.Frequency // zero when the circuit has one resonance
}

// FreqRange is a tuning range, lowest to highest frequency.
type FreqRange struct {
	Min, Max unit.Frequency
}

// BandOnRange says where a band sits on one of the ranges.
type BandOnRange struct {
	Range string // "low" or "high"
	// SettingAtLow and SettingAtHigh are the dial settings at which this
	// range is tuned to the band's low and high edge; an edge beyond the
	// range is clamped to the dial's end.
	SettingAtLow, SettingAtHigh float64
	// Whole is true when both edges are on the dial.
	Whole bool
	// Margin is the smaller distance of a band edge inside the range's
	// ends, as a fraction of that edge (negative: past the end).
	Margin float64
	// Fraction of the band (in frequency) this range reaches.
	Fraction float64
}

// BandCoverage is one listed band and the ranges that reach it.
type BandCoverage struct {
	Band    Band
	Ranges  []BandOnRange // only ranges that reach some of the band
	Covered bool          // some range holds the whole band, or both together (Across)
	// Across is true when neither range holds the band alone but the two
	// overlapping ranges hold it together, from the low range's bottom to
	// the high range's top: a band wider than one range, tuned on both.
	Across bool
}

// Coincidence is a stretch of the dial where, with the low range tuned
// inside a listed band, the Order-th harmonic of the low range's
// frequency falls inside the high range's passband. Setting, FLow, FHigh
// and Offset are at the point of the stretch where the harmonic comes
// closest to the high range's peak.
type Coincidence struct {
	Band        string // the listed band the low range is in ("" when none are listed)
	Order       int    // 2 … Spec.MaxHarmonic
	Setting     float64
	SettingFrom float64
	SettingTo   float64
	FLow        unit.Frequency
	FHigh       unit.Frequency
	Harmonic    unit.Frequency // Order × FLow
	Offset      unit.Frequency // Harmonic − FHigh
	Passband    unit.Frequency // full −3 dB width of the high range there
	LoadedQ     float64
	// Depth is |Offset| as a fraction of half the passband: 0 on the peak,
	// 1 at the −3 dB edge.
	Depth float64
	// AttenuationDB is how far the harmonic is down on the high range's
	// response, 10·log10(1 + (2·Q·Offset/FHigh)²).
	AttenuationDB float64
}

// OnPeak reports whether the harmonic sits on the high range's peak to
// within a thousandth of the passband: there an offset in hertz is only
// the bisection's rounding and should not be printed as a distance.
func (co Coincidence) OnPeak() bool {
	return math.Abs(float64(co.Offset)) <= 1e-3*float64(co.Passband)
}

// Span is the two-gang circuit across the dial.
type Span struct {
	Sections        coil.Sections
	SelfCapacitance unit.Capacitance // the model's equivalent, across the whole coil
	Dial            []DialRow
	Low, High       FreqRange
	HasHigh         bool // false when the circuit has one resonance only
	// Overlap is Low.Max − High.Min: positive when the ranges overlap,
	// negative for a gap.
	Overlap unit.Frequency
	// When the ranges leave a gap: the quarter-turn tap on the winding whose
	// ranges overlap most (or leave the smallest gap), and its overlap.
	// The overlap is not monotonic in the tap: the high range is lowest
	// with the tap near the middle and rises towards either end. Zero
	// when the ranges already overlap.
	WidestOverlapTap float64
	WidestOverlap    unit.Frequency
	Bands            []BandCoverage
	Coincidences     []Coincidence
	// Tracking lists the dial stretches where the high range stays near
	// an integer multiple of the low range (see Tracking).
	Tracking []Tracking
	// MaxHarmonic is the highest harmonic order checked.
	MaxHarmonic int
	Margin      float64
	Warnings    []string
}

// spanScan is the internal dial resolution for coincidences: 0.25 % of
// the dial.
const spanScan = 400

// spanCircuit evaluates the circuit at any setting.
type spanCircuit struct {
	geom    coil.Geometry
	sec     coil.Sections
	a, b    GangSection
	cself   float64 // the whole coil's self-capacitance, F
	srf     float64 // the whole coil's self-resonance, Hz
	loadedQ float64
	q       qTable
	maxHarm int
}

func (c *spanCircuit) at(x float64) (DialRow, error) {
	ca, cb := c.a.Capacitance(x), c.b.Capacitance(x)
	ct := ca + c.a.Trimmer + c.a.Stray + unit.Capacitance(c.cself)
	ctap := cb + c.b.Trimmer + c.b.Stray
	r, err := TwoNodeResonances(c.sec, ct, ctap)
	if err != nil {
		return DialRow{}, err
	}
	return DialRow{Setting: x, CA: ca, CB: cb, CTop: ct, CTap: ctap, FLow: r.Low, FHigh: r.High}, nil
}

// Solve computes both ranges across the dial, their overlap, where
// the listed bands fall and the harmonic coincidences.
//
// The section inductances are taken at one frequency, the geometric mean
// of the two ranges at mid-dial (found from a first pass at low
// frequency): across an HF range the skin effect moves them by well under
// 1 %. The coil's equivalent self-capacitance (its mounting's SRF) is put
// across the whole coil, in parallel with section A.
//
// Coincidences are searched where the low range is in a listed band (the
// whole dial when none is listed), at 0.25 % steps of the dial; every
// sign change of m·f_low − f_high between two steps is bisected, so a
// harmonic crossing the high range's peak is found even when the passband
// is narrower than a step. When the ranges leave a gap, every quarter-turn
// tap is tried for the one that closes it (WidestOverlapTap).
func Solve(spec Spec) (Span, error) {
	c, err := newSpanCircuit(spec)
	if err != nil {
		return Span{}, err
	}
	return c.solve(spec)
}

// validateSpan checks spec and returns the sections of its tap at low
// frequency (coil.Tap validates the geometry and the tap).
func validateSpan(spec *Spec) (coil.Sections, error) {
	sec, err := coil.Tap(spec.Geometry, spec.TapTurns, 0)
	if err != nil {
		return coil.Sections{}, err
	}
	if err := spec.A.Validate("gang_a"); err != nil {
		return coil.Sections{}, err
	}
	if err := spec.B.Validate("gang_b"); err != nil {
		return coil.Sections{}, err
	}
	if spec.Steps != 0 && (spec.Steps < 2 || spec.Steps > 1001) {
		return coil.Sections{}, coil.InputErrorf("steps", "%d dial rows: give 2 to 1001", spec.Steps)
	}
	if !coil.Finite(spec.LoadedQ) || spec.LoadedQ < 0 || spec.LoadedQ > 1e5 {
		return coil.Sections{}, coil.InputErrorf("loaded_q", "must be between 0 (from the coil model) and 100000")
	}
	if spec.MaxHarmonic != 0 && (spec.MaxHarmonic < 2 || spec.MaxHarmonic > MaxHarmonicLimit) {
		return coil.Sections{}, coil.InputErrorf("max_harmonic", "%d: give 2 to %d", spec.MaxHarmonic, MaxHarmonicLimit)
	}
	if !coil.Finite(spec.Bandspread) || spec.Bandspread < 0 || spec.Bandspread > 0.5 {
		return coil.Sections{}, coil.InputErrorf("bandspread", "must be between 0 and 50 %% of the dial")
	}
	if !coil.Finite(spec.Margin) || spec.Margin < 0 || spec.Margin > 0.5 {
		return coil.Sections{}, coil.InputErrorf("margin", "must be between 0 and 50 %%")
	}
	for i, b := range spec.Bands {
		lo, hi := float64(b.Low), float64(b.High)
		if !coil.Finite(lo) || !coil.Finite(hi) || lo <= 0 || hi <= lo || hi > coil.MaxFrequency {
			return coil.Sections{}, coil.InputErrorf("band", "band %d (%s): give LOW-HIGH with LOW below HIGH, e.g. 3.5-3.8MHz", i+1, b.Name)
		}
	}
	return sec, nil
}

// coilModel is what the circuit takes from the coil model that does not
// depend on the tap: the whole coil at low frequency (self-capacitance,
// self-resonance) and its Q against frequency. Solving many taps of one
// coil (ChooseTap, the gap advice) builds it once.
type coilModel struct {
	whole coil.Prediction
	q     qTable
}

func newCoilModel(g coil.Geometry, mt coil.Mounting) (*coilModel, error) {
	whole, err := coil.PredictMounted(g, 0, mt)
	if err != nil {
		return nil, err
	}
	q, err := newQTable(g, float64(whole.SRFUsed()), mt)
	if err != nil {
		return nil, err
	}
	return &coilModel{whole: whole, q: q}, nil
}

func newSpanCircuit(spec Spec) (*spanCircuit, error) {
	return newSpanCircuitOf(spec, nil)
}

// newSpanCircuitOf builds the circuit of spec; m is spec.Geometry's
// coilModel, or nil to build it.
func newSpanCircuitOf(spec Spec, m *coilModel) (*spanCircuit, error) {
	sec0, err := validateSpan(&spec)
	if err != nil {
		return nil, err
	}
	g := spec.Geometry
	if m == nil {
		if m, err = newCoilModel(g, spec.Mounting); err != nil {
			return nil, err
		}
	}
	c := &spanCircuit{
		geom:    g,
		a:       spec.A,
		b:       spec.B,
		cself:   float64(m.whole.SelfCapacitance),
		srf:     float64(m.whole.SRFUsed()),
		loadedQ: spec.LoadedQ,
		q:       m.q,
		maxHarm: spec.MaxHarmonic,
	}
	// First pass at low frequency, then the sections at the mid-dial
	// frequency.
	c.sec = sec0
	mid, err := c.at(0.5)
	if err != nil {
		return nil, err
	}
	fRef := float64(mid.FLow)
	if mid.FHigh > 0 {
		fRef = math.Sqrt(float64(mid.FLow) * float64(mid.FHigh))
	}
	if fRef > 0.9*c.srf {
		fRef = 0.9 * c.srf
	}
	if c.sec, err = coil.Tap(g, spec.TapTurns, unit.Frequency(fRef)); err != nil {
		return nil, err
	}
	return c, nil
}

func (c *spanCircuit) solve(spec Spec) (Span, error) {
	sp := Span{Sections: c.sec, SelfCapacitance: unit.Capacitance(c.cself), Margin: spec.Margin, MaxHarmonic: spec.MaxHarmonic}
	if sp.MaxHarmonic == 0 {
		sp.MaxHarmonic = DefaultMaxHarmonic
	}
	if sp.Margin == 0 {
		sp.Margin = DefaultMargin
	}
	steps := spec.Steps
	if steps == 0 {
		steps = 11
	}
	for i := range steps {
		r, err := c.at(float64(i) / float64(steps-1))
		if err != nil {
			return Span{}, err
		}
		sp.Dial = append(sp.Dial, r)
	}
	open, meshed := sp.Dial[0], sp.Dial[len(sp.Dial)-1]
	sp.Low = FreqRange{Min: meshed.FLow, Max: open.FLow}
	sp.HasHigh = open.FHigh > 0 && meshed.FHigh > 0
	if sp.HasHigh {
		sp.High = FreqRange{Min: meshed.FHigh, Max: open.FHigh}
		sp.Overlap = sp.Low.Max - sp.High.Min
	}
	for _, b := range spec.Bands {
		sp.Bands = append(sp.Bands, c.coverage(&sp, b))
	}
	if sp.HasHigh {
		co, err := c.coincidences(spec.Bands)
		if err != nil {
			return Span{}, err
		}
		sp.Coincidences = co
		if sp.Tracking, err = c.tracking(spec.MaxHarmonic); err != nil {
			return Span{}, err
		}
	}
	if sp.HasHigh && sp.Overlap < 0 {
		sp.WidestOverlapTap, sp.WidestOverlap = widestOverlapTap(spec)
	}
	sp.Warnings = c.warnings(&sp)
	share := spec.Bandspread
	if share == 0 {
		share = DefaultBandspread
	}
	sp.Warnings = append(sp.Warnings, bandspreadWarnings(&sp, share)...)
	for _, t := range sp.Tracking {
		sp.Warnings = append(sp.Warnings, trackingWarning(t))
	}
	return sp, nil
}

// widestOverlapTap tries every quarter-turn tap on spec's winding and
// returns the one whose ranges overlap most, relative to the bottom of the
// high range (as the margin is), or, when none overlaps, the one leaving
// the smallest gap in hertz; and that overlap in hertz (negative: a gap).
func widestOverlapTap(spec Spec) (float64, unit.Frequency) {
	bestTap, bestHz := 0.0, math.Inf(-1)
	bestRel := math.Inf(-1) // among taps that overlap
	m, err := newCoilModel(spec.Geometry, spec.Mounting)
	if err != nil {
		return bestTap, unit.Frequency(bestHz)
	}
	steps := int(math.Round(spec.Geometry.Turns * 4))
	for i := 1; i < steps; i++ {
		spec.TapTurns = float64(i) / 4
		c, err := newSpanCircuitOf(spec, m)
		if err != nil {
			continue
		}
		open, err1 := c.at(0)
		meshed, err2 := c.at(1)
		if err1 != nil || err2 != nil || !(meshed.FHigh > 0) {
			continue
		}
		ov := float64(open.FLow - meshed.FHigh)
		rel := ov / float64(meshed.FHigh)
		if (ov >= 0 && rel > bestRel) || (bestRel == math.Inf(-1) && ov > bestHz) {
			bestTap, bestHz = spec.TapTurns, ov
			if ov >= 0 {
				bestRel = rel
			}
		}
	}
	return bestTap, unit.Frequency(bestHz)
}

// freq returns the low or high range's frequency at x.
func (c *spanCircuit) freq(x float64, high bool) float64 {
	r, err := c.at(x)
	if err != nil {
		return math.NaN()
	}
	if high {
		return float64(r.FHigh)
	}
	return float64(r.FLow)
}

// settingFor finds the dial setting where a range is tuned to f, by
// bisection (frequency never rises as the plates mesh); f must be within
// the range.
func (c *spanCircuit) settingFor(f float64, high bool, rg FreqRange) float64 {
	switch {
	case f >= float64(rg.Max):
		return 0
	case f <= float64(rg.Min):
		return 1
	}
	lo, hi := 0.0, 1.0
	for range 60 {
		mid := (lo + hi) / 2
		if c.freq(mid, high) > f {
			lo = mid
		} else {
			hi = mid
		}
	}
	return (lo + hi) / 2
}

func (c *spanCircuit) coverage(sp *Span, b Band) BandCoverage {
	bc := BandCoverage{Band: b}
	ranges := []struct {
		name string
		rg   FreqRange
		high bool
	}{{"low", sp.Low, false}}
	if sp.HasHigh {
		ranges = append(ranges, struct {
			name string
			rg   FreqRange
			high bool
		}{"high", sp.High, true})
	}
	lo, hi := float64(b.Low), float64(b.High)
	for _, r := range ranges {
		rmin, rmax := float64(r.rg.Min), float64(r.rg.Max)
		reach := math.Min(hi, rmax) - math.Max(lo, rmin)
		if reach < 0 || (reach == 0 && lo != hi) {
			continue
		}
		on := BandOnRange{
			Range:         r.name,
			SettingAtLow:  c.settingFor(lo, r.high, r.rg),
			SettingAtHigh: c.settingFor(hi, r.high, r.rg),
			Whole:         lo >= rmin && hi <= rmax,
			Margin:        math.Min((lo-rmin)/lo, (rmax-hi)/hi),
			Fraction:      reach / (hi - lo),
		}
		bc.Ranges = append(bc.Ranges, on)
		if on.Whole {
			bc.Covered = true
		}
	}
	if !bc.Covered && sp.HasHigh && sp.Overlap >= 0 && lo >= float64(sp.Low.Min) && hi <= float64(sp.High.Max) {
		bc.Covered, bc.Across = true, true
	}
	return bc
}

// window is a stretch of dial settings, from and to inclusive.
type window struct {
	band     string
	from, to float64
}

// lowWindows returns the stretches of the dial where the low range is
// inside a listed band; the whole dial when none are listed.
func (c *spanCircuit) lowWindows(bands []Band, low FreqRange) []window {
	if len(bands) == 0 {
		return []window{{"", 0, 1}}
	}
	var w []window
	for _, b := range bands {
		lo, hi := math.Max(float64(b.Low), float64(low.Min)), math.Min(float64(b.High), float64(low.Max))
		if lo > hi {
			continue
		}
		w = append(w, window{b.Name, c.settingFor(hi, false, low), c.settingFor(lo, false, low)})
	}
	return w
}

// windowRows evaluates the circuit across a dial stretch at the scan
// resolution. Solve and ChooseTap scan the same rows, so that a tap
// ChooseTap calls clean is reported clean.
func (c *spanCircuit) windowRows(w window) ([]DialRow, error) {
	n := max(int(math.Ceil((w.to-w.from)*spanScan))+1, 2)
	rows := make([]DialRow, n)
	for i := range rows {
		var err error
		if rows[i], err = c.at(w.from + (w.to-w.from)*float64(i)/float64(n-1)); err != nil {
			return nil, err
		}
	}
	return rows, nil
}

// coincidences scans the stretches of the dial where the low range is in a
// listed band for harmonics of order 2 … c.maxHarm inside the high range's
// passband.
func (c *spanCircuit) coincidences(bands []Band) ([]Coincidence, error) {
	low, err := c.lowRange()
	if err != nil {
		return nil, err
	}
	var out []Coincidence
	for _, w := range c.lowWindows(bands, low) {
		rows, err := c.windowRows(w)
		if err != nil {
			return nil, err
		}
		for _, m := range orders(c.maxHarm) {
			out = append(out, c.runs(w.band, m, rows)...)
		}
	}
	sort.SliceStable(out, func(i, j int) bool {
		if out[i].Setting != out[j].Setting {
			return out[i].Setting < out[j].Setting
		}
		return out[i].Order < out[j].Order
	})
	return out, nil
}

// lowRange is the low range from plates open to fully meshed.
func (c *spanCircuit) lowRange() (FreqRange, error) {
	open, err := c.at(0)
	if err != nil {
		return FreqRange{}, err
	}
	meshed, err := c.at(1)
	if err != nil {
		return FreqRange{}, err
	}
	return FreqRange{Min: meshed.FLow, Max: open.FLow}, nil
}

// measure describes the harmonic of order m at one dial row.
func (c *spanCircuit) measure(band string, m int, r DialRow) Coincidence {
	fl, fh := float64(r.FLow), float64(r.FHigh)
	q := c.qLoaded(fh)
	bw := fh / q
	off := float64(m)*fl - fh
	x := 2 * q * off / fh
	return Coincidence{
		Band: band, Order: m, Setting: r.Setting, SettingFrom: r.Setting, SettingTo: r.Setting,
		FLow: r.FLow, FHigh: r.FHigh, Harmonic: unit.Frequency(float64(m) * fl),
		Offset: unit.Frequency(off), Passband: unit.Frequency(bw), LoadedQ: q,
		Depth: math.Abs(off) / (bw / 2), AttenuationDB: 10 * math.Log10(1+x*x),
	}
}

// runs groups consecutive rows whose harmonic is inside the passband and
// reports each group at its closest point. Where the offset changes sign
// between two rows the harmonic crosses the high range's peak: the
// crossing is found by bisection and reported even when both rows are
// outside the passband (a high loaded Q gives a passband narrower than
// the scan step).
func (c *spanCircuit) runs(band string, m int, rows []DialRow) []Coincidence {
	var out []Coincidence
	var cur *Coincidence
	var prev Coincidence
	for i, r := range rows {
		h := c.measure(band, m, r)
		if i > 0 && (h.Offset > 0) != (prev.Offset > 0) {
			if x, ok := c.crossing(m, prev.Setting, r.Setting); ok {
				if e, err := c.at(x); err == nil {
					best := c.measure(band, m, e)
					if cur != nil {
						best.SettingFrom = cur.SettingFrom
					}
					cur = &best
				}
			}
		}
		if h.Depth <= 1 {
			switch {
			case cur == nil:
				cur = &h
			case h.Depth < cur.Depth:
				from := cur.SettingFrom
				*cur = h
				cur.SettingFrom = from
			default:
				cur.SettingTo = r.Setting
			}
		}
		if cur != nil && (h.Depth > 1 || i == len(rows)-1) {
			out = append(out, *cur)
			cur = nil
		}
		prev = h
	}
	return out
}

// crossing finds the setting between a and b where m·f_low = f_high.
func (c *spanCircuit) crossing(m int, a, b float64) (float64, bool) {
	g := func(x float64) float64 {
		r, err := c.at(x)
		if err != nil {
			return math.NaN()
		}
		return float64(m)*float64(r.FLow) - float64(r.FHigh)
	}
	ga, gb := g(a), g(b)
	if !(ga*gb <= 0) {
		return 0, false
	}
	for range 60 {
		mid := (a + b) / 2
		gm := g(mid)
		if (gm > 0) == (ga > 0) {
			a, ga = mid, gm
		} else {
			b = mid
		}
	}
	return (a + b) / 2, true
}

func (c *spanCircuit) qLoaded(f float64) float64 {
	if c.loadedQ > 0 {
		return c.loadedQ
	}
	return c.q.at(f) / 2
}

func (c *spanCircuit) warnings(sp *Span) []string {
	var w []string
	srf := c.srf
	top := float64(sp.Low.Max)
	if sp.HasHigh {
		top = float64(sp.High.Max)
	}
	name := map[bool]string{true: "high", false: "low"}[sp.HasHigh]
	switch {
	case top > srf:
		w = append(w, fmt.Sprintf("the top of the %s range, %s, is above the coil's self-resonance %s: the lumped circuit does not hold there and the real range will fall well short; move the tap or use a coil with fewer turns",
			name, quantity.FormatFrequency(float64(unit.Frequency(top))), quantity.FormatFrequency(float64(unit.Frequency(srf)))))
	case top > srf/3:
		w = append(w, fmt.Sprintf("the top of the %s range, %s, is above a third of the coil's self-resonance %s (common practice limit): expect the real range to fall short there",
			name, quantity.FormatFrequency(float64(unit.Frequency(top))), quantity.FormatFrequency(float64(unit.Frequency(srf)))))
	}
	if !sp.HasHigh {
		w = append(w, "the circuit has one resonance only (section B at zero capacitance, or the tap at an end of the coil): there is no high range")
	}
	if sp.HasHigh && sp.Overlap < 0 {
		w = append(w, fmt.Sprintf("the ranges do not meet: a gap from %s to %s that neither range tunes; %s",
			quantity.FormatFrequency(float64(sp.Low.Max)), quantity.FormatFrequency(float64(sp.High.Min)), sp.GapAdvice()))
	}
	for _, b := range sp.Bands {
		if !b.Covered {
			w = append(w, fmt.Sprintf("band %s is not wholly inside either range", bandWithEdges(b.Band)))
		}
	}
	for _, co := range sp.Coincidences {
		where := fmt.Sprintf("is %s from the high range's peak %s, inside its %s passband (only %.1f dB down)",
			quantity.FormatFrequency(float64(unit.Frequency(math.Abs(float64(co.Offset))))), quantity.FormatFrequency(float64(co.FHigh)), quantity.FormatFrequency(float64(co.Passband)), co.AttenuationDB)
		if co.OnPeak() {
			where = fmt.Sprintf("is on the high range's peak, in the middle of its %s passband", quantity.FormatFrequency(float64(co.Passband)))
		}
		w = append(w, fmt.Sprintf("harmonic coincidence at %.1f %% of the dial (0 %% = plates open): low range at %s%s, its %s harmonic %s %s",
			co.Setting*100, quantity.FormatFrequency(float64(co.FLow)), inBand(co.Band), Ordinal(co.Order), quantity.FormatFrequency(float64(co.Harmonic)), where))
	}
	return w
}

// GapAdvice says which tap closes a gap between the ranges, or that none
// on this winding does.
func (sp *Span) GapAdvice() string {
	if sp.WidestOverlap >= 0 {
		return fmt.Sprintf("a tap %g turns from the cold end makes them overlap by %s", sp.WidestOverlapTap, quantity.FormatFrequency(float64(sp.WidestOverlap)))
	}
	return fmt.Sprintf("no tap on this winding closes it (the best, %g turns from the cold end, still leaves %s): the capacitance swing, maximum to minimum with the strays, is too small", sp.WidestOverlapTap, quantity.FormatFrequency(float64(-sp.WidestOverlap)))
}

// bandWithEdges is "80m (3.5 MHz–3.8 MHz)", or the edges alone for a
// band without a name.
func bandWithEdges(b Band) string {
	edges := fmt.Sprintf("%s–%s", quantity.FormatFrequency(float64(b.Low)), quantity.FormatFrequency(float64(b.High)))
	if b.Name == "" {
		return edges
	}
	return b.Name + " (" + edges + ")"
}

func inBand(name string) string {
	if name == "" {
		return ""
	}
	return " (in " + name + ")"
}

// Ordinal writes a harmonic order: 2nd, 3rd, 4th …
func Ordinal(m int) string {
	switch m {
	case 2:
		return "2nd"
	case 3:
		return "3rd"
	}
	return fmt.Sprintf("%dth", m)
}

// qTable interpolates the coil model's Q against frequency (in ln f) so
// that a dial scan does not evaluate the model at every point.
type qTable struct {
	lnF, q []float64
}

const qTablePoints = 48

// newQTable tabulates Q from 10⁻⁴ of 0.9·SRF up to 0.9·SRF (and at most
// coil.MaxFrequency), the frequencies at which coil.Predict accepts the coil.
func newQTable(g coil.Geometry, srf float64, mt coil.Mounting) (qTable, error) {
	fMax := 0.9 * srf
	fMin := fMax / 1e4
	fTop := math.Min(fMax, coil.MaxFrequency)
	t := qTable{lnF: make([]float64, qTablePoints), q: make([]float64, qTablePoints)}
	for i := range qTablePoints {
		lf := math.Log(fMin) + (math.Log(fMax)-math.Log(fMin))*float64(i)/(qTablePoints-1)
		p, err := coil.PredictMounted(g, unit.Frequency(math.Min(math.Exp(lf), fTop)), mt)
		if err != nil {
			return qTable{}, err
		}
		t.lnF[i], t.q[i] = lf, p.Q
	}
	return t, nil
}

func (t qTable) at(f float64) float64 {
	lf := math.Log(f)
	n := len(t.lnF)
	switch {
	case lf <= t.lnF[0]:
		return t.q[0]
	case lf >= t.lnF[n-1]:
		return t.q[n-1]
	}
	i := sort.SearchFloat64s(t.lnF, lf)
	w := (lf - t.lnF[i-1]) / (t.lnF[i] - t.lnF[i-1])
	return t.q[i-1] + w*(t.q[i]-t.q[i-1])
}
