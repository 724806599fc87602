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
// "!". Y and Z are written normalised to the reference, as version 1.1
// prescribes.
//
// Read takes version 1.1 files (option line "# <Hz|kHz|MHz|GHz> <S|Y|Z>
// <RI|MA|DB> R <ohms>", defaults GHz S MA R 50; "!" comments; any
// whitespace; two-port noise data skipped) and version 2.0 files with the
// keywords a one- or two-port file needs ([Version], [Number of Ports],
// [Two-Port Data Order], [Number of Frequencies], [Reference], [Matrix
// Format] Full, [Begin/End Information], [Network Data], [Noise Data],
// [End]). Errors are *ParseError naming the line and what is wrong there.
// ToS converts Y and Z data to S.
//
// References:
//   - EIA/IBIS Open Forum, Touchstone File Format Specification, version
//     1.1 (2002) and version 2.0 (2009).
package touchstone
