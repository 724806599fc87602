package atomicfile

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
)

// LockSuffix names the lock file Lock keeps beside the file it guards.
const LockSuffix = ".lock"

// Lock takes an advisory exclusive lock guarding path for a
// read-modify-write (read the file, change it, Write it back): it locks
// the file path+".lock" (a separate file, because path itself is replaced
// by rename; created for the duration and removed on unlock, with a
// re-check after locking so a waiter never holds a removed lock file) and
// waits while another turnwise holds it. Read path
// only after Lock returns. The returned function releases the lock.
//
// Unix uses flock(2), Windows LockFileEx; both are released by the system
// if the process dies.
func Lock(path string) (unlock func() error, err error) {
	target, err := Resolve(path)
	if err != nil {
		return nil, err
	}
	name := target + LockSuffix
	for {
		f, err := os.OpenFile(name, os.O_RDWR|os.O_CREATE, 0o644)
		if err != nil {
			if errors.Is(err, fs.ErrNotExist) {
				return nil, fmt.Errorf("%s: directory %s does not exist; create it first or choose another path: %w", path, filepath.Dir(target), err)
			}
			return nil, fmt.Errorf("lock %s: %w", path, err)
		}
		if err := lockFile(f); err != nil {
			f.Close()
			return nil, fmt.Errorf("lock %s: %w", path, err)
		}
		// The holder before us removes the lock file as it lets go; a lock
		// on that removed file guards nothing, so start again on the new one.
		fst, ferr := f.Stat()
		pst, perr := os.Stat(name)
		if ferr == nil && perr == nil && os.SameFile(fst, pst) {
			return func() error {
				os.Remove(name) // before unlocking: waiters on it retry (best effort; Windows keeps it)
				uerr := unlockFile(f)
				if cerr := f.Close(); uerr == nil {
					uerr = cerr
				}
				return uerr
			}, nil
		}
		unlockFile(f)
		f.Close()
	}
}

// CheckWritable returns an error wrapping fs.ErrPermission when path exists
// and we may not write it: no write permission for us, or no write bit at
// all (a file made read-only on purpose stays so, even for root). A file
// that does not exist yet is writable as far as this check goes.
func CheckWritable(path string) error {
	target, err := Resolve(path)
	if err != nil {
		return err
	}
	st, err := os.Stat(target)
	if errors.Is(err, fs.ErrNotExist) {
		return nil
	}
	if err != nil {
		return err
	}
	if err := writable(target, st); err != nil {
		return fmt.Errorf("%s is read-only (mode %v): %w", path, st.Mode().Perm(), err)
	}
	return nil
}
