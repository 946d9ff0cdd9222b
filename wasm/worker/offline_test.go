//go:build workerd && browser

package main

import (
	"context"
	"io"
	"net/http"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"saltcast/web/carry"
	"strconv"
	"strings"
	"testing"
	"time"

	cdpbrowser "github.com/chromedp/cdproto/browser"
	"github.com/chromedp/cdproto/network"
	"github.com/chromedp/chromedp"
)

// The installable copy: the worker serves a service worker, a manifest and icons;
// a browser that visited once opens the app with no network and computes; a new version
// waits until the user agrees, and the recipes survive it.

// The files of the installable copy answer with their types and a fresh-check cache rule.
func TestWorkerdServesInstallFiles(t *testing.T) {
	s := sharedWorkerd(t)
	for path, want := range map[string]string{
		"/sw.js":                       "text/javascript; charset=utf-8",
		"/manifest.webmanifest":        "application/manifest+json",
		"/icons/icon-192.png":          "image/png",
		"/icons/icon-512.png":          "image/png",
		"/icons/icon-maskable-512.png": "image/png",
		"/icons/apple-touch-icon.png":  "image/png",
	} {
		res, err := http.Get(s.base + path)
		if err != nil {
			t.Fatal(err)
		}
		body, _ := io.ReadAll(res.Body)
		res.Body.Close()
		file := strings.TrimPrefix(path, "/")
		if path == "/sw.js" {
			file = "sw.txt"
		}
		built, err := os.ReadFile(repoPath("build", "worker", file))
		if err != nil {
			t.Fatal(err)
		}
		if res.StatusCode != 200 || string(body) != string(built) {
			t.Errorf("GET %s = %d, %d bytes; want 200 and build/worker/%s", path, res.StatusCode, len(body), file)
		}
		h := res.Header
		if h.Get("Content-Type") != want || h.Get("Cache-Control") != "no-cache" || h.Get("X-Content-Type-Options") != "nosniff" {
			t.Errorf("GET %s headers: %v", path, h)
		}
		if csp := h.Get("Content-Security-Policy"); !strings.Contains(csp, "default-src 'none'") {
			t.Errorf("GET %s Content-Security-Policy %q", path, csp)
		}
	}
	// The page served names them, and its policy (header) lets it use them.
	res, err := http.Get(s.base + "/")
	if err != nil {
		t.Fatal(err)
	}
	page, _ := io.ReadAll(res.Body)
	res.Body.Close()
	for _, want := range []string{`<link rel="manifest" href="/manifest.webmanifest">`, `sw.register("/sw.js"`} {
		if !strings.Contains(string(page), want) {
			t.Errorf("the served page lacks %s", want)
		}
	}
	csp := res.Header.Get("Content-Security-Policy")
	for _, want := range []string{"worker-src 'self'", "manifest-src 'self'", "connect-src 'self'"} {
		if !strings.Contains(csp, want) {
			t.Errorf("the page's header policy lacks %q: %s", want, csp)
		}
	}
	if res, err := http.Post(s.base+"/sw.js", "text/plain", strings.NewReader("x")); err != nil || res.StatusCode != 405 {
		t.Errorf("POST /sw.js = %v, %v; want 405", res, err)
	}
}

// offlineBrowser starts headless chromium with a profile of its own; fails without chromium.
func offlineBrowser(t *testing.T) context.Context {
	t.Helper()
	exe, err := exec.LookPath("chromium")
	if err != nil {
		t.Fatal("chromium is not installed; run bash web/scripts/deps-chromium.sh (or `make test`)")
	}
	opts := append(chromedp.DefaultExecAllocatorOptions[:],
		chromedp.ExecPath(exe),
		chromedp.UserDataDir(t.TempDir()),
		chromedp.DisableGPU,
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("no-first-run", true),
	)
	if os.Geteuid() == 0 {
		opts = append(opts, chromedp.NoSandbox)
	}
	alloc, cancelAlloc := chromedp.NewExecAllocator(context.Background(), opts...)
	browser, cancelBrowser := chromedp.NewContext(alloc)
	if err := chromedp.Do(browser); err != nil {
		t.Fatal("starting chromium: " + err.Error())
	}
	ctx, cancel := context.WithTimeout(browser, 3*time.Minute)
	t.Cleanup(func() { cancel(); cancelBrowser(); cancelAlloc() })
	return ctx
}

