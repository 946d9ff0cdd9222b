//go:build js && wasm

package main

import (
	"errors"
	"runtime"
	"strings"
	"syscall/js"

	"saltcast/core/compound"
	"saltcast/core/recipe"
	"saltcast/core/recipe/demo"
	"saltcast/core/unit"
	"saltcast/web/chart"
)

// localStorage keys.
const (
	keyShelf   = "saltcast.recipes" // the saved recipes, as a recipe collection file
	keyCurrent = "saltcast.current" // the recipe on screen, so a reload keeps the work
	keyUnits   = "saltcast.units"   // "C g mL"
)

type app struct {
	u     Units
	d     *Draft
	store storage
	shelf Shelf

	got  *received      // recipes received and not yet taken in (carry.go)
	last *recipe.Result // the last good plan, kept on screen while an input is wrong
	// The batch chart: what builds and draws it, the drawing #chart shows (when chartShown) and the
	// whole SVG of #chart once asked for (lastSVG), or its placeholder.
	chartC     chart.SolubilityCache
	chartR     chart.Renderer
	chartD     chart.Drawing
	chartShown bool
	chartSVG   string
	planErr    string // the field that the last plan error is shown beside
	compound   *compound.Compound

	shown      map[string]string // what parts of the page show now (see changed)
	sheetDirty bool              // the batch sheet shows an older plan
	sheetIdle  js.Func           // sheetIfDirty, for the browser's idle callbacks (sheetWhenIdle)
	onSheet    bool              // the batch sheet is the screen shown (showScreen)

	current       recipe.Recipe // the recipe last planned
	currentQueued bool          // keepCurrent will run
	rehearsing    bool          // recompute runs as a rehearsal (rehearse)
	rehearsals    int           // rehearsals still to run
	stale         bool          // the results on screen are not of the inputs (setStale)
	sinceGC       int           // plans since the last collection in idle time
	gcQueued      bool          // collectWhenIdle has asked for an idle period
	starting      bool          // the first plan is being shown: drawings wait (renderDrawings)
	prog          progTable     // the cooling programme on the batch screen
	progKinds     []js.Value    // its linear/cubic choice
	gasShown      bool          // the gas screen has been opened, so it follows the unit switch
	pending       []func()
	tick          js.Func

	recipeForm js.Value
	inputs     map[string]js.Value // recipe inputs by name
	msgs       map[string]js.Value // the message beside each input
	tiles      []tile              // one per Figure
	strip      []stripOut          // the figures of the pinned result strip
}

// tile is where one Figure shows on the batch screen.
type tile struct {
	fig  Figure
	out  js.Value // the element with data-key
	unit js.Value // the unit beside it, if any
	box  js.Value // the tile to hide when the plan has no such figure
	own  bool     // box is this figure's own tile (not the tile of another it sits in)
	text js.Value // out's text node, once written (setOut)
}

// setOut shows text in el, a figure's output on the batch screen or in its result strip,
// through el's own text node (node, made on the first write). Later writes change the node's
// data, so a new number is a change of text, not of the page's nodes (cheaper to restyle).
// Only setOut writes these outputs: another write would leave node out of the page.
func setOut(el js.Value, node *js.Value, text string) {
	if exists(*node) {
		node.Set("data", text)
		return
	}
	*node = doc.Call("createTextNode", text)
	setText(el, "")
	el.Call("appendChild", *node)
}

// stripOut is one figure in the result strip pinned under the tabs.
type stripOut struct {
	key  string // the Figure's key (data-strip)
	el   js.Value
	text js.Value
}

func newApp() *app {
	return &app{u: DefaultUnits, d: NewDraft(), inputs: map[string]js.Value{}, msgs: map[string]js.Value{}}
}

