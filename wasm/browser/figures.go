package main

import (
	"strconv"
	"strings"

	"saltcast/core/recipe"
	"saltcast/core/unit"
)

// Figure is one number (or word) of a plan as the page, the batch sheet and the CSV show it.
// Key is the CLI output key, so an element showing it carries data-key=Key.
type Figure struct {
	Key   string
	Label string
	Kind  kind   // kMass, kTemp, kDelta or kPlain (Unit names the unit), kText
	Unit  string // unit of a kPlain figure
	Sig   int    // significant figures shown (temperatures: decimals)
	Get   func(r *recipe.Result) (v float64, text string, ok bool)
}

const (
	kDelta    kind = 100 // a temperature difference: K, or °F-degrees when °F is shown
	kTempText kind = 101 // words with one temperature in them: "{T}" in the text becomes v in the user's unit
)

func num(f func(r *recipe.Result) float64) func(*recipe.Result) (float64, string, bool) {
	return func(r *recipe.Result) (float64, string, bool) { return f(r), "", true }
}

func numIf(ok func(r *recipe.Result) bool, f func(r *recipe.Result) float64) func(*recipe.Result) (float64, string, bool) {
	return func(r *recipe.Result) (float64, string, bool) {
		if !ok(r) {
			return 0, "", false
		}
		return f(r), "", true
	}
}

func hasTarget(r *recipe.Result) bool    { return r.HasTarget }
func hasHeatBasis(r *recipe.Result) bool { return r.HasTarget && r.HeatBasis != "" && r.CrystalsG > 0 }

// heldText says whether the seeded, insulated batch holds at the end of the seeded phase's
// range (CH3COONa·3H2O at 58 °C) or stops where the heat runs out.
func heldText(r *recipe.Result) (float64, string, bool) {
	if !r.HasAdiabatic {
		return 0, "", false
	}
	if r.AdiabaticHeld {
		return r.AdiabaticEndC, "held at {T}: above it " + r.AdiabaticPhase + " is no longer the stable solid, and the liquor stays supersaturated", true
	}
	return r.AdiabaticEndC, "not held at a transition: warms to {T}, where the heat of the crystals runs out", true
}
func hasAdiabatic(r *recipe.Result) bool { return r.HasAdiabatic }

// hasDissolutionHeat: without an enthalpy of solution the library gives no heat of
// dissolving (a warning says so), which is not the same as none.
func hasDissolutionHeat(r *recipe.Result) bool { return r.HasDissolutionHeat }
func hasSeedHint(r *recipe.Result) bool        { return r.HasSeedHint }

// notGiven stands where the library has no data for a figure (no enthalpy of solution):
// a number there would read as "none".
const notGiven = "not given (no enthalpy of solution in the library)"

