// Package trim turns a measurement of a wound coil into what to change to
// land on target. It owns the measure-and-trim step of building a coil:
//
//   - the measurement forms (an inductance meter, one resonance with a
//     known capacitor, the resonance in the coil's own circuit, the
//     two-capacitor method) reduced to one inductance with its uncertainty
//     (Measurement, Reading);
//   - the springback fit that makes coil's model agree with the reading,
//     with the band that follows from the instruments' tolerances
//     (Calibrate, Calibration);
//   - the correction in the order a builder prefers: leave it, squeeze or
//     spread to a new outside length inside the window, else add or remove
//     quarter turns (Correct, Correction), and what the next reading made
//     the same way should show (ExpectedReading);
//   - tapped coils: per-section readings and where the tap goes, keeping a
//     measured offset of the ratio from the model (CalibrateSections,
//     MoveTap, PlanTap);
//   - the rules that say what a result means for the builder: when a coil
//     is on target, when a fitted springback is unusual for its support,
//     when a miss is smaller than the reading's own uncertainty, when a
//     section departs from the rest of the coil (Plan, Result, Finding and
//     the thresholds beside it). Callers word the findings; they decide
//     nothing about them.
//
// The model of one coil (Predict, Tap, Window, LengthPerPercent) belongs
// to package coil; trim only asks it questions. Like coil, trim never
// prints, reads files or exits; bad input is a *coil.InputError naming the
// field, and a target no change reaches wraps coil.ErrInfeasible.
//
// # References
//
//   - F. E. Terman, Radio Engineers' Handbook, McGraw-Hill, 1943: the
//     distributed capacitance of coils and its measurement with two
//     capacitors (from memory), the basis of the two-capacitor line.
//   - R. G. Medhurst, "H.F. resistance and self-capacitance of single-layer
//     solenoids", Wireless Engineer 24, 35–43 and 80–92, 1947: the
//     self-capacitance the calibrated model compares with (through coil).
//   - Fixture allowance (the meter's reading with its clips shorted), the
//     loosest settable pitch, caliper resolution of an outside length and
//     the typical springback of wire released from a mandrel: common
//     practice.
package trim
