package main

import (
	"saltcast/web/carry"
	"strings"
	"testing"

	"saltcast/core/recipe"
)

func TestCarryWords(t *testing.T) {
	rs := []recipe.Recipe{{Name: "a"}, {Name: "b"}}
	sealed := carry.Carried{SentBy: "Ana", SavedAt: "2026-12-01T09:30:00Z", AppVersion: "v1.2", Recipes: rs, Sealed: true}
	for _, tc := range []struct{ got, want string }{
		{CarriedNote(sealed), "This copy of Saltcast carries 2 recipes from Ana. They are kept apart from your own until you take them in."},
		{CarriedNote(carry.Carried{Recipes: rs[:1]}), "This copy of Saltcast carries 1 recipe. They are kept apart from your own until you take them in."},
		{FromLine(sealed, "this copy"), "2 recipes carried by this copy, sent by Ana, saved 2026-12-01 09:30 UTC with Saltcast v1.2."},
		{FromLine(carry.Carried{Recipes: rs}, "x.json"), "2 recipes from the file “x.json” (a recipe export: no sender or checksum recorded)."},
		{UTCStamp("2026-12-01T09:30:00.123Z"), "2026-12-01T09:30:00Z"},
		{UTCStamp("+012026-12-01T09:30:00.123Z"), ""},
		{YMD(2026, 3, 7), "2026-03-07"},
		{CopyFileName("2026-12-01"), "saltcast-with-recipes-2026-12-01.html"},
		{TakeInMessage(rs, rs, 2, 0), "Took 2 recipes into your list."},
		{TakeInMessage(rs, nil, 0, 2), "2 were there already."},
		{TakeInMessage(rs, []recipe.Recipe{{Name: "a (received 2026-12-01)"}}, 1, 1),
			"Took 1 recipe into your list. 1 was there already. A recipe of the same name was kept as “a (received 2026-12-01)”."},
	} {
		if tc.got != tc.want {
			t.Errorf("got  %q\nwant %q", tc.got, tc.want)
		}
	}
	if stamp := UTCStamp("2026-12-01T09:30:00.123Z"); stamp != "" {
		if _, err := carry.EncodeCarried(carry.Carried{SavedAt: stamp}); err != nil {
			t.Errorf("UTCStamp gives %q, which the carried format refuses: %v", stamp, err)
		}
	}
	for s, want := range map[string]int{"0": 0, "12": 12, "": -1, "1x": -1, "-1": -1, "9999999": -1} {
		if got := atoi(s); got != want {
			t.Errorf("atoi(%q) = %d, want %d", s, got, want)
		}
	}
	_, err := carry.ExtractCarried([]byte("<p>x</p>"))
	if m := carryMessage(err); !strings.HasPrefix(m, "This file carries no") || !strings.HasSuffix(m, ".") {
		t.Errorf("carryMessage = %q", m)
	}
}

func TestInList(t *testing.T) {
	a := recipe.Recipe{Name: "a", Solute: "KNO3", WaterG: recipe.Some(100), DissolveTempC: 60}
	b := a
	b.WaterG = recipe.Some(200)
	if !InList([]recipe.Recipe{a}, a) || InList([]recipe.Recipe{a}, b) || InList(nil, a) {
		t.Error("InList is wrong")
	}
}

func TestCarryWordsPreps(t *testing.T) {
	rs := []recipe.Recipe{{Name: "a"}}
	ps := []recipe.Prep{{Name: "p"}, {Name: "q"}}
	for _, tc := range []struct{ got, want string }{
		{CarriedNote(carry.Carried{Recipes: rs, Preps: ps}), "This copy of Saltcast carries 1 recipe and 2 preparations. They are kept apart from your own until you take them in."},
		{FromLine(carry.Carried{Preps: ps[:1], Sealed: true}, "this copy"), "1 preparation carried by this copy."},
		{TakeInPrepsMessage(ps, []recipe.Prep{{Name: "p (received 2026-12-01)"}}, 1, 1),
			"Took 1 preparation into your list. 1 was there already. A preparation of the same name was kept as “p (received 2026-12-01)”."},
	} {
		if tc.got != tc.want {
			t.Errorf("got  %q\nwant %q", tc.got, tc.want)
		}
	}
	p := recipe.Prep{Name: "p", Solute: "KCl", Concentration: 1, ConcentrationUnit: "mol/L", FinalVolumeML: recipe.Some(100)}
	p2 := p
	p2.Concentration = 2
	if !InListPrep([]recipe.Prep{p}, p) || InListPrep([]recipe.Prep{p}, p2) || InListPrep(nil, p) {
		t.Error("InListPrep is wrong")
	}
}
