package touchstone

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"math/cmplx"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// implTol is for values that only pass through the reader's arithmetic.
const implTol = 1e-9

func near(a, b complex128, tol float64) bool {
	return cmplx.Abs(a-b) <= tol*math.Max(1, cmplx.Abs(b))
}

func readFile(t *testing.T, name string) Data {
	t.Helper()
	b, err := os.ReadFile(filepath.Join("testdata", name))
	if err != nil {
		t.Fatal(err)
	}
	d, err := Read(bytes.NewReader(b), PortsFromName(name))
	if err != nil {
		t.Fatalf("%s: %v", name, err)
	}
	return d
}

func deg(a float64) float64 { return a * math.Pi / 180 }

// Files shaped after the specifications' own examples.
func TestReadSpecExamples(t *testing.T) {
	t.Run("one-port S MA", func(t *testing.T) {
		d := readFile(t, "spec-1port-s.s1p")
		if d.Ports != 1 || d.Param != S || d.Z0 != 50 || len(d.Points) != 1 {
			t.Fatalf("got %+v", d)
		}
		// 2.000 MHz, 0.894∠−12.136° (the file's line)
		if p := d.Points[0]; math.Abs(p.Frequency-2e6) > 1e-6 || !near(p.M[0][0], cmplx.Rect(0.894, deg(-12.136)), implTol) {
			t.Errorf("got %v", p)
		}
	})
	t.Run("one-port Z normalised to 75 ohm", func(t *testing.T) {
		d := readFile(t, "spec-1port-z.s1p")
		if d.Param != Z || d.Z0 != 75 || len(d.Points) != 5 {
			t.Fatalf("got %+v", d)
		}
		// 300 MHz: 0.707∠−45° times R = 75 ohm (version 1.1 normalises Z)
		if p := d.Points[2]; !near(p.M[0][0], cmplx.Rect(0.707*75, deg(-45)), implTol) {
			t.Errorf("got %v", p.M[0][0])
		}
	})
	t.Run("two-port v1.1 order and noise skipped", func(t *testing.T) {
		d := readFile(t, "spec-2port-s.s2p")
		if d.Ports != 2 || len(d.Points) != 3 {
			t.Fatalf("got %d ports, %d points", d.Ports, len(d.Points))
		}
		// 1 GHz: S21 = 3.2160∠148.8°, S12 = 0.0835∠81.2° (the file's first data line)
		p := d.Points[0]
		if !near(p.M[1][0], cmplx.Rect(3.216, deg(148.8)), implTol) || !near(p.M[0][1], cmplx.Rect(0.0835, deg(81.2)), implTol) {
			t.Errorf("got S21 %v S12 %v", p.M[1][0], p.M[0][1])
		}
	})
	t.Run("two-port v2.0 12_21 equals v1.1", func(t *testing.T) {
		a, b := readFile(t, "spec-2port-s.s2p"), readFile(t, "spec-2port-v2.s2p")
		for k := range a.Points {
			for i := range 2 {
				for j := range 2 {
					if !near(a.Points[k].M[i][j], b.Points[k].M[i][j], implTol) {
						t.Errorf("point %d S%d%d: %v vs %v", k, i+1, j+1, a.Points[k].M[i][j], b.Points[k].M[i][j])
					}
				}
			}
		}
	})
	t.Run("one-port v2.0 Y with [Reference] on its own line", func(t *testing.T) {
		d := readFile(t, "spec-1port-v2-y.s1p")
		if d.Param != Y || d.Z0 != 75 || len(d.Points) != 2 {
			t.Fatalf("got %+v", d)
		}
		if !near(d.Points[0].M[0][0], complex(0.01, -0.002), implTol) { // not normalised in 2.0
			t.Errorf("got %v", d.Points[0].M[0][0])
		}
	})
}

// variant writes the one-port impedances zs at freqs (Hz) in one of the
// format's variants.
func variant(v2 bool, unitName string, param Param, format string, z0 float64, freqs []float64, zs []complex128) string {
	scale := map[string]float64{"Hz": 1, "kHz": 1e3, "MHz": 1e6, "GHz": 1e9}[unitName]
	var b strings.Builder
	if v2 {
		fmt.Fprintf(&b, "[Version] 2.0\n# %s %c %s R %g\n[Number of Ports] 1\n[Number of Frequencies] %d\n[Reference] %g\n[Network Data]\n",
			unitName, param, format, z0, len(freqs), z0)
	} else {
		fmt.Fprintf(&b, "!  variant\n#   %s\t%c  %s R %g  \n", strings.ToLower(unitName), param, strings.ToLower(format), z0)
	}
	for k, f := range freqs {
		var v complex128
		switch param {
		case S:
			v = (zs[k] - complex(z0, 0)) / (zs[k] + complex(z0, 0))
		case Z:
			v = zs[k]
			if !v2 {
				v /= complex(z0, 0)
			}
		case Y:
			v = 1 / zs[k]
			if !v2 {
				v *= complex(z0, 0)
			}
		}
		var a, c float64
		switch format {
		case "RI":
			a, c = real(v), imag(v)
		case "MA":
			a, c = cmplx.Abs(v), cmplx.Phase(v)*180/math.Pi
		case "DB":
			a, c = 20*math.Log10(cmplx.Abs(v)), cmplx.Phase(v)*180/math.Pi
		}
		fmt.Fprintf(&b, "%.17g   %.17g %.17g ! point %d\n", f/scale, a, c, k)
	}
	if v2 {
		b.WriteString("[End]\n")
	}
	return b.String()
}

