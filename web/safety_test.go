//go:build browser

package web_test

// Nothing lost, nothing injected, nothing sent: the page under a full localStorage, a file
// from a newer Saltcast, hostile text in every free-text field, a whole session watched for
// network requests, and the SDS pointer beside every caution.

import (
	"context"
	"encoding/base64"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"

	"saltcast/core/recipe"
)

// junkPrefix names the keys a test fills localStorage with; they are removed afterwards, as
// every file:// page of the profile shares one localStorage.
const junkPrefix = "saltcast-test-junk."

// fillStorage fills localStorage until the browser refuses even one more character, and
// returns how many junk keys it took. It fails the test if the browser never refused.
func fillStorage(t *testing.T, ctx context.Context) int {
	t.Helper()
	t.Cleanup(func() { clearJunk(t, ctx) })
	res := mustEval[[]any](t, ctx, `(() => {
		let size = 1 << 20, i = 0, refused = "";
		while (size >= 1) {
			try { localStorage.setItem("`+junkPrefix+`" + i, "x".repeat(size)); i++; }
			catch (e) { refused = e.name; size >>= 1; }
			if (i > 10000) break;
		}
		return [i, refused];
	})()`)
	n, refused := int(res[0].(float64)), res[1].(string)
	if refused != "QuotaExceededError" {
		t.Fatalf("filling localStorage: %d keys and the browser never refused (last error %q)", n, refused)
	}
	return n
}

func clearJunk(t *testing.T, ctx context.Context) {
	t.Helper()
	eval[bool](ctx, `(() => { for (const k of Object.keys(localStorage)) if (k.startsWith("`+junkPrefix+`")) localStorage.removeItem(k); return true })()`)
}

