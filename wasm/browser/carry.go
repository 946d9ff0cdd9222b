//go:build js && wasm

package main

import (
	"errors"
	"saltcast/web/carry"
	"strings"
	"syscall/js"

	"saltcast/core/recipe"
	"saltcast/web/pagecopy"
)

// Recipes that travel with the app: "save a copy with recipes" writes this page's own bytes
// (rebuilt from pageTemplate, see saltcast/web/pagecopy) with the chosen recipes in an inert
// block (core/carry.WithCarried); a page that carries recipes, or a file the user drops or
// picks, shows them as received, apart from the user's own list, until the user takes them in
// (core/carry.TakeIn: nothing of theirs is overwritten).

// received is what the user has been sent and not yet dismissed.
type received struct {
	from   carry.Carried
	source string // "this copy" or the file's name
}

func (a *app) bindCarry() {
	on(byID("carry-save"), "click", func(js.Value, event) { a.saveCopy() })
	on(byID("carry-all"), "change", func(t js.Value, _ event) {
		for _, el := range qa(byID("carry-pick"), "input[type=checkbox]") {
			setChecked(el, checked(t))
		}
	})
	on(byID("carry-pick"), "change", func(js.Value, event) { a.syncCarryAll() })
	on(byID("received"), "click", a.onReceivedClick)
	on(byID("take-all"), "click", func(js.Value, event) { a.takeIn(a.got.from.Recipes, a.got.from.Preps) })
	on(byID("carry-file"), "change", func(t js.Value, _ event) {
		files := t.Get("files")
		if files.Length() > 0 {
			a.readFile(files.Index(0))
		}
		setValue(t, "")
	})
	drop := byID("carry-drop")
	on(drop, "dragover", func(_ js.Value, ev event) {
		ev.PreventDefault()
		classSet(drop, "over", true)
	})
	on(drop, "dragleave", func(js.Value, event) { classSet(drop, "over", false) })
	on(drop, "drop", func(_ js.Value, ev event) {
		ev.PreventDefault()
		classSet(drop, "over", false)
		files := ev.Underlying().Get("dataTransfer").Get("files")
		if files.Length() > 0 {
			a.readFile(files.Index(0))
		}
	})
	// A file dropped beside the drop zone would make the browser open it in place of the
	// app (and lose what is typed): only the drop zone takes files.
	stray := js.FuncOf(func(_ js.Value, args []js.Value) any {
		ev := args[0]
		if !exists(closest(ev.Get("target"), "#carry-drop")) {
			ev.Call("preventDefault")
		}
		return nil
	})
	doc.Call("addEventListener", "dragover", stray)
	doc.Call("addEventListener", "drop", stray)
	on(byID("carry-note-go"), "click", func(js.Value, event) {
		a.showScreen("box")
		byID("received-panel").Call("scrollIntoView", map[string]any{"block": "start"})
	})

	// The recipes this copy of the page carries.
	if block := byID(carry.CarriedID); exists(block) {
		if text := strings.TrimSpace(block.Get("textContent").String()); text != "" {
			c, err := carry.ExtractCarried([]byte(text))
			if err != nil {
				a.boxMessage("m-received", "The recipes this copy carries could not be read, so none are shown: "+carryMessage(err))
			} else {
				a.got = &received{from: c, source: "this copy"}
				note := byID("carry-note")
				setText(byID("carry-note-text"), CarriedNote(c))
				setHidden(note, false)
			}
		}
	}
	a.renderReceived()
}

// readFile takes the recipes out of a file the user dropped or picked; nothing in it runs.
func (a *app) readFile(file js.Value) {
	name := file.Get("name").String()
	if size := file.Get("size").Int(); size > carry.MaxCarrierBytes {
		a.boxMessage("m-received", "“"+name+"” is too large ("+itoa(size>>20)+" MB) to be a Saltcast file; nothing was read.")
		return
	}
	var done, failed js.Func
	release := func() { done.Release(); failed.Release() }
	done = js.FuncOf(func(_ js.Value, args []js.Value) any {
		release()
		c, err := carry.ExtractCarried([]byte(args[0].String()))
		if err != nil {
			a.boxMessage("m-received", "Nothing was taken from “"+name+"”: "+carryMessage(err))
			return nil
		}
		a.got = &received{from: c, source: name}
		a.renderReceived()
		a.boxMessage("m-received", "“"+name+"” holds "+carriedCount(c)+": they are listed above, apart from yours.")
		return nil
	})
	failed = js.FuncOf(func(_ js.Value, args []js.Value) any {
		release()
		a.boxMessage("m-received", "“"+name+"” could not be read.")
		return nil
	})
	file.Call("text").Call("then", done, failed)
}

