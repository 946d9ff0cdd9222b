//go:build browser

package web_test

import (
	"context"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/chromedp"
)

// Where scripts do not run (a mail or file preview), the file says what it is and how to
// open it in a browser, on a phone or tablet and on a computer, at the top; the calculator
// (inputs and "—" results) is not shown. Loaded normally, the note is gone. With
// SALTCAST_SHOTS set, the no-script view is saved at 768×1024 and 390×844.
func TestNoScriptNote(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	if err := chromedp.Do(ctx, scriptsDisabled(true), chromedp.EmulateViewport(768, 1024), chromedp.Navigate(u)); err != nil {
		t.Fatal(err)
	}
	time.Sleep(500 * time.Millisecond) // nothing runs; the layout settles
	// The test's own evaluation runs apart from the page's disabled scripts.
	v := mustEval[map[string]any](t, ctx, `(function(){
		const shown = el => !!el && el.getClientRects().length > 0 && getComputedStyle(el).visibility !== "hidden";
		const note = document.getElementById("no-app");
		return {
			ran: document.documentElement.hasAttribute("data-run"),
			note: shown(note), top: note ? note.getBoundingClientRect().top : -1,
			text: note ? note.textContent.replace(/\s+/g, " ") : "",
			main: shown(document.querySelector("main")),
			dashes: [...document.querySelectorAll("output, [data-strip]")].filter(shown).length,
			inputs: [...document.querySelectorAll("input, select, textarea")].filter(shown).length };
	})()`)
	if v["ran"] != false {
		t.Fatal("the page's scripts ran; this check needs them off")
	}
	if v["note"] != true || v["top"].(float64) < 0 || v["top"].(float64) > 1024/3 {
		t.Errorf("without scripts the note is not shown near the top: %v", v)
	}
	text, _ := v["text"].(string)
	for _, words := range []string{"browser", "phone or tablet", "Open in", "Share", "computer", "Double-click", "drag"} {
		if !strings.Contains(text, words) {
			t.Errorf("the note does not say %q: %s", words, text)
		}
	}
	if v["main"] != false || v["dashes"].(float64) > 0 || v["inputs"].(float64) > 0 {
		t.Errorf("without scripts the calculator shows: %v", v)
	}
	if dir := os.Getenv("SALTCAST_SHOTS"); dir != "" {
		for _, w := range [][2]int64{{768, 1024}, {390, 844}} {
			if err := chromedp.Do(ctx, chromedp.EmulateViewport(w[0], w[1])); err != nil {
				t.Fatal(err)
			}
			time.Sleep(200 * time.Millisecond)
			png, err := chromedp.Run(ctx, chromedp.CaptureScreenshot())
			if err != nil {
				t.Fatal(err)
			}
			if err := os.WriteFile(filepath.Join(dir, "noscript-chromium-"+strconv.FormatInt(w[0], 10)+".png"), png, 0o644); err != nil {
				t.Fatal(err)
			}
		}
	}

	// Scripts on: the app, and no note.
	if err := chromedp.Do(ctx, scriptsDisabled(false), chromedp.EmulateViewport(1280, 800)); err != nil {
		t.Fatal(err)
	}
	open(t, ctx, u)
	if mustEval[bool](t, ctx, `getComputedStyle(document.getElementById("no-app")).display !== "none"`) {
		t.Error("the running app still shows the note on opening the file")
	}
	if !mustEval[bool](t, ctx, `document.querySelector("main").getClientRects().length > 0`) {
		t.Error("the running app is hidden")
	}
}

// scriptsDisabled turns the page's scripts off or on (CDP Emulation.setScriptExecutionDisabled).
func scriptsDisabled(off bool) chromedp.Action[chromedp.Void] {
	return chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := chromedp.Call(ctx, emulation.SetScriptExecutionDisabled, emulation.SetScriptExecutionDisabledParams{Value: off})
		return err
	})
}

// A browser that runs scripts but cannot start the app (here: a damaged module) shows why
// and the note on opening the file in a current browser again, not a calculator of dashes.
func TestStartFailureShowsNote(t *testing.T) {
	page, err := os.ReadFile(filepath.Join("..", "dist", "saltcast.html"))
	if err != nil {
		need(t, "dist/saltcast.html is not built")
	}
	const open0 = `<script id="saltcast-wasm" type="application/octet-stream">`
	s := string(page)
	i := strings.Index(s, open0)
	if i < 0 {
		t.Fatal("the page has no module block")
	}
	i += len(open0)
	j := strings.Index(s[i:], "</script>")
	damaged := s[:i] + s[i:i+64] + s[i+j:] // the module cut short
	path := filepath.Join(t.TempDir(), "damaged.html")
	if err := os.WriteFile(path, []byte(damaged), 0o644); err != nil {
		t.Fatal(err)
	}
	ctx := tab(t)
	if err := chromedp.Do(ctx, chromedp.Navigate(fileURL(t, path))); err != nil {
		t.Fatal(err)
	}
	state, err := chromedp.Run(ctx, chromedp.Poll[string](`document.documentElement.getAttribute("data-ready")`))
	if err != nil || state != "error" {
		t.Fatalf("a damaged module: data-ready %q, %v; want error", state, err)
	}
	if msg := mustEval[string](t, ctx, `document.getElementById("load-error").textContent`); !strings.Contains(msg, "Safari 16") {
		t.Errorf("the load error does not name the browsers needed: %q", msg)
	}
	if !mustEval[bool](t, ctx, `getComputedStyle(document.getElementById("no-app")).display !== "none" && document.querySelector("main").getClientRects().length === 0`) {
		t.Error("after a failed start the note is hidden or the calculator shows")
	}
}
