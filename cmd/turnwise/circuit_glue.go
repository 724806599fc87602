package main

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"

	"turnwise/coil/circuit"
	"turnwise/forms"
	"turnwise/internal/spec"
)

// Circuit files: read one and build the circuit.Network it describes, each
// wound coil resolved through the same stock and coil flags as predict (an
// inline winding) or as a job file's coil (job = ..., coil = ...). The
// matching and temperature commands build on these too.

// loadCircuitFile reads and checks a circuit file. A missing file is a
// usage error, a malformed one a *forms.ParseError (both exit 2).
func loadCircuitFile(path string) (*forms.Circuit, error) {
	f, err := os.Open(path)
	if err != nil {
		if errors.Is(err, os.ErrNotExist) {
			return nil, usageErrorf("circuit file %q does not exist; check the path (demos are in testdata/circuits/)", path)
		}
		return nil, fmt.Errorf("read circuit file: %w", err)
	}
	defer f.Close()
	return forms.LoadCircuit(f, path)
}

// circuitModel is a circuit file made ready to solve.
type circuitModel struct {
	File *forms.Circuit
	Net  *circuit.Network
	// Coils holds each wound coil's resolved winding, by part index.
	Coils map[int]spec.Spec
	// Mounting is each wound coil's mounting ("grounded" or "floating"),
	// by part index.
	Mounting map[int]string
	// Entries is each part's file entry, by part index, for messages;
	// Lumped is the lumped part's file record (nil for a coil).
	Entries []*forms.CircuitEntry
	Lumped  []*forms.CircuitPart
}

// PartIndex returns the index of the named part, or -1.
func (m *circuitModel) PartIndex(name string) int {
	for i, p := range m.Net.Parts {
		if p.Name == name {
			return i
		}
	}
	return -1
}

// buildCircuit turns a circuit file into a network. cat is the stock for
// inline windings; so and flagsGiven choose the stock for coils taken from
// a job file, as sheet does. Errors are *forms.ParseError at the line and
// key at fault.
func buildCircuit(c *forms.Circuit, cat *forms.Catalog, so *stockOptions, flagsGiven bool) (*circuitModel, error) {
	m := &circuitModel{File: c, Net: &circuit.Network{Nodes: []string{forms.GroundNode}},
		Coils: map[int]spec.Spec{}, Mounting: map[int]string{}}
	nodes := map[string]int{forms.GroundNode: circuit.Ground}
	node := func(name string) int {
		if i, ok := nodes[name]; ok {
			return i
		}
		nodes[name] = len(m.Net.Nodes)
		m.Net.Nodes = append(m.Net.Nodes, name)
		return nodes[name]
	}
	fail := func(line int, field string, err error) error {
		return &forms.ParseError{Kind: "circuit", File: c.File, Line: line, Field: field, Err: err}
	}
	jobs := map[string]*forms.Job{}
	for i := range c.Coils {
		k := &c.Coils[i]
		var cs spec.Spec
		var err error
		if k.Winding != nil {
			cs, err = spec.ResolveJobCoil(&forms.Job{File: c.File}, k.Winding, cat)
			if err != nil {
				return nil, asCircuitError(err, c.File)
			}
		} else {
			cs, err = circuitJobCoil(c, k, jobs, so, flagsGiven)
			if err != nil {
				return nil, err
			}
		}
		g := cs.Geometry
		p := circuit.Part{Name: k.Name, Kind: circuit.Wound, A: node(k.From), B: node(k.To), Coil: &g, TapNode: -1}
		if k.Tap != nil {
			if *k.Tap >= g.Turns {
				return nil, fail(k.KeyLine("tap"), k.Label()+": tap", fmt.Errorf("%g turns is not inside the %g-turn winding; count the tap from the cold end (to)", *k.Tap, g.Turns))
			}
			p.TapNode, p.TapTurns = node(k.TapNode), *k.Tap
		}
		m.Coils[len(m.Net.Parts)] = cs
		m.Mounting[len(m.Net.Parts)] = k.Mounting
		m.Net.Parts = append(m.Net.Parts, p)
		m.Entries = append(m.Entries, &k.CircuitEntry)
		m.Lumped = append(m.Lumped, nil)
	}
	for _, list := range [][]forms.CircuitPart{c.Capacitors, c.Inductors, c.Resistors} {
		for i := range list {
			lp := &list[i]
			p := circuit.Part{Name: lp.Name, A: node(lp.From), B: node(lp.To), Value: lp.Value,
				ESR: lp.ESR, Q: lp.Q, QFrequency: lp.QAt, TapNode: -1}
			switch lp.Kind {
			case "capacitor":
				p.Kind = circuit.Capacitor
			case "inductor":
				p.Kind = circuit.Inductor
			default:
				p.Kind = circuit.Resistor
			}
			m.Net.Parts = append(m.Net.Parts, p)
			m.Entries = append(m.Entries, &lp.CircuitEntry)
			m.Lumped = append(m.Lumped, lp)
		}
	}
	for i := range c.Couplings {
		k := &c.Couplings[i]
		cp := circuit.Coupling{Name: k.Name, P: m.PartIndex(k.Parts[0]), Q: m.PartIndex(k.Parts[1]), K: k.K}
		if cp.P < 0 || cp.Q < 0 {
			return nil, fail(k.KeyLine("parts"), fmt.Sprintf("coupling %q: parts", k.Name), errors.New("names a part that is not in the circuit (names match exactly here)"))
		}
		m.Net.Couplings = append(m.Net.Couplings, cp)
	}
	for _, pt := range c.Ports {
		m.Net.Ports = append(m.Net.Ports, circuit.Port{Node: node(pt.Node), Z0: pt.Z0})
	}
	if err := m.Net.Validate(); err != nil {
		return nil, m.fileError(err)
	}
	return m, nil
}

