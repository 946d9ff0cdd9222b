//go:build js && wasm

package main

import (
	"errors"
	"math"
	"syscall/js"

	"saltcast/core/gas"
	"saltcast/core/unit"
	"saltcast/web/chart"
)

// The dissolved-gas screen: the saturation of O2 (or N2, Ar, CO2, CH4) for the day's water,
// % saturation of a reading, what heating drives out, and a printable oxygen field table. Its
// inputs are named like the service's query keys (gas, temp_C, salinity, pressure with
// pressure_unit, or altitude_m, co2_ppm, measured_mg_per_L, from_C, to_C) and its results
// carry the service's output keys as data-key.

// gasFields are the number inputs of the gas form and whether each is a temperature.
var gasFields = map[string]bool{"temp_C": true, "salinity": false, "pressure": false, "altitude_m": false,
	"co2_ppm": false, "measured_mg_per_L": false, "from_C": true, "to_C": true}

// gasPick holds the form's menus and switches: the gas, the unit of the pressure typed, and
// whether the pressure comes from a barometer reading or from the altitude.
var gasPick = map[string]string{"gas": "O2", "pressure_unit": "kPa", "pressure_from": "barometer"}

// pressureSteps are the field table's column steps in each pressure unit (about 2 kPa).
var pressureSteps = map[string]float64{"kPa": 2, "hPa": 20, "mmHg": 15, "inHg": 0.6, "atm": 0.02}

// pressureResolution is the step a pressure worked out from the altitude is rounded to for
// the field table's columns: about 0.1 kPa.
var pressureResolution = map[string]float64{"kPa": 0.1, "hPa": 1, "mmHg": 1, "inHg": 0.01, "atm": 0.001}

// pressurePlaceholders show one standard atmosphere in each unit.
var pressurePlaceholders = map[string]string{"kPa": "101.325", "hPa": "1013.25", "mmHg": "760", "inHg": "29.92", "atm": "1"}

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
		if _, ok := gasPick[name]; ok {
			gasPick[name] = value(el)
			a.gasChoices()
			a.recomputeGas()
			return
		}
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
	a.gasChoices()
	a.recomputeGas()
}

// gasChoices shows the inputs the form's menus call for: the barometer reading or the
// altitude, CO2 in the air for CO2, the gas's name by the measured value.
func (a *app) gasChoices() {
	byAlt := gasPick["pressure_from"] == "altitude"
	setHidden(byID("g-pressure-box"), byAlt)
	setHidden(byID("g-altitude-box"), !byAlt)
	setHidden(byID("g-co2-box"), gasPick["gas"] != "CO2")
	setAttr(byID("g-pressure"), "placeholder", pressurePlaceholders[gasPick["pressure_unit"]])
	setText(q(byID("gas"), ".g-gasname"), gasLabel(gasPick["gas"]))
	// A field hidden by the switch no longer holds the screen back.
	for _, name := range []string{"pressure", "altitude_m", "co2_ppm"} {
		if gasBad[name] && !gasUsed(name) {
			delete(gasBad, name)
			a.gasFieldError(name, nil)
		}
	}
}

// gasUsed reports whether the number input name counts with the form's choices.
func gasUsed(name string) bool {
	switch name {
	case "pressure":
		return gasPick["pressure_from"] != "altitude"
	case "altitude_m":
		return gasPick["pressure_from"] == "altitude"
	case "co2_ppm":
		return gasPick["gas"] == "CO2"
	}
	return true
}

