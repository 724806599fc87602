package spec

import (
	"errors"
	"fmt"
	"math"
	"strings"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

// Spec is a resolved coil: its geometry and where each part came from.
type Spec struct {
	Geometry         coil.Geometry
	Wire             forms.Wire
	SupportKind      coil.SupportKind
	SupportName      string
	SpringbackSource coil.SpringbackSource // given, calibration or none
	SpringbackNote   string
	PitchSource      coil.PitchSource
}

// closeWound reports a pitch equal to the wire's overall diameter.
func closeWound(g coil.Geometry) bool {
	return math.Abs(float64(g.Pitch)-float64(g.OverallDiameter())) < 1e-9
}

// FromCandidate is the Spec of a design candidate, described as Resolve
// describes the same coil: the wire by the row the search took it from
// (rows, from WireRows), the springback source in Resolve's words, and a
// close-wound pitch called so.
func FromCandidate(rows map[string]forms.Wire, c design.Candidate) Spec {
	g := c.Prediction.Geometry
	kind := coil.SupportMandrel
	if c.Support.OnFormer {
		kind = coil.SupportFormer
	}
	w, ok := rows[c.Wire.Name]
	if !ok {
		overall := c.Wire.Overall
		if overall == 0 {
			overall = c.Wire.Diameter
		}
		w = forms.Wire{Name: c.Wire.Name, System: "user", Bare: c.Wire.Diameter, Overall: overall,
			Insulation: "none", Conductor: c.Wire.Conductor.String(), Origin: "design"}
		if overall > c.Wire.Diameter {
			w.Insulation = "custom"
		}
	}
	src := c.SpringbackSource
	if src == coil.SpringbackOnFormer {
		src = coil.SpringbackNone // a coil left on its former has no springback to report
	}
	pitch := coil.PitchGiven
	if closeWound(g) {
		pitch = coil.PitchCloseWound
	}
	return Spec{
		Geometry: g, Wire: w, SupportKind: kind, SupportName: c.Support.Name,
		SpringbackSource: src, SpringbackNote: c.Support.SpringbackNote, PitchSource: pitch,
	}
}

// Predict resolves a winding and evaluates the model at f, naming the flag
// of a model error.
func Predict(cat *forms.Catalog, o forms.JobWinding, f unit.Frequency) (Spec, coil.Prediction, error) {
	return PredictMounted(cat, o, f, coil.Grounded)
}

// PredictMounted is Predict for a coil mounted as m (whose self-resonance
// feeds the effective inductance and Q).
func PredictMounted(cat *forms.Catalog, o forms.JobWinding, f unit.Frequency, m coil.Mounting) (Spec, coil.Prediction, error) {
	s, err := Resolve(cat, o)
	if err != nil {
		return s, coil.Prediction{}, err
	}
	p, err := coil.PredictMounted(s.Geometry, f, m)
	if err != nil {
		return s, p, AttachFlag(err, s.SupportKind.String(), s.PitchSource)
	}
	return s, p, nil
}

// Resolve turns a described winding (predict's flags, or a job file's
// fixed-winding keys, which have the same names) into a Spec, looking names
// up in cat. This is the one builder: predict, tap, span, sheet and trim
// call it, and FromCandidate gives a design candidate the same Spec.
// Errors name the flag: *UsageError, *FlagError.
func Resolve(cat *forms.Catalog, o forms.JobWinding) (Spec, error) {
	var s Spec
	switch {
	case o.Mandrel != "" && o.Former != "":
		return s, Usagef("--mandrel and --former cannot be used together; a coil is either slid off a mandrel or left on a former")
	case o.Mandrel == "" && o.Former == "":
		return s, Usagef("give --mandrel (self-supporting coil, e.g. --mandrel 6mm) or --former (coil stays on it, e.g. --former 20mm)")
	case o.Wire == "":
		return s, Usagef("--wire is required: a gauge (22awg, 18swg), a bare diameter (1mm) or a stock wire name")
	case o.Turns == nil:
		return s, Usagef("--turns is required, e.g. --turns 5")
	case o.Leads == nil:
		return s, Usagef("--leads is required: the length of each lead to the solder joint, e.g. --leads 5mm (0mm if you measure at the winding); at VHF leads are often 10–20 %% of the inductance")
	case o.Pitch != nil && o.Length != nil:
		return s, Usagef("--pitch and --length cannot be used together; give one (or neither for close-wound)")
	}

	var temp unit.Temperature
	if o.Temp != nil {
		temp = *o.Temp
	}
	w, cond, err := ResolveWireAs(cat, o.Wire, o.Insulation, o.Conductor)
	if err != nil {
		return s, err
	}
	s.Wire = w

	g := coil.Geometry{
		WireDiameter: w.Bare,
		WireOverall:  w.Overall,
		Conductor:    cond,
		Turns:        *o.Turns,
		LeadLength:   *o.Leads,
		Temperature:  temp,
	}
	if o.Plating != nil {
		g.Plating = *o.Plating
	}
	supportFlag := "mandrel"
	if o.Mandrel != "" {
		s.SupportKind = coil.SupportMandrel
		d, name, err := ResolveMandrel(cat, o.Mandrel)
		if err != nil {
			return s, err
		}
		g.FormerDiameter, s.SupportName = d, name
	} else {
		supportFlag = "former"
		s.SupportKind = coil.SupportFormer
		d, name, err := ResolveFormer(cat, o.Former)
		if err != nil {
			return s, err
		}
		g.FormerDiameter, s.SupportName = d, name
	}

	switch {
	case o.Springback != nil:
		g.Springback, s.SpringbackSource = *o.Springback, coil.SpringbackGiven
	default:
		if c, ok := cat.Springback(s.SupportName, w.Name); ok {
			g.Springback, s.SpringbackSource, s.SpringbackNote = c.Springback, coil.SpringbackCalibration, c.Note
		} else {
			s.SpringbackSource = "none"
		}
	}

	overall := w.Overall
	if overall == 0 {
		overall = w.Bare
	}
	switch {
	case o.Pitch != nil:
		g.Pitch, s.PitchSource = *o.Pitch, coil.PitchGiven
	case o.Length != nil:
		n := *o.Turns
		if !(n >= 1) {
			// The turns are wrong whatever the length: blame them.
			return s, AttachFlag(coil.ValidateTurns(n), supportFlag, coil.PitchGiven)
		}
		p, err := coil.PitchForWindingLength(n, overall, *o.Length)
		if err != nil {
			return s, AttachFlag(err, supportFlag, coil.PitchFromLength)
		}
		if float64(p) > coil.MaxPitch {
			return s, &FlagError{Flag: "length", Err: fmt.Errorf("%s over %g turns gives a pitch of %s between turn centres, more than the %s the model accepts; use more turns or a shorter --length",
				quantity.FormatMillimetres(float64(*o.Length)), n, quantity.FormatMillimetres(float64(p)), quantity.FormatMillimetres(coil.MaxPitch))}
		}
		g.Pitch, s.PitchSource = p, coil.PitchFromLength
	default:
		g.Pitch, s.PitchSource = overall, coil.PitchCloseWound
	}
	if err := g.Validate(); err != nil {
		return s, AttachFlag(err, supportFlag, s.PitchSource)
	}
	s.Geometry = g
	return s, nil
}

// AttachFlag names the flag a coil.InputError belongs to: supportFlag is
// "mandrel" or "former", pitchSource the Spec's.
func AttachFlag(err error, supportFlag string, pitchSource coil.PitchSource) error {
	var ie *coil.InputError
	if !errors.As(err, &ie) {
		return err
	}
	flag := map[string]string{
		"former_diameter":       supportFlag,
		"wire_diameter":         "wire",
		"wire_overall_diameter": "insulation",
		"turns":                 "turns",
		"lead_length":           "leads",
		"springback":            "springback",
		"temperature":           "temp",
		"frequency":             "freq",
		"winding_length":        "length",
		"conductor":             "conductor",
		"plating":               "plating",
	}[ie.Param]
	if ie.Param == "pitch" {
		flag = "pitch"
		if pitchSource == coil.PitchFromLength {
			flag = "length"
		}
	}
	if flag == "" {
		return err
	}
	return &FlagError{Flag: flag, Err: err}
}

// ResolveWireAs resolves a wire and applies the --insulation and
// --conductor given with it (empty keeps the catalog row's).
func ResolveWireAs(cat *forms.Catalog, name, insulation, conductor string) (forms.Wire, coil.Conductor, error) {
	w, err := ResolveWire(cat, name)
	if err != nil {
		return w, coil.Copper, err
	}
	if insulation != "" {
		overall, ins, err := forms.ParseInsulation(insulation, w.Bare)
		if err != nil {
			return w, coil.Copper, &FlagError{Flag: "insulation", Err: err}
		}
		w.Overall, w.Insulation = overall, ins
	}
	if conductor != "" {
		w.Conductor = conductor
	}
	cond, err := coil.ParseConductor(w.Conductor)
	if err != nil {
		return w, coil.Copper, &FlagError{Flag: "conductor", Err: err}
	}
	return w, cond, nil
}

// ResolveWire accepts a stock or built-in name, a gauge or a bare diameter.
func ResolveWire(cat *forms.Catalog, s string) (forms.Wire, error) {
	if d, err := quantity.ParseLength(s); err == nil {
		return forms.Wire{
			Name: s, System: "user", Bare: d, Overall: d, Insulation: "none",
			Conductor: "copper", Source: "given on the command line", Origin: "command line",
		}, nil
	}
	if w, err := cat.Wire(s); err == nil {
		return w, nil
	}
	w, ok, err := forms.ParseGauge(s)
	if err != nil {
		return forms.Wire{}, &FlagError{Flag: "wire", Err: err}
	}
	if ok {
		return w, nil
	}
	const fix = "give a gauge (22awg, 18swg), a bare diameter (1mm) or a stock wire name"
	if looksLikeQuantity(s) {
		_, perr := quantity.ParseLength(s)
		return forms.Wire{}, &FlagError{Flag: "wire", Err: fmt.Errorf("%w; %s", perr, fix)}
	}
	_, lookupErr := cat.Wire(s)
	return forms.Wire{}, &FlagError{Flag: "wire", Err: fmt.Errorf("%w; %s", lookupErr, fix)}
}

// looksLikeQuantity reports whether s starts like a number.
func looksLikeQuantity(s string) bool {
	s = strings.TrimSpace(s)
	return s != "" && (s[0] >= '0' && s[0] <= '9' || s[0] == '.' || s[0] == '-' || s[0] == '+')
}

// ResolveMandrel accepts a stock mandrel or a diameter.
func ResolveMandrel(cat *forms.Catalog, s string) (unit.Length, string, error) {
	if m, err := cat.Mandrel(s); err == nil {
		return m.Diameter, m.Name, nil
	}
	d, err := quantity.ParseLength(s)
	if err != nil {
		_, lookupErr := cat.Mandrel(s)
		var le *forms.LookupError
		if looksLikeQuantity(s) && !(errors.As(lookupErr, &le) && len(le.Suggestions) > 0) {
			return 0, "", &FlagError{Flag: "mandrel", Err: err}
		}
		return 0, "", &FlagError{Flag: "mandrel", Err: fmt.Errorf("%w; or give a diameter such as 6mm", lookupErr)}
	}
	return d, fmt.Sprintf("%s rod", s), nil
}

// ResolveFormer accepts a stock former or an outside diameter.
func ResolveFormer(cat *forms.Catalog, s string) (unit.Length, string, error) {
	if f, err := cat.Former(s); err == nil {
		return f.Diameter, f.Name, nil
	}
	d, err := quantity.ParseLength(s)
	if err != nil {
		_, lookupErr := cat.Former(s)
		var le *forms.LookupError
		if looksLikeQuantity(s) && !(errors.As(lookupErr, &le) && len(le.Suggestions) > 0) {
			return 0, "", &FlagError{Flag: "former", Err: err}
		}
		return 0, "", &FlagError{Flag: "former", Err: fmt.Errorf("%w; or give an outside diameter such as 20mm", lookupErr)}
	}
	return d, fmt.Sprintf("%s former", s), nil
}

// FirstWindingKey names the first key (or coil flag: they have the same
// names) a winding gives, or "" for none.
func FirstWindingKey(w forms.JobWinding) string {
	for _, f := range []struct {
		name string
		set  bool
	}{
		{"mandrel", w.Mandrel != ""}, {"former", w.Former != ""}, {"wire", w.Wire != ""},
		{"insulation", w.Insulation != ""}, {"conductor", w.Conductor != ""}, {"plating", w.Plating != nil},
		{"springback", w.Springback != nil}, {"turns", w.Turns != nil}, {"pitch", w.Pitch != nil},
		{"length", w.Length != nil}, {"leads", w.Leads != nil}, {"temp", w.Temp != nil},
	} {
		if f.set {
			return f.name
		}
	}
	return ""
}