func storedRecipes(t *testing.T, ctx context.Context) string {
	t.Helper()
	return mustEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`)
}

// withOneSaved opens the page with empty storage, saves the copper sulfate demo and returns
// what localStorage then holds.
func withOneSaved(t *testing.T, ctx context.Context, u string) string {
	t.Helper()
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	click(t, ctx, "#save-btn")
	stored := storedRecipes(t, ctx)
	if stored == "" {
		t.Fatal("nothing saved")
	}
	return stored
}

func setTransfer(t *testing.T, ctx context.Context, text string) {
	t.Helper()
	mustEval[bool](t, ctx, `document.getElementById("transfer").value=`+strconv.Quote(text)+`, true`)
}

// exportAll is what "Export all saved" puts in the box: the page's list in memory.
func exportAll(t *testing.T, ctx context.Context) string {
	t.Helper()
	click(t, ctx, "#export-all")
	return mustEval[string](t, ctx, `document.getElementById("transfer").value`)
}

// With localStorage full, saving a new recipe, saving over a saved one and importing all say
// so, and what was saved before stays as it was: in storage, in the list and in memory.
func TestFullStorageLosesNothing(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "name", "vitriol A (invented)")
	mustEval[bool](t, ctx, `document.getElementById("save-name").value="", true`)
	click(t, ctx, "#save-btn")
	click(t, ctx, `[data-demo="kno3"]`)
	setField(t, ctx, "recipe", "name", "stock B (invented)")
	click(t, ctx, "#save-btn")
	before := storedRecipes(t, ctx)
	if rs, err := recipe.DecodeCollection([]byte(before)); err != nil || len(rs) != 2 {
		t.Fatalf("the two recipes were not saved: %v, %s", err, before)
	}
	listed := texts(t, ctx, "#saved .nm")

	fillStorage(t, ctx)
	unchanged := func(what string) {
		t.Helper()
		if got := storedRecipes(t, ctx); got != before {
			t.Errorf("%s: the stored recipes changed to %s", what, got)
		}
		if got := texts(t, ctx, "#saved .nm"); strings.Join(got, "\n") != strings.Join(listed, "\n") {
			t.Errorf("%s: the list shows %q, want %q", what, got, listed)
		}
		if got := exportAll(t, ctx); got != before {
			t.Errorf("%s: the page's list in memory (export all) is %s, want %s", what, got, before)
		}
	}
	saveSays := func(what string) {
		t.Helper()
		msg := mustEval[string](t, ctx, `document.getElementById("m-save").textContent`)
		if !strings.HasPrefix(msg, "Not saved") || !strings.Contains(msg, "storage full") {
			t.Errorf("%s: the page says %q, want a clear 'Not saved … storage full'", what, msg)
		}
	}

	// A new recipe.
	setField(t, ctx, "recipe", "name", "stock C (invented)")
	setField(t, ctx, "recipe", "notes", strings.Repeat("a longer note so the list grows; ", 20))
	mustEval[bool](t, ctx, `document.getElementById("save-name").value="", true`)
	click(t, ctx, "#save-btn")
	saveSays("saving a new recipe")
	unchanged("saving a new recipe")

	// Over a saved one, with more text than before: the old one must survive intact.
	setField(t, ctx, "recipe", "name", "stock B (invented)")
	click(t, ctx, "#save-btn")
	saveSays("saving over a saved recipe")
	unchanged("saving over a saved recipe")

	// An import that would have to grow the list.
	extra := recipe.EncodeCollection([]recipe.Recipe{{Format: 1, Name: "imported D (invented)", Notes: strings.Repeat("n", 400),
		Solute: "NaCl", WaterG: recipe.Some(100), DissolveTempC: 25}})
	setTransfer(t, ctx, string(extra))
	click(t, ctx, "#import-btn")
	if msg := mustEval[string](t, ctx, `document.getElementById("m-import").textContent`); !strings.HasPrefix(msg, "Nothing was imported") {
		t.Errorf("import into a full storage says %q", msg)
	}
	unchanged("importing")

	// Room again: the same save now works, and the earlier recipes are still there.
	clearJunk(t, ctx)
	setField(t, ctx, "recipe", "name", "stock C (invented)")
	click(t, ctx, "#save-btn")
	rs, err := recipe.DecodeCollection([]byte(storedRecipes(t, ctx)))
	if err != nil || len(rs) != 3 || rs[0].Name != "vitriol A (invented)" || rs[1].Name != "stock B (invented)" {
		t.Errorf("after freeing space the saved list is %v, %v", names(rs), err)
	}
	// Reloaded, the page reads back what it stored.
	open(t, ctx, u)
	click(t, ctx, "#tab-box")
	if got := texts(t, ctx, "#saved .nm"); len(got) != 3 {
		t.Errorf("after reload the list shows %q", got)
	}
}

// A file written by a newer Saltcast (format 2) is refused by every way in — the import box,
// the import file picker and the received-file picker — with a message, and nothing changes.
func TestNewerFormatRefused(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	before := withOneSaved(t, ctx, u)
	click(t, ctx, "#tab-box")
	newer := map[string]string{
		"collection.json":           `{"format":2,"kind":"saltcast-recipes","recipes":[{"format":1,"name":"from the future (invented)","solute":"KNO3","water_g":100,"dissolve_temp_C":30}]}`,
		"recipe-in-collection.json": `{"format":1,"kind":"saltcast-recipes","recipes":[{"format":2,"name":"from the future (invented)","solute":"KNO3","water_g":100,"dissolve_temp_C":30}]}`,
		"single.json":               `{"format":2,"name":"from the future (invented)","solute":"KNO3","water_g":100,"dissolve_temp_C":30}`,
	}
	dir := t.TempDir()
	check := func(how, msg string) {
		t.Helper()
		if !strings.Contains(msg, "newer") {
			t.Errorf("%s: the page says %q, want it to say the file is from a newer Saltcast", how, msg)
		}
		if got := storedRecipes(t, ctx); got != before {
			t.Errorf("%s changed the saved recipes to %s", how, got)
		}
		if n := mustEval[int](t, ctx, `document.querySelectorAll("#saved li").length`); n != 1 {
			t.Errorf("%s: %d recipes listed, want 1", how, n)
		}
		if n := mustEval[int](t, ctx, `document.querySelectorAll("#received li").length`); n != 0 {
			t.Errorf("%s: %d received recipes listed, want 0", how, n)
		}
	}
	waitMsg := func(id, before string) string {
		t.Helper()
		msg, err := chromedp.Run(ctx, chromedp.Poll[string](`(() => { const m = document.getElementById("`+id+`").textContent;
			return m !== `+strconv.Quote(before)+` && m })()`, chromedp.WithPollingInterval(10*time.Millisecond)))
		if err != nil {
			t.Fatalf("no message in #%s: %v", id, err)
		}
		return msg
	}
	for name, text := range newer {
		setTransfer(t, ctx, text)
		click(t, ctx, "#import-btn")
		msg := mustEval[string](t, ctx, `document.getElementById("m-import").textContent`)
		if !strings.HasPrefix(msg, "Nothing was imported") {
			t.Errorf("import box, %s: %q", name, msg)
		}
		check("import box, "+name, msg)

		path := filepath.Join(dir, name)
		if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
			t.Fatal(err)
		}
		mustEval[bool](t, ctx, `document.getElementById("m-import").textContent="", true`)
		if err := chromedp.Do(ctx, chromedp.SetUploadFiles(chromedp.CSS("#import-file"), []string{path})); err != nil {
			t.Fatal(err)
		}
		check("import file, "+name, waitMsg("m-import", ""))

		mustEval[bool](t, ctx, `document.getElementById("m-received").textContent="", true`)
		if err := chromedp.Do(ctx, chromedp.SetUploadFiles(chromedp.CSS("#carry-file"), []string{path})); err != nil {
			t.Fatal(err)
		}
		msg = waitMsg("m-received", "")
		if !strings.HasPrefix(msg, "Nothing was taken") {
			t.Errorf("received file, %s: %q", name, msg)
		}
		check("received file, "+name, msg)
	}
}

// Markup typed or carried into the page. Each would run script if it became markup.
var xssPayloads = []string{
	`<img src=x onerror="window.__xss=1">`,
	`"><svg onload=window.__xss=1>`,
}

