//go:build gecko || webkit

package web_test

// The cross-engine suite: the core checks of the Chromium suite, run in Gecko (Debian's
// firefox-esr, tag gecko) and WebKit (WebKitGTK's MiniBrowser, tag webkit), driven by
// saltcast/web/enginetest. `make test` sets both tags; with a tag set, a missing browser,
// driver or page fails the test, never skips it.

import (
	"bytes"
	"encoding/json"
	"math"
	"net/url"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"saltcast/core/recipe"
	"saltcast/web/carry"
	"saltcast/web/enginetest"
)

// engine is one engine the suite runs in; each tag's file adds its own.
type engine struct {
	name  string
	start func(enginetest.Options) (enginetest.Browser, error)
	// scriptsOffByPolicy: the engine cannot be started with scripts off (Gecko under its
	// remote agent), so the no-script view is loaded from a copy of the file whose head
	// adds the policy script-src 'none': the same markup and styles, no script runs.
	scriptsOffByPolicy bool
}

var engines []engine

// engineRelTol is the relative rounding of a mass shown with four significant figures.
const engineRelTol = 5e-4

func builtPage(t *testing.T) (string, []byte) {
	t.Helper()
	path, err := filepath.Abs(filepath.Join("..", "dist", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	b, err := os.ReadFile(path)
	if err != nil {
		t.Fatal("dist/saltcast.html is not built (run `make build`, or `make test`)")
	}
	return (&url.URL{Scheme: "file", Path: path}).String(), b
}

func startEngine(t *testing.T, e engine, o enginetest.Options) enginetest.Browser {
	t.Helper()
	b, err := e.start(o)
	if err != nil {
		t.Fatalf("starting %s: %v (install with web/scripts/test-deps.sh, or run `make test`)", e.name, err)
	}
	t.Cleanup(func() { b.Close() })
	return b
}

// js evaluates expr in b's page and decodes its JSON value into a T.
func js[T any](t *testing.T, b enginetest.Browser, expr string) T {
	t.Helper()
	s, err := b.Eval(expr)
	if err != nil {
		t.Fatalf("%s: evaluate %s: %v", b.Name(), expr, err)
	}
	var v T
	if err := json.Unmarshal([]byte(s), &v); err != nil {
		t.Fatalf("%s: %s gave %s: %v", b.Name(), expr, s, err)
	}
	return v
}

// openApp opens u and waits (at most 60 s) for the app's first result.
func openApp(t *testing.T, b enginetest.Browser, u string) {
	t.Helper()
	if err := b.Open(u); err != nil {
		t.Fatalf("%s: open %s: %v", b.Name(), u, err)
	}
	state := js[string](t, b, `new Promise(r => { const end = Date.now() + 60000; (function poll() {
		const d = document.documentElement, s = d.getAttribute("data-ready");
		if (s === "error" || s && d.hasAttribute("data-settled") || Date.now() > end) r(s || "timeout"); else setTimeout(poll, 20); })(); })`)
	if state != "1" {
		msg := js[string](t, b, `document.getElementById("load-error").textContent`)
		t.Fatalf("%s: the page did not start: %s %s", b.Name(), state, msg)
	}
}

func engineClick(t *testing.T, b enginetest.Browser, sel string) {
	t.Helper()
	if !js[bool](t, b, `(function(){const el=document.querySelector(`+strconv.Quote(sel)+`); if(!el) return false; el.click(); return true})()`) {
		t.Fatalf("%s: nothing to click at %s", b.Name(), sel)
	}
}

func engineSet(t *testing.T, b enginetest.Browser, form, name, text string) {
	t.Helper()
	if !js[bool](t, b, `(function(){const el=document.querySelector('#`+form+` [name="`+name+`"]'); if(!el) return false;`+
		` el.value=`+strconv.Quote(text)+`; el.dispatchEvent(new Event("input",{bubbles:true}));`+
		` el.dispatchEvent(new Event("change",{bubbles:true})); return true})()`) {
		t.Fatalf("%s: no field %s in #%s", b.Name(), name, form)
	}
}

func engineNumber(t *testing.T, b enginetest.Browser, key string) float64 {
	t.Helper()
	s := js[string](t, b, `(document.querySelector('[data-key="`+key+`"]')||{textContent:"<missing>"}).textContent`)
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("%s: data-key %s holds %q, not a number", b.Name(), key, s)
	}
	return v
}

// engineCurrent is the recipe on screen (the page keeps it in localStorage after a zero
// timeout) and the core's plan of it.
func engineCurrent(t *testing.T, b enginetest.Browser) (recipe.Recipe, recipe.Result) {
	t.Helper()
	src := js[string](t, b, `new Promise(r => setTimeout(() => r(localStorage.getItem("saltcast.current") || ""), 0))`)
	r, err := recipe.Decode([]byte(src))
	if err != nil {
		t.Fatalf("%s: the page's current recipe %q: %v", b.Name(), src, err)
	}
	res, err := recipe.Plan(r)
	if err != nil {
		t.Fatalf("core plan of the page's recipe: %v", err)
	}
	return r, res
}

// The core checks, in every engine of the build tags.
func TestEngines(t *testing.T) {
	if len(engines) == 0 {
		t.Fatal("no engine in this build (tags gecko, webkit)")
	}
	u, page := builtPage(t)
	for _, e := range engines {
		t.Run(e.name, func(t *testing.T) {
			b := startEngine(t, e, enginetest.Options{})
			t.Logf("engine: %s", b.Name())

			// The request log sees requests: a page on the network is asked for (and the
			// proxy refuses it). Without this the "nothing requested" check below could not fail.
			probe := "http://saltcast-probe.invalid/"
			b.Open(probe) // an error page is expected
			if !enginetest.Sees(b.Requests(), probe) {
				t.Fatalf("the request log did not see a page on the network (%q); it cannot see the app's requests", b.Requests())
			}
			// The error page of the probe loads its own resources (Gecko: a data: font); they
			// are done before the count starts.
			b.Open("about:blank")
			time.Sleep(time.Second)
			before := len(b.Requests())

			t.Run("computes on load from file", func(t *testing.T) {
				openApp(t, b, u)
				js[bool](t, b, `localStorage.clear(), true`)
				openApp(t, b, u)
				_, res := engineCurrent(t, b)
				if got := engineNumber(t, b, "charge_g"); !(got > 0) || math.Abs(got-res.ChargeG) > engineRelTol*res.ChargeG {
					t.Errorf("charge_g on load = %v, the core plans %v g for the same recipe", got, res.ChargeG)
				}
				if !js[bool](t, b, `getComputedStyle(document.getElementById("no-app")).display === "none"`) {
					t.Error("the running app still shows the note on opening the file in a browser")
				}
			})
			t.Run("recomputes on input", func(t *testing.T) {
				engineClick(t, b, `[data-demo="cuso4"]`)
				engineSet(t, b, "recipe", "water_g", "1000")
				first := engineNumber(t, b, "charge_g")
				engineSet(t, b, "recipe", "water_g", "1500")
				after := engineNumber(t, b, "charge_g")
				r, res := engineCurrent(t, b)
				if !r.WaterG.Set || r.WaterG.Value != 1500 {
					t.Fatalf("the page's recipe has water_g %v, want 1500", r.WaterG)
				}
				if math.Abs(after-res.ChargeG) > engineRelTol*res.ChargeG {
					t.Errorf("charge_g shown %v, core says %v", after, res.ChargeG)
				}
				// At a fixed % of saturation the charge is proportional to the water (mass balance).
				if ratio := after / first; math.Abs(ratio-1.5) > 2*engineRelTol {
					t.Errorf("charge for 1500 g / for 1000 g of water = %v, want 1.5", ratio)
				}
				// Water by mass → by volume and back carries the amount; the charge stays.
				engineClick(t, b, `#recipe [name="water_basis"][value="volume"]`)
				if v := js[string](t, b, `document.querySelector('#recipe [name="water_mL"]').value`); v == "" {
					t.Error("switched to water by volume: the box is empty")
				}
				if got := engineNumber(t, b, "charge_g"); math.Abs(got-after) > engineRelTol*after {
					t.Errorf("charge after switching to volume %v, was %v", got, after)
				}
			})
			t.Run("import export round trip", func(t *testing.T) {
				js[bool](t, b, `localStorage.removeItem("saltcast.recipes"), true`)
				openApp(t, b, u)
				for _, demo := range []string{"kno3", "cuso4"} {
					engineClick(t, b, `[data-demo="`+demo+`"]`)
					js[bool](t, b, `document.getElementById("save-name").value="", true`)
					engineClick(t, b, "#save-btn")
				}
				saved := js[string](t, b, `localStorage.getItem("saltcast.recipes") || ""`)
				engineClick(t, b, "#tab-box")
				engineClick(t, b, "#export-all")
				exported := js[string](t, b, `document.getElementById("transfer").value`)
				if exported != saved || !strings.Contains(saved, `"recipes":[`) {
					t.Fatalf("export differs from what was saved:\n%s\n%s", exported, saved)
				}
				js[bool](t, b, `localStorage.removeItem("saltcast.recipes"), true`)
				openApp(t, b, u)
				js[bool](t, b, `document.getElementById("transfer").value=`+strconv.Quote(exported)+`, true`)
				engineClick(t, b, "#import-btn")
				engineClick(t, b, "#export-all")
				again := js[string](t, b, `document.getElementById("transfer").value`)
				if again != exported {
					t.Errorf("after import the recipes differ:\n%s\nwant\n%s", again, exported)
				}
				if rs, err := recipe.DecodeCollection([]byte(again)); err != nil || len(rs) != 2 {
					t.Errorf("the imported collection reads back as %v, %v", rs, err)
				}
			})
			t.Run("save a copy", func(t *testing.T) {
				// The blob the page hands to the download is kept (and the download itself
				// not started, so no engine asks where to save it).
				js[bool](t, b, `(function(){ window.__saved = []; const make = URL.createObjectURL;
					URL.createObjectURL = function (o) { window.__saved.push(o); return make.call(URL, o); };
					HTMLAnchorElement.prototype.click = function () {}; return true })()`)
				engineClick(t, b, "#tab-box")
				engineClick(t, b, "#carry-all")
				engineClick(t, b, "#carry-save")
				copyText := js[string](t, b, `window.__saved.length ? window.__saved[window.__saved.length-1].text() : ""`)
				if copyText == "" {
					t.Fatal("saving a copy handed nothing to download")
				}
				c, err := carry.ExtractCarried([]byte(copyText))
				if err != nil {
					t.Fatalf("the saved copy: %v", err)
				}
				if len(c.Recipes) != 2 || !c.Sealed {
					t.Errorf("the copy carries %d recipes, sealed %v; want the 2 saved", len(c.Recipes), c.Sealed)
				}
				if want, _ := carry.WithCarried(page, c); !bytes.Equal([]byte(copyText), want) {
					t.Errorf("the copy (%d B) is not the page (%d B) with the recipes block", len(copyText), len(page))
				}
				// Opened, the copy lists them as received.
				path := filepath.Join(t.TempDir(), "copy.html")
				if err := os.WriteFile(path, []byte(copyText), 0o644); err != nil {
					t.Fatal(err)
				}
				openApp(t, b, (&url.URL{Scheme: "file", Path: path}).String())
				engineClick(t, b, "#tab-box")
				if got := js[[]string](t, b, `[...document.querySelectorAll("#received .nm")].map(e => e.textContent)`); len(got) != 2 {
					t.Errorf("the copy shows %q as received", got)
				}
			})
			t.Run("no network request", func(t *testing.T) {
				// file: is the page and its copy from disk. A data: URL carries its bytes in
				// itself and reaches no network (Gecko reports one data: font while the page
				// loads; the page holds no font and its policy has font-src 'none').
				var extra []string
				for _, r := range b.Requests()[before:] {
					if !strings.HasPrefix(r, "file:") && !strings.HasPrefix(r, "data:") {
						extra = append(extra, r)
					}
				}
				if len(extra) > 0 {
					t.Errorf("the page made %d network requests: %s", len(extra), strings.Join(extra, ", "))
				}
			})
		})
	}
}

// With scripts off (a mail or file preview), the page shows the note on how to open it in a
// browser, and not the calculator; with scripts on, the app and not the note.
func TestEnginesNoScriptNote(t *testing.T) {
	u, page := builtPage(t)
	shots := os.Getenv("SALTCAST_SHOTS")
	for _, e := range engines {
		t.Run(e.name, func(t *testing.T) {
			b := startEngine(t, e, enginetest.Options{NoScript: true, Width: 768, Height: 1024})
			at := u
			if e.scriptsOffByPolicy {
				at = withoutScripts(t, page)
			}
			if err := b.Open(at); err != nil {
				t.Fatal(err)
			}
			time.Sleep(time.Second) // nothing runs; give the engine a moment to lay out
			checkNoScriptView(t, b)
			if shots != "" {
				for _, w := range [][2]int{{768, 1024}, {390, 844}} {
					b.Resize(w[0], w[1])
					png, err := b.Screenshot()
					if err != nil {
						t.Fatal(err)
					}
					name := filepath.Join(shots, "noscript-"+e.name+"-"+strconv.Itoa(w[0])+".png")
					if err := os.WriteFile(name, png, 0o644); err != nil {
						t.Fatal(err)
					}
				}
			}
		})
	}
}

// checkNoScriptView checks, in a page whose own scripts never ran, that the note is shown
// near the top and the calculator is not. The look is taken by the driver (its scripts run
// apart from the page's).
func checkNoScriptView(t *testing.T, b enginetest.Browser) {
	t.Helper()
	type view struct {
		Ran          bool    `json:"ran"`
		NoteShown    bool    `json:"note"`
		NoteTop      float64 `json:"noteTop"`
		NoteText     string  `json:"text"`
		MainShown    bool    `json:"main"`
		DashesShown  int     `json:"dashes"`
		InputsShown  int     `json:"inputs"`
		ViewportHigh float64 `json:"vh"`
	}
	v := js[view](t, b, `(function(){
		const shown = el => !!el && el.getClientRects().length > 0 && getComputedStyle(el).visibility !== "hidden";
		const note = document.getElementById("no-app");
		return {
			ran: document.documentElement.hasAttribute("data-run") || document.documentElement.hasAttribute("data-ready"),
			note: shown(note), noteTop: note ? note.getBoundingClientRect().top : -1,
			text: note ? note.textContent.replace(/\s+/g, " ") : "",
			main: shown(document.querySelector("main")),
			dashes: [...document.querySelectorAll("output, [data-strip]")].filter(shown).length,
			inputs: [...document.querySelectorAll("input, select, textarea")].filter(shown).length,
			vh: innerHeight };
	})()`)
	if v.Ran {
		t.Fatalf("%s: the page's scripts ran; this check needs them off", b.Name())
	}
	if !v.NoteShown || v.NoteTop < 0 || v.NoteTop > v.ViewportHigh/3 {
		t.Errorf("%s: the note is not shown near the top (shown %v, at %v px of %v)", b.Name(), v.NoteShown, v.NoteTop, v.ViewportHigh)
	}
	for _, words := range []string{"browser", "phone or tablet", "Open in", "Share", "computer", "Double-click", "drag"} {
		if !strings.Contains(v.NoteText, words) {
			t.Errorf("%s: the note does not say %q: %s", b.Name(), words, v.NoteText)
		}
	}
	if v.MainShown || v.DashesShown > 0 || v.InputsShown > 0 {
		t.Errorf("%s: without scripts the calculator shows (main %v, %d results, %d inputs)", b.Name(), v.MainShown, v.DashesShown, v.InputsShown)
	}
}

// withoutScripts writes a copy of page whose head starts with a second policy that lets no
// script run (every policy is enforced, W3C CSP Level 3 §8.1) and returns its file URL.
func withoutScripts(t *testing.T, page []byte) string {
	t.Helper()
	const head = "<head>\n"
	if bytes.Count(page, []byte(head)) != 1 {
		t.Fatal("the page has no single <head>")
	}
	cp := bytes.Replace(page, []byte(head), []byte(head+`<meta http-equiv="Content-Security-Policy" content="script-src 'none'">`+"\n"), 1)
	path := filepath.Join(t.TempDir(), "saltcast-noscript.html")
	if err := os.WriteFile(path, cp, 0o644); err != nil {
		t.Fatal(err)
	}
	return (&url.URL{Scheme: "file", Path: path}).String()
}
