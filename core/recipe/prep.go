package recipe

import (
	"strings"

	"saltcast/core/compound"
	"saltcast/core/prep"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// PrepKind is the optional "kind" of a preparation recipe; Encode writes it so that a
// collection can hold batches and preparations side by side.
const PrepKind = "preparation"

// Prep is a preparation recipe: a solution made up to the mark (see package prep). The JSON
// key of each field is in its comment; zero values of optional fields mean "not given".
type Prep struct {
	Format int    // "format": 1; a missing format reads as 1
	Name   string // "name"
	Notes  string // "notes"

	Solute      string // "solute": a library id or name (a hydrate's name picks the hydrate)
	ChargedForm string // "charged_form": the form on the shelf; not with a stock
	PurityPct   Opt    // "purity_pct": 0 < p ≤ 100, default 100; not with a stock

	Concentration     float64 // "concentration": required, > 0
	ConcentrationUnit string  // "concentration_unit": required, one of prep.Units

	FinalVolumeML Opt // "final_volume_mL": made up to the mark at temp_C
	FinalMassG    Opt // "final_mass_g": mass of solution
	SolventG      Opt // "solvent_g": total water in the solution (hydrate water included)

	TempC Opt // "temp_C": make-up temperature, 0–100 °C, default 20

	StockConcentration Opt    // "stock_concentration": dilute a stock of the same solute
	StockUnit          string // "stock_unit": required with stock_concentration

	StoreAtC Opt // "store_at_C": storage temperature to check
}

// PrepFields is the preparation recipe's table: every key of the format, in the order
// Encode writes them. Decoding, encoding, the key list in errors, the Make up screen's form
// and the README's key table derive from it (see Table for how to add a key).
var PrepFields = Table[Prep]{
	Noun:  "preparation",
	New:   func() Prep { return Prep{Format: CurrentFormat} },
	Check: func(p *Prep, prefix string) error { return p.check(prefix) },
	Fields: []Field[Prep]{
		{Spec: Spec{Key: "format", Kind: Version, Max: CurrentFormat, Label: "Format",
			Help: "recipe format version (optional)"},
			Int: func(p *Prep) *int { return &p.Format }},
		{Spec: Spec{Key: "kind", Kind: Tag, MaxBytes: 100, Choices: []string{PrepKind},
			Allowed: `"` + PrepKind + `" (or leave it out)`, Label: "Kind",
			Help: `"` + PrepKind + `" (optional): tells a preparation from a batch recipe`}},
		{Spec: Spec{Key: "name", Kind: Text, MaxBytes: maxTextName, Label: "Name",
			Help: "shown on the screen and in the recipe box"},
			Text: func(p *Prep) *string { return &p.Name }},
		{Spec: Spec{Key: "notes", Kind: Text, MaxBytes: maxTextNote, Label: "Notes", Help: "free text"},
			Text: func(p *Prep) *string { return &p.Notes }},
		{Spec: Spec{Key: "solute", Kind: Text, MaxBytes: maxTextName, Trim: true, Label: "Solute",
			Help: "library compound: id, hydrate formula or common name (required)"},
			Text: func(p *Prep) *string { return &p.Solute }},
		{Spec: Spec{Key: "charged_form", Kind: Text, MaxBytes: maxTextName, Trim: true, Group: "from", Choice: "solid",
			Label: "Form on the shelf", Help: "the form weighed, e.g. CuSO4·5H2O; not with a stock"},
			Text: func(p *Prep) *string { return &p.ChargedForm }},
		{Spec: Spec{Key: "purity_pct", Kind: Plain, Unit: "%", Min: 0, MinOpen: true, Max: 100, Group: "from", Choice: "solid",
			Allowed: "a percentage > 0 and ≤ 100", Label: "Purity", Help: "default 100; not with a stock"},
			Opt: func(p *Prep) *Opt { return &p.PurityPct }},
		{Spec: Spec{Key: "concentration", Kind: Plain, Min: 0, MinOpen: true, Max: 1e6, Required: true,
			Allowed: "a concentration > 0 (in concentration_unit)", Label: "Concentration",
			Help: "the target, in concentration_unit (required)"},
			Num: func(p *Prep) *float64 { return &p.Concentration }},
		{Spec: Spec{Key: "concentration_unit", Kind: Text, MaxBytes: 20, Trim: true, Choices: prepUnits, Required: true,
			Label: "Unit", Help: "mol/L, mmol/L, g/L, mg/L, % w/v (g per 100 mL of solution), % w/w or mol/kg (required)"},
			Text: func(p *Prep) *string { return &p.ConcentrationUnit }},
		{Spec: Spec{Key: "final_volume_mL", Kind: Volume, Min: minMassG, Max: maxMassG, Group: "amount", Choice: "volume",
			Allowed: "a volume from 0.001 to 1e7 mL", Label: "Made up to", Help: "volume of solution, made up to the mark at temp_C"},
			Opt: func(p *Prep) *Opt { return &p.FinalVolumeML }},
		{Spec: Spec{Key: "final_mass_g", Kind: Mass, Min: minMassG, Max: maxMassG, Group: "amount", Choice: "mass",
			Allowed: massAllowed, Label: "Solution mass", Help: "mass of solution"},
			Opt: func(p *Prep) *Opt { return &p.FinalMassG }},
		{Spec: Spec{Key: "solvent_g", Kind: Mass, Min: minMassG, Max: maxMassG, Group: "amount", Choice: "water",
			Allowed: massAllowed, Label: "Water in it", Help: "all the water in the solution, a hydrate's included"},
			Opt: func(p *Prep) *Opt { return &p.SolventG }},
		{Spec: Spec{Key: "temp_C", Kind: Temp, Min: 0, Max: 100,
			Allowed: "a make-up temperature from 0 to 100 °C", Label: "Made up at", Help: "make-up temperature; default 20 °C"},
			Opt: func(p *Prep) *Opt { return &p.TempC }},
		{Spec: Spec{Key: "stock_concentration", Kind: Plain, Min: 0, MinOpen: true, Max: 1e6, Group: "from", Choice: "stock",
			Allowed: "a concentration > 0 (in stock_unit)", Label: "Stock", Help: "dilute a stock of the same solute, in stock_unit"},
			Opt: func(p *Prep) *Opt { return &p.StockConcentration }},
		{Spec: Spec{Key: "stock_unit", Kind: Text, MaxBytes: 20, Trim: true, Choices: prepUnits, Group: "from", Choice: "stock",
			Label: "Stock unit", Help: "the unit of stock_concentration (required with it)"},
			Text: func(p *Prep) *string { return &p.StockUnit }},
		{Spec: Spec{Key: "store_at_C", Kind: Temp, Min: minTempC, Max: maxTempC,
			Allowed: tempAllowed, Label: "Stored at", Help: "storage temperature to check against crystallization and freezing"},
			Opt: func(p *Prep) *Opt { return &p.StoreAtC }},
	},
}

// PrepSpecs are the keys of PrepFields without their accessors, for forms.
var PrepSpecs = PrepFields.Specs()

// prepUnits are the concentration units as the table's choices.
var prepUnits = func() []string {
	s := make([]string, len(prep.Units))
	for i, u := range prep.Units {
		s[i] = string(u)
	}
	return s
}()

// PrepKeys lists the keys of a preparation recipe in the order Encode writes them.
func PrepKeys() []string { return PrepSpecs.Keys("") }

// DecodePrep reads one preparation recipe strictly, as Decode reads a batch recipe: unknown
// keys, wrong types, non-finite or absurd numbers and contradictory keys are refused with a
// *unit.FieldError naming the key; malformed JSON is a *wire.SyntaxError.
func DecodePrep(data []byte) (Prep, error) { return PrepFields.Decode(data) }

// DecodePrepValue checks one preparation object already read as JSON, as DecodePrep does;
// prefix goes in front of field names ("recipes[2].").
func DecodePrepValue(v wire.Value, prefix string) (Prep, error) {
	return PrepFields.FromValue(v, prefix)
}

// check enforces the rules that involve more than one key or a required key.
func (p *Prep) check(prefix string) error {
	fe := func(field, value, allowed string) error {
		return &unit.FieldError{Field: prefix + field, Value: value, Allowed: allowed}
	}
	if strings.TrimSpace(p.Solute) == "" {
		return fe("solute", p.Solute, "a compound id or name, e.g. KCl or \"calcium chloride dihydrate\" (the key is required)")
	}
	if p.Concentration == 0 { // the table refuses 0: it was left out
		return fe("concentration", "", "the target concentration (the key is required)")
	}
	if _, err := prep.ParseUnit(prefix+"concentration_unit", p.ConcentrationUnit); err != nil {
		return err
	}
	if p.ConcentrationUnit == string(prep.PctWW) && !(p.Concentration < 100) {
		return fe("concentration", fmtNum(p.Concentration), "a mass per cent below 100")
	}
	n := 0
	for _, o := range []Opt{p.FinalVolumeML, p.FinalMassG, p.SolventG} {
		if o.Set {
			n++
		}
	}
	switch {
	case n == 0:
		return fe("final_volume_mL", "", "the amount: exactly one of final_volume_mL, final_mass_g and solvent_g")
	case n > 1:
		field, val := "final_mass_g", p.FinalMassG.Value
		if !p.FinalMassG.Set {
			field, val = "solvent_g", p.SolventG.Value
		}
		return fe(field, fmtNum(val), "only one of final_volume_mL, final_mass_g and solvent_g")
	case p.StockConcentration.Set != (p.StockUnit != ""):
		if p.StockConcentration.Set {
			return fe("stock_unit", "", "the unit of stock_concentration (required with it)")
		}
		return fe("stock_concentration", "", "stock_concentration together with stock_unit")
	case p.StockConcentration.Set && p.ChargedForm != "":
		return fe("charged_form", p.ChargedForm, "no charged_form when diluting a stock")
	case p.StockConcentration.Set && p.PurityPct.Set:
		return fe("purity_pct", fmtNum(p.PurityPct.Value), "no purity_pct when diluting a stock")
	}
	if p.StockUnit == string(prep.PctWW) && !(p.StockConcentration.Value < 100) {
		return fe("stock_concentration", fmtNum(p.StockConcentration.Value), "a mass per cent below 100")
	}
	return nil
}

// Encode writes the preparation as canonical JSON: "format" and "kind" first, then the keys
// that are set in the order of PrepFields. DecodePrep(p.Encode()) gives p back.
func (p Prep) Encode() []byte { return PrepFields.Encode(&p) }

func (p Prep) encode(e *wire.Encoder) { PrepFields.encode(e, &p) }

// Encodable reports what would make Encode panic or DecodePrep refuse the text of p, as
// Recipe.Encodable does. A Prep from DecodePrep is always fine.
func (p Prep) Encodable() error { return encodable(&PrepFields, &p) }

// PrepResult is a worked preparation with the recipe it came from.
type PrepResult struct {
	Recipe Prep
	prep.Result
}

// Default make-up temperature when temp_C is not given.
const DefaultPrepTempC = prep.DefaultTempC

// PlanPrep works out a preparation recipe. The compound, the form and every temperature are
// checked here; errors are *unit.FieldError values naming the recipe key.
func PlanPrep(p Prep) (PrepResult, error) {
	res := PrepResult{Recipe: p}
	c, form, err := compound.Lookup(p.Solute)
	if err != nil {
		return res, err
	}
	if p.ChargedForm != "" {
		if form, err = c.Form(p.ChargedForm); err != nil {
			return res, err
		}
	}
	s := prep.Spec{
		Compound: c, Form: form, PurityPct: p.PurityPct.Value,
		Concentration: p.Concentration, Unit: prep.Unit(strings.TrimSpace(p.ConcentrationUnit)),
		TempC:      p.TempC.Or(DefaultPrepTempC),
		HasStoreAt: p.StoreAtC.Set, StoreAtC: p.StoreAtC.Value,
	}
	switch {
	case p.FinalVolumeML.Set:
		s.Amount, s.AmountValue = prep.ByVolume, p.FinalVolumeML.Value
	case p.FinalMassG.Set:
		s.Amount, s.AmountValue = prep.ByMass, p.FinalMassG.Value
	case p.SolventG.Set:
		s.Amount, s.AmountValue = prep.ByWater, p.SolventG.Value
	}
	if p.StockConcentration.Set {
		s.HasStock, s.StockConcentration, s.StockUnit = true, p.StockConcentration.Value, prep.Unit(strings.TrimSpace(p.StockUnit))
		s.Form = nil
	}
	r, err := prep.Plan(s)
	if err != nil {
		return res, err
	}
	res.Result = r
	if !p.TempC.Set {
		res.Warnings = append(res.Warnings, "temp_C not given: made up at "+unit.FormatCompact(DefaultPrepTempC, 3)+
			" °C, the temperature volumetric glassware is calibrated for")
	}
	return res, nil
}

// Encode writes the worked preparation as JSON with a fixed set of keys in a fixed order (see
// the README's command-line section). A key that does not apply is null: stock_mL and
// stock_g without a stock, form_g with one, volumes and per-volume concentrations without
// density data.
func (res PrepResult) Encode() []byte {
	var e wire.Encoder
	e.Grow(resultSizeHint / 2)
	res.encode(&e)
	b, err := e.Bytes()
	if err != nil {
		panic("recipe: PrepResult.Encode: " + err.Error())
	}
	return b
}

func (res PrepResult) encode(e *wire.Encoder) {
	w := answer{e}
	num, opt, list := w.num, w.opt, w.list
	r := res.Result
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	e.Key("kind").String(PrepKind)
	e.Key("name").String(res.Recipe.Name)
	e.Key("solute").String(r.SoluteID)
	e.Key("solute_name").String(r.SoluteName)
	num("concentration", r.Concentration)
	e.Key("concentration_unit").String(string(r.Unit))
	num("temp_C", r.TempC)

	// What to measure.
	if r.HasForm {
		e.Key("form").String(r.Form)
	} else {
		e.Key("form").Null()
	}
	opt("purity_pct", r.PurityPct, r.HasForm)
	opt("form_g", r.FormG, r.HasForm)
	opt("impurity_g", r.ImpurityG, r.HasForm)
	opt("hydrate_water_g", r.HydrateWaterG, r.HasForm)
	opt("stock_concentration", res.Recipe.StockConcentration.Value, r.HasStock)
	if r.HasStock {
		e.Key("stock_unit").String(strings.TrimSpace(res.Recipe.StockUnit))
	} else {
		e.Key("stock_unit").Null()
	}
	opt("stock_mL", r.StockML, r.HasStock && r.HasStockVolume)
	opt("stock_g", r.StockG, r.HasStock)
	num("water_g", r.WaterG)
	num("water_mL", r.WaterML)
	e.Key("water_approximate").Bool(r.WaterApprox)

	// The solution.
	num("solute_g", r.SoluteG)
	num("solution_g", r.SolutionG)
	d := r.HasDensity
	opt("solution_mL", r.SolutionML, d || r.Amount == prep.ByVolume)
	opt("density_g_per_mL", r.DensityKgPerM3/1000, d)
	opt("density_error_pct", r.DensityErrPct, d)
	if d {
		e.Key("density_source").String(r.DensitySource)
	} else {
		e.Key("density_source").Null()
	}
	opt("mol_per_L", r.MolPerL, d)
	opt("mmol_per_L", r.MmolPerL, d)
	opt("g_per_L", r.GPerL, d)
	opt("mg_per_L", r.MgPerL, d)
	opt("pct_w_v", r.PctWV, d)
	num("pct_w_w", r.PctWW)
	num("mol_per_kg", r.MolPerKg)
	num("g_per_100g_water", r.GPer100gWater)

	// Saturation and storage.
	num("solubility_g_per_100g_water", r.SolubilityG100)
	e.Key("stable_phase").String(r.StablePhase)
	num("saturation_pct", r.SaturationPct)
	e.Key("supersaturated").Bool(r.Supersaturated)
	opt("saturation_temp_C", r.SaturationTempC, r.HasSaturationTemp)
	opt("freezing_point_C", r.FreezingPointC, r.HasFreezingPoint)
	opt("keep_above_C", r.KeepAboveC, r.HasKeepAbove)
	opt("clear_down_to_C", r.ClearDownToC, !r.HasSaturationTemp && !r.Supersaturated)
	opt("crystallizes_above_C", r.CrystallizesAbove, r.HasWarmLimit)
	opt("store_at_C", r.StoreAtC, r.HasStoreAt)
	if r.HasStoreAt {
		e.Key("clear_at_store").Bool(r.ClearAtStore)
	} else {
		e.Key("clear_at_store").Null()
	}
	opt("dissolve_temp_change_K", r.DissolveChangeK, r.HasDissolveHeat)
	list("cautions", r.Cautions)
	e.Key("caution_kinds").BeginArray()
	for _, k := range r.CautionKinds {
		e.String(string(k))
	}
	e.EndArray()
	list("warnings", r.Warnings)
	list("sources", r.Sources)
	e.EndObject()
}

// PrepCollectionKind is the "kind" of a file holding many preparations.
const PrepCollectionKind = "saltcast-preparations"

// DecodePrepCollection reads {"format":1,"kind":"saltcast-preparations","recipes":[...]}
// all or nothing, as DecodeCollection reads batches; fields are named like
// "recipes[3].concentration".
func DecodePrepCollection(data []byte) ([]Prep, error) {
	v, err := wire.DecodeLimits(data, wire.Limits{MaxBytes: MaxCollectionBytes, MaxDepth: 32})
	if err != nil {
		return nil, err
	}
	if v.Kind != wire.Object {
		return nil, &unit.FieldError{Field: "collection", Value: v.Kind.String(),
			Allowed: `an object {"format":1,"kind":"` + PrepCollectionKind + `","recipes":[...]}`}
	}
	d := reader{}
	var items []wire.Value
	kind := false
	for _, m := range v.Members {
		switch m.Key {
		case "format":
			d.format(m.Value, CurrentFormat)
		case "kind":
			if k := d.text("kind", m.Value, 100); d.err == nil && k != PrepCollectionKind {
				d.fail("kind", k, `"`+PrepCollectionKind+`"`)
			}
			kind = true
		case "recipes":
			if m.Value.Kind != wire.Array {
				d.fail("recipes", literal(m.Value), "a list of preparations")
			}
			items = m.Value.Items
		default:
			d.fail(m.Key, m.Key, "one of the collection keys: format, kind, recipes")
		}
		if d.err != nil {
			return nil, d.err
		}
	}
	if !kind {
		return nil, &unit.FieldError{Field: "kind", Value: "", Allowed: `"` + PrepCollectionKind + `" (the key is required)`}
	}
	if len(items) > MaxCollectionRecipes {
		return nil, &unit.FieldError{Field: "recipes", Value: fmtNum(float64(len(items))) + " preparations",
			Allowed: "at most " + fmtNum(MaxCollectionRecipes) + " in one file"}
	}
	out := make([]Prep, 0, len(items))
	for i, it := range items {
		p, err := PrepFields.FromValue(it, "recipes["+fmtNum(float64(i))+"].")
		if err != nil {
			return nil, err
		}
		out = append(out, p)
	}
	return out, nil
}

// EncodePrepCollection writes preparations as one collection file.
func EncodePrepCollection(preps []Prep) []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	e.Key("kind").String(PrepCollectionKind)
	e.Key("recipes").BeginArray()
	for _, p := range preps {
		p.encode(&e)
	}
	e.EndArray()
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		panic("recipe: EncodePrepCollection of a non-finite number: " + err.Error())
	}
	return b
}

