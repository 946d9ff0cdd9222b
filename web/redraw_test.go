//go:build browser

package web_test

import (
	"strconv"
	"testing"
)

// The batch chart redraws only its batch layer while the curves and axes stay (typing a
// target temperature), and the page then holds the same chart a whole redraw gives: after
// a run of edits, some moving only the batch and some the axes, the chart's markup equals
// the batch sheet's copy (drawn from the whole SVG text) and the chart drawn afresh after
// a round trip through °F.
func TestChartRedrawsOnlyTheBatch(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	const chartHTML = `document.getElementById("chart").innerHTML`
	mark := `(function(){const g=document.querySelector('#chart g[data-layer="static"]'); if(!g) return false; g.dataset.kept="1"; return true})()`
	kept := `!!document.querySelector('#chart g[data-layer="static"][data-kept]')`
	if !mustEval[bool](t, ctx, mark) {
		t.Fatal("the chart has no static layer")
	}
	before := mustEval[string](t, ctx, chartHTML)
	setField(t, ctx, "recipe", "cool_to_C", "12")
	if mustEval[string](t, ctx, chartHTML) == before {
		t.Fatal("the chart did not change with the target temperature")
	}
	if !mustEval[bool](t, ctx, kept) {
		t.Error("a new target temperature redrew the curves and axes, not only the batch")
	}
	setUnit := func(unit string) {
		t.Helper()
		mustEval[bool](t, ctx, `(function(){const s=document.querySelector('#units [name="unit_temp"]'); s.value=`+strconv.Quote(unit)+`; s.dispatchEvent(new Event("change",{bubbles:true})); return true})()`)
	}
	for _, e := range []struct{ name, text string }{
		{"cool_to_C", "15"}, {"water_g", "950"}, {"cool_to_C", "8"},
		{"dissolve_temp_C", "95"}, {"cool_to_C", "30"}, {"dissolve_temp_C", "45"}, {"cool_to_C", "14"},
	} {
		setField(t, ctx, "recipe", e.name, e.text)
	}
	setUnit("F")
	setField(t, ctx, "recipe", "cool_to_C", "50")
	setField(t, ctx, "recipe", "cool_to_C", "55")
	setUnit("C")
	setField(t, ctx, "recipe", "cool_to_C", "11")
	got := mustEval[string](t, ctx, chartHTML)

	click(t, ctx, "#tab-sheet")
	if sheet := mustEval[string](t, ctx, `document.getElementById("s-chart").innerHTML`); sheet != got {
		t.Errorf("after the edits the chart differs from the sheet's, drawn whole:\n%s\nwant\n%s", got, sheet)
	}
	click(t, ctx, "#tab-batch")
	setUnit("F")
	setUnit("C")
	if fresh := mustEval[string](t, ctx, chartHTML); fresh != got {
		t.Errorf("after the edits the chart differs from a fresh one:\n%s\nwant\n%s", got, fresh)
	}
}
