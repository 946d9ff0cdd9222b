package carry

import (
	"bytes"
	"errors"
	"os"
	"strings"
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/recipe/demo"
)

// demoPreps reads the invented demo preparation (core/recipe/demo) and adds a stock
// dilution whose name is markup; both invented.
func demoPreps(t testing.TB) []recipe.Prep {
	t.Helper()
	var ps []recipe.Prep
	for _, d := range demo.Preps {
		p, err := recipe.DecodePrep(d.JSON)
		if err != nil {
			t.Fatalf("%s: %v", d.File, err)
		}
		ps = append(ps, p)
	}
	p, err := recipe.DecodePrep([]byte(`{"kind":"preparation","name":"<b>NaCl 0.1 mol/L</b> (invented)",
		"solute":"NaCl","concentration":0.1,"concentration_unit":"mol/L","final_volume_mL":500,
		"stock_concentration":2,"stock_unit":"mol/L"}`))
	if err != nil {
		t.Fatal(err)
	}
	return append(ps, p)
}

func samePreps(t *testing.T, what string, got, want []recipe.Prep) {
	t.Helper()
	g := recipe.Collection{Preps: got}.Encode()
	w := recipe.Collection{Preps: want}.Encode()
	if !bytes.Equal(g, w) {
		t.Errorf("%s: preparations\n got %s\nwant %s", what, g, w)
	}
}

func TestCarriedPrepsRoundTrip(t *testing.T) {
	c := demoCarried(t)
	c.Preps = demoPreps(t)
	for _, tc := range []struct {
		what string
		c    Carried
	}{
		{"recipes and preparations", c},
		{"preparations only", Carried{AppVersion: "v1", Preps: c.Preps}},
	} {
		page, err := WithCarried([]byte(testPage), tc.c)
		if err != nil {
			t.Fatalf("%s: %v", tc.what, err)
		}
		if !bytes.Contains(page, []byte(`id="saltcast-carried">{"format":2,`)) {
			t.Errorf("%s: a block with preparations is not written as carried format 2", tc.what)
		}
		got, err := ExtractCarried(page)
		if err != nil {
			t.Fatalf("%s: ExtractCarried = %v", tc.what, err)
		}
		if !got.Sealed || got.SentBy != tc.c.SentBy || got.SavedAt != tc.c.SavedAt || got.AppVersion != tc.c.AppVersion {
			t.Errorf("%s: details %+v", tc.what, got)
		}
		sameRecipes(t, tc.what, got.Recipes, tc.c.Recipes)
		samePreps(t, tc.what, got.Preps, tc.c.Preps)
	}
}

// A copy saved before preparations could travel (the file was written by the Saltcast of
// that day from demoCarried and testPage) reads and verifies, and the same recipes are
// still carried in exactly the same bytes.
func TestCarriedFormat1StillReads(t *testing.T) {
	old, err := os.ReadFile("testdata/carried-format1.html")
	if err != nil {
		t.Fatal(err)
	}
	got, err := ExtractCarried(old)
	if err != nil {
		t.Fatalf("old copy: %v", err)
	}
	c := demoCarried(t)
	if !got.Sealed || got.Preps != nil || got.SentBy != c.SentBy {
		t.Errorf("old copy read as %+v", got)
	}
	sameRecipes(t, "old copy", got.Recipes, c.Recipes)
	now, err := WithCarried([]byte(testPage), c)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(now, old) {
		t.Errorf("a copy without preparations is no longer written as before:\n now %s\n old %s", now, old)
	}
}

