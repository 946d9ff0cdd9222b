//go:build js && wasm

// Command browser is the bench app's program in the page (GOOS=js GOARCH=wasm). It is glue
// only: it reads the inputs, asks the core (core/recipe, core/compound, core/gas) and shows
// the answers, the chart (web/chart) and the batch sheet. No physics lives here.
//
// User text never becomes markup: names, notes and compound names are set with
// textContent; the only markup inserted is the SVG that web/chart renders, which escapes
// every piece of text it holds.
package main

import "syscall/js"

func main() {
	mark("goMain")
	a := newApp()
	a.start()
	js.Global().Call("saltcastReady")
	select {}
}

// mark notes the time (performance.now, ms) at a step of the start in the loader's marks,
// which the performance figures read (web/figures_test.go), and as a user timing mark, which
// a DevTools trace shows.
func mark(step string) {
	if m := js.Global().Get("saltcastMarks"); m.Type() == js.TypeObject {
		perf := js.Global().Get("performance")
		m.Set(step, perf.Call("now"))
		perf.Call("mark", step)
	}
}
