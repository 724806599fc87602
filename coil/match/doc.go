// Package match maps which loads a coupler can bring to its port's
// reference impedance, with which settings of its adjustable capacitors,
// how much power the coupler loses doing so, and what voltage and current
// each part sees at a stated power.
//
// # The map
//
// A coupler is a circuit.Network with one port (the transmitter side),
// a load node (the antenna side; the load returns to ground) and one to
// three adjustable capacitors with their ranges. For each frequency and
// each load R + jX on a grid (resistance log-spaced, reactance evenly
// spaced) Map searches the capacitors' settings for the least reflection
// at port 1: a grid over the dial positions (logarithmic in capacitance),
// then gonum/optimize's Nelder–Mead (Lagarias et al. 1998) from the
// grid's best local minima. A load is matched when some setting found
// gives an SWR at most the limit; when several distinct settings do (an
// L-network's two branches, a tapped tank's low- and high-Q settings),
// the one with least loss is reported. Every match reported was solved by
// the circuit solver at the settings reported; what the search does not
// guarantee is stated in solve.go.
//
// At each frequency the wound coils are evaluated once (coil.ModelAt,
// coil.Tap) and enter the network as coupled inductors with their
// resistance and self-capacitance, exactly as the circuit solver stamps
// them; only the capacitors and the load change inside the search.
//
// # Loss and stress
//
// Loss is each part's dissipated power over the power into port 1 (the
// coil's from its R_ac at f, a capacitor's from its stated Q or ESR);
// efficiency is the load's share. At a stated power P into port 1 each
// voltage and current scales by √(P/P_in); peak values are the phasor
// magnitudes, RMS values peak/√2. Capacitor ratings are compared with the
// peak voltage; a coil's dissipation with the heating rule in heat.go.
//
// # Tap choice
//
// ChooseTap maps the same grid for every quarter-turn tap of one coil and
// ranks the taps by the matched share over the listed frequencies.
//
// References:
//   - J. C. Lagarias, J. A. Reeds, M. H. Wright, P. E. Wright,
//     "Convergence properties of the Nelder–Mead simplex method in low
//     dimensions", SIAM J. Optimization 9(1):112–147, 1998.
//   - C. Bowick, RF Circuit Design, 2nd ed., Newnes, 2008, ch. 4
//     (the L network: Q = √(R_high/R_low − 1), X_s = Q·R_low,
//     X_p = R_high/Q).
//   - F. P. Incropera, D. P. DeWitt, Fundamentals of Heat and Mass
//     Transfer, Wiley, Table 1.1 (typical convection coefficients).
package match
