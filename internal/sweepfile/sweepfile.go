package sweepfile

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"

	"turnwise/coil"
	"turnwise/coil/sweep"
	"turnwise/forms/touchstone"
)

// Files names the sweep of the coil and, optionally, the jig's open and
// short sweeps (both or neither), measured with the same fixture.
type Files struct {
	Sweep       string
	Open, Short string
	Fixture     sweep.Fixture
}

// Loaded is a sweep ready for the fit.
type Loaded struct {
	Points []sweep.Point
	Ports  int
	Z0     float64
	// Corrected reports that open/short correction was applied.
	Corrected bool
}

// Load reads the files and returns the coil's impedance.
func Load(f Files) (Loaded, error) {
	if (f.Open == "") != (f.Short == "") {
		return Loaded{}, &coil.InputError{Param: "open", Reason: "open/short correction needs both --open and --short files of the jig"}
	}
	pts, d, err := ReadImpedance(f.Sweep, f.Fixture)
	if err != nil {
		return Loaded{}, err
	}
	out := Loaded{Points: pts, Ports: d.Ports, Z0: d.Z0}
	if f.Open == "" {
		return out, nil
	}
	open, _, err := readImpedance(f.Open, "open", f.Fixture)
	if err != nil {
		return Loaded{}, err
	}
	short, _, err := readImpedance(f.Short, "short", f.Fixture)
	if err != nil {
		return Loaded{}, err
	}
	if out.Points, err = sweep.Correct(pts, open, short); err != nil {
		return Loaded{}, err
	}
	out.Corrected = true
	return out, nil
}

// MaxSweepBytes is the largest Touchstone file read: 64 MiB, far above a
// sweep of touchstone.MaxLines points, checked before reading it whole.
const MaxSweepBytes = 64 << 20

// readLimited reads name, refusing a file above MaxSweepBytes. role is
// the file's part in the request: "sweep" (the coil), "open" or "short"
// (the jig alone); a missing file is a *coil.InputError with that Param,
// so the message names the flag that gave the path.
func readLimited(name, role string) ([]byte, error) {
	f, err := os.Open(name)
	if errors.Is(err, fs.ErrNotExist) {
		reason := fmt.Sprintf("sweep file %q does not exist; check the path (demos are in testdata/sweep/)", name)
		if role != "sweep" {
			reason = fmt.Sprintf("the jig's %s sweep %q does not exist; check the path (demos are in testdata/sweep/)", role, name)
		}
		return nil, &coil.InputError{Param: role, Reason: reason}
	}
	if err != nil {
		return nil, err
	}
	defer f.Close()
	b, err := io.ReadAll(io.LimitReader(f, MaxSweepBytes+1))
	if err != nil {
		return nil, err
	}
	if len(b) > MaxSweepBytes {
		return nil, fmt.Errorf("%s: larger than the %d MiB limit for a sweep file; is this the right file?", name, MaxSweepBytes>>20)
	}
	return b, nil
}

// ReadImpedance reads one Touchstone file (the port count from its
// extension) and converts it with the fixture.
func ReadImpedance(name string, fx sweep.Fixture) ([]sweep.Point, touchstone.Data, error) {
	return readImpedance(name, "sweep", fx)
}

// readImpedance is ReadImpedance for the file in role (see readLimited).
func readImpedance(name, role string, fx sweep.Fixture) ([]sweep.Point, touchstone.Data, error) {
	b, err := readLimited(name, role)
	if err != nil {
		return nil, touchstone.Data{}, err
	}
	d, err := touchstone.Read(bytes.NewReader(b), touchstone.PortsFromName(name))
	if err != nil {
		return nil, d, fmt.Errorf("%s: %w", name, err)
	}
	pts, err := Impedance(d, fx)
	if err != nil {
		return nil, d, fmt.Errorf("%s: %w", name, err)
	}
	return pts, d, nil
}

// Impedance converts read data with the fixture.
func Impedance(d touchstone.Data, fx sweep.Fixture) ([]sweep.Point, error) {
	s, err := d.ToS()
	if err != nil {
		return nil, &coil.InputError{Param: "sweep", Reason: err.Error()}
	}
	sp := make([]sweep.SPoint, len(s.Points))
	for i, p := range s.Points {
		sp[i] = sweep.SPoint{Frequency: p.Frequency, S: p.M}
	}
	return sweep.Impedance(fx, d.Ports, d.Z0, sp)
}