// saveCopy downloads this page with the ticked recipes in it.
func (a *app) saveCopy() {
	var pick []recipe.Recipe
	var picks []recipe.Prep
	for _, el := range qa(byID("carry-pick"), "input[type=checkbox]") {
		if !checked(el) {
			continue
		}
		if hasAttr(el, "data-p") {
			if i := atoi(attr(el, "data-p")); i >= 0 && i < len(a.shelf.Preps) {
				picks = append(picks, a.shelf.Preps[i])
			}
			continue
		}
		if i := atoi(attr(el, "data-i")); i >= 0 && i < len(a.shelf.Recipes) {
			pick = append(pick, a.shelf.Recipes[i])
		}
	}
	if len(pick)+len(picks) == 0 {
		a.boxMessage("m-carry", "Tick at least one recipe to send.")
		return
	}
	page, err := ownPage()
	if err != nil {
		a.boxMessage("m-carry", "No copy was saved: "+err.Error())
		return
	}
	now := js.Global().Get("Date").New()
	c := carry.Carried{
		AppVersion: strings.TrimSpace(byID("app-version").Get("textContent").String()),
		SavedAt:    UTCStamp(now.Call("toISOString").String()),
		SentBy:     strings.TrimSpace(value(byID("carry-by"))),
		Recipes:    pick,
		Preps:      picks,
	}
	out, err := carry.WithCarried(page, c)
	if err != nil {
		a.boxMessage("m-carry", "No copy was saved: "+carryMessage(err))
		return
	}
	download(CopyFileName(localDate(now)), "text/html", string(out))
	a.boxMessage("m-carry", "Saved a copy of Saltcast with "+carriedCount(c)+". Send that file; whoever opens it sees the recipes as received.")
}

// ownPage rebuilds this page's bytes from the template compiled into the program and the
// text the page's own elements hold.
func ownPage() ([]byte, error) {
	if pageTemplate == "" {
		return nil, errors.New("this build of Saltcast cannot copy itself (it was not built by web/bundle)")
	}
	tpl := pagecopy.Template(pageTemplate)
	missing := ""
	page := tpl.Join(func(id string) string {
		el := byID(id)
		if !exists(el) {
			missing = id
			return ""
		}
		return el.Get("textContent").String()
	})
	if missing != "" {
		return nil, errors.New("the page has lost its element " + missing)
	}
	return page, nil
}

// takeIn adds received recipes and preparations to the user's own list (web/carry.TakeIn,
// TakeInPreps): both or neither are kept.
func (a *app) takeIn(rs []recipe.Recipe, ps []recipe.Prep) {
	if len(rs)+len(ps) == 0 {
		return
	}
	day := localDate(js.Global().Get("Date").New())
	all, added, same := carry.TakeIn(a.shelf.Recipes, rs, day)
	allP, addedP, sameP := carry.TakeInPreps(a.shelf.Preps, ps, day)
	next := a.shelf
	next.Recipes, next.Preps = all, allP
	if !a.store.set(keyShelf, string(next.Encode())) {
		a.boxMessage("m-received", "Nothing was taken: this browser does not let the page keep data (private window or storage full).")
		return
	}
	renamed := all[len(a.shelf.Recipes):]
	renamedP := allP[len(a.shelf.Preps):]
	a.shelf = next
	a.renderShelf()
	var msg []string
	if len(rs) > 0 {
		msg = append(msg, TakeInMessage(rs, renamed, added, same))
	}
	if len(ps) > 0 {
		msg = append(msg, TakeInPrepsMessage(ps, renamedP, addedP, sameP))
	}
	a.boxMessage("m-received", strings.Join(msg, " "))
}

