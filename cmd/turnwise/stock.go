package main

import (
	"context"
	"io"
	"strings"
	"turnwise/internal/report"

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

func runStock(_ context.Context, opts *stockCmdOptions, stdout io.Writer) error {
	if opts.template {
		_, err := io.WriteString(stdout, forms.StockTemplate())
		return err
	}
	cat, err := opts.stock.load()
	if err != nil {
		return err
	}
	if opts.json {
		return report.WriteStockJSON(stdout, cat, opts.kind.v)
	}
	return report.WriteStockTable(stdout, cat, opts.kind.v, newLengthFormatter(opts.units.v))
}
