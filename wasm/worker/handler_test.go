//go:build !(js && wasm)

package main

import (
	"bytes"
	"crypto/sha256"
	"encoding/base64"
	"encoding/json"
	"io"
	"net/http"
	"net/http/httptest"
	"net/url"
	"strings"
	"testing"
)

// inProcess serves requests with h directly, as net/http would.
func inProcess(h http.Handler) func(*http.Request) (*http.Response, error) {
	return func(r *http.Request) (*http.Response, error) {
		rec := httptest.NewRecorder()
		h.ServeHTTP(rec, r)
		return rec.Result(), nil
	}
}

func TestRoutesInProcess(t *testing.T) {
	do := inProcess(NewHandler(Options{Page: []byte("<!doctype html><title>t</title>")}))
	for _, c := range apiCases(t) {
		t.Run(c.name, func(t *testing.T) { c.check(t, "http://saltcast.test", do) })
	}
}

// The limit is on the body: exactly MaxBodyBytes still reaches the recipe reader.
func TestBodyAtLimitIsRead(t *testing.T) {
	body := append([]byte(`{"notes":"`), bytes.Repeat([]byte("x"), MaxBodyBytes-len(`{"notes":""}`))...)
	body = append(body, `"}`...)
	if len(body) != MaxBodyBytes {
		t.Fatalf("body is %d bytes, want %d", len(body), MaxBodyBytes)
	}
	do := inProcess(NewHandler(Options{}))
	req := httptest.NewRequest("POST", "/api/v1/plan", bytes.NewReader(body))
	res, _ := do(req)
	if res.StatusCode != http.StatusBadRequest {
		t.Errorf("POST %d bytes: status %d, want 400 from the recipe reader (notes too long or no dissolve_temp_C)", len(body), res.StatusCode)
	}
	// A body that does not declare its length is cut at the limit all the same.
	req = httptest.NewRequest("POST", "/api/v1/plan", io.MultiReader(bytes.NewReader(body), strings.NewReader(" ")))
	req.ContentLength = -1
	res, _ = do(req)
	if res.StatusCode != http.StatusRequestEntityTooLarge {
		t.Errorf("POST %d bytes of unknown length: status %d, want 413", len(body)+1, res.StatusCode)
	}
}

func TestPage(t *testing.T) {
	page := []byte("<!doctype html><title>t</title><script>alert('Hello, world.');</script>")
	tests := []struct {
		name    string
		opt     Options
		want    []byte
		wantCSP string
	}{
		{"page", Options{Page: page}, page, "'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"},
		{"not built", Options{}, []byte(placeholderPage), "script-src 'wasm-unsafe-eval'"},
	}
	for _, tt := range tests {
		res, _ := inProcess(NewHandler(tt.opt))(httptest.NewRequest("GET", "/", nil))
		got, _ := io.ReadAll(res.Body)
		if res.StatusCode != 200 || !bytes.Equal(got, tt.want) {
			t.Errorf("%s: GET / = %d %.80q, want 200 %.80q", tt.name, res.StatusCode, got, tt.want)
		}
		h := res.Header
		if h.Get("Content-Type") != "text/html; charset=utf-8" || h.Get("X-Content-Type-Options") != "nosniff" {
			t.Errorf("%s: GET / headers %v", tt.name, h)
		}
		if csp := h.Get("Content-Security-Policy"); !strings.Contains(csp, tt.wantCSP) || !strings.Contains(csp, "default-src 'none'") {
			t.Errorf("%s: CSP %q lacks %q", tt.name, csp, tt.wantCSP)
		}
		if h.Get("Access-Control-Allow-Origin") != "" {
			t.Errorf("%s: the page carries CORS headers", tt.name)
		}
	}
}

// The runtime's own copy of the page is used when the worker offers one.
func TestPageWrittenByRuntime(t *testing.T) {
	called := false
	h := NewHandler(Options{Page: []byte("<p>x</p>"), WritePage: func(w ResponseWriter) bool {
		called = true
		w.WriteHeader(statusOK)
		io.WriteString(w, "from the runtime")
		return true
	}})
	res, _ := inProcess(h)(httptest.NewRequest("GET", "/", nil))
	got, _ := io.ReadAll(res.Body)
	if !called || string(got) != "from the runtime" || res.Header.Get("Content-Security-Policy") == "" {
		t.Errorf("GET / with WritePage: called %v, body %q, CSP %q", called, got, res.Header.Get("Content-Security-Policy"))
	}
}

