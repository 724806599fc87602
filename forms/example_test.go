package forms_test

import (
	"fmt"
	"strings"
	"turnwise/internal/quantity"

	"turnwise/forms"
)

func ExampleParseLength() {
	for _, s := range []string{"4.5mm", "0.177in", "1/4in", "4.5", "48nH"} {
		l, err := quantity.ParseLength(s)
		if err != nil {
			fmt.Println("error:", err)
			continue
		}
		fmt.Printf("%s = %.4g m\n", s, float64(l))
	}
	// Output:
	// 4.5mm = 0.0045 m
	// 0.177in = 0.004496 m
	// 1/4in = 0.00635 m
	// error: length "4.5": add a unit, e.g. 4.5mm or 0.18in
	// error: length "48nH": that is an inductance; expected a length such as 4.5mm
}

func ExampleCatalog_Wire() {
	c, err := forms.BuiltIn()
	if err != nil {
		fmt.Println(err)
		return
	}
	w, err := c.Wire("22awg")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s: bare %.4g mm, overall %.4g mm (%s %s)\n", w.Name, float64(w.Bare)*1e3, float64(w.Overall)*1e3, w.Insulation, w.Conductor)
	_, err = c.Wire("22agw")
	fmt.Println(err)
	// Output:
	// 22awg: bare 0.6438 mm, overall 0.6933 mm (grade1 copper)
	// wire "22agw" not found; did you mean 22awg?
}

func ExampleLoadStock() {
	const stock = `
[[mandrel]]
name = "brass rod 6"
diameter = "6.0mm"

[[calibration]]
mandrel = "brass rod 6"
wire = "22awg"
springback = "3.1%"
`
	mine, err := forms.LoadStock(strings.NewReader(stock), "bench.toml")
	if err != nil {
		fmt.Println(err)
		return
	}
	builtIn, err := forms.BuiltIn()
	if err != nil {
		fmt.Println(err)
		return
	}
	all := forms.Merge(builtIn, mine)
	cal, ok := all.Springback("brass rod 6", "22 AWG")
	fmt.Printf("%v %.4g (line %d)\n", ok, cal.Springback, cal.Line)

	_, err = forms.LoadStock(strings.NewReader("[[wire]]\nname = \"green spool\"\nbare = \"0,64mm\"\n"), "my.toml")
	fmt.Println(err)
	// Output:
	// true 0.031 (line 6)
	// stock "my.toml": line 3: wire "green spool": bare: length "0,64mm": use a decimal point, not a comma: 0.64mm
}
