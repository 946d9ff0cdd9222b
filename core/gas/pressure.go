package gas

import (
	"math"
	"strings"

	"saltcast/core/unit"
)

// Pressure units accepted by PressureKPa. Factors are exact by definition or as given in
// NIST Special Publication 811 (2008), appendix B.8 (mmHg: "millimeter of mercury,
// conventional"; inHg: "inch of mercury, conventional", both for mercury at 0 °C and
// standard gravity; the torr is 1/760 atm exactly).
const (
	PaPerAtm  = 101325.0            // standard atmosphere, exact
	PaPerMmHg = 133.322387415       // conventional mmHg = 13595.1 kg/m³ · 9.80665 m/s² · 1 mm
	PaPerInHg = 3386.388640341      // 25.4 mmHg, conventional
	PaPerHPa  = 100.0               // hPa = mbar, exact
	PaPerKPa  = 1000.0              // exact
	StdKPa    = PaPerAtm / PaPerKPa // 101.325 kPa
)

// PressureUnits lists the unit names PressureKPa accepts, for messages and menus.
const PressureUnits = "kPa, hPa, mbar, mmHg, Torr, inHg, atm"

// PressureKPa converts a barometric pressure typed in the named unit to kPa. An unknown unit is a
// *unit.FieldError for field "pressure_unit"; a value that is not finite and positive is a
// *unit.FieldError for field.
func PressureKPa(field string, v float64, unitName string) (float64, error) {
	var paPer float64
	switch strings.ToLower(strings.TrimSpace(unitName)) {
	case "kpa", "":
		paPer = PaPerKPa
	case "hpa", "mbar", "mb":
		paPer = PaPerHPa
	case "mmhg":
		paPer = PaPerMmHg
	case "torr":
		paPer = PaPerAtm / 760
	case "inhg", "in hg":
		paPer = PaPerInHg
	case "atm":
		paPer = PaPerAtm
	default:
		return 0, &unit.FieldError{Field: "pressure_unit", Value: unitName, Allowed: PressureUnits}
	}
	if math.IsNaN(v) || math.IsInf(v, 0) || v <= 0 {
		return 0, unit.NumberError(field, v, "a pressure > 0")
	}
	return v * paPer / PaPerKPa, nil
}

// The standard atmosphere below 11 km (troposphere): U.S. Standard Atmosphere, 1976
// (NOAA/NASA/USAF), identical there to the ICAO Standard Atmosphere (ICAO Doc 7488/3, 1993).
// P = P0·(1 − L·h/T0)^(g0·M/(R·L)), h geopotential altitude in m (from memory).
const (
	atmT0   = 288.15    // K, sea-level temperature
	atmL    = 0.0065    // K/m, lapse rate
	atmG0   = 9.80665   // m/s², standard gravity
	atmM    = 0.0289644 // kg/mol, molar mass of dry air (1976 value)
	atmR    = 8.31432   // J/(mol·K), the gas constant as used in the 1976 standard
	atmR0   = 6356766.0 // m, Earth radius used for geopotential height in the 1976 standard
	atmMinM = -500.0    // m, a little below the Dead Sea shore
	atmMaxM = 11000.0   // m, top of the troposphere layer of the model
)

// AltitudeKPa returns the standard-atmosphere pressure (kPa) at an altitude in metres above
// mean sea level (geometric height, as on a map; converted to geopotential height
// H = r0·z/(r0 + z) as the standard prescribes). The standard atmosphere is a yearly,
// mid-latitude average: on a given day the true station pressure can differ by several kPa,
// so a barometer reading is better.
// Altitudes outside −500 to 11 000 m are a *unit.FieldError for field "altitude_m".
func AltitudeKPa(altitudeM float64) (float64, error) {
	if math.IsNaN(altitudeM) || altitudeM < atmMinM || altitudeM > atmMaxM {
		return 0, unit.NumberError("altitude_m", altitudeM, "an altitude from -500 to 11000 m")
	}
	h := atmR0 * altitudeM / (atmR0 + altitudeM)
	exp := atmG0 * atmM / (atmR * atmL)
	return StdKPa * math.Pow(1-atmL*h/atmT0, exp), nil
}