func TestInlineScriptHashes(t *testing.T) {
	tests := []struct {
		name, page string
		want       []string
	}{
		// W3C CSP Level 3, the hash-source example: alert('Hello, world.'); hashes to
		// qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng= (from memory; openssl dgst -sha256 agrees).
		{"spec example", "<script>alert('Hello, world.');</script>", []string{"'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"}},
		{"upper case tags", "<SCRIPT type=module>alert('Hello, world.');</Script >", []string{"'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"}},
		// The HTML parser turns CR LF into LF before the browser hashes (WHATWG HTML, "preprocessing the input stream").
		{"CR LF", "<script>a\r\nb</script>", []string{"'sha256-" + b64sha("a\nb") + "'"}},
		{"src script not hashed", `<script src="x.js"></script><script>alert('Hello, world.');</script>`, []string{"'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='"}},
		{"not a script element", "<scripts>x</scripts>", nil},
		{"unterminated", "<script>alert(1)", []string{"'sha256-" + b64sha("alert(1)") + "'"}},
	}
	for _, tt := range tests {
		csp := pageCSP([]byte(tt.page))
		src := directive(csp, "script-src")
		for _, w := range tt.want {
			if !strings.Contains(src, w) {
				t.Errorf("%s: script-src %q lacks %s", tt.name, src, w)
			}
		}
		if n := strings.Count(src, "'sha256-"); n != len(tt.want) {
			t.Errorf("%s: script-src %q has %d hashes, want %d", tt.name, src, n, len(tt.want))
		}
		if strings.Contains(src, "unsafe-inline") || strings.Contains(src, "'self'") {
			t.Errorf("%s: script-src %q allows more than the page's own scripts", tt.name, src)
		}
	}
}

func directive(csp, name string) string {
	for d := range strings.SplitSeq(csp, ";") {
		if d = strings.TrimSpace(d); strings.HasPrefix(d, name+" ") {
			return d
		}
	}
	return ""
}

func TestCORS(t *testing.T) {
	const lab = "https://records.lab.example" // (invented)
	tests := []struct {
		name, allow, method, origin string
		wantACAO                    string
	}{
		{"off by default", "", "GET", lab, ""},
		{"allowed origin", lab, "GET", lab, lab},
		{"other origin", lab, "GET", "https://elsewhere.example", ""},
		{"any origin", "*", "GET", "https://elsewhere.example", "*"},
		{"preflight allowed", lab, "OPTIONS", lab, lab},
		{"preflight off", "", "OPTIONS", lab, ""},
	}
	for _, tt := range tests {
		h := NewHandler(Options{AllowOrigin: tt.allow})
		req := httptest.NewRequest(tt.method, "/api/v1/solubility?solute=KNO3&temp_C=20", nil)
		req.Header.Set("Origin", tt.origin)
		if tt.method == "OPTIONS" {
			req.Header.Set("Access-Control-Request-Method", "GET")
		}
		res, _ := inProcess(h)(req)
		if got := res.Header.Get("Access-Control-Allow-Origin"); got != tt.wantACAO {
			t.Errorf("%s: Access-Control-Allow-Origin %q, want %q", tt.name, got, tt.wantACAO)
		}
		if tt.wantACAO != "" && tt.wantACAO != "*" && res.Header.Get("Vary") != "Origin" {
			t.Errorf("%s: Vary %q, want Origin", tt.name, res.Header.Get("Vary"))
		}
		if tt.method == "OPTIONS" {
			wantMethods := ""
			if tt.wantACAO != "" {
				wantMethods = "GET, HEAD"
			}
			if res.StatusCode != 204 || res.Header.Get("Access-Control-Allow-Methods") != wantMethods {
				t.Errorf("%s: preflight %d, methods %q, want 204 and %q", tt.name, res.StatusCode,
					res.Header.Get("Access-Control-Allow-Methods"), wantMethods)
			}
		}
	}
}

