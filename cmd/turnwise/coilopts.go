package main

import (
	"fmt"
	"turnwise/coil"
	"turnwise/forms"
	"turnwise/internal/spec"

	"github.com/spf13/pflag"
)

// coilOptions are the flags that describe one wound coil; predict, sheet,
// tap, span and trim share them.
type coilOptions struct {
	mounting   mountingFlag
	mandrel    string
	former     string
	wire       string
	insulation string
	conductor  string
	plating    lengthFlag
	springback percentFlag
	turns      turnsFlag
	pitch      lengthFlag
	length     lengthFlag
	leads      lengthFlag
	temp       temperatureFlag
}

func (o *coilOptions) addFlags(fs *pflag.FlagSet) {
	fs.Var(&o.mounting, "mounting", "how the coil is mounted, which sets the self-resonance used for effective L and Q: grounded (one end on ground) or floating (both ends live)")
	fs.StringVar(&o.mandrel, "mandrel", "", "wind on this mandrel and slide it out (self-supporting): a stock name or a diameter, e.g. 6mm or 1/4in")
	fs.StringVar(&o.former, "former", "", "wind on this former and leave the coil on it: a stock name or an outside diameter, e.g. 20mm")
	fs.StringVar(&o.wire, "wire", "", "a gauge (22awg, 18swg), a diameter (1mm: bare copper unless --insulation says otherwise) or a stock wire name")
	fs.StringVar(&o.insulation, "insulation", "", "none, grade1, grade2 (enamel) or the diameter over the insulation, e.g. 1.06mm (default: the stock row's, or none for a plain diameter)")
	fs.StringVar(&o.conductor, "conductor", "", "copper, silver-plated or tinned (default: the stock row's, or copper)")
	fs.Var(&o.plating, "plating", "thickness of a tinned or silver-plated wire's plating, e.g. 1um (default: tin 1um, silver 2um)")
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
	return forms.JobWinding{Mandrel: o.mandrel, Former: o.former, Wire: o.wire, Insulation: o.insulation, Conductor: o.conductor,
		Springback: o.springback.ptr(), Turns: o.turns.ptr(), Pitch: o.pitch.ptr(), Length: o.length.ptr(),
		Leads: o.leads.ptr(), Temp: o.temp.ptr(), Plating: o.plating.ptr()}
}

// predictCoil resolves the flags and evaluates the model at f.
func predictCoil(co *coilOptions, so *stockOptions, f frequencyFlag) (spec.Spec, coil.Prediction, error) {
	cat, err := so.load()
	if err != nil {
		return spec.Spec{}, coil.Prediction{}, err
	}
	return spec.PredictMounted(cat, co.winding(), f.v, co.mounting.v)
}

// mountingFlag takes grounded or floating (coil.ParseMounting); the zero
// value is grounded.
type mountingFlag struct{ v coil.Mounting }

func (f *mountingFlag) String() string { return f.v.String() }
func (f *mountingFlag) Type() string   { return "grounded|floating" }
func (f *mountingFlag) Set(s string) error {
	m, err := coil.ParseMounting(s)
	if err != nil {
		return fmt.Errorf("%v: use grounded (one end on ground or a bypassed rail) or floating (both ends live)", err)
	}
	f.v = m
	return nil
}
