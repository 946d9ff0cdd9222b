// Package demo holds Saltcast's demo recipes, embedded once: the page's example buttons,
// `saltcast demo` without files, and the tests all read these files. They are invented
// batches, marked "(invented)" in their notes; they are examples of the format, not data.
//
// To add one: put its JSON file in this folder, add it to All, and give the page a button
// with data-demo set to its Key (web/shell.html); the tests check that each file decodes
// and plans and that the page offers every demo.
package demo

import (
	_ "embed" // the recipe files

	"saltcast/core/recipe"
)

//go:embed demo-kno3-stock.json
var kno3 []byte

//go:embed demo-cuso4-crystals.json
var cuso4 []byte

//go:embed demo-prep-kcl-coldroom.json
var prepKCl []byte

// Demo is one demo recipe.
type Demo struct {
	Key  string // the page's name for it (data-demo="kno3")
	File string // its file name in this folder
	JSON []byte // the file; callers must not change it
}

// All are the demo recipes, in the order they are offered.
var All = []Demo{
	{Key: "kno3", File: "demo-kno3-stock.json", JSON: kno3},
	{Key: "cuso4", File: "demo-cuso4-crystals.json", JSON: cuso4},
}

// Preps are the demo preparations (solutions made up to the mark), read by recipe.DecodePrep.
var Preps = []Demo{
	{Key: "kcl-coldroom", File: "demo-prep-kcl-coldroom.json", JSON: prepKCl},
}

// Lookup finds a demo batch or preparation by its Key or its File name.
func Lookup(name string) (Demo, bool) {
	for _, d := range append(All[:len(All):len(All)], Preps...) {
		if d.Key == name || d.File == name {
			return d, true
		}
	}
	return Demo{}, false
}

// Recipe decodes the demo called name (a Key or a File name). The files are checked by the
// tests, but an error is still returned, never dropped.
func Recipe(name string) (recipe.Recipe, error) {
	d, ok := Lookup(name)
	if !ok {
		return recipe.Recipe{}, &unknownError{name}
	}
	return recipe.Decode(d.JSON)
}

type unknownError struct{ name string }

func (e *unknownError) Error() string { return "demo: no demo recipe called " + e.name }
