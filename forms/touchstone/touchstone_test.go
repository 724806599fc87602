package touchstone

import (
	"bytes"
	"strings"
	"testing"
)

func TestWriteOnePort(t *testing.T) {
	var b bytes.Buffer
	d := Data{Ports: 1, Param: S, Z0: 50, Points: []Point{
		{Frequency: 1e6, M: [2][2]complex128{{complex(0.5, -0.25)}}},
		{Frequency: 2e6, M: [2][2]complex128{{complex(-1, 0)}}},
	}}
	if err := Write(&b, d, []string{"made by a test"}); err != nil {
		t.Fatal(err)
	}
	want := "! made by a test\n# Hz S RI R 50\n1000000 0.5 -0.25\n2000000 -1 0\n"
	if b.String() != want {
		t.Errorf("got\n%s\nwant\n%s", b.String(), want)
	}
}

// Version 1.1 orders two-port data N11 N21 N12 N22 (the specification's
// one exception to row order).
func TestWriteTwoPortOrder(t *testing.T) {
	var b bytes.Buffer
	d := Data{Ports: 2, Param: S, Z0: 75, Points: []Point{
		{Frequency: 1e9, M: [2][2]complex128{{1, 3}, {2, 4}}},
	}}
	if err := Write(&b, d, nil); err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(strings.TrimSpace(b.String()), "\n")
	if lines[0] != "# Hz S RI R 75" || lines[1] != "1000000000 1 0 2 0 3 0 4 0" {
		t.Errorf("got %q", lines)
	}
}

func TestWriteRefuses(t *testing.T) {
	cases := []struct {
		name string
		d    Data
	}{
		{"three ports", Data{Ports: 3, Param: S, Z0: 50}},
		{"bad param", Data{Ports: 1, Param: 'H', Z0: 50}},
		{"zero z0", Data{Ports: 1, Param: S}},
		{"descending", Data{Ports: 1, Param: S, Z0: 50, Points: []Point{{Frequency: 2}, {Frequency: 1}}}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			if err := Write(&bytes.Buffer{}, c.d, nil); err == nil {
				t.Error("accepted")
			}
		})
	}
}
