package recipe

import (
	"strconv"
	"strings"

	"saltcast/core/unit"
)

// Plausibility bounds checked while decoding; the compound's own range is checked by Plan.
const (
	minTempC    = -40.0
	maxTempC    = 150.0
	minMassG    = 1e-3 // 1 mg: no balance weighs less (common practice), and it keeps subnormal numbers out
	maxMassG    = 1e7  // 10 t
	maxTextName = 200
	maxTextNote = 4000
	maxPoints   = 200
)

const (
	tempAllowed = "a temperature from −40 to 150 °C"
	massAllowed = "a mass > 0, from 0.001 g to 1e7 g"
)

// Fields is the batch recipe's table: every key of the recipe format, in the order Encode
// writes them. See Table for how to add a key.
var Fields = Table[Recipe]{
	Noun:  "recipe",
	New:   func() Recipe { return Recipe{Format: CurrentFormat} },
	Check: func(r *Recipe, prefix string) error { return r.checkCombination(prefix) },
	Fields: []Field[Recipe]{
		{Spec: Spec{Key: "format", Kind: Version, Max: CurrentFormat, Label: "Format",
			Help: "recipe format version (optional)"},
			Int: func(r *Recipe) *int { return &r.Format }},
		{Spec: Spec{Key: "name", Kind: Text, MaxBytes: maxTextName, Label: "Batch name",
			Help: "shown on the batch sheet"},
			Text: func(r *Recipe) *string { return &r.Name }},
		{Spec: Spec{Key: "notes", Kind: Text, MaxBytes: maxTextNote, Label: "Notes",
			Help: "shown on the batch sheet"},
			Text: func(r *Recipe) *string { return &r.Notes }},
		{Spec: Spec{Key: "solute", Kind: Text, MaxBytes: maxTextName, Trim: true, Group: "solute", Choice: "library",
			Label: "Solute", Help: "library compound: id, hydrate formula or common name"},
			Text: func(r *Recipe) *string { return &r.Solute }},
		{Spec: Spec{Key: "charged_form", Kind: Text, MaxBytes: maxTextName, Trim: true, Group: "solute", Choice: "library",
			Label: "Form on the shelf", Help: "the form weighed, e.g. CuSO4·5H2O"},
			Text: func(r *Recipe) *string { return &r.ChargedForm }},
		{Spec: Spec{Key: "purity_pct", Kind: Plain, Unit: "%", Min: 0, MinOpen: true, Max: 100,
			Allowed: "a percentage > 0 and ≤ 100", Label: "Purity", Help: "impurities are inert and insoluble; default 100"},
			Opt: func(r *Recipe) *Opt { return &r.PurityPct }},
		{Spec: Spec{Key: "custom", Kind: Object, Group: "solute", Choice: "custom",
			Allowed: "an object with name, molar_mass_g_per_mol, points and model",
			Label:   "Own compound", Help: "your own compound instead of solute"},
			Has:   func(r *Recipe) bool { return r.Custom != nil },
			Make:  func(r *Recipe) { r.Custom = &Custom{Model: "table"} },
			Close: func(r *Recipe, prefix string) error { return r.Custom.check(prefix) }},
		{Spec: Spec{Key: "custom.name", Kind: Text, MaxBytes: maxTextName, Required: true,
			Label: "Compound name", Help: "name of your compound"},
			Text: func(r *Recipe) *string { return &r.Custom.Name }},
		{Spec: Spec{Key: "custom.molar_mass_g_per_mol", Kind: Plain, Unit: "g/mol", Min: 1, Max: 1e4, Required: true,
			Allowed: "a molar mass from 1 to 10000 g/mol", Label: "Molar mass", Help: "of the anhydrous compound"},
			Num: func(r *Recipe) *float64 { return &r.Custom.MolarMassGPerMol }},
		{Spec: Spec{Key: "custom.points", Kind: Points, Required: true,
			Label: "Measured points", Help: "[temp_C, g anhydrous per 100 g water], at least 3, at most 200"},
			Points: func(r *Recipe) *[]Point { return &r.Custom.Points }},
		{Spec: Spec{Key: "custom.model", Kind: Text, MaxBytes: 20, Trim: true, Choices: customModels,
			Label: "Curve through the points", Help: "table (monotone PCHIP, the default), vant-hoff, apelblat or polynomial"},
			Text: func(r *Recipe) *string { return &r.Custom.Model }},
		{Spec: Spec{Key: "custom.source", Kind: Text, MaxBytes: maxTextName,
			Label: "Source of the points", Help: "where the points come from"},
			Text: func(r *Recipe) *string { return &r.Custom.Source }},
		{Spec: Spec{Key: "custom.solution_enthalpy_kJ_per_mol", Kind: Plain, Unit: "kJ/mol", Min: -500, Max: 500,
			Allowed: "an enthalpy from −500 to 500 kJ/mol", Label: "Enthalpy of solution", Help: "positive = dissolving absorbs heat"},
			Opt: func(r *Recipe) *Opt { return &r.Custom.SolutionEnthalpyKJPerMol }},
		{Spec: Spec{Key: "water_g", Kind: Mass, Min: minMassG, Max: maxMassG, Group: "water", Choice: "mass",
			Allowed: massAllowed, Label: "Water", Help: "water added, by mass"},
			Opt: func(r *Recipe) *Opt { return &r.WaterG }},
		{Spec: Spec{Key: "water_mL", Kind: Volume, Min: minMassG, Max: maxMassG, Group: "water", Choice: "volume",
			Allowed: "a volume > 0, from 0.001 to 1e7 mL", Label: "Water (volume)", Help: "water added, by volume"},
			Opt: func(r *Recipe) *Opt { return &r.WaterML }},
		{Spec: Spec{Key: "water_temp_C", Kind: Temp, Min: 0, Max: 100, Group: "water", Choice: "volume",
			Allowed: "a temperature from 0 to 100 °C (range of the water density equation)",
			Label:   "measured at", Help: "temperature of the measured volume; default 20 °C"},
			Opt: func(r *Recipe) *Opt { return &r.WaterTempC }},
		{Spec: Spec{Key: "dissolve_temp_C", Kind: Temp, Min: minTempC, Max: maxTempC, Required: true,
			Allowed: tempAllowed, Need: "a dissolve temperature in °C (the key is required)",
			Label: "Process temperature", Help: "where the charge is dissolved"},
			Num: func(r *Recipe) *float64 { return &r.DissolveTempC }},
		{Spec: Spec{Key: "saturation_pct", Kind: Plain, Unit: "%", Min: 0, MinOpen: true, Max: 100, Group: "amount", Choice: "saturation",
			Allowed: "a percentage of saturation > 0 and ≤ 100", Label: "Saturation",
			Help: "the charge as this % of saturation at the dissolve temperature; default 100"},
			Opt: func(r *Recipe) *Opt { return &r.SaturationPct }},
		{Spec: Spec{Key: "charge_g", Kind: Mass, Min: minMassG, Max: maxMassG, Group: "amount", Choice: "charge",
			Allowed: massAllowed, Label: "Charge", Help: "the charge as weighed"},
			Opt: func(r *Recipe) *Opt { return &r.ChargeG }},
		{Spec: Spec{Key: "clear_down_to_C", Kind: Temp, Min: minTempC, Max: maxTempC, Group: "amount", Choice: "clear",
			Allowed: tempAllowed, Label: "Stays clear down to", Help: "the most that stays clear down to this temperature"},
			Opt: func(r *Recipe) *Opt { return &r.ClearDownToC }},
		{Spec: Spec{Key: "clear_margin_K", Kind: Plain, Unit: "K", Min: 0, Max: 50, Group: "amount", Choice: "clear",
			Allowed: "a margin from 0 to 50 K", Label: "Safety margin", Help: "the saturation temperature lies this far below clear_down_to_C; default 2 K"},
			Opt: func(r *Recipe) *Opt { return &r.ClearMarginK }},
		{Spec: Spec{Key: "cool_to_C", Kind: Temp, Min: minTempC, Max: maxTempC,
			Allowed: tempAllowed, Label: "Target temperature", Help: "filtration or storage temperature"},
			Opt: func(r *Recipe) *Opt { return &r.CoolToC }},
		{Spec: Spec{Key: "evaporated_water_g", Kind: Mass, Min: 0, Max: maxMassG,
			Allowed: "a mass ≥ 0 and ≤ 1e7 g", Label: "Water boiled off", Help: "water lost before filtering"},
			Opt: func(r *Recipe) *Opt { return &r.EvaporatedWaterG }},
		{Spec: Spec{Key: "seed_at_C", Kind: Temp, Min: minTempC, Max: maxTempC,
			Allowed: tempAllowed, Label: "Seed at", Help: "cooled unseeded to here, then seeded in an insulated vessel"},
			Opt: func(r *Recipe) *Opt { return &r.SeedAtC }},
		{Spec: Spec{Key: "metastable_width_K", Kind: Plain, Unit: "K", Min: 0, MinOpen: true, Max: 50,
			Allowed: "a width > 0 and ≤ 50 K", Label: "Metastable band width", Help: "metastable zone width below saturation"},
			Opt: func(r *Recipe) *Opt { return &r.MetastableWidthK }},
		{Spec: Spec{Key: "cooling_time_min", Kind: Plain, Unit: "min", Min: 0, MinOpen: true, Max: 1e5,
			Allowed: "a duration > 0 and ≤ 100000 min", Label: "Cooling time", Help: "duration of the cooling programme"},
			Opt: func(r *Recipe) *Opt { return &r.CoolingTimeMin }},
		{Spec: Spec{Key: "liquor_heat_capacity_kJ_per_kgK", Kind: Plain, Unit: "kJ/(kg·K)", Min: 0.5, Max: 10,
			Allowed: "a specific heat capacity from 0.5 to 10 kJ/(kg·K)", Label: "Liquor heat capacity",
			Help: "replaces the built-in water-equivalent model"},
			Opt: func(r *Recipe) *Opt { return &r.LiquorHeatCapacityKJPerKgK }},
		{Spec: Spec{Key: "vessel_heat_capacity_J_per_K", Kind: Plain, Unit: "J/K", Min: 0, Max: 1e8,
			Allowed: "a heat capacity ≥ 0 and ≤ 1e8 J/K", Label: "Vessel heat capacity", Help: "vessel and stirrer; default 0"},
			Opt: func(r *Recipe) *Opt { return &r.VesselHeatCapacityJPerK }},
	},
}

// FieldSpecs are the keys of Fields without their accessors, for forms.
var FieldSpecs = Fields.Specs()

// Custom-model names accepted in "model".
var customModels = []string{"table", "vant-hoff", "apelblat", "polynomial"}

// check enforces the rules inside a custom compound once its keys are read.
func (c *Custom) check(prefix string) error {
	fe := func(field, value, allowed string) error {
		return &unit.FieldError{Field: prefix + "custom." + field, Value: value, Allowed: allowed}
	}
	switch {
	case strings.TrimSpace(c.Name) == "":
		return fe("name", "", "a name for the custom compound")
	case c.MolarMassGPerMol == 0:
		return fe("molar_mass_g_per_mol", "", "the molar mass in g/mol (the key is required)")
	case len(c.Points) < 3:
		return fe("points", strconv.Itoa(len(c.Points))+" points", "at least 3 points [temp_C, g_per_100g_water]")
	}
	return nil
}
