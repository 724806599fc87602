package main

import (
	"cmp"
	"context"
	"fmt"
	"io"
	"path/filepath"
	"strings"
	"time"
	"unicode"

	"github.com/spf13/cobra"

	"turnwise/coil"
	"turnwise/forms"
	"turnwise/internal/report"
	"turnwise/internal/spec"
	"turnwise/sheets"
)

// sheetOptions holds everything `turnwise sheet` needs; no cobra types.
type sheetOptions struct {
	job        string // job file; empty for one coil from the flags
	coil       coilOptions
	stock      *stockOptions
	stockGiven bool // --stock or --use on the command line: overrides the job's
	titleGiven bool // --title on the command line
	freq       frequencyFlag
	tap        turnsFlag
	units      *choiceFlag
	paper      *choiceFlag
	output     string
	title      string
	name       string
	quantity   int
	date       string
	now        func() time.Time // the date when neither --date nor the job gives one

	uncompressed bool // plain-text page content, for tests and reading by eye
}

func newSheetCmd(g *globalOptions) *cobra.Command {
	opts := &sheetOptions{
		stock: newStockOptions(),
		units: newChoice("", "mm", "in"),
		paper: newChoice("", "A4", "Letter"),
		now:   time.Now,
	}
	cmd := &cobra.Command{
		Use:   "sheet [JOB.toml] -o FILE.pdf",
		Short: "Print PDF build sheets: a job file, or one coil from the flags",
		Long: strings.TrimSpace(`
Print build sheets for the bench: a cover page with the bill of materials
for the whole batch, then one page per coil with a side view drawn at full
size (1:1), the winding steps, what the coil should measure, how far to
squeeze or spread it, a cut-out pitch template, a measurement log and
cautions. A coil tuned by a two-gang capacitor gets a second page charting
both tuning ranges across the dial.

Give a job file (TOML), or describe one coil with predict's flags. In a
job file each [[coil]] is a fixed winding (predict's flags as keys) or a
target for the design search (design's flags as keys), with optional tap
and two-gang capacitor (span's flags as keys):

  title = "Club build night"     # required; paper = "A4" or "Letter",
  date = 2026-03-14              # units = "mm" or "in", stock = "bench.toml"
  [[coil]]
  name = "L1"                    # required
  quantity = 6
  mandrel = "6mm drill"          # or former; also insulation, conductor,
  wire = "1.00mm silver-plated"  # springback, pitch, temp
  turns = 5
  length = "10mm"
  leads = "4mm"                  # required
  freq = "137.5MHz"
  tap = 1                        # turns from the cold end; or tap-ratio = 0.1
  [[coil]]
  name = "L2"
  cap = "15pF"                   # or inductance = "80nH"; also stray,
  freq = "137.5MHz"              # tolerance, support, mandrel, former, wire,
  leads = "4mm"                  # max-length, max-diameter, min-srf-ratio ...
  # two-gang: gang = "12-365pF", gang-b, law, trim-a, trim-b, stray-a,
  # stray-b, bands = ["80m=3.5-3.8MHz"], choose-tap = true

testdata/club-night.toml is a complete example. A malformed file is
reported with its line and nothing is written.

Print at 100 % ("actual size"). Every coil page carries a 50 mm bar:
measure it before trusting the drawing. The PDF is written to a temporary
file and renamed, so an existing FILE is replaced only by a complete one.
` + exitStatusHelp),
		Example: exampleText(`
  turnwise sheet testdata/club-night.toml -o build-sheets.pdf
  turnwise sheet --mandrel 6mm --wire 1mm --turns 5 --length 8mm --leads 5mm --freq 145MHz --name "L1 145 MHz" -o l1.pdf`),
		Args: func(cmd *cobra.Command, args []string) error {
			if len(args) > 1 {
				return usageErrorf("sheet takes one job file (got %d arguments); quote names with spaces", len(args))
			}
			return nil
		},
		RunE: func(cmd *cobra.Command, args []string) error {
			if opts.output == "" {
				return usageErrorf("-o FILE.pdf is required (or -o - for standard output)")
			}
			fs := cmd.Flags()
			if len(args) == 1 {
				opts.job = args[0]
				for _, f := range []string{"mandrel", "former", "wire", "insulation", "conductor", "plating", "springback", "turns", "pitch", "length", "leads", "temp", "freq", "tap", "name", "quantity"} {
					if fs.Changed(f) {
						return usageErrorf("--%s describes one coil without a job file; put it in %s instead, or drop the job file", f, args[0])
					}
				}
			}
			opts.stockGiven = fs.Changed("stock") || fs.Changed("use")
			opts.titleGiven = fs.Changed("title")
			return runSheet(cmd.Context(), opts, cmd.OutOrStdout(), cmd.ErrOrStderr())
		},
	}
	fs := cmd.Flags()
	opts.coil.addFlags(fs)
	opts.stock.addFlags(fs)
	fs.Var(&opts.freq, "freq", "operating frequency for L at f, effective L and Q, e.g. 145MHz")
	fs.Var(&opts.tap, "tap", "tap position in turns from the cold (grounded) end, e.g. 1.5")
	fs.StringVarP(&opts.output, "output", "o", "", "the PDF to write; - for standard output")
	fs.Var(opts.units, "units", "display lengths in mm or in (default: the job's, else mm)")
	fs.Var(opts.paper, "paper", "paper size A4 or Letter (default: the job's, else A4)")
	fs.StringVar(&opts.title, "title", "", "title on every page (default: the job's, or \"Build sheet\")")
	fs.StringVar(&opts.name, "name", "Coil", "name of the coil, without a job file")
	fs.IntVar(&opts.quantity, "quantity", 1, "how many to build, without a job file")
	fs.StringVar(&opts.date, "date", "", "date to print, YYYY-MM-DD (default: the job's date, else today)")
	fs.BoolVar(&opts.uncompressed, "uncompressed", false, "write page content uncompressed (larger; for reading the PDF by eye)")
	_ = fs.MarkHidden("uncompressed")
	return cmd
}

