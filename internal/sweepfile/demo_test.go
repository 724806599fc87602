package sweepfile

import (
	"bytes"
	"flag"
	"math"
	"math/cmplx"
	"math/rand/v2"
	"os"
	"path/filepath"
	"testing"

	"gonum.org/v1/gonum/unit"
	"turnwise/coil"
	"turnwise/forms/touchstone"
	"turnwise/internal/spec"
)

var update = flag.Bool("update", false, "rewrite the demo sweep in testdata/sweep")

// The demo sweep (invented data): coil "L1 filter input" of the demo job
// testdata/club-night.toml as it came off the mandrel with 6 % springback
// where the job assumes none, measured by reflection at 50 ohm on an
// invented jig — an edge-mount socket on a scrap of board, 1.5 nH and
// 0.03 ohm in series, 0.35 pF across — from 2 MHz to 1 GHz in 500 points
// with Gaussian noise of 1e-3 on each part of S11 (seeded). The jig's open
// and short are swept the same way. Regenerate with
// go test ./internal/sweepfile -run TestDemoSweep -update.
const (
	demoSpringback = 0.06
	jigL           = 1.5e-9
	jigR           = 0.03
	jigC           = 0.35e-12
	demoNoise      = 1e-3
)

func demoGeometry(t *testing.T) coil.Geometry {
	t.Helper()
	job, err := spec.LoadJob(filepath.Join("..", "..", "testdata", "club-night.toml"))
	if err != nil {
		t.Fatal(err)
	}
	c, err := job.Coil("L1 filter input")
	if err != nil {
		t.Fatal(err)
	}
	cat, err := spec.JobCatalog(job, "", "", false)
	if err != nil {
		t.Fatal(err)
	}
	s, err := spec.ResolveJobCoil(job, c, cat)
	if err != nil {
		t.Fatal(err)
	}
	g := s.Geometry
	g.Springback = demoSpringback
	return g
}

func TestDemoSweep(t *testing.T) {
	g := demoGeometry(t)
	coilZ := func(f float64) complex128 {
		m, err := coil.ModelAt(g, unitF(f))
		if err != nil {
			t.Fatal(err)
		}
		w := 2 * math.Pi * f
		zl := complex(float64(m.R), w*float64(m.L))
		return zl/(1+zl*complex(0, w*float64(m.SelfCapacitance))) + complex(float64(m.RLeads), w*float64(m.LLeads))
	}
	jig := func(dut func(float64) complex128) func(float64) complex128 {
		return func(f float64) complex128 {
			w := 2 * math.Pi * f
			y := complex(0, w*jigC)
			if dut != nil {
				y += 1 / dut(f)
			}
			return complex(jigR, w*jigL) + 1/y
		}
	}
	files := []struct {
		name string
		z    func(float64) complex128
		seed uint64
		note string
	}{
		{"l1-as-wound.s1p", jig(coilZ), 1, "coil L1 filter input of testdata/club-night.toml as wound (6 % springback), on the jig"},
		{"jig-open.s1p", jig(nil), 2, "the jig open"},
		{"jig-short.s1p", func(f float64) complex128 { return complex(jigR, 2*math.Pi*f*jigL) }, 3, "the jig with a short where the coil goes"},
	}
	for _, fl := range files {
		rng := rand.New(rand.NewPCG(fl.seed, 14))
		d := touchstone.Data{Ports: 1, Param: touchstone.S, Z0: 50}
		for i := range 500 {
			f := 2e6 + float64(i)*(1e9-2e6)/499
			z := fl.z(f)
			s := (z - 50) / (z + 50)
			s += complex(demoNoise*rng.NormFloat64(), demoNoise*rng.NormFloat64())
			d.Points = append(d.Points, touchstone.Point{Frequency: math.Round(f), M: [2][2]complex128{{s}}})
		}
		var b bytes.Buffer
		if err := touchstone.Write(&b, d, []string{"DEMO sweep, invented data for turnwise's README and tests: " + fl.note + ".",
			"Synthesised by internal/sweepfile/demo_test.go (jig: 1.5 nH and 0.03 ohm in series, 0.35 pF across; noise 1e-3 on S11)."}); err != nil {
			t.Fatal(err)
		}
		path := filepath.Join("..", "..", "testdata", "sweep", fl.name)
		if *update {
			if err := os.WriteFile(path, b.Bytes(), 0o644); err != nil {
				t.Fatal(err)
			}
			continue
		}
		got, err := os.ReadFile(path)
		if err != nil {
			t.Fatalf("%v (regenerate with -update)", err)
		}
		gd, err := touchstone.Read(bytes.NewReader(got), 1)
		if err != nil {
			t.Fatal(err)
		}
		for i, p := range gd.Points {
			if cmplx.Abs(p.M[0][0]-d.Points[i].M[0][0]) > 1e-9 {
				t.Fatalf("%s point %d differs from the generator: regenerate with -update", fl.name, i)
			}
		}
	}
}

func unitF(f float64) unit.Frequency { return unit.Frequency(f) }
