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

// A preparation recipe as a technician writes it: 1 L of 0.5 mol/L NaCl from the 5 mol/L
// stock on the shelf. c1·V1 = c2·V2 gives 100 mL of stock; 0.5·58.44 = 29.2 g/L by definition;
// 2.87 % w/w between the CRC 102nd ed. rows 2.5 % (0.435 mol/L) and 3 % (0.523 mol/L).
func ExamplePlanPrep() {
	p, err := recipe.DecodePrep([]byte(`{"solute":"NaCl","concentration":0.5,"concentration_unit":"mol/L",
		"final_volume_mL":1000,"stock_concentration":5,"stock_unit":"mol/L"}`))
	if err != nil {
		fmt.Println(err)
		return
	}
	res, err := recipe.PlanPrep(p)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("%.1f mL of stock, water to the mark; %.2f %% w/w, %.1f g/L\n", res.StockML, res.PctWW, res.GPerL)
	// Output: 100.0 mL of stock, water to the mark; 2.87 % w/w, 29.2 g/L
}
