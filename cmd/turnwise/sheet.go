package main

import (
	"cmp"
	"context"
	"errors"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"strings"
	"time"
	"turnwise/internal/quantity"

	"github.com/spf13/cobra"

	"turnwise/coil"
	"turnwise/coil/design"
	"turnwise/coil/tuning"
	"turnwise/forms"
	"turnwise/sheets"
)

// sheetOptions holds everything `turnwise sheet` needs; no cobra types.
type sheetOptions struct {
	job        string // job file; empty for one coil from the flags
	coil       coilOptions
	stock      *stockOptions
	stockGiven bool // --stock or --use on the command line: overrides the job's
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
				for _, f := range []string{"mandrel", "former", "wire", "insulation", "conductor", "springback", "turns", "pitch", "length", "leads", "temp", "freq", "tap", "name", "quantity"} {
					if fs.Changed(f) {
						return usageErrorf("--%s describes one coil without a job file; put it in %s instead, or drop the job file", f, args[0])
					}
				}
			}
			opts.stockGiven = fs.Changed("stock") || fs.Changed("use")
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

func runSheet(_ context.Context, opts *sheetOptions, stdout, stderr io.Writer) error {
	doc, warnings, err := sheetDocument(opts)
	if err != nil {
		return err
	}
	err = writeFileAtomic(opts.output, 0o644, stdout, func(w io.Writer) error {
		return sheets.Render(w, doc, sheets.Options{Uncompressed: opts.uncompressed})
	})
	if err != nil {
		return fmt.Errorf("-o %w", err)
	}
	for _, w := range warnings {
		fmt.Fprintf(stderr, "warning: %s\n", w)
	}
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
// job file leaves no output behind.
func sheetDocument(opts *sheetOptions) (sheets.Document, []string, error) {
	doc := sheets.Document{Title: opts.title, Paper: opts.paper.v, Units: opts.units.v}
	var warnings []string
	var date time.Time
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
		job, err := loadJobFile(opts.job)
		if err != nil {
			return doc, nil, err
		}
		cat, err := jobCatalog(job, opts.stock, opts.stockGiven)
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
			c, w, err := jobSheetCoil(job, &job.Coils[i], cat, newLengthFormatter(cmp.Or(doc.Units, "mm")))
			if err != nil {
				return doc, nil, err
			}
			doc.Coils = append(doc.Coils, c)
			warnings = append(warnings, w...)
		}
		for _, path := range job.Circuits {
			c, err := jobCircuitPage(job, path, opts.stock, opts.stockGiven)
			if err != nil {
				return doc, nil, err
			}
			doc.Circuits = append(doc.Circuits, *c)
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
	spec, p, err := predictCoil(&opts.coil, opts.stock, opts.freq)
	if err != nil {
		return sheets.Coil{}, nil, err
	}
	if opts.quantity < 1 || opts.quantity > 10000 {
		return sheets.Coil{}, nil, usageErrorf("--quantity %d: give how many to build, 1 to 10000", opts.quantity)
	}
	if strings.TrimSpace(opts.name) == "" {
		return sheets.Coil{}, nil, usageErrorf("--name is empty; name the coil as the builder will call it, e.g. --name L1")
	}
	lf := newLengthFormatter(cmp.Or(opts.units.v, "mm"))
	c := newSheetCoil(spec, p, lf)
	c.Name, c.Quantity = strings.TrimSpace(opts.name), opts.quantity
	if opts.tap.set {
		if opts.tap.v <= 0 {
			return c, nil, usageErrorf("--tap %s: a tap at the cold end is no tap; give the turns from the cold (grounded) end, e.g. --tap 1.5", opts.tap.raw)
		}
		s, err := coil.Tap(spec.Geometry, opts.tap.v, p.Frequency)
		if err != nil {
			return c, nil, &flagError{"tap", err}
		}
		c.Tap = sheetTap(s)
	}
	return c, sheetWarnings(c.Name, c.Warnings), nil
}

// jobSheetCoil resolves one job coil: the design search for a target, the
// tap and the two-gang span when asked for. Errors point into the job file.
func jobSheetCoil(job *forms.Job, jc *forms.JobCoil, cat *forms.Catalog, lf lengthFormatter) (sheets.Coil, []string, error) {
	var c sheets.Coil
	if jc.Target != nil {
		cand, res, err := designJobCoil(job, jc, cat)
		if err != nil {
			return c, nil, err
		}
		spec := candidateSpec(cat, cand)
		c = newSheetCoil(spec, cand.Prediction, lf)
		c.Target = &sheets.Target{
			Description: targetDescription(jc, res),
			Inductance:  float64(res.Required),
			Effective:   res.Effective,
			Tolerance:   res.Tolerance,
			Rank:        1,
			Why:         cand.Why,
		}
	} else {
		spec, p, err := predictJobCoil(job, jc, cat)
		if err != nil {
			return c, nil, err
		}
		c = newSheetCoil(spec, p, lf)
	}
	c.Name, c.Quantity, c.Notes, c.HighVoltage = jc.Name, jc.Quantity, jc.Notes, jc.Transmit
	g, f := c.Prediction.Geometry, c.Prediction.Frequency

	if t := jc.Tap; t != nil {
		var s coil.Sections
		var err error
		var miss float64 // (achieved − asked)/asked for a tap-ratio
		key := "tap"
		if t.Turns != nil {
			s, err = coil.Tap(g, *t.Turns, f)
		} else {
			key = "tap-ratio"
			var choices []coil.TapChoice
			choices, err = coil.FindTap(g, f, coil.GoalVoltageRatio, *t.Ratio)
			if len(choices) > 0 {
				s, miss = choices[0].Sections, choices[0].Error
			}
		}
		if err != nil {
			if errors.Is(err, coil.ErrInfeasible) {
				return c, nil, fmt.Errorf("job %q: line %d: %s: %s: %w", job.File, jc.KeyLine(key), jc.Label(), key, err)
			}
			return c, nil, jobFieldError(job, jc, key, err)
		}
		c.Tap = sheetTap(s)
		if t.Ratio != nil {
			off := fmt.Sprintf("%+.1f %%", miss*100)
			if math.Abs(miss) >= 0.1 {
				off = fmt.Sprintf("%+.0f %%", miss*100)
				c.Warnings = append(c.Warnings, fmt.Sprintf("tap-ratio %.3g: the nearest quarter-turn tap, at turn %s from the cold end, gives %.3g (%s); change the turns or the pitch to come closer",
					*t.Ratio, strings.TrimPrefix(quantity.FormatTurns(s.TapTurns), "0"), s.Ratio, off))
			}
			c.Tap.Purpose = fmt.Sprintf("This is the quarter turn nearest the voltage ratio %.3g asked for (%s).", *t.Ratio, off)
		}
	}
	if jc.Span != nil {
		sp, tap, w, err := spanJobCoil(job, jc, g, c.Tap)
		if err != nil {
			return c, nil, err
		}
		c.Span = sp
		if tap != nil {
			c.Tap = tap
		}
		c.Warnings = append(c.Warnings, w...)
	}
	return c, sheetWarnings(c.Name, c.Warnings), nil
}

func sheetWarnings(name string, ws []string) []string {
	out := make([]string, len(ws))
	for i, w := range ws {
		out[i] = fmt.Sprintf("coil %q: %s", name, w)
	}
	return out
}

// newSheetCoil is the page data of a predicted coil.
func newSheetCoil(spec coilSpec, p coil.Prediction, lf lengthFormatter) sheets.Coil {
	desc := describeWire(spec, lf)
	c := sheets.Coil{
		Wire:             desc,
		WireKey:          desc,
		Support:          spec.SupportKind,
		SupportName:      spec.SupportName,
		SpringbackSource: spec.SpringbackSource,
		SpringbackNote:   spec.SpringbackNote,
		CloseWound:       spec.PitchSource == "close-wound" || math.Abs(float64(p.Geometry.Pitch)-float64(p.Geometry.OverallDiameter())) < 1e-9,
		Prediction:       p,
		Warnings:         p.Warnings(),
	}
	if p.Frequency > 0 {
		if p0, err := coil.Predict(p.Geometry, 0); err == nil {
			c.LowFrequency = float64(p0.Inductance)
		}
	}
	if dl, err := coil.LengthPerPercent(p.Geometry, p.Frequency); err == nil {
		c.TrimPerPercent = float64(dl)
	}
	if least, most, err := coil.Window(p.Geometry, p.Frequency); err == nil {
		c.TrimLeast, c.TrimMost = float64(least), float64(most)
	}
	return c
}

func sheetTap(s coil.Sections) *sheets.Tap {
	return &sheets.Tap{
		Turns:    s.TapTurns,
		Ratio:    s.Ratio,
		LBelow:   float64(s.LB),
		LAbove:   float64(s.LA),
		Mutual:   float64(s.M),
		Coupling: s.K,
	}
}

// designJobCoil runs the design search for a job coil with a target and
// returns the best candidate.
func designJobCoil(job *forms.Job, jc *forms.JobCoil, cat *forms.Catalog) (design.Candidate, design.Result, error) {
	t, w := jc.Target, jc.Winding
	o := &designSearchOptions{
		Support:    t.Support,
		Mandrel:    w.Mandrel,
		Former:     w.Former,
		Insulation: w.Insulation,
		Conductor:  w.Conductor,
		Springback: w.Springback,
		Prefer:     t.Prefer,
		Top:        1,
	}
	if w.Wire != "" {
		o.Wires = []string{w.Wire}
	}
	if t.Inductance != nil {
		o.Inductance = *t.Inductance
	}
	if t.Cap != nil {
		o.Capacitance = *t.Cap
	}
	if t.Stray != nil {
		o.Stray = *t.Stray
	}
	if w.Freq != nil {
		o.Freq = *w.Freq
	}
	if t.Tolerance != nil {
		o.Tolerance = *t.Tolerance
	}
	if w.Leads != nil {
		o.Leads = *w.Leads
	}
	if w.Temp != nil {
		o.Temp = *w.Temp
	}
	if t.MaxLength != nil {
		o.MaxLength = *t.MaxLength
	}
	if t.MaxDiameter != nil {
		o.MaxDiameter = *t.MaxDiameter
	}
	if t.MaxWireLength != nil {
		o.MaxWireLength = *t.MaxWireLength
	}
	if t.MinSRFRatio != nil {
		o.MinSRFRatio = *t.MinSRFRatio
	}
	res, err := runDesignSearch(cat, o)
	if err != nil {
		if errors.Is(err, coil.ErrInfeasible) {
			return design.Candidate{}, res, fmt.Errorf("job %q: line %d: %s: %w", job.File, jc.Line, jc.Label(), err)
		}
		return design.Candidate{}, res, jobCoilError(job, jc, err)
	}
	if len(res.Candidates) == 0 {
		return design.Candidate{}, res, fmt.Errorf("job %q: line %d: %s: %w: the design search returned no candidate", job.File, jc.Line, jc.Label(), coil.ErrInfeasible)
	}
	return res.Candidates[0], res, nil
}

// candidateSpec is the coilSpec of a design candidate, its wire looked up
// in the catalog for the page's description.
func candidateSpec(cat *forms.Catalog, c design.Candidate) coilSpec {
	g := c.Prediction.Geometry
	kind := "mandrel"
	if c.Support.OnFormer {
		kind = "former"
	}
	w, err := cat.Wire(c.Wire.Name)
	if err != nil {
		w = forms.Wire{Name: c.Wire.Name, Bare: c.Wire.Diameter, Overall: c.Wire.Overall, Insulation: "none", Origin: "design"}
		if c.Wire.Overall > c.Wire.Diameter {
			w.Insulation = "custom"
		}
	}
	src := c.SpringbackSource
	if src == "support" {
		src = "given"
	}
	pitch := "pitch"
	if math.Abs(float64(g.Pitch)-float64(g.OverallDiameter())) < 1e-9 {
		pitch = "close-wound"
	}
	return coilSpec{
		Geometry: g, Wire: w, SupportKind: kind, SupportName: c.Support.Name,
		SpringbackSource: src, SpringbackNote: c.Support.SpringbackNote, PitchSource: pitch,
	}
}

func targetDescription(jc *forms.JobCoil, res design.Result) string {
	t := jc.Target
	tol := fmt.Sprintf(", L within ± %.3g %%", res.Tolerance*100)
	if t.Cap != nil {
		c := quantity.FormatCapacitance(float64(*t.Cap))
		if t.Stray != nil && *t.Stray > 0 {
			c += " + " + quantity.FormatCapacitance(float64(*t.Stray)) + " stray"
		}
		return fmt.Sprintf("resonate with %s at %s%s", c, quantity.FormatEng(float64(*jc.Winding.Freq), "Hz", 4), tol)
	}
	d := quantity.FormatEng(float64(*t.Inductance), "H", 3) + " at the terminals"
	if jc.Winding.Freq != nil {
		d += " at " + quantity.FormatEng(float64(*jc.Winding.Freq), "Hz", 4)
	}
	return d + tol
}

// spanJobCoil solves the two-gang circuit of a job coil and converts it to
// the chart's data; with choose-tap it returns the chosen tap too.
func spanJobCoil(job *forms.Job, jc *forms.JobCoil, g coil.Geometry, tap *sheets.Tap) (*sheets.Span, *sheets.Tap, []string, error) {
	js := jc.Span
	if _, named := tuning.ParseLaw(js.Law); js.GangA.Max == 0 && named {
		return nil, nil, nil, jobFieldError(job, jc, "gang", errors.New("a gang of 0 pF leaves section A with no capacitor; give the capacitor's minimum and maximum per section, e.g. 15-365pF"))
	}
	law := js.Law
	if _, named := tuning.ParseLaw(law); !named && !filepath.IsAbs(law) {
		law = filepath.Join(filepath.Dir(job.File), law)
	}
	set := spanSettings{
		GangA: [2]float64{float64(js.GangA.Min), float64(js.GangA.Max)}, GangB: [2]float64{float64(js.GangB.Min), float64(js.GangB.Max)},
		GangBSet: js.GangBSet, Law: law, TrimA: js.TrimA, TrimB: js.TrimB, StrayA: js.StrayA, StrayB: js.StrayB,
		Steps: max(js.Steps, 101), LoadedQ: js.LoadedQ, Margin: js.Margin, ChooseTap: js.ChooseTap,
	}
	if tap != nil {
		set.Tap = tap.Turns
	}
	for _, b := range js.Bands {
		set.Bands = append(set.Bands, tuning.Band{Name: b.Name, Low: b.Low, High: b.High})
	}
	out, err := buildSpan(g, set)
	var warnings []string
	if err != nil {
		if !errors.Is(err, coil.ErrInfeasible) || out.Plan == nil {
			return nil, nil, nil, spanJobError(job, jc, err)
		}
		// choose-tap found no tap meeting everything: print its best
		// compromise and say so.
		warnings = append(warnings, "choose-tap: no tap meets every requirement; the sheet shows the best compromise: "+strings.Join(out.Plan.Conflicts, "; "))
	}
	a, b, _ := gangFromSettings(set)
	sp := out.Span
	s := &sheets.Span{
		GangA:     describeGang(a),
		GangB:     describeGang(b),
		Capacitor: sheetCapacitor(a, b),
		Law:       describeLaw(a),
		Overlap:   float64(sp.Overlap),
		Notes:     sp.Warnings,
	}
	for _, d := range sp.Dial {
		s.Dial = append(s.Dial, sheets.DialPoint{Setting: d.Setting, FLow: float64(d.FLow), FHigh: float64(d.FHigh)})
	}
	for _, bc := range sp.Bands {
		where, on := bc.Placement()
		sb := sheets.Band{Low: float64(bc.Band.Low), High: float64(bc.Band.High), Label: bc.Band.Name,
			Range: where.String(), DialLow: on.SettingAtLow, DialHigh: on.SettingAtHigh}
		s.Bands = append(s.Bands, sb)
	}
	for _, co := range sp.Coincidences {
		s.Coincidences = append(s.Coincidences, sheets.Coincidence{
			Setting: co.Setting, Order: co.Order, Band: co.Band,
			FLow: float64(co.FLow), FHigh: float64(co.FHigh), Depth: co.Depth,
		})
	}
	var chosen *sheets.Tap
	if out.Plan != nil {
		chosen = sheetTap(sp.Sections)
		chosen.Purpose = "The tap was chosen for the bands (choose-tap)."
	}
	return s, chosen, warnings, nil
}

// spanJobError reports an error of the two-gang glue, which speaks in
// span's flags, at the job file's key of the same name: "--law: ..." is
// reported at law = with the dashes dropped, and a bad capacitor table at
// the law key.
func spanJobError(job *forms.Job, jc *forms.JobCoil, err error) error {
	var fe *flagError
	if errors.As(err, &fe) {
		return jobFieldError(job, jc, fe.flag, fe.err)
	}
	key := ""
	if _, named := tuning.ParseLaw(jc.Span.Law); !named {
		key = "law"
	}
	var ue *usageError
	if errors.As(err, &ue) {
		msg := ue.msg
		if rest, ok := strings.CutPrefix(msg, "--"); ok {
			if i := strings.IndexAny(rest, " :"); i > 0 && jc.Has(rest[:i]) {
				key, msg = rest[:i], strings.TrimLeft(rest[i:], ": ")
			}
		}
		return jobFieldError(job, jc, key, errors.New(strings.ReplaceAll(msg, "--", "")))
	}
	return jobFieldError(job, jc, key, err)
}

// sheetCapacitor is the two-gang capacitor to buy, without the board's
// stray capacitance.
func sheetCapacitor(a, b tuning.GangSection) string {
	a.Stray, b.Stray = 0, 0
	if describeGang(b) == describeGang(a) {
		return describeGang(a) + " per section"
	}
	return "A " + describeGang(a) + ", B " + describeGang(b)
}
