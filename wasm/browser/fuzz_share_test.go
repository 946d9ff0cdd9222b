package main

import (
	"errors"
	"strings"
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Seeds also live in testdata/fuzz/<target>/ beside this file (Go reads them from there).

// inputError reports whether err is the user's: a bad field or malformed JSON.
func inputError(err error) bool {
	var fe *unit.FieldError
	var se *wire.SyntaxError
	return errors.As(err, &fe) || errors.As(err, &se)
}

// FuzzFromFragment checks the share-link reader: it never panics; a fragment without the
// recipe prefix is ignored; a bad one is refused as an input error; an accepted one shares
// again to a link that reads back the same recipe.
func FuzzFromFragment(f *testing.F) {
	r, _ := recipe.Decode([]byte(`{"name":"stock (invented)","solute":"KNO3","water_g":100,"dissolve_temp_C":60,"cool_to_C":20}`))
	f.Add(ShareFragment(r))
	f.Add("#recipe=")
	f.Add("#recipe=e30")
	f.Add("#recipe=eyJzb2x1dGUiOiJLTk8zIn0=")
	f.Add("#recipe=%%%")
	f.Add("#other")
	f.Add("")
	f.Fuzz(func(t *testing.T, hash string) {
		r, ok, err := FromFragment(hash)
		if !strings.HasPrefix(hash, shareKey) {
			if ok || err != nil {
				t.Fatalf("FromFragment(%q) = %v, %v; want no recipe and no error", hash, ok, err)
			}
			return
		}
		if !ok {
			t.Fatalf("FromFragment(%q): ok false for a recipe link", hash)
		}
		if err != nil {
			if !inputError(err) {
				t.Fatalf("FromFragment(%q) error %v is not an input error", hash, err)
			}
			return
		}
		again, ok, err := FromFragment(ShareFragment(r))
		if !ok || err != nil || string(again.Encode()) != string(r.Encode()) {
			t.Fatalf("share link of %s reads back as %s, %v, %v", r.Encode(), again.Encode(), ok, err)
		}
	})
}

// FuzzImport checks that an import is all or nothing: a refused file leaves the shelf exactly
// as it was, with an input error; an accepted one puts every recipe on the shelf, and its
// export imports again to the same recipes.
func FuzzImport(f *testing.F) {
	f.Add([]byte(`{"format":1,"kind":"saltcast-recipes","recipes":[{"name":"a (invented)","solute":"KNO3","water_g":100,"dissolve_temp_C":60}]}`))
	f.Add([]byte(`{"name":"b (invented)","solute":"NaCl","water_mL":250,"dissolve_temp_C":25}`))
	f.Add([]byte(`{"format":1,"kind":"saltcast-recipes","recipes":[{"name":"a","solute":"KNO3","water_g":100,"dissolve_temp_C":60},{"name":"c","solute":"KNO3","water_g":0,"dissolve_temp_C":60}]}`))
	f.Add([]byte(`{"format":2,"kind":"saltcast-recipes","recipes":[]}`))
	f.Add([]byte(`{"solute":"KNO3","water_g":100,"dissolve_temp_C":60}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		var s Shelf
		for _, in := range []string{
			`{"name":"kept 1 (invented)","solute":"KNO3","water_g":100,"dissolve_temp_C":60}`,
			`{"name":"kept 2 (invented)","solute":"CuSO4·5H2O","water_g":50,"dissolve_temp_C":70,"cool_to_C":20}`,
		} {
			r, err := recipe.Decode([]byte(in))
			if err != nil {
				t.Fatal(err)
			}
			s.Put(r)
		}
		before := string(s.Encode())
		n, err := s.Import(data)
		if err != nil {
			if !inputError(err) {
				t.Fatalf("Import error %v is not an input error", err)
			}
			if n != 0 || string(s.Encode()) != before {
				t.Fatalf("a refused import changed the shelf: %d recipes, %s", n, s.Encode())
			}
			return
		}
		c, _ := ReadImport(data)
		for _, r := range c.Recipes {
			if _, ok := s.Get(r.Name); !ok {
				t.Fatalf("imported recipe %q is not on the shelf", r.Name)
			}
		}
		exported := c.Encode()
		again, err := ReadImport(exported)
		if err != nil || string(again.Encode()) != string(exported) {
			t.Fatalf("export of an import does not import again: %v\n%s", err, exported)
		}
	})
}

// FuzzParsePoints checks the custom-points box: it never panics, refuses with a field error
// naming the box, and what it accepts is written back by FormatPoints to the same points.
func FuzzParsePoints(f *testing.F) {
	f.Add("0; 13,3\n20; 31,6\n40; 63,9")
	f.Add("# T  g\n0 10\n\n50\t20")
	f.Add("1.234,5; 2")
	f.Add("20; NaN")
	f.Add("20;;30")
	f.Fuzz(func(t *testing.T, text string) {
		pts, err := ParsePoints("points", text)
		if err != nil {
			var fe *unit.FieldError
			if !errors.As(err, &fe) || fe.Field != "points" {
				t.Fatalf("ParsePoints(%q) error %v does not name the box", text, err)
			}
			return
		}
		again, err := ParsePoints("points", FormatPoints(pts))
		if err != nil || len(again) != len(pts) {
			t.Fatalf("FormatPoints of %v reads back as %v, %v", pts, again, err)
		}
		for i := range pts {
			if again[i] != pts[i] {
				t.Fatalf("point %d: %v reads back as %v", i, pts[i], again[i])
			}
		}
	})
}
