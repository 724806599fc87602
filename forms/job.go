package forms

import (
	"cmp"
	"errors"
	"fmt"
	"io"
	"slices"
	"strconv"
	"strings"
	"time"

	"github.com/BurntSushi/toml"
	"gonum.org/v1/gonum/unit"

	"turnwise/internal/quantity"
)

// Job is a batch of coils to build, read from a job file (TOML) by LoadJob.
// Values are parsed and range-checked as far as the file alone allows;
// names (wire, mandrel, former) are looked up later against the stock.
type Job struct {
	File  string    // name given to LoadJob
	Title string    // required
	Paper string    // "A4" (default) or "Letter"
	Units string    // display units: "mm" (default) or "in"
	Stock string    // stock file as written, relative to the job file; may be empty
	Use   string    // "builtin", "mine", "both" or "" (both when Stock is set, else builtin)
	Date  time.Time // date to print; zero means the day the sheets are made
	Notes string
	// TempLow and TempHigh are the workshop's temperature range (kelvin)
	// for the drift of tanks on the sheet: the temp-range key, default
	// 15 °C … 35 °C (DefaultTempLow, DefaultTempHigh).
	TempLow, TempHigh unit.Temperature
	Coils             []JobCoil
	// Circuits are circuit files as written (relative to the job file):
	// each gets a page on the build sheet.
	Circuits []string
	// Coupler is the [coupler] table (job_coupler.go); nil when absent.
	Coupler *JobCoupler

	lines map[string]int // top-level key -> line
}

// KeyLine returns the line of a top-level key, or 0.
func (j *Job) KeyLine(key string) int { return j.lines[key] }

// Coil finds a coil by name, ignoring case and repeated spaces.
func (j *Job) Coil(name string) (*JobCoil, error) {
	if i := findName(j.Coils, name, func(c JobCoil) string { return c.Name }); i >= 0 {
		return &j.Coils[i], nil
	}
	among := make([]string, len(j.Coils))
	for i, c := range j.Coils {
		among[i] = strconv.Quote(c.Name)
	}
	return nil, &LookupError{Kind: "coil", Name: name, Among: among,
		Suggestions: suggest(name, j.Coils, func(c JobCoil) string { return c.Name })}
}

// JobCoil is one [[coil]] of a job: a fixed winding (Target nil, Winding.Turns
// set) or a target for the design search (Target set), with an optional tap
// and two-gang span.
type JobCoil struct {
	Name     string
	Quantity int // how many to build, at least 1
	Notes    string
	Transmit bool // carries transmitter power: the RF caution leads
	Line     int  // line of its [[coil]] header

	Winding JobWinding
	Target  *JobTarget // nil for a fixed winding
	Tap     *JobTap    // nil when untapped
	// CapTempco is the cap-tempco key as written: the tank capacitor's
	// class (C0G, N750, air …) or coefficient, for its drift on the
	// sheet; "" means C0G.
	CapTempco string
	// TankCap is the tank-cap key of a fixed winding: the capacitor it
	// resonates with, for its tank's drift on the sheet; nil when absent.
	// (A design target's capacitor is its cap key, Target.Cap.)
	TankCap *unit.Capacitance
	Span    *JobSpan // nil unless a two-gang capacitor tunes it

	keys map[string]jobKey
}

type jobKey struct {
	raw  string // as written, for messages
	line int
}

// KeyLine returns the line of key in this coil, falling back to the line of
// its [[coil]] header.
func (c *JobCoil) KeyLine(key string) int {
	if k, ok := c.keys[key]; ok && k.line > 0 {
		return k.line
	}
	return c.Line
}

// Raw returns key's value as written in the file, or "" when absent.
func (c *JobCoil) Raw(key string) string { return c.keys[key].raw }

// Has reports whether key was given for this coil.
func (c *JobCoil) Has(key string) bool { _, ok := c.keys[key]; return ok }

// Label is how messages name the coil: coil "L1".
func (c *JobCoil) Label() string { return fmt.Sprintf("coil %q", c.Name) }

