package balance

import (
	"math"

	"saltcast/core/compound"
	"saltcast/core/unit"
)

// The cold side of a plan: below the freezing point of the liquor ice crystallizes, and
// below the eutectic the batch sets solid (ice and the salt or hydrate together).
//
// Equilibrium at a temperature T < 0 °C for S g of anhydrous solute in W g of water, with
// s(T) the solubility of the stable solid and c_ice(T) the concentration whose freezing
// point is T (compound.Freezing): a liquor of concentration c is stable against ice when
// c ≥ c_ice(T) and against the solid when c ≤ s(T). Above the eutectic c_ice(T) < s(T) and
//
//	c0 = 100·S/W < c_ice(T):         ice = W − 100·S/c_ice(T), liquor at c_ice(T)
//	c_ice(T) ≤ c0 ≤ s(T):             one clear liquor
//	c0 > s(T):                        crystals by CrashAt, liquor at s(T)
//
// Below the eutectic c_ice(T) > s(T): no liquor is left; all the solute is in the solid
// phase P (anhydrous fraction f) and the rest of the water is ice:
//
//	crystals = S/f,   ice = W − S·(1 − f)/f
//
// Which curve the liquor meets first on cooling follows from the same inequalities, so the
// state at T does not depend on the path (equilibrium, as everywhere in the planner).

// iceFusionKJPerKg is the enthalpy of fusion of ice Ih at 0 °C and 101.325 kPa: 333.55 kJ/kg
// (Feistel & Wagner 2006, J. Phys. Chem. Ref. Data 35:1021, the IAPWS equation of state of
// ice Ih; the calorimetry of Osborne 1939, J. Res. NBS 23:643, gives 333.5; tables quote
// 333.4–333.6; all from memory). The planner takes it at every temperature below 0 °C: ice
// that freezes at T releases less, by about (c_p,water − c_p,ice)·(0 °C − T) ≈ 2.1 kJ/kg per K
// (c_p of water 4.22 and of ice 2.10 kJ/(kg·K) at 0 °C, from memory), about 6 % less at
// −10 °C, so the cooling duty errs on the safe side.
const iceFusionKJPerKg = 333.55

// iceHeatSource is cited with a cooling duty that includes the heat of the ice.
const iceHeatSource = "heat of fusion of ice 333.55 kJ/kg at 0 °C (Feistel & Wagner 2006, J. Phys. Chem. Ref. Data 35:1021, " +
	"IAPWS ice Ih; tables quote 333.4–333.6; from memory), used at every temperature below 0 °C: ice freezing at −10 °C " +
	"releases about 6 % less (c_p of water less c_p of ice ≈ 2.1 kJ/(kg·K), from memory), so the duty errs on the safe side"

// coldTol is the relative margin within which a liquor counts as exactly on a curve
// (last-bit differences of the interpolations, far below anything a balance weighs).
const coldTol = 1e-9

// freezingPoint sets the freezing point of the solution as made and the compound's
// eutectic. Its warnings and sources are given only to a batch that goes below 0 °C.
func freezingPoint(res *Result, b Batch, warn, srcs *notes) {
	c := res.Compound
	fz := c.Freezing
	if fz == nil {
		return
	}
	if fz.HasEutectic {
		res.HasEutectic, res.EutecticC, res.EutecticPhase = true, fz.EutecticC, fz.EutecticForm.Formula
		res.EutecticG100 = fz.EutecticG100
	}
	t, ok := fz.TempC(res.ConcentrationG100)
	res.HasFreezing, res.FreezingPointC = ok, t
	if !(b.DissolveTempC < 0 || b.HasTarget && b.TargetC < 0 || b.HasSeedAt && b.SeedAtC < 0 ||
		b.HasClearDown && b.ClearDownToC-b.ClearMarginK < 0) {
		return
	}
	srcs.add(fz.Source)
	if fz.HasEutectic {
		srcs.add(fz.EutecticSource)
	}
	if ok {
		return
	}
	if fz.HasEutectic {
		warn.add("the solution as made is richer than the eutectic liquor of " + c.ID + " (" +
			unit.FormatCompact(fz.EutecticG100, 4) + " g per 100 g water): on cooling " + fz.EutecticForm.Formula +
			" crystallizes before any ice, and ice appears only at the eutectic, " + fmtC(fz.EutecticC))
		return
	}
	warn.add("the freezing point of this solution is not known: the freezing data of " + c.ID + " stop at " +
		unit.FormatCompact(fz.MaxG100(), 4) + " g per 100 g water (" + fmtC(fz.LowestC()) + "); it lies below that")
}

