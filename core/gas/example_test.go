package gas_test

import (
	"fmt"
	"math"

	"saltcast/core/gas"
)

// A field technician checks a dissolved-oxygen meter in a pond at 18 °C on a day when the
// station barometer reads 741 mmHg (invented scenario).
func ExampleOxygenSaturation() {
	kPa, _ := gas.PressureKPa("pressure", 741, "mmHg")
	c := gas.Conditions{TempC: 18, Salinity: 0, PressureKPa: kPa}
	sat, _ := gas.OxygenSaturation(c, gas.BensonKrause)
	other, _ := gas.OxygenSaturation(c, gas.GarciaGordon)
	pct, _ := gas.PercentSaturation(8.7, sat)
	fmt.Printf("saturation %.2f mg/L (%s)\n", sat.MgPerL, sat.Method)
	fmt.Printf("%s differs by %.3f mg/L\n", other.Method, math.Abs(other.MgPerL-sat.MgPerL))
	fmt.Printf("reading 8.7 mg/L is %.0f %% of saturation\n", pct)
	// Output:
	// saturation 9.23 mg/L (Benson & Krause 1984)
	// Garcia & Gordon 1992 differs by 0.000 mg/L
	// reading 8.7 mg/L is 94 % of saturation
}

// Tap water that sat overnight at 15 °C is heated to 70 °C in an open beaker at sea level
// (invented scenario).
func ExampleOutgas() {
	o, _ := gas.Outgas(gas.OutgasInput{FromC: 15, ToC: 70, PressureKPa: gas.StdKPa, CO2PPM: gas.DefaultCO2PPM})
	for _, r := range o.Gases[:3] {
		fmt.Printf("%-3s %.2f mL/L at 70 °C\n", r.Gas.ID, r.ReleasedMLPerL)
	}
	fmt.Printf("air %.1f mL/L at 70 °C, %.1f mL/L at STP\n", o.TotalMLPerL, o.TotalMLSTPPerL)
	// Output:
	// O2  5.49 mL/L at 70 °C
	// N2  9.33 mL/L at 70 °C
	// Ar  0.27 mL/L at 70 °C
	// air 15.5 mL/L at 70 °C, 12.3 mL/L at STP
}
