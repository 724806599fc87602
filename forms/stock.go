package forms

import (
	"cmp"
	_ "embed"
	"errors"
	"fmt"
	"io"
	"slices"
	"strings"
	"turnwise/internal/quantity"
	"unicode"
	"unicode/utf8"

	"github.com/BurntSushi/toml"
	"gonum.org/v1/gonum/unit"
)

// ParseError reports a problem in a file the user wrote, with its position.
type ParseError struct {
	Kind  string // what was being read: "stock" when empty
	File  string // name given to the loader, usually the path
	Line  int    // 1-based; 0 when unknown
	Field string // the entry and key, e.g. `wire "green spool": bare`; may be empty
	Err   error
}

func (e *ParseError) Error() string {
	var b strings.Builder
	b.WriteString(cmp.Or(e.Kind, "stock"))
	if e.File != "" {
		fmt.Fprintf(&b, " %q", e.File)
	}
	if e.Line > 0 {
		fmt.Fprintf(&b, ": line %d", e.Line)
	}
	if e.Field != "" {
		b.WriteString(": " + e.Field)
	}
	fmt.Fprintf(&b, ": %v", e.Err)
	return b.String()
}

func (e *ParseError) Unwrap() error { return e.Err }

// syntaxError wraps the toml package's error with a message in our style;
// errors.As still finds the toml.ParseError.
type syntaxError struct{ err toml.ParseError }

func (e *syntaxError) Error() string {
	msg := strings.TrimSuffix(e.err.Message, ".")
	if r, n := utf8.DecodeRuneInString(msg); n > 0 {
		msg = string(unicode.ToLower(r)) + msg[n:]
	}
	return "not valid TOML: " + msg
}

func (e *syntaxError) Unwrap() error { return e.err }

// Limits on stock entries: outside them a value is a typo, not a coil.
const (
	minWireBare     = 0.02e-3 // m
	maxWireBare     = 12e-3   // m
	maxWireOverall  = 20e-3   // m
	minHolder       = 0.5e-3  // m, mandrel or former diameter
	maxHolder       = 1000e-3 // m
	minSpringback   = -0.20
	maxSpringback   = 0.50
	stockSourceText = "user stock"
)

// stockKeys lists the keys of each section, in the order the template uses.
var stockKeys = map[string][]string{
	"wire":        {"name", "gauge", "bare", "insulation", "conductor", "source"},
	"mandrel":     {"name", "diameter", "kind", "source"},
	"former":      {"name", "diameter", "kind", "material", "expansion", "source"},
	"calibration": {"mandrel", "wire", "springback", "note"},
}

var stockSections = []string{"wire", "mandrel", "former", "calibration"}

// LoadStock reads a stock file: the user's own wire, mandrels, formers and
// springback calibrations, in TOML (see StockTemplate for the format). name
// labels errors and becomes each row's Origin. Every error is a *ParseError
// with the line; when the file has several problems the first one is returned.
//
// The result holds only the file's rows. Calibrations may name rows of this
// file or built-in ones; combine with Merge(builtIn, stock) for lookups.
func LoadStock(r io.Reader, name string) (*Catalog, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxFileBytes+1))
	if err != nil {
		return nil, &ParseError{File: name, Err: err}
	}
	text := string(data)
	if err := checkShape(text, "", name); err != nil {
		return nil, err
	}
	var doc map[string]any
	if _, err := toml.Decode(text, &doc); err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, &ParseError{File: name, Line: pe.Position.Line, Err: &syntaxError{pe}}
		}
		return nil, &ParseError{File: name, Err: err}
	}
	l := &stockLoader{
		file:   name,
		idx:    indexTOML(text),
		out:    &Catalog{},
		names:  map[string]int{},
		broken: map[string]bool{},
	}
	l.load(doc)
	if len(l.errs) > 0 {
		// Report the first problem in the file, whatever order it was found in.
		first := slices.MinFunc(l.errs, func(a, b *ParseError) int { return a.Line - b.Line })
		return nil, first
	}
	return l.out, nil
}

