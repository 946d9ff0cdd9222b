package api_test

import (
	"fmt"

	"saltcast/core/wire"
	"saltcast/web/api"
)

// Glauber's salt below its 32.38 °C transition: the stable solid is the decahydrate.
// CRC 98th ed. gives 16.13 mass % at 20 °C, i.e. 19.23 g Na2SO4 per 100 g water.
func ExampleSolubility() {
	out, err := api.Solubility(api.Params{"solute": "Glauber's salt", "temp_C": "20"})
	if err != nil {
		fmt.Println(api.IsInputError(err), string(api.ErrorJSON(err)))
		return
	}
	v, _ := wire.Decode(out)
	g, _ := v.Get("g_per_100g_water")
	phase, _ := v.Get("solid_phase")
	fmt.Printf("%.2f g per 100 g water, solid %s\n", g.Num, phase.Text)
	// Output: 19.23 g per 100 g water, solid Na2SO4·10H2O
}

func ExampleErrorJSON() {
	_, err := api.Solubility(api.Params{"solute": "KNO3", "temp_C": "1.234,5"})
	fmt.Println(api.IsInputError(err))
	fmt.Println(string(api.ErrorJSON(err))[:30])
	// Output:
	// true
	// {"error":"temp_C: \"1.234,5\"
}
