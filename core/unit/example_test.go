package unit_test

import (
	"fmt"

	"saltcast/core/unit"
)

func ExampleParseNumber() {
	for _, s := range []string{"12,5", "12.5", "1.234,5"} {
		v, err := unit.ParseNumber("water_g", s)
		fmt.Println(v, err)
	}
	// Output:
	// 12.5 <nil>
	// 12.5 <nil>
	// 0 water_g: "1.234,5" is not allowed; allowed: a number without thousands separators, with one decimal point or comma (e.g. 1234,5 or 1234.5)
}

func ExampleFormatNumber() {
	fmt.Println(unit.FormatNumber(31.9263, 3), unit.FormatNumber(1234.5, 2), unit.FormatNumber(0.5, 3))
	// Output: 31.9 1200 0.500
}

func ExampleGramsFromPounds() {
	fmt.Printf("%.2f g\n", unit.GramsFromPounds(2.2))
	fmt.Printf("%.1f °F\n", unit.FahrenheitFromCelsius(37))
	// Output:
	// 997.90 g
	// 98.6 °F
}
