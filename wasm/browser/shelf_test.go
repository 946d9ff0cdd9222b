package main

import (
	"math/rand/v2"
	"reflect"
	"strings"
	"testing"

	"saltcast/core/recipe"
)

func mustRecipe(t *testing.T, src string) recipe.Recipe {
	t.Helper()
	r, err := recipe.Decode([]byte(src))
	if err != nil {
		t.Fatal(err)
	}
	return r
}

// Saved, stored, exported and imported recipes come back byte for byte.
func TestShelfRoundTrip(t *testing.T) {
	var s Shelf
	s.Put(mustRecipe(t, `{"name":"a (invented)","solute":"KNO3","water_g":100,"dissolve_temp_C":35}`))
	s.Put(mustRecipe(t, `{"name":"<img src=x onerror=alert(1)>","solute":"NaCl","water_g":50,"dissolve_temp_C":20}`))
	s.Put(mustRecipe(t, `{"name":"a (invented)","solute":"KNO3","water_g":200,"dissolve_temp_C":35}`))
	if len(s.Recipes) != 2 || s.Recipes[0].WaterG.Value != 200 {
		t.Fatalf("Put did not replace by name: %s", s.Encode())
	}
	stored := s.Encode()
	back, err := LoadShelf(string(stored))
	if err != nil {
		t.Fatal(err)
	}
	var fresh Shelf
	if n, err := fresh.Import(back.Encode()); err != nil || n != 2 {
		t.Fatalf("Import = %d, %v", n, err)
	}
	if string(fresh.Encode()) != string(stored) {
		t.Errorf("after import:\n%s\nwant\n%s", fresh.Encode(), stored)
	}
}

// A file with one bad recipe changes nothing.
func TestImportAllOrNothing(t *testing.T) {
	var s Shelf
	s.Put(mustRecipe(t, `{"name":"keep","solute":"KNO3","water_g":100,"dissolve_temp_C":35}`))
	before := string(s.Encode())
	for _, bad := range []string{
		`{"format":1,"kind":"saltcast-recipes","recipes":[{"name":"new","solute":"KNO3","water_g":1,"dissolve_temp_C":20},{"name":"bad","solute":"KNO3","water_g":-1,"dissolve_temp_C":20}]}`,
		`{"format":1,"kind":"saltcast-recipes","recipes":[{"solute":"KNO3","water_g":1,"dissolve_temp_C":20}]}`, // no name
		`{"format":1,"kind":"saltcast-recipes","recipes":[`, // cut short
		`not json at all`,
		``,
	} {
		if _, err := s.Import([]byte(bad)); err == nil {
			t.Errorf("Import(%q) accepted", bad)
		}
		if got := string(s.Encode()); got != before {
			t.Errorf("Import(%q) changed the shelf to %s", bad, got)
		}
	}
	if n, err := s.Import([]byte(`{"name":"single","solute":"NaCl","water_g":10,"dissolve_temp_C":20}`)); err != nil || n != 1 {
		t.Errorf("a single recipe file: %d, %v", n, err)
	}
}

func TestShareFragment(t *testing.T) {
	r := mustRecipe(t, `{"name":"ünïcode & <tags>","solute":"CuSO4","charged_form":"CuSO4·5H2O","water_g":500,"dissolve_temp_C":60,"cool_to_C":20}`)
	frag := ShareFragment(r)
	got, ok, err := FromFragment(frag)
	if !ok || err != nil || string(got.Encode()) != string(r.Encode()) {
		t.Errorf("FromFragment(ShareFragment(r)) = %s, %v, %v", got.Encode(), ok, err)
	}
	if _, ok, _ := FromFragment("#top"); ok {
		t.Error("a plain fragment read as a recipe")
	}
	if _, ok, err := FromFragment(frag[:len(frag)-7]); !ok || err == nil {
		t.Error("a cut-short link was accepted")
	}
}

// Preparations travel with the batch recipes: a shelf holding both exports one file that
// imports again to the same shelf, byte for byte; a preparations file of the Make up screen
// and a single preparation import too; a shelf without preparations is written as before.
func TestShelfCarriesPreparations(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261203, 2))
	var s Shelf
	s.Put(recipe.Recipe{Format: 1, Name: "KNO3 batch (invented)", Solute: "KNO3", WaterG: recipe.Some(100), DissolveTempC: 40})
	before := string(s.Encode())
	if before != string(recipe.EncodeCollection(s.Recipes)) {
		t.Fatalf("a shelf without preparations is not the plain collection: %s", before)
	}
	var preps []recipe.Prep
	for i := range 20 {
		p := tablePrep(rng, i%2 == 0)
		p.Name = PrepName(p) + " #" + itoa(i)
		preps = append(preps, p)
		s.PutPrep(p)
	}
	exported := s.Encode()
	var back Shelf
	n, err := back.Import(exported)
	if err != nil || n != 21 {
		t.Fatalf("Import(export) = %d, %v", n, err)
	}
	if !reflect.DeepEqual(back.Preps, preps) || string(back.Encode()) != string(exported) {
		t.Fatalf("preparations changed through export and import:\n%s\n%s", exported, back.Encode())
	}
	var fromScreen Shelf
	if n, err := fromScreen.Import(recipe.EncodePrepCollection(preps)); err != nil || n != len(preps) {
		t.Fatalf("Import(preparations file) = %d, %v", n, err)
	}
	var one Shelf
	p := preps[0]
	p.Name = ""
	if n, err := one.Import(p.Encode()); err != nil || n != 1 || one.Preps[0].Name != PrepName(p) {
		t.Fatalf("Import(single preparation) = %d, %v, %+v", n, err, one.Preps)
	}
	// All or nothing: one bad preparation refuses the file and leaves the shelf as it was.
	bad := strings.Replace(string(exported), `"kind":"preparation"`, `"kind":"batch"`, 1)
	keep := string(back.Encode())
	if _, err := back.Import([]byte(bad)); err == nil || string(back.Encode()) != keep {
		t.Errorf("a bad preparation was imported or changed the shelf: %v", err)
	}
}
