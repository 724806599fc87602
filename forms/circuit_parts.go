package forms

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"

	"turnwise/internal/quantity"
)

// Reading the tables of a circuit file, and its structure.

func (l *jobLoader) circuitCoil(i int, m map[string]any) CircuitCoil {
	e, ce := l.entry("coil", i, m, circuitCoilKeys)
	c := CircuitCoil{CircuitEntry: ce, Mounting: "grounded"}
	ends(e, &c.Name, &c.From, &c.To)
	if s, ok := e.choice("mounting", []string{"grounded", "floating"}); ok {
		c.Mounting = s
	}
	_, hasJob := m["job"]
	_, hasRef := m["coil"]
	var winding []string
	for _, k := range circuitWindingKeys {
		if _, ok := m[k]; ok {
			winding = append(winding, k)
		}
	}
	switch {
	case hasJob || hasRef:
		if s, ok := e.str("job", true, `"club-night.toml"`); ok {
			c.Job = strings.TrimSpace(s)
		}
		if s, ok := e.str("coil", true, `"L2"`); ok {
			c.JobCoil = strings.TrimSpace(s)
		}
		for _, k := range winding {
			e.fail(k, k, errors.New("the winding comes from the job file's coil; remove this key, or remove job and coil and give the whole winding here"))
			break
		}
	default:
		jc := JobCoil{Name: c.Name, Quantity: 1, Line: ce.Line, keys: map[string]jobKey{}}
		for k, v := range ce.keys {
			jc.keys[k] = jobKey(v)
		}
		l.winding(e, &jc)
		if _, ok := m["turns"]; !ok {
			e.missing(errors.New(`add turns = 5 (or job = "file.toml" with coil = "name" to use a job file's coil)`))
		} else if n := jc.Winding.Turns; n != nil && !quarterTurns(*n) {
			e.fail("turns", "turns", fmt.Errorf("%g is not a positive number of quarter turns; e.g. turns = 5.25", *n))
		}
		e.needWinding(m["mandrel"] == nil && m["former"] == nil)
		c.Winding = &jc
	}
	_, hasTap := m["tap"]
	_, hasTapNode := m["tap_node"]
	switch {
	case hasTap:
		n, ok := e.number("tap", "3.25")
		if !ok {
			break
		}
		if !quarterTurns(n) {
			e.fail("tap", "tap", fmt.Errorf("%g is not a positive number of quarter turns from the cold end; e.g. tap = 3.25", n))
			break
		}
		if c.Winding != nil && c.Winding.Winding.Turns != nil && n >= *c.Winding.Winding.Turns {
			e.fail("tap", "tap", fmt.Errorf("%g turns is not inside the %g-turn winding; count the tap from the cold end (to)", n, *c.Winding.Winding.Turns))
			break
		}
		c.Tap = &n
		if s, ok := e.str("tap_node", true, `"t1"`); ok {
			c.TapNode = nodeName(s)
			switch c.TapNode {
			case "":
				e.fail("tap_node", "tap_node", errors.New(`is empty; name the tap's node, e.g. tap_node = "t1"`))
			case c.From, c.To:
				e.fail("tap_node", "tap_node", fmt.Errorf("is the node of an end (%q): that section would be shorted; give the tap its own node", c.TapNode))
			}
		}
	case hasTapNode:
		e.fail("tap_node", "tap_node", errors.New("a tap node needs the tap: add tap = 3.25 (turns from the cold end)"))
	}
	return c
}

