//go:build workerd && browser

package main

import (
	"context"
	"os"
	"os/exec"
	"testing"
	"time"

	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"
)

// The page the worker serves must still start under the Content-Security-Policy the worker
// adds: headless Debian chromium opens GET / from workerd, and the app must show its first
// result with no violation reported. Built with the workerd and browser tags; without
// chromium it fails.
func TestWorkerdPageStartsUnderCSP(t *testing.T) {
	s := sharedWorkerd(t)
	exe, err := exec.LookPath("chromium")
	if err != nil {
		t.Fatal("chromium is not installed; run bash web/scripts/deps-chromium.sh (or `make test`)")
	}
	profile := t.TempDir()
	opts := append(chromedp.DefaultExecAllocatorOptions[:],
		chromedp.ExecPath(exe),
		chromedp.UserDataDir(profile),
		chromedp.DisableGPU,
		chromedp.Flag("disable-background-networking", true),
		chromedp.Flag("no-first-run", true),
	)
	if os.Geteuid() == 0 {
		opts = append(opts, chromedp.NoSandbox)
	}
	alloc, cancelAlloc := chromedp.NewExecAllocator(context.Background(), opts...)
	defer cancelAlloc()
	browser, cancelBrowser := chromedp.NewContext(alloc)
	defer cancelBrowser()
	ctx, cancel := context.WithTimeout(browser, 90*time.Second)
	defer cancel()

	// Collect violations from before the page's first script runs.
	if err := chromedp.Do(ctx); err != nil {
		t.Fatal("starting chromium: " + err.Error())
	}
	const collect = `window.__cspViolations = [];
document.addEventListener("securitypolicyviolation", (e) =>
  window.__cspViolations.push(e.violatedDirective + " " + (e.blockedURI || "inline") + " " + e.sample));`
	if _, err := chromedp.Call(ctx, page.AddScriptToEvaluateOnNewDocument,
		page.AddScriptToEvaluateOnNewDocumentParams{Source: collect}); err != nil {
		t.Fatal(err)
	}
	if err := chromedp.Do(ctx, chromedp.Navigate(s.base+"/")); err != nil {
		t.Fatal("navigate: " + err.Error())
	}
	state, err := chromedp.Run(ctx, chromedp.Poll[string](`(function(){const d=document.documentElement, s=d.getAttribute("data-ready"); return s === "1" && !d.hasAttribute("data-settled") ? null : s})()`,
		chromedp.WithPollingInterval(10*time.Millisecond)))
	if err != nil {
		t.Fatal("waiting for the app's first result: " + err.Error())
	}
	violations, err := chromedp.Run(ctx, chromedp.Evaluate[[]string](`window.__cspViolations`))
	if err != nil {
		t.Fatal(err)
	}
	if state != "1" || len(violations) > 0 {
		t.Errorf("the app served by the worker: data-ready %q, CSP violations %q", state, violations)
	}
}