// coldCrash replaces the crash-out at the target by the equilibrium with ice when the target
// lies below the freezing point of the liquor. soluteG and waterG are the batch after
// evaporation; k is the crash-out with the solid alone. Compounds without freezing data
// keep k, with the general warning of temperatureWarnings.
func coldCrash(res *Result, c *compound.Compound, k Crash, soluteG, waterG float64, warn *notes) (Crash, error) {
	fz := c.Freezing
	T := k.TempC
	if fz == nil || T >= 0 {
		return k, nil
	}
	res.HasIce = true
	unknown := func() error {
		return unit.NumberError("cool_to_C", T, "a temperature at or above "+fmtC(fz.LowestC())+
			": the freezing data of "+c.ID+" end there, and below it ice forms in an amount Saltcast cannot compute")
	}
	cl := 100 * k.LiquorSoluteG / k.LiquorWaterG
	if tf, ok := fz.TempC(cl); ok && tf <= T {
		return k, nil // the liquor stays above its freezing point
	} else if !ok && T >= fz.LowestC() {
		return k, nil // richer than the data, so it freezes below their end, which is below T
	}
	cIce, ok := fz.LiquorG100(T)
	if !ok {
		if !fz.HasEutectic {
			return k, unknown()
		}
		return solid(res, c, k, soluteG, waterG, warn)
	}
	if k.CrystalsG > 0 || cIce > k.SolubilityG*(1+coldTol) {
		// The liquor would have to be richer than the solid allows: below the eutectic.
		return solid(res, c, k, soluteG, waterG, warn)
	}
	liquorW := 100 * soluteG / cIce
	res.IceG = math.Max(0, waterG-liquorW)
	k.CrystalsG, k.LiquorSoluteG, k.LiquorWaterG = 0, soluteG, waterG-res.IceG
	warn.add(fmtC(T) + " is below the freezing point of the liquor: " + unit.FormatCompact(res.IceG, 4) +
		" g of ice separate and the liquor concentrates to " + unit.FormatCompact(cIce, 4) + " g per 100 g water" +
		eutecticNote(fz))
	return k, nil
}

// solid is the state below the eutectic: all the solute in the stable solid, the rest ice.
func solid(res *Result, c *compound.Compound, k Crash, soluteG, waterG float64, warn *notes) (Crash, error) {
	f := k.Phase.AnhydrousFraction
	x := soluteG / f
	ice := waterG - x*(1-f)
	if !(ice >= 0) {
		return k, unit.NumberError("cool_to_C", k.TempC, "a temperature above the eutectic of "+c.ID+
			": below it this batch, richer than "+k.Phase.Formula+" itself, would set to a solid Saltcast does not model")
	}
	res.IceG, res.Frozen = ice, true
	k.CrystalsG, k.LiquorSoluteG, k.LiquorWaterG = x, 0, 0
	where := "below the eutectic"
	if fz := c.Freezing; fz.HasEutectic {
		where += " (" + fmtC(fz.EutecticC) + ")"
	} else {
		where += ", where the freezing curve of the data meets the solubility of " + k.Phase.Formula
	}
	warn.add(fmtC(k.TempC) + " is " + where + ": the batch freezes solid, " + unit.FormatCompact(x, 4) + " g of " +
		k.Phase.Formula + " and " + unit.FormatCompact(ice, 4) + " g of ice, with no liquor to filter off")
	return k, nil
}

func eutecticNote(fz *compound.Freezing) string {
	if !fz.HasEutectic {
		return ""
	}
	return "; below the eutectic, " + fmtC(fz.EutecticC) + ", " + fz.EutecticForm.Formula + " and ice separate together"
}

