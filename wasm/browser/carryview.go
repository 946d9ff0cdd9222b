package main

import (
	"saltcast/web/carry"
	"strings"

	"saltcast/core/recipe"
)

// The words of the carried-recipes screens, kept apart from the DOM so host tests read them.

// CarriedNote is the line shown on opening a copy that carries recipes.
func CarriedNote(c carry.Carried) string {
	s := "This copy of Saltcast carries " + carriedCount(c)
	if c.SentBy != "" {
		s += " from " + c.SentBy
	}
	return s + ". They are kept apart from your own until you take them in."
}

// carriedCount says what c holds: "2 recipes", "2 recipes and 1 preparation",
// "1 preparation".
func carriedCount(c carry.Carried) string {
	switch {
	case len(c.Preps) == 0:
		return plural(len(c.Recipes), "recipe")
	case len(c.Recipes) == 0:
		return plural(len(c.Preps), "preparation")
	}
	return plural(len(c.Recipes), "recipe") + " and " + plural(len(c.Preps), "preparation")
}

// FromLine says where received recipes come from.
func FromLine(c carry.Carried, source string) string {
	var b strings.Builder
	b.WriteString(carriedCount(c))
	if source == "" || source == "this copy" {
		b.WriteString(" carried by this copy")
	} else {
		b.WriteString(" from the file “" + source + "”")
	}
	if c.SentBy != "" {
		b.WriteString(", sent by " + c.SentBy)
	}
	if c.SavedAt != "" {
		b.WriteString(", saved " + c.SavedAt[:10] + " " + c.SavedAt[11:16] + " UTC")
	}
	if c.AppVersion != "" {
		b.WriteString(" with Saltcast " + c.AppVersion)
	}
	if !c.Sealed {
		b.WriteString(" (a recipe export: no sender or checksum recorded)")
	}
	return b.String() + "."
}

// TakeInMessage reports what TakeIn did: rs were offered, added of them are new to the
// list (renamed holds them as kept), same were there already.
func TakeInMessage(rs, kept []recipe.Recipe, added, same int) string {
	return takeInWords(recipeNames(rs), recipeNames(kept), added, same, "recipe")
}

// TakeInPrepsMessage reports what TakeInPreps did, as TakeInMessage does for recipes.
func TakeInPrepsMessage(ps, kept []recipe.Prep, added, same int) string {
	return takeInWords(prepNames(ps), prepNames(kept), added, same, "preparation")
}

func recipeNames(rs []recipe.Recipe) []string {
	n := make([]string, len(rs))
	for i, r := range rs {
		n[i] = r.Name
	}
	return n
}

func prepNames(ps []recipe.Prep) []string {
	n := make([]string, len(ps))
	for i, p := range ps {
		n[i] = p.Name
	}
	return n
}

// takeInWords is TakeInMessage for a noun: offered names were taken in, kept the names the
// added ones are kept under.
func takeInWords(offered, kept []string, added, same int, noun string) string {
	var b strings.Builder
	if added > 0 {
		b.WriteString("Took " + plural(added, noun) + " into your list.")
	}
	if same > 0 {
		if b.Len() > 0 {
			b.WriteString(" ")
		}
		if same == 1 {
			b.WriteString("1 was there already.")
		} else {
			b.WriteString(itoa(same) + " were there already.")
		}
	}
	// Name each clash: the received one kept beside the user's under a marked name.
	names := map[string]bool{}
	for _, n := range offered {
		names[n] = true
	}
	for _, k := range kept {
		if !names[k] {
			b.WriteString(" A " + noun + " of the same name was kept as “" + k + "”.")
		}
	}
	return b.String()
}

// InList reports whether the list holds r as it is (same name, same recipe).
func InList(list []recipe.Recipe, r recipe.Recipe) bool {
	enc := r.Encode()
	for _, x := range list {
		if x.Name == r.Name && string(x.Encode()) == string(enc) {
			return true
		}
	}
	return false
}

// InListPrep reports whether the list holds p as it is (same name, same preparation).
func InListPrep(list []recipe.Prep, p recipe.Prep) bool {
	enc := p.Encode()
	for _, x := range list {
		if x.Name == p.Name && string(x.Encode()) == string(enc) {
			return true
		}
	}
	return false
}

// UTCStamp turns Date.toISOString's "2026-12-01T09:30:00.123Z" into the carried format's
// "2026-12-01T09:30:00Z"; anything else gives "" (no time recorded).
func UTCStamp(iso string) string {
	if len(iso) == 24 && iso[19] == '.' && iso[23] == 'Z' {
		return iso[:19] + "Z"
	}
	return ""
}

// CopyFileName names a saved copy after the local date.
func CopyFileName(date string) string {
	return "saltcast-with-recipes-" + date + ".html"
}

// YMD writes a date as 2026-12-01.
func YMD(y, m, d int) string {
	two := func(n int) string {
		if n < 10 {
			return "0" + itoa(n)
		}
		return itoa(n)
	}
	return itoa(y) + "-" + two(m) + "-" + two(d)
}

// carryMessage turns an error of ExtractCarried or WithCarried into a sentence.
func carryMessage(err error) string {
	s := err.Error()
	if s == "" {
		return "unknown error."
	}
	if c := s[0]; 'a' <= c && c <= 'z' {
		s = string(c-'a'+'A') + s[1:]
	}
	if !strings.HasSuffix(s, ".") {
		s += "."
	}
	return s
}

func plural(n int, word string) string {
	if n == 1 {
		return "1 " + word
	}
	return itoa(n) + " " + word + "s"
}

// atoi reads a small non-negative number from an attribute the program wrote; -1 if it is
// not one.
func atoi(s string) int {
	if s == "" || len(s) > 6 {
		return -1
	}
	n := 0
	for _, c := range s {
		if c < '0' || c > '9' {
			return -1
		}
		n = n*10 + int(c-'0')
	}
	return n
}
