package spec

import (
	"errors"
	"fmt"
	"io"
	"math"
	"math/cmplx"
	"path/filepath"
	"sort"

	"turnwise/coil"
	"turnwise/coil/circuit"
	"turnwise/forms"
	"turnwise/internal/quantity"
	"turnwise/sheets"

	"gonum.org/v1/gonum/unit"
)

// CircuitSettings is what to compute for a network.
type CircuitSettings struct {
	From, To float64 // 0: the default range
	Points   int
	Log      *bool // nil: log when the range spans more than a decade
	Bands    []circuit.Band
	At       []float64
	LO, IF   float64 // mixer products when both are set
	Signal   float64 // the wanted input; 0: LO ± IF, whichever passes better
}

// CircuitResult is everything `turnwise circuit` reports.
type CircuitResult struct {
	Title      string
	File       string
	Ports      int
	Resonances []circuit.Resonance
	Freqs      []float64
	Log        bool
	Sweep      []circuit.Response
	PeakGain   float64 // the reference for rejection: |S21| or |Z|
	PeakFreq   float64
	Fits       []circuit.BandFit
	Strays     []circuit.Stray
	Self       []circuit.SelfResonance
	Rejection  []RejectionRow
	Wanted     float64
	Products   []ProductRow
	Passband   *circuit.Passband
	Thermal    *CircuitDrift // the resonances' temperature drift; nil when not computed
	Warnings   []string
}

// TitleOrFile is the circuit's title, or its file's base name when it has
// none: the heading of the table, the Touchstone comment and the SPICE
// title line.
func (r *CircuitResult) TitleOrFile() string {
	if r.Title != "" {
		return r.Title
	}
	return filepath.Base(r.File)
}

// RejectionRow is the response at one --at frequency.
type RejectionRow struct {
	Frequency float64
	Z         complex128
	S21       float64 // |S21|, two ports
	DB        float64 // below the reference, positive
}

// ProductRow is one mixer product with its rejection.
type ProductRow struct {
	circuit.Product
	Relation string  // "2*LO - 1*f = IF"
	DB       float64 // below the wanted signal, positive
}

// DB is 20·log10 x, floored at −300 dB so no infinity reaches the output.
func DB(x float64) float64 { return 20 * math.Log10(math.Max(x, 1e-15)) }

