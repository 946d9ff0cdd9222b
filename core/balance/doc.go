// Package balance is the batch planner: the charge to weigh, the saturation (onset)
// temperature, the crash-out with its hydrate water, the heat, the adiabatic end
// temperature of a seeded batch, seeding and the cooling programme.
//
// # Model
//
// Everything is worked in grams of anhydrous solute per 100 g of water (g/100 g), the basis
// of compound.Solubility. A charge m of a shelf form F with anhydrous mass fraction
// f = M_anhydrous/M_F and purity p (mass fraction) into W grams of water gives
//
//	solute S = m·p·f,   water Wt = W + m·p·(1 − f)
//
// (a hydrate's water of crystallization joins the solvent). Impurities are treated as inert
// and insoluble: they add mass to the charge and to the filter cake but take no part in the
// balance, and they are reported separately.
//
// The crash-out at a temperature T2, after evaporating E grams of water, leaves the phase P
// that is stable at T2 (anhydrous fraction f_P, solubility s2 g/100 g):
//
//	crystals x = (S − (Wt − E)·s2/100) / (f_P − (1 − f_P)·s2/100)   when positive, else 0
//
// which is the equilibrium amount: the plan assumes the batch reaches equilibrium at T2
// (enough time, seeding or nucleation), ideal mixing, and a solid free of liquor. The mass
// balance crystals + liquor + evaporated water = charge·p + water closes exactly.
//
// Heats. Crystals grow from a saturated liquor, so the heat that counts is the differential
// (last) heat of solution at saturation, not the tabulated value at infinite dilution (Mullin,
// Crystallization, 4th ed., 2001, ch. 3, from memory). Per solid phase the planner gathers:
//
//   - the activity-corrected van 't Hoff value ΔH = ν·R·T²·(1 + d ln γ±/d ln m)·(1 − n·m·M_w)·
//     d ln m_s/dT from the slope of the curve and the salt's Pitzer parameters (package
//     activity), where the saturation molality lies inside the parameters' range;
//   - the heat of fusion of a hydrate that melts in its own water (CH3COONa·3H2O,
//     Na2SO4·10H2O), exact for a liquor of the hydrate's own composition;
//   - as fallbacks only, ΔsolH at infinite dilution and the ideal van 't Hoff slope.
//
// The design figure is the largest of the best estimates (the fallbacks when there are none):
// it gives the larger cooling duty and the larger insulated jump. The range is reported.
//
// Heat capacity of the batch (see heatCap): liquor from water (IAPWS-95 c_p) plus the solute
// at its solid heat capacity, or, where a hydrate melt heat capacity is known, a mix of that
// melt and free water; crystals at their solid heat capacity (library, else Kopp's rule); plus
// the vessel. A measured liquor value in kJ/(kg·K) replaces the liquor model.
//
// The insulated seeded batch: crystals of the phase stable at the seed temperature grow and
// warm the slurry until the solubility stops them or the phase's range ends at a transition,
// where the temperature holds and the crystal mass follows from the energy balance. Heat
// released equals heat taken up, to rounding.
//
// Below 0 °C, for a compound with freezing data (compound.Freezing), ice separates when the
// liquor lies below its freezing point: the liquor left beside the ice is the one whose
// freezing point is the target, and below the eutectic the batch freezes solid (all the
// solute in the stable solid, the rest ice). See ice.go. Compounds without freezing data get
// a warning instead. The latent heat of the ice is reported in a warning, not in the duty.
//
// # Not modelled
//
// Kinetics (growth and nucleation rates), agglomeration, inclusions of mother liquor,
// solid solutions, other solutes (common-ion effects), the heat carried off by evaporated
// water, heat losses to the room, the boiling point, and metastable ice-free liquors below the
// freezing point (supercooling).
package balance