// JobWinding holds the keys shared with predict's flags, under the same
// names. Strings are as written (stock names or sizes); nil pointers are
// keys not given. For a design target the mandrel, former and wire, when
// given, pin the search to them.
type JobWinding struct {
	Mandrel    string       // slide off after winding (self-supporting)
	Former     string       // the coil stays on it
	Wire       string       // gauge, bare diameter or stock name
	Insulation string       // none, grade1..3 or an overall diameter
	Conductor  string       // copper, silver-plated, tinned
	Plating    *unit.Length // plating thickness; nil: the conductor's typical
	Springback *float64
	Turns      *float64
	Pitch      *unit.Length
	Length     *unit.Length // outside length over the wire
	Leads      *unit.Length // each lead; required
	Temp       *unit.Temperature
	Freq       *unit.Frequency // operating frequency
}

// JobTarget is what the design search must meet, and its constraints; the
// keys follow the design command's flags.
type JobTarget struct {
	Inductance    *unit.Inductance  // at the terminals at Freq
	Cap           *unit.Capacitance // resonate with this at Freq
	Stray         *unit.Capacitance
	Tolerance     *float64 // fraction
	Support       string   // "", "mandrel" (self-supporting) or "former"
	MaxLength     *unit.Length
	MaxDiameter   *unit.Length
	MaxWireLength *unit.Length
	MinSRFRatio   *float64
	Prefer        string // "", "q", "small", "easy"
	// Band, with Trimmer, asks for a coil that, with Cap (fixed) and Stray,
	// tunes the whole band with the trimmer (the design command's --band
	// and --trimmer); nil otherwise. The band's centre is the operating
	// frequency.
	Band    *Band
	Trimmer *[2]unit.Capacitance // the trimmer's least and most
}

// JobTap places a tap: by turns from the cold (ground) end, or by the
// unloaded voltage ratio at the tap. Exactly one is set.
type JobTap struct {
	Turns *float64
	Ratio *float64 // voltage ratio, 0 … 1
}

// JobSpan is a two-gang capacitor: section A across the whole coil,
// section B from the tap to ground, one shaft. The keys are the span
// command's flags; zero values mean its defaults.
type JobSpan struct {
	GangA, GangB   CapRange // GangB equals GangA unless gang-b is given
	GangBSet       bool
	Law            string // slc, slf, slw or a measured table file as written (relative to the job file)
	TrimA, TrimB   unit.Capacitance
	StrayA, StrayB unit.Capacitance
	Bands          []Band // bands to cover, in file order
	Steps          int    // dial rows
	LoadedQ        float64
	Margin         float64 // fraction
	ChooseTap      bool    // choose the tap for the bands
}

// CapRange is a capacitance range MIN-MAX.
type CapRange struct{ Min, Max unit.Capacitance }

// Keys a job file takes, in the order a reader meets them.
var (
	jobTopKeys  = []string{"title", "paper", "units", "stock", "use", "date", "notes", "temp-range", "circuit", "coupler", "coil"}
	jobCoilKeys = []string{
		"name", "quantity", "notes",
		"mandrel", "former", "wire", "insulation", "conductor", "springback",
		"turns", "pitch", "length", "leads", "temp", "freq",
		"inductance", "cap", "stray", "tolerance", "support",
		"max-length", "max-diameter", "max-wire-length", "min-srf-ratio", "prefer", "band", "trimmer",
		"tap", "tap-ratio", "transmit", "cap-tempco", "tank-cap",
		"gang", "gang-b", "law", "trim-a", "trim-b", "stray-a", "stray-b", "bands", "steps",
		"loaded-q", "margin", "choose-tap",
	}
	jobSpanKeys = []string{"gang", "gang-b", "law", "trim-a", "trim-b", "stray-a", "stray-b", "bands", "steps", "loaded-q", "margin", "choose-tap"}
)

// Limits on job values: outside them a value is a typo.
const (
	maxJobCoils    = 500
	maxJobQuantity = 10000
	maxJobSteps    = 10000
)

