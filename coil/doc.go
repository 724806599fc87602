// Package coil models an air-cored, single-layer solenoid wound from round
// wire: its inductance, self-capacitance, self-resonance, losses and Q, and
// the numbers a builder needs to wind it.
//
// The package is pure computation. It never prints, reads files or exits;
// bad input comes back as an *InputError naming the offending field.
//
// # Units
//
// Every exported quantity is a gonum unit type holding SI base units
// (unit.Length in metres, unit.Inductance in henries, ...). Internal
// float64 values carry their unit in the name (pitchM, lH).
//
// # Model
//
// The wire-centre diameter is D = D_f·(1+s) + d_o for a mandrel or former of
// outside diameter D_f, springback s and insulated wire diameter d_o. The
// current sheet has Rosa's length l = N·p.
//
//	L_sheet = μ0·π·(D/2)²·N²/l · K_N       Nagaoka's coefficient K_N, exact
//	L_coil  = L_sheet − μ0·(D/2)·N·(k_s + k_m)   Rosa's round-wire correction
//	k_s     = 3/2 − φ/4 − ln(2p/d)          φ = internal-inductance fraction
//	k_m     = Rosa's mutual term (asymptotic series in N)
//
// φ is 1 at DC (Rosa's 5/4 − ln(2p/d)) and falls towards 2δ/r as the skin
// depth δ shrinks against the wire radius r; it comes from the exact Bessel
// solution for the internal impedance of a round wire. Two straight leads of
// the same wire add their own inductance at the terminals. The
// self-resonance of both mountings (one end grounded: quarter-wave-like;
// both ends floating: half-wave-like) comes from the coil as a helical
// transmission line (srf.go: sheath helix with an end correction and a
// slow correction in ln(p/d), ln(p/d)·ln(l/D) and D/l (D/(N·l) floating) per mounting, five
// constants each, calibrated against NEC-2; uncertainty from a
// leave-one-out check, 4 % grounded and 8 % floating); the equivalent self-capacitance is the C that resonates
// the winding at its mounting's SRF. The effective inductance and Q at the
// operating frequency follow from the lumped model (leads in series with
// the coil, the coil in parallel with that self-capacitance). Against a
// helix Neumann integral (the tests) the inductance holds to 0.2 % for
// p ≤ D/20 and 1 % to D/8; beyond D/8 Rosa's rings fall low (2–13 % at
// D/2) and the prediction warns: no pitch correction yet.
//
// Losses: IACS copper with its temperature coefficient, skin effect from
// the same Bessel solution, Medhurst's proximity factor for the winding,
// small-loop radiation resistance. Q carries a stated uncertainty band.
//
// The model assumes a coil in free space: no shield, no core, no lossy
// former; a wire shorter than about a tenth of a wavelength (Predict warns
// otherwise); and turns that are evenly spaced.
//
// # References
//
//   - S. Ramo, J. R. Whinnery and T. Van Duzer, Fields and Waves in
//     Communication Electronics, 3rd ed., Wiley 1994: surface impedance of a
//     layered (plated) conductor (plating.go).
//   - CRC Handbook of Chemistry and Physics, "Electrical resistivity of pure
//     metals": tin and silver at 20 °C (plating.go).
//   - H. Nagaoka, "The inductance coefficients of solenoids", Journal of the
//     College of Science, Imperial University of Tokyo, 27(6), 1909.
//   - E. B. Rosa, "The self and mutual inductances of linear conductors" and
//     "On the geometrical mean distances of rectangular areas and the
//     calculation of self-inductance", Bulletin of the Bureau of Standards
//     4(2), 1908 (round-wire correction first in Bull. BS 2(2), 1906).
//   - E. B. Rosa and F. W. Grover, "Formulas and tables for the calculation of
//     mutual and self-inductance", Bulletin of the Bureau of Standards 8(1),
//     1912 (Nagaoka table; Rosa's A and B tables).
//   - F. W. Grover, Inductance Calculations, Van Nostrand, 1946 (Dover 2004):
//     also the Neumann formula for the mutual inductance of two filaments
//     (ch. 1) and the straight round wire's self-inductance with its
//     geometric mean distance (ch. 2, 5), the parts of the helix Neumann
//     integral that checks the steep-pitch correction (helixpitch.go,
//     helix_neumann_test.go). The correction's remainder table
//     (helixpitch_table.go) is generated from that integral with
//     gonum/integrate/quad by `go test -tags helixtable -run
//     TestHelixPitchTable ./coil`.
//   - H. A. Wheeler, "Simple inductance formulas for radio coils", Proc. IRE
//     16(10), 1398–1400, 1928.
//   - R. G. Medhurst, "H.F. resistance and self-capacitance of single-layer
//     solenoids", Wireless Engineer 24, 35–43 and 80–92, 1947.
//   - H. A. Wheeler, "Formulas for the skin effect", Proc. IRE 30(9),
//     412–424, 1942.
//   - S. Ramo, J. R. Whinnery, T. Van Duzer, Fields and Waves in
//     Communication Electronics, 3rd ed., Wiley, 1994, §5.6 (internal
//     impedance of a round wire).
//   - F. E. Terman, Radio Engineers' Handbook, McGraw-Hill, 1943 (apparent
//     inductance and Q near self-resonance).
//   - J. D. Kraus, Antennas, 2nd ed., McGraw-Hill, 1988 (small-loop
//     radiation resistance).
//   - International Annealed Copper Standard, NBS 1914 (resistivity
//     1.7241e-8 Ω·m at 20 °C, temperature coefficient 0.00393 /K, density
//     8890 kg/m³).
//   - CODATA 2018 recommended values (μ0).
//   - J. C. Maxwell, A Treatise on Electricity and Magnetism, 1873, §701–705
//     (mutual inductance of coaxial circles; thin-ring self-inductance), used
//     for tapped sections and partial turns.
//   - R. Ollendorff, Die Grundlagen der Hochfrequenztechnik, Springer, 1926
//     (the sheath helix: a cylinder conducting only along the winding).
//   - S. A. Schelkunoff, Electromagnetic Waves, Van Nostrand, 1943 (the
//     helical line's propagation constant).
//   - A. G. Kandoian and W. Sichak, "Wide-frequency-range tuned helical
//     antennas and circuits", Electrical Communication 30, 294–299, 1953
//     (closed-form velocity on a helical line).
//   - S. Sensiper, "Electromagnetic wave propagation on helical structures",
//     Proc. IRE 43(2), 149–161, 1955; J. R. Pierce, Traveling-Wave Tubes,
//     Van Nostrand, 1950, ch. 3 (sheath-helix L′ and C′ with I₁K₁ and I₀K₀).
//   - M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions,
//     1964, 9.8.1–9.8.8 (modified Bessel functions, bessel.go).
//   - G. J. Burke and A. J. Poggio, Numerical Electromagnetics Code (NEC-2),
//     Lawrence Livermore National Laboratory, 1981 (the method-of-moments
//     reference for the SRF calibration, run as nec2c; testdata/nec/srf.csv).
//     for tapped sections and partial turns, and for link windings
//     (link.go: LoopMutual, LinkOver, summed over turn pairs).
//   - F. E. Terman, Radio Engineers' Handbook, 1943, sec. 3 (from memory):
//     a load R_s at a tap of voltage ratio n loads the tank as R_s/n² in
//     parallel (loading.go: LoadedQ, TapForLoad; a quarter-turn tap is
//     accepted within ±10 % of the impedance ratio, common practice).
//   - R. M. Foster, "A reactance theorem", Bell System Technical Journal 3,
//     259–267, 1924 (the two-gang circuit's resonances alternate with its
//     zeros).
//
// # Beyond the single coil
//
// Tapped coils (tap.go) split the winding into two coaxial coils from the
// same model, with M = (L − L_a − L_b)/2. The two-gang circuit (gang.go,
// span.go) solves the generalized eigenproblem of the two-node network with
// gonum/mat, the coil's self-capacitance across the whole coil. A harmonic
// coincidence is a dial setting where the 2nd or 3rd harmonic of the low
// range falls inside the high range's passband (f/Q_loaded); the dial is
// scanned at 0.25 % steps and every sign change of m·f_low − f_high is
// bisected, so a crossing is found even when the passband is narrower than
// a step. ChooseTap (choosetap.go) scores every quarter-turn tap with the
// same scan. The design search (package coil/design) inverts the model: it starts
// from Wheeler's closed form solved for the turns, brackets the pitch that
// hits the target, and prunes supports, wires and turns by bounds on the
// score. Trim (trim*.go) fits the springback that makes the model agree
// with a measurement (the two-capacitor method is common practice; Terman
// 1943 describes it) and corrects pitch, turns or tap.
package coil
