package recipe

import (
	"errors"

	"saltcast/core/balance"
)

// Result is the plan of one recipe: the recipe as read, and the balance.Result fields
// promoted for the browser and the chart.
type Result struct {
	Recipe Recipe
	balance.Result
}

// Plan works out the batch. INCOMPLETE: not wired to the planner yet.
func Plan(r Recipe) (Result, error) {
	return Result{Recipe: r}, errors.New("recipe: Plan is not implemented yet")
}
