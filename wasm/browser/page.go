//go:build js && wasm

package main

import (
	"syscall/js"

	"honnef.co/go/js/dom/v2"
)

// Small helpers over honnef.co/go/js/dom/v2 for what the page does often.

var (
	win = dom.GetWindow()
	doc = win.Document()
)

func byID(id string) dom.Element { return doc.GetElementByID(id) }

// value is the current value of an input, select or textarea.
func value(el dom.Element) string { return el.Underlying().Get("value").String() }

func setValue(el dom.Element, s string) { el.Underlying().Set("value", s) }

func checked(el dom.Element) bool { return el.Underlying().Get("checked").Bool() }

func setChecked(el dom.Element, b bool) { el.Underlying().Set("checked", b) }

func setHidden(el dom.Element, h bool) {
	if el != nil {
		el.Underlying().Set("hidden", h)
	}
}

// clear removes every child of el.
func clear(el dom.Element) { el.Underlying().Call("replaceChildren") }

// add appends a new element with the given tag, class and text (set as text, never markup).
func add(parent dom.Element, tag, class, text string) dom.Element {
	el := doc.CreateElement(tag)
	if class != "" {
		el.SetAttribute("class", class)
	}
	if text != "" {
		el.SetTextContent(text)
	}
	parent.AppendChild(el)
	return el
}

// fillList replaces the items of a list with one <li> per text.
func fillList(list dom.Element, items []string) {
	clear(list)
	for _, s := range items {
		add(list, "li", "", s)
	}
}

// on listens for an event on el.
func on(el dom.Element, typ string, f func(dom.Event)) {
	if el != nil {
		el.AddEventListener(typ, false, f)
	}
}

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
	if v.IsNull() || v.IsUndefined() {
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
	a := doc.CreateElement("a")
	a.SetAttribute("href", url.String())
	a.SetAttribute("download", name)
	a.(dom.HTMLElement).Click()
	var revoke js.Func
	revoke = js.FuncOf(func(js.Value, []js.Value) any {
		js.Global().Get("URL").Call("revokeObjectURL", url)
		revoke.Release()
		return nil
	})
	js.Global().Call("setTimeout", revoke, 1000)
}

// today is the local date, as the sheet prints it.
func today() string {
	return js.Global().Get("Date").New().Call("toLocaleDateString").String()
}
