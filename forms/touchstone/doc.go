// Package touchstone reads and writes Touchstone network-parameter files:
// the open text format network analysers and circuit tools use for one-
// and two-port S, Y and Z parameters against frequency (.s1p, .s2p).
//
// The writer produces version 1.1 files: an option line
//
//	# Hz S RI R 50
//
// then one line per frequency, ascending: the frequency and the
// parameters as real/imaginary pairs, for two ports in the order
// N11 N21 N12 N22 that version 1.1 prescribes. Comment lines start with
// "!".
//
// References:
//   - EIA/IBIS Open Forum, Touchstone File Format Specification, version
//     1.1 (2002) and version 2.0 (2009).
package touchstone
