package main

import (
	"io"
	"strconv"
	"strings"
	"unicode/utf8"

	"saltcast/core/recipe"
	demos "saltcast/core/recipe/demo"
	"saltcast/core/unit"
	"saltcast/web/api"
)

// demo plans each recipe file (without files, the demo recipes of core/recipe/demo) and
// prints it as a plain-text batch sheet. It stops at the first file that fails, with the
// file named.
func demo(files []string, u units, stdin io.Reader, stdout, stderr io.Writer) int {
	read := func(name string) ([]byte, error) { return readRecipe(name, stdin) }
	if len(files) == 0 {
		for _, d := range demos.All {
			files = append(files, d.File)
		}
		read = func(name string) ([]byte, error) {
			d, _ := demos.Lookup(name)
			return d.JSON, nil
		}
	}
	for i, name := range files {
		data, err := read(name)
		if err == nil {
			var r recipe.Recipe
			if r, err = recipe.Decode(data); err == nil {
				var res recipe.Result
				if res, err = recipe.Plan(r); err == nil {
					if i > 0 {
						io.WriteString(stdout, "\n")
					}
					io.WriteString(stdout, SheetIn(res, u))
					continue
				}
			}
		}
		io.WriteString(stderr, "saltcast demo: "+name+": "+err.Error()+"\n")
		if api.IsInputError(err) {
			return 2
		}
		return 1
	}
	return 0
}

// sheet builds aligned "label  value" lines, with quantities in the units u.
type sheet struct {
	b strings.Builder
	u units
}

const labelWidth = 30

func (s *sheet) title(t string) {
	s.b.WriteString(t + "\n" + strings.Repeat("=", utf8.RuneCountInString(t)) + "\n")
}

func (s *sheet) section(t string) { s.b.WriteString("\n" + t + "\n") }

func (s *sheet) row(label, value string) {
	s.b.WriteString("  " + label)
	if n := utf8.RuneCountInString(label); n < labelWidth {
		s.b.WriteString(strings.Repeat(" ", labelWidth-n))
	} else {
		s.b.WriteString("  ")
	}
	s.b.WriteString(value + "\n")
}

func (s *sheet) bullet(t string) { s.b.WriteString("  - " + t + "\n") }

func n(v float64) string { return unit.FormatCompact(v, 4) }

// g shows a mass given in grams, in the sheet's mass unit, to 4 significant figures.
func (s *sheet) g(grams float64) string {
	return unit.FormatCompact(s.u.MassFromG(grams), 4) + " " + s.u.Mass
}

// tc shows a temperature given in °C on the sheet's scale, to 3 significant figures.
func (s *sheet) tc(c float64) string {
	if s.u.Temp == "C" {
		return unit.FormatCompact(c, 3) + " " + unitSymbol(s.u.Temp)
	}
	// °F and K: to a tenth of a degree, as fine as 3 significant figures of a °C reading.
	v := strconv.FormatFloat(s.u.TempFromC(c), 'f', 1, 64)
	v = strings.TrimSuffix(strings.TrimSuffix(v, "0"), ".")
	if v == "-0" {
		v = "0"
	}
	return v + " " + unitSymbol(s.u.Temp)
}

// dk shows a temperature difference given in K: in K, or in °F degrees on the °F scale.
func (s *sheet) dk(k float64, sign bool) string {
	v, sym := k, "K"
	if s.u.Temp == "F" {
		v, sym = k*1.8, "°F"
	}
	if sign {
		return signed(v) + " " + sym
	}
	return n(v) + " " + sym
}

// signed writes v with an explicit + for positive numbers.
func signed(v float64) string {
	s := n(v)
	if v > 0 {
		s = "+" + s
	}
	return s
}

// Sheet renders a plan as a readable batch sheet (plain text, fixed layout) in °C and g.
func Sheet(res recipe.Result) string { return SheetIn(res, defaultUnits) }

