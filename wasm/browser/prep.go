//go:build js && wasm

package main

import (
	"strconv"
	"strings"
	"syscall/js"

	"saltcast/core/compound"
	"saltcast/core/prep"
	"saltcast/core/recipe"
	"saltcast/core/unit"
)

// The preparation screen ("Make up"): a solution made up to the mark or diluted from a stock,
// its figures, the stock-bottle labels, and the saved preparations. Its inputs are named like
// the recipe keys (prepform.go) and its results carry the answer's keys as data-key.

// keyPreps held the saved preparations before they joined the recipe box (keyShelf); what
// it still holds is moved there once (adoptOldPreps).
const keyPreps = "saltcast.preps"

// keyLabelBy remembers who makes the solutions on this device, for the label.
const keyLabelBy = "saltcast.label_by"

// maxLabels bounds the labels printed at once (three A4 pages of the 2 × 4 grid).
const maxLabels = 24

type prepScreen struct {
	started bool
	d       *Draft
	last    *recipe.PrepResult
	shown   map[string]js.Value // result outputs by data-key
	boxes   map[string]js.Value // their tiles
	subs    map[string]js.Value // the line under a tile's value
}

var ps prepScreen

func (a *app) startPrep() {
	ps.started = true
	ps.d = NewPrepDraft()
	ps.shown, ps.boxes, ps.subs = map[string]js.Value{}, map[string]js.Value{}, map[string]js.Value{}
	form := byID("prep")
	dl := byID("p-solutes")
	for _, c := range compound.All() {
		opt := add(dl, "option", "", "")
		setAttr(opt, "value", c.ID)
		setAttr(opt, "label", c.Name)
	}
	figs := byID("prep-figures")
	for _, t := range []struct{ key, label string }{
		{"form_g", "Weigh"},
		{"stock_mL", "Measure of the stock"},
		{"water_g", "Water, about"},
		{"solution_mL", "Solution"},
		{"density_g_per_mL", "Density"},
		{"saturation_pct", "Of saturation"},
		{"keep_above_C", "Keep above"},
		{"saturation_temp_C", "Crystallizes below"},
		{"freezing_point_C", "Freezes at"},
	} {
		box := addFigure(figs, t.label)
		val := add(box, "span", "val", "")
		out := add(val, "output", "", "—")
		setAttr(out, "data-key", t.key)
		ps.shown[t.key], ps.boxes[t.key] = out, box
		ps.subs[t.key] = add(box, "span", "sub", "")
	}
	classSet(ps.boxes["form_g"], "big", true)
	classSet(ps.boxes["stock_mL"], "big", true)
	classSet(ps.boxes["keep_above_C"], "big", true)
	tbl := byID("prep-units")
	body := add(tbl, "tbody", "", "")
	for _, u := range []struct{ key, label string }{
		{"mol_per_L", "mol/L"}, {"mmol_per_L", "mmol/L"}, {"g_per_L", "g/L"}, {"mg_per_L", "mg/L"},
		{"pct_w_v", "% w/v (g per 100 mL)"}, {"pct_w_w", "% w/w"}, {"mol_per_kg", "mol/kg (molality)"},
		{"g_per_100g_water", "g per 100 g water"},
	} {
		tr := add(body, "tr", "", "")
		th := add(tr, "th", "", u.label)
		setAttr(th, "scope", "row")
		td := add(tr, "td", "", "—")
		out := add(td, "output", "", "—")
		td.Call("replaceChildren", out)
		setAttr(out, "data-key", u.key)
		ps.shown[u.key] = out
	}
	if s, ok := a.store.get(keyLabelBy); ok {
		setValue(byID("p-label_by"), s)
	}
	setValue(byID("p-label_date"), today())

	on(form, "input", a.onPrepInput)
	on(form, "change", a.onPrepInput)
	on(form, "submit", func(_ js.Value, ev event) { ev.PreventDefault() })
	on(byID("prep-to-batch"), "click", func(js.Value, event) { a.prepToBatch() })
	on(byID("prep-print"), "click", func(js.Value, event) { a.printLabels() })
	on(byID("p-label_by"), "input", func(js.Value, event) {
		a.store.set(keyLabelBy, value(byID("p-label_by")))
		a.renderLabels()
	})
	on(byID("p-label_date"), "input", func(js.Value, event) { a.renderLabels() })
	on(byID("p-label_copies"), "input", func(js.Value, event) { a.renderLabels() })
	on(byID("prep-save"), "click", func(js.Value, event) { a.savePrep() })
	on(byID("prep-saved"), "click", a.onSavedPrep)
	on(byID("prep-export"), "click", func(js.Value, event) {
		setValue(byID("prep-transfer"), string(recipe.EncodePrepCollection(a.shelf.Preps)))
		setText(byID("m-prep-import"), "The saved preparations are in the box below: copy them, or download them as a file.")
	})
	on(byID("prep-download"), "click", func(js.Value, event) {
		download("saltcast-preparations.json", "application/json", string(recipe.EncodePrepCollection(a.shelf.Preps)))
	})
	on(byID("prep-import"), "click", func(js.Value, event) { a.importPreps() })
	on(byID("prep-share"), "click", func(js.Value, event) { a.sharePrep() })
	a.showPrepForm()
	a.renderSavedPreps()
	a.recomputePrep()
}

