package forms

import (
	"cmp"
	"errors"
	"fmt"
	"io"
	"slices"
	"strings"

	"github.com/BurntSushi/toml"
)

// Circuit is a network of parts read from a circuit file (TOML) by
// LoadCircuit: coils, capacitors, inductors, resistors, couplings and one
// or two ports. Nodes are named by the parts that join them; ground is
// "gnd". Values are parsed and checked as far as the file alone allows
// (the structure too: a node used once, a part shorted to itself, a port on
// ground, a part of the network with no path to ground); coil windings are
// resolved later against the stock, as a job file's are.
type Circuit struct {
	File  string
	Title string
	Notes string

	Coils      []CircuitCoil
	Capacitors []CircuitPart
	Inductors  []CircuitPart
	Resistors  []CircuitPart
	Couplings  []CircuitCoupling
	Ports      []CircuitPort
	Load       *CircuitLoad // nil when the file has no [load]
	// Bands the network serves: used when the command line gives none.
	Bands []Band

	lines map[string]int // top-level key -> line
}

// GroundNode is the name of the ground node.
const GroundNode = "gnd"

// KeyLine returns the line of a top-level key, or 0.
func (c *Circuit) KeyLine(key string) int { return c.lines[key] }

// circuitKey is one key of a table as written.
type circuitKey struct {
	raw  string
	line int
}

// CircuitEntry is what every [[table]] of a circuit file has: its line and
// the line of each key, for messages.
type CircuitEntry struct {
	Line int // line of its [[header]]
	keys map[string]circuitKey
}

// KeyLine returns the line of key in this entry, falling back to the line
// of its header.
func (e *CircuitEntry) KeyLine(key string) int {
	if k, ok := e.keys[key]; ok && k.line > 0 {
		return k.line
	}
	return e.Line
}

// Has reports whether key was given.
func (e *CircuitEntry) Has(key string) bool { _, ok := e.keys[key]; return ok }

// Raw returns key's value as written, or "".
func (e *CircuitEntry) Raw(key string) string { return e.keys[key].raw }

// CircuitCoil is a wound coil: its winding given inline with a job file's
// fixed-coil keys (Winding), or a reference to a coil of a job file (Job
// and JobCoil). From is the hot end, To the cold end.
type CircuitCoil struct {
	CircuitEntry
	Name, From, To string
	// Winding holds the inline winding as a job's fixed coil (Name, Line
	// and key lines set), so that the same resolver reads it; nil for a
	// reference.
	Winding *JobCoil
	Job     string // job file as written (relative to the circuit file)
	JobCoil string // coil name in it
	// Tap is turns from the cold end, with its node; nil when untapped.
	Tap      *float64
	TapNode  string
	Mounting string // "grounded" (default: one end at RF ground) or "floating"
}

// Label is how messages name the coil: coil "L1".
func (c *CircuitCoil) Label() string { return fmt.Sprintf("coil %q", c.Name) }

// CircuitPart is a capacitor, inductor or resistor given by value.
type CircuitPart struct {
	CircuitEntry
	Kind           string // "capacitor", "inductor", "resistor"
	Name, From, To string
	Value          float64 // F, H or Ω
	// Q at QAt (Hz), or ESR (Ω): at most one is set (capacitor, inductor).
	Q, QAt float64
	ESR    float64
	// Capacitor only.
	Tempco    float64 // fractional change per kelvin (−750 ppm/K is −750e-6)
	HasTempco bool
	TempcoRaw string  // as written: "N750", "-750ppm/K"
	Rating    float64 // working voltage, V; 0 when not given
	Min, Max  float64 // adjustable range, F; both 0 for a fixed part
}

// Label is how messages name the part: capacitor "C1".
func (p *CircuitPart) Label() string { return fmt.Sprintf("%s %q", p.Kind, p.Name) }

// Adjustable reports whether the part has a range.
func (p *CircuitPart) Adjustable() bool { return p.Max > 0 }

// CircuitCoupling is a mutual coupling k between two inductive parts.
type CircuitCoupling struct {
	CircuitEntry
	Name  string
	Parts [2]string
	K     float64
}

// CircuitPort is a port from Node to ground with a real reference
// impedance (50 Ω when not given).
type CircuitPort struct {
	CircuitEntry
	Node string
	Z0   float64
}

// CircuitLoad is where a load being matched connects.
type CircuitLoad struct {
	Line int
	Node string
}

