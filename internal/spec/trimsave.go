package spec

import (
	"bytes"
	"fmt"

	"turnwise/coil/trim"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

// SavedCalibration is what `trim --save` wrote.
type SavedCalibration struct {
	Path, Backup string // the stock file; its previous version ("" when it is new)
	Mandrel      string // the mandrel or former, as named in the file
	Wire         string
	Springback   float64
	Note         string
	Added        []string           // rows added so that the calibration's names resolve
	Superseded   *forms.Calibration // the calibration in effect before, if any
}

// AppendCalibration adds the springback cal found for the coil cs (from
// the measurement m) to the stock file's text orig, read from path; the
// edit is text-level (forms.AppendStock), so comments and layout are kept.
// Names must resolve in the file (or the built-in catalog) once saved: a
// mandrel or wire given as a bare size becomes a row of its own. It
// returns the new text and what was saved (Path is shown, Backup is left
// for the caller that writes the files).
func AppendCalibration(orig []byte, path, shown string, cs Spec, cal trim.Calibration, m trim.Measurement, lf quantity.LengthFormat) ([]byte, *SavedCalibration, error) {
	mine, err := forms.LoadStock(bytes.NewReader(orig), path)
	if err != nil {
		return nil, nil, fmt.Errorf("--save: %w", err)
	}
	builtIn, err := forms.BuiltIn()
	if err != nil {
		return nil, nil, err
	}
	lookup := forms.Merge(builtIn, mine)
	g := cs.Geometry
	add := &forms.Catalog{}
	s := &SavedCalibration{Path: shown, Mandrel: cs.SupportName, Wire: cs.Wire.Name, Springback: cal.Springback}
	const source = "given on the command line; added by turnwise trim --save"
	if cs.SupportKind == "mandrel" {
		if _, err := lookup.Mandrel(cs.SupportName); err != nil {
			add.Mandrels = append(add.Mandrels, forms.Mandrel{Name: cs.SupportName, Diameter: g.FormerDiameter, Kind: "rod", Source: source})
			s.Added = append(s.Added, fmt.Sprintf("mandrel %q (%s)", cs.SupportName, lf.Format(float64(g.FormerDiameter))))
		}
	} else if _, err := lookup.Former(cs.SupportName); err != nil {
		add.Formers = append(add.Formers, forms.Former{Name: cs.SupportName, Diameter: g.FormerDiameter, Kind: "former", Source: source})
		s.Added = append(s.Added, fmt.Sprintf("former %q (%s)", cs.SupportName, lf.Format(float64(g.FormerDiameter))))
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
	s.Note = calibrationNote(cs, cal, m, lf)
	add.Calibrations = []forms.Calibration{{Mandrel: cs.SupportName, Wire: cs.Wire.Name, Springback: cal.Springback, Note: s.Note}}

	text, err := forms.AppendStock(orig, path, add)
	if err != nil {
		return nil, nil, fmt.Errorf("--save: %w", err)
	}
	return text, s, nil
}

// calibrationNote records where a saved springback came from.
func calibrationNote(cs Spec, cal trim.Calibration, m trim.Measurement, lf quantity.LengthFormat) string {
	r := cal.Reading
	g := cs.Geometry
	var how string
	switch r.Kind {
	case trim.MeasureDirect:
		how = "meter " + quantity.FormatEng(float64(r.Inductance), "H", 3)
	case trim.MeasureResonance, trim.MeasureInCircuit:
		rs := m.Resonances[0]
		how = fmt.Sprintf("resonance %s with %s", quantity.FormatEng(float64(rs.Frequency), "Hz", 4), quantity.FormatCapacitance(float64(rs.Capacitance)))
	default:
		how = fmt.Sprintf("two-capacitor method, L %s", quantity.FormatEng(float64(r.Inductance), "H", 3))
	}
	return fmt.Sprintf("trim: %s ±%.1f %% on %s turns, %s long (springback %s … %s)", how, r.Uncertainty*100,
		quantity.FormatTurns(g.Turns), lf.Format(float64(g.WindingLength())), quantity.FormatPercent(cal.SpringbackLow), quantity.FormatPercent(cal.SpringbackHigh))
}
