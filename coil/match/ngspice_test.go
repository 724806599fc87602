package match

import (
	"context"
	"fmt"
	"math"
	"math/cmplx"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"turnwise/coil/circuit"
	"turnwise/internal/testtools"
)

// spiceNetlist writes the lumped network at f (the wound coil as its
// coupled sections and self-capacitance, the settings in place) with the
// load as a resistor and a reactance, driven by 1 V AC behind 50 Ω.
func spiceNetlist(ln *lumped, f, r, x float64, out string) string {
	var b strings.Builder
	node := func(i int) string {
		if i == circuit.Ground {
			return "0"
		}
		return fmt.Sprintf("n%d", i)
	}
	fmt.Fprintf(&b, "* turnwise match cross-check\n")
	extra := 0
	inner := func() string { extra++; return fmt.Sprintf("x%d", extra) }
	for i, p := range ln.net.Parts {
		if i == ln.load {
			continue
		}
		rs := p.SeriesR()
		a, bb := node(p.A), node(p.B)
		switch p.Kind {
		case circuit.Capacitor:
			if rs > 0 {
				m := inner()
				fmt.Fprintf(&b, "RS%d %s %s %.15g\n", i, a, m, rs)
				a = m
			}
			fmt.Fprintf(&b, "C%d %s %s %.15g\n", i, a, bb, p.Value)
		case circuit.Inductor:
			if rs > 0 {
				m := inner()
				fmt.Fprintf(&b, "RS%d %s %s %.15g\n", i, a, m, rs)
				a = m
			}
			fmt.Fprintf(&b, "L%d %s %s %.15g\n", i, a, bb, p.Value)
		case circuit.Resistor:
			fmt.Fprintf(&b, "R%d %s %s %.15g\n", i, a, bb, p.Value)
		}
	}
	for k, c := range ln.net.Couplings {
		fmt.Fprintf(&b, "K%d L%d L%d %.15g\n", k, c.P, c.Q, c.K)
	}
	w := 2 * math.Pi * f
	lp := ln.net.Parts[ln.load]
	m := inner()
	fmt.Fprintf(&b, "RL %s %s %.15g\n", node(lp.A), m, r)
	if x > 0 {
		fmt.Fprintf(&b, "LX %s 0 %.15g\n", m, x/w)
	} else {
		fmt.Fprintf(&b, "CX %s 0 %.15g\n", m, -1/(w*x))
	}
	port := node(ln.net.Ports[0].Node)
	fmt.Fprintf(&b, "VS src 0 DC 0 AC 1\nRSRC src %s %.15g\n", port, ln.net.Ports[0].Z0)
	fmt.Fprintf(&b, ".control\nset wr_singlescale\nset numdgt=12\nac lin 1 %.15g %.15g\nwrdata %s vr(%s) vi(%s)\nquit 0\n.endc\n.end\n", f, f, out, port, port)
	return b.String()
}

// A few matched points of the demo coupler, their settings in an ngspice
// AC analysis of the same lumped network: the input impedance, and so the
// SWR, agree with the map.
func TestMatchesAgainstNgspice(t *testing.T) {
	ngspice := testtools.Need(t, "ngspice", "ngspice")
	s := tappedCoupler(8)
	p, err := s.prepare()
	if err != nil {
		t.Fatal(err)
	}
	checked := 0
	for _, f := range []float64{3.6e6, 14.2e6} {
		r, err := Map(context.Background(), s, Options{Frequencies: []float64{f}})
		if err != nil {
			t.Fatal(err)
		}
		e, err := newEngine(p, f)
		if err != nil {
			t.Fatal(err)
		}
		n := 0
		for _, pt := range r.Frequencies[0].Points {
			if !pt.Matched || n >= 3 {
				continue
			}
			n++
			for k, st := range pt.Settings {
				e.ln.net.Parts[e.adj[k]].Value = st.Capacitance
			}
			dir := t.TempDir()
			out := filepath.Join(dir, "v.txt")
			cir := filepath.Join(dir, "m.cir")
			if err := os.WriteFile(cir, []byte(spiceNetlist(e.ln, f, pt.LoadR, pt.LoadX, out)), 0o644); err != nil {
				t.Fatal(err)
			}
			ctx, cancel := context.WithTimeout(context.Background(), time.Minute)
			log, err := exec.CommandContext(ctx, ngspice, "-b", cir).CombinedOutput()
			cancel()
			if err != nil {
				t.Fatalf("ngspice: %v\n%s", err, log)
			}
			data, err := os.ReadFile(out)
			if err != nil {
				t.Fatalf("no data: %v\n%s", err, log)
			}
			fields := strings.Fields(string(data))
			if len(fields) < 3 {
				t.Fatalf("data %q", data)
			}
			vr, _ := strconv.ParseFloat(fields[1], 64)
			vi, _ := strconv.ParseFloat(fields[2], 64)
			v := complex(vr, vi)
			zin := v / ((1 - v) / 50)
			g := cmplx.Abs((zin - 50) / (zin + 50))
			got := (1 + g) / (1 - g)
			t.Logf("%g Hz load %.4g%+.4gj: SWR map %.6f, ngspice %.6f", f, pt.LoadR, pt.LoadX, pt.SWR, got)
			if math.Abs(got-pt.SWR) > 1e-3 || got > DefaultSWR {
				t.Errorf("%g Hz load %g%+gj: SWR map %g, ngspice %g", f, pt.LoadR, pt.LoadX, pt.SWR, got)
			}
			checked++
		}
	}
	if checked < 4 {
		t.Fatalf("only %d points checked", checked)
	}
}
