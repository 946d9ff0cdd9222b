package main

import (
	"encoding/base64"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Shelf is the list of recipes kept in the browser, by name: batch recipes and, apart,
// preparations. It is stored as one recipe collection file (recipe.Collection), the same
// format Export writes and Import reads.
type Shelf struct {
	Recipes []recipe.Recipe
	Preps   []recipe.Prep
}

// LoadShelf reads what the browser stored; "" is an empty shelf.
func LoadShelf(stored string) (Shelf, error) {
	if strings.TrimSpace(stored) == "" {
		return Shelf{}, nil
	}
	c, err := recipe.DecodeAll([]byte(stored))
	return Shelf{Recipes: c.Recipes, Preps: c.Preps}, err
}

// Encode is what the browser stores, and what "export all" writes.
func (s Shelf) Encode() []byte { return recipe.Collection{Recipes: s.Recipes, Preps: s.Preps}.Encode() }

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

// PutPrep keeps p under its name, replacing a preparation of the same name. The list is
// copied first, so a Shelf copied before still holds the old one.
func (s *Shelf) PutPrep(p recipe.Prep) {
	s.Preps = append([]recipe.Prep(nil), s.Preps...)
	for i := range s.Preps {
		if s.Preps[i].Name == p.Name {
			s.Preps[i] = p
			return
		}
	}
	s.Preps = append(s.Preps, p)
}

// DeletePrep removes the preparation at i (the list is copied first).
func (s *Shelf) DeletePrep(i int) {
	s.Preps = append(append([]recipe.Prep(nil), s.Preps[:i]...), s.Preps[i+1:]...)
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

// PrepName is the name a preparation is kept under: its own, else what it makes.
func PrepName(p recipe.Prep) string {
	if n := strings.TrimSpace(p.Name); n != "" {
		return p.Name
	}
	return p.Solute + " " + exact(p.Concentration) + " " + p.ConcentrationUnit
}

// ReadImport reads an import file: a recipe collection (with or without preparations), a
// preparations file of the Make up screen, a single recipe or a single preparation. It is
// all or nothing: any error refuses the whole file, and nothing is returned. Every batch
// recipe needs a name, since the shelf keeps recipes by name; a preparation without one is
// named after what it makes.
func ReadImport(data []byte) (recipe.Collection, error) {
	v, err := wire.DecodeLimits(data, wire.Limits{MaxBytes: recipe.MaxCollectionBytes, MaxDepth: 32})
	if err != nil {
		return recipe.Collection{}, err
	}
	var c recipe.Collection
	kind, hasKind := v.Get("kind")
	switch {
	case hasKind && kind.Kind == wire.String && kind.Text == recipe.PrepCollectionKind:
		c.Preps, err = recipe.DecodePrepCollection(data)
	case hasKind && kind.Kind == wire.String && kind.Text == recipe.PrepKind:
		var p recipe.Prep
		if p, err = recipe.DecodePrepValue(v, ""); err == nil {
			c.Preps = []recipe.Prep{p}
		}
	case hasKind:
		c, err = recipe.CollectionFromValue(v)
	default:
		var r recipe.Recipe
		if r, err = recipe.DecodeValue(v); err == nil {
			c.Recipes = []recipe.Recipe{r}
		}
	}
	if err != nil {
		return recipe.Collection{}, err
	}
	for i, r := range c.Recipes {
		if strings.TrimSpace(r.Name) == "" {
			return recipe.Collection{}, &unit.FieldError{Field: "recipes[" + itoa(i) + "].name", Value: "",
				Allowed: "a name for every recipe (recipes are kept by name)"}
		}
	}
	for i := range c.Preps {
		c.Preps[i].Name = PrepName(c.Preps[i])
	}
	return c, nil
}

// Import puts every recipe and preparation of an import file on the shelf, or none (see
// ReadImport); n counts both.
func (s *Shelf) Import(data []byte) (int, error) {
	c, err := ReadImport(data)
	if err != nil {
		return 0, err
	}
	for _, r := range c.Recipes {
		s.Put(r)
	}
	for _, p := range c.Preps {
		s.PutPrep(p)
	}
	return len(c.Recipes) + len(c.Preps), nil
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
