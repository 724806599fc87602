// Package circuit computes what a network of coils, capacitors, inductors
// and resistors does: its impedance and scattering parameters at any
// frequency, and its resonances found exactly rather than sampled.
//
// # Model
//
// Modified nodal analysis (Ho, Ruehli and Brennan 1975) in complex
// arithmetic at one frequency: an unknown for every node voltage (ground
// is node 0 and is not an unknown) and for every inductive branch current,
// so that mutual inductance enters as an off-diagonal term of the branch
// equations:
//
//	Σ_k Y_ik·V_k + Σ_b A_ib·I_b = J_i           (Kirchhoff's current law)
//	V_p(b) − V_q(b) − (R_b + jωL_b)·I_b − Σ_c jωM_bc·I_c = 0
//
// A wound coil enters with the frequency-dependent model of package coil
// at each frequency (coil.ModelAt): the winding's L and R at f with the
// skin and proximity effects, its self-capacitance across the winding, and
// the leads in series. A tapped coil is two coupled sections with the
// mutual inductance of the tap model (coil.Tap).
//
// Port impedances come from injecting a unit current at each port with the
// other ports open (the Z matrix); S parameters follow from
// S = (z − 1)(z + 1)⁻¹ with z the Z matrix normalised to the ports'
// reference impedances.
//
// # Resonances
//
// The natural frequencies of the lossless network (resistors and port
// terminations removed, each coil's inductance taken at the frequency being
// sought) solve the generalized symmetric eigenproblem
//
//	Γ·v = ω²·C·v,   Γ = A·L⁻¹·Aᵀ
//
// with C the nodal capacitance matrix. It is reduced to a standard
// symmetric one through the Cholesky factor of Γ/ω₀² + C and solved with
// gonum/mat's EigenSym. Modes seen at port 1 with the port open are its
// parallel resonances; with port 1 shorted, its series resonances. Each is
// then refined with every loss in place to the maximum (parallel) or
// minimum (series) of |Z| at port 1, and its Q read from the −3 dB points.
//
// References:
//   - C.-W. Ho, A. E. Ruehli, P. A. Brennan, "The modified nodal approach to
//     network analysis", IEEE Trans. Circuits and Systems 22(6):504–509, 1975.
//   - K. Kurokawa, "Power waves and the scattering matrix", IEEE Trans.
//     Microwave Theory and Techniques 13(2):194–202, 1965.
//   - G. H. Golub, C. F. Van Loan, Matrix Computations, 4th ed., 2013,
//     §8.7 (the symmetric-definite generalized eigenproblem).
package circuit