// A panic inside a route is a bug; the answer is still JSON, and a 500.
func TestPanicIsA500(t *testing.T) {
	h := newHandler(Options{})
	h.routes["/api/v1/boom"] = route{methods: "GET", serve: func(*Request) ([]byte, error) { panic("boom") }}
	res, _ := inProcess(httpHandler{h})(httptest.NewRequest("GET", "/api/v1/boom", nil))
	body, _ := io.ReadAll(res.Body)
	if res.StatusCode != 500 || res.Header.Get("Content-Type") != "application/json" {
		t.Errorf("panicking route: %d %q", res.StatusCode, res.Header.Get("Content-Type"))
	}
	checkErrorShape(t, "panicking route", body, "")
}

func TestParseQuery(t *testing.T) {
	tests := []struct {
		raw     string
		want    map[string]string
		wantErr string // the field of the error
	}{
		{"solute=KNO3&temp_C=20", map[string]string{"solute": "KNO3", "temp_C": "20"}, ""},
		{"solute=potassium+nitrate&temp_C=20%2C5", map[string]string{"solute": "potassium nitrate", "temp_C": "20,5"}, ""},
		{"a=&&b", map[string]string{"a": "", "b": ""}, ""},
		{"", map[string]string{}, ""},
		{"solute=CuSO4%C2%B75H2O", map[string]string{"solute": "CuSO4·5H2O"}, ""},
		{"a=1&a=2", nil, "a"},
		{"a=%4", nil, "a"},
		{"a=%ff", nil, "a"}, // not UTF-8
		{"%zz=1", nil, "query"},
	}
	for _, tt := range tests {
		got, err := parseQuery(tt.raw)
		if tt.wantErr != "" {
			if err == nil || statusOf(err) != 400 || !strings.HasPrefix(err.Error(), tt.wantErr+":") {
				t.Errorf("parseQuery(%q) error = %v, want a 400 about %s", tt.raw, err, tt.wantErr)
			}
			continue
		}
		if err != nil || len(got) != len(tt.want) {
			t.Errorf("parseQuery(%q) = %v, %v, want %v", tt.raw, got, err, tt.want)
			continue
		}
		for k, v := range tt.want {
			if got[k] != v {
				t.Errorf("parseQuery(%q)[%q] = %q, want %q", tt.raw, k, got[k], v)
			}
		}
	}
}

// Property: whatever net/url encodes, parseQuery reads back unchanged; nothing panics.
func FuzzParseQuery(f *testing.F) {
	f.Add("solute", "potassium nitrate", "temp_C", "20,5")
	f.Add("a b", "%&=+", "c", "·")
	f.Fuzz(func(t *testing.T, k1, v1, k2, v2 string) {
		_, _ = parseQuery(k1 + "=" + v1 + "&" + k2) // arbitrary text: no panic
		if k1 == k2 || k1 == "" || k2 == "" || !validUTF8(k1, v1, k2, v2) {
			return
		}
		q := url.Values{k1: {v1}, k2: {v2}}
		got, err := parseQuery(q.Encode())
		if err != nil || got[k1] != v1 || got[k2] != v2 {
			t.Errorf("parseQuery(%q) = %v, %v", q.Encode(), got, err)
		}
	})
}

func validUTF8(ss ...string) bool {
	for _, s := range ss {
		if strings.ToValidUTF8(s, "") != s {
			return false
		}
	}
	return true
}

func b64sha(s string) string {
	sum := sha256.Sum256([]byte(s))
	return base64.StdEncoding.EncodeToString(sum[:])
}

var sink []byte

// BenchmarkServePlanKNO3 is the handler's own cost for one plan (the demo KNO3 recipe), with
// no runtime around it; TestFigures measures it inside workerd.
func BenchmarkServePlanKNO3(b *testing.B) {
	body := testdataFile(b, "demo-kno3-stock.json")
	h := NewHandler(Options{})
	for b.Loop() {
		rec := httptest.NewRecorder()
		h.ServeHTTP(rec, httptest.NewRequest("POST", "/api/v1/plan", bytes.NewReader(body)))
		sink = rec.Body.Bytes()
	}
}