func jsEval[T any](t *testing.T, ctx context.Context, expr string) T {
	t.Helper()
	v, err := chromedp.Run(ctx, chromedp.Evaluate[T](expr, chromedp.EvalAwaitPromise))
	if err != nil {
		t.Fatalf("evaluate %s: %v", expr, err)
	}
	return v
}

// waitFor evaluates expr until it is true, across page loads, or fails after a while.
func waitFor(t *testing.T, ctx context.Context, what, expr string) {
	t.Helper()
	deadline := time.Now().Add(60 * time.Second)
	for time.Now().Before(deadline) {
		ok, err := chromedp.Run(ctx, chromedp.Evaluate[bool](expr))
		if err == nil && ok {
			return
		}
		time.Sleep(20 * time.Millisecond)
	}
	state, _ := chromedp.Run(ctx, chromedp.Evaluate[string](`document.documentElement.outerHTML.slice(0, 200) + " offline=" +
		document.documentElement.getAttribute("data-offline") + " " + (document.documentElement.getAttribute("data-offline-error") || "")`))
	t.Fatalf("waiting for %s: not so after 60 s (%s)", what, state)
}

// setNetwork turns the tab's network off or back on (the page, and its service worker too),
// as the browser's developer tools do (Network.emulateNetworkConditionsByRule), and tells
// the page (navigator.onLine).
func setNetwork(t *testing.T, ctx context.Context, offline bool) {
	t.Helper()
	var rules []*network.Conditions
	if offline {
		rules = []*network.Conditions{{Offline: true, DownloadThroughput: -1, UploadThroughput: -1}}
	}
	if err := chromedp.Do(ctx, chromedp.Func(func(ctx context.Context, tg *chromedp.Target) error {
		if _, err := chromedp.Call(ctx, network.Enable, network.EnableParams{}); err != nil {
			return err
		}
		if _, err := chromedp.Call(ctx, network.EmulateNetworkConditionsByRule, network.EmulateNetworkConditionsByRuleParams{
			EmulateOfflineServiceWorker: &offline, MatchedNetworkConditions: rules,
		}); err != nil {
			return err
		}
		_, err := chromedp.Call(ctx, network.OverrideNetworkState, network.OverrideNetworkStateParams{
			Offline: offline, DownloadThroughput: -1, UploadThroughput: -1,
		})
		return err
	})); err != nil {
		t.Fatal("network emulation: " + err.Error())
	}
}