// gasLabel writes a gas formula with subscript digits (O₂, CH₄).
func gasLabel(id string) string {
	out := []rune(id)
	for i, r := range out {
		if r >= '0' && r <= '9' {
			out[i] = '₀' + (r - '0')
		}
	}
	return string(out)
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
	bad := false
	for name := range gasBad {
		bad = bad || gasUsed(name)
	}
	if bad {
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
	pUnit := gasPick["pressure_unit"]
	kPa := gas.StdKPa
	altNote := ""
	var extraSources []string
	if gasPick["pressure_from"] == "altitude" {
		if h, ok := gasNums["altitude_m"]; ok {
			var err error
			if kPa, err = gas.AltitudeKPa(h); err != nil {
				return err
			}
			altNote = "Standard atmosphere at this altitude: " + pressureText(kPa, pUnit) +
				". The day's pressure can differ by a few kPa: a barometer reading is better."
			extraSources = append(extraSources, "barometric pressure from altitude: U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), troposphere")
		}
	} else if p, ok := gasNums["pressure"]; ok {
		var err error
		if kPa, err = gas.PressureKPa("pressure", p, pUnit); err != nil {
			return err
		}
	}
	setText(byID("g-altitude-kPa"), altNote)
	cond := gas.Conditions{TempC: tempC, Salinity: gasNums["salinity"], PressureKPa: kPa}
	sat, err := gasSaturation(cond)
	if err != nil {
		return err
	}
	warnings := append([]string(nil), sat.Warnings...)
	sources := append([]string{sat.Source}, extraSources...)
	var cautions []string
	pointsToSDS := false
	shown := map[string]string{
		"saturation_mg_per_L":    unit.FormatNumber(sat.MgPerL, 4),
		"saturation_umol_per_kg": unit.FormatNumber(sat.UmolPerKg, 4),
	}
	var measured *float64
	if m, ok := gasNums["measured_mg_per_L"]; ok {
		if m < 0 || m > gas.MeasuredMaxMgPerL {
			return unit.NumberError("measured_mg_per_L", m, "a measured concentration from 0 to 100 mg/L")
		}
		if sat.MgPerL > 0 { // none with CO2-free air
			shown["percent_saturation"] = unit.FormatNumber(100*m/sat.MgPerL, 3)
		}
		if gasPick["gas"] == "O2" {
			measured = &m
		}
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

	cols, colsKPa := pressureColumns(kPa, pUnit, altNote != "")
	tbl, err := gas.OxygenTable(steps(0, 40, 1), gas.ColumnsPressure, colsKPa, cond.Salinity, gas.BensonKrause)
	if err != nil {
		return err
	}

	name := gasLabel(gasPick["gas"])
	for _, t := range gasTiles {
		if t.key == "saturation_mg_per_L" || t.key == "saturation_umol_per_kg" {
			setText(q(t.box, ".lbl"), name+" at saturation")
			setAttr(t.box, "aria-label", name+" at saturation")
		} else if t.key == "percent_saturation" {
			setText(q(t.box, ".lbl"), "Measured "+name+" is")
			setAttr(t.box, "aria-label", "Measured "+name+" is")
		}
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
	v, err := chart.OxygenChartView(gas.Conditions{TempC: tempC, Salinity: cond.Salinity, PressureKPa: kPa}, gas.BensonKrause, measured, chart.Options{Temp: chartUnit(a.u)})
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
	a.gasTable(tbl, cols, pUnit)
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

// pressureColumns are the field table's pressures in the unit shown (cols) and in kPa: the
// day's and two either side, about 2 kPa apart, kept inside the range the equations take.
// rounded centres them on the day's pressure rounded to pressureResolution (for a pressure
// worked out from the altitude rather than typed).
func pressureColumns(day float64, pUnit string, rounded bool) (cols, kPa []float64) {
	per, err := gas.PressureKPa("pressure", 1, pUnit)
	if err != nil {
		per, pUnit = 1, "kPa"
	}
	center := day / per
	if rounded {
		center = math.Round(center/pressureResolution[pUnit]) * pressureResolution[pUnit]
	}
	for _, d := range []float64{-2, -1, 0, 1, 2} {
		c := center + d*pressureSteps[pUnit]
		if p := c * per; p >= gas.O2MinKPa && p <= gas.O2MaxKPa {
			cols = append(cols, c)
			kPa = append(kPa, p)
		}
	}
	return cols, kPa
}

// pressureText shows a pressure given in kPa in the unit pUnit.
func pressureText(kPa float64, pUnit string) string {
	per, err := gas.PressureKPa("pressure", 1, pUnit)
	if err != nil {
		per, pUnit = 1, "kPa"
	}
	return unit.FormatNumber(kPa/per, 4) + " " + pUnit
}

// gasSaturation works out the chosen gas at saturation as the service does: O2 by Benson &
// Krause, CO2 by Weiss, N2, Ar and CH4 by Henry's law (fresh water only).
func gasSaturation(c gas.Conditions) (gas.Oxygen, error) {
	id := gasPick["gas"]
	if id == "O2" {
		return gas.OxygenSaturation(c, gas.BensonKrause)
	}
	var d gas.Dissolved
	var err error
	co2PPM, ok := gasNums["co2_ppm"]
	if !ok {
		co2PPM = gas.DefaultCO2PPM
	}
	if id == "CO2" {
		d, err = gas.CO2Saturation(c, co2PPM)
		if !ok && err == nil {
			d.Warnings = append(d.Warnings, "CO2 in the air taken as "+unit.FormatCompact(gas.DefaultCO2PPM, 4)+
				" ppm, about the global mean of "+itoa(gas.DefaultCO2Year)+"; indoors and near plants or traffic it is often higher")
		}
	} else {
		g, lerr := gas.Lookup(id)
		if lerr != nil {
			return gas.Oxygen{}, lerr
		}
		if c.Salinity != 0 {
			return gas.Oxygen{}, unit.NumberError("salinity", c.Salinity,
				"0 for "+gasLabel(id)+" (no sourced salinity correction here; O₂ and CO₂ take salinity)")
		}
		d, err = gas.AirSaturated(g, c.TempC, c.PressureKPa, co2PPM)
	}
	if err != nil {
		return gas.Oxygen{}, err
	}
	return gas.Oxygen{MgPerL: d.MgPerL, UmolPerKg: d.UmolPerKg, Method: d.Method, Source: d.Source, Warnings: d.Warnings}, nil
}

func (a *app) gasTable(t gas.Table, cols []float64, pUnit string) {
	tbl := byID("gas-table")
	clear(tbl)
	head := add(tbl, "thead", "", "")
	tr := add(head, "tr", "", "")
	th := add(tr, "th", "", a.u.TempSymbol()+" \\ "+pUnit)
	setAttr(th, "scope", "col")
	for _, p := range cols {
		th := add(tr, "th", "", unit.FormatCompact(p, 6))
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
	cap := add(tbl, "caption", "", "Practical salinity "+unit.FormatNumber(t.Fixed, 3)+" · "+t.Method)
	tbl.Call("prepend", cap)
}
