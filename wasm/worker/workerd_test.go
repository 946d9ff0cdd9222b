//go:build workerd

package main

import (
	"bytes"
	"compress/gzip"
	"errors"
	"fmt"
	"io"
	"net"
	"net/http"
	"os"
	"os/exec"
	"path/filepath"
	"runtime"
	"strings"
	"sync"
	"testing"
	"time"

	"saltcast/web/api"
	"saltcast/web/policy"
)

// These tests run the built worker (build/worker, from `make worker`) under workerd (from
// `make test-deps`, the pinned npm package) on a loopback port, and talk to it over HTTP.
// They are built only with the workerd tag (`make test` sets it); with the tag, a missing
// build or workerd is a failure, never a skip.

// labOrigin is the origin the shared test server allows for CORS (invented).
const labOrigin = "https://records.lab.example"

// bundleFiles are the modules of the worker, as workerd.capnp and wrangler.toml load them.
var bundleFiles = []string{"worker.mjs", "wasm_exec.js", "app.wasm", "saltcast.html", "sw.txt",
	"manifest.webmanifest", "icons/icon-192.png", "icons/icon-512.png", "icons/icon-maskable-512.png",
	"icons/apple-touch-icon.png"}

func repoPath(parts ...string) string {
	return filepath.Join(append([]string{"..", ".."}, parts...)...)
}

// needBuild returns the workerd binary, or fails if it or the built worker is missing.
func needBuild(t testing.TB) string {
	t.Helper()
	missing := func(what string) {
		t.Helper()
		t.Fatal(what + "; run `make test-deps worker` (or `make test`) first")
	}
	for _, f := range bundleFiles {
		if _, err := os.Stat(repoPath("build", "worker", f)); err != nil {
			missing("no build/worker/" + f)
		}
	}
	bin, err := workerdBinary()
	if err != nil {
		missing(err.Error())
	}
	return bin
}

// workerdBinary finds workerd: $SALTCAST_WORKERD, else the platform binary inside the npm
// package (started directly, without the Node.js launcher in node_modules/.bin).
func workerdBinary() (string, error) {
	if p := os.Getenv("SALTCAST_WORKERD"); p != "" {
		return p, nil
	}
	arch := map[string]string{"amd64": "64", "arm64": "arm64"}[runtime.GOARCH]
	for _, p := range []string{
		repoPath("wasm", "worker", "node_modules", "@cloudflare", "workerd-"+runtime.GOOS+"-"+arch, "bin", "workerd"),
		repoPath("wasm", "worker", "node_modules", ".bin", "workerd"),
	} {
		if fi, err := os.Stat(p); err == nil && !fi.IsDir() {
			return filepath.Abs(p)
		}
	}
	return "", errors.New("no workerd in wasm/worker/node_modules")
}

// workerdServer is one workerd process serving the built worker.
type workerdServer struct {
	base    string // http://127.0.0.1:port
	cmd     *exec.Cmd
	log     *syncBuffer
	started time.Time
	config  string
}

// startWorkerd starts workerd on a loopback port it opens itself and hands to workerd
// (--socket-fd), so no other process can take the port in between. allowOrigin becomes the
// SALTCAST_ALLOW_ORIGIN binding. It does not wait for the worker to answer.
func startWorkerd(t testing.TB, bin, allowOrigin string) *workerdServer {
	t.Helper()
	return startWorkerdWith(t, bin, allowOrigin, nil)
}

// startWorkerdWith is startWorkerd with a last change to the config text (nil: none).
func startWorkerdWith(t testing.TB, bin, allowOrigin string, edit func(cfg string) string) *workerdServer {
	t.Helper()
	return startWorkerdAt(t, bin, "127.0.0.1:0", allowOrigin, edit)
}