// AnalyzeCircuit runs every computation the settings ask for.
func AnalyzeCircuit(m *CircuitModel, set CircuitSettings) (*CircuitResult, error) {
	s, err := circuit.NewSolver(m.Net)
	if err != nil {
		return nil, m.FileError(err)
	}
	r := &CircuitResult{Title: m.File.Title, File: m.File.File, Ports: len(m.Net.Ports)}
	fMax := 1e9
	if set.To > 0 {
		fMax = set.To
	}
	for _, b := range set.Bands {
		fMax = math.Max(fMax, b.High*(1+circuit.StrayMargin))
	}
	fMax = math.Min(fMax, coil.MaxFrequency)
	r.Resonances, err = s.Resonances(fMax)
	if err != nil {
		return nil, err
	}
	from, to := circuit.DefaultRange(r.Resonances)
	if set.From > 0 {
		from = set.From
	}
	if set.To > 0 {
		to = set.To
	}
	if !(to > from) {
		return nil, Usagef("--from %s is not below --to %s; give a range low to high", quantity.FormatFrequency(from), quantity.FormatFrequency(to))
	}
	r.Log = to/from > 10
	if set.Log != nil {
		r.Log = *set.Log
	}
	r.Freqs, err = circuit.Frequencies(from, to, set.Points, r.Log)
	if err != nil {
		return nil, Usagef("--points: %v", err)
	}
	r.Sweep, err = s.Sweep(r.Freqs)
	if err != nil {
		return nil, err
	}
	// The reference for rejection: the passband peak.
	for _, resp := range r.Sweep {
		if g := resp.Gain(); g > r.PeakGain {
			r.PeakGain, r.PeakFreq = g, resp.Frequency
		}
	}
	for _, res := range r.Resonances {
		if res.Frequency < from || res.Frequency > to || (r.Ports == 1 && res.Kind != circuit.Parallel) {
			continue
		}
		if g, err := s.GainAt(res.Frequency); err == nil && g > r.PeakGain {
			r.PeakGain, r.PeakFreq = g, res.Frequency
		}
	}
	if r.Ports == 2 {
		pb, err := s.FindPassband(r.Freqs)
		if err != nil {
			return nil, err
		}
		r.Passband = &pb
		if g := math.Pow(10, pb.PeakDB/20); g > r.PeakGain {
			r.PeakGain, r.PeakFreq = g, pb.Peak
		}
	}
	floating := make([]bool, len(m.Net.Parts))
	for i, mt := range m.Mounting {
		floating[i] = mt == "floating"
	}
	r.Self, err = s.SelfResonances(floating)
	if err != nil {
		return nil, m.FileError(err)
	}
	for i := range set.Bands {
		if set.Bands[i].Name == "" {
			set.Bands[i].Name = BandRange(set.Bands[i])
		}
	}
	r.Fits, r.Strays = circuit.FitBands(set.Bands, r.Resonances, r.Self)
	for _, f := range r.Fits {
		if f.Resonance < 0 {
			r.Warnings = append(r.Warnings, fmt.Sprintf("band %s (%s): no resonance within 10 %% of it", CircuitBandName(f.Band), BandRange(f.Band)))
		} else if !f.Inside {
			r.Warnings = append(r.Warnings, fmt.Sprintf("band %s: the nearest resonance, %s, is outside the band (%+.1f %% from its centre)", CircuitBandName(f.Band), quantity.FormatFrequency(f.Frequency), f.Offset*100))
		}
	}
	for _, st := range r.Strays {
		where := "within 10 % of"
		if st.Inside {
			where = "inside"
		}
		if st.Self {
			mount := "one end grounded"
			if floating[m.PartIndex(st.Part)] {
				mount = "floating"
			}
			r.Warnings = append(r.Warnings, fmt.Sprintf("coil %s: its own self-resonance (%s to %s, %s) lies %s band %s", st.Part,
				quantity.FormatFrequency(st.Low), quantity.FormatFrequency(st.High), mount, where, st.Band))
		} else {
			r.Warnings = append(r.Warnings, fmt.Sprintf("stray resonance at %s %s band %s, caused by %s", quantity.FormatFrequency(st.Frequency), where, st.Band, st.Part))
		}
	}
	ref := r.PeakGain
	for _, f := range set.At {
		resp, err := s.Response(f)
		if err != nil {
			return nil, &FlagError{Flag: "at", Err: err}
		}
		row := RejectionRow{Frequency: f, Z: resp.Zin, DB: DB(ref) - DB(resp.Gain())}
		if r.Ports == 2 {
			row.S21 = cmplx.Abs(resp.S[1][0])
		}
		r.Rejection = append(r.Rejection, row)
	}
	if set.LO > 0 || set.IF > 0 {
		if err := r.mixer(s, set); err != nil {
			return nil, err
		}
	}
	return r, nil
}

func (r *CircuitResult) mixer(s *circuit.Solver, set CircuitSettings) error {
	if !(set.LO > 0 && set.IF > 0) {
		return Usagef("--lo and --if go together: give both, e.g. --lo 116MHz --if 29MHz")
	}
	cands := []float64{set.LO + set.IF}
	if d := math.Abs(set.LO - set.IF); d > 0 {
		cands = append(cands, d)
	}
	wanted := set.Signal
	if wanted == 0 {
		best := -1.0
		for _, f := range cands {
			g, err := s.GainAt(f)
			if err != nil {
				return &FlagError{Flag: "lo", Err: err}
			}
			if g > best {
				best, wanted = g, f
			}
		}
	} else if math.Abs(wanted-cands[0]) > 1e-9*wanted && (len(cands) < 2 || math.Abs(wanted-cands[1]) > 1e-9*wanted) {
		return Usagef("--signal %s is neither LO + IF nor |LO - IF|; give the frequency the converter is for", quantity.FormatFrequency(wanted))
	}
	ps, err := circuit.Products(set.LO, set.IF, wanted, coil.MaxFrequency)
	if err != nil {
		return Usagef("--lo/--if: %v", err)
	}
	gw, err := s.GainAt(wanted)
	if err != nil {
		return err
	}
	r.Wanted = wanted
	for _, p := range ps {
		g, err := s.GainAt(p.Frequency)
		if err != nil {
			return err
		}
		rel := fmt.Sprintf("%d*f - %d*LO = IF", p.N, p.M)
		switch {
		case p.Sum:
			rel = fmt.Sprintf("%d*LO + %d*f = IF", p.M, p.N)
		case float64(p.M)*set.LO > float64(p.N)*p.Frequency:
			rel = fmt.Sprintf("%d*LO - %d*f = IF", p.M, p.N)
		}
		r.Products = append(r.Products, ProductRow{Product: p, Relation: rel, DB: DB(gw) - DB(g)})
	}
	return nil
}

