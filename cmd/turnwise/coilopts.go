package main

import (
	"errors"
	"fmt"
	"strconv"
	"strings"
	"turnwise/internal/quantity"

	"github.com/spf13/pflag"
	"gonum.org/v1/gonum/unit"

	"turnwise/coil"
	"turnwise/forms"
)

// turnsFlag takes a number of turns in quarter steps ("5", "5.25").
type turnsFlag struct {
	raw string
	v   float64
	set bool
}

func (f *turnsFlag) String() string { return f.raw }
func (f *turnsFlag) Type() string   { return "turns" }
func (f *turnsFlag) Set(s string) error {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	if err != nil || !(v == v) || v > 1e9 || v < -1e9 {
		return fmt.Errorf("%q is not a number of turns; use e.g. 5 or 5.25 (quarter turns)", s)
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

// coilOptions are the flags that describe one wound coil; predict, sheet,
// tap, span and trim share them.
type coilOptions struct {
	mounting   string
	mandrel    string
	former     string
	wire       string
	insulation string
	conductor  string
	springback percentFlag
	turns      turnsFlag
	pitch      lengthFlag
	length     lengthFlag
	leads      lengthFlag
	temp       temperatureFlag
}

func (o *coilOptions) addFlags(fs *pflag.FlagSet) {
	fs.StringVar(&o.mounting, "mounting", "grounded", "how the coil is mounted, which sets the self-resonance used for effective L and Q: grounded (one end on ground) or floating (both ends live)")
	fs.StringVar(&o.mandrel, "mandrel", "", "wind on this mandrel and slide it out (self-supporting): a stock name or a diameter, e.g. 6mm or 1/4in")
	fs.StringVar(&o.former, "former", "", "wind on this former and leave the coil on it: a stock name or an outside diameter, e.g. 20mm")
	fs.StringVar(&o.wire, "wire", "", "a gauge (22awg, 18swg), a diameter (1mm: bare copper unless --insulation says otherwise) or a stock wire name")
	fs.StringVar(&o.insulation, "insulation", "", "none, grade1, grade2 (enamel) or the diameter over the insulation, e.g. 1.06mm (default: the stock row's, or none for a plain diameter)")
	fs.StringVar(&o.conductor, "conductor", "", "copper, silver-plated or tinned (default: the stock row's, or copper)")
	fs.Var(&o.springback, "springback", "growth of the bore when released from the mandrel, percent (default: your saved calibration for this mandrel and wire, else 0)")
	fs.Var(&o.turns, "turns", "number of turns, in quarter turns (5, 5.25, 5.5)")
	fs.Var(&o.pitch, "pitch", "distance between turn centres, e.g. 1.5mm (default: close-wound)")
	fs.Var(&o.length, "length", "outside winding length over the wire, as measured with calipers, e.g. 8mm (sets the pitch)")
	fs.Var(&o.leads, "leads", "length of each of the two leads from the winding to the solder joint, e.g. 5mm (0mm allowed)")
	fs.Var(&o.temp, "temp", "conductor temperature (default 20C)")
}

// coilSpec is a resolved coil: its geometry and where each part came from.
type coilSpec struct {
	Geometry         coil.Geometry
	Wire             forms.Wire
	SupportKind      string // "mandrel" or "former"
	SupportName      string
	SpringbackSource string // "given", "calibration", "none"
	SpringbackNote   string
	PitchSource      string // "pitch", "length", "close-wound"
}

// resolve turns the flags into a geometry, looking names up in cat.
func (o *coilOptions) resolve(cat *forms.Catalog) (coilSpec, error) {
	var s coilSpec
	switch {
	case o.mandrel != "" && o.former != "":
		return s, usageErrorf("--mandrel and --former cannot be used together; a coil is either slid off a mandrel or left on a former")
	case o.mandrel == "" && o.former == "":
		return s, usageErrorf("give --mandrel (self-supporting coil, e.g. --mandrel 6mm) or --former (coil stays on it, e.g. --former 20mm)")
	case o.wire == "":
		return s, usageErrorf("--wire is required: a gauge (22awg, 18swg), a bare diameter (1mm) or a stock wire name")
	case !o.turns.set:
		return s, usageErrorf("--turns is required, e.g. --turns 5")
	case !o.leads.set:
		return s, usageErrorf("--leads is required: the length of each lead to the solder joint, e.g. --leads 5mm (0mm if you measure at the winding); at VHF leads are often 10–20 %% of the inductance")
	case o.pitch.set && o.length.set:
		return s, usageErrorf("--pitch and --length cannot be used together; give one (or neither for close-wound)")
	}

	w, cond, err := resolveWireAs(cat, o.wire, o.insulation, o.conductor)
	if err != nil {
		return s, err
	}
	s.Wire = w

	g := coil.Geometry{
		WireDiameter: w.Bare,
		WireOverall:  w.Overall,
		Conductor:    cond,
		Turns:        o.turns.v,
		LeadLength:   o.leads.v,
		Temperature:  o.temp.v,
	}
	supportFlag := "mandrel"
	if o.mandrel != "" {
		s.SupportKind = "mandrel"
		d, name, err := resolveMandrel(cat, o.mandrel)
		if err != nil {
			return s, err
		}
		g.FormerDiameter, s.SupportName = d, name
	} else {
		supportFlag = "former"
		s.SupportKind = "former"
		d, name, err := resolveFormer(cat, o.former)
		if err != nil {
			return s, err
		}
		g.FormerDiameter, s.SupportName = d, name
	}

	switch {
	case o.springback.set:
		g.Springback, s.SpringbackSource = o.springback.v, "given"
	default:
		if c, ok := cat.Springback(s.SupportName, w.Name); ok {
			g.Springback, s.SpringbackSource, s.SpringbackNote = c.Springback, "calibration", c.Note
		} else {
			s.SpringbackSource = "none"
		}
	}

	overall := w.Overall
	if overall == 0 {
		overall = w.Bare
	}
	switch {
	case o.pitch.set:
		g.Pitch, s.PitchSource = o.pitch.v, "pitch"
	case o.length.set:
		p, err := coil.PitchForWindingLength(o.turns.v, overall, o.length.v)
		if err != nil {
			return s, &flagError{"length", err}
		}
		g.Pitch, s.PitchSource = p, "length"
	default:
		g.Pitch, s.PitchSource = overall, "close-wound"
	}
	if err := g.Validate(); err != nil {
		return s, o.attachFlag(err, supportFlag, s.PitchSource)
	}
	s.Geometry = g
	return s, nil
}

// attachFlag names the flag a coil.InputError belongs to.
func (o *coilOptions) attachFlag(err error, supportFlag, pitchSource string) error {
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
	}[ie.Param]
	if ie.Param == "pitch" {
		flag = "pitch"
		if pitchSource == "length" {
			flag = "length"
		}
	}
	if flag == "" {
		return err
	}
	return &flagError{flag, err}
}

// resolveWireAs resolves a wire and applies the --insulation and
// --conductor given with it (empty keeps the catalog row's).
func resolveWireAs(cat *forms.Catalog, name, insulation, conductor string) (forms.Wire, coil.Conductor, error) {
	w, err := resolveWire(cat, name)
	if err != nil {
		return w, coil.Copper, err
	}
	if insulation != "" {
		overall, ins, err := forms.ParseInsulation(insulation, w.Bare)
		if err != nil {
			return w, coil.Copper, &flagError{"insulation", err}
		}
		w.Overall, w.Insulation = overall, ins
	}
	if conductor != "" {
		w.Conductor = conductor
	}
	cond, err := coil.ParseConductor(w.Conductor)
	if err != nil {
		return w, coil.Copper, &flagError{"conductor", err}
	}
	return w, cond, nil
}

// resolveWire accepts a stock or built-in name, a gauge or a bare diameter.
func resolveWire(cat *forms.Catalog, s string) (forms.Wire, error) {
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
		return forms.Wire{}, &flagError{"wire", err}
	}
	if ok {
		return w, nil
	}
	const fix = "give a gauge (22awg, 18swg), a bare diameter (1mm) or a stock wire name"
	if looksLikeQuantity(s) {
		_, perr := quantity.ParseLength(s)
		return forms.Wire{}, &flagError{"wire", fmt.Errorf("%w; %s", perr, fix)}
	}
	_, lookupErr := cat.Wire(s)
	return forms.Wire{}, &flagError{"wire", fmt.Errorf("%w; %s", lookupErr, fix)}
}

