package main

import (
	"encoding/json"
	"errors"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"turnwise/coil"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"

	"github.com/spf13/pflag"
	"gonum.org/v1/gonum/unit"

	"turnwise/forms"
	"turnwise/internal/testtools"
)

// demoJob is the README's example job.
var demoJob = filepath.Join("..", "..", "testdata", "club-night.toml")

func loadDemo(t *testing.T) (*forms.Job, *forms.Catalog) {
	t.Helper()
	return loadJob(t, demoJob)
}

// loadJob reads a job file and its catalog as the sheet command does, with
// no stock or wire-table overrides.
func loadJob(t *testing.T, file string) (*forms.Job, *forms.Catalog) {
	t.Helper()
	job, err := spec.LoadJob(file)
	if err != nil {
		t.Fatal(err)
	}
	cat, err := spec.JobCatalog(job, "", "", false)
	if err != nil {
		t.Fatal(err)
	}
	return job, cat
}

func TestSheetDemo(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	out := filepath.Join(t.TempDir(), "build-sheets.pdf")
	stdout, stderr, code := runCLI(t, "sheet", demoJob, "-o", out)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	checkGolden(t, "sheet_demo.txt", strings.ReplaceAll(stdout, out, "OUT"))
	b, err := os.ReadFile(out)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.HasPrefix(string(b), "%PDF-") {
		t.Fatalf("not a PDF: %q", b[:min(20, len(b))])
	}
	pdfinfo := testtools.Need(t, "pdfinfo", "poppler-utils")
	info, err := exec.Command(pdfinfo, out).Output()
	if err != nil {
		t.Fatal(err)
	}
	// Cover, five coil pages, one tuning chart, one coupler page.
	if !regexp.MustCompile(`Pages:\s+8\n`).Match(info) || !strings.Contains(string(info), "A4") {
		t.Errorf("pdfinfo:\n%s", info)
	}
}

// pageText returns the raw text of one page, whitespace collapsed.
func pageText(t *testing.T, file string, page int) string {
	t.Helper()
	pdftotext := testtools.Need(t, "pdftotext", "poppler-utils")
	out, err := exec.Command(pdftotext, "-raw", "-f", fmt.Sprint(page), "-l", fmt.Sprint(page), file, "-").Output()
	if err != nil {
		t.Fatal(err)
	}
	return strings.Join(strings.Fields(string(out)), " ")
}

var siPrefix = map[string]float64{"": 1, "p": 1e-12, "n": 1e-9, "µ": 1e-6, "m": 1e-3, "k": 1e3, "M": 1e6, "G": 1e9}

// printed parses a number as printed, with an optional SI prefix and unit
// ("82.5 nH", "2.25 mm", "395"), and returns its SI value and half a unit
// in its last digit: the rounding it carries.
func printed(t *testing.T, s string) (v, halfULP float64) {
	t.Helper()
	m := regexp.MustCompile(`^(-?[\d.]+)\s*(p|n|µ|m|k|M|G)?(H|Hz|F|m|g)?$`).FindStringSubmatch(strings.TrimSpace(s))
	if m == nil {
		t.Fatalf("%q is not a printed quantity", s)
	}
	x, err := strconv.ParseFloat(m[1], 64)
	if err != nil {
		t.Fatal(err)
	}
	scale := siPrefix[m[2]]
	if m[3] == "" && m[2] == "m" { // "2.25 mm" splits as prefix m, unit m; a bare "m" is metres
		scale = 1
	}
	dec := 0
	if i := strings.IndexByte(m[1], '.'); i >= 0 {
		dec = len(m[1]) - i - 1
	}
	return x * scale, 0.5 * math.Pow(10, -float64(dec)) * scale
}

