package forms

import (
	"errors"
	"math"
	"os"
	"strings"
	"testing"
	"time"
)

const jobOK = `# a small job
title = "Bench test"
paper = "letter"
units = "in"
date = 2026-03-14

[[coil]]
name = "L1"
quantity = 3
mandrel = "6mm drill"
wire = "1mm"
turns = 5.25
length = "8mm"
leads = "5mm"
freq = "137.5MHz"
tap = 1.5

[[coil]]
name = "L2"
cap = "22pF"
freq = "137.5MHz"
leads = "5mm"
tolerance = "2%"
max-length = "15mm"

[[coil]]
name = "front end"
former = "pvc 25mm"
wire = "0.5mm"
insulation = "grade1"
turns = 28
leads = "30mm"
tap = 8
gang = "12-365pF"
bands = ["80m=3.5-3.8MHz", "5.9MHz-6.2MHz"]
`

func TestLoadJob(t *testing.T) {
	t.Parallel()
	const implTol = 1e-12 // parsing only: exact up to float rounding
	job, err := LoadJob(strings.NewReader(jobOK), "ok.toml")
	if err != nil {
		t.Fatal(err)
	}
	if job.Title != "Bench test" || job.Paper != "Letter" || job.Units != "in" {
		t.Errorf("header: %+v", job)
	}
	if want := time.Date(2026, 3, 14, 0, 0, 0, 0, time.UTC); !job.Date.Equal(want) {
		t.Errorf("date %v, want %v", job.Date, want)
	}
	if len(job.Coils) != 3 {
		t.Fatalf("%d coils", len(job.Coils))
	}
	l1 := job.Coils[0]
	if l1.Quantity != 3 || *l1.Winding.Turns != 5.25 || l1.Target != nil {
		t.Errorf("L1: %+v", l1)
	}
	if math.Abs(float64(*l1.Winding.Length)-8e-3) > implTol*8e-3 || l1.KeyLine("length") != 13 {
		t.Errorf("L1 length %v at line %d", *l1.Winding.Length, l1.KeyLine("length"))
	}
	if l1.Tap == nil || *l1.Tap.Turns != 1.5 {
		t.Errorf("L1 tap %+v", l1.Tap)
	}
	l2 := job.Coils[1]
	if l2.Target == nil || l2.Target.Cap == nil || math.Abs(float64(*l2.Target.Cap)-22e-12) > implTol*22e-12 ||
		*l2.Target.Tolerance != 0.02 || l2.Quantity != 1 {
		t.Errorf("L2 target %+v", l2.Target)
	}
	fe := job.Coils[2]
	if fe.Span == nil || fe.Span.GangA != fe.Span.GangB || len(fe.Span.Bands) != 2 || fe.Span.Law != "slc" {
		t.Fatalf("span %+v", fe.Span)
	}
	if math.Abs(float64(fe.Span.GangA.Min)-12e-12) > implTol*12e-12 || math.Abs(float64(fe.Span.Bands[1].High)-6.2e6) > implTol*6.2e6 || fe.Span.Bands[0].Name != "80m" {
		t.Errorf("span values %+v", fe.Span)
	}
	c, err := job.Coil("FRONT  end")
	if err != nil || c.Name != "front end" {
		t.Errorf("Coil lookup: %v %v", c, err)
	}
	if _, err := job.Coil("L3"); !errors.Is(err, ErrNotFound) || !strings.Contains(err.Error(), "L1") {
		t.Errorf("missing coil: %v", err)
	}
}

