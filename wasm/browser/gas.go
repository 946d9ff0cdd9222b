//go:build js && wasm

package main

import (
	"errors"
	"syscall/js"

	"saltcast/core/gas"
	"saltcast/core/unit"
	"saltcast/web/chart"
)

// The dissolved-gas screen: O2 saturation for the day's water, % saturation of a reading,
// what heating drives out, and a printable field table. Its inputs are named like the
// service's query keys (temp_C, salinity, pressure_kPa, measured_mg_per_L, from_C, to_C) and
// its results carry the service's output keys as data-key.

// gasFields are the inputs of the gas form and whether each is a temperature.
var gasFields = map[string]bool{"temp_C": true, "salinity": false, "pressure_kPa": false,
	"measured_mg_per_L": false, "from_C": true, "to_C": true}

// gasDefaults are the values of a first visit: a cool day at sea level (invented).
var gasDefaults = map[string]float64{"temp_C": 12, "from_C": 12, "to_C": 80}

type gasTile struct {
	key, label, unit string
	out, box         js.Value
}

var (
	gasNums  = map[string]float64{}
	gasBad   = map[string]bool{}
	gasTiles []gasTile
)

func (a *app) startGas() {
	form := byID("gas")
	for k, v := range gasDefaults {
		gasNums[k] = v
	}
	for name := range gasFields {
		if v, ok := gasNums[name]; ok {
			in := q(form, `[name="`+name+`"]`)
			setValue(in, editable(a.gasShow(name, v)))
		}
	}
	figs := byID("gas-figures")
	for _, t := range []struct{ key, label, unit string }{
		{"saturation_mg_per_L", "O₂ at saturation", "mg/L"},
		{"saturation_umol_per_kg", "O₂ at saturation", "µmol/kg"},
		{"percent_saturation", "Measured O₂ is", "% of saturation"},
		{"total_released_mL_per_L", "Gas driven out on heating", "mL per L of water"},
		{"bubble_temp_C", "Gas starts to leave", "temp"},
	} {
		box := addFigure(figs, t.label)
		val := add(box, "span", "val", "")
		out := add(val, "output", "", "—")
		setAttr(out, "data-key", t.key)
		val.Call("appendChild", doc.Call("createTextNode", " "))
		u := add(val, "span", "u", t.unit)
		if t.unit == "temp" {
			setAttr(u, "data-unit", "temp")
			setText(u, a.u.TempSymbol())
		}
		gasTiles = append(gasTiles, gasTile{key: t.key, label: t.label, unit: t.unit, out: out, box: box})
	}
	on(form, "input", func(el js.Value, _ event) {
		name := attr(el, "name")
		if _, ok := gasFields[name]; !ok {
			return
		}
		delete(gasBad, name)
		a.gasFieldError(name, nil)
		text := value(el)
		if text == "" {
			delete(gasNums, name)
		} else if v, err := a.gasParse(name, text); err != nil {
			gasBad[name] = true
			a.gasFieldError(name, err)
		} else {
			gasNums[name] = v
		}
		a.recomputeGas()
	})
	on(form, "submit", func(_ js.Value, ev event) { ev.PreventDefault() })
	a.recomputeGas()
}

func (a *app) gasShow(name string, c float64) float64 {
	if gasFields[name] {
		return TempFromC(c, a.u)
	}
	return c
}

func (a *app) gasParse(name, text string) (float64, error) {
	v, err := unit.ParseNumber(name, text)
	if err != nil || !gasFields[name] {
		return v, err
	}
	return unit.ToCelsius(name, v, a.u.Temp)
}

func (a *app) gasFieldError(name string, err error) {
	in := q(byID("gas"), `[name="`+name+`"]`)
	msg := byID("m-g-" + name)
	if !exists(in) || !exists(msg) {
		return
	}
	if err == nil {
		in.Call("removeAttribute", "aria-invalid")
		setText(msg, "")
		return
	}
	setAttr(in, "aria-invalid", "true")
	setText(msg, fieldMessage(err, value(in)))
}

