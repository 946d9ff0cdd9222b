//go:build browser

package web_test

import (
	"context"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"

	"saltcast/core/gas"
	"saltcast/core/recipe"
)

// The page computes on load: the demo batch's charge is on screen without any input.
func TestComputesOnLoad(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	if got := outputNumber(t, ctx, "charge_g"); !(got > 0) {
		t.Errorf("charge_g on load = %v, want a positive mass", got)
	}
}

// Nothing is fetched: opening the page and using it makes no request beyond the file itself.
func TestNoNetworkRequests(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	rc := countRequests(t, ctx)
	open(t, ctx, u)
	var extra []string
	sawPage := false
	for _, r := range rc.list() {
		if r == u {
			sawPage = true
		} else {
			extra = append(extra, r)
		}
	}
	if !sawPage {
		t.Fatal("the request counter did not see the page itself, so it cannot see others")
	}
	if len(extra) > 0 {
		t.Errorf("the page made %d network requests: %s", len(extra), strings.Join(extra, ", "))
	}
}

// current is the recipe the page has on screen (it keeps it in localStorage) and the core's
// plan of that same recipe.
func current(t *testing.T, ctx context.Context) (recipe.Recipe, recipe.Result) {
	t.Helper()
	// The page stores it in a zero timeout after planning; a later timeout runs after it.
	src := mustEval[string](t, ctx, `new Promise(r => setTimeout(() => r(localStorage.getItem("saltcast.current") || ""), 0))`)
	r, err := recipe.Decode([]byte(src))
	if err != nil {
		t.Fatalf("the page's current recipe %q: %v", src, err)
	}
	res, err := recipe.Plan(r)
	if err != nil {
		t.Fatalf("core plan of the page's recipe: %v", err)
	}
	return r, res
}

func click(t *testing.T, ctx context.Context, sel string) {
	t.Helper()
	if !mustEval[bool](t, ctx, `(function(){const b=document.querySelector(`+strconv.Quote(sel)+`); if(!b) return false; b.click(); return true})()`) {
		t.Fatalf("nothing to click at %s", sel)
	}
}

// shownTol is the relative rounding of a mass shown with four significant figures.
const shownTol = 5e-4

// Changing water_g changes charge_g to what the core computes for the same recipe; at a fixed
// % of saturation the charge is proportional to the water (mass balance).
func TestWaterChangesCharge(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "water_g", "1000")
	before := outputNumber(t, ctx, "charge_g")
	setField(t, ctx, "recipe", "water_g", "1500")
	after := outputNumber(t, ctx, "charge_g")
	r, res := current(t, ctx)
	if !r.WaterG.Set || r.WaterG.Value != 1500 {
		t.Fatalf("the page's recipe has water_g %v, want 1500", r.WaterG)
	}
	if math.Abs(after-res.ChargeG) > shownTol*res.ChargeG {
		t.Errorf("charge_g shown %v, core says %v for the same recipe", after, res.ChargeG)
	}
	if ratio := after / before; math.Abs(ratio-1.5) > 2*shownTol {
		t.Errorf("charge for 1500 g water / charge for 1000 g = %v, want 1.5", ratio)
	}
}

// An entry that cannot be read shows a message beside its field, keeps the user's text and
// keeps the last good results on screen.
func TestInvalidEntryKeepsResults(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	good := output(t, ctx, "charge_g")
	setField(t, ctx, "recipe", "water_g", "12,5,0")
	if msg := mustEval[string](t, ctx, `document.getElementById("m-water_g").textContent`); !strings.Contains(msg, "12,5,0") {
		t.Errorf("message beside water_g = %q, want one naming what was typed", msg)
	}
	if v := mustEval[string](t, ctx, `document.querySelector('#recipe [name="water_g"]').value`); v != "12,5,0" {
		t.Errorf("water_g now holds %q, want the user's text", v)
	}
	if got := output(t, ctx, "charge_g"); got != good {
		t.Errorf("charge_g after a bad entry = %q, want the last good %q", got, good)
	}
	if mustEval[bool](t, ctx, `document.getElementById("stale").hidden`) {
		t.Error("the results are not marked as the last good ones")
	}
	setField(t, ctx, "recipe", "water_g", "1000")
	if mustEval[string](t, ctx, `document.getElementById("m-water_g").textContent`) != "" {
		t.Error("the message stays after a good entry")
	}
}

const hostileName = `<img src=x onerror=alert(1)>`

