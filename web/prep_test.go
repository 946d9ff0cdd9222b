//go:build browser

package web_test

import (
	"context"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"testing"

	"github.com/chromedp/chromedp"

	"saltcast/core/recipe"
)

// The make-up screen answers what the core answers: 250 mL of 0.1 mol/L CuSO4 from the
// pentahydrate takes 0.025·249.677 = 6.242 g (IUPAC atomic weights; mol/L by definition).
func TestPrepScreen(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, "#tab-prep")
	setField(t, ctx, "prep", "solute", "CuSO4·5H2O")
	setField(t, ctx, "prep", "concentration", "0,1")
	setField(t, ctx, "prep", "concentration_unit", "mol/L")
	setField(t, ctx, "prep", "final_volume_mL", "250")
	if got := prepNumber(t, ctx, "form_g"); math.Abs(got-6.242) > shownTol*6.242 {
		t.Errorf("form_g = %v, want 6.242", got)
	}
	p, _ := recipe.DecodePrep([]byte(`{"solute":"CuSO4·5H2O","concentration":0.1,"concentration_unit":"mol/L","final_volume_mL":250}`))
	res, err := recipe.PlanPrep(p)
	if err != nil {
		t.Fatal(err)
	}
	if got := prepNumber(t, ctx, "water_g"); math.Abs(got-res.WaterG) > shownTol*res.WaterG {
		t.Errorf("water_g = %v, core says %v", got, res.WaterG)
	}
	// A wrong entry is marked and the last good figures stay.
	setField(t, ctx, "prep", "final_volume_mL", "-5")
	if !mustEval[bool](t, ctx, `document.querySelector('#prep [name="final_volume_mL"]').getAttribute("aria-invalid")==="true"`) {
		t.Errorf("a negative volume is not marked")
	}
	if got := prepNumber(t, ctx, "form_g"); math.Abs(got-6.242) > shownTol*6.242 {
		t.Errorf("form_g after a wrong entry = %v, want the last good 6.242", got)
	}
	setField(t, ctx, "prep", "final_volume_mL", "250")
	// Handing over to the batch screen keeps the solution.
	click(t, ctx, "#prep-to-batch")
	if !mustEval[bool](t, ctx, `!document.getElementById("screen-batch").hidden`) {
		t.Errorf("the batch screen is not shown after the hand-over")
	}
}

// A label is printed: in print media only the labels show, each with the concentration, the
// keep-above temperature and the hazard note pointing to the SDS.
func TestPrepLabelPrinted(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, "#tab-prep")
	setField(t, ctx, "prep", "solute", "KCl")
	setField(t, ctx, "prep", "concentration", "3.5")
	setField(t, ctx, "prep", "final_volume_mL", "1000")
	setField(t, ctx, "prep-outcome", "label_by", "A. Tech")
	setField(t, ctx, "prep-outcome", "label_date", "2026-03-01")
	setField(t, ctx, "prep-outcome", "label_copies", "6")
	mustEval[bool](t, ctx, `window.print=function(){}, true`)
	click(t, ctx, "#prep-print")
	if err := emulatePrint(ctx); err != nil {
		t.Fatal(err)
	}
	n := mustEval[float64](t, ctx, `document.querySelectorAll("#labels .plabel").length`)
	if n != 6 {
		t.Errorf("%v labels, want 6", n)
	}
	text := mustEval[string](t, ctx, `document.querySelector("#labels .plabel").innerText`)
	for _, want := range []string{"Potassium chloride", "3.5 mol/L", "Keep above 7 °C", "2026-03-01", "A. Tech", "SDS"} {
		if !contains(text, want) {
			t.Errorf("label lacks %q:\n%s", want, text)
		}
	}
	// Nothing else prints: the form and the batch sheet are hidden.
	if mustEval[bool](t, ctx, `getComputedStyle(document.getElementById("prep")).display!=="none" || getComputedStyle(document.getElementById("screen-sheet")).display!=="none"`) {
		t.Errorf("the print view shows more than the labels")
	}
	if dir := os.Getenv("SALTCAST_SHOTS"); dir != "" {
		if png, err := chromedp.Run(ctx, chromedp.FullScreenshot(100)); err == nil {
			os.WriteFile(filepath.Join(dir, "prep-labels-print.png"), png, 0o644)
		}
	}
}

func contains(s, sub string) bool {
	for i := 0; i+len(sub) <= len(s); i++ {
		if s[i:i+len(sub)] == sub {
			return true
		}
	}
	return false
}

// prepNumber reads a figure of the make-up screen (the batch screen uses some of the same keys).
func prepNumber(t *testing.T, ctx context.Context, key string) float64 {
	t.Helper()
	s := mustEval[string](t, ctx, `(document.querySelector('#prep-outcome [data-key="`+key+`"]')||{textContent:"<missing>"}).textContent`)
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("make-up data-key %s holds %q, not a number", key, s)
	}
	return v
}
