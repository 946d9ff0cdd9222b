// Package web writes the bench app as one offline HTML file: the Go program compiled to
// WebAssembly, gzip-compressed and inlined as ASCII text (saltcast/web/text91), the Go
// toolchain's wasm_exec.js, and the HTML/CSS shell kept beside this file.
//
// The page needs no network: the module is unpacked in the browser (LZMA by the loader, or gzip by DecompressionStream)
// and compiled from memory, and a Content-Security-Policy in the page forbids every request
// (connect-src 'none' and the rest) while allowing its own three inline scripts, by their
// SHA-256 hashes, and the WebAssembly compile ('wasm-unsafe-eval', which is needed and enough).
package web

import (
	"bytes"
	"compress/gzip"
	_ "embed"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"unicode/utf8"

	"saltcast/web/help"
	"saltcast/web/pagecopy"
	"saltcast/web/policy"
	"saltcast/web/text91"
	"saltcast/web/wasmpack"
)

//go:embed shell.html
var shellHTML string

//go:embed app.css
var appCSS string

// loader.js carries the unpacker assembled from unlzma.wat (binaryen's wasm-as).
//
//go:generate go run gen_unpacker.go
//go:embed loader.js
var loaderJS string

// cspMetaOpen starts the page's policy element; PageCSP finds the policy by it.
const cspMetaOpen = `<meta http-equiv="Content-Security-Policy" content="`

// PageCSP returns the Content-Security-Policy a built page carries in its meta element.
func PageCSP(page []byte) (string, error) {
	s := string(page)
	i := strings.Index(s, cspMetaOpen)
	if i < 0 || strings.Count(s, cspMetaOpen) != 1 {
		return "", errors.New("the page has no single Content-Security-Policy meta element")
	}
	rest := s[i+len(cspMetaOpen):]
	end := strings.IndexByte(rest, '"')
	if end < 0 {
		return "", errors.New("the page's Content-Security-Policy meta element never ends")
	}
	return rest[:end], nil
}

// DefaultWasmOpt is the optimisation level web/bundle uses with -wasm-opt auto.
const DefaultWasmOpt = "-Oz"

// WasmOptFlags are the only feature flags Debian's binaryen wasm-opt needs to accept Go's
// output. --all-features produces a module Chromium refuses, so it is never used.
var WasmOptFlags = []string{
	"--enable-bulk-memory", "--enable-sign-ext",
	"--enable-nontrapping-float-to-int", "--enable-mutable-globals",
}

// Config says what to build.
type Config struct {
	Dir      string // module root (where go.mod is); "" means the current directory
	Package  string // Go package to compile, e.g. "./wasm/browser"
	Version  string // shown in the page and on the batch sheet; "" asks git, then VERSION
	WasmOpt  string // "" skips wasm-opt; else the optimisation flag such as "-Oz"
	GoBinary string // "" means "go"
	// KeepSymbols leaves out -ldflags "-s -w" (only to measure what stripping buys).
	KeepSymbols bool
	// KeepInlining leaves out -gcflags=all=-l (only to measure what it buys).
	KeepInlining bool
	// KeepSegments leaves the linker's data segments as they are instead of merging them
	// (saltcast/web/wasmpack; only to measure what merging buys).
	KeepSegments bool
	// Gzip is the compressor: "xz" (LZMA from the xz program, unpacked by the loader),
	// "zopfli" (gzip from the zopfli program, zopfliIterations), "go" (compress/gzip at best
	// compression) or "" for xz when it is installed, else zopfli, else go.
	Gzip string
}

// Report gives the sizes of each stage, in bytes.
type Report struct {
	Version   string
	WasmBytes int    // after go build -ldflags "-s -w"
	OptBytes  int    // after wasm-opt (equal to WasmBytes when skipped)
	PackBytes int    // after merging data segments (equal to OptBytes when skipped)
	Segments  [2]int // data segments before and after merging
	GzipBytes int
	PageBytes int
	WasmOpt   string // the flag used, or "" when skipped
	Gzip      string // the compressor used
}

