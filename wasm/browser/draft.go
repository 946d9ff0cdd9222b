package main

import (
	"strconv"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Units are the units the user reads and types: temperature "C", "F" or "K"; mass "g", "kg"
// or "lb"; volume "mL", "L" or "gal" (US). The recipe itself is always °C, g and mL.
type Units struct{ Temp, Mass, Volume string }

// DefaultUnits are the units of a first visit.
var DefaultUnits = Units{Temp: "C", Mass: "g", Volume: "mL"}

// TempSymbol is the symbol shown beside a temperature.
func (u Units) TempSymbol() string {
	switch u.Temp {
	case "F":
		return "°F"
	case "K":
		return "K"
	}
	return "°C"
}

// VolumeSymbol is the symbol shown beside a volume.
func (u Units) VolumeSymbol() string {
	if u.Volume == "gal" {
		return "US gal"
	}
	return u.Volume
}

// kind says how a field travels between the screen and the recipe.
type kind uint8

const (
	kPlain  kind = iota // a number in the recipe's own unit (%, K, min, J/K, g/mol)
	kTemp               // °C in the recipe, the user's temperature unit on screen
	kMass               // g in the recipe
	kVolume             // mL in the recipe
	kText               // a string
	kPoints             // the custom compound's points, one "temp solubility" pair a line
)

// fieldKinds lists every recipe input of the page by its name (the recipe JSON key; custom
// compound keys are prefixed "custom.").
var fieldKinds = map[string]kind{
	"name": kText, "notes": kText, "solute": kText, "charged_form": kText,
	"purity_pct": kPlain, "water_g": kMass, "water_mL": kVolume, "water_temp_C": kTemp,
	"dissolve_temp_C": kTemp, "saturation_pct": kPlain, "charge_g": kMass,
	"clear_down_to_C": kTemp, "clear_margin_K": kPlain,
	"cool_to_C": kTemp, "evaporated_water_g": kMass, "seed_at_C": kTemp,
	"metastable_width_K": kPlain, "cooling_time_min": kPlain,
	"vessel_heat_capacity_J_per_K": kPlain,
	"custom.name":                  kText, "custom.molar_mass_g_per_mol": kPlain, "custom.points": kPoints,
	"custom.model": kText, "custom.source": kText, "custom.solution_enthalpy_kJ_per_mol": kPlain,
}

// Draft is the recipe as it stands on screen: what each field last parsed to (in recipe
// units) and the fields that do not parse. The page rebuilds the recipe from a Draft, so a
// unit switch re-displays numbers without re-reading, and rounding on screen never changes
// a saved value.
type Draft struct {
	Text   map[string]string
	Num    map[string]float64
	Points []recipe.Point
	Errs   map[string]error

	Water  string // "mass" or "volume"
	Amount string // "saturation", "charge" or "clear"
	Custom bool   // the user's own compound instead of a library solute
}

// NewDraft returns an empty draft: water by mass, amount as % of saturation.
func NewDraft() *Draft {
	return &Draft{Text: map[string]string{}, Num: map[string]float64{}, Errs: map[string]error{},
		Water: "mass", Amount: "saturation"}
}

// Known reports whether name is a recipe input of the page.
func Known(name string) bool { _, ok := fieldKinds[name]; return ok }

// Set reads what the user typed into field name, in units u. An empty optional number
// clears the field. The error, also kept in d.Errs, is a *unit.FieldError for name.
func (d *Draft) Set(name, text string, u Units) error {
	delete(d.Errs, name)
	k, ok := fieldKinds[name]
	if !ok {
		return nil
	}
	err := d.set(name, k, text, u)
	if err != nil {
		d.Errs[name] = err
	}
	return err
}

func (d *Draft) set(name string, k kind, text string, u Units) error {
	switch k {
	case kText:
		if name == "solute" || name == "charged_form" || name == "custom.model" {
			text = strings.TrimSpace(text)
		}
		if text == "" {
			delete(d.Text, name)
		} else {
			d.Text[name] = text
		}
		return nil
	case kPoints:
		pts, err := ParsePoints(name, text)
		if err != nil {
			return err
		}
		d.Points = pts
		return nil
	}
	if strings.TrimSpace(text) == "" {
		delete(d.Num, name)
		return nil
	}
	v, err := unit.ParseNumber(name, text)
	if err != nil {
		return err
	}
	switch k {
	case kTemp:
		v, err = unit.ToCelsius(name, v, u.Temp)
	case kMass:
		v, err = unit.ToGrams(name, v, u.Mass)
	case kVolume:
		v, err = unit.ToMilliliters(name, v, u.Volume)
	}
	if err != nil {
		return err
	}
	d.Num[name] = v
	return nil
}

// ParsePoints reads solubility points, one a line: temperature in °C and solubility in g per
// 100 g water, separated by a semicolon, a tab or spaces (so a decimal comma stays free:
// "20; 31,6"). Blank lines and lines starting with # are skipped.
func ParsePoints(field, text string) ([]recipe.Point, error) {
	var pts []recipe.Point
	for i, line := range strings.Split(text, "\n") {
		line = strings.TrimSpace(line)
		if line == "" || strings.HasPrefix(line, "#") {
			continue
		}
		f := strings.FieldsFunc(line, func(r rune) bool { return r == ';' || r == '\t' || r == ' ' })
		where := field + " line " + strconv.Itoa(i+1)
		if len(f) != 2 {
			return nil, &unit.FieldError{Field: field, Value: line,
				Allowed: "on " + where + ": a temperature (°C) and a solubility (g per 100 g water) separated by a semicolon or a space"}
		}
		t, err := unit.ParseNumber(where+" temperature", f[0])
		if err != nil {
			return nil, relabel(err, field)
		}
		g, err := unit.ParseNumber(where+" solubility", f[1])
		if err != nil {
			return nil, relabel(err, field)
		}
		pts = append(pts, recipe.Point{TempC: t, GPer100gWater: g})
	}
	return pts, nil
}

// relabel keeps a FieldError's detail but files it under field.
func relabel(err error, field string) error {
	if fe, ok := err.(*unit.FieldError); ok {
		return &unit.FieldError{Field: field, Value: fe.Value, Allowed: fe.Field + ": " + fe.Allowed}
	}
	return err
}

// FormatPoints writes points as ParsePoints reads them.
func FormatPoints(pts []recipe.Point) string {
	var b strings.Builder
	for i, p := range pts {
		if i > 0 {
			b.WriteByte('\n')
		}
		b.WriteString(exact(p.TempC))
		b.WriteString("; ")
		b.WriteString(exact(p.GPer100gWater))
	}
	return b.String()
}

// JSON writes the draft as recipe JSON, with only the keys its switches make active, in the
// order of the recipe format. recipe.Decode checks it and names any bad field.
func (d *Draft) JSON() []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("format").Int(recipe.CurrentFormat)
	str := func(k string) {
		if v, ok := d.Text[k]; ok {
			e.Key(strings.TrimPrefix(k, "custom.")).String(v)
		}
	}
	num := func(k string) {
		if v, ok := d.Num[k]; ok {
			e.Key(strings.TrimPrefix(k, "custom.")).Float(v)
		}
	}
	str("name")
	str("notes")
	if d.Custom {
		e.Key("custom").BeginObject()
		e.Key("name").String(d.Text["custom.name"])
		num("custom.molar_mass_g_per_mol")
		e.Key("points").BeginArray()
		for _, p := range d.Points {
			e.BeginArray().Float(p.TempC).Float(p.GPer100gWater).EndArray()
		}
		e.EndArray()
		str("custom.model")
		str("custom.source")
		num("custom.solution_enthalpy_kJ_per_mol")
		e.EndObject()
	} else {
		str("solute")
		str("charged_form")
	}
	num("purity_pct")
	if d.Water == "volume" {
		num("water_mL")
		num("water_temp_C")
	} else {
		num("water_g")
	}
	num("dissolve_temp_C")
	switch d.Amount {
	case "charge":
		num("charge_g")
	case "clear":
		num("clear_down_to_C")
		num("clear_margin_K")
	default:
		num("saturation_pct")
	}
	for _, k := range []string{"cool_to_C", "evaporated_water_g", "seed_at_C", "metastable_width_K",
		"cooling_time_min", "vessel_heat_capacity_J_per_K"} {
		num(k)
	}
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		// Every number in a draft came through unit.ParseNumber, which refuses NaN and Inf.
		panic("draft: " + err.Error())
	}
	return b
}

