//go:build gecko || webkit

package enginetest

import (
	"bufio"
	"encoding/base64"
	"encoding/json"
	"errors"
	"fmt"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"sync"
	"time"
)

// FirefoxPath is the Gecko engine the tests use (Debian's firefox-esr).
const FirefoxPath = "/usr/bin/firefox-esr"

// gecko is firefox-esr, headless, in a new profile, driven over WebDriver BiDi.
type gecko struct {
	cmd     *exec.Cmd
	dir     string
	ws      *wsConn
	proxy   *proxy
	version string
	context string
	sandbox string // the realm of Eval when the page's scripts are off

	mu      sync.Mutex
	nextID  int
	waiting map[int]chan bidiReply
	reqs    []string
	done    chan struct{}
}

type bidiReply struct {
	Type    string          `json:"type"`
	ID      int             `json:"id"`
	Method  string          `json:"method"`
	Result  json.RawMessage `json:"result"`
	Params  json.RawMessage `json:"params"`
	Error   string          `json:"error"`
	Message string          `json:"message"`
}

// geckoPrefs keep the browser itself off the network (updates, telemetry, captive portal and
// connectivity probes, safe browsing, remote settings) and send anything left through the
// recording proxy; downloads go to the profile without asking.
const geckoPrefs = `user_pref("app.update.disabledForTesting", true);
user_pref("app.update.auto", false);
user_pref("browser.shell.checkDefaultBrowser", false);
user_pref("browser.startup.page", 0);
user_pref("browser.startup.homepage_override.mstone", "ignore");
user_pref("datareporting.policy.dataSubmissionEnabled", false);
user_pref("datareporting.healthreport.uploadEnabled", false);
user_pref("toolkit.telemetry.enabled", false);
user_pref("toolkit.telemetry.server", "");
user_pref("network.captive-portal-service.enabled", false);
user_pref("network.connectivity-service.enabled", false);
user_pref("network.dns.disablePrefetch", true);
user_pref("network.prefetch-next", false);
user_pref("browser.safebrowsing.malware.enabled", false);
user_pref("browser.safebrowsing.phishing.enabled", false);
user_pref("browser.safebrowsing.downloads.enabled", false);
user_pref("browser.safebrowsing.update.enabled", false);
user_pref("extensions.update.enabled", false);
user_pref("extensions.getAddons.cache.enabled", false);
user_pref("browser.search.update", false);
user_pref("services.settings.server", "http://127.0.0.1:9/");
user_pref("messaging-system.rsexperimentloader.enabled", false);
user_pref("app.normandy.enabled", false);
user_pref("browser.newtabpage.enabled", false);
user_pref("browser.download.folderList", 2);
user_pref("browser.download.useDownloadDir", true);
user_pref("browser.download.always_ask_before_handling_new_types", false);
`

