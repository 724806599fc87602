package main

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"turnwise/coil/match"
	"turnwise/forms"
	"turnwise/internal/report"
	"turnwise/sheets"
)

// couplerSheetPage maps a job's [coupler] (forms.JobCoupler) as `turnwise
// match` would with the same keys as flags, and returns the build-sheet
// page: the plot, a summary line per band, the worst stress at the power
// and the cautions. Errors name the job file's [coupler] keys.
func couplerSheetPage(job *forms.Job, so *stockOptions, flagsGiven bool) (sheets.Coupler, []string, error) {
	jc := job.Coupler
	fail := func(key string, err error) error {
		return &forms.ParseError{Kind: "job", File: job.File, Line: jc.Line, Field: "coupler: " + key, Err: err}
	}
	path := jc.Circuit
	if !filepath.IsAbs(path) {
		path = filepath.Join(filepath.Dir(job.File), path)
	}
	if _, err := os.Stat(path); err != nil {
		return sheets.Coupler{}, nil, fail("circuit", fmt.Errorf("%q (read as %s) cannot be read; the path is relative to the job file", jc.Circuit, path))
	}
	if !flagsGiven && (job.Stock != "" || job.Use != "") {
		so = jobStockOptions(job, so, flagsGiven)
	}
	cp, err := loadCoupler(path, so, flagsGiven)
	if err != nil {
		return sheets.Coupler{}, nil, err
	}
	mo := match.Options{SWR: jc.SWR, Power: jc.Power}
	var labels []string
	for _, f := range jc.Freqs {
		mo.Frequencies, labels = append(mo.Frequencies, f), append(labels, "")
	}
	for _, b := range jc.Bands {
		mo.Frequencies, labels = append(mo.Frequencies, float64(b.Low+b.High)/2), append(labels, b.Name)
	}
	res, err := match.Map(context.Background(), cp.setup, mo)
	if err != nil {
		var fe *flagError
		if errors.As(matchError(err, path), &fe) {
			return sheets.Coupler{}, nil, fail(fe.Flag, err) // the [coupler] key has the flag's name
		}
		return sheets.Coupler{}, nil, matchError(err, path)
	}
	req := report.MatchRequest{Circuit: jc.Circuit, Title: cp.file.Title, Labels: labels}
	var png bytes.Buffer
	if err := report.WriteMatchPlot(&png, "png", req, res); err != nil {
		return sheets.Coupler{}, nil, err
	}
	g := res.Grid
	about := fmt.Sprintf("Circuit file %s. Loads R %.4g Ω to %.4g Ω (%d logarithmic steps) by X %.4g Ω to %.4g Ω (%d steps), each brought to SWR ≤ %.3g at the port by turning %s.",
		jc.Circuit, g.RMin, g.RMax, g.NR, g.XMin, g.XMax, g.NX, res.SWR, adjustableNames(cp.setup))
	if res.Power > 0 {
		about += fmt.Sprintf(" Stress at %.4g W into the port.", res.Power)
	}
	page := sheets.Coupler{
		Name: cp.file.Title, Source: jc.Circuit, About: about, Summary: report.MatchSummary(req, res),
		PlotPNG: png.Bytes(), HeatRule: strings.ReplaceAll(res.HeatRule, "π", "pi"), Warnings: res.Warnings, Cautions: res.Cautions,
	}
	if page.Name == "" {
		page.Name = "Coupler"
	}
	if len(res.Worst) > 0 {
		page.Stress = report.MatchWorstRows(res.Worst)
	}
	var warnings []string
	for _, w := range res.Warnings {
		warnings = append(warnings, "coupler: "+w)
	}
	return page, warnings, nil
}

func adjustableNames(s match.Setup) string {
	out := ""
	for i, a := range s.Adjustable {
		switch {
		case i == 0:
		case i == len(s.Adjustable)-1:
			out += " and "
		default:
			out += ", "
		}
		out += a.Part
	}
	return out
}
