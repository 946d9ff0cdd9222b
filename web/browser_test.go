//go:build browser

package web_test

// Browser tests: headless Debian chromium, driven by chromedp, opens dist/saltcast.html over
// file:// exactly as a user would. They are built only with the browser tag (`make test` sets
// it), so a plain `go test ./...` runs the host tests alone; with the tag, a missing chromium
// or page is a failure, never a skip.

import (
	"context"
	"errors"
	"net/url"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"sync"
	"testing"
	"time"

	"github.com/chromedp/cdproto/emulation"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/chromedp"
)

// pageTimeout bounds one test's conversation with its tab (load, compute, clicks).
const pageTimeout = 60 * time.Second

var (
	browserOnce sync.Once
	browserCtx  context.Context
	browserErr  error
	profileDir  string
)

func TestMain(m *testing.M) {
	code := m.Run()
	if browserCtx != nil {
		chromedp.Cancel(browserCtx)
	}
	if profileDir != "" {
		os.RemoveAll(profileDir)
	}
	os.Exit(code)
}

// need fails a browser test that cannot run: the browser tag asks for these tests, so a
// missing tool or page is a failure.
func need(t testing.TB, why string) {
	t.Helper()
	t.Fatal(why + " (run `make build` and `bash web/scripts/deps-chromium.sh`, or `make test`)")
}

func chromiumPath() string {
	for _, p := range []string{"chromium", "chromium-browser"} {
		if path, err := exec.LookPath(p); err == nil {
			return path
		}
	}
	return ""
}