func (l *jobLoader) circuitPart(kind string, i int, m map[string]any) CircuitPart {
	allowed := circuitResKeys
	switch kind {
	case "capacitor":
		allowed = circuitCapKeys
	case "inductor":
		allowed = circuitIndKeys
	}
	e, ce := l.entry(kind, i, m, allowed)
	p := CircuitPart{CircuitEntry: ce, Kind: kind}
	ends(e, &p.Name, &p.From, &p.To)
	var example string
	var parse func(string) (float64, error)
	switch kind {
	case "capacitor":
		example = `"180pF"`
		parse = func(s string) (float64, error) { v, err := quantity.ParseCapacitance(s); return float64(v), err }
	case "inductor":
		example = `"10uH"`
		parse = func(s string) (float64, error) { v, err := quantity.ParseInductance(s); return float64(v), err }
	default:
		example = `"50ohm"`
		parse = quantity.ParseResistance
	}
	positive := func(key, ex string, parse func(string) (float64, error), required bool) (float64, bool) {
		s, ok := e.str(key, required, ex)
		if !ok {
			return 0, false
		}
		v, err := parse(s)
		if err != nil {
			e.fail(key, key, err)
			return 0, false
		}
		if !(v > 0) {
			e.fail(key, key, fmt.Errorf("must be positive, e.g. %s = %s", key, ex))
			return 0, false
		}
		return v, true
	}
	p.Value, _ = positive("value", example, parse, true)
	if kind == "resistor" {
		return p
	}
	_, hasQ := m["q"]
	_, hasQAt := m["q_at"]
	_, hasESR := m["esr"]
	switch {
	case hasQ && hasESR:
		e.fail("esr", "esr", errors.New("give q (with q_at) or esr, not both"))
	case hasQ:
		if q, ok := e.number("q", "500"); ok {
			if q <= 0 || q > 1e7 {
				e.fail("q", "q", fmt.Errorf("%g is not a Q; e.g. q = 500", q))
			} else {
				p.Q = q
			}
		}
		if !hasQAt {
			e.fail("q", "q", errors.New(`a Q is stated at a frequency: add q_at = "10MHz"`))
		}
	case hasESR:
		p.ESR, _ = positive("esr", `"0.05ohm"`, quantity.ParseResistance, false)
	}
	if hasQAt {
		if !hasQ {
			e.fail("q_at", "q_at", errors.New("q_at is the frequency a Q is stated at: add q = 500, or remove q_at"))
		}
		p.QAt, _ = positive("q_at", `"10MHz"`, func(s string) (float64, error) { v, err := quantity.ParseFrequency(s); return float64(v), err }, false)
	}
	if kind != "capacitor" {
		return p
	}
	if s, ok := e.str("tempco", false, `"N750"`); ok {
		tc, err := ParseTempco(s)
		if err != nil {
			e.fail("tempco", "tempco", err)
		} else {
			p.Tempco, p.HasTempco, p.TempcoRaw = tc, true, strings.TrimSpace(s)
		}
	}
	p.Rating, _ = positive("rating", `"1kV"`, quantity.ParseVoltage, false)
	if s, ok := e.str("range", false, `"10pF-250pF"`); ok {
		lo, hi, err := ParseCapacitanceRange(s)
		switch {
		case err != nil:
			e.fail("range", "range", err)
		case !(hi > lo):
			e.fail("range", "range", errors.New(`give the minimum and maximum, e.g. range = "10pF-250pF"`))
		default:
			p.Min, p.Max = float64(lo), float64(hi)
			if p.Value > 0 && (p.Value < p.Min*(1-1e-9) || p.Value > p.Max*(1+1e-9)) {
				e.fail("value", "value", fmt.Errorf("the setting %s is outside range %s; give a value within it",
					quantity.FormatCapacitanceShort(p.Value), s))
			}
		}
	}
	return p
}

var tempcoClassRE = regexp.MustCompile(`^(?i)([NP])(\d{1,4})$`)

// ParseTempco reads a capacitor's temperature coefficient: an EIA class-1
// code ("NP0", "C0G", "N750", "P100") or a value ("-750ppm/K",
// "+30ppm/C"), or "air" for an air-dielectric variable (+50 ppm/K, a
// typical value from memory; coil/thermal.AirVariable holds it with its
// tolerance). It returns the fractional change per kelvin.
func ParseTempco(s string) (float64, error) {
	t := strings.TrimSpace(s)
	switch strings.ToUpper(t) {
	case "NP0", "NPO", "C0G", "COG":
		return 0, nil
	case "AIR":
		return 50e-6, nil // typical air variable, from memory
	}
	if m := tempcoClassRE.FindStringSubmatch(t); m != nil {
		v, _ := strconv.ParseFloat(m[2], 64)
		if strings.EqualFold(m[1], "N") {
			v = -v
		}
		return v * 1e-6, nil
	}
	low := strings.ToLower(strings.ReplaceAll(t, " ", ""))
	for _, suf := range []string{"ppm/k", "ppm/c", "ppm/°c", "ppm"} {
		if num, ok := strings.CutSuffix(low, suf); ok {
			v, err := strconv.ParseFloat(num, 64)
			if err != nil || math.IsNaN(v) || math.IsInf(v, 0) || math.Abs(v) > 1e5 {
				break
			}
			return v * 1e-6, nil
		}
	}
	return 0, &quantity.Error{Input: s, Want: "tempco", Reason: `write a class code (NP0, N750, P100) or a value such as "-750ppm/K"`}
}