// CircuitBandName is the band's name, or its range when it has none.
func CircuitBandName(b circuit.Band) string {
	if b.Name != "" {
		return b.Name
	}
	return BandRange(b)
}

// BandRange prints a band as LOW-HIGH.
func BandRange(b circuit.Band) string {
	return quantity.FormatFrequency(b.Low) + "-" + quantity.FormatFrequency(b.High)
}

// SheetCircuit returns the result as the build sheet and the plot draw it.
func (r *CircuitResult) SheetCircuit() *sheets.Circuit {
	c := &sheets.Circuit{Title: r.Title, Source: r.File, TwoPort: r.Ports == 2, Freqs: r.Freqs, LogX: r.Log, Warnings: r.Warnings}
	if c.Title == "" {
		c.Title = r.File
	}
	for _, resp := range r.Sweep {
		if c.TwoPort {
			c.Values = append(c.Values, DB(cmplx.Abs(resp.S[1][0])))
		} else {
			c.Values = append(c.Values, math.Max(cmplx.Abs(resp.Zin), 1e-9))
		}
	}
	for _, res := range r.Resonances {
		c.Resonances = append(c.Resonances, sheets.CircuitResonance{Frequency: res.Frequency, Kind: res.Kind.String(),
			Q: res.Q, Impedance: cmplx.Abs(res.Impedance), Part: res.Part})
	}
	for _, f := range r.Fits {
		c.Bands = append(c.Bands, sheets.CircuitBand{Name: f.Name, Low: f.Low, High: f.High, Serving: f.Frequency, Offset: f.Offset})
	}
	sort.SliceStable(c.Bands, func(i, j int) bool { return c.Bands[i].Low < c.Bands[j].Low })
	return c
}

// JobCircuitPage computes a circuit named in a job file (its path relative
// to the job file) for the build sheet, with the circuit file's own bands.
func JobCircuitPage(job *forms.Job, path, stockPath, use string, stockGiven bool) (*sheets.Circuit, error) {
	full := JobPath(job, path)
	c, err := LoadCircuitFile(full)
	if err != nil {
		var ue *UsageError
		if errors.As(err, &ue) {
			return nil, &forms.ParseError{Kind: "job", File: job.File, Line: job.KeyLine("circuit"), Field: "circuit",
				Err: fmt.Errorf("%q (read as %s) does not exist; the path is relative to the job file", path, full)}
		}
		return nil, err
	}
	cat, err := JobCatalog(job, stockPath, use, stockGiven)
	if err != nil {
		return nil, err
	}
	m, err := BuildCircuit(c, cat, stockPath, use, stockGiven)
	if err != nil {
		return nil, err
	}
	r, err := AnalyzeCircuit(m, CircuitSettings{Points: 401, Bands: FileBands(c)})
	if err != nil {
		return nil, err
	}
	page := r.SheetCircuit()
	page.Source = filepath.Base(c.File)
	return page, nil
}

// FileBands are a circuit file's own bands.
func FileBands(c *forms.Circuit) []circuit.Band {
	var out []circuit.Band
	for _, b := range c.Bands {
		out = append(out, circuit.Band{Name: b.Name, Low: float64(b.Low), High: float64(b.High)})
	}
	return out
}

// SpiceNetlist returns the writer of the circuit's SPICE netlist over r's
// sweep, its AC source at atFreq (nil: the sweep's geometric centre).
func (m *CircuitModel) SpiceNetlist(r *CircuitResult, atFreq *unit.Frequency) (func(io.Writer) error, error) {
	at := math.Sqrt(r.Freqs[0] * r.Freqs[len(r.Freqs)-1])
	if atFreq != nil {
		at = float64(*atFreq)
	}
	s, err := circuit.NewSolver(m.Net)
	if err != nil {
		return nil, m.FileError(err)
	}
	return func(w io.Writer) error {
		return s.WriteSpice(w, circuit.SpiceOptions{Title: "* " + r.TitleOrFile(), At: at,
			From: r.Freqs[0], To: r.Freqs[len(r.Freqs)-1], Points: len(r.Freqs), Log: r.Log})
	}, nil
}