// Saved, reloaded, exported and imported recipes come back identical; a hostile name shows
// as text everywhere.
func TestSaveReloadExportImport(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "name", hostileName)
	mustEval[bool](t, ctx, `document.getElementById("save-name").value="", true`)
	click(t, ctx, "#save-btn")
	click(t, ctx, `[data-demo="kno3"]`)
	click(t, ctx, "#save-btn") // saved under the example's own name
	saved := mustEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`)
	if !strings.Contains(saved, `"recipes":[`) {
		t.Fatalf("nothing saved: %q", saved)
	}

	open(t, ctx, u) // reload
	click(t, ctx, "#tab-box")
	names := mustEval[[]string](t, ctx, `[...document.querySelectorAll("#saved .nm")].map(e => e.textContent)`)
	if len(names) != 2 || names[0] != hostileName {
		t.Fatalf("saved list after reload = %q", names)
	}
	if n := mustEval[int](t, ctx, `document.querySelectorAll("img").length`); n != 0 {
		t.Errorf("the page holds %d img elements: a name became markup", n)
	}
	click(t, ctx, "#export-all")
	exported := mustEval[string](t, ctx, `document.getElementById("transfer").value`)
	if exported != saved {
		t.Errorf("export differs from what was saved:\n%s\n%s", exported, saved)
	}

	// A fresh browser imports the file.
	mustEval[bool](t, ctx, `localStorage.removeItem("saltcast.recipes"), true`)
	open(t, ctx, u)
	mustEval[bool](t, ctx, `document.getElementById("transfer").value=`+strconv.Quote(exported)+`, true`)
	click(t, ctx, "#import-btn")
	click(t, ctx, "#export-all")
	again := mustEval[string](t, ctx, `document.getElementById("transfer").value`)
	if again != exported {
		t.Errorf("after import the recipes differ:\n%s\nwant\n%s", again, exported)
	}
	rs, err := recipe.DecodeCollection([]byte(again))
	if err != nil || len(rs) != 2 || rs[0].Name != hostileName {
		t.Errorf("the imported collection reads back as %v, %v", rs, err)
	}

	// The hostile name opened on the batch screen and on the sheet is text too.
	click(t, ctx, `#saved [data-open="0"]`)
	idle(t, ctx)
	if got := mustEval[string](t, ctx, `document.getElementById("s-name").textContent`); got != hostileName {
		t.Errorf("sheet name = %q, want %q as text", got, hostileName)
	}
	if n := mustEval[int](t, ctx, `document.querySelectorAll("img").length`); n != 0 {
		t.Errorf("the page holds %d img elements after opening the recipe", n)
	}
}

// A corrupt import file changes nothing and says so.
func TestCorruptImportLeavesSaved(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	before := withOneSaved(t, ctx, u)
	for _, bad := range []string{
		`{"format":1,"kind":"saltcast-recipes","recipes":[{"name":"ok","solute":"KNO3","water_g":100,"dissolve_temp_C":30},{"name":"bad","solute":"KNO3","water_g":-1,"dissolve_temp_C":30}]}`,
		`{"format":1,"kind":"saltcast-recipes","recipes":[{"name":"cut`,
		"\x00\x01 not a recipe file",
	} {
		mustEval[bool](t, ctx, `document.getElementById("transfer").value=`+strconv.Quote(bad)+`, true`)
		click(t, ctx, "#import-btn")
		if msg := mustEval[string](t, ctx, `document.getElementById("m-import").textContent`); !strings.HasPrefix(msg, "Nothing was imported") {
			t.Errorf("import of %q says %q", bad, msg)
		}
		if after := mustEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`); after != before {
			t.Errorf("import of %q changed the saved recipes to %s", bad, after)
		}
		if n := mustEval[int](t, ctx, `document.querySelectorAll("#saved li").length`); n != 1 {
			t.Errorf("import of %q: %d recipes listed, want 1", bad, n)
		}
	}
}

// Printing shows the batch sheet, and it holds every caution and source of the plan.
func TestPrintViewHasSourcesAndCautions(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="kno3"]`)
	_, res := current(t, ctx)
	if len(res.Cautions) == 0 || len(res.Sources) == 0 {
		t.Fatalf("the example has %d cautions and %d sources; the test needs both", len(res.Cautions), len(res.Sources))
	}
	if err := emulatePrint(ctx); err != nil {
		t.Fatal(err)
	}
	if d := mustEval[string](t, ctx, `getComputedStyle(document.getElementById("screen-sheet")).display`); d == "none" {
		t.Fatal("the batch sheet is not shown in print")
	}
	if d := mustEval[string](t, ctx, `getComputedStyle(document.getElementById("screen-batch")).display`); d != "none" {
		t.Error("the batch screen prints too")
	}
	text := mustEval[string](t, ctx, `document.getElementById("screen-sheet").innerText`)
	for _, c := range res.Cautions {
		if !strings.Contains(text, c) {
			t.Errorf("printed sheet lacks the caution %q", c)
		}
	}
	for _, s := range res.Sources {
		if !strings.Contains(text, s) {
			t.Errorf("printed sheet lacks the source %q", s)
		}
	}
	for _, want := range []string{"Prepared by", "Checked by", "SDS"} {
		if !strings.Contains(text, want) {
			t.Errorf("printed sheet lacks %q", want)
		}
	}
	if v := mustEval[string](t, ctx, `document.querySelector('meta[name="saltcast-version"]').content`); v == "" || !strings.Contains(text, v) {
		t.Errorf("printed sheet lacks the app version %q", v)
	}
}

