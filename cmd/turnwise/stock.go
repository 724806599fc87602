package main

import (
	"context"
	"encoding/json"
	"fmt"
	"io"
	"strings"
	"text/tabwriter"
	"turnwise/internal/quantity"

	"github.com/spf13/cobra"

	"turnwise/forms"
)

type stockCmdOptions struct {
	stock    *stockOptions
	kind     *choiceFlag
	units    *choiceFlag
	template bool
	json     bool
}

func newStockCmd(g *globalOptions) *cobra.Command {
	opts := &stockCmdOptions{
		stock: newStockOptions(),
		kind:  newChoice("all", "all", "wire", "mandrel", "former", "calibration"),
		units: newChoice("mm", "mm", "in"),
	}
	cmd := &cobra.Command{
		Use:   "stock",
		Short: "List the wire, mandrels and formers turnwise can use",
		Long: strings.TrimSpace(`
List the built-in catalogs (AWG, SWG and metric enamelled wire; metric and
fractional-inch drill shanks as mandrels; PVC pipe as formers) and your own
stock file, with the source of every row. Your stock file is TOML; print a
commented starting point with --template.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise stock --kind mandrel
  turnwise stock --template > ~/coils/stock.toml
  turnwise stock --stock ~/coils/stock.toml --use mine --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			return runStock(cmd.Context(), opts, cmd.OutOrStdout())
		},
	}
	opts.stock.addFlags(cmd.Flags())
	cmd.Flags().Var(opts.kind, "kind", "which rows: all, wire, mandrel, former or calibration")
	cmd.Flags().Var(opts.units, "units", "display lengths in mm or in")
	cmd.Flags().BoolVar(&opts.template, "template", false, "print a commented stock file to start from")
	cmd.Flags().BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	return cmd
}

type stockJSON struct {
	Schema       int           `json:"schema"`
	Wires        []wireJSON    `json:"wires,omitempty"`
	Mandrels     []supportJSON `json:"mandrels,omitempty"`
	Formers      []supportJSON `json:"formers,omitempty"`
	Calibrations []calJSON     `json:"calibrations,omitempty"`
}

type wireJSON struct {
	Name       string  `json:"name"`
	System     string  `json:"system"`
	Bare       float64 `json:"wire_diameter"`
	Overall    float64 `json:"wire_overall_diameter"`
	Insulation string  `json:"insulation"`
	Conductor  string  `json:"conductor"`
	Source     string  `json:"source"`
	Origin     string  `json:"origin"`
}

type supportJSON struct {
	Name     string  `json:"name"`
	Kind     string  `json:"kind"`
	Diameter float64 `json:"diameter"`
	Source   string  `json:"source"`
	Origin   string  `json:"origin"`
}

type calJSON struct {
	Mandrel    string  `json:"mandrel"`
	Wire       string  `json:"wire"`
	Springback float64 `json:"springback"`
	Note       string  `json:"note"`
	Origin     string  `json:"origin"`
}

func runStock(_ context.Context, opts *stockCmdOptions, stdout io.Writer) error {
	if opts.template {
		_, err := io.WriteString(stdout, forms.StockTemplate())
		return err
	}
	cat, err := opts.stock.load()
	if err != nil {
		return err
	}
	k := opts.kind.v
	want := func(s string) bool { return k == "all" || k == s }
	if opts.json {
		doc := stockJSON{Schema: schemaVersion}
		if want("wire") {
			for _, w := range cat.Wires {
				doc.Wires = append(doc.Wires, wireJSON{w.Name, w.System, float64(w.Bare), float64(w.Overall), w.Insulation, w.Conductor, w.Source, w.Origin})
			}
		}
		if want("mandrel") {
			for _, m := range cat.Mandrels {
				doc.Mandrels = append(doc.Mandrels, supportJSON{m.Name, m.Kind, float64(m.Diameter), m.Source, m.Origin})
			}
		}
		if want("former") {
			for _, f := range cat.Formers {
				doc.Formers = append(doc.Formers, supportJSON{f.Name, f.Kind, float64(f.Diameter), f.Source, f.Origin})
			}
		}
		if want("calibration") {
			for _, c := range cat.Calibrations {
				doc.Calibrations = append(doc.Calibrations, calJSON{c.Mandrel, c.Wire, c.Springback, c.Note, c.Origin})
			}
		}
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		return enc.Encode(doc)
	}
	lf := newLengthFormatter(opts.units.v)
	tw := tabwriter.NewWriter(stdout, 0, 0, 2, ' ', 0)
	if want("wire") {
		fmt.Fprintln(tw, "WIRE\tbare\toverall\tinsulation\tconductor\tsource")
		for _, w := range cat.Wires {
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\t%s\t%s\n", w.Name, lf.fmt(float64(w.Bare)), lf.fmt(float64(w.Overall)), w.Insulation, w.Conductor, originNote(w.Source, w.Origin))
		}
		fmt.Fprintln(tw)
	}
	if want("mandrel") {
		fmt.Fprintln(tw, "MANDREL\tdiameter\tkind\tsource")
		for _, m := range cat.Mandrels {
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\n", m.Name, lf.fmt(float64(m.Diameter)), m.Kind, originNote(m.Source, m.Origin))
		}
		fmt.Fprintln(tw)
	}
	if want("former") {
		fmt.Fprintln(tw, "FORMER\toutside dia.\tkind\tsource")
		for _, f := range cat.Formers {
			fmt.Fprintf(tw, "%s\t%s\t%s\t%s\n", f.Name, lf.fmt(float64(f.Diameter)), f.Kind, originNote(f.Source, f.Origin))
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

func originNote(source, origin string) string {
	if origin == "" || origin == forms.OriginBuiltIn {
		return source
	}
	return source + " [" + origin + "]"
}
