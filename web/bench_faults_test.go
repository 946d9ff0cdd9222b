//go:build browser

package web_test

// Faults found by a technician trying the app at the bench: each test here failed on the page
// as it was and checks the page as it should be.

import (
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
)

// rgb reads a computed CSS colour "rgb(r, g, b)" or "rgba(r, g, b, a)" as #rrggbb.
func rgb(t *testing.T, css string) string {
	t.Helper()
	m := regexp.MustCompile(`rgba?\((\d+),\s*(\d+),\s*(\d+)`).FindStringSubmatch(css)
	if m == nil {
		t.Fatalf("computed colour %q is not rgb()", css)
	}
	hex := "#"
	for _, s := range m[1:] {
		v, _ := strconv.Atoi(s)
		hex += strconv.FormatInt(int64(v)+256, 16)[1:]
	}
	return hex
}

// After a wrong entry the results strip stays readable: its figures and labels keep a
// contrast of at least 4.5:1 with the strip's background (WCAG 2.1, SC 1.4.3).
func TestStaleStripReadable(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	// The strip shows below 1000 px: a portrait tablet.
	if err := chromedp.Do(ctx, chromedp.EmulateViewport(768, 1024)); err != nil {
		t.Fatal(err)
	}
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "water_g", "abc")
	if !mustEval[bool](t, ctx, `document.getElementById("strip").classList.length > 0 && !document.getElementById("stale").hidden`) {
		t.Fatal("the wrong entry did not mark the results as stale")
	}
	bg := rgb(t, mustEval[string](t, ctx, `getComputedStyle(document.getElementById("strip")).backgroundColor`))
	for _, sel := range []string{"#strip b", "#strip small", "#strip [data-unit]"} {
		fg := rgb(t, mustEval[string](t, ctx, `getComputedStyle(document.querySelector(`+strconv.Quote(sel)+`)).color`))
		if r := contrast(fg, bg); r < 4.5 {
			t.Errorf("stale strip: %s is %s on %s, contrast %.2f:1, want ≥ 4.5:1", sel, fg, bg, r)
		}
	}
}

// A solute without an enthalpy of solution in the library (benzoic acid) shows the heat of
// dissolving as not given, never as 0 kJ or 0.0 K, on the batch screen and the sheet.
func TestNoEnthalpyNotZero(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "solute", "benzoic acid")
	setField(t, ctx, "recipe", "dissolve_temp_C", "80")
	setField(t, ctx, "recipe", "cool_to_C", "20")
	if got := output(t, ctx, "charge_g"); got == "—" {
		t.Fatal("no plan for benzoic acid")
	}
	// Every visible figure of the heat of dissolving.
	shown := mustEval[string](t, ctx, `[...document.querySelectorAll('[data-key="dissolution_heat_kJ"],[data-key="dissolution_temp_change_K"]')]
		.filter(o => o.offsetParent !== null).map(o => o.closest(".fig").textContent).join(" | ")`)
	if regexp.MustCompile(`(^|[^0-9.])0(\.0+)? *(kJ|K)`).MatchString(shown) {
		t.Errorf("heat of dissolving without an enthalpy shows %q", shown)
	}
	if !strings.Contains(shown, "not given") {
		t.Errorf("heat of dissolving shows %q, want it said to be not given", shown)
	}
	click(t, ctx, `#tab-sheet`)
	sheet := mustEval[string](t, ctx, `document.getElementById("s-results").textContent`)
	if regexp.MustCompile(`dissolving[^0-9]*0(\.0+)? *(kJ|K)`).MatchString(sheet) {
		t.Errorf("the sheet shows a zero heat of dissolving: %q", sheet)
	}
}

// A share link pasted into a tab that already shows the app loads its recipe (hashchange).
func TestShareLinkInOpenTab(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "name", "Linked batch")
	click(t, ctx, `#share-btn`)
	frag := mustEval[string](t, ctx, `(function(){const v=document.getElementById("share-link").value; return v.slice(v.indexOf("#"))})()`)
	if !strings.HasPrefix(frag, "#") || len(frag) < 10 {
		t.Fatalf("share link fragment %q", frag)
	}
	mustEval[bool](t, ctx, `history.replaceState(null, "", location.pathname), true`)
	click(t, ctx, `[data-demo="kno3"]`)
	if got := mustEval[string](t, ctx, `document.getElementById("f-name").value`); got == "Linked batch" {
		t.Fatal("the demo did not replace the name")
	}
	got := mustEval[string](t, ctx, `new Promise(r => { location.hash = `+strconv.Quote(frag)+`; setTimeout(() => r(document.getElementById("f-name").value), 300) })`)
	if got != "Linked batch" {
		t.Errorf("after pasting the link into the open tab the batch is %q, want %q", got, "Linked batch")
	}
}

