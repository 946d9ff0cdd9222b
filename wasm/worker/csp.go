package main

import (
	"bytes"
	"crypto/sha256"
	"encoding/base64"
	"strings"
)

// pageCSP returns the Content-Security-Policy for the single-file app: its inline scripts
// run only if their SHA-256 hashes are listed, so an injected script would not; WebAssembly
// may be compiled ('wasm-unsafe-eval', which allows nothing else); styles may be inline
// (the charts carry style attributes); images from data: and blob: URLs made in the page
// and this worker's icons; the page may call this worker's API, register its service worker
// (/sw.js) and read its web app manifest ('self'); everything else (fonts, frames, other
// workers, plugins, forms, <base>, other origins) falls back to default-src 'none'.
func pageCSP(page []byte) string {
	var b strings.Builder
	b.WriteString("default-src 'none'; script-src")
	for _, s := range inlineScripts(page) {
		// The HTML parser turns CR LF and lone CR into LF before the browser hashes.
		s = bytes.ReplaceAll(bytes.ReplaceAll(s, []byte("\r\n"), []byte("\n")), []byte("\r"), []byte("\n"))
		sum := sha256.Sum256(s)
		b.WriteString(" 'sha256-")
		b.WriteString(base64.StdEncoding.EncodeToString(sum[:]))
		b.WriteString("'")
	}
	b.WriteString(" 'wasm-unsafe-eval'; style-src 'unsafe-inline'; img-src 'self' data: blob:;" +
		" connect-src 'self'; manifest-src 'self'; worker-src 'self'; base-uri 'none'; form-action 'none';" +
		" frame-ancestors 'none'")
	return b.String()
}

// inlineScripts returns the text of every <script> element without a src attribute, byte
// for byte as the browser hashes it. HTML ends a script at the first "</script" whatever
// the case, so that is where each text ends here too.
func inlineScripts(page []byte) [][]byte {
	var out [][]byte
	rest := page
	for {
		i := indexFold(rest, "<script")
		if i < 0 {
			return out
		}
		rest = rest[i+len("<script"):]
		if len(rest) == 0 || !(rest[0] == '>' || isSpace(rest[0]) || rest[0] == '/') {
			continue // e.g. <scripts>, not a script element
		}
		end := bytes.IndexByte(rest, '>')
		if end < 0 {
			return out
		}
		tag := rest[:end]
		rest = rest[end+1:]
		closing := indexFold(rest, "</script")
		if closing < 0 {
			closing = len(rest)
		}
		if !hasAttr(tag, "src") {
			out = append(out, rest[:closing])
		}
		rest = rest[closing:]
	}
}

// hasAttr reports whether the attributes of a start tag include name (a rough reading that
// is enough for pages we build ourselves).
func hasAttr(tag []byte, name string) bool {
	for f := range strings.FieldsSeq(strings.ToLower(string(tag))) {
		if f == name || strings.HasPrefix(f, name+"=") {
			return true
		}
	}
	return false
}

func indexFold(s []byte, sub string) int {
	for i := 0; i+len(sub) <= len(s); i++ {
		if s[i] == '<' && bytes.EqualFold(s[i:i+len(sub)], []byte(sub)) {
			return i
		}
	}
	return -1
}

func isSpace(c byte) bool { return c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' }