// Figures are the plan's results in the order the sheet and the CSV list them. The first
// ones are also the big tiles of the batch screen (see shell.html).
var Figures = []Figure{
	{Key: "charge_g", Label: "Charge to weigh", Kind: kMass, Sig: 4, Get: num(func(r *recipe.Result) float64 { return r.ChargeG })},
	{Key: "charged_form", Label: "Form weighed", Kind: kText, Get: func(r *recipe.Result) (float64, string, bool) { return 0, r.ChargedForm, r.ChargedForm != "" }},
	{Key: "impurity_g", Label: "Impurity in the charge (taken as inert and insoluble: it ends in the filter cake)", Kind: kMass, Sig: 3, Get: numIf(func(r *recipe.Result) bool { return r.ImpurityG > 0 }, func(r *recipe.Result) float64 { return r.ImpurityG })},
	{Key: "water_g", Label: "Water added", Kind: kMass, Sig: 4, Get: num(func(r *recipe.Result) float64 { return r.WaterG })},
	{Key: "hydrate_water_g", Label: "Water brought in by the hydrate", Kind: kMass, Sig: 4, Get: numIf(func(r *recipe.Result) bool { return r.HydrateWaterG > 0 }, func(r *recipe.Result) float64 { return r.HydrateWaterG })},
	{Key: "saturation_pct", Label: "Saturation at process temperature", Kind: kPlain, Unit: "%", Sig: 3, Get: num(func(r *recipe.Result) float64 { return r.SaturationPct })},
	{Key: "min_water_g", Label: "Least water that dissolves the charge", Kind: kMass, Sig: 4, Get: numIf(func(r *recipe.Result) bool { return r.MinWaterG > 0 }, func(r *recipe.Result) float64 { return r.MinWaterG })},
	{Key: "saturation_temp_C", Label: "Clear above (onset of crystallization)", Kind: kTemp, Sig: 1, Get: numIf(func(r *recipe.Result) bool { return r.HasOnset }, func(r *recipe.Result) float64 { return r.SaturationTempC })},
	{Key: "crystals_g", Label: "Crystals at target", Kind: kMass, Sig: 4, Get: numIf(hasTarget, func(r *recipe.Result) float64 { return r.CrystalsG })},
	{Key: "crystal_phase", Label: "Crystals are", Kind: kText, Get: func(r *recipe.Result) (float64, string, bool) {
		return 0, r.CrystalPhase, r.HasTarget && r.CrystalPhase != ""
	}},
	{Key: "yield_pct", Label: "Yield", Kind: kPlain, Unit: "%", Sig: 3, Get: numIf(hasTarget, func(r *recipe.Result) float64 { return r.YieldPct })},
	{Key: "liquor_g", Label: "Mother liquor", Kind: kMass, Sig: 4, Get: numIf(hasTarget, func(r *recipe.Result) float64 { return r.LiquorG })},
	{Key: "liquor_g_per_100g_water", Label: "Mother liquor strength", Kind: kPlain, Unit: "g/100 g water", Sig: 4, Get: numIf(hasTarget, func(r *recipe.Result) float64 { return r.LiquorG100 })},
	{Key: "dissolution_heat_kJ", Label: "Heat on dissolving (+ absorbed)", Kind: kPlain, Unit: "kJ", Sig: 3, Get: func(r *recipe.Result) (float64, string, bool) {
		if !r.HasDissolutionHeat {
			return 0, notGiven, true // said, not shown as 0 kJ
		}
		return r.DissolutionHeatKJ, "", true
	}},
	{Key: "dissolution_temp_change_K", Label: "Batch temperature change on dissolving, if insulated", Kind: kDelta, Sig: 1, Get: numIf(hasDissolutionHeat, func(r *recipe.Result) float64 { return r.DissolutionTempChangeK })},
	{Key: "crystallization_heat_kJ", Label: "Heat of crystallization (+ released)", Kind: kPlain, Unit: "kJ", Sig: 3, Get: numIf(hasTarget, func(r *recipe.Result) float64 { return r.CrystallizationHeatKJ })},
	{Key: "heat_basis", Label: "Heat of crystallization, basis", Kind: kText, Get: func(r *recipe.Result) (float64, string, bool) {
		return 0, string(r.HeatBasis), hasHeatBasis(r)
	}},
	{Key: "crystal_enthalpy_kJ_per_mol", Label: "Heat released per mol of crystals, design value (the larger estimate, safe side)", Kind: kPlain, Unit: "kJ/mol", Sig: 3, Get: numIf(hasHeatBasis, func(r *recipe.Result) float64 { return r.CrystalEnthalpyKJPerMol })},
	{Key: "crystal_enthalpy_low_kJ_per_mol", Label: "Heat released per mol of crystals, lowest estimate", Kind: kPlain, Unit: "kJ/mol", Sig: 3, Get: numIf(hasHeatBasis, func(r *recipe.Result) float64 { return r.CrystalEnthalpyLowKJPerMol })},
	{Key: "crystallization_heat_low_kJ", Label: "Heat of crystallization, lowest estimate", Kind: kPlain, Unit: "kJ", Sig: 3, Get: numIf(func(r *recipe.Result) bool {
		return hasHeatBasis(r) && r.CrystallizationHeatLowKJ < r.CrystallizationHeatKJ
	}, func(r *recipe.Result) float64 { return r.CrystallizationHeatLowKJ })},
	{Key: "heat_capacity_kJ_per_K", Label: "Batch heat capacity", Kind: kPlain, Unit: "kJ/K", Sig: 3, Get: num(func(r *recipe.Result) float64 { return r.HeatCapacityKJPerK })},
	{Key: "heat_capacity_model", Label: "Heat-capacity model", Kind: kText, Get: func(r *recipe.Result) (float64, string, bool) {
		return 0, r.HeatCapacityModel, r.HeatCapacityModel != ""
	}},
	{Key: "ice_heat_kJ", Label: "Heat released by the ice freezing (in the cooling duty)", Kind: kPlain, Unit: "kJ", Sig: 3, Get: numIf(func(r *recipe.Result) bool { return r.HasTarget && r.HasIce && r.IceG > 0 }, func(r *recipe.Result) float64 { return r.IceHeatKJ })},
	{Key: "cooling_duty_kJ", Label: "Cooling duty", Kind: kPlain, Unit: "kJ", Sig: 3, Get: numIf(hasTarget, func(r *recipe.Result) float64 { return r.CoolingDutyKJ })},
	{Key: "cooling_power_W", Label: "Mean cooling power", Kind: kPlain, Unit: "W", Sig: 3, Get: numIf(func(r *recipe.Result) bool { return r.HasCoolingPower }, func(r *recipe.Result) float64 { return r.CoolingPowerW })},
	{Key: "nucleation_temp_C", Label: "Unseeded crystals expected near", Kind: kTemp, Sig: 1, Get: numIf(func(r *recipe.Result) bool { return r.HasMetastable }, func(r *recipe.Result) float64 { return r.NucleationC })},
	{Key: "seed_temp_C", Label: "Suggested seeding temperature", Kind: kTemp, Sig: 1, Get: numIf(hasSeedHint, func(r *recipe.Result) float64 { return r.SeedHintC })},
	{Key: "seed_low_g", Label: "Seed mass, from", Kind: kMass, Sig: 2, Get: numIf(hasSeedHint, func(r *recipe.Result) float64 { return r.SeedLowG })},
	{Key: "seed_high_g", Label: "Seed mass, to", Kind: kMass, Sig: 2, Get: numIf(hasSeedHint, func(r *recipe.Result) float64 { return r.SeedHighG })},
	{Key: "adiabatic_end_temp_C", Label: "Seeded in an insulated vessel: ends at", Kind: kTemp, Sig: 1, Get: numIf(hasAdiabatic, func(r *recipe.Result) float64 { return r.AdiabaticEndC })},
	{Key: "adiabatic_crystals_g", Label: "Seeded in an insulated vessel: crystals", Kind: kMass, Sig: 4, Get: numIf(hasAdiabatic, func(r *recipe.Result) float64 { return r.AdiabaticCrystalsG })},
	{Key: "adiabatic_rise_K", Label: "Seeded in an insulated vessel: temperature jump", Kind: kDelta, Sig: 1, Get: numIf(hasAdiabatic, func(r *recipe.Result) float64 { return r.AdiabaticRiseK })},
	{Key: "adiabatic_held_at_transition", Label: "Seeded in an insulated vessel: held at a transition?", Kind: kTempText, Get: heldText},
	{Key: "adiabatic_phase", Label: "Seeded in an insulated vessel: crystals are", Kind: kText, Get: func(r *recipe.Result) (float64, string, bool) {
		return 0, r.AdiabaticPhase, r.HasAdiabatic
	}},
	{Key: "adiabatic_crystals_low_g", Label: "Seeded in an insulated vessel: crystals with the lowest heat estimate", Kind: kMass, Sig: 4, Get: numIf(hasAdiabatic, func(r *recipe.Result) float64 { return r.AdiabaticCrystalsLowG })},
	{Key: "adiabatic_end_low_temp_C", Label: "Seeded in an insulated vessel: ends, with the lowest heat estimate, at", Kind: kTemp, Sig: 1, Get: numIf(hasAdiabatic, func(r *recipe.Result) float64 { return r.AdiabaticEndLowC })},
	{Key: "freezing_point_C", Label: "Solution freezes (ice forms) at", Kind: kTemp, Sig: 1, Get: numIf(func(r *recipe.Result) bool { return r.HasFreezing }, func(r *recipe.Result) float64 { return r.FreezingPointC })},
	{Key: "ice_g", Label: "Ice at target", Kind: kMass, Sig: 4, Get: numIf(func(r *recipe.Result) bool { return r.HasTarget && r.HasIce }, func(r *recipe.Result) float64 { return r.IceG })},
	{Key: "eutectic_C", Label: "Freezes solid (eutectic) below", Kind: kTemp, Sig: 1, Get: numIf(func(r *recipe.Result) bool { return r.HasTarget && r.HasIce && r.HasEutectic }, func(r *recipe.Result) float64 { return r.EutecticC })},
	{Key: "eutectic_phase", Label: "At the eutectic, ice freezes out with", Kind: kText, Get: func(r *recipe.Result) (float64, string, bool) {
		return 0, r.EutecticPhase, r.HasTarget && r.HasIce && r.HasEutectic
	}},
	{Key: "frozen_solid", Label: "Frozen solid at target", Kind: kText, Get: func(r *recipe.Result) (float64, string, bool) {
		return 0, "yes: below the eutectic no mother liquor is left", r.HasTarget && r.Frozen
	}},
}

