package main

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"strings"
	"testing"

	"turnwise/coil"
	"turnwise/forms"
	"turnwise/internal/quantity"
	"turnwise/internal/spec"
)

// TestLookupNotFoundWraps follows an unknown wire, mandrel and former
// through every layer that rewraps the lookup error (flag resolution, the
// coil spec, the design search's supports, a job file, the whole command)
// and checks errors.Is still finds forms.ErrNotFound and the exit code is 2.
func TestLookupNotFoundWraps(t *testing.T) {
	// Checks here: error wrapping and exit codes (internal consistency); no reference values.
	t.Setenv("TURNWISE_STOCK", "")
	cat, err := forms.BuiltIn()
	if err != nil {
		t.Fatal(err)
	}
	base := coilOptions{mandrel: "6mm", wire: "1mm", turns: turnsFlag{v: 5, set: true}, leads: lengthFlag{v: 0.005, set: true}}
	tests := []struct {
		name, flag string
		set        func(o *coilOptions)
		direct     func() error
		design     *spec.SearchOptions
		jobKey     string
	}{
		{"wire", "wire", func(o *coilOptions) { o.wire = "unobtainium wire" },
			func() error { _, err := spec.ResolveWire(cat, "unobtainium wire"); return err }, nil, `wire = "unobtainium wire"`},
		{"mandrel", "mandrel", func(o *coilOptions) { o.mandrel = "unobtainium rod" },
			func() error { _, _, err := spec.ResolveMandrel(cat, "unobtainium rod"); return err },
			&spec.SearchOptions{Mandrel: "unobtainium rod"}, `mandrel = "unobtainium rod"`},
		{"former", "former", func(o *coilOptions) { o.mandrel, o.former = "", "unobtainium pipe" },
			func() error { _, _, err := spec.ResolveFormer(cat, "unobtainium pipe"); return err },
			&spec.SearchOptions{Former: "unobtainium pipe"}, `former = "unobtainium pipe"`},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			check := func(layer string, err error) {
				t.Helper()
				if !errors.Is(err, forms.ErrNotFound) {
					t.Errorf("%s: errors.Is(%v, forms.ErrNotFound) = false", layer, err)
				}
				if _, ok := errors.AsType[*forms.LookupError](err); !ok {
					t.Errorf("%s: no *forms.LookupError in %v", layer, err)
				}
				if c := exitCode(err); c != exitBadInput {
					t.Errorf("%s: exit code %d, want %d", layer, c, exitBadInput)
				}
			}
			err := tc.direct()
			check("resolve", err)
			if fe, ok := errors.AsType[*flagError](err); !ok || fe.Flag != tc.flag {
				t.Errorf("resolve: %v does not name --%s", err, tc.flag)
			}

			o := base
			tc.set(&o)
			_, err = spec.Resolve(cat, o.winding())
			check("coil spec", err)

			if tc.design != nil {
				_, _, err = spec.SearchLists(cat, tc.design)
				check("design supports", err)
			}

			support := `mandrel = "6mm"`
			if tc.name != "wire" {
				support = tc.jobKey
			}
			wire := `wire = "1mm"`
			if tc.name == "wire" {
				wire = tc.jobKey
			}
			src := fmt.Sprintf("title = \"t\"\n[[coil]]\nname = \"L1\"\n%s\n%s\nturns = 5\nleads = \"5mm\"\n", support, wire)
			job, err := forms.LoadJob(strings.NewReader(src), "job.toml")
			if err != nil {
				t.Fatalf("job: %v", err)
			}
			_, err = spec.ResolveJobCoil(job, &job.Coils[0], cat)
			check("job coil", err)
			if pe, ok := errors.AsType[*forms.ParseError](err); !ok || pe.Line == 0 {
				t.Errorf("job coil: %v is not a ParseError at a line", err)
			}

			args := append([]string{"predict", "--turns", "5", "--leads", "5mm"}, "--wire", o.wire)
			if o.mandrel != "" {
				args = append(args, "--mandrel", o.mandrel)
			} else {
				args = append(args, "--former", o.former)
			}
			checkRefusal(t, args, exitBadInput, "--"+tc.flag, "not found")
		})
	}
}

// TestExitCodes checks the exit code of representative errors, bare and
// wrapped, and that the code follows the error's type, never its text.
func TestExitCodes(t *testing.T) {
	lookup := &forms.LookupError{Kind: "wire", Name: "x"}
	infeasible := fmt.Errorf("no coil: %w", coil.ErrInfeasible)
	tests := []struct {
		name string
		err  error
		want int
	}{
		{"nil", nil, exitOK},
		{"usage", usageErrorf("--turns is required"), exitBadInput},
		{"flag", &flagError{Flag: "turns", Err: errors.New("must be positive")}, exitBadInput},
		{"model input", &coil.InputError{Param: "turns", Reason: "must be positive"}, exitBadInput},
		{"parse", &forms.ParseError{Kind: "job", File: "j.toml", Line: 3, Err: errors.New("bad")}, exitBadInput},
		{"quantity", &quantity.Error{Input: "4.5q", Want: "length", Reason: "unknown unit"}, exitBadInput},
		{"lookup", lookup, exitBadInput},
		{"lookup wrapped twice", fmt.Errorf("job: %w", &flagError{Flag: "wire", Err: fmt.Errorf("%w; fix", lookup)}), exitBadInput},
		{"infeasible", infeasible, exitInfeasible},
		{"infeasible in a job", fmt.Errorf("job %q: line 4: L1: %w", "j.toml", infeasible), exitInfeasible},
		{"file system", fmt.Errorf("write out.pdf: %w", &fs.PathError{Op: "open", Path: "out.pdf", Err: fs.ErrPermission}), exitFailure},
		{"plain", errors.New("disk on fire"), exitFailure},
		// Text alone decides nothing: these read like bad input but are
		// untyped runtime failures.
		{"text says unknown command", errors.New("unknown command \"x\" for \"turnwise\""), exitFailure},
		{"text says unknown flag", errors.New("unknown flag: --x"), exitFailure},
		{"text says not found", errors.New("wire \"x\" not found"), exitFailure},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			if got := exitCode(tc.err); got != tc.want {
				t.Errorf("exitCode(%v) = %d, want %d", tc.err, got, tc.want)
			}
		})
	}
}

// TestCommandLineExitCodes runs the command line: unknown commands and
// flags are bad input (2), a file that cannot be written is a runtime
// failure (1).
func TestCommandLineExitCodes(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	if err := os.WriteFile(dir+"/file", nil, 0o644); err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name string
		args []string
		want int
		says string
	}{
		{"unknown command", []string{"bogus"}, exitBadInput, `unknown command "bogus"`},
		{"misspelt command", []string{"prdict"}, exitBadInput, "predict"},
		{"unknown root flag", []string{"--colour", "red"}, exitBadInput, "--colour"},
		{"unknown shorthand", []string{"predict", "-z"}, exitBadInput, "'z'"},
		{"output under a file", []string{"sheet", "../../testdata/club-night.toml", "-o", dir + "/file/out.pdf"}, exitFailure, "not a directory"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, errOut, code := runCLI(t, tc.args...)
			if code != tc.want {
				t.Errorf("exit %d, want %d; stderr %q", code, tc.want, errOut)
			}
			if !strings.Contains(errOut, tc.says) {
				t.Errorf("stderr %q does not say %q", errOut, tc.says)
			}
		})
	}
}
