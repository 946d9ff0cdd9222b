// Package compound is Saltcast's library of solutes: their solid forms, the solubility of the
// stable form at each temperature, enthalpies of solution, solution densities and hazards.
//
// Model: a Compound has forms (Forms[0] is the anhydrous salt, the others hydrates written
// "CuSO4·5H2O") and a chain of temperature segments, each with the form that is the stable
// solid there and its solubility curve (a solubility.Table through published points). At a
// transition, such as Na2SO4·10H2O → Na2SO4 at 32.38 °C, the two segments share the
// transition point, so the solubility is continuous where the solid changes.
//
// Units: solubility is g of anhydrous solute per 100 g of water, also under a hydrate (its
// water of crystallization counts as water once dissolved); temperatures °C; enthalpies of
// solution kJ/mol at infinite dilution and 25 °C, positive = endothermic; densities kg/m³.
//
// Valid range: each compound's data range (Range), usually 0–100 °C; within
// solubility.WarnMarginK outside it the solubility is extrapolated with a warning, beyond it
// refused. Densities are CRC values at 20 °C, fitted by a cubic in mass fraction; other
// temperatures or stronger solutions give a warning; a compound without density data returns
// an error that asks for the density.
//
// Freezing: a compound may carry a freezing curve (Freezing: the freezing point of its
// solutions against concentration, linear between CRC rows, never extrapolated) and the
// eutectic with ice, which also ends the coldest phase's solubility curve.
//
// Sources: the data file library.txt names a source on every dataset and value; mainly the CRC
// Handbook of Chemistry and Physics (98th ed., aqueous solubility; 102nd ed., concentrative
// properties), Perry's Chemical Engineers' Handbook and the PHREEQC thermodynamic databases.
// Molar masses are computed from the formulas with IUPAC standard atomic weights.
package compound
