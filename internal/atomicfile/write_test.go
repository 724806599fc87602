package atomicfile

import (
	"context"
	"errors"
	"io"
	"io/fs"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"
)

func writeString(s string) func(io.Writer) error {
	return func(w io.Writer) error { _, err := io.WriteString(w, s); return err }
}

func names(t *testing.T, dir string) []string {
	t.Helper()
	ents, err := os.ReadDir(dir)
	if err != nil {
		t.Fatal(err)
	}
	var out []string
	for _, e := range ents {
		out = append(out, e.Name())
	}
	return out
}

func TestWriteReplacesOrKeeps(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	path := filepath.Join(dir, "out.txt")
	if err := os.WriteFile(path, []byte("old"), 0o640); err != nil {
		t.Fatal(err)
	}
	boom := errors.New("boom")
	err := Write(context.Background(), path, Options{}, func(w io.Writer) error {
		io.WriteString(w, "half")
		return boom
	})
	if !errors.Is(err, boom) {
		t.Fatalf("err = %v", err)
	}
	if b, _ := os.ReadFile(path); string(b) != "old" {
		t.Errorf("old file changed to %q", b)
	}
	if n := names(t, dir); len(n) != 1 {
		t.Errorf("temporary file left behind: %v", n)
	}
	if err := Write(context.Background(), path, Options{}, writeString("new")); err != nil {
		t.Fatal(err)
	}
	if b, _ := os.ReadFile(path); string(b) != "new" {
		t.Errorf("file is %q, want new", b)
	}
	// An existing file keeps its mode.
	if st, _ := os.Stat(path); runtime.GOOS != "windows" && st.Mode().Perm() != 0o640 {
		t.Errorf("mode %v, want 0640 kept", st.Mode().Perm())
	}
	// A directory is refused.
	if err := Write(context.Background(), dir, Options{}, writeString("x")); !errors.Is(err, ErrIsDir) {
		t.Errorf("directory: %v", err)
	}
}

func TestWriteFollowsSymlink(t *testing.T) {
	t.Parallel()
	if runtime.GOOS == "windows" {
		t.Skip("symbolic links need privileges on Windows")
	}
	dir := t.TempDir()
	real := filepath.Join(dir, "real.pdf")
	link := filepath.Join(dir, "link.pdf")
	if err := os.WriteFile(real, []byte("old"), 0o644); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink("real.pdf", link); err != nil {
		t.Fatal(err)
	}
	if err := Write(context.Background(), link, Options{}, writeString("new")); err != nil {
		t.Fatal(err)
	}
	st, err := os.Lstat(link)
	if err != nil || st.Mode()&fs.ModeSymlink == 0 {
		t.Fatalf("link replaced: %v %v", st.Mode(), err)
	}
	if b, _ := os.ReadFile(real); string(b) != "new" {
		t.Errorf("target holds %q, want new", b)
	}
	// A dangling link: the file appears where it points.
	dangling := filepath.Join(dir, "dangling.pdf")
	if err := os.Symlink("made.pdf", dangling); err != nil {
		t.Fatal(err)
	}
	if err := Write(context.Background(), dangling, Options{}, writeString("made")); err != nil {
		t.Fatal(err)
	}
	if b, _ := os.ReadFile(filepath.Join(dir, "made.pdf")); string(b) != "made" {
		t.Errorf("dangling link target holds %q", b)
	}
}

func TestWriteDeviceAndFIFO(t *testing.T) {
	t.Parallel()
	if runtime.GOOS == "windows" {
		t.Skip("no /dev/null or FIFOs")
	}
	// /dev/null stays a character device (as root a rename would replace it).
	if err := Write(context.Background(), "/dev/null", Options{}, writeString("x")); err != nil {
		t.Fatalf("/dev/null: %v", err)
	}
	if st, err := os.Stat("/dev/null"); err != nil || st.Mode()&fs.ModeCharDevice == 0 {
		t.Fatalf("/dev/null is no longer a device: %v %v", st.Mode(), err)
	}
	mkfifo, err := exec.LookPath("mkfifo")
	if err != nil {
		t.Skip("mkfifo not found")
	}
	dir := t.TempDir()
	fifo := filepath.Join(dir, "pipe")
	if out, err := exec.Command(mkfifo, fifo).CombinedOutput(); err != nil {
		t.Fatalf("mkfifo: %v %s", err, out)
	}
	got := make(chan string, 1)
	go func() {
		b, _ := os.ReadFile(fifo)
		got <- string(b)
	}()
	if err := Write(context.Background(), fifo, Options{}, writeString("through the pipe")); err != nil {
		t.Fatal(err)
	}
	select {
	case s := <-got:
		if s != "through the pipe" {
			t.Errorf("reader got %q", s)
		}
	case <-time.After(5 * time.Second):
		t.Fatal("reader got nothing")
	}
	if st, err := os.Lstat(fifo); err != nil || st.Mode()&fs.ModeNamedPipe == 0 {
		t.Errorf("FIFO replaced: %v %v", st.Mode(), err)
	}
}

