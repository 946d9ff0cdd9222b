package carry

import (
	"saltcast/core/recipe"
	"strconv"
	"strings"
	"unicode/utf8"
)

// TakeIn adds received recipes to mine without overwriting any of mine. A received recipe
// whose name is already taken keeps its place beside the one it clashes with, renamed
// "name (received 2026-12-01)" with day, the local date of taking it in; if that name is
// taken too, "name (received 2026-12-01, 2)" and so on. A received recipe identical to one
// already kept under the same name (the same canonical JSON) is not added twice: same
// counts those. A name that would grow past the 200 bytes a recipe name may hold is cut
// first, at a character boundary, so the list still reads back. An empty name becomes
// "unnamed". mine is not changed; the result starts with mine.
func TakeIn(mine, received []recipe.Recipe, day string) (all []recipe.Recipe, added, same int) {
	return takeIn(mine, received, day, func(r *recipe.Recipe) *string { return &r.Name }, recipe.Recipe.Encode)
}

// TakeInPreps adds received preparations to mine as TakeIn adds recipes: a clash of names
// keeps both, the received one renamed "name (received day)"; one identical to a kept
// preparation of the same name is counted in same and not added again.
func TakeInPreps(mine, received []recipe.Prep, day string) (all []recipe.Prep, added, same int) {
	return takeIn(mine, received, day, func(p *recipe.Prep) *string { return &p.Name }, recipe.Prep.Encode)
}

// takeIn is TakeIn for recipes of any kind: name gives the name to read and set, encode the
// canonical JSON that tells identical ones apart.
func takeIn[R any](mine, received []R, day string, name func(*R) *string, encode func(R) []byte) (all []R, added, same int) {
	day = cutName(day, 32) // a date; longer text would crowd out the name
	all = make([]R, len(mine), len(mine)+len(received))
	copy(all, mine)
	taken := make(map[string]int, len(all)+len(received)) // name → index in all
	for i := range all {
		if _, ok := taken[*name(&all[i])]; !ok {
			taken[*name(&all[i])] = i
		}
	}
	for _, r := range received {
		n := name(&r)
		if strings.TrimSpace(*n) == "" {
			*n = "unnamed"
		}
		if i, ok := taken[*n]; ok {
			if string(encode(all[i])) == string(encode(r)) {
				same++
				continue
			}
			*n = freeName(*n, day, taken)
		}
		taken[*n] = len(all)
		all = append(all, r)
		added++
	}
	return all, added, same
}

// ReceivedName is the name TakeIn gives a received recipe whose name is taken, before any
// counter: "name (received day)".
func ReceivedName(name, day string) string {
	mark := " (received " + day + ")"
	return cutName(name, recipe.MaxNameBytes-len(mark)) + mark
}

// freeName finds the first of "name (received day)", "name (received day, 2)", … that is
// not taken.
func freeName(name, day string, taken map[string]int) string {
	for n := 1; ; n++ {
		mark := " (received " + day + ")"
		if n > 1 {
			mark = " (received " + day + ", " + strconv.Itoa(n) + ")"
		}
		c := cutName(name, recipe.MaxNameBytes-len(mark)) + mark
		if _, ok := taken[c]; !ok {
			return c
		}
	}
}

// cutName shortens s to at most max bytes at a character boundary, trimming the spaces
// left at the cut.
func cutName(s string, max int) string {
	if max < 0 {
		max = 0
	}
	if len(s) <= max {
		return s
	}
	for max > 0 && !utf8.RuneStart(s[max]) {
		max--
	}
	return strings.TrimRight(s[:max], " ")
}
