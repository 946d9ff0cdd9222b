package main

import (
	"errors"
	"math"
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// typedSig is the most significant digits a technician types for one number (a balance
// shows at most seven; common practice).
const typedSig = 7

// The recipe checksum printed on the batch sheet is the same whatever units the recipe was
// shown and typed in: 1 000 random recipes (fixed seed), their numbers as a person types them,
// shown in °F, lb and US gal or in K, kg and L and every number typed back as shown, give the
// checksum of the recipe typed in °C, g and mL. Conversions: NIST SP 811 (2008), appendix B.8.
// The numbers are typed to ten significant figures in the other units (the input boxes show a
// converted value to five, and keep the exact one until it is retyped: a value retyped from five
// figures is another recipe, and rightly gets another check).
func TestChecksumSameInEveryUnitSystem(t *testing.T) {
	atBound := 0
recipes:
	for i, r := range randRecipes(t, roundTripRecipes) {
		typed := roundRecipe(r, typedSig)
		want := typed.Checksum()
		for _, u := range []Units{{Temp: "F", Mass: "lb", Volume: "gal"}, {Temp: "K", Mass: "kg", Volume: "L"}, {Temp: "C", Mass: "g", Volume: "mL"}} {
			shown := FromRecipe(typed)
			back := FromRecipe(typed)
			for k, v := range shown.Num {
				delete(back.Num, k) // typed into an empty field, as on another device
				if err := back.Set(k, typedIn(shown, k, u), u); err != nil {
					// A value at the very end of its range (1e7 g) can come back a hair
					// beyond it from ten digits of lb: refused, not mistaken. Such recipes
					// are left out of this test (a few in a thousand at most).
					if s, _ := recipe.FieldSpecs.Lookup(k); s != nil && (nearTol(v, s.Max, 1e-9) || nearTol(v, s.Min, 1e-9)) {
						atBound++
						continue recipes
					}
					t.Fatalf("recipe %d, %s in %v: %v", i, k, u, err)
				}
			}
			got, err := back.Recipe()
			var fe *unit.FieldError
			if errors.As(err, &fe) {
				if s, _ := recipe.FieldSpecs.Lookup(fe.Field); s != nil {
					if v, ok := shown.Num[fe.Field]; ok && (nearTol(v, s.Max, 1e-9) || nearTol(v, s.Min, 1e-9)) {
						atBound++
						continue recipes
					}
				}
			}
			if err != nil {
				t.Fatalf("recipe %d in %v: %v", i, u, err)
			}
			if got.Checksum() != want {
				t.Errorf("recipe %d: checksum %s typed in %v, %s in the recipe's own units\n%s\n%s", i, got.Checksum(), u, want,
					got.Encode(), typed.Encode())
			}
		}
	}
	if atBound > roundTripRecipes/100 {
		t.Errorf("%d of %d recipes left out for a value at the end of its range", atBound, roundTripRecipes)
	}
}

// roundRecipe rounds every number of r (outside the custom points) to sig digits and
// temperatures to 0.01 K besides, and moves
// a number at the very end of its range (the generator likes them) one part in a million in.
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
		in := func(v float64) float64 {
			if f.Kind == recipe.Temp {
				v = math.Round(v*100) / 100 // a thermometer's 0.01 K
			}
			v = wire.RoundSig(v, sig)
			if f.Max != 0 && nearTol(v, f.Max, 1e-9) {
				v = wire.RoundSig(f.Max-1e-6*math.Abs(f.Max), sig)
			}
			if f.Min != 0 && nearTol(v, f.Min, 1e-9) {
				v = wire.RoundSig(f.Min+1e-6*math.Abs(f.Min), sig)
			}
			return v
		}
		if f.Opt != nil {
			o := f.Opt(&r)
			o.Value = in(o.Value)
		} else if f.Num != nil {
			*f.Num(&r) = in(*f.Num(&r))
		}
	}
	return r
}

// typedIn is field k of d as a person would type the same quantity in units u, to ten
// significant figures.
func typedIn(d *Draft, k string, u Units) string {
	v, ok := d.Num[k]
	s, found := d.specs.Lookup(k)
	if !ok || !found {
		return d.Display(k, u)
	}
	switch {
	case s.Kind == kTemp:
		v = TempFromC(v, u)
	case s.Kind == kMass:
		v = MassFromG(v, u)
	case s.Kind == kVolume:
		v = VolumeFromML(v, u)
	case isDelta(s):
		v = u.DeltaFromK(v)
	}
	return editable(v)
}