// Every value on a coil page matches `turnwise predict --json` for that
// coil, to the precision printed.
func TestSheetMatchesPredict(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	file := filepath.Join(t.TempDir(), "demo.pdf")
	if _, stderr, code := runCLI(t, "sheet", demoJob, "-o", file); code != exitOK {
		t.Fatalf("sheet: %s", stderr)
	}
	job, cat := loadDemo(t)
	num := `(-?[\d.]+ ?(?:p|n|µ|m|k|M|G)?(?:H|Hz|F|m))`
	checks := []struct {
		re   string
		keys []string // JSON keys, one per group; "lf:" = predict without --freq
	}{
		{`L at the terminals ` + num + ` at `, []string{"inductance"}},
		{`coil \+ leads ` + num + ` \+ ` + num, []string{"inductance_coil_at_f", "inductance_leads"}},
		{`L effective at f ` + num, []string{"inductance_effective"}},
		{`on an L meter ` + num, []string{"lf:inductance"}},
		{`self-resonance ` + num + ` ± [\d.]+ %, one end grounded`, []string{"srf"}},
		{`self-capacitance ` + num, []string{"self_capacitance"}},
		{`Q at [\d.]+ [kMG]?Hz (\d+) \(likely (\d+) … (\d+)\)`, []string{"q", "q_min", "q_max"}},
		{`wire to cut ` + num, []string{"wire_length"}},
		{`the winding ` + num, []string{"wire_length_winding"}},
		{`outside length ` + num + ` over the turns`, []string{"winding_length"}},
		{`outside dia\. ` + num, []string{"outside_diameter"}},
		{`bore ` + num, []string{"inside_diameter"}},
		{`pitch ` + num, []string{"pitch"}},
		{`lead ` + num, []string{"lead_length"}},
		{`1 % of L = ` + num + ` of outside length`, []string{"trim_length_per_percent"}},
	}
	page := 2
	for i := range job.Coils {
		jc := &job.Coils[i]
		t.Run(jc.Name, func(t *testing.T) {
			args := predictArgs(t, job, jc, cat)
			js := predictJSON(t, append(args, "--freq", jc.Raw("freq")))
			lf := predictJSON(t, args)
			text := pageText(t, file, page)
			for _, c := range checks {
				m := regexp.MustCompile(c.re).FindStringSubmatch(text)
				if m == nil {
					t.Errorf("page %d has no %q:\n%s", page, c.re, text)
					continue
				}
				for j, key := range c.keys {
					src := js
					if k, ok := strings.CutPrefix(key, "lf:"); ok {
						src, key = lf, k
					}
					want, ok := src[key].(float64)
					if !ok {
						t.Fatalf("predict --json has no %s", key)
					}
					got, half := printed(t, m[j+1])
					if math.Abs(got-want) > half*(1+1e-9) {
						t.Errorf("page %d %s: printed %s, predict says %.6g", page, key, m[j+1], want)
					}
				}
			}
			if !strings.Contains(text, quantity.FormatTurns(js["turns"].(float64))+" turns of ") {
				t.Errorf("page %d does not say %s turns", page, quantity.FormatTurns(js["turns"].(float64)))
			}
		})
		page++
		if jc.Span != nil {
			page++
		}
	}
}

// predictArgs are predict's flags for a job coil: the job's own keys for a
// fixed winding (they are predict's flag names), the design's answer for a
// target.
func predictArgs(t *testing.T, job *forms.Job, jc *forms.JobCoil, cat *forms.Catalog) []string {
	t.Helper()
	args := []string{"predict"}
	if jc.Target == nil {
		for _, k := range []string{"mandrel", "former", "wire", "insulation", "conductor", "springback", "turns", "pitch", "length", "leads", "temp"} {
			if jc.Has(k) {
				args = append(args, "--"+k, jc.Raw(k))
			}
		}
		return args
	}
	_, cand, _, err := spec.DesignJobCoil(job, jc, cat)
	if err != nil {
		t.Fatal(err)
	}
	g := cand.Prediction.Geometry
	support := "--mandrel"
	if cand.Support.OnFormer {
		support = "--former"
	}
	ins := "none"
	if g.WireOverall > g.WireDiameter {
		ins = fmt.Sprintf("%.15gmm", float64(g.WireOverall)*1e3)
	}
	return append(args, support, fmt.Sprintf("%.15gmm", float64(g.FormerDiameter)*1e3),
		"--wire", fmt.Sprintf("%.15gmm", float64(g.WireDiameter)*1e3), "--insulation", ins,
		"--conductor", g.Conductor.String(), "--springback", fmt.Sprintf("%.15g%%", g.Springback*100),
		"--turns", fmt.Sprint(g.Turns), "--pitch", fmt.Sprintf("%.15gmm", float64(g.Pitch)*1e3),
		"--leads", jc.Raw("leads"))
}

