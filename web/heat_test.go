//go:build browser

package web_test

import (
	"context"
	"encoding/base64"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
)

// openRecipe opens the page on a share link holding the recipe JSON, as a colleague's link
// would, and waits until it has planned.
func openRecipe(t *testing.T, ctx context.Context, u, recipeJSON string) {
	t.Helper()
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	link := u + "#recipe=" + base64.RawURLEncoding.EncodeToString([]byte(recipeJSON))
	if err := chromedp.Do(ctx, chromedp.Navigate("about:blank"), chromedp.Navigate(link)); err != nil {
		t.Fatal(err)
	}
	waitReady(t, ctx)
}

// tileText is the visible text of the result tile holding data-key.
func tileText(t *testing.T, ctx context.Context, key string) string {
	t.Helper()
	return mustEval[string](t, ctx, `(() => { const o = document.querySelector('#outcome [data-key="`+key+`"]');
		if (!o) return "<missing>"; const f = o.closest(".fig"); return f && !f.hidden ? f.innerText : "<hidden>" })()`)
}

// sheetText is the batch sheet as printed.
func sheetText(t *testing.T, ctx context.Context) string {
	t.Helper()
	click(t, ctx, "#tab-sheet")
	return mustEval[string](t, ctx, `document.getElementById("screen-sheet").innerText`)
}

// Seeded sodium acetate in an insulated vessel: the crystallization heat is the trihydrate's
// heat of fusion (264–289 kJ/kg, Lane, Solar Heat Storage, 1983, from memory), and the batch
// warms to 58 °C, where the trihydrate melts incongruently (Lane 1983, from memory), and
// holds there. Screen and sheet both say so, with the heat-capacity model beside the figure.
func TestSeededAcetateShowsBasisAndHold(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	openRecipe(t, ctx, u, `{"format":1,"solute":"CH3COONa","water_g":100,"dissolve_temp_C":70,"seed_at_C":20,"cool_to_C":20}`)
	if got := tileText(t, ctx, "heat_basis"); !strings.Contains(got, "heat of fusion of the hydrate") || !strings.Contains(got, "kJ/mol") {
		t.Errorf("heat basis tile reads %q, want the heat of fusion with the design value", got)
	}
	if got := tileText(t, ctx, "adiabatic_end_temp_C"); !strings.Contains(got, "held at 58 °C") || !strings.Contains(got, "CH3COONa·3H2O") {
		t.Errorf("insulated tile reads %q, want it held at 58 °C with the trihydrate", got)
	}
	if got := tileText(t, ctx, "heat_capacity_kJ_per_K"); !strings.Contains(got, "melt") {
		t.Errorf("heat-capacity tile reads %q, want the model (the trihydrate melt) beside it", got)
	}
	sheet := sheetText(t, ctx)
	for _, want := range []string{"heat of fusion of the hydrate", "held at 58 °C", "Heat-capacity model", "lowest"} {
		if !strings.Contains(sheet, want) {
			t.Errorf("the batch sheet lacks %q", want)
		}
	}
}

// A KNO3 stock of 5 g in 100 g water (4.76 mass %) freezes at −1.43 °C (derived: between the
// CRC 102nd ed. "Concentrative Properties of Aqueous Solutions" rows 4 %, 1.22 K and 5 %,
// 1.50 K); cooled to −2 °C it holds ice, and the heat of that ice is in the cooling duty.
func TestColdKNO3ShowsIce(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	openRecipe(t, ctx, u, `{"format":1,"solute":"KNO3","water_g":100,"charge_g":5,"dissolve_temp_C":20,"cool_to_C":-2}`)
	mustEval[bool](t, ctx, `document.querySelector('#units [name="unit_temp"]').value="C", document.querySelector('#units [name="unit_temp"]').dispatchEvent(new Event("change",{bubbles:true})), true`)
	if got := output(t, ctx, "freezing_point_C"); got != "-1.4" {
		t.Errorf("freezing point shows %q, want -1.4", got)
	}
	for _, key := range []string{"ice_g", "ice_heat_kJ", "eutectic_C"} {
		if got := tileText(t, ctx, key); got == "<hidden>" || got == "<missing>" || strings.Contains(got, "—") {
			t.Errorf("tile %s reads %q, want a value", key, got)
		}
	}
	if ice := outputNumber(t, ctx, "ice_g"); !(ice > 0) {
		t.Errorf("ice at −2 °C = %v g, want some", ice)
	}
	sheet := sheetText(t, ctx)
	for _, want := range []string{"Ice at target", "Heat released by the ice freezing", "Freezes solid (eutectic) below"} {
		if !strings.Contains(sheet, want) {
			t.Errorf("the batch sheet lacks %q", want)
		}
	}
}

// Potassium dichromate is a carcinogen, mutagen and reproductive toxicant (GHS H340, H350,
// H360FD on suppliers' SDS, from memory): its plan opens with the strong caution, set apart,
// on the screen and on the sheet.
func TestToxicCompoundShowsStrongCaution(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	openRecipe(t, ctx, u, `{"format":1,"solute":"K2Cr2O7","water_g":100,"dissolve_temp_C":60,"saturation_pct":90,"cool_to_C":20}`)
	for _, list := range []string{"cautions", "s-cautions"} {
		if list == "s-cautions" {
			click(t, ctx, "#tab-sheet")
		}
		got := mustEval[[]any](t, ctx, `(() => { const li = document.querySelector('#`+list+` li');
			return li ? [li.dataset.kind || "", li.classList.contains("strong"), li.textContent, getComputedStyle(li).fontWeight] : ["", false, "", ""] })()`)
		if got[0] != "toxic" || got[1] != true || !strings.Contains(got[2].(string), "SDS") {
			t.Errorf("#%s opens with kind %q strong %v: %q; want the toxic caution, set apart, pointing to the SDS", list, got[0], got[1], got[2])
		}
	}
}