// looksLikeQuantity reports whether s starts like a number.
func looksLikeQuantity(s string) bool {
	s = strings.TrimSpace(s)
	return s != "" && (s[0] >= '0' && s[0] <= '9' || s[0] == '.' || s[0] == '-' || s[0] == '+')
}

func resolveMandrel(cat *forms.Catalog, s string) (unit.Length, string, error) {
	if m, err := cat.Mandrel(s); err == nil {
		return m.Diameter, m.Name, nil
	}
	d, err := quantity.ParseLength(s)
	if err != nil {
		_, lookupErr := cat.Mandrel(s)
		if looksLikeQuantity(s) {
			return 0, "", &flagError{"mandrel", err}
		}
		return 0, "", &flagError{"mandrel", fmt.Errorf("%v; or give a diameter such as 6mm", lookupErr)}
	}
	return d, fmt.Sprintf("%s rod", s), nil
}

func resolveFormer(cat *forms.Catalog, s string) (unit.Length, string, error) {
	if f, err := cat.Former(s); err == nil {
		return f.Diameter, f.Name, nil
	}
	d, err := quantity.ParseLength(s)
	if err != nil {
		_, lookupErr := cat.Former(s)
		if looksLikeQuantity(s) {
			return 0, "", &flagError{"former", err}
		}
		return 0, "", &flagError{"former", fmt.Errorf("%v; or give an outside diameter such as 20mm", lookupErr)}
	}
	return d, fmt.Sprintf("%s former", s), nil
}