// SheetIn renders a plan as a readable batch sheet in the units u: the cautions first, then
// the charge, the target, seeding, the cooling programme, heat, warnings and sources.
func SheetIn(res recipe.Result, u units) string {
	s := sheet{u: u}
	r := res.Result
	name := res.Recipe.Name
	if name == "" {
		name = "Batch of " + r.SoluteID
	}
	s.title(name)
	if res.Recipe.Notes != "" {
		s.b.WriteString(res.Recipe.Notes + "\n")
	}

	s.section("Cautions (read first)")
	for _, c := range r.Cautions {
		s.bullet(c)
	}

	s.section("Charge")
	s.row("solute", r.SoluteID+" ("+r.SoluteName+")")
	form := r.ChargedForm
	if r.PurityPct < 100 {
		form += ", " + n(r.PurityPct) + " % pure"
	}
	s.row("weigh", s.g(r.ChargeG)+" of "+form)
	water := s.g(r.WaterG)
	if rc := res.Recipe; rc.WaterML.Set {
		at := 20.0 // the recipe format's default measuring temperature
		if rc.WaterTempC.Set {
			at = rc.WaterTempC.Value
		}
		water += " (" + unit.FormatCompact(s.u.VolumeFromML(rc.WaterML.Value), 4) + " " + unitSymbol(s.u.Volume) + " measured at " + s.tc(at) + ")"
	}
	s.row("into water", water)
	if r.HydrateWaterG > 0 {
		s.row("hydrate water joins it", s.g(r.HydrateWaterG)+" (total "+s.g(r.TotalWaterG)+")")
	}
	if r.ImpurityG > 0 {
		s.row("insoluble impurity", s.g(r.ImpurityG)+" (taken as inert: it is filtered off with any solid)")
	}
	s.row("dissolve at", s.tc(r.DissolveTempC)+", "+n(r.SaturationPct)+" % of saturation")
	s.row("concentration", n(r.ConcentrationG100)+" g per 100 g water (saturated: "+n(r.SolubilityAtStart)+")")
	if r.MinWaterG > 0 {
		s.row("least water for this charge", s.g(r.MinWaterG))
	}
	if r.HasClearDown {
		s.row("sized to stay clear down to", s.tc(r.ClearDownToC))
	}
	if r.HasFreezing {
		s.row("freezing point", s.tc(r.FreezingPointC)+" (ice forms below it)")
	}
	if r.HasOnset {
		s.row("saturation temperature", s.tc(r.SaturationTempC)+" (crystals can form beyond it)")
	} else {
		s.row("saturation temperature", "none: "+r.OnsetNote)
	}

	if r.HasTarget {
		s.section("At " + s.tc(r.TargetC))
		if r.EvaporatedWaterG > 0 {
			s.row("water evaporated", s.g(r.EvaporatedWaterG))
		}
		if r.CrystalsG > 0 {
			s.row("crystals", s.g(r.CrystalsG)+" of "+r.CrystalPhase)
			s.row("yield (anhydrous basis)", n(r.YieldPct)+" %")
		} else {
			s.row("crystals", "none: the liquor stays unsaturated ("+n(r.LiquorG100)+" of "+n(r.SolubilityAtTargetG100)+" g per 100 g water)")
		}
		if r.HasIce {
			s.row("ice", s.g(r.IceG))
			if r.HasEutectic {
				s.row("eutectic", s.tc(r.EutecticC)+": below it "+r.EutecticPhase+" and ice freeze out together")
			}
		}
		if r.Frozen {
			s.row("mother liquor", "none: below the eutectic the batch freezes solid")
		} else {
			s.row("mother liquor", s.g(r.LiquorG)+", "+n(r.LiquorG100)+" g per 100 g water")
		}
		for _, p := range r.PhaseChanges {
			s.row("phase change", p.From+" → "+p.To+" at "+s.tc(p.TempC))
		}
	}

	if len(r.Supersaturation) > 0 {
		s.section("Unseeded cooling: supersaturation")
		s.row("temperature", "S = c/c*    excess, g per 100 g water")
		for _, p := range r.Supersaturation {
			s.row(s.tc(p.TempC), pad(unit.FormatNumber(p.Ratio, 4), 12)+n(p.DeltaG))
		}
		if r.HasMetastable {
			s.row("expected nucleation near", s.tc(r.NucleationC)+" (metastable zone "+s.dk(r.MetastableWidthK, false)+")")
		}
	}
	if r.HasSeedHint {
		s.section("Seeding")
		s.row("seed at", s.tc(r.SeedHintC)+" with "+s.g(r.SeedLowG)+" to "+s.g(r.SeedHighG)+" of "+r.SeedPhase)
		s.row("rule", r.SeedRule)
	}
	if len(r.Programme) > 0 {
		s.section("Cooling programme, " + s.tc(r.ProgrammeFromC) + " → " + s.tc(r.ProgrammeToC))
		s.row("time, min", pad("linear", 12)+"cubic (Mullin & Nývlt)")
		for _, p := range r.Programme {
			s.row(n(p.TimeMin), pad(s.tc(p.LinearC), 12)+s.tc(p.CubicC))
		}
	}

	s.section("Heat")
	s.row("batch heat capacity", n(r.HeatCapacityKJPerK)+" kJ/K")
	s.row("heat-capacity model", r.HeatCapacityModel)
	if r.HasDissolutionHeat {
		verb, q := "dissolving absorbs", r.DissolutionHeatKJ
		if q < 0 {
			verb, q = "dissolving releases", -q
		}
		s.row(verb, n(q)+" kJ (insulated: "+s.dk(r.DissolutionTempChangeK, true)+"; ΔsolH at infinite dilution)")
	}
	if r.HasTarget {
		if r.HeatBasis != "" && r.CrystalsG > 0 {
			s.row("heat basis", string(r.HeatBasis))
			design := n(r.CrystalEnthalpyKJPerMol) + " kJ/mol of " + r.CrystalPhase
			if r.CrystalEnthalpyLowKJPerMol < r.CrystalEnthalpyKJPerMol {
				design += " (estimates " + n(r.CrystalEnthalpyLowKJPerMol) + " to " + n(r.CrystalEnthalpyKJPerMol) +
					" kJ/mol; sized on the safe side, the larger)"
			}
			s.row("design value", design)
		}
		released := n(r.CrystallizationHeatKJ) + " kJ"
		if r.HeatBasis != "" && r.CrystalsG > 0 && r.CrystallizationHeatLowKJ < r.CrystallizationHeatKJ {
			released += " (" + n(r.CrystallizationHeatLowKJ) + " with the lowest estimate)"
		}
		s.row("crystallization releases", released)
		if r.EnthalpyBasis != "" && r.CrystalsG > 0 {
			s.row("enthalpy used", r.EnthalpyBasis)
			if r.HasApparent {
				s.row("apparent (curve slope)", n(r.ApparentEnthalpyKJPerMol)+" kJ/mol")
			}
		}
		s.row("sensible heat to remove", n(r.SensibleHeatKJ)+" kJ")
		if r.HasIce && r.IceG > 0 {
			s.row("ice freezing releases", n(r.IceHeatKJ)+" kJ ("+s.g(r.IceG)+" of ice)")
		}
		duty := n(r.CoolingDutyKJ) + " kJ"
		if r.HasCoolingPower {
			duty += ", " + n(r.CoolingPowerW) + " W mean over " + n(r.CoolingTimeMin) + " min"
		}
		s.row("cooling duty", duty)
	}
	if r.HasAdiabatic {
		s.section("Seeded at " + s.tc(r.SeedAtC) + " in an insulated vessel")
		end := s.tc(r.AdiabaticEndC) + " (" + s.dk(r.AdiabaticRiseK, true) + ")"
		if r.AdiabaticHeld {
			end = "held at " + s.tc(r.AdiabaticEndC) + ", the end of " + r.AdiabaticPhase + "'s range (" + s.dk(r.AdiabaticRiseK, true) + ")"
		}
		s.row("end temperature", end)
		s.row("crystals at once", s.g(r.AdiabaticCrystalsG)+" of "+r.AdiabaticPhase+" (design heat, "+n(r.AdiabaticEnthalpyKJPerMol)+" kJ/mol)")
		if r.AdiabaticCrystalsLowG != r.AdiabaticCrystalsG || r.AdiabaticEndLowC != r.AdiabaticEndC {
			s.row("with the lowest estimate", s.g(r.AdiabaticCrystalsLowG)+", ends at "+s.tc(r.AdiabaticEndLowC))
		}
		s.row("energy balance", n(r.AdiabaticHeatKJ)+" kJ released = "+n(r.AdiabaticHeatCapacityKJPerK)+" kJ/K × "+n(r.AdiabaticRiseK)+" K")
	}

	if len(r.Warnings) > 0 {
		s.section("Warnings")
		for _, w := range r.Warnings {
			s.bullet(w)
		}
	}
	s.section("Sources")
	for _, src := range r.Sources {
		s.bullet(src)
	}
	return s.b.String()
}

func pad(s string, w int) string {
	if k := utf8.RuneCountInString(s); k < w {
		return s + strings.Repeat(" ", w-k)
	}
	return s + " "
}

// units are the units a text sheet shows: temperature "C", "F" or "K"; mass "g", "kg" or
// "lb"; volume "mL", "L" or "gal" (US). Plans and recipes themselves are always °C, g, mL.
// It is unit.System, the app's too, so a quantity is converted the same way everywhere.
type units = unit.System

var defaultUnits = unit.Metric

// unitsOf reads --temp-unit, --mass-unit and --volume-unit (checked by parseFlags).
func unitsOf(p *parsed) (units, error) {
	u := defaultUnits
	if v, ok := p.opts["temp-unit"]; ok {
		u.Temp = v
	}
	if v, ok := p.opts["mass-unit"]; ok {
		u.Mass = v
	}
	if v, ok := p.opts["volume-unit"]; ok {
		u.Volume = v
	}
	return u, nil
}
