// Package solubility gives the equilibrium solubility of a solid as a function of temperature.
//
// Model: a Curve pairs a Model (a raw function of temperature) with the temperature range its
// data cover. Models are a monotone table (Fritsch–Carlson piecewise cubic Hermite
// interpolation of ln x against 1/T, where x is the solute mole fraction and T the
// temperature in kelvin), the van 't Hoff equation ln x = A + B/T, the modified Apelblat
// equation ln x = A + B/T + C·ln T, and a polynomial in t (°C) giving the solubility directly.
// Fit fits any of them to a person's own points by linear least squares (in ln x for the
// laws, in the solubility itself for the polynomial) and reports residuals, R², the RMS
// deviation and the fitted range.
//
// Units: solubility is grams of anhydrous solute per 100 g of solvent (water unless a solvent
// molar mass is given); temperatures are °C in names and values; T in the laws is in kelvin.
// The mole fraction counts formula units of the solute, not ions. Conversions to mass percent,
// mole fraction, molality, g/L and mol/L (the last two need the solution density) are done by
// Convert, which checks its inputs, and by plain helpers such as MassPercent.
//
// Valid range: Curve.At answers inside [MinC, MaxC]; within WarnMarginK outside it the value
// is extrapolated (a table continues with its end slope in ln x vs 1/T, which is the van 't
// Hoff law) and returned with a warning; beyond the margin it is refused with a
// *unit.FieldError. No function returns NaN or Inf to a caller of At or Fit.
//
// Sources: F. N. Fritsch and R. E. Carlson, "Monotone piecewise cubic interpolation", SIAM J.
// Numer. Anal. 17 (1980) 238–246; the modified Apelblat equation: A. Apelblat and E. Manzurola,
// J. Chem. Thermodyn. 31 (1999) 85–91 (from memory). Molar mass of water 18.015 g/mol from
// IUPAC standard atomic weights (H 1.008, O 15.999).
package solubility