// Recipe checks the draft as the CLI would check the same recipe file.
func (d *Draft) Recipe() (recipe.Recipe, error) { return recipe.Decode(d.JSON()) }

// FromRecipe makes the draft that shows r.
func FromRecipe(r recipe.Recipe) *Draft {
	d := NewDraft()
	text := func(k, v string) {
		if v != "" {
			d.Text[k] = v
		}
	}
	num := func(k string, o recipe.Opt) {
		if o.Set {
			d.Num[k] = o.Value
		}
	}
	text("name", r.Name)
	text("notes", r.Notes)
	text("solute", r.Solute)
	text("charged_form", r.ChargedForm)
	if c := r.Custom; c != nil {
		d.Custom = true
		text("custom.name", c.Name)
		d.Num["custom.molar_mass_g_per_mol"] = c.MolarMassGPerMol
		d.Points = append([]recipe.Point(nil), c.Points...)
		text("custom.model", c.Model)
		text("custom.source", c.Source)
		num("custom.solution_enthalpy_kJ_per_mol", c.SolutionEnthalpyKJPerMol)
	}
	num("purity_pct", r.PurityPct)
	num("water_g", r.WaterG)
	num("water_mL", r.WaterML)
	num("water_temp_C", r.WaterTempC)
	if r.WaterML.Set {
		d.Water = "volume"
	}
	d.Num["dissolve_temp_C"] = r.DissolveTempC
	num("saturation_pct", r.SaturationPct)
	num("charge_g", r.ChargeG)
	num("clear_down_to_C", r.ClearDownToC)
	num("clear_margin_K", r.ClearMarginK)
	switch {
	case r.ChargeG.Set:
		d.Amount = "charge"
	case r.ClearDownToC.Set:
		d.Amount = "clear"
	}
	num("cool_to_C", r.CoolToC)
	num("evaporated_water_g", r.EvaporatedWaterG)
	num("seed_at_C", r.SeedAtC)
	num("metastable_width_K", r.MetastableWidthK)
	num("cooling_time_min", r.CoolingTimeMin)
	num("vessel_heat_capacity_J_per_K", r.VesselHeatCapacityJPerK)
	return d
}

