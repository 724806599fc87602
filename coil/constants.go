package coil

import "math"

// Physical constants, SI.
const (
	// Mu0 is the vacuum permeability, CODATA 2018: 1.25663706212(19)e-6 N/A².
	// Defined here rather than via gonum/unit/constant, whose dimensions for
	// μ0 are wrong in the vendored snapshot.
	Mu0 = 1.25663706212e-6

	// SpeedOfLight in vacuum, m/s (exact, SI 2019).
	SpeedOfLight = 299792458.0

	// CopperResistivity20 is the IACS resistivity of annealed copper at
	// 20 °C, Ω·m.
	CopperResistivity20 = 1.7241e-8

	// CopperTempCoeff is the IACS temperature coefficient of resistance at
	// 20 °C, 1/K.
	CopperTempCoeff = 0.00393

	// CopperDensity is the IACS density of copper, kg/m³.
	CopperDensity = 8890.0

	// roomKelvin is 20 °C, the reference temperature of the IACS values.
	roomKelvin = 293.15
)

// twoPi saves a multiply in hot paths.
const twoPi = 2 * math.Pi
