//go:build gecko || webkit

// Package enginetest drives the browser engines other than Chromium for the cross-engine
// browser tests of web/: Gecko (Debian's firefox-esr, over WebDriver BiDi, the W3C
// bidirectional protocol it speaks on its remote port) and WebKit (Debian's WebKitWebDriver
// with WebKitGTK's MiniBrowser under Xvfb, over classic W3C WebDriver). It is test-only: the
// page never imports it, and it builds only with the gecko or webkit tag.
//
// Both give the same small Browser: open a URL, evaluate a JavaScript expression (awaited,
// returned as JSON), take a screenshot, and, through a recording proxy that every engine is
// pointed at, list the network requests the page tried to make.
package enginetest

import (
	"errors"
	"net"
	"net/http"
	"os"
	"strings"
	"sync"
	"time"
)

// Browser is one engine with one page.
type Browser interface {
	// Name is the engine and its version, for messages.
	Name() string
	// Open navigates to url and waits for its load event.
	Open(url string) error
	// Eval evaluates the JavaScript expression expr in the page (a promise is awaited) and
	// returns its value as JSON text.
	Eval(expr string) (string, error)
	// Screenshot is a PNG of the viewport.
	Screenshot() ([]byte, error)
	// Resize sets the viewport (CSS pixels) as near as the engine allows.
	Resize(width, height int) error
	// Requests are the URLs the engine asked the recording proxy for since it started.
	Requests() []string
	Close() error
}

// Options start a browser.
type Options struct {
	// NoScript starts the engine with JavaScript turned off for pages.
	NoScript bool
	// Width and Height of the window (CSS pixels); 1280×800 when zero.
	Width, Height int
}

// wrapExpr is a function body that awaits expr and returns its JSON text, or throws.
func wrapExpr(expr string) string {
	return "return Promise.resolve().then(() => (" + expr + ")).then(v => JSON.stringify(v === undefined ? null : v));"
}

// proxy is an HTTP proxy on the loopback that answers nothing and records every request
// (absolute URLs, and the host of each CONNECT for https). The engines are started with it
// as their proxy, so a request from the page, to any host, lands here instead of leaving.
type proxy struct {
	ln   net.Listener
	mu   sync.Mutex
	seen []string
}

func startProxy() (*proxy, error) {
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		return nil, err
	}
	p := &proxy{ln: ln}
	go http.Serve(ln, p)
	return p, nil
}

func (p *proxy) ServeHTTP(w http.ResponseWriter, r *http.Request) {
	u := r.URL.String()
	if r.Method == http.MethodConnect {
		u = "https://" + r.Host
	}
	p.mu.Lock()
	p.seen = append(p.seen, u)
	p.mu.Unlock()
	http.Error(w, "saltcast test proxy: no network", http.StatusBadGateway)
}

func (p *proxy) addr() string { return p.ln.Addr().String() }

func (p *proxy) list() []string {
	p.mu.Lock()
	defer p.mu.Unlock()
	return append([]string(nil), p.seen...)
}

// freePort is a TCP port on the loopback that was free a moment ago.
func freePort() (string, error) {
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		return "", err
	}
	defer ln.Close()
	_, port, _ := net.SplitHostPort(ln.Addr().String())
	return port, nil
}

// waitFor polls ok every 100 ms until it is true or d has passed.
func waitFor(d time.Duration, ok func() bool) bool {
	for end := time.Now().Add(d); time.Now().Before(end); time.Sleep(100 * time.Millisecond) {
		if ok() {
			return true
		}
	}
	return ok()
}

// ErrMissing says an engine or its driver is not installed.
var ErrMissing = errors.New("not installed")

func executable(path string) bool {
	st, err := os.Stat(path)
	return err == nil && !st.IsDir() && st.Mode()&0o111 != 0
}

func lastLines(s string, n int) string {
	lines := strings.Split(strings.TrimSpace(s), "\n")
	if len(lines) > n {
		lines = lines[len(lines)-n:]
	}
	return strings.Join(lines, "\n")
}

// Sees reports whether the request log holds url (the same URL, or one that starts with it).
func Sees(log []string, url string) bool {
	for _, r := range log {
		if strings.HasPrefix(r, url) || strings.HasPrefix(r, strings.TrimSuffix(url, "/")) {
			return true
		}
	}
	return false
}