func predictJSON(t *testing.T, args []string) map[string]any {
	t.Helper()
	out, stderr, code := runCLI(t, append(args, "--json")...)
	if code != exitOK {
		t.Fatalf("%v: exit %d: %s", args, code, stderr)
	}
	var m map[string]any
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	return m
}

// A job coil resolves to the same geometry as predict's flags with the
// same names; this is what trim --job relies on.
func TestResolveJobCoil(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	job, cat := loadDemo(t)
	for i := range job.Coils {
		jc := &job.Coils[i]
		if jc.Target != nil {
			if _, err := spec.ResolveJobCoil(job, jc, cat); err == nil || !strings.Contains(err.Error(), "design target") {
				t.Errorf("%s: a design target resolved as a winding: %v", jc.Name, err)
			}
			continue
		}
		got, err := spec.ResolveJobCoil(job, jc, cat)
		if err != nil {
			t.Fatal(err)
		}
		var o coilOptions
		fs := pflag.NewFlagSet("predict", pflag.ContinueOnError)
		o.addFlags(fs)
		if err := fs.Parse(predictArgs(t, job, jc, cat)[1:]); err != nil {
			t.Fatal(err)
		}
		want, err := spec.Resolve(cat, o.winding())
		if err != nil {
			t.Fatal(err)
		}
		if got.Geometry != want.Geometry || got.SupportName != want.SupportName || got.PitchSource != want.PitchSource {
			t.Errorf("%s: job gives %+v, flags give %+v", jc.Name, got, want)
		}
	}
}

// Errors in a job coil point at the key's line and keep their exit codes.
func TestJobCoilErrors(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	cat, err := forms.BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	const head = "title = \"t\"\n[[coil]]\nname = \"L1\"\nleads = \"5mm\"\nturns = 5\n" // lines 1-5
	cases := []struct {
		name string
		body string
		line int
		want string
	}{
		{"pitch below wire", "mandrel = \"6mm\"\nwire = \"1mm\"\npitch = \"0.5mm\"\n", 8, "pitch: 0.5 mm is less than the wire's overall diameter"},
		{"unknown wire", "mandrel = \"6mm\"\nwire = \"green spool\"\n", 7, `wire: wire "green spool" not found`},
		{"unknown mandrel", "mandrel = \"broom handle\"\nwire = \"1mm\"\n", 6, "mandrel:"},
		{"length too short", "mandrel = \"6mm\"\nwire = \"1mm\"\nlength = \"3mm\"\n", 8, "length:"},
		{"frequency above SRF", "mandrel = \"6mm\"\nwire = \"1mm\"\nfreq = \"5GHz\"\n", 8, "freq:"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			job, err := forms.LoadJob(strings.NewReader(head+tc.body), "j.toml")
			if err != nil {
				t.Fatal(err)
			}
			_, _, err = spec.PredictJobCoil(job, &job.Coils[0], cat)
			var pe *forms.ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("%v (%T) is not a *forms.ParseError", err, err)
			}
			if pe.Line != tc.line || !strings.Contains(err.Error(), tc.want) || exitCode(err) != exitBadInput {
				t.Errorf("line %d exit %d: %v; want line %d and %q", pe.Line, exitCode(err), err, tc.line, tc.want)
			}
			if !strings.HasPrefix(err.Error(), `job "j.toml": line `) {
				t.Errorf("error %q does not start with the file and line", err)
			}
		})
	}
}

