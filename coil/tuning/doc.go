// Package tuning solves a tapped coil on a two-gang variable capacitor:
// section A from the top of the coil to ground, section B from the tap to
// ground, on one shaft. It owns the capacitor laws (GangSection), the
// two-node circuit's resonances (TwoNodeResonances), the span across the
// dial with band coverage, harmonic coincidences and gap advice (Solve),
// the choice of tap, and optionally pitch, for a list of bands
// (ChooseTap), the choice of turns, pitch and tap together (ChooseCoil,
// choosecoil.go), harmonics of any order with the dial stretches where the
// ranges track an integer ratio, and the bandspread warning (harmonics.go;
// default 5th harmonic, 2 % tracking tolerance, 3 % of the dial per band:
// common practice).
//
// The coil itself comes from package coil: its sections at the tap
// (coil.Tap: L_a, L_b, M), its self-capacitance and Q (coil.Predict).
// tuning never prints and returns *coil.InputError for bad input and
// errors wrapping coil.ErrInfeasible when no tap meets a request.
//
// # The two-node circuit
//
// With node voltages v = (v_top, v_tap), the capacitance to ground at
// each node C = diag(C_top, C_tap) and the inverse inductance matrix of
// the coupled sections mapped onto the nodes, Γ, the natural frequencies
// satisfy the symmetric-definite generalized eigenproblem
//
//	Γ·x = ω²·C·x,   det(Γ − ω²·C) = 0
//
// which for two nodes is a quadratic in ω², solved in closed form with the
// cancellation-free form of the quadratic formula (TwoNodeResonances).
// The coil's equivalent self-capacitance (coil.Predict: the C that resonates
// it at its helical-line SRF) is put across the whole coil.
//
// # Dial convention
//
// A dial setting runs from 0, plates fully open (the top of both ranges),
// to 1, fully meshed.
//
// References:
//
//   - G. H. Golub and C. F. Van Loan, Matrix Computations, 4th ed., Johns
//     Hopkins University Press, 2013, §8.7 (the symmetric-definite
//     generalized eigenproblem).
//   - W. H. Press, S. A. Teukolsky, W. T. Vetterling and B. P. Flannery,
//     Numerical Recipes, 3rd ed., Cambridge University Press, 2007, §5.6
//     (roots of a quadratic without cancellation).
//   - F. E. Terman, Radio Engineers' Handbook, McGraw-Hill, 1943, sec. 3
//     (coupled circuits; the −3 dB bandwidth f/Q of a single tuned circuit).
//   - R. G. Medhurst, "H.F. resistance and self-capacitance of single-layer
//     solenoids", Wireless Engineer 24, pp. 35–43 and 80–92, 1947.
package tuning
