package carry

import (
	"saltcast/core/recipe"
	"strings"
	"testing"
	"unicode/utf8"
)

func named3(names ...string) []recipe.Recipe {
	rs := make([]recipe.Recipe, len(names))
	for i, n := range names {
		rs[i] = recipe.Recipe{Format: 1, Name: n, Solute: "KNO3", WaterG: recipe.Some(100), DissolveTempC: 60}
	}
	return rs
}

func names(rs []recipe.Recipe) string {
	var b []string
	for _, r := range rs {
		b = append(b, r.Name)
	}
	return strings.Join(b, " | ")
}

func TestTakeIn(t *testing.T) {
	const day = "2026-12-01"
	other := func(rs []recipe.Recipe) []recipe.Recipe { // same names, different batches
		for i := range rs {
			rs[i].WaterG = recipe.Some(250 + float64(i))
		}
		return rs
	}
	long := strings.Repeat("é", 100) // 200 bytes, the longest name a recipe holds
	for _, tc := range []struct {
		what        string
		mine, in    []recipe.Recipe
		want        string
		added, same int
	}{
		{"nothing received", named3("a"), nil, "a", 0, 0},
		{"new names", named3("a"), named3("b", "c"), "a | b | c", 2, 0},
		{"into an empty list", nil, named3("b"), "b", 1, 0},
		// clashes are kept side by side, marked
		{"a clash", named3("a", "b"), other(named3("a")), "a | b | a (received 2026-12-01)", 1, 0},
		{"a clash with a mark already there", named3("a", "a (received 2026-12-01)"), other(named3("a")),
			"a | a (received 2026-12-01) | a (received 2026-12-01, 2)", 1, 0},
		{"the same name twice in one file", nil, other(named3("x", "x")), "x | x (received 2026-12-01)", 2, 0},
		// identical recipes are not doubled
		{"the same recipe again", named3("a", "b"), named3("b"), "a | b", 0, 1},
		{"empty names", nil, other(named3("", "  ")), "unnamed | unnamed (received 2026-12-01)", 2, 0},
		// the marked name still fits the 200 bytes a name may hold
		{"a long name", named3(long), other(named3(long)),
			long + " | " + strings.Repeat("é", 89) + " (received 2026-12-01)", 1, 0},
	} {
		mineBefore := names(tc.mine)
		all, added, same := TakeIn(tc.mine, tc.in, day)
		if got := names(all); got != tc.want || added != tc.added || same != tc.same {
			t.Errorf("%s: TakeIn = %q, %d added, %d same; want %q, %d, %d", tc.what, got, added, same, tc.want, tc.added, tc.same)
		}
		if names(tc.mine) != mineBefore {
			t.Errorf("%s: TakeIn changed mine", tc.what)
		}
		if _, err := recipe.DecodeCollection(recipe.EncodeCollection(all)); err != nil {
			t.Errorf("%s: the list does not read back: %v", tc.what, err)
		}
	}
}

func FuzzTakeIn(f *testing.F) {
	f.Add("a", "a", "2026-12-01")
	f.Add(strings.Repeat("ж", 100), strings.Repeat("ж", 100), "2026-12-01")
	f.Add("", " ", "")
	f.Add("x (received 1)", "x", "1")
	f.Fuzz(func(t *testing.T, mine, in, day string) {
		if len(mine) > recipe.MaxNameBytes-1 || len(in) > recipe.MaxNameBytes || !utf8.ValidString(mine) || !utf8.ValidString(in) || !utf8.ValidString(day) {
			return // recipe.Decode refuses such names, so no recipe holds one
		}
		m := named3(mine, mine+"!")
		r := named3(in, in, mine)
		r[0].WaterG, r[1].WaterG = recipe.Some(1), recipe.Some(2)
		all, added, same := TakeIn(m, r, day)
		if added+same != len(r) || len(all) != len(m)+added {
			t.Fatalf("TakeIn counts: %d added + %d same of %d; list %d", added, same, len(r), len(all))
		}
		seen := map[string]bool{}
		for i, x := range all {
			if i >= len(m) && seen[x.Name] {
				t.Errorf("received %q takes a name already in the list", x.Name)
			}
			seen[x.Name] = true
			if len(x.Name) > recipe.MaxNameBytes || !utf8.ValidString(x.Name) {
				t.Errorf("name %q: %d bytes, valid %v", x.Name, len(x.Name), utf8.ValidString(x.Name))
			}
		}
		if _, err := recipe.DecodeCollection(recipe.EncodeCollection(all)); err != nil {
			t.Errorf("list does not read back: %v", err)
		}
	})
}