// A share link made from the file opened from disk does not carry the folder it lies in.
func TestShareLinkHidesLocalPath(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `#share-btn`)
	link := mustEval[string](t, ctx, `document.getElementById("share-link").value`)
	dir, _ := filepath.Abs(filepath.Join("..", "dist"))
	if strings.Contains(link, dir) || strings.Contains(link, "file:") || strings.Contains(link, "/dist/") {
		t.Errorf("the share link carries the local path: %q", link[:min(len(link), 120)])
	}
	if !strings.Contains(link, "#") {
		t.Errorf("the share link %q carries no recipe", link)
	}
	// The link can be taken in through the import box on the other side.
	click(t, ctx, `[data-demo="kno3"]`)
	mustEval[bool](t, ctx, `(function(){const t=document.getElementById("transfer"); t.value=`+strconv.Quote(link)+`; return true})()`)
	click(t, ctx, `#import-btn`)
	if got := mustEval[string](t, ctx, `document.getElementById("f-solute").value`); got != "CuSO4·5H2O" && !strings.Contains(got, "CuSO4") {
		msg := mustEval[string](t, ctx, `document.getElementById("m-import").textContent`)
		t.Errorf("the link pasted into the import box did not load: solute %q, message %q", got, msg)
	}
}

// °F, lb and US gal apply everywhere: messages, margins, rounding, and K shows 0 °C as 273.15.
func TestUnitsApplyEverywhere(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="kno3"]`)
	setField(t, ctx, "units", "unit_temp", "F")
	setField(t, ctx, "units", "unit_mass", "lb")
	setField(t, ctx, "units", "unit_volume", "gal")

	// 20 000 mL is 5.283441047 US gal (NIST SP 811, B.8: 1 gal = 3.785411784 L); shown rounded.
	if v := mustEval[string](t, ctx, `document.getElementById("f-water_mL").value`); len(strings.TrimLeft(strings.ReplaceAll(v, ".", ""), "0")) > 6 {
		t.Errorf("water box shows %q US gal, want a sensibly rounded volume", v)
	}
	// The 3 K margin of the demo is 5.4 °F-degrees (ΔT/°F = 1.8·ΔT/K, NIST SP 811 B.9).
	if v := mustEval[string](t, ctx, `document.getElementById("f-clear_margin_K").value`); v != "5.4" {
		t.Errorf("safety margin box shows %q, want 5.4 (°F)", v)
	}
	if lbl := mustEval[string](t, ctx, `document.querySelector('label[for="f-clear_margin_K"]').textContent`); !strings.Contains(lbl, "°F") {
		t.Errorf("safety margin label %q, want °F", lbl)
	}
	if lbl := mustEval[string](t, ctx, `document.querySelector('label[for="f-metastable_width_K"]').textContent`); !strings.Contains(lbl, "°F") {
		t.Errorf("metastable width label %q, want °F", lbl)
	}
	// Cautions and warnings in the chosen units.
	lists := mustEval[string](t, ctx, `document.getElementById("cautions").textContent + document.getElementById("warnings").textContent`)
	if strings.Contains(lists, "°C") || regexp.MustCompile(`\d K\b`).MatchString(lists) {
		t.Errorf("cautions and warnings in °F still say °C or K: %q", lists)
	}
	// A range message and a required-field message in °F.
	setField(t, ctx, "recipe", "dissolve_temp_C", "500")
	if msg := mustEval[string](t, ctx, `document.getElementById("m-dissolve_temp_C").textContent`); !strings.Contains(msg, "°F") || strings.Contains(msg, "°C") {
		t.Errorf("range message in °F: %q", msg)
	}
	setField(t, ctx, "recipe", "dissolve_temp_C", "")
	if msg := mustEval[string](t, ctx, `document.getElementById("m-dissolve_temp_C").textContent + document.getElementById("stale").textContent`); strings.Contains(msg, "°C") || strings.Contains(msg, "key") {
		t.Errorf("required-field message in °F: %q", msg)
	}
	setField(t, ctx, "recipe", "dissolve_temp_C", "95")
	// The CSV names the unit it uses in its keys.
	csv := mustEval[string](t, ctx, `(function(){let got=""; const o=URL.createObjectURL; URL.createObjectURL=function(b){b.text().then(t=>{window.__csv=t}); return o.call(URL,b)}; document.getElementById("csv-btn").click(); URL.createObjectURL=o; return true})() && new Promise(r=>setTimeout(()=>r(window.__csv||""),200))`)
	if csv == "" {
		t.Fatal("no CSV")
	}
	for _, line := range strings.Split(csv, "\r\n") {
		c := strings.Split(line, ",")
		if len(c) < 3 {
			continue
		}
		key, ut := c[0], c[2]
		if (strings.HasSuffix(key, "_g") && ut != "g") || (strings.HasSuffix(key, "_C") && ut != "°C") || (strings.HasSuffix(key, "_mL") && ut != "mL") {
			t.Errorf("CSV row %q names a unit other than the one used", line)
		}
	}
	// Kelvin: 0 °C is 273.15 K (NIST SP 811 §4.2.1.1): the cooling programme ends at a target of 0 °C.
	setField(t, ctx, "units", "unit_temp", "C")
	setField(t, ctx, "recipe", "cool_to_C", "0")
	setField(t, ctx, "units", "unit_temp", "K")
	if s := mustEval[string](t, ctx, `[...document.querySelectorAll("#programme tbody tr")].pop().lastChild.textContent`); s != "273.15" {
		t.Errorf("a target of 0 °C ends the programme at %q K, want 273.15", s)
	}
}

// Messages speak the form's words, not the recipe file's keys.
func TestMessagesUseLabels(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "metastable_width_K", "2")
	setField(t, ctx, "recipe", "seed_at_C", "5")
	setField(t, ctx, "recipe", "cool_to_C", "5")
	all := mustEval[string](t, ctx, `[...document.querySelectorAll("#recipe .msg, #stale, #warnings")].map(e => e.textContent).join(" | ")`)
	if regexp.MustCompile(`[a-z]+_[a-zA-Z_]+`).MatchString(all) || strings.Contains(all, "the key") {
		t.Errorf("messages show recipe keys: %q", all)
	}
	if !strings.Contains(all, "Seed at") {
		t.Errorf("messages %q do not name the seeding temperature by its label", all)
	}
	setField(t, ctx, "recipe", "dissolve_temp_C", "")
	all = mustEval[string](t, ctx, `[...document.querySelectorAll("#recipe .msg, #stale")].map(e => e.textContent).join(" | ")`)
	if strings.Contains(all, "the key") || strings.Contains(all, "dissolve_temp_C") {
		t.Errorf("the required-field message shows the file's words: %q", all)
	}
	// Own compound with too few points.
	setField(t, ctx, "recipe", "use_custom", "")
	mustEval[bool](t, ctx, `(function(){const c=document.getElementById("f-use_custom"); c.checked=true; c.dispatchEvent(new Event("input",{bubbles:true})); return true})()`)
	setField(t, ctx, "recipe", "custom.molar_mass_g_per_mol", "100")
	setField(t, ctx, "recipe", "custom.points", "10; 5\n20; 4\n30; 6")
	setField(t, ctx, "recipe", "custom.model", "vant-hoff")
	fit := mustEval[string](t, ctx, `document.getElementById("custom-fit").textContent`)
	if strings.Contains(fit, "Not allowed;") || regexp.MustCompile(`[a-z]+_[a-z_]+`).MatchString(fit) {
		t.Errorf("fit message %q", fit)
	}
}

// Air-saturated water starts giving off gas as soon as it warms: the bubble figure says so
// rather than repeating the start temperature as a number.
func TestBubbleFigureSaysSomething(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `#tab-gas`)
	setField(t, ctx, "gas", "from_C", "15")
	setField(t, ctx, "gas", "to_C", "60")
	box := mustEval[string](t, ctx, `(function(){const o=document.querySelector('#gas-figures [data-key="bubble_temp_C"]'); return o ? o.closest(".fig").textContent : ""})()`)
	if box == "" {
		t.Fatal("no bubble figure on the gas screen")
	}
	if regexp.MustCompile(`^\s*15(\.0)?\s*$`).MatchString(output(t, ctx, "bubble_temp_C")) {
		t.Errorf("bubble figure just repeats the start temperature: %q", box)
	}
	if !strings.Contains(box, "warm") {
		t.Errorf("bubble figure %q does not say that gas leaves as soon as the water warms", box)
	}
}