// StartGecko starts firefox-esr with a fresh profile and opens a BiDi session on its one tab.
func StartGecko(o Options) (Browser, error) {
	if !executable(FirefoxPath) {
		return nil, fmt.Errorf("%s %w (apt-get install firefox-esr, or run web/scripts/deps-gecko.sh)", FirefoxPath, ErrMissing)
	}
	g := &gecko{waiting: map[int]chan bidiReply{}, done: make(chan struct{})}
	var err error
	if g.proxy, err = startProxy(); err != nil {
		return nil, err
	}
	if g.dir, err = os.MkdirTemp("", "saltcast-gecko-"); err != nil {
		return nil, err
	}
	host, port, _ := strings.Cut(g.proxy.addr(), ":")
	prefs := geckoPrefs +
		`user_pref("network.proxy.type", 1);` + "\n" +
		`user_pref("network.proxy.http", "` + host + `");` + "\n" +
		`user_pref("network.proxy.http_port", ` + port + `);` + "\n" +
		`user_pref("network.proxy.ssl", "` + host + `");` + "\n" +
		`user_pref("network.proxy.ssl_port", ` + port + `);` + "\n" +
		`user_pref("network.proxy.no_proxies_on", "");` + "\n" +
		`user_pref("network.proxy.allow_hijacking_localhost", true);` + "\n" +
		`user_pref("browser.download.dir", "` + filepath.Join(g.dir, "downloads") + `");` + "\n"
	if err := os.WriteFile(filepath.Join(g.dir, "user.js"), []byte(prefs), 0o644); err != nil {
		return nil, err
	}
	if o.NoScript {
		// Honoured when firefox-esr runs alone (a --screenshot run shows <noscript>), but
		// with the remote agent listening the page's scripts still ran (firefox-esr 153,
		// 2 Dec 2026); the suite therefore also blocks them by policy (see web/).
		prefs += `user_pref("javascript.enabled", false);` + "\n"
	}
	w, h := size(o)
	g.cmd = exec.Command(FirefoxPath, "--headless", "--no-remote", "--remote-debugging-port=0",
		"--width="+strconv.Itoa(w), "--height="+strconv.Itoa(h), "--profile", g.dir, "about:blank")
	g.cmd.Env = append(os.Environ(), "MOZ_CRASHREPORTER_DISABLE=1", "MOZ_DISABLE_AUTO_SAFE_MODE=1")
	stderr, err := g.cmd.StderrPipe()
	if err != nil {
		return nil, err
	}
	if err := g.cmd.Start(); err != nil {
		return nil, err
	}
	// Firefox prints its BiDi address on stderr once the remote agent listens.
	addr := make(chan string, 1)
	var out strings.Builder
	var outMu sync.Mutex
	go func() {
		re := regexp.MustCompile(`WebDriver BiDi listening on (ws://\S+)`)
		sc := bufio.NewScanner(stderr)
		for sc.Scan() {
			outMu.Lock()
			out.WriteString(sc.Text() + "\n")
			outMu.Unlock()
			if m := re.FindStringSubmatch(sc.Text()); m != nil {
				select {
				case addr <- m[1]:
				default:
				}
			}
		}
	}()
	var wsURL string
	select {
	case wsURL = <-addr:
	case <-time.After(60 * time.Second):
		g.Close()
		outMu.Lock()
		defer outMu.Unlock()
		return nil, errors.New("firefox-esr did not open its remote port within 60 s:\n" + lastLines(out.String(), 20))
	}
	if g.ws, err = dialWS(wsURL + "/session"); err != nil {
		g.Close()
		return nil, fmt.Errorf("connecting to firefox-esr's BiDi port: %w", err)
	}
	go g.readLoop()
	var sess struct {
		Capabilities struct {
			BrowserName    string `json:"browserName"`
			BrowserVersion string `json:"browserVersion"`
		} `json:"capabilities"`
	}
	if err := g.call("session.new", map[string]any{"capabilities": map[string]any{}}, &sess); err != nil {
		g.Close()
		return nil, err
	}
	g.version = "Gecko (" + sess.Capabilities.BrowserName + " " + sess.Capabilities.BrowserVersion + ")"
	var tree struct {
		Contexts []struct {
			Context string `json:"context"`
		} `json:"contexts"`
	}
	if err := g.call("browsingContext.getTree", map[string]any{}, &tree); err != nil || len(tree.Contexts) == 0 {
		g.Close()
		return nil, fmt.Errorf("firefox-esr has no tab: %v", err)
	}
	g.context = tree.Contexts[0].Context
	if err := g.call("session.subscribe", map[string]any{"events": []string{"network.beforeRequestSent"}}, nil); err != nil {
		g.Close()
		return nil, err
	}
	if err := g.Resize(w, h); err != nil {
		g.Close()
		return nil, err
	}
	if o.NoScript {
		// The test's own scripts run in a sandbox realm, apart from the page's, which the
		// javascript.enabled pref turns off.
		g.sandbox = "saltcast-test"
	}
	return g, nil
}

func size(o Options) (int, int) {
	if o.Width == 0 || o.Height == 0 {
		return 1280, 800
	}
	return o.Width, o.Height
}

