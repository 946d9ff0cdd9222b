package recipe_test

import (
	"fmt"

	"saltcast/core/recipe"
)

// A recipe read from JSON and planned: potassium nitrate saturated at 60 °C in 250 mL of
// water measured at 20 °C, cooled to 20 °C. By hand: 250 mL weigh 249.55 g (998.204 kg/m³,
// Kell 1975); KNO3 dissolves 109.2 g per 100 g water at 60 °C and 31.93 at 20 °C (CRC 98th
// ed.), so the charge is 272.5 g and the crystals (109.2 − 31.93)·2.4955 = 192.8 g (192.9 with
// the unrounded mass % the library converts).
func ExamplePlan() {
	r, err := recipe.Decode([]byte(`{"format":1,"solute":"potassium nitrate",
		"water_mL":250,"water_temp_C":20,"dissolve_temp_C":60,"cool_to_C":20}`))
	if err != nil {
		fmt.Println(err)
		return
	}
	res, err := recipe.Plan(r)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("weigh %.1f g %s into %.2f g water\n", res.ChargeG, res.ChargedForm, res.WaterG)
	fmt.Printf("at %.0f °C: %.1f g of %s, yield %.1f %%\n", res.TargetC, res.CrystalsG, res.CrystalPhase, res.YieldPct)
	// Output:
	// weigh 272.5 g KNO3 into 249.55 g water
	// at 20 °C: 192.9 g of KNO3, yield 70.8 %
}

// Errors name the recipe key and say what is allowed.
func ExampleDecode() {
	_, err := recipe.Decode([]byte(`{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"purity_pct":120}`))
	fmt.Println(err)
	// Output: purity_pct: "120" is not allowed; allowed: a percentage > 0 and ≤ 100
}
