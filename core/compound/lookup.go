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

// Match is one compound found by Search, with the form the query named: the hydrate when the
// query matched a hydrate's formula or name ("washing soda", "CuSO4·5"), else the anhydrous form.
type Match struct {
	Compound *Compound
	Form     *Form
}

// Search lists up to max compounds whose id, name, other names, or a form's formula or name
// contain query, best first: an exact name or formula, then one that starts with the query,
// then one with a word that starts with it, then any other. Within a rank the library's order
// holds, and a compound is listed once, with the form of its best hit. Names are folded as
// Lookup folds them ("sulphate" = "sulfate", any letter case). An empty query lists the first
// max compounds of the library.
func Search(query string, max int) []Match {
	qn := strings.TrimPrefix(nameKey(query), "n:")
	qf := strings.TrimPrefix(formulaKey(query), "f:")
	type hit struct {
		m    Match
		rank int
	}
	var hits []hit
	for _, e := range searchable() {
		best := hit{rank: 4}
		for _, k := range e.keys {
			r := min(rankOf(k.name, qn), rankOf(k.formula, qf))
			if r < best.rank {
				best = hit{Match{e.c, k.f}, r}
			}
		}
		if best.rank < 4 {
			hits = append(hits, best)
		}
	}
	out := make([]Match, 0, max)
	for rank := 0; rank < 4 && len(out) < max; rank++ {
		for _, h := range hits {
			if h.rank == rank && len(out) < max {
				out = append(out, h.m)
			}
		}
	}
	return out
}

// searchKey is one name or formula of a compound, folded both ways, and the form it names.
type searchKey struct {
	name, formula string
	f             *Form
}

// searchable folds every name of the library once, in the library's order.
var searchable = sync.OnceValue(func() []struct {
	c    *Compound
	keys []searchKey
} {
	lib := load()
	out := make([]struct {
		c    *Compound
		keys []searchKey
	}, len(lib.all))
	for i, c := range lib.all {
		out[i].c = c
		add := func(text string, f *Form) {
			out[i].keys = append(out[i].keys, searchKey{
				strings.TrimPrefix(nameKey(text), "n:"), strings.TrimPrefix(formulaKey(text), "f:"), f})
		}
		anh := c.Forms[0]
		add(c.ID, anh)
		add(c.Name, anh)
		for _, n := range c.Names {
			add(n, anh)
		}
		for _, f := range c.Forms[1:] {
			add(f.Formula, f)
			for _, n := range f.Names {
				add(n, f)
			}
		}
	}
	return out
})

// rankOf says how well the folded text matches the folded query: 0 the same, 1 it starts with
// the query, 2 a word of it does, 3 it contains the query, 4 not at all. An empty query
// matches everything at rank 3.
func rankOf(text, q string) int {
	switch {
	case q == "":
		return 3
	case text == q:
		return 0
	case strings.HasPrefix(text, q):
		return 1
	case strings.Contains(text, " "+q) || strings.Contains(text, "("+q):
		return 2
	case strings.Contains(text, q):
		return 3
	}
	return 4
}
