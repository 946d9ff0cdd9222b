package main

import (
	"errors"
	"io"
	"strconv"
	"strings"
	"sync"
	"unicode/utf8"

	"saltcast/core/unit"
	"saltcast/core/wire"
	"saltcast/web/api"
)

// MaxBodyBytes is the largest request body the API reads; a larger one is answered 413.
// 64 KiB holds any recipe many times over and is the limit core/wire applies to JSON too.
const MaxBodyBytes = 64 << 10

// Request is what the handler reads of an HTTP request: main_js.go fills it from the
// runtime's Request object, NewHandler (handler_http.go, host only) from net/http's. The
// worker's Go program does not link net/http: through github.com/syumai/workers it made
// app.wasm 0.8 MB larger gzipped (wasm/worker/README.md).
type Request struct {
	Method        string
	Path          string // unescaped, as net/url gives it
	RawQuery      string
	ContentLength int64 // -1 when unknown
	Header        interface{ Get(name string) string }
	Body          io.Reader // nil: the request has no body
}

// ResponseWriter takes the answer, in net/http's shape.
type ResponseWriter interface {
	Header() Header
	WriteHeader(status int)
	Write(p []byte) (int, error)
}

// Header holds response headers by name; the handler writes names in canonical case.
type Header map[string][]string

// Set replaces the values of name with value.
func (h Header) Set(name, value string) { h[name] = []string{value} }

// Add appends value to the values of name.
func (h Header) Add(name, value string) { h[name] = append(h[name], value) }

// Get returns the first value of name, or "".
func (h Header) Get(name string) string {
	if v := h[name]; len(v) > 0 {
		return v[0]
	}
	return ""
}

// The HTTP statuses the handler answers with.
const (
	statusOK                    = 200
	statusNoContent             = 204
	statusBadRequest            = 400
	statusNotFound              = 404
	statusMethodNotAllowed      = 405
	statusRequestEntityTooLarge = 413
	statusUnsupportedMediaType  = 415
	statusInternalServerError   = 500
)

// Options say what a handler serves besides the API.
type Options struct {
	// Page is the single-file app served at GET /. Empty: a page saying the app was not built.
	Page []byte

	// LoadPage, when set and Page is empty, gives Page on the first request for /: the worker
	// reads the page from the runtime then, not at start, so an API call's cold start does not
	// pay for copying and hashing 1 MB it does not serve.
	LoadPage func() []byte

	// WritePage, when set, writes the body of GET / itself and reports whether it did; the
	// worker uses it to hand the runtime its own copy of the page instead of streaming Page
	// through Go. Page is still needed: the Content-Security-Policy hashes its scripts.
	WritePage func(w ResponseWriter) bool

	// Files are served as they are, by path ("/sw.js"): the service worker, web app
	// manifest and icons that let a tablet install the app from this address and run it
	// offline (written by web/offline). None: those paths are 404.
	Files map[string]Static

	// AllowOrigin is the one origin ("https://records.example") whose web pages may call the
	// API from a browser, or "*" for any origin. Empty: CORS is off and browsers block such
	// calls (other clients are not affected: CORS binds browsers only).
	AllowOrigin string
}

// Static is one file the worker serves as it is.
type Static struct {
	Body        []byte
	ContentType string
}

// StaticType is the Content-Type of a file of the installable copy, by its name; "" for a
// kind the worker does not serve.
func StaticType(path string) string {
	switch {
	case strings.HasSuffix(path, ".js"):
		return "text/javascript; charset=utf-8"
	case strings.HasSuffix(path, ".webmanifest"):
		return "application/manifest+json"
	case strings.HasSuffix(path, ".png"):
		return "image/png"
	}
	return ""
}

// staticCSP fences in the service worker (a script run from its own response headers): it
// may fetch the app from this origin for its cache and nothing else. The other files are
// data, for which the policy changes nothing.
const staticCSP = "default-src 'none'; connect-src 'self'; frame-ancestors 'none'"

