package forms

import (
	"errors"
	"fmt"
	"math"

	"turnwise/internal/quantity"
)

// JobCoupler is a job file's [coupler] table: a circuit file with
// adjustable capacitors and a [load] node, mapped on the build sheet at
// the centre of each band (or at each frequency) and, with a power, with
// the stress its parts see and the cautions. The keys follow the match
// command's flags:
//
//	[coupler]
//	circuit = "circuits/coupler.toml"   # relative to the job file
//	bands = ["80m=3.5-3.8MHz", "40m=7.0-7.2MHz"]   # and/or freq = ["14.2MHz"]
//	power = "100W"                      # optional: stress, ratings, cautions
//	swr = 1.5                           # optional, the default
type JobCoupler struct {
	Line    int    // line of the [coupler] header
	Circuit string // as written
	Bands   []Band
	Freqs   []float64 // Hz
	Power   float64   // W; 0 when not given
	SWR     float64   // 0 means the match command's default
}

var jobCouplerKeys = []string{"circuit", "bands", "freq", "power", "swr"}

// coupler reads the [coupler] table; nil when the job has none.
func (l *jobLoader) coupler(doc map[string]any) *JobCoupler {
	v, present := doc["coupler"]
	if !present {
		return nil
	}
	line := l.idx.top["coupler"]
	m, ok := v.(map[string]any)
	if !ok {
		l.fail(line, "coupler", errors.New(`write a table: [coupler] with circuit = "circuits/coupler.toml" and bands = [...]`))
		return nil
	}
	e := &jobEntry{l: l, m: m, label: "coupler", line: func(string) int { return line }}
	for k := range m {
		if !containsString(jobCouplerKeys, k) {
			e.fail(k, k, fmt.Errorf("unknown key %q; [coupler] takes circuit, bands, freq, power and swr", k))
			e.typo = true
		}
	}
	c := &JobCoupler{Line: line}
	if s, ok := e.str("circuit", true, `"circuits/coupler.toml"`); ok {
		c.Circuit = s
	}
	for _, s := range e.strings("bands", `"40m=7.0-7.2MHz"`) {
		b, err := ParseBand(s)
		if err != nil {
			e.fail("bands", "bands", err)
			continue
		}
		c.Bands = append(c.Bands, b)
	}
	for _, s := range e.strings("freq", `"14.2MHz"`) {
		f, err := quantity.ParseFrequency(s)
		if err != nil {
			e.fail("freq", "freq", err)
			continue
		}
		c.Freqs = append(c.Freqs, float64(f))
	}
	if len(c.Bands) == 0 && len(c.Freqs) == 0 && e.m["bands"] == nil && e.m["freq"] == nil {
		e.missing(errors.New(`add bands = ["40m=7.0-7.2MHz", ...] or freq = ["14.2MHz", ...]: where to map the coupler`))
	}
	if s, ok := e.str("power", false, `"100W"`); ok {
		p, err := quantity.ParsePower(s)
		switch {
		case err != nil:
			e.fail("power", "power", err)
		case !(p >= 0) || math.IsInf(p, 0):
			e.fail("power", "power", errors.New(`must be zero or positive, e.g. power = "100W"`))
		default:
			c.Power = p
		}
	}
	if _, present := e.m["swr"]; present {
		if x, ok := e.number("swr", "1.5"); ok {
			if !(x > 1) {
				e.fail("swr", "swr", errors.New("must be above 1, e.g. swr = 1.5"))
			} else {
				c.SWR = x
			}
		}
	}
	return c
}

// strings reads key as a list of strings (a single string counts as a
// list of one).
func (e *jobEntry) strings(key, example string) []string {
	v, present := e.m[key]
	if !present {
		return nil
	}
	if s, ok := v.(string); ok {
		return []string{s}
	}
	list, ok := v.([]any)
	if !ok {
		e.fail(key, key, fmt.Errorf("is a %s; write a list, e.g. %s = [%s]", tomlType(v), key, example))
		return nil
	}
	var out []string
	for i, x := range list {
		s, ok := x.(string)
		if !ok {
			e.fail(key, fmt.Sprintf("%s[%d]", key, i+1), fmt.Errorf("write each in quotes, e.g. %s", example))
			continue
		}
		out = append(out, s)
	}
	return out
}

func containsString(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}
