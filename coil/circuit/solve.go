package circuit

import (
	"math"
	"math/cmplx"
	"slices"

	"turnwise/coil"
)

// branch is an inductive branch: current from node p to node q.
type branch struct {
	part int
	role int // roleInductor, roleLeads, roleWinding, roleTop, roleBottom
	p, q int
}

const (
	roleInductor = iota
	roleLeads
	roleWinding
	roleTop
	roleBottom
)

// Solver solves one network at any frequency. It reads the parts' values
// at every call, so a caller may change a capacitor's Value (a tuning
// setting), a load's Z, a coupling's K or a wound coil's geometry between
// calls: the factorisation is reused only while the frequency, the port
// terminations and every value it was built from are unchanged. A Solver
// is not safe for concurrent use.
type Solver struct {
	net      *Network
	nodes    int   // all nodes, ground and coils' internal nodes included
	internal []int // per part: the internal node of an untapped wound coil, else -1
	branches []branch
	partBr   []int // per part: its first branch, or -1
	size     int   // unknowns: nodes − 1 + branches

	a    []complex128 // size×size, row-major
	perm []int
	rhs  []complex128
	x    []complex128
	lf   float64 // frequency the factorisation is for (0: none)
	lt   uint8   // ports terminated in that factorisation (bit k: port k)
	wnd  []woundAt

	// The values the factorisation was built from, to tell when a
	// caller has changed one since.
	seenParts []Part
	seenCoils []coil.Geometry // per part: *Coil's value for a wound coil
	seenCpl   []Coupling
	seenPorts []Port
}

// NewSolver validates n and prepares its equations. n must not change
// shape afterwards (values may).
func NewSolver(n *Network) (*Solver, error) {
	if err := n.Validate(); err != nil {
		return nil, err
	}
	s := &Solver{net: n, nodes: len(n.Nodes)}
	s.internal = make([]int, len(n.Parts))
	s.partBr = make([]int, len(n.Parts))
	for i, p := range n.Parts {
		s.internal[i], s.partBr[i] = -1, -1
		switch p.Kind {
		case Inductor:
			s.partBr[i] = len(s.branches)
			s.branches = append(s.branches, branch{i, roleInductor, p.A, p.B})
		case Wound:
			s.partBr[i] = len(s.branches)
			if p.TapNode >= 0 {
				s.branches = append(s.branches, branch{i, roleTop, p.A, p.TapNode},
					branch{i, roleBottom, p.TapNode, p.B})
				continue
			}
			if p.Coil.LeadLength == 0 {
				// No leads: the winding joins the terminals directly.
				s.branches = append(s.branches, branch{i, roleWinding, p.A, p.B})
				s.internal[i] = p.A
				continue
			}
			x := s.nodes
			s.nodes++
			s.internal[i] = x
			s.branches = append(s.branches, branch{i, roleLeads, p.A, x}, branch{i, roleWinding, x, p.B})
		}
	}
	s.size = s.nodes - 1 + len(s.branches)
	s.a = make([]complex128, s.size*s.size)
	s.perm = make([]int, s.size)
	s.rhs = make([]complex128, s.size)
	s.x = make([]complex128, s.size)
	s.wnd = make([]woundAt, len(n.Parts))
	s.seenParts = make([]Part, len(n.Parts))
	s.seenCoils = make([]coil.Geometry, len(n.Parts))
	s.seenCpl = make([]Coupling, len(n.Couplings))
	s.seenPorts = make([]Port, len(n.Ports))
	return s, nil
}

// Network is the network the solver was made for.
func (s *Solver) Network() *Network { return s.net }

func (s *Solver) at(r, c int) *complex128 { return &s.a[r*s.size+c] }

// addY stamps an admittance between nodes i and j.
func (s *Solver) addY(i, j int, y complex128) {
	if i != Ground {
		*s.at(i-1, i-1) += y
	}
	if j != Ground {
		*s.at(j-1, j-1) += y
	}
	if i != Ground && j != Ground {
		*s.at(i-1, j-1) -= y
		*s.at(j-1, i-1) -= y
	}
}

