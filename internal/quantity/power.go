package quantity

// Power, for the power a transmitter puts into a coupler.

var powerDim = &dimension{
	want: "power", article: "a power",
	eg:    "100W or 1.5kW",
	such:  "100W",
	units: "mW, W or kW",
	bases: []base{{symbol: "W", names: []string{"w"}, factor: 1, prefixes: "mk"}},
}

// ParsePower reads a power such as "100W", "1.5kW" or "500mW" and returns
// watts. A negative number is returned as read; the caller refuses it.
func ParsePower(s string) (float64, error) { return powerDim.parse(s) }
