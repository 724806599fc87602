package main

import (
	"fmt"
	"strconv"
	"strings"
	"turnwise/coil"
	"turnwise/forms"
	"turnwise/internal/spec"

	"github.com/spf13/pflag"
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

// winding is the coil the flags describe, in the terms of a job file's
// fixed winding (whose keys have the flags' names): spec.Resolve takes both.
func (o *coilOptions) winding() forms.JobWinding {
	w := forms.JobWinding{Mandrel: o.mandrel, Former: o.former, Wire: o.wire, Insulation: o.insulation, Conductor: o.conductor}
	if o.springback.set {
		w.Springback = &o.springback.v
	}
	if o.turns.set {
		w.Turns = &o.turns.v
	}
	if o.pitch.set {
		w.Pitch = &o.pitch.v
	}
	if o.length.set {
		w.Length = &o.length.v
	}
	if o.leads.set {
		w.Leads = &o.leads.v
	}
	if o.temp.set {
		w.Temp = &o.temp.v
	}
	return w
}

// predictCoil resolves the flags and evaluates the model at f.
func predictCoil(co *coilOptions, so *stockOptions, f frequencyFlag) (spec.Spec, coil.Prediction, error) {
	cat, err := so.load()
	if err != nil {
		return spec.Spec{}, coil.Prediction{}, err
	}
	return spec.Predict(cat, co.winding(), f.v)
}