// Keys a circuit file takes.
var (
	circuitTopKeys = []string{"title", "notes", "bands", "coil", "capacitor", "inductor", "resistor", "coupling", "port", "load"}
	circuitEnds    = []string{"name", "from", "to"}
	// A coil takes a job file's fixed-winding keys, under the same names.
	circuitWindingKeys = []string{"mandrel", "former", "wire", "insulation", "conductor", "springback",
		"turns", "pitch", "length", "leads", "temp", "freq"}
	circuitCoilKeys = slices.Concat(circuitEnds, circuitWindingKeys,
		[]string{"notes", "job", "coil", "tap", "tap_node", "mounting"})
	circuitCapKeys  = slices.Concat(circuitEnds, []string{"value", "q", "q_at", "esr", "tempco", "rating", "range", "notes"})
	circuitIndKeys  = slices.Concat(circuitEnds, []string{"value", "q", "q_at", "esr", "notes"})
	circuitResKeys  = slices.Concat(circuitEnds, []string{"value", "notes"})
	circuitCplKeys  = []string{"name", "parts", "k"}
	circuitPortKeys = []string{"node", "z0", "name"}
)

// Limits: beyond them a file is not a circuit a builder draws.
const (
	maxCircuitBytes = 1 << 20
	maxCircuitParts = 500
)

// LoadCircuit reads a circuit file. name labels errors (usually the path).
// Every error is a *ParseError with Kind "circuit", the line and the
// entry and key at fault; unknown keys are errors. When the file has
// several problems the first in the file is returned.
//
// The format, with every key:
//
//	title = "HF+VHF front end"
//	notes = "..."
//	bands = ["80m=3.5-3.8MHz", "2m=144-146MHz"]   # served bands (default for --band)
//
//	[[coil]]                       # a wound coil; from = hot end, to = cold end
//	name = "L1"   from = "ant"   to = "gnd"
//	former = "pvc 20mm"   wire = "0.5mm"   turns = 24   leads = "10mm"
//	pitch = "0.6mm"                # or length; the job file's fixed-coil keys
//	tap = 3.25   tap_node = "t1"   # turns from the cold end, and its node
//	mounting = "grounded"          # or "floating" (both ends above ground)
//	# or: job = "club-night.toml"   coil = "L2"
//
//	[[capacitor]]
//	name = "C1"   from = "ant"   to = "gnd"   value = "180pF"
//	q = 500   q_at = "10MHz"       # or esr = "0.05ohm"
//	tempco = "N750"                # or "-750ppm/K"
//	rating = "1kV"
//	range = "10pF-250pF"           # adjustable; value is the setting
//
//	[[inductor]]                   # name, from, to, value, q/q_at or esr
//	[[resistor]]                   # name, from, to, value = "50ohm"
//
//	[[coupling]]
//	name = "K1"   parts = ["L1", "L2"]   k = 0.05
//
//	[[port]]                       # one or two; port 1 first
//	node = "ant"   z0 = "50ohm"    # 50 ohm when not given
//
//	[load]
//	node = "ant"                   # where a load being matched connects
func LoadCircuit(r io.Reader, name string) (*Circuit, error) {
	data, err := io.ReadAll(io.LimitReader(r, maxCircuitBytes+1))
	if err != nil {
		return nil, &ParseError{Kind: "circuit", File: name, Err: err}
	}
	if len(data) > maxCircuitBytes {
		return nil, &ParseError{Kind: "circuit", File: name, Err: fmt.Errorf("larger than %d MiB; is this the right file?", maxCircuitBytes>>20)}
	}
	text := string(data)
	if err := checkShape(text, "circuit", name); err != nil { // nesting before the decoder sees it
		return nil, err
	}
	var doc map[string]any
	if _, err := toml.Decode(text, &doc); err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, &ParseError{Kind: "circuit", File: name, Line: pe.Position.Line, Err: &syntaxError{pe}}
		}
		return nil, &ParseError{Kind: "circuit", File: name, Err: err}
	}
	// The job loader's value readers serve here too; its errors are
	// relabelled as the circuit file's.
	l := &jobLoader{file: name, idx: indexTOML(text)}
	c := loadCircuit(l, doc)
	if len(l.errs) > 0 {
		e := slices.MinFunc(l.errs, func(a, b *ParseError) int { return a.Line - b.Line })
		e.Kind = "circuit"
		return nil, e
	}
	return c, nil
}