func (l *jobLoader) circuitCoupling(i int, m map[string]any) CircuitCoupling {
	e, ce := l.entry("coupling", i, m, circuitCplKeys)
	c := CircuitCoupling{CircuitEntry: ce}
	if s, ok := e.str("name", false, `"K1"`); ok {
		c.Name = strings.TrimSpace(s)
	}
	if c.Name == "" {
		c.Name = fmt.Sprintf("K%d", i+1)
	}
	v, present := m["parts"]
	list, isList := v.([]any)
	switch {
	case !present:
		e.missing(errors.New(`add parts = ["L1", "L2"]: the two coils or inductors coupled`))
	case !isList || len(list) != 2:
		e.fail("parts", "parts", errors.New(`name two parts, e.g. parts = ["L1", "L2"]`))
	default:
		for j, x := range list {
			s, ok := x.(string)
			if !ok || strings.TrimSpace(s) == "" {
				e.fail("parts", "parts", errors.New(`write the part names in quotes, e.g. parts = ["L1", "L2"]`))
				break
			}
			c.Parts[j] = strings.TrimSpace(s)
		}
		if c.Parts[0] != "" && strings.EqualFold(c.Parts[0], c.Parts[1]) {
			e.fail("parts", "parts", errors.New("couples a part to itself; name two different parts"))
		}
	}
	if _, ok := m["k"]; !ok {
		e.missing(errors.New("add k = 0.05: the coupling coefficient, between -1 and 1"))
	} else if k, ok := e.number("k", "0.05"); ok {
		if !(math.Abs(k) < 1) || k == 0 {
			e.fail("k", "k", fmt.Errorf("%g is not a coupling coefficient; it lies between -1 and 1 (exclusive) and is not 0, e.g. k = 0.05", k))
		} else {
			c.K = k
		}
	}
	return c
}

func (l *jobLoader) circuitPort(i int, m map[string]any) CircuitPort {
	e, ce := l.entry("port", i, m, circuitPortKeys)
	p := CircuitPort{CircuitEntry: ce, Z0: 50}
	e.label = fmt.Sprintf("port %d", i+1)
	if s, ok := e.str("node", true, `"ant"`); ok {
		p.Node = nodeName(s)
		switch p.Node {
		case "":
			e.fail("node", "node", errors.New(`is empty; name the node, e.g. node = "ant"`))
		case GroundNode:
			e.fail("node", "node", errors.New("is gnd: a port is between a node and ground; name the node it connects to"))
		}
	}
	if s, ok := e.str("z0", false, `"50ohm"`); ok {
		z, err := quantity.ParseResistance(s)
		switch {
		case err != nil:
			e.fail("z0", "z0", err)
		case !(z > 0):
			e.fail("z0", "z0", errors.New(`must be positive, e.g. z0 = "50ohm"`))
		default:
			p.Z0 = z
		}
	}
	return p
}

func (l *jobLoader) circuitLoad(m map[string]any) *CircuitLoad {
	line := l.idx.top["load"]
	e := &jobEntry{l: l, m: m, label: "load", line: func(string) int { return line }}
	for k := range m {
		if k != "node" {
			e.fail(k, "", fmt.Errorf("unknown key %q; [load] takes node", k))
			e.typo = true
		}
	}
	ld := &CircuitLoad{Line: line}
	if s, ok := e.str("node", true, `"ant"`); ok {
		ld.Node = nodeName(s)
		if ld.Node == "" || ld.Node == GroundNode {
			e.fail("node", "node", errors.New(`name the node the load connects to (not gnd), e.g. node = "ant"`))
		}
	}
	return ld
}

// terminal is one place a node is used, for messages.
type terminal struct {
	label, key string
	line       int
}