// noMarkup fails when a payload became an element or ran: it waits for a failed image load
// to fire, then looks for window.__xss and for the elements and handlers the payloads carry.
func noMarkup(t *testing.T, ctx context.Context, where string) {
	t.Helper()
	got := mustEval[[]any](t, ctx, `new Promise(r => setTimeout(() => r([typeof window.__xss,
		document.querySelectorAll('img[src="x"], svg[onload], [onerror], [onload]').length]), 60))`)
	if got[0].(string) != "undefined" || got[1].(float64) != 0 {
		t.Errorf("%s: window.__xss is %v and %v elements came from user text", where, got[0], got[1])
	}
}

// shows fails unless the text of the element at sel contains want as text.
func shows(t *testing.T, ctx context.Context, where, sel, want string) {
	t.Helper()
	got := mustEval[string](t, ctx, `(document.querySelector(`+strconv.Quote(sel)+`)||{textContent:"<missing>"}).textContent`)
	if !strings.Contains(got, want) {
		t.Errorf("%s: %s shows %q, want it to contain %q as text", where, sel, clipText(got), want)
	}
}

func clipText(s string) string {
	if len(s) > 300 {
		return s[:300] + "…"
	}
	return s
}

func inputValue(t *testing.T, ctx context.Context, name string) string {
	t.Helper()
	return mustEval[string](t, ctx, `document.querySelector('#recipe [name="`+name+`"]').value`)
}