// Build compiles cfg.Package for GOOS=js GOARCH=wasm and returns the whole page.
func Build(cfg Config) ([]byte, Report, error) {
	var rep Report
	gobin := cfg.GoBinary
	if gobin == "" {
		gobin = "go"
	}
	tmp, err := os.MkdirTemp("", "saltcast-bundle-")
	if err != nil {
		return nil, rep, err
	}
	defer os.RemoveAll(tmp)

	root, err := goroot(gobin)
	if err != nil {
		return nil, rep, err
	}
	wasmExec, err := os.ReadFile(filepath.Join(root, "lib", "wasm", "wasm_exec.js"))
	if err != nil {
		return nil, rep, err
	}
	version := cfg.Version
	if version == "" {
		version = Version(cfg.Dir)
	}
	rep.Version = version

	// The page's template goes into the program before it is compiled, so the running page
	// can write an exact copy of itself (saltcast/web/pagecopy). It holds no part of the
	// module, so a page around an empty module gives it.
	probe, err := Page(nil, string(wasmExec), version)
	if err != nil {
		return nil, rep, err
	}
	tpl, err := pagecopy.Cut(probe, PageParts...)
	if err != nil {
		return nil, rep, err
	}
	overlay, err := templateOverlay(gobin, cfg, tpl, tmp)
	if err != nil {
		return nil, rep, err
	}

	out := filepath.Join(tmp, "app.wasm")
	args := []string{"build", "-trimpath"}
	if !cfg.KeepSymbols {
		args = append(args, "-ldflags=-s -w")
	}
	if !cfg.KeepInlining {
		// Without inlining Go's wasm output is 7 % smaller after gzip (measured, see
		// TestFigures); the planner's arithmetic is microseconds either way.
		args = append(args, "-gcflags=all=-l")
	}
	if overlay != "" {
		args = append(args, "-overlay="+overlay)
	}
	args = append(args, "-o", out, cfg.Package)
	cmd := exec.Command(gobin, args...)
	cmd.Dir = cfg.Dir
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	if msg, err := cmd.CombinedOutput(); err != nil {
		return nil, rep, errors.New("go build " + cfg.Package + ": " + err.Error() + "\n" + string(msg))
	}
	wasm, err := os.ReadFile(out)
	if err != nil {
		return nil, rep, err
	}
	rep.WasmBytes = len(wasm)
	rep.OptBytes = len(wasm)
	if cfg.WasmOpt != "" {
		opt := filepath.Join(tmp, "opt.wasm")
		args := append([]string{cfg.WasmOpt}, WasmOptFlags...)
		args = append(args, out, "-o", opt)
		if msg, err := exec.Command("wasm-opt", args...).CombinedOutput(); err != nil {
			return nil, rep, errors.New("wasm-opt: " + err.Error() + "\n" + string(msg))
		}
		if wasm, err = os.ReadFile(opt); err != nil {
			return nil, rep, err
		}
		rep.OptBytes = len(wasm)
		rep.WasmOpt = cfg.WasmOpt
	}

	rep.PackBytes = len(wasm)
	if !cfg.KeepSegments {
		// After wasm-opt, whose memory packing would split the segments again.
		packed, st, err := wasmpack.Pack(wasm, wasmpack.DefaultGap)
		if err != nil {
			return nil, rep, err
		}
		wasm = packed
		rep.PackBytes = len(wasm)
		rep.Segments = [2]int{st.SegmentsBefore, st.SegmentsAfter}
	}

	gz, how, err := compress(wasm, cfg.Gzip, tmp)
	if err != nil {
		return nil, rep, err
	}
	rep.Gzip = how
	page, err := Page(gz, string(wasmExec), version)
	if err != nil {
		return nil, rep, err
	}
	if again, err := pagecopy.Cut(page, PageParts...); err != nil || again != tpl {
		return nil, rep, errors.New("the page's template changed once the module was in it; the page could not copy itself")
	}
	rep.GzipBytes = len(gz)
	rep.PageBytes = len(page)
	return page, rep, nil
}

// PageParts are the ids of the page's <script> and <style> elements whose text the running
// page reads back to write a copy of itself; the rest of the page is the template compiled
// into the program (see saltcast/web/pagecopy).
var PageParts = []string{"saltcast-css", "saltcast-wasm", "saltcast-go", "saltcast-loader"}

// TemplateFile is the file of the compiled package that declares pageTemplate. Build
// compiles the page's template in its place (go build -overlay); a package without the
// file (the floor program) is compiled as it is.
const TemplateFile = "pagetemplate.go"

// templateOverlay writes the Go file holding tpl and the -overlay file that puts it in
// place of cfg.Package's TemplateFile; "" when the package has no such file.
func templateOverlay(gobin string, cfg Config, tpl pagecopy.Template, tmp string) (string, error) {
	cmd := exec.Command(gobin, "list", "-f", "{{.Dir}}", cfg.Package)
	cmd.Dir = cfg.Dir
	cmd.Env = append(os.Environ(), "GOOS=js", "GOARCH=wasm")
	out, err := cmd.Output()
	if err != nil {
		return "", errors.New("go list " + cfg.Package + ": " + err.Error())
	}
	target := filepath.Join(strings.TrimSpace(string(out)), TemplateFile)
	if _, err := os.Stat(target); err != nil {
		return "", nil
	}
	src := filepath.Join(tmp, TemplateFile)
	if err := os.WriteFile(src, tpl.GoSource("main", "pageTemplate"), 0o644); err != nil {
		return "", err
	}
	overlay := filepath.Join(tmp, "overlay.json")
	js := `{"Replace":{` + jsonString(target) + `:` + jsonString(src) + `}}`
	return overlay, os.WriteFile(overlay, []byte(js), 0o644)
}

