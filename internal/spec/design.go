package spec

// The design search from catalog rows and option values: the glue between
// forms (what the bench holds) and coil.Design (the physics), with no
// cobra in sight so that `turnwise design` and the build-sheet command
// (a job coil with a target instead of a winding) share it:
//
//	res, err := Search(cat, &SearchOptions{
//		Capacitance: 22e-12, Freq: 145e6, Leads: 5e-3, MaxLength: 15e-3,
//	})
//
// res.Candidates[0].Prediction.Geometry is the coil to wind;
// res.Candidates[0].Support.Name and .Wire.Name are catalog names. Errors
// name the design command's flags (the job file's keys have the same
// names): a *FlagError or *UsageError for bad values (exit 2), an error
// wrapping coil.ErrInfeasible when nothing fits (exit 3).

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/coil/thermal"
	"turnwise/forms"
)

// SearchOptions are the values of the design command's flags, parsed.
// Zero values mean the flag was not given.
type SearchOptions struct {
	// Target: Inductance, or Capacitance with Freq as the resonance.
	Inductance  unit.Inductance
	Capacitance unit.Capacitance
	Stray       unit.Capacitance
	Freq        unit.Frequency // operating frequency; with Capacitance the resonance too
	Tolerance   float64        // fraction; 0: 2 %

	Leads unit.Length      // each lead
	Temp  unit.Temperature // 0: 20 °C

	Support    string   // "", "any", "mandrel" (self-supporting) or "former"
	Mandrel    string   // pin the support: a stock name or a diameter
	Former     string   //   (at most one of the two)
	Wires      []string // pin the wire: gauges, diameters or stock names
	Insulation string   // for pinned wires: none, grade1..3 or an overall diameter
	Conductor  string   // for pinned wires
	Springback *float64 // for every mandrel, instead of saved calibrations

	MaxLength     unit.Length
	MaxDiameter   unit.Length
	MaxWireLength unit.Length
	MinSRFRatio   float64     // 0: 3
	MinWire       unit.Length // bare diameter bounds
	MaxWire       unit.Length
	TrimMargin    float64 // 0: 5 %
	Prefer        string  // "", "balanced", "q", "small", "easy"
	Top           int     // 0: 5
	FreeDiameter  bool    // also search a support of any diameter

	// PitchFollows is what sets the pitch on a former as the temperature
	// changes, for each candidate's temperature coefficients (CandidateTempco).
	PitchFollows thermal.PitchFollows
	// A window instead of one inductance: Inductance to InductanceMax.
	InductanceMax unit.Inductance
	// A band (BandLow < BandHigh) tuned by Capacitance (fixed) + Stray and
	// a trimmer TrimMin-TrimMax, TrimmerMargin of its swing free at each
	// end (0: 10 %).
	BandLow, BandHigh unit.Frequency
	TrimMin, TrimMax  unit.Capacitance
	TrimmerMargin     float64
	// MinQ is the least Q at the operating frequency (the band centre).
	MinQ float64
	// A tapped design: TapRatio (impedance ratio), or TapSource with the
	// tank's TankImpedance or TankQ (0: the model's) and LoadedQ (0:
	// matched).
	TapRatio      float64
	TapSource     unit.Resistance
	TankImpedance unit.Resistance
	TankQ         float64
	LoadedQ       float64
}