// The gas screen shows the day's O2 saturation as the core computes it.
func TestGasScreen(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, "#tab-gas")
	mustEval[bool](t, ctx, `document.querySelector('#units [name="unit_temp"]').value="C", document.querySelector('#units [name="unit_temp"]').dispatchEvent(new Event("change",{bubbles:true})), true`)
	setField(t, ctx, "gas", "temp_C", "12")
	setField(t, ctx, "gas", "salinity", "0")
	setField(t, ctx, "gas", "pressure", "101,325")
	got := outputNumber(t, ctx, "saturation_mg_per_L")
	want, err := gas.OxygenSaturation(gas.Conditions{TempC: 12, PressureKPa: 101.325}, gas.BensonKrause)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(got-want.MgPerL) > shownTol*want.MgPerL {
		t.Errorf("saturation_mg_per_L = %v, core says %v", got, want.MgPerL)
	}
	// Fresh water at 12 °C and 760 mm Hg: 10.77 mg/L (USGS dissolved-oxygen solubility
	// table after Benson & Krause; from memory). gasTol is the table's last digit plus memory.
	const gasTol = 0.05
	if math.Abs(got-10.77) > gasTol {
		t.Errorf("saturation at 12 °C = %v mg/L, want about 10.77", got)
	}
	setField(t, ctx, "gas", "measured_mg_per_L", "8")
	if pct := outputNumber(t, ctx, "percent_saturation"); math.Abs(pct-100*8/got) > 0.1 {
		t.Errorf("percent_saturation = %v, want 100·8/%v", pct, got)
	}
}

// minTarget is the smallest touch target, in CSS px (WCAG 2.1 SC 2.5.5 "Target Size", and
// the 44 pt of Apple's Human Interface Guidelines; common practice for tablets).
const minTarget = 44

// Every control a finger uses is at least minTarget on each side, on every screen, in both
// tablet orientations.
func TestTouchTargets(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	for _, size := range [][2]int64{{768, 1024}, {1280, 800}} {
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		open(t, ctx, u)
		click(t, ctx, `[data-demo="cuso4"]`)
		mustEval[bool](t, ctx, `document.getElementById("custom-box").open = true, true`)
		for _, screen := range []string{"batch", "gas", "box", "sheet"} {
			click(t, ctx, "#tab-"+screen)
			small := mustEval[[]string](t, ctx, `[...document.querySelectorAll(
				'button, select, textarea, summary, .seg span, label.check, label.act, a.strip, ' +
				'input:not([type=radio]):not([type=checkbox]):not([type=file])')]
				.filter(e => e.getClientRects().length > 0)
				.filter(e => { const r = e.getBoundingClientRect(); return r.width < `+strconv.Itoa(minTarget)+` || r.height < `+strconv.Itoa(minTarget)+` })
				.map(e => (e.name || e.id || e.className || e.tagName) + " " + Math.round(e.getBoundingClientRect().width) + "×" + Math.round(e.getBoundingClientRect().height))`)
			for _, s := range small {
				t.Errorf("%dx%d %s: control %s is smaller than %d px", size[0], size[1], screen, s, minTarget)
			}
		}
	}
}

// The share link carries the recipe in its fragment: opened in a fresh browser it shows the
// same recipe. From a file opened from disk the link is the fragment alone (no local path);
// the receiver's own copy of the page opens it.
func TestShareLink(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "water_g", "777")
	want := mustEval[string](t, ctx, `new Promise(r => setTimeout(() => r(localStorage.getItem("saltcast.current")), 0))`)
	click(t, ctx, "#share-btn")
	link := mustEval[string](t, ctx, `document.getElementById("share-link").value`)
	if !strings.HasPrefix(link, "#recipe=") {
		t.Fatalf("share link %q from a file does not start with #recipe=", link)
	}
	link = u + link
	resetStorage(t, ctx, u)
	if err := chromedp.Do(ctx, chromedp.Navigate("about:blank"), chromedp.Navigate(link)); err != nil {
		t.Fatal(err)
	}
	waitReady(t, ctx)
	if got := mustEval[string](t, ctx, `document.querySelector('#recipe [name="water_g"]').value`); got != "777" {
		t.Errorf("water_g from the link = %q, want 777", got)
	}
	if got := mustEval[string](t, ctx, `new Promise(r => setTimeout(() => r(localStorage.getItem("saltcast.current")), 0))`); got != want {
		t.Errorf("recipe from the link =\n%s\nwant\n%s", got, want)
	}
}

