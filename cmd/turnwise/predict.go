package main

import (
	"context"
	"io"
	"strings"

	"github.com/spf13/cobra"

	"turnwise/coil/thermal"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// predictOptions holds everything `turnwise predict` needs; no cobra types.
type predictOptions struct {
	coil  coilOptions
	stock *stockOptions
	freq  frequencyFlag
	units *choiceFlag
	json  bool
	pitch *choiceFlag // what the pitch follows with temperature on a former
}

func newPredictCmd(g *globalOptions) *cobra.Command {
	opts := &predictOptions{stock: newStockOptions(), units: newChoice("mm", "mm", "in"), pitch: newPitchFollows()}
	cmd := &cobra.Command{
		Use:   "predict",
		Short: "Predict L, self-resonance and Q of a coil you describe",
		Long: strings.TrimSpace(`
Describe a coil as you would wind it and turnwise predicts what it will
measure: inductance at the terminals (leads included), the helix alone at
DC and at the operating frequency, self-capacitance and self-resonance
(SRF), effective inductance and Q at --freq, and the build numbers: bore,
outside diameter, outside length, wire to cut.

The SRF is given for both mountings, one end grounded and both ends
floating, each with its uncertainty against NEC-2; --mounting chooses the
one that feeds effective L and Q. Q is an estimate and is printed with its
uncertainty band.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise predict --mandrel 6mm --wire 1mm --turns 5 --length 8mm --leads 5mm --freq 145MHz
  turnwise predict --former 25mm --wire 22awg --turns 30 --leads 20mm --freq 3.7MHz --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			return runPredict(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	opts.coil.addFlags(cmd.Flags())
	opts.stock.addFlags(cmd.Flags())
	cmd.Flags().Var(&opts.freq, "freq", "operating frequency for L at f, effective L and Q, e.g. 145MHz")
	cmd.Flags().Var(opts.units, "units", "display lengths in mm or in")
	cmd.Flags().BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	addPitchFollowsFlag(cmd, opts.pitch)
	return cmd
}

func runPredict(_ context.Context, opts *predictOptions, stdout, stderr io.Writer) error {
	cat, err := opts.stock.load()
	if err != nil {
		return err
	}
	s, p, err := spec.Predict(cat, opts.coil.winding(), opts.freq.v)
	if err != nil {
		return err
	}
	rec := report.NewPredictRecord(s, p)
	lf := newLengthFormatter(opts.units.v)
	if !opts.json {
		rec.Warnings = p.WarningsIn(lf) // the table's length unit on stderr too
	}
	var tc report.TempcoRecord
	pf, _ := thermal.ParsePitchFollows(opts.pitch.v)
	if c, ok, warn := spec.Tempco(cat, s, p.Frequency, pf); ok {
		tc = report.NewTempcoRecord(c, float64(p.Frequency))
	} else {
		rec.Warnings = append(rec.Warnings, warn)
	}
	if opts.json {
		if err := report.WritePredictJSON(stdout, rec, tc); err != nil {
			return err
		}
	} else {
		if err := report.WritePredictTable(stdout, s, p, rec, lf); err != nil {
			return err
		}
		if err := report.WriteTempcoTable(stdout, tc); err != nil {
			return err
		}
	}
	printWarnings(stderr, rec.Warnings)
	return nil
}
