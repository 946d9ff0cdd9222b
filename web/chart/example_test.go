package chart_test

import (
	"fmt"
	"strings"

	"saltcast/web/chart"
)

// An invented copper sulfate batch: 30 g CuSO4 per 100 g water dissolved at
// 60 °C, cooled to 20 °C (invented). The curve points are the CRC Handbook,
// 98th ed., "Aqueous Solubility of Inorganic Compounds at Various
// Temperatures", converted to g per 100 g water.
func ExampleSolubility() {
	crc := []chart.Point{{0, 14.16}, {10, 16.82}, {20, 20.05}, {30, 23.92}, {40, 28.53}, {50, 34.05}, {60, 40.45}}
	onset := chart.Point{X: 38, Y: 30}
	c, err := chart.Solubility(chart.SolubilityView{
		Title:       "Copper sulfate pentahydrate (invented batch)",
		Phases:      []chart.Phase{{Form: "CuSO4·5H2O", Points: crc}},
		MetastableK: 4,
		Batch: &chart.Batch{
			Dissolve: chart.Point{X: 60, Y: 30},
			Onset:    &onset,
			End:      chart.Point{X: 20, Y: 20.05},
		},
	})
	if err != nil {
		fmt.Println(err)
		return
	}
	svg, err := chart.Render(c)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(strings.HasPrefix(svg, "<svg"), strings.Contains(svg, "Saturated, solid CuSO4·5H2O"))
	for _, m := range c.Markers {
		fmt.Println(m.Label)
	}
	// Output:
	// true true
	// Dissolved at 60 °C
	// Crystals from 38 °C
	// Ends at 20 °C
}

// A chart that cannot be drawn becomes a placeholder with the reason.
func ExamplePlaceholder() {
	_, err := chart.Render(chart.Chart{Title: "Oxygen saturation"})
	svg := chart.Placeholder("Oxygen saturation", err.Error())
	fmt.Println(err)
	fmt.Println(strings.Contains(svg, "nothing to draw yet"))
	// Output:
	// chart: nothing to draw yet
	// true
}

func ExampleNiceTicks() {
	t, _ := chart.NiceTicks(4, 35, 8) // an invented batch from 35 °C down to 4 °C
	for _, v := range t.Values() {
		fmt.Print(t.Label(v, false), " ")
	}
	fmt.Println()
	// Output:
	// 0 10 20 30 40
}
