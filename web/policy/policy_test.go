package policy

import (
	"slices"
	"strings"
	"testing"
)

// directivesOf splits a policy into its directives, keyed by name.
func directivesOf(csp string) map[string]string {
	out := map[string]string{}
	for d := range strings.SplitSeq(csp, ";") {
		d = strings.TrimSpace(d)
		name, value, _ := strings.Cut(d, " ")
		out[name] = value
	}
	return out
}

// The file and the served page share one builder: over the same scripts they differ only
// where the served page must (icons, the update check, the service worker, the manifest).
func TestFileAndServedDifferOnlyWhereServedMust(t *testing.T) {
	scripts := []string{"go();", "load();"}
	file, served := directivesOf(File(scripts...)), directivesOf(Served(scripts...))
	must := map[string]string{
		"img-src": "'self' data:", "connect-src": "'self'", "worker-src": "'self'", "manifest-src": "'self'",
	}
	if len(file)+1 != len(served) || file["manifest-src"] != "" {
		t.Fatalf("file has %d directives, served %d; want the served page's manifest-src more", len(file), len(served))
	}
	for name, fv := range file {
		sv, ok := served[name]
		switch {
		case !ok:
			t.Errorf("served policy lacks %s", name)
		case must[name] != "":
			if sv != must[name] || fv == sv {
				t.Errorf("%s: file %q, served %q; want the served page to allow %q", name, fv, sv, must[name])
			}
		case fv != sv:
			t.Errorf("%s: file %q, served %q; they must not differ", name, fv, sv)
		}
	}
	// The file may fetch nothing at all.
	for _, d := range []string{"default-src", "connect-src", "worker-src", "object-src",
		"frame-src", "form-action", "base-uri"} {
		if file[d] != "'none'" {
			t.Errorf("file %s = %q, want 'none'", d, file[d])
		}
	}
	if s := file["script-src"]; strings.Contains(s, "unsafe-inline") || strings.Contains(s, "'self'") ||
		strings.Count(s, "'sha256-") != len(scripts) {
		t.Errorf("file script-src %q: want the scripts' hashes and 'wasm-unsafe-eval' only", s)
	}
}

func TestScriptHash(t *testing.T) {
	// W3C CSP Level 3, the hash-source example: alert('Hello, world.'); hashes to
	// qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng= (from memory; openssl dgst -sha256 agrees).
	if got, want := ScriptHash("alert('Hello, world.');"), "'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"; got != want {
		t.Errorf("ScriptHash = %s, want %s", got, want)
	}
	// The HTML parser turns CR LF and lone CR into LF before the browser hashes (WHATWG HTML,
	// "preprocessing the input stream").
	if ScriptHash("a\r\nb") != ScriptHash("a\nb") || ScriptHash("a\rb") != ScriptHash("a\nb") {
		t.Error("CR LF and CR are not hashed as LF")
	}
}

func TestInlineScripts(t *testing.T) {
	for _, tt := range []struct {
		name, page string
		want       []string
	}{
		{"plain", "<script>a()</script>", []string{"a()"}},
		{"upper case, module", "<SCRIPT type=module>a()</Script >", []string{"a()"}},
		{"src script", `<script src="x.js"></script><script>b()</script>`, []string{"b()"}},
		{"empty src", `<script src>c()</script>`, nil},
		{"data blocks", `<script type="application/octet-stream" id="saltcast-wasm">AAAA</script>` +
			`<script type="application/x-saltcast-recipes">{}</script><script id="saltcast-go">go()</script>`, []string{"go()"}},
		{"not a script element", "<scripts>x</scripts>", nil},
		{"closing tag in text ends it", "<script>a('</SCRIPT>')</script>", []string{"a('"}},
		{"unterminated", "<script>alert(1)", []string{"alert(1)"}},
		{"tag never ends", "<script type='x", nil},
	} {
		if got := InlineScripts(tt.page); !slices.Equal(got, tt.want) {
			t.Errorf("%s: InlineScripts(%q) = %q, want %q", tt.name, tt.page, got, tt.want)
		}
	}
}

func FuzzInlineScripts(f *testing.F) {
	f.Add("<script>a()</script><script src=x></script>")
	f.Add("<SCRIPT type='module'>x</script")
	f.Fuzz(func(t *testing.T, page string) {
		for _, s := range InlineScripts(page) {
			if !strings.Contains(page, s) {
				t.Fatalf("script text %q is not in the page", s)
			}
		}
	})
}

// The file's policy names only directives that Chromium, Gecko and WebKit all know at the
// minimum versions the README names (Chrome 97, Firefox 102, Safari 16), so no engine logs an
// unknown directive when the file opens. The list: CSP directives that MDN browser-compat-data
// (http/headers/Content-Security-Policy.json, read 2 Dec 2026) marks as supported there, the
// last to arrive being worker-src (Safari 15.5). manifest-src is marked supported from Safari
// 11 there, but WebKitGTK 2.50 logs it as an unrecognised directive, so it stays out.
func TestFileDirectivesKnownToAllEngines(t *testing.T) {
	known := []string{"default-src", "script-src", "style-src", "img-src", "font-src", "connect-src",
		"media-src", "object-src", "frame-src", "worker-src", "form-action", "base-uri", "child-src"}
	for name := range directivesOf(File("go();")) {
		if !slices.Contains(known, name) {
			t.Errorf("the file's policy has %s, which not every engine knows", name)
		}
	}
}
