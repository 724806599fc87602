package touchstone

import (
	"bytes"
	"math"
	"math/cmplx"
	"os"
	"path/filepath"
	"testing"
)

// FuzzRead feeds the reader arbitrary bytes: it must never panic, and what
// it accepts must be a valid sweep that the writer writes and the reader
// reads back to the same values. The seed corpus is every file in
// testdata (the specification-shaped examples) and testdata/fuzz/FuzzRead.
func FuzzRead(f *testing.F) {
	files, _ := filepath.Glob(filepath.Join("testdata", "*.s?p"))
	for _, name := range files {
		b, err := os.ReadFile(name)
		if err != nil {
			f.Fatal(err)
		}
		f.Add(b, PortsFromName(name))
	}
	f.Fuzz(func(t *testing.T, b []byte, ports int) {
		d, err := Read(bytes.NewReader(b), ports)
		if err != nil {
			if _, ok := err.(*ParseError); !ok {
				t.Fatalf("error %v is not a *ParseError", err)
			}
			return
		}
		if d.Ports != 1 && d.Ports != 2 || !(d.Z0 > 0) || len(d.Points) == 0 {
			t.Fatalf("accepted %d ports, Z0 %g, %d points", d.Ports, d.Z0, len(d.Points))
		}
		prev := math.Inf(-1)
		for _, p := range d.Points {
			if !(p.Frequency > prev) || math.IsInf(p.Frequency, 0) {
				t.Fatalf("frequency %g after %g", p.Frequency, prev)
			}
			prev = p.Frequency
			for i := range 2 {
				for j := range 2 {
					if v := p.M[i][j]; cmplx.IsNaN(v) || cmplx.IsInf(v) {
						t.Fatalf("value %v", v)
					}
				}
			}
		}
		var out bytes.Buffer
		if err := Write(&out, d, nil); err != nil {
			return // e.g. a Z value that overflows when normalised
		}
		back, err := Read(&out, d.Ports)
		if err != nil {
			t.Fatalf("re-reading the written file: %v\n%s", err, out.String())
		}
		if len(back.Points) != len(d.Points) || back.Param != d.Param {
			t.Fatalf("round trip changed the data")
		}
	})
}
