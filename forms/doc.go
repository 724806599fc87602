// Package forms reads what turnwise users write and what ships with it:
// quantities with unit suffixes, wire gauges, the built-in catalogs of wire,
// mandrels and formers, and the user's stock file.
//
// # Quantities
//
// Every size, value and frequency carries its unit; a bare number is refused
// rather than guessed. Results are gonum unit types holding SI values:
//
//	quantity.ParseLength("0.177in")     → 0.0044958 m
//	quantity.ParseLength("1-1/4in")     → 0.03175 m
//	quantity.ParseInductance("0.048µH") → 4.8e-08 H
//	quantity.ParseFrequency("7.1mhz")   → 7.1e+06 Hz (lowercase m is mega here)
//	quantity.ParsePercent("3.1%")       → 0.031
//
// # Catalogs
//
// The built-in catalog is parsed from CSV files embedded from data/, each row
// naming its source. Wire rows: AWG 0000–40 from the ASTM B258 formula, SWG
// 7/0–50 from the BS 3737 table, metric enamelled sizes 0.05–3.15 mm, and a few
// bare tinned and silver-plated sizes. Each size appears once as copper with
// grade 1 enamel where the enamel table covers it (0.05–3.15 mm), else bare.
// Mandrels are drill sizes, formers are PVC pipe outside diameters.
//
// # Stock file
//
// A TOML file of the user's own wire, mandrels, formers and springback
// calibrations; StockTemplate shows the format. LoadStock reports every
// problem as a *ParseError with its line. The toml package gives lines for
// syntax errors only, so forms finds the lines of keys by scanning the text
// itself (tomlindex.go).
//
// # Job file
//
// A TOML file describing a batch of coils for build sheets (LoadJob): a
// title, paper, units, the stock to use, and [[coil]] sections that hold
// either a fixed winding (the same keys as predict's flags) or a design
// target (design's keys), with an optional tap and two-gang span. Unknown
// keys are errors, and every error carries its line.
//
// # Other inputs
//
// Band lists (LoadBands, ParseBand) and measured capacitor laws
// (LoadGangTable) for the two-gang span; AppendCalibration and AppendStock
// add springback calibrations to a stock file's text without disturbing its
// comments or layout (the caller writes the file).
//
// # References
//
// Values marked "from memory" were recalled, not read from the standard; the
// data files say so row by row.
//
//   - ASTM B258, Standard Specification for Standard Nominal Diameters and
//     Cross-Sectional Areas of AWG Sizes of Solid Round Wires Used as
//     Electrical Conductors. The defining formula d = 0.005 in · 92^((36−n)/39)
//     is used directly; test values of the rounded table are from memory.
//   - BS 3737, Metric values for the Imperial Standard Wire Gauge (SWG).
//     data/swg.csv, from memory.
//   - IEC 60317-0-1, Specifications for particular types of winding wires —
//     Part 0-1: General requirements — Enamelled round copper wire. Grade 1
//     and 2 maximum overall diameters in data/enamel.csv and the nominal size
//     series in data/wire.csv, from memory. Grade 3 is not tabulated.
//   - ISO 3, Preferred numbers — Series of preferred numbers (Renard R20, R40),
//     the size series of data/wire.csv.
//   - ISO 235, Parallel shank jobber and stub series drills and Morse taper
//     shank drills: metric drill sizes in data/mandrels.csv (series from memory).
//   - ASME B94.11M, Twist drills: fractional-inch sizes in data/mandrels.csv
//     (series from memory).
//   - ASTM D1785, Poly(Vinyl Chloride) (PVC) Plastic Pipe, Schedules 40, 80 and
//     120: schedule 40 outside diameters in data/formers.csv, from memory.
//   - EN 1452-2, Plastics piping systems for water supply — PVC-U — Part 2:
//     Pipes: nominal outside diameters in data/formers.csv, from memory.
//   - The international inch of 1959: 1 in = 25.4 mm exactly.
package forms
