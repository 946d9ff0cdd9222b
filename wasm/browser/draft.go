package main

import (
	"strconv"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Units are the units the user reads and types: temperature "C", "F" or "K"; mass "g", "kg"
// or "lb"; volume "mL", "L" or "gal" (US). The recipe itself is always °C, g and mL (and K
// for temperature differences). unit.System converts and words them, in figures and in
// the sentences of messages, cautions and warnings (Words).
type Units = unit.System

// DefaultUnits are the units of a first visit.
var DefaultUnits = unit.Metric

// kind says how a value travels between the screen and the recipe: the recipe table's kinds
// (recipe.Kind), and kDelta for a result that is a temperature difference.
type kind = recipe.Kind

const (
	kPlain  = recipe.Plain  // a number in the recipe's own unit (%, K, min, J/K, g/mol)
	kTemp   = recipe.Temp   // °C in the recipe, the user's temperature unit on screen
	kMass   = recipe.Mass   // g in the recipe
	kVolume = recipe.Volume // mL in the recipe
	kText   = recipe.Text   // a string
	kPoints = recipe.Points // the custom compound's points, one "temp solubility" pair a line
)

// groupInputs names the control of the page that picks the Choice of each Group of the
// recipe table: radio buttons whose values are the Choices, or (use_custom) a checkbox.
var groupInputs = map[string]string{"water": "water_basis", "amount": "amount_basis", "solute": "use_custom"}

// Draft is the recipe as it stands on screen: what each field last parsed to (in recipe
// units, under its recipe key; custom compound keys are "custom.name" and so on), the
// choice made in each group of keys (water by mass or volume...) and the fields that do not
// parse. The page rebuilds the recipe from a Draft, so a unit switch re-displays numbers
// without re-reading, and rounding on screen never changes a saved value. Every key comes
// from the recipe table (recipe.Fields), so the draft holds whatever a recipe file can.
type Draft struct {
	recipe.Form
	Errs map[string]error

	specs recipe.Specs // the keys of the recipe kind on screen
}

// NewDraft returns an empty batch recipe draft: water by mass, amount as % of saturation,
// a library solute (the first choice of each group in recipe.Fields).
func NewDraft() *Draft { return newDraft(recipe.FieldSpecs) }

func newDraft(s recipe.Specs) *Draft {
	return &Draft{Form: s.NewForm(), Errs: map[string]error{}, specs: s}
}

// Known reports whether name is a recipe input of the page: a key of the recipe table
// that holds a value.
func Known(name string) bool {
	s, ok := recipe.FieldSpecs.Lookup(name)
	return ok && s.Kind != recipe.Object && !s.Kind.Fixed()
}

// Custom reports whether the draft plans with the user's own compound.
func (d *Draft) Custom() bool { return d.Pick["solute"] == "custom" }

// SetCustom picks the user's own compound (true) or a library solute.
func (d *Draft) SetCustom(on bool) {
	d.Pick["solute"] = "library"
	if on {
		d.Pick["solute"] = "custom"
	}
}

// SwitchWater gives the water by basis ("mass" or "volume") and carries the amount over, as
// the planner converts it: the grams of the volume at its temperature (water_temp_C, else
// recipe.DefaultWaterTempC) by recipe.WaterGPerML, the planner's own density, or the volume of the
// grams at that temperature. With nothing readable to carry (the box left is empty or
// wrong), the new box keeps what it had; an empty one then fails the plan and the page
// marks its last result as stale.
func (d *Draft) SwitchWater(basis string) {
	old := d.Pick["water"]
	d.Pick["water"] = basis
	if old == basis {
		return
	}
	tempC := recipe.DefaultWaterTempC
	if v, ok := d.Num["water_temp_C"]; ok && d.Errs["water_temp_C"] == nil {
		tempC = v
	}
	gPerML := recipe.WaterGPerML(tempC)
	from, to, factor := "water_mL", "water_g", gPerML
	if basis == "volume" {
		from, to, factor = "water_g", "water_mL", 1/gPerML
	}
	v, ok := d.Num[from]
	if !ok || d.Errs[from] != nil || !(factor > 0) {
		return
	}
	d.Num[to] = v * factor
	delete(d.Errs, to)
}

// Set reads what the user typed into field name, in units u. An empty optional number
// clears the field. The error, also kept in d.Errs, is a *unit.FieldError for name.
func (d *Draft) Set(name, text string, u Units) error {
	delete(d.Errs, name)
	s, ok := d.specs.Lookup(name)
	if !ok || s.Kind == recipe.Object || s.Kind.Fixed() {
		return nil
	}
	err := d.set(s, text, u)
	if err != nil {
		d.Errs[name] = err
	}
	return err
}

func (d *Draft) set(s *recipe.Spec, text string, u Units) error {
	name := s.Key
	switch s.Kind {
	case kText:
		if s.Trim {
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
	if _, ok := d.Num[name]; ok && text == d.Display(name, u) {
		// The number as shown, typed back: keep the value itself, not its rounding.
		return nil
	}
	v, err := unit.ParseNumber(name, text)
	if err != nil {
		return err
	}
	switch s.Kind {
	case kPlain:
		if isDelta(s) {
			v = u.DeltaToK(v) // typed in °F-degrees when °F is shown
		}
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

// JSON writes the draft as recipe JSON, with only the keys its choices make active, in the
// order of the recipe format. recipe.Decode checks it and names any bad field.
func (d *Draft) JSON() []byte { return d.specs.FormJSON(&d.Form) }

// Recipe checks the draft as the CLI would check the same recipe file.
func (d *Draft) Recipe() (recipe.Recipe, error) { return recipe.Decode(d.JSON()) }

// FromRecipe makes the draft that shows r.
func FromRecipe(r recipe.Recipe) *Draft {
	d := NewDraft()
	recipe.Fields.ToForm(&r, &d.Form)
	return d
}

// Display is the text field name shows in units u ("" when the field is empty).
func (d *Draft) Display(name string, u Units) string {
	s, ok := d.specs.Lookup(name)
	if !ok {
		return ""
	}
	k := s.Kind
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
	switch {
	case k == kTemp:
		return shownIn(TempFromC(v, u), u.Temp == "C")
	case k == kMass:
		return shownIn(MassFromG(v, u), u.Mass == "g")
	case k == kVolume:
		return shownIn(VolumeFromML(v, u), u.Volume == "mL")
	case isDelta(s):
		return shownIn(u.DeltaFromK(v), u.Temp != "F")
	}
	return exact(v)
}

// isDelta reports whether a key holds a temperature difference in K (the safety margin, the
// metastable width): shown in °F-degrees when °F is shown.
func isDelta(s *recipe.Spec) bool { return s.Kind == kPlain && s.Unit == "K" }

// shownIn is the text of a value in an input: as stored in the recipe's own unit; converted,
// to inputDigits significant figures (5.2834 US gal, not 5.283441047). The draft keeps the
// value itself, so a converted number typed back unchanged is not rounded.
func shownIn(v float64, native bool) string {
	if native {
		return editable(v)
	}
	return exact(wire.RoundSig(v, inputDigits))
}

// inputDigits is how many significant figures a converted value shows in an input: 0.1 °F,
// 0.01 K, 1 mg in a kilogram, well inside what a balance or thermometer reads.
const inputDigits = 5

// unitText is the unit shown beside a recipe key's number in units u.
func unitText(s *recipe.Spec, u Units) string {
	switch s.Kind {
	case kTemp:
		return u.TempSymbol()
	case kMass:
		return u.Mass
	case kVolume:
		return u.VolumeSymbol()
	}
	if isDelta(s) {
		return u.DeltaSymbol()
	}
	return s.Unit
}

// TempFromC converts °C to the user's temperature unit.
func TempFromC(c float64, u Units) float64 { return u.TempFromC(c) }

// MassFromG converts grams to the user's mass unit.
func MassFromG(g float64, u Units) float64 { return u.MassFromG(g) }

// VolumeFromML converts millilitres to the user's volume unit.
func VolumeFromML(ml float64, u Units) float64 { return u.VolumeFromML(ml) }

// exact prints the shortest text that reads back as v, without an exponent.
func exact(v float64) string { return strconv.FormatFloat(v, 'f', -1, 64) }

// editable prints a converted value for an input: ten significant digits hide the binary
// noise of the conversion (35 °C is 95 °F, not 95.00000000000001).
func editable(v float64) string { return exact(wire.RoundSig(v, 10)) }