func (a *app) start() {
	a.recipeForm = byID("recipe")
	for _, el := range qa(a.recipeForm, "[name]") {
		name := attr(el, "name")
		if Known(name) {
			a.inputs[name] = el
			a.msgs[name] = byID("m-" + name)
		}
	}
	a.bindTiles()
	a.loadUnits()

	shelfRead := true // nothing stored, or read: the box may be written
	if s, ok := a.store.get(keyShelf); ok {
		if sh, err := LoadShelf(s); err == nil {
			a.shelf = sh
		} else {
			shelfRead = false
			a.boxMessage("m-save", "The saved recipes in this browser could not be read ("+err.Error()+"); they are left as they were.")
		}
	}
	if shelfRead {
		a.adoptOldPreps()
	}

	// The recipe to start with: a share link, else the last one on screen, else a demo.
	start, err := demo.Recipe(demo.All[0].Key)
	if err != nil {
		a.showPlanError(err)
	}
	if r, ok, err := FromFragment(win.Location().Hash()); ok {
		if err == nil {
			start = r
		} else {
			a.boxMessage("m-import", "The link's recipe could not be read: "+err.Error())
		}
	} else if s, ok := a.store.get(keyCurrent); ok {
		if r, err := recipe.Decode([]byte(s)); err == nil {
			start = r
		}
	}

	on(a.recipeForm, "input", a.onRecipeInput)
	a.tick = js.FuncOf(func(js.Value, []js.Value) any {
		p := a.pending
		a.pending = nil
		for _, f := range p {
			f()
		}
		return nil
	})
	mark("goBound")
	a.starting = true
	a.load(start)
	a.starting = false
	mark("goPlanned")
	a.openPrepLink(win.Location().Hash())
	// What the first result does not need waits until it is painted: the tabs', buttons' and
	// printing's listeners, the recipe box and the copies to carry (their lists and buttons);
	// then the page says it is settled (data-settled), which the browser tests wait for.
	a.later(a.bindControls)
	a.later(a.bindBox)
	a.later(a.bindCarry)
	a.later(func() { setAttr(doc.Get("documentElement"), "data-settled", "") })
	a.later(a.startRehearsal)
	// A link pasted into the address bar of a tab that already shows Saltcast changes only
	// the part after the #: the page reads it then too.
	on(js.Global(), "hashchange", func(js.Value, event) { a.openLink(win.Location().Hash()) })
}

// bindControls listens to the unit choice, the screens' tabs, the demo and fresh-batch
// buttons, the programme's choice and printing. start runs it in the task after the first
// result; the recipe form itself is listened to from the start, so nothing typed is missed.
func (a *app) bindControls() {
	on(a.recipeForm, "submit", func(_ js.Value, ev event) { ev.PreventDefault() })
	on(byID("units"), "change", a.onUnits)
	for _, b := range qa(doc, ".screens [data-screen]") {
		b := b
		on(b, "click", func(js.Value, event) { a.showScreen(attr(b, "data-screen")) })
	}
	for _, b := range qa(doc, "[data-demo]") {
		b := b
		on(b, "click", func(js.Value, event) {
			if r, err := demo.Recipe(attr(b, "data-demo")); err == nil {
				a.load(r)
			} else {
				a.showPlanError(err)
			}
		})
	}
	on(byID("new-batch"), "click", func(js.Value, event) { a.freshBatch() })
	on(byID("solute-matches"), "click", a.onPickMatch)
	for _, el := range qa(doc, `[name="programme_kind"]`) {
		on(el, "change", func(js.Value, event) { a.renderProgramme() })
	}
	for _, b := range qa(doc, "[data-print]") {
		b := b
		on(b, "click", func(js.Value, event) { a.print(attr(b, "data-print")) })
	}
	on(js.Global(), "beforeprint", func(js.Value, event) {
		a.sheetIfDirty()
		setText(byID("s-date"), today())
	})
	// Print media emulated or chosen without beforeprint (some print paths) still get a
	// current sheet.
	if mq := js.Global().Call("matchMedia", "print"); exists(mq) {
		var f js.Func
		f = js.FuncOf(func(js.Value, []js.Value) any { a.sheetIfDirty(); return nil })
		mq.Call("addEventListener", "change", f)
	}
	on(js.Global(), "afterprint", func(js.Value, event) {
		classSet(doc.Get("body"), "print-gas", false)
		classSet(doc.Get("body"), "print-labels", false)
	})
}