// recomputeGas works out the gas screen; on an error it keeps the last good figures.
func (a *app) recomputeGas() {
	form := byID("gas")
	if !exists(form) {
		return
	}
	// Temperatures on screen follow the unit switch; a field being corrected keeps its text.
	for name, isTemp := range gasFields {
		if v, ok := gasNums[name]; ok && isTemp && !gasBad[name] {
			in := q(form, `[name="`+name+`"]`)
			if exists(in) && !doc.Get("activeElement").Equal(in) {
				setValue(in, editable(a.gasShow(name, v)))
			}
		}
	}
	stale := byID("gas-stale")
	if len(gasBad) > 0 {
		setHidden(stale, false)
		return
	}
	if err := a.gasCompute(); err != nil {
		var fe *unit.FieldError
		if errors.As(err, &fe) {
			if _, ok := gasFields[fe.Field]; ok {
				a.gasFieldError(fe.Field, err)
			}
		}
		setText(stale, "Showing the last good result. "+fieldMessage(err, ""))
		setHidden(stale, false)
		return
	}
	setHidden(stale, true)
	setText(stale, "Showing the last good result: correct the marked field to update.")
}

func (a *app) gasCompute() error {
	tempC, ok := gasNums["temp_C"]
	if !ok {
		return &unit.FieldError{Field: "temp_C", Allowed: "the water temperature"}
	}
	kPa, ok := gasNums["pressure_kPa"]
	if !ok {
		kPa = gas.StdKPa
	}
	cond := gas.Conditions{TempC: tempC, Salinity: gasNums["salinity"], PressureKPa: kPa}
	sat, err := gas.OxygenSaturation(cond, gas.BensonKrause)
	if err != nil {
		return err
	}
	warnings := append([]string(nil), sat.Warnings...)
	sources := []string{sat.Source}
	var cautions []string
	pointsToSDS := false
	shown := map[string]string{
		"saturation_mg_per_L":    unit.FormatNumber(sat.MgPerL, 4),
		"saturation_umol_per_kg": unit.FormatNumber(sat.UmolPerKg, 4),
	}
	var measured *float64
	if m, ok := gasNums["measured_mg_per_L"]; ok {
		pct, err := gas.PercentSaturation(m, sat)
		if err != nil {
			return err
		}
		shown["percent_saturation"] = unit.FormatNumber(pct, 3)
		measured = &m
	}
	from, okF := gasNums["from_C"]
	to, okT := gasNums["to_C"]
	if okF && okT {
		o, err := gas.Outgas(gas.OutgasInput{FromC: from, ToC: to, PressureKPa: kPa, CO2PPM: gas.DefaultCO2PPM})
		if err != nil {
			return err
		}
		shown["total_released_mL_per_L"] = unit.FormatNumber(o.TotalMLPerL, 3)
		if o.BubbleFound {
			// Water saturated with air at the start holds all the gas it can: any warming lets
			// gas out, so the bubble temperature is the start temperature and says nothing new.
			if o.BubbleTempC-from < bubbleAtOnceK {
				shown["bubble_temp_C"] = bubbleAtOnce
			} else {
				shown["bubble_temp_C"] = fixed(TempFromC(o.BubbleTempC, a.u), 1)
			}
		}
		warnings = append(warnings, o.Warnings...)
		warnings = append(warnings, o.Notes...)
		cautions = append(cautions, o.Cautions...)
		pointsToSDS = o.PointsToSDS()
		sources = append(sources, o.Source)
	}

	tbl, err := gas.OxygenTable(steps(0, 40, 1), gas.ColumnsPressure, pressureColumns(kPa), cond.Salinity, gas.BensonKrause)
	if err != nil {
		return err
	}

	for _, t := range gasTiles {
		s, ok := shown[t.key]
		if !ok {
			s = "—"
		}
		setText(t.out, s)
		setHidden(t.box, !ok)
		if t.key == "bubble_temp_C" {
			words := s == bubbleAtOnce
			setHidden(q(t.box, ".u"), words)
			sub := q(t.box, ".sub")
			if !exists(sub) {
				sub = add(t.box, "span", "sub", bubbleWhy)
			}
			setHidden(sub, !words)
		}
	}
	// The chart goes through web/chart's one oxygen adapter (curve, label, units, notes);
	// anything it cannot draw becomes a placeholder saying why. (chart.OxygenSVG does the same
	// but links its own copy of this fallback: 1 904 B more code in the module, measured 2 Dec 2026.)
	v, err := chart.OxygenChartView(cond, gas.BensonKrause, measured, chart.Options{Temp: chartUnit(a.u)})
	svg := ""
	if err == nil {
		var c chart.Chart
		if c, err = chart.Oxygen(v); err == nil {
			svg, err = chart.Render(c)
		}
	}
	if err != nil {
		svg = chart.Placeholder("Oxygen saturation", "No chart: "+err.Error())
	}
	setHTML(byID("gas-chart"), svg) // SVG from web/chart, text escaped there
	a.gasTable(tbl)
	if !pointsToSDS {
		cautions = append(cautions, gasCaution)
	}
	fillList(byID("gas-cautions"), cautions)
	fillList(byID("gas-warnings"), orNone(warnings))
	fillList(byID("gas-sources"), sources)
	return nil
}

