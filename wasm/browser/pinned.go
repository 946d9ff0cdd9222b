//go:build js && wasm

package main

import "syscall/js"

// Pinned strips: a screen whose results sit below its form on a portrait tablet or a phone
// keeps its key figures in a strip pinned at the top (app.css). Such a strip names the
// outcome it follows (data-of) and the key of each figure it shows (data-mirror); an
// observer copies each figure from its tile, hides it with its tile and marks the strip
// stale with the outcome, whenever the outcome changes. The screen's own code need not know
// the strip is there. (The batch screen's strip is filled by render.go, data-strip.)
func init() {
	for _, strip := range qa(doc, ".strip[data-of]") {
		outcome := byID(attr(strip, "data-of"))
		if !exists(outcome) {
			continue
		}
		update := func() {
			for _, item := range qa(strip, "[data-mirror]") {
				out := q(outcome, `output[data-key="`+attr(item, "data-mirror")+`"]`)
				show := false
				if exists(out) {
					box := out.Call("closest", ".fig")
					show = exists(box) && !box.Get("hidden").Bool()
				}
				text := "—"
				if show {
					text = out.Get("textContent").String()
				}
				setText(q(item, "b"), text)
				setHidden(item, !show)
			}
			stale := q(outcome, ".stale")
			classSet(strip, "stale", exists(stale) && !stale.Get("hidden").Bool())
		}
		observer := js.Global().Get("MutationObserver").New(js.FuncOf(func(js.Value, []js.Value) any {
			update()
			return nil
		}))
		observer.Call("observe", outcome, map[string]any{"subtree": true, "childList": true, "characterData": true,
			"attributes": true, "attributeFilter": []any{"hidden"}})
		update()
	}
}
