package main

import (
	"context"
	"fmt"
	"io"

	"turnwise/internal/atomicfile"
)

// writeOutput writes the output of fill to the file a flag named
// (internal/atomicfile: complete or nothing; a symlink's target; a device
// or FIFO written in place; no temporary file left on Ctrl-C). path "-"
// is stdout. An output that is one of the command's inputs is refused as
// bad input (exit 2) before anything is written; any failure to write is a
// runtime failure (exit 1). Errors start with the flag.
func writeOutput(ctx context.Context, flag, path string, inputs []string, stdout io.Writer, fill func(io.Writer) error) error {
	if path == "-" {
		return fill(stdout)
	}
	if err := checkNotInput(flag, path, inputs); err != nil {
		return err
	}
	if err := atomicfile.Write(ctx, path, atomicfile.Options{Perm: 0o644}, fill); err != nil {
		return fmt.Errorf("%s %w", flag, err)
	}
	return nil
}

// checkNotInput refuses an output path that names the same file as one of
// the inputs (after symlinks; hard links count): writing it would destroy
// the input.
func checkNotInput(flag, path string, inputs []string) error {
	for _, in := range inputs {
		if in != "" && in != "-" && atomicfile.SameFile(path, in) {
			return usageErrorf("%s %s is the input file %s: writing it would destroy the input; choose another output name", flag, path, in)
		}
	}
	return nil
}
