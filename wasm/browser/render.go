//go:build js && wasm

package main

import (
	"errors"
	"strings"
	"syscall/js"

	"saltcast/core/balance"
	"saltcast/core/compound"
	"saltcast/core/recipe"
	"saltcast/core/solubility"
	"saltcast/core/unit"
	"saltcast/core/wire"
	"saltcast/web/chart"
)

// onSheetOnly are figures the batch screen leaves to the sheet and the CSV: the heat of
// crystallization on the lowest estimate is said once on screen, in the basis tile (lowest
// kJ/mol beside the design value the cooling is sized on).
var onSheetOnly = map[string]bool{"crystallization_heat_low_kJ": true}

// impuritiesNote is said wherever the purity is: the planner's model of what is not the salt.
const impuritiesNote = "impurities taken as inert and insoluble"

// bindTiles finds the element of each Figure on the batch screen, making a small tile in
// #extra-figures for the figures the shell does not place itself.
func (a *app) bindTiles() {
	outcome := byID("outcome")
	extra := byID("extra-figures")
	for _, f := range Figures {
		t := tile{fig: f}
		if el := q(outcome, `[data-key="`+f.Key+`"]`); exists(el) {
			t.out = el
			t.box = closest(el, ".fig")
			if p := el.Get("parentElement"); exists(p) {
				t.unit = q(p, ".u")
			}
		} else if f.Kind == kText || onSheetOnly[f.Key] {
			continue // words such as the form weighed already show beside their numbers
		} else {
			t.box = addFigure(extra, f.Label)
			val := add(t.box, "span", "val", "")
			t.out = add(val, "output", "", "—")
			setAttr(t.out, "data-key", f.Key)
			val.Call("appendChild", doc.Call("createTextNode", " "))
			t.unit = add(val, "span", "u", "")
		}
		t.own = exists(t.box) && q(t.box, "output").Equal(t.out)
		a.tiles = append(a.tiles, t)
	}
	for _, el := range qa(byID("strip"), "[data-strip]") {
		a.strip = append(a.strip, stripOut{key: attr(el, "data-strip"), el: el})
	}
}

// render shows a.last: figures, cautions, warnings, sources, chart, programme and sheet.
func (a *app) render() {
	r := a.last
	for i := range a.tiles {
		t := &a.tiles[i]
		text, ut, ok := t.fig.Show(r, a.u)
		if !ok {
			text = "—"
		}
		if a.changed("out:"+t.fig.Key, text) {
			setOut(t.out, &t.text, text)
		}
		// A number's words in its place (not given) carry no unit; a figure of words only
		// leaves the unit it sits beside alone.
		words := t.fig.Kind == kText || t.fig.Kind == kTempText
		if exists(t.unit) && (ut != "" || !words) && a.changed("unit:"+t.fig.Key, ut) {
			setText(t.unit, ut)
		}
		// A tile of its own hides when the plan has no such figure; a figure inside
		// another tile (crystal_phase) follows its tile.
		if t.own {
			setHidden(t.box, !ok)
		}
	}
	for i := range a.strip {
		st := &a.strip[i]
		text := "—"
		if f, ok := FigureByKey(st.key); ok {
			if s, _, ok := f.Show(r, a.u); ok {
				text = s
			}
		}
		if a.changed("strip:"+st.key, text) {
			setOut(st.el, &st.text, text)
		}
	}
	cf := ""
	if r.ChargedForm != "" {
		cf = "of " + r.ChargedForm
		if r.PurityPct > 0 && r.PurityPct < 100 {
			cf += " at " + exact(wire.RoundSig(r.PurityPct, 4)) + " % purity"
		}
		cf += "; " + impuritiesNote
	}
	if a.changed("charge-form", cf) {
		setText(byID("charge-form"), cf)
	}

	cautions := sayAll(r.Cautions)
	kinds := make([]string, len(r.CautionKinds))
	for i, k := range r.CautionKinds {
		kinds[i] = string(k)
	}
	if a.changed("caution-kinds", strings.Join(kinds, " ")+"\x00"+strings.Join(cautions, "\x00")) {
		a.fillListOnce("cautions", cautions)
		markCautions(byID("cautions"), r.CautionKinds)
	}
	a.fillListOnce("warnings", orNone(sayAll(r.Warnings)))
	a.fillListOnce("sources", r.Sources)
	if ct := a.curveText(r); a.changed("curve-range", ct) {
		setText(byID("curve-range"), ct)
	}

	if a.starting {
		// The first plan's figures, cautions and warnings go on screen first; the chart and
		// the cooling programme follow once they are painted.
		a.later(a.renderDrawings)
	} else {
		a.renderDrawings()
	}
	if !a.sheetDirty && !a.rehearsing { // a rehearsal shows the plan the sheet has
		a.sheetDirty = true
		a.sheetWhenIdle()
	}
}

