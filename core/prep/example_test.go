package prep_test

import (
	"fmt"

	"saltcast/core/compound"
	"saltcast/core/prep"
)

// Two litres of 1.5 mol/L KCl made up to the mark at 20 °C, for a cold room at 4 °C.
// By definition of mol/L the flask needs 1.5·2·74.548 = 223.6 g of KCl; the CRC densities
// say the solution weighs about 2133 g, so about 1909 g of water goes in; w = 10.48 % gives
// 1000·0.10484/(0.89516·74.548) = 1.571 mol/kg.
func ExamplePlan() {
	c, _, _ := compound.Lookup("potassium chloride")
	r, err := prep.Plan(prep.Spec{Compound: c, Concentration: 1.5, Unit: prep.MolPerL,
		Amount: prep.ByVolume, AmountValue: 2000, TempC: 20, HasStoreAt: true, StoreAtC: 4})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("weigh %.1f g %s, fill to 2000 mL (about %.0f g of water)\n", r.FormG, r.Form, r.WaterG)
	fmt.Printf("%.4f g/mL, %.2f %% w/w, %.3f mol/kg, %.0f %% of saturation\n", r.DensityKgPerM3/1000, r.PctWW, r.MolPerKg, r.SaturationPct)
	fmt.Printf("clear at 4 °C: %v\n", r.ClearAtStore)
	// Output:
	// weigh 223.6 g KCl, fill to 2000 mL (about 1909 g of water)
	// 1.0666 g/mL, 10.48 % w/w, 1.571 mol/kg, 34 % of saturation
	// clear at 4 °C: true
}

// Diluting a stock: 1 L of 0.5 mol/L NaCl from a 5 mol/L stock takes 100 mL of it
// (c1·V1 = c2·V2).
func ExamplePlan_stock() {
	c, _, _ := compound.Lookup("NaCl")
	r, _ := prep.Plan(prep.Spec{Compound: c, Concentration: 0.5, Unit: prep.MolPerL,
		Amount: prep.ByVolume, AmountValue: 1000, TempC: 20,
		HasStock: true, StockConcentration: 5, StockUnit: prep.MolPerL})
	fmt.Printf("%.1f mL (%.2f g) of stock, then water to 1000 mL (about %.0f g)\n", r.StockML, r.StockG, r.WaterG)
	// Output: 100.0 mL (118.58 g) of stock, then water to 1000 mL (about 900 g)
}
