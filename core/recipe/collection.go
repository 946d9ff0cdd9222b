package recipe

import (
	"strconv"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

// CollectionKind is the "kind" of a file holding many recipes.
const CollectionKind = "saltcast-recipes"

// MaxCollectionBytes bounds a collection file (many recipes of at most a few KiB each).
const MaxCollectionBytes = 4 << 20

// MaxCollectionRecipes bounds the number of recipes in one collection.
const MaxCollectionRecipes = 1000

// Collection is what a recipes file holds: batch recipes and, under "preparations",
// preparation recipes (both optional). A file without preparations is written exactly as
// before they could travel in it.
type Collection struct {
	Recipes []Recipe
	Preps   []Prep
}

// DecodeCollection reads {"format":1,"kind":"saltcast-recipes","recipes":[...]}, with any
// "preparations":[...] beside them. It is all or nothing: one bad recipe refuses the whole
// file, with the field named like "recipes[3].water_g" or "preparations[0].concentration",
// so an import never half-succeeds.
func DecodeCollection(data []byte) ([]Recipe, error) {
	c, err := DecodeAll(data)
	return c.Recipes, err
}

// DecodeAll reads a recipes file with its preparations, as DecodeCollection does.
func DecodeAll(data []byte) (Collection, error) {
	v, err := wire.DecodeLimits(data, wire.Limits{MaxBytes: MaxCollectionBytes, MaxDepth: 32})
	if err != nil {
		return Collection{}, err
	}
	return CollectionFromValue(v)
}

// CollectionFromValue checks a recipes file already read as JSON.
func CollectionFromValue(v wire.Value) (Collection, error) {
	if v.Kind != wire.Object {
		return Collection{}, &unit.FieldError{Field: "collection", Value: v.Kind.String(),
			Allowed: `an object {"format":1,"kind":"` + CollectionKind + `","recipes":[...]}`}
	}
	d := reader{}
	var items, preps []wire.Value
	kind := false
	list := func(key, what string, m wire.Value) []wire.Value {
		if m.Kind != wire.Array {
			d.fail(key, literal(m), "a list of "+what)
		}
		return m.Items
	}
	for _, m := range v.Members {
		switch m.Key {
		case "format":
			d.format(m.Value, CurrentFormat)
		case "kind":
			k := d.text("kind", m.Value, 100)
			if d.err == nil && k != CollectionKind {
				d.fail("kind", k, `"`+CollectionKind+`"`)
			}
			kind = true
		case "recipes":
			items = list("recipes", "recipes", m.Value)
		case "preparations":
			preps = list("preparations", "preparations", m.Value)
		default:
			d.fail(m.Key, m.Key, "one of the collection keys: format, kind, recipes, preparations")
		}
		if d.err != nil {
			return Collection{}, d.err
		}
	}
	if !kind {
		return Collection{}, &unit.FieldError{Field: "kind", Value: "", Allowed: `"` + CollectionKind + `" (the key is required)`}
	}
	if len(items)+len(preps) > MaxCollectionRecipes {
		return Collection{}, &unit.FieldError{Field: "recipes", Value: strconv.Itoa(len(items)+len(preps)) + " recipes",
			Allowed: "at most " + strconv.Itoa(MaxCollectionRecipes) + " recipes in one file"}
	}
	c := Collection{Recipes: make([]Recipe, 0, len(items))}
	for i, it := range items {
		r, err := fromValue(it, "recipes["+strconv.Itoa(i)+"].")
		if err != nil {
			return Collection{}, err
		}
		c.Recipes = append(c.Recipes, r)
	}
	for i, it := range preps {
		p, err := PrepFields.FromValue(it, "preparations["+strconv.Itoa(i)+"].")
		if err != nil {
			return Collection{}, err
		}
		c.Preps = append(c.Preps, p)
	}
	return c, nil
}

// EncodeCollection writes recipes as one collection file.
func EncodeCollection(recipes []Recipe) []byte { return Collection{Recipes: recipes}.Encode() }

// Encode writes the collection as one file; "preparations" only when there are some.
func (c Collection) Encode() []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	e.Key("kind").String(CollectionKind)
	e.Key("recipes").BeginArray()
	for _, r := range c.Recipes {
		r.encode(&e)
	}
	e.EndArray()
	if len(c.Preps) > 0 {
		e.Key("preparations").BeginArray()
		for _, p := range c.Preps {
			p.encode(&e)
		}
		e.EndArray()
	}
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		panic("recipe: EncodeCollection of a non-finite number: " + err.Error())
	}
	return b
}
