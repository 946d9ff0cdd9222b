package balance

import (
	"math"

	"saltcast/core/compound"
	"saltcast/core/solubility"
)

// Crash is the equilibrium state of a batch at one temperature.
type Crash struct {
	TempC         float64
	Phase         *compound.Form // the stable solid there
	SolubilityG   float64        // g per 100 g water
	CrystalsG     float64        // mass of Phase, hydrate water included; never negative
	LiquorSoluteG float64
	LiquorWaterG  float64
}

// LiquorG is the mass of mother liquor.
func (k Crash) LiquorG() float64 { return k.LiquorSoluteG + k.LiquorWaterG }

// CrashAt returns the equilibrium at tempC of a batch holding soluteG of anhydrous solute in
// waterG of water (evaporation already subtracted), where the solubility there is s
// (g/100 g) and phase is the stable solid:
//
//	x = (S − W·s/100) / (f − (1 − f)·s/100)
//
// clamped at zero when the liquor is unsaturated. ok is false when the denominator is not
// positive (the liquor would be richer than the solid itself) or the water is not enough
// to hold the hydrate's water of crystallization.
func CrashAt(phase *compound.Form, s, soluteG, waterG, tempC float64) (k Crash, ok bool) {
	k = Crash{TempC: tempC, Phase: phase, SolubilityG: s, LiquorSoluteG: soluteG, LiquorWaterG: waterG}
	f := phase.AnhydrousFraction
	den := f - (1-f)*s/100
	if !(den > 0) {
		return k, false
	}
	x := (soluteG - waterG*s/100) / den
	if !(x > 0) {
		return k, true
	}
	k.CrystalsG = x
	k.LiquorSoluteG = soluteG - x*f
	k.LiquorWaterG = waterG - x*(1-f)
	return k, k.LiquorWaterG > 0 && k.LiquorSoluteG >= 0
}

// crashAt evaluates CrashAt with the compound's curve at tempC (no range check).
func crashAt(c *compound.Compound, soluteG, waterG, tempC float64) (Crash, bool) {
	s, seg := solAt(c, tempC)
	return CrashAt(seg.Form, s, soluteG, waterG, tempC)
}

// gasConstant is R in J/(mol·K): CODATA 2018 exact value 8.314462618.
const gasConstant = 8.314462618

// moleFraction converts g per 100 g water to the mole fraction of the anhydrous solute.
func moleFraction(g100, molarMass float64) float64 {
	n := g100 / molarMass
	return n / (n + 100/solubility.WaterGPerMol)
}

// ApparentEnthalpy returns the ideal van 't Hoff enthalpy of solution of the phase stable
// at the temperatures between t1 and t2, per mol of anhydrous solute, from the secant of
// ln x against 1/T over the part of that interval where the same phase is stable (a
// 0.5 K interval around t2 when that part is shorter). ok is false where the curve gives
// no usable slope.
func ApparentEnthalpy(c *compound.Compound, t1, t2 float64) (kJPerMol float64, ok bool) {
	seg := c.SegmentAt(t2)
	a := math.Max(math.Min(t1, t2), seg.MinC)
	b := math.Min(math.Max(t1, t2), seg.MaxC)
	if b-a < 0.5 {
		a, b = t2-0.25, t2+0.25
		if a < seg.MinC {
			a, b = seg.MinC, seg.MinC+0.5
		}
		if b > seg.MaxC {
			a, b = seg.MaxC-0.5, seg.MaxC
		}
	}
	m := c.MolarMassGPerMol
	xa := moleFraction(seg.Curve.Model.Value(a), m)
	xb := moleFraction(seg.Curve.Model.Value(b), m)
	Ta, Tb := a+273.15, b+273.15
	h := -gasConstant * (math.Log(xb) - math.Log(xa)) / (1/Tb - 1/Ta) / 1000
	if math.IsNaN(h) || math.IsInf(h, 0) {
		return 0, false
	}
	return h, true
}
