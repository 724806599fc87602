//go:build !unix && !windows

package atomicfile

import (
	"errors"
	"io/fs"
	"os"
)

func processAlive(int) bool           { return true }
func keepOwner(*os.File, fs.FileInfo) {}
func writable(_ string, st fs.FileInfo) error {
	if st.Mode().Perm()&0o200 == 0 {
		return fs.ErrPermission
	}
	return nil
}

// lockFile: no advisory locks here; the exclusive-create lock in Lock is
// used instead.
func lockFile(*os.File) error   { return errUnsupported }
func unlockFile(*os.File) error { return nil }

var errUnsupported = errors.New("advisory locks are not supported here")
