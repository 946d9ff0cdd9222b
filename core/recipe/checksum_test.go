package recipe_test

import (
	"math/rand/v2"
	"regexp"
	"slices"
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/recipe/demo"
	"saltcast/core/wire"
)

// demoRecipes are the invented demo batches, and one with a custom compound.
func demoRecipes(t *testing.T) []recipe.Recipe {
	t.Helper()
	var rs []recipe.Recipe
	for _, d := range demo.All {
		r, err := recipe.Decode(d.JSON)
		if err != nil {
			t.Fatal(err)
		}
		rs = append(rs, r)
	}
	// An invented custom compound with every optional custom key.
	r, err := recipe.Decode([]byte(`{"name":"own salt (invented)","custom":{"name":"X","molar_mass_g_per_mol":150,` +
		`"points":[[10,20],[30,35],[60,60]],"model":"table","source":"invented","solution_enthalpy_kJ_per_mol":12},` +
		`"water_g":500,"dissolve_temp_C":60,"cool_to_C":10}`))
	if err != nil {
		t.Fatal(err)
	}
	return append(rs, r)
}

var hex8 = regexp.MustCompile(`^[0-9a-f]{8}$`)

// The checksum does not depend on the order of the keys in the file: the demo files read
// with their keys (and the custom compound's keys) in reverse order give the same checksum.
func TestChecksumIgnoresKeyOrder(t *testing.T) {
	for _, r := range demoRecipes(t) {
		v, err := wire.Decode(r.Encode())
		if err != nil {
			t.Fatal(err)
		}
		var reverse func(v *wire.Value)
		reverse = func(v *wire.Value) {
			slices.Reverse(v.Members)
			for i := range v.Members {
				reverse(&v.Members[i].Value)
			}
		}
		reverse(&v)
		js, err := wire.Encode(v)
		if err != nil {
			t.Fatal(err)
		}
		r2, err := recipe.Decode(js)
		if err != nil {
			t.Fatalf("%s: %v", js, err)
		}
		if got, want := r2.Checksum(), r.Checksum(); got != want || !hex8.MatchString(want) {
			t.Errorf("%s: reversed keys give %q, want %q (8 hex digits)", r.Name, got, want)
		}
	}
}

// Every input of the batch changes the checksum; the name and notes do not (they are printed
// beside it). Each number present is nudged by one part in a million (the seventh digit a
// balance shows) and each temperature by 1 mK (the finest a laboratory thermometer reads;
// common practice), each text gets a letter more, and each optional number absent is set.
func TestChecksumFollowsEveryInput(t *testing.T) {
	for _, base := range demoRecipes(t) {
		want := base.Checksum()
		same := base
		same.Name, same.Notes = "another name", "other notes"
		if got := same.Checksum(); got != want {
			t.Errorf("%s: renaming changed the checksum %s → %s", base.Name, want, got)
		}
		for i := range recipe.Fields.Fields {
			f := &recipe.Fields.Fields[i]
			if f.Key == "name" || f.Key == "notes" || f.Key == "format" || (f.Parent() != "" && base.Custom == nil) {
				continue
			}
			r := base
			if base.Custom != nil {
				c := *base.Custom
				c.Points = slices.Clone(c.Points)
				r.Custom = &c
			}
			switch {
			case f.Opt != nil:
				o := f.Opt(&r)
				if o.Set && f.Kind == recipe.Temp {
					o.Value += 1e-3
				} else if o.Set {
					o.Value = o.Value*(1+1e-6) + 1e-6
				} else {
					*o = recipe.Some(1)
				}
			case f.Num != nil && f.Kind == recipe.Temp:
				*f.Num(&r) += 1e-3
			case f.Num != nil:
				*f.Num(&r) *= 1 + 1e-6
			case f.Text != nil:
				*f.Text(&r) += "x"
			case f.Points != nil:
				(*f.Points(&r))[0].GPer100gWater *= 1 + 1e-6
			default:
				continue
			}
			if got := r.Checksum(); got == want {
				t.Errorf("%s: changing %s leaves the checksum %s", base.Name, f.Key, want)
			}
			if base.Checksum() != want {
				t.Fatalf("%s: Checksum changed the recipe it was given", base.Name)
			}
		}
	}
}

// Property: over random changes of one number of a demo recipe, by a relative step from 1e-6
// (a balance's seventh digit) to about 50, or for a temperature by 1 mK to 65 K, the checksum
// changes every time, and the same recipe always gives the same one (fixed seed, so a failure
// can be replayed).
func TestChecksumChangesWithInputs(t *testing.T) {
	rng := rand.New(rand.NewPCG(14, 2026))
	rs := demoRecipes(t)
	for range 3000 {
		base := rs[rng.IntN(len(rs))]
		r := base
		var opts []*recipe.Opt
		var temp []bool
		for i := range recipe.Fields.Fields {
			f := &recipe.Fields.Fields[i]
			if f.Opt != nil && f.Parent() == "" && f.Opt(&r).Set {
				opts = append(opts, f.Opt(&r))
				temp = append(temp, f.Kind == recipe.Temp)
			}
		}
		i := rng.IntN(len(opts))
		o := opts[i]
		sign := float64(1 - 2*rng.IntN(2))
		step := 1e-6 * float64(int64(1)<<rng.IntN(26))
		if temp[i] {
			step = 1e-3 * float64(int64(1)<<rng.IntN(17))
			o.Value += sign * step
		} else {
			o.Value *= 1 + sign*step/2
		}
		if r.Checksum() == base.Checksum() {
			t.Errorf("%s: a relative change of %g leaves the checksum %s", base.Name, step, base.Checksum())
		}
		if r.Checksum() != r.Checksum() {
			t.Fatal("the same recipe gave two checksums")
		}
	}
}
