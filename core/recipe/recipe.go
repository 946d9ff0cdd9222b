package recipe

import (
	"errors"
	"math"
	"strconv"
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

// MaxNameBytes is the longest recipe name Decode reads, in bytes of UTF-8.
const MaxNameBytes = maxTextName

// Decode reads one recipe strictly: unknown keys, wrong types, non-finite or absurd numbers
// and contradictory keys are refused with a *unit.FieldError naming the key; malformed JSON
// is a *wire.SyntaxError. A recipe without "format" is read as format 1 (the only format so
// far); a newer format is refused with a message to update Saltcast. The keys are those of
// Fields.
func Decode(data []byte) (Recipe, error) { return Fields.Decode(data) }

// DecodeValue checks one recipe object already read as JSON, as Decode does.
func DecodeValue(v wire.Value) (Recipe, error) { return Fields.FromValue(v, "") }

// fromValue checks one recipe object; prefix goes in front of field names ("recipes[2].").
func fromValue(v wire.Value, prefix string) (Recipe, error) { return Fields.FromValue(v, prefix) }

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

// literal gives a short form of a JSON value for an error message.
func literal(v wire.Value) string { return wire.Literal(v) }

// num reads a number that s accepts.
func (d *reader) num(field string, v wire.Value, s *Spec) Opt {
	if v.Kind != wire.Number {
		d.fail(field, literal(v), s.Allowed+" (a JSON number, not "+v.Kind.String()+")")
		return Opt{}
	}
	if !s.inRange(v.Num) {
		d.fail(field, v.Text, s.Allowed)
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

// format reads a format number from 1 to newest.
func (d *reader) format(v wire.Value, newest int) int {
	if v.Kind != wire.Number || v.Num != math.Trunc(v.Num) || v.Num < 1 {
		d.fail("format", literal(v), "the whole number "+strconv.Itoa(newest)+" (or leave it out)")
		return 0
	}
	if v.Num > float64(newest) {
		d.fail("format", v.Text, "format "+strconv.Itoa(newest)+" or older; this recipe was written by a newer Saltcast, so update Saltcast to read it")
		return 0
	}
	return int(v.Num)
}

// points reads the solubility points of field.
func (d *reader) points(field string, v wire.Value) []Point {
	const allowed = "a list of [temp_C, g_per_100g_water] pairs"
	if v.Kind != wire.Array {
		d.fail(field, literal(v), allowed)
		return nil
	}
	if len(v.Items) > maxPoints {
		d.fail(field, strconv.Itoa(len(v.Items))+" points", "at most "+strconv.Itoa(maxPoints)+" points")
		return nil
	}
	pts := make([]Point, 0, len(v.Items))
	for i, it := range v.Items {
		field := field + "[" + strconv.Itoa(i) + "]"
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
// in the order of Fields. Decode(r.Encode()) gives r back (with Format 1).
func (r Recipe) Encode() []byte { return Fields.Encode(&r) }

func (r Recipe) encode(e *wire.Encoder) { Fields.encode(e, &r) }

// Encodable reports what would make Encode panic, Decode refuse the text of r, or the
// checksum differ once read back: texts longer than Decode reads, and text that is not
// UTF-8 (the encoder writes U+FFFD for it, which reads back as other bytes). A Recipe from
// Decode is always fine.
func (r Recipe) Encodable() error { return encodable(&Fields, &r) }

// encodable is Encodable for a recipe of any table.
func encodable[R any](t *Table[R], r *R) error {
	var bad error
	t.texts(r, func(s string, max int) {
		if bad == nil && (len(s) > max || !utf8.ValidString(s)) {
			bad = errors.New("UTF-8 texts of at most " + strconv.Itoa(max) + " bytes")
		}
	})
	if bad != nil {
		return bad
	}
	var e wire.Encoder
	t.encode(&e, r)
	if _, err := e.Bytes(); err != nil {
		return errors.New("finite numbers only")
	}
	return nil
}
