//go:build browser

package web_test

import (
	"context"
	"strings"
	"testing"

	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"
)

// beforeScripts runs src in the tab before any of the page's own scripts, on every load.
func beforeScripts(t *testing.T, ctx context.Context, src string) {
	t.Helper()
	if err := chromedp.Do(ctx, chromedp.Func(func(c context.Context, _ *chromedp.Target) error {
		_, err := chromedp.Call(c, page.AddScriptToEvaluateOnNewDocument, page.AddScriptToEvaluateOnNewDocumentParams{Source: src})
		return err
	})); err != nil {
		t.Fatal(err)
	}
}

// After the start the app rehearses its recompute in idle time, so that someone's first
// keystrokes run code the browser has already compiled and optimised. The rehearsals must not
// show: from data-settled until the last one (the goRehearsed mark) nothing in the document
// changes and nothing is stored; and they do run, all of them, and end.
func TestRehearsalChangesNothing(t *testing.T) {
	ctx := tab(t)
	beforeScripts(t, ctx, `(function(){
  window.__changes = [];
  window.__stored = 0;
  let settled = false;
  const setItem = Storage.prototype.setItem;
  Storage.prototype.setItem = function (k, v) { if (settled) window.__stored++; return setItem.call(this, k, v); };
  new MutationObserver(function (records) {
    for (const r of records) {
      if (!settled) {
        if (r.type === "attributes" && r.attributeName === "data-settled") settled = true;
        continue;
      }
      const el = r.target.nodeType === 1 ? r.target : r.target.parentElement;
      window.__changes.push(r.type + " " + (r.attributeName || "") + " at " + (el ? el.tagName + "#" + el.id + "." + el.className : "?"));
    }
  }).observe(document, {subtree: true, childList: true, attributes: true, characterData: true});
})();`)
	open(t, ctx, appURL(t))
	if _, err := chromedp.Run(ctx, chromedp.Poll[bool](`window.saltcastMarks.goRehearsed !== undefined`)); err != nil {
		t.Fatal("the rehearsals did not end: " + err.Error())
	}
	if n := mustEval[int](t, ctx, `window.saltcastMarks.rehearsals`); n != 60 {
		t.Errorf("%d rehearsals ran, want all 60 (on the demo batch, whose inputs are all good)", n)
	}
	// The observer's last records arrive in a microtask after the last change.
	changes := mustEval[[]string](t, ctx, `new Promise(r => setTimeout(() => r(window.__changes), 0))`)
	if len(changes) > 0 {
		t.Errorf("%d changes to the page while rehearsing, e.g. %v", len(changes), changes[:min(len(changes), 5)])
	}
	if n := mustEval[int](t, ctx, `window.__stored`); n != 0 {
		t.Errorf("%d writes to storage while rehearsing", n)
	}
}

// Go collects its garbage in the browser's idle time, not inside a keystroke: over 40 inputs
// typed 60 ms apart, every collection Go's trace reports (GODEBUG=gctrace=1) is one the app
// asked for ("forced"), none one that Go started because the heap had grown. With Go's
// default (a collection every 4 MB, every ten keystrokes or so here) this fails.
func TestGarbageCollectedWhenIdle(t *testing.T) {
	ctx := tab(t)
	beforeScripts(t, ctx, `(function(){
  window.__gc = [];
  const log = console.log.bind(console);
  console.log = function (...a) { const s = a.join(" "); if (s.startsWith("gc ")) window.__gc.push(s); log(...a); };
  // The loader sets the Go program's environment; GODEBUG is added to whatever it sets.
  Object.defineProperty(window, "Go", {configurable: true, get() { return undefined; }, set(Go) {
    class Traced extends Go {
      constructor() {
        super();
        let env = {GODEBUG: "gctrace=1"};
        Object.defineProperty(this, "env", {get() { return env; }, set(e) { env = Object.assign({}, e, {GODEBUG: "gctrace=1"}); }});
      }
    }
    Object.defineProperty(window, "Go", {value: Traced, writable: true, configurable: true});
  }});
})();`)
	open(t, ctx, appURL(t))
	click(t, ctx, `[data-demo="cuso4"]`)
	gc := mustEval[[]string](t, ctx, `(async function(){
		`+typeInputJS+`
		for (let i = 0; i < 40; i++) {
			await new Promise(r => setTimeout(r, 60));
			typeInput(i);
		}
		await new Promise(r => setTimeout(r, 500));
		return window.__gc;
	})()`)
	if len(gc) == 0 {
		t.Fatal("no garbage collection traced: GODEBUG did not reach the Go program, or nothing was collected in 40 inputs")
	}
	for _, line := range gc {
		if !strings.HasSuffix(strings.TrimSpace(line), "(forced)") {
			t.Errorf("a collection Go started itself, perhaps inside a keystroke: %s", line)
		}
	}
	t.Logf("%d collections; the last: %s", len(gc), gc[len(gc)-1])
}

// A keystroke on the batch screen leaves the hidden batch sheet alone until the browser is
// idle (drawing it, the chart's whole markup among it, took 5-11 ms a keystroke): nothing in
// the sheet changes in the keystroke's task or the next one, and once the browser has been
// idle the sheet shows the new plan.
func TestSheetWaitsForIdle(t *testing.T) {
	ctx := tab(t)
	open(t, ctx, appURL(t))
	click(t, ctx, `[data-demo="cuso4"]`)
	idle(t, ctx)
	changes := mustEval[int](t, ctx, `(async function(){
		let n = 0;
		const obs = new MutationObserver(r => { n += r.length; });
		obs.observe(document.getElementById("screen-sheet"), {subtree: true, childList: true, characterData: true, attributes: true});
		const water = document.querySelector('#recipe [name="water_g"]');
		water.value = "777"; water.dispatchEvent(new Event("input", {bubbles: true}));
		await new Promise(r => setTimeout(r, 0));
		n += obs.takeRecords().length;
		obs.disconnect();
		return n;
	})()`)
	if changes != 0 {
		t.Errorf("%d changes to the hidden sheet in the keystroke's task and the next", changes)
	}
	idle(t, ctx)
	want := output(t, ctx, "charge_g")
	sheet := mustEval[string](t, ctx, `document.getElementById("s-weigh").textContent`)
	if !strings.Contains(sheet, want) {
		t.Errorf("once idle, the sheet's weighing table %q lacks the charge on screen %q", sheet, want)
	}
}