// startWorkerdAt is startWorkerdWith on a given loopback address ("127.0.0.1:0" for any
// free port), so a test can bring a server back at the same origin.
func startWorkerdAt(t testing.TB, bin, addr, allowOrigin string, edit func(cfg string) string) *workerdServer {
	t.Helper()
	// The committed config, with its paths made relative to build/worker/ (capnp embeds
	// only relative paths) and the origin binding set.
	src, err := os.ReadFile("workerd.capnp")
	if err != nil {
		t.Fatal(err)
	}
	cfg := string(src)
	const binding = `(name = "SALTCAST_ALLOW_ORIGIN", text = "")`
	if strings.Count(cfg, binding) != 1 || !strings.Contains(cfg, `"../../build/worker/`) {
		t.Fatalf("workerd.capnp: the test expects one %s and embeds from ../../build/worker/", binding)
	}
	cfg = strings.Replace(cfg, binding, `(name = "SALTCAST_ALLOW_ORIGIN", text = "`+allowOrigin+`")`, 1)
	cfg = strings.ReplaceAll(cfg, `"../../build/worker/`, `"`)
	if edit != nil {
		cfg = edit(cfg)
	}
	f, err := os.CreateTemp(repoPath("build", "worker"), "test-*.capnp")
	if err != nil {
		t.Fatal(err)
	}
	config := f.Name()
	if _, err := f.WriteString(cfg); err != nil {
		t.Fatal(err)
	}
	f.Close()

	ln, err := net.Listen("tcp", addr)
	if err != nil {
		os.Remove(config)
		t.Fatal(err)
	}
	lnFile, err := ln.(*net.TCPListener).File()
	ln.Close() // the duplicate in lnFile keeps the socket listening
	if err != nil {
		os.Remove(config)
		t.Fatal(err)
	}
	defer lnFile.Close()

	s := &workerdServer{base: "http://" + ln.Addr().String(), log: &syncBuffer{}, config: config}
	s.cmd = exec.Command(bin, "serve", config, "--socket-fd", "http=3")
	s.cmd.ExtraFiles = []*os.File{lnFile} // fd 3 in the child
	s.cmd.Stdout, s.cmd.Stderr = s.log, s.log
	s.started = time.Now()
	if err := s.cmd.Start(); err != nil {
		os.Remove(config)
		t.Fatal(err)
	}
	return s
}

// stop ends the workerd process this test started, and removes its config.
func (s *workerdServer) stop() {
	s.cmd.Process.Kill()
	s.cmd.Wait()
	os.Remove(s.config)
}

// waitReady waits for the first 200 from the worker and returns when it came.
func (s *workerdServer) waitReady(t testing.TB) time.Time {
	t.Helper()
	c := &http.Client{Timeout: 60 * time.Second}
	res, err := c.Get(s.base + "/api/v1/openapi.json")
	if err != nil {
		t.Fatalf("workerd did not answer: %v\n%s", err, s.log.String())
	}
	io.Copy(io.Discard, res.Body)
	res.Body.Close()
	if res.StatusCode != 200 {
		t.Fatalf("workerd's first answer: %s\n%s", res.Status, s.log.String())
	}
	return time.Now()
}

func (s *workerdServer) do(r *http.Request) (*http.Response, error) {
	return workerdClient.Do(r)
}

var workerdClient = &http.Client{
	Timeout:   30 * time.Second,
	Transport: &http.Transport{MaxIdleConnsPerHost: 16, DisableCompression: true},
}

// The tests of this package share one server, started by the first that needs it and
// stopped by TestMain.
var (
	sharedOnce sync.Once
	shared     *workerdServer
)

// sharedWorkerd returns the package's workerd server (CORS allowed for labOrigin).
func sharedWorkerd(t testing.TB) *workerdServer {
	t.Helper()
	bin := needBuild(t)
	sharedOnce.Do(func() {
		s := startWorkerd(t, bin, labOrigin)
		shared = s
		s.waitReady(t)
	})
	if shared == nil {
		t.Fatal("the shared workerd did not start")
	}
	return shared
}