// openLink loads the recipe or preparation a share link carries (hash is from the # on);
// it reports whether the text was such a link.
func (a *app) openLink(hash string) bool {
	if r, ok, err := FromFragment(hash); ok {
		a.showScreen("batch")
		if err == nil {
			a.load(r)
		} else {
			a.boxMessage("m-import", "The link's recipe could not be read: "+err.Error())
		}
		return true
	}
	return a.openPrepLink(hash)
}

func (a *app) openPrepLink(hash string) bool {
	p, ok, err := PrepFromFragment(hash)
	if !ok {
		return false
	}
	a.showScreen("prep")
	if err == nil {
		a.loadPrep(p)
	} else {
		setText(byID("m-prep-import"), "The link's preparation could not be read: "+err.Error())
	}
	return true
}

// rehearsalRuns is how many times the recompute is rehearsed after the start: enough for the
// browser to have compiled and optimised the code a keystroke runs, which it does only once
// that code has run a while (the figures are in DEVELOPERS.md, "Decisions measured").
const rehearsalRuns = 60

// startRehearsal begins rehearsing the recompute in the browser's idle time.
func (a *app) startRehearsal() {
	a.rehearsals = rehearsalRuns
	var step js.Func
	next := func() { whenIdle(step) }
	step = js.FuncOf(func(_ js.Value, args []js.Value) any {
		// An idle period too short for a recompute (about 5 ms) is left to the browser.
		if len(args) > 0 && args[0].Type() == js.TypeObject && !args[0].Get("didTimeout").Truthy() &&
			args[0].Call("timeRemaining").Float() < 8 {
			next()
			return nil
		}
		if a.rehearse() && a.rehearsals > 0 {
			next()
		} else {
			step.Release()
			mark("goRehearsed")
			if m := js.Global().Get("saltcastMarks"); m.Type() == js.TypeObject {
				m.Set("rehearsals", rehearsalRuns-a.rehearsals) // how many ran (tests read it)
			}
		}
		return nil
	})
	next()
}

// rehearse runs the recompute of the recipe on screen once more, as a keystroke does, so the
// browser compiles and optimises that code before someone types rather than on their first
// keystrokes. Nothing on the page changes: the box's own text read again gives the same plan,
// whose figures and chart render leaves alone (changed, drawChart), and a rehearsal neither
// stores the recipe nor redraws the sheet. It reports whether to go on: not while the results
// are stale (an input or the plan has an error, and a keystroke then takes another path), and
// not once the runs are done.
func (a *app) rehearse() bool {
	if a.stale || len(a.d.Errs) > 0 || a.last == nil || a.rehearsals <= 0 {
		return false
	}
	a.rehearsals--
	a.rehearsing = true
	// As if the text of a temperature box were typed again: the input handler, the plan, the
	// figures; then the chart, which a change of the cooling end redraws.
	if el, ok := a.inputs[rehearsedInputs[a.rehearsals%len(rehearsedInputs)]]; ok {
		a.onRecipeInput(el, event{})
	} else {
		a.recompute()
	}
	if !a.stale && a.last != nil {
		a.drawChart(a.last)
	}
	a.rehearsing = false
	return true
}

// rehearsedInputs are the boxes whose input a rehearsal replays: numbers typed often, each
// taking the form's common path (no unit switch, no compound look-up).
var rehearsedInputs = [...]string{"cool_to_C", "dissolve_temp_C"}

// plansPerGC is how many plans collectWhenIdle lets pass before it collects: a keystroke's
// plan, figures and chart leave about 45 KB of garbage, the batch sheet redrawn after it
// another 0.24 MB (runtime.MemStats in Chromium), so 8 plans stay far below the 16 MB at which
// Go would collect by itself.
const plansPerGC = 8

