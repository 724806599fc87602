package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"turnwise/internal/atomicfile"
	"turnwise/internal/report"
	"turnwise/internal/spec"
)

// saveTrimCalibration appends the calibration to the stock file at path:
// the old file is copied to FILE.bak first, then the new text
// (spec.AppendCalibration) replaces it atomically. The whole
// read-change-replace runs under an advisory lock (atomicfile.Lock) so
// concurrent saves into one file keep every calibration; a symlinked stock
// file is updated where it lives.
func saveTrimCalibration(ctx context.Context, shown string, res *trimResult) (*report.SavedCalibration, error) {
	path := shown
	// A read-only stock file stays so: renaming over it would succeed in a
	// writable directory and silently drop the protection (exit 1, like any
	// file turnwise cannot write).
	if err := atomicfile.CheckWritable(path); err != nil {
		return nil, fmt.Errorf("--save: %w; make it writable (chmod u+w) or give another --stock file", err)
	}
	// A stock file kept behind a symbolic link is updated where it lives.
	if real, err := atomicfile.Resolve(path); err == nil {
		path = real
	}
	// Another turnwise may be saving into the same file: read, change and
	// replace it under an exclusive lock, so neither calibration is lost.
	unlock, err := atomicfile.Lock(path)
	if err != nil {
		return nil, fmt.Errorf("--save: %w", err)
	}
	defer unlock()
	orig, err := os.ReadFile(path)
	existed := err == nil
	var mode fs.FileMode = 0o644
	switch {
	case existed:
		if st, err := os.Stat(path); err == nil {
			mode = st.Mode().Perm()
		}
	case errors.Is(err, os.ErrNotExist):
		orig = nil
	default:
		return nil, fmt.Errorf("--save: read %s: %w", path, err)
	}
	text, s, err := spec.AppendCalibration(orig, path, shown, res.Coil, res.Calibration, res.Meas, res.LF)
	if err != nil {
		return nil, err
	}
	if existed {
		s.Backup = path + ".bak"
		if err := atomicfile.Write(ctx, s.Backup, atomicfile.Options{Perm: mode}, func(w io.Writer) error { _, err := w.Write(orig); return err }); err != nil {
			return nil, fmt.Errorf("--save: keep the old stock file: %w", err)
		}
	}
	// The stock file keeps its own permissions.
	if err := atomicfile.Write(ctx, path, atomicfile.Options{Perm: mode}, func(w io.Writer) error { _, err := w.Write(text); return err }); err != nil {
		return nil, fmt.Errorf("--save: %w", err)
	}
	return s, nil
}