// Search runs the design search over cat with the options o.
func Search(cat *forms.Catalog, o *SearchOptions) (design.Result, error) {
	if o.BandHigh > 0 {
		return searchBand(cat, o)
	}
	oo := *o
	if o.InductanceMax > 0 {
		// A window: aim at its middle with its half-width as the tolerance.
		if !(o.InductanceMax > o.Inductance && o.Inductance > 0) {
			return design.Result{}, Usagef("--inductance: give the window as MIN-MAX with MIN below MAX, e.g. 90-110nH")
		}
		oo.Inductance = (o.Inductance + o.InductanceMax) / 2
		oo.Tolerance = float64((o.InductanceMax - o.Inductance) / (o.InductanceMax + o.Inductance))
		if o.Tolerance > 0 {
			return design.Result{}, Usagef("--tolerance does not apply to an inductance window; the window is the tolerance")
		}
	}
	t, err := searchTarget(&oo)
	if err != nil {
		return design.Result{}, err
	}
	c, err := searchConstraints(cat, &oo)
	if err != nil {
		return design.Result{}, err
	}
	top := c.Top
	if top == 0 {
		top = design.DefaultTop
	}
	c.MinQ = o.MinQ // a constraint inside the search: the list fills from coils that reach it
	res, err := design.Search(t, c)
	if err != nil {
		return res, searchError(err)
	}
	if res, err = design.WithMinQ(res, o.MinQ, top); err != nil {
		return res, searchError(err)
	}
	return addTaps(res, o)
}

// searchBand runs a band design.
func searchBand(cat *forms.Catalog, o *SearchOptions) (design.Result, error) {
	switch {
	case o.Inductance > 0:
		return design.Result{}, Usagef("--band and --inductance cannot be used together: a band is tuned by --cap and --trimmer")
	case o.TrimMax == 0:
		return design.Result{}, Usagef("a band needs a trimmer to tune it: give --trimmer MIN-MAX, e.g. --trimmer 2-10pF (with --cap for the fixed capacitor)")
	case o.Tolerance > 0:
		return design.Result{}, Usagef("--tolerance does not apply to a band: the trimmer's range is the tolerance (see --trimmer-margin)")
	}
	c, err := searchConstraints(cat, o)
	if err != nil {
		return design.Result{}, err
	}
	b := design.BandTarget{Low: o.BandLow, High: o.BandHigh, Fixed: o.Capacitance, Stray: o.Stray, TrimMin: o.TrimMin, TrimMax: o.TrimMax,
		TrimMargin: o.TrimmerMargin, MinQ: o.MinQ}
	res, err := design.SearchBand(b, c)
	if err != nil {
		return res, searchError(err)
	}
	return addTaps(res, o)
}

// addTaps adds the tap of a tapped design.
func addTaps(res design.Result, o *SearchOptions) (design.Result, error) {
	if o.TapRatio == 0 && o.TapSource == 0 {
		return res, nil
	}
	g := design.TapGoalInfo{Ratio: o.TapRatio}
	if o.TapSource > 0 {
		g.Load = &coil.LoadGoal{Source: o.TapSource, TankImpedance: o.TankImpedance, TankQ: o.TankQ, LoadedQ: o.LoadedQ}
	}
	f := res.Frequency
	if res.Band != nil {
		f = res.Band.Centre
	}
	res, err := design.AddTaps(res, g, f)
	if err != nil {
		return res, searchError(err)
	}
	return res, nil
}

// searchTarget turns the target flags into a design.Target.
func searchTarget(o *SearchOptions) (design.Target, error) {
	for _, q := range []struct {
		flag, example string
		v             float64
	}{
		{"inductance", "48nH", float64(o.Inductance)}, {"cap", "22pF", float64(o.Capacitance)},
		{"stray", "3pF", float64(o.Stray)}, {"freq", "145MHz", float64(o.Freq)},
	} {
		if q.v < 0 {
			return design.Target{}, Usagef("--%s: give a positive value, e.g. %s", q.flag, q.example)
		}
	}
	switch {
	case o.Inductance > 0 && o.Capacitance > 0:
		return design.Target{}, Usagef("--inductance and --cap cannot be used together: give an inductance, or a capacitance with the --freq it must resonate at")
	case o.Inductance == 0 && o.Capacitance == 0:
		return design.Target{}, Usagef("give a target: --inductance 48nH, or --cap 22pF with --freq 145MHz (the resonance)")
	case o.Capacitance > 0 && o.Freq == 0:
		return design.Target{}, Usagef("--cap needs --freq, the frequency it must resonate at, e.g. --freq 145MHz")
	case o.Stray > 0 && o.Capacitance == 0:
		return design.Target{}, Usagef("--stray adds to --cap; give --cap and --freq, or add the stray to nothing and drop it")
	}
	t := design.Target{Tolerance: o.Tolerance}
	if o.Inductance > 0 {
		t.Inductance, t.Frequency = o.Inductance, o.Freq
	} else {
		t.Resonance, t.Capacitance, t.Stray = o.Freq, o.Capacitance, o.Stray
	}
	return t, nil
}