// collectWhenIdle has Go collect its garbage in the browser's idle time once plansPerGC plans
// have run since the last time, so that a collection (8-12 ms) seldom falls inside a
// keystroke; the loader's GOGC=400 leaves room for the plans in between.
func (a *app) collectWhenIdle() {
	a.sinceGC++
	if a.sinceGC < plansPerGC || a.gcQueued {
		return
	}
	a.gcQueued = true
	var f js.Func
	f = js.FuncOf(func(js.Value, []js.Value) any {
		f.Release()
		a.gcQueued, a.sinceGC = false, 0
		runtime.GC()
		return nil
	})
	whenIdle(f)
}

// whenIdle calls f in the browser's next idle period (within 2 s), or after 50 ms where there
// are no idle callbacks (Safari).
func whenIdle(f js.Func) {
	if js.Global().Get("requestIdleCallback").Type() == js.TypeFunction {
		js.Global().Call("requestIdleCallback", f, map[string]any{"timeout": 2000})
	} else {
		js.Global().Call("setTimeout", f, 50)
	}
}

// keepCurrent stores the recipe on screen so a reload (or a closed tab) finds it.
func (a *app) keepCurrent() {
	a.currentQueued = false
	a.store.set(keyCurrent, string(a.current.Encode()))
}

// later runs f in a task of its own after this one (a zero timeout), which the browser may
// paint before.
func (a *app) later(f func()) {
	if len(a.pending) == 0 {
		js.Global().Call("setTimeout", a.tick, 0)
	}
	a.pending = append(a.pending, f)
}

// load shows recipe r in the form and plans it.
func (a *app) load(r recipe.Recipe) {
	a.d = FromRecipe(r)
	a.showDraft()
	setValue(byID("save-name"), r.Name)
	a.recompute()
}

// keptForFresh are the recipe keys a fresh batch keeps: how the lab works (its safety margin
// for stocks, its vessel), not what this batch is.
var keptForFresh = []string{"clear_margin_K", "vessel_heat_capacity_J_per_K"}

// freshBatch empties the form for a new batch: name, notes, solute, amounts, temperatures.
// The units, the choices of how water and amount are given, and keptForFresh stay; the
// results of the batch before go, so none of its numbers can be read as the new one's.
func (a *app) freshBatch() {
	d := NewDraft()
	d.Pick["water"], d.Pick["amount"] = a.d.Pick["water"], a.d.Pick["amount"]
	for _, k := range keptForFresh {
		if v, ok := a.d.Num[k]; ok {
			d.Num[k] = v
		}
	}
	a.d = d
	a.last = nil
	a.shown = nil
	a.showDraft()
	setValue(byID("save-name"), "")
	for i := range a.tiles {
		setOut(a.tiles[i].out, &a.tiles[i].text, "—")
	}
	for i := range a.strip {
		setOut(a.strip[i].el, &a.strip[i].text, "—")
	}
	for _, id := range []string{"cautions", "warnings", "sources"} {
		clear(byID(id))
	}
	setText(byID("charge-form"), "")
	setText(byID("curve-range"), "")
	setHTML(byID("chart"), "")
	a.chartShown, a.chartSVG = false, ""
	setHidden(byID("programme-box"), true)
	a.recompute()
}

// staleText is the banner over results that do not match the form: the last good result
// kept, or none yet (a fresh batch).
func (a *app) staleText(rest string) string {
	if a.last == nil {
		if rest == "" {
			return "Nothing planned yet: fill in the marked fields."
		}
		return "Nothing planned yet. " + rest
	}
	if rest == "" {
		return "Showing the last good result: correct the marked field to update."
	}
	return "Showing the last good result. " + rest
}

// showDraft writes the draft into every input, in the current units.
func (a *app) showDraft() {
	for name, el := range a.inputs {
		if name == "charged_form" {
			continue
		}
		setValue(el, a.d.Display(name, a.u))
		a.showFieldError(name, nil)
	}
	if a.d.Text["custom.model"] == "" {
		setValue(a.inputs["custom.model"], "table")
	}
	setChecked(byID("f-use_custom"), a.d.Custom())
	if a.d.Custom() {
		setAttr(byID("custom-box"), "open", "")
	}
	for _, group := range []string{"water", "amount"} {
		for _, el := range qa(a.recipeForm, `[name="`+groupInputs[group]+`"]`) {
			setChecked(el, value(el) == a.d.Pick[group])
		}
	}
	a.showBases()
	a.updateSolute(false)
}

