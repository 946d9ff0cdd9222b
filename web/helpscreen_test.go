//go:build browser

package web_test

import (
	"testing"

	"saltcast/core/recipe"
)

// The Help tab opens a screen of the built page (no network: the page's policy forbids it)
// that has an entry for every key a user types, batch and preparation, and the cautions.
func TestHelpScreen(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, "#tab-help")
	if !mustEval[bool](t, ctx, `!document.getElementById("screen-help").hidden && document.getElementById("screen-help").getBoundingClientRect().height > 500`) {
		t.Fatal("the Help tab does not show the help screen")
	}
	for _, set := range []struct {
		prefix string
		specs  recipe.Specs
	}{{"f", recipe.FieldSpecs}, {"p", recipe.PrepSpecs}} {
		for _, s := range set.specs {
			if s.Kind.Fixed() {
				continue
			}
			if !mustEval[bool](t, ctx, `(function(){const e=document.getElementById("help-`+set.prefix+`-`+s.Key+`"); return !!e && e.closest("#screen-help") !== null && e.getClientRects().length > 0})()`) {
				t.Errorf("no visible help entry for %s (%s)", s.Key, set.prefix)
			}
		}
	}
	text := mustEval[string](t, ctx, `document.getElementById("screen-help").textContent`)
	for _, want := range []string{"SDS", "local rules", "Assumptions and limits", "Where the data come from"} {
		if !contains(text, want) {
			t.Errorf("the help screen does not say %q", want)
		}
	}
}
