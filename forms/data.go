package forms

import (
	"embed"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"slices"
	"strconv"
	"strings"
	"sync"
	"turnwise/internal/quantity"

	"gonum.org/v1/gonum/unit"
)

// The built-in tables are CSV with a header row and # comment lines, so that
// contributors can add rows in any editor. Every row names its source.
//
//go:embed data/*.csv
var dataFS embed.FS

// enamelRow is one line of data/enamel.csv: maximum overall diameters.
type enamelRow struct {
	nominal, grade1, grade2 unit.Length
}

// swgRow is one line of data/swg.csv.
type swgRow struct {
	dia    unit.Length
	source string
}

// builtinData holds everything parsed from the embedded files.
type builtinData struct {
	enamel []enamelRow
	swg    map[int]swgRow // by gauge number; 7/0 is -6, 0 is 0
	cat    Catalog
	err    error
}

var (
	builtinOnce sync.Once
	builtinVal  builtinData
)

// loadBuiltin parses the embedded data once. Functions called from here take
// the data explicitly: calling loadBuiltin again inside the Once would deadlock.
func loadBuiltin() *builtinData {
	builtinOnce.Do(func() {
		builtinVal.err = builtinVal.load()
	})
	return &builtinVal
}

func (d *builtinData) load() error {
	var err error
	if d.enamel, err = loadEnamel(); err != nil {
		return err
	}
	if d.swg, err = loadSWG(); err != nil {
		return err
	}
	for n := -3; n <= 40; n++ {
		w, err := gaugeWire("awg", n, d)
		if err != nil {
			return err
		}
		d.cat.Wires = append(d.cat.Wires, w)
	}
	for n := -6; n <= 50; n++ {
		w, err := gaugeWire("swg", n, d)
		if err != nil {
			return err
		}
		d.cat.Wires = append(d.cat.Wires, w)
	}
	metric, err := loadMetricWire(d)
	if err != nil {
		return err
	}
	d.cat.Wires = append(d.cat.Wires, metric...)
	if d.cat.Mandrels, err = loadMandrels(); err != nil {
		return err
	}
	if d.cat.Materials, err = loadMaterials(); err != nil {
		return err
	}
	if d.cat.Formers, err = loadFormers(d.cat.Materials); err != nil {
		return err
	}
	return nil
}

// dataRow is one CSV record with its line number, fields keyed by header name.
type dataRow struct {
	line   int
	fields map[string]string
}

// readData reads an embedded CSV file whose header must equal header.
// The last column of every file is "source" and may not be empty.
func readData(name string, header ...string) ([]dataRow, error) {
	f, err := dataFS.Open("data/" + name)
	if err != nil {
		return nil, fmt.Errorf("forms: built-in data %s: %w", name, err)
	}
	defer f.Close()
	r := csv.NewReader(f)
	r.Comment = '#'
	r.FieldsPerRecord = len(header)
	r.TrimLeadingSpace = true
	head, err := r.Read()
	if err != nil {
		return nil, fmt.Errorf("forms: built-in data %s: header: %w", name, err)
	}
	if !slices.Equal(head, header) {
		return nil, fmt.Errorf("forms: built-in data %s: header is %q, want %q", name, head, header)
	}
	var rows []dataRow
	for {
		rec, err := r.Read()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			return nil, fmt.Errorf("forms: built-in data %s: %w", name, err)
		}
		line, _ := r.FieldPos(0)
		row := dataRow{line: line, fields: make(map[string]string, len(header))}
		for i, h := range header {
			row.fields[h] = strings.TrimSpace(rec[i])
		}
		if row.fields["source"] == "" {
			return nil, row.errorf(name, "source is empty; every row names where its numbers come from")
		}
		rows = append(rows, row)
	}
	return rows, nil
}

func (r dataRow) errorf(file, format string, args ...any) error {
	return fmt.Errorf("forms: built-in data %s: line %d: %s", file, r.line, fmt.Sprintf(format, args...))
}