func runSheet(ctx context.Context, opts *sheetOptions, stdout, stderr io.Writer) error {
	doc, warnings, inputs, err := sheetDocument(opts)
	if err != nil {
		return err
	}
	err = writeOutput(ctx, "-o", opts.output, inputs, stdout, func(w io.Writer) error {
		return sheets.Render(w, doc, sheets.Options{Uncompressed: opts.uncompressed})
	})
	if err != nil {
		return err
	}
	printWarnings(stderr, warnings)
	report := stdout
	if opts.output == "-" {
		report = stderr
	}
	pages, charts := 1+len(doc.Coils), 0
	for _, c := range doc.Coils {
		if c.Span != nil {
			charts++
		}
	}
	what := fmt.Sprintf("cover and %d coil %s", len(doc.Coils), sheetPlural(len(doc.Coils), "page", "pages"))
	if charts > 0 {
		what += fmt.Sprintf(", %d tuning %s", charts, sheetPlural(charts, "chart", "charts"))
	}
	if n := len(doc.Circuits); n > 0 {
		pages += n
		what += fmt.Sprintf(", %d circuit %s", n, sheetPlural(n, "page", "pages"))
	}
	name := opts.output
	if name == "-" {
		name = "standard output"
	}
	if n := len(doc.Couplers); n > 0 {
		what += fmt.Sprintf(", %d coupler %s", n, sheetPlural(n, "page", "pages"))
		pages += n
	}
	fmt.Fprintf(report, "wrote %s: %d pages (%s), %s\n", name, pages+charts, what, doc.Paper)
	fmt.Fprintln(report, "Print at 100 % (actual size) and measure the 50 mm bar on each page before using the drawings.")
	return nil
}

func sheetPlural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}

// sheetDocument resolves every coil before anything is written, so a bad
// job file leaves no output behind. inputs lists the files it read (job,
// stock, law tables), which -o must not name.
func sheetDocument(opts *sheetOptions) (doc sheets.Document, warnings, inputs []string, err error) {
	doc, warnings, err = sheetDocumentOf(opts, &inputs)
	return doc, warnings, inputs, err
}