func (a *app) showBases() {
	for _, el := range qa(a.recipeForm, "[data-basis]") {
		setHidden(el, attr(el, "data-basis") != a.d.Pick["water"])
	}
	for _, el := range qa(a.recipeForm, "[data-amount]") {
		setHidden(el, attr(el, "data-amount") != a.d.Pick["amount"])
	}
}

func (a *app) onRecipeInput(el js.Value, _ event) {
	name := attr(el, "name")
	switch name {
	case groupInputs["water"]:
		// The amount goes over to the other box (converted), so the result on screen stays
		// the one of the amount shown.
		a.d.SwitchWater(value(el))
		for _, k := range []string{"water_g", "water_mL"} {
			if a.d.Errs[k] == nil { // a box with a typing error keeps the user's text
				setValue(a.inputs[k], a.d.Display(k, a.u))
				a.showFieldError(k, nil)
			}
		}
		a.showBases()
	case groupInputs["amount"]:
		a.d.Pick["amount"] = value(el)
		a.showBases()
	case groupInputs["solute"]:
		a.d.SetCustom(checked(el))
		a.updateSolute(false)
	default:
		if !Known(name) {
			return
		}
		err := a.d.Set(name, value(el), a.u)
		a.showFieldError(name, err)
		if name == "solute" {
			a.updateSolute(true)
		}
		if name == "name" {
			setValue(byID("save-name"), a.d.Text["name"])
		}
		if strings.HasPrefix(name, "custom.") {
			a.showFit()
		}
	}
	a.recompute()
}

// showFieldError puts err's message beside field name (or clears it).
func (a *app) showFieldError(name string, err error) {
	in, msg := a.inputs[name], a.msgs[name]
	if !exists(in) {
		return
	}
	if err == nil {
		in.Call("removeAttribute", "aria-invalid")
		if exists(msg) {
			setText(msg, "")
		}
		return
	}
	setAttr(in, "aria-invalid", "true")
	if exists(msg) {
		setText(msg, fieldMessage(err, value(in)))
	}
}

// recompute plans the draft; on any error it keeps the last good results on screen.
func (a *app) recompute() {
	stale := byID("stale")
	if len(a.d.Errs) > 0 {
		a.clearPlanError()
		setText(stale, a.staleText(""))
		a.setStale(true)
		return
	}
	r, err := a.d.Recipe()
	if err == nil {
		var res recipe.Result
		res, err = recipe.Plan(r)
		if err == nil {
			a.clearPlanError()
			a.setStale(false)
			a.last = &res
			a.render()
			// Kept for the next visit once the browser is idle: writing storage on every
			// keystroke costs about a millisecond here.
			a.current = r
			a.collectWhenIdle()
			if !a.currentQueued && !a.rehearsing {
				a.currentQueued = true
				a.later(a.keepCurrent)
			}
			return
		}
	}
	a.showPlanError(err)
}

func (a *app) setStale(s bool) {
	a.stale = s
	setHidden(byID("stale"), !s)
	out := byID("outcome")
	classSet(out, "is-stale", s)
	classSet(byID("strip"), "is-stale", s) // not "stale": that class is the banner's
}

// showPlanError shows a recipe or plan error beside the field it names, or above the
// results when no input on screen has that name.
func (a *app) showPlanError(err error) {
	a.clearPlanError()
	field := ""
	var fe *unit.FieldError
	if errors.As(err, &fe) {
		field = fe.Field
		if i := strings.IndexByte(field, '['); i > 0 {
			field = field[:i]
		}
		if field == "custom" {
			field = "custom.name"
		}
	}
	stale := byID("stale")
	if in, ok := a.inputs[field]; ok && !inHiddenPart(in) {
		a.planErr = field
		a.showFieldError(field, err)
		setText(stale, a.staleText(""))
	} else {
		setText(stale, a.staleText(fieldMessage(err, "")))
	}
	a.setStale(true)
}

func inHiddenPart(el js.Value) bool {
	return exists(closest(el, "[hidden]"))
}

