package balance

import (
	"math"

	"saltcast/core/unit"
)

// heat fills the heat fields: batch heat capacity, heat of dissolving, heat of
// crystallization at the target, cooling duty, and the insulated seeded batch.
func (pl *planner) heat() {
	res, b, c := pl.res, pl.b, pl.c
	hc := newHeatCap(c, b.LiquorCpKJPerKgK, b.VesselJPerK)
	tMean := b.DissolveTempC
	if b.HasTarget {
		tMean = (b.DissolveTempC + b.TargetC) / 2
	}
	// The batch as a clear liquor, before crystals form: the sensible heat is taken out of
	// it, then the crystals form at the target (Hess's law; the heat of crystallization is
	// evaluated on the crystallization path).
	capAt := func(t float64) float64 { return hc.liquor(pl.S, pl.Wt, t) + hc.vesselKJK }
	res.HeatCapacityKJPerK = capAt(tMean)
	res.HeatCapacityModel = hc.model()
	if b.LiquorCpKJPerKgK == 0 {
		pl.srcs.add(cpWaterSource)
		if hc.melt != nil {
			pl.srcs.add(hc.melt.MeltCpSource)
		} else {
			_, src := c.Anhydrous().SolidHeatCapacity()
			pl.srcs.add(src)
		}
	}

	// Dissolving the charge.
	form := pl.form
	if form.HasEnthalpy {
		res.HasDissolutionHeat = true
		res.DissolutionEnthalpyKJPerMol = form.SolutionEnthalpyKJPerMol
		res.DissolutionHeatKJ = pl.m * pl.p / form.MolarMassGPerMol * form.SolutionEnthalpyKJPerMol
		res.DissolutionTempChangeK = -res.DissolutionHeatKJ / capAt(b.DissolveTempC)
		pl.srcs.add(form.EnthalpySource)
		if math.Abs(res.DissolutionTempChangeK) > 2 {
			// Said in proportion: the far larger gap of salts that form hydrates is named only
			// for them, not for a plain salt such as KCl.
			w := "the heat of dissolving uses ΔsolH at infinite dilution; dissolving into a strong liquor releases or " +
				"absorbs a somewhat different amount, so treat the dissolving figures as rough"
			if len(c.Forms) > 1 {
				w = "the heat of dissolving uses ΔsolH at infinite dilution; dissolving into a strong liquor releases or " +
					"absorbs a different amount (for salts that form hydrates, such as CH3COONa, far less heat than the " +
					"infinite-dilution value), so treat the dissolving figures as rough"
			}
			pl.warn.add(w)
		}
	} else {
		pl.warn.add("the library has no enthalpy of solution for " + form.Formula + ": the heat of dissolving is not given")
	}

	if b.HasTarget {
		pl.crystallizationHeat()
	}
	if b.HasSeedAt {
		pl.adiabatic(hc)
	}
}