func TestMain(m *testing.M) {
	code := m.Run()
	if shared != nil {
		log := shared.log.String()
		shared.stop()
		// A panic the handler recovered from is still a bug; so is a Go program that died.
		if code == 0 && (strings.Contains(log, "saltcast worker:")) {
			fmt.Fprintf(os.Stderr, "workerd log shows a fault:\n%s\n", log)
			code = 1
		}
	}
	os.Exit(code)
}

func TestWorkerdRoutes(t *testing.T) {
	s := sharedWorkerd(t)
	for _, c := range apiCases(t) {
		t.Run(c.name, func(t *testing.T) { c.check(t, s.base, s.do) })
	}
}

func TestWorkerdPage(t *testing.T) {
	s := sharedWorkerd(t)
	page, err := os.ReadFile(repoPath("build", "worker", "saltcast.html"))
	if err != nil {
		t.Fatal(err)
	}
	res, err := http.Get(s.base + "/")
	if err != nil {
		t.Fatal(err)
	}
	got, err := io.ReadAll(res.Body)
	res.Body.Close()
	if err != nil {
		t.Fatal(err)
	}
	if res.StatusCode != 200 || !bytes.Equal(got, page) {
		t.Errorf("GET / = %d, %d bytes; want 200 and build/worker/saltcast.html (%d bytes)", res.StatusCode, len(got), len(page))
	}
	h := res.Header
	if ct := h.Get("Content-Type"); ct != "text/html; charset=utf-8" {
		t.Errorf("GET / Content-Type %q", ct)
	}
	if h.Get("X-Content-Type-Options") != "nosniff" {
		t.Errorf("GET / lacks X-Content-Type-Options: nosniff")
	}
	if csp, want := h.Get("Content-Security-Policy"), pageCSP(page); csp != want {
		t.Errorf("GET / Content-Security-Policy\n got %q\nwant %q", csp, want)
	}
	if n := len(policy.InlineScripts(string(page))); bytes.Contains(page, []byte("saltcast-wasm")) && n < 2 {
		t.Errorf("the built page has %d inline scripts; the CSP would block the app", n)
	}
}

// The SALTCAST_ALLOW_ORIGIN binding reaches the Go program.
func TestWorkerdCORS(t *testing.T) {
	s := sharedWorkerd(t)
	for _, tt := range []struct{ origin, want string }{
		{labOrigin, labOrigin},
		{"https://elsewhere.example", ""},
	} {
		req, _ := http.NewRequest("GET", s.base+"/api/v1/solubility?solute=KNO3&temp_C=20", nil)
		req.Header.Set("Origin", tt.origin)
		res, err := s.do(req)
		if err != nil {
			t.Fatal(err)
		}
		res.Body.Close()
		if got := res.Header.Get("Access-Control-Allow-Origin"); got != tt.want {
			t.Errorf("Origin %s: Access-Control-Allow-Origin %q, want %q", tt.origin, got, tt.want)
		}
	}
}