func TestLoadJobErrors(t *testing.T) {
	t.Parallel()
	// head is line 1; coil is lines 2-7 after it.
	const head = "title = \"t\"\n"
	coil := "[[coil]]\nname = \"L1\"\nmandrel = \"6mm drill\"\nwire = \"1mm\"\nturns = 5\nleads = \"5mm\"\n"
	cases := []struct {
		name string
		in   string
		line int
		err  string
	}{
		{"bad toml", head + "[[coil]]\nname = L1\n", 3, "not valid TOML"},
		{"unknown top key", head + "papr = \"A4\"\n" + coil, 2, `unknown key "papr"; did you mean paper?`},
		{"unknown coil key", head + coil + "colour = \"red\"\n", 8, `coil "L1": unknown key "colour"`},
		{"snake case key", head + coil + "max_length = \"9mm\"\n", 8, "did you mean max-length?"},
		{"missing title", coil, 1, "add title ="},
		{"no coils", head, 1, "no coils"},
		{"single brackets", head + "[coil]\nname = \"a\"\n", 2, "double brackets"},
		{"bad paper", "paper = \"A3\"\n" + head + coil, 1, `"A3" is not one of A4, Letter`},
		{"length unit missing", head + coil + "length = \"8\"\n", 8, `coil "L1": length: length "8": add a unit`},
		{"pitch and length", head + coil + "pitch = \"2mm\"\nlength = \"9mm\"\n", 9, "give pitch or length, not both"},
		{"mandrel and former", head + coil + "former = \"pvc 20mm\"\n", 8, "give mandrel or former, not both"},
		{"leads missing", head + "[[coil]]\nname = \"L1\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = 5\n", 2, "add leads ="},
		{"wire missing", head + "[[coil]]\nname = \"L1\"\nmandrel = \"6mm\"\nturns = 5\nleads = \"5mm\"\n", 2, "add wire ="},
		{"nothing to build", head + "[[coil]]\nname = \"L1\"\nleads = \"5mm\"\n", 2, "say what to build"},
		{"turns and target", head + coil + "inductance = \"48nH\"\n", 8, "either a fixed winding"},
		{"cap without freq", head + "[[coil]]\nname = \"L1\"\ncap = \"22pF\"\nleads = \"5mm\"\n", 4, "needs the frequency"},
		{"design key on fixed coil", head + coil + "max-length = \"9mm\"\n", 8, "design-search key"},
		{"turns as text", head + "[[coil]]\nname = \"L1\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = \"five\"\nleads = \"5mm\"\n", 6, `"five" is not a number`},
		{"quantity fraction", head + coil + "quantity = 1.5\n", 8, "not a whole number"},
		{"duplicate name", head + coil + coil, 9, "already used on line 3"},
		{"tap outside", head + coil + "tap = 6\n", 8, "not inside the 5-turn winding"},
		{"tap not quarter", head + coil + "tap = 1.3\n", 8, "quarter turns"},
		{"tap ratio range", head + coil + "tap-ratio = 1.5\n", 8, "outside 0 … 1"},
		{"gang without tap", head + coil + "gang = \"12-365pF\"\n", 8, "add tap ="},
		{"gang reversed", head + coil + "tap = 2\ngang = \"365-12pF\"\n", 9, "minimum comes first"},
		{"band not a range", head + coil + "tap = 2\ngang = \"12-365pF\"\nbands = [\"3.5MHz\"]\n", 10, "no dash"},
		{"choose-tap and tap", head + coil + "tap = 2\ngang = \"12-365pF\"\nchoose-tap = true\n", 10, "picks the tap itself"},
		{"choose-tap without bands", head + coil + "gang = \"12-365pF\"\nchoose-tap = true\n", 9, "needs the bands"},
		{"transmit not bool", head + coil + "transmit = \"yes\"\n", 8, "transmit = true"},
		{"transmit a number", head + coil + "transmit = 1\n", 8, "is a number; write transmit = true or false"},
		{"choose-tap as text", head + coil + "gang = \"12-365pF\"\nchoose-tap = \"yes\"\nbands = [\"3.5-3.8MHz\"]\n", 9, `choose-tap: "yes" is text`},
		{"choose-tap with a bad band", head + coil + "gang = \"12-365pF\"\nchoose-tap = true\nbands = [\"80m=3.8-3.5MHz\"]\n", 10, "bands[1]"},
		{"bands not a list", head + coil + "tap = 2\ngang = \"12-365pF\"\nbands = \"3.5-3.8MHz\"\n", 10, "is a string; it must be a list of \"name=F1-F2\" strings"},
		{"wrong dimension", head + coil + "freq = \"22pF\"\n", 8, "capacitance"},
		{"bad date", head + "date = \"14/3/2026\"\n" + coil, 2, "2026-03-14"},
		{"use mine without stock", head + "use = \"mine\"\n" + coil, 2, "needs a stock file"},
		{"tank-cap not a capacitance", head + coil + "tank-cap = \"180nH\"\n", 8, "tank-cap"},
		{"tank-cap zero", head + coil + "tank-cap = \"0pF\"\n", 8, "tank-cap: must be positive"},
		{"tank-cap on a target", head + "[[coil]]\nname = \"L1\"\ncap = \"22pF\"\nfreq = \"7MHz\"\nleads = \"5mm\"\ntank-cap = \"22pF\"\n", 7, "is for a fixed winding"},
		{"band without trimmer", head + "[[coil]]\nname = \"L1\"\nband = \"144-146MHz\"\ncap = \"15pF\"\nleads = \"5mm\"\n", 4, "needs a trimmer"},
		{"trimmer without band", head + "[[coil]]\nname = \"L1\"\ncap = \"15pF\"\nfreq = \"145MHz\"\ntrimmer = \"2-10pF\"\nleads = \"5mm\"\n", 6, "tunes a band"},
		{"band with freq", head + "[[coil]]\nname = \"L1\"\nband = \"144-146MHz\"\ntrimmer = \"2-10pF\"\nfreq = \"145MHz\"\nleads = \"5mm\"\n", 6, "remove freq"},
		{"band on a fixed winding", head + coil + "band = \"144-146MHz\"\ntrimmer = \"2-10pF\"\n", 8, "fixed winding"},
		{"band reversed", head + "[[coil]]\nname = \"L1\"\nband = \"146-144MHz\"\ntrimmer = \"2-10pF\"\nleads = \"5mm\"\n", 4, "band"},
		{"trimmer one value", head + "[[coil]]\nname = \"L1\"\nband = \"144-146MHz\"\ntrimmer = \"10pF\"\nleads = \"5mm\"\n", 5, "MIN below MAX"},
		{"first error in file wins", head + coil + "tap = 9\n[[coil]]\nname = \"L2\"\nturns = 2\n", 8, "tap"},
	}
	for _, tc := range cases {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			_, err := LoadJob(strings.NewReader(tc.in), "job.toml")
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v (%T) is not a *ParseError", err, err)
			}
			if pe.Line != tc.line || pe.Kind != "job" {
				t.Errorf("line %d kind %q, want %d job: %v", pe.Line, pe.Kind, tc.line, err)
			}
			if !strings.Contains(err.Error(), tc.err) {
				t.Errorf("error %q lacks %q", err, tc.err)
			}
			if !strings.HasPrefix(err.Error(), `job "job.toml"`) {
				t.Errorf("error %q does not name the file", err)
			}
			if strings.Count(err.Error(), "\n") != 0 {
				t.Errorf("not one line: %q", err)
			}
		})
	}
}