func (r dataRow) length(file, field string) (unit.Length, error) {
	l, err := quantity.ParseLength(r.fields[field])
	if err != nil {
		return 0, r.errorf(file, "%s: %v", field, err)
	}
	if l <= 0 {
		return 0, r.errorf(file, "%s: must be positive", field)
	}
	return l, nil
}

func loadEnamel() ([]enamelRow, error) {
	const file = "enamel.csv"
	rows, err := readData(file, "nominal_mm", "grade1_max_mm", "grade2_max_mm", "source")
	if err != nil {
		return nil, err
	}
	var out []enamelRow
	for _, r := range rows {
		var mm [3]float64
		for i, k := range []string{"nominal_mm", "grade1_max_mm", "grade2_max_mm"} {
			v, err := strconv.ParseFloat(r.fields[k], 64)
			if err != nil || !(v > 0) || v > 100 {
				return nil, r.errorf(file, "%s %q: want a positive number of millimetres", k, r.fields[k])
			}
			mm[i] = v
		}
		e := enamelRow{
			nominal: unit.Length(mm[0] * 1e-3),
			grade1:  unit.Length(mm[1] * 1e-3),
			grade2:  unit.Length(mm[2] * 1e-3),
		}
		if !(e.nominal < e.grade1 && e.grade1 < e.grade2) {
			return nil, r.errorf(file, "want nominal < grade1 < grade2")
		}
		if len(out) > 0 && e.nominal <= out[len(out)-1].nominal {
			return nil, r.errorf(file, "nominal diameters must increase down the table")
		}
		out = append(out, e)
	}
	if len(out) < 2 {
		return nil, fmt.Errorf("forms: built-in data %s: fewer than two rows", file)
	}
	return out, nil
}

func loadSWG() (map[int]swgRow, error) {
	const file = "swg.csv"
	rows, err := readData(file, "gauge", "diameter", "source")
	if err != nil {
		return nil, err
	}
	out := make(map[int]swgRow, len(rows))
	for _, r := range rows {
		n, err := gaugeNumber(r.fields["gauge"])
		if err != nil {
			return nil, r.errorf(file, "gauge %q: %v", r.fields["gauge"], err)
		}
		if _, dup := out[n]; dup {
			return nil, r.errorf(file, "gauge %q listed twice", r.fields["gauge"])
		}
		d, err := r.length(file, "diameter")
		if err != nil {
			return nil, err
		}
		out[n] = swgRow{dia: d, source: r.fields["source"]}
	}
	for n := swgMin; n <= swgMax; n++ {
		if _, ok := out[n]; !ok {
			return nil, fmt.Errorf("forms: built-in data %s: gauge %s missing", file, gaugeLabel(n))
		}
	}
	return out, nil
}

func loadMetricWire(d *builtinData) ([]Wire, error) {
	const file = "wire.csv"
	rows, err := readData(file, "name", "bare", "insulation", "conductor", "source")
	if err != nil {
		return nil, err
	}
	var out []Wire
	for _, r := range rows {
		bare, err := r.length(file, "bare")
		if err != nil {
			return nil, err
		}
		w := Wire{
			Name:       r.fields["name"],
			System:     "metric",
			Bare:       bare,
			Overall:    bare,
			Insulation: r.fields["insulation"],
			Conductor:  r.fields["conductor"],
			Source:     r.fields["source"],
			Origin:     OriginBuiltIn,
		}
		if _, ok := conductors[w.Conductor]; !ok {
			return nil, r.errorf(file, "conductor %q: use copper, tinned or silver-plated", w.Conductor)
		}
		switch w.Insulation {
		case "none":
		case "grade1", "grade2":
			w.Overall, err = d.enamelOverall(bare, w.Insulation)
			if err != nil {
				return nil, r.errorf(file, "%v", err)
			}
			w.Source += "; overall: " + enamelSourceFor(w.Insulation)
		default:
			return nil, r.errorf(file, "insulation %q: use none, grade1 or grade2", w.Insulation)
		}
		out = append(out, w)
	}
	return out, nil
}

