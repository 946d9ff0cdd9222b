// Command wasmpack merges the data segments of a WebAssembly module written by Go's linker
// (see saltcast/web/wasmpack); wasm/worker/build.sh runs it on the worker's module.
//
//	go run ./web/cmd/wasmpack [-gap 64] in.wasm out.wasm
package main

import (
	"flag"
	"os"
	"strconv"

	"saltcast/web/wasmpack"
)

func main() {
	gap := flag.Int("gap", wasmpack.DefaultGap, "longest run of zero bytes written out to join two segments")
	flag.Parse()
	if flag.NArg() != 2 {
		os.Stderr.WriteString("usage: wasmpack [-gap n] in.wasm out.wasm\n")
		os.Exit(2)
	}
	in, err := os.ReadFile(flag.Arg(0))
	if err != nil {
		fail(err)
	}
	out, st, err := wasmpack.Pack(in, *gap)
	if err != nil {
		fail(err)
	}
	if err := os.WriteFile(flag.Arg(1), out, 0o644); err != nil {
		fail(err)
	}
	os.Stderr.WriteString("wasmpack: " + flag.Arg(1) + ": segments " + strconv.Itoa(st.SegmentsBefore) + " → " +
		strconv.Itoa(st.SegmentsAfter) + ", " + strconv.Itoa(len(in)) + " → " + strconv.Itoa(len(out)) + " B\n")
}

func fail(err error) {
	os.Stderr.WriteString("wasmpack: " + err.Error() + "\n")
	os.Exit(1)
}
