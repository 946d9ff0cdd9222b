//go:build gecko || webkit

package enginetest

import (
	"bufio"
	"bytes"
	"encoding/base64"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"net/http"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"time"
)

// The WebKit engine the tests use: Debian's webkit2gtk-driver and WebKitGTK's MiniBrowser,
// shown on a virtual X display (Debian's xvfb).
const (
	WebKitDriverPath = "/usr/bin/WebKitWebDriver"
	XvfbPath         = "/usr/bin/Xvfb"
)

// miniBrowser is WebKitGTK's MiniBrowser (package libwebkit2gtk-4.1-0, which
// webkit2gtk-driver depends on), under the machine's multiarch directory.
func miniBrowser() string {
	if m, _ := filepath.Glob("/usr/lib/*/webkit2gtk-4.1/MiniBrowser"); len(m) > 0 {
		return m[0]
	}
	return "/usr/lib/x86_64-linux-gnu/webkit2gtk-4.1/MiniBrowser"
}

type webkit struct {
	xvfb, driver *exec.Cmd
	base         string // http://127.0.0.1:port/session/id
	proxy        *proxy
	version      string
	client       http.Client
}

// StartWebKit starts Xvfb on a free display, WebKitWebDriver on a free port and a MiniBrowser
// session in it, with every request the page might make sent to the recording proxy.
func StartWebKit(o Options) (Browser, error) {
	for _, p := range []string{WebKitDriverPath, miniBrowser(), XvfbPath} {
		if !executable(p) {
			return nil, fmt.Errorf("%s %w (apt-get install webkit2gtk-driver xvfb, or run web/scripts/deps-webkit.sh)", p, ErrMissing)
		}
	}
	k := &webkit{client: http.Client{Timeout: 120 * time.Second}}
	var err error
	if k.proxy, err = startProxy(); err != nil {
		return nil, err
	}
	// Xvfb picks a free display itself and writes its number to the pipe (-displayfd).
	r, w, err := os.Pipe()
	if err != nil {
		return nil, err
	}
	wd, ht := size(o)
	k.xvfb = exec.Command(XvfbPath, "-displayfd", "3", "-screen", "0", strconv.Itoa(max(wd, 1280))+"x"+strconv.Itoa(max(ht, 1024))+"x24", "-nolisten", "tcp")
	k.xvfb.ExtraFiles = []*os.File{w}
	if err := k.xvfb.Start(); err != nil {
		return nil, err
	}
	w.Close()
	disp := make(chan string, 1)
	go func() {
		line, _ := bufio.NewReader(r).ReadString('\n')
		disp <- strings.TrimSpace(line)
		r.Close()
	}()
	var display string
	select {
	case display = <-disp:
	case <-time.After(30 * time.Second):
	}
	if display == "" {
		k.Close()
		return nil, errors.New("Xvfb did not start a display within 30 s")
	}
	port, err := freePort()
	if err != nil {
		k.Close()
		return nil, err
	}
	var log bytes.Buffer
	k.driver = exec.Command(WebKitDriverPath, "--port="+port)
	k.driver.Env = append(os.Environ(), "DISPLAY=:"+display)
	k.driver.Stdout, k.driver.Stderr = &log, &log
	if err := k.driver.Start(); err != nil {
		k.Close()
		return nil, err
	}
	root := "http://127.0.0.1:" + port
	if !waitFor(30*time.Second, func() bool {
		resp, err := k.client.Get(root + "/status")
		if err == nil {
			resp.Body.Close()
		}
		return err == nil
	}) {
		k.Close()
		return nil, errors.New("WebKitWebDriver did not answer within 30 s")
	}
	args := []string{"--automation"}
	if o.NoScript {
		args = append(args, "--enable-javascript=false") // a WebKitSettings property
	}
	caps := map[string]any{"capabilities": map[string]any{"alwaysMatch": map[string]any{
		"webkitgtk:browserOptions": map[string]any{"binary": miniBrowser(), "args": args},
		"proxy":                    map[string]any{"proxyType": "manual", "httpProxy": k.proxy.addr(), "sslProxy": k.proxy.addr()},
	}}}
	var sess struct {
		SessionID    string `json:"sessionId"`
		Capabilities struct {
			BrowserName    string `json:"browserName"`
			BrowserVersion string `json:"browserVersion"`
		} `json:"capabilities"`
	}
	if err := k.do("POST", root+"/session", caps, &sess); err != nil {
		k.Close()
		return nil, fmt.Errorf("new WebKit session: %w\n%s", err, lastLines(log.String(), 20))
	}
	k.base = root + "/session/" + sess.SessionID
	k.version = "WebKit (" + sess.Capabilities.BrowserName + ", WebKitGTK " + sess.Capabilities.BrowserVersion + ")"
	if err := k.Resize(wd, ht); err != nil {
		k.Close()
		return nil, err
	}
	return k, nil
}

