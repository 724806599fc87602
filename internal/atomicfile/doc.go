// Package atomicfile owns how turnwise writes and updates files so that no
// run loses data: Write puts a complete file in place or leaves the old one
// untouched (temporary file in the same directory, fsync, rename), follows
// a symbolic link to the file it names, writes straight into a device or
// FIFO instead of replacing it, removes its temporary file when the context
// is cancelled (Ctrl-C, SIGTERM) and clears stale temporary files that a
// killed turnwise left behind; Lock takes an advisory exclusive lock for a
// read-modify-write of a shared file (the stock file); SameFile tells
// whether an output path names one of the inputs.
//
// It never prints and never exits. Errors name the path; callers add the
// flag it came from.
//
// References:
//   - POSIX.1-2017, rename(2): replacing a name atomically within one file system.
//   - flock(2), Linux man-pages 6.x: advisory whole-file locks, released on close.
//   - Microsoft, LockFileEx function (fileapi.h), Win32 API documentation.
package atomicfile
