package coil

// Mounting is how a coil's ends meet the rest of the circuit, which sets
// its self-resonance (srf.go): one end grounded (on the chassis or a
// bypassed rail) or both ends floating (between two live nodes).
type Mounting int

const (
	Grounded Mounting = iota
	Floating
)

func (m Mounting) String() string {
	if m == Floating {
		return "floating"
	}
	return "grounded"
}

// ParseMounting maps "grounded" (or "" ) and "floating" to a Mounting.
func ParseMounting(s string) (Mounting, error) {
	switch s {
	case "", "grounded", "ground":
		return Grounded, nil
	case "floating", "float":
		return Floating, nil
	}
	return Grounded, inputErrorf("mounting", "%q is not a mounting: use grounded (one end on ground) or floating (both ends live)", s)
}

// Description says what the mounting is, for messages and sheets.
func (m Mounting) Description() string {
	if m == Floating {
		return "both ends floating"
	}
	return "one end grounded"
}
