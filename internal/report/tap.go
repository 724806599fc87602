package report

import (
	"fmt"
	"io"
	"math"
	"text/tabwriter"
	"turnwise/coil"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

// TapChoiceRecord is one tap in JSON.
type TapChoiceRecord struct {
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

func NewTapChoiceRecord(c coil.TapChoice) TapChoiceRecord {
	s := c.Sections
	return TapChoiceRecord{
		TapTurns: s.TapTurns, TapPosition: float64(s.TapPosition), L: float64(s.L), LA: float64(s.LA), LB: float64(s.LB),
		M: float64(s.M), K: s.K, Ratio: s.Ratio, ImpedanceRatio: s.ImpedanceRatio(), Achieved: c.Achieved, Error: c.Error,
	}
}

// TapRecord is the JSON document: the best tap's values at the top level
// (the keys), every choice in "choices".
type TapRecord struct {
	Schema int    `json:"schema"`
	Goal   string `json:"goal"` // "voltage_ratio", "impedance_ratio", "bottom_inductance" or "at"
	// Target is the goal's value: a ratio, or henries for bottom_inductance.
	Target    float64 `json:"target"`
	Frequency float64 `json:"frequency"`
	TapChoiceRecord
	Choices  []TapChoiceRecord `json:"choices"`
	Coil     CoilRecord        `json:"coil"`
	Warnings []string          `json:"warnings"`
}

func WriteTapTable(w io.Writer, s spec.Spec, p coil.Prediction, goal coil.TapGoal, goalKey string, target float64, choices []coil.TapChoice, lf quantity.LengthFormat) error {
	g := p.Geometry
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	at := "low frequency"
	if p.Frequency > 0 {
		at = quantity.FormatEng(float64(p.Frequency), "Hz", 4)
	}
	fmt.Fprintf(tw, "%s turns of %s on %s, pitch %s: %s at the terminals (%s, leads included)\n\n",
		quantity.FormatTurns(g.Turns), spec.DescribeWire(s, lf), s.SupportName, lf.Format(float64(g.Pitch)), quantity.FormatEng(float64(choices[0].L), "H", 3), at)
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
			quantity.FormatTurnsWord(c.TapTurns), lf.Format(float64(c.TapPosition)), quantity.FormatEng(float64(c.LB), "H", 3), quantity.FormatEng(float64(c.LA), "H", 3),
			quantity.FormatEng(float64(c.M), "H", 3), c.K, ratioCell("%.4f", c.Ratio), ratioCell("%.4g", c.ImpedanceRatio()))
		if goalKey != "at" {
			line += "\t" + missCell(c.Error)
		}
		fmt.Fprintln(tw, line)
	}
	best := choices[0]
	fmt.Fprintln(tw, "\nHOW TO PLACE IT")
	fmt.Fprintf(tw, "  count %s up from the cold (grounded) end and solder the tap there: %s along the axis from the centre of the wire where the winding starts\n",
		quantity.FormatTurnsWord(best.TapTurns), lf.Format(float64(best.TapPosition)))
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

// TapGoalValue prints a goal's quantity: a ratio with its 1:N form, or an
// inductance.
func TapGoalValue(goal coil.TapGoal, v float64) string {
	if goal == coil.GoalBottomInductance {
		return quantity.FormatEng(v, "H", 3) + " below the tap"
	}
	return fmt.Sprintf("%s %.4g (1:%.3g)", goal, v, 1/v)
}

// NewTapRecord is tap's JSON document for the choices found for goal
// (goalKey "at" for a tap given by position), with its warnings: the
// coil's, and when no quarter-turn tap reaches the target (found is false
// when the search reported an error) or the coil is short.
func NewTapRecord(s spec.Spec, p coil.Prediction, goal coil.TapGoal, goalKey string, target float64, choices []coil.TapChoice, found bool) TapRecord {
	rec := TapRecord{
		Schema: SchemaVersion, Goal: goalKey, Target: target, Frequency: float64(p.Frequency),
		TapChoiceRecord: NewTapChoiceRecord(choices[0]),
		Coil:            NewCoilRecord(s, p),
		Warnings:        append([]string{}, p.Warnings()...),
	}
	for _, c := range choices {
		rec.Choices = append(rec.Choices, NewTapChoiceRecord(c))
	}
	if goalKey != "at" && found && len(choices) == 1 && math.Abs(choices[0].Error) > 0.05 {
		end := choices[0]
		rec.Warnings = append(rec.Warnings, fmt.Sprintf("no quarter-turn tap on the winding reaches the target: the nearest, %s from the cold end, gives %s; for a finer tap near that end use more turns",
			quantity.FormatTurnsWord(end.TapTurns), TapGoalValue(goal, end.Achieved)))
	}
	if s.Geometry.Turns < 4 && goalKey != "at" {
		rec.Warnings = append(rec.Warnings, "a coil this short has few tap positions: a quarter turn moves the ratio a lot; consider more turns")
	}
	return rec
}

// WriteTapJSON writes tap's JSON document.
func WriteTapJSON(w io.Writer, rec TapRecord) error { return writeJSON(w, rec) }
