//go:build js && wasm

package main

import (
	"strings"
	"syscall/js"

	"saltcast/core/recipe"
)

// The recipe box: recipes saved in this browser by name, export and import of recipe
// collection files, CSV of the results, and the share link.

func (a *app) bindBox() {
	on(byID("save-btn"), "click", func(js.Value, event) { a.save() })
	on(byID("saved"), "click", a.onSavedClick)
	on(byID("saved-preps"), "click", a.onSavedPrep)
	on(byID("export-one"), "click", func(js.Value, event) {
		if r, err := a.d.Recipe(); err == nil {
			setValue(byID("transfer"), string(recipe.EncodeCollection([]recipe.Recipe{r})))
			a.boxMessage("m-import", "This recipe is in the box above: copy it, or download it as a file.")
		} else {
			a.boxMessage("m-import", "The recipe on the Batch screen has an error to correct first: "+fieldMessage(err, ""))
		}
	})
	on(byID("export-all"), "click", func(js.Value, event) {
		setValue(byID("transfer"), string(a.shelf.Encode()))
		a.boxMessage("m-import", itoa(len(a.shelf.Recipes))+" saved recipes are in the box above.")
	})
	on(byID("download-json"), "click", func(js.Value, event) {
		text := value(byID("transfer"))
		if strings.TrimSpace(text) == "" {
			text = string(a.shelf.Encode())
		}
		download("saltcast-recipes.json", "application/json", text)
	})
	on(byID("import-btn"), "click", func(js.Value, event) { a.importText(value(byID("transfer"))) })
	on(byID("import-file"), "change", func(t js.Value, _ event) {
		files := t.Get("files")
		if files.Length() == 0 {
			return
		}
		var done js.Func
		done = js.FuncOf(func(_ js.Value, args []js.Value) any {
			done.Release()
			setValue(byID("transfer"), args[0].String())
			a.importText(args[0].String())
			return nil
		})
		files.Index(0).Call("text").Call("then", done)
		setValue(t, "")
	})
	on(byID("csv-btn"), "click", func(js.Value, event) {
		if a.last == nil {
			return
		}
		name := a.last.Recipe.Name
		if name == "" {
			name = "batch"
		}
		download(fileName(name)+".csv", "text/csv", CSV(a.last, a.u))
	})
	on(byID("share-btn"), "click", func(js.Value, event) { a.share() })
	on(byID("copy-link"), "click", func(js.Value, event) {
		link := byID("share-link")
		if value(link) == "" {
			a.share()
		}
		link.Call("select")
		nav := js.Global().Get("navigator")
		if cb := nav.Get("clipboard"); cb.Truthy() {
			cb.Call("writeText", value(link))
		}
	})
	a.renderShelf()
}

// save keeps the recipe on screen under the name typed (or its own name).
func (a *app) save() {
	r, err := a.d.Recipe()
	if err != nil {
		a.boxMessage("m-save", "Not saved: the recipe has an error to correct first: "+fieldMessage(err, ""))
		return
	}
	name := strings.TrimSpace(value(byID("save-name")))
	if name == "" {
		name = strings.TrimSpace(r.Name)
	}
	if name == "" {
		a.boxMessage("m-save", "Not saved: give the recipe a name.")
		return
	}
	r.Name = name
	// Check it as a stored file would be checked on the next visit.
	if _, err := recipe.Decode(r.Encode()); err != nil {
		a.boxMessage("m-save", "Not saved: "+fieldMessage(err, name))
		return
	}
	next := a.shelf
	next.Recipes = append([]recipe.Recipe(nil), a.shelf.Recipes...)
	next.Put(r)
	if !a.store.set(keyShelf, string(next.Encode())) {
		a.boxMessage("m-save", "Not saved: this browser does not let the page keep data (private window or storage full).")
		return
	}
	a.shelf = next
	a.d.Text["name"] = name
	setValue(a.inputs["name"], name)
	a.renderShelf()
	a.boxMessage("m-save", "Saved as “"+name+"”.")
	a.recompute()
}

// importText adds every recipe of a file to the shelf, or none of them.
func (a *app) importText(text string) {
	if a.importLink(text) {
		return
	}
	next := a.shelf
	next.Recipes = append([]recipe.Recipe(nil), a.shelf.Recipes...)
	n, err := next.Import([]byte(text))
	if err != nil {
		a.boxMessage("m-import", "Nothing was imported: "+err.Error())
		return
	}
	if !a.store.set(keyShelf, string(next.Encode())) {
		a.boxMessage("m-import", "Nothing was imported: this browser does not let the page keep data.")
		return
	}
	a.shelf = next
	a.renderShelf()
	a.boxMessage("m-import", "Imported "+itoa(n)+" recipe(s).")
}