// NaCl·2H2O (hydrohalite) exists only below 0.1 °C: nobody keeps it on a shelf.
func TestNoHydrohaliteOnShelf(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	setField(t, ctx, "recipe", "solute", "NaCl")
	opts := mustEval[string](t, ctx, `[...document.querySelectorAll("#f-form option")].map(o => o.value + "=" + o.textContent).join(" | ")`)
	if strings.Contains(opts, "2H2O") {
		t.Errorf("shelf forms of NaCl: %q", opts)
	}
	if !strings.Contains(opts, "NaCl") {
		t.Errorf("shelf forms of NaCl: %q, want the anhydrous salt", opts)
	}
	click(t, ctx, `#tab-prep`)
	setField(t, ctx, "prep", "solute", "NaCl")
	opts = mustEval[string](t, ctx, `[...document.querySelectorAll("#p-charged_form option")].map(o => o.value).join(" | ")`)
	if strings.Contains(opts, "2H2O") {
		t.Errorf("make-up screen's shelf forms of NaCl: %q", opts)
	}
}

// A new batch clears name, notes and the batch's numbers, keeps the units and the settings,
// and shows no results of the batch before.
func TestNewBatch(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "units", "unit_temp", "F")
	setField(t, ctx, "recipe", "vessel_heat_capacity_J_per_K", "800")
	click(t, ctx, `#new-batch`)
	got := mustEval[string](t, ctx, `["name","notes","water_g","dissolve_temp_C","cool_to_C","saturation_pct","vessel_heat_capacity_J_per_K"].map(n => document.querySelector('#recipe [name="'+n+'"]').value).join("|")`)
	if got != "||||||800" {
		t.Errorf("after a new batch the fields read %q, want empty batch fields and the vessel kept", got)
	}
	if v := mustEval[string](t, ctx, `document.querySelector('#units [name="unit_temp"]').value`); v != "F" {
		t.Errorf("units after a new batch: %q, want F kept", v)
	}
	if c := output(t, ctx, "charge_g"); c != "—" {
		t.Errorf("charge after a new batch: %q, want none until the batch is given", c)
	}
	// Typing the new batch plans it.
	setField(t, ctx, "recipe", "solute", "KNO3")
	setField(t, ctx, "recipe", "water_g", "500")
	setField(t, ctx, "recipe", "dissolve_temp_C", "140")
	if c := output(t, ctx, "charge_g"); c == "—" {
		t.Errorf("the new batch is not planned once its water and temperature are given")
	}
}

// The sources and the screen say that impurities are taken as inert and insoluble; a plain,
// well-documented salt (KCl) gets its heat-estimate spread said once, not in three places.
func TestImpuritiesAndHeatNoise(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `#new-batch`)
	click(t, ctx, `[name="water_basis"][value="mass"]`)
	click(t, ctx, `[name="amount_basis"][value="saturation"]`)
	setField(t, ctx, "recipe", "solute", "KCl")
	setField(t, ctx, "recipe", "water_g", "1000")
	setField(t, ctx, "recipe", "dissolve_temp_C", "60")
	setField(t, ctx, "recipe", "cool_to_C", "10")
	text := mustEval[string](t, ctx, `document.getElementById("outcome").innerText`)
	if !strings.Contains(text, "inert") || !strings.Contains(text, "insoluble") {
		t.Errorf("the results do not say impurities are taken as inert and insoluble")
	}
	if n := strings.Count(text, "lowest estimate"); n > 1 {
		t.Errorf("the lowest heat estimate is shown %d times on the batch screen for KCl", n)
	}
	if strings.Contains(text, "CH3COONa") {
		t.Errorf("KCl's warnings talk about sodium acetate")
	}
}
