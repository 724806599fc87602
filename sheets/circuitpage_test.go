package sheets

import (
	"bytes"
	"math"
	"strings"
	"testing"
)

func demoCircuit() Circuit {
	c := Circuit{Title: "trap", Source: "trap.toml", TwoPort: true, LogX: true,
		Resonances: []CircuitResonance{{Frequency: 7.1e6, Kind: "series", Q: 80, Impedance: 17e3, Part: "Ctrap"}},
		Bands:      []CircuitBand{{Name: "40m", Low: 7.0e6, High: 7.2e6, Serving: 7.1e6}},
		Warnings:   []string{"a warning"}}
	for i := 0; i <= 100; i++ {
		f := 1e6 * math.Pow(30, float64(i)/100)
		c.Freqs = append(c.Freqs, f)
		c.Values = append(c.Values, -40/(1+math.Pow((f-7.1e6)/2e5, 2)))
	}
	return c
}

func TestPlotCircuit(t *testing.T) {
	c := demoCircuit()
	for _, format := range []string{"svg", "png"} {
		var b bytes.Buffer
		if err := PlotCircuit(&b, &c, format, 160, 100); err != nil {
			t.Fatal(err)
		}
		if format == "svg" && !strings.Contains(b.String(), "<svg") {
			t.Error("no svg element")
		}
		if format == "png" && !bytes.HasPrefix(b.Bytes(), []byte("\x89PNG")) {
			t.Error("not a PNG")
		}
	}
	c.Values[3] = math.NaN()
	if err := PlotCircuit(&bytes.Buffer{}, &c, "svg", 160, 100); err == nil {
		t.Error("NaN accepted")
	}
}

func TestRenderCircuitPage(t *testing.T) {
	doc := testDoc(t, "A4")
	var plain bytes.Buffer
	if err := Render(&plain, doc, Options{}); err != nil {
		t.Fatal(err)
	}
	doc.Circuits = []Circuit{demoCircuit()}
	var b bytes.Buffer
	if err := Render(&b, doc, Options{}); err != nil {
		t.Fatal(err)
	}
	if b.Len() <= plain.Len() {
		t.Errorf("the circuit page added nothing (%d vs %d bytes)", b.Len(), plain.Len())
	}
}