type stockLoader struct {
	file   string
	idx    *tomlIndex
	out    *Catalog
	errs   []*ParseError
	names  map[string]int  // "wire:" or "holder:" + nameKey -> line, for duplicates
	broken map[string]bool // names of entries that failed, so calibrations naming them stay quiet
}

func (l *stockLoader) fail(line int, field string, err error) {
	l.errs = append(l.errs, &ParseError{File: l.file, Line: line, Field: field, Err: err})
}

func (l *stockLoader) load(doc map[string]any) {
	keys := make([]string, 0, len(doc))
	for k := range doc {
		keys = append(keys, k)
	}
	// Deterministic order: by line, then by name.
	slices.SortFunc(keys, func(a, b string) int {
		return cmp.Or(l.idx.top[a]-l.idx.top[b], strings.Compare(a, b))
	})
	entries := map[string][]map[string]any{}
	for _, k := range keys {
		line := l.idx.top[k]
		if !slices.Contains(stockSections, k) {
			msg := fmt.Sprintf("unknown key %q; a stock file holds [[wire]], [[mandrel]], [[former]] and [[calibration]] sections", k)
			if s := closest(k, stockSections); s != "" {
				msg += fmt.Sprintf("; did you mean [[%s]]?", s)
			}
			l.fail(line, "", errors.New(msg))
			continue
		}
		list, ok := tableList(doc[k])
		if !ok {
			l.fail(line, k, fmt.Errorf("write each %s as its own [[%s]] section (double brackets)", k, k))
			continue
		}
		entries[k] = list
	}
	for i, m := range entries["wire"] {
		l.wire(l.entry("wire", i, m))
	}
	// Mandrels and formers share names: read them in file order so that a
	// duplicate is reported at its second use.
	type ref struct {
		section string
		i, line int
	}
	var holders []ref
	for _, sec := range []string{"mandrel", "former"} {
		for i := range entries[sec] {
			holders = append(holders, ref{sec, i, l.idx.entryLine(sec, i)})
		}
	}
	slices.SortStableFunc(holders, func(a, b ref) int { return a.line - b.line })
	for _, h := range holders {
		l.holder(l.entry(h.section, h.i, entries[h.section][h.i]))
	}
	if cals := entries["calibration"]; len(cals) > 0 {
		builtIn, err := BuiltIn()
		if err != nil {
			l.fail(0, "", err)
			return
		}
		all := Merge(builtIn, l.out)
		for i, m := range cals {
			l.calibration(l.entry("calibration", i, m), all)
		}
	}
}

// tableList accepts [[x]] sections and x = [{...}, {...}].
func tableList(v any) ([]map[string]any, bool) {
	switch v := v.(type) {
	case []map[string]any:
		return v, true
	case []any:
		out := make([]map[string]any, 0, len(v))
		for _, e := range v {
			m, ok := e.(map[string]any)
			if !ok {
				return nil, false
			}
			out = append(out, m)
		}
		return out, true
	}
	return nil, false
}

// stockEntry is one [[section]] being read.
type stockEntry struct {
	l       *stockLoader
	section string
	i       int
	m       map[string]any
	label   string // `wire "green spool"` or `wire #2`
	ok      bool   // false once a problem was reported
	typo    bool   // has unknown keys: a missing key is then likely misspelt
}

func (l *stockLoader) entry(section string, i int, m map[string]any) *stockEntry {
	e := &stockEntry{l: l, section: section, i: i, m: m, ok: true}
	e.label = fmt.Sprintf("%s #%d", section, i+1)
	if n, isStr := m["name"].(string); isStr && strings.TrimSpace(n) != "" {
		e.label = fmt.Sprintf("%s %q", section, n)
	}
	// Unknown keys first, in file order.
	for _, k := range unknownKeys(m, stockKeys[section], e.line) {
		e.fail(k, "", unknownKeyError(k, k, stockKeys[section], fmt.Sprintf("[[%s]] takes %s", section, strings.Join(stockKeys[section], ", "))))
		e.typo = true
	}
	return e
}

// unknownKeys returns the keys of m that are not in allowed, in file order
// (line gives a key's line).
func unknownKeys(m map[string]any, allowed []string, line func(string) int) []string {
	var unknown []string
	for k := range m {
		if !slices.Contains(allowed, k) {
			unknown = append(unknown, k)
		}
	}
	slices.SortFunc(unknown, func(a, b string) int { return cmp.Or(line(a)-line(b), strings.Compare(a, b)) })
	return unknown
}

