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

// DecodeCollection reads {"format":1,"kind":"saltcast-recipes","recipes":[...]}. It is all
// or nothing: one bad recipe refuses the whole file, with the field named like
// "recipes[3].water_g", so an import never half-succeeds.
func DecodeCollection(data []byte) ([]Recipe, error) {
	v, err := wire.DecodeLimits(data, wire.Limits{MaxBytes: MaxCollectionBytes, MaxDepth: 32})
	if err != nil {
		return nil, err
	}
	if v.Kind != wire.Object {
		return nil, &unit.FieldError{Field: "collection", Value: v.Kind.String(),
			Allowed: `an object {"format":1,"kind":"` + CollectionKind + `","recipes":[...]}`}
	}
	d := reader{}
	var items []wire.Value
	kind := false
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
			if m.Value.Kind != wire.Array {
				d.fail("recipes", literal(m.Value), "a list of recipes")
			}
			items = m.Value.Items
		default:
			d.fail(m.Key, m.Key, "one of the collection keys: format, kind, recipes")
		}
		if d.err != nil {
			return nil, d.err
		}
	}
	if !kind {
		return nil, &unit.FieldError{Field: "kind", Value: "", Allowed: `"` + CollectionKind + `" (the key is required)`}
	}
	if len(items) > MaxCollectionRecipes {
		return nil, &unit.FieldError{Field: "recipes", Value: strconv.Itoa(len(items)) + " recipes",
			Allowed: "at most " + strconv.Itoa(MaxCollectionRecipes) + " recipes in one file"}
	}
	out := make([]Recipe, 0, len(items))
	for i, it := range items {
		r, err := fromValue(it, "recipes["+strconv.Itoa(i)+"].")
		if err != nil {
			return nil, err
		}
		out = append(out, r)
	}
	return out, nil
}

// EncodeCollection writes recipes as one collection file.
func EncodeCollection(recipes []Recipe) []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	e.Key("kind").String(CollectionKind)
	e.Key("recipes").BeginArray()
	for _, r := range recipes {
		r.encode(&e)
	}
	e.EndArray()
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		panic("recipe: EncodeCollection of a non-finite number: " + err.Error())
	}
	return b
}
