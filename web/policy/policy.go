// Package policy builds the Content-Security-Policy of Saltcast's page, one builder for both
// of its forms: the single file opened from disk (File), which may fetch nothing at all, and
// the page the worker serves (Served), which also registers its service worker, reads its
// manifest and icons and asks its own origin for updates. Everything else is the same.
//
// Scripts run only if their SHA-256 hash is listed (W3C Content Security Policy Level 3,
// hash-source), so a script or event handler that got into the page some other way would not
// run; 'wasm-unsafe-eval' lets the page compile the inlined module and allows no other
// evaluation. Data blocks (the packed module, carried recipes) are not scripts to the browser
// and need no hash. InlineScripts finds a built page's scripts with web/htmlscan.
package policy

import (
	"crypto/sha256"
	"encoding/base64"
	"strings"

	"saltcast/web/htmlscan"
)

// directive is one policy directive and its sources in the file and in the served page; a
// directive with no file sources is left out of the file's policy.
type directive struct{ name, file, served string }

// directives in the order they are written. script-src is written apart (the hashes).
var directives = []directive{
	{"style-src", "'unsafe-inline'", "'unsafe-inline'"}, // the charts carry style attributes
	{"img-src", "data:", "'self' data:"},                // served: the home-screen icons
	{"font-src", "'none'", "'none'"},
	{"connect-src", "'none'", "'self'"}, // served: the update check of the service worker
	{"media-src", "'none'", "'none'"},
	{"object-src", "'none'", "'none'"},
	{"frame-src", "'none'", "'none'"},
	{"worker-src", "'none'", "'self'"}, // served: /sw.js
	// served: /manifest.webmanifest. Left out of the file: WebKitGTK logs manifest-src as an
	// unrecognised directive, and default-src 'none' already covers it where it is known.
	{"manifest-src", "", "'self'"},
	{"form-action", "'none'", "'none'"},
	{"base-uri", "'none'", "'none'"},
}

// File is the policy of the single file whose inline scripts are scripts (their texts, byte
// for byte): nothing may be fetched, framed, submitted or connected to.
func File(scripts ...string) string { return build(false, scripts) }

// Served is the policy of the page the worker serves, whose inline scripts (the file's and
// the install script) are scripts. It differs from File only in the served directives above.
func Served(scripts ...string) string { return build(true, scripts) }

// HeaderOnly is what the worker's response header adds to the served page's policy:
// frame-ancestors, which browsers ignore in a meta element.
const HeaderOnly = "; frame-ancestors 'none'"

func build(served bool, scripts []string) string {
	var b strings.Builder
	b.WriteString("default-src 'none'; script-src")
	for _, sc := range scripts {
		b.WriteString(" ")
		b.WriteString(ScriptHash(sc))
	}
	b.WriteString(" 'wasm-unsafe-eval'")
	for _, d := range directives {
		if !served && d.file == "" {
			continue
		}
		b.WriteString("; ")
		b.WriteString(d.name)
		b.WriteString(" ")
		if served {
			b.WriteString(d.served)
		} else {
			b.WriteString(d.file)
		}
	}
	return b.String()
}

// ScriptHash is the CSP hash-source of an inline script's text: 'sha256-…'. The HTML parser
// turns CR LF and lone CR into LF before the browser hashes, so the text is hashed that way.
func ScriptHash(text string) string {
	text = strings.ReplaceAll(strings.ReplaceAll(text, "\r\n", "\n"), "\r", "\n")
	sum := sha256.Sum256([]byte(text))
	return "'sha256-" + base64.StdEncoding.EncodeToString(sum[:]) + "'"
}

// InlineScripts returns the text of every script element of page that the browser runs: no
// src attribute, and no type or a JavaScript one. A data block (any other type: the packed
// module, carried recipes) is left out. HTML ends a script at the first "</script" whatever
// the case, so each text ends there.
func InlineScripts(page string) []string {
	var out []string
	for i := 0; i < len(page); {
		lt := strings.IndexByte(page[i:], '<')
		if lt < 0 {
			break
		}
		i += lt + 1
		name, p := htmlscan.TagName(page, i)
		if name != "script" {
			continue
		}
		_, hasSrc, _ := htmlscan.Lookup(page, p, "src")
		typ, end := htmlscan.Attr(page, p, "type")
		if end < 0 {
			break
		}
		closing := htmlscan.IndexFold(page, end, "</script")
		if closing < 0 {
			closing = len(page)
		}
		if !hasSrc && isJavaScript(typ) {
			out = append(out, page[end:closing])
		}
		i = closing
	}
	return out
}

// isJavaScript reports whether a script's type attribute makes it a classic or module script
// (HTML Living Standard, "the script element": empty, a JavaScript MIME type, or "module").
func isJavaScript(typ string) bool {
	t := strings.TrimSpace(typ)
	return t == "" || htmlscan.EqualFold(t, "text/javascript") || htmlscan.EqualFold(t, "module") ||
		htmlscan.EqualFold(t, "application/javascript")
}
