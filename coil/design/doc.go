// Package design searches a stock of supports (mandrels, formers) and
// wires for the air-wound single-layer coils that meet a target
// inductance (or a resonance with a given capacitance) under the
// builder's constraints, and ranks them by Q, self-resonance, size, copper
// and ease of winding.
//
// It owns the search only: the target and constraints (Target,
// Constraints, Support, WireOption, SpringbackCalibration), the
// hand-winding rules (WireSuits), the branch-and-bound over pairs, turns
// and pitch, the score, and the words of an infeasible request. Every
// physical value comes from package coil: the inner loop calls the same
// allocation-free functions as coil.Predict (coil.NewCore,
// coil.Core.SelfResonance, coil.Core.LossAt), its bounds read the model's
// tables through coil.SelfCapacitanceMinOver and coil.ProximityRow, and every
// candidate returned is re-evaluated with coil.Predict.
//
// Practitioner's targets sit on top of the search (band.go, tapped.go):
// SearchBand, a band tuned by a fixed capacitor and a trimmer (every
// candidate re-predicted at both edges, the trimmer settings reported,
// 10 % of the trimmer's swing kept free at each end, common practice);
// WithMinQ, a floor on Q; AddTaps, the tap of every candidate for an
// impedance ratio or for a load and a loaded Q (coil.TapForLoad), with a
// link winding and a capacitive divider as alternatives.
//
// References:
//   - H. Nagaoka, "The inductance coefficients of solenoids", J. Coll. Sci.
//     Tokyo 27 (1909): the current-sheet inductance.
//   - E. B. Rosa, "The self and mutual inductances of linear conductors",
//     Bull. Bureau of Standards 4 (1908): the round-wire corrections.
//   - R. G. Medhurst, "H.F. resistance and self-capacitance of single-layer
//     solenoids", Wireless Engineer 24 (1947): self-capacitance and the
//     proximity factor, whose tables bound the search.
//   - J. D. Kraus, Antennas, 2nd ed. (1988): small-loop radiation resistance.
//   - A. H. Land and A. G. Doig, "An automatic method of solving discrete
//     programming problems", Econometrica 28 (1960): branch and bound.
//   - F. E. Terman, Radio Engineers' Handbook, McGraw-Hill, 1943, sec. 3
//     (from memory): a load R_s at a tap of voltage ratio n appears as
//     R_s/n² across the tank; loaded Q and bandwidth f/Q.
//   - Hand-winding and self-supporting wire rules: common practice.
package design