// assemble builds and factors the equations at f, with the ports in
// term (bit k: port k) terminated in their reference impedance.
func (s *Solver) assemble(f float64, term uint8) error {
	if !(f > 0) || f > coil.MaxFrequency {
		return errorf("", "frequency must be above 0 and at most 10 GHz")
	}
	clear(s.a)
	w := omega(f)
	jw := complex(0, w)
	n := s.net
	for i := range n.Parts {
		p := &n.Parts[i]
		switch p.Kind {
		case Resistor:
			s.addY(p.A, p.B, complex(1/p.Value, 0))
		case Impedance:
			s.addY(p.A, p.B, 1/p.Z)
		case Capacitor:
			z := complex(p.SeriesR(), -1/(w*p.Value))
			s.addY(p.A, p.B, 1/z)
		case Wound:
			wa, err := p.woundAt(f)
			if err != nil {
				return err
			}
			s.wnd[i] = wa
			c := complex(0, w*float64(wa.m.SelfCapacitance))
			if p.TapNode >= 0 {
				s.addY(p.A, p.B, c)
			} else {
				s.addY(s.internal[i], p.B, c)
			}
		}
	}
	for k, pt := range n.Ports {
		if term&(1<<k) != 0 {
			s.addY(pt.Node, Ground, complex(1/pt.Z0, 0))
		}
	}
	nv := s.nodes - 1
	for bi, b := range s.branches {
		row := nv + bi
		// KCL: the branch current leaves p and enters q.
		if b.p != Ground {
			*s.at(b.p-1, row) += 1
		}
		if b.q != Ground {
			*s.at(b.q-1, row) -= 1
		}
		// Branch equation: V_p − V_q − Z·I − Σ jωM·I = 0.
		if b.p != Ground {
			*s.at(row, b.p-1) += 1
		}
		if b.q != Ground {
			*s.at(row, b.q-1) -= 1
		}
		p := &n.Parts[b.part]
		var z complex128
		switch b.role {
		case roleInductor:
			z = complex(p.SeriesR(), w*p.Value)
		case roleLeads:
			m := s.wnd[b.part].m
			z = complex(float64(m.RLeads), w*float64(m.LLeads))
		case roleWinding:
			m := s.wnd[b.part].m
			z = complex(float64(m.R), w*float64(m.L))
		case roleTop:
			wa := s.wnd[b.part]
			z = complex(wa.ra, w*wa.la)
			*s.at(row, row+1) -= jw * complex(wa.mm, 0)
		case roleBottom:
			wa := s.wnd[b.part]
			z = complex(wa.rb, w*wa.lb)
			*s.at(row, row-1) -= jw * complex(wa.mm, 0)
		}
		*s.at(row, row) -= z
	}
	for _, c := range n.Couplings {
		bp, bq := s.inductiveBranch(c.P), s.inductiveBranch(c.Q)
		lp, lq := s.branchL(bp), s.branchL(bq)
		m := jw * complex(c.K*math.Sqrt(lp*lq), 0)
		*s.at(nv+bp, nv+bq) -= m
		*s.at(nv+bq, nv+bp) -= m
	}
	s.lf = 0
	if err := s.factor(); err != nil {
		return err
	}
	s.lf, s.lt = f, term
	s.remember()
	return nil
}

// remember records the values the factorisation was built from.
func (s *Solver) remember() {
	n := s.net
	copy(s.seenParts, n.Parts)
	for i := range n.Parts {
		if n.Parts[i].Kind == Wound {
			s.seenCoils[i] = *n.Parts[i].Coil
		}
	}
	copy(s.seenCpl, n.Couplings)
	copy(s.seenPorts, n.Ports)
}

// unchanged reports whether every value is still the one the
// factorisation was built from.
func (s *Solver) unchanged() bool {
	n := s.net
	for i := range n.Parts {
		p := &n.Parts[i]
		if *p != s.seenParts[i] || p.Kind == Wound && *p.Coil != s.seenCoils[i] {
			return false
		}
	}
	return slices.Equal(n.Couplings, s.seenCpl) && slices.Equal(n.Ports, s.seenPorts)
}

// inductiveBranch is the branch that carries a part's coupled inductance:
// an inductor's own, a wound coil's winding.
func (s *Solver) inductiveBranch(part int) int {
	b := s.partBr[part]
	if s.branches[b].role == roleLeads {
		b++
	}
	return b
}