// Every free-text field, and every way text comes in from outside (an import, a received
// copy, a share link), shows markup as text on every screen that displays it, and nothing of
// it runs.
func TestUserTextNeverMarkup(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	next := downloads(t, ctx)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	noMarkup(t, ctx, "the page as loaded")

	for i, p := range xssPayloads {
		other := xssPayloads[1-i]
		where := func(s string) string { return "payload " + strconv.Itoa(i) + ", " + s }

		// Batch name and notes: batch screen, recipe box, sheet.
		click(t, ctx, `[data-demo="cuso4"]`)
		setField(t, ctx, "recipe", "name", p)
		setField(t, ctx, "recipe", "notes", other)
		if inputValue(t, ctx, "name") != p || inputValue(t, ctx, "notes") != other {
			t.Errorf("%s: the name and notes fields do not hold the text typed", where("batch screen"))
		}
		mustEval[bool](t, ctx, `document.getElementById("save-name").value="", true`)
		click(t, ctx, "#save-btn")
		shows(t, ctx, where("recipe box"), "#saved li:last-child .nm", p)
		shows(t, ctx, where("save message"), "#m-save", p)
		click(t, ctx, "#tab-sheet")
		shows(t, ctx, where("sheet name"), "#s-name", p)
		shows(t, ctx, where("sheet notes"), "#s-notes", other)
		noMarkup(t, ctx, where("name and notes"))

		// Solute search: the text typed goes into the message and the match list as text.
		click(t, ctx, "#tab-batch")
		setField(t, ctx, "recipe", "solute", p)
		if inputValue(t, ctx, "solute") != p {
			t.Errorf("%s: the solute field lost the text typed", where("solute search"))
		}
		shows(t, ctx, where("solute search"), "#m-solute", strings.TrimSpace(p))
		noMarkup(t, ctx, where("solute search"))
		click(t, ctx, `[data-demo="cuso4"]`)

		// Custom compound name and source: chart title and legend (SVG), sources, sheet.
		mustEval[bool](t, ctx, `document.getElementById("custom-box").open = true, true`)
		setField(t, ctx, "recipe", "custom.name", p)
		setField(t, ctx, "recipe", "custom.molar_mass_g_per_mol", "101,1")
		setField(t, ctx, "recipe", "custom.points", "10; 21\n30; 45,5\n50; 85\n70; 138")
		setField(t, ctx, "recipe", "custom.source", other)
		mustEval[bool](t, ctx, `(function(){const c=document.querySelector('#recipe [name="use_custom"]'); c.checked=true; c.dispatchEvent(new Event("input",{bubbles:true})); return true})()`)
		if stale := mustEval[bool](t, ctx, `!document.getElementById("stale").hidden`); stale {
			t.Fatalf("%s: the custom compound was not planned: %s", where("custom"), mustEval[string](t, ctx, `document.getElementById("stale").textContent`))
		}
		shows(t, ctx, where("chart title"), "#chart svg", p+" (own data)")
		if n := mustEval[int](t, ctx, `[...document.querySelectorAll("#chart svg text")].filter(e => e.textContent.includes(`+strconv.Quote(p)+`)).length`); n < 2 {
			t.Errorf("%s: the chart shows the custom name in %d text elements, want title and legend", where("chart"), n)
		}
		shows(t, ctx, where("sources"), "#sources", other)
		shows(t, ctx, where("custom fit"), "#custom-fit", "R²")
		click(t, ctx, "#tab-sheet")
		shows(t, ctx, where("sheet chart"), "#s-chart svg", p+" (own data)")
		shows(t, ctx, where("sheet sources"), "#s-sources", other)
		noMarkup(t, ctx, where("custom compound"))
		click(t, ctx, "#tab-batch")
		mustEval[bool](t, ctx, `(function(){const c=document.querySelector('#recipe [name="use_custom"]'); c.checked=false; c.dispatchEvent(new Event("input",{bubbles:true})); return true})()`)

		// Imported recipe names and notes: recipe box, batch screen, sheet.
		imp := recipe.EncodeCollection([]recipe.Recipe{
			{Format: 1, Name: "imported " + p, Notes: other, Solute: "KNO3", WaterG: recipe.Some(100), DissolveTempC: 30},
		})
		click(t, ctx, "#tab-box")
		setTransfer(t, ctx, string(imp))
		click(t, ctx, "#import-btn")
		shows(t, ctx, where("import message"), "#m-import", "Imported 1")
		shows(t, ctx, where("recipe box, imported"), "#saved li:last-child .nm", "imported "+p)
		click(t, ctx, "#saved li:last-child [data-open]")
		if inputValue(t, ctx, "name") != "imported "+p || inputValue(t, ctx, "notes") != other {
			t.Errorf("%s: the opened recipe's name and notes are %q, %q", where("imported, opened"), inputValue(t, ctx, "name"), inputValue(t, ctx, "notes"))
		}
		click(t, ctx, "#tab-sheet")
		shows(t, ctx, where("sheet, imported"), "#s-name", "imported "+p)
		shows(t, ctx, where("sheet notes, imported"), "#s-notes", other)
		noMarkup(t, ctx, where("import"))

		// Save a copy with the sender's name: received list and sender line.
		click(t, ctx, "#tab-box")
		click(t, ctx, "#carry-all")
		if !mustEval[bool](t, ctx, `document.getElementById("carry-all").checked`) {
			click(t, ctx, "#carry-all")
		}
		mustEval[bool](t, ctx, `document.getElementById("carry-by").value=`+strconv.Quote(p)+`, true`)
		click(t, ctx, "#carry-save")
		copyBytes := next()
		path := filepath.Join(t.TempDir(), "copy.html")
		if err := os.WriteFile(path, copyBytes, 0o644); err != nil {
			t.Fatal(err)
		}
		mustEval[bool](t, ctx, `document.getElementById("m-received").textContent="", true`)
		if err := chromedp.Do(ctx, chromedp.SetUploadFiles(chromedp.CSS("#carry-file"), []string{path})); err != nil {
			t.Fatal(err)
		}
		if _, err := chromedp.Run(ctx, chromedp.Poll[bool](`document.getElementById("m-received").textContent !== ""`,
			chromedp.WithPollingInterval(10*time.Millisecond))); err != nil {
			t.Fatal(err)
		}
		shows(t, ctx, where("received from"), "#received-from", p)
		if got := texts(t, ctx, "#received .nm"); !containsText(got, p) || !containsText(got, "imported "+p) {
			t.Errorf("%s: received list shows %q", where("received"), got)
		}
		noMarkup(t, ctx, where("received copy"))

		// The copy opened as a page: its note, its received list.
		open(t, ctx, fileURL(t, path))
		click(t, ctx, "#carry-note-go")
		shows(t, ctx, where("opened copy"), "#received-from", p)
		noMarkup(t, ctx, where("opened copy"))

		// A share link carrying the payload, and links that are markup themselves.
		frag := "#recipe=" + base64.RawURLEncoding.EncodeToString(
			(recipe.Recipe{Format: 1, Name: p, Notes: other, Solute: "NaCl", WaterG: recipe.Some(50), DissolveTempC: 20}).Encode())
		for _, link := range []string{u + frag, u + "#recipe=" + p, u + "#" + p, u + "#recipe=" + url64(p)} {
			openLink(t, ctx, link)
			noMarkup(t, ctx, where("share link "+link[len(u):]))
		}
		openLink(t, ctx, u+frag)
		if inputValue(t, ctx, "name") != p {
			t.Errorf("%s: the name field holds %q", where("share link"), inputValue(t, ctx, "name"))
		}
		click(t, ctx, "#tab-sheet")
		shows(t, ctx, where("share link, sheet"), "#s-name", p)
		shows(t, ctx, where("share link, sheet notes"), "#s-notes", other)
		noMarkup(t, ctx, where("share link"))
		open(t, ctx, u)
	}
}