// LoadJob reads a job file. name labels errors (usually the path). Every
// error is a *ParseError with Kind "job" and the line; unknown keys are
// errors, with a suggestion when one is close. When the file has several
// problems the first in the file is returned.
//
// The format, with every key:
//
//	title = "Club build night"          # required
//	paper = "A4"                        # or "Letter"
//	units = "mm"                        # or "in"
//	stock = "bench.toml"                # relative to the job file
//	use   = "both"                      # builtin, mine or both
//	date  = 2026-03-14                  # printed on the cover; default today
//	notes = "..."
//	circuit = "circuits/filter.toml"    # or a list: a circuit page each
//	[coupler] circuit = "..." bands = [...] power = "100W"   # a match map page (job_coupler.go)
//
//	[[coil]]                            # a fixed winding: predict's flags
//	name = "L1"                         # required, unique
//	quantity = 3
//	mandrel = "6mm drill"               # or former = "pvc 20mm"
//	wire = "1mm"                        # gauge, diameter or stock name
//	insulation = "none"   conductor = "silver-plated"   springback = "2%"
//	turns = 5                           # quarter turns
//	length = "8mm"                      # or pitch = "1.6mm"; neither: close-wound
//	leads = "5mm"                       # required
//	temp = "40C"   freq = "137.5MHz"
//	tank-cap = "180pF"                  # the capacitor it resonates with: its tank's drift
//	cap-tempco = "N750"                 # that capacitor's class or ppm/K; default C0G
//
//	[[coil]]                            # a target for the design search
//	name = "L2"
//	inductance = "48nH"                 # or cap = "22pF" with freq
//	freq = "137.5MHz"   leads = "5mm"
//	stray = "2pF"   tolerance = "2%"   support = "mandrel"
//	max-length = "15mm"   max-diameter = "12mm"   max-wire-length = "200mm"
//	min-srf-ratio = 3   prefer = "q"
//
//	[[coil]]                            # a target tuned over a band
//	name = "L3"
//	band = "144-146MHz"                 # instead of inductance or freq; its centre is the operating frequency
//	trimmer = "2-10pF"                  # in parallel: tunes both band edges (10 % of its swing kept free at each)
//	cap = "15pF"   stray = "2pF"        # the fixed capacitor (optional) and wiring
//	leads = "5mm"
//
//	tap = 2.5                           # turns from the cold end, or
//	tap-ratio = 0.25                    # unloaded voltage ratio
//	transmit = true                     # RF caution first on the page
//
//	gang = "12-365pF"   gang-b = "10-290pF"   law = "slc"   # two-gang: span's flags
//	trim-a = "5pF"   trim-b = "5pF"   stray-a = "5pF"   stray-b = "5pF"
//	steps = 11   loaded-q = 60   margin = "3%"   choose-tap = true
//	bands = ["80m=3.5-3.8MHz", "7.0-7.2MHz"]
func LoadJob(r io.Reader, name string) (*Job, error) {
	data, err := io.ReadAll(io.LimitReader(r, MaxFileBytes+1))
	if err != nil {
		return nil, &ParseError{Kind: "job", File: name, Err: err}
	}
	text := string(data)
	if err := checkShape(text, "job", name); err != nil {
		return nil, err
	}
	var doc map[string]any
	if _, err := toml.Decode(text, &doc); err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, &ParseError{Kind: "job", File: name, Line: pe.Position.Line, Err: &syntaxError{pe}}
		}
		return nil, &ParseError{Kind: "job", File: name, Err: err}
	}
	l := &jobLoader{file: name, idx: indexTOML(text)}
	job := l.load(doc)
	if len(l.errs) > 0 {
		return nil, slices.MinFunc(l.errs, func(a, b *ParseError) int { return a.Line - b.Line })
	}
	return job, nil
}

type jobLoader struct {
	file string
	idx  *tomlIndex
	errs []*ParseError
}

func (l *jobLoader) fail(line int, field string, err error) {
	l.errs = append(l.errs, &ParseError{Kind: "job", File: l.file, Line: line, Field: field, Err: err})
}