// handler routes the HTTP API onto web/api. It holds no state between requests.
type handler struct {
	opt       Options
	pageOnce  sync.Once
	page      []byte // the page served at / and its CSP, set by loadPage on first use
	pageCSP   string
	routes    map[string]route
	openapi   []byte
	allowCORS func(origin string) bool
}

// route is one path of the API: the methods it answers and what answers them.
type route struct {
	methods     string // for the Allow header, e.g. "GET, HEAD"
	serve       func(r *Request) ([]byte, error)
	contentType string // of a successful answer; "" is application/json
}

// newHandler returns the worker's HTTP handler (NewHandler adapts it to net/http on the host).
func newHandler(opt Options) *handler {
	h := &handler{opt: opt, openapi: openAPI}
	h.allowCORS = func(origin string) bool {
		return opt.AllowOrigin != "" && (opt.AllowOrigin == "*" || origin == opt.AllowOrigin)
	}
	h.routes = map[string]route{
		"/api/v1/plan":         {methods: "POST", serve: h.plan},
		"/api/v1/prep":         {methods: "POST", serve: h.prep},
		"/api/v1/solubility":   {methods: "GET, HEAD", serve: h.query(api.Solubility)},
		"/api/v1/gas":          {methods: "GET, HEAD, POST", serve: h.gas},
		"/api/v1/gas/outgas":   {methods: "GET, HEAD", serve: h.query(api.Outgas)},
		"/api/v1/gas/table":    {methods: "GET, HEAD", serve: h.query(api.GasTable)},
		"/api/v1/compounds":    {methods: "GET, HEAD", serve: func(*Request) ([]byte, error) { return api.Compounds(), nil }},
		"/api/v1/openapi.json": {methods: "GET, HEAD", serve: func(*Request) ([]byte, error) { return h.openapi, nil }},
	}
	return h
}

// Serve answers one request.
func (h *handler) Serve(w ResponseWriter, r *Request) {
	defer func() {
		// A panic here is a bug, never the user's fault; the tests assert none happens.
		if v := recover(); v != nil {
			println("saltcast worker: panic serving", r.Method, r.Path+":", panicText(v))
			writeJSON(w, statusInternalServerError,
				api.ErrorJSON(errors.New("internal error in the Saltcast worker; the request was not the cause")))
		}
	}()
	hdr := w.Header()
	hdr.Set("X-Content-Type-Options", "nosniff")
	hdr.Set("Referrer-Policy", "no-referrer")

	if r.Path == "/" {
		h.servePage(w, r)
		return
	}
	if f, ok := h.opt.Files[r.Path]; ok {
		h.serveFile(w, r, f)
		return
	}
	rt, ok := h.routes[r.Path]
	if !ok {
		writeError(w, statusNotFound, errors.New("no such address: "+r.Path+
			"; the API is described at /api/v1/openapi.json"))
		return
	}
	origin := r.Header.Get("Origin")
	cors := origin != "" && h.allowCORS(origin)
	if cors {
		if h.opt.AllowOrigin == "*" {
			hdr.Set("Access-Control-Allow-Origin", "*")
		} else {
			hdr.Set("Access-Control-Allow-Origin", origin)
			hdr.Add("Vary", "Origin")
		}
	}
	if r.Method == "OPTIONS" {
		// A CORS preflight, or a client asking what the address allows.
		hdr.Set("Allow", rt.methods+", OPTIONS")
		if cors {
			hdr.Set("Access-Control-Allow-Methods", rt.methods)
			hdr.Set("Access-Control-Allow-Headers", "Content-Type")
			hdr.Set("Access-Control-Max-Age", "86400")
		}
		w.WriteHeader(statusNoContent)
		return
	}
	if !allows(rt.methods, r.Method) {
		hdr.Set("Allow", rt.methods+", OPTIONS")
		writeError(w, statusMethodNotAllowed, errors.New("method "+strconv.Quote(r.Method)+
			" is not allowed at "+r.Path+"; allowed: "+rt.methods))
		return
	}
	body, err := rt.serve(r)
	if err != nil {
		writeError(w, statusOf(err), err)
		return
	}
	hdr.Set("Cache-Control", "no-store")
	if rt.contentType != "" {
		hdr.Set("Content-Type", rt.contentType)
		hdr.Set("Content-Length", strconv.Itoa(len(body)))
		w.WriteHeader(statusOK)
		w.Write(body)
		return
	}
	writeJSON(w, statusOK, body)
}