// A malformed job file: the line and the problem, exit 2, nothing written,
// an existing output untouched.
func TestSheetBadJob(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	// A measured capacitor table (invented values) for the law cases.
	if err := os.WriteFile(filepath.Join(dir, "table.csv"), []byte("0% 12pF\n100% 365pF\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	cases := []struct {
		name string
		job  string
		code int
		want string
	}{
		{"toml syntax", "title = \"t\"\n[[coil]]\nname = L1\n", exitBadInput, "line 3: not valid TOML"},
		{"unknown key", "title = \"t\"\n[[coil]]\nname = \"L1\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = 5\nleads = \"5mm\"\nturnz = 6\n", exitBadInput, `line 8: coil "L1": unknown key "turnz"; did you mean turns?`},
		{"model refuses", "title = \"t\"\n[[coil]]\nname = \"L1\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = 5\nleads = \"5mm\"\npitch = \"0.2mm\"\n", exitBadInput, `line 8: coil "L1": pitch:`},
		{"second coil", "title = \"t\"\n[[coil]]\nname = \"L1\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = 5\nleads = \"5mm\"\n[[coil]]\nname = \"L2\"\nformer = \"pvc 20mm\"\nwire = \"99awg\"\nturns = 5\nleads = \"5mm\"\n", exitBadInput, `line 11: coil "L2": wire:`},
		{"law file missing", "title = \"t\"\n[[coil]]\nname = \"L1\"\nformer = \"pvc 25mm\"\nwire = \"0.5mm\"\nturns = 28\nleads = \"30mm\"\ntap = 8\nlaw = \"nothere.csv\"\n", exitBadInput, `line 9: coil "L1": law: "`},
		{"law table and gang", "title = \"t\"\n[[coil]]\nname = \"L1\"\nformer = \"pvc 25mm\"\nwire = \"0.5mm\"\nturns = 28\nleads = \"30mm\"\ntap = 8\ngang = \"12-365pF\"\nlaw = \"table.csv\"\n", exitBadInput, `line 10: coil "L1": law: `},
		{"gang of nothing", "title = \"t\"\n[[coil]]\nname = \"L1\"\nformer = \"pvc 25mm\"\nwire = \"0.5mm\"\nturns = 28\nleads = \"30mm\"\ntap = 8\ngang = \"0-0pF\"\n", exitBadInput, `line 9: coil "L1": gang: a gang of 0 pF`},
		{"impossible design", "title = \"t\"\n[[coil]]\nname = \"L1\"\ninductance = \"10uH\"\nfreq = \"145MHz\"\nleads = \"5mm\"\nmandrel = \"6mm drill\"\nwire = \"1mm\"\nmax-length = \"5mm\"\n", exitInfeasible, `line 2: coil "L1": no coil meets`},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			jobFile := filepath.Join(dir, strings.ReplaceAll(tc.name, " ", "-")+".toml")
			if err := os.WriteFile(jobFile, []byte(tc.job), 0o644); err != nil {
				t.Fatal(err)
			}
			out := filepath.Join(dir, "keep.pdf")
			if err := os.WriteFile(out, []byte("previous"), 0o644); err != nil {
				t.Fatal(err)
			}
			stdout, stderr, code := runCLI(t, "sheet", jobFile, "-o", out)
			if code != tc.code {
				t.Errorf("exit %d, want %d: %s", code, tc.code, stderr)
			}
			if !strings.Contains(stderr, tc.want) || strings.Count(strings.TrimSpace(stderr), "\n") != 0 {
				t.Errorf("stderr %q: want one line with %q", stderr, tc.want)
			}
			if stdout != "" {
				t.Errorf("stdout %q", stdout)
			}
			if strings.Contains(stderr, " --") {
				t.Errorf("stderr %q names a flag; a job file has keys", stderr)
			}
			if b, _ := os.ReadFile(out); string(b) != "previous" {
				t.Error("the existing output was changed")
			}
			if left, _ := filepath.Glob(filepath.Join(dir, ".turnwise-tmp-*")); len(left) > 0 {
				t.Errorf("temporary files left: %v", left)
			}
		})
	}
}

