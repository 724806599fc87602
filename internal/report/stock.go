package report

import (
	"fmt"
	"io"
	"text/tabwriter"
	"turnwise/forms"
	"turnwise/internal/quantity"
)

type StockRecord struct {
	Schema       int                 `json:"schema"`
	Wires        []WireRecord        `json:"wires,omitempty"`
	Mandrels     []SupportRecord     `json:"mandrels,omitempty"`
	Formers      []SupportRecord     `json:"formers,omitempty"`
	Calibrations []CalibrationRecord `json:"calibrations,omitempty"`
}

type WireRecord struct {
	Name       string  `json:"name"`
	System     string  `json:"system"`
	Bare       float64 `json:"wire_diameter"`
	Overall    float64 `json:"wire_overall_diameter"`
	Insulation string  `json:"insulation"`
	Conductor  string  `json:"conductor"`
	Source     string  `json:"source"`
	Origin     string  `json:"origin"`
}

type SupportRecord struct {
	Name     string  `json:"name"`
	Kind     string  `json:"kind"`
	Diameter float64 `json:"diameter"`
	Source   string  `json:"source"`
	Origin   string  `json:"origin"`
}

type CalibrationRecord struct {
	Mandrel    string  `json:"mandrel"`
	Wire       string  `json:"wire"`
	Springback float64 `json:"springback"`
	Note       string  `json:"note"`
	Origin     string  `json:"origin"`
}

func originNote(source, origin string) string {
	if origin == "" || origin == forms.OriginBuiltIn {
		return source
	}
	return source + " [" + origin + "]"
}

// WriteStockJSON writes the catalog rows of kind ("all", "wire",
// "mandrel", "former" or "calibration") as JSON.
func WriteStockJSON(w io.Writer, cat *forms.Catalog, kind string) error {
	want := func(s string) bool { return kind == "all" || kind == s }
	doc := StockRecord{Schema: SchemaVersion}
	if want("wire") {
		for _, w := range cat.Wires {
			doc.Wires = append(doc.Wires, WireRecord{w.Name, w.System, float64(w.Bare), float64(w.Overall), w.Insulation, w.Conductor, w.Source, w.Origin})
		}
	}
	if want("mandrel") {
		for _, m := range cat.Mandrels {
			doc.Mandrels = append(doc.Mandrels, SupportRecord{m.Name, m.Kind, float64(m.Diameter), m.Source, m.Origin})
		}
	}
	if want("former") {
		for _, f := range cat.Formers {
			doc.Formers = append(doc.Formers, SupportRecord{f.Name, f.Kind, float64(f.Diameter), f.Source, f.Origin})
		}
	}
	if want("calibration") {
		for _, c := range cat.Calibrations {
			doc.Calibrations = append(doc.Calibrations, CalibrationRecord{c.Mandrel, c.Wire, c.Springback, c.Note, c.Origin})
		}
	}
	return writeJSON(w, doc)
}

// WriteStockTable writes the catalog rows of kind as tables.
func WriteStockTable(w io.Writer, cat *forms.Catalog, kind string, lf quantity.LengthFormat) error {
	want := func(s string) bool { return kind == "all" || kind == s }
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	if want("wire") {
		fmt.Fprintln(tw, "WIRE\tbare\toverall\tinsulation\tconductor\tsource")
		for _, w := range cat.Wires {
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\n", w.Name, lf.Format(float64(w.Bare)), lf.Format(float64(w.Overall)), w.Insulation, w.Conductor, originNote(w.Source, w.Origin))
		}
		fmt.Fprintln(tw)
	}
	if want("mandrel") {
		fmt.Fprintln(tw, "MANDREL\tdiameter\tkind\tsource")
		for _, m := range cat.Mandrels {
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\n", m.Name, lf.Format(float64(m.Diameter)), m.Kind, originNote(m.Source, m.Origin))
		}
		fmt.Fprintln(tw)
	}
	if want("former") {
		fmt.Fprintln(tw, "FORMER\toutside dia.\tkind\tsource")
		for _, f := range cat.Formers {
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\n", f.Name, lf.Format(float64(f.Diameter)), f.Kind, originNote(f.Source, f.Origin))
		}
		fmt.Fprintln(tw)
	}
	if want("calibration") && len(cat.Calibrations) > 0 {
		fmt.Fprintln(tw, "CALIBRATION\twire\tspringback\tnote")
		for _, c := range cat.Calibrations {
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\n", c.Mandrel, c.Wire, quantity.FormatPercent(c.Springback), c.Note)
		}
	}
	return tw.Flush()
}