// loadPage sets the page served at / (Options.Page, else Options.LoadPage's, else a
// placeholder) and its Content-Security-Policy, once.
func (h *handler) loadPage() {
	h.pageOnce.Do(func() {
		h.page = h.opt.Page
		if len(h.page) == 0 && h.opt.LoadPage != nil {
			h.page = h.opt.LoadPage()
			h.opt.Page = h.page
		}
		if len(h.page) == 0 {
			h.page = []byte(placeholderPage)
		}
		h.pageCSP = pageCSP(h.page)
	})
}

// servePage answers GET / with the single-file app and the headers that fence it in.
func (h *handler) servePage(w ResponseWriter, r *Request) {
	hdr := w.Header()
	if r.Method != "GET" && r.Method != "HEAD" {
		hdr.Set("Allow", "GET, HEAD")
		writeError(w, statusMethodNotAllowed, errors.New("method "+strconv.Quote(r.Method)+
			" is not allowed at /; allowed: GET, HEAD"))
		return
	}
	h.loadPage()
	hdr.Set("Content-Type", "text/html; charset=utf-8")
	hdr.Set("Content-Security-Policy", h.pageCSP)
	hdr.Set("Cache-Control", "no-cache")
	if r.Method == "HEAD" {
		hdr.Set("Content-Length", strconv.Itoa(len(h.page)))
		w.WriteHeader(statusOK)
		return
	}
	if h.opt.WritePage != nil && len(h.opt.Page) > 0 && h.opt.WritePage(w) {
		return
	}
	hdr.Set("Content-Length", strconv.Itoa(len(h.page)))
	w.WriteHeader(statusOK)
	w.Write(h.page)
}

// serveFile answers GET of a file of the installable copy. no-cache: a browser may keep it
// but asks each time whether it changed, so a new version is seen at once (the service
// worker keeps the app for offline use, not the HTTP cache).
func (h *handler) serveFile(w ResponseWriter, r *Request, f Static) {
	hdr := w.Header()
	if r.Method != "GET" && r.Method != "HEAD" {
		hdr.Set("Allow", "GET, HEAD")
		writeError(w, statusMethodNotAllowed, errors.New("method "+strconv.Quote(r.Method)+
			" is not allowed at "+r.Path+"; allowed: GET, HEAD"))
		return
	}
	hdr.Set("Content-Type", f.ContentType)
	hdr.Set("Content-Length", strconv.Itoa(len(f.Body)))
	hdr.Set("Cache-Control", "no-cache")
	hdr.Set("Content-Security-Policy", staticCSP)
	w.WriteHeader(statusOK)
	if r.Method != "HEAD" {
		w.Write(f.Body)
	}
}

// plan answers POST /api/v1/plan: a recipe in, the plan out.
func (h *handler) plan(r *Request) ([]byte, error) {
	body, err := readBody(r)
	if err != nil {
		return nil, err
	}
	return api.Plan(body)
}

// prep answers POST /api/v1/prep: a preparation recipe in, the worked preparation out.
func (h *handler) prep(r *Request) ([]byte, error) {
	body, err := readBody(r)
	if err != nil {
		return nil, err
	}
	return api.Prep(body)
}

// query adapts a service call that takes the query string's parameters.
func (h *handler) query(call func(api.Params) ([]byte, error)) func(*Request) ([]byte, error) {
	return func(r *Request) ([]byte, error) {
		p, err := parseQuery(r.RawQuery)
		if err != nil {
			return nil, err
		}
		return call(p)
	}
}

