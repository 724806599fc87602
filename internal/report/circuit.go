package report

import (
	"fmt"
	"io"
	"math/cmplx"
	"text/tabwriter"

	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

// The table and JSON writers for `turnwise circuit`.

type circuitJSON struct {
	Title      string                 `json:"title,omitempty"`
	File       string                 `json:"file"`
	Ports      int                    `json:"ports"`
	Resonances []circuitResonanceJSON `json:"resonances"`
	Sweep      []circuitSweepJSON     `json:"sweep"`
	Bands      []circuitBandJSON      `json:"bands"`
	SelfRes    []circuitSelfResJSON   `json:"self_resonances"`
	Rejection  []circuitRejectionJSON `json:"rejection"`
	Wanted     float64                `json:"wanted,omitempty"`
	Products   []circuitProductJSON   `json:"products"`
	Passband   *circuitPassbandJSON   `json:"passband,omitempty"`
	Reference  float64                `json:"reference_frequency"`
	Warnings   []string               `json:"warnings"`
}

type circuitResonanceJSON struct {
	Frequency float64 `json:"frequency"`
	Kind      string  `json:"kind"`
	Q         float64 `json:"q"`
	Impedance float64 `json:"impedance"`
	ZRe       float64 `json:"z_re"`
	ZIm       float64 `json:"z_im"`
	Natural   float64 `json:"natural"`
	Part      string  `json:"part"`
	Distinct  bool    `json:"distinct"`
	// Temperature (internal/report): drift per kelvin, and the split
	// --compensate proposes.
	Drift        *DriftRecord        `json:"drift,omitempty"`
	Compensation *CompensationRecord `json:"compensation,omitempty"`
}

type circuitSweepJSON struct {
	Frequency float64  `json:"frequency"`
	ZRe       float64  `json:"z_re"`
	ZIm       float64  `json:"z_im"`
	S21DB     *float64 `json:"s21_db,omitempty"`
	S11DB     *float64 `json:"s11_db,omitempty"`
}

type circuitBandJSON struct {
	Name      string             `json:"name"`
	Low       float64            `json:"low"`
	High      float64            `json:"high"`
	Resonance float64            `json:"resonance"` // 0 when none serves it
	Offset    float64            `json:"offset"`    // fraction of the centre
	Inside    bool               `json:"inside"`
	Strays    []circuitStrayJSON `json:"strays"`
}

type circuitStrayJSON struct {
	Part      string  `json:"part"`
	Frequency float64 `json:"frequency"`
	Low       float64 `json:"low"`
	High      float64 `json:"high"`
	Self      bool    `json:"self_resonance"`
	Inside    bool    `json:"inside"`
}

type circuitSelfResJSON struct {
	Part     string  `json:"part"`
	Low      float64 `json:"low"`
	High     float64 `json:"high"`
	Floating bool    `json:"floating"`
}

type circuitRejectionJSON struct {
	Frequency float64  `json:"frequency"`
	DB        float64  `json:"db"`
	ZRe       float64  `json:"z_re"`
	ZIm       float64  `json:"z_im"`
	S21DB     *float64 `json:"s21_db,omitempty"`
}

type circuitProductJSON struct {
	Frequency float64 `json:"frequency"`
	M         int     `json:"m"`
	N         int     `json:"n"`
	Relation  string  `json:"relation"`
	Image     bool    `json:"image"`
	Wanted    bool    `json:"wanted"`
	DB        float64 `json:"db"`
}

type circuitPassbandJSON struct {
	Peak          float64 `json:"peak"`
	InsertionLoss float64 `json:"insertion_loss_db"`
	Low           float64 `json:"low"`
	High          float64 `json:"high"`
}

// WriteCircuitJSON writes the result as `turnwise circuit --json` prints
// it (SI units).
func WriteCircuitJSON(w io.Writer, r *spec.CircuitResult) error {
	out := circuitJSON{Title: r.Title, File: r.File, Ports: r.Ports, Reference: r.PeakFreq, Wanted: r.Wanted,
		Resonances: []circuitResonanceJSON{}, Sweep: []circuitSweepJSON{}, Bands: []circuitBandJSON{}, SelfRes: []circuitSelfResJSON{},
		Rejection: []circuitRejectionJSON{}, Products: []circuitProductJSON{}, Warnings: []string{}}
	for j, res := range r.Resonances {
		dr, comp := CircuitResonanceThermal(r.Thermal, j)
		out.Resonances = append(out.Resonances, circuitResonanceJSON{Frequency: res.Frequency, Kind: res.Kind.String(), Q: res.Q,
			Impedance: cmplx.Abs(res.Impedance), ZRe: real(res.Impedance), ZIm: imag(res.Impedance),
			Natural: res.Natural, Part: res.Part, Distinct: res.Distinct, Drift: dr, Compensation: comp})
	}
	for _, resp := range r.Sweep {
		p := circuitSweepJSON{Frequency: resp.Frequency, ZRe: real(resp.Zin), ZIm: imag(resp.Zin)}
		if r.Ports == 2 {
			s21, s11 := spec.DB(cmplx.Abs(resp.S[1][0])), spec.DB(cmplx.Abs(resp.S[0][0]))
			p.S21DB, p.S11DB = &s21, &s11
		}
		out.Sweep = append(out.Sweep, p)
	}
	for _, f := range r.Fits {
		b := circuitBandJSON{Name: f.Name, Low: f.Low, High: f.High, Resonance: f.Frequency, Offset: f.Offset, Inside: f.Inside, Strays: []circuitStrayJSON{}}
		for _, st := range r.Strays {
			if st.Band == f.Name {
				b.Strays = append(b.Strays, circuitStrayJSON{Part: st.Part, Frequency: st.Frequency, Low: st.Low, High: st.High, Self: st.Self, Inside: st.Inside})
			}
		}
		out.Bands = append(out.Bands, b)
	}
	for _, s := range r.Self {
		out.SelfRes = append(out.SelfRes, circuitSelfResJSON{Part: s.Part, Low: s.Low, High: s.High, Floating: s.Floating})
	}
	for _, rj := range r.Rejection {
		row := circuitRejectionJSON{Frequency: rj.Frequency, DB: rj.DB, ZRe: real(rj.Z), ZIm: imag(rj.Z)}
		if r.Ports == 2 {
			v := spec.DB(rj.S21)
			row.S21DB = &v
		}
		out.Rejection = append(out.Rejection, row)
	}
	for _, p := range r.Products {
		out.Products = append(out.Products, circuitProductJSON{Frequency: p.Frequency, M: p.M, N: p.N, Relation: p.Relation,
			Image: p.Image, Wanted: p.Wanted, DB: p.DB})
	}
	if pb := r.Passband; pb != nil {
		out.Passband = &circuitPassbandJSON{Peak: pb.Peak, InsertionLoss: -pb.PeakDB, Low: pb.Low, High: pb.High}
	}
	out.Warnings = append(out.Warnings, r.Warnings...)
	return writeJSON(w, out)
}

// WriteCircuitTable writes the result as tables.
func WriteCircuitTable(w io.Writer, r *spec.CircuitResult) error {
	fz := func(v float64) string { return quantity.FormatEng(v, "ohm", 4) }
	hzs := quantity.FormatFrequency
	fmt.Fprintf(w, "%s\n", r.TitleOrFile())
	fmt.Fprintf(w, "%d port(s); sweep %s to %s, %d points (%s)\n\n", r.Ports, hzs(r.Freqs[0]), hzs(r.Freqs[len(r.Freqs)-1]), len(r.Freqs),
		map[bool]string{true: "log", false: "linear"}[r.Log])
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "RESONANCE\tKIND\tQ\t|Z| AT PORT 1\tPART")
	for _, res := range r.Resonances {
		q := "-"
		if res.Q > 0 {
			q = fmt.Sprintf("%.4g", res.Q)
		}
		fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\n", hzs(res.Frequency), res.Kind, q, fz(cmplx.Abs(res.Impedance)), res.Part)
	}
	tw.Flush()
	freqs := make([]float64, len(r.Resonances))
	for j, res := range r.Resonances {
		freqs[j] = res.Frequency
	}
	if err := WriteCircuitDrift(w, r.Thermal, freqs); err != nil {
		return err
	}
	if len(r.Self) > 0 {
		fmt.Fprintln(w)
		tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "COIL\tOWN SELF-RESONANCE\tMOUNTING")
		for _, s := range r.Self {
			fmt.Fprintf(tw, "%s\t%s to %s\t%s\n", s.Part, hzs(s.Low), hzs(s.High), map[bool]string{true: "floating", false: "one end grounded"}[s.Floating])
		}
		tw.Flush()
	}
	if len(r.Fits) > 0 {
		fmt.Fprintln(w)
		tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "BAND\tRANGE\tSERVED BY\tOFF CENTRE")
		for _, f := range r.Fits {
			by, off := "none", "-"
			if f.Resonance >= 0 {
				by, off = hzs(f.Frequency), fmt.Sprintf("%+.2f %%", f.Offset*100)
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\n", spec.CircuitBandName(f.Band), spec.BandRange(f.Band), by, off)
		}
		tw.Flush()
	}
	if pb := r.Passband; pb != nil {
		fmt.Fprintf(w, "\nPassband: peak %s, insertion loss %.2f dB, -3 dB from %s to %s\n", hzs(pb.Peak), -pb.PeakDB, orDash(pb.Low), orDash(pb.High))
	}
	if len(r.Rejection) > 0 {
		fmt.Fprintln(w)
		tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "AT\t|Z| AT PORT 1\t|S21|\tREJECTION")
		for _, rj := range r.Rejection {
			s21 := "-"
			if r.Ports == 2 {
				s21 = fmt.Sprintf("%.2f dB", spec.DB(rj.S21))
			}
			fmt.Fprintf(tw, "%s\t%s\t%s\t%.2f dB\n", hzs(rj.Frequency), fz(cmplx.Abs(rj.Z)), s21, rj.DB)
		}
		tw.Flush()
		fmt.Fprintf(w, "(rejection below the peak at %s)\n", hzs(r.PeakFreq))
	}
	if len(r.Products) > 0 {
		fmt.Fprintf(w, "\nMixer products (wanted signal %s):\n", hzs(r.Wanted))
		tw = tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
		fmt.Fprintln(tw, "INPUT\tMIXES BY\tREJECTION\t")
		for _, p := range r.Products {
			note := ""
			switch {
			case p.Wanted:
				note = "wanted"
			case p.Image:
				note = "IMAGE"
			}
			fmt.Fprintf(tw, "%s\t%s\t%.2f dB\t%s\n", hzs(p.Frequency), p.Relation, p.DB, note)
		}
		tw.Flush()
	}
	if len(r.Warnings) > 0 {
		fmt.Fprintln(w)
		for _, s := range r.Warnings {
			fmt.Fprintf(w, "warning: %s\n", s)
		}
	}
	return nil
}

// orDash prints a passband edge, or says it lies beyond the sweep.
func orDash(f float64) string {
	if f > 0 {
		return quantity.FormatFrequency(f)
	}
	return "beyond the sweep"
}