func loadCircuit(l *jobLoader, doc map[string]any) *Circuit {
	c := &Circuit{File: l.file, lines: map[string]int{}}
	keys := make([]string, 0, len(doc))
	for k := range doc {
		keys = append(keys, k)
	}
	slices.SortFunc(keys, func(a, b string) int { return cmp.Or(l.idx.top[a]-l.idx.top[b], strings.Compare(a, b)) })
	top := &jobEntry{l: l, m: doc, line: func(k string) int {
		if k == "" {
			return 1
		}
		return l.idx.top[k]
	}}
	for _, k := range keys {
		c.lines[k] = l.idx.top[k]
		if slices.Contains(circuitTopKeys, k) {
			continue
		}
		top.fail(k, "", unknownKeyError(k, k, circuitTopKeys, "a circuit file takes title, notes, [[coil]], [[capacitor]], [[inductor]], [[resistor]], [[coupling]], [[port]] and [load]"))
	}
	if s, ok := top.str("title", false, `"HF+VHF front end"`); ok {
		c.Title = strings.TrimSpace(s)
	}
	if s, ok := top.str("notes", false, `"..."`); ok {
		c.Notes = s
	}

	if v, present := doc["bands"]; present {
		list, isList := v.([]any)
		if !isList {
			top.fail("bands", "bands", fmt.Errorf("is a %s; write a list, e.g. bands = [\"80m=3.5-3.8MHz\"]", tomlType(v)))
		}
		for i, x := range list {
			bs, isStr := x.(string)
			if !isStr {
				top.fail("bands", fmt.Sprintf("bands[%d]", i+1), errors.New(`write each band in quotes, e.g. "80m=3.5-3.8MHz"`))
				continue
			}
			b, err := ParseBand(bs)
			if err != nil {
				top.fail("bands", fmt.Sprintf("bands[%d]", i+1), err)
				continue
			}
			c.Bands = append(c.Bands, b)
		}
	}
	tables := func(key string) []map[string]any {
		v, present := doc[key]
		if !present {
			return nil
		}
		list, ok := tableList(v)
		if !ok {
			top.fail(key, key, fmt.Errorf("write each %s as its own [[%s]] section (double brackets)", key, key))
			return nil
		}
		return list
	}
	coils, caps, inds, ress := tables("coil"), tables("capacitor"), tables("inductor"), tables("resistor")
	cpls, ports := tables("coupling"), tables("port")
	if n := len(coils) + len(caps) + len(inds) + len(ress); n > maxCircuitParts {
		top.fail("", "", fmt.Errorf("%d parts; a circuit file holds at most %d", n, maxCircuitParts))
		return c
	}
	for i, m := range coils {
		c.Coils = append(c.Coils, l.circuitCoil(i, m))
	}
	for _, kind := range []struct {
		key  string
		list []map[string]any
		dst  *[]CircuitPart
	}{{"capacitor", caps, &c.Capacitors}, {"inductor", inds, &c.Inductors}, {"resistor", ress, &c.Resistors}} {
		for i, m := range kind.list {
			*kind.dst = append(*kind.dst, l.circuitPart(kind.key, i, m))
		}
	}
	for i, m := range cpls {
		c.Couplings = append(c.Couplings, l.circuitCoupling(i, m))
	}
	for i, m := range ports {
		c.Ports = append(c.Ports, l.circuitPort(i, m))
	}
	if v, present := doc["load"]; present {
		m, ok := v.(map[string]any)
		if !ok {
			top.fail("load", "load", errors.New(`write the load as a [load] section with node = "ant"`))
		} else {
			c.Load = l.circuitLoad(m)
		}
	}
	if len(l.errs) == 0 {
		l.circuitStructure(c)
	}
	return c
}

// entry prepares the reader of the i-th [[table]]: unknown keys reported,
// key lines noted.
func (l *jobLoader) entry(table string, i int, m map[string]any, allowed []string) (*jobEntry, CircuitEntry) {
	ce := CircuitEntry{Line: l.idx.entryLine(table, i), keys: map[string]circuitKey{}}
	e := &jobEntry{l: l, m: m, label: fmt.Sprintf("%s #%d", table, i+1)}
	e.line = func(k string) int {
		if k == "" {
			return l.idx.entryLine(table, i)
		}
		return l.idx.keyLine(table, i, k)
	}
	for k, v := range m {
		raw := fmt.Sprint(v)
		if s, ok := v.(string); ok {
			raw = s
		}
		ce.keys[k] = circuitKey{raw: raw, line: e.line(k)}
	}
	if n, ok := m["name"].(string); ok && strings.TrimSpace(n) != "" {
		e.label = fmt.Sprintf("%s %q", table, strings.TrimSpace(n))
	}
	for _, k := range unknownKeys(m, allowed, e.line) {
		e.fail(k, "", unknownKeyError(k, k, allowed, fmt.Sprintf("a [[%s]] takes %s", table, strings.Join(allowed, ", "))))
		e.typo = true
	}
	return e, ce
}

// ends reads name, from and to.
func ends(e *jobEntry, name, from, to *string) {
	if s, ok := e.str("name", true, `"C1"`); ok {
		*name = strings.TrimSpace(s)
	}
	if s, ok := e.str("from", true, `"ant"`); ok {
		*from = nodeName(s)
		if *from == "" {
			e.fail("from", "from", errors.New(`is empty; name the node, e.g. from = "ant"`))
		}
	}
	if s, ok := e.str("to", true, `"gnd"`); ok {
		*to = nodeName(s)
		if *to == "" {
			e.fail("to", "to", errors.New(`is empty; name the node, e.g. to = "gnd"`))
		}
	}
	if *from != "" && *from == *to {
		e.fail("to", "to", fmt.Errorf("is the same node as from (%q): the part is shorted to itself; join it between two nodes", *to))
	}
}

// nodeName is a node as the network knows it: blanks trimmed, ground in
// any case is "gnd".
func nodeName(s string) string {
	s = strings.TrimSpace(s)
	if strings.EqualFold(s, GroundNode) {
		return GroundNode
	}
	return s
}
