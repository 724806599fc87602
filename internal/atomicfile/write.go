package atomicfile

import (
	"context"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
)

// TempPrefix starts the name of every temporary file Write creates, followed
// by the writing process's id and a dash; CleanStale recognises its own
// leftovers by it.
const TempPrefix = ".turnwise-tmp-"

// ErrIsDir is returned when the path names a directory.
var ErrIsDir = errors.New("is a directory; give a file name in it")

// Options tunes Write. The zero value keeps an existing file's mode (else
// 0644) and owner.
type Options struct {
	Perm fs.FileMode // mode of a new file; 0 means 0644. An existing file keeps its own.
}

// Write writes the output of fill to path so that a reader never sees a
// half-written file and an interrupted run leaves nothing behind:
//
//   - a symbolic link is followed: the file it names is replaced and the
//     link stays;
//   - a device, FIFO or socket (/dev/null, /dev/stdout, a named pipe) is
//     written directly: it is not a regular file and is never replaced;
//   - otherwise fill writes a temporary file in the same directory, which is
//     synced, given the old file's mode and (where permitted) owner, and
//     renamed over path. On any error, and when ctx is cancelled before the
//     rename, the temporary file is removed and an existing file is
//     untouched. Writes made by fill after cancellation fail with ctx.Err().
//
// Stale temporary files of dead turnwise processes in the directory are
// removed first (CleanStale).
func Write(ctx context.Context, path string, opt Options, fill func(io.Writer) error) (err error) {
	if ctx == nil {
		ctx = context.Background()
	}
	if err := ctx.Err(); err != nil {
		return err
	}
	target, err := Resolve(path)
	if err != nil {
		return err
	}
	perm := opt.Perm
	if perm == 0 {
		perm = 0o644
	}
	var old fs.FileInfo
	if st, err := os.Stat(target); err == nil {
		switch {
		case st.IsDir():
			return fmt.Errorf("%s %w", path, ErrIsDir)
		case !st.Mode().IsRegular():
			return writeDirect(ctx, target, path, fill)
		}
		old = st
		perm = st.Mode().Perm()
	}
	dir := filepath.Dir(target)
	CleanStale(dir)
	tmp, err := os.CreateTemp(dir, TempPrefix+strconv.Itoa(os.Getpid())+"-*")
	if err != nil {
		if errors.Is(err, fs.ErrNotExist) {
			return fmt.Errorf("%s: directory %s does not exist; create it first or choose another path", path, dir)
		}
		if errors.Is(err, fs.ErrPermission) {
			return fmt.Errorf("%s: cannot write in %s (permission denied); choose another path", path, dir)
		}
		return fmt.Errorf("write %s: %w", path, err)
	}
	// On cancellation the temporary file goes at once, even while fill is
	// still busy: the process may be about to exit.
	var mu sync.Mutex
	state := 0 // 0 writing, 1 renamed, 2 removed
	remove := func() {
		mu.Lock()
		defer mu.Unlock()
		if state == 0 {
			tmp.Close()
			os.Remove(tmp.Name())
			state = 2
		}
	}
	stop := context.AfterFunc(ctx, remove)
	defer stop()
	defer func() {
		if err != nil {
			remove()
		}
	}()
	if err = fill(&ctxWriter{ctx: ctx, w: tmp}); err != nil {
		return err
	}
	if err = tmp.Sync(); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	// CreateTemp makes the file 0600; give it the final mode (and the old
	// file's owner) before it appears under its name.
	if err = tmp.Chmod(perm); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if old != nil {
		keepOwner(tmp, old)
	}
	mu.Lock()
	if state != 0 {
		mu.Unlock()
		return ctx.Err()
	}
	if err = tmp.Close(); err == nil {
		err = os.Rename(tmp.Name(), target)
	}
	if err != nil {
		os.Remove(tmp.Name())
		state = 2
		mu.Unlock()
		return fmt.Errorf("write %s: %w", path, err)
	}
	state = 1
	mu.Unlock()
	if d, derr := os.Open(dir); derr == nil {
		d.Sync() // best effort: make the rename durable
		d.Close()
	}
	return nil
}

// writeDirect writes into a device or FIFO in place.
func writeDirect(ctx context.Context, target, path string, fill func(io.Writer) error) error {
	f, err := os.OpenFile(target, os.O_WRONLY, 0)
	if err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	if err := fill(&ctxWriter{ctx: ctx, w: f}); err != nil {
		f.Close()
		return err
	}
	if err := f.Close(); err != nil {
		return fmt.Errorf("write %s: %w", path, err)
	}
	return nil
}

// Resolve returns the file path names once symbolic links are followed.
// A link whose target does not exist yet resolves to that target, so the
// new file appears where the link points.
func Resolve(path string) (string, error) {
	for range 40 {
		st, err := os.Lstat(path)
		if err != nil || st.Mode()&fs.ModeSymlink == 0 {
			return path, nil
		}
		dest, err := os.Readlink(path)
		if err != nil {
			return "", fmt.Errorf("write %s: %w", path, err)
		}
		if !filepath.IsAbs(dest) {
			dest = filepath.Join(filepath.Dir(path), dest)
		}
		path = dest
	}
	return "", fmt.Errorf("write %s: too many levels of symbolic links", path)
}

// CleanStale removes temporary files in dir that Write made in a process
// that is no longer running (killed before it could clean up). Files of
// live processes, and anything not named by Write, are left alone. Errors
// are ignored: cleaning is best effort.
func CleanStale(dir string) {
	ents, err := os.ReadDir(dir)
	if err != nil {
		return
	}
	self := os.Getpid()
	for _, e := range ents {
		rest, ok := strings.CutPrefix(e.Name(), TempPrefix)
		if !ok || !e.Type().IsRegular() {
			continue
		}
		pidText, _, ok := strings.Cut(rest, "-")
		pid, err := strconv.Atoi(pidText)
		if !ok || err != nil || pid <= 0 || pid == self || processAlive(pid) {
			continue
		}
		os.Remove(filepath.Join(dir, e.Name()))
	}
}

// SameFile reports whether out names the same file as in (after following
// symbolic links; hard links count). A path that does not exist is the
// same as nothing.
func SameFile(out, in string) bool {
	a, err := os.Stat(out)
	if err != nil {
		return false
	}
	b, err := os.Stat(in)
	if err != nil {
		return false
	}
	return os.SameFile(a, b)
}

// ctxWriter fails writes once ctx is done, so a cancelled run stops
// writing.
type ctxWriter struct {
	ctx context.Context
	w   io.Writer
}

func (c *ctxWriter) Write(p []byte) (int, error) {
	if err := c.ctx.Err(); err != nil {
		return 0, err
	}
	return c.w.Write(p)
}