func (a *app) renderShelf() {
	list := byID("saved")
	clear(list)
	setHidden(byID("saved-empty"), len(a.shelf.Recipes) > 0)
	for i, r := range a.shelf.Recipes {
		li := add(list, "li", "", "")
		add(li, "span", "nm", r.Name) // the user's text, as text
		setAttr(add(li, "span", "sum", r.Checksum()), "title", "recipe check, as printed on its batch sheet")
		open := add(li, "button", "act", "Open")
		setAttr(open, "type", "button")
		setAttr(open, "data-open", itoa(i))
		del := add(li, "button", "act danger", "Delete")
		setAttr(del, "type", "button")
		setAttr(del, "data-delete", itoa(i))
		setAttr(del, "aria-label", "Delete "+r.Name)
	}
	a.renderSavedPreps()
	// The list to send from and the "in your list" marks of received recipes follow.
	a.renderCarry()
	a.renderReceived()
}

func (a *app) onSavedClick(t js.Value, _ event) {
	b := closest(t, "button")
	if !exists(b) {
		return
	}
	idx := func(name string) int {
		s := attr(b, name)
		n := 0
		for _, c := range s {
			n = n*10 + int(c-'0')
		}
		return n
	}
	switch {
	case hasAttr(b, "data-open"):
		if i := idx("data-open"); i < len(a.shelf.Recipes) {
			r := a.shelf.Recipes[i]
			a.load(r)
			setValue(byID("save-name"), r.Name)
			a.showScreen("batch")
		}
	case hasAttr(b, "data-delete"):
		if i := idx("data-delete"); i < len(a.shelf.Recipes) {
			name := a.shelf.Recipes[i].Name
			if !win.Confirm("Delete the saved recipe “" + name + "”?") {
				return
			}
			next := a.shelf
			next.Recipes = append([]recipe.Recipe(nil), a.shelf.Recipes...)
			next.Delete(name)
			if a.store.set(keyShelf, string(next.Encode())) {
				a.shelf = next
				a.renderShelf()
				a.boxMessage("m-save", "Deleted “"+name+"”.")
			}
		}
	}
}

// share puts the recipe into the page's own link, after the #.
func (a *app) share() {
	r, err := a.d.Recipe()
	if err != nil {
		a.boxMessage("m-import", "No link: the recipe has an error to correct first.")
		return
	}
	frag := ShareFragment(r)
	js.Global().Get("history").Call("replaceState", nil, "", frag)
	link, local := shareLink(frag)
	setValue(byID("share-link"), link)
	if local {
		a.boxMessage("m-import", localLinkNote)
	}
}

// shareLink is the page's address with frag after the #. A page opened from a file gives
// frag alone: its address would show the folders of this computer and opens nowhere else.
func shareLink(frag string) (link string, local bool) {
	loc := win.Location()
	if loc.Protocol() == "file:" {
		return frag, true
	}
	base := loc.Href()
	if i := strings.IndexByte(base, '#'); i >= 0 {
		base = base[:i]
	}
	return base + frag, false
}

// localLinkNote says how the receiver uses a link made from a file.
const localLinkNote = "Opened from a file, so the link holds the recipe only (from the #), not where this file lies. " +
	"In their own copy of Saltcast the receiver pastes it into the Recipe box's text box and presses Import text, " +
	"or adds it to the end of the address."

// importLink takes in a share link pasted into the import box; it reports whether text was one.
func (a *app) importLink(text string) bool {
	text = strings.TrimSpace(text)
	i := strings.IndexByte(text, '#')
	if i < 0 || strings.ContainsAny(text, "{\n") {
		return false
	}
	if !a.openLink(text[i:]) {
		return false
	}
	a.boxMessage("m-import", "The link's recipe is open on the Batch screen (not saved: save it to keep it).")
	return true
}

func (a *app) boxMessage(id, text string) {
	if el := byID(id); exists(el) {
		setText(el, text)
	}
}

// fileName keeps letters, digits, dashes and underscores of a recipe name for a file name.
func fileName(s string) string {
	var b strings.Builder
	for _, r := range s {
		switch {
		case r >= 'a' && r <= 'z', r >= 'A' && r <= 'Z', r >= '0' && r <= '9', r == '-', r == '_':
			b.WriteRune(r)
		case r == ' ':
			b.WriteByte('-')
		}
	}
	if b.Len() == 0 {
		return "batch"
	}
	return b.String()
}
