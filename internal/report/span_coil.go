package report

import (
	"fmt"
	"io"
	"turnwise/coil/tuning"
	"turnwise/internal/quantity"
)

// The COIL CHOICE section of `turnwise span --choose-coil`.

type chooseCoilRecord struct {
	Feasible  bool     `json:"feasible"`
	Turns     float64  `json:"turns"`
	Pitch     float64  `json:"pitch"`
	TapTurns  float64  `json:"tap_turns"`
	TurnsFrom float64  `json:"turns_from"`
	TurnsTo   float64  `json:"turns_to"`
	Coils     int      `json:"coils_tried"`
	Conflicts []string `json:"conflicts"`
	Advice    []string `json:"advice"`
}

func newChooseCoilRecord(p *tuning.CoilPlan) *chooseCoilRecord {
	if p == nil {
		return nil
	}
	return &chooseCoilRecord{p.Feasible, p.Geometry.Turns, float64(p.Geometry.Pitch), p.TapTurns, p.TurnsFrom, p.TurnsTo, p.Coils,
		append([]string{}, p.Conflicts...), append([]string{}, p.Advice...)}
}

func writeCoilChoice(w io.Writer, p *tuning.CoilPlan, lf quantity.LengthFormat) {
	if p == nil {
		return
	}
	fmt.Fprintln(w, "COIL CHOICE")
	verdict := "covers every band, the ranges overlap, no harmonic coincidence in a band"
	if !p.Feasible {
		verdict = "no coil tried meets every requirement: this is the best compromise"
	}
	fmt.Fprintf(w, "  chosen      %s at pitch %s (outside length %s), tapped %s from the cold end: %s\n",
		quantity.FormatTurnsWord(p.Geometry.Turns), lf.Format(float64(p.Geometry.Pitch)), lf.Format(float64(p.Geometry.WindingLength())),
		quantity.FormatTurnsWord(p.TapTurns), verdict)
	fmt.Fprintf(w, "  tried       %d coils: %g to %g turns (every turn to 30, then about 4 %% apart), pitch 1.05 to 3 × wire, every quarter-turn tap\n", p.Coils, p.TurnsFrom, p.TurnsTo)
	for _, c := range p.Conflicts {
		fmt.Fprintf(w, "  conflict    %s\n", c)
	}
	for _, a := range p.Advice {
		fmt.Fprintf(w, "  to make it possible  %s\n", a)
	}
	fmt.Fprintln(w)
}