func (a *app) onReceivedClick(t js.Value, _ event) {
	b := closest(t, "button")
	if !exists(b) || a.got == nil {
		return
	}
	if hasAttr(b, "data-p") {
		i := atoi(attr(b, "data-p"))
		if i < 0 || i >= len(a.got.from.Preps) {
			return
		}
		p := a.got.from.Preps[i]
		switch {
		case hasAttr(b, "data-take"):
			a.takeIn(nil, []recipe.Prep{p})
		case hasAttr(b, "data-look"):
			a.loadPrep(p)
			a.showScreen("prep")
		}
		return
	}
	i := atoi(attr(b, "data-i"))
	if i < 0 || i >= len(a.got.from.Recipes) {
		return
	}
	r := a.got.from.Recipes[i]
	switch {
	case hasAttr(b, "data-take"):
		a.takeIn([]recipe.Recipe{r}, nil)
	case hasAttr(b, "data-look"):
		a.load(r)
		a.showScreen("batch")
	}
}

// renderCarry lists the saved recipes with a box to tick each.
func (a *app) renderCarry() {
	list := byID("carry-pick")
	if !exists(list) {
		return
	}
	was := map[string]bool{}
	for _, el := range qa(list, "input[type=checkbox]") {
		if checked(el) {
			was[attr(el, "data-name")] = true
		}
	}
	clear(list)
	for i, r := range a.shelf.Recipes {
		li := add(list, "li", "", "")
		lab := add(li, "label", "check", "")
		box := add(lab, "input", "", "")
		setAttr(box, "type", "checkbox")
		setAttr(box, "data-i", itoa(i))
		setAttr(box, "data-name", r.Name)
		setChecked(box, was[r.Name])
		add(lab, "span", "", r.Name) // the user's text, as text
	}
	for i, p := range a.shelf.Preps {
		li := add(list, "li", "", "")
		lab := add(li, "label", "check", "")
		box := add(lab, "input", "", "")
		setAttr(box, "type", "checkbox")
		setAttr(box, "data-p", itoa(i))
		setAttr(box, "data-name", "preparation:"+p.Name)
		setChecked(box, was["preparation:"+p.Name])
		add(lab, "span", "", "Preparation: "+p.Name) // the user's text, as text
	}
	n := len(a.shelf.Recipes) + len(a.shelf.Preps)
	setHidden(byID("carry-empty"), n > 0)
	setHidden(byID("carry-form"), n == 0)
	a.syncCarryAll()
}

func (a *app) syncCarryAll() {
	boxes := qa(byID("carry-pick"), "input[type=checkbox]")
	all := len(boxes) > 0
	for _, el := range boxes {
		all = all && checked(el)
	}
	setChecked(byID("carry-all"), all)
}

// renderReceived lists the received recipes, marking those already in the user's list.
func (a *app) renderReceived() {
	list := byID("received")
	clear(list)
	has := a.got != nil && len(a.got.from.Recipes)+len(a.got.from.Preps) > 0
	setHidden(byID("received-empty"), has)
	setHidden(byID("take-all"), !has)
	setText(byID("received-from"), "")
	if !has {
		return
	}
	setText(byID("received-from"), FromLine(a.got.from, a.got.source))
	left := 0 // received recipes not yet in the user's list
	// row lists one received item: its name as text, Open, and Take unless it is already kept.
	// attr says which list it is in: data-i for recipes, data-p for preparations.
	row := func(shown, name, attr string, i int, kept bool) {
		li := add(list, "li", "", "")
		add(li, "span", "nm", shown) // the sender's text, as text
		look := add(li, "button", "act", "Open")
		setAttr(look, "type", "button")
		setAttr(look, "data-look", "")
		setAttr(look, attr, itoa(i))
		setAttr(look, "aria-label", "Open "+name)
		if kept {
			add(li, "span", "tag", "in your list")
			return
		}
		left++
		take := add(li, "button", "act primary", "Take into my list")
		setAttr(take, "type", "button")
		setAttr(take, "data-take", "")
		setAttr(take, attr, itoa(i))
		setAttr(take, "aria-label", "Take "+name+" into my list")
	}
	for i, r := range a.got.from.Recipes {
		row(r.Name, r.Name, "data-i", i, InList(a.shelf.Recipes, r))
	}
	for i, p := range a.got.from.Preps {
		row("Preparation: "+p.Name, p.Name, "data-p", i, InListPrep(a.shelf.Preps, p))
	}
	setHidden(byID("take-all"), left == 0)
	if left == 0 {
		setHidden(byID("carry-note"), true)
	}
}

// localDate is the device's date as 2026-12-01.
func localDate(d js.Value) string {
	y, m, day := d.Call("getFullYear").Int(), d.Call("getMonth").Int()+1, d.Call("getDate").Int()
	return YMD(y, m, day)
}