// jsonString quotes a file path for the overlay file.
func jsonString(s string) string {
	var b strings.Builder
	b.WriteByte('"')
	for _, r := range s {
		switch {
		case r == '"' || r == '\\':
			b.WriteByte('\\')
			b.WriteRune(r)
		case r < 0x20:
			b.WriteString(`\u00`)
			b.WriteByte("0123456789abcdef"[r>>4])
			b.WriteByte("0123456789abcdef"[r&0xf])
		default:
			b.WriteRune(r)
		}
	}
	b.WriteByte('"')
	return b.String()
}

// zopfliIterations: 15 iterations made the packed module 3.8 KB smaller than 1 (880 001 against
// 883 786 B; 5 gave 880 710) for 9 s more build time (measured 2 Dec 2026 on the build machine).
const zopfliIterations = 15

// compress packs the module: with xz's LZMA when asked or installed ("xz"; the loader's own
// decoder unpacks it: about a quarter smaller than the best gzip, 736 639 against 970 887 B on
// 2 Dec 2026), else gzip from zopfli when installed (about 5 % smaller than compress/gzip,
// measured), else compress/gzip at its best level.
func compress(wasm []byte, how, tmp string) ([]byte, string, error) {
	if how == "" {
		how = "go"
		if _, err := exec.LookPath("zopfli"); err == nil {
			how = "zopfli"
		}
		if _, err := exec.LookPath("xz"); err == nil {
			how = "xz"
		}
	}
	switch how {
	case "xz":
		in := filepath.Join(tmp, "x.wasm")
		if err := os.WriteFile(in, wasm, 0o644); err != nil {
			return nil, how, err
		}
		out, err := exec.Command("xz", "--format=lzma", "-9e", "--stdout", in).Output()
		if err != nil {
			return nil, how, errors.New("xz: " + err.Error())
		}
		return withSize(out, len(wasm))
	case "zopfli":
		in := filepath.Join(tmp, "z.wasm")
		if err := os.WriteFile(in, wasm, 0o644); err != nil {
			return nil, how, err
		}
		out, err := exec.Command("zopfli", "--i"+strconv.Itoa(zopfliIterations), "--gzip", "-c", in).Output()
		if err != nil {
			return nil, how, errors.New("zopfli: " + err.Error())
		}
		return out, how, nil
	case "go":
		var gz bytes.Buffer
		zw, err := gzip.NewWriterLevel(&gz, gzip.BestCompression)
		if err != nil {
			return nil, how, err
		}
		if _, err := zw.Write(wasm); err != nil {
			return nil, how, err
		}
		if err := zw.Close(); err != nil {
			return nil, how, err
		}
		return gz.Bytes(), how, nil
	}
	return nil, how, errors.New("unknown compressor " + strconv.Quote(how) + `; use "xz", "zopfli" or "go"`)
}

// withSize writes the unpacked size into an "lzma alone" header (bytes 5 to 12, little
// endian), which xz leaves as "unknown" when it ends the stream with a marker instead: the
// loader allocates the module once and stops at that size, before the marker.
func withSize(lz []byte, size int) ([]byte, string, error) {
	if len(lz) < 13 || lz[0] >= 225 {
		return nil, "xz", errors.New("xz: not an lzma alone stream")
	}
	for i := 0; i < 8; i++ {
		lz[5+i] = byte(uint64(size) >> (8 * i))
	}
	return lz, "xz", nil
}

// runMark is the page's first script, in its head: it marks the page as running scripts
// before anything is painted, so app.css shows the app and not the note on how to open the
// file (which a viewer without scripts shows instead). The loader takes the mark away when
// the app cannot start.
const runMark = `document.documentElement.setAttribute("data-run", "");`

// Page assembles the HTML file from the gzip-compressed module, the toolchain's
// wasm_exec.js and the version text.
func Page(gz []byte, wasmExec, version string) ([]byte, error) {
	for name, js := range map[string]string{"wasm_exec.js": wasmExec, "loader.js": loaderJS} {
		if strings.Contains(strings.ToLower(js), "</script") {
			return nil, errors.New(name + " contains </script and cannot be inlined")
		}
	}
	if strings.Contains(strings.ToLower(appCSS), "</style") {
		return nil, errors.New("app.css contains </style and cannot be inlined")
	}
	r := strings.NewReplacer(
		"{{CSP}}", policy.File(runMark, wasmExec, loaderJS),
		"{{RUN}}", runMark,
		"{{VERSION}}", htmlEscape(version),
		"{{CSS}}", appCSS,
		"{{HELP}}", help.HTML(),
		"{{WASM_EXEC}}", wasmExec,
		"{{LOADER}}", loaderJS,
		"{{WASM}}", text91.Encode(gz),
	)
	return ASCII(r.Replace(shellHTML))
}

