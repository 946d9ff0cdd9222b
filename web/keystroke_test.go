//go:build browser

package web_test

import (
	"context"
	"strconv"
	"testing"
)

// The batch screen's cooling programme is updated in place (its cells' text changes) while
// the batch sheet's copy is built anew each time: after edits that move the set-points, switch
// the ramp, hide and bring back the programme and change the temperature unit, the screen's
// rows read the same as the sheet's, one text node a cell.
func TestProgrammeInPlaceMatchesTheSheet(t *testing.T) {
	ctx := tab(t)
	open(t, ctx, appURL(t))
	click(t, ctx, `[data-demo="cuso4"]`)
	setUnit := func(u string) {
		mustEval[bool](t, ctx, `(function(){const s=document.querySelector('#units [name="unit_temp"]'); s.value="`+u+`"; s.dispatchEvent(new Event("change",{bubbles:true})); return true})()`)
	}
	defer setUnit("C")
	for _, step := range []struct {
		name string
		do   func()
	}{
		{"the demo", func() {}},
		{"target 15", func() { setField(t, ctx, "recipe", "cool_to_C", "15") }},
		{"cooling time 90", func() { setField(t, ctx, "recipe", "cooling_time_min", "90") }},
		{"cubic ramp", func() { click(t, ctx, `[name="programme_kind"][value="cubic"]`) }},
		{"no cooling time", func() { setField(t, ctx, "recipe", "cooling_time_min", "") }},
		{"cooling time 300", func() { setField(t, ctx, "recipe", "cooling_time_min", "300") }},
		{"°F", func() { setUnit("F") }},
		{"linear ramp, target 8", func() {
			click(t, ctx, `[name="programme_kind"][value="linear"]`)
			setField(t, ctx, "recipe", "cool_to_C", "46.4") // 8 °C in °F
		}},
	} {
		step.do()
		got := programmeRows(t, ctx)
		if got.hidden {
			if step.name != "no cooling time" {
				t.Errorf("%s: the programme is hidden", step.name)
			}
			continue
		}
		if got.screen == "" || got.screen != got.sheet || got.stray != 0 {
			t.Errorf("%s: the screen's programme\n%s\nthe sheet's\n%s\n(%d cells not one text node)", step.name, got.screen, got.sheet, got.stray)
		}
	}
}

type programme struct {
	screen, sheet string
	stray         int
	hidden        bool
}

// programmeRows reads the batch screen's programme (time and the set-point shown) and the
// same two columns of the sheet's (time, then linear or cubic as the screen shows), once the
// browser has been idle, when the app brings the sheet up to date.
func programmeRows(t *testing.T, ctx context.Context) programme {
	t.Helper()
	idle(t, ctx)
	r := mustEval[[]string](t, ctx, `(function(){
		const cubic = document.querySelector('[name="programme_kind"][value="cubic"]').checked;
		let stray = 0;
		const screen = [...document.querySelectorAll("#programme tbody tr")].map(tr => [...tr.cells].map(td => {
			if (td.childNodes.length !== 1 || td.firstChild.nodeType !== 3) stray++;
			return td.textContent;
		}).join(" ")).join("\n");
		const sheet = [...document.querySelectorAll("#s-programme tbody tr")].map(tr => tr.cells[0].textContent + " " + tr.cells[cubic ? 2 : 1].textContent).join("\n");
		return [screen, sheet, String(stray), String(document.getElementById("programme-box").hidden)];
	})()`)
	stray, err := strconv.Atoi(r[2])
	if err != nil {
		t.Fatal(err)
	}
	return programme{screen: r[0], sheet: r[1], stray: stray, hidden: r[3] == "true"}
}

// A keystroke writes only what changed: over edits of the water and the target temperature
// (which moves the chart and the programme), no attribute is written
// with the value it had, and no figure, strip entry or programme cell has its node replaced
// (their text changes in place).
func TestKeystrokeWritesOnlyChanges(t *testing.T) {
	ctx := tab(t)
	open(t, ctx, appURL(t))
	click(t, ctx, `[data-demo="cuso4"]`)
	mustEval[bool](t, ctx, `new Promise(done => setTimeout(() => done(true), 0))`) // the demo's drawings
	bad := mustEval[[]string](t, ctx, `(function(){
		const bad = [];
		const mo = new MutationObserver(() => {});
		mo.observe(document.documentElement, {subtree: true, attributes: true, attributeOldValue: true, childList: true});
		const water = document.querySelector('#recipe [name="water_g"]');
		const cool = document.querySelector('#recipe [name="cool_to_C"]');
		const where = n => { const e = n.nodeType === 1 ? n : n.parentElement; return e.tagName.toLowerCase() + (e.id ? "#" + e.id : "") + (e.dataset.key ? "[" + e.dataset.key + "]" : ""); };
		for (let i = 0; i < 12; i++) {
			const el = i % 2 ? cool : water;
			el.value = String(i % 2 ? 10 + i : 400 + 37 * i);
			el.dispatchEvent(new Event("input", {bubbles: true}));
			for (const r of mo.takeRecords()) {
				if (r.type === "attributes" && r.oldValue === r.target.getAttribute(r.attributeName))
					bad.push("same " + r.attributeName + " written again on " + where(r.target));
				if (r.type === "childList" && r.target.closest && r.target.closest("output, #strip, #programme"))
					bad.push("nodes replaced in " + where(r.target));
			}
		}
		mo.disconnect();
		return bad;
	})()`)
	if len(bad) > 0 {
		t.Errorf("%d needless writes, e.g. %q", len(bad), bad[:min(len(bad), 5)])
	}
}