// circuitStructure checks what needs the whole file: unique names, the
// parts a coupling names, ports, nodes used once, and sub-networks with no
// path to ground.
func (l *jobLoader) circuitStructure(c *Circuit) {
	fail := func(line int, field string, err error) { l.fail(line, field, err) }
	names := map[string]terminal{}
	inductive := map[string]bool{}
	uses := map[string][]terminal{}
	parent := map[string]string{}
	var find func(string) string
	find = func(x string) string {
		p, ok := parent[x]
		if !ok || p == x {
			parent[x] = x
			return x
		}
		r := find(p)
		parent[x] = r
		return r
	}
	union := func(a, b string) { parent[find(a)] = find(b) }
	addPart := func(label, name string, ce *CircuitEntry, from, to string, ind bool) {
		k := nameKey(name)
		if prev, dup := names[k]; dup {
			fail(ce.KeyLine("name"), label+": name", fmt.Errorf("already used by %s on line %d; give each part its own name", prev.label, prev.line))
		} else {
			names[k] = terminal{label: label, line: ce.KeyLine("name")}
		}
		inductive[k] = ind
		uses[from] = append(uses[from], terminal{label, "from", ce.KeyLine("from")})
		uses[to] = append(uses[to], terminal{label, "to", ce.KeyLine("to")})
		union(from, to)
	}
	for i := range c.Coils {
		k := &c.Coils[i]
		addPart(k.Label(), k.Name, &k.CircuitEntry, k.From, k.To, k.Tap == nil)
		if k.Tap != nil {
			uses[k.TapNode] = append(uses[k.TapNode], terminal{k.Label(), "tap_node", k.KeyLine("tap_node")})
			union(k.TapNode, k.From)
		}
	}
	for _, list := range [][]CircuitPart{c.Capacitors, c.Inductors, c.Resistors} {
		for i := range list {
			p := &list[i]
			addPart(p.Label(), p.Name, &p.CircuitEntry, p.From, p.To, p.Kind == "inductor")
		}
	}
	if len(names) == 0 {
		fail(1, "", errors.New("no parts: add [[coil]], [[capacitor]], [[inductor]] or [[resistor]] sections"))
		return
	}
	for i := range c.Couplings {
		k := &c.Couplings[i]
		label := fmt.Sprintf("coupling %q", k.Name)
		for _, p := range k.Parts {
			ind, ok := inductive[nameKey(p)]
			switch {
			case !ok:
				fail(k.KeyLine("parts"), label+": parts", fmt.Errorf("no part is named %q", p))
			case !ind:
				fail(k.KeyLine("parts"), label+": parts", fmt.Errorf("%q is not an inductor or an untapped coil; only those couple", p))
			}
		}
	}
	switch len(c.Ports) {
	case 0:
		fail(1, "", errors.New(`no port: add a [[port]] section with node = "..." (one or two ports; port 1 first)`))
	case 1, 2:
	default:
		fail(c.Ports[2].Line, "port 3", fmt.Errorf("%d ports; a circuit has one or two", len(c.Ports)))
	}
	for i := range c.Ports {
		p := &c.Ports[i]
		if _, ok := uses[p.Node]; !ok {
			fail(p.KeyLine("node"), fmt.Sprintf("port %d: node", i+1), fmt.Errorf("no part joins node %q; check the spelling", p.Node))
			continue
		}
		if i == 1 && p.Node == c.Ports[0].Node {
			fail(p.KeyLine("node"), "port 2: node", fmt.Errorf("both ports are on node %q; put port 2 on another node", p.Node))
		}
		uses[p.Node] = append(uses[p.Node], terminal{fmt.Sprintf("port %d", i+1), "node", p.KeyLine("node")})
	}
	if c.Load != nil {
		if _, ok := uses[c.Load.Node]; !ok {
			fail(c.Load.Line, "load: node", fmt.Errorf("no part joins node %q; check the spelling", c.Load.Node))
		}
	}
	for node, ts := range uses {
		if node != GroundNode && len(ts) == 1 {
			t := ts[0]
			fail(t.line, t.label+": "+t.key, fmt.Errorf("node %q connects to only one part: join it to something else, or check the spelling", node))
		}
	}
	if _, ok := uses[GroundNode]; !ok {
		fail(1, "", errors.New(`no part joins gnd: the network needs a path to ground (to = "gnd")`))
		return
	}
	for node, ts := range uses {
		if find(node) != find(GroundNode) {
			t := ts[0]
			fail(t.line, t.label+": "+t.key, fmt.Errorf("node %q is in a part of the network with no path to gnd; join it to the rest", node))
		}
	}
}

// eiaCode is the shape of an EIA-198 class 1 code (U2J, S2H …), which
// coil/thermal reads with its tolerance.
var eiaCode = regexp.MustCompile(`^(?i)[A-Z][0-9][A-Z]$`)

// The workshop's temperature range when a job file gives none.
const (
	DefaultTempLow  = 288.15 // 15 °C
	DefaultTempHigh = 308.15 // 35 °C
)