// Temperatures follow the unit switch: inputs and results show °F and the recipe stays °C.
// The copper sulfate demo dissolves at 60 °C, which is 140 °F (NIST SP 811, 2008, sec.
// 4.2.1.1: t/°F = 1.8 t/°C + 32).
func TestUnitSwitch(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	onsetC := outputNumber(t, ctx, "saturation_temp_C")
	mustEval[bool](t, ctx, `(function(){const s=document.querySelector('#units [name="unit_temp"]'); s.value="F"; s.dispatchEvent(new Event("change",{bubbles:true})); return true})()`)
	defer mustEval[bool](t, ctx, `(function(){const s=document.querySelector('#units [name="unit_temp"]'); s.value="C"; s.dispatchEvent(new Event("change",{bubbles:true})); return true})()`)
	if v := mustEval[string](t, ctx, `document.querySelector('#recipe [name="dissolve_temp_C"]').value`); v != "140" {
		t.Errorf("dissolve_temp_C shows %q in °F, want 140", v)
	}
	onsetF := outputNumber(t, ctx, "saturation_temp_C")
	if math.Abs(onsetF-(onsetC*1.8+32)) > 0.1 {
		t.Errorf("onset %v °C shows as %v °F", onsetC, onsetF)
	}
	if unitText := mustEval[string](t, ctx, `document.querySelector('[data-key="saturation_temp_C"]').parentElement.querySelector(".u").textContent`); unitText != "°F" {
		t.Errorf("unit beside the onset = %q, want °F", unitText)
	}
	r, _ := current(t, ctx)
	if r.DissolveTempC != 60 {
		t.Errorf("the recipe's dissolve_temp_C = %v after a unit switch, want 60", r.DissolveTempC)
	}
}

// A compound of the user's own points is planned, and its fit is reported.
func TestCustomCompound(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	mustEval[bool](t, ctx, `document.getElementById("custom-box").open = true, true`)
	setField(t, ctx, "recipe", "custom.name", "bench salt (invented)")
	setField(t, ctx, "recipe", "custom.molar_mass_g_per_mol", "101,1")
	setField(t, ctx, "recipe", "custom.points", "10; 21\n30; 45,5\n50; 85\n70; 138")
	mustEval[bool](t, ctx, `(function(){const c=document.querySelector('#recipe [name="use_custom"]'); c.checked=true; c.dispatchEvent(new Event("input",{bubbles:true})); return true})()`)
	if stale := mustEval[bool](t, ctx, `!document.getElementById("stale").hidden`); stale {
		t.Fatalf("the custom compound was not planned: %s", mustEval[string](t, ctx, `document.getElementById("stale").textContent`))
	}
	r, res := current(t, ctx)
	if r.Custom == nil || len(r.Custom.Points) != 4 || r.Custom.MolarMassGPerMol != 101.1 {
		t.Fatalf("the page's recipe custom part = %+v", r.Custom)
	}
	if got := outputNumber(t, ctx, "charge_g"); math.Abs(got-res.ChargeG) > shownTol*res.ChargeG {
		t.Errorf("charge_g = %v, core says %v", got, res.ChargeG)
	}
	if fit := mustEval[string](t, ctx, `document.getElementById("custom-fit").textContent`); !strings.Contains(fit, "R²") {
		t.Errorf("fit report = %q", fit)
	}
}

// maxPageBytes is the limit on dist/saltcast.html: 1.15 MB, read as 1 150 000 bytes (decimal
// megabytes), so the page opens quickly on a tablet and has room to grow (web/PERFORMANCE.md).
const maxPageBytes = 1_150_000

func TestPageSize(t *testing.T) {
	appURL(t)
	fi, err := os.Stat(filepath.Join("..", "dist", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	if fi.Size() > maxPageBytes {
		t.Errorf("dist/saltcast.html is %d bytes, more than the %d allowed (web/PERFORMANCE.md and DEVELOPERS.md's measured decisions say what the bytes buy)", fi.Size(), maxPageBytes)
	}
}
