package compound_test

import (
	"fmt"

	"saltcast/core/compound"
)

// A technician has a jar labelled "Glauber's salt" and wants to know how much dissolves at
// room temperature and at 40 °C, and which solid comes back out.
func ExampleLookup() {
	c, form, err := compound.Lookup("Glauber's salt")
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%s is %s, %.2f g/mol\n", form.Formula, c.Name, form.MolarMassGPerMol)
	for _, t := range []float64{20, 40} {
		g, seg, _, _ := c.Solubility(t)
		fmt.Printf("%.0f °C: %.1f g Na2SO4 per 100 g water, solid %s\n", t, g, seg.Form.Formula)
	}
	// Output:
	// Na2SO4·10H2O is sodium sulfate, 322.19 g/mol
	// 20 °C: 19.2 g Na2SO4 per 100 g water, solid Na2SO4·10H2O
	// 40 °C: 47.8 g Na2SO4 per 100 g water, solid Na2SO4
}