func (l *jobLoader) load(doc map[string]any) *Job {
	job := &Job{File: l.file, Paper: "A4", Units: "mm", lines: map[string]int{}}
	keys := make([]string, 0, len(doc))
	for k := range doc {
		keys = append(keys, k)
	}
	slices.SortFunc(keys, func(a, b string) int { return cmp.Or(l.idx.top[a]-l.idx.top[b], strings.Compare(a, b)) })
	top := &jobEntry{l: l, m: doc, label: "", line: func(k string) int {
		if k == "" {
			return 1 // a missing top-level key: the top of the file
		}
		return l.idx.top[k]
	}}
	for _, k := range keys {
		job.lines[k] = l.idx.top[k]
		if slices.Contains(jobTopKeys, k) {
			continue
		}
		top.fail(k, "", unknownKeyError(k, k, jobTopKeys, fmt.Sprintf("a job file takes %s and [[coil]] sections", strings.Join(jobTopKeys[:len(jobTopKeys)-1], ", "))))
	}

	if s, ok := top.str("title", true, `"Club build night"`); ok {
		job.Title = strings.TrimSpace(s)
	}
	if s, ok := top.choice("paper", []string{"A4", "Letter"}); ok {
		job.Paper = s
	}
	if s, ok := top.choice("units", []string{"mm", "in"}); ok {
		job.Units = s
	}
	if s, ok := top.str("stock", false, `"bench.toml"`); ok {
		job.Stock = strings.TrimSpace(s)
	}
	if s, ok := top.choice("use", []string{"builtin", "mine", "both"}); ok {
		job.Use = s
		if s == "mine" && job.Stock == "" {
			top.fail("use", "use", errors.New(`"mine" needs a stock file: add stock = "bench.toml"`))
		}
	}
	job.Date = top.date("date")
	if s, ok := top.str("notes", false, `"bring flux"`); ok {
		job.Notes = s
	}
	job.TempLow, job.TempHigh = DefaultTempLow, DefaultTempHigh
	if s, ok := top.str("temp-range", false, `"15C-35C"`); ok {
		lo, hi, err := quantity.ParseTemperatureRange(s)
		if err != nil {
			top.fail("temp-range", "temp-range", err)
		} else {
			job.TempLow, job.TempHigh = lo, hi
		}
	}

	switch v := doc["circuit"].(type) {
	case nil:
	case string:
		job.Circuits = []string{strings.TrimSpace(v)}
	case []any:
		for _, x := range v {
			s, ok := x.(string)
			if !ok {
				top.fail("circuit", "circuit", errors.New(`write the circuit files in quotes, e.g. circuit = ["filter.toml"]`))
				break
			}
			job.Circuits = append(job.Circuits, strings.TrimSpace(s))
		}
	default:
		top.fail("circuit", "circuit", errors.New(`write circuit = "filter.toml" (a circuit file, relative to the job file) or a list of them`))
	}
	job.Coupler = l.coupler(doc)
	v, present := doc["coil"]
	if !present {
		top.fail("", "", errors.New("no coils: add a [[coil]] section with at least a name"))
		return job
	}
	list, ok := tableList(v)
	if !ok {
		top.fail("coil", "coil", errors.New("write each coil as its own [[coil]] section (double brackets)"))
		return job
	}
	if len(list) > maxJobCoils {
		top.fail("coil", "coil", fmt.Errorf("%d coils; a job holds at most %d", len(list), maxJobCoils))
		return job
	}
	names := map[string]int{}
	for i, m := range list {
		c := l.coil(i, m)
		if c.Name != "" {
			k := nameKey(c.Name)
			if prev, dup := names[k]; dup {
				l.fail(c.KeyLine("name"), c.Label()+": name", fmt.Errorf("already used on line %d; give each coil its own name", prev))
			} else {
				names[k] = c.KeyLine("name")
			}
		}
		job.Coils = append(job.Coils, c)
	}
	return job
}