func TestSheetFlags(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	coilFlags := []string{"--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm", "--freq", "145MHz"}
	t.Run("one coil", func(t *testing.T) {
		out := filepath.Join(dir, "one.pdf")
		stdout, stderr, code := runCLI(t, append(append([]string{"sheet"}, coilFlags...), "--tap", "1.5", "--name", "L7", "--date", "2026-03-14", "-o", out)...)
		if code != exitOK {
			t.Fatalf("exit %d: %s", code, stderr)
		}
		checkGolden(t, "sheet_one.txt", strings.ReplaceAll(stdout, out, "OUT"))
		text := pageText(t, out, 2)
		for _, want := range []string{"L7", "5 turns of 1.00 mm bare copper wire on the 6mm drill", "TAP: 1½ turns from the cold end", "14 March 2026"} {
			if !strings.Contains(text, want) {
				t.Errorf("page 2 lacks %q:\n%s", want, text)
			}
		}
	})
	t.Run("stdout", func(t *testing.T) {
		stdout, stderr, code := runCLI(t, append(append([]string{"sheet"}, coilFlags...), "-o", "-")...)
		if code != exitOK || !strings.HasPrefix(stdout, "%PDF-") || !strings.Contains(stderr, "wrote standard output") {
			t.Errorf("exit %d, stdout starts %q, stderr %q", code, stdout[:min(8, len(stdout))], stderr)
		}
	})
	bad := []struct {
		name string
		args []string
		want string
	}{
		{"no output", append([]string{"sheet"}, coilFlags...), "-o FILE.pdf is required"},
		{"job and coil flags", []string{"sheet", demoJob, "--turns", "5", "-o", filepath.Join(dir, "x.pdf")}, "--turns describes one coil"},
		{"two jobs", []string{"sheet", demoJob, demoJob, "-o", filepath.Join(dir, "x.pdf")}, "one job file"},
		{"missing job", []string{"sheet", filepath.Join(dir, "nope.toml"), "-o", filepath.Join(dir, "x.pdf")}, "does not exist"},
		{"bad date", append(append([]string{"sheet"}, coilFlags...), "--date", "14/3/26", "-o", filepath.Join(dir, "x.pdf")), "--date"},
		{"bad paper", append(append([]string{"sheet"}, coilFlags...), "--paper", "A3", "-o", filepath.Join(dir, "x.pdf")), "--paper"},
		{"tap outside", append(append([]string{"sheet"}, coilFlags...), "--tap", "7", "-o", filepath.Join(dir, "x.pdf")), "--tap"},
		{"tap at the cold end", append(append([]string{"sheet"}, coilFlags...), "--tap", "0", "-o", filepath.Join(dir, "x.pdf")), "--tap 0"},
		{"blank name", append(append([]string{"sheet"}, coilFlags...), "--name", " ", "-o", filepath.Join(dir, "x.pdf")), "--name"},
	}
	for _, tc := range bad {
		t.Run(tc.name, func(t *testing.T) {
			_, stderr, code := runCLI(t, tc.args...)
			if code != exitBadInput || !strings.Contains(stderr, tc.want) {
				t.Errorf("exit %d, stderr %q; want 2 and %q", code, stderr, tc.want)
			}
		})
	}
	if left, _ := filepath.Glob(filepath.Join(dir, "x.pdf*")); len(left) > 0 {
		t.Errorf("files written on error: %v", left)
	}
}