// unknownKeyError reports key k as unknown: it names the allowed key
// nearest to guess (k as the reader spells keys), or else gives hint.
func unknownKeyError(k, guess string, allowed []string, hint string) error {
	if s := closest(guess, allowed); s != "" {
		return fmt.Errorf("unknown key %q; did you mean %s?", k, s)
	}
	return fmt.Errorf("unknown key %q; %s", k, hint)
}

// missing reports a required key that is absent, unless an unknown key
// (likely the same one misspelt) was already reported for the entry.
func (e *stockEntry) missing(err error) {
	if e.typo {
		e.ok = false
		return
	}
	e.fail("", "", err)
}

func (e *stockEntry) line(key string) int {
	if key == "" {
		return e.l.idx.entryLine(e.section, e.i)
	}
	return e.l.idx.keyLine(e.section, e.i, key)
}

// fail reports err at the line of key (the entry's line when key is "").
// field names the key in the message when it differs from key.
func (e *stockEntry) fail(key, field string, err error) {
	e.ok = false
	f := e.label
	if field != "" {
		f += ": " + field
	}
	e.l.fail(e.line(key), f, err)
}

// str returns the text of key; ok is false when absent or not text.
func (e *stockEntry) str(key string, required bool, example string) (string, bool) {
	return tableString(e.m, key, required, example, e.fail, e.missing)
}

// tableString reads key of a TOML table m as text, for stock and job
// entries alike; ok is false when absent or not text. A required key that
// is absent goes to missing, a wrong or empty value to fail.
func tableString(m map[string]any, key string, required bool, example string, fail func(key, field string, err error), missing func(error)) (string, bool) {
	v, present := m[key]
	if !present {
		if required {
			missing(fmt.Errorf("add %s = %s", key, example))
		}
		return "", false
	}
	s, isStr := v.(string)
	if !isStr {
		fail(key, key, fmt.Errorf("is a %s; write it in quotes, e.g. %s = %s", tomlType(v), key, example))
		return "", false
	}
	if required && strings.TrimSpace(s) == "" {
		fail(key, key, fmt.Errorf("is empty; e.g. %s = %s", key, example))
		return "", false
	}
	return s, true
}

func tomlType(v any) string {
	switch v.(type) {
	case int64, float64:
		return "number"
	case bool:
		return "true/false value"
	case string:
		return "string"
	case []any, []map[string]any:
		return "list"
	case map[string]any:
		return "table"
	}
	return "date or time"
}

// length reads key as a length within [lo, hi].
func (e *stockEntry) length(key string, lo, hi unit.Length, example string) (unit.Length, bool) {
	s, ok := e.str(key, true, example)
	if !ok {
		return 0, false
	}
	v, err := quantity.ParseLength(s)
	if err != nil {
		e.fail(key, key, err)
		return 0, false
	}
	if v < lo || v > hi {
		e.fail(key, key, fmt.Errorf("%s is outside %s to %s; check the number and its unit", mm(v), mm(lo), mm(hi)))
		return 0, false
	}
	return v, true
}

// name reads the entry's name and checks it is not used twice. Mandrels and
// formers share one namespace because a calibration names either.
func (e *stockEntry) name(space string) (string, bool) {
	n, ok := e.str("name", true, `"my `+e.section+`"`)
	if !ok {
		return "", false
	}
	k := space + ":" + nameKey(n)
	if prev, dup := e.l.names[k]; dup {
		e.fail("name", "name", fmt.Errorf("already used on line %d; give each entry its own name", prev))
		return n, false
	}
	e.l.names[k] = e.line("name")
	return n, true
}