// bubbleAtOnceK: a bubble temperature this close to the start is the start itself
// (air-saturated water), said in words.
const bubbleAtOnceK = 0.5

// bubbleAtOnce is what the technician needs to know about air-saturated water.
const bubbleAtOnce = "as soon as it warms"

// bubbleWhy says why, under the figure.
const bubbleWhy = "Water saturated with air holds all the gas it can: every degree of warming drives some out. " +
	"Bubbles show on walls and probes a few degrees later; boil or pull a vacuum first if they matter."

// gasCaution closes the gas screen's cautions, as the planner's general caution closes a
// batch's.
const gasCaution = "Saltcast is a planning aid, not a safety assessment: hot water scalds and heated " +
	"closed vessels build pressure; follow your local rules and licensed practice, and the SDS of anything added to the water."

func steps(from, to, step float64) []float64 {
	var out []float64
	for t := from; t <= to+step/2; t += step {
		out = append(out, t)
	}
	return out
}

// pressureColumns are the field table's pressures: the day's and two either side, 2 kPa apart,
// kept inside the range the equations take.
func pressureColumns(day float64) []float64 {
	var cols []float64
	for _, d := range []float64{-4, -2, 0, 2, 4} {
		p := day + d
		if p >= gas.O2MinKPa && p <= gas.O2MaxKPa {
			cols = append(cols, p)
		}
	}
	return cols
}

func (a *app) gasTable(t gas.Table) {
	tbl := byID("gas-table")
	clear(tbl)
	head := add(tbl, "thead", "", "")
	tr := add(head, "tr", "", "")
	th := add(tr, "th", "", a.u.TempSymbol()+" \\ kPa")
	setAttr(th, "scope", "col")
	for _, p := range t.Columns {
		th := add(tr, "th", "", unit.FormatNumber(p, 4))
		setAttr(th, "scope", "col")
	}
	body := add(tbl, "tbody", "", "")
	for i, tc := range t.TempsC {
		tr := add(body, "tr", "", "")
		th := add(tr, "th", "", fixed(TempFromC(tc, a.u), 1))
		setAttr(th, "scope", "row")
		for _, v := range t.MgPerL[i] {
			add(tr, "td", "", fixed(v, 2))
		}
	}
	cap := add(tbl, "caption", "", "Salinity "+unit.FormatNumber(t.Fixed, 3)+" g/kg · "+t.Method)
	tbl.Call("prepend", cap)
}