// A job's stock file is read relative to the job file; a missing one is
// reported at the stock line.
func TestJobStock(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	bench, err := os.ReadFile(filepath.Join("..", "..", "testdata", "stock", "bench.toml"))
	if err != nil {
		t.Fatal(err)
	}
	if err := os.MkdirAll(filepath.Join(dir, "shelf"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "shelf", "bench.toml"), bench, 0o644); err != nil {
		t.Fatal(err)
	}
	job := "title = \"t\"\nstock = \"shelf/bench.toml\"\n[[coil]]\nname = \"L1\"\nmandrel = \"brass rod 6\"\nwire = \"green spool\"\nturns = 8\nleads = \"5mm\"\n"
	jobFile := filepath.Join(dir, "job.toml")
	if err := os.WriteFile(jobFile, []byte(job), 0o644); err != nil {
		t.Fatal(err)
	}
	j, cat := loadJob(t, jobFile)
	cs, err := spec.ResolveJobCoil(j, &j.Coils[0], cat)
	if err != nil {
		t.Fatal(err)
	}
	// The bench stock's latest calibration for this pair is 2.8 % (demo value in testdata/stock/bench.toml).
	if cs.SpringbackSource != "calibration" || math.Abs(cs.Geometry.Springback-0.028) > 1e-12 {
		t.Errorf("springback %v from %s, want the stock's 2.8 %% calibration", cs.Geometry.Springback, cs.SpringbackSource)
	}

	missing := filepath.Join(dir, "missing.toml")
	if err := os.WriteFile(missing, []byte(strings.Replace(job, "shelf/bench.toml", "shelf/none.toml", 1)), 0o644); err != nil {
		t.Fatal(err)
	}
	_, stderr, code := runCLI(t, "sheet", missing, "-o", filepath.Join(dir, "x.pdf"))
	if code != exitBadInput || !strings.Contains(stderr, "line 2: stock:") {
		t.Errorf("exit %d, stderr %q", code, stderr)
	}
}

// A tap by voltage ratio says how near the quarter turn comes, and warns
// when no quarter turn comes within 10 %.
func TestSheetTapRatio(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	const job = "title = \"t\"\n[[coil]]\nname = \"L1\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nleads = \"5mm\"\nturns = 5\nfreq = \"100MHz\"\ntap-ratio = %g\n"
	for _, tc := range []struct {
		ratio float64
		warn  bool
	}{
		{0.2, false}, // inside the range of the quarter-turn taps: one comes within 10 %
		{0.01, true}, // below what the ¼-turn tap gives: nothing comes near
	} {
		jobFile := filepath.Join(dir, fmt.Sprintf("r%g.toml", tc.ratio))
		if err := os.WriteFile(jobFile, []byte(fmt.Sprintf(job, tc.ratio)), 0o644); err != nil {
			t.Fatal(err)
		}
		out := filepath.Join(dir, fmt.Sprintf("r%g.pdf", tc.ratio))
		_, stderr, code := runCLI(t, "sheet", jobFile, "-o", out)
		if code != exitOK {
			t.Fatalf("ratio %g: exit %d: %s", tc.ratio, code, stderr)
		}
		if got := strings.Contains(stderr, fmt.Sprintf("tap-ratio %g: the nearest quarter-turn tap", tc.ratio)); got != tc.warn {
			t.Errorf("ratio %g: warning %v, want %v: %q", tc.ratio, got, tc.warn, stderr)
		}
		if text := pageText(t, out, 2); !strings.Contains(text, fmt.Sprintf("nearest the voltage ratio %g asked for (", tc.ratio)) {
			t.Errorf("ratio %g: page 2 does not say how near the tap comes:\n%s", tc.ratio, text)
		}
	}
}

