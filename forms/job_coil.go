package forms

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// Reading one [[coil]] of a job file: its winding, design target, tap and
// two-gang capacitor.

func (l *jobLoader) coil(i int, m map[string]any) JobCoil {
	c := JobCoil{Quantity: 1, Line: l.idx.entryLine("coil", i), keys: map[string]jobKey{}}
	e := &jobEntry{l: l, m: m, label: fmt.Sprintf("coil #%d", i+1)}
	e.line = func(k string) int {
		if k == "" {
			return l.idx.entryLine("coil", i)
		}
		return l.idx.keyLine("coil", i, k)
	}
	for k, v := range m {
		raw := fmt.Sprint(v)
		if s, ok := v.(string); ok {
			raw = s
		}
		c.keys[k] = jobKey{raw: raw, line: e.line(k)}
	}
	if n, ok := m["name"].(string); ok && strings.TrimSpace(n) != "" {
		c.Name = strings.TrimSpace(n)
		e.label = c.Label()
	}
	for _, k := range unknownKeys(m, jobCoilKeys, e.line) {
		e.fail(k, "", unknownKeyError(k, strings.ReplaceAll(k, "_", "-"), jobCoilKeys, "see the job file format with turnwise sheet --help"))
		e.typo = true
	}

	e.str("name", true, `"L1"`)
	if q, ok := e.integer("quantity", 1, maxJobQuantity, "3"); ok {
		c.Quantity = q
	}
	if s, ok := e.str("notes", false, `"wind on the 6 mm drill"`); ok {
		c.Notes = s
	}
	c.Transmit, _ = e.boolean("transmit")
	if s, ok := e.str("cap-tempco", false, `"N750"`); ok {
		if _, err := ParseTempco(s); err != nil && !eiaCode.MatchString(strings.TrimSpace(s)) {
			e.fail("cap-tempco", "cap-tempco", err)
		} else {
			c.CapTempco = strings.TrimSpace(s)
		}
	}
	l.winding(e, &c)
	l.target(e, &c)
	l.tap(e, &c)
	l.span(e, &c)
	return c
}

func (l *jobLoader) winding(e *jobEntry, c *JobCoil) {
	w := &c.Winding
	w.Mandrel, _ = e.str("mandrel", false, `"6mm drill"`)
	w.Former, _ = e.str("former", false, `"pvc 20mm"`)
	w.Wire, _ = e.str("wire", false, `"1mm"`)
	w.Insulation, _ = e.str("insulation", false, `"grade1"`)
	w.Conductor, _ = e.str("conductor", false, `"copper"`)
	if w.Mandrel != "" && w.Former != "" {
		e.fail("former", "former", errors.New("give mandrel or former, not both; a coil is either slid off a mandrel or left on a former"))
	}
	if _, present := e.m["springback"]; present {
		if s, ok := e.str("springback", false, `"2%"`); ok {
			if sb, err := quantity.ParsePercent(s); err != nil {
				e.fail("springback", "springback", err)
			} else {
				w.Springback = &sb
			}
		}
	}
	if n, ok := e.number("turns", "5.25"); ok {
		w.Turns = &n
	}
	w.Pitch, _ = quantityOf(e, "pitch", `"1.6mm"`, quantity.ParseLength, false)
	w.Length, _ = quantityOf(e, "length", `"8mm"`, quantity.ParseLength, false)
	if w.Pitch != nil && w.Length != nil {
		e.fail("length", "length", errors.New("give pitch or length, not both (neither means close-wound)"))
	}
	w.Leads, _ = quantityOf(e, "leads", `"5mm"`, quantity.ParseLength, true)
	if _, present := e.m["leads"]; !present {
		e.missing(errors.New(`add leads = "5mm": the length of each lead to the solder joint ("0mm" if you measure at the winding); at VHF leads are often 10–20 % of the inductance`))
	}
	w.Plating, _ = quantityOf(e, "plating", `"1um"`, quantity.ParseLength, false)
	w.Temp, _ = quantityOf(e, "temp", `"40C"`, quantity.ParseTemperature, false)
	w.Freq, _ = quantityOf(e, "freq", `"137.5MHz"`, quantity.ParseFrequency, false)
}

