package web_test

import (
	"bytes"
	"compress/gzip"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"saltcast/web"
	"saltcast/web/policy"
	"saltcast/web/text91"
)

// The page is one self-contained file: the policy forbids every request, nothing refers to
// another file or host, and the inlined module unpacks to what went in.
func TestPageIsSelfContained(t *testing.T) {
	module := []byte("\x00asm\x01\x00\x00\x00 a stand-in for the module, not run here")
	var gz bytes.Buffer
	zw := gzip.NewWriter(&gz)
	zw.Write(module)
	zw.Close()
	wasmExec, err := os.ReadFile(filepath.Join(goroot(t), "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		t.Fatal(err)
	}
	page, err := web.Page(gz.Bytes(), string(wasmExec), `v1 <b>"&"</b>`)
	if err != nil {
		t.Fatal(err)
	}
	html := string(page)

	csp, err := web.PageCSP(page)
	if err != nil {
		t.Fatal(err)
	}
	for _, directive := range []string{"default-src 'none'", "connect-src 'none'", "form-action 'none'",
		"'wasm-unsafe-eval'", "img-src data:", "base-uri 'none'"} {
		if !strings.Contains(csp, directive) {
			t.Errorf("CSP lacks %q", directive)
		}
	}
	if strings.Contains(csp, "'unsafe-inline' 'wasm") || strings.Contains(csp, "script-src 'unsafe-inline'") {
		t.Error("CSP lets any inline script run; it should list the page's own scripts by hash")
	}
	if strings.Contains(csp, "unsafe-eval'") && !strings.Contains(csp, "'wasm-unsafe-eval'") {
		t.Error("CSP allows eval")
	}
	// Every script the page runs is listed by its hash, and nothing else is.
	scripts := regexp.MustCompile(`(?s)<script id="(saltcast-run|saltcast-go|saltcast-loader)">(.*?)</script>`).FindAllStringSubmatch(html, -1)
	if len(scripts) != 3 {
		t.Fatalf("found %d of the page's three scripts", len(scripts))
	}
	for _, m := range scripts {
		if !strings.Contains(csp, policy.ScriptHash(m[2])) {
			t.Errorf("CSP lacks the hash of script %s", m[1])
		}
	}
	if n := strings.Count(csp, "'sha256-"); n != 3 {
		t.Errorf("CSP lists %d script hashes, want 3", n)
	}
	// No element loads anything: no src or href to another file, no link or iframe. Script
	// and style contents are code, not markup, so they are left out of this look.
	markup := regexp.MustCompile(`(?s)(<script[^>]*>).*?</script>|(<style[^>]*>).*?</style>`).ReplaceAllString(html, "$1$2")
	for _, re := range []string{`(?i)<(link|iframe|object|embed|img|audio|vide[o]|source)\b`, `(?i)\ssrc\s*=`, `(?i)\shref\s*=\s*"(?:[^"#]|$)`} {
		if m := regexp.MustCompile(re).FindString(markup); m != "" {
			t.Errorf("the page refers to something outside itself: %q", m)
		}
	}
	if regexp.MustCompile(`(?i)@import|url\(`).MatchString(html) {
		t.Error("the styles load something")
	}
	if strings.Contains(html, `<b>"&"</b>`) {
		t.Error("the version text became markup")
	}

	// The module comes back byte for byte from the text block.
	m := regexp.MustCompile(`<script id="saltcast-wasm" type="application/octet-stream">([!-~]+)</script>`).FindStringSubmatch(html)
	if m == nil {
		t.Fatal("no inlined module")
	}
	raw, err := text91.Decode(m[1])
	if err != nil {
		t.Fatal(err)
	}
	zr, err := gzip.NewReader(bytes.NewReader(raw))
	if err != nil {
		t.Fatal(err)
	}
	back, err := io.ReadAll(zr)
	if err != nil || !bytes.Equal(back, module) {
		t.Errorf("the inlined module unpacks to %q, %v", back, err)
	}
}

func goroot(t *testing.T) string {
	t.Helper()
	out, err := execOutput("go", "env", "GOROOT")
	if err != nil {
		t.Fatal(err)
	}
	return strings.TrimSpace(out)
}

func execOutput(name string, args ...string) (string, error) {
	out, err := exec.Command(name, args...).Output()
	return string(out), err
}

// The hash-source of a script is base64(SHA-256(text)): W3C CSP Level 3, the hash-source
// example, alert('Hello, world.'); hashes to qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng=
// (from memory; openssl dgst -sha256 agrees). The HTML parser turns CR LF into LF before the
// browser hashes (WHATWG HTML, "preprocessing the input stream").
func TestScriptHashSpecExample(t *testing.T) {
	if got, want := policy.ScriptHash("alert('Hello, world.');"), "'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"; got != want {
		t.Errorf("ScriptHash = %s, want %s", got, want)
	}
	if policy.ScriptHash("a\r\nb") != policy.ScriptHash("a\nb") {
		t.Error("CR LF is hashed differently from LF; the browser normalises it first")
	}
}

// The page is plain ASCII (every other character written as a character reference), so mail
// gateways and editors cannot damage it and Chromium decodes it on its fast path; the
// references read back as the characters in the document. A character beyond ASCII inside a
// script or style, where a reference would stay literal, is refused.
func TestPageIsASCII(t *testing.T) {
	wasmExec, err := os.ReadFile(filepath.Join(goroot(t), "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		t.Fatal(err)
	}
	page, err := web.Page([]byte("stand-in"), string(wasmExec), "v1 °C")
	if err != nil {
		t.Fatal(err)
	}
	for i, c := range page {
		if c >= 0x80 {
			t.Fatalf("byte %d of the page is beyond ASCII: %q", i, page[max(0, i-40):min(len(page), i+10)])
		}
	}
	if !bytes.Contains(page, []byte("v1 &#176;C")) {
		t.Error("the version's ° is not written as &#176;")
	}
	for _, c := range []struct{ in, want string }{
		{`<p title="20 °C">CuSO₄·5H₂O — 5 %</p>`, `<p title="20 &#176;C">CuSO&#8324;&#183;5H&#8322;O &#8212; 5 %</p>`},
		{`<script>var a = "x";</script><b>µ</b>`, `<script>var a = "x";</script><b>&#181;</b>`},
		{`a < b`, `a < b`},
		// İ lowercases to three bytes, not two: the script after it is still found where it is.
		{`<p>İ</p><script>var a = "x";</script><b>é</b>`, `<p>&#304;</p><script>var a = "x";</script><b>&#233;</b>`},
		{`<scripted>°</scripted>`, `<scripted>&#176;</scripted>`},
	} {
		got, err := web.ASCII(c.in)
		if err != nil || string(got) != c.want {
			t.Errorf("ASCII(%q) = %q, %v; want %q", c.in, got, err, c.want)
		}
	}
	for _, bad := range []string{`<script>var a = "°";</script>`, `<STYLE>p::after{content:"—"}</STYLE>`, "<p>\xff</p>"} {
		if _, err := web.ASCII(bad); err == nil {
			t.Errorf("ASCII(%q) took a character it cannot write", bad)
		}
	}
}