// branchL is a branch's inductance at the frequency last assembled.
func (s *Solver) branchL(b int) float64 {
	br := s.branches[b]
	p := &s.net.Parts[br.part]
	switch br.role {
	case roleInductor:
		return p.Value
	case roleLeads:
		return float64(s.wnd[br.part].m.LLeads)
	case roleWinding:
		return float64(s.wnd[br.part].m.L)
	case roleTop:
		return s.wnd[br.part].la
	}
	return s.wnd[br.part].lb
}

// factor is LU decomposition with partial pivoting, in place.
func (s *Solver) factor() error {
	n := s.size
	a := s.a
	scale := 0.0
	for _, v := range a {
		scale = math.Max(scale, cmplx.Abs(v))
	}
	for i := range s.perm {
		s.perm[i] = i
	}
	for k := 0; k < n; k++ {
		piv, best := k, cmplx.Abs(a[k*n+k])
		for i := k + 1; i < n; i++ {
			if v := cmplx.Abs(a[i*n+k]); v > best {
				piv, best = i, v
			}
		}
		if !(best > 1e-300) || best < 1e-15*scale*1e-12 {
			return ErrSingular
		}
		if piv != k {
			s.perm[k], s.perm[piv] = s.perm[piv], s.perm[k]
			for j := 0; j < n; j++ {
				a[k*n+j], a[piv*n+j] = a[piv*n+j], a[k*n+j]
			}
		}
		inv := 1 / a[k*n+k]
		for i := k + 1; i < n; i++ {
			m := a[i*n+k] * inv
			if m == 0 {
				continue
			}
			a[i*n+k] = m
			for j := k + 1; j < n; j++ {
				a[i*n+j] -= m * a[k*n+j]
			}
		}
	}
	return nil
}

// solveInto solves the factored system for the right-hand side b (by
// original row), overwriting x.
func (s *Solver) solveInto(b, x []complex128) {
	n := s.size
	a := s.a
	for i := 0; i < n; i++ {
		x[i] = b[s.perm[i]]
	}
	for i := 0; i < n; i++ {
		v := x[i]
		for j := 0; j < i; j++ {
			v -= a[i*n+j] * x[j]
		}
		x[i] = v
	}
	for i := n - 1; i >= 0; i-- {
		v := x[i]
		for j := i + 1; j < n; j++ {
			v -= a[i*n+j] * x[j]
		}
		x[i] = v / a[i*n+i]
	}
}

// State is the solution for one excitation: node voltages (index by
// node; ground is 0) and inductive branch currents, as peak phasors.
type State struct {
	Frequency float64
	V         []complex128
	branchI   []complex128
	solver    *Solver
}

// Solve returns the state at f with currents inj[k] (amperes, peak
// phasors) injected into port k's node and every port open.
func (s *Solver) Solve(f float64, inj []complex128) (State, error) {
	if err := s.ensure(f, 0); err != nil {
		return State{}, err
	}
	clear(s.rhs)
	for k, pt := range s.net.Ports {
		if k < len(inj) {
			s.rhs[pt.Node-1] += inj[k]
		}
	}
	return s.state(f), nil
}

// Drive returns the state at f with port 1 driven by a source of EMF emf
// (volts, peak) behind its reference impedance, and port 2, if any,
// terminated in its own: the network as it works.
func (s *Solver) Drive(f float64, emf complex128) (State, error) {
	if err := s.ensure(f, s.allPorts()); err != nil {
		return State{}, err
	}
	clear(s.rhs)
	pt := s.net.Ports[0]
	s.rhs[pt.Node-1] = emf / complex(pt.Z0, 0) // Norton equivalent
	return s.state(f), nil
}

func (s *Solver) allPorts() uint8 { return uint8(1<<len(s.net.Ports)) - 1 }

func (s *Solver) state(f float64) State {
	x := make([]complex128, s.size)
	s.solveInto(s.rhs, x)
	st := State{Frequency: f, V: make([]complex128, s.nodes), solver: s}
	copy(st.V[1:], x[:s.nodes-1])
	st.branchI = x[s.nodes-1:]
	return st
}

func (s *Solver) ensure(f float64, term uint8) error {
	if s.lf == f && s.lt == term && f > 0 && s.unchanged() {
		return nil
	}
	return s.assemble(f, term)
}

// PartVoltage is the voltage across part i, from A to B.
func (st State) PartVoltage(i int) complex128 {
	p := st.solver.net.Parts[i]
	return st.V[p.A] - st.V[p.B]
}

