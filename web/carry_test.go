//go:build browser

package web_test

import (
	"bytes"
	"context"
	"net/url"
	"os"
	"path/filepath"
	"saltcast/web/carry"
	"strconv"
	"strings"
	"testing"
	"time"

	cdpbrowser "github.com/chromedp/cdproto/browser"
	"github.com/chromedp/chromedp"

	"saltcast/core/recipe"
)

// Recipes that travel inside a copy of the page, in a real browser over file://.

// carriedName is the second recipe's name: markup that must stay text all the way round.
const carriedName = `<img src=x onerror=alert(1)> & </script><b>blue</b>`

// saveRecipes saves the two invented demo recipes in the open page's recipe box, the second
// under carriedName, and returns the saved list as the page stored it.
func saveRecipes(t *testing.T, ctx context.Context) []recipe.Recipe {
	t.Helper()
	for _, demo := range []struct{ key, name string }{{"kno3", ""}, {"cuso4", carriedName}} {
		click(t, ctx, `[data-demo="`+demo.key+`"]`)
		if demo.name != "" {
			setField(t, ctx, "recipe", "name", demo.name)
		}
		mustEval[bool](t, ctx, `document.getElementById("save-name").value="", true`)
		click(t, ctx, "#save-btn")
	}
	return shelf(t, ctx)
}