// circuitJobCoil resolves a coil taken from a job file, the job read
// relative to the circuit file and with its own stock.
func circuitJobCoil(c *forms.Circuit, k *forms.CircuitCoil, jobs map[string]*forms.Job, so *stockOptions, flagsGiven bool) (spec.Spec, error) {
	path := k.Job
	if !filepath.IsAbs(path) {
		path = filepath.Join(filepath.Dir(c.File), path)
	}
	fail := func(key string, err error) error {
		return &forms.ParseError{Kind: "circuit", File: c.File, Line: k.KeyLine(key), Field: k.Label() + ": " + key, Err: err}
	}
	job, ok := jobs[path]
	if !ok {
		var err error
		job, err = spec.LoadJob(path)
		if err != nil {
			var ue *usageError
			if errors.As(err, &ue) {
				return spec.Spec{}, fail("job", fmt.Errorf("%q (read as %s) does not exist; the path is relative to the circuit file", k.Job, path))
			}
			return spec.Spec{}, err // the job file's own error, at its line
		}
		jobs[path] = job
	}
	jc, err := job.Coil(k.JobCoil)
	if err != nil {
		return spec.Spec{}, fail("coil", err)
	}
	if jc.Target != nil {
		return spec.Spec{}, fail("coil", fmt.Errorf("%s of %s is a design target, not a fixed winding; design it and put its turns in the job file first", jc.Label(), k.Job))
	}
	cat, err := spec.JobCatalog(job, so.path, so.use.v, flagsGiven)
	if err != nil {
		return spec.Spec{}, err
	}
	return spec.ResolveJobCoil(job, jc, cat)
}

// asCircuitError relabels an error the job-coil resolver made for an inline
// winding as the circuit file's.
func asCircuitError(err error, file string) error {
	var pe *forms.ParseError
	if errors.As(err, &pe) && (pe.File == file || pe.File == "") {
		pe.Kind, pe.File = "circuit", file
	}
	return err
}

// fileError maps a network fault (*circuit.Error names a part, a node or
// "port") to the file's line and key.
func (m *circuitModel) fileError(err error) error {
	var ce *circuit.Error
	if !errors.As(err, &ce) {
		return err
	}
	c := m.File
	at := func(line int, field string) error {
		return &forms.ParseError{Kind: "circuit", File: c.File, Line: line, Field: field, Err: errors.New(ce.Reason)}
	}
	if i := m.PartIndex(ce.Part); i >= 0 {
		kind := m.Net.Parts[i].Kind.String()
		return at(m.Entries[i].Line, fmt.Sprintf("%s %q", kind, ce.Part))
	}
	for i, p := range m.Net.Parts {
		if m.Net.Nodes[p.A] == ce.Part {
			return at(m.Entries[i].KeyLine("from"), fmt.Sprintf("%s %q: from", p.Kind, p.Name))
		}
		if m.Net.Nodes[p.B] == ce.Part {
			return at(m.Entries[i].KeyLine("to"), fmt.Sprintf("%s %q: to", p.Kind, p.Name))
		}
	}
	for i := range c.Couplings {
		if c.Couplings[i].Name == ce.Part {
			return at(c.Couplings[i].Line, fmt.Sprintf("coupling %q", ce.Part))
		}
	}
	if ce.Part == "port" && len(c.Ports) > 0 {
		return at(c.Ports[0].KeyLine("node"), "port: node")
	}
	return at(1, ce.Part)
}
