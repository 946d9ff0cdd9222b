// Command bundle writes the bench app as one offline HTML file.
//
//	go run ./web/bundle -out dist/saltcast.html
//
// It compiles ./wasm/browser for GOOS=js GOARCH=wasm with -trimpath -ldflags "-s -w" and
// -gcflags=all=-l, optionally runs Debian's wasm-opt (-wasm-opt; see web.WasmOptFlags: it
// buys under 0.2 % after gzip, so it is off by default), merges the linker's data segments
// (saltcast/web/wasmpack: 119 KB less after gzip), compresses the module with zopfli
// when installed (else compress/gzip), and inlines it as text91 text (saltcast/web/text91)
// with wasm_exec.js and the CSS into the page (see package web).
package main

import (
	"flag"
	"os"
	"os/exec"
	"path/filepath"

	"saltcast/web"
)

func main() {
	out := flag.String("out", "dist/saltcast.html", "where to write the page")
	pkg := flag.String("pkg", "./wasm/browser", "Go package to compile to WebAssembly")
	opt := flag.String("wasm-opt", "off", `wasm-opt level such as -Oz, "auto" (use `+web.DefaultWasmOpt+` when wasm-opt is installed) or "off"`)
	gz := flag.String("gzip", "", `compressor: "xz", "zopfli", "go", or "" for the best one installed`)
	version := flag.String("version", "", "version text for the page (default: git describe, then VERSION)")
	flag.Parse()

	level := *opt
	switch level {
	case "off":
		level = ""
	case "auto":
		level = ""
		if _, err := exec.LookPath("wasm-opt"); err == nil {
			level = web.DefaultWasmOpt
		}
	}
	page, rep, err := web.Build(web.Config{Package: *pkg, Version: *version, WasmOpt: level, Gzip: *gz})
	if err != nil {
		os.Stderr.WriteString("bundle: " + err.Error() + "\n")
		os.Exit(1)
	}
	if err := os.MkdirAll(filepath.Dir(*out), 0o755); err != nil {
		os.Stderr.WriteString("bundle: " + err.Error() + "\n")
		os.Exit(1)
	}
	if err := os.WriteFile(*out, page, 0o644); err != nil {
		os.Stderr.WriteString("bundle: " + err.Error() + "\n")
		os.Exit(1)
	}
	os.Stderr.WriteString("bundle: " + *out + ": " + rep.String() + "\n")
}
