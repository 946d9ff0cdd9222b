package main

import (
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/wire"
)

// typedSig is the most significant digits a technician types for one number (a balance
// shows at most seven; common practice).
const typedSig = 7

// The recipe checksum printed on the batch sheet is the same whatever units the recipe was
// shown and typed in: 1 000 random recipes (fixed seed), their numbers as a person types them,
// shown in °F, lb and US gal or in K, kg and L and every number typed back as shown, give the
// checksum of the recipe typed in °C, g and mL. Conversions: NIST SP 811 (2008), appendix B.8.
func TestChecksumSameInEveryUnitSystem(t *testing.T) {
	for i, r := range randRecipes(t, roundTripRecipes) {
		typed := roundRecipe(r, typedSig)
		want := typed.Checksum()
		for _, u := range []Units{{"F", "lb", "gal"}, {"K", "kg", "L"}, {"C", "g", "mL"}} {
			shown := FromRecipe(typed)
			back := FromRecipe(typed)
			for k := range shown.Num {
				if err := back.Set(k, shown.Display(k, u), u); err != nil {
					t.Fatalf("recipe %d, %s in %v: %v", i, k, u, err)
				}
			}
			got, err := back.Recipe()
			if err != nil {
				t.Fatalf("recipe %d in %v: %v", i, u, err)
			}
			if got.Checksum() != want {
				t.Errorf("recipe %d: checksum %s typed in %v, %s in the recipe's own units\n%s\n%s", i, got.Checksum(), u, want,
					got.Encode(), typed.Encode())
			}
		}
	}
}

// roundRecipe rounds every number of r (outside the custom points) to sig digits.
func roundRecipe(r recipe.Recipe, sig int) recipe.Recipe {
	if r.Custom != nil {
		c := *r.Custom
		r.Custom = &c
	}
	for i := range recipe.Fields.Fields {
		f := &recipe.Fields.Fields[i]
		if f.Parent() != "" && r.Custom == nil {
			continue
		}
		if f.Opt != nil {
			o := f.Opt(&r)
			o.Value = wire.RoundSig(o.Value, sig)
		} else if f.Num != nil {
			*f.Num(&r) = wire.RoundSig(*f.Num(&r), sig)
		}
	}
	return r
}
