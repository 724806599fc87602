// Package thermal owns the temperature behaviour of a coil and of the
// circuits it sits in: the temperature coefficients of a coil's
// inductance and Q, the coefficients of capacitors by their class, the
// drift of a resonance, and the split of a tank capacitor into two
// standard parts that cancels the drift.
//
// # Coil
//
// The coefficients come from the coil model itself (package coil), by a
// central difference of ±1 K of the full model, each dimension following
// the material that sets it (Support.At):
//
//   - a self-supporting coil (slid off a mandrel): every dimension follows
//     the wire, so its low-frequency inductance, homogeneous of degree one
//     in length, has exactly the wire's coefficient;
//   - a coil wound tight on a former: the bore follows the former, the
//     wire's diameter and insulation follow copper, so the wire-centre
//     diameter D_f + d_o follows mostly the former; the pitch follows the
//     former (the turns ride its surface) or, with PitchFollowsWire, the
//     wire; touching turns always follow the wire;
//   - the leads follow the wire; the conductor's temperature moves with the
//     rest, so copper's resistivity (IACS, 0.00393/K) changes the skin depth
//     and with it the internal inductance left at f (Coefficients.Skin) and
//     the resistance and Q.
//
// The expansion of the former assumes the wire stays tight on it (a
// thermoplastic former may relax the winding after a few cycles; the model
// does not know).
//
// # Capacitors and resonances
//
// Ceramic class 1 dielectrics by their IEC 60384-8 names (C0G/NP0, P100,
// N033 … N4700) or EIA-198 codes (U2J …), with each class's tolerance;
// air-variable capacitors by a stated typical value; or a number. A simple
// tank drifts by d ln f = −½(d ln L + d ln C); a network (coil/circuit) by
// moving every part with its coefficient and solving its natural
// frequencies again. Compensation searches pairs of standard classes and
// E12 values for the split whose combined coefficient cancels the rest.
//
// # References
//
//   - IEC 60384-8, Fixed capacitors for use in electronic equipment – Part
//     8: Sectional specification – Fixed capacitors of ceramic dielectric,
//     Class 1 (temperature-coefficient classes; recalled from memory).
//   - EIA-198, Ceramic dielectric capacitors classes I, II, III and IV
//     (three-character class 1 codes; recalled from memory).
//   - IEC 60063, Preferred number series for resistors and capacitors (E12).
//   - International Annealed Copper Standard, NBS 1914 (0.00393/K).
//   - CRC Handbook of Chemistry and Physics, thermal expansion of the
//     elements (copper 16.5e-6/K; from memory).
//   - The coil model's own references (package coil): Nagaoka 1909, Rosa
//     1908, Medhurst 1947, Ramo, Whinnery & Van Duzer 1994 §5.6.
package thermal