func (l *stockLoader) wire(e *stockEntry) {
	name, _ := e.name("wire")
	defer func() {
		if !e.ok {
			l.broken["wire:"+nameKey(name)] = true
		}
	}()
	w := Wire{Name: name, System: "user", Conductor: "copper", Origin: l.file}
	gauge, hasGauge := e.str("gauge", false, `"22awg"`)
	_, hasBare := e.m["bare"]
	source := stockSourceText
	switch {
	case hasGauge && hasBare:
		e.fail("bare", "bare", errors.New("give gauge or bare, not both"))
		return
	case hasGauge:
		g, ok, err := ParseGauge(gauge)
		if !ok {
			err = fmt.Errorf("%q is not a gauge; use e.g. 22awg or 18swg, or write bare = %q", gauge, gauge)
		}
		if err != nil {
			e.fail("gauge", "gauge", err)
			return
		}
		w.Bare = g.Bare
		source += "; bare: " + strings.Split(g.Source, ";")[0]
	case hasBare:
		bare, ok := e.length("bare", minWireBare, maxWireBare, `"0.64mm"`)
		if !ok {
			return
		}
		w.Bare = bare
	default:
		if _, present := e.m["gauge"]; !present {
			e.missing(errors.New(`add gauge = "22awg" or bare = "0.64mm"`))
		}
		return
	}
	if w.Bare < minWireBare || w.Bare > maxWireBare {
		e.fail("gauge", "gauge", fmt.Errorf("bare %s is outside %s to %s", mm(w.Bare), mm(minWireBare), mm(maxWireBare)))
		return
	}
	if ins, ok := e.str("insulation", false, `"grade1"`); ok {
		o, label, err := ParseInsulation(ins, w.Bare)
		if err != nil {
			e.fail("insulation", "insulation", err)
			return
		}
		if o > maxWireOverall {
			e.fail("insulation", "insulation", fmt.Errorf("overall %s is more than %s; check the unit", mm(o), mm(maxWireOverall)))
			return
		}
		w.Overall, w.Insulation = o, label
	} else if _, present := e.m["insulation"]; present {
		return
	} else if o, err := EnamelOverall(w.Bare, "grade1"); err == nil {
		w.Overall, w.Insulation = o, "grade1"
	} else {
		w.Overall, w.Insulation = w.Bare, "none"
	}
	if w.Insulation == "grade1" || w.Insulation == "grade2" {
		source += "; overall: " + enamelSourceFor(w.Insulation)
	}
	if c, ok := e.str("conductor", false, `"copper"`); ok {
		canon, known := conductors[nameKey(c)]
		if !known {
			e.fail("conductor", "conductor", fmt.Errorf("%q: use copper, tinned or silver-plated", c))
			return
		}
		w.Conductor = canon
	}
	if s, ok := e.str("source", false, `"measured with a micrometer"`); ok && strings.TrimSpace(s) != "" {
		source = s
	}
	w.Source = source
	if e.ok {
		l.out.Wires = append(l.out.Wires, w)
	}
}

// holder reads a [[mandrel]] or [[former]].
func (l *stockLoader) holder(e *stockEntry) {
	name, _ := e.name("holder")
	dia, _ := e.length("diameter", minHolder, maxHolder, `"6mm"`)
	kind, hasKind := e.str("kind", false, `"brass rod"`)
	if !hasKind || strings.TrimSpace(kind) == "" {
		kind = "user"
	}
	source, hasSource := e.str("source", false, `"measured with calipers"`)
	if !hasSource || strings.TrimSpace(source) == "" {
		source = stockSourceText
	}
	if !e.ok {
		l.broken["holder:"+nameKey(name)] = true
		return
	}
	if e.section == "mandrel" {
		l.out.Mandrels = append(l.out.Mandrels, Mandrel{Name: name, Diameter: dia, Kind: kind, Source: source, Origin: l.file, Material: MaterialNone})
		return
	}
	f := Former{Name: name, Diameter: dia, Kind: kind, Source: source, Origin: l.file}
	if !l.formerMaterial(e, &f) {
		l.broken["holder:"+nameKey(name)] = true
		return
	}
	l.out.Formers = append(l.out.Formers, f)
}

