package spec

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"gonum.org/v1/gonum/unit"

	"turnwise/coil/circuit"
	"turnwise/forms"
)

// CircuitFlags are the circuit command's flags that CircuitSettings takes
// as text or checks beyond their values.
type CircuitFlags struct {
	From, To                Given
	Log, LogSet             bool
	Bands                   []string
	BandsFile               string
	At                      []string
	ParseAt                 func(string) (unit.Frequency, error) // the frequency flag's parser
	LOSet, IFSet, SignalSet bool
	Plot, Touchstone, Spice string // output files
}

// ApplyFlags checks the circuit command's flags and takes the bands, the
// --at frequencies and the sweep scale into set. Errors name the flag.
func (set *CircuitSettings) ApplyFlags(f CircuitFlags) error {
	if set.Points < 2 || set.Points > 1_000_000 {
		return Usagef("--points %d: give 2 to 1000000 points", set.Points)
	}
	if f.From.Set && f.To.Set && !(set.To > set.From) {
		return Usagef("--from %s is not below --to %s; give the sweep low to high", f.From.Raw, f.To.Raw)
	}
	if f.LogSet {
		v := f.Log
		set.Log = &v
	}
	for _, b := range f.Bands {
		fb, err := forms.ParseBand(b)
		if err != nil {
			return &FlagError{Flag: "band", Err: err}
		}
		set.Bands = append(set.Bands, circuit.Band{Name: fb.Name, Low: float64(fb.Low), High: float64(fb.High)})
	}
	if f.BandsFile != "" {
		file, err := os.Open(f.BandsFile)
		if err != nil {
			return Usagef("--bands: %q cannot be read; check the path", f.BandsFile)
		}
		defer file.Close()
		list, err := forms.LoadBands(file, f.BandsFile)
		if err != nil {
			return err
		}
		for _, b := range list {
			set.Bands = append(set.Bands, circuit.Band{Name: b.Name, Low: float64(b.Low), High: float64(b.High)})
		}
	}
	for _, a := range f.At {
		v, err := f.ParseAt(a)
		if err != nil {
			return &FlagError{Flag: "at", Err: err}
		}
		if !(v > 0) {
			return Usagef("--at %s: give a positive frequency", a)
		}
		set.At = append(set.At, float64(v))
	}
	if f.LOSet != f.IFSet {
		return Usagef("--lo and --if go together: give both, e.g. --lo 116MHz --if 29MHz")
	}
	if f.SignalSet && !f.LOSet {
		return Usagef("--signal needs --lo and --if")
	}
	for flag, path := range map[string]string{"plot": f.Plot, "touchstone": f.Touchstone, "spice": f.Spice} {
		if path == "" {
			continue
		}
		ext := strings.ToLower(filepath.Ext(path))
		ok := map[string][]string{"plot": {".svg", ".png"}, "touchstone": {".s1p", ".s2p"}, "spice": {".cir", ".sp", ".net"}}[flag]
		good := false
		for _, e := range ok {
			good = good || ext == e
		}
		if !good {
			return Usagef("--%s %s: the file name must end in %s", flag, path, strings.Join(ok, " or "))
		}
	}
	return nil
}

// CheckTouchstoneName refuses a --touchstone file whose extension does not
// give the circuit's number of ports.
func (m *CircuitModel) CheckTouchstoneName(path string) error {
	want := fmt.Sprintf(".s%dp", len(m.Net.Ports))
	if strings.ToLower(filepath.Ext(path)) != want {
		return Usagef("--touchstone %s: this circuit has %d port(s); name the file %s", path, len(m.Net.Ports), want)
	}
	return nil
}
