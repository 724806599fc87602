package coil

import (
	"math"

	"gonum.org/v1/gonum/unit"
)

// ResonantFrequency is the resonance of an ideal L and C: 1/(2π√(LC)).
func ResonantFrequency(l unit.Inductance, c unit.Capacitance) unit.Frequency {
	return unit.Frequency(1 / (twoPi * math.Sqrt(float64(l)*float64(c))))
}

// InductanceForResonance is the L that resonates with c at f: 1/(ω²C).
func InductanceForResonance(f unit.Frequency, c unit.Capacitance) unit.Inductance {
	w := twoPi * float64(f)
	return unit.Inductance(1 / (w * w * float64(c)))
}

// CapacitanceForResonance is the C that resonates with l at f: 1/(ω²L).
func CapacitanceForResonance(f unit.Frequency, l unit.Inductance) unit.Capacitance {
	w := twoPi * float64(f)
	return unit.Capacitance(1 / (w * w * float64(l)))
}