func (g *gecko) readLoop() {
	defer close(g.done)
	for {
		msg, err := g.ws.read()
		if err != nil {
			g.mu.Lock()
			for id, ch := range g.waiting {
				ch <- bidiReply{Type: "error", Error: "connection closed", Message: err.Error()}
				delete(g.waiting, id)
			}
			g.mu.Unlock()
			return
		}
		var r bidiReply
		if json.Unmarshal(msg, &r) != nil {
			continue
		}
		if r.Type == "event" {
			if r.Method == "network.beforeRequestSent" {
				var p struct {
					Context string `json:"context"`
					Request struct {
						URL string `json:"url"`
					} `json:"request"`
				}
				if json.Unmarshal(r.Params, &p) == nil {
					g.mu.Lock()
					g.reqs = append(g.reqs, p.Request.URL)
					g.mu.Unlock()
				}
			}
			continue
		}
		g.mu.Lock()
		ch := g.waiting[r.ID]
		delete(g.waiting, r.ID)
		g.mu.Unlock()
		if ch != nil {
			ch <- r
		}
	}
}

// call sends one BiDi command and waits (at most 90 s) for its answer.
func (g *gecko) call(method string, params any, result any) error {
	g.mu.Lock()
	g.nextID++
	id := g.nextID
	ch := make(chan bidiReply, 1)
	g.waiting[id] = ch
	g.mu.Unlock()
	msg, err := json.Marshal(map[string]any{"id": id, "method": method, "params": params})
	if err != nil {
		return err
	}
	if err := g.ws.write(msg); err != nil {
		return err
	}
	select {
	case r := <-ch:
		if r.Type == "error" || r.Error != "" {
			return fmt.Errorf("%s: %s: %s", method, r.Error, r.Message)
		}
		if result != nil {
			return json.Unmarshal(r.Result, result)
		}
		return nil
	case <-time.After(90 * time.Second):
		return fmt.Errorf("%s: no answer from firefox-esr within 90 s", method)
	}
}

func (g *gecko) Name() string { return g.version }

func (g *gecko) Open(url string) error {
	return g.call("browsingContext.navigate", map[string]any{"context": g.context, "url": url, "wait": "complete"}, nil)
}

func (g *gecko) Eval(expr string) (string, error) {
	var r struct {
		Type   string `json:"type"`
		Result struct {
			Type  string `json:"type"`
			Value any    `json:"value"`
		} `json:"result"`
		ExceptionDetails struct {
			Text string `json:"text"`
		} `json:"exceptionDetails"`
	}
	target := map[string]any{"context": g.context}
	if g.sandbox != "" {
		target["sandbox"] = g.sandbox
	}
	err := g.call("script.callFunction", map[string]any{
		"functionDeclaration": "function () { " + wrapExpr(expr) + " }",
		"target":              target,
		"awaitPromise":        true,
	}, &r)
	if err != nil {
		return "", err
	}
	if r.Type == "exception" {
		return "", errors.New("script error: " + r.ExceptionDetails.Text)
	}
	s, ok := r.Result.Value.(string)
	if !ok {
		return "", fmt.Errorf("script returned a %s, not JSON text", r.Result.Type)
	}
	return s, nil
}

func (g *gecko) Screenshot() ([]byte, error) {
	var r struct {
		Data string `json:"data"`
	}
	if err := g.call("browsingContext.captureScreenshot", map[string]any{"context": g.context}, &r); err != nil {
		return nil, err
	}
	return base64.StdEncoding.DecodeString(r.Data)
}

func (g *gecko) Resize(w, h int) error {
	return g.call("browsingContext.setViewport", map[string]any{"context": g.context,
		"viewport": map[string]any{"width": w, "height": h}}, nil)
}

func (g *gecko) Requests() []string {
	g.mu.Lock()
	defer g.mu.Unlock()
	// The page's requests as BiDi reports them for its tab. The proxy also catches the
	// browser's own background traffic, which is not the page's doing, so it is not listed.
	return append([]string(nil), g.reqs...)
}

func (g *gecko) Close() error {
	if g.ws != nil {
		g.call("browser.close", map[string]any{}, nil)
		g.ws.close()
	}
	if g.cmd != nil && g.cmd.Process != nil {
		exited := make(chan struct{})
		go func() { g.cmd.Wait(); close(exited) }()
		select {
		case <-exited:
		case <-time.After(10 * time.Second):
			g.cmd.Process.Kill()
			<-exited
		}
	}
	if g.proxy != nil {
		g.proxy.ln.Close()
	}
	if g.dir != "" {
		os.RemoveAll(g.dir)
	}
	return nil
}
