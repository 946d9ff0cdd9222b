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

// prepField describes one key of the preparation recipe: its check and where it goes. The
// list is the single place the keys are named, in the order Encode writes them.
type prepField struct {
	key     string
	text    int // maximum bytes of a text field; 0 for a number
	lo, hi  float64
	loOpen  bool                 // lo excluded
	allowed string               // what is allowed, in words
	str     func(*Prep) *string  // a text field
	num     func(*Prep) *Opt     // an optional number
	req     func(*Prep) *float64 // a required number
}

var prepFields = []prepField{
	{key: "name", text: maxTextName, str: func(p *Prep) *string { return &p.Name }},
	{key: "notes", text: maxTextNote, str: func(p *Prep) *string { return &p.Notes }},
	{key: "solute", text: maxTextName, str: func(p *Prep) *string { return &p.Solute }},
	{key: "charged_form", text: maxTextName, str: func(p *Prep) *string { return &p.ChargedForm }},
	{key: "purity_pct", lo: 0, loOpen: true, hi: 100, allowed: "a percentage > 0 and ≤ 100",
		num: func(p *Prep) *Opt { return &p.PurityPct }},
	{key: "concentration", lo: 0, loOpen: true, hi: 1e6, allowed: "a concentration > 0 (in concentration_unit)",
		req: func(p *Prep) *float64 { return &p.Concentration }},
	{key: "concentration_unit", text: 20, str: func(p *Prep) *string { return &p.ConcentrationUnit }},
	{key: "final_volume_mL", lo: minMassG, hi: maxMassG, allowed: "a volume from 0.001 to 1e7 mL",
		num: func(p *Prep) *Opt { return &p.FinalVolumeML }},
	{key: "final_mass_g", lo: minMassG, hi: maxMassG, allowed: massAllowed,
		num: func(p *Prep) *Opt { return &p.FinalMassG }},
	{key: "solvent_g", lo: minMassG, hi: maxMassG, allowed: massAllowed,
		num: func(p *Prep) *Opt { return &p.SolventG }},
	{key: "temp_C", lo: 0, hi: 100, allowed: "a make-up temperature from 0 to 100 °C",
		num: func(p *Prep) *Opt { return &p.TempC }},
	{key: "stock_concentration", lo: 0, loOpen: true, hi: 1e6, allowed: "a concentration > 0 (in stock_unit)",
		num: func(p *Prep) *Opt { return &p.StockConcentration }},
	{key: "stock_unit", text: 20, str: func(p *Prep) *string { return &p.StockUnit }},
	{key: "store_at_C", lo: minTempC, hi: maxTempC, allowed: tempAllowed,
		num: func(p *Prep) *Opt { return &p.StoreAtC }},
}

// PrepKeys lists the keys of a preparation recipe, "format" and "kind" first.
func PrepKeys() []string {
	keys := []string{"format", "kind"}
	for _, f := range prepFields {
		keys = append(keys, f.key)
	}
	return keys
}

// DecodePrep reads one preparation recipe strictly, as Decode reads a batch recipe: unknown
// keys, wrong types, non-finite or absurd numbers and contradictory keys are refused with a
// *unit.FieldError naming the key; malformed JSON is a *wire.SyntaxError.
func DecodePrep(data []byte) (Prep, error) {
	v, err := wire.Decode(data)
	if err != nil {
		return Prep{}, err
	}
	return prepFromValue(v, "")
}

func prepFromValue(v wire.Value, prefix string) (Prep, error) {
	if v.Kind != wire.Object {
		return Prep{}, &unit.FieldError{Field: strings.TrimSuffix(prefix, ".") + "recipe", Value: v.Kind.String(),
			Allowed: "a JSON object of preparation keys"}
	}
	p := Prep{Format: CurrentFormat}
	d := reader{prefix: prefix}
	for _, m := range v.Members {
		switch m.Key {
		case "format":
			p.Format = d.format(m.Value, CurrentFormat)
		case "kind":
			if k := d.text("kind", m.Value, 100); d.err == nil && k != PrepKind {
				d.fail("kind", k, `"`+PrepKind+`" (or leave it out)`)
			}
		default:
			f := findPrepField(m.Key)
			if f == nil {
				d.fail(m.Key, m.Key, unit.KeysAllowed(PrepKeys()))
				break
			}
			f.set(&d, &p, m.Value)
		}
		if d.err != nil {
			return Prep{}, d.err
		}
	}
	if err := p.check(v, prefix); err != nil {
		return Prep{}, err
	}
	return p, nil
}

func findPrepField(key string) *prepField {
	for i := range prepFields {
		if prepFields[i].key == key {
			return &prepFields[i]
		}
	}
	return nil
}

func (f *prepField) set(d *reader, p *Prep, v wire.Value) {
	if f.text > 0 {
		*f.str(p) = d.text(f.key, v, f.text)
		return
	}
	o := d.num(f.key, v, &Spec{Key: f.key, Kind: Plain, Min: f.lo, MinOpen: f.loOpen, Max: f.hi, Allowed: f.allowed})
	if f.req != nil {
		*f.req(p) = o.Value
		return
	}
	*f.num(p) = o
}

// check enforces the rules that involve more than one key or a required key.
func (p *Prep) check(v wire.Value, prefix string) error {
	fe := func(field, value, allowed string) error {
		return &unit.FieldError{Field: prefix + field, Value: value, Allowed: allowed}
	}
	if strings.TrimSpace(p.Solute) == "" {
		return fe("solute", p.Solute, "a compound id or name, e.g. KCl or \"calcium chloride dihydrate\" (the key is required)")
	}
	if _, ok := v.Get("concentration"); !ok {
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
	if p.StockConcentration.Set {
		if _, err := prep.ParseUnit(prefix+"stock_unit", p.StockUnit); err != nil {
			return err
		}
		if p.StockUnit == string(prep.PctWW) && !(p.StockConcentration.Value < 100) {
			return fe("stock_concentration", fmtNum(p.StockConcentration.Value), "a mass per cent below 100")
		}
	}
	return nil
}

// Encode writes the preparation as canonical JSON: "format" and "kind" first, then the keys
// that are set in the order of the field table. DecodePrep(p.Encode()) gives p back.
func (p Prep) Encode() []byte {
	var e wire.Encoder
	p.encode(&e)
	b, err := e.Bytes()
	if err != nil {
		panic("recipe: Prep.Encode of a non-finite number: " + err.Error())
	}
	return b
}

func (p Prep) encode(e *wire.Encoder) {
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	e.Key("kind").String(PrepKind)
	for _, f := range prepFields {
		if f.text > 0 {
			if s := *f.str(&p); s != "" || f.key == "concentration_unit" {
				e.Key(f.key).String(s)
			}
			continue
		}
		if f.req != nil {
			e.Key(f.key).Float(*f.req(&p))
		} else if o := f.num(&p); o.Set {
			e.Key(f.key).Float(o.Value)
		}
	}
	e.EndObject()
}

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
	num := func(k string, v float64) { e.Key(k).Round(v, sig) }
	opt := func(k string, v float64, ok bool) {
		if ok {
			e.Key(k).Round(v, sig)
		} else {
			e.Key(k).Null()
		}
	}
	list := func(k string, l []string) {
		e.Key(k).BeginArray()
		for _, s := range l {
			e.String(s)
		}
		e.EndArray()
	}
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
		p, err := prepFromValue(it, "recipes["+fmtNum(float64(i))+"].")
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