// crystallizationHeat works out the heat released by the crystals at the target and the
// cooling duty, sized on the safe side of the estimates.
func (pl *planner) crystallizationHeat() {
	res, b, c := pl.res, pl.b, pl.c
	seg := c.SegmentAt(b.TargetC)
	phase := seg.Form
	from := b.DissolveTempC
	if res.HasOnset {
		from = res.SaturationTempC
	}
	res.ApparentEnthalpyKJPerMol, res.HasApparent = ApparentEnthalpy(c, from, b.TargetC)
	// The crystals of the target phase grow between the onset (or the start of the
	// phase's range) and the target: the heat is taken at the middle of that stretch.
	lo, hi := math.Min(from, b.TargetC), math.Max(from, b.TargetC)
	lo, hi = math.Max(lo, seg.MinC), math.Min(hi, seg.MaxC)
	tc := b.TargetC
	if hi > lo {
		tc = (lo + hi) / 2
	}
	ch := CrystallizationHeat(c, phase, tc)
	if ch.OK {
		res.CrystalEnthalpyKJPerMol = ch.HighKJPerMol
		res.CrystalEnthalpyLowKJPerMol = ch.LowKJPerMol
		res.HeatBasis = ch.Basis
		res.EnthalpyBasis = ch.Describe()
		n := res.CrystalsG / phase.MolarMassGPerMol
		res.CrystallizationHeatKJ = n * ch.HighKJPerMol
		res.CrystallizationHeatLowKJ = n * ch.LowKJPerMol
		if res.CrystalsG > 0 {
			for _, e := range ch.Estimates {
				pl.srcs.add(e.Source)
			}
			pl.srcs.add(heatSource)
		}
	} else if res.CrystalsG > 0 {
		pl.warn.add("no estimate of the heat of crystallization of " + phase.Formula + ": it is not included in the cooling duty")
	}
	res.SensibleHeatKJ = res.HeatCapacityKJPerK * (b.DissolveTempC - b.TargetC)
	// The ice that freezes at the target gives up its heat of fusion, which the cooling must
	// also take away (the sensible heat above treats it as liquid down to the target).
	if res.HasIce && res.IceG > 0 {
		res.IceHeatKJ = iceHeat(res.IceG)
		pl.srcs.add(iceHeatSource)
		pl.warn.add("the cooling duty includes " + unit.FormatCompact(res.IceHeatKJ, 3) + " kJ released by " +
			unit.FormatCompact(res.IceG, 4) + " g of ice freezing (" + unit.FormatCompact(iceFusionKJPerKg, 5) +
			" kJ/kg, the value at 0 °C, on the safe side below it)")
	}
	res.CoolingDutyKJ = res.SensibleHeatKJ + res.CrystallizationHeatKJ + res.IceHeatKJ
	if pl.heating {
		pl.warn.add("the batch is heated to the target: a negative cooling duty is heat to supply")
	}
	if b.CoolingTimeMin > 0 {
		res.HasCoolingPower = true
		res.CoolingTimeMin = b.CoolingTimeMin
		res.CoolingPowerW = res.CoolingDutyKJ * 1000 / (b.CoolingTimeMin * 60)
	}
}

// adiabaticScanK is the step of the scan for the end of the insulated warming; finer than
// the features of the library curves near a transition.
const adiabaticScanK = 0.25

