// Package water gives the density, isobaric heat capacity and saturation vapour pressure of
// pure liquid water as functions of temperature in °C, each from a named published source.
//
// The three functions are meant for 0–100 °C at about atmospheric pressure (for vapour
// pressure: on the saturation line). Callers validate temperatures against MinC and MaxC
// before calling; the functions themselves never panic and never turn a finite input into
// NaN or Inf. Outside the range each one behaves as documented on it: an equation is used
// as far as its own published domain reaches, and beyond that the temperature is held at the
// nearest end of that domain. A NaN input gives a NaN result, as in package math.
//
// Sources:
//   - Density: G. S. Kell, "Density, thermal expansivity, and compressibility of liquid water
//     from 0° to 150 °C", J. Chem. Eng. Data 20 (1975) 97–105, the rational function for
//     101.325 kPa. Kell wrote it on IPTS-68; the difference from ITS-90 (about 0.005 K here)
//     changes the density by less than 0.001 kg/m³ and is ignored.
//   - Vapour pressure: W. Wagner and A. Pruss, "International equations for the saturation
//     properties of ordinary water substance", J. Phys. Chem. Ref. Data 22 (1993) 783–787,
//     as adopted by IAPWS (1992 supplementary release; consistent with IAPWS-95).
//   - Heat capacity: IAPWS-95 values at 101.325 kPa tabulated every 10 K (from memory,
//     ±0.003 kJ/(kg·K)), joined by a monotone cubic (Fritsch–Carlson) interpolant.
package water