// openLink opens link as a fresh load (not a fragment change of the page open now) and
// waits for the first result (waitReady retries while the new document's script context
// is not there yet).
func openLink(t *testing.T, ctx context.Context, link string) {
	t.Helper()
	if err := chromedp.Do(ctx, chromedp.Navigate("about:blank"), chromedp.Navigate(link)); err != nil {
		t.Fatalf("open %s: %v", link, err)
	}
	waitReady(t, ctx)
}

// url64 is text in base64url, as a hand-made link would carry something that is not JSON.
func url64(s string) string { return base64.RawURLEncoding.EncodeToString([]byte(s)) }

func containsText(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

// A whole working session makes no network request: the only documents loaded are the page
// itself and the copy it saved, both from disk. (Downloads are blob: URLs made in the page;
// chromium reports no request for them, and any it did report would fail this test.)
func TestSessionSendsNothing(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	next := downloads(t, ctx)
	rc := countRequests(t, ctx)
	open(t, ctx, u)
	resetStorage(t, ctx, u)

	// Both demos, edits, every unit.
	click(t, ctx, `[data-demo="kno3"]`)
	click(t, ctx, `[data-demo="cuso4"]`)
	setField(t, ctx, "recipe", "water_g", "1200")
	setField(t, ctx, "recipe", "dissolve_temp_C", "65")
	setField(t, ctx, "recipe", "cool_to_C", "15")
	setField(t, ctx, "recipe", "seed_at_C", "40")
	setField(t, ctx, "recipe", "name", "session (invented)")
	setField(t, ctx, "recipe", "notes", "a note (invented)")
	for _, sel := range [][2]string{{"unit_temp", "F"}, {"unit_mass", "kg"}, {"unit_volume", "gal"}, {"unit_temp", "K"},
		{"unit_mass", "lb"}, {"unit_volume", "L"}, {"unit_temp", "C"}, {"unit_mass", "g"}, {"unit_volume", "mL"}} {
		mustEval[bool](t, ctx, `(function(){const s=document.querySelector('#units [name="`+sel[0]+`"]'); s.value="`+sel[1]+`"; s.dispatchEvent(new Event("change",{bubbles:true})); return true})()`)
	}

	// The gas screen, hot water included.
	click(t, ctx, "#tab-gas")
	setField(t, ctx, "gas", "temp_C", "25")
	setField(t, ctx, "gas", "measured_mg_per_L", "7")
	setField(t, ctx, "gas", "from_C", "20")
	setField(t, ctx, "gas", "to_C", "90")

	// Save, export, download, import (text and file), CSV.
	click(t, ctx, "#tab-box")
	click(t, ctx, "#save-btn")
	click(t, ctx, "#export-one")
	click(t, ctx, "#export-all")
	exported := mustEval[string](t, ctx, `document.getElementById("transfer").value`)
	click(t, ctx, "#download-json")
	if got := string(next()); got != exported {
		t.Errorf("the downloaded export differs from the box: %q", clipText(got))
	}
	click(t, ctx, "#import-btn")
	path := filepath.Join(t.TempDir(), "export.json")
	if err := os.WriteFile(path, []byte(exported), 0o644); err != nil {
		t.Fatal(err)
	}
	mustEval[bool](t, ctx, `document.getElementById("m-import").textContent="", true`)
	if err := chromedp.Do(ctx, chromedp.SetUploadFiles(chromedp.CSS("#import-file"), []string{path})); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.Run(ctx, chromedp.Poll[bool](`document.getElementById("m-import").textContent.startsWith("Imported")`,
		chromedp.WithPollingInterval(10*time.Millisecond))); err != nil {
		t.Errorf("the import file was not read: %v", err)
	}
	click(t, ctx, "#csv-btn")
	next()

	// Print.
	click(t, ctx, "#tab-sheet")
	if err := emulatePrint(ctx); err != nil {
		t.Fatal(err)
	}
	mustEval[string](t, ctx, `document.getElementById("screen-sheet").innerText`)
	if err := chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, _ *chromedp.Target) error {
		_, err := chromedp.Call(ctx, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: ""})
		return err
	})); err != nil {
		t.Fatal(err)
	}

	// Save a copy, read it back as a received file, open it as a page, take its recipes in.
	click(t, ctx, "#tab-box")
	click(t, ctx, "#carry-all")
	mustEval[bool](t, ctx, `document.getElementById("carry-by").value="bench 2 (invented)", true`)
	click(t, ctx, "#carry-save")
	copyPath := filepath.Join(t.TempDir(), "copy.html")
	if err := os.WriteFile(copyPath, next(), 0o644); err != nil {
		t.Fatal(err)
	}
	mustEval[bool](t, ctx, `document.getElementById("m-received").textContent="", true`)
	if err := chromedp.Do(ctx, chromedp.SetUploadFiles(chromedp.CSS("#carry-file"), []string{copyPath})); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.Run(ctx, chromedp.Poll[bool](`document.getElementById("m-received").textContent !== ""`,
		chromedp.WithPollingInterval(10*time.Millisecond))); err != nil {
		t.Fatal(err)
	}
	copyURL := fileURL(t, copyPath)
	open(t, ctx, copyURL)
	click(t, ctx, "#carry-note-go")
	click(t, ctx, "#take-all")

	// The share link, opened as a fresh load.
	open(t, ctx, u)
	click(t, ctx, "#tab-box")
	click(t, ctx, "#share-btn")
	link := mustEval[string](t, ctx, `document.getElementById("share-link").value`)
	openLink(t, ctx, u+link) // from a file the link is its fragment alone

	var sent []string
	pages := 0
	for _, r := range rc.list() {
		switch {
		case r == u || r == copyURL:
			pages++
		default:
			sent = append(sent, r)
		}
	}
	if pages < 3 {
		t.Fatalf("the request counter saw the page loaded %d times, so it cannot be trusted to see others", pages)
	}
	if len(sent) > 0 {
		t.Errorf("the session made %d network requests: %s", len(sent), strings.Join(sent, ", "))
	}
	t.Logf("%d requests seen, all of them the page or its copy loading from disk", len(rc.list()))
}

