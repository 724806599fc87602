package main

import (
	"bytes"
	"errors"
	"io"
	"os"
	"path/filepath"
	"testing"
)

func TestWriteFileAtomic(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	path := filepath.Join(dir, "out.txt")
	if err := os.WriteFile(path, []byte("old"), 0o644); err != nil {
		t.Fatal(err)
	}
	// A failing writer leaves the old file and no temporary behind.
	boom := errors.New("boom")
	err := writeFileAtomic(path, 0o644, nil, func(w io.Writer) error {
		io.WriteString(w, "half")
		return boom
	})
	if !errors.Is(err, boom) {
		t.Fatalf("err = %v", err)
	}
	if b, _ := os.ReadFile(path); string(b) != "old" {
		t.Errorf("old file changed to %q", b)
	}
	if ents, _ := os.ReadDir(dir); len(ents) != 1 {
		t.Errorf("temporary file left behind: %v", ents)
	}
	// A good writer replaces it.
	if err := writeFileAtomic(path, 0o644, nil, func(w io.Writer) error { _, err := io.WriteString(w, "new"); return err }); err != nil {
		t.Fatal(err)
	}
	if b, _ := os.ReadFile(path); string(b) != "new" {
		t.Errorf("file is %q, want new", b)
	}
	if st, err := os.Stat(path); err != nil || st.Mode().Perm() != 0o644 {
		t.Errorf("permissions %v, %v; want 0644", st.Mode().Perm(), err)
	}
	// "-" goes to stdout.
	var out bytes.Buffer
	if err := writeFileAtomic("-", 0o644, &out, func(w io.Writer) error { _, err := io.WriteString(w, "x"); return err }); err != nil || out.String() != "x" {
		t.Errorf("stdout: %q, %v", out.String(), err)
	}
	// A missing directory is bad input, named.
	err = writeFileAtomic(filepath.Join(dir, "nope", "f.pdf"), 0o644, nil, func(io.Writer) error { return nil })
	if exitCode(err) != exitBadInput {
		t.Errorf("missing dir: %v (exit %d)", err, exitCode(err))
	}
}