// A fixed winding's tank-cap is read in farads, with its cap-tempco kept
// as written.
func TestLoadJobTankCap(t *testing.T) {
	t.Parallel()
	in := "title = \"t\"\n[[coil]]\nname = \"V1\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = 5\nleads = \"5mm\"\ntank-cap = \"180pF\"\ncap-tempco = \"N750\"\n"
	job, err := LoadJob(strings.NewReader(in), "job.toml")
	if err != nil {
		t.Fatal(err)
	}
	c := job.Coils[0]
	if c.TankCap == nil || math.Abs(float64(*c.TankCap)-180e-12) > 1e-24 || c.CapTempco != "N750" || c.Target != nil {
		t.Errorf("tank-cap %v, cap-tempco %q, target %v: want 180 pF, N750, a fixed winding", c.TankCap, c.CapTempco, c.Target)
	}
	if c.KeyLine("tank-cap") != 8 {
		t.Errorf("tank-cap on line %d, want 8", c.KeyLine("tank-cap"))
	}
}

// A band target reads its band and trimmer; cap stays the fixed capacitor
// and no frequency is needed.
func TestLoadJobBand(t *testing.T) {
	t.Parallel()
	in := "title = \"t\"\n[[coil]]\nname = \"T2\"\nband = \"144-146MHz\"\ntrimmer = \"2-10pF\"\ncap = \"15pF\"\nstray = \"2pF\"\nleads = \"5mm\"\n"
	job, err := LoadJob(strings.NewReader(in), "job.toml")
	if err != nil {
		t.Fatal(err)
	}
	tg := job.Coils[0].Target
	if tg == nil || tg.Band == nil || tg.Trimmer == nil || tg.Cap == nil {
		t.Fatalf("target %+v: want a band, a trimmer and a cap", tg)
	}
	if math.Abs(float64(tg.Band.Low)-144e6) > 1 || math.Abs(float64(tg.Band.High)-146e6) > 1 ||
		math.Abs(float64(tg.Trimmer[0])-2e-12) > 1e-24 || math.Abs(float64(tg.Trimmer[1])-10e-12) > 1e-24 {
		t.Errorf("band %v … %v, trimmer %v: want 144 … 146 MHz, 2 … 10 pF", tg.Band.Low, tg.Band.High, *tg.Trimmer)
	}
}

// The demo job in testdata loads.
func TestLoadDemoJob(t *testing.T) {
	t.Parallel()
	f, err := os.Open("../testdata/club-night.toml")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	job, err := LoadJob(f, "club-night.toml")
	if err != nil {
		t.Fatal(err)
	}
	if len(job.Coils) < 3 {
		t.Errorf("demo has %d coils", len(job.Coils))
	}
}

func FuzzLoadJob(f *testing.F) {
	f.Add(jobOK)
	f.Add("title = \"x\"\n[[coil]]\nname = \"a\"\nturns = 1e308\nleads = \"-1mm\"\n")
	f.Add("title = \"x\"\ncoil = [{name = \"a\", gang = \"1-2-3pF\", tap = 0.25, choose-tap = true}]\n")
	f.Fuzz(func(t *testing.T, in string) {
		job, err := LoadJob(strings.NewReader(in), "fuzz.toml")
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v is not a *ParseError", err)
			}
			return
		}
		if job.Title == "" || len(job.Coils) == 0 {
			t.Fatalf("accepted a job without title or coils: %+v", job)
		}
		for _, c := range job.Coils {
			if c.Name == "" || c.Quantity < 1 || c.Winding.Leads == nil {
				t.Fatalf("accepted coil %+v", c)
			}
			if (c.Target == nil) == (c.Winding.Turns == nil) {
				t.Fatalf("coil %q is neither fixed nor a target", c.Name)
			}
		}
	})
}