// Every variant of the same data gives the same impedance.
func TestReadVariantsAgree(t *testing.T) {
	freqs := []float64{10e6, 50e6, 137.5e6, 300e6}
	// a 100 nH coil with 1 pF across it and 0.5 ohm loss: invented data
	zs := make([]complex128, len(freqs))
	for k, f := range freqs {
		w := 2 * math.Pi * f
		zl := complex(0.5, w*100e-9)
		zs[k] = zl / (1 + zl*complex(0, w*1e-12))
	}
	for _, v2 := range []bool{false, true} {
		for _, u := range []string{"Hz", "kHz", "MHz", "GHz"} {
			for _, param := range []Param{S, Y, Z} {
				for _, format := range []string{"RI", "MA", "DB"} {
					for _, z0 := range []float64{50, 75, 12.5} {
						name := fmt.Sprintf("v2=%v/%s/%c/%s/R%g", v2, u, param, format, z0)
						t.Run(name, func(t *testing.T) {
							txt := variant(v2, u, param, format, z0, freqs, zs)
							d, err := Read(strings.NewReader(txt), 1)
							if err != nil {
								t.Fatalf("%v\n%s", err, txt)
							}
							if d.Z0 != z0 {
								t.Errorf("Z0 %g, want %g", d.Z0, z0)
							}
							s, err := d.ToS()
							if err != nil {
								t.Fatal(err)
							}
							for k, p := range s.Points {
								if math.Abs(p.Frequency/freqs[k]-1) > 1e-12 {
									t.Errorf("frequency %g, want %g", p.Frequency, freqs[k])
								}
								g := p.M[0][0]
								z := complex(s.Z0, 0) * (1 + g) / (1 - g)
								if !near(z, zs[k], 1e-9) {
									t.Errorf("at %g Hz: Z %v, want %v", freqs[k], z, zs[k])
								}
							}
						})
					}
				}
			}
		}
	}
}

func TestWriteReadRoundTrip(t *testing.T) {
	for _, param := range []Param{S, Y, Z} {
		for _, ports := range []int{1, 2} {
			t.Run(fmt.Sprintf("%c%d", param, ports), func(t *testing.T) {
				d := Data{Ports: ports, Param: param, Z0: 75}
				for k := range 4 {
					f := float64(k+1) * 1e6
					d.Points = append(d.Points, Point{Frequency: f, M: [2][2]complex128{{complex(f/1e7, 2), complex(3, -1)}, {complex(0.5, 0.25), complex(-4, 1)}}})
					if ports == 1 {
						d.Points[k].M = [2][2]complex128{{complex(f/1e7, 2)}}
					}
				}
				var b bytes.Buffer
				if err := Write(&b, d, []string{"round trip"}); err != nil {
					t.Fatal(err)
				}
				got, err := Read(&b, ports)
				if err != nil {
					t.Fatal(err)
				}
				if got.Ports != ports || got.Param != param || got.Z0 != 75 || len(got.Points) != 4 {
					t.Fatalf("got %+v", got)
				}
				for k := range d.Points {
					for i := range 2 {
						for j := range 2 {
							if !near(got.Points[k].M[i][j], d.Points[k].M[i][j], 1e-11) {
								t.Errorf("point %d [%d][%d]: %v, want %v", k, i, j, got.Points[k].M[i][j], d.Points[k].M[i][j])
							}
						}
					}
				}
			})
		}
	}
}

