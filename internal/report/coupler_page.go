package report

import (
	"bytes"
	"context"
	"fmt"
	"strings"

	"turnwise/forms"
	"turnwise/internal/spec"
	"turnwise/sheets"
)

// CouplerSheetPage maps a job's [coupler] (forms.JobCoupler) as `turnwise
// match` would with the same keys as flags, and returns the build-sheet
// page: the plot, a summary line per band, the worst stress at the power
// and the cautions. Errors name the job file's [coupler] keys.
func CouplerSheetPage(ctx context.Context, job *forms.Job, stockPath, use string, flagsGiven bool) (sheets.Coupler, []string, error) {
	jc := job.Coupler
	cp, res, labels, err := spec.CouplerMap(ctx, job, stockPath, use, flagsGiven)
	if err != nil {
		return sheets.Coupler{}, nil, err
	}
	req := MatchRequest{Circuit: jc.Circuit, Title: cp.File.Title, Labels: labels}
	var png bytes.Buffer
	if err := WriteMatchPlot(&png, "png", req, res); err != nil {
		return sheets.Coupler{}, nil, err
	}
	g := res.Grid
	about := fmt.Sprintf("Circuit file %s. Loads R %.4g Ω to %.4g Ω (%d logarithmic steps) by X %.4g Ω to %.4g Ω (%d steps), each brought to SWR ≤ %.3g at the port by turning %s.",
		jc.Circuit, g.RMin, g.RMax, g.NR, g.XMin, g.XMax, g.NX, res.SWR, cp.AdjustableNames())
	if res.Power > 0 {
		about += fmt.Sprintf(" Stress at %.4g W into the port.", res.Power)
	}
	page := sheets.Coupler{
		Name: cp.File.Title, Source: jc.Circuit, About: about, Summary: MatchSummary(req, res),
		PlotPNG: png.Bytes(), HeatRule: strings.ReplaceAll(res.HeatRule, "π", "pi"), Warnings: res.Warnings, Cautions: res.Cautions,
	}
	if page.Name == "" {
		page.Name = "Coupler"
	}
	if len(res.Worst) > 0 {
		page.Stress = MatchWorstRows(res.Worst)
	}
	var warnings []string
	for _, w := range res.Warnings {
		warnings = append(warnings, "coupler: "+w)
	}
	return page, warnings, nil
}
