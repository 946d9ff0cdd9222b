// Command offline writes what the worker serves so that a tablet can install Saltcast from
// the lab's shared address and run it with no network:
//
//	go run ./web/offline -page dist/saltcast.html -out build/worker
//
// It writes, into -out:
//
//	saltcast.html          the single-file app as served: the page of -page with a web app
//	                       manifest link, an icon for iOS, the script that registers the
//	                       service worker (install.js) and the bar that asks before an update;
//	                       a note in the footer on keeping it on the home screen;
//	                       its Content-Security-Policy allows the service worker, the manifest
//	                       and requests to the same origin (connect-src, worker-src,
//	                       manifest-src 'self'), and nothing else more than the file's
//	sw.txt                 the service worker (served at /sw.js; .txt so that the worker's
//	                       bundlers import it as text), named for this page's version and
//	                       checksum
//	manifest.webmanifest   the web app manifest
//	icons/*.png            the icons drawn by saltcast/web/icons
//
// With -page "" (the app was not built) it writes everything but saltcast.html, and the
// service worker is named "unbuilt".
//
// The file that people e-mail (dist/saltcast.html) is not changed: it registers no service
// worker, names no manifest and keeps connect-src 'none'.
package main

import (
	"bytes"
	_ "embed"
	"errors"
	"flag"
	"hash/crc32"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"saltcast/web"
	"saltcast/web/icons"
	"saltcast/web/policy"
)

//go:embed sw.js
var serviceWorker string

//go:embed install.js
var installJS string

//go:embed manifest.webmanifest
var manifest []byte

// installCSS styles the bar install.js shows when a new version waits (the app's colours,
// targets of at least 44 px through the app's .act buttons).
const installCSS = `.update-bar { display: flex; flex-wrap: wrap; align-items: center; gap: 8px 12px; padding: 8px 12px;
  background: var(--warn-bg); color: var(--warn-ink); border-bottom: 3px solid var(--focus); }
.update-bar p { margin: 0; flex: 1 1 18em; font-weight: 600; }
.home-note { max-width: 46em; margin: 0 auto 8px; }
@media print { .update-bar { display: none; } }`

// headExtra goes just before </head> of the served page.
const headExtra = `<link rel="manifest" href="/manifest.webmanifest">
<meta name="theme-color" content="#0c5868">
<link rel="apple-touch-icon" href="/icons/apple-touch-icon.png">
<style id="saltcast-install-css">` + installCSS + `</style>
`

// homeNote goes at the top of the served page's footer: how to keep Saltcast on the home
// screen of a tablet or phone, where the service worker then opens it without a network.
// The file from disk has no such note: a file cannot be installed.
const homeNote = `<p class="home-note" id="home-note">To keep Saltcast on this tablet or phone for use without a
network: in Safari tap Share, then <b>Add to Home Screen</b>; in Chrome or Edge open the menu, then
<b>Install app</b> or <b>Add to Home screen</b>; in Firefox for Android open the menu, then
<b>Add to Home screen</b>. Open it from that icon: once it has loaded here, it works offline.</p>
`

// footOpen is the start of the page's footer, where homeNote goes.
const footOpen = `<footer class="foot no-print">`

// ServedCSP is the page's Content-Security-Policy when the worker serves it: policy.Served
// over the page's own inline scripts and the install script. fileCSP, the policy the page
// carries, must be policy.File over the same scripts (a page web.Page built).
func ServedCSP(page []byte, fileCSP string) (string, error) {
	scripts := policy.InlineScripts(string(page))
	if policy.File(scripts...) != fileCSP {
		return "", errors.New("the page's policy is not the file policy of its own scripts; build it with web.Page")
	}
	return policy.Served(append(scripts, installJS)...), nil
}

