package water_test

import (
	"fmt"

	"saltcast/core/water"
)

func Example() {
	fmt.Printf("density at 20 °C: %.3f kg/m³\n", water.DensityKgPerM3(20))
	fmt.Printf("vapour pressure at 20 °C: %.1f Pa\n", water.VaporPressurePa(20))
	fmt.Printf("heat capacity at 20 °C: %.4f kJ/(kg·K)\n", water.HeatCapacityKJPerKgK(20))
	// Output:
	// density at 20 °C: 998.204 kg/m³
	// vapour pressure at 20 °C: 2339.2 Pa
	// heat capacity at 20 °C: 4.1841 kJ/(kg·K)
}