// ASCII writes every character of page beyond ASCII (°, ·, —, ₂ ...) as an HTML character
// reference (&#176;), so the file is plain ASCII: it survives any mail gateway or editor, and
// Chromium decodes it on its fast path. Measured on 2026-12-02 (TestStartTrace-style trace of
// one load): with the 364 non-ASCII bytes of the shell, decoding the 1.08 MB page into text
// took 104 ms and parsing it 117 ms; the same page in ASCII 24 ms and 82 ms, because one
// non-ASCII character makes the decoder widen all the text after it. Inside <script> and
// <style> a reference would not be read as the character, so a non-ASCII character there is
// an error (write it as a \u or CSS escape).
func ASCII(page string) ([]byte, error) {
	out := make([]byte, 0, len(page)+1024)
	for i := 0; i < len(page); {
		if raw := rawTextAt(page, i); raw != "" {
			end := closeTagAt(page, i, raw)
			for k := i; k < end; k++ {
				if page[k] >= 0x80 {
					return nil, errors.New("a character beyond ASCII inside <" + raw + "> at byte " + strconv.Itoa(k) + "; write it as an escape")
				}
			}
			out = append(out, page[i:end]...)
			i = end
			continue
		}
		if c := page[i]; c < 0x80 {
			out = append(out, c)
			i++
			continue
		}
		r, n := utf8.DecodeRuneInString(page[i:])
		if r == utf8.RuneError && n <= 1 {
			return nil, errors.New("the page is not UTF-8 at byte " + strconv.Itoa(i))
		}
		out = append(out, "&#"+strconv.Itoa(int(r))+";"...)
		i += n
	}
	return out, nil
}

// rawTextAt names the element whose text is not read for character references ("script" or
// "style") when page opens one at byte i, or "". Names are matched in ASCII letter case only,
// so byte offsets stay those of page.
func rawTextAt(page string, i int) string {
	if page[i] != '<' {
		return ""
	}
	for _, name := range []string{"script", "style"} {
		j := i + 1 + len(name)
		if j < len(page) && strings.EqualFold(page[i+1:j], name) && strings.IndexByte(" \t\n\r/>", page[j]) >= 0 {
			return name
		}
	}
	return ""
}

// closeTagAt is where the element name opened at byte i ends: the byte of its "</name", or
// the end of page.
func closeTagAt(page string, i int, name string) int {
	for j := i + 1; j+2+len(name) <= len(page); j++ {
		if page[j] == '<' && page[j+1] == '/' && strings.EqualFold(page[j+2:j+2+len(name)], name) {
			return j
		}
	}
	return len(page)
}

// Version describes the source the page was built from: `git describe`, else the first line
// of a VERSION file, else "dev".
func Version(dir string) string {
	cmd := exec.Command("git", "describe", "--tags", "--always", "--dirty")
	cmd.Dir = dir
	if out, err := cmd.Output(); err == nil {
		if v := strings.TrimSpace(string(out)); v != "" {
			return v
		}
	}
	if b, err := os.ReadFile(filepath.Join(dir, "VERSION")); err == nil {
		if v, _, _ := strings.Cut(strings.TrimSpace(string(b)), "\n"); v != "" {
			return v
		}
	}
	return "dev"
}

func goroot(gobin string) (string, error) {
	out, err := exec.Command(gobin, "env", "GOROOT").Output()
	if err != nil {
		return "", errors.New("go env GOROOT: " + err.Error())
	}
	return strings.TrimSpace(string(out)), nil
}

func htmlEscape(s string) string {
	return strings.NewReplacer("&", "&amp;", "<", "&lt;", ">", "&gt;", `"`, "&quot;", "'", "&#39;").Replace(s)
}

// String formats a report for a terminal.
func (r Report) String() string {
	opt := "wasm-opt skipped"
	if r.WasmOpt != "" {
		opt = "wasm-opt " + r.WasmOpt + " " + strconv.Itoa(r.OptBytes) + " B"
	}
	pack := "segments kept"
	if r.Segments[0] > 0 {
		pack = "segments " + strconv.Itoa(r.Segments[0]) + " → " + strconv.Itoa(r.Segments[1]) + " " + strconv.Itoa(r.PackBytes) + " B"
	}
	return "version " + r.Version + ": wasm " + strconv.Itoa(r.WasmBytes) + " B, " + opt + ", " + pack +
		", gzip (" + r.Gzip + ") " + strconv.Itoa(r.GzipBytes) + " B, page " + strconv.Itoa(r.PageBytes) + " B"
}
