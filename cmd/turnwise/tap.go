package main

import (
	"context"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"text/tabwriter"
	"turnwise/internal/quantity"

	"github.com/spf13/cobra"

	"turnwise/coil"
)

// ratioFlag takes a ratio as a fraction (0.2), a percentage (20%) or
// "1:5".
type ratioFlag struct {
	raw string
	v   float64
	set bool
}

func (f *ratioFlag) String() string { return f.raw }
func (f *ratioFlag) Type() string   { return "ratio" }
func (f *ratioFlag) Set(s string) error {
	v, err := parseRatio(s)
	if err != nil {
		return err
	}
	f.raw, f.v, f.set = s, v, true
	return nil
}

// parseRatio reads "0.2", "20%" or "1:5" (the first number over the second).
func parseRatio(s string) (float64, error) {
	t := strings.TrimSpace(s)
	bad := fmt.Errorf("%q is not a ratio; write 0.2, 20%% or 1:5", s)
	var v float64
	switch {
	case strings.Contains(t, ":"):
		a, b, _ := strings.Cut(t, ":")
		x, err1 := strconv.ParseFloat(strings.TrimSpace(a), 64)
		y, err2 := strconv.ParseFloat(strings.TrimSpace(b), 64)
		if err1 != nil || err2 != nil || y == 0 {
			return 0, bad
		}
		v = x / y
	case strings.HasSuffix(t, "%"):
		p, err := quantity.ParsePercent(t)
		if err != nil {
			return 0, bad
		}
		v = p
	default:
		x, err := strconv.ParseFloat(t, 64)
		if err != nil {
			return 0, bad
		}
		v = x
	}
	if math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 || v >= 1 {
		return 0, fmt.Errorf("%q: a tap ratio must be between 0 and 1 (the tap sees part of the whole coil), e.g. 0.2 or 1:5", s)
	}
	return v, nil
}

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

or evaluate a tap you already have with --at TURNS. turnwise prints the
nearest quarter-turn taps with what each gives. Taps count from the cold
(grounded) end.

The two sections are coaxial coils coupled by their mutual inductance, so
the voltage ratio is (L_b + M)/L, not the turns ratio. The cold lead is
counted in the bottom section and the hot lead in the top one; the tap
wire itself is not modelled: keep it short. The impedance ratio is the
voltage ratio squared, which holds for a high-Q tank whose tap load is
light; a heavy load on a loosely coupled tap transforms less.

