package gas

import (
	"math"
	"strings"

	"saltcast/core/unit"
	"saltcast/core/water"
)

// Gas is one permanent gas with its Henry's-law data.
//
// Two temperature laws are kept. Sander298 and SanderB are the compiled constant at
// 298.15 K and its van 't Hoff temperature coefficient (Sander 2015): the usual quick
// reference, but a single B drifts from measured data away from 25 °C (by about 25 % at
// 80 °C). The library therefore computes solubility from 0 to 100 °C with the IAPWS
// correlation (HenryMolPerKgPa), which follows the measured minimum of gas solubility near
// 90–100 °C; the tests hold it against both Sander and Benson & Krause.
type Gas struct {
	ID               string  // formula, e.g. "O2"
	Name             string  // English name, lower case
	MolarMassGPerMol float64 // IUPAC standard atomic weights

	// AirMoleFraction is the mole fraction in dry air (U.S. Standard Atmosphere, 1976, table 3;
	// from memory). For CO2 and CH4, which rise year by year, it is today's value (see
	// DefaultCO2PPM, DefaultCH4PPM) and the caller may override CO2.
	AirMoleFraction float64

	Sander298 float64 // Hscp at 298.15 K, mol m⁻³ Pa⁻¹ (Sander 2015)
	SanderB   float64 // d ln Hscp / d(1/T), K (Sander 2015)
	SanderRef string  // the literature row of the compilation used

	iapws [3]float64 // A, B, C of the IAPWS G7-04 correlation for ln(kH/p*)
}

// Sources, as printed with results.
const (
	SourceSander = "R. Sander, Atmos. Chem. Phys. 15 (2015) 4399-4981, compilation of Henry's law constants (version 4.0)"
	SourceIAPWS  = "IAPWS G7-04 (2004), Guideline on the Henry's constant for gases in H2O at high temperatures; " +
		"R. Fernández-Prini, J. L. Alvarez and A. H. Harvey, J. Phys. Chem. Ref. Data 32 (2003) 903-916 " +
		"(coefficients from memory; checked against Sander 2015 and Benson & Krause 1984)"
	SourceAir = "dry-air composition: U.S. Standard Atmosphere, 1976, table 3 (from memory); " +
		"CO2 and CH4 set to recent NOAA global means (from memory)"
)

// Present-day trace-gas mole fractions in dry air. DefaultCO2PPM is close to the NOAA Global
// Monitoring Laboratory global surface mean for 2023–2024 (about 419–423 ppm; from memory);
// CO2 rises by about 2.5 ppm a year, so callers let the user set it. DefaultCH4PPM: NOAA global
// mean 2023, about 1.92 ppm (from memory).
const (
	DefaultCO2PPM  = 420.0
	DefaultCO2Year = 2024
	DefaultCH4PPM  = 1.92
	CO2MaxPPM      = 100000.0 // 10 %: beyond "air"; refused
)

// library holds the gases in a stable order. Sander values looked up on henrys-law.org
// (Sander 2015 species pages), rows named in SanderRef; IAPWS G7-04 table 2 coefficients from
// memory.
var library = []*Gas{
	{ID: "O2", Name: "oxygen", MolarMassGPerMol: 31.9988, AirMoleFraction: 0.209476,
		Sander298: 1.3e-5, SanderB: 1500, SanderRef: "Sander et al. 2011 / Wilhelm et al. 1977",
		iapws: [3]float64{-9.44833, 4.43822, 11.42005}},
	{ID: "N2", Name: "nitrogen", MolarMassGPerMol: 28.0134, AirMoleFraction: 0.78084,
		Sander298: 6.4e-6, SanderB: 1300, SanderRef: "Sander et al. 2011 / Wilhelm et al. 1977",
		iapws: [3]float64{-9.67578, 4.72162, 11.70585}},
	{ID: "Ar", Name: "argon", MolarMassGPerMol: 39.948, AirMoleFraction: 0.00934,
		Sander298: 1.4e-5, SanderB: 1500, SanderRef: "Wilhelm et al. 1977 / Clever 1980",
		iapws: [3]float64{-8.40954, 4.29587, 10.52779}},
	{ID: "CO2", Name: "carbon dioxide", MolarMassGPerMol: 44.0095, AirMoleFraction: DefaultCO2PPM * 1e-6,
		Sander298: 3.3e-4, SanderB: 2400, SanderRef: "Sander et al. 2011 / Wilhelm et al. 1977",
		iapws: [3]float64{-8.55445, 4.01195, 9.52345}},
	{ID: "CH4", Name: "methane", MolarMassGPerMol: 16.0425, AirMoleFraction: DefaultCH4PPM * 1e-6,
		Sander298: 1.4e-5, SanderB: 1600, SanderRef: "Sander et al. 2011 / Abraham & Matteoli 1988",
		iapws: [3]float64{-10.44708, 4.66491, 12.12986}},
}