// FigureByKey finds a figure of Figures.
func FigureByKey(key string) (Figure, bool) {
	for _, f := range Figures {
		if f.Key == key {
			return f, true
		}
	}
	return Figure{}, false
}

// Show returns the text of f for r in units u and the unit text shown beside it. ok is
// false when the plan has no such figure (no target given, no seeding...). A number that is
// not finite shows as "—" (unit.FormatNumber), so NaN never reaches the screen.
func (f Figure) Show(r *recipe.Result, u Units) (text, unitText string, ok bool) {
	v, s, ok := f.Get(r)
	if !ok {
		return "", "", false
	}
	if s != "" && f.Kind != kTempText {
		return s, "", true // words in place of the number (kText, or notGiven)
	}
	switch f.Kind {
	case kText:
		return s, "", true
	case kTempText:
		return strings.Replace(s, "{T}", unit.FormatCompact(TempFromC(v, u), 4)+" "+u.TempSymbol(), 1), "", true
	case kTemp:
		return fixed(TempFromC(v, u), u.TempDecimals(f.Sig)), u.TempSymbol(), true
	case kDelta:
		return fixed(u.DeltaFromK(v), f.Sig), u.DeltaSymbol(), true
	case kMass:
		return unit.FormatNumber(MassFromG(v, u), f.Sig), u.Mass, true
	}
	return unit.FormatNumber(v, f.Sig), f.Unit, true
}

