package recipe

import (
	"errors"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

// CurrentFormat is the recipe format this Saltcast writes and the newest it reads.
const CurrentFormat = 1

// Opt is an optional number: Set says whether the recipe gave it.
type Opt struct {
	Value float64
	Set   bool
}

// Some returns a set Opt holding v.
func Some(v float64) Opt { return Opt{Value: v, Set: true} }

// Or returns the value if set, else def.
func (o Opt) Or(def float64) float64 {
	if o.Set {
		return o.Value
	}
	return def
}

// Recipe is one batch as a technician describes it. Zero values of optional fields mean
// "not given"; Plan applies the documented defaults. The JSON key of each field is in its
// comment.
type Recipe struct {
	Format int    // "format": 1; a missing format reads as 1
	Name   string // "name"
	Notes  string // "notes"

	Solute      string  // "solute": a library id or name; exclusive with Custom
	ChargedForm string  // "charged_form": the form on the shelf; "" = anhydrous
	PurityPct   Opt     // "purity_pct": 0 < p ≤ 100, default 100
	Custom      *Custom // "custom": the user's own compound

	WaterG     Opt // "water_g": water added, g; exclusive with WaterML
	WaterML    Opt // "water_mL": water added by volume, mL
	WaterTempC Opt // "water_temp_C": temperature of the measured volume, default 20 °C

	DissolveTempC float64 // "dissolve_temp_C": required

	// At most one of these three sets the charge; with none, the charge saturates the
	// water at the dissolve temperature (saturation_pct 100).
	SaturationPct Opt // "saturation_pct": 0 < q ≤ 100, % of saturation at the dissolve temperature
	ChargeG       Opt // "charge_g": grams of the charged form
	ClearDownToC  Opt // "clear_down_to_C": the most that stays clear down to this temperature
	ClearMarginK  Opt // "clear_margin_K": the saturation temperature lies this far below ClearDownToC, default 2 K

	CoolToC          Opt // "cool_to_C": filtration or storage temperature
	EvaporatedWaterG Opt // "evaporated_water_g": water lost before filtration
	SeedAtC          Opt // "seed_at_C": cooled unseeded to here, then seeded in an insulated vessel
	MetastableWidthK Opt // "metastable_width_K": width of the metastable zone below saturation
	CoolingTimeMin   Opt // "cooling_time_min": duration of the cooling programme

	LiquorHeatCapacityKJPerKgK Opt // "liquor_heat_capacity_kJ_per_kgK": replaces the built-in model
	VesselHeatCapacityJPerK    Opt // "vessel_heat_capacity_J_per_K": vessel and stirrer, default 0
}

// Custom is a compound the user describes: an anhydrous solid with its own solubility data.
type Custom struct {
	Name                     string  // "name"
	MolarMassGPerMol         float64 // "molar_mass_g_per_mol"
	Points                   []Point // "points": [[temp_C, g_per_100g_water], ...]
	Model                    string  // "model": table (default), vant-hoff, apelblat or polynomial
	Source                   string  // "source": where the points come from
	SolutionEnthalpyKJPerMol Opt     // "solution_enthalpy_kJ_per_mol": positive = dissolving absorbs heat
}

// Point is one user solubility point.
type Point struct {
	TempC         float64
	GPer100gWater float64
}

// Custom-model names accepted in "model".
var customModels = []string{"table", "vant-hoff", "apelblat", "polynomial"}

// MaxNameBytes is the longest recipe name Decode reads, in bytes of UTF-8.
const MaxNameBytes = maxTextName

// Plausibility bounds checked while decoding; the compound's own range is checked by Plan.
const (
	minTempC    = -40.0
	maxTempC    = 150.0
	minMassG    = 1e-3 // 1 mg: no balance weighs less (common practice), and it keeps subnormal numbers out
	maxMassG    = 1e7  // 10 t
	maxTextName = 200
	maxTextNote = 4000
)

var recipeKeys = []string{"format", "name", "notes", "solute", "charged_form", "purity_pct", "custom",
	"water_g", "water_mL", "water_temp_C", "dissolve_temp_C", "saturation_pct", "charge_g",
	"clear_down_to_C", "clear_margin_K", "cool_to_C", "evaporated_water_g", "seed_at_C",
	"metastable_width_K", "cooling_time_min", "liquor_heat_capacity_kJ_per_kgK",
	"vessel_heat_capacity_J_per_K"}

var customKeys = []string{"name", "molar_mass_g_per_mol", "points", "model", "source",
	"solution_enthalpy_kJ_per_mol"}

// Decode reads one recipe strictly: unknown keys, wrong types, non-finite or absurd numbers
// and contradictory keys are refused with a *unit.FieldError naming the key; malformed JSON
// is a *wire.SyntaxError. A recipe without "format" is read as format 1 (the only format so
// far); a newer format is refused with a message to update Saltcast.
func Decode(data []byte) (Recipe, error) {
	v, err := wire.Decode(data)
	if err != nil {
		return Recipe{}, err
	}
	return fromValue(v, "")
}

// DecodeValue checks one recipe object already read as JSON, as Decode does.
func DecodeValue(v wire.Value) (Recipe, error) { return fromValue(v, "") }

// fromValue checks one recipe object; prefix goes in front of field names ("recipes[2].").
func fromValue(v wire.Value, prefix string) (Recipe, error) {
	if v.Kind != wire.Object {
		return Recipe{}, &unit.FieldError{Field: strings.TrimSuffix(prefix, ".") + "recipe", Value: v.Kind.String(),
			Allowed: "a JSON object of recipe keys"}
	}
	r := Recipe{Format: CurrentFormat}
	d := reader{prefix: prefix}
	for _, m := range v.Members {
		switch m.Key {
		case "format":
			r.Format = d.format(m.Value)
		case "name":
			r.Name = d.text(m.Key, m.Value, maxTextName)
		case "notes":
			r.Notes = d.text(m.Key, m.Value, maxTextNote)
		case "solute":
			r.Solute = d.text(m.Key, m.Value, maxTextName)
		case "charged_form":
			r.ChargedForm = d.text(m.Key, m.Value, maxTextName)
		case "purity_pct":
			r.PurityPct = d.num(m.Key, m.Value, above(0), atMost(100), "a percentage > 0 and ≤ 100")
		case "custom":
			r.Custom = d.custom(m.Value)
		case "water_g":
			r.WaterG = d.num(m.Key, m.Value, atLeast(minMassG), atMost(maxMassG), massAllowed)
		case "water_mL":
			r.WaterML = d.num(m.Key, m.Value, atLeast(minMassG), atMost(maxMassG), "a volume > 0, from 0.001 to 1e7 mL")
		case "water_temp_C":
			r.WaterTempC = d.num(m.Key, m.Value, atLeast(0), atMost(100), "a temperature from 0 to 100 °C (range of the water density equation)")
		case "dissolve_temp_C":
			r.DissolveTempC = d.num(m.Key, m.Value, atLeast(minTempC), atMost(maxTempC), tempAllowed).Value
		case "saturation_pct":
			r.SaturationPct = d.num(m.Key, m.Value, above(0), atMost(100), "a percentage of saturation > 0 and ≤ 100")
		case "charge_g":
			r.ChargeG = d.num(m.Key, m.Value, atLeast(minMassG), atMost(maxMassG), massAllowed)
		case "clear_down_to_C":
			r.ClearDownToC = d.num(m.Key, m.Value, atLeast(minTempC), atMost(maxTempC), tempAllowed)
		case "clear_margin_K":
			r.ClearMarginK = d.num(m.Key, m.Value, atLeast(0), atMost(50), "a margin from 0 to 50 K")
		case "cool_to_C":
			r.CoolToC = d.num(m.Key, m.Value, atLeast(minTempC), atMost(maxTempC), tempAllowed)
		case "evaporated_water_g":
			r.EvaporatedWaterG = d.num(m.Key, m.Value, atLeast(0), atMost(maxMassG), "a mass ≥ 0 and ≤ 1e7 g")
		case "seed_at_C":
			r.SeedAtC = d.num(m.Key, m.Value, atLeast(minTempC), atMost(maxTempC), tempAllowed)
		case "metastable_width_K":
			r.MetastableWidthK = d.num(m.Key, m.Value, above(0), atMost(50), "a width > 0 and ≤ 50 K")
		case "cooling_time_min":
			r.CoolingTimeMin = d.num(m.Key, m.Value, above(0), atMost(1e5), "a duration > 0 and ≤ 100000 min")
		case "liquor_heat_capacity_kJ_per_kgK":
			r.LiquorHeatCapacityKJPerKgK = d.num(m.Key, m.Value, atLeast(0.5), atMost(10), "a specific heat capacity from 0.5 to 10 kJ/(kg·K)")
		case "vessel_heat_capacity_J_per_K":
			r.VesselHeatCapacityJPerK = d.num(m.Key, m.Value, atLeast(0), atMost(1e8), "a heat capacity ≥ 0 and ≤ 1e8 J/K")
		default:
			d.fail(m.Key, m.Key, unit.KeysAllowed(recipeKeys))
		}
		if d.err != nil {
			return Recipe{}, d.err
		}
	}
	if _, ok := v.Get("dissolve_temp_C"); !ok {
		d.fail("dissolve_temp_C", "", "a dissolve temperature in °C (the key is required)")
	}
	if err := r.checkCombination(prefix); err != nil {
		return Recipe{}, err
	}
	return r, d.err
}

const (
	tempAllowed = "a temperature from −40 to 150 °C"
	massAllowed = "a mass > 0, from 0.001 g to 1e7 g"
)

// checkCombination enforces the rules that involve more than one key.
func (r *Recipe) checkCombination(prefix string) error {
	fe := func(field, value, allowed string) error {
		return &unit.FieldError{Field: prefix + field, Value: value, Allowed: allowed}
	}
	switch {
	case r.Solute == "" && r.Custom == nil:
		return fe("solute", "", "a compound id or name, e.g. KNO3 or \"potassium nitrate\" (or a \"custom\" compound)")
	case r.Solute != "" && r.Custom != nil:
		return fe("custom", r.Custom.Name, "either \"solute\" or \"custom\", not both")
	case r.Custom != nil && r.ChargedForm != "":
		return fe("charged_form", r.ChargedForm, "no charged_form with a custom compound (it is charged anhydrous)")
	case r.WaterG.Set && r.WaterML.Set:
		return fe("water_mL", fmtNum(r.WaterML.Value), "either water_g or water_mL, not both")
	case !r.WaterG.Set && !r.WaterML.Set:
		return fe("water_g", "", "the water added, as water_g (grams) or water_mL (mL at water_temp_C)")
	case r.WaterTempC.Set && !r.WaterML.Set:
		return fe("water_temp_C", fmtNum(r.WaterTempC.Value), "water_temp_C only together with water_mL")
	case r.ClearMarginK.Set && !r.ClearDownToC.Set:
		return fe("clear_margin_K", fmtNum(r.ClearMarginK.Value), "clear_margin_K only together with clear_down_to_C")
	}
	n := 0
	for _, o := range []Opt{r.SaturationPct, r.ChargeG, r.ClearDownToC} {
		if o.Set {
			n++
		}
	}
	if n > 1 {
		field, val := "charge_g", r.ChargeG.Value
		if !r.ChargeG.Set {
			field, val = "clear_down_to_C", r.ClearDownToC.Value
		}
		return fe(field, fmtNum(val), "only one of saturation_pct, charge_g and clear_down_to_C")
	}
	return nil
}

// reader collects the first error while checking members.
type reader struct {
	prefix string
	err    error
}

func (d *reader) fail(field, value, allowed string) {
	if d.err == nil {
		d.err = &unit.FieldError{Field: d.prefix + field, Value: value, Allowed: allowed}
	}
}

type bound func(float64) bool

func above(lo float64) bound   { return func(v float64) bool { return v > lo } }
func atLeast(lo float64) bound { return func(v float64) bool { return v >= lo } }
func atMost(hi float64) bound  { return func(v float64) bool { return v <= hi } }

// literal gives a short form of a JSON value for an error message.
func literal(v wire.Value) string { return wire.Literal(v) }

func (d *reader) num(field string, v wire.Value, lo, hi bound, allowed string) Opt {
	if v.Kind != wire.Number {
		d.fail(field, literal(v), allowed+" (a JSON number, not "+v.Kind.String()+")")
		return Opt{}
	}
	if math.IsNaN(v.Num) || math.IsInf(v.Num, 0) || !lo(v.Num) || !hi(v.Num) {
		d.fail(field, v.Text, allowed)
		return Opt{}
	}
	return Some(v.Num)
}

func (d *reader) text(field string, v wire.Value, max int) string {
	if v.Kind != wire.String {
		d.fail(field, literal(v), "a JSON string")
		return ""
	}
	if len(v.Text) > max {
		d.fail(field, literal(v), "text of at most "+strconv.Itoa(max)+" bytes")
		return ""
	}
	return v.Text
}

func (d *reader) format(v wire.Value) int {
	if v.Kind != wire.Number || v.Num != math.Trunc(v.Num) || v.Num < 1 {
		d.fail("format", literal(v), "the whole number "+strconv.Itoa(CurrentFormat)+" (or leave it out)")
		return 0
	}
	if v.Num > CurrentFormat {
		d.fail("format", v.Text, "format "+strconv.Itoa(CurrentFormat)+" or older; this recipe was written by a newer Saltcast, so update Saltcast to read it")
		return 0
	}
	return int(v.Num)
}

func (d *reader) custom(v wire.Value) *Custom {
	if v.Kind != wire.Object {
		d.fail("custom", literal(v), "an object with name, molar_mass_g_per_mol, points and model")
		return nil
	}
	c := &Custom{Model: "table"}
	sub := reader{prefix: d.prefix + "custom."}
	for _, m := range v.Members {
		switch m.Key {
		case "name":
			c.Name = sub.text(m.Key, m.Value, maxTextName)
		case "molar_mass_g_per_mol":
			c.MolarMassGPerMol = sub.num(m.Key, m.Value, atLeast(1), atMost(1e4), "a molar mass from 1 to 10000 g/mol").Value
		case "points":
			c.Points = sub.points(m.Value)
		case "model":
			c.Model = sub.text(m.Key, m.Value, 20)
			if sub.err == nil && !contains(customModels, c.Model) {
				sub.fail(m.Key, c.Model, "one of "+strings.Join(customModels, ", "))
			}
		case "source":
			c.Source = sub.text(m.Key, m.Value, maxTextName)
		case "solution_enthalpy_kJ_per_mol":
			c.SolutionEnthalpyKJPerMol = sub.num(m.Key, m.Value, atLeast(-500), atMost(500), "an enthalpy from −500 to 500 kJ/mol")
		default:
			sub.fail(m.Key, m.Key, unit.KeysAllowed(customKeys))
		}
		if sub.err != nil {
			break
		}
	}
	if sub.err == nil {
		switch {
		case strings.TrimSpace(c.Name) == "":
			sub.fail("name", "", "a name for the custom compound")
		case c.MolarMassGPerMol == 0:
			sub.fail("molar_mass_g_per_mol", "", "the molar mass in g/mol (the key is required)")
		case len(c.Points) < 3:
			sub.fail("points", strconv.Itoa(len(c.Points))+" points", "at least 3 points [temp_C, g_per_100g_water]")
		}
	}
	if sub.err != nil && d.err == nil {
		d.err = sub.err
	}
	return c
}

const maxPoints = 200

func (d *reader) points(v wire.Value) []Point {
	const allowed = "a list of [temp_C, g_per_100g_water] pairs"
	if v.Kind != wire.Array {
		d.fail("points", literal(v), allowed)
		return nil
	}
	if len(v.Items) > maxPoints {
		d.fail("points", strconv.Itoa(len(v.Items))+" points", "at most "+strconv.Itoa(maxPoints)+" points")
		return nil
	}
	pts := make([]Point, 0, len(v.Items))
	for i, it := range v.Items {
		field := "points[" + strconv.Itoa(i) + "]"
		if it.Kind != wire.Array || len(it.Items) != 2 || it.Items[0].Kind != wire.Number || it.Items[1].Kind != wire.Number {
			d.fail(field, literal(it), "a pair [temp_C, g_per_100g_water] of two numbers")
			return nil
		}
		t, g := it.Items[0].Num, it.Items[1].Num
		if t < minTempC || t > maxTempC {
			d.fail(field, it.Items[0].Text, tempAllowed)
			return nil
		}
		if !(g >= 1e-6) || g > 1e5 {
			d.fail(field, it.Items[1].Text, "a solubility > 0, from 1e-6 to 1e5 g per 100 g water")
			return nil
		}
		pts = append(pts, Point{TempC: t, GPer100gWater: g})
	}
	return pts
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

func fmtNum(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// Encode writes the recipe as canonical JSON: "format" first, then the keys that are set
// in the order of the Recipe fields. Decode(r.Encode()) gives r back (with Format 1).
func (r Recipe) Encode() []byte {
	var e wire.Encoder
	r.encode(&e)
	b, err := e.Bytes()
	if err != nil {
		// A Recipe from Decode holds only finite numbers; a hand-built one with NaN is a
		// programming error in the caller.
		panic("recipe: Encode of a non-finite number: " + err.Error())
	}
	return b
}

func (r Recipe) encode(e *wire.Encoder) {
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	str := func(k, v string) {
		if v != "" {
			e.Key(k).String(v)
		}
	}
	opt := func(k string, o Opt) {
		if o.Set {
			e.Key(k).Float(o.Value)
		}
	}
	str("name", r.Name)
	str("notes", r.Notes)
	str("solute", r.Solute)
	str("charged_form", r.ChargedForm)
	opt("purity_pct", r.PurityPct)
	if c := r.Custom; c != nil {
		e.Key("custom").BeginObject()
		e.Key("name").String(c.Name)
		e.Key("molar_mass_g_per_mol").Float(c.MolarMassGPerMol)
		e.Key("points").BeginArray()
		for _, p := range c.Points {
			e.BeginArray().Float(p.TempC).Float(p.GPer100gWater).EndArray()
		}
		e.EndArray()
		e.Key("model").String(c.Model)
		str("source", c.Source)
		opt("solution_enthalpy_kJ_per_mol", c.SolutionEnthalpyKJPerMol)
		e.EndObject()
	}
	opt("water_g", r.WaterG)
	opt("water_mL", r.WaterML)
	opt("water_temp_C", r.WaterTempC)
	e.Key("dissolve_temp_C").Float(r.DissolveTempC)
	opt("saturation_pct", r.SaturationPct)
	opt("charge_g", r.ChargeG)
	opt("clear_down_to_C", r.ClearDownToC)
	opt("clear_margin_K", r.ClearMarginK)
	opt("cool_to_C", r.CoolToC)
	opt("evaporated_water_g", r.EvaporatedWaterG)
	opt("seed_at_C", r.SeedAtC)
	opt("metastable_width_K", r.MetastableWidthK)
	opt("cooling_time_min", r.CoolingTimeMin)
	opt("liquor_heat_capacity_kJ_per_kgK", r.LiquorHeatCapacityKJPerKgK)
	opt("vessel_heat_capacity_J_per_K", r.VesselHeatCapacityJPerK)
	e.EndObject()
}

// Encodable reports what would make Encode panic, Decode refuse the text of r, or the
// checksum differ once read back: texts longer than Decode reads, and text that is not
// UTF-8 (the encoder writes U+FFFD for it, which reads back as other bytes). A Recipe from
// Decode is always fine.
func (r Recipe) Encodable() error {
	texts := []struct {
		s   string
		max int
	}{{r.Name, maxTextName}, {r.Notes, maxTextNote}, {r.Solute, maxTextName}, {r.ChargedForm, maxTextName}}
	if c := r.Custom; c != nil {
		texts = append(texts, struct {
			s   string
			max int
		}{c.Name + c.Source + c.Model, 3 * maxTextName})
	}
	for _, t := range texts {
		if len(t.s) > t.max || !utf8.ValidString(t.s) {
			return errors.New("UTF-8 texts of at most " + strconv.Itoa(t.max) + " bytes")
		}
	}
	var e wire.Encoder
	r.encode(&e)
	if _, err := e.Bytes(); err != nil {
		return errors.New("finite numbers only")
	}
	return nil
}