// shelf is the user's own list as the page keeps it in localStorage.
func shelf(t *testing.T, ctx context.Context) []recipe.Recipe {
	t.Helper()
	s := mustEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`)
	if s == "" {
		return nil
	}
	rs, err := recipe.DecodeCollection([]byte(s))
	if err != nil {
		t.Fatalf("the page's saved recipes %q: %v", s, err)
	}
	return rs
}

// downloads makes the browser save downloads into a new directory and returns a function
// that waits for the next one and gives its bytes.
func downloads(t *testing.T, ctx context.Context) func() []byte {
	t.Helper()
	dir := t.TempDir()
	done := make(chan string, 4)
	chromedp.ListenBrowser(ctx, func(ev any) {
		if e, ok := ev.(*cdpbrowser.EventDownloadProgress); ok && e.State == cdpbrowser.DownloadProgressStateCompleted {
			done <- e.GUID
		}
	})
	events := true
	if _, err := chromedp.CallBrowser(ctx, cdpbrowser.SetDownloadBehavior, cdpbrowser.SetDownloadBehaviorParams{
		Behavior: cdpbrowser.SetDownloadBehaviorBehaviorAllowAndName, DownloadPath: dir, EventsEnabled: &events,
	}); err != nil {
		t.Fatal(err)
	}
	return func() []byte {
		t.Helper()
		select {
		case guid := <-done:
			b, err := os.ReadFile(filepath.Join(dir, guid))
			if err != nil {
				t.Fatal(err)
			}
			return b
		case <-time.After(30 * time.Second):
			t.Fatal("no download within 30 s")
		}
		return nil
	}
}

// freshTab opens a tab in a browser of its own with a new, empty profile: a colleague's
// machine.
func freshTab(t *testing.T) context.Context {
	t.Helper()
	exe := chromiumPath()
	if exe == "" {
		need(t, "chromium is not installed")
	}
	opts := append(chromedp.DefaultExecAllocatorOptions[:],
		chromedp.ExecPath(exe),
		chromedp.UserDataDir(t.TempDir()),
		chromedp.DisableGPU,
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("no-first-run", true),
		chromedp.WindowSize(1280, 800),
	)
	if os.Geteuid() == 0 {
		opts = append(opts, chromedp.NoSandbox)
	}
	alloc, cancelAlloc := chromedp.NewExecAllocator(context.Background(), opts...)
	b, cancelBrowser := chromedp.NewContext(alloc)
	if err := chromedp.Do(b); err != nil {
		cancelBrowser()
		cancelAlloc()
		t.Fatal("starting a second chromium: " + err.Error())
	}
	ctx, cancel := context.WithTimeout(b, pageTimeout)
	t.Cleanup(func() { cancel(); cancelBrowser(); cancelAlloc() })
	return ctx
}

func fileURL(t *testing.T, path string) string {
	abs, err := filepath.Abs(path)
	if err != nil {
		t.Fatal(err)
	}
	return (&url.URL{Scheme: "file", Path: abs}).String()
}

func texts(t *testing.T, ctx context.Context, sel string) []string {
	t.Helper()
	return mustEval[[]string](t, ctx, `[...document.querySelectorAll(`+strconv.Quote(sel)+`)].map(e => e.textContent)`)
}

func sameList(t *testing.T, what string, got, want []recipe.Recipe) {
	t.Helper()
	if g, w := recipe.EncodeCollection(got), recipe.EncodeCollection(want); !bytes.Equal(g, w) {
		t.Errorf("%s:\n got %s\nwant %s", what, g, w)
	}
}

// Save a copy with two recipes, open it in a fresh profile, see both as received, take them
// in, reload: still there. The copy is the page's own bytes plus the block, and the name
// with markup stays text all the way.
func TestCarrySaveCopyRoundTrip(t *testing.T) {
	u := appURL(t)
	page, err := os.ReadFile(filepath.Join("..", "dist", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	ctx := tab(t)
	next := downloads(t, ctx)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	mine := saveRecipes(t, ctx)
	if len(mine) != 2 || mine[1].Name != carriedName {
		t.Fatalf("saved %d recipes: %v", len(mine), mine)
	}

	click(t, ctx, "#tab-box")
	if got := texts(t, ctx, "#carry-pick label span"); len(got) != 2 || got[1] != carriedName {
		t.Fatalf("the list to send shows %q", got)
	}
	click(t, ctx, "#carry-all")
	mustEval[bool](t, ctx, `document.getElementById("carry-by").value="Ana (bench 3)", true`)
	click(t, ctx, "#carry-save")
	saved := next()
	if msg := mustEval[string](t, ctx, `document.getElementById("m-carry").textContent`); !strings.Contains(msg, "2 recipes") {
		t.Errorf("after saving a copy the page says %q", msg)
	}

	// The copy: the recipes sealed in the block, and otherwise the page byte for byte.
	c, err := carry.ExtractCarried(saved)
	if err != nil {
		t.Fatalf("the saved copy: %v", err)
	}
	sameList(t, "recipes in the copy", c.Recipes, mine)
	if c.SentBy != "Ana (bench 3)" || !c.Sealed || c.SavedAt == "" || !strings.Contains(string(page), `content="`+c.AppVersion+`"`) {
		t.Errorf("the copy's sender, time, seal and version: %+v", c)
	}
	if want, _ := carry.WithCarried(page, c); !bytes.Equal(saved, want) {
		t.Errorf("the saved copy (%d B) is not the page (%d B) with the recipes block; the page did not copy its own bytes",
			len(saved), len(page))
	}

	// A colleague opens it: both recipes are received, apart from their (empty) list.
	path := filepath.Join(t.TempDir(), "saltcast-with-recipes.html")
	if err := os.WriteFile(path, saved, 0o644); err != nil {
		t.Fatal(err)
	}
	other := freshTab(t)
	open(t, other, fileURL(t, path))
	if hidden := mustEval[bool](t, other, `document.getElementById("carry-note").hidden`); hidden {
		t.Error("the copy does not say it carries recipes")
	}
	click(t, other, "#carry-note-go")
	if got := texts(t, other, "#received .nm"); len(got) != 2 || got[0] != mine[0].Name || got[1] != carriedName {
		t.Fatalf("received list = %q", got)
	}
	if from := mustEval[string](t, other, `document.getElementById("received-from").textContent`); !strings.Contains(from, "Ana (bench 3)") {
		t.Errorf("received-from = %q, want the sender", from)
	}
	if n := len(shelf(t, other)); n != 0 {
		t.Errorf("opening the copy put %d recipes in the colleague's own list", n)
	}
	if n := mustEval[int](t, other, `document.querySelectorAll("img, #received b").length`); n != 0 {
		t.Errorf("the received name became markup (%d elements)", n)
	}

	click(t, other, "#take-all")
	sameList(t, "the colleague's list after taking all", shelf(t, other), mine)
	open(t, other, fileURL(t, path)) // reload
	click(t, other, "#tab-box")
	if got := texts(t, other, "#saved .nm"); len(got) != 2 || got[1] != carriedName {
		t.Errorf("after reload the colleague's list shows %q", got)
	}
	if got := texts(t, other, "#received .tag"); len(got) != 2 {
		t.Errorf("after reload the received recipes are not marked as in the list: %q", got)
	}
	if !mustEval[bool](t, other, `document.getElementById("take-all").hidden && document.getElementById("carry-note").hidden`) {
		t.Error("with every received recipe in the list, the page still offers to take them in")
	}
	// Taking them again (a second tap before the page updates) adds nothing.
	click(t, other, "#take-all")
	sameList(t, "the list after taking the same recipes again", shelf(t, other), mine)
	if n := mustEval[int](t, other, `document.querySelectorAll("img, #saved b, #received b").length`); n != 0 {
		t.Errorf("a name became markup after the round trip (%d elements)", n)
	}
}

// A received file with a corrupted block changes nothing and says why; a good one is listed
// as received, and a name clash is kept side by side, marked.
func TestCarryOpenFile(t *testing.T) {
	u := appURL(t)
	page, err := os.ReadFile(filepath.Join("..", "dist", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	ctx := tab(t)
	open(t, ctx, u)
	resetStorage(t, ctx, u)
	mine := saveRecipes(t, ctx)
	click(t, ctx, "#tab-box")

	// A colleague's batch of the same name as one of mine, but different.
	theirs := mine[0]
	theirs.WaterML = recipe.Some(15000)
	good, err := carry.WithCarried(page, carry.Carried{AppVersion: "v-test", SavedAt: "2026-12-01T09:30:00Z",
		SentBy: "Bo", Recipes: []recipe.Recipe{theirs}})
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	write := func(name string, b []byte) string {
		p := filepath.Join(dir, name)
		if err := os.WriteFile(p, b, 0o644); err != nil {
			t.Fatal(err)
		}
		return p
	}
	pick := func(path string) string {
		t.Helper()
		before := mustEval[string](t, ctx, `document.getElementById("m-received").textContent`)
		if err := chromedp.Do(ctx, chromedp.SetUploadFiles(chromedp.CSS("#carry-file"), []string{path})); err != nil {
			t.Fatal(err)
		}
		msg, err := chromedp.Run(ctx, chromedp.Poll[string](`(() => { const m = document.getElementById("m-received").textContent;
			return m !== `+strconv.Quote(before)+` && m })()`, chromedp.WithPollingInterval(10*time.Millisecond)))
		if err != nil {
			t.Fatal(err)
		}
		return msg
	}

	stored := mustEval[string](t, ctx, `localStorage.getItem("saltcast.recipes")`)
	i := bytes.Index(good, []byte(`"water_mL":15000`))
	corrupt := bytes.Clone(good)
	corrupt[i+len(`"water_mL":1`)] = '6' // 16000: the checksum no longer matches
	for name, bad := range map[string][]byte{
		"corrupt.html":  corrupt,
		"cut.html":      good[:i],
		"page.html":     page, // no recipes at all
		"nonsense.json": []byte(`{"format":1,"kind":"saltcast-recipes","recipes":[{"name":"x","water_g":-1}]}`),
	} {
		msg := pick(write(name, bad))
		if !strings.HasPrefix(msg, "Nothing was taken from “"+name+"”") {
			t.Errorf("%s: the page says %q", name, msg)
		}
		if got := mustEval[string](t, ctx, `localStorage.getItem("saltcast.recipes")`); got != stored {
			t.Errorf("%s changed the saved recipes", name)
		}
		if n := mustEval[int](t, ctx, `document.querySelectorAll("#received li").length`); n != 0 {
			t.Errorf("%s: %d received recipes listed", name, n)
		}
	}
	if msg := pick(write("corrupt2.html", corrupt)); !strings.Contains(msg, "changed or cut short") {
		t.Errorf("a corrupted block is refused with %q; want it to say the block was changed", msg)
	}

	// The good file: listed as received, taken in beside mine, marked.
	if msg := pick(write("from-bo.html", good)); !strings.Contains(msg, "1 recipe") {
		t.Errorf("the good file: %q", msg)
	}
	if got := texts(t, ctx, "#received .nm"); len(got) != 1 || got[0] != theirs.Name {
		t.Fatalf("received = %q", got)
	}
	click(t, ctx, `#received [data-take]`)
	after := shelf(t, ctx)
	if len(after) != 3 || after[2].Name != theirs.Name+" (received "+localDate(t, ctx)+")" || after[2].WaterML != theirs.WaterML {
		t.Errorf("after taking in a clashing name the list is %q", names(after))
	}
	sameList(t, "my own recipes after taking in", after[:2], mine)
	if msg := mustEval[string](t, ctx, `document.getElementById("m-received").textContent`); !strings.Contains(msg, "(received ") {
		t.Errorf("the page does not say the clash was kept under a marked name: %q", msg)
	}

	// Dropped on the drop zone, a file is read the same way; dropped anywhere else it is
	// held back, so the browser does not open it in place of the app.
	drop := `(where) => { const dt = new DataTransfer();
		dt.items.add(new File([` + strconv.Quote(string(good)) + `], "dropped.html", {type: "text/html"}));
		const ev = new DragEvent("drop", {dataTransfer: dt, bubbles: true, cancelable: true});
		document.querySelector(where).dispatchEvent(ev); return ev.defaultPrevented }`
	if !mustEval[bool](t, ctx, `(`+drop+`)("#tab-batch")`) {
		t.Error("a file dropped outside the drop zone is not held back")
	}
	mustEval[bool](t, ctx, `(`+drop+`)("#carry-drop")`)
	if _, err := chromedp.Run(ctx, chromedp.Poll[bool](`document.getElementById("m-received").textContent.includes("dropped.html")`,
		chromedp.WithPollingInterval(10*time.Millisecond))); err != nil {
		t.Errorf("a file dropped on the drop zone was not read: %v", err)
	}

	// A JSON export is read the same way, with no seal.
	pick(write("export.json", recipe.EncodeCollection(mine)))
	if from := mustEval[string](t, ctx, `document.getElementById("received-from").textContent`); !strings.Contains(from, "recipe export") {
		t.Errorf("received-from for a JSON export = %q", from)
	}
	if got := texts(t, ctx, "#received .tag"); len(got) != 2 {
		t.Errorf("my own recipes in an export are not marked as in the list: %q", got)
	}
}

func localDate(t *testing.T, ctx context.Context) string {
	return mustEval[string](t, ctx, `(() => { const d = new Date(); const p = n => String(n).padStart(2, "0");
		return d.getFullYear() + "-" + p(d.getMonth() + 1) + "-" + p(d.getDate()); })()`)
}

func names(rs []recipe.Recipe) []string {
	var out []string
	for _, r := range rs {
		out = append(out, r.Name)
	}
	return out
}