func TestCarriedPrepsChecked(t *testing.T) {
	c := demoCarried(t)
	c.Preps = demoPreps(t)
	good, err := WithCarried([]byte(testPage), c)
	if err != nil {
		t.Fatal(err)
	}
	edit := func(old, new string) []byte {
		if !bytes.Contains(good, []byte(old)) {
			t.Fatalf("copy has no %q", old)
		}
		return bytes.Replace(good, []byte(old), []byte(new), 1)
	}
	// the second preparation taken out, its comma with it
	second := string(c.Preps[1].Encode())
	for _, tc := range []struct {
		what string
		in   []byte
		kind error
	}{
		{"a concentration changed", edit(`"concentration":1.5,`, `"concentration":1.6,`), ErrChecksum},
		{"a volume changed", edit(`"final_volume_mL":2000`, `"final_volume_mL":200`), ErrChecksum},
		{"a preparation's name changed", edit(`cold room`, `cold rooms`), ErrChecksum},
		{"a preparation taken out", edit(","+second, ""), ErrChecksum},
		{"the format turned back to 1", edit(`{"format":2,`, `{"format":1,`), ErrMalformed},
		{"a bad preparation", edit(`"concentration":1.5,`, `"concentration":-1.5,`), ErrMalformed},
		{"a preparation's name taken out", edit(`"name":"KCl 1.5 mol/L for the cold room (invented)",`, ``), ErrChecksum},
	} {
		got, err := ExtractCarried(tc.in)
		if !errors.Is(err, tc.kind) {
			t.Errorf("%s: error %v, want %v", tc.what, err, tc.kind)
		}
		if got.Recipes != nil || got.Preps != nil {
			t.Errorf("%s: came with %d recipes, %d preparations", tc.what, len(got.Recipes), len(got.Preps))
		}
	}
	// A carried format 1 block that holds preparations was not written by any Saltcast.
	plain := Carried{AppVersion: "v1", Recipes: named3("a")}
	js, _ := EncodeCarried(plain)
	withPrep := strings.Replace(string(js), `}]}`, `}],"preparations":[`+second+`]}`, 1)
	if _, err := ExtractCarried([]byte(withPrep)); !errors.Is(err, ErrMalformed) {
		t.Errorf("format 1 block with preparations: %v, want malformed", err)
	}
}

// A JSON export with preparations, dropped on the page, shows them too (no checksum).
func TestExtractExportWithPreps(t *testing.T) {
	ps := demoPreps(t)
	exp := recipe.Collection{Recipes: named3("a"), Preps: ps}.Encode()
	got, err := ExtractCarried(exp)
	if err != nil {
		t.Fatal(err)
	}
	if got.Sealed {
		t.Errorf("an export read as sealed")
	}
	samePreps(t, "export", got.Preps, ps)
	only := recipe.Collection{Preps: ps}.Encode()
	if got, err := ExtractCarried(only); err != nil || len(got.Preps) != len(ps) {
		t.Errorf("export of preparations only: %d, %v", len(got.Preps), err)
	}
}

func TestCarriedRefusesBadPrep(t *testing.T) {
	c := Carried{Preps: demoPreps(t)}
	c.Preps[0].Name = strings.Repeat("x", recipe.MaxNameBytes+1)
	_, err := EncodeCarried(c)
	var ce *CarryError
	if !errors.As(err, &ce) || !strings.Contains(err.Error(), "preparations[0]") {
		t.Errorf("too long a name: %v, want an error naming preparations[0]", err)
	}
}

func TestTakeInPreps(t *testing.T) {
	const day = "2026-12-01"
	ps := demoPreps(t)
	mine := ps[:1]
	changed := ps[0]
	changed.Concentration = 1.0
	all, added, same := TakeInPreps(mine, []recipe.Prep{ps[0], changed, ps[1]}, day)
	var got []string
	for _, p := range all {
		got = append(got, p.Name)
	}
	want := []string{ps[0].Name, ps[0].Name + " (received 2026-12-01)", ps[1].Name}
	if strings.Join(got, " | ") != strings.Join(want, " | ") || added != 2 || same != 1 {
		t.Errorf("TakeInPreps = %q, %d added, %d same; want %q, 2, 1", got, added, same, want)
	}
	if len(mine) != 1 || mine[0].Name != ps[0].Name {
		t.Errorf("TakeInPreps changed mine")
	}
	if _, err := recipe.DecodeAll(recipe.Collection{Preps: all}.Encode()); err != nil {
		t.Errorf("the list does not read back: %v", err)
	}
}
