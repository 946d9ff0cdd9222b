package balance

import (
	"saltcast/core/compound"
	"saltcast/core/unit"
)

// heatCap works out heat capacities of the batch: liquor, crystals and vessel.
type heatCap struct {
	c         *compound.Compound
	userCp    float64 // kJ/(kg·K) of liquor, 0 = the built-in model
	vesselKJK float64
	melt      *compound.Form // the hydrate whose melt is an end member of the liquor, or nil
}

func newHeatCap(c *compound.Compound, userCpKJPerKgK, vesselJPerK float64) heatCap {
	h := heatCap{c: c, userCp: userCpKJPerKgK, vesselKJK: vesselJPerK / 1000}
	for _, f := range c.Forms {
		if f.HasMeltCp {
			h.melt = f
			break
		}
	}
	return h
}

// liquor returns the heat capacity in kJ/K of a liquor of soluteG anhydrous solute in waterG
// of water at tempC.
//
// With a measured melt heat capacity of one of the compound's hydrates, the liquor is split
// into that melt (all the solute, with the hydrate's water) and free water, and their heat
// capacities are added: a linear mix between two measured end members, exact at both ends
// (pure water; the hydrate melt) and an approximation between them (common practice). A
// liquor richer than the hydrate adds the excess solute at its solid heat capacity. Without
// a melt value the solute is added at its solid heat capacity to the water's (additivity,
// common practice; errs low by roughly 5–25 % for strong liquors, from memory).
func (h heatCap) liquor(soluteG, waterG, tempC float64) float64 {
	if h.userCp > 0 {
		return (soluteG + waterG) / 1000 * h.userCp
	}
	cpw := waterHeatCapacity(tempC)
	solid, _ := h.c.Anhydrous().SolidHeatCapacity()
	if h.melt == nil {
		return (waterG*cpw + soluteG*solid) / 1000
	}
	f := h.melt.AnhydrousFraction
	meltG := min(soluteG/f, waterG/(1-f))
	return (meltG*h.melt.MeltCpKJPerKgK + (waterG-meltG*(1-f))*cpw + (soluteG-meltG*f)*solid) / 1000
}

// slurry is liquor plus crystalsG of phase plus the vessel, in kJ/K.
func (h heatCap) slurry(soluteG, waterG float64, phase *compound.Form, crystalsG, tempC float64) float64 {
	f := phase.AnhydrousFraction
	cps, _ := phase.SolidHeatCapacity()
	return h.liquor(soluteG-crystalsG*f, waterG-crystalsG*(1-f), tempC) + crystalsG*cps/1000 + h.vesselKJK
}

// model says how the figures are worked out, with the sources.
func (h heatCap) model() string {
	var s string
	switch {
	case h.userCp > 0:
		s = cpModelUser + " (" + unit.FormatCompact(h.userCp, 4) + " kJ/(kg·K))"
	case h.melt != nil:
		s = "liquor: mix of the " + h.melt.Formula + " melt (" + unit.FormatCompact(h.melt.MeltCpKJPerKgK, 3) +
			" kJ/(kg·K); " + h.melt.MeltCpSource + ") and free water (c_p of water), between measured end members " +
			"(common practice; about ±10 % between them)"
	default:
		cp, src := h.c.Anhydrous().SolidHeatCapacity()
		s = "liquor: water (c_p of water) plus the solute at its solid heat capacity, " + unit.FormatCompact(cp, 3) +
			" kJ/(kg·K) (" + src + "); additivity, common practice, errs low by about 5–25 % for strong liquors (from memory)"
	}
	s += "; crystals at their solid heat capacity (library value, or Kopp's rule where it has none)"
	if h.vesselKJK > 0 {
		s += "; plus the vessel, " + unit.FormatCompact(h.vesselKJK*1000, 4) + " J/K"
	}
	return s
}