// loadPrep shows p on the preparation screen.
func (a *app) loadPrep(p recipe.Prep) {
	if !ps.started {
		a.startPrep()
	}
	ps.d = FromPrep(p)
	setValue(byID("prep-save-name"), p.Name)
	a.showPrepForm()
	a.recomputePrep()
}

// prepInputs are the inputs of the preparation form that hold a recipe key, by name.
func prepInputs() map[string]js.Value {
	m := map[string]js.Value{}
	for _, el := range qa(byID("prep"), "[name]") {
		if name := attr(el, "name"); PrepKnown(name) {
			m[name] = el
		}
	}
	return m
}

// showPrepForm writes the draft into the inputs, in the user's units.
func (a *app) showPrepForm() {
	for name, el := range prepInputs() {
		setValue(el, ps.d.Display(name, a.u))
		a.prepFieldError(name, nil)
	}
	for group, control := range prepGroupInputs {
		for _, el := range qa(byID("prep"), `[name="`+control+`"]`) {
			setChecked(el, value(el) == ps.d.Pick[group])
		}
	}
	a.showPrepParts()
	a.fillForms()
}

// showPrepParts shows the inputs of the choices picked (the amount, solid or stock).
func (a *app) showPrepParts() {
	for _, el := range qa(byID("prep"), "[data-group]") {
		setHidden(el, attr(el, "data-choice") != ps.d.Pick[attr(el, "data-group")])
	}
}

// fillForms lists the forms on the shelf of the solute typed.
func (a *app) fillForms() {
	sel := byID("p-charged_form")
	clear(sel)
	c, f, err := compound.Lookup(ps.d.Text["solute"])
	picked := byID("p-picked")
	if err != nil {
		setText(picked, "")
		add(sel, "option", "", "choose a solute first")
		return
	}
	setText(picked, c.Name+" · "+c.ID)
	want := ps.d.Text["charged_form"]
	if fw, err := c.Form(want); err == nil && !fw.NotOnShelf {
		want = fw.Formula
	} else if !f.NotOnShelf {
		want = f.Formula
	} else {
		want = c.Forms[0].Formula
	}
	for i, form := range c.Forms {
		if form.NotOnShelf {
			continue // crystallizes in the cold, never weighed out
		}
		label := form.Formula
		if i == 0 {
			label += " (anhydrous)"
		} else if len(form.Names) > 0 {
			label += " (" + form.Names[0] + ")"
		}
		opt := add(sel, "option", "", label)
		setAttr(opt, "value", form.Formula)
	}
	setValue(sel, want)
	ps.d.Text["charged_form"] = want
}

func (a *app) onPrepInput(el js.Value, _ event) {
	name := attr(el, "name")
	for group, control := range prepGroupInputs {
		if name == control {
			ps.d.Pick[group] = value(el)
			a.showPrepParts()
			a.recomputePrep()
			return
		}
	}
	if !PrepKnown(name) {
		return
	}
	a.prepFieldError(name, ps.d.Set(name, value(el), a.u))
	switch name {
	case "solute":
		delete(ps.d.Text, "charged_form")
		a.fillForms()
	case "name":
		setValue(byID("prep-save-name"), value(el))
	}
	a.recomputePrep()
}