// versionB copies the served page and service worker into a directory of their own with
// another version text, as the next deployment would serve them, and returns the config
// edit that makes workerd serve them.
func versionB(t *testing.T) (edit func(string) string, version string) {
	t.Helper()
	page, err := os.ReadFile(repoPath("build", "worker", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	sw, err := os.ReadFile(repoPath("build", "worker", "sw.txt"))
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`<meta name="saltcast-version" content="([^"]*)">`).FindSubmatch(page)
	if m == nil {
		t.Fatal("the served page has no version")
	}
	old, version := string(m[1]), string(m[1])+"-next"
	b := strings.ReplaceAll(string(page), `content="`+old+`"`, `content="`+version+`"`)
	b = strings.ReplaceAll(b, `<span id="app-version">`+old+`<`, `<span id="app-version">`+version+`<`)
	s := regexp.MustCompile(`const VERSION = "[^"]*";`).ReplaceAllString(string(sw), `const VERSION = "`+version+`";`)
	if b == string(page) || s == string(sw) {
		t.Fatal("could not make the next version")
	}
	dir, err := os.MkdirTemp(repoPath("build"), "worker-next-")
	if err != nil {
		t.Fatal(err)
	}
	t.Cleanup(func() { os.RemoveAll(dir) })
	os.WriteFile(filepath.Join(dir, "saltcast.html"), []byte(b), 0o644)
	os.WriteFile(filepath.Join(dir, "sw.txt"), []byte(s), 0o644)
	rel := "../" + filepath.Base(dir) + "/"
	return func(cfg string) string {
		for _, f := range []string{"saltcast.html", "sw.txt"} {
			if !strings.Contains(cfg, `embed "`+f+`"`) {
				t.Fatalf("workerd config does not embed %s", f)
			}
			cfg = strings.Replace(cfg, `embed "`+f+`"`, `embed "`+rel+f+`"`, 1)
		}
		return cfg
	}, version
}

// First visit online; then with the network off (emulated, and the server stopped) the app
// loads from the service worker's cache and computes; then a new version is offered and
// taken only when the user agrees, and the saved recipes are still there.
func TestServedAppOfflineAndUpdate(t *testing.T) {
	bin := needBuild(t)
	ctx := offlineBrowser(t)
	a := startWorkerd(t, bin, "")
	defer a.stop()
	a.waitReady(t)
	addr := strings.TrimPrefix(a.base, "http://")

	// 1. The first visit, online: the app starts, and is kept on the device.
	if err := chromedp.Do(ctx, chromedp.Navigate(a.base+"/")); err != nil {
		t.Fatal(err)
	}
	waitFor(t, ctx, "the app's first result", `document.documentElement.getAttribute("data-ready") === "1" && document.documentElement.hasAttribute("data-settled")`)
	waitFor(t, ctx, "the service worker to control the page",
		`document.documentElement.getAttribute("data-offline") === "ready" && !!navigator.serviceWorker.controller`)
	versionA := jsEval[string](t, ctx, `document.getElementById("app-version").textContent`)
	jsEval[bool](t, ctx, `document.querySelector('[data-demo="cuso4"]').click(), true`)
	jsEval[bool](t, ctx, `document.getElementById("save-name").value = "blue batch (invented)", document.getElementById("save-btn").click(), true`)
	saved := jsEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`)
	if !strings.Contains(saved, "blue batch (invented)") {
		t.Fatalf("the recipe was not saved: %q", saved)
	}

	// A copy saved from the served app is the file people e-mail, not the served page: no
	// service worker, no manifest, the file's strict policy.
	jsEval[bool](t, ctx, `document.getElementById("tab-box").click(), document.getElementById("carry-all").click(), true`)
	copyPage := download(t, ctx, `document.getElementById("carry-save").click()`)
	file, err := os.ReadFile(repoPath("dist", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	c, err := carry.ExtractCarried(copyPage)
	if err != nil {
		t.Fatalf("the copy saved from the served app: %v", err)
	}
	if want, _ := carry.WithCarried(file, c); string(copyPage) != string(want) || len(c.Recipes) != 1 {
		t.Errorf("the copy saved from the served app (%d B, %d recipes) is not dist/saltcast.html with its recipe", len(copyPage), len(c.Recipes))
	}
	for _, never := range []string{"serviceWorker", "manifest.webmanifest"} {
		if strings.Contains(string(copyPage), never) {
			t.Errorf("the copy saved from the served app mentions %s", never)
		}
	}
	jsEval[bool](t, ctx, `document.getElementById("tab-batch").click(), true`)

	// 2. Offline: the network is off and the server is gone.
	a.stop()
	setNetwork(t, ctx, true)
	if err := chromedp.Do(ctx, chromedp.Navigate(a.base+"/")); err != nil {
		t.Fatal("offline reload: " + err.Error())
	}
	waitFor(t, ctx, "the app to start offline", `document.documentElement.getAttribute("data-ready") === "1" && document.documentElement.hasAttribute("data-settled")`)
	charge := func() float64 {
		v, _ := strconv.ParseFloat(jsEval[string](t, ctx, `document.querySelector('[data-key="charge_g"]').textContent`), 64)
		return v
	}
	before := charge()
	jsEval[bool](t, ctx, `(() => { const el = document.querySelector('#recipe [name="water_g"]');
		el.value = "2000"; el.dispatchEvent(new Event("input", {bubbles: true})); return true })()`)
	waitFor(t, ctx, "a new charge offline", `parseFloat(document.querySelector('[data-key="charge_g"]').textContent) !== `+strconv.FormatFloat(before, 'g', -1, 64))
	if after := charge(); !(before > 0 && after > before) {
		t.Errorf("offline the charge went from %v to %v after more water; the app does not compute", before, after)
	}
	if got := jsEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`); got != saved {
		t.Errorf("offline the saved recipes are %q", got)
	}

	// 3. A new version at the same address, back online: offered, not forced.
	edit, versionB := versionB(t)
	b := startWorkerdAt(t, bin, addr, "", edit)
	defer b.stop()
	b.waitReady(t)
	setNetwork(t, ctx, false)
	if err := chromedp.Do(ctx, chromedp.Navigate(a.base+"/")); err != nil {
		t.Fatal(err)
	}
	waitFor(t, ctx, "the question about the new version", `document.documentElement.getAttribute("data-offline") === "update-ready" &&
		!!document.getElementById("update-now")`)
	if got := jsEval[string](t, ctx, `document.getElementById("app-version").textContent`); got != versionA {
		t.Errorf("before the user agreed the page runs version %q, want the kept %q", got, versionA)
	}
	if text := jsEval[string](t, ctx, `document.getElementById("update-text").textContent`); !strings.Contains(text, "new version") {
		t.Errorf("the update bar says %q", text)
	}
	shots(t, ctx, "update-bar")
	// Not agreeing keeps the old version: "Later", then a reload, still runs it and asks again.
	jsEval[bool](t, ctx, `document.getElementById("update-later").click(), true`)
	time.Sleep(time.Second)
	if err := chromedp.Do(ctx, chromedp.Navigate(a.base+"/")); err != nil {
		t.Fatal(err)
	}
	waitFor(t, ctx, "the question again after a reload", `document.documentElement.getAttribute("data-ready") === "1" && document.documentElement.hasAttribute("data-settled") &&
		document.documentElement.getAttribute("data-offline") === "update-ready"`)
	if got := jsEval[string](t, ctx, `document.getElementById("app-version").textContent`); got != versionA {
		t.Errorf("without the user's yes a reload runs version %q, want the kept %q", got, versionA)
	}
	if !jsEval[bool](t, ctx, `navigator.serviceWorker.getRegistration().then(r => !!(r && r.waiting))`) {
		t.Error("the new version is not waiting")
	}
	jsEval[bool](t, ctx, `document.getElementById("update-now").click(), true`)
	waitFor(t, ctx, "the new version to run", `document.documentElement.getAttribute("data-ready") === "1" && document.documentElement.hasAttribute("data-settled") &&
		document.getElementById("app-version").textContent === `+strconv.Quote(versionB))
	if got := jsEval[string](t, ctx, `localStorage.getItem("saltcast.recipes") || ""`); got != saved {
		t.Errorf("after the update the saved recipes are %q, want %q", got, saved)
	}
	jsEval[bool](t, ctx, `document.getElementById("tab-box").click(), true`)
	if got := jsEval[[]string](t, ctx, `[...document.querySelectorAll("#saved .nm")].map(e => e.textContent)`); len(got) != 1 || got[0] != "blue batch (invented)" {
		t.Errorf("after the update the recipe box lists %q", got)
	}
	if n := jsEval[int](t, ctx, `caches.keys().then(k => k.filter(n => n.startsWith("saltcast-app-")).length)`); n != 1 {
		t.Errorf("%d app caches after the update; the old one should be gone", n)
	}
}

