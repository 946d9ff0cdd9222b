package main

import (
	"bytes"
	"fmt"
	"os"
	"strings"
)

// A quick plan from flags, as the README shows it: 500 g of water saturated to 90 % with
// KNO3 at 60 °C and cooled to 10 °C, the charge and the crop read off the text sheet. By
// hand: KNO3 dissolves 109.2 g per 100 g water at 60 °C and 21.4 at 10 °C (CRC Handbook,
// 98th ed., "Aqueous Solubility of Inorganic Compounds at Various Temperatures": 52.2 and
// 17.6 mass % as the library holds them, r = 100·w/(100 − w)), so 0.9 × 109.2 × 5 = 491.4 g is weighed and
// 491.4 − 5 × 21.4 ≈ 384.4 g crystallize.
func Example_quickPlan() {
	var out bytes.Buffer
	code := Run([]string{"plan", "--solute", "KNO3", "--water-g", "500", "--dissolve-temp-C", "60",
		"--saturation-pct", "90", "--cool-to-C", "10", "--format", "text"}, nil, &out, os.Stderr)
	fmt.Println("exit", code)
	for _, line := range strings.Split(out.String(), "\n") {
		for _, label := range []string{"  weigh ", "  saturation temperature ", "At ", "  crystals ", "  yield ", "  mother liquor "} {
			if strings.HasPrefix(line, label) {
				fmt.Println(line)
			}
		}
	}
	// Output:
	// exit 0
	//   weigh                         491.4 g of KNO3
	//   saturation temperature        55.8 °C (crystals can form beyond it)
	// At 10 °C
	//   crystals                      384.6 g of KNO3
	//   yield (anhydrous basis)       78.27 %
	//   mother liquor                 606.8 g, 21.36 g per 100 g water
}

// A batch typed in °F and pounds, and shown in them: 1.1 lb of water, 140 °F = 60 °C,
// 50 °F = 10 °C, so the charge is 0.9 × 1.092 × 1.1 = 1.081 lb and the crop
// (0.9828 − 0.2136) × 1.1 = 0.846 lb (the solubilities above).
func Example_quickPlanInPounds() {
	var out bytes.Buffer
	Run([]string{"plan", "--solute", "KNO3", "--water-lb", "1.1", "--dissolve-temp-F", "140",
		"--saturation-pct", "90", "--cool-to-F", "50", "--format", "text", "--temp-unit", "F", "--mass-unit", "lb"}, nil, &out, os.Stderr)
	for _, line := range strings.Split(out.String(), "\n") {
		for _, label := range []string{"  weigh ", "  into water ", "At ", "  crystals "} {
			if strings.HasPrefix(line, label) {
				fmt.Println(line)
			}
		}
	}
	// Output:
	//   weigh                         1.081 lb of KNO3
	//   into water                    1.1 lb
	// At 50 °F
	//   crystals                      0.8462 lb of KNO3
}
