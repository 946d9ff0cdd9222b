package solubility_test

import (
	"fmt"

	"saltcast/core/solubility"
)

// A technician measured the solubility of an invented product in water at four temperatures
// and wants a curve to plan with (invented data).
func ExampleFit() {
	pts := []solubility.Point{{TempC: 10, GPer100gWater: 8.1}, {TempC: 25, GPer100gWater: 12.9}, {TempC: 40, GPer100gWater: 19.6}, {TempC: 60, GPer100gWater: 32.8}}
	res, err := solubility.Fit(solubility.KindApelblat, pts, 180.16)
	if err != nil {
		fmt.Println(err)
		return
	}
	g, _, _ := res.Curve.At(30)
	fmt.Printf("at 30 °C: %.1f g/100 g water (R² %.4f, fitted %g–%g °C)\n", g, res.R2, res.Curve.MinC, res.Curve.MaxC)
	_, warning, _ := res.Curve.At(63)
	fmt.Println(warning)
	_, _, err = res.Curve.At(80)
	fmt.Println(err)
	// Output:
	// at 30 °C: 14.9 g/100 g water (R² 1.0000, fitted 10–60 °C)
	// 63 °C is 3 K above the data (10–60 °C); the solubility is extrapolated
	// temp_C: "80" is not allowed; allowed: a temperature from 5 to 65 °C (data 10–60 °C, extrapolated with a warning up to 5 K beyond)
}

func ExampleConvert() {
	// KNO3 saturated at 20 °C: 31.93 g/100 g water (CRC Handbook 98th ed., 24.2 mass %).
	for _, u := range []solubility.Unit{solubility.MassPct, solubility.MolPerKg, solubility.MoleFrac} {
		v, _ := solubility.Convert(31.93, solubility.GPer100gWater, u, 101.10, 0)
		fmt.Printf("%.4g %s\n", v, u)
	}
	// Output:
	// 24.2 mass%
	// 3.158 mol/kg
	// 0.05383 x
}
