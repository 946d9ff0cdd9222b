package balance

import (
	"math"

	"saltcast/core/compound"
	"saltcast/core/unit"
)

// enthalpyChoice is the enthalpy of solution used for one solid phase, per mol of the
// phase (one formula unit: the same as per mol of anhydrous solute).
type enthalpyChoice struct {
	kJPerMol float64
	ok       bool
	basis    string
	apparent float64
	hasApp   bool
}

// chooseEnthalpy prefers the library value at infinite dilution (sourced); the apparent
// van 't Hoff value from the curve between t1 and t2 is computed beside it and used only
// when the library has none.
func chooseEnthalpy(c *compound.Compound, phase *compound.Form, t1, t2 float64) enthalpyChoice {
	var e enthalpyChoice
	e.apparent, e.hasApp = ApparentEnthalpy(c, t1, t2)
	switch {
	case phase.HasEnthalpy:
		e.kJPerMol, e.ok = phase.SolutionEnthalpyKJPerMol, true
		e.basis = "ΔsolH of " + phase.Formula + " at infinite dilution, 25 °C, from the library (" +
			unit.FormatCompact(phase.SolutionEnthalpyKJPerMol, 4) + " kJ/mol; " + phase.EnthalpySource + ")"
	case e.hasApp:
		e.kJPerMol, e.ok = e.apparent, true
		e.basis = "apparent ΔsolH of " + phase.Formula + " from the slope of the solubility curve (ideal van 't Hoff, " +
			unit.FormatCompact(e.apparent, 4) + " kJ/mol), because the library has no measured value"
	}
	return e
}

// heat fills the heat fields of res: batch heat capacity, heat of dissolving, heat of
// crystallization at the target, cooling duty, and the adiabatic end temperature.
func heat(res *Result, b Batch, form *compound.Form, m, p, S, Wt float64, heating bool, warn, srcs *notes) {
	c := b.Compound
	tMean := b.DissolveTempC
	if b.HasTarget {
		tMean = (b.DissolveTempC + b.TargetC) / 2
	}
	capAt := func(t float64) float64 {
		if b.LiquorCpKJPerKgK > 0 {
			return (m*p+b.WaterG)/1000*b.LiquorCpKJPerKgK + b.VesselJPerK/1000
		}
		return Wt/1000*waterHeatCapacity(t) + b.VesselJPerK/1000
	}
	res.HeatCapacityKJPerK = capAt(tMean)
	res.HeatCapacityModel = cpModelWater
	if b.LiquorCpKJPerKgK > 0 {
		res.HeatCapacityModel = cpModelUser
	} else {
		srcs.add(cpWaterSource)
	}
	if b.VesselJPerK > 0 {
		res.HeatCapacityModel += "; plus the vessel, " + unit.FormatCompact(b.VesselJPerK, 4) + " J/K"
	}

	// Dissolving the charge.
	if form.HasEnthalpy {
		res.HasDissolutionHeat = true
		res.DissolutionEnthalpyKJPerMol = form.SolutionEnthalpyKJPerMol
		res.DissolutionHeatKJ = m * p / form.MolarMassGPerMol * form.SolutionEnthalpyKJPerMol
		res.DissolutionTempChangeK = -res.DissolutionHeatKJ / capAt(b.DissolveTempC)
		srcs.add(form.EnthalpySource)
	} else {
		warn.add("the library has no enthalpy of solution for " + form.Formula + ": the heat of dissolving is not given")
	}

	// Crystallization at the target.
	if b.HasTarget {
		phase := c.SegmentAt(b.TargetC).Form
		from := b.DissolveTempC
		if res.HasOnset {
			from = res.SaturationTempC
		}
		e := chooseEnthalpy(c, phase, from, b.TargetC)
		res.ApparentEnthalpyKJPerMol, res.HasApparent = e.apparent, e.hasApp
		if e.ok {
			res.CrystalEnthalpyKJPerMol = e.kJPerMol
			res.EnthalpyBasis = e.basis
			res.CrystallizationHeatKJ = res.CrystalsG / phase.MolarMassGPerMol * e.kJPerMol
			if res.CrystalsG > 0 && phase.HasEnthalpy {
				srcs.add(phase.EnthalpySource)
			}
			if res.CrystalsG > 0 {
				srcs.add(heatSource)
			}
			if res.CrystalsG > 0 && phase.HasEnthalpy && e.hasApp && differ(e.kJPerMol, e.apparent) {
				warn.add("the library ΔsolH of " + phase.Formula + " (" + unit.FormatCompact(e.kJPerMol, 3) +
					" kJ/mol) and the apparent value from the curve slope (" + unit.FormatCompact(e.apparent, 3) +
					" kJ/mol) differ by more than " + unit.FormatCompact(enthalpyDiffPct, 2) +
					" %; the library value is used, so treat the crystallization heat as a rough figure")
			}
		} else if res.CrystalsG > 0 {
			warn.add("no enthalpy of solution for " + phase.Formula + ": the heat of crystallization is not included")
		}
		res.SensibleHeatKJ = res.HeatCapacityKJPerK * (b.DissolveTempC - b.TargetC)
		res.CoolingDutyKJ = res.SensibleHeatKJ + res.CrystallizationHeatKJ
		if heating {
			warn.add("the batch is heated to the target: a negative cooling duty is heat to supply")
		}
		if b.CoolingTimeMin > 0 {
			res.HasCoolingPower = true
			res.CoolingTimeMin = b.CoolingTimeMin
			res.CoolingPowerW = res.CoolingDutyKJ * 1000 / (b.CoolingTimeMin * 60)
		}
	}

	if b.HasSeedAt {
		adiabatic(res, b, S, Wt, capAt, warn)
	}
}