// BatchFrom turns a worked preparation into a batch recipe holding the same solution, for
// planning a crystallization from it: the form weighed and the water added (or, from a
// stock, the anhydrous solute and all the water), dissolved at the make-up temperature and,
// when a storage temperature was given, cooled to it.
func BatchFrom(res PrepResult) Recipe {
	r := res.Result
	b := Recipe{Format: CurrentFormat, Solute: r.SoluteID, DissolveTempC: r.TempC}
	b.Name = res.Recipe.Name
	if b.Name == "" {
		b.Name = r.SoluteID + " " + unit.FormatCompact(r.Concentration, 4) + " " + string(r.Unit)
	}
	b.Notes = "From the preparation: " + unit.FormatCompact(r.Concentration, 6) + " " + string(r.Unit) + " " + r.SoluteID + "."
	if r.HasForm {
		if r.Form != r.Compound.Anhydrous().Formula {
			b.ChargedForm = r.Form
		}
		if r.PurityPct != 100 {
			b.PurityPct = Some(r.PurityPct)
		}
		b.ChargeG = Some(r.FormG)
		b.WaterG = Some(r.WaterG)
	} else {
		b.ChargeG = Some(r.SoluteG)
		b.WaterG = Some(r.TotalWaterG)
	}
	if r.HasStoreAt {
		b.CoolToC = Some(r.StoreAtC)
	}
	return b
}
