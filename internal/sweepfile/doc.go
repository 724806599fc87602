// Package sweepfile is the glue between a network analyser's Touchstone
// files (forms/touchstone) and the sweep fit (coil/sweep): it reads the
// coil's sweep and the jig's open and short sweeps, converts each to the
// coil's impedance with the fixture, and applies the open/short
// correction. It also holds the generator of the demo sweep in testdata
// (demo_test.go), so the demo's provenance is code.
//
// Errors keep their kind: a malformed file is a *touchstone.ParseError
// wrapped with the file name; a mismatch of fixture and file is a
// *coil.InputError.
//
// # References
//
//   - EIA/IBIS Open Forum, Touchstone File Format Specification, versions
//     1.1 (2002) and 2.0 (2009).
package sweepfile
