package report

import (
	"cmp"
	"context"
	"fmt"
	"io"
	"path/filepath"
	"strings"
	"time"
	"unicode"

	"turnwise/forms"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
	"turnwise/sheets"
)

// SheetRequest is what `turnwise sheet` asks for: a job file, or one coil
// from the flags (FlagCoil), with the command line's title, paper, units,
// date and stock selection.
type SheetRequest struct {
	Job        string // job file; empty for one coil from the flags
	Title      string
	TitleGiven bool // --title on the command line
	Paper      string
	Units      string
	Date       string           // YYYY-MM-DD, or "" for the job's date, else today
	Now        func() time.Time // today, when neither Date nor the job gives one
	StockPath  string
	Use        string
	StockGiven bool // --stock or --use on the command line: overrides the job's
	// FlagCoil builds the one coil without a job file, lengths in units.
	FlagCoil func(lf quantity.LengthFormat) (sheets.Coil, []string, error)
}

// SheetDocument resolves every page before anything is written, so a bad
// job file leaves no output behind. inputs lists the files it read (job,
// stock, law tables), which -o must not name.
func SheetDocument(r SheetRequest) (doc sheets.Document, warnings, inputs []string, err error) {
	doc, warnings, err = sheetDocumentOf(r, &inputs)
	return doc, warnings, inputs, err
}

func sheetDocumentOf(r SheetRequest, inputs *[]string) (sheets.Document, []string, error) {
	doc := sheets.Document{Title: r.Title, Paper: r.Paper, Units: r.Units}
	var warnings []string
	var date time.Time
	if strings.ContainsFunc(r.Title, unicode.IsControl) {
		return doc, nil, spec.Usagef("--title holds a control character; give printable words, e.g. --title \"Club build night\"")
	}
	if r.TitleGiven && strings.TrimSpace(r.Title) == "" {
		return doc, nil, spec.Usagef("--title is blank; give the words to print on every page, e.g. --title \"Club build night\", or leave --title out")
	}
	*inputs = append(*inputs, r.StockPath)
	if r.Date != "" {
		d, err := time.Parse("2006-01-02", strings.TrimSpace(r.Date))
		if err != nil {
			return doc, nil, spec.Usagef("--date %q: write it as 2026-03-14", r.Date)
		}
		date = d
	}
	if r.Job == "" {
		c, w, err := r.FlagCoil(quantity.LengthFormat{Inches: strings.EqualFold(cmp.Or(r.Units, "mm"), "in")})
		if err != nil {
			return doc, nil, err
		}
		doc.Coils = []sheets.Coil{c}
		warnings = w
		if doc.Title == "" {
			doc.Title = "Build sheet"
		}
	} else {
		*inputs = append(*inputs, r.Job)
		job, err := spec.LoadJob(r.Job)
		if err != nil {
			return doc, nil, err
		}
		*inputs = append(*inputs, JobInputs(job)...)
		cat, err := spec.JobCatalog(job, r.StockPath, r.Use, r.StockGiven)
		if err != nil {
			return doc, nil, err
		}
		doc.Title, doc.Paper, doc.Units = cmp.Or(doc.Title, job.Title), cmp.Or(doc.Paper, job.Paper), cmp.Or(doc.Units, job.Units)
		if date.IsZero() {
			date = job.Date
		}
		doc.Notes = job.Notes
		doc.Source = filepath.Base(job.File)
		lf := quantity.LengthFormat{Inches: strings.EqualFold(cmp.Or(doc.Units, "mm"), "in")}
		for i := range job.Coils {
			c, w, err := spec.JobSheetCoil(job, &job.Coils[i], cat, lf)
			if err != nil {
				return doc, nil, err
			}
			doc.Coils = append(doc.Coils, c)
			warnings = append(warnings, w...)
		}
		for _, path := range job.Circuits {
			c, err := spec.JobCircuitPage(job, path, r.StockPath, r.Use, r.StockGiven)
			if err != nil {
				return doc, nil, err
			}
			doc.Circuits = append(doc.Circuits, *c)
		}
		if job.Coupler != nil {
			cp, w, err := CouplerSheetPage(context.Background(), job, r.StockPath, r.Use, r.StockGiven)
			if err != nil {
				return doc, nil, err
			}
			doc.Couplers = append(doc.Couplers, cp)
			warnings = append(warnings, w...)
		}
	}
	doc.Paper, doc.Units = cmp.Or(doc.Paper, "A4"), cmp.Or(doc.Units, "mm")
	if date.IsZero() {
		now := r.Now()
		date = time.Date(now.Year(), now.Month(), now.Day(), 0, 0, 0, 0, time.UTC)
	}
	doc.Date = date
	return doc, warnings, nil
}

// JobInputs lists the other files a job reads: its stock file and law
// tables, as given and relative to the job file.
func JobInputs(job *forms.Job) []string {
	var out []string
	rel := func(p string) {
		out = append(out, p)
		if !filepath.IsAbs(p) {
			out = append(out, spec.JobPath(job, p))
		}
	}
	if job.Stock != "" {
		rel(job.Stock)
	}
	for i := range job.Coils {
		if c := &job.Coils[i]; c.Has("law") {
			rel(strings.Trim(c.Raw("law"), "\""))
		}
	}
	return out
}

// WriteSheetSummary prints what a build sheet holds: its pages by kind
// and the reminder to print at actual size. name is the file written.
func WriteSheetSummary(w io.Writer, doc sheets.Document, name string) {
	pages, charts := 1+len(doc.Coils), 0
	for _, c := range doc.Coils {
		if c.Span != nil {
			charts++
		}
	}
	what := fmt.Sprintf("cover and %d coil %s", len(doc.Coils), plural(len(doc.Coils), "page", "pages"))
	if charts > 0 {
		what += fmt.Sprintf(", %d tuning %s", charts, plural(charts, "chart", "charts"))
	}
	if n := len(doc.Circuits); n > 0 {
		pages += n
		what += fmt.Sprintf(", %d circuit %s", n, plural(n, "page", "pages"))
	}
	if n := len(doc.Couplers); n > 0 {
		what += fmt.Sprintf(", %d coupler %s", n, plural(n, "page", "pages"))
		pages += n
	}
	fmt.Fprintf(w, "wrote %s: %d pages (%s), %s\n", name, pages+charts, what, doc.Paper)
	fmt.Fprintln(w, "Print at 100 % (actual size) and measure the 50 mm bar on each page before using the drawings.")
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}