func TestReadErrors(t *testing.T) {
	cases := []struct {
		name  string
		ports int
		text  string
		line  int
		cause error
		says  string
	}{
		{"missing option line", 1, "! sweep\n1 0 0\n", 2, ErrOptionLine, "option line"},
		{"missing option line, no data", 1, "! only a comment\n", 0, ErrOptionLine, "option line"},
		{"descending frequency", 1, "# MHz S RI R 50\n1 0 0\n3 0 0\n2 0 0\n", 4, ErrFrequency, "does not ascend"},
		{"repeated frequency", 1, "# MHz S RI R 50\n1 0 0\n1 0 0\n", 3, ErrFrequency, "ascend"},
		{"column count", 1, "# MHz S RI R 50\n1 0 0\n2 0 0 0\n", 3, ErrColumns, "4 columns"},
		{"extension contradicts data", 1, "# MHz S RI R 50\n1 0 0 0 0 0 0 0 0\n", 2, ErrPorts, ".s2p"},
		{"s2p with one-port data", 2, "# MHz S RI R 50\n1 0 0\n", 2, ErrPorts, ".s1p"},
		{"v2 ports contradict extension", 1, "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 2\n", 3, ErrPorts, "contradicts"},
		{"bad number", 1, "# MHz S RI R 50\n1 0 x\n", 2, ErrNumber, "column 3"},
		{"infinite number", 1, "# MHz S RI R 50\n1 0 1e999\n", 2, ErrNumber, "column 3"},
		{"unknown option", 1, "# MHz S RI Q 50\n", 1, ErrOptionLine, "\"Q\""},
		{"H parameters", 2, "# MHz H RI R 50\n", 1, ErrOptionLine, "S, Y and Z"},
		{"bad reference", 1, "# MHz S RI R -5\n", 1, ErrOptionLine, "reference"},
		{"keyword in v1.1", 1, "# MHz S RI R 50\n[Number of Ports] 1\n", 2, ErrKeyword, "Version"},
		{"v2 without End", 1, "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 0 0\n", 0, ErrKeyword, "[End]"},
		{"v2 two-port without order", 2, "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 2\n[Network Data]\n", 4, ErrKeyword, "Two-Port Data Order"},
		{"v2 reference count", 1, "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Reference] 50 50\n", 4, ErrKeyword, "more values"},
		{"v2 frequency count", 1, "[Version] 2.0\n# MHz S RI R 50\n[Number of Ports] 1\n[Number of Frequencies] 2\n[Network Data]\n1 0 0\n[End]\n", 0, ErrColumns, "Number of Frequencies"},
		{"v2 unknown keyword", 1, "[Version] 2.0\n[Colour] blue\n", 2, ErrKeyword, "Colour"},
		{"v2 version not first", 1, "# MHz S RI R 50\n[Version] 2.0\n", 2, ErrKeyword, "first"},
		{"three-port data by columns", 0, "# MHz S RI R 50\n1 0 0 0 0 0\n", 2, ErrColumns, "6 columns"},
		{"no data", 1, "# MHz S RI R 50\n", 0, ErrEmpty, "no data"},
		{"negative frequency", 1, "# MHz S RI R 50\n-1 0 0\n", 2, ErrFrequency, "positive"},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			_, err := Read(strings.NewReader(c.text), c.ports)
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("got %v, want a *ParseError", err)
			}
			if pe.Line != c.line || !errors.Is(err, c.cause) || !strings.Contains(err.Error(), c.says) {
				t.Errorf("got line %d %q (cause %v), want line %d, cause %v, saying %q", pe.Line, err, pe.Err, c.line, c.cause, c.says)
			}
			if c.line > 0 && !strings.Contains(err.Error(), fmt.Sprintf("line %d:", c.line)) {
				t.Errorf("%q does not name line %d", err, c.line)
			}
		})
	}
}

func TestPortsFromName(t *testing.T) {
	for name, want := range map[string]int{"a.s1p": 1, "b/C.S2P": 2, "c.s4p": 4, "d.ts": 0, "e": 0, "f.sxp": 0} {
		if got := PortsFromName(name); got != want {
			t.Errorf("%s: %d, want %d", name, got, want)
		}
	}
	if _, err := Read(strings.NewReader("# MHz S RI R 50\n"), 4); !errors.Is(err, ErrPorts) {
		t.Errorf("four ports: %v", err)
	}
}

// A two-port series element: S from Z and from Y agree with the known
// closed form S21 = 2·Z0/(2·Z0 + Z) (common practice).
func TestToSTwoPort(t *testing.T) {
	z, z0 := complex(3, 40), 50.0
	y := 1 / z
	d := Data{Ports: 2, Param: Y, Z0: z0, Points: []Point{{Frequency: 1e6, M: [2][2]complex128{{y, -y}, {-y, y}}}}}
	s, err := d.ToS()
	if err != nil {
		t.Fatal(err)
	}
	want21 := complex(2*z0, 0) / (complex(2*z0, 0) + z)
	want11 := z / (z + complex(2*z0, 0))
	if got := s.Points[0].M; !near(got[1][0], want21, implTol) || !near(got[0][0], want11, implTol) {
		t.Errorf("S %v, want S21 %v S11 %v", got, want21, want11)
	}
	// shunt element: Z matrix all z; S21 = 2z/(2z+Z0)
	d = Data{Ports: 2, Param: Z, Z0: z0, Points: []Point{{Frequency: 1e6, M: [2][2]complex128{{z, z}, {z, z}}}}}
	if s, err = d.ToS(); err != nil {
		t.Fatal(err)
	}
	if got, want := s.Points[0].M[1][0], 2*z/(2*z+complex(z0, 0)); !near(got, want, implTol) {
		t.Errorf("shunt S21 %v, want %v", got, want)
	}
}
