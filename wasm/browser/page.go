//go:build js && wasm

package main

import (
	"strconv"
	"syscall/js"

	"honnef.co/go/js/dom/v2"
)

// The page's DOM helpers. Window, document, events and the location go through
// honnef.co/go/js/dom/v2; element reads and writes go straight to the element's js.Value.
// Calling element methods through dom.Element's interface would make the linker keep that
// method for every one of dom's hundred element types: measured, that is 2 100 extra
// functions and about 100 KB more in the gzipped page.

var (
	win = dom.GetWindow()
	doc = win.Document().Underlying()
)

func byID(id string) js.Value { return doc.Call("getElementById", id) }

func exists(v js.Value) bool { return !v.IsNull() && !v.IsUndefined() }

// q and qa are querySelector and querySelectorAll on el.
func q(el js.Value, sel string) js.Value { return el.Call("querySelector", sel) }

func qa(el js.Value, sel string) []js.Value {
	list := el.Call("querySelectorAll", sel)
	out := make([]js.Value, list.Length())
	for i := range out {
		out[i] = list.Index(i)
	}
	return out
}

func attr(el js.Value, name string) string {
	v := el.Call("getAttribute", name)
	if !exists(v) {
		return ""
	}
	return v.String()
}

func setAttr(el js.Value, name, v string) { el.Call("setAttribute", name, v) }

func hasAttr(el js.Value, name string) bool { return el.Call("hasAttribute", name).Bool() }

func closest(el js.Value, sel string) js.Value {
	if !exists(el) || el.Get("closest").IsUndefined() {
		return js.Null()
	}
	return el.Call("closest", sel)
}

func setText(el js.Value, s string) { el.Set("textContent", s) }

// setHTML inserts markup the program made itself (SVG from web/chart); never user text.
func setHTML(el js.Value, s string) { el.Set("innerHTML", s) }

// value is the current value of an input, select or textarea.
func value(el js.Value) string { return el.Get("value").String() }

func setValue(el js.Value, s string) { el.Set("value", s) }

func checked(el js.Value) bool { return el.Get("checked").Bool() }

func setChecked(el js.Value, b bool) { el.Set("checked", b) }

// setHidden, classSet and setAttrIf write only a change: the same value written again
// still counts as a mutation, and the browser restyles the element and what depends on it
// (measured: 10 such writes a keystroke on the batch screen before).
func setHidden(el js.Value, h bool) {
	if exists(el) && el.Get("hidden").Truthy() != h {
		el.Set("hidden", h)
	}
}

func classSet(el js.Value, class string, on bool) {
	list := el.Get("classList")
	if list.Call("contains", class).Bool() == on {
		return
	}
	if on {
		list.Call("add", class)
	} else {
		list.Call("remove", class)
	}
}

func setAttrIf(el js.Value, name, v string) {
	if cur := el.Call("getAttribute", name); cur.Type() != js.TypeString || cur.String() != v {
		el.Call("setAttribute", name, v)
	}
}

// clear removes every child of el.
func clear(el js.Value) { el.Call("replaceChildren") }

// add appends a new element with the given tag, class and text (set as text, never markup).
// addFigure adds a result tile labelled for screen readers: the tile is a group named by its
// label, so the number inside is read with what it means.
func addFigure(parent js.Value, label string) js.Value {
	box := add(parent, "div", "fig", "")
	setAttr(box, "role", "group")
	setAttr(box, "aria-label", label)
	setAttr(add(box, "span", "lbl", label), "aria-hidden", "true")
	return box
}

func add(parent js.Value, tag, class, text string) js.Value {
	el := doc.Call("createElement", tag)
	if class != "" {
		el.Set("className", class)
	}
	if text != "" {
		el.Set("textContent", text)
	}
	parent.Call("appendChild", el)
	return el
}

// fillList replaces the items of a list with one <li> per text.
func fillList(list js.Value, items []string) {
	clear(list)
	for _, s := range items {
		add(list, "li", "", s)
	}
}

// on listens for an event on el (an element, the document or the window); f gets the
// element the event happened on. The listener is a plain js.Func: dom/v2's AddEventListener
// wraps every event in one of its forty event types, and that switch alone kept all of them,
// and package time, in the page (measured: see DEVELOPERS.md).
func on(el js.Value, typ string, f func(target js.Value, ev event)) {
	if !exists(el) {
		return
	}
	el.Call("addEventListener", typ, js.FuncOf(func(_ js.Value, args []js.Value) any {
		ev := event{args[0]}
		f(ev.Get("target"), ev)
		return nil
	}))
}

// event is a DOM event as a listener sees it.
type event struct{ js.Value }

func (ev event) PreventDefault() { ev.Call("preventDefault") }

// Underlying is the event's js.Value (as dom/v2's events have it).
func (ev event) Underlying() js.Value { return ev.Value }

// storage wraps localStorage; a browser that refuses it (private mode, file:// rules) makes
// every call a no-op that reports failure rather than a panic.
type storage struct{}

func (storage) get(key string) (s string, ok bool) {
	defer func() {
		if recover() != nil {
			s, ok = "", false
		}
	}()
	v := js.Global().Get("localStorage").Call("getItem", key)
	if !exists(v) {
		return "", false
	}
	return v.String(), true
}

func (storage) set(key, val string) (ok bool) {
	defer func() {
		if recover() != nil {
			ok = false
		}
	}()
	js.Global().Get("localStorage").Call("setItem", key, val)
	return true
}

// download offers text as a file to save, made in the page (a blob: URL, no request).
func download(name, mime, text string) {
	blob := js.Global().Get("Blob").New([]any{text}, map[string]any{"type": mime})
	url := js.Global().Get("URL").Call("createObjectURL", blob)
	a := doc.Call("createElement", "a")
	a.Set("href", url)
	a.Set("download", name)
	a.Call("click")
	var revoke js.Func
	revoke = js.FuncOf(func(js.Value, []js.Value) any {
		js.Global().Get("URL").Call("revokeObjectURL", url)
		revoke.Release()
		return nil
	})
	js.Global().Call("setTimeout", revoke, 1000)
}

// today is the local date as YYYY-MM-DD (ISO 8601), as the sheet and the bottle label print
// it: a month/day date reads the wrong way round in half the world.
func today() string {
	d := js.Global().Get("Date").New()
	two := func(n int) string {
		if n < 10 {
			return "0" + strconv.Itoa(n)
		}
		return strconv.Itoa(n)
	}
	return strconv.Itoa(d.Call("getFullYear").Int()) + "-" + two(d.Call("getMonth").Int()+1) + "-" + two(d.Call("getDate").Int())
}
