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
// Heats use the enthalpy of solution of the form at infinite dilution and 25 °C from the
// library (positive = dissolving absorbs heat); crystallizing n mol of P releases n·ΔsolH(P).
// That is an approximation (the heat of solution into a nearly saturated solution differs by
// 5–20 %; Mullin, Crystallization, 4th ed., 2001, ch. 2–3, from memory). The apparent
// enthalpy from the slope of the curve (ideal van 't Hoff, ΔH = R·T²·d ln x/dT per mol of
// anhydrous solute) is shown beside it and used only when the library has no value.
//
// Heat capacity of the batch: the "water-equivalent" model, C = m_water·c_p,water(T) (IAPWS-95
// values, see package water): dissolved solute and crystals add nothing. It is an
// approximation (common practice) that errs low by roughly 5–15 % for concentrated salt
// solutions (from memory); a measured value in kJ/(kg·K) of liquor can replace it, and a
// vessel heat capacity in J/K can be added.
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
