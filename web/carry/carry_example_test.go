package carry_test

import (
	"fmt"
	"saltcast/web/carry"

	"saltcast/core/recipe"
)

// A technician sends two invented batches to a colleague inside a copy of the page, and
// the colleague, who already has a recipe of the same name, takes them in.
func ExampleWithCarried() {
	night, _ := recipe.Decode([]byte(`{"name":"night stock (invented)","solute":"KNO3","water_g":20000,"dissolve_temp_C":35,"clear_down_to_C":4}`))
	blue, _ := recipe.Decode([]byte(`{"name":"blue crystals (invented)","solute":"CuSO4","charged_form":"CuSO4·5H2O","water_g":500,"dissolve_temp_C":60,"cool_to_C":20}`))
	page := []byte("<!doctype html><html><body><p>Saltcast</p></body></html>")

	copy, err := carry.WithCarried(page, carry.Carried{AppVersion: "v1", SavedAt: "2026-12-01T09:30:00Z",
		SentBy: "bench 3", Recipes: []recipe.Recipe{night, blue}})
	if err != nil {
		fmt.Println(err)
		return
	}
	got, err := carry.ExtractCarried(copy)
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(len(got.Recipes), "recipes from", got.SentBy, "sealed:", got.Sealed)

	mine, _ := recipe.Decode([]byte(`{"name":"night stock (invented)","solute":"KNO3","water_g":5000,"dissolve_temp_C":30}`))
	all, added, same := carry.TakeIn([]recipe.Recipe{mine}, got.Recipes, "2026-12-02")
	for _, r := range all {
		fmt.Println(r.Name)
	}
	fmt.Println(added, "added,", same, "already there")

	// Output:
	// 2 recipes from bench 3 sealed: true
	// night stock (invented)
	// night stock (invented) (received 2026-12-02)
	// blue crystals (invented)
	// 2 added, 0 already there
}