// download runs expr (which starts a download) and returns the downloaded bytes.
func download(t *testing.T, ctx context.Context, expr string) []byte {
	t.Helper()
	dir := t.TempDir()
	done := make(chan string, 1)
	lctx, stop := context.WithCancel(ctx)
	defer stop()
	chromedp.ListenBrowser(lctx, func(ev any) {
		if e, ok := ev.(*cdpbrowser.EventDownloadProgress); ok && e.State == cdpbrowser.DownloadProgressStateCompleted {
			select {
			case done <- e.GUID:
			default:
			}
		}
	})
	events := true
	if _, err := chromedp.CallBrowser(ctx, cdpbrowser.SetDownloadBehavior, cdpbrowser.SetDownloadBehaviorParams{
		Behavior: cdpbrowser.SetDownloadBehaviorBehaviorAllowAndName, DownloadPath: dir, EventsEnabled: &events,
	}); err != nil {
		t.Fatal(err)
	}
	jsEval[bool](t, ctx, "("+expr+", true)")
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

// shots writes screenshots at the two tablet sizes when SALTCAST_SHOTS names a directory.
func shots(t *testing.T, ctx context.Context, name string) {
	dir := os.Getenv("SALTCAST_SHOTS")
	if dir == "" {
		return
	}
	os.MkdirAll(dir, 0o755)
	for _, size := range [][2]int64{{768, 1024}, {1280, 800}} {
		if err := chromedp.Do(ctx, chromedp.EmulateViewport(size[0], size[1])); err != nil {
			t.Fatal(err)
		}
		png, err := chromedp.Run(ctx, chromedp.CaptureScreenshot())
		if err != nil {
			t.Fatal(err)
		}
		os.WriteFile(filepath.Join(dir, name+"-"+strconv.FormatInt(size[0], 10)+"x"+strconv.FormatInt(size[1], 10)+".png"), png, 0o644)
	}
}