// formerMaterial reads a former's optional material (a row of the
// built-in materials table) and expansion (its own coefficient, which
// wins over the material's). It reports false after a problem.
func (l *stockLoader) formerMaterial(e *stockEntry, f *Former) bool {
	if m, ok := e.str("material", false, `"rigid pvc"`); ok {
		builtIn, err := BuiltIn()
		if err != nil {
			e.fail("", "", err)
			return false
		}
		mat, found := findMaterial(builtIn.Materials, m)
		if !found {
			names := make([]string, len(builtIn.Materials))
			for i, x := range builtIn.Materials {
				names[i] = x.Name
			}
			e.fail("material", "material", fmt.Errorf("%q is not a known material (%s); or give its coefficient, e.g. expansion = \"70ppm/K\"", m, strings.Join(names, ", ")))
			return false
		}
		f.setMaterial(mat)
	} else if _, present := e.m["material"]; present {
		return false
	}
	if x, ok := e.str("expansion", false, `"70ppm/K"`); ok {
		v, err := quantity.ParsePerKelvin(x)
		if err != nil {
			e.fail("expansion", "expansion", err)
			return false
		}
		if v < minExpansion || v > maxExpansion {
			e.fail("expansion", "expansion", fmt.Errorf("%s is outside %s to %s; check the sign and the ppm", quantity.FormatPPMPerK(v, 3),
				quantity.FormatPPMPerK(minExpansion, 3), quantity.FormatPPMPerK(maxExpansion, 3)))
			return false
		}
		if f.Material == "" {
			f.Material = "user"
		}
		f.Expansion, f.ExpansionLow, f.ExpansionHigh = v, v, v
		f.ExpansionSource = stockSourceText
	} else if _, present := e.m["expansion"]; present {
		return false
	}
	return e.ok
}

func (l *stockLoader) calibration(e *stockEntry, all *Catalog) {
	cal := Calibration{Line: e.line(""), Origin: l.file}
	if m, ok := e.str("mandrel", true, `"my rod"`); ok {
		if hm, err := all.Mandrel(m); err == nil {
			cal.Mandrel = hm.Name
		} else if f, err := all.Former(m); err == nil {
			cal.Mandrel = f.Name
		} else if !l.broken["holder:"+nameKey(m)] {
			sugg := mergeSuggestions(
				suggest(m, all.Mandrels, func(x Mandrel) string { return x.Name }),
				suggest(m, all.Formers, func(x Former) string { return x.Name }))
			e.fail("mandrel", "mandrel", &LookupError{Kind: "mandrel or former", Name: m, Suggestions: sugg})
		} else {
			e.ok = false
		}
	}
	if w, ok := e.str("wire", true, `"my spool"`); ok {
		if ww, err := all.Wire(w); err == nil {
			cal.Wire = ww.Name
		} else if !l.broken["wire:"+nameKey(w)] {
			e.fail("wire", "wire", err)
		} else {
			e.ok = false
		}
	}
	if v, present := e.m["springback"]; present {
		if _, isStr := v.(string); !isStr {
			e.fail("springback", "springback", errors.New(`write it as text with a percent sign, e.g. springback = "3.1%"`))
		} else if s, _ := e.str("springback", true, `"3.1%"`); s != "" {
			sb, err := quantity.ParsePercent(s)
			switch {
			case err != nil:
				e.fail("springback", "springback", err)
			case sb < minSpringback || sb > maxSpringback:
				e.fail("springback", "springback", fmt.Errorf("%.4g%% is outside %.0f%% to %.0f%%; check the sign and the percent", sb*100, minSpringback*100, maxSpringback*100))
			default:
				cal.Springback = sb
			}
		}
	} else {
		e.missing(errors.New(`add springback = "3.1%"`))
	}
	if note, ok := e.str("note", false, `"trim: 52 nH measured"`); ok {
		cal.Note = note
	}
	if e.ok {
		l.out.Calibrations = append(l.out.Calibrations, cal)
	}
}

// closest returns the candidate within edit distance 2 of s, or "".
func closest(s string, candidates []string) string {
	best, bestD := "", 3
	for _, c := range candidates {
		if d := editDistance(strings.ToLower(s), c); d < bestD {
			best, bestD = c, d
		}
	}
	return best
}

//go:embed data/stock-template.toml
var stockTemplate string

// StockTemplate returns a commented example stock file to start from.
func StockTemplate() string { return stockTemplate }
