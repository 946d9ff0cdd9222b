//go:build browser

package web_test

import (
	"strconv"
	"testing"

	"saltcast/web/badinput"
)

// uiBadInputs are a dozen cases of the shared catalogue (testdata/bad-inputs.txt) as a user
// meets them: text typed into one box of the recipe form, starting from the copper sulfate
// example. The catalogue row gives the words the message must hold.
var uiBadInputs = []struct {
	id    string // catalogue row
	field string // the box typed into
	text  string // what is typed
}{
	{"thousands-eu", "water_g", "1.234,5"},
	{"thousands-us", "water_g", "1,234.5"},
	{"letters", "water_g", "abc"},
	{"unit-typed", "dissolve_temp_C", "20°C"},
	{"parse-1e999", "water_g", "1e999"},
	{"nan-typed", "water_g", "NaN"},
	{"water-negative", "water_g", "-5"},
	{"purity-over", "purity_pct", "101"},
	{"saturation-over", "saturation_pct", "120"},
	{"dissolve-above-decode-range", "dissolve_temp_C", "151"},
	{"dissolve-beyond-range", "dissolve_temp_C", "107"},
	{"cool-above-dissolve", "cool_to_C", "85"}, // the example dissolves at 70 °C,
	{"unknown-solute", "solute", "unobtainium"},
}

// TestBadInputsInPage types each case into its box and checks what the technician sees: the
// message beside the box saying what is allowed, the box marked invalid and still holding
// the text as typed, and the last good results kept (marked as such). Typing the good value
// back clears the message and updates the results again.
func TestBadInputsInPage(t *testing.T) {
	rows, err := badinput.Load()
	if err != nil {
		t.Fatal(err)
	}
	byID := map[string]badinput.Case{}
	for _, r := range rows {
		byID[r.ID] = r
	}
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	for _, c := range uiBadInputs {
		row, ok := byID[c.id]
		if !ok || row.Kind != badinput.Refuse {
			t.Fatalf("%s is not a refusal in the catalogue", c.id)
		}
		t.Run(c.id, func(t *testing.T) {
			open(t, ctx, u)
			if !mustEval[bool](t, ctx, `(function(){const b=document.querySelector('[data-demo="cuso4"]'); if(!b) return false; b.click(); return true})()`) {
				t.Fatal("no copper sulfate example button")
			}
			box := `document.querySelector('#recipe [name="` + c.field + `"]')`
			good := mustEval[string](t, ctx, box+`.value`)
			charge, crystals := output(t, ctx, "charge_g"), output(t, ctx, "crystals_g")
			if _, err := strconv.ParseFloat(charge, 64); err != nil {
				t.Fatalf("the example shows no charge: %q", charge)
			}
			if !mustEval[bool](t, ctx, `document.getElementById("stale").hidden`) {
				t.Fatal("the example's results are marked stale before anything is typed")
			}

			setField(t, ctx, "recipe", c.field, c.text)
			msg := mustEval[string](t, ctx, `(document.getElementById("m-`+c.field+`")||{textContent:""}).textContent`)
			if msg == "" {
				t.Fatalf("typing %q into %s shows no message beside it; above the results: %q", c.text, c.field,
					mustEval[string](t, ctx, `document.getElementById("stale").textContent+" | "+[...document.querySelectorAll("#recipe .msg")].filter(m=>m.textContent).map(m=>m.id+": "+m.textContent).join(" | ")`))
			}
			if bad := row.Check(msg); bad != "" {
				t.Errorf("message beside %s %q %s (%s)", c.field, msg, bad, row.Why)
			}
			if got := mustEval[string](t, ctx, box+`.getAttribute("aria-invalid")||""`); got != "true" {
				t.Errorf("%s is not marked invalid (aria-invalid %q)", c.field, got)
			}
			if got := mustEval[string](t, ctx, box+`.value`); got != c.text {
				t.Errorf("%s holds %q after the error, want the text as typed %q", c.field, got, c.text)
			}
			if got := output(t, ctx, "charge_g"); got != charge {
				t.Errorf("charge_g shows %q after the error, want the last good %q", got, charge)
			}
			if got := output(t, ctx, "crystals_g"); got != crystals {
				t.Errorf("crystals_g shows %q after the error, want the last good %q", got, crystals)
			}
			if mustEval[bool](t, ctx, `document.getElementById("stale").hidden`) {
				t.Errorf("the results are not marked as the last good ones")
			}

			setField(t, ctx, "recipe", c.field, good)
			if msg := mustEval[string](t, ctx, `document.getElementById("m-`+c.field+`").textContent`); msg != "" {
				t.Errorf("after typing %q back, %s still says %q", good, c.field, msg)
			}
			if got := output(t, ctx, "charge_g"); got != charge {
				t.Errorf("after typing %q back, charge_g = %q, want %q", good, got, charge)
			}
			if !mustEval[bool](t, ctx, `document.getElementById("stale").hidden`) {
				t.Errorf("after typing %q back, the results are still marked stale", good)
			}
		})
	}
}
