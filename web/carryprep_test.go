//go:build browser

package web_test

import (
	"bytes"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"saltcast/core/recipe"
	"saltcast/web/carry"
)

// A preparation saved in the recipe box travels in a saved copy: the colleague's fresh
// profile lists it as received, and taking it in puts it, byte for byte, in their box.
func TestCarryPreparationRoundTrip(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	next := downloads(t, ctx)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, "#tab-prep")
	setField(t, ctx, "prep", "solute", "KCl")
	setField(t, ctx, "prep", "concentration", "1.5")
	setField(t, ctx, "prep", "concentration_unit", "mol/L")
	setField(t, ctx, "prep", "final_volume_mL", "500")
	const name = "KCl for the bench <b>(invented)</b>"
	mustEval[bool](t, ctx, `document.getElementById("prep-save-name").value=`+strconv.Quote(name)+`, true`)
	click(t, ctx, "#prep-save")
	stored := mustEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`)
	mine, err := recipe.DecodeAll([]byte(stored))
	if err != nil || len(mine.Preps) != 1 || mine.Preps[0].Name != name {
		t.Fatalf("the box after saving the preparation: %q, %v", stored, err)
	}

	click(t, ctx, "#tab-box")
	if got := texts(t, ctx, "#carry-pick label span"); len(got) != 1 || !strings.Contains(got[0], name) {
		t.Fatalf("the list to send shows %q", got)
	}
	click(t, ctx, "#carry-all")
	click(t, ctx, "#carry-save")
	saved := next()
	if msg := mustEval[string](t, ctx, `document.getElementById("m-carry").textContent`); !strings.Contains(msg, "1 preparation") {
		t.Errorf("after saving a copy the page says %q", msg)
	}
	c, err := carry.ExtractCarried(saved)
	if err != nil {
		t.Fatalf("the saved copy: %v", err)
	}
	if !c.Sealed || len(c.Recipes) != 0 || len(c.Preps) != 1 || !bytes.Equal(c.Preps[0].Encode(), mine.Preps[0].Encode()) {
		t.Fatalf("the copy carries %+v", c)
	}

	path := filepath.Join(t.TempDir(), "saltcast-with-recipes.html")
	if err := os.WriteFile(path, saved, 0o644); err != nil {
		t.Fatal(err)
	}
	other := freshTab(t)
	open(t, other, fileURL(t, path))
	click(t, other, "#carry-note-go")
	if got := texts(t, other, "#received .nm"); len(got) != 1 || !strings.Contains(got[0], name) {
		t.Fatalf("received list = %q", got)
	}
	if s := mustEval[string](t, other, `localStorage.getItem("saltcast.recipes") || ""`); s != "" {
		t.Errorf("opening the copy stored %q before anything was taken in", s)
	}
	if n := mustEval[int](t, other, `document.querySelectorAll("#received b, #carry-pick b").length`); n != 0 {
		t.Errorf("the received name became markup (%d elements)", n)
	}
	click(t, other, `#received [data-take][data-p="0"]`)
	theirs, err := recipe.DecodeAll([]byte(mustEval[string](t, other, `localStorage.getItem("saltcast.recipes") || ""`)))
	if err != nil || len(theirs.Preps) != 1 || !bytes.Equal(theirs.Preps[0].Encode(), mine.Preps[0].Encode()) {
		t.Fatalf("the colleague's box after taking it in: %+v, %v", theirs, err)
	}
	if got := texts(t, other, "#saved-preps .nm"); len(got) != 1 || got[0] != name {
		t.Errorf("the colleague's box lists %q", got)
	}
	if got := texts(t, other, "#received .tag"); len(got) != 1 {
		t.Errorf("the taken preparation is not marked as in the list: %q", got)
	}
}

// The Make up screen follows the unit switch: 2 typed in L is 2000 mL when switched back,
// and the mass and volume figures are the core's answer in the units chosen (1 L = 1000 mL,
// 1 kg = 1000 g by definition of the SI prefixes).
func TestPrepFollowsUnits(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	unitSel := func(name, v string) {
		mustEval[bool](t, ctx, `(function(){const s=document.querySelector('#units [name="`+name+`"]'); s.value="`+v+
			`"; s.dispatchEvent(new Event("change",{bubbles:true})); return true})()`)
	}
	click(t, ctx, "#tab-prep")
	unitSel("unit_volume", "L")
	unitSel("unit_mass", "kg")
	setField(t, ctx, "prep", "solute", "KCl")
	setField(t, ctx, "prep", "concentration", "1.5")
	setField(t, ctx, "prep", "concentration_unit", "mol/L")
	setField(t, ctx, "prep", "final_volume_mL", "2")

	p, err := recipe.DecodePrep([]byte(`{"solute":"KCl","concentration":1.5,"concentration_unit":"mol/L","final_volume_mL":2000}`))
	if err != nil {
		t.Fatal(err)
	}
	res, err := recipe.PlanPrep(p)
	if err != nil {
		t.Fatal(err)
	}
	near := func(what string, got, want float64) {
		t.Helper()
		if math.Abs(got-want) > shownTol*math.Abs(want) {
			t.Errorf("%s = %v, core says %v", what, got, want)
		}
	}
	near("solution in L", prepNumber(t, ctx, "solution_mL"), res.SolutionML/1000)
	near("KCl to weigh in kg", prepNumber(t, ctx, "form_g"), res.FormG/1000)
	near("water in kg", prepNumber(t, ctx, "water_g"), res.WaterG/1000)

	unitSel("unit_volume", "mL")
	unitSel("unit_mass", "g")
	typed := mustEval[string](t, ctx, `document.querySelector('#prep [name="final_volume_mL"]').value`)
	if v, err := strconv.ParseFloat(strings.ReplaceAll(strings.ReplaceAll(typed, " ", ""), "\u202f", ""), 64); err != nil || v != 2000 {
		t.Errorf("2 L shows as %q after switching to mL, want 2000", typed)
	}
	near("solution in mL", prepNumber(t, ctx, "solution_mL"), res.SolutionML)
	near("KCl to weigh in g", prepNumber(t, ctx, "form_g"), res.FormG)
	near("water in g", prepNumber(t, ctx, "water_g"), res.WaterG)
}
