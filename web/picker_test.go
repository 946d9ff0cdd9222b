//go:build browser

package web_test

import (
	"testing"
)

// Picking a solute as a technician does: by the name on the jar. The names are the usual shelf
// names of these hydrates (from memory; the synonyms in the CRC Handbook's "Physical Constants
// of Inorganic Compounds" and on suppliers' labels).
func TestPickerTakesTheFormNamed(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)

	// Typing a trade name lists the hydrate it names first; tapping it puts that hydrate on the
	// shelf, not the anhydrous salt.
	setField(t, ctx, "recipe", "solute", "washing soda")
	first := mustEval[string](t, ctx, `(document.querySelector('#solute-matches [data-id]')||{dataset:{}}).dataset.form||""`)
	if first != "Na2CO3·10H2O" {
		t.Fatalf("first match for 'washing soda' names form %q, want Na2CO3·10H2O", first)
	}
	click(t, ctx, `#solute-matches [data-id]`)
	if got := mustEval[string](t, ctx, `document.querySelector('#recipe [name="charged_form"]').value`); got != "Na2CO3·10H2O" {
		t.Errorf("after tapping 'washing soda' the form on the shelf is %q, want Na2CO3·10H2O", got)
	}
	if got := mustEval[string](t, ctx, `document.querySelector('#recipe [name="solute"]').value`); got != "Na2CO3" {
		t.Errorf("after tapping 'washing soda' the solute reads %q, want Na2CO3", got)
	}

	// After the copper sulfate demo, typing another salt's hydrate takes that hydrate; the old
	// form does not linger as "not a form of".
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "solute", "MgSO4·7H2O")
	if got := mustEval[string](t, ctx, `document.querySelector('#recipe [name="charged_form"]').value`); got != "MgSO4·7H2O" {
		t.Errorf("typing MgSO4·7H2O after the CuSO4 demo leaves form %q on the shelf, want MgSO4·7H2O", got)
	}
	if n := mustEval[int](t, ctx, `[...document.querySelectorAll('#recipe [name="charged_form"] option')].filter(o => o.textContent.includes("not a form")).length`); n != 0 {
		t.Errorf("the form list still offers %d forms of another compound", n)
	}
	// Typing the plain salt next drops the hydrate again.
	setField(t, ctx, "recipe", "solute", "KNO3")
	if got := mustEval[string](t, ctx, `document.querySelector('#recipe [name="charged_form"]').value`); got != "" {
		t.Errorf("typing KNO3 after MgSO4·7H2O leaves form %q, want the anhydrous salt", got)
	}
}