func TestWriteCancelRemovesTemp(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	path := filepath.Join(dir, "out.pdf")
	ctx, cancel := context.WithCancel(context.Background())
	started := make(chan struct{})
	release := make(chan struct{})
	done := make(chan error, 1)
	go func() {
		done <- Write(ctx, path, Options{}, func(w io.Writer) error {
			io.WriteString(w, "first part")
			close(started)
			<-release // a long render, interrupted
			_, err := io.WriteString(w, "rest")
			return err
		})
	}()
	<-started
	if n := names(t, dir); len(n) != 1 || !strings.HasPrefix(n[0], TempPrefix+strconv.Itoa(os.Getpid())+"-") {
		t.Fatalf("while writing: %v, want one %s<pid>- file", n, TempPrefix)
	}
	cancel()
	// The temporary file goes at cancellation, before fill returns.
	deadline := time.Now().Add(2 * time.Second)
	for len(names(t, dir)) != 0 && time.Now().Before(deadline) {
		time.Sleep(5 * time.Millisecond)
	}
	if n := names(t, dir); len(n) != 0 {
		t.Errorf("after cancel, before fill returned: %v", n)
	}
	close(release)
	if err := <-done; !errors.Is(err, context.Canceled) {
		t.Errorf("err = %v, want context.Canceled", err)
	}
	if n := names(t, dir); len(n) != 0 {
		t.Errorf("after cancel: %v", n)
	}
}

func TestCleanStale(t *testing.T) {
	t.Parallel()
	if runtime.GOOS == "windows" {
		t.Skip("needs a finished child's pid")
	}
	// A pid that surely is dead: a child that has exited and been reaped.
	cmd := exec.Command("true")
	if err := cmd.Run(); err != nil {
		t.Skip("cannot run true:", err)
	}
	dead := cmd.Process.Pid
	dir := t.TempDir()
	stale := filepath.Join(dir, TempPrefix+strconv.Itoa(dead)+"-123")
	live := filepath.Join(dir, TempPrefix+strconv.Itoa(os.Getpid())+"-456")
	other := filepath.Join(dir, ".out.pdf.tmp-789")
	for _, p := range []string{stale, live, other} {
		if err := os.WriteFile(p, nil, 0o600); err != nil {
			t.Fatal(err)
		}
	}
	if err := Write(context.Background(), filepath.Join(dir, "out.pdf"), Options{}, writeString("x")); err != nil {
		t.Fatal(err)
	}
	if _, err := os.Stat(stale); !errors.Is(err, fs.ErrNotExist) {
		t.Errorf("stale temp file of dead pid %d kept", dead)
	}
	for _, p := range []string{live, other} {
		if _, err := os.Stat(p); err != nil {
			t.Errorf("%s removed: %v", filepath.Base(p), err)
		}
	}
}

func TestSameFile(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	a := filepath.Join(dir, "job.toml")
	os.WriteFile(a, []byte("x"), 0o644)
	if !SameFile(a, filepath.Join(dir, ".", "job.toml")) {
		t.Error("same path not recognised")
	}
	if runtime.GOOS != "windows" {
		l := filepath.Join(dir, "link.pdf")
		os.Symlink(a, l)
		if !SameFile(l, a) {
			t.Error("symlink to the input not recognised")
		}
		h := filepath.Join(dir, "hard.pdf")
		os.Link(a, h)
		if !SameFile(h, a) {
			t.Error("hard link not recognised")
		}
	}
	if SameFile(filepath.Join(dir, "new.pdf"), a) {
		t.Error("a new file is not an input")
	}
}

func TestCheckWritable(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	p := filepath.Join(dir, "stock.toml")
	os.WriteFile(p, []byte("x"), 0o444)
	if err := CheckWritable(p); !errors.Is(err, fs.ErrPermission) {
		t.Errorf("0444 file: %v, want permission error", err)
	}
	os.Chmod(p, 0o644)
	if err := CheckWritable(p); err != nil {
		t.Errorf("0644 file: %v", err)
	}
	if err := CheckWritable(filepath.Join(dir, "new.toml")); err != nil {
		t.Errorf("new file: %v", err)
	}
}

// TestLockExcludes: goroutines each doing read-increment-write under Lock
// (separate opens of the lock file, as separate processes would) lose no
// update. Without the lock they lose most of them.
func TestLockExcludes(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	p := filepath.Join(dir, "count")
	os.WriteFile(p, []byte("0"), 0o644)
	const n = 40
	var wg sync.WaitGroup
	for range n {
		wg.Go(func() {
			unlock, err := Lock(p)
			if err != nil {
				t.Error(err)
				return
			}
			defer unlock()
			b, _ := os.ReadFile(p)
			k, _ := strconv.Atoi(string(b))
			time.Sleep(time.Millisecond)
			if err := Write(context.Background(), p, Options{}, writeString(strconv.Itoa(k+1))); err != nil {
				t.Error(err)
			}
		})
	}
	wg.Wait()
	if b, _ := os.ReadFile(p); string(b) != strconv.Itoa(n) {
		t.Errorf("count %s, want %d: updates lost", b, n)
	}
}
