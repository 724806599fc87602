package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
)

// writeFileAtomic writes the output of fill to path so that a reader never
// sees a half-written file: it writes a temporary file in the same
// directory, syncs it, sets its permissions to perm, closes it and renames
// it over path. On any error the temporary file is removed and an existing
// file at path is untouched. path "-" writes to stdout instead. Errors name
// the path, not a flag: callers add the flag they took it from.
func writeFileAtomic(path string, perm os.FileMode, stdout io.Writer, fill func(io.Writer) error) (err error) {
	if path == "-" {
		return fill(stdout)
	}
	dir := filepath.Dir(path)
	if st, statErr := os.Stat(path); statErr == nil && st.IsDir() {
		return usageErrorf("%s is a directory; give a file name in it", path)
	}
	tmp, err := os.CreateTemp(dir, "."+filepath.Base(path)+".tmp-*")
	if err != nil {
		if errors.Is(err, os.ErrNotExist) {
			return usageErrorf("%s: directory %s does not exist; create it first or choose another path", path, dir)
		}
		if errors.Is(err, os.ErrPermission) {
			return usageErrorf("%s: cannot write in %s (permission denied); choose another path", path, dir)
		}
		return fmt.Errorf("write %s: %w", path, err)
	}
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	if err = fill(tmp); err != nil {
		return err
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	// CreateTemp makes the file 0600; set the caller's permissions before
	// the file appears under its name.
	if err = tmp.Chmod(perm); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if err = tmp.Close(); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if err = os.Rename(tmp.Name(), path); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if d, derr := os.Open(dir); derr == nil {
		d.Sync() // best effort: make the rename durable
		d.Close()
	}
	return nil
}
