package forms

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestLoadGangTable(t *testing.T) {
	t.Parallel()
	f, err := os.Open(filepath.Join("..", "testdata", "span", "gang-measured.txt"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	tab, err := LoadGangTable(f, "gang-measured.txt")
	if err != nil {
		t.Fatal(err)
	}
	if !tab.HasB || len(tab.Points) != 11 || tab.Points[0].A != 16e-12 || tab.Points[10].B != 350e-12 || tab.Points[10].Setting != 1 {
		t.Errorf("table %+v", tab)
	}
	one, err := LoadGangTable(strings.NewReader("0, 10pF\n50%, 100pF\n100, 300pF\n"), "one")
	if err != nil || one.HasB || one.Points[1].B != one.Points[1].A || one.Points[1].Setting != 0.5 {
		t.Errorf("one column: %+v %v", one, err)
	}
	for _, tc := range []struct {
		name, text string
		line       int
		want       string
	}{
		{"not from 0", "10% 20pF\n100% 300pF\n", 1, "0 %"},
		{"not to 100", "0 10pF\n90% 300pF\n", 2, "100 %"},
		{"falling", "0 10pF\n50 200pF\n100 150pF\n", 3, "falls"},
		{"settings back", "0 10pF\n50 100pF\n40 150pF\n100 300pF\n", 3, "rise"},
		{"columns change", "0 10pF 11pF\n100 300pF\n", 2, "section B"},
		{"no unit", "0 10\n100 300pF\n", 1, "section A"},
		{"too many", "0 1pF 2pF 3pF\n", 1, "fields"},
		{"one row", "0 10pF\n", 1, "two rows"},
		{"over 100", "0 10pF\n120% 50pF\n", 2, "outside"},
		{"fractions", "0 10pF\n0.5 100pF\n1 300pF\n", 3, "a bare 1 means 1 %"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			t.Parallel()
			_, err := LoadGangTable(strings.NewReader(tc.text), "t.txt")
			var pe *ParseError
			if !errors.As(err, &pe) || pe.Line != tc.line || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("err = %v, want ParseError at line %d mentioning %q", err, tc.line, tc.want)
			}
		})
	}
}

func FuzzLoadGangTable(f *testing.F) {
	f.Add("0 10pF\n100 300pF\n")
	f.Add("0% 16pF 15pF\n50% 100pF 90pF\n100% 361pF 350pF\n")
	f.Fuzz(func(t *testing.T, s string) {
		tab, err := LoadGangTable(strings.NewReader(s), "fuzz")
		if err != nil {
			return
		}
		for i, p := range tab.Points {
			if p.A < 0 || p.B < 0 || (i > 0 && (p.Setting <= tab.Points[i-1].Setting || p.A < tab.Points[i-1].A)) {
				t.Fatalf("accepted %+v from %q", tab, s)
			}
		}
	})
}