// PartCurrent is the current into part i at terminal A (for a tapped
// coil, into the hot end: the top section's current plus the
// self-capacitance's).
func (st State) PartCurrent(i int) complex128 {
	s := st.solver
	p := &s.net.Parts[i]
	w := omega(st.Frequency)
	v := st.V[p.A] - st.V[p.B]
	switch p.Kind {
	case Resistor:
		return v / complex(p.Value, 0)
	case Impedance:
		return v / p.Z
	case Capacitor:
		return v / complex(p.SeriesR(), -1/(w*p.Value))
	case Inductor:
		return st.branchI[s.partBr[i]]
	}
	b := s.partBr[i]
	c := complex(0, w*float64(s.wnd[i].m.SelfCapacitance))
	if p.TapNode >= 0 {
		return st.branchI[b] + c*v
	}
	if s.branches[b].role == roleWinding { // no leads
		return st.branchI[b] + c*v
	}
	return st.branchI[b] // the leads carry the whole current
}

// SectionCurrents is a wound coil's winding currents: for an untapped
// coil the winding's (without the self-capacitance's share) and zero; for
// a tapped coil the top and bottom sections'.
func (st State) SectionCurrents(i int) (top, bottom complex128) {
	s := st.solver
	b := s.partBr[i]
	if b < 0 || s.net.Parts[i].Kind != Wound {
		return 0, 0
	}
	if s.net.Parts[i].TapNode >= 0 {
		return st.branchI[b], st.branchI[b+1]
	}
	if s.branches[b].role == roleWinding {
		return st.branchI[b], 0
	}
	return st.branchI[b+1], 0
}

// PartLoss is the real power (W) dissipated in part i: ½·Re(V·I*) for
// peak phasors.
func (st State) PartLoss(i int) float64 {
	s := st.solver
	p := &s.net.Parts[i]
	if p.Kind != Wound {
		return 0.5 * real(st.PartVoltage(i)*cmplx.Conj(st.PartCurrent(i)))
	}
	wa := s.wnd[i]
	top, bot := st.SectionCurrents(i)
	sq := func(c complex128) float64 { return real(c)*real(c) + imag(c)*imag(c) }
	if p.TapNode >= 0 {
		return 0.5 * (wa.ra*sq(top) + wa.rb*sq(bot))
	}
	if s.branches[s.partBr[i]].role == roleWinding {
		return 0.5 * float64(wa.m.R) * sq(top)
	}
	lead := st.branchI[s.partBr[i]]
	return 0.5 * (float64(wa.m.RLeads)*sq(lead) + float64(wa.m.R)*sq(top))
}

// Response is what a network shows at its ports at one frequency.
type Response struct {
	Frequency float64
	Ports     int
	// Zin is the impedance at port 1 with port 2, if any, terminated in
	// its reference impedance.
	Zin complex128
	// S is the scattering matrix for the ports' reference impedances
	// (power waves; 1×1 in S[0][0] for one port).
	S [2][2]complex128
}

// Response solves the network at f. Each port is driven in turn by a unit
// current with the other port terminated, so no quantity is found by
// subtracting nearly equal numbers (an open-circuit Z matrix would be, for
// a network that is nearly open).
func (s *Solver) Response(f float64) (Response, error) {
	r := Response{Frequency: f, Ports: len(s.net.Ports)}
	np := r.Ports
	for k := 0; k < np; k++ {
		other := uint8(0)
		if np == 2 {
			other = 1 << (1 - k)
		}
		if err := s.ensure(f, other); err != nil {
			return Response{}, err
		}
		clear(s.rhs)
		pk := s.net.Ports[k]
		s.rhs[pk.Node-1] = 1
		s.solveInto(s.rhs, s.x)
		zk := s.x[pk.Node-1] // input impedance at port k
		z0 := complex(pk.Z0, 0)
		if k == 0 {
			r.Zin = zk
		}
		r.S[k][k] = (zk - z0) / (zk + z0)
		if np == 2 {
			j := 1 - k
			pj := s.net.Ports[j]
			// a_k = (Z_in + Z0k)/(2√Z0k) for a unit current; b_j = V_j/√Z0j.
			r.S[j][k] = 2 * s.x[pj.Node-1] * complex(math.Sqrt(pk.Z0/pj.Z0), 0) / (zk + z0)
		}
	}
	return r, nil
}
