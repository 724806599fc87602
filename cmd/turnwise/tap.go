package main

import (
	"context"
	"io"
	"strings"
	"turnwise/internal/report"
	"turnwise/internal/spec"

	"github.com/spf13/cobra"

	"turnwise/coil"
)

// tapOptions holds everything `turnwise tap` needs; no cobra types.
type tapOptions struct {
	coil      coilOptions
	stock     *stockOptions
	ratio     ratioFlag
	impedance ratioFlag
	bottomL   inductanceFlag
	at        turnsFlag
	freq      frequencyFlag
	units     *choiceFlag
	json      bool
	source    resistanceFlag
	load      resistanceFlag
	tankQ     float64
	tankR     resistanceFlag
	loadedQ   float64
}

func newTapCmd(g *globalOptions) *cobra.Command {
	opts := &tapOptions{stock: newStockOptions(), units: newChoice("mm", "mm", "in")}
	cmd := &cobra.Command{
		Use:   "tap",
		Short: "Where to tap a coil for a voltage ratio, impedance ratio or section inductance",
		Long: strings.TrimSpace(`
Find the tap on a coil you describe (as for predict) for one goal:

  --ratio R            the unloaded voltage at the tap as a fraction of the
                       voltage across the coil, e.g. 0.2, 20% or 1:5
  --impedance-ratio R  the impedance at the tap as a fraction of the tuned
                       coil's, e.g. 1:50 for a 50 Ω load on a 2.5 kΩ tank
  --bottom-l L         the inductance between the cold end and the tap

  --source R / --load R  a resistance at the tap, e.g. 50ohm: the tap for
                       the --loaded-q wanted (default: matched, half the
                       unloaded Q), with the tank's --tank-q or
                       --tank-impedance (default: the coil model's Q)

or evaluate a tap you already have with --at TURNS. turnwise prints the
nearest quarter-turn taps with what each gives. Taps count from the cold
(grounded) end.

The two sections are coaxial coils coupled by their mutual inductance, so
the voltage ratio is (L_b + M)/L, not the turns ratio. The cold lead is
counted in the bottom section and the hot lead in the top one; the tap
wire itself is not modelled: keep it short. The impedance ratio is the
voltage ratio squared, which holds for a high-Q tank whose tap load is
light; a heavy load on a loosely coupled tap transforms less.

For --source/--load the rule is: R_s at a tap of voltage ratio n loads
the tank with R_s/n² in parallel, Q_L = (R_p ∥ R_s/n²)/X (Terman 1943);
the loaded Q and bandwidth of each tap are printed. When no quarter-turn
tap is within ±10 % of the impedance ratio, a link winding over the cold
end (coupling by Maxwell's formula for coaxial turns) and a capacitive
divider are given instead.

Caution: a tank driven by a transmitter carries high RF voltage at its
hot end; follow local regulations and licensed practice.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise tap --former "pvc 20mm" --wire 0.5mm --turns 40 --pitch 1mm --leads 20mm --impedance-ratio 1:50 --freq 7.1MHz
  turnwise tap --mandrel 6mm --wire 1mm --turns 5 --length 8mm --leads 5mm --ratio 0.25 --freq 145MHz --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			n := 0
			for _, f := range []string{"ratio", "impedance-ratio", "bottom-l", "at", "source", "load"} {
				if cmd.Flags().Changed(f) {
					n++
				}
			}
			if n != 1 {
				return usageErrorf("give exactly one of --ratio, --impedance-ratio, --bottom-l, --source/--load (what the tap is for) or --at TURNS (a tap you have)")
			}
			if opts.source.set || opts.load.set {
				return runTapLoad(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
			}
			for _, f := range []string{"tank-q", "tank-impedance", "loaded-q"} {
				if cmd.Flags().Changed(f) {
					return usageErrorf("--%s works with --source or --load (the resistance at the tap), e.g. --source 50ohm", f)
				}
			}
			return runTap(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	opts.coil.addFlags(cmd.Flags())
	opts.stock.addFlags(cmd.Flags())
	cmd.Flags().Var(&opts.ratio, "ratio", "voltage ratio at the tap: 0.2, 20% or 1:5")
	cmd.Flags().Var(&opts.impedance, "impedance-ratio", "impedance ratio at the tap: 0.02 or 1:50")
	cmd.Flags().Var(&opts.bottomL, "bottom-l", "inductance from the cold end to the tap, e.g. 1.2uH")
	cmd.Flags().Var(&opts.at, "at", "evaluate a tap this many turns from the cold end")
	cmd.Flags().Var(&opts.source, "source", "a source resistance at the tap, e.g. 50ohm: find the tap for --loaded-q (default matched)")
	cmd.Flags().Var(&opts.load, "load", "a load resistance at the tap, e.g. 50ohm (the same rule as --source)")
	cmd.Flags().Float64Var(&opts.tankQ, "tank-q", 0, "the tank's unloaded Q (default: the coil model's Q)")
	cmd.Flags().Var(&opts.tankR, "tank-impedance", "the tank's parallel resistance at resonance, e.g. 20kohm (instead of --tank-q)")
	cmd.Flags().Float64Var(&opts.loadedQ, "loaded-q", 0, "the loaded Q wanted (default: matched, half the unloaded Q)")
	cmd.Flags().Var(&opts.freq, "freq", "operating frequency for the inductances (skin effect), e.g. 7.1MHz")
	cmd.Flags().Var(opts.units, "units", "display lengths in mm or in")
	cmd.Flags().BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	return cmd
}

func runTap(_ context.Context, opts *tapOptions, stdout, stderr io.Writer) error {
	cs, p, err := predictCoil(&opts.coil, opts.stock, opts.freq)
	if err != nil {
		return err
	}
	pl, err := spec.PlanTap(cs.Geometry, opts.freq.v, spec.TapGoalInput{
		Ratio: opts.ratio.v, ImpedanceRatio: opts.impedance.v, BottomL: opts.bottomL.v, At: opts.at.v,
		RatioSet: opts.ratio.set, ImpedanceSet: opts.impedance.set, BottomLSet: opts.bottomL.set, AtSet: opts.at.set,
	})
	if err != nil {
		return err
	}
	goal, goalKey, target, choices := pl.Goal, pl.GoalKey, pl.Target, pl.Choices
	rec := report.NewTapRecord(cs, p, goal, goalKey, target, choices, pl.Found == nil)
	if !opts.json {
		// The model's warnings lead the list: reword them in the table's length unit.
		copy(rec.Warnings, p.WarningsIn(newLengthFormatter(opts.units.v)))
	}
	rec.Warnings = append(rec.Warnings, pl.Advice...)
	if opts.json {
		if err := report.WriteTapJSON(stdout, rec); err != nil {
			return err
		}
	} else if err := report.WriteTapTable(stdout, cs, p, goal, goalKey, target, choices, newLengthFormatter(opts.units.v)); err != nil {
		return err
	}
	printWarnings(stderr, rec.Warnings)
	return pl.Found
}

// runTapLoad finds the tap (or link, or divider) for a resistance at the
// tap and a loaded Q.
func runTapLoad(_ context.Context, opts *tapOptions, stdout, stderr io.Writer) error {
	r := opts.source
	if opts.load.set {
		r = opts.load
	}
	if err := spec.CheckTapLoad(opts.freq.set, opts.tankQ, opts.tankR.set, opts.loadedQ); err != nil {
		return err
	}
	cs, p, err := predictCoil(&opts.coil, opts.stock, opts.freq)
	if err != nil {
		return err
	}
	plan, err := coil.TapForLoad(cs.Geometry, coil.LoadGoal{Frequency: opts.freq.v, Source: r.v, TankImpedance: opts.tankR.v, TankQ: opts.tankQ, LoadedQ: opts.loadedQ})
	if err != nil {
		return spec.TapLoadError(err)
	}
	warnings := plan.Advice()
	if opts.json {
		return report.WriteTapLoadJSON(stdout, cs, p, float64(r.v), plan, warnings)
	}
	if err := report.WriteTapLoadTable(stdout, cs, p, float64(r.v), plan, newLengthFormatter(opts.units.v)); err != nil {
		return err
	}
	printWarnings(stderr, warnings)
	return nil
}