// cautionLists returns, for every caution list on the page that holds a caution, its id and
// its text.
func cautionLists(t *testing.T, ctx context.Context) [][]string {
	t.Helper()
	raw := mustEval[[]any](t, ctx, `[...document.querySelectorAll("ul.cautions")].filter(u => u.querySelector("li")).map(u => [u.id, u.textContent])`)
	out := make([][]string, 0, len(raw))
	for _, r := range raw {
		pair := r.([]any)
		out = append(out, []string{pair[0].(string), pair[1].(string)})
	}
	return out
}

// wantSDS fails unless each of the named caution lists holds a caution and points to the
// SDS, and unless every other caution list that holds one does too.
func wantSDS(t *testing.T, ctx context.Context, what string, ids ...string) {
	t.Helper()
	seen := map[string]bool{}
	for _, l := range cautionLists(t, ctx) {
		seen[l[0]] = true
		if !strings.Contains(l[1], "SDS") {
			t.Errorf("%s: #%s shows cautions without pointing to the SDS: %q", what, l[0], clipText(l[1]))
		}
		if !strings.Contains(l[1], "local rules") {
			t.Errorf("%s: #%s shows cautions without pointing to local rules: %q", what, l[0], clipText(l[1]))
		}
	}
	for _, id := range ids {
		if !seen[id] {
			t.Errorf("%s: #%s shows no caution", what, id)
		}
	}
}