// A fixed winding's tank-cap puts its tank's drift on its page, the same
// row a design target's cap gets: with the N750 class (−750 ppm/K,
// EIA-198 class 1 from memory) over the job's temp-range, at the frequency
// the winding resonates with that capacitor. A bad tank-cap is exit 2 at
// its line, naming the key.
func TestSheetTankCap(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	const job = "title = \"t\"\ntemp-range = \"10C-40C\"\n[[coil]]\nname = \"V1\"\nformer = \"pvc 20mm\"\nwire = \"0.5mm\"\nleads = \"10mm\"\nturns = 10\npitch = \"1mm\"\ntank-cap = %s\ncap-tempco = \"N750\"\n"
	jobFile := filepath.Join(dir, "tank.toml")
	if err := os.WriteFile(jobFile, []byte(fmt.Sprintf(job, `"100pF"`)), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "tank.pdf")
	if _, stderr, code := runCLI(t, "sheet", jobFile, "-o", out); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	j, cat := loadJob(t, jobFile)
	c, _, err := spec.JobSheetCoil(j, &j.Coils[0], cat, quantity.LengthFormat{})
	if err != nil || c.Thermal == nil || c.Thermal.Tank == nil {
		t.Fatalf("%v, %+v: want a tank drift", err, c.Thermal)
	}
	k := c.Thermal.Tank
	text := pageText(t, out, 2)
	m := regexp.MustCompile(`tank drift with 100 pF N750 at ([\d.]+ ?[kMG]?Hz): ([+\-−]?[\d.]+) ppm/K ± [\d.]+, ([+\-−]?[\d.]+ ?[kM]?Hz) ± [\d.]+ ?[kM]?Hz from 10 °C to 40 °C`).FindStringSubmatch(text)
	if m == nil {
		t.Fatalf("page 2 has no tank drift row:\n%s", text)
	}
	num := func(s string) string {
		return strings.ReplaceAll(strings.ReplaceAll(strings.ReplaceAll(s, "−", "-"), "+", ""), " ", "")
	}
	for _, x := range []struct {
		name, s string
		want    float64
	}{
		{"frequency", m[1], float64(k.Frequency)},
		{"shift", m[3], k.ShiftHz},
	} {
		s := num(x.s)
		v, half := printed(t, strings.TrimSuffix(s, "z")) // "7.03MHz" -> "7.03MH": prefix and unit H
		if math.Abs(v-x.want) > half*1.001 {
			t.Errorf("%s printed %q, computed %.6g", x.name, x.s, x.want)
		}
	}
	if ppm, err := strconv.ParseFloat(num(m[2]), 64); err != nil || math.Abs(ppm-k.PerK*1e6) > 0.51 {
		t.Errorf("ppm/K printed %q, computed %.4g", m[2], k.PerK*1e6)
	}
	// N750 pulls the tank up: −½(τ_L − 750 ppm/K) is above +300 ppm/K for any τ_L under 150 ppm/K.
	if !(k.PerK > 300e-6) || !(k.ShiftHz > 0) {
		t.Errorf("tank %+v: want a rising drift with N750", k)
	}
	for _, tc := range []struct{ val, want string }{
		{`"hot"`, "tank-cap"},
		{`"-5pF"`, "tank-cap"},
	} {
		bad := filepath.Join(dir, "bad.toml")
		if err := os.WriteFile(bad, []byte(fmt.Sprintf(job, tc.val)), 0o644); err != nil {
			t.Fatal(err)
		}
		_, stderr, code := runCLI(t, "sheet", bad, "-o", filepath.Join(dir, "bad.pdf"))
		if code != exitBadInput || !strings.Contains(stderr, tc.want) || !strings.Contains(stderr, "line 10") {
			t.Errorf("tank-cap = %s: exit %d, %q: want exit 2 naming %s at line 10", tc.val, code, stderr, tc.want)
		}
	}
}