func (l *jobLoader) target(e *jobEntry, c *JobCoil) {
	t := &JobTarget{}
	t.Inductance, _ = quantityOf(e, "inductance", `"48nH"`, quantity.ParseInductance, false)
	t.Cap, _ = quantityOf(e, "cap", `"22pF"`, quantity.ParseCapacitance, false)
	t.Stray, _ = quantityOf(e, "stray", `"2pF"`, quantity.ParseCapacitance, true)
	if tol, ok := e.fraction("tolerance", `"2%"`); ok {
		if *tol <= 0 || *tol >= 0.5 {
			e.fail("tolerance", "tolerance", fmt.Errorf("%.4g %% is outside 0 … 50 %%; e.g. tolerance = \"2%%\"", *tol*100))
		} else {
			t.Tolerance = tol
		}
	}
	t.Support, _ = e.choice("support", []string{"mandrel", "former"})
	t.MaxLength, _ = quantityOf(e, "max-length", `"15mm"`, quantity.ParseLength, false)
	t.MaxDiameter, _ = quantityOf(e, "max-diameter", `"12mm"`, quantity.ParseLength, false)
	t.MaxWireLength, _ = quantityOf(e, "max-wire-length", `"300mm"`, quantity.ParseLength, false)
	if r, ok := e.number("min-srf-ratio", "3"); ok {
		if r < 1 {
			e.fail("min-srf-ratio", "min-srf-ratio", fmt.Errorf("%g is below 1; the coil must resonate above the operating frequency, e.g. min-srf-ratio = 3", r))
		} else {
			t.MinSRFRatio = &r
		}
	}
	t.Prefer, _ = e.choice("prefer", []string{"q", "small", "easy"})
	if s, ok := e.str("band", false, `"144-146MHz"`); ok {
		if b, err := ParseBand(s); err != nil {
			e.fail("band", "band", err)
		} else {
			t.Band = &b
		}
	}
	if s, ok := e.str("trimmer", false, `"2-10pF"`); ok {
		if lo, hi, err := ParseCapacitanceRange(s); err != nil {
			e.fail("trimmer", "trimmer", err)
		} else if !(hi > lo) {
			e.fail("trimmer", "trimmer", fmt.Errorf("%q: give the trimmer's range as MIN-MAX with MIN below MAX, e.g. trimmer = \"2-10pF\"", s))
		} else {
			t.Trimmer = &[2]unit.Capacitance{lo, hi}
		}
	}
	_, hasBand := e.m["band"]
	_, hasTrimmer := e.m["trimmer"]

	isTarget := false
	for _, k := range []string{"inductance", "cap", "stray", "tolerance", "support", "max-length", "max-diameter", "max-wire-length", "min-srf-ratio", "prefer", "band", "trimmer"} {
		if _, present := e.m[k]; present {
			isTarget = true
		}
	}
	_, hasTurns := e.m["turns"]
	_, hasInd := e.m["inductance"]
	_, hasCap := e.m["cap"]
	switch {
	case hasBand && hasTurns:
		e.fail("band", "band", errors.New("a band is a design target; this coil is a fixed winding (turns): remove band, or replace turns by band and trimmer"))
	case hasBand && hasInd:
		e.fail("band", "band", errors.New("give a band (tuned by cap and trimmer) or an inductance, not both"))
	case hasBand && e.m["freq"] != nil:
		e.fail("freq", "freq", errors.New("a band sets the frequency (its centre); remove freq"))
	case hasBand && e.m["tolerance"] != nil:
		e.fail("tolerance", "tolerance", errors.New("a band's tolerance is its trimmer's range; remove tolerance"))
	case hasBand && !hasTrimmer:
		e.fail("band", "band", errors.New(`a band needs a trimmer to tune it: add trimmer = "2-10pF" (with cap for the fixed capacitor)`))
	case hasTrimmer && !hasBand:
		e.fail("trimmer", "trimmer", errors.New(`a trimmer tunes a band: add band = "144-146MHz"`))
	case hasBand:
		// A band target: cap is optional, freq comes from the band.
	case hasTurns && (hasInd || hasCap):
		k := "inductance"
		if hasCap {
			k = "cap"
		}
		e.fail(k, k, errors.New("a coil is either a fixed winding (turns) or a design target (inductance, or cap with freq), not both; remove one"))
	case hasTurns && isTarget:
		for _, k := range []string{"stray", "tolerance", "support", "max-length", "max-diameter", "max-wire-length", "min-srf-ratio", "prefer", "trimmer"} {
			if _, present := e.m[k]; present {
				e.fail(k, k, errors.New("is a design-search key, but this coil is a fixed winding (turns); remove it or replace turns by inductance or cap"))
				break
			}
		}
	case hasInd && hasCap:
		e.fail("cap", "cap", errors.New("give inductance or cap (with freq), not both"))
	case isTarget && !hasInd && !hasCap:
		e.missing(errors.New(`design keys without a target: add inductance = "48nH", or cap = "22pF" with freq`))
	case hasCap && e.m["freq"] == nil:
		e.fail("cap", "cap", errors.New(`a capacitance target needs the frequency: add freq = "137.5MHz"`))
	case !hasTurns && !isTarget:
		e.missing(errors.New(`say what to build: turns = 5 (a fixed winding), or inductance = "48nH" or cap = "22pF" (a design target)`))
	}
	if _, present := e.m["tank-cap"]; present {
		if hasTurns {
			c.TankCap, _ = quantityOf(e, "tank-cap", `"180pF"`, quantity.ParseCapacitance, false)
		} else if isTarget {
			e.fail("tank-cap", "tank-cap", errors.New("is for a fixed winding (turns); a design target's tank capacitor is its cap key: remove tank-cap"))
		}
	}
	if isTarget && !hasTurns {
		c.Target = t
		for _, k := range []string{"pitch", "length"} {
			if _, present := e.m[k]; present {
				e.fail(k, k, errors.New("the design search chooses the pitch; remove it, or give turns for a fixed winding"))
			}
		}
		return
	}
	if hasTurns {
		w := &c.Winding
		e.needWinding(w.Mandrel == "" && w.Former == "" && e.m["mandrel"] == nil && e.m["former"] == nil)
	}
}

