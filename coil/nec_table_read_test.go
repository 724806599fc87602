package coil

import (
	"bufio"
	"os"
	"strconv"
	"strings"
	"testing"
)

// necRow is one row of testdata/nec/srf.csv.
type necRow struct {
	C                necCoil
	Segments         int
	Grounded, Free   float64 // Hz
	Grounded2, Free2 float64 // Hz at twice the segments; zero if not run
}

func readNECTable(t testing.TB, path string) []necRow {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var rows []necRow
	sc := bufio.NewScanner(f)
	header := true
	for sc.Scan() {
		line := sc.Text()
		if strings.HasPrefix(line, "#") || line == "" {
			continue
		}
		if header {
			header = false
			continue
		}
		v := strings.Split(line, ",")
		if len(v) != 10 {
			t.Fatalf("%s: %d fields in %q", path, len(v), line)
		}
		num := func(s string) float64 {
			if s == "" {
				return 0
			}
			x, err := strconv.ParseFloat(s, 64)
			if err != nil {
				t.Fatalf("%s: %v", path, err)
			}
			return x
		}
		rows = append(rows, necRow{C: necCoil{Name: v[0], D: num(v[1]), P: num(v[2]), Wd: num(v[3]), N: num(v[4])},
			Segments: int(num(v[5])), Grounded: num(v[6]), Free: num(v[7]), Grounded2: num(v[8]), Free2: num(v[9])})
	}
	if err := sc.Err(); err != nil {
		t.Fatal(err)
	}
	return rows
}

// ref is the reference resonance of a row: the finer segmentation where
// it was run, else the base one.
func (r necRow) ref(grounded bool) float64 {
	if grounded {
		if r.Grounded2 > 0 {
			return r.Grounded2
		}
		return r.Grounded
	}
	if r.Free2 > 0 {
		return r.Free2
	}
	return r.Free
}
