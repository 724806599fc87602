// Package quantity is the one place turnwise reads and prints physical
// quantities. Flags, job, stock and circuit files take numbers with unit
// suffixes ("48nH", "0.048µH", "25pF", "145MHz", "4.5mm", "0.177in",
// "1/4in", "3%", "20C"); tables and build sheets print them with a chosen
// number of significant figures and an SI prefix (FormatEng), lengths in
// one display unit per run (LengthFormat: mm or inches), turns in quarter
// turns as a builder says them (FormatTurns: "5¼"); messages print them a
// little more loosely (message.go: FormatShort, "145 MHz").
//
// A lowercase m before Hz is read as mega (nobody means millihertz); a bare
// prefix is refused with the likely meaning ("145M: did you mean 145MHz?").
// Errors are *Error values naming what was wanted and how to fix it.
//
// It imports the standard library and gonum/unit only, so every other
// package (the coil model included) may use it.
//
// References:
//   - BIPM, The International System of Units (SI), 9th edition, 2019
//     (prefixes and unit symbols).
//   - The international yard and pound agreement, 1959: 1 in = 25.4 mm
//     exactly.
package quantity