// gas answers GET /api/v1/gas?… and POST /api/v1/gas with the same keys in a JSON object.
func (h *handler) gas(r *Request) ([]byte, error) {
	if r.Method != "POST" {
		return h.query(api.Gas)(r)
	}
	body, err := readBody(r)
	if err != nil {
		return nil, err
	}
	p, err := bodyParams(body)
	if err != nil {
		return nil, err
	}
	return api.Gas(p)
}

// maxDrainBytes bounds the bodies that are read before a 413 rather than refused on their
// declared length alone: a client still sending when the answer comes may see its connection
// closed instead of the 413 (about 1 in 200 such requests under workerd, measured).
const maxDrainBytes = 1 << 20

// errBodyTooLarge marks a body over MaxBodyBytes (413).
var errBodyTooLarge = errors.New("the request body is larger than " + strconv.Itoa(MaxBodyBytes) +
	" bytes; send one recipe of at most 64 KiB")

// errMediaType marks a body that is not declared as JSON (415).
var errMediaType = errors.New("the request body must be JSON: send Content-Type: application/json")

// readBody reads a JSON request body of at most MaxBodyBytes.
func readBody(r *Request) ([]byte, error) {
	if ct := r.Header.Get("Content-Type"); ct != "" {
		mt, _, _ := strings.Cut(ct, ";")
		if !strings.EqualFold(strings.TrimSpace(mt), "application/json") {
			return nil, errMediaType
		}
	}
	if r.ContentLength > maxDrainBytes {
		return nil, errBodyTooLarge
	}
	if r.Body == nil {
		return nil, &unit.FieldError{Field: "body", Value: "", Allowed: "a JSON object"}
	}
	body, err := io.ReadAll(io.LimitReader(r.Body, MaxBodyBytes+1))
	if err != nil {
		return nil, &unit.FieldError{Field: "body", Value: "(unreadable)", Allowed: "a JSON object"}
	}
	if len(body) > MaxBodyBytes {
		io.Copy(io.Discard, io.LimitReader(r.Body, maxDrainBytes))
		return nil, errBodyTooLarge
	}
	return body, nil
}

// splitURL gives the path (unescaped) and the raw query of an absolute URL as the runtime
// hands it over ("https://host/api/v1/gas?temp_C=20"), as net/url's Parse does for such
// URLs (TestSplitURLAsNetURL), without linking net/url, and with it fmt and reflect, into
// the worker. A path with a bad escape is kept as it came (and answered 404).
func splitURL(raw string) (path, rawQuery string) {
	raw, _, _ = strings.Cut(raw, "#")
	raw, rawQuery, _ = strings.Cut(raw, "?")
	if i := strings.Index(raw, "://"); i >= 0 {
		raw = raw[i+3:]
		if j := strings.IndexByte(raw, '/'); j >= 0 {
			raw = raw[j:]
		} else {
			raw = ""
		}
	}
	if !strings.Contains(raw, "%") {
		return raw, rawQuery
	}
	b := make([]byte, 0, len(raw))
	for i := 0; i < len(raw); i++ {
		if raw[i] != '%' {
			b = append(b, raw[i])
			continue
		}
		if i+2 >= len(raw) || unhex(raw[i+1]) < 0 || unhex(raw[i+2]) < 0 {
			return raw, rawQuery
		}
		b = append(b, byte(unhex(raw[i+1])<<4|unhex(raw[i+2])))
		i += 2
	}
	return string(b), rawQuery
}

// parseQuery decodes a query string strictly: every key once, valid percent-escapes.
func parseQuery(raw string) (api.Params, error) {
	p := api.Params{}
	for raw != "" {
		var pair string
		pair, raw, _ = strings.Cut(raw, "&")
		if pair == "" {
			continue
		}
		k, v, _ := strings.Cut(pair, "=")
		key, err := unescape(k)
		if err != nil {
			return nil, &unit.FieldError{Field: "query", Value: k, Allowed: "percent-escaped UTF-8 (%XX)"}
		}
		val, err := unescape(v)
		if err != nil {
			return nil, &unit.FieldError{Field: key, Value: v, Allowed: "percent-escaped UTF-8 (%XX)"}
		}
		if _, dup := p[key]; dup {
			return nil, &unit.FieldError{Field: key, Value: val, Allowed: "the parameter once"}
		}
		p[key] = val
	}
	return p, nil
}

