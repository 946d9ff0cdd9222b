//go:build !(js && wasm)

package main

import "os"

// main explains itself when the page's program is built for the host by mistake.
func main() {
	os.Stderr.WriteString("wasm/browser runs in the page: build it with `make build` (GOOS=js GOARCH=wasm via web/bundle)\n")
	os.Exit(2)
}