// needWinding reports the keys a fixed winding cannot do without: the
// wire, and the mandrel or former when noForm.
func (e *jobEntry) needWinding(noForm bool) {
	if noForm {
		e.missing(errors.New(`add mandrel = "6mm drill" (self-supporting) or former = "pvc 20mm" (the coil stays on it)`))
	}
	if e.m["wire"] == nil {
		e.missing(errors.New(`add wire = "1mm" (a gauge, a bare diameter or a stock wire name)`))
	}
}

// quarterTurns reports whether n is a positive whole number of quarter
// turns, the resolution of turns and taps.
func quarterTurns(n float64) bool { return n > 0 && math.Abs(n*4-math.Round(n*4)) <= 1e-9 }

func (l *jobLoader) tap(e *jobEntry, c *JobCoil) {
	_, hasTurns := e.m["tap"]
	_, hasRatio := e.m["tap-ratio"]
	if !hasTurns && !hasRatio {
		return
	}
	t := &JobTap{}
	switch {
	case hasTurns && hasRatio:
		e.fail("tap-ratio", "tap-ratio", errors.New("give tap (turns from the cold end) or tap-ratio, not both"))
		return
	case hasTurns:
		n, ok := e.number("tap", "2.5")
		if !ok {
			return
		}
		if !quarterTurns(n) {
			e.fail("tap", "tap", fmt.Errorf("%g is not a positive number of quarter turns from the cold end; e.g. tap = 2.5", n))
			return
		}
		if w := c.Winding.Turns; w != nil && n >= *w {
			e.fail("tap", "tap", fmt.Errorf("%g turns is not inside the %g-turn winding; count the tap from the cold (ground) end", n, *w))
			return
		}
		t.Turns = &n
	default:
		r, ok := e.fraction("tap-ratio", "0.25")
		if !ok {
			return
		}
		if *r <= 0 || *r >= 1 {
			e.fail("tap-ratio", "tap-ratio", fmt.Errorf("%g is outside 0 … 1; the voltage at the tap over the voltage across the coil, e.g. tap-ratio = 0.25", *r))
			return
		}
		t.Ratio = r
	}
	c.Tap = t
}