func (a *app) prepFieldError(name string, err error) {
	in := q(byID("prep"), `[name="`+name+`"]`)
	msg := byID("m-p-" + name)
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

// recomputePrep works the preparation out; on an error it keeps the last good result.
func (a *app) recomputePrep() {
	if !ps.started {
		return
	}
	form := byID("prep")
	for name := range prepInputs() {
		if ps.d.Errs[name] == nil {
			a.prepFieldError(name, nil)
		}
	}
	stale := byID("prep-stale")
	errs := ps.d.Errs
	var res recipe.PrepResult
	if len(errs) == 0 {
		p, err := ps.d.Prep()
		if err == nil {
			res, err = recipe.PlanPrep(p)
		}
		if err != nil {
			errs = map[string]error{fieldOf(err): err}
		}
	}
	if len(errs) > 0 {
		msg := "Showing the last good result: correct the marked field to update."
		for name, e := range errs {
			if in := q(form, `[name="`+name+`"]`); exists(in) && !inHiddenPart(in) {
				a.prepFieldError(name, e)
			} else {
				msg = "Showing the last good result. " + fieldMessage(e, "")
			}
		}
		setText(stale, msg)
		setHidden(stale, false)
		classSet(byID("prep-outcome"), "is-stale", true)
		return
	}
	setHidden(stale, true)
	classSet(byID("prep-outcome"), "is-stale", false)
	ps.last = &res
	a.renderPrep()
}

// fieldOf is the field a *unit.FieldError names, or "".
func fieldOf(err error) string {
	if fe, ok := err.(*unit.FieldError); ok {
		return fe.Field
	}
	return ""
}

func (a *app) renderPrep() {
	res := ps.last
	if res == nil {
		return
	}
	r := res.Result
	num := func(v float64) string { return unit.FormatNumber(v, 4) }
	set := func(key, text, sub string, show bool) {
		if out, ok := ps.shown[key]; ok {
			setText(out, text)
		}
		if box, ok := ps.boxes[key]; ok {
			setHidden(box, !show)
		}
		if s, ok := ps.subs[key]; ok {
			setText(s, sub)
		}
	}
	formSub := ""
	if r.HasForm {
		formSub = "of " + r.Form
		if r.PurityPct < 100 {
			formSub += " at " + unit.FormatCompact(r.PurityPct, 4) + " %"
		}
	}
	u := a.u
	mass := func(g float64) string { return num(MassFromG(g, u)) }
	vol := func(ml float64) string { return num(VolumeFromML(ml, u)) }
	set("form_g", mass(r.FormG), u.Mass+" "+formSub, r.HasForm)
	set("stock_mL", vol(r.StockML), u.VolumeSymbol()+" of stock = "+mass(r.StockG)+" "+u.Mass, r.HasStock && r.HasStockVolume)
	waterSub := u.Mass + " = " + vol(r.WaterML) + " " + u.VolumeSymbol()
	if r.WaterApprox {
		waterSub += "; fill to the mark"
	}
	set("water_g", mass(r.WaterG), waterSub, true)
	set("solution_mL", vol(r.SolutionML), u.VolumeSymbol()+" = "+mass(r.SolutionG)+" "+u.Mass, r.HasDensity || r.Amount == prep.ByVolume)
	set("density_g_per_mL", unit.FormatNumber(r.DensityKgPerM3/1000, 5), "g/mL ± "+unit.FormatCompact(r.DensityErrPct, 2)+" %", r.HasDensity)
	set("saturation_pct", unit.FormatNumber(r.SaturationPct, 3), "% at "+TempText(r.TempC, a.u), true)
	set("keep_above_C", fixed(TempFromC(r.KeepAboveC, a.u), 1), a.u.TempSymbol(), r.HasKeepAbove)
	set("saturation_temp_C", fixed(TempFromC(r.SaturationTempC, a.u), 1), a.u.TempSymbol(), r.HasSaturationTemp && !r.Supersaturated)
	set("freezing_point_C", fixed(TempFromC(r.FreezingPointC, a.u), 1), a.u.TempSymbol(), r.HasFreezingPoint)
	for key, v := range map[string]float64{"mol_per_L": r.MolPerL, "mmol_per_L": r.MmolPerL, "g_per_L": r.GPerL,
		"mg_per_L": r.MgPerL, "pct_w_v": r.PctWV} {
		s := "—"
		if r.HasDensity {
			s = num(v)
		}
		setText(ps.shown[key], s)
	}
	setText(ps.shown["pct_w_w"], num(r.PctWW))
	setText(ps.shown["mol_per_kg"], num(r.MolPerKg))
	setText(ps.shown["g_per_100g_water"], num(r.GPer100gWater))
	fillList(byID("prep-cautions"), r.Cautions)
	markCautions(byID("prep-cautions"), r.CautionKinds)
	fillList(byID("prep-warnings"), orNone(r.Warnings))
	fillList(byID("prep-sources"), r.Sources)
	a.renderLabels()
}

// labelCopies reads how many labels to print, 1 to maxLabels.
func labelCopies() int {
	n, err := strconv.Atoi(strings.TrimSpace(value(byID("p-label_copies"))))
	if err != nil || n < 1 {
		return 1
	}
	return min(n, maxLabels)
}

// renderLabels draws the stock-bottle labels as they will print.
func (a *app) renderLabels() {
	box := byID("labels")
	clear(box)
	if ps.last == nil {
		return
	}
	l := LabelFor(*ps.last, strings.TrimSpace(value(byID("p-label_by"))), strings.TrimSpace(value(byID("p-label_date"))), a.u)
	for range labelCopies() {
		el := add(box, "div", "plabel", "")
		h := add(el, "p", "pl-title", l.Title+" ")
		add(h, "span", "pl-formula", l.Formula)
		add(el, "p", "pl-conc", l.Concentration)
		add(el, "p", "pl-also", l.Also)
		add(el, "p", "pl-made", l.Made)
		add(el, "p", "pl-keep", l.Keep)
		by := "Made " + l.Date
		if l.By != "" {
			by += " by " + l.By
		}
		add(el, "p", "pl-by", by)
		hz := add(el, "p", "pl-hazard", l.Hazard)
		if l.Oxidizer {
			classSet(hz, "ox", true)
		}
	}
}

func (a *app) printLabels() {
	if ps.last == nil {
		setText(byID("m-p-label"), "Nothing to print: correct the marked field first.")
		return
	}
	setText(byID("m-p-label"), "")
	a.renderLabels()
	classSet(doc.Get("body"), "print-labels", true)
	js.Global().Call("print")
}

// prepToBatch opens the batch screen with the same solution, to plan crystallizing from it.
func (a *app) prepToBatch() {
	if ps.last == nil {
		return
	}
	a.load(recipe.BatchFrom(*ps.last))
	a.showScreen("batch")
}

func (a *app) savePrep() {
	msg := byID("m-prep-save")
	p, err := ps.d.Prep()
	if err != nil || len(ps.d.Errs) > 0 {
		setText(msg, "Not saved: correct the marked field first.")
		return
	}
	name := strings.TrimSpace(value(byID("prep-save-name")))
	if name == "" {
		name = PrepName(p)
	}
	p.Name = name
	next := a.shelf
	next.PutPrep(p)
	if !a.store.set(keyShelf, string(next.Encode())) {
		setText(msg, "Not saved: this browser's storage is full or switched off. Export the saved preparations first.")
		return
	}
	a.shelf = next
	ps.d.Text["name"] = name
	setValue(q(byID("prep"), `[name="name"]`), name)
	setText(msg, "Saved “"+name+"”; it is in the recipe box too.")
	a.renderShelf()
}

// renderSavedPreps lists the saved preparations on the Make up screen and in the recipe box.
func (a *app) renderSavedPreps() {
	for _, id := range []string{"prep-saved", "saved-preps"} {
		list := byID(id)
		if !exists(list) {
			continue
		}
		clear(list)
		for i, p := range a.shelf.Preps {
			li := add(list, "li", "", "")
			add(li, "span", "nm", p.Name)
			b := add(li, "button", "act", "Open")
			setAttr(b, "type", "button")
			setAttr(b, "data-open", strconv.Itoa(i))
			d := add(li, "button", "act danger", "Delete")
			setAttr(d, "type", "button")
			setAttr(d, "data-delete", strconv.Itoa(i))
			setAttr(d, "aria-label", "Delete "+p.Name)
		}
	}
	if el := byID("saved-preps-empty"); exists(el) {
		setHidden(el, len(a.shelf.Preps) > 0)
	}
}

func (a *app) onSavedPrep(t js.Value, _ event) {
	if b := closest(t, "[data-open]"); exists(b) {
		if i, err := strconv.Atoi(attr(b, "data-open")); err == nil && i < len(a.shelf.Preps) {
			a.loadPrep(a.shelf.Preps[i])
			a.showScreen("prep")
		}
		return
	}
	if b := closest(t, "[data-delete]"); exists(b) {
		i, err := strconv.Atoi(attr(b, "data-delete"))
		if err != nil || i >= len(a.shelf.Preps) || !win.Confirm("Delete the saved preparation “"+a.shelf.Preps[i].Name+"”?") {
			return
		}
		next := a.shelf
		next.DeletePrep(i)
		if a.store.set(keyShelf, string(next.Encode())) {
			a.shelf = next
			a.renderShelf()
		}
	}
}

// adoptOldPreps moves preparations saved before they joined the recipe box into it, once.
func (a *app) adoptOldPreps() {
	s, ok := a.store.get(keyPreps)
	if !ok || strings.TrimSpace(s) == "" {
		return
	}
	list, err := recipe.DecodePrepCollection([]byte(s))
	if err != nil {
		return // left as it was, for a newer Saltcast to read
	}
	next := a.shelf
	for _, p := range list {
		p.Name = PrepName(p)
		next.PutPrep(p)
	}
	if a.store.set(keyShelf, string(next.Encode())) {
		a.shelf = next
		a.store.set(keyPreps, "")
	}
}

// importPreps takes a whole file (preparations, recipes or both, or one preparation) or
// nothing, into the recipe box.
func (a *app) importPreps() {
	msg := byID("m-prep-import")
	if t := strings.TrimSpace(value(byID("prep-transfer"))); !strings.ContainsAny(t, "{\n") &&
		strings.Contains(t, "#") && a.openLink(t[strings.IndexByte(t, '#'):]) {
		return // a share link: its preparation (or recipe) is open on screen
	}
	next := a.shelf
	next.Recipes = append([]recipe.Recipe(nil), a.shelf.Recipes...)
	n, err := next.Import([]byte(strings.TrimSpace(value(byID("prep-transfer")))))
	if err != nil {
		setText(msg, "Nothing imported: "+err.Error())
		return
	}
	if !a.store.set(keyShelf, string(next.Encode())) {
		setText(msg, "Nothing imported: this browser's storage is full or switched off.")
		return
	}
	a.shelf = next
	a.renderShelf()
	setText(msg, "Imported "+strconv.Itoa(n)+" recipe(s) and preparation(s).")
}

func (a *app) sharePrep() {
	p, err := ps.d.Prep()
	if err != nil || len(ps.d.Errs) > 0 {
		setText(byID("m-prep-import"), "No link: correct the marked field first.")
		return
	}
	link, local := shareLink(PrepFragment(p))
	setValue(byID("prep-transfer"), link)
	js.Global().Get("history").Call("replaceState", nil, "", PrepFragment(p))
	if local {
		setText(byID("m-prep-import"), "The link is in the box below. Opened from a file, so it holds the preparation only (from the #), "+
			"not where this file lies: the receiver pastes it into this box in their copy of Saltcast and imports it, or adds it to the end of the address.")
		return
	}
	setText(byID("m-prep-import"), "The link is in the box below; the preparation rides in it after the #, nothing is sent anywhere.")
}

// prepUnits follows the unit switch: temperatures, masses and volumes on the form are shown
// in the new units (an input that does not read keeps its text; the draft keeps the values
// themselves, so nothing is rounded) and the results are drawn again.
func (a *app) prepUnits(Units) {
	if !ps.started {
		return
	}
	for name, el := range prepInputs() {
		if ps.d.Errs[name] == nil && name != "charged_form" {
			setValue(el, ps.d.Display(name, a.u))
		}
	}
	a.recomputePrep()
}