func loadMandrels() ([]Mandrel, error) {
	const file = "mandrels.csv"
	rows, err := readData(file, "name", "diameter", "kind", "source")
	if err != nil {
		return nil, err
	}
	var out []Mandrel
	for _, r := range rows {
		dia, err := r.length(file, "diameter")
		if err != nil {
			return nil, err
		}
		out = append(out, Mandrel{Name: r.fields["name"], Diameter: dia, Kind: r.fields["kind"], Source: r.fields["source"], Origin: OriginBuiltIn, Material: MaterialNone})
	}
	return out, nil
}

func loadFormers(materials []Material) ([]Former, error) {
	const file = "formers.csv"
	rows, err := readData(file, "name", "diameter", "kind", "material", "source")
	if err != nil {
		return nil, err
	}
	var out []Former
	for _, r := range rows {
		dia, err := r.length(file, "diameter")
		if err != nil {
			return nil, err
		}
		f := Former{Name: r.fields["name"], Diameter: dia, Kind: r.fields["kind"], Source: r.fields["source"], Origin: OriginBuiltIn}
		m, ok := findMaterial(materials, r.fields["material"])
		if !ok {
			return nil, r.errorf(file, "material %q is not a row of materials.csv", r.fields["material"])
		}
		f.setMaterial(m)
		out = append(out, f)
	}
	return out, nil
}

// Expansion limits: outside them a coefficient is a typo (per kelvin).
const (
	minExpansion = -20e-6
	maxExpansion = 500e-6
)

func loadMaterials() ([]Material, error) {
	const file = "materials.csv"
	rows, err := readData(file, "name", "expansion", "low", "high", "source")
	if err != nil {
		return nil, err
	}
	var out []Material
	for _, r := range rows {
		m := Material{Name: r.fields["name"], Source: r.fields["source"], Origin: OriginBuiltIn}
		if nameKey(m.Name) == MaterialNone {
			return nil, r.errorf(file, "%q is reserved for a self-supporting coil", MaterialNone)
		}
		for _, c := range []struct {
			key string
			to  *float64
		}{{"expansion", &m.Expansion}, {"low", &m.Low}, {"high", &m.High}} {
			v, err := quantity.ParsePerKelvin(r.fields[c.key])
			if err != nil {
				return nil, r.errorf(file, "%s: %v", c.key, err)
			}
			if v < minExpansion || v > maxExpansion {
				return nil, r.errorf(file, "%s: %s is outside %s to %s", c.key, quantity.FormatPPMPerK(v, 3),
					quantity.FormatPPMPerK(minExpansion, 3), quantity.FormatPPMPerK(maxExpansion, 3))
			}
			*c.to = v
		}
		if !(m.Low <= m.Expansion && m.Expansion <= m.High) {
			return nil, r.errorf(file, "want low <= expansion <= high")
		}
		if _, dup := findMaterial(out, m.Name); dup {
			return nil, r.errorf(file, "material %q listed twice", m.Name)
		}
		out = append(out, m)
	}
	if _, ok := findMaterial(out, "copper"); !ok {
		return nil, fmt.Errorf("forms: built-in data %s: no copper row", file)
	}
	return out, nil
}

// findMaterial finds a material by name, case and spacing ignored.
func findMaterial(ms []Material, name string) (Material, bool) {
	k := nameKey(name)
	for _, m := range ms {
		if nameKey(m.Name) == k {
			return m, true
		}
	}
	return Material{}, false
}

// setMaterial gives f material m's coefficient and source.
func (f *Former) setMaterial(m Material) {
	f.Material, f.Expansion, f.ExpansionLow, f.ExpansionHigh = m.Name, m.Expansion, m.Low, m.High
	f.ExpansionSource = m.Source
}