// searchConstraints builds the search's stock and limits from cat and o.
func searchConstraints(cat *forms.Catalog, o *SearchOptions) (design.Constraints, error) {
	c := design.Constraints{
		LeadLength:    o.Leads,
		Temperature:   o.Temp,
		MaxLength:     o.MaxLength,
		MaxDiameter:   o.MaxDiameter,
		MaxWireLength: o.MaxWireLength,
		MinSRFRatio:   o.MinSRFRatio,
		MinWire:       o.MinWire,
		MaxWire:       o.MaxWire,
		TrimMargin:    o.TrimMargin,
		Top:           o.Top,
	}
	switch o.Prefer {
	case "", "balanced":
	case "q":
		c.Prefer = design.PreferQ
	case "small":
		c.Prefer = design.PreferSmall
	case "easy":
		c.Prefer = design.PreferEasy
	default:
		return c, &FlagError{Flag: "prefer", Err: fmt.Errorf("%q is not one of balanced, q, small, easy", o.Prefer)}
	}
	sups, err := searchSupports(cat, o)
	if err != nil {
		return c, err
	}
	c.Supports = sups
	if c.Wires, err = searchWires(cat, o); err != nil {
		return c, err
	}
	if o.Springback == nil {
		c.Calibrations = searchCalibrations(cat, c.Supports, c.Wires)
	}
	if o.FreeDiameter {
		c.FreeDiameter = &design.FreeDiameter{OnFormer: o.Support == "former" || o.Former != ""}
		if o.Mandrel != "" || o.Former != "" {
			return c, Usagef("--free-diameter chooses the diameter itself; drop --mandrel/--former, or drop --free-diameter")
		}
	}
	return c, nil
}

// SearchLists is the catalog as the design search's lists of supports and
// wires under o: the one conversion, used by Search and by the search's
// benchmarks.
func SearchLists(cat *forms.Catalog, o *SearchOptions) ([]design.Support, []design.WireOption, error) {
	sups, err := searchSupports(cat, o)
	if err != nil {
		return nil, nil, err
	}
	wires, err := searchWires(cat, o)
	if err != nil {
		return nil, nil, err
	}
	return sups, wires, nil
}

