//go:build browser

package web_test

import (
	"encoding/base64"
	"math"
	"testing"

	"github.com/chromedp/chromedp"

	"saltcast/core/recipe"
	"saltcast/core/wire"
	"saltcast/web/api"
)

// dutyShownTol is the relative rounding of a heat shown with three significant figures.
const dutyShownTol = 5e-3

// A recipe opened from a share link keeps every key it gives, the liquor's and the vessel's
// heat capacities included, and the page plans the same cooling duty as the CLI (web/api)
// for it. The batch is invented: potassium nitrate, 40 → 10 °C, 2.0 kJ/(kg·K).
func TestShareLinkKeepsHeatCapacities(t *testing.T) {
	src := `{"format":1,"name":"KNO3 with a measured liquor heat capacity (invented)","solute":"KNO3",` +
		`"water_g":100,"dissolve_temp_C":40,"cool_to_C":10,"liquor_heat_capacity_kJ_per_kgK":2,"vessel_heat_capacity_J_per_K":450}`
	r, err := recipe.Decode([]byte(src))
	if err != nil {
		t.Fatal(err)
	}
	out, err := api.Plan(r.Encode())
	if err != nil {
		t.Fatal(err)
	}
	v, err := wire.Decode(out)
	if err != nil {
		t.Fatal(err)
	}
	duty, ok := v.Get("cooling_duty_kJ")
	if !ok || duty.Kind != wire.Number {
		t.Fatalf("the CLI's plan has no cooling_duty_kJ: %s", out)
	}

	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	link := u + "#recipe=" + base64.RawURLEncoding.EncodeToString(r.Encode())
	if err := chromedp.Do(ctx, chromedp.Navigate("about:blank"), chromedp.Navigate(link)); err != nil {
		t.Fatal(err)
	}
	waitReady(t, ctx)
	if got := mustEval[string](t, ctx, `document.querySelector('#recipe [name="liquor_heat_capacity_kJ_per_kgK"]').value`); got != "2" {
		t.Errorf("the liquor heat capacity input shows %q, want 2", got)
	}
	got, _ := current(t, ctx)
	if string(got.Encode()) != string(r.Encode()) {
		t.Errorf("the page's recipe from the link is\n%s\nwant\n%s", got.Encode(), r.Encode())
	}
	if shown := outputNumber(t, ctx, "cooling_duty_kJ"); math.Abs(shown-duty.Num) > dutyShownTol*math.Abs(duty.Num) {
		t.Errorf("cooling duty shown %v kJ, the CLI plans %v kJ", shown, duty.Num)
	}
}