// A job coil designed to a band with a trimmer states, on its page, the
// band, the trimmer and its settings at both band edges; re-predicted
// (coil.Predict at each edge, self-capacitance included), the coil with
// the fixed capacitor, the stray and the trimmer at the printed setting
// resonates at that edge. The page states the tap and its achieved
// voltage ratio, which re-checks through coil.Tap.
func TestSheetBandTrimmer(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	const job = "title = \"t\"\n[[coil]]\nname = \"T2\"\nband = \"144-146MHz\"\ntrimmer = \"2-10pF\"\ncap = \"15pF\"\nstray = \"2pF\"\nleads = \"5mm\"\ntap-ratio = 0.2\n"
	jobFile := filepath.Join(dir, "band.toml")
	if err := os.WriteFile(jobFile, []byte(job), 0o644); err != nil {
		t.Fatal(err)
	}
	out := filepath.Join(dir, "band.pdf")
	if _, stderr, code := runCLI(t, "sheet", jobFile, "-o", out); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	text := pageText(t, out, 2)
	for _, want := range []string{"band 144.0 MHz … 146.0 MHz", "trimmer 2 pF … 10 pF in parallel with 15 pF + 2 pF stray", "Designed to tune 144 MHz–146 MHz with a 2 pF–10 pF trimmer"} {
		if !strings.Contains(text, want) {
			t.Errorf("page 2 lacks %q:\n%s", want, text)
		}
	}
	// The coil on the page, from the same search.
	j, cat := loadJob(t, jobFile)
	_, cand, _, err := spec.DesignJobCoil(j, &j.Coils[0], cat)
	if err != nil {
		t.Fatal(err)
	}
	g := cand.Prediction.Geometry
	const fixed, stray, tmin, tmax = 15e-12, 2e-12, 2e-12, 10e-12
	for _, edge := range []struct {
		f    float64
		name string
	}{{144e6, "low"}, {146e6, "high"}} {
		m := regexp.MustCompile(`set at ` + regexp.QuoteMeta(quantity.FormatEng(edge.f, "Hz", 4)) + ` ([\d.]+ pF) \(band's ` + edge.name + ` edge\)`).FindStringSubmatch(text)
		if m == nil {
			t.Errorf("page 2 gives no trimmer setting at the %s edge:\n%s", edge.name, text)
			continue
		}
		set, half := printed(t, m[1])
		// 10 % of the swing kept free at each end (the default margin).
		if set < tmin+0.1*(tmax-tmin)-half || set > tmax-0.1*(tmax-tmin)+half {
			t.Errorf("%s edge: trimmer at %.3g pF leaves less than 10 %% of its swing", edge.name, set*1e12)
		}
		p, err := coil.Predict(g, unit.Frequency(edge.f))
		if err != nil {
			t.Fatal(err)
		}
		// f = 1/(2π√(L_eff·C)): the resonance with the printed setting.
		fr := 1 / (2 * math.Pi * math.Sqrt(float64(p.InductanceEffective)*(fixed+stray+set)))
		tol := half/(2*(fixed+stray+set)) + 1e-6 // the printed digits' rounding, through √
		if math.Abs(fr/edge.f-1) > tol {
			t.Errorf("%s edge: with the trimmer at %s the coil resonates at %.6g MHz, want %.6g MHz (± %.2g)", edge.name, m[1], fr/1e6, edge.f/1e6, tol)
		}
	}
	// The tap: the page's ratio is coil.Tap's at the page's turns.
	f := cand.Prediction.Frequency
	choices, err := coil.FindTap(g, f, coil.GoalVoltageRatio, 0.2)
	if err != nil || len(choices) == 0 {
		t.Fatalf("FindTap: %v", err)
	}
	s, err := coil.Tap(g, choices[0].Sections.TapTurns, f)
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`tap (\S+) turns? from the cold end voltage at the tap ([\d.]+) ×`).FindStringSubmatch(text)
	if m == nil {
		t.Fatalf("page 2 does not state the tap and its ratio:\n%s", text)
	}
	if m[1] != quantity.FormatTurnsWord(s.TapTurns) && m[1]+" turn" != quantity.FormatTurnsWord(s.TapTurns) && m[1]+" turns" != quantity.FormatTurnsWord(s.TapTurns) {
		t.Errorf("tap at %q, want %s", m[1], quantity.FormatTurnsWord(s.TapTurns))
	}
	if r, half := printed(t, m[2]); math.Abs(r-s.Ratio) > half+1e-9 {
		t.Errorf("tap ratio printed %s, coil.Tap gives %.4g", m[2], s.Ratio)
	}
}