// GasIDs lists the accepted gas identifiers, for messages and menus.
const GasIDs = "O2, N2, Ar, CO2, CH4"

// All returns the gas library in a stable order. The caller must not modify the gases.
func All() []*Gas { return library }

// Lookup finds a gas by formula or English name, ignoring case ("o2", "Oxygen"). An unknown
// name is a *unit.FieldError for field "gas".
func Lookup(name string) (*Gas, error) {
	key := strings.ToLower(strings.TrimSpace(name))
	for _, g := range library {
		if key == strings.ToLower(g.ID) || key == g.Name {
			return g, nil
		}
	}
	return nil, &unit.FieldError{Field: "gas", Value: name, Allowed: GasIDs}
}

// Henry's-law temperature range of this package: liquid water at about 1 atm.
const (
	HenryMinC = 0.0
	HenryMaxC = 100.0
)

// Reference temperature of the Sander compilation.
const refK = 298.15

// SanderMolPerM3Pa returns Hscp(T) = Hscp(298.15 K)·exp(B·(1/T − 1/298.15 K)) in mol m⁻³ Pa⁻¹
// (Sander 2015). The van 't Hoff form with one B is good near 25 °C and drifts beyond about
// 50 °C; prefer HenryMolPerKgPa for work away from room temperature.
func (g *Gas) SanderMolPerM3Pa(tempC float64) float64 {
	T := tempC + unit.ZeroCelsiusK
	return g.Sander298 * math.Exp(g.SanderB*(1/T-1/refK))
}

// KHPa returns the IAPWS G7-04 Henry's constant kH = lim(f₂/x₂) in Pa (gas fugacity over mole
// fraction in the liquid): ln(kH/p*) = A/Tr + B·τ^0.355/Tr + C·Tr^−0.41·e^τ, Tr = T/Tc,
// τ = 1 − Tr, p* the vapour pressure of water. Temperatures outside 0–100 °C are held at the
// nearer end (callers validate against HenryMinC and HenryMaxC first).
func (g *Gas) KHPa(tempC float64) float64 {
	t := math.Max(HenryMinC, math.Min(HenryMaxC, tempC))
	const tcK = 647.096 // critical temperature of water, K (IAPWS)
	tr := (t + unit.ZeroCelsiusK) / tcK
	tau := 1 - tr
	a, b, c := g.iapws[0], g.iapws[1], g.iapws[2]
	ln := a/tr + b*math.Pow(tau, 0.355)/tr + c*math.Pow(tr, -0.41)*math.Exp(tau)
	return water.VaporPressurePa(t) * math.Exp(ln)
}

// molarMassWater is H2O in kg/mol (IUPAC standard atomic weights).
const molarMassWater = 0.018015

