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
	day = cutName(day, 32) // a date; longer text would crowd out the name
	all = make([]recipe.Recipe, len(mine), len(mine)+len(received))
	copy(all, mine)
	taken := make(map[string]int, len(all)+len(received)) // name → index in all
	for i, r := range all {
		if _, ok := taken[r.Name]; !ok {
			taken[r.Name] = i
		}
	}
	for _, r := range received {
		if strings.TrimSpace(r.Name) == "" {
			r.Name = "unnamed"
		}
		if i, ok := taken[r.Name]; ok {
			if string(all[i].Encode()) == string(r.Encode()) {
				same++
				continue
			}
			r.Name = freeName(r.Name, day, taken)
		}
		taken[r.Name] = len(all)
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
