package forms

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"
)

// nestedJob is a job whose one coil key holds n nested inline tables, the
// shape that made the TOML decoder take 48 s and 4 GB at 40 KB.
func nestedJob(n int) string {
	return "title = \"t\"\n[[coil]]\nname = \"L1\"\nx = " + strings.Repeat("{a=", n) + "1" + strings.Repeat("}", n) + "\n"
}

func nestedArrays(n int) string {
	return "title = \"t\"\nbands = " + strings.Repeat("[", n) + strings.Repeat("]", n) + "\n"
}

func TestCheckShape(t *testing.T) {
	t.Parallel()
	tests := []struct {
		name    string
		text    string
		line    int    // 0: accepted
		message string // part of the error
	}{
		{"flat job", "title = \"t\"\n[[coil]]\nname = \"L1\"\nbands = [\"80m=3.5-3.8MHz\", \"7.0-7.2MHz\"]\n", 0, ""},
		{"nesting at the limit", "a = " + strings.Repeat("[", MaxNesting) + strings.Repeat("]", MaxNesting), 0, ""},
		{"one past the limit", "a = " + strings.Repeat("[", MaxNesting+1) + strings.Repeat("]", MaxNesting+1), 1, "nested more than 16 deep"},
		{"nested inline tables", nestedJob(2000), 4, "nested more than 16 deep"},
		{"nested arrays on line 2", nestedArrays(5000), 2, "nested more than 16 deep"},
		{"brackets in strings do not count", "a = \"" + strings.Repeat("[{", 100) + "\"\nb = '" + strings.Repeat("[", 100) + "'\n", 0, ""},
		{"escaped quote in a string", "a = \"\\\"" + strings.Repeat("[", 100) + "\"\n", 0, ""},
		{"brackets in comments do not count", "# " + strings.Repeat("[", 100) + "\na = 1\n", 0, ""},
		{"multi-line strings", "a = \"\"\"\n" + strings.Repeat("[", 100) + "\n\"\"\"\nb = '''\n" + strings.Repeat("{", 100) + "'''\nc = " + strings.Repeat("[", 17), 6, "nested"},
		{"too large", "# " + strings.Repeat("x", MaxFileBytes), 0, "1 MiB"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			err := checkShape(tc.text, "job", "j.toml")
			if tc.message == "" {
				if err != nil {
					t.Errorf("refused: %v", err)
				}
				return
			}
			var pe *ParseError
			if !errors.As(err, &pe) || pe.Line != tc.line || !strings.Contains(err.Error(), tc.message) || !strings.Contains(err.Error(), "j.toml") {
				t.Errorf("err = %v, want line %d and %q", err, tc.line, tc.message)
			}
		})
	}
}

// Hostile files fail fast, with the line, through the real loaders; the
// bound is generous (the decoder took 48 s on the first case before).
func TestHostileFilesFailFast(t *testing.T) {
	t.Parallel()
	stockNested := "[[wire]]\nname = \"w\"\nbare = " + strings.Repeat("{a=", 8000) + "1" + strings.Repeat("}", 8000) + "\n"
	big := strings.Repeat("# padding line for a file that is far too large\n", MaxFileBytes/48+10)
	tests := []struct {
		name string
		load func() error
		want string
	}{
		{"job: 40 KB of nested inline tables", func() error { _, err := LoadJob(strings.NewReader(nestedJob(13000)), "j.toml"); return err }, `"j.toml": line 4`},
		{"job: 200 KB of nested arrays", func() error { _, err := LoadJob(strings.NewReader(nestedArrays(100000)), "j.toml"); return err }, `"j.toml": line 2`},
		{"stock: nested inline tables", func() error { _, err := LoadStock(strings.NewReader(stockNested), "s.toml"); return err }, `"s.toml": line 3`},
		{"job: over 1 MiB", func() error { _, err := LoadJob(strings.NewReader(big), "j.toml"); return err }, "1 MiB"},
		{"stock: over 1 MiB", func() error { _, err := LoadStock(strings.NewReader(big), "s.toml"); return err }, "1 MiB"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			start := time.Now()
			err := tc.load()
			if d := time.Since(start); d > time.Second {
				t.Errorf("took %v, want well under 1 s", d)
			}
			if err == nil || !strings.Contains(err.Error(), tc.want) {
				t.Errorf("err = %v, want %q", err, tc.want)
			}
		})
	}
}

// fuzzBound is the time any one input may take to load or fail.
const fuzzBound = time.Second

// fuzzSeeds adds the shapes that hurt: deep nesting of each kind, long
// strings, many entries, and the real demo files.
func fuzzSeeds(f *testing.F, files ...string) {
	for _, p := range files {
		if b, err := os.ReadFile(p); err == nil {
			f.Add(string(b))
		}
	}
	f.Add(nestedJob(3000))
	f.Add(nestedArrays(3000))
	f.Add("a = [" + strings.Repeat("{b=[", 500) + strings.Repeat("]}", 500) + "]")
	f.Add("title = \"" + strings.Repeat("x", 200_000) + "\"\n")
	var many strings.Builder
	for i := range 2000 {
		fmt.Fprintf(&many, "[[wire]]\nname = \"w%d\"\nbare = \"0.5mm\"\ninsulation = \"none\"\n", i)
	}
	f.Add(many.String())
}

// FuzzJobHostile feeds LoadJob nested and oversized inputs (seeds here and
// in testdata/fuzz/FuzzJobHostile): each must load or fail, with a
// *ParseError, within fuzzBound.
func FuzzJobHostile(f *testing.F) {
	fuzzSeeds(f, filepath.Join("..", "testdata", "club-night.toml"))
	f.Fuzz(func(t *testing.T, b string) {
		start := time.Now()
		job, err := LoadJob(strings.NewReader(b), "fuzz.toml")
		if d := time.Since(start); d > fuzzBound {
			t.Fatalf("LoadJob took %v on %d bytes", d, len(b))
		}
		if err == nil && job == nil {
			t.Fatal("no job and no error")
		}
		var pe *ParseError
		if err != nil && !errors.As(err, &pe) {
			t.Fatalf("error is not a *ParseError: %v", err)
		}
	})
}

// FuzzStockHostile is FuzzJobHostile for LoadStock.
func FuzzStockHostile(f *testing.F) {
	fuzzSeeds(f, filepath.Join("..", "testdata", "stock", "bench.toml"))
	f.Fuzz(func(t *testing.T, b string) {
		start := time.Now()
		cat, err := LoadStock(strings.NewReader(b), "fuzz.toml")
		if d := time.Since(start); d > fuzzBound {
			t.Fatalf("LoadStock took %v on %d bytes", d, len(b))
		}
		if err == nil && cat == nil {
			t.Fatal("no catalog and no error")
		}
		var pe *ParseError
		if err != nil && !errors.As(err, &pe) {
			t.Fatalf("error is not a *ParseError: %v", err)
		}
	})
}