// iceHeat is the heat released by iceG of ice freezing, in kJ (iceFusionKJPerKg).
func iceHeat(iceG float64) float64 { return iceG / 1000 * iceFusionKJPerKg }

// clearOfIce refuses a storage temperature at which even the richest stock that stays free of
// crystals (g100) would freeze: a stock with ice in it is not clear. Below the eutectic no
// stock is clear.
func clearOfIce(c *compound.Compound, g100, tempC, clearDownToC float64) error {
	fz := c.Freezing
	if fz == nil || tempC >= 0 {
		return nil
	}
	tf, ok := fz.TempC(g100)
	switch {
	case ok && tf <= tempC:
		return nil
	case !ok && tempC >= fz.LowestC():
		return nil
	case !ok && !fz.HasEutectic:
		return unit.NumberError("clear_down_to_C", clearDownToC, "a storage temperature at or above "+
			fmtC(fz.LowestC())+" (with the margin), where the freezing data of "+c.ID+" end")
	}
	allowed := "a storage temperature at which the stock does not freeze"
	if fz.HasEutectic {
		allowed += ": above the eutectic of " + c.ID + ", " + fmtC(fz.EutecticC) + ", with the margin"
	} else {
		allowed += ": the richest stock that stays free of crystals there freezes at " + fmtC(tf)
	}
	return unit.NumberError("clear_down_to_C", clearDownToC, allowed)
}

// coldWarnings warns where a planned temperature lies below the freezing point of the
// solution as made, for compounds with freezing data (temperatureWarnings covers the others).
func coldWarnings(res *Result, b Batch, warn *notes) {
	if res.Compound.Freezing == nil || !res.HasFreezing {
		return
	}
	tf := res.FreezingPointC
	if b.HasSeedAt && b.SeedAtC < tf {
		warn.add("seed_at_C " + fmtC(b.SeedAtC) + " is below the freezing point of the solution, " + fmtC(tf) +
			": ice may form before or with the crystals, which the seeded (adiabatic) figures do not include")
	}
	if res.HasOnset && res.SaturationTempC < tf && b.HasTarget && b.TargetC < tf {
		warn.add("the solution reaches its freezing point, " + fmtC(tf) + ", before it saturates: ice forms first")
	}
}

// dissolveAboveFreezing refuses a dissolve temperature at which the solution as made would
// be partly ice.
func dissolveAboveFreezing(res *Result, b Batch) error {
	if res.HasFreezing && b.DissolveTempC < res.FreezingPointC {
		return unit.NumberError("dissolve_temp_C", b.DissolveTempC, "a temperature at or above "+
			fmtC(res.FreezingPointC)+", the freezing point of this solution")
	}
	return nil
}

// liquorG100 is the concentration of the liquor of k; with no liquor left (frozen solid) it
// is that of the last liquor, the eutectic one (or the solubility at the target where no
// eutectic is published).
func liquorG100(k Crash, c *compound.Compound) float64 {
	if k.LiquorWaterG > 0 {
		return 100 * k.LiquorSoluteG / k.LiquorWaterG
	}
	if fz := c.Freezing; fz != nil && fz.HasEutectic {
		return fz.EutecticG100
	}
	return k.SolubilityG
}

// coldNote says how a planned temperature below 0 °C stands against the freezing point of
// the solution as made, for a compound with freezing data.
func coldNote(res *Result, key string, t float64) string {
	fz := res.Compound.Freezing
	head := key + " " + fmtC(t) + " is below 0 °C"
	switch {
	case res.HasFreezing && t >= res.FreezingPointC:
		return head + " but not below the freezing point of the solution as made, " + fmtC(res.FreezingPointC)
	case res.HasFreezing:
		return head + " and below the freezing point of the solution as made, " + fmtC(res.FreezingPointC) +
			": ice forms there unless crystals have taken enough solute out first"
	case fz.HasEutectic:
		return head + "; the solution as made is richer than the eutectic liquor, so it does not freeze above the eutectic, " +
			fmtC(fz.EutecticC)
	}
	return head + "; the solution as made is richer than the freezing data reach, so its freezing point lies below " +
		fmtC(fz.LowestC())
}