// HenryMolPerKgPa returns the amount of gas dissolved per kg of water per Pa of its partial
// pressure (ideal gas, dilute solution), mol kg⁻¹ Pa⁻¹, from the IAPWS G7-04 correlation.
func (g *Gas) HenryMolPerKgPa(tempC float64) float64 {
	return 1 / (g.KHPa(tempC) * molarMassWater)
}

// HenryMolPerM3Pa is HenryMolPerKgPa per cubic metre of water at tempC, comparable with the
// Sander constants (mol m⁻³ Pa⁻¹).
func (g *Gas) HenryMolPerM3Pa(tempC float64) float64 {
	return g.HenryMolPerKgPa(tempC) * water.DensityKgPerM3(tempC)
}

// Dissolved is the amount of one gas in fresh water in equilibrium with water-saturated air.
type Dissolved struct {
	Gas       *Gas
	MgPerL    float64
	UmolPerKg float64
	Method    string
	Source    string
	Warnings  []string
}

// CheckHenry validates conditions for Henry's-law work in fresh water: temperature 0–100 °C and
// a pressure (kPa) above the vapour pressure of water at that temperature and at most 1000 kPa.
// Field names are "temp_C" and "pressure_kPa" unless given.
func CheckHenry(tempField string, tempC float64, pressureField string, pressureKPa float64) error {
	if math.IsNaN(tempC) || tempC < HenryMinC || tempC > HenryMaxC {
		return unit.NumberError(tempField, tempC, "a water temperature from 0 to 100 °C")
	}
	pw := water.VaporPressurePa(tempC) / PaPerKPa
	if math.IsNaN(pressureKPa) || pressureKPa <= pw || pressureKPa > 1000 {
		return unit.NumberError(pressureField, pressureKPa,
			"a pressure above the vapour pressure of water at the temperature ("+unit.FormatCompact(pw, 4)+" kPa) and at most 1000 kPa")
	}
	return nil
}

// CheckCO2PPM validates a CO2 mole fraction in ppm (field "co2_ppm").
func CheckCO2PPM(ppm float64) error {
	if math.IsNaN(ppm) || ppm < 0 || ppm > CO2MaxPPM {
		return unit.NumberError("co2_ppm", ppm, "a CO2 mole fraction from 0 to 100000 ppm")
	}
	return nil
}

// moleFractionIn returns the dry-air mole fraction of g with CO2 set to co2PPM.
func moleFractionIn(g *Gas, co2PPM float64) float64 {
	if g.ID == "CO2" {
		return co2PPM * 1e-6
	}
	return g.AirMoleFraction
}

// AirSaturated returns the concentration of gas g in fresh water at tempC in equilibrium with
// water-saturated air at pressureKPa, by Henry's law with the IAPWS G7-04 constant:
// c = x_air·(P − p_w)/kH. For O2 and CO2 the dedicated equations (OxygenSaturation,
// CO2Saturation) are more exact below 40 °C.
func AirSaturated(g *Gas, tempC, pressureKPa, co2PPM float64) (Dissolved, error) {
	if err := CheckHenry("temp_C", tempC, "pressure_kPa", pressureKPa); err != nil {
		return Dissolved{}, err
	}
	if err := CheckCO2PPM(co2PPM); err != nil {
		return Dissolved{}, err
	}
	pPa := moleFractionIn(g, co2PPM) * (pressureKPa*PaPerKPa - water.VaporPressurePa(tempC))
	molPerKg := g.HenryMolPerKgPa(tempC) * pPa
	rho := water.DensityKgPerM3(tempC)
	d := Dissolved{
		Gas:       g,
		UmolPerKg: molPerKg * 1e6,
		MgPerL:    molPerKg * rho / 1000 * g.MolarMassGPerMol * 1000,
		Method:    "Henry's law (IAPWS G7-04)",
		Source:    SourceIAPWS + "; " + SourceAir,
	}
	if g.ID == "CH4" {
		d.Warnings = append(d.Warnings, "methane in air is a trace gas (about 1.9 ppm); the value is for that mole fraction")
	}
	return d, nil
}