// Wherever a hazard or a strong heat effect is shown — the batch screen, the batch sheet on
// screen and in print, the gas screen for hot water — the SDS and local rules are named,
// for the copper sulfate demo, the potassium nitrate (oxidizer) demo, and a hot, saturated
// potassium nitrate batch.
func TestCautionsPointToSDS(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	for _, c := range []struct {
		what, demo string
		edit       [][2]string
		hazard     string // a word of the compound's hazard note that must be among the cautions
	}{
		{"copper sulfate demo", "cuso4", nil, "SDS"},
		{"potassium nitrate demo", "kno3", nil, "Oxidizer"},
		{"hot saturated potassium nitrate", "kno3", [][2]string{{"dissolve_temp_C", "90"}, {"cool_to_C", "10"}}, "Oxidizer"},
	} {
		click(t, ctx, "#tab-batch")
		click(t, ctx, `[data-demo="`+c.demo+`"]`)
		for _, e := range c.edit {
			setField(t, ctx, "recipe", e[0], e[1])
		}
		if stale := mustEval[bool](t, ctx, `!document.getElementById("stale").hidden`); stale {
			t.Fatalf("%s: not planned: %s", c.what, mustEval[string](t, ctx, `document.getElementById("stale").textContent`))
		}
		shows(t, ctx, c.what, "#cautions", c.hazard)
		wantSDS(t, ctx, c.what+", batch screen", "cautions")
		click(t, ctx, "#tab-sheet")
		wantSDS(t, ctx, c.what+", sheet", "s-cautions")
		if err := emulatePrint(ctx); err != nil {
			t.Fatal(err)
		}
		printed := mustEval[string](t, ctx, `document.getElementById("s-cautions").innerText`)
		if !strings.Contains(printed, "SDS") || !strings.Contains(printed, c.hazard) {
			t.Errorf("%s: the printed cautions lack the SDS or the hazard: %q", c.what, clipText(printed))
		}
		if err := chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, _ *chromedp.Target) error {
			_, err := chromedp.Call(ctx, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: ""})
			return err
		})); err != nil {
			t.Fatal(err)
		}
	}

	// The gas screen: the day's water, and water heated to near boiling.
	click(t, ctx, "#tab-gas")
	for _, e := range [][2]string{{"temp_C", "38"}, {"from_C", "20"}, {"to_C", "95"}} {
		setField(t, ctx, "gas", e[0], e[1])
	}
	if stale := mustEval[bool](t, ctx, `!document.getElementById("gas-stale").hidden`); stale {
		t.Fatalf("gas screen not computed: %s", mustEval[string](t, ctx, `document.getElementById("gas-stale").textContent`))
	}
	shows(t, ctx, "gas screen, hot water", "#gas-cautions", "scalds")
	wantSDS(t, ctx, "gas screen, hot water", "gas-cautions")
}