// TempText shows a temperature in °C in the user's unit with its symbol.
func TempText(c float64, u Units) string {
	return fixed(TempFromC(c, u), u.TempDecimals(1)) + " " + u.TempSymbol()
}

// fixed prints v with dec decimals, "—" when v is not finite; "-0.0" prints as "0.0".
func fixed(v float64, dec int) string {
	if v != v || v > 1e300 || v < -1e300 {
		return "—"
	}
	s := strconv.FormatFloat(v, 'f', dec, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return s
}

// InputRow is one number of a recipe as the batch sheet and the CSV show it.
type InputRow struct{ Key, Label, Text, Unit string }

// InputRows lists the numbers r gives (outside the custom compound), in the order of the
// recipe table, as the form shows them in units u.
func InputRows(r recipe.Recipe, u Units) []InputRow {
	d := FromRecipe(r)
	var rows []InputRow
	for i := range recipe.FieldSpecs {
		s := &recipe.FieldSpecs[i]
		if !s.Kind.IsNumber() || s.Parent() != "" {
			continue
		}
		if text := d.Display(s.Key, u); text != "" {
			rows = append(rows, InputRow{Key: s.Key, Label: s.Label, Text: text, Unit: unitText(s, u)})
		}
	}
	return rows
}

// CSV writes the plan as comma-separated key,value,unit,label rows (RFC 4180 quoting): the
// recipe's name and solute first, then its numbers (keys "recipe.water_g"...), the plan's
// figures, and warnings, cautions and sources as rows of their own.
func CSV(r *recipe.Result, u Units) string {
	var b strings.Builder
	row := func(cells ...string) {
		for i, c := range cells {
			if i > 0 {
				b.WriteByte(',')
			}
			if strings.ContainsAny(c, ",\"\r\n") {
				c = `"` + strings.ReplaceAll(c, `"`, `""`) + `"`
			}
			b.WriteString(c)
		}
		b.WriteString("\r\n")
	}
	row("key", "value", "unit", "label")
	name, _ := recipe.FieldSpecs.Lookup("name")
	row("name", r.Recipe.Name, "", name.Label)
	row("solute", r.SoluteID, "", r.SoluteName)
	for _, in := range InputRows(r.Recipe, u) {
		row("recipe."+csvKey(in.Key, in.Unit), in.Text, in.Unit, in.Label)
	}
	for _, f := range Figures {
		if text, ut, ok := f.Show(r, u); ok {
			row(csvKey(f.Key, ut), text, ut, f.Label)
		}
	}
	for _, w := range r.Warnings {
		row("warning", say(w), "", "")
	}
	for _, c := range r.Cautions {
		row("caution", say(c), "", "")
	}
	for _, s := range r.Sources {
		row("source", s, "", "")
	}
	return b.String()
}

// csvKey is key with its unit suffix (_g, _C, _mL, _K) naming the unit the row is in:
// charge_g in pounds is charge_lb, saturation_temp_C in °F is saturation_temp_F.
func csvKey(key, shownUnit string) string {
	suffix := map[string]string{"g": "g", "kg": "kg", "lb": "lb", "°C": "C", "°F": "F", "K": "K",
		"mL": "mL", "L": "L", "US gal": "gal"}[shownUnit]
	if suffix == "" {
		return key
	}
	for _, old := range []string{"_g", "_C", "_mL", "_K"} {
		if strings.HasSuffix(key, old) {
			return strings.TrimSuffix(key, old) + "_" + suffix
		}
	}
	return key
}