// searchSupports lists the mandrels and formers the search may use.
func searchSupports(cat *forms.Catalog, o *SearchOptions) ([]design.Support, error) {
	if sb := o.Springback; sb != nil && !(*sb >= coil.MinSpringback && *sb <= coil.MaxSpringback) {
		return nil, &FlagError{Flag: "springback", Err: fmt.Errorf("%s is outside %s … %s", quantity.FormatPercent(*sb), quantity.FormatPercent(coil.MinSpringback), quantity.FormatPercent(coil.MaxSpringback))}
	}
	kind := o.Support
	switch kind {
	case "", "any", "mandrel", "former":
	default:
		return nil, &FlagError{Flag: "support", Err: fmt.Errorf("%q is not one of any, mandrel, former", kind)}
	}
	withSpring := func(s design.Support) design.Support {
		if !s.OnFormer && o.Springback != nil {
			s.Springback, s.SpringbackNote = *o.Springback, "given"
		}
		return s
	}
	switch {
	case o.Mandrel != "" && o.Former != "":
		return nil, Usagef("--mandrel and --former cannot be used together; a coil is either slid off a mandrel or left on a former")
	case o.Mandrel != "":
		if kind == "former" {
			return nil, Usagef("--mandrel contradicts --support former; drop one")
		}
		d, name, err := ResolveMandrel(cat, o.Mandrel)
		if err != nil {
			return nil, err
		}
		if !(d > 0) {
			return nil, &FlagError{Flag: "mandrel", Err: fmt.Errorf("%q is not a diameter; give a positive one, e.g. 6mm", o.Mandrel)}
		}
		return []design.Support{withSpring(design.Support{Name: name, Diameter: d})}, nil
	case o.Former != "":
		if kind == "mandrel" {
			return nil, Usagef("--former contradicts --support mandrel; drop one")
		}
		d, name, err := ResolveFormer(cat, o.Former)
		if err != nil {
			return nil, err
		}
		if !(d > 0) {
			return nil, &FlagError{Flag: "former", Err: fmt.Errorf("%q is not a diameter; give a positive one, e.g. 20mm", o.Former)}
		}
		return []design.Support{{Name: name, Diameter: d, OnFormer: true}}, nil
	}
	var out []design.Support
	if kind != "former" {
		for _, m := range cat.Mandrels {
			out = append(out, withSpring(design.Support{Name: m.Name, Diameter: m.Diameter}))
		}
	}
	if kind != "mandrel" {
		for _, f := range cat.Formers {
			out = append(out, design.Support{Name: f.Name, Diameter: f.Diameter, OnFormer: true})
		}
	}
	if len(out) == 0 && !o.FreeDiameter {
		what := map[string]string{"mandrel": "mandrel", "former": "former"}[kind]
		if what == "" {
			what = "mandrel or former"
		}
		return nil, Usagef("the stock has no %s; add one to your stock file, use --use both, or give --free-diameter", what)
	}
	return out, nil
}

// searchWires lists the wires the search may use: the pinned ones, or the
// whole catalog.
func searchWires(cat *forms.Catalog, o *SearchOptions) ([]design.WireOption, error) {
	rows, err := wireRowsFor(cat, o)
	if err != nil {
		return nil, err
	}
	out := make([]design.WireOption, 0, len(rows))
	for _, w := range rows {
		cond, err := coil.ParseConductor(w.Conductor)
		if err != nil {
			return nil, &FlagError{Flag: "conductor", Err: err}
		}
		out = append(out, design.WireOption{Name: w.Name, Diameter: w.Bare, Overall: w.Overall, Conductor: cond})
	}
	if len(out) == 0 {
		return nil, Usagef("the stock has no wire; add some to your stock file or use --use both")
	}
	return out, nil
}

// wireRowsFor is the catalog rows behind searchWires, with the pinned
// wires' --insulation and --conductor applied; commands describe the
// candidates' wire from them.
func wireRowsFor(cat *forms.Catalog, o *SearchOptions) ([]forms.Wire, error) {
	rows := cat.Wires
	if len(o.Wires) > 0 {
		rows = nil
		for _, name := range o.Wires {
			w, _, err := ResolveWireAs(cat, name, o.Insulation, o.Conductor)
			if err != nil {
				return nil, err
			}
			rows = append(rows, w)
		}
	} else if o.Insulation != "" || o.Conductor != "" {
		return nil, Usagef("--insulation and --conductor apply to a wire you name; add --wire")
	}
	return rows, nil
}

