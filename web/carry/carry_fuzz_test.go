package carry

import (
	"bytes"
	"errors"
	"os"
	"saltcast/core/recipe"
	"testing"
)

// FuzzExtractCarried feeds arbitrary files to the extractor. Properties: it never panics;
// an error is a *CarryError and comes with nothing; what it accepts has names and at most
// recipe.MaxCollectionRecipes recipes and preparations together, and survives being
// carried again unchanged, preparations included.
func FuzzExtractCarried(f *testing.F) {
	c := Carried{AppVersion: "v1", SavedAt: "2026-12-01T09:30:00Z", SentBy: "bench 2",
		Recipes: named3("stock A", "<b>x</b>")}
	page, err := WithCarried([]byte(testPage), c)
	if err != nil {
		f.Fatal(err)
	}
	js, _ := EncodeCarried(c)
	f.Add(page)
	f.Add(js)
	f.Add([]byte(testPage))
	f.Add(recipe.EncodeCollection(c.Recipes))
	f.Add(c.Recipes[0].Encode())
	f.Add([]byte(`<script type=application/x-saltcast-recipes>{"format":1,"kind":"saltcast-carried-recipes"}`))
	f.Add([]byte(`<script type="application/x-saltcast-recipes"><!--</script>`))
	f.Add([]byte(`<scrip<script type='x'<script type=application/x-saltcast-recipes a="`))
	// with preparations: a page, a block, an export; and an old format 1 copy
	cp := c
	cp.Preps = demoPreps(f)
	if page, err = WithCarried([]byte(testPage), cp); err != nil {
		f.Fatal(err)
	}
	js, _ = EncodeCarried(cp)
	f.Add(page)
	f.Add(js)
	f.Add(recipe.Collection{Recipes: c.Recipes, Preps: cp.Preps}.Encode())
	f.Add(recipe.Collection{Preps: cp.Preps[:1]}.Encode())
	if old, err := os.ReadFile("testdata/carried-format1.html"); err == nil {
		f.Add(old)
	}
	f.Fuzz(func(t *testing.T, data []byte) {
		got, err := ExtractCarried(data)
		if err != nil {
			var ce *CarryError
			if !errors.As(err, &ce) {
				t.Fatalf("error %T %v is not a *CarryError", err, err)
			}
			if got.Recipes != nil || got.Preps != nil || got.Sealed || got.SentBy != "" || got.AppVersion != "" || got.SavedAt != "" {
				t.Fatalf("error %v came with %+v", err, got)
			}
			return
		}
		if n := len(got.Recipes) + len(got.Preps); n == 0 || n > recipe.MaxCollectionRecipes {
			t.Fatalf("accepted %d recipes and %d preparations", len(got.Recipes), len(got.Preps))
		}
		again, err := WithCarried([]byte(testPage), got)
		if err != nil {
			t.Fatalf("accepted content cannot be carried again: %v", err)
		}
		back, err := ExtractCarried(again)
		if err != nil {
			t.Fatalf("carried again, it does not read: %v", err)
		}
		if !bytes.Equal(recipe.Collection{Recipes: back.Recipes, Preps: back.Preps}.Encode(),
			recipe.Collection{Recipes: got.Recipes, Preps: got.Preps}.Encode()) ||
			back.SentBy != got.SentBy || back.SavedAt != got.SavedAt || back.AppVersion != got.AppVersion {
			t.Fatalf("carried again, it changed")
		}
	})
}

// FuzzWithCarried puts a block into arbitrary pages: never a panic, and a page it accepts
// gives the same recipes back.
func FuzzWithCarried(f *testing.F) {
	f.Add([]byte(testPage))
	f.Add([]byte(pageNoBlock))
	f.Add([]byte("<body></body>"))
	f.Add([]byte("<script></body>"))
	f.Add([]byte(`<!--</body>--></body><script type=application/x-saltcast-recipes>`))
	c := Carried{AppVersion: "v1", Recipes: named3("one")}
	f.Fuzz(func(t *testing.T, page []byte) {
		out, err := WithCarried(page, c)
		if err != nil {
			return
		}
		got, err := ExtractCarried(out)
		if err != nil {
			// The page may hide the block: an unclosed comment or raw-text element before
			// </body> swallows it. That refusal is what a browser would do too, so only
			// check that the block is in the output.
			if !bytes.Contains(out, []byte(`id="saltcast-carried">{"format":1`)) {
				t.Fatalf("WithCarried accepted the page but wrote no block")
			}
			return
		}
		if !bytes.Equal(recipe.EncodeCollection(got.Recipes), recipe.EncodeCollection(c.Recipes)) {
			t.Fatalf("recipes changed")
		}
	})
}