// renderDrawings draws the chart and the cooling programme of a.last.
func (a *app) renderDrawings() {
	r := a.last
	if r == nil {
		return
	}
	// The chart depends on the compound, the units and the path in g per 100 g water, not
	// on the batch size: redraw it only when those change.
	if a.changed("chart-input", a.chartKey(r)) {
		a.drawChart(r)
	}
	a.renderProgramme()
}

// sheetWhenIdle has the batch sheet brought up to date once the browser is idle, after the
// batch screen has shown the keystroke's result: drawing the sheet (the whole chart's markup
// among it) took 5-11 ms and 0.24 MB of garbage a keystroke when it followed every keystroke
// in the next task. At the start, and while the sheet itself is on screen (the units changed
// there), it is drawn in the next task. Showing the sheet and printing draw it at once.
func (a *app) sheetWhenIdle() {
	if a.starting || a.onSheet {
		a.later(a.sheetIfDirty)
		return
	}
	if a.sheetIdle.IsUndefined() {
		a.sheetIdle = js.FuncOf(func(js.Value, []js.Value) any { a.sheetIfDirty(); return nil })
	}
	whenIdle(a.sheetIdle)
}

// sheetIfDirty brings the batch sheet up to date. The sheet is drawn after the batch screen
// (in idle time, on showing it, and before printing) so typing stays quick.
func (a *app) sheetIfDirty() {
	if a.sheetDirty && a.last != nil {
		a.sheetDirty = false
		a.renderSheet()
	}
}

// changed records text as what element key shows and reports whether it differs from
// before, so unchanged parts of the page are not rewritten on every keystroke.
func (a *app) changed(key, text string) bool {
	if a.shown == nil {
		a.shown = map[string]string{}
	}
	if old, ok := a.shown[key]; ok && old == text {
		return false
	}
	a.shown[key] = text
	return true
}

func (a *app) fillListOnce(id string, items []string) {
	if a.changed(id, strings.Join(items, "\x00")) {
		fillList(byID(id), items)
	}
}

// markCautions marks each caution item with its kind (data-kind) and sets the toxic one
// apart (class strong): the page tests the kind, never the wording.
func markCautions(list js.Value, kinds []balance.CautionKind) {
	for i, li := range qa(list, "li") {
		k := balance.CautionKind("")
		if i < len(kinds) {
			k = kinds[i]
		}
		setAttrIf(li, "data-kind", string(k))
		classSet(li, "strong", k == balance.CautionToxic)
	}
}

// sayAll words each of the core's sentences for the screen (say).
func sayAll(s []string) []string {
	out := make([]string, len(s))
	for i, x := range s {
		out[i] = say(x)
	}
	return out
}

func orNone(s []string) []string {
	if len(s) == 0 {
		return []string{"None."}
	}
	return s
}

// curveText names the curve used and the range it is valid over.
func (a *app) curveText(r *recipe.Result) string {
	c := a.compound
	if c == nil {
		if a.d.Custom() && len(a.d.Points) > 0 {
			lo, hi := pointRange(a.d.Points)
			return "Your own points for " + a.d.Text["custom.name"] + ", valid from " + TempText(lo, a.u) + " to " + TempText(hi, a.u) + "."
		}
		return ""
	}
	lo, hi := c.Range()
	s := c.Name + " (" + c.ID + "): data from " + TempText(lo, a.u) + " to " + TempText(hi, a.u) + "."
	for _, seg := range c.Segments {
		s += " " + seg.Form.Formula + " is the stable solid from " + TempText(seg.MinC, a.u) + " to " + TempText(seg.MaxC, a.u)
		if seg.Curve.Source != "" {
			s += " (" + seg.Curve.Source + ")"
		}
		s += "."
	}
	return s
}