// Display is the text field name shows in units u ("" when the field is empty).
func (d *Draft) Display(name string, u Units) string {
	k := fieldKinds[name]
	switch k {
	case kText:
		return d.Text[name]
	case kPoints:
		return FormatPoints(d.Points)
	}
	v, ok := d.Num[name]
	if !ok {
		return ""
	}
	switch k {
	case kTemp:
		return editable(TempFromC(v, u))
	case kMass:
		return editable(MassFromG(v, u))
	case kVolume:
		return editable(VolumeFromML(v, u))
	}
	return exact(v)
}

// TempFromC converts °C to the user's temperature unit.
func TempFromC(c float64, u Units) float64 {
	switch u.Temp {
	case "F":
		return unit.FahrenheitFromCelsius(c)
	case "K":
		return unit.KelvinFromCelsius(c)
	}
	return c
}

// MassFromG converts grams to the user's mass unit.
func MassFromG(g float64, u Units) float64 {
	switch u.Mass {
	case "kg":
		return unit.KilogramsFromGrams(g)
	case "lb":
		return unit.PoundsFromGrams(g)
	}
	return g
}

// VolumeFromML converts millilitres to the user's volume unit.
func VolumeFromML(ml float64, u Units) float64 {
	switch u.Volume {
	case "L":
		return unit.LitersFromMilliliters(ml)
	case "gal":
		return unit.USGallonsFromMilliliters(ml)
	}
	return ml
}

// exact prints the shortest text that reads back as v, without an exponent.
func exact(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }

// editable prints a converted value for an input: ten significant digits hide the binary
// noise of the conversion (35 °C is 95 °F, not 95.00000000000001).
func editable(v float64) string { return exact(wire.RoundSig(v, 10)) }
