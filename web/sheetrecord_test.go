//go:build browser

package web_test

import (
	"regexp"
	"strings"
	"testing"
)

// The printed batch sheet is a batch record: beside each planned amount, empty cells for the
// actual weight, the lot number and the balance; a box for deviations; prepared and checked
// by, with dates; the recipe's name, the Saltcast version and the recipe check, which is the
// core's checksum of the recipe on screen (the same in °F, lb and US gal, another after an
// input changes, and shown beside the saved recipe). The cautions stay on the sheet.
func TestSheetIsBatchRecord(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	r, res := current(t, ctx)
	click(t, ctx, "#tab-sheet")
	if err := emulatePrint(ctx); err != nil {
		t.Fatal(err)
	}
	sum := mustEval[string](t, ctx, `document.getElementById("s-checksum").textContent`)
	if want := r.Checksum(); sum != want || !regexp.MustCompile(`^[0-9a-f]{8}$`).MatchString(sum) {
		t.Errorf("the sheet's recipe check is %q, the core's checksum of the recipe %q", sum, want)
	}
	// Each row: what, planned, and three empty cells to write in, tall enough for a pen.
	rows := mustEval[[]string](t, ctx, `Array.from(document.querySelectorAll("#s-weigh tbody tr")).map(tr => {
		const td = tr.querySelectorAll("td.fill");
		const ok = td.length === 3 && Array.from(td).every(c => c.textContent === "" && c.getBoundingClientRect().height >= 30 && c.getBoundingClientRect().width >= 60);
		return tr.querySelector("th").textContent + "|" + tr.querySelector("td").textContent + "|" + ok})`)
	if len(rows) < 2 {
		t.Fatalf("weighing record has %d rows: %q", len(rows), rows)
	}
	head := mustEval[string](t, ctx, `document.querySelector("#s-weigh thead").innerText`)
	for _, w := range []string{"Planned", "Actual", "Lot", "Balance"} {
		if !strings.Contains(head, w) {
			t.Errorf("weighing record header %q lacks %q", head, w)
		}
	}
	charge := output(t, ctx, "charge_g")
	water := output(t, ctx, "water_g")
	for i, want := range []string{res.ChargedForm + "|" + charge + " g|true", "Water|" + water + " g|true"} {
		if i >= len(rows) || !strings.HasSuffix(rows[i], "|true") || !strings.Contains(rows[i], strings.TrimSuffix(want, "|true")) {
			t.Errorf("weighing record row %d = %q, want %q with three empty cells", i, rows[i], want)
		}
	}
	// Deviations box, signatures with dates, disclaimer and cautions, all in print.
	if h := mustEval[float64](t, ctx, `document.getElementById("s-deviations").getBoundingClientRect().height`); h < 90 {
		t.Errorf("the deviations box is %v px tall in print, too small to write in", h)
	}
	text := mustEval[string](t, ctx, `document.getElementById("screen-sheet").innerText`)
	for _, w := range []string{"Deviations", "Prepared by", "Checked by", "date", "recipe check " + sum, r.Name, "SDS"} {
		if !strings.Contains(text, w) {
			t.Errorf("the printed sheet lacks %q", w)
		}
	}
	for _, c := range res.Cautions {
		if !strings.Contains(text, c) {
			t.Errorf("the printed sheet lacks the caution %q", c)
		}
	}
	// A larger chart: on this 1280 px wide tab the printed chart may be 135 mm tall (it was
	// held to 95 mm); 120 mm is 453.5 CSS px (96 px to the inch, CSS Values 3).
	if h := mustEval[float64](t, ctx, `document.querySelector("#s-chart svg").getBoundingClientRect().height`); h < 453.5 {
		t.Errorf("the printed chart is %.0f px (%.0f mm) tall, want at least 120 mm", h, h/96*25.4)
	}

	// The same recipe in other units keeps its check; the planned weights follow the units.
	mustEval[bool](t, ctx, `(function(){for (const [n,v] of [["unit_temp","F"],["unit_mass","lb"],["unit_volume","gal"]]) {
		const s=document.querySelector('#units [name="'+n+'"]'); s.value=v; s.dispatchEvent(new Event("change",{bubbles:true}))} return true})()`)
	if got := mustEval[string](t, ctx, `document.getElementById("s-checksum").textContent`); got != sum {
		t.Errorf("in °F, lb and US gal the recipe check is %q, in °C, g and mL %q", got, sum)
	}
	if row := mustEval[string](t, ctx, `document.querySelector("#s-weigh tbody td").textContent`); !strings.HasSuffix(row, " lb") {
		t.Errorf("in lb the planned charge reads %q", row)
	}
	mustEval[bool](t, ctx, `(function(){for (const [n,v] of [["unit_temp","C"],["unit_mass","g"],["unit_volume","mL"]]) {
		const s=document.querySelector('#units [name="'+n+'"]'); s.value=v; s.dispatchEvent(new Event("change",{bubbles:true}))} return true})()`)

	// Another input, another check: the core's for the new recipe.
	click(t, ctx, "#tab-batch")
	setField(t, ctx, "recipe", "water_g", "321")
	click(t, ctx, "#tab-sheet")
	r2, _ := current(t, ctx)
	got := mustEval[string](t, ctx, `document.getElementById("s-checksum").textContent`)
	if got == sum || got != r2.Checksum() {
		t.Errorf("with 321 g of water the recipe check is %q (was %q; the core says %q)", got, sum, r2.Checksum())
	}
	// Saved, the recipe shows the same check in the Recipe box.
	click(t, ctx, "#tab-box")
	mustEval[bool](t, ctx, `document.getElementById("save-name").value="record test (invented)", true`)
	click(t, ctx, "#save-btn")
	if listed := mustEval[string](t, ctx, `(document.querySelector("#saved li .sum")||{textContent:""}).textContent`); listed != got {
		t.Errorf("the Recipe box lists the saved recipe with check %q, the sheet says %q", listed, got)
	}
}