Caution: a tank driven by a transmitter carries high RF voltage at its
hot end; follow local regulations and licensed practice.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise tap --former "pvc 20mm" --wire 0.5mm --turns 40 --pitch 1mm --leads 20mm --impedance-ratio 1:50 --freq 7.1MHz
  turnwise tap --mandrel 6mm --wire 1mm --turns 5 --length 8mm --leads 5mm --ratio 0.25 --freq 145MHz --json`),
		Args: noArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			n := 0
			for _, f := range []string{"ratio", "impedance-ratio", "bottom-l", "at"} {
				if cmd.Flags().Changed(f) {
					n++
				}
			}
			if n != 1 {
				return usageErrorf("give exactly one of --ratio, --impedance-ratio, --bottom-l (what the tap is for) or --at TURNS (a tap you have)")
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
	cmd.Flags().Var(&opts.freq, "freq", "operating frequency for the inductances (skin effect), e.g. 7.1MHz")
	cmd.Flags().Var(opts.units, "units", "display lengths in mm or in")
	cmd.Flags().BoolVar(&opts.json, "json", false, "print JSON (SI units) instead of a table")
	return cmd
}

// tapChoiceRecord is one tap in JSON.
type tapChoiceRecord struct {
	TapTurns       float64 `json:"tap_turns"`
	TapPosition    float64 `json:"tap_position"`
	L              float64 `json:"l"`
	LA             float64 `json:"l_a"`
	LB             float64 `json:"l_b"`
	M              float64 `json:"m"`
	K              float64 `json:"k"`
	Ratio          float64 `json:"ratio"`
	ImpedanceRatio float64 `json:"impedance_ratio"`
	Achieved       float64 `json:"achieved,omitempty"`
	Error          float64 `json:"error,omitempty"`
}

func newTapChoiceRecord(c coil.TapChoice) tapChoiceRecord {
	s := c.Sections
	return tapChoiceRecord{
		TapTurns: s.TapTurns, TapPosition: float64(s.TapPosition), L: float64(s.L), LA: float64(s.LA), LB: float64(s.LB),
		M: float64(s.M), K: s.K, Ratio: s.Ratio, ImpedanceRatio: s.ImpedanceRatio(), Achieved: c.Achieved, Error: c.Error,
	}
}

// tapRecord is the JSON document: the best tap's values at the top level
// (the keys), every choice in "choices".
type tapRecord struct {
	Schema int    `json:"schema"`
	Goal   string `json:"goal"` // "voltage_ratio", "impedance_ratio", "bottom_inductance" or "at"
	// Target is the goal's value: a ratio, or henries for bottom_inductance.
	Target    float64 `json:"target"`
	Frequency float64 `json:"frequency"`
	tapChoiceRecord
	Choices  []tapChoiceRecord `json:"choices"`
	Coil     coilRecord        `json:"coil"`
	Warnings []string          `json:"warnings"`
}

func runTap(_ context.Context, opts *tapOptions, stdout, stderr io.Writer) error {
	spec, p, err := predictCoil(&opts.coil, opts.stock, opts.freq)
	if err != nil {
		return err
	}
	g := spec.Geometry
	var goal coil.TapGoal
	var target float64
	goalKey, goalFlag := "at", "at"
	switch {
	case opts.ratio.set:
		goal, target, goalKey, goalFlag = coil.GoalVoltageRatio, opts.ratio.v, "voltage_ratio", "ratio"
	case opts.impedance.set:
		goal, target, goalKey, goalFlag = coil.GoalImpedanceRatio, opts.impedance.v, "impedance_ratio", "impedance-ratio"
	case opts.bottomL.set:
		goal, target, goalKey, goalFlag = coil.GoalBottomInductance, float64(opts.bottomL.v), "bottom_inductance", "bottom-l"
	}
	var choices []coil.TapChoice
	var findErr error
	if opts.at.set {
		s, err := coil.Tap(g, opts.at.v, opts.freq.v)
		if err != nil {
			return tapFlagError(err, goalFlag)
		}
		target = opts.at.v
		choices = []coil.TapChoice{{Sections: s}}
	} else {
		choices, findErr = coil.FindTap(g, opts.freq.v, goal, target)
		if findErr != nil && len(choices) == 0 {
			return tapFlagError(findErr, goalFlag)
		}
	}
	rec := tapRecord{
		Schema: schemaVersion, Goal: goalKey, Target: target, Frequency: float64(opts.freq.v),
		tapChoiceRecord: newTapChoiceRecord(choices[0]),
		Coil:            newCoilRecord(spec, p),
		Warnings:        append([]string{}, p.Warnings()...),
	}
	for _, c := range choices {
		rec.Choices = append(rec.Choices, newTapChoiceRecord(c))
	}
	if goalKey != "at" && findErr == nil && len(choices) == 1 && math.Abs(choices[0].Error) > 0.05 {
		end := choices[0]
		rec.Warnings = append(rec.Warnings, fmt.Sprintf("no quarter-turn tap on the winding reaches the target: the nearest, %s from the cold end, gives %s; for a finer tap near that end use more turns",
			quantity.FormatTurnsWord(end.TapTurns), tapGoalValue(goal, end.Achieved)))
	}
	if g.Turns < 4 && goalKey != "at" {
		rec.Warnings = append(rec.Warnings, "a coil this short has few tap positions: a quarter turn moves the ratio a lot; consider more turns")
	}
	if opts.json {
		enc := json.NewEncoder(stdout)
		enc.SetIndent("", "  ")
		if err := enc.Encode(rec); err != nil {
			return err
		}
		return findErr
	}
	if err := writeTapTable(stdout, spec, p, goal, goalKey, target, choices, newLengthFormatter(opts.units.v)); err != nil {
		return err
	}
	for _, w := range rec.Warnings {
		fmt.Fprintf(stderr, "warning: %s\n", w)
	}
	return findErr
}

// tapFlagError names the flag of a tap error; goalFlag is the flag that
// gave the target.
func tapFlagError(err error, goalFlag string) error {
	var ie *coil.InputError
	if !errors.As(err, &ie) {
		return err
	}
	switch ie.Param {
	case "tap_turns":
		return &flagError{"at", err}
	case "frequency":
		return &flagError{"freq", err}
	case "target":
		return &flagError{goalFlag, err}
	}
	return err
}

func writeTapTable(w io.Writer, s coilSpec, p coil.Prediction, goal coil.TapGoal, goalKey string, target float64, choices []coil.TapChoice, lf lengthFormatter) error {
	g := p.Geometry
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	at := "low frequency"
	if p.Frequency > 0 {
		at = quantity.FormatEng(float64(p.Frequency), "Hz", 4)
	}
	fmt.Fprintf(tw, "%s turns of %s on %s, pitch %s: %s at the terminals (%s, leads included)\n\n",
		quantity.FormatTurns(g.Turns), describeWire(s, lf), s.SupportName, lf.fmt(float64(g.Pitch)), quantity.FormatEng(float64(choices[0].L), "H", 3), at)
	switch goalKey {
	case "at":
		fmt.Fprintf(tw, "TAP AT %s TURNS FROM THE COLD END\n", quantity.FormatTurns(target))
	case "bottom_inductance":
		fmt.Fprintf(tw, "TAP FOR %s BELOW THE TAP (nearest quarter turns)\n", quantity.FormatEng(target, "H", 3))
	case "impedance_ratio":
		fmt.Fprintf(tw, "TAP FOR AN IMPEDANCE RATIO OF %.4g (1:%.4g; nearest quarter turns)\n", target, 1/target)
	default:
		fmt.Fprintf(tw, "TAP FOR A VOLTAGE RATIO OF %.4g (1:%.4g; nearest quarter turns)\n", target, 1/target)
	}
	header := "  TAP (FROM COLD END)\tALONG THE COIL\tL BELOW\tL ABOVE\tM\tk\tVOLTAGE RATIO\tIMPEDANCE RATIO"
	if goalKey != "at" {
		header += "\tMISS"
	}
	fmt.Fprintln(tw, header)
	for _, c := range choices {
		line := fmt.Sprintf("  %s\t%s\t%s\t%s\t%s\t%.3f\t%s\t%s",
			quantity.FormatTurnsWord(c.TapTurns), lf.fmt(float64(c.TapPosition)), quantity.FormatEng(float64(c.LB), "H", 3), quantity.FormatEng(float64(c.LA), "H", 3),
			quantity.FormatEng(float64(c.M), "H", 3), c.K, ratioCell("%.4f", c.Ratio), ratioCell("%.4g", c.ImpedanceRatio()))
		if goalKey != "at" {
			line += "\t" + missCell(c.Error)
		}
		fmt.Fprintln(tw, line)
	}
	best := choices[0]
	fmt.Fprintln(tw, "\nHOW TO PLACE IT")
	fmt.Fprintf(tw, "  count %s up from the cold (grounded) end and solder the tap there: %s along the axis from the centre of the wire where the winding starts\n",
		quantity.FormatTurnsWord(best.TapTurns), lf.fmt(float64(best.TapPosition)))
	fmt.Fprintf(tw, "  turns ratio alone would say %.3f; the coupled sections give %.3f\n", best.TapTurns/g.Turns, best.Ratio)
	fmt.Fprintln(tw, "\nNOTES")
	fmt.Fprintln(tw, "  the cold lead is counted below the tap and the hot lead above it; the tap wire is not modelled: keep it short")
	if goal == coil.GoalImpedanceRatio || goalKey == "at" {
		fmt.Fprintln(tw, "  impedance ratio = voltage ratio squared: true for a high-Q tank with a light load at the tap; a heavy load on a loosely coupled tap transforms less")
	}
	fmt.Fprintln(tw, "  caution: the hot end of a transmitting tank carries high RF voltage; follow local regulations and licensed practice")
	return tw.Flush()
}

// ratioCell prints a ratio with its 1:N form; a tap at the cold terminal
// has ratio 0 and no 1:N.
func ratioCell(format string, r float64) string {
	if r <= 0 {
		return fmt.Sprintf(format, 0.0) + " (cold end)"
	}
	return fmt.Sprintf(format+" (1:%.3g)", r, 1/r)
}

// missCell prints how far a tap misses its target; a miss of more than
// 1000 % reads better as a factor.
func missCell(e float64) string {
	if math.Abs(e) >= 10 {
		return fmt.Sprintf("%.3g× target", e+1)
	}
	return fmt.Sprintf("%+.1f %%", e*100)
}

// tapGoalValue prints a goal's quantity: a ratio with its 1:N form, or an
// inductance.
func tapGoalValue(goal coil.TapGoal, v float64) string {
	if goal == coil.GoalBottomInductance {
		return quantity.FormatEng(v, "H", 3) + " below the tap"
	}
	return fmt.Sprintf("%s %.4g (1:%.3g)", goal, v, 1/v)
}
