package main

import (
	"encoding/base64"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Shelf is the list of recipes kept in the browser, by name. It is stored as one recipe
// collection file (recipe.EncodeCollection), the same format Export writes and Import reads.
type Shelf struct{ Recipes []recipe.Recipe }

// LoadShelf reads what the browser stored; "" is an empty shelf.
func LoadShelf(stored string) (Shelf, error) {
	if strings.TrimSpace(stored) == "" {
		return Shelf{}, nil
	}
	rs, err := recipe.DecodeCollection([]byte(stored))
	return Shelf{Recipes: rs}, err
}

// Encode is what the browser stores, and what "export all" writes.
func (s Shelf) Encode() []byte { return recipe.EncodeCollection(s.Recipes) }

// Put keeps r under its name, replacing a recipe of the same name.
func (s *Shelf) Put(r recipe.Recipe) {
	for i := range s.Recipes {
		if s.Recipes[i].Name == r.Name {
			s.Recipes[i] = r
			return
		}
	}
	s.Recipes = append(s.Recipes, r)
}

// Get returns the recipe saved under name.
func (s Shelf) Get(name string) (recipe.Recipe, bool) {
	for _, r := range s.Recipes {
		if r.Name == name {
			return r, true
		}
	}
	return recipe.Recipe{}, false
}

// Delete removes the recipe saved under name.
func (s *Shelf) Delete(name string) {
	for i := range s.Recipes {
		if s.Recipes[i].Name == name {
			s.Recipes = append(s.Recipes[:i], s.Recipes[i+1:]...)
			return
		}
	}
}

// ReadImport reads an import file: a recipe collection or a single recipe. It is all or
// nothing: any error refuses the whole file, and nothing is returned. Every recipe needs a
// name, since the shelf keeps recipes by name.
func ReadImport(data []byte) ([]recipe.Recipe, error) {
	v, err := wire.DecodeLimits(data, wire.Limits{MaxBytes: recipe.MaxCollectionBytes, MaxDepth: 32})
	if err != nil {
		return nil, err
	}
	var rs []recipe.Recipe
	if _, ok := v.Get("kind"); ok {
		if rs, err = recipe.DecodeCollection(data); err != nil {
			return nil, err
		}
	} else {
		r, err := recipe.Decode(data)
		if err != nil {
			return nil, err
		}
		rs = []recipe.Recipe{r}
	}
	for i, r := range rs {
		if strings.TrimSpace(r.Name) == "" {
			return nil, &unit.FieldError{Field: "recipes[" + itoa(i) + "].name", Value: "",
				Allowed: "a name for every recipe (recipes are kept by name)"}
		}
	}
	return rs, nil
}

// Import puts every recipe of an import file on the shelf, or none (see ReadImport).
func (s *Shelf) Import(data []byte) (int, error) {
	rs, err := ReadImport(data)
	if err != nil {
		return 0, err
	}
	for _, r := range rs {
		s.Put(r)
	}
	return len(rs), nil
}

// shareKey starts the URL fragment that carries a recipe.
const shareKey = "#recipe="

// ShareFragment is the URL fragment that carries r: "#recipe=" and the recipe JSON in
// unpadded base64url. A fragment never leaves the browser in a request.
func ShareFragment(r recipe.Recipe) string {
	return shareKey + base64.RawURLEncoding.EncodeToString(r.Encode())
}

// FromFragment reads a recipe from a URL fragment made by ShareFragment. ok is false when
// the fragment carries no recipe.
func FromFragment(hash string) (r recipe.Recipe, ok bool, err error) {
	if !strings.HasPrefix(hash, shareKey) {
		return recipe.Recipe{}, false, nil
	}
	b, err := base64.RawURLEncoding.DecodeString(strings.TrimRight(hash[len(shareKey):], "="))
	if err != nil {
		return recipe.Recipe{}, true, &unit.FieldError{Field: "link", Value: "#recipe=…",
			Allowed: "a link made by Saltcast's Share button (this one is cut short or changed)"}
	}
	r, err = recipe.Decode(b)
	return r, true, err
}

func itoa(i int) string {
	if i == 0 {
		return "0"
	}
	var b [20]byte
	n := len(b)
	for ; i > 0; i /= 10 {
		n--
		b[n] = byte('0' + i%10)
	}
	return string(b[n:])
}