// unescape decodes one query component ('+' is a space, %XX a byte) and requires UTF-8.
func unescape(s string) (string, error) {
	if !strings.ContainsAny(s, "%+") {
		if !utf8.ValidString(s) {
			return "", errBadEscape
		}
		return s, nil
	}
	b := make([]byte, 0, len(s))
	for i := 0; i < len(s); i++ {
		switch c := s[i]; c {
		case '+':
			b = append(b, ' ')
		case '%':
			if i+2 >= len(s) {
				return "", errBadEscape
			}
			hi, lo := unhex(s[i+1]), unhex(s[i+2])
			if hi < 0 || lo < 0 {
				return "", errBadEscape
			}
			b = append(b, byte(hi<<4|lo))
			i += 2
		default:
			b = append(b, c)
		}
	}
	if !utf8.ValidString(string(b)) {
		return "", errBadEscape
	}
	return string(b), nil
}

var errBadEscape = errors.New("bad escape")

func unhex(c byte) int {
	switch {
	case '0' <= c && c <= '9':
		return int(c - '0')
	case 'a' <= c && c <= 'f':
		return int(c - 'a' + 10)
	case 'A' <= c && c <= 'F':
		return int(c - 'A' + 10)
	}
	return -1
}

// bodyParams reads a JSON object of the query's keys; values are numbers or strings.
func bodyParams(body []byte) (api.Params, error) {
	v, err := wire.DecodeLimits(body, wire.Limits{MaxBytes: MaxBodyBytes, MaxDepth: 2})
	if err != nil {
		return nil, err
	}
	if v.Kind != wire.Object {
		return nil, &unit.FieldError{Field: "body", Value: v.Kind.String(), Allowed: "a JSON object of parameters"}
	}
	p := make(api.Params, len(v.Members))
	for _, m := range v.Members {
		switch m.Value.Kind {
		case wire.Number, wire.String:
			p[m.Key] = m.Value.Text
		default:
			return nil, &unit.FieldError{Field: m.Key, Value: m.Value.Kind.String(), Allowed: "a number or a string"}
		}
	}
	return p, nil
}

// statusOf maps an error from the glue or web/api to an HTTP status. Only an error that
// is neither the user's (IsInputError) nor the glue's own is a 500.
func statusOf(err error) int {
	var syn *wire.SyntaxError
	switch {
	case errors.Is(err, errBodyTooLarge):
		return statusRequestEntityTooLarge
	case errors.Is(err, errMediaType):
		return statusUnsupportedMediaType
	case errors.As(err, &syn), api.IsInputError(err):
		return statusBadRequest
	}
	var fe *unit.FieldError
	if errors.As(err, &fe) {
		return statusBadRequest
	}
	return statusInternalServerError
}

func writeError(w ResponseWriter, status int, err error) {
	w.Header().Set("Cache-Control", "no-store")
	writeJSON(w, status, api.ErrorJSON(err))
}

func writeJSON(w ResponseWriter, status int, body []byte) {
	hdr := w.Header()
	hdr.Set("Content-Type", "application/json")
	hdr.Set("Content-Length", strconv.Itoa(len(body)))
	w.WriteHeader(status)
	w.Write(body)
}

// allows reports whether methods ("GET, HEAD") lists method.
func allows(methods, method string) bool {
	for m := range strings.SplitSeq(methods, ", ") {
		if m == method {
			return true
		}
	}
	return false
}

func panicText(v any) string {
	switch v := v.(type) {
	case error:
		return v.Error()
	case string:
		return v
	}
	return "(a value that is not an error)"
}

const placeholderPage = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Saltcast: app not built</title></head>
<body><h1>Saltcast</h1><p>The single-file app was not built into this worker. Run
<code>make build worker</code> and deploy again. The JSON API under /api/v1/ works.</p></body></html>
`
