package spec

import (
	"context"
	"errors"
	"fmt"
	"os"
	"sort"
	"strings"

	"turnwise/coil"
	"turnwise/coil/circuit"
	"turnwise/coil/match"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

// MatchFlags are the command-line choices of `turnwise match` as typed:
// frequencies, bands, the load grid, the SWR and the power.
type MatchFlags struct {
	Freqs     []string
	Bands     []string
	BandsFile string
	LoadR     string
	LoadX     string
	RSteps    int
	XSteps    int
	SWR       float64
	Power     float64
	PowerSet  bool
	PowerRaw  string
}

// MatchOptions turns the match command's flags into the map options and a
// label per frequency (a band name or ""), lowest frequency first. Errors
// name the flag (*FlagError, *UsageError: exit 2).
func MatchOptions(o MatchFlags) (match.Options, []string, error) {
	var mo match.Options
	var labels []string
	for _, s := range o.Freqs {
		f, err := quantity.ParseFrequency(s)
		if err != nil {
			return mo, nil, &FlagError{Flag: "freq", Err: err}
		}
		mo.Frequencies = append(mo.Frequencies, float64(f))
		labels = append(labels, "")
	}
	bands, err := LoadBandFlags(o.Bands, o.BandsFile)
	if err != nil {
		return mo, nil, err
	}
	for _, b := range bands {
		mo.Frequencies = append(mo.Frequencies, float64(b.Low+b.High)/2)
		labels = append(labels, b.Name)
	}
	if len(mo.Frequencies) == 0 {
		return mo, nil, Usagef("give at least one --freq (e.g. --freq 7.1MHz), --band or --bands")
	}
	// Lowest frequency first, each label with its frequency.
	order := make([]int, len(mo.Frequencies))
	for i := range order {
		order[i] = i
	}
	sort.SliceStable(order, func(a, b int) bool { return mo.Frequencies[order[a]] < mo.Frequencies[order[b]] })
	fs, ls := make([]float64, len(order)), make([]string, len(order))
	for k, i := range order {
		fs[k], ls[k] = mo.Frequencies[i], labels[i]
	}
	mo.Frequencies, labels = fs, ls
	rLo, rHi, err := ParseOhmRange(o.LoadR)
	if err != nil {
		return mo, nil, &FlagError{Flag: "load-r", Err: err}
	}
	xLo, xHi, err := ParseOhmRange(o.LoadX)
	if err != nil {
		return mo, nil, &FlagError{Flag: "load-x", Err: err}
	}
	mo.Grid = match.Grid{RMin: rLo, RMax: rHi, NR: o.RSteps, XMin: xLo, XMax: xHi, NX: o.XSteps}
	if o.RSteps < 1 || o.RSteps > 200 {
		return mo, nil, Usagef("--r-steps %d: give 1 to 200", o.RSteps)
	}
	if o.XSteps < 1 || o.XSteps > 200 {
		return mo, nil, Usagef("--x-steps %d: give 1 to 200", o.XSteps)
	}
	mo.SWR = o.SWR
	if o.PowerSet && !(o.Power >= 0) {
		return mo, nil, Usagef("--power %s: the power must be zero or positive, e.g. 100W", o.PowerRaw)
	}
	mo.Power = o.Power
	return mo, labels, nil
}

// Coupler is a circuit file made ready to map.
type Coupler struct {
	File  *forms.Circuit
	Setup match.Setup
}

// LoadCoupler reads a circuit file and builds its coupler; stockPath, use
// and flagsGiven choose the catalogs its coils draw on.
func LoadCoupler(path, stockPath, use string, flagsGiven bool) (*Coupler, error) {
	c, _, m, err := LoadCircuitModel(path, stockPath, use, flagsGiven)
	if err != nil {
		return nil, err
	}
	s, err := MatchSetup(c, m.Net)
	if err != nil {
		return nil, err
	}
	return &Coupler{File: c, Setup: s}, nil
}

// matchFlags are the match.InputError keys that are the match command's
// flags; the others (range, load.node, rating, port) are circuit file keys.
var matchFlags = map[string]bool{"freq": true, "load-r": true, "load-x": true, "swr": true, "power": true, "choose-tap": true}

// LoadCircuitModel reads a circuit file and builds its network from the
// catalogs stockPath and use select (flagsGiven: chosen on the command
// line), returning the file, the catalogs and the model.
func LoadCircuitModel(path, stockPath, use string, flagsGiven bool) (*forms.Circuit, *forms.Catalog, *CircuitModel, error) {
	c, err := LoadCircuitFile(path)
	if err != nil {
		return nil, nil, nil, err
	}
	cat, err := LoadCatalog(stockPath, use)
	if err != nil {
		return nil, nil, nil, err
	}
	m, err := BuildCircuit(c, cat, stockPath, use, flagsGiven)
	if err != nil {
		return nil, nil, nil, err
	}
	return c, cat, m, nil
}

// MatchError names the flag or the circuit file key of a refusal.
func MatchError(err error, file string) error {
	var ie *coil.InputError
	if !errors.As(err, &ie) {
		return err
	}
	if matchFlags[ie.Param] {
		return &FlagError{Flag: ie.Param, Err: err}
	}
	return &forms.ParseError{Kind: "circuit", File: file, Field: ie.Param, Err: errors.New(ie.Reason)}
}

// TappedCoil is the coil --choose-tap moves: name (--tap-coil), or the
// only tapped coil of the circuit.
func TappedCoil(net *circuit.Network, name string) (string, error) {
	var tapped []string
	for _, p := range net.Parts {
		if p.Kind == circuit.Wound && p.TapNode >= 0 {
			tapped = append(tapped, p.Name)
		}
	}
	switch {
	case name != "":
		return name, nil
	case len(tapped) == 1:
		return tapped[0], nil
	case len(tapped) == 0:
		return "", Usagef("--choose-tap: the circuit has no tapped coil; give a [[coil]] tap = and tap_node =")
	}
	return "", Usagef("--choose-tap: the circuit has %d tapped coils (%s); name one with --tap-coil", len(tapped), strings.Join(tapped, ", "))
}

// SetTap moves the tap of the coil named name to tapTurns, on a copy of
// the setup's parts.
func (c *Coupler) SetTap(name string, tapTurns float64) {
	parts := append([]circuit.Part(nil), c.Setup.Network.Parts...)
	for i := range parts {
		if parts[i].Name == name {
			parts[i].TapTurns = tapTurns
		}
	}
	c.Setup.Network.Parts = parts
}

// JobStock is the stock selection for a job: the command line's (path,
// use) when --stock or --use was given there (flagsGiven), else the job
// file's own stock = and use = keys, the stock path taken relative to the
// job file.
func JobStock(job *forms.Job, path, use string, flagsGiven bool) (string, string) {
	if flagsGiven || (job.Stock == "" && job.Use == "") {
		return path, use
	}
	if job.Stock == "" {
		return "", job.Use
	}
	return JobPath(job, job.Stock), job.Use
}

// CouplerMap maps a job's [coupler] (forms.JobCoupler) as `turnwise match`
// would with the same keys as flags. It returns the coupler, the result
// and a label per frequency. Errors name the job file's [coupler] keys.
func CouplerMap(ctx context.Context, job *forms.Job, stockPath, use string, flagsGiven bool) (*Coupler, *match.Result, []string, error) {
	jc := job.Coupler
	fail := func(key string, err error) error {
		return &forms.ParseError{Kind: "job", File: job.File, Line: jc.Line, Field: "coupler: " + key, Err: err}
	}
	path := JobPath(job, jc.Circuit)
	if _, err := os.Stat(path); err != nil {
		return nil, nil, nil, fail("circuit", fmt.Errorf("%q (read as %s) cannot be read; the path is relative to the job file", jc.Circuit, path))
	}
	stockPath, use = JobStock(job, stockPath, use, flagsGiven)
	cp, err := LoadCoupler(path, stockPath, use, flagsGiven)
	if err != nil {
		return nil, nil, nil, err
	}
	mo := match.Options{SWR: jc.SWR, Power: jc.Power}
	var labels []string
	for _, f := range jc.Freqs {
		mo.Frequencies, labels = append(mo.Frequencies, f), append(labels, "")
	}
	for _, b := range jc.Bands {
		mo.Frequencies, labels = append(mo.Frequencies, float64(b.Low+b.High)/2), append(labels, b.Name)
	}
	res, err := match.Map(ctx, cp.Setup, mo)
	if err != nil {
		var fe *FlagError
		if errors.As(MatchError(err, path), &fe) {
			return nil, nil, nil, fail(fe.Flag, err) // the [coupler] key has the flag's name
		}
		return nil, nil, nil, MatchError(err, path)
	}
	return cp, res, labels, nil
}

// AdjustableNames lists the parts the search turns: "C1, C2 and C3".
func (c *Coupler) AdjustableNames() string {
	out := ""
	for i, a := range c.Setup.Adjustable {
		switch {
		case i == 0:
		case i == len(c.Setup.Adjustable)-1:
			out += " and "
		default:
			out += ", "
		}
		out += a.Part
	}
	return out
}