// searchCalibrations resolves the catalog's springback calibrations to the
// support and wire names the search uses; cat.Springback picks the latest
// for each pair, with the same name matching as predict.
func searchCalibrations(cat *forms.Catalog, sups []design.Support, wires []design.WireOption) []design.SpringbackCalibration {
	if len(cat.Calibrations) == 0 {
		return nil
	}
	holder := func(name string) string {
		if m, err := cat.Mandrel(name); err == nil {
			return "mandrel:" + strings.ToLower(m.Name)
		}
		if f, err := cat.Former(name); err == nil {
			return "former:" + strings.ToLower(f.Name)
		}
		return ""
	}
	wireKey := func(name string) string {
		if w, err := cat.Wire(name); err == nil {
			return strings.ToLower(w.Name)
		}
		if w, ok, err := forms.ParseGauge(name); err == nil && ok {
			return strings.ToLower(w.Name)
		}
		return ""
	}
	holders, wireKeys := map[string]bool{}, map[string]bool{}
	for _, cal := range cat.Calibrations {
		holders[holder(cal.Mandrel)] = true
		wireKeys[wireKey(cal.Wire)] = true
	}
	var calWires []design.WireOption
	for _, w := range wires {
		if k := wireKey(w.Name); k != "" && wireKeys[k] {
			calWires = append(calWires, w)
		}
	}
	var out []design.SpringbackCalibration
	for _, s := range sups {
		if h := holder(s.Name); h == "" || !holders[h] {
			continue
		}
		for _, w := range calWires {
			if cal, ok := cat.Springback(s.Name, w.Name); ok {
				out = append(out, design.SpringbackCalibration{Support: s.Name, Wire: w.Name, Springback: cal.Springback, Note: cal.Note})
			}
		}
	}
	return out
}

// searchFlags maps coil.InputError parameters to the design flags.
var searchFlags = map[string]string{
	"band":            "band",
	"trimmer":         "trimmer",
	"trimmer_margin":  "trimmer-margin",
	"min_q":           "min-q",
	"tap_ratio":       "tap-ratio",
	"source":          "tap-impedance",
	"tank_impedance":  "tank-impedance",
	"tank_q":          "tank-q",
	"loaded_q":        "loaded-q",
	"inductance":      "inductance",
	"resonance":       "freq",
	"frequency":       "freq",
	"capacitance":     "cap",
	"stray":           "stray",
	"tolerance":       "tolerance",
	"lead_length":     "leads",
	"temperature":     "temp",
	"min_srf_ratio":   "min-srf-ratio",
	"trim_margin":     "trim-margin",
	"min_wire":        "min-wire",
	"top":             "top",
	"springback":      "springback",
	"wires":           "wire",
	"supports":        "support",
	"free_diameter":   "free-diameter",
	"min_turns":       "min-turns",
	"constraints":     "max-length",
	"max_length":      "max-length",
	"max_diameter":    "max-diameter",
	"max_wire_length": "max-wire-length",
	"max_wire":        "max-wire",
}

// searchError names the flag behind a model error and adds the flag to try
// to an infeasibility.
func searchError(err error) error {
	var ie *coil.InputError
	if errors.As(err, &ie) {
		if f, ok := searchFlags[ie.Param]; ok {
			return &FlagError{Flag: f, Err: err}
		}
		return err
	}
	var inf *design.InfeasibleError
	if errors.As(err, &inf) {
		hint := ""
		if f, ok := searchFlags[inf.Constraint]; ok {
			hint = " (--" + f + ")"
		}
		return fmt.Errorf("%w%s", err, hint)
	}
	return err
}

// ParseWireSize reads a bare diameter or a gauge for --min-wire/--max-wire.
func ParseWireSize(s string) (unit.Length, error) {
	if d, err := quantity.ParseLength(s); err == nil {
		return d, nil
	}
	w, ok, err := forms.ParseGauge(s)
	if err != nil {
		return 0, err
	}
	if !ok || math.IsNaN(float64(w.Bare)) {
		return 0, fmt.Errorf("%q is neither a diameter (0.5mm) nor a gauge (24awg, 22swg)", s)
	}
	return w.Bare, nil
}

// WireRows indexes the search's wire rows by name.
func WireRows(cat *forms.Catalog, so *SearchOptions) map[string]forms.Wire {
	rows, _ := wireRowsFor(cat, so) // the search already accepted them
	m := make(map[string]forms.Wire, len(rows))
	for _, w := range rows {
		if _, dup := m[w.Name]; !dup {
			m[w.Name] = w
		}
	}
	return m
}