func sheetDocumentOf(opts *sheetOptions, inputs *[]string) (sheets.Document, []string, error) {
	doc := sheets.Document{Title: opts.title, Paper: opts.paper.v, Units: opts.units.v}
	var warnings []string
	var date time.Time
	if strings.ContainsFunc(opts.title, unicode.IsControl) {
		return doc, nil, usageErrorf("--title holds a control character; give printable words, e.g. --title \"Club build night\"")
	}
	if opts.titleGiven && strings.TrimSpace(opts.title) == "" {
		return doc, nil, usageErrorf("--title is blank; give the words to print on every page, e.g. --title \"Club build night\", or leave --title out")
	}
	*inputs = append(*inputs, opts.stock.path)
	if opts.date != "" {
		d, err := time.Parse("2006-01-02", strings.TrimSpace(opts.date))
		if err != nil {
			return doc, nil, usageErrorf("--date %q: write it as 2026-03-14", opts.date)
		}
		date = d
	}
	if opts.job == "" {
		c, w, err := flagSheetCoil(opts)
		if err != nil {
			return doc, nil, err
		}
		doc.Coils = []sheets.Coil{c}
		warnings = w
		if doc.Title == "" {
			doc.Title = "Build sheet"
		}
	} else {
		*inputs = append(*inputs, opts.job)
		job, err := spec.LoadJob(opts.job)
		if err != nil {
			return doc, nil, err
		}
		*inputs = append(*inputs, jobInputs(job)...)
		cat, err := spec.JobCatalog(job, opts.stock.path, opts.stock.use.v, opts.stockGiven)
		if err != nil {
			return doc, nil, err
		}
		if doc.Title == "" {
			doc.Title = job.Title
		}
		if doc.Paper == "" {
			doc.Paper = job.Paper
		}
		if doc.Units == "" {
			doc.Units = job.Units
		}
		if date.IsZero() {
			date = job.Date
		}
		doc.Notes = job.Notes
		doc.Source = filepath.Base(job.File)
		for i := range job.Coils {
			c, w, err := spec.JobSheetCoil(job, &job.Coils[i], cat, newLengthFormatter(cmp.Or(doc.Units, "mm")))
			if err != nil {
				return doc, nil, err
			}
			doc.Coils = append(doc.Coils, c)
			warnings = append(warnings, w...)
		}
		for _, path := range job.Circuits {
			c, err := spec.JobCircuitPage(job, path, opts.stock.path, opts.stock.use.v, opts.stockGiven)
			if err != nil {
				return doc, nil, err
			}
			doc.Circuits = append(doc.Circuits, *c)
		}
		if job.Coupler != nil {
			cp, w, err := report.CouplerSheetPage(context.Background(), job, opts.stock.path, opts.stock.use.v, opts.stockGiven)
			if err != nil {
				return doc, nil, err
			}
			doc.Couplers = append(doc.Couplers, cp)
			warnings = append(warnings, w...)
		}
	}
	doc.Paper, doc.Units = cmp.Or(doc.Paper, "A4"), cmp.Or(doc.Units, "mm")
	if date.IsZero() {
		now := opts.now()
		date = time.Date(now.Year(), now.Month(), now.Day(), 0, 0, 0, 0, time.UTC)
	}
	doc.Date = date
	return doc, warnings, nil
}

// flagSheetCoil is the one coil described by predict's flags.
func flagSheetCoil(opts *sheetOptions) (sheets.Coil, []string, error) {
	cs, p, err := predictCoil(&opts.coil, opts.stock, opts.freq)
	if err != nil {
		return sheets.Coil{}, nil, err
	}
	if opts.quantity < 1 || opts.quantity > 10000 {
		return sheets.Coil{}, nil, usageErrorf("--quantity %d: give how many to build, 1 to 10000", opts.quantity)
	}
	if strings.TrimSpace(opts.name) == "" {
		return sheets.Coil{}, nil, usageErrorf("--name is empty; name the coil as the builder will call it, e.g. --name L1")
	}
	if strings.ContainsFunc(opts.name, unicode.IsControl) {
		return sheets.Coil{}, nil, usageErrorf("--name holds a control character; name the coil in printable text, e.g. --name L1")
	}
	lf := newLengthFormatter(cmp.Or(opts.units.v, "mm"))
	c := spec.NewSheetCoil(cs, p, lf)
	c.Name, c.Quantity = strings.TrimSpace(opts.name), opts.quantity
	if opts.tap.set {
		if opts.tap.v <= 0 {
			return c, nil, usageErrorf("--tap %s: a tap at the cold end is no tap; give the turns from the cold (grounded) end, e.g. --tap 1.5", opts.tap.raw)
		}
		s, err := coil.Tap(cs.Geometry, opts.tap.v, p.Frequency)
		if err != nil {
			return c, nil, &flagError{Flag: "tap", Err: err}
		}
		c.Tap = spec.SheetTap(s)
	}
	return c, spec.SheetWarnings(c.Name, c.Warnings), nil
}

// jobInputs lists the other files a job reads: its stock file and law
// tables, as given and relative to the job file.
func jobInputs(job *forms.Job) []string {
	var out []string
	rel := func(p string) {
		out = append(out, p)
		if !filepath.IsAbs(p) {
			out = append(out, filepath.Join(filepath.Dir(job.File), p))
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