// Served returns the page as the worker serves it (see the package comment). page must be
// a page web.Page built: one CSP meta element with the file's policy, one </head> and one
// </body>.
func Served(page []byte) ([]byte, error) {
	fileCSP, err := web.PageCSP(page)
	if err != nil {
		return nil, err
	}
	if strings.Contains(fileCSP, "worker-src 'self'") {
		return nil, errors.New("the page is already the served page")
	}
	served, err := ServedCSP(page, fileCSP)
	if err != nil {
		return nil, err
	}
	meta := `<meta http-equiv="Content-Security-Policy" content="` + fileCSP + `">`
	if strings.Contains(strings.ToLower(installJS), "</script") {
		return nil, errors.New("install.js contains </script and cannot be inlined")
	}
	for _, tag := range []string{"</head>", "</body>", footOpen} {
		if n := bytes.Count(page, []byte(tag)); n != 1 {
			return nil, errors.New("the page has " + strconv.Itoa(n) + " " + tag + "; want 1")
		}
	}
	s := string(page)
	s = strings.Replace(s, meta, `<meta http-equiv="Content-Security-Policy" content="`+served+`">`, 1)
	s = strings.Replace(s, "</head>", headExtra+"</head>", 1)
	s = strings.Replace(s, footOpen, footOpen+homeNote, 1)
	s = strings.Replace(s, "</body>", `<script id="saltcast-install">`+installJS+"</script>\n</body>", 1)
	return []byte(s), nil
}

// ServiceWorker returns sw.js named for the served page: its version (the page's
// saltcast-version meta) and the CRC-32 of its bytes, so every new page is a new service
// worker and the browser offers it as an update.
func ServiceWorker(served []byte) []byte {
	version := "dev"
	const key = `<meta name="saltcast-version" content="`
	if i := bytes.Index(served, []byte(key)); i >= 0 {
		rest := served[i+len(key):]
		if j := bytes.IndexByte(rest, '"'); j >= 0 {
			version = string(rest[:j])
		}
	}
	// The version text is the page's (HTML-escaped, from git describe); keep only what is
	// plainly safe inside a JS string and a cache name.
	clean := strings.Map(func(r rune) rune {
		if r >= '0' && r <= '9' || r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' || r == '.' || r == '-' || r == '_' || r == '+' {
			return r
		}
		return '_'
	}, version)
	sum := strconv.FormatUint(uint64(crc32.ChecksumIEEE(served)), 16)
	return []byte(strings.Replace(serviceWorker, "{{SW_VERSION}}", clean+"-"+sum, 1))
}

func main() {
	pagePath := flag.String("page", "dist/saltcast.html", "the single-file app built by web/bundle")
	out := flag.String("out", "build/worker", "directory to write the served files into")
	flag.Parse()
	files := map[string][]byte{"manifest.webmanifest": manifest}
	if *pagePath == "" {
		files["sw.txt"] = []byte(strings.Replace(serviceWorker, "{{SW_VERSION}}", "unbuilt", 1))
	} else {
		page, err := os.ReadFile(*pagePath)
		if err != nil {
			fail(err)
		}
		served, err := Served(page)
		if err != nil {
			fail(errors.New(*pagePath + ": " + err.Error()))
		}
		files["saltcast.html"] = served
		files["sw.txt"] = ServiceWorker(served)
	}
	for _, ic := range icons.Icons {
		b, err := ic.PNG()
		if err != nil {
			fail(err)
		}
		files[filepath.Join("icons", ic.Name)] = b
	}
	if err := os.MkdirAll(filepath.Join(*out, "icons"), 0o755); err != nil {
		fail(err)
	}
	for name, b := range files {
		if err := os.WriteFile(filepath.Join(*out, name), b, 0o644); err != nil {
			fail(err)
		}
	}
	os.Stderr.WriteString("offline: " + *out + ": saltcast.html " + strconv.Itoa(len(files["saltcast.html"])) +
		" B, sw.txt, manifest, " + strconv.Itoa(len(icons.Icons)) + " icons\n")
}

func fail(err error) {
	os.Stderr.WriteString("offline: " + err.Error() + "\n")
	os.Exit(1)
}