func (a *app) clearPlanError() {
	if a.planErr != "" {
		if a.d.Errs[a.planErr] == nil {
			a.showFieldError(a.planErr, nil)
		}
		a.planErr = ""
	}
}

// updateSolute follows the solute field: it finds the compound, lists matches to pick from
// (when typing) and fills the forms on the shelf.
func (a *app) updateSolute(typing bool) {
	picked := byID("solute-picked")
	matches := byID("solute-matches")
	sel := a.inputs["charged_form"]
	clear(matches)
	a.compound = nil
	if a.d.Custom() {
		setText(picked, "Planning with your own compound (below).")
		clear(sel)
		opt := add(sel, "option", "", "anhydrous (own compound)")
		setAttr(opt, "value", "")
		return
	}
	text := a.d.Text["solute"]
	c, f, err := compound.Lookup(text)
	if err == nil {
		a.compound = c
		setText(picked, c.Name+" · "+c.ID)
	} else {
		setText(picked, "")
	}
	if typing || err != nil {
		a.listMatches(matches, text)
	}
	// The forms on the shelf of this compound; "" is the anhydrous form.
	want := a.d.Text["charged_form"]
	if c != nil && f != nil && typing {
		// Typing a hydrate's formula or name puts that hydrate on the shelf; a form left over
		// from another compound goes.
		if f != c.Forms[0] && !f.NotOnShelf {
			want = f.Formula
		} else if _, err := c.Form(want); want != "" && err != nil {
			want = ""
		}
		if want == "" {
			delete(a.d.Text, "charged_form")
		} else {
			a.d.Text["charged_form"] = want
		}
	}
	clear(sel)
	if c == nil {
		opt := add(sel, "option", "", "choose a solute first")
		setAttr(opt, "value", want)
		return
	}
	for i, form := range c.Forms {
		if form.NotOnShelf {
			continue // it crystallizes (NaCl·2H2O below 0.1 °C) but nobody weighs it out
		}
		label := form.Formula
		if i == 0 {
			label += " (anhydrous)"
		} else if len(form.Names) > 0 {
			label += " (" + form.Names[0] + ")"
		}
		opt := add(sel, "option", "", label)
		v := form.Formula
		if i == 0 {
			v = ""
		}
		setAttr(opt, "value", v)
	}
	if want != "" {
		if form, err := c.Form(want); err == nil && form != c.Forms[0] {
			if form.NotOnShelf { // from a recipe file: shown, but not offered
				opt := add(sel, "option", "", form.Formula+" (not kept on a shelf)")
				setAttr(opt, "value", form.Formula)
			}
			setValue(sel, form.Formula)
			if want != form.Formula {
				a.d.Text["charged_form"] = form.Formula
			}
			return
		}
		// A form the compound does not have stays in the draft so the plan names it.
		opt := add(sel, "option", "", want+" (not a form of "+c.ID+")")
		setAttr(opt, "value", want)
		setValue(sel, want)
		return
	}
	setValue(sel, "")
}

// maxMatches is how many compounds the search lists at once.
const maxMatches = 8

func (a *app) listMatches(box js.Value, text string) {
	for _, m := range compound.Search(text, maxMatches) {
		label := m.Compound.ID + " "
		form := ""
		if m.Form != m.Compound.Forms[0] && !m.Form.NotOnShelf {
			label, form = m.Form.Formula+" ", m.Form.Formula
		}
		b := add(box, "button", "", label)
		setAttr(b, "type", "button")
		setAttr(b, "role", "option")
		setAttr(b, "data-id", m.Compound.ID)
		setAttr(b, "data-form", form)
		add(b, "small", "", m.Compound.Name)
	}
}

// onPickMatch takes the compound and the form the user's search named: tapping "washing
// soda" puts the decahydrate on the shelf, not the anhydrous salt.
func (a *app) onPickMatch(t js.Value, _ event) {
	b := closest(t, "[data-id]")
	if !exists(b) {
		return
	}
	id := attr(b, "data-id")
	setValue(a.inputs["solute"], id)
	a.d.Set("solute", id, a.u)
	a.showFieldError("solute", nil)
	if form := attr(b, "data-form"); form != "" {
		a.d.Text["charged_form"] = form
	} else {
		delete(a.d.Text, "charged_form")
	}
	a.updateSolute(false)
	clear(byID("solute-matches"))
	a.recompute()
}

