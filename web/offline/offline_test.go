package main

import (
	"bytes"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"

	"saltcast/web"
	"saltcast/web/icons"
	"saltcast/web/policy"
)

// benchPage is the bench app's page around a stand-in module (the module does not matter
// here, and compiling it would make this test slow).
func benchPage(t *testing.T) []byte {
	t.Helper()
	out, err := exec.Command("go", "env", "GOROOT").Output()
	if err != nil {
		t.Fatal("go env GOROOT: ", err)
	}
	wasmExec, err := os.ReadFile(filepath.Join(strings.TrimSpace(string(out)), "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		t.Fatal(err)
	}
	p, err := web.Page([]byte("stand-in module"), string(wasmExec), "v1.2-3-gabc")
	if err != nil {
		t.Fatal(err)
	}
	return p
}

func TestServed(t *testing.T) {
	page := benchPage(t)
	served, err := Served(page)
	if err != nil {
		t.Fatal(err)
	}
	fileCSP, err := web.PageCSP(page)
	if err != nil {
		t.Fatal(err)
	}
	csp, err := ServedCSP(page, fileCSP)
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(csp, policy.ScriptHash(installJS)) {
		t.Error("served CSP lacks the install script's hash")
	}
	// Both policies come from web/policy, over the scripts each page holds; the worker's
	// header is the served page's policy plus policy.HeaderOnly (wasm/worker pageCSP).
	if want := policy.File(policy.InlineScripts(string(page))...); fileCSP != want {
		t.Errorf("file CSP %q is not policy.File of its scripts %q", fileCSP, want)
	}
	if want := policy.Served(policy.InlineScripts(string(served))...); csp != want {
		t.Errorf("served CSP %q is not policy.Served of the served page's scripts %q", csp, want)
	}
	s := string(served)
	for _, want := range []string{
		`<link rel="manifest" href="/manifest.webmanifest">`,
		`<link rel="apple-touch-icon" href="/icons/apple-touch-icon.png">`,
		`<meta http-equiv="Content-Security-Policy" content="` + csp + `">`,
		`<script id="saltcast-install">`,
		`sw.register("/sw.js"`,
		`<b>Add to Home Screen</b>`, // Safari's wording
		`<b>Install app</b>`,        // Chrome's and Edge's
	} {
		if strings.Count(s, want) != 1 {
			t.Errorf("served page holds %q %d times, want once", want, strings.Count(s, want))
		}
	}
	for _, want := range []string{"connect-src 'self'", "worker-src 'self'", "manifest-src 'self'", "default-src 'none'",
		"object-src 'none'", "frame-src 'none'", "base-uri 'none'", "form-action 'none'"} {
		if !strings.Contains(csp, want) {
			t.Errorf("served CSP lacks %q: %s", want, csp)
		}
	}
	if strings.Contains(s, fileCSP) {
		t.Error("served page still holds the file's CSP")
	}
	// Nothing else changed: undo the three edits and the file's page is back.
	back := strings.Replace(s, csp, fileCSP, 1)
	back = strings.Replace(back, headExtra, "", 1)
	back = strings.Replace(back, homeNote, "", 1)
	back = strings.Replace(back, `<script id="saltcast-install">`+installJS+"</script>\n", "", 1)
	if back != string(page) {
		t.Error("the served page differs from the file's in more than the CSP, the head links, the home-screen note and the install script")
	}
	// The file's page itself registers nothing and names no manifest.
	for _, never := range []string{"serviceWorker", "manifest.webmanifest", "sw.js"} {
		if bytes.Contains(page, []byte(never)) {
			t.Errorf("the file's page mentions %s", never)
		}
	}
	if _, err := Served(served); err == nil {
		t.Error("Served(served page) gave no error; the served page has no file CSP left to replace")
	}
}

func TestServiceWorkerVersion(t *testing.T) {
	page := benchPage(t)
	served, _ := Served(page)
	sw := string(ServiceWorker(served))
	if strings.Contains(sw, "{{") {
		t.Fatal("sw.js keeps a place holder")
	}
	if !strings.Contains(sw, `const VERSION = "v1.2-3-gabc-`) {
		t.Errorf("sw.js does not name the page's version:\n%s", sw[:400])
	}
	other := bytes.Replace(served, []byte("Saltcast"), []byte("SaltcasT"), 1)
	if ServiceWorker(other) == nil || string(ServiceWorker(other)) == sw {
		t.Error("a changed page gives the same sw.js, so the browser would not see an update")
	}
	hostile := bytes.Replace(served, []byte(`content="v1.2-3-gabc"`), []byte(`content="v1&quot;;alert(1)//"`), 1)
	if s := string(ServiceWorker(hostile)); strings.Contains(s, "alert(1)\"") || strings.Contains(s, `";`+"alert") {
		t.Errorf("a version text with quotes reaches sw.js as code")
	}
	if node, err := exec.LookPath("node"); err == nil {
		f := filepath.Join(t.TempDir(), "sw.js")
		os.WriteFile(f, []byte(sw), 0o644)
		if out, err := exec.Command(node, "--check", f).CombinedOutput(); err != nil {
			t.Errorf("node --check sw.js: %v\n%s", err, out)
		}
	}
}

func TestMainWritesFiles(t *testing.T) {
	page := benchPage(t)
	dir := t.TempDir()
	in := filepath.Join(dir, "saltcast.html")
	os.WriteFile(in, page, 0o644)
	out := filepath.Join(dir, "worker")
	cmd := exec.Command("go", "run", ".", "-page", in, "-out", out)
	if msg, err := cmd.CombinedOutput(); err != nil {
		t.Fatalf("go run ./web/offline: %v\n%s", err, msg)
	}
	for _, f := range []string{"saltcast.html", "sw.txt", "manifest.webmanifest", "icons/icon-192.png",
		"icons/icon-512.png", "icons/icon-maskable-512.png", "icons/apple-touch-icon.png"} {
		if fi, err := os.Stat(filepath.Join(out, f)); err != nil || fi.Size() == 0 {
			t.Errorf("%s not written: %v", f, err)
		}
	}
}

// The service worker caches exactly the files this command writes (and the page at /).
func TestServiceWorkerCachesWrittenFiles(t *testing.T) {
	start := strings.Index(serviceWorker, "const APP = [")
	end := strings.Index(serviceWorker[start:], "];")
	var cached []string
	for _, line := range strings.Split(serviceWorker[start:start+end], "\n")[1:] {
		if p := strings.Trim(strings.TrimSpace(line), `",`); p != "" {
			cached = append(cached, p)
		}
	}
	want := []string{"/", "/manifest.webmanifest"}
	for _, ic := range icons.Icons {
		want = append(want, "/icons/"+ic.Name)
	}
	if strings.Join(cached, " ") != strings.Join(want, " ") {
		t.Errorf("sw.js caches %q, want %q", cached, want)
	}
}
