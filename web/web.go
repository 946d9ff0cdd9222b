// Package web writes the bench app as one offline HTML file: the Go program compiled to
// WebAssembly, gzip-compressed and base64-inlined, the Go toolchain's wasm_exec.js, and the
// HTML/CSS shell kept beside this file.
//
// The page needs no network: the module is unpacked in the browser with DecompressionStream
// and compiled from memory, and a Content-Security-Policy in the page forbids every request
// (connect-src 'none' and the rest) while allowing the inline script and the WebAssembly
// compile ('wasm-unsafe-eval', which is needed and enough).
package web

import (
	"bytes"
	"compress/gzip"
	_ "embed"
	"encoding/base64"
	"errors"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
)

//go:embed shell.html
var shellHTML string

//go:embed app.css
var appCSS string

//go:embed loader.js
var loaderJS string

// CSP is the Content-Security-Policy of the page. Everything is inline; nothing may be
// fetched, framed, submitted or connected to. 'wasm-unsafe-eval' lets the page compile the
// inlined module; no other script evaluation is allowed.
const CSP = "default-src 'none'; script-src 'unsafe-inline' 'wasm-unsafe-eval'; " +
	"style-src 'unsafe-inline'; img-src data:; font-src 'none'; connect-src 'none'; " +
	"media-src 'none'; object-src 'none'; frame-src 'none'; worker-src 'none'; " +
	"manifest-src 'none'; form-action 'none'; base-uri 'none'"

// DefaultWasmOpt is the optimisation level web/bundle uses when wasm-opt is installed.
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
}

// Report gives the sizes of each stage, in bytes.
type Report struct {
	Version   string
	WasmBytes int // after go build -ldflags "-s -w"
	OptBytes  int // after wasm-opt (equal to WasmBytes when skipped)
	GzipBytes int
	PageBytes int
	WasmOpt   string // the flag used, or "" when skipped
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

	out := filepath.Join(tmp, "app.wasm")
	args := []string{"build", "-trimpath", "-ldflags=-s -w", "-o", out, cfg.Package}
	if cfg.KeepSymbols {
		args = slices.Delete(args, 2, 3)
	}
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

	page, gz, err := Page(wasm, string(wasmExec), version)
	if err != nil {
		return nil, rep, err
	}
	rep.GzipBytes = gz
	rep.PageBytes = len(page)
	return page, rep, nil
}

// Page assembles the HTML file from a compiled module, the toolchain's wasm_exec.js and the
// version text. It also returns the size of the gzip stream it inlined.
func Page(wasm []byte, wasmExec, version string) ([]byte, int, error) {
	var gz bytes.Buffer
	zw, err := gzip.NewWriterLevel(&gz, gzip.BestCompression)
	if err != nil {
		return nil, 0, err
	}
	if _, err := zw.Write(wasm); err != nil {
		return nil, 0, err
	}
	if err := zw.Close(); err != nil {
		return nil, 0, err
	}
	for name, js := range map[string]string{"wasm_exec.js": wasmExec, "loader.js": loaderJS} {
		if strings.Contains(strings.ToLower(js), "</script") {
			return nil, 0, errors.New(name + " contains </script and cannot be inlined")
		}
	}
	if strings.Contains(strings.ToLower(appCSS), "</style") {
		return nil, 0, errors.New("app.css contains </style and cannot be inlined")
	}
	r := strings.NewReplacer(
		"{{CSP}}", CSP,
		"{{VERSION}}", htmlEscape(version),
		"{{CSS}}", appCSS,
		"{{WASM_EXEC}}", wasmExec,
		"{{LOADER}}", loaderJS,
		"{{WASM}}", base64.StdEncoding.EncodeToString(gz.Bytes()),
	)
	return []byte(r.Replace(shellHTML)), gz.Len(), nil
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
	return "version " + r.Version + ": wasm " + strconv.Itoa(r.WasmBytes) + " B (-s -w), " + opt +
		", gzip " + strconv.Itoa(r.GzipBytes) + " B, page " + strconv.Itoa(r.PageBytes) + " B"
}
