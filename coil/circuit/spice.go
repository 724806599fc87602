package circuit

import (
	"bufio"
	"fmt"
	"io"
	"math"
	"strings"
	"unicode"
)

// SpiceOptions shape a netlist.
type SpiceOptions struct {
	Title string
	// At is the frequency each wound coil's equivalent is taken at (Hz).
	At float64
	// The .ac card: Points from From to To, linear or (Log) per decade.
	From, To float64
	Points   int
	Log      bool
}

// WriteSpice writes the network as a SPICE netlist for an AC analysis
// (ngspice reads it): every part by value, each wound coil as its
// equivalent at o.At (leads and winding L and R in series, the
// self-capacitance across the winding; a tapped coil as two coupled
// sections), couplings as K cards, and the ports as sources: one port is
// driven by a 1 A AC current (V at the port is Z), two ports by a 2 V EMF
// behind port 1's reference resistance with port 2 terminated in its own
// (then S11 = V(port 1) − 1 and S21 = V(port 2)·√(Z01/Z02)).
func (s *Solver) WriteSpice(w io.Writer, o SpiceOptions) error {
	if !(o.At > 0) {
		return errorf("", "the netlist needs the frequency the coils' equivalents are taken at")
	}
	bw := bufio.NewWriter(w)
	n := s.net
	title := strings.TrimSpace(strings.ReplaceAll(o.Title, "\n", " "))
	if title == "" {
		title = "turnwise circuit"
	}
	fmt.Fprintf(bw, "%s\n", title)
	fmt.Fprintf(bw, "* Written by turnwise. Units: ohm, F, H, Hz.\n")
	names := newSpiceNames()
	node := make([]string, len(n.Nodes))
	node[Ground] = "0"
	for i := 1; i < len(n.Nodes); i++ {
		node[i] = names.unique("", n.Nodes[i])
	}
	num := func(v float64) string { return fmt.Sprintf("%.15g", v) }
	inductorName := make([]string, len(n.Parts)) // the L card a coupling refers to
	for i := range n.Parts {
		p := &n.Parts[i]
		a, b := node[p.A], node[p.B]
		fmt.Fprintf(bw, "* %s %q: %s to %s\n", p.Kind, p.Name, n.Nodes[p.A], n.Nodes[p.B])
		switch p.Kind {
		case Resistor:
			fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("R", p.Name), a, b, num(p.Value))
		case Impedance:
			// R + jX at every frequency has no SPICE element; written as
			// its value at o.At.
			x := imag(p.Z)
			mid := names.unique("", p.Name+"_x")
			fmt.Fprintf(bw, "* fixed impedance written as its equivalent at %s Hz\n", num(o.At))
			fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("R", p.Name), a, mid, num(math.Max(real(p.Z), 1e-12)))
			switch {
			case x > 0:
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("L", p.Name), mid, b, num(x/omega(o.At)))
			case x < 0:
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("C", p.Name), mid, b, num(-1/(x*omega(o.At))))
			default:
				fmt.Fprintf(bw, "%s %s %s 0\n", names.unique("V", p.Name), mid, b)
			}
		case Capacitor, Inductor:
			letter := "C"
			if p.Kind == Inductor {
				letter = "L"
			}
			el := names.unique(letter, p.Name)
			if p.Kind == Inductor {
				inductorName[i] = el
			}
			if r := p.SeriesR(); r > 0 {
				mid := names.unique("", p.Name+"_esr")
				fmt.Fprintf(bw, "%s %s %s %s\n", el, a, mid, num(p.Value))
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("R", p.Name+"_esr"), mid, b, num(r))
			} else {
				fmt.Fprintf(bw, "%s %s %s %s\n", el, a, b, num(p.Value))
			}
		case Wound:
			e, err := s.Equivalent(i, o.At)
			if err != nil {
				return err
			}
			fmt.Fprintf(bw, "* wound coil written as its equivalent at %s Hz (L, series R, parallel C): L = %s H, R = %s ohm, C = %s F at the terminals\n",
				num(o.At), num(e.L), num(e.R), num(e.C))
			if e.Tapped {
				t := node[p.TapNode]
				la, lb := names.unique("L", p.Name+"_top"), names.unique("L", p.Name+"_bottom")
				m1, m2 := names.unique("", p.Name+"_top"), names.unique("", p.Name+"_bottom")
				fmt.Fprintf(bw, "%s %s %s %s\n", la, a, m1, num(e.LA))
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("R", p.Name+"_top"), m1, t, num(math.Max(e.RA, 1e-12)))
				fmt.Fprintf(bw, "%s %s %s %s\n", lb, t, m2, num(e.LB))
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("R", p.Name+"_bottom"), m2, b, num(math.Max(e.RB, 1e-12)))
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("K", p.Name+"_tap"), la, lb, num(e.M/math.Sqrt(e.LA*e.LB)))
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("C", p.Name+"_self"), a, b, num(e.C))
				continue
			}
			in := a
			if e.LeadL > 0 {
				in = names.unique("", p.Name+"_leads")
				mid := names.unique("", p.Name+"_leads_r")
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("L", p.Name+"_leads"), a, mid, num(e.LeadL))
				fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("R", p.Name+"_leads"), mid, in, num(math.Max(e.LeadR, 1e-12)))
			}
			mid := names.unique("", p.Name+"_r")
			el := names.unique("L", p.Name)
			inductorName[i] = el
			fmt.Fprintf(bw, "%s %s %s %s\n", el, in, mid, num(e.WindingL))
			fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("R", p.Name), mid, b, num(math.Max(e.WindingR, 1e-12)))
			fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("C", p.Name+"_self"), in, b, num(e.C))
		}
	}
	for _, c := range n.Couplings {
		fmt.Fprintf(bw, "* coupling %q\n", c.Name)
		fmt.Fprintf(bw, "%s %s %s %s\n", names.unique("K", c.Name), inductorName[c.P], inductorName[c.Q], num(c.K))
	}
	p1 := n.Ports[0]
	if len(n.Ports) == 1 {
		fmt.Fprintf(bw, "* port 1 at %s: a 1 A AC current, so V(%s) is the impedance Z\n", n.Nodes[p1.Node], node[p1.Node])
		fmt.Fprintf(bw, "Iport1 0 %s AC 1\n", node[p1.Node])
	} else {
		p2 := n.Ports[1]
		src := names.unique("", "port1_source")
		fmt.Fprintf(bw, "* port 1 at %s: 2 V EMF behind %s ohm, so S11 = V(%s) - 1\n", n.Nodes[p1.Node], num(p1.Z0), node[p1.Node])
		fmt.Fprintf(bw, "Vport1 %s 0 AC 2\n", src)
		fmt.Fprintf(bw, "Rport1 %s %s %s\n", src, node[p1.Node], num(p1.Z0))
		fmt.Fprintf(bw, "* port 2 at %s: terminated in %s ohm, so S21 = V(%s) * sqrt(%s/%s)\n",
			n.Nodes[p2.Node], num(p2.Z0), node[p2.Node], num(p1.Z0), num(p2.Z0))
		fmt.Fprintf(bw, "Rport2 %s 0 %s\n", node[p2.Node], num(p2.Z0))
	}
	if o.Points >= 2 && o.From > 0 && o.To > o.From {
		if o.Log {
			perDecade := int(math.Ceil(float64(o.Points-1) / math.Log10(o.To/o.From)))
			fmt.Fprintf(bw, ".ac dec %d %s %s\n", max(perDecade, 1), num(o.From), num(o.To))
		} else {
			fmt.Fprintf(bw, ".ac lin %d %s %s\n", o.Points, num(o.From), num(o.To))
		}
	}
	fmt.Fprintf(bw, ".end\n")
	return bw.Flush()
}

// spiceNames makes element and node names SPICE reads: letters, digits
// and underscores, unique without regard to case.
type spiceNames map[string]bool

func newSpiceNames() spiceNames { return spiceNames{"0": true} }

func (u spiceNames) unique(letter, name string) string {
	var b strings.Builder
	b.WriteString(letter)
	for _, r := range name {
		if r < unicode.MaxASCII && (unicode.IsLetter(r) || unicode.IsDigit(r)) {
			b.WriteRune(r)
		} else {
			b.WriteByte('_')
		}
	}
	base := b.String()
	if letter == "" {
		base = "n_" + base
	} else if len(base) == 1 {
		base += "_"
	}
	out := base
	for i := 2; u[strings.ToLower(out)]; i++ {
		out = fmt.Sprintf("%s_%d", base, i)
	}
	u[strings.ToLower(out)] = true
	return out
}