// appURL returns the file:// URL of the built page, or fails when it is missing.
func appURL(t testing.TB) string {
	t.Helper()
	path, err := filepath.Abs(filepath.Join("..", "dist", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	if _, err := os.Stat(path); err != nil {
		need(t, "dist/saltcast.html is not built")
	}
	return (&url.URL{Scheme: "file", Path: path}).String()
}

// browser returns the shared browser context; the first run owns the browser process, so
// it carries no timeout. Each test opens its own tab from it.
func browser(t testing.TB) context.Context {
	t.Helper()
	exe := chromiumPath()
	if exe == "" {
		need(t, "chromium is not installed")
	}
	browserOnce.Do(func() {
		profileDir, browserErr = os.MkdirTemp("", "saltcast-chromium-")
		if browserErr != nil {
			return
		}
		opts := append(chromedp.DefaultExecAllocatorOptions[:],
			chromedp.ExecPath(exe),
			chromedp.UserDataDir(profileDir),
			chromedp.DisableGPU,
			chromedp.Flag("disable-background-networking", true),
			chromedp.Flag("disable-component-update", true),
			chromedp.Flag("disable-sync", true),
			chromedp.Flag("no-first-run", true),
			chromedp.Flag("no-default-browser-check", true),
			chromedp.WindowSize(1280, 800),
		)
		if os.Geteuid() == 0 {
			opts = append(opts, chromedp.NoSandbox)
		}
		alloc, _ := chromedp.NewExecAllocator(context.Background(), opts...)
		browserCtx, _ = chromedp.NewContext(alloc)
		browserErr = chromedp.Do(browserCtx)
	})
	if browserErr != nil {
		t.Fatal("starting chromium: " + browserErr.Error())
	}
	return browserCtx
}

// tab opens a new tab at 1280×800 and returns its context, with a timeout, and a cleanup.
func tab(t testing.TB) context.Context {
	t.Helper()
	b := browser(t)
	ctx, cancel := chromedp.NewContext(b)
	if err := chromedp.Do(ctx); err != nil {
		cancel()
		t.Fatal(err)
	}
	tctx, tcancel := context.WithTimeout(ctx, pageTimeout)
	t.Cleanup(func() { tcancel(); cancel() })
	return tctx
}

// open navigates to u and waits until the Go program has shown its first result.
func open(t testing.TB, ctx context.Context, u string) {
	t.Helper()
	if err := chromedp.Do(ctx, chromedp.Navigate(u)); err != nil {
		t.Fatal("navigate: " + err.Error())
	}
	waitReady(t, ctx)
}

// settledJS is the page's start state once it is settled: "1" when the first result is on
// screen and the work put off until after it is done (data-settled), "error" when the app
// could not start, null before.
const settledJS = `(function(){const d=document.documentElement, s=d.getAttribute("data-ready"); return s === "1" && !d.hasAttribute("data-settled") ? null : s})()`

// waitReady waits for the page's data-ready mark and, on success, its data-settled mark. A poll that starts while a navigation is
// still replacing the document can lose its execution context ("Cannot find context with
// specified id"); that is retried a few times rather than failed.
func waitReady(t testing.TB, ctx context.Context) {
	t.Helper()
	var state string
	var err error
	for try := 0; try < 4; try++ {
		state, err = chromedp.Run(ctx, chromedp.Poll[string](settledJS,
			chromedp.WithPollingInterval(5*time.Millisecond)))
		if err == nil || ctx.Err() != nil {
			break
		}
		time.Sleep(200 * time.Millisecond)
	}
	if err != nil {
		t.Fatal("waiting for the first result: " + err.Error())
	}
	if state != "1" {
		msg, _ := eval[string](ctx, `document.getElementById("load-error").textContent`)
		t.Fatal("the page did not start: " + state + " " + msg)
	}
}

// typeInputJS defines typeInput(i), which changes one input of the batch form as a technician
// does: the water when i is even (the results change; the chart, drawn per 100 g of water, does
// not) and the cooling end when i is odd (the results and the chart change).
const typeInputJS = `const typeInput = (function () {
	const water = document.querySelector('#recipe [name="water_g"]');
	const cool = document.querySelector('#recipe [name="cool_to_C"]');
	return function (i) {
		const el = i % 2 == 0 ? water : cool;
		el.value = String(i % 2 == 0 ? 900 + (i % 7) * 25 : 10 + (i % 9));
		el.dispatchEvent(new Event("input", {bubbles: true}));
	};
})();`

// idle waits for the browser's next idle period after what the page has asked to run in idle
// time (idle callbacks run in the order asked for): the app brings the hidden batch sheet up
// to date then.
func idle(t testing.TB, ctx context.Context) {
	t.Helper()
	mustEval[bool](t, ctx, `new Promise(done => (window.requestIdleCallback || (f => setTimeout(f, 60)))(() => done(true)))`)
}

// eval runs a JavaScript expression in the page and returns its value.
func eval[T any](ctx context.Context, expr string) (T, error) {
	return chromedp.Run(ctx, chromedp.Evaluate[T](expr, chromedp.EvalAwaitPromise))
}

func mustEval[T any](t testing.TB, ctx context.Context, expr string) T {
	t.Helper()
	v, err := eval[T](ctx, expr)
	if err != nil {
		t.Fatalf("evaluate %s: %v", expr, err)
	}
	return v
}

// resetStorage empties the page's localStorage (all file:// pages share one) and reloads.
func resetStorage(t testing.TB, ctx context.Context, u string) {
	t.Helper()
	mustEval[bool](t, ctx, `localStorage.clear(), true`)
	open(t, ctx, u)
}

// setField types text into a named input of a form as a user would (value, then an input
// event) and returns once the page has handled it.
func setField(t testing.TB, ctx context.Context, form, name, text string) {
	t.Helper()
	js := `(function(){const el=document.querySelector('#` + form + ` [name="` + name + `"]');` +
		`if(!el) return false; el.value=` + strconv.Quote(text) + `;` +
		`el.dispatchEvent(new Event("input",{bubbles:true})); el.dispatchEvent(new Event("change",{bubbles:true})); return true})()`
	if !mustEval[bool](t, ctx, js) {
		t.Fatalf("no field %s in #%s", name, form)
	}
}

func output(t testing.TB, ctx context.Context, key string) string {
	t.Helper()
	return mustEval[string](t, ctx, `(document.querySelector('[data-key="`+key+`"]')||{textContent:"<missing>"}).textContent`)
}

func outputNumber(t testing.TB, ctx context.Context, key string) float64 {
	t.Helper()
	s := output(t, ctx, key)
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		t.Fatalf("data-key %s holds %q, not a number", key, s)
	}
	return v
}

func emulatePrint(ctx context.Context) error {
	return chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := chromedp.Call(ctx, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: "print"})
		return err
	}))
}

// emulateScreen ends emulatePrint: the tab renders for the screen again.
func emulateScreen(ctx context.Context) error {
	return chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		_, err := chromedp.Call(ctx, emulation.SetEmulatedMedia, emulation.SetEmulatedMediaParams{Media: ""})
		return err
	}))
}

// requestCounter records every request the tab makes after it is started.
type requestCounter struct {
	mu   sync.Mutex
	urls []string
}

func countRequests(t testing.TB, ctx context.Context) *requestCounter {
	t.Helper()
	rc := &requestCounter{}
	if err := chromedp.Listen(ctx, func(ev any) {
		if e, ok := ev.(*network.EventRequestWillBeSent); ok {
			rc.mu.Lock()
			rc.urls = append(rc.urls, e.Request.URL)
			rc.mu.Unlock()
		}
	}); err != nil {
		t.Fatal(err)
	}
	if _, err := chromedp.Call(ctx, network.Enable, network.EnableParams{}); err != nil {
		t.Fatal(err)
	}
	return rc
}

func (rc *requestCounter) list() []string {
	rc.mu.Lock()
	defer rc.mu.Unlock()
	return append([]string(nil), rc.urls...)
}

var errNoCore = errors.New("core not ready")