// adiabatic solves the insulated, seeded batch. Crystals of the phase P stable at the seed
// temperature T_s grow and warm the slurry, which raises the solubility, which stops them.
// With q the heat released per gram of P and C(x, T) the heat capacity of slurry and vessel
// holding x grams of P, the end is the first T above T_s with
//
//	C(x_eq(T), T)·(T − T_s) = x_eq(T)·q
//
// where x_eq(T) is the equilibrium amount of P on P's own curve. If warming reaches the end
// of P's range (its transition: 58 °C for CH3COONa·3H2O, 32.38 °C for Na2SO4·10H2O) first,
// the temperature holds there, because above it P dissolves again (the hydrate melts in its
// own water), and the crystal mass follows from the balance: x·q = C(x)·(T_t − T_s), below
// the equilibrium amount. The other phase is not seeded and (for the hydrates above)
// absorbs heat as it crystallizes, so none of it is formed. The balance closes by
// construction: x is solved from it at the end temperature.
func (pl *planner) adiabatic(hc heatCap) {
	res, b, c := pl.res, pl.b, pl.c
	ts, on := b.SeedAtC, res.SaturationTempC
	seg := c.SegmentAt(ts)
	P := seg.Form
	top := seg.MaxC
	last := seg == &c.Segments[len(c.Segments)-1] // P's range ends with the data, not at a transition
	ch := CrystallizationHeat(c, P, (ts+math.Min(on, top))/2)
	if !ch.OK {
		pl.warn.add("no estimate of the heat of crystallization of " + P.Formula + ": the insulated seeded batch is not worked out")
		return
	}
	if ch.HighKJPerMol <= 0 {
		pl.warn.add(P.Formula + " absorbs heat as it crystallizes from its saturated liquor, so seeding cools the batch: " +
			"the insulated seeded batch is not worked out")
		return
	}
	xeq := func(t float64) float64 {
		k, ok := CrashAt(P, seg.Curve.Model.Value(t), pl.S, pl.Wt, t)
		if !ok {
			return 0
		}
		return k.CrystalsG
	}
	if !(xeq(ts) > 0) {
		return
	}
	solve := func(kJPerMol float64) (tEnd, x float64, atTop, ok bool) {
		qg := kJPerMol / P.MolarMassGPerMol // kJ per gram of P
		h := func(t float64) float64 {
			x := xeq(t)
			return hc.slurry(pl.S, pl.Wt, P, x, (ts+t)/2)*(t-ts) - x*qg
		}
		prevT, prevH := ts, h(ts)
		tEnd, atTop = top, true
		n := int(math.Ceil((top - ts) / adiabaticScanK))
		for i := 1; i <= n; i++ {
			t := ts + (top-ts)*float64(i)/float64(n)
			if ht := h(t); ht >= 0 {
				tEnd, atTop = refine(h, prevT, prevH, t, ht), false
				break
			} else {
				prevT, prevH = t, ht
			}
		}
		if atTop && last {
			return 0, 0, false, false // would warm past the end of the data
		}
		// x from the balance at tEnd: g(x) = x·q − C(x)·ΔT is increasing in x (q exceeds
		// the heat capacity of a gram of crystals times ΔT wherever g(x_eq) ≤ 0), so bisect.
		dT := tEnd - ts
		g := func(x float64) float64 { return x*qg - hc.slurry(pl.S, pl.Wt, P, x, (ts+tEnd)/2)*dT }
		a, z := 0.0, xeq(tEnd)
		if g(z) < 0 {
			z = math.Max(z, hc.slurry(pl.S, pl.Wt, P, 0, (ts+tEnd)/2)*dT/qg*2)
		}
		for range 200 {
			mid := (a + z) / 2
			if g(mid) < 0 {
				a = mid
			} else {
				z = mid
			}
			if z-a <= 1e-14*z {
				break
			}
		}
		return tEnd, (a + z) / 2, atTop, true
	}
	tEnd, x, atTop, ok := solve(ch.HighKJPerMol)
	if !ok {
		pl.warn.add("seeded at " + fmtC(ts) + ", the insulated batch would warm past the end of the data for " + c.ID +
			": its end temperature is not worked out")
		return
	}
	f := P.AnhydrousFraction
	res.HasAdiabatic = true
	res.SeedAtC = ts
	res.AdiabaticEndC = tEnd
	res.AdiabaticCrystalsG = x
	res.AdiabaticRiseK = tEnd - ts
	res.AdiabaticPhase = P.Formula
	res.AdiabaticG100 = 100 * (pl.S - x*f) / (pl.Wt - x*(1-f))
	res.AdiabaticHeld = atTop
	res.AdiabaticEnthalpyKJPerMol = ch.HighKJPerMol
	res.AdiabaticHeatKJ = x / P.MolarMassGPerMol * ch.HighKJPerMol
	res.AdiabaticHeatCapacityKJPerK = hc.slurry(pl.S, pl.Wt, P, x, (ts+tEnd)/2)
	res.AdiabaticBasis = ch.Describe()
	res.AdiabaticEndLowC, res.AdiabaticCrystalsLowG = tEnd, x
	if ch.LowKJPerMol < ch.HighKJPerMol && ch.LowKJPerMol > 0 {
		if t2, x2, _, ok := solve(ch.LowKJPerMol); ok {
			res.AdiabaticEndLowC, res.AdiabaticCrystalsLowG = t2, x2
		}
	}
	for _, e := range ch.Estimates {
		pl.srcs.add(e.Source)
	}
	if atTop {
		next := c.SegmentAt(top + 1e-9).Form
		pl.warn.add("seeded, the insulated batch warms to the " + fmtC(top) + " transition and holds there: above it " +
			P.Formula + " gives way to " + next.Formula + ", whose crystallizing does not release the heat; " +
			unit.FormatCompact(x, 4) + " g of " + P.Formula + " form (from the energy balance), and the liquor stays " +
			"supersaturated until it is cooled")
	}
}