// do sends one WebDriver command; the answer's "value" goes into result.
func (k *webkit) do(method, url string, body any, result any) error {
	var rd io.Reader
	if body != nil {
		b, err := json.Marshal(body)
		if err != nil {
			return err
		}
		rd = bytes.NewReader(b)
	}
	req, err := http.NewRequest(method, url, rd)
	if err != nil {
		return err
	}
	req.Header.Set("Content-Type", "application/json")
	resp, err := k.client.Do(req)
	if err != nil {
		return err
	}
	defer resp.Body.Close()
	raw, err := io.ReadAll(resp.Body)
	if err != nil {
		return err
	}
	var env struct {
		Value json.RawMessage `json:"value"`
	}
	if err := json.Unmarshal(raw, &env); err != nil {
		return fmt.Errorf("WebKitWebDriver answered %s: %q", resp.Status, raw)
	}
	if resp.StatusCode != http.StatusOK {
		var e struct {
			Error   string `json:"error"`
			Message string `json:"message"`
		}
		json.Unmarshal(env.Value, &e)
		return fmt.Errorf("%s: %s", e.Error, e.Message)
	}
	if result != nil {
		return json.Unmarshal(env.Value, result)
	}
	return nil
}

func (k *webkit) Name() string { return k.version }

func (k *webkit) Open(url string) error {
	return k.do("POST", k.base+"/url", map[string]any{"url": url}, nil)
}

func (k *webkit) Eval(expr string) (string, error) {
	var out string
	script := "const done = arguments[arguments.length - 1]; (function () { " + wrapExpr(expr) +
		" })().then(done, e => done({__error: String(e)}));"
	var v any
	if err := k.do("POST", k.base+"/execute/async", map[string]any{"script": script, "args": []any{}}, &v); err != nil {
		return "", err
	}
	switch x := v.(type) {
	case string:
		out = x
	case map[string]any:
		return "", fmt.Errorf("script error: %v", x["__error"])
	default:
		return "", fmt.Errorf("script returned %T, not JSON text", v)
	}
	return out, nil
}

func (k *webkit) Screenshot() ([]byte, error) {
	var s string
	if err := k.do("GET", k.base+"/screenshot", nil, &s); err != nil {
		return nil, err
	}
	return base64.StdEncoding.DecodeString(s)
}

// Resize sets the window so that the viewport (innerWidth × innerHeight) is w × h: it sets
// the window, measures the viewport (without scripts, assumes MiniBrowser's chrome is the
// same as measured in a scripted session) and corrects once.
func (k *webkit) Resize(w, h int) error {
	if err := k.do("POST", k.base+"/window/rect", map[string]any{"width": w, "height": h}, nil); err != nil {
		return err
	}
	s, err := k.Eval("[innerWidth, innerHeight]")
	if err != nil {
		return nil // no scripts: the window size is as near as it gets
	}
	var got [2]int
	if json.Unmarshal([]byte(s), &got) != nil || (got[0] == w && got[1] == h) {
		return nil
	}
	return k.do("POST", k.base+"/window/rect", map[string]any{"width": 2*w - got[0], "height": 2*h - got[1]}, nil)
}

func (k *webkit) Requests() []string { return k.proxy.list() }

var killOnce sync.Mutex

func (k *webkit) Close() error {
	killOnce.Lock()
	defer killOnce.Unlock()
	if k.base != "" {
		k.client.Timeout = 10 * time.Second
		k.do("DELETE", k.base, nil, nil)
	}
	for _, c := range []*exec.Cmd{k.driver, k.xvfb} {
		if c != nil && c.Process != nil {
			c.Process.Kill()
			c.Wait()
		}
	}
	if k.proxy != nil {
		k.proxy.ln.Close()
	}
	return nil
}