// Property: whatever a client sends, the answer is never a 5xx and an API answer is JSON.
func FuzzHandler(f *testing.F) {
	for _, c := range apiCases(f) {
		if len(c.body) <= MaxBodyBytes {
			f.Add(c.method, c.path, c.contentType, c.body)
		}
	}
	f.Add("POST", "/api/v1/plan", "application/json", []byte(`{"custom":{"name":"x","molar_mass_g_per_mol":1e308,"points":[[0,1e-300],[1,1e300],[2,5]]},"water_g":1e-3,"dissolve_temp_C":1}`))
	f.Add("GET", "/api/v1/gas?temp_C=1e308&pressure=-0&pressure_unit=atm", "", []byte(nil))
	h := NewHandler(Options{Page: []byte("<p>page</p>")})
	f.Fuzz(func(t *testing.T, method, target, contentType string, body []byte) {
		if !strings.HasPrefix(target, "/") {
			target = "/" + target
		}
		u, err := url.ParseRequestURI(target)
		if err != nil {
			return
		}
		req := &http.Request{Method: method, URL: u, Header: http.Header{}, Body: io.NopCloser(bytes.NewReader(body)),
			ContentLength: int64(len(body)), Host: "saltcast.test"}
		if contentType != "" {
			req.Header.Set("Content-Type", contentType)
		}
		rec := httptest.NewRecorder()
		h.ServeHTTP(rec, req)
		if rec.Code >= 500 {
			t.Fatalf("%s %s (%q, %.200q): %d %s", method, target, contentType, body, rec.Code, rec.Body.Bytes())
		}
		if u.Path != "/" && rec.Code != http.StatusNoContent && !json.Valid(rec.Body.Bytes()) {
			t.Fatalf("%s %s: answer is not JSON: %.200q", method, target, rec.Body.Bytes())
		}
	})
}

// splitURL reads the URLs the runtime hands over as Go's net/url does (the reference).
func TestSplitURLAsNetURL(t *testing.T) {
	for _, raw := range []string{
		"http://saltcast.test/",
		"https://saltcast.example/api/v1/plan",
		"http://127.0.0.1:8787/api/v1/solubility?solute=KNO3&temp_C=20%2C5",
		"http://h/api/v1/gas/table?temp_to_C=30#frag",
		"http://h/api%2Fv1/plan?a=%zz",
		"http://h/api/v1/caf%C3%A9?x=1?y=2",
		"http://h/a+b/%20c",
		"http://h",
		"http://h?q=1",
		"http://user@h:1/p",
	} {
		u, err := url.Parse(raw)
		if err != nil {
			t.Fatalf("%s: %v", raw, err)
		}
		path, query := splitURL(raw)
		if path != u.Path || query != u.RawQuery {
			t.Errorf("splitURL(%q) = %q, %q; net/url: %q, %q", raw, path, query, u.Path, u.RawQuery)
		}
	}
	// A bad escape in the path, which net/url refuses, is kept as it came.
	if path, _ := splitURL("http://h/api/%zz"); path != "/api/%zz" {
		t.Errorf("bad escape: path %q", path)
	}
}

// LoadPage is read on the first request for the page, once, and never for an API call.
func TestPageLoadedOnFirstUse(t *testing.T) {
	loads := 0
	// The CSP specification's example script and its hash, as in TestInlineScriptHashes.
	page := "<!doctype html><title>t</title><script>alert('Hello, world.');</script>"
	do := inProcess(NewHandler(Options{LoadPage: func() []byte { loads++; return []byte(page) }}))
	res, _ := do(httptest.NewRequest("GET", "/api/v1/compounds", nil))
	if res.StatusCode != 200 || loads != 0 {
		t.Fatalf("API call: %d, page loaded %d times", res.StatusCode, loads)
	}
	for range 2 {
		res, _ = do(httptest.NewRequest("GET", "/", nil))
		got, _ := io.ReadAll(res.Body)
		if string(got) != page || !strings.Contains(res.Header.Get("Content-Security-Policy"), "'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='") {
			t.Errorf("GET /: body %q, CSP %q", got, res.Header.Get("Content-Security-Policy"))
		}
	}
	if loads != 1 {
		t.Errorf("page loaded %d times, want 1", loads)
	}
}
