// Package gas gives the solubility of atmospheric gases in water: oxygen saturation for
// field checks of dissolved-oxygen meters, Henry's-law solubility of O2, N2, Ar, CO2 and CH4,
// the CO2 solubility function K0, and the gas released when air-saturated water is heated.
//
// Models, units and sources:
//   - Oxygen saturation, mg/L and µmol/kg, from water-saturated air at a barometric pressure:
//     Benson & Krause (1984), Limnol. Oceanogr. 29:620, in the form used by the USGS (Office of
//     Water Quality Technical Memorandum 2011.03) and Standard Methods 4500-O, with their
//     water-vapour and non-ideality pressure correction; and, as a second method, the fit of
//     Garcia & Gordon (1992), Limnol. Oceanogr. 37:1307, to the same data. Valid 0–40 °C,
//     practical salinity 0–40, 0.5–1.1 atm. Within −2–50 °C and 40–125 kPa results carry a
//     warning; beyond, inputs are refused.
//   - Henry's law: constants at 298.15 K and van 't Hoff coefficients from the compilation of
//     Sander (2015), Atmos. Chem. Phys. 15:4399; over 0–100 °C the IAPWS G7-04 correlation
//     (Fernández-Prini, Alvarez & Harvey 2003), which follows measured solubilities where a
//     single van 't Hoff coefficient does not. Fresh water only.
//   - CO2: Weiss (1974), Marine Chemistry 2:203, K0 in mol/(L·atm) and mol/(kg·atm), fresh and
//     sea water, −1–40 °C.
//   - Air: dry-air mole fractions of the U.S. Standard Atmosphere, 1976, with CO2 set by the
//     caller (DefaultCO2PPM, a recent global mean) and CH4 a recent global mean.
//   - Barometric pressure from altitude: the U.S. Standard Atmosphere, 1976 (= ICAO) troposphere.
//   - Outgassing on heating: Henry's law for each gas at the start and end temperatures; the
//     bubble temperature is where the dissolved gases' pressures plus the water vapour
//     pressure reach the pressure during heating. Fresh water only: salting-out by dissolved
//     salts (Sechenov coefficients) is not modelled, for want of a checked source here, so
//     for a salt solution the released volumes are upper estimates; results say so.
//
// Every function that takes user values validates them and returns a *unit.FieldError that
// names the field and what is allowed; none returns NaN or Inf for accepted input. Functions
// documented as "raw equation" do no range checks and are for callers that have validated.
package gas
