//go:build browser

package web_test

import "testing"

// Every result number is read with its meaning: each output with a data-key sits in a tile
// that is a named group (WCAG 2.1, success criterion 1.3.1 "Info and Relationships"), on the
// batch and the gas screens, including the tiles the program adds itself.
func TestResultTilesNamed(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	click(t, ctx, "#tab-gas")
	unnamed := mustEval[[]string](t, ctx, `[...document.querySelectorAll('.fig output[data-key]')]
		.filter(o => { const g = o.closest('[role=group]'); return !g || !(g.getAttribute('aria-label') || '').trim() })
		.map(o => o.dataset.key)`)
	for _, k := range unnamed {
		t.Errorf("result %s is not inside a named group: a screen reader reads the number without its label", k)
	}
	total := mustEval[int](t, ctx, `document.querySelectorAll('.fig output[data-key]').length`)
	if total < 20 {
		t.Errorf("found %d result tiles, want the batch and gas screens' (at least 20)", total)
	}
}