func (a *app) loadUnits() {
	if s, ok := a.store.get(keyUnits); ok {
		f := strings.Fields(s)
		if len(f) == 3 {
			a.u = Units{Temp: f[0], Mass: f[1], Volume: f[2]}
		}
	}
	uf := byID("units")
	setValue(q(uf, `[name="unit_temp"]`), a.u.Temp)
	setValue(q(uf, `[name="unit_mass"]`), a.u.Mass)
	setValue(q(uf, `[name="unit_volume"]`), a.u.Volume)
	// A stored value the select does not offer leaves it empty: fall back to the defaults.
	if value(q(uf, `[name="unit_temp"]`)) == "" || value(q(uf, `[name="unit_mass"]`)) == "" ||
		value(q(uf, `[name="unit_volume"]`)) == "" {
		a.u = DefaultUnits
		a.loadUnitsInto(uf)
	}
	a.showUnitLabels()
}

func (a *app) loadUnitsInto(uf js.Value) {
	setValue(q(uf, `[name="unit_temp"]`), a.u.Temp)
	setValue(q(uf, `[name="unit_mass"]`), a.u.Mass)
	setValue(q(uf, `[name="unit_volume"]`), a.u.Volume)
}

func (a *app) onUnits(js.Value, event) {
	old := a.u
	defer a.prepUnits(old)
	uf := byID("units")
	a.u = Units{
		Temp:   value(q(uf, `[name="unit_temp"]`)),
		Mass:   value(q(uf, `[name="unit_mass"]`)),
		Volume: value(q(uf, `[name="unit_volume"]`)),
	}
	a.store.set(keyUnits, a.u.Temp+" "+a.u.Mass+" "+a.u.Volume)
	a.showUnitLabels()
	for name, err := range a.d.Errs { // their messages, in the new units
		a.showFieldError(name, err)
	}
	if a.planErr != "" || !byID("stale").Get("hidden").Bool() {
		a.recompute()
	}
	// Fields that do not parse keep the user's text; the others show the same quantity in
	// the new unit.
	for name, el := range a.inputs {
		if a.d.Errs[name] == nil && name != "charged_form" {
			setValue(el, a.d.Display(name, a.u))
		}
	}
	if a.last != nil {
		a.render()
	}
	if a.gasShown {
		a.recomputeGas()
	}
}

func (a *app) showUnitLabels() {
	sayUnits = a.u
	for _, el := range qa(doc, "[data-unit]") {
		switch attr(el, "data-unit") {
		case "temp":
			setText(el, a.u.TempSymbol())
		case "mass":
			setText(el, a.u.Mass)
		case "volume":
			setText(el, a.u.VolumeSymbol())
		case "tempdiff":
			setText(el, a.u.DeltaSymbol())
		}
	}
}

func (a *app) showScreen(name string) {
	a.onSheet = name == "sheet"
	for _, b := range qa(doc, ".screens [data-screen]") {
		sel := attr(b, "data-screen") == name
		if sel {
			setAttr(b, "aria-selected", "true")
		} else {
			setAttr(b, "aria-selected", "false")
		}
		setHidden(byID("screen-"+attr(b, "data-screen")), !sel)
	}
	switch name {
	case "sheet":
		a.sheetIfDirty()
		setText(byID("s-date"), today())
	case "prep":
		if !ps.started {
			a.startPrep()
		}
	case "gas":
		if !a.gasShown {
			a.gasShown = true
			a.startGas()
		}
	}
}

func (a *app) print(what string) {
	classSet(doc.Get("body"), "print-gas", what == "gas")
	classSet(doc.Get("body"), "print-labels", false)
	a.sheetIfDirty()
	setText(byID("s-date"), today())
	js.Global().Call("print")
}
