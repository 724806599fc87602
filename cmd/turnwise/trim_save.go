package main

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"turnwise/internal/quantity"
	"turnwise/internal/report"

	"turnwise/coil/trim"
	"turnwise/forms"
)

// saveTrimCalibration appends the calibration to the stock file: the old
// file is copied to FILE.bak first, then the new text replaces it
// atomically; comments and layout are kept because the edit is text-level
// (forms.AppendStock).
func saveTrimCalibration(tc trimCoil, res *trimResult) (*report.SavedCalibration, error) {
	path := tc.stock.path
	// A stock file kept behind a symbolic link is updated where it lives;
	// renaming over the link would replace it with a copy.
	if st, err := os.Lstat(path); err == nil && st.Mode()&fs.ModeSymlink != 0 {
		if real, err := filepath.EvalSymlinks(path); err == nil {
			path = real
		}
	}
	orig, err := os.ReadFile(path)
	existed := err == nil
	var mode fs.FileMode = 0o644
	switch {
	case existed:
		if st, err := os.Stat(path); err == nil {
			mode = st.Mode().Perm()
		}
	case errors.Is(err, os.ErrNotExist):
		orig = nil
	default:
		return nil, fmt.Errorf("--save: read %s: %w", path, err)
	}

	// Names must resolve in the file (or the built-in catalog) once saved:
	// a mandrel or wire given as a bare size becomes a row of its own.
	mine, err := forms.LoadStock(bytes.NewReader(orig), path)
	if err != nil {
		return nil, fmt.Errorf("--save: %w", err)
	}
	builtIn, err := forms.BuiltIn()
	if err != nil {
		return nil, err
	}
	lookup := forms.Merge(builtIn, mine)
	cs := res.Coil
	g := cs.Geometry
	add := &forms.Catalog{}
	s := &report.SavedCalibration{Path: tc.stock.path, Mandrel: cs.SupportName, Wire: cs.Wire.Name, Springback: res.Calibration.Springback}
	const source = "given on the command line; added by turnwise trim --save"
	if cs.SupportKind == "mandrel" {
		if _, err := lookup.Mandrel(cs.SupportName); err != nil {
			add.Mandrels = append(add.Mandrels, forms.Mandrel{Name: cs.SupportName, Diameter: g.FormerDiameter, Kind: "rod", Source: source})
			s.Added = append(s.Added, fmt.Sprintf("mandrel %q (%s)", cs.SupportName, res.LF.Format(float64(g.FormerDiameter))))
		}
	} else if _, err := lookup.Former(cs.SupportName); err != nil {
		add.Formers = append(add.Formers, forms.Former{Name: cs.SupportName, Diameter: g.FormerDiameter, Kind: "former", Source: source})
		s.Added = append(s.Added, fmt.Sprintf("former %q (%s)", cs.SupportName, res.LF.Format(float64(g.FormerDiameter))))
	}
	if _, err := lookup.Wire(cs.Wire.Name); err != nil {
		w := cs.Wire
		w.Source = source
		add.Wires = append(add.Wires, w)
		s.Added = append(s.Added, fmt.Sprintf("wire %q", w.Name))
	}
	if prev, ok := lookup.Springback(cs.SupportName, cs.Wire.Name); ok {
		s.Superseded = &prev
	}
	s.Note = calibrationNote(res)
	add.Calibrations = []forms.Calibration{{Mandrel: cs.SupportName, Wire: cs.Wire.Name, Springback: res.Calibration.Springback, Note: s.Note}}

	text, err := forms.AppendStock(orig, path, add)
	if err != nil {
		return nil, fmt.Errorf("--save: %w", err)
	}
	if existed {
		s.Backup = path + ".bak"
		if err := writeFileAtomic(s.Backup, mode, nil, func(w io.Writer) error { _, err := w.Write(orig); return err }); err != nil {
			return nil, fmt.Errorf("--save: keep the old stock file: %w", err)
		}
	}
	// The stock file keeps its own permissions.
	if err := writeFileAtomic(path, mode, nil, func(w io.Writer) error { _, err := w.Write(text); return err }); err != nil {
		return nil, fmt.Errorf("--save: %w", err)
	}
	return s, nil
}

// calibrationNote records where a saved springback came from.
func calibrationNote(res *trimResult) string {
	r := res.Calibration.Reading
	g := res.Coil.Geometry
	var how string
	switch r.Kind {
	case trim.MeasureDirect:
		how = "meter " + quantity.FormatEng(float64(r.Inductance), "H", 3)
	case trim.MeasureResonance, trim.MeasureInCircuit:
		rs := res.Meas.Resonances[0]
		how = fmt.Sprintf("resonance %s with %s", quantity.FormatEng(float64(rs.Frequency), "Hz", 4), quantity.FormatCapacitance(float64(rs.Capacitance)))
	default:
		how = fmt.Sprintf("two-capacitor method, L %s", quantity.FormatEng(float64(r.Inductance), "H", 3))
	}
	return fmt.Sprintf("trim: %s ±%.1f %% on %s turns, %s long (springback %s … %s)", how, r.Uncertainty*100,
		quantity.FormatTurns(g.Turns), res.LF.Format(float64(g.WindingLength())), quantity.FormatPercent(res.Calibration.SpringbackLow), quantity.FormatPercent(res.Calibration.SpringbackHigh))
}
