//go:build ignore

// gen_unpacker assembles web/unlzma.wat with binaryen's wasm-as and writes the bytes, in
// base64, into web/loader.js (the line `var UNPACKER = "...";`). Run by `go generate ./web`
// (or `make unpacker`) after changing unlzma.wat; TestLoaderUnpackerIsAssembledFromSource
// fails until it has been run.
package main

import (
	"encoding/base64"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
)

func main() {
	tmp, err := os.MkdirTemp("", "unlzma-")
	if err != nil {
		fail(err.Error())
	}
	defer os.RemoveAll(tmp)
	out := filepath.Join(tmp, "unlzma.wasm")
	if msg, err := exec.Command("wasm-as", "unlzma.wat", "-o", out).CombinedOutput(); err != nil {
		fail("wasm-as (binaryen): " + err.Error() + "\n" + string(msg))
	}
	wasm, err := os.ReadFile(out)
	if err != nil {
		fail(err.Error())
	}
	loader, err := os.ReadFile("loader.js")
	if err != nil {
		fail(err.Error())
	}
	line := regexp.MustCompile(`(?m)^  var UNPACKER = "[A-Za-z0-9+/=]*";$`)
	if len(line.FindAll(loader, -1)) != 1 {
		fail("loader.js has no single line `  var UNPACKER = \"...\";`")
	}
	loader = line.ReplaceAllLiteral(loader, []byte(`  var UNPACKER = "`+base64.StdEncoding.EncodeToString(wasm)+`";`))
	if err := os.WriteFile("loader.js", loader, 0o644); err != nil {
		fail(err.Error())
	}
	os.Stderr.WriteString("gen_unpacker: " + strconv.Itoa(len(wasm)) + " B of WebAssembly into loader.js\n")
}

func fail(msg string) {
	os.Stderr.WriteString("gen_unpacker: " + msg + "\n")
	os.Exit(1)
}
