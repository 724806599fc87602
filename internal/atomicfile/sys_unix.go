//go:build unix

package atomicfile

import (
	"errors"
	"io/fs"
	"os"
	"syscall"

	"golang.org/x/sys/unix"
)

// processAlive reports whether a process with this id runs (signal 0).
// EPERM means it runs under another user.
func processAlive(pid int) bool {
	err := unix.Kill(pid, 0)
	return err == nil || errors.Is(err, unix.EPERM)
}

// keepOwner gives f the owner and group of old, where the caller may
// (root, or the same owner changing group within its own). Failure is
// silent: the file is still written with the caller's ownership.
func keepOwner(f *os.File, old fs.FileInfo) {
	st, ok := old.Sys().(*syscall.Stat_t)
	if !ok {
		return
	}
	if int(st.Uid) == os.Geteuid() && int(st.Gid) == os.Getegid() {
		return
	}
	_ = f.Chown(int(st.Uid), int(st.Gid))
}

// writable reports whether we may write the file at path: its access bits
// for us (root included: a file with no write bit at all is read-only on
// purpose).
func writable(path string, st fs.FileInfo) error {
	if st.Mode().Perm()&0o222 == 0 {
		return fs.ErrPermission
	}
	if err := unix.Access(path, unix.W_OK); err != nil {
		return fs.ErrPermission
	}
	return nil
}

// lockFile takes an exclusive flock on f, waiting for it.
func lockFile(f *os.File) error {
	for {
		err := unix.Flock(int(f.Fd()), unix.LOCK_EX)
		if !errors.Is(err, unix.EINTR) {
			return err
		}
	}
}

func unlockFile(f *os.File) error { return unix.Flock(int(f.Fd()), unix.LOCK_UN) }