func pointRange(pts []recipe.Point) (lo, hi float64) {
	lo, hi = pts[0].TempC, pts[0].TempC
	for _, p := range pts {
		lo, hi = min(lo, p.TempC), max(hi, p.TempC)
	}
	return lo, hi
}

// chartKey names everything the batch chart is drawn from.
func (a *app) chartKey(r *recipe.Result) string {
	k := a.u.Temp + "|" + r.SoluteID + "|" + r.Recipe.Solute
	if a.d.Custom() {
		k += "|" + string(a.d.JSON())
	}
	if r.HasMetastable {
		k += "|m" + exact(r.MetastableWidthK)
	}
	for _, p := range r.Path {
		k += "|" + string(p.Kind) + "," + exact(p.TempC) + "," + exact(p.G100)
	}
	return k
}

// chartUnit maps the page's temperature unit to the chart's.
func chartUnit(u Units) chart.TempUnit {
	switch u.Temp {
	case "F":
		return chart.Fahrenheit
	case "K":
		return chart.Kelvin
	}
	return chart.Celsius
}

// chartPoints is how many points each solid phase's curve is drawn with.
const chartPoints = 60

// drawChart draws the compound's curves and the batch's path into #chart. When only the
// batch moved (same curves, units and axes) it replaces just the batch layer, the viewBox's
// height and the description: the page then holds what a whole redraw would give, without
// building and parsing the curves and axes again.
func (a *app) drawChart(r *recipe.Result) {
	el := byID("chart")
	c, err := a.chartOf(r)
	var d chart.Drawing
	same := false
	if err == nil {
		d, same, err = a.chartR.Draw(c)
	}
	if err != nil {
		ph := chart.Placeholder("Solubility", "No chart: "+err.Error())
		a.chartSVG, a.chartShown = ph, false
		if a.changed("chart", ph) {
			setHTML(el, ph) // SVG from web/chart: every text in it is escaped
		}
		return
	}
	delete(a.shown, "chart")
	if same && a.chartShown {
		svg := el.Get("firstElementChild")
		if d.Height != a.chartD.Height {
			setAttr(svg, "viewBox", d.ViewBox())
		}
		if d.Desc != a.chartD.Desc {
			setHTML(q(svg, "desc"), d.Desc) // escaped by web/chart
		}
		if d.Batch != a.chartD.Batch {
			setHTML(q(svg, `g[data-layer="batch"]`), d.Batch) // SVG from web/chart
		}
	} else {
		setHTML(el, d.SVG()) // SVG from web/chart: every text in it is escaped
	}
	a.chartD, a.chartShown, a.chartSVG = d, true, ""
}

// lastSVG is the chart as #chart shows it, whole (for the batch sheet).
func (a *app) lastSVG() string {
	if a.chartSVG == "" && a.chartShown {
		a.chartSVG = a.chartD.SVG()
	}
	return a.chartSVG
}

// chartOf builds the chart of the compound's curves and the batch's path.
func (a *app) chartOf(r *recipe.Result) (chart.Chart, error) {
	view := chart.SolubilityView{Temp: chartUnit(a.u), Batch: chart.BatchFromPlan(&r.Result)}
	if r.HasMetastable {
		view.MetastableK = r.MetastableWidthK
	}
	var err error
	switch {
	case a.compound != nil:
		view.Title = a.compound.Name + ", " + a.compound.ID
		view.Phases, err = phases(a.compound)
	case a.d.Custom():
		view.Title = a.d.Text["custom.name"] + " (own data)"
		var fit solubility.FitResult
		fit, err = a.fit()
		if err == nil {
			var pts []chart.Point
			pts, err = chart.Sample(fit.Curve.MinC, fit.Curve.MaxC, chartPoints, curveAt(fit.Curve))
			view.Phases = []chart.Phase{{Form: view.Title, Points: pts}}
		}
	}
	if err != nil {
		return chart.Chart{}, err
	}
	return a.chartC.Solubility(view)
}

func curveAt(c solubility.Curve) func(float64) (float64, error) {
	return func(t float64) (float64, error) {
		g, _, err := c.At(t)
		return g, err
	}
}

// phaseCache keeps the sampled curves of library compounds, which never change.
var phaseCache = map[string][]chart.Phase{}

