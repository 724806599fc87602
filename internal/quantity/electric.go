package quantity

// Resistance and voltage, for circuit files: a part's series resistance,
// a port's reference impedance, a capacitor's voltage rating.

var (
	resistanceDim = &dimension{
		want: "resistance", article: "a resistance",
		eg:    "50ohm or 0.05ohm",
		such:  "50ohm",
		units: "mohm, ohm, kohm or Mohm (Ω also)",
		bases: []base{{symbol: "ohm", names: []string{"ohm", "ohms", "Ω", "Ω"}, factor: 1, prefixes: "mkM"}},
	}
	voltageDim = &dimension{
		want: "voltage", article: "a voltage",
		eg:    "500V or 1kV",
		such:  "1kV",
		units: "mV, V or kV",
		bases: []base{{symbol: "V", names: []string{"v"}, factor: 1, prefixes: "mk"}},
	}
)

// ParseResistance reads a resistance such as "50ohm", "0.05ohm", "4.7kohm"
// or "50Ω" and returns ohms.
func ParseResistance(s string) (float64, error) { return resistanceDim.parse(s) }

// ParseVoltage reads a voltage such as "500V", "1kV" or "350mV" and
// returns volts.
func ParseVoltage(s string) (float64, error) { return voltageDim.parse(s) }
