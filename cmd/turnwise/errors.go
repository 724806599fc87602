package main

import "turnwise/internal/spec"

// The bad-input errors live with the glue that returns them
// (internal/spec); exitCode maps both to exit 2.
type (
	usageError = spec.UsageError
	flagError  = spec.FlagError
)

func usageErrorf(format string, args ...any) error { return spec.Usagef(format, args...) }