func phases(c *compound.Compound) ([]chart.Phase, error) {
	if p, ok := phaseCache[c.ID]; ok && !c.Custom {
		return p, nil
	}
	out, err := chart.Phases(c, chartPoints)
	if err == nil && !c.Custom {
		phaseCache[c.ID] = out
	}
	return out, err
}

// fit fits the user's points with the chosen model, as the planner does.
func (a *app) fit() (solubility.FitResult, error) {
	pts := make([]solubility.Point, len(a.d.Points))
	for i, p := range a.d.Points {
		pts[i] = solubility.Point{TempC: p.TempC, GPer100gWater: p.GPer100gWater}
	}
	model := a.d.Text["custom.model"]
	if model == "" {
		model = solubility.KindTable
	}
	return solubility.Fit(model, pts, a.d.Num["custom.molar_mass_g_per_mol"])
}

// showFit reports how well the chosen curve fits the user's points.
func (a *app) showFit() {
	out := byID("custom-fit")
	if len(a.d.Points) < 3 || a.d.Num["custom.molar_mass_g_per_mol"] <= 0 {
		setText(out, "Give the molar mass and at least three points to see the curve.")
		return
	}
	f, err := a.fit()
	if err != nil {
		var fe *unit.FieldError
		if errors.As(err, &fe) && fe.Allowed != "" {
			setText(out, "No curve yet: the fit needs "+say(fe.Allowed)+".")
		} else {
			setText(out, "No curve yet: "+say(err.Error()))
		}
		return
	}
	setText(out, "Curve over "+TempText(f.Curve.MinC, a.u)+" to "+TempText(f.Curve.MaxC, a.u)+
		": R² "+unit.FormatNumber(f.R2, 4)+", RMS deviation "+unit.FormatNumber(f.RMS, 3)+" g per 100 g water.")
}

func (a *app) renderProgramme() {
	r := a.last
	box := byID("programme-box")
	if r == nil || len(r.Programme) == 0 {
		setHidden(box, true)
		return
	}
	setHidden(box, false)
	if a.progKinds == nil {
		a.progKinds = qa(doc, `[name="programme_kind"]`)
	}
	cubic := false
	for _, el := range a.progKinds {
		if checked(el) && value(el) == "cubic" {
			cubic = true
		}
	}
	key := a.u.Temp
	if cubic {
		key += "c"
	}
	for _, st := range r.Programme {
		key += ";" + fixed(st.TimeMin, 3) + "," + fixed(st.LinearC, 2) + "," + fixed(st.CubicC, 2)
	}
	if a.changed("programme", key) {
		rows := make([][2]string, len(r.Programme))
		for i, st := range r.Programme {
			c := st.LinearC
			if cubic {
				c = st.CubicC
			}
			rows[i] = [2]string{programmeTime(st.TimeMin), programmeTemp(c, a.u)}
		}
		if !exists(a.prog.body) {
			a.prog.body = q(byID("programme"), "tbody")
		}
		a.prog.show(rows)
	}
}

// progTable is the batch screen's cooling programme (time, set-point). It keeps each cell's
// text node, so a keystroke changes the numbers in place: building the rows anew was half of
// the page's changes a keystroke (340 of 687 mutation records over 20 keystrokes).
type progTable struct {
	body  js.Value // the table's tbody, which only show writes
	cells [][2]progCell
}

type progCell struct {
	node js.Value // the cell's text node
	text string
}

func (p *progTable) show(rows [][2]string) {
	for i, r := range rows {
		if i == len(p.cells) {
			tr := add(p.body, "tr", "", "")
			var c [2]progCell
			for j := range c {
				c[j].node = doc.Call("createTextNode", "")
				add(tr, "td", "", "").Call("appendChild", c[j].node)
			}
			p.cells = append(p.cells, c)
		}
		for j, text := range r {
			if c := &p.cells[i][j]; c.text != text {
				c.node.Set("data", text)
				c.text = text
			}
		}
	}
	for len(p.cells) > len(rows) {
		p.body.Get("lastElementChild").Call("remove")
		p.cells = p.cells[:len(p.cells)-1]
	}
}

// fillProgramme writes the rows of the cooling programme with both set-point columns (the
// batch sheet; the batch screen shows one column through progTable).
func fillProgramme(body js.Value, r *recipe.Result, u Units) {
	clear(body)
	for _, s := range r.Programme {
		tr := add(body, "tr", "", "")
		add(tr, "td", "", programmeTime(s.TimeMin))
		add(tr, "td", "", programmeTemp(s.LinearC, u))
		add(tr, "td", "", programmeTemp(s.CubicC, u))
	}
}

