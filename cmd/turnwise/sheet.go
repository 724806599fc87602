package main

import (
	"context"
	"io"
	"strings"
	"time"

	"github.com/spf13/cobra"

	"turnwise/internal/quantity"
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
  # a band instead of freq: band = "144-146MHz", trimmer = "2-10pF"
  # (in parallel with cap): the page gives the trimmer's settings
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
	doc, warnings, inputs, err := report.SheetDocument(report.SheetRequest{
		Job: opts.job, Title: opts.title, TitleGiven: opts.titleGiven, Paper: opts.paper.v, Units: opts.units.v,
		Date: opts.date, Now: opts.now, StockPath: opts.stock.path, Use: opts.stock.use.v, StockGiven: opts.stockGiven,
		FlagCoil: func(lf quantity.LengthFormat) (sheets.Coil, []string, error) {
			cs, p, err := predictCoil(&opts.coil, opts.stock, opts.freq)
			if err != nil {
				return sheets.Coil{}, nil, err
			}
			return spec.FlagSheetCoil(cs, p, lf, opts.name, opts.quantity, opts.tap.set, opts.tap.v, opts.tap.raw)
		},
	})
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
	if opts.output == "-" {
		report.WriteSheetSummary(stderr, doc, "standard output")
	} else {
		report.WriteSheetSummary(stdout, doc, opts.output)
	}
	return nil
}