// Requests in flight together share the isolate's one Go program: each must get its own
// answer, byte for byte.
func TestWorkerdConcurrent(t *testing.T) {
	s := sharedWorkerd(t)
	const goroutines, each = 8, 50
	kno3 := testdataFile(t, "demo-kno3-stock.json")
	cuso4 := testdataFile(t, "demo-cuso4-crystals.json")
	type call struct {
		method, path string
		body         []byte
		want         func() ([]byte, error)
	}
	calls := []call{
		{"POST", "/api/v1/plan", kno3, plan(kno3)},
		{"POST", "/api/v1/plan", cuso4, plan(cuso4)},
		{"GET", "/api/v1/solubility?solute=KNO3&temp_C=35", nil, params(api.Solubility, api.Params{"solute": "KNO3", "temp_C": "35"})},
		{"GET", "/api/v1/gas?temp_C=8", nil, params(api.Gas, api.Params{"temp_C": "8"})},
		{"GET", "/api/v1/solubility?solute=nope&temp_C=35", nil, params(api.Solubility, api.Params{"solute": "nope", "temp_C": "35"})},
	}
	wants := make([][]byte, len(calls))
	for i, c := range calls {
		b, err := c.want()
		if err != nil {
			b = api.ErrorJSON(err)
		}
		wants[i] = b
	}
	var wg sync.WaitGroup
	errs := make(chan error, goroutines*each)
	for g := range goroutines {
		wg.Go(func() {
			for i := range each {
				k := (g + i) % len(calls)
				c := calls[k]
				req, _ := http.NewRequest(c.method, s.base+c.path, bytes.NewReader(c.body))
				if c.body == nil {
					req.Body = nil
				}
				res, err := s.do(req)
				if err != nil {
					errs <- err
					continue
				}
				got, err := io.ReadAll(res.Body)
				res.Body.Close()
				if err != nil || res.StatusCode >= 500 || !bytes.Equal(got, wants[k]) {
					errs <- fmt.Errorf("%s %s: %d %v %.200s", c.method, c.path, res.StatusCode, err, got)
				}
			}
		})
	}
	wg.Wait()
	close(errs)
	n := 0
	for err := range errs {
		if n++; n <= 5 {
			t.Error(err)
		}
	}
	if n > 0 {
		t.Errorf("%d of %d concurrent requests went wrong", n, goroutines*each)
	}
}

// freePlanLimit is the compressed size limit of a Worker on Cloudflare's free plan, 3 MB;
// the paid plan allows 10 MB (Cloudflare Workers "Limits" page, worker size; from memory).
const freePlanLimit = 3 << 20

// The bundle must fit the free plan, or users on it cannot deploy.
func TestBundleFitsFreePlan(t *testing.T) {
	needBuild(t)
	size, err := bundleGzipSize()
	if err != nil {
		t.Fatal(err)
	}
	if size > freePlanLimit {
		t.Errorf("bundle is %d bytes gzipped; the free plan allows %d", size, freePlanLimit)
	}
}

// bundleGzipSize is the size of the worker's modules gzipped together, as an upload is
// compressed for the size limit.
func bundleGzipSize() (int, error) {
	var buf bytes.Buffer
	zw, _ := gzip.NewWriterLevel(&buf, gzip.BestCompression)
	for _, f := range bundleFiles {
		b, err := os.ReadFile(repoPath("build", "worker", f))
		if err != nil {
			return 0, err
		}
		zw.Write(b)
	}
	if err := zw.Close(); err != nil {
		return 0, err
	}
	return buf.Len(), nil
}

// syncBuffer collects workerd's output from its two pipes.
type syncBuffer struct {
	mu sync.Mutex
	b  bytes.Buffer
}

func (s *syncBuffer) Write(p []byte) (int, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.b.Write(p)
}

func (s *syncBuffer) String() string {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.b.String()
}

// Requests that arrive together on a fresh isolate all wait for the one Go program being
// started by the first of them (a promise made in one request, awaited in the others).
func TestWorkerdConcurrentFirstRequests(t *testing.T) {
	bin := needBuild(t)
	s := startWorkerd(t, bin, "")
	defer s.stop()
	want, err := api.Solubility(api.Params{"solute": "KNO3", "temp_C": "20"})
	if err != nil {
		t.Fatal(err)
	}
	const clients = 16
	var wg sync.WaitGroup
	errs := make(chan error, clients)
	for range clients {
		wg.Go(func() {
			res, err := (&http.Client{Timeout: 60 * time.Second}).Get(s.base + "/api/v1/solubility?solute=KNO3&temp_C=20")
			if err != nil {
				errs <- err
				return
			}
			got, err := io.ReadAll(res.Body)
			res.Body.Close()
			if err != nil || res.StatusCode != 200 || !bytes.Equal(got, want) {
				errs <- fmt.Errorf("%d %v %.200s", res.StatusCode, err, got)
			}
		})
	}
	wg.Wait()
	close(errs)
	for err := range errs {
		t.Error(err)
	}
	if strings.Contains(s.log.String(), "saltcast worker:") {
		t.Errorf("workerd log:\n%s", s.log.String())
	}
}
