package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"io/fs"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"turnwise/internal/atomicfile"
)

// TestMain lets a test start this test binary as the real turnwise
// (TURNWISE_TEST_MAIN=1): a separate process with main's signal handling.
func TestMain(m *testing.M) {
	if os.Getenv("TURNWISE_TEST_MAIN") == "1" {
		os.Exit(runMain(os.Args[1:]))
	}
	os.Exit(m.Run())
}

// turnwiseCmd is the real turnwise in a process of its own.
func turnwiseCmd(t *testing.T, dir string, args ...string) *exec.Cmd {
	t.Helper()
	exe, err := os.Executable()
	if err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(exe, args...)
	cmd.Dir = dir
	cmd.Env = append(os.Environ(), "TURNWISE_TEST_MAIN=1", "TURNWISE_STOCK=")
	return cmd
}

// snapshot records every file in dir (name, mode, content) to prove a
// refused run changed nothing.
func dirListing(t *testing.T, dir string) string {
	t.Helper()
	var b strings.Builder
	err := filepath.WalkDir(dir, func(p string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		st, err := os.Lstat(p)
		if err != nil {
			return err
		}
		fmt.Fprintf(&b, "%s %v", p, st.Mode())
		if st.Mode().IsRegular() {
			c, _ := os.ReadFile(p)
			fmt.Fprintf(&b, " %x", c)
		}
		b.WriteByte('\n')
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	return b.String()
}

const smallJob = `title = "Small"
[[coil]]
name = "L1"
mandrel = "6mm"
wire = "1mm"
turns = 5
length = "8mm"
leads = "5mm"
freq = "145MHz"
`

// -o naming an input (the job, its stock file, through a symlink or a
// hard link) is refused with exit 2 naming -o, and nothing changes.
func TestOutputIsInput(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	job := filepath.Join(dir, "job.toml")
	stock := filepath.Join(dir, "stock.toml")
	os.WriteFile(job, []byte(smallJob+"\nstock = \"stock.toml\"\n"), 0o644)
	os.WriteFile(job, []byte("stock = \"stock.toml\"\n"+smallJob), 0o644)
	copyFile(t, filepath.Join("..", "..", "testdata", "stock", "bench.toml"), stock, 0o644)
	cases := map[string]string{
		"the job":                 job,
		"the job's stock file":    stock,
		"the job by another name": filepath.Join(dir, ".", "sub", "..", "job.toml"),
	}
	if runtime.GOOS != "windows" {
		os.Symlink(job, filepath.Join(dir, "link.pdf"))
		os.Link(job, filepath.Join(dir, "hard.pdf"))
		cases["a symlink to the job"] = filepath.Join(dir, "link.pdf")
		cases["a hard link to the job"] = filepath.Join(dir, "hard.pdf")
	}
	os.Mkdir(filepath.Join(dir, "sub"), 0o755)
	for name, out := range cases {
		t.Run(name, func(t *testing.T) {
			before := dirListing(t, dir)
			stdout, stderr, code := runCLI(t, "sheet", job, "-o", out)
			if code != exitBadInput || stdout != "" || !strings.HasPrefix(stderr, "turnwise: -o ") || !strings.Contains(stderr, "input file") {
				t.Errorf("exit %d, stdout %q, stderr %q; want 2 naming -o", code, stdout, stderr)
			}
			if after := dirListing(t, dir); after != before {
				t.Errorf("files changed:\nbefore\n%s\nafter\n%s", before, after)
			}
		})
	}
	// --stock on the command line is an input too.
	before := dirListing(t, dir)
	if _, stderr, code := runCLI(t, "sheet", "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm", "--stock", stock, "-o", stock); code != exitBadInput || !strings.Contains(stderr, "-o") {
		t.Errorf("-o = --stock: exit %d, %q", code, stderr)
	}
	if dirListing(t, dir) != before {
		t.Error("stock file changed")
	}
}

// -o naming a symlink writes its target and keeps the link; /dev/null
// stays a device.
func TestOutputSymlinkAndDevice(t *testing.T) {
	if runtime.GOOS == "windows" {
		t.Skip("symlinks and /dev/null")
	}
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	job := filepath.Join(dir, "job.toml")
	os.WriteFile(job, []byte(smallJob), 0o644)
	os.Mkdir(filepath.Join(dir, "pdfs"), 0o755)
	real := filepath.Join(dir, "pdfs", "real.pdf")
	os.WriteFile(real, []byte("old"), 0o644)
	link := filepath.Join(dir, "out.pdf")
	os.Symlink(filepath.Join("pdfs", "real.pdf"), link)
	if _, stderr, code := runCLI(t, "sheet", job, "-o", link); code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	if st, err := os.Lstat(link); err != nil || st.Mode()&fs.ModeSymlink == 0 {
		t.Errorf("the link was replaced: %v %v", st.Mode(), err)
	}
	if b, _ := os.ReadFile(real); !bytes.HasPrefix(b, []byte("%PDF-")) {
		t.Errorf("the link's target holds %q", b[:min(len(b), 8)])
	}
	if _, stderr, code := runCLI(t, "sheet", job, "-o", "/dev/null"); code != exitOK {
		t.Fatalf("-o /dev/null: exit %d: %s", code, stderr)
	}
	if st, err := os.Stat("/dev/null"); err != nil || st.Mode()&fs.ModeCharDevice == 0 {
		t.Fatalf("/dev/null is no longer a device: %v %v", st.Mode(), err)
	}
}

// An output turnwise cannot write is exit 1 (runtime failure), as the
// README's table says, for sheet -o and trim --save alike.
func TestUnwritableOutputExit1(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	job := filepath.Join(dir, "job.toml")
	os.WriteFile(job, []byte(smallJob), 0o644)
	file := filepath.Join(dir, "file")
	os.WriteFile(file, nil, 0o644)
	for name, args := range map[string][]string{
		"missing directory": {"sheet", job, "-o", filepath.Join(dir, "no", "such", "x.pdf")},
		"under a file":      {"sheet", job, "-o", filepath.Join(file, "x.pdf")},
		"a directory":       {"sheet", job, "-o", dir},
	} {
		t.Run(name, func(t *testing.T) {
			before := dirListing(t, dir)
			_, stderr, code := runCLI(t, args...)
			if code != exitFailure || !strings.HasPrefix(stderr, "turnwise: -o ") || strings.Count(stderr, "\n") != 1 {
				t.Errorf("exit %d, stderr %q; want 1 and one line naming -o", code, stderr)
			}
			if dirListing(t, dir) != before {
				t.Error("files changed")
			}
		})
	}
}

// trim --save on a read-only stock file is refused (exit 1) and the file
// keeps its text and mode; a normal save keeps mode.
func TestTrimSaveReadOnly(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	stock := filepath.Join(dir, "stock.toml")
	copyFile(t, filepath.Join(trimData, "stock.toml"), stock, 0o444)
	before := dirListing(t, dir)
	args := []string{"trim", "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm", "--measured-l", "90nH", "--stock", stock, "--save"}
	out, stderr, code := runCLI(t, args...)
	if code != exitFailure || out != "" || !strings.Contains(stderr, "--save") || !strings.Contains(stderr, "read-only") {
		t.Errorf("exit %d, stdout %q, stderr %q; want 1, --save, read-only", code, out, stderr)
	}
	if after := dirListing(t, dir); after != before {
		t.Errorf("read-only stock file changed:\n%s\n%s", before, after)
	}
}

// Two turnwise processes saving calibrations into one stock file at the
// same moment: the advisory lock serialises read-change-replace, so both
// calibrations are in the file afterwards, every round.
func TestTrimSaveConcurrent(t *testing.T) {
	if testing.Short() {
		t.Skip("starts many processes")
	}
	base, err := os.ReadFile(filepath.Join("..", "..", "testdata", "stock", "bench.toml"))
	if err != nil {
		t.Fatal(err)
	}
	// A large stock file makes each run's read-change-replace slower, so
	// the two overlap (the race was reproduced that way).
	var big bytes.Buffer
	big.Write(base)
	for i := range 400 {
		fmt.Fprintf(&big, "\n[[wire]]\nname = \"spool %d\"\nbare = \"%.2fmm\"\ninsulation = \"none\"\n", i, 0.2+float64(i)*0.002)
	}
	const rounds = 6
	for r := range rounds {
		dir := t.TempDir()
		stock := filepath.Join(dir, "stock.toml")
		os.WriteFile(stock, big.Bytes(), 0o644)
		var wg sync.WaitGroup
		start := make(chan struct{})
		outs := make([]string, 2)
		for i, mandrel := range []string{"brass rod 6", "6.5mm"} {
			cmd := turnwiseCmd(t, dir, "trim", "--mandrel", mandrel, "--wire", "1mm", "--turns", "5", "--length", "8mm",
				"--leads", "5mm", "--measured-l", "90nH", "--stock", stock, "--save")
			wg.Go(func() {
				<-start
				b, err := cmd.CombinedOutput()
				outs[i] = string(b)
				if err != nil {
					t.Errorf("round %d run %d: %v\n%s", r, i, err, b)
				}
			})
		}
		close(start)
		wg.Wait()
		got, _ := os.ReadFile(stock)
		if n := bytes.Count(got, []byte("[[calibration]]")) - bytes.Count(base, []byte("[[calibration]]")); n != 2 {
			t.Fatalf("round %d: %d new calibrations in the file, want 2 (one lost); both said:\n%s\n%s", r, n, outs[0], outs[1])
		}
		for _, m := range []string{`mandrel = "brass rod 6"`, `mandrel = "6.5mm`} {
			if !bytes.Contains(got[len(base):], []byte(m)) {
				t.Errorf("round %d: no calibration with %s", r, m)
			}
		}
		if left, _ := filepath.Glob(filepath.Join(dir, "*.lock")); len(left) > 0 {
			t.Errorf("round %d: lock file left: %v", r, left)
		}
	}
}

// bigJob writes a job of n coils, slow enough to render that a signal
// lands while the temporary file is open.
func bigJob(t *testing.T, dir string, n int) string {
	var b strings.Builder
	b.WriteString("title = \"Signal test\"\n")
	for i := range n {
		fmt.Fprintf(&b, "[[coil]]\nname = \"L%d\"\nmandrel = \"6mm\"\nwire = \"1mm\"\nturns = %d\nlength = \"%dmm\"\nleads = \"5mm\"\nfreq = \"50MHz\"\n", i, 4+i%5, 10+i%5)
	}
	p := filepath.Join(dir, "big.toml")
	if err := os.WriteFile(p, []byte(b.String()), 0o644); err != nil {
		t.Fatal(err)
	}
	return p
}

// waitTemp waits until a turnwise temporary file appears in dir.
func waitTemp(t *testing.T, dir string) bool {
	deadline := time.Now().Add(30 * time.Second)
	for time.Now().Before(deadline) {
		if m, _ := filepath.Glob(filepath.Join(dir, atomicfile.TempPrefix+"*")); len(m) > 0 {
			return true
		}
		time.Sleep(5 * time.Millisecond)
	}
	return false
}

// SIGINT or SIGTERM during sheet: the process exits 130/143, and neither
// the PDF nor a temporary file is left. After kill -9 (which nothing can
// catch) the next run in the directory removes the dead run's temp file.
func TestSheetSignalLeavesNothing(t *testing.T) {
	if runtime.GOOS == "windows" {
		t.Skip("POSIX signals")
	}
	if testing.Short() {
		t.Skip("renders large jobs in child processes")
	}
	for _, tc := range []struct {
		sig  syscall.Signal
		code int
	}{{syscall.SIGINT, 130}, {syscall.SIGTERM, 143}, {syscall.SIGKILL, -1}} {
		t.Run(tc.sig.String(), func(t *testing.T) {
			dir := t.TempDir()
			job := bigJob(t, dir, 300)
			cmd := turnwiseCmd(t, dir, "sheet", job, "-o", "out.pdf")
			var stderr bytes.Buffer
			cmd.Stderr = &stderr
			if err := cmd.Start(); err != nil {
				t.Fatal(err)
			}
			if !waitTemp(t, dir) {
				cmd.Process.Kill()
				cmd.Wait()
				t.Fatal("no temporary file appeared")
			}
			cmd.Process.Signal(tc.sig)
			cmd.Wait()
			if tc.code > 0 && cmd.ProcessState.ExitCode() != tc.code {
				t.Errorf("exit %d, want %d; stderr %q", cmd.ProcessState.ExitCode(), tc.code, stderr.String())
			}
			if tc.sig == syscall.SIGKILL {
				// Left behind by the killed run; the next run clears it.
				if m, _ := filepath.Glob(filepath.Join(dir, atomicfile.TempPrefix+"*")); len(m) != 1 {
					t.Fatalf("after kill -9: %v, want the dead run's temp file", m)
				}
				small := filepath.Join(dir, "small.toml")
				os.WriteFile(small, []byte(smallJob), 0o644)
				if _, errOut, code := runCLI(t, "sheet", small, "-o", filepath.Join(dir, "small.pdf")); code != exitOK {
					t.Fatalf("next run: exit %d %s", code, errOut)
				}
				os.Remove(small)
				os.Remove(filepath.Join(dir, "small.pdf"))
			}
			ents, _ := os.ReadDir(dir)
			var names []string
			for _, e := range ents {
				names = append(names, e.Name())
			}
			if len(names) != 1 || names[0] != "big.toml" {
				t.Errorf("files left after %v: %v", tc.sig, names)
			}
		})
	}
}

// With --json the warnings are in the JSON warnings array and on stderr,
// the same lines as in table mode, for every command that warns.
func TestJSONWarningsOnStderr(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	for name, args := range map[string][]string{
		"predict": {"predict", "--mandrel", "6mm", "--wire", "1mm", "--turns", "30", "--length", "40mm", "--leads", "50mm", "--freq", "145MHz"},
		"design":  {"design", "--inductance", "100nH", "--freq", "145MHz"},
		"trim":    {"trim", "--mandrel", "6.5mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm", "--measured-l", "90nH"},
	} {
		t.Run(name, func(t *testing.T) {
			_, tableErr, code := runCLI(t, args...)
			if code != exitOK || tableErr == "" {
				t.Fatalf("table: exit %d, stderr %q; want warnings", code, tableErr)
			}
			out, jsonErr, code := runCLI(t, append(args, "--json")...)
			if code != exitOK {
				t.Fatalf("json: exit %d %s", code, jsonErr)
			}
			if jsonErr != tableErr {
				t.Errorf("stderr with --json %q, without %q", jsonErr, tableErr)
			}
			var doc struct{ Warnings []string }
			if err := json.Unmarshal([]byte(out), &doc); err != nil {
				t.Fatal(err)
			}
			for _, w := range doc.Warnings {
				if !strings.Contains(jsonErr, "warning: "+w+"\n") {
					t.Errorf("JSON warning %q not on stderr", w)
				}
			}
			if len(doc.Warnings) == 0 {
				t.Error("no warnings in the JSON")
			}
		})
	}
}

// Exit codes the README states: a blank --title is bad input on --title;
// an unknown or missing completion shell is exit 2 naming the shells;
// version has --json like every command.
func TestExitCodesAndVersionJSON(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	dir := t.TempDir()
	tests := []struct {
		name string
		args []string
		code int
		want string
	}{
		{"blank title", []string{"sheet", "--mandrel", "6mm", "--wire", "1mm", "--turns", "5", "--length", "8mm", "--leads", "5mm", "--title", " ", "-o", filepath.Join(dir, "x.pdf")}, exitBadInput, "turnwise: --title is blank"},
		{"completion tcsh", []string{"completion", "tcsh"}, exitBadInput, "bash, zsh, fish, powershell"},
		{"completion without shell", []string{"completion"}, exitBadInput, "completion needs a shell"},
		{"completion bash", []string{"completion", "bash"}, exitOK, ""},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, stderr, code := runCLI(t, tc.args...)
			if code != tc.code || !strings.Contains(stderr, tc.want) || (tc.want != "" && strings.Count(stderr, "\n") != 1) {
				t.Errorf("exit %d, stderr %q; want %d and one line with %q", code, stderr, tc.code, tc.want)
			}
		})
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 0 {
		t.Errorf("files written: %v", ents)
	}
	out, stderr, code := runCLI(t, "version", "--json")
	var doc struct {
		Schema   int
		Version  string
		Warnings []string
	}
	if code != exitOK || json.Unmarshal([]byte(out), &doc) != nil || doc.Schema != 1 || doc.Version == "" || doc.Warnings == nil {
		t.Errorf("version --json: exit %d, %q %q", code, out, stderr)
	}
}

// Shell completion offers the words of the choice flags and stock names,
// the user's stock file included.
func TestFlagCompletion(t *testing.T) {
	t.Setenv("TURNWISE_STOCK", "")
	stock := filepath.Join("..", "..", "testdata", "stock", "bench.toml")
	tests := []struct {
		args []string
		want []string
	}{
		{[]string{"design", "--prefer", ""}, []string{"balanced", "q", "small", "easy"}},
		{[]string{"predict", "--units", ""}, []string{"mm", "in"}},
		{[]string{"span", "--law", ""}, []string{"slc", "slf", "slw"}},
		{[]string{"design", "--support", ""}, []string{"any", "mandrel", "former"}},
		{[]string{"predict", "--conductor", ""}, []string{"copper", "silver-plated", "tinned"}},
		{[]string{"predict", "--insulation", "gr"}, []string{"grade1", "grade2"}},
		{[]string{"predict", "--wire", "22"}, []string{"22awg"}},
		{[]string{"predict", "--stock", stock, "--wire", "gr"}, []string{"green spool"}},
		{[]string{"trim", "--stock", stock, "--mandrel", "brass"}, []string{"brass rod 6"}},
		{[]string{"design", "--former", ""}, nil}, // built-in formers: checked non-empty below
	}
	for _, tc := range tests {
		t.Run(strings.Join(tc.args, " "), func(t *testing.T) {
			out, stderr, code := runCLI(t, append([]string{"__complete"}, tc.args...)...)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			lines := strings.Split(strings.TrimSpace(out), "\n")
			got := lines[:len(lines)-1] // the last line is the directive
			if len(got) == 0 {
				t.Fatalf("no completions: %q", out)
			}
			for _, w := range tc.want {
				found := false
				for _, g := range got {
					found = found || g == w
				}
				if !found {
					t.Errorf("%q not offered; got %v", w, got)
				}
			}
		})
	}
}
