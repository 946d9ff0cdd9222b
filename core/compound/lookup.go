package compound

import (
	_ "embed"
	"strings"
	"sync"
	"unicode"

	"saltcast/core/unit"
)

//go:embed library.txt
var libraryText []byte

type entry struct {
	c *Compound
	f *Form
}

type library struct {
	all   []*Compound
	index map[string]entry
}

// load parses the embedded library once. The library is part of the program, so a parse error
// is a programmer error that the package tests catch; load panics on it.
var load = sync.OnceValue(func() *library {
	all, err := Parse(libraryText)
	if err != nil {
		panic("compound: embedded library.txt: " + err.Error())
	}
	lib := &library{all: all, index: map[string]entry{}}
	add := func(key string, e entry) {
		if key == "" {
			return
		}
		if old, dup := lib.index[key]; dup && (old.c != e.c || old.f != e.f) {
			panic("compound: name " + key + " is used by " + old.c.ID + " and " + e.c.ID)
		}
		lib.index[key] = e
	}
	for _, c := range all {
		anh := c.Forms[0]
		add(formulaKey(c.ID), entry{c, anh})
		add(nameKey(c.Name), entry{c, anh})
		for _, n := range c.Names {
			add(nameKey(n), entry{c, anh})
			add(formulaKey(n), entry{c, anh})
		}
		for _, f := range c.Forms {
			add(formulaKey(f.Formula), entry{c, f})
			for _, n := range f.Names {
				add(nameKey(n), entry{c, f})
				add(formulaKey(n), entry{c, f})
			}
		}
	}
	return lib
})

// All returns the library's compounds in the order of the data file. The slice is a copy; the
// compounds are shared and must not be modified.
func All() []*Compound {
	return append([]*Compound(nil), load().all...)
}

// Lookup finds a compound by id ("KNO3", "CH3COONa"), by the formula of a form typed with '·',
// '.', '*' or spaces ("CuSO4.5H2O"), or by a common name in any letter case ("potassium
// nitrate", "Glauber's salt", "epsom salt"; "sulphate" is read as "sulfate"). It returns the
// form named: the anhydrous form for an id or the name of the salt, the hydrate for a hydrate
// formula or a hydrate's name. An unknown name is a *unit.FieldError for "solute".
func Lookup(name string) (*Compound, *Form, error) {
	lib := load()
	if len(name) <= 200 {
		if e, ok := lib.index[nameKey(name)]; ok {
			return e.c, e.f, nil
		}
		if e, ok := lib.index[formulaKey(name)]; ok {
			return e.c, e.f, nil
		}
	}
	return nil, nil, &unit.FieldError{Field: "solute", Value: name,
		Allowed: "a compound of the library by formula or name (e.g. KNO3, CuSO4·5H2O, sodium acetate trihydrate), or a custom solute with its own curve"}
}

// nameKey folds a name for look-up: lower case, apostrophes dropped, runs of spaces, hyphens
// and underscores made one space, "sulph" read as "sulf".
func nameKey(s string) string {
	var b strings.Builder
	space := false
	for _, r := range strings.TrimSpace(s) {
		switch {
		case r == '\'' || r == '’' || r == '`' || r == '‘':
			continue
		case unicode.IsSpace(r) || r == '-' || r == '_':
			space = true
			continue
		}
		if space && b.Len() > 0 {
			b.WriteByte(' ')
		}
		space = false
		b.WriteRune(unicode.ToLower(r))
	}
	return "n:" + strings.ReplaceAll(b.String(), "sulph", "sulf")
}

// formulaKey folds a formula for look-up: spaces dropped, every hydrate dot made '·', lower case.
func formulaKey(s string) string {
	s = normalizeDots(s)
	var b strings.Builder
	for _, r := range s {
		if unicode.IsSpace(r) {
			continue
		}
		b.WriteRune(unicode.ToLower(r))
	}
	return "f:" + b.String()
}
