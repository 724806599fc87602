//go:build windows

package atomicfile

import (
	"io/fs"
	"os"

	"golang.org/x/sys/windows"
)

// processAlive reports whether a process with this id runs.
func processAlive(pid int) bool {
	h, err := windows.OpenProcess(windows.PROCESS_QUERY_LIMITED_INFORMATION, false, uint32(pid))
	if err != nil {
		return err == windows.ERROR_ACCESS_DENIED
	}
	defer windows.CloseHandle(h)
	var code uint32
	if err := windows.GetExitCodeProcess(h, &code); err != nil {
		return true
	}
	return code == 259 // STILL_ACTIVE
}

// keepOwner: Windows files keep the directory's inherited ACL; nothing to do.
func keepOwner(*os.File, fs.FileInfo) {}

// writable: the read-only attribute is what Windows users set.
func writable(_ string, st fs.FileInfo) error {
	if st.Mode().Perm()&0o200 == 0 {
		return fs.ErrPermission
	}
	return nil
}

// lockFile takes an exclusive LockFileEx lock on f, waiting for it.
func lockFile(f *os.File) error {
	var ol windows.Overlapped
	return windows.LockFileEx(windows.Handle(f.Fd()), windows.LOCKFILE_EXCLUSIVE_LOCK, 0, 1, 0, &ol)
}

func unlockFile(f *os.File) error {
	var ol windows.Overlapped
	return windows.UnlockFileEx(windows.Handle(f.Fd()), 0, 1, 0, &ol)
}