func (l *jobLoader) span(e *jobEntry, c *JobCoil) {
	given := false
	for _, k := range jobSpanKeys {
		if _, present := e.m[k]; present {
			given = true
		}
	}
	if !given {
		return
	}
	s := &JobSpan{Law: "slc"}
	ok := true
	if law, present := e.str("law", false, `"slc"`); present {
		s.Law = strings.TrimSpace(law)
		if s.Law == "" {
			e.fail("law", "law", errors.New("is empty; use slc, slf, slw or a measured table file"))
			ok = false
		}
	}
	table := s.Law != "slc" && s.Law != "slf" && s.Law != "slw"
	gs, hasGang := e.str("gang", false, `"12-365pF"`)
	switch {
	case hasGang:
		lo, hi, err := ParseCapacitanceRange(gs)
		if err != nil {
			e.fail("gang", "gang", err)
			ok = false
		}
		s.GangA = CapRange{lo, hi}
		s.GangB = s.GangA
	case e.m["gang"] != nil:
		ok = false
	case !table:
		e.missing(errors.New(`two-gang keys without the capacitor: add gang = "12-365pF" (min-max of each section)`))
		return
	}
	if gb, present := e.str("gang-b", false, `"10-290pF"`); present {
		lo, hi, err := ParseCapacitanceRange(gb)
		if err != nil {
			e.fail("gang-b", "gang-b", err)
			ok = false
		}
		s.GangB, s.GangBSet = CapRange{lo, hi}, true
	}
	for _, k := range []string{"trim-a", "trim-b", "stray-a", "stray-b"} {
		v, present := quantityOf(e, k, `"5pF"`, quantity.ParseCapacitance, true)
		if !present {
			if e.m[k] != nil {
				ok = false
			}
			continue
		}
		switch k {
		case "trim-a":
			s.TrimA = *v
		case "trim-b":
			s.TrimB = *v
		case "stray-a":
			s.StrayA = *v
		case "stray-b":
			s.StrayB = *v
		}
	}
	if n, present := e.integer("steps", 2, maxJobSteps, "101"); present {
		s.Steps = n
	}
	if q, present := e.number("loaded-q", "60"); present {
		if q <= 0 || q > 1e5 {
			e.fail("loaded-q", "loaded-q", fmt.Errorf("%g is not a loaded Q; e.g. loaded-q = 60", q))
			ok = false
		}
		s.LoadedQ = q
	}
	if m, present := e.fraction("margin", `"3%"`); present {
		if *m <= 0 || *m >= 0.5 {
			e.fail("margin", "margin", fmt.Errorf("%.4g %% is outside 0 … 50 %%; e.g. margin = \"3%%\"", *m*100))
			ok = false
		}
		s.Margin = *m
	}
	chooseTap, chooseOK := e.boolean("choose-tap")
	_, chooseGiven := e.m["choose-tap"]
	chooseBad := chooseGiven && !chooseOK // reported; the tap's absence may be its doing
	if chooseBad {
		ok = false
	}
	s.ChooseTap = chooseTap
	if v, present := e.m["bands"]; present {
		list, isList := v.([]any)
		if !isList {
			e.fail("bands", "bands", fmt.Errorf("is a %s; it must be a list of \"name=F1-F2\" strings in square brackets, e.g. bands = [\"80m=3.5-3.8MHz\", \"7.0-7.2MHz\"]", tomlType(v)))
			ok = false
		}
		for i, b := range list {
			bs, isStr := b.(string)
			if !isStr {
				e.fail("bands", fmt.Sprintf("bands[%d]", i+1), errors.New(`write each band in quotes, e.g. "80m=3.5-3.8MHz"`))
				ok = false
				continue
			}
			band, err := ParseBand(bs)
			if err != nil {
				e.fail("bands", fmt.Sprintf("bands[%d]", i+1), err)
				ok = false
				continue
			}
			s.Bands = append(s.Bands, band)
		}
	}
	hasTap := c.Tap != nil || e.m["tap"] != nil || e.m["tap-ratio"] != nil
	switch {
	case s.ChooseTap && hasTap:
		e.fail("choose-tap", "choose-tap", errors.New("choose-tap picks the tap itself; remove tap (or tap-ratio), or choose-tap"))
		ok = false
	case s.ChooseTap && e.m["bands"] == nil:
		e.fail("choose-tap", "choose-tap", errors.New(`choose-tap needs the bands to cover: add bands = ["80m=3.5-3.8MHz", ...]`))
		ok = false
	case !s.ChooseTap && !hasTap && !chooseBad:
		key := "gang"
		if !hasGang {
			key = "law"
		}
		e.fail(key, key, errors.New("section B of the gang connects to the tap: add tap = 2.5 (turns from the cold end), or choose-tap = true with bands"))
		ok = false
	}
	if ok {
		c.Span = s
	}
}
