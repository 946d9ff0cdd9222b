package recipe

import "saltcast/core/wire"

// Digits is the number of significant digits of every number in an answer (the plan here;
// web/api's solubility, gas and compound answers use it too): finer than any balance can
// weigh, coarse enough that the last digit is not noise.
const Digits = 6

const sig = Digits

// resultSizeHint is about the size of a plan's JSON with its sources and cautions, so the
// encoder allocates once.
const resultSizeHint = 6 << 10

// Encode writes the result as JSON with a fixed set of keys in a fixed order (see the
// web/cmd/saltcast/README.md). A key that does not apply to this batch is null (for
// instance crystals_g without cool_to_C), so scripts can rely on every key being present.
func (res Result) Encode() []byte {
	var e wire.Encoder
	e.Grow(resultSizeHint)
	res.encode(&e)
	b, err := e.Bytes()
	if err != nil {
		// balance.Plan refuses non-finite numbers, so this is a programming error.
		panic("recipe: Result.Encode: " + err.Error())
	}
	return b
}

func (res Result) encode(e *wire.Encoder) {
	w := answer{e}
	num, opt, optStr, list := w.num, w.opt, w.optStr, w.list
	r := res.Result
	e.BeginObject()
	e.Key("format").Int(CurrentFormat)
	e.Key("name").String(res.Recipe.Name)
	e.Key("recipe_check").String(res.Recipe.Checksum())
	e.Key("solute").String(r.SoluteID)
	e.Key("solute_name").String(r.SoluteName)
	e.Key("charged_form").String(r.ChargedForm)
	num("purity_pct", r.PurityPct)

	// The charge.
	num("charge_g", r.ChargeG)
	num("water_g", r.WaterG)
	num("hydrate_water_g", r.HydrateWaterG)
	num("total_water_g", r.TotalWaterG)
	num("solute_g", r.SoluteG)
	num("impurity_g", r.ImpurityG)
	num("dissolve_temp_C", r.DissolveTempC)
	num("solubility_at_dissolve_g_per_100g_water", r.SolubilityAtStart)
	num("concentration_g_per_100g_water", r.ConcentrationG100)
	num("saturation_pct", r.SaturationPct)
	num("min_water_g", r.MinWaterG)
	opt("clear_down_to_C", r.ClearDownToC, r.HasClearDown)
	opt("saturation_temp_C", r.SaturationTempC, r.HasOnset)
	optStr("saturation_note", r.OnsetNote, !r.HasOnset)

	// Crash-out.
	t := r.HasTarget
	opt("cool_to_C", r.TargetC, t)
	opt("evaporated_water_g", r.EvaporatedWaterG, t)
	opt("crystals_g", r.CrystalsG, t)
	optStr("crystal_phase", r.CrystalPhase, t)
	opt("yield_pct", r.YieldPct, t)
	opt("liquor_g", r.LiquorG, t)
	opt("liquor_g_per_100g_water", r.LiquorG100, t)
	opt("solubility_at_target_g_per_100g_water", r.SolubilityAtTargetG100, t)
	opt("freezing_point_C", r.FreezingPointC, r.HasFreezing)
	opt("ice_g", r.IceG, t && r.HasIce)
	e.Key("frozen_solid").Bool(t && r.Frozen)
	opt("eutectic_C", r.EutecticC, r.HasEutectic)
	optStr("eutectic_phase", r.EutecticPhase, r.HasEutectic)
	e.Key("phase_changes").BeginArray()
	for _, p := range r.PhaseChanges {
		e.BeginObject()
		num("temp_C", p.TempC)
		e.Key("from").String(p.From)
		e.Key("to").String(p.To)
		e.EndObject()
	}
	e.EndArray()

	// The unseeded path, seeding and the programme.
	e.Key("supersaturation").BeginArray()
	for _, p := range r.Supersaturation {
		e.BeginObject()
		num("temp_C", p.TempC)
		num("ratio", p.Ratio)
		num("excess_g_per_100g_water", p.DeltaG)
		e.EndObject()
	}
	e.EndArray()
	opt("metastable_width_K", r.MetastableWidthK, r.HasMetastable)
	opt("nucleation_temp_C", r.NucleationC, r.HasMetastable)
	h := r.HasSeedHint
	opt("seed_temp_C", r.SeedHintC, h)
	optStr("seed_phase", r.SeedPhase, h)
	opt("seed_low_g", r.SeedLowG, h)
	opt("seed_high_g", r.SeedHighG, h)
	optStr("seed_rule", r.SeedRule, h)
	if len(r.Programme) > 0 {
		e.Key("programme").BeginObject()
		num("from_C", r.ProgrammeFromC)
		num("to_C", r.ProgrammeToC)
		e.Key("steps").BeginArray()
		for _, s := range r.Programme {
			e.BeginObject()
			num("time_min", s.TimeMin)
			num("linear_C", s.LinearC)
			num("cubic_C", s.CubicC)
			e.EndObject()
		}
		e.EndArray()
		e.EndObject()
	} else {
		e.Key("programme").Null()
	}

	// Heat.
	num("heat_capacity_kJ_per_K", r.HeatCapacityKJPerK)
	e.Key("heat_capacity_model").String(r.HeatCapacityModel)
	opt("dissolution_heat_kJ", r.DissolutionHeatKJ, r.HasDissolutionHeat)
	opt("dissolution_temp_change_K", r.DissolutionTempChangeK, r.HasDissolutionHeat)
	opt("crystallization_heat_kJ", r.CrystallizationHeatKJ, t)
	opt("crystal_enthalpy_kJ_per_mol", r.CrystalEnthalpyKJPerMol, t && r.EnthalpyBasis != "")
	opt("apparent_enthalpy_kJ_per_mol", r.ApparentEnthalpyKJPerMol, t && r.HasApparent)
	optStr("enthalpy_basis", r.EnthalpyBasis, r.EnthalpyBasis != "")
	optStr("heat_basis", string(r.HeatBasis), r.HeatBasis != "")
	opt("crystal_enthalpy_low_kJ_per_mol", r.CrystalEnthalpyLowKJPerMol, t && r.HeatBasis != "")
	opt("crystallization_heat_low_kJ", r.CrystallizationHeatLowKJ, t && r.HeatBasis != "")
	opt("sensible_heat_kJ", r.SensibleHeatKJ, t)
	opt("ice_heat_kJ", r.IceHeatKJ, t && r.HasIce)
	opt("cooling_duty_kJ", r.CoolingDutyKJ, t)
	opt("cooling_time_min", r.CoolingTimeMin, r.HasCoolingPower)
	opt("cooling_power_W", r.CoolingPowerW, r.HasCoolingPower)

	// Seeded in an insulated vessel.
	a := r.HasAdiabatic
	opt("seed_at_C", r.SeedAtC, a)
	opt("adiabatic_end_temp_C", r.AdiabaticEndC, a)
	opt("adiabatic_crystals_g", r.AdiabaticCrystalsG, a)
	opt("adiabatic_rise_K", r.AdiabaticRiseK, a)
	optStr("adiabatic_phase", r.AdiabaticPhase, a)
	if a {
		e.Key("adiabatic_held_at_transition").Bool(r.AdiabaticHeld)
	} else {
		e.Key("adiabatic_held_at_transition").Null()
	}
	opt("adiabatic_heat_kJ", r.AdiabaticHeatKJ, a)
	opt("adiabatic_heat_capacity_kJ_per_K", r.AdiabaticHeatCapacityKJPerK, a)
	opt("adiabatic_enthalpy_kJ_per_mol", r.AdiabaticEnthalpyKJPerMol, a)
	opt("adiabatic_crystals_low_g", r.AdiabaticCrystalsLowG, a)
	opt("adiabatic_end_low_temp_C", r.AdiabaticEndLowC, a)
	optStr("adiabatic_basis", r.AdiabaticBasis, a)

	e.Key("path").BeginArray()
	for _, p := range r.Path {
		e.BeginObject()
		e.Key("label").String(p.Label)
		e.Key("kind").String(string(p.Kind))
		num("temp_C", p.TempC)
		num("g_per_100g_water", p.G100)
		e.EndObject()
	}
	e.EndArray()
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

// answer writes the keys of a result object: numbers rounded to sig significant digits, and
// null for a key that does not apply, so every key is always present. The plan and the
// preparation answers write through it.
type answer struct{ e *wire.Encoder }

func (w answer) num(k string, v float64) { w.e.Key(k).Round(v, sig) }

func (w answer) opt(k string, v float64, ok bool) {
	if ok {
		w.e.Key(k).Round(v, sig)
	} else {
		w.e.Key(k).Null()
	}
}

func (w answer) optStr(k, v string, ok bool) {
	if ok {
		w.e.Key(k).String(v)
	} else {
		w.e.Key(k).Null()
	}
}

func (w answer) list(k string, l []string) {
	w.e.Key(k).BeginArray()
	for _, s := range l {
		w.e.String(s)
	}
	w.e.EndArray()
}
