package main

import (
	"bytes"
	"context"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestWriteOutput(t *testing.T) {
	t.Parallel()
	dir := t.TempDir()
	in := filepath.Join(dir, "job.toml")
	if err := os.WriteFile(in, []byte("title = \"t\"\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	fill := func(w io.Writer) error { _, err := io.WriteString(w, "x"); return err }
	ctx := context.Background()
	// "-" goes to stdout.
	var out bytes.Buffer
	if err := writeOutput(ctx, "-o", "-", nil, &out, fill); err != nil || out.String() != "x" {
		t.Errorf("stdout: %q, %v", out.String(), err)
	}
	// The input itself is bad input, named by the flag, and untouched.
	err := writeOutput(ctx, "-o", in, []string{in}, nil, fill)
	if exitCode(err) != exitBadInput || !strings.HasPrefix(err.Error(), "-o ") {
		t.Errorf("output = input: %v (exit %d)", err, exitCode(err))
	}
	if b, _ := os.ReadFile(in); string(b) != "title = \"t\"\n" {
		t.Errorf("input changed to %q", b)
	}
	// A missing directory is a runtime failure (exit 1, README), named.
	err = writeOutput(ctx, "-o", filepath.Join(dir, "nope", "f.pdf"), nil, nil, fill)
	if exitCode(err) != exitFailure || !strings.Contains(err.Error(), "does not exist") {
		t.Errorf("missing dir: %v (exit %d)", err, exitCode(err))
	}
}
