// Package prep works out an everyday solution made up to the mark: how much of the solid on
// the shelf (or of a stock solution) and how much water give a target concentration in a
// final volume, a final mass or a given mass of water, and how cold the bottle may get
// before the solute crystallizes.
//
// # Model
//
// Everything is solved for w, the mass fraction of anhydrous solute in the finished
// solution. Mass-based targets give w directly: % w/w is 100·w; a molality b (mol/kg of
// water) gives w = b·M/(1000 + b·M), M the anhydrous molar mass. Volume-based targets (mol/L,
// mmol/L, g/L, mg/L and % w/v = g per 100 mL of solution) fix the solute per litre,
// c = w·ρ(w, T), which is solved for w exactly by bisection on the density curve (the
// solute per litre grows with w), not by guessing a density first.
//
// The amount then gives the solution mass m: m = V·ρ(w, T) for a final volume V made up to
// the mark at the make-up temperature T; m as given for a final mass; m = W/(1 − w) for a
// total water mass W (the water of a hydrate counts as water). The solute is S = w·m and
// the water W = m − S.
//
// From a shelf form with anhydrous mass fraction f (M_anhydrous/M_form) at purity p, the
// mass to weigh is S/(f·p); its water of crystallization S·(1 − f)/f joins the water, so the
// water to add is W − S·(1 − f)/f, which must not be negative: a hydrate cannot make a
// solution stronger than itself. Impurities are taken as inert and insoluble, as in package
// balance: they are weighed and reported but take no part in the composition. The mass
// balance form + water added = solution + impurity closes exactly.
//
// From a stock of the same solute with mass fraction w_s > w: stock mass S/w_s, water
// m − S/w_s; the stock's volume at T is its mass over ρ(w_s, T).
//
// When filling to the mark the water is added until the meniscus reaches it; the water
// mass printed is what the density data say it will take, so it is labelled approximate.
// The volume of the flask is taken as its nominal volume at T: borosilicate glass (linear
// expansion about 3.3e-6 /K, ISO 3585, from memory) changes a flask's volume by under
// 0.03 % between 0 and 50 °C, less than the density data's own uncertainty.
//
// # Densities
//
// Solution densities at 20 °C come from package compound (CRC Handbook of Chemistry and
// Physics, 102nd ed., 2021, "Concentrative Properties of Aqueous Solutions", fitted by a
// cubic in w). At another temperature T the 20 °C value is scaled by the density ratio of
// pure water, ρ(w, T) = ρ(w, 20 °C)·ρ_water(T)/ρ_water(20 °C) (Kell 1975, J. Chem. Eng. Data
// 20:97). That assumes the solution expands like water; salt solutions expand more. Against
// the NaCl densities of Rogers & Pitzer (1982, J. Phys. Chem. Ref. Data 11:15, as tabulated
// in the CRC Handbook's "Volumetric Properties of Aqueous Sodium Chloride Solutions") the
// approximation errs by up to 0.64 % at 0 °C and 0.35 % at 60 °C for 5 mol/kg (22.6 mass %),
// and by under 0.05 % at 0.1 mol/kg. DensityErrorPct states the bound that covers those
// deviations; the tests hold it against every row of that table. For other solutes the same
// behaviour is assumed, not measured. A solute without density data can still be made to a
// % w/w or mol/kg target by mass or by water; volume-based targets and final volumes are
// refused with a *unit.FieldError, never guessed.
//
// # Saturation and storage
//
// The solution holds g = 100·w/(1 − w) g of anhydrous solute per 100 g of water, the basis of
// package compound's solubility curves. The saturation temperature is where the curve of the
// stable solid meets g: for an ordinary (prograde) solute, the temperature below which the
// bottle starts to crystallize, found by balance.Onset; for a solution already stronger than
// the solubility at T, the temperature it must be warmed to before it dissolves. The bottle is
// labelled "keep above" the higher of the saturation temperature and the freezing point, plus
// StorageMarginK. Saturation is at equilibrium: a clean solution may stay supersaturated
// below it for a while, but no one should rely on that.
//
// The freezing point is read from the compound's freezing curve (package compound:
// freezing-point depressions of the CRC Handbook, 102nd ed., "Concentrative Properties of
// Aqueous Solutions", interpolated linearly in g per 100 g water, never extrapolated). A
// storage temperature below it is a warning and the bottle is not clear there; without data,
// or for a solution richer than the data reach, the freezing point is left out with a
// warning. A compound flagged toxic carries balance.ToxicCaution first, as a plan does.
//
// # Units and ranges
//
// Masses g, volumes mL, temperatures °C, densities kg/m³ inside (g/mL in the JSON). The
// make-up temperature is 0–100 °C and inside the compound's data range (within
// solubility.WarnMarginK outside it a warning, beyond it refused).
//
// # Sources
//
// Molar masses from the formulas with IUPAC standard atomic weights (package compound);
// solubilities and densities as cited by each compound in the library; water densities Kell
// (1975); the temperature error of the density scaling measured against Rogers & Pitzer
// (1982).
package prep
