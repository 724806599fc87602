// Package sweepfile is the glue between a network analyser's Touchstone
// files (forms/touchstone) and the sweep fit (coil/sweep): it reads the
// coil's sweep and the jig's open and short sweeps, converts each to the
// coil's impedance with the fixture, and applies the open/short
// correction; Fit does all that and the fit from a Request (what the
// flags of fit and trim --sweep say), PlotFit draws the measurement with
// the fit and the model of the coil as wound (ModelZ: coil.ModelAt's
// equivalent as an impedance). It also holds the generator of the demo sweep in testdata
// (demo_test.go), so the demo's provenance is code.
//
// Errors keep their kind: a malformed file is a *touchstone.ParseError
// wrapped with the file name; a mismatch of fixture and file is a
// *coil.InputError.
//
// It imports coil, coil/*, forms, forms/*, internal/quantity and
// gonum/plot; never cmd or cobra.
//
// # References
//
//   - EIA/IBIS Open Forum, Touchstone File Format Specification, versions
//     1.1 (2002) and 2.0 (2009).
package sweepfile
