package gas

import (
	"math"

	"saltcast/core/unit"
)

// Weiss (1974) solubility function of CO2: ln K0 = A1 + A2·(100/T) + A3·ln(T/100)
// + S·[B1 + B2·(T/100) + B3·(T/100)²]. K0 refers to CO2 fugacity; using the partial pressure
// instead changes results by about 0.3 % at 1 atm.
const SourceWeiss = "R. F. Weiss, Marine Chemistry 2 (1974) 203-215, CO2 solubility function K0"

// Weiss measured −1 to 40 °C and S 0 to 40.
const (
	WeissMinC     = -1.0
	WeissMaxC     = 40.0
	WeissWarnMaxC = 50.0
)

type weissCoef struct{ a1, a2, a3, b1, b2, b3 float64 }

// Coefficient sets looked up in open implementations of Weiss (1974), table 1.
var (
	weissPerL  = weissCoef{-58.0931, 90.5069, 22.2940, 0.027766, -0.025888, 0.0050578} // mol L⁻¹ atm⁻¹
	weissPerKg = weissCoef{-60.2409, 93.4517, 23.3585, 0.023517, -0.023656, 0.0047036} // mol kg⁻¹ atm⁻¹
)

func weiss(k *weissCoef, tempC, salinity float64) float64 {
	t100 := (tempC + unit.ZeroCelsiusK) / 100
	return math.Exp(k.a1 + k.a2/t100 + k.a3*math.Log(t100) +
		salinity*(k.b1+t100*(k.b2+t100*k.b3)))
}

// WeissK0MolPerLAtm returns K0 in mol L⁻¹ atm⁻¹ (raw equation, no range check).
func WeissK0MolPerLAtm(tempC, salinity float64) float64 { return weiss(&weissPerL, tempC, salinity) }

// WeissK0MolPerKgAtm returns K0 in mol kg⁻¹ atm⁻¹ (raw equation, no range check).
func WeissK0MolPerKgAtm(tempC, salinity float64) float64 { return weiss(&weissPerKg, tempC, salinity) }

// CheckWeiss validates conditions for the Weiss equation: temperature −1 to 40 °C (warning to
// 50 °C), salinity 0 to 40, pressure 40 to 125 kPa (fields "temp_C", "salinity", "pressure_kPa").
func CheckWeiss(c Conditions) (warnings []string, err error) {
	switch {
	case math.IsNaN(c.TempC) || c.TempC < WeissMinC || c.TempC > WeissWarnMaxC:
		return nil, unit.NumberError("temp_C", c.TempC, "a water temperature from -1 to 50 °C (Weiss measured -1 to 40 °C)")
	case c.TempC > WeissMaxC:
		warnings = append(warnings, "temperature above 40 °C: Weiss (1974) covers -1 to 40 °C; the value is extrapolated")
	}
	if math.IsNaN(c.Salinity) || c.Salinity < 0 || c.Salinity > SalinityMax {
		return nil, unit.NumberError("salinity", c.Salinity, "a practical salinity from 0 to 40 (0 for fresh water)")
	}
	if math.IsNaN(c.PressureKPa) || c.PressureKPa < O2WarnMinKPa || c.PressureKPa > O2WarnMaxKPa {
		return nil, unit.NumberError("pressure_kPa", c.PressureKPa, "a barometric pressure from 40 to 125 kPa")
	}
	return warnings, nil
}

// CO2Saturation returns the CO2 dissolved (as CO2(aq), not counting bicarbonate or carbonate)
// in water in equilibrium with water-saturated air holding co2PPM of CO2 in the dry gas:
// c = K0·x·(P − p_w), with p_w from Standard Methods 4500-O as for oxygen and the salinity
// lowering of p_w ignored (0.5 % at S 35). Errors are *unit.FieldError as for CheckWeiss and
// CheckCO2PPM.
func CO2Saturation(c Conditions, co2PPM float64) (Dissolved, error) {
	warnings, err := CheckWeiss(c)
	if err != nil {
		return Dissolved{}, err
	}
	if err := CheckCO2PPM(co2PPM); err != nil {
		return Dissolved{}, err
	}
	g, _ := Lookup("CO2")
	pAtm := co2PPM * 1e-6 * (c.PressureKPa/StdKPa - smVaporPressureAtm(c.TempC))
	d := Dissolved{
		Gas:       g,
		MgPerL:    WeissK0MolPerLAtm(c.TempC, c.Salinity) * pAtm * g.MolarMassGPerMol * 1000,
		UmolPerKg: WeissK0MolPerKgAtm(c.TempC, c.Salinity) * pAtm * 1e6,
		Method:    "Weiss 1974",
		Source:    SourceWeiss + "; CO2 in dry air " + unit.FormatCompact(co2PPM, 6) + " ppm as given",
		Warnings:  append(warnings, "CO2(aq) only: dissolved inorganic carbon (bicarbonate, carbonate) depends on pH and alkalinity and is not included"),
	}
	return d, nil
}