// programmeTime and programmeTemp are how a step of the cooling programme reads, on the
// screen and the sheet alike.
func programmeTime(min float64) string { return exact(wire.RoundSig(min, 4)) }

func programmeTemp(tempC float64, u Units) string {
	return fixed(TempFromC(tempC, u), u.TempDecimals(1))
}

// renderSheet fills the printable batch sheet from the recipe and the plan.
func (a *app) renderSheet() {
	r := a.last
	name := r.Recipe.Name
	if name == "" {
		name = "unnamed batch"
	}
	setText(byID("s-name"), name)
	setText(byID("s-date"), today())
	setText(byID("s-checksum"), r.Recipe.Checksum())
	a.renderRecord(r)
	fillList(byID("s-cautions"), sayAll(r.Cautions))
	markCautions(byID("s-cautions"), r.CautionKinds)
	fillList(byID("s-warnings"), orNone(sayAll(r.Warnings)))
	fillList(byID("s-sources"), append(r.Sources, a.curveText(r)))
	setText(byID("s-notes"), r.Recipe.Notes)

	in := byID("s-inputs")
	clear(in)
	row := func(tb js.Value, label, val string) {
		if val == "" {
			return
		}
		tr := add(tb, "tr", "", "")
		th := add(tr, "th", "", label)
		setAttr(th, "scope", "row")
		add(tr, "td", "", val)
	}
	solute := r.SoluteName
	if r.SoluteID != "" && r.SoluteID != solute {
		solute += " (" + r.SoluteID + ")"
	}
	row(in, "Solute", solute)
	row(in, "Form on the shelf", r.ChargedForm)
	row(in, "Purity", exact(wire.RoundSig(r.PurityPct, 4))+" % ("+impuritiesNote+")")
	for _, k := range InputRows(r.Recipe, a.u) {
		if k.Key != "purity_pct" { // shown above from the plan, with its default
			row(in, k.Label, k.Text+" "+k.Unit)
		}
	}

	out := byID("s-results")
	clear(out)
	for _, f := range Figures {
		if text, ut, ok := f.Show(r, a.u); ok {
			row(out, f.Label, text+" "+ut)
		}
	}
	setHTML(byID("s-chart"), a.lastSVG())

	pt := byID("s-programme")
	clear(pt)
	if len(r.Programme) > 0 {
		head := add(pt, "tr", "", "")
		for _, h := range []string{"time, min", "linear, " + a.u.TempSymbol(), "cubic (Mullin & Nývlt), " + a.u.TempSymbol()} {
			th := add(head, "th", "", h)
			setAttr(th, "scope", "col")
		}
		body := add(pt, "tbody", "", "")
		fillProgramme(body, r, a.u)
	}
	setHidden(pt.Get("parentElement"), len(r.Programme) == 0)
}

// renderRecord fills the sheet's weighing record: a row for each amount weighed or measured
// out (and the crystals collected), its planned value as the sheet's results show it, and
// empty cells for what the balance showed, the lot number and the balance used.
func (a *app) renderRecord(r *recipe.Result) {
	tb := q(byID("s-weigh"), "tbody")
	clear(tb)
	show := func(key string) string {
		if f, ok := FigureByKey(key); ok {
			if text, ut, ok := f.Show(r, a.u); ok {
				return text + " " + ut
			}
		}
		return ""
	}
	row := func(what, planned string) {
		if planned == "" {
			return
		}
		tr := add(tb, "tr", "", "")
		setAttr(add(tr, "th", "", what), "scope", "row")
		add(tr, "td", "", planned)
		for range 3 {
			add(tr, "td", "fill", "")
		}
	}
	row("Solid: "+r.ChargedForm, show("charge_g"))
	water := show("water_g")
	for _, in := range InputRows(r.Recipe, a.u) {
		if in.Key == "water_mL" { // measured by volume: the volume first, its mass beside
			water = in.Text + " " + in.Unit + " (" + water + ")"
		}
	}
	row("Water", water)
	if r.HasSeedHint {
		row("Seed crystals", show("seed_low_g")+" to "+show("seed_high_g"))
	}
	row("Crystals collected (expected)", show("crystals_g"))
}