func differ(a, b float64) bool {
	return math.Abs(a-b) > enthalpyDiffPct/100*math.Max(math.Abs(a), math.Abs(b))
}

// adiabatic solves the insulated, seeded batch: crystals form at SeedAtC and warm the batch,
// which raises the solubility, which stops the crystals forming. It finds T_end in
// [T_seed, T_onset] with C·(T_end − T_seed) = Q_cryst(x_eq(T_end)).
func adiabatic(res *Result, b Batch, S, Wt float64, capAt func(float64) float64, warn *notes) {
	c := b.Compound
	ts, on := b.SeedAtC, res.SaturationTempC
	seedPhase := c.SegmentAt(ts).Form
	// One enthalpy per phase met, chosen once (there are at most a few phases).
	type choice struct {
		phase *compound.Form
		e     enthalpyChoice
	}
	var choices [4]choice
	n := 0
	hOf := func(phase *compound.Form, t float64) enthalpyChoice {
		for i := 0; i < n; i++ {
			if choices[i].phase == phase {
				return choices[i].e
			}
		}
		e := chooseEnthalpy(c, phase, on, t)
		if n < len(choices) {
			choices[n] = choice{phase, e}
			n++
		}
		return e
	}
	e0 := hOf(seedPhase, ts)
	if !e0.ok {
		warn.add("no enthalpy of solution for " + seedPhase.Formula + ": the adiabatic end temperature is not worked out")
		return
	}
	if e0.kJPerMol <= 0 {
		warn.add(seedPhase.Formula + " releases heat on dissolving, so crystallizing it cools the batch: " +
			"the insulated seeded batch is not worked out")
		return
	}
	C := capAt((ts + on) / 2)
	q := func(t float64) float64 {
		k, ok := crashAt(c, S, Wt, t)
		if !ok || k.CrystalsG == 0 {
			return 0
		}
		e := hOf(k.Phase, t)
		if !e.ok {
			return 0
		}
		return k.CrystalsG / k.Phase.MolarMassGPerMol * e.kJPerMol
	}
	h := func(t float64) float64 { return C*(t-ts) - q(t) }
	hs := h(ts)
	if !(hs < 0) {
		return
	}
	tEnd := refine(h, ts, hs, on, h(on))
	k, _ := crashAt(c, S, Wt, tEnd)
	res.HasAdiabatic = true
	res.SeedAtC = ts
	res.AdiabaticEndC = tEnd
	res.AdiabaticCrystalsG = k.CrystalsG
	res.AdiabaticRiseK = tEnd - ts
	res.AdiabaticPhase = k.Phase.Formula
	res.AdiabaticG100 = 100 * k.LiquorSoluteG / k.LiquorWaterG
	if k.Phase != seedPhase {
		warn.add("the insulated batch warms past a phase change: the solid at its end temperature is " + k.Phase.Formula)
	}
	res.AdiabaticBasis = e0.basis
	for i := 1; i < len(c.Segments); i++ {
		if bt := c.Segments[i].MinC; math.Abs(bt-tEnd) < 0.5 {
			warn.add("the adiabatic end temperature is held near the " + fmtC(bt) + " transition, where " +
				c.Segments[i-1].Form.Formula + " stops being the stable solid")
		}
	}
}
