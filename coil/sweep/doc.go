// Package sweep turns a network analyser's sweep of a wound coil into the
// coil's equivalent model. It owns three steps:
//
//   - the fixture: how the coil was connected, and the impedance that
//     follows from the measured S parameters (Fixture, Impedance):
//
//     reflection (one port, coil from port to ground)  Z = Z0·(1+S11)/(1−S11)
//     series (two ports, coil between them)             Z = 2·Z0·(1−S21)/S21
//     shunt (two ports, coil from the line to ground)   Z = Z0·S21/(2·(1−S21))
//
//   - open/short correction of a test jig from two more sweeps of the jig
//     alone, modelled as a series impedance Zs and a shunt admittance Yo:
//
//     Z = (Zm − Zs) / (1 − (Zm − Zs)·Yo),  Zs = Z_short, Yo = 1/(Z_open − Z_short)
//
//   - the least-squares fit (gonum/optimize) of the equivalent model
//
//     Z(f) = jω·L_lead + (R(f) + jω·L) ∥ 1/(jω·C),  R(f) = R_dc + k·√f
//
//     to the corrected impedance, over the points below 0.8 of the
//     self-resonance (or a range the caller gives), weighted so that each
//     residual is the error in the measured S parameter to first order
//     (the analyser's noise is about equal across S). The parameters'
//     uncertainties come from the Jacobian (covariance s²·(JᵀJ)⁻¹), and
//     derived figures (SRF, Q, L at f) carry theirs by first-order
//     propagation. The self-resonance is read from the data where the
//     sweep crosses it (a local line through Im Y = 0), else from the fit.
//
// Like coil, sweep never prints or reads files: callers hand it S
// parameters (package forms/touchstone reads them) and render the Fit.
//
// # References
//
//   - EIA/IBIS Open Forum, Touchstone File Format Specification, version
//     2.0, 2009: what the S, Y and Z parameters in a sweep mean.
//   - D. M. Pozar, Microwave Engineering, 4th ed., Wiley, 2012, ch. 4: S
//     parameters of a series and a shunt impedance between two ports
//     (S21 = 2Z0/(2Z0+Z), S21 = 2Z/(2Z+Z0)); from memory.
//   - Keysight Technologies, Impedance Measurement Handbook, 6th ed., 2016:
//     open/short compensation of a test fixture; from memory.
//   - R. G. Medhurst, "H.F. resistance and self-capacitance of single-layer
//     solenoids", Wireless Engineer 24, 1947: the parallel self-capacitance
//     of the equivalent circuit.
//   - W. H. Press et al., Numerical Recipes, 3rd ed., Cambridge, 2007,
//     §15.5: nonlinear least squares and the covariance of the fitted
//     parameters from the Jacobian; from memory.
package sweep
