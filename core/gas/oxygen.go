package gas

import (
	"math"

	"saltcast/core/unit"
)

// Method names for OxygenSaturation; they are also the "method" values in service output.
const (
	BensonKrause = "Benson & Krause 1984"
	GarciaGordon = "Garcia & Gordon 1992"
)

// Sources, as printed with results.
const (
	SourceBensonKrause = "B. B. Benson and D. Krause, Limnol. Oceanogr. 29 (1984) 620-632, " +
		"as used by USGS Office of Water Quality Technical Memorandum 2011.03 and Standard Methods 4500-O; " +
		"pressure and water-vapour correction as in those documents"
	SourceGarciaGordon = "H. E. Garcia and L. I. Gordon, Limnol. Oceanogr. 37 (1992) 1307-1312, " +
		"fit to the Benson & Krause data (coefficients as corrected by R. Hamme); " +
		"same pressure correction as Benson & Krause"
)

// Ranges of the oxygen equations. Benson & Krause measured 0–40 °C and S 0–40; Garcia & Gordon
// fitted −2 to 40 °C and S 0–42. The pressure correction is stated for 0.5–1.1 atm
// (Standard Methods 4500-O). Inside the warn bands a result carries a warning; beyond them
// the input is refused.
const (
	O2MinC     = 0.0
	O2MaxC     = 40.0
	O2WarnMinC = -2.0 // saline or supercooled water; Garcia & Gordon fitted down to −2 °C
	O2WarnMaxC = 50.0

	SalinityMax = 40.0

	O2MinKPa     = 0.5 * StdKPa
	O2MaxKPa     = 1.1 * StdKPa
	O2WarnMinKPa = 40.0
	O2WarnMaxKPa = 125.0

	// MeasuredMaxMgPerL bounds a measured dissolved-oxygen reading. Water in equilibrium with
	// pure oxygen at 1 atm and 0 °C holds about 70 mg/L (Benson & Krause × 1/0.20946).
	MeasuredMaxMgPerL = 100.0
)

// Conversion of oxygen amounts (Garcia & Gordon 1992): 1 mL of O2 at STP (0 °C, 1 atm, real
// gas) is 1.42905 mg = 44.659 µmol (44.659 from memory).
const (
	MgPerMLO2   = 1.42905
	UmolPerMLO2 = 44.659
	MolarMassO2 = 31.9988 // g/mol, IUPAC standard atomic weight of O 15.9994 (1997) ×2
)

// Conditions are the water and the air it is in equilibrium with: water temperature (°C),
// practical salinity (PSS-78, about g of salt per kg of seawater; 0 for fresh water) and total
// barometric pressure at the water surface (kPa, the station pressure, not the sea-level
// corrected value weather services report).
type Conditions struct {
	TempC       float64
	Salinity    float64
	PressureKPa float64
}

// Oxygen is the dissolved-oxygen concentration of water in equilibrium with water-saturated air
// under Conditions.
type Oxygen struct {
	MgPerL    float64
	UmolPerKg float64
	MLPerL    float64 // mL of O2 at STP (0 °C, 101.325 kPa) per litre of water
	Method    string
	Source    string
	Warnings  []string
}

// CheckO2 validates Conditions for the oxygen methods. It returns warnings for mild
// extrapolation and a *unit.FieldError (fields "temp_C", "salinity", "pressure_kPa") for values
// it refuses.
func CheckO2(c Conditions) (warnings []string, err error) {
	switch {
	case math.IsNaN(c.TempC) || c.TempC < O2WarnMinC || c.TempC > O2WarnMaxC:
		return nil, unit.NumberError("temp_C", c.TempC, "a water temperature from -2 to 50 °C (methods measured 0 to 40 °C)")
	case c.TempC < O2MinC:
		warnings = append(warnings, "temperature below 0 °C: only saline or supercooled water is liquid there; "+
			"Benson & Krause measured 0 to 40 °C, so the value is extrapolated")
	case c.TempC > O2MaxC:
		warnings = append(warnings, "temperature above 40 °C: the oxygen equations were measured 0 to 40 °C; "+
			"the value is extrapolated and may be off by 0.1 mg/L or more")
	}
	if math.IsNaN(c.Salinity) || c.Salinity < 0 || c.Salinity > SalinityMax {
		return nil, unit.NumberError("salinity", c.Salinity, "a practical salinity from 0 to 40 (0 for fresh water)")
	}
	switch {
	case math.IsNaN(c.PressureKPa) || c.PressureKPa < O2WarnMinKPa || c.PressureKPa > O2WarnMaxKPa:
		return nil, unit.NumberError("pressure_kPa", c.PressureKPa, "a barometric pressure from 40 to 125 kPa")
	case c.PressureKPa < O2MinKPa || c.PressureKPa > O2MaxKPa:
		warnings = append(warnings, "pressure outside 0.5 to 1.1 atm (50.7 to 111.5 kPa), "+
			"the stated range of the pressure correction; the value is extrapolated")
	}
	return warnings, nil
}

// OxygenSaturation returns the solubility of oxygen from water-saturated air under c by the
// named method (BensonKrause or GarciaGordon). Both equations are for 1 atm; the result is
// scaled to the given pressure with the water-vapour and non-ideality correction of Standard
// Methods 4500-O. An unknown method is a *unit.FieldError for field "method".
func OxygenSaturation(c Conditions, method string) (Oxygen, error) {
	warnings, err := CheckO2(c)
	if err != nil {
		return Oxygen{}, err
	}
	f := pressureFactor(c.TempC, c.PressureKPa)
	rho := SeawaterDensityKgPerM3(c.TempC, c.Salinity)
	var o Oxygen
	switch method {
	case BensonKrause, "":
		o.MgPerL = bensonKrauseMgPerL(c.TempC, c.Salinity) * f
		o.MLPerL = o.MgPerL / MgPerMLO2
		// mg/L → µmol/L → µmol/kg through the density of the water.
		o.UmolPerKg = o.MgPerL / MolarMassO2 * 1000 / (rho / 1000)
		o.Method, o.Source = BensonKrause, SourceBensonKrause
	case GarciaGordon:
		o.MLPerL = garciaGordon(&ggMLPerL, c.TempC, c.Salinity) * f
		o.MgPerL = o.MLPerL * MgPerMLO2
		o.UmolPerKg = garciaGordon(&ggUmolPerKg, c.TempC, c.Salinity) * f
		o.Method, o.Source = GarciaGordon, SourceGarciaGordon
	default:
		return Oxygen{}, &unit.FieldError{Field: "method", Value: method,
			Allowed: `"` + BensonKrause + `" or "` + GarciaGordon + `"`}
	}
	o.Warnings = warnings
	return o, nil
}

// PercentSaturation returns 100·measured/saturation. A reading that is not finite, negative or
// above MeasuredMaxMgPerL is a *unit.FieldError for field "measured_mg_per_L".
func PercentSaturation(measuredMgPerL float64, sat Oxygen) (float64, error) {
	if math.IsNaN(measuredMgPerL) || measuredMgPerL < 0 || measuredMgPerL > MeasuredMaxMgPerL {
		return 0, unit.NumberError("measured_mg_per_L", measuredMgPerL, "a dissolved-oxygen reading from 0 to 100 mg/L")
	}
	return 100 * measuredMgPerL / sat.MgPerL, nil
}

// bensonKrauseMgPerL is C* in mg/L at 1 atm: Benson & Krause (1984) as written in USGS memo
// 2011.03 and Standard Methods 4500-O (coefficients looked up in an open implementation, the
// R package wql, function oxySol).
func bensonKrauseMgPerL(tempC, salinity float64) float64 {
	T := tempC + unit.ZeroCelsiusK
	r := 1 / T
	lnC := -139.34411 + r*(1.575701e5+r*(-6.642308e7+r*(1.243800e10+r*-8.621949e11))) -
		salinity*(1.7674e-2+r*(-1.0754e1+r*2.1407e3))
	return math.Exp(lnC)
}

// pressureFactor scales a 1-atm saturation to P (Standard Methods 4500-O; USGS memo 2011.03):
// P·(1 − Pwv/P)(1 − θP) / ((1 − Pwv)(1 − θ)), P and Pwv in atm, θ the second virial term of O2.
func pressureFactor(tempC, pressureKPa float64) float64 {
	p := pressureKPa / StdKPa
	pwv := smVaporPressureAtm(tempC)
	theta := 0.000975 - 1.426e-5*tempC + 6.436e-8*tempC*tempC
	return p * (1 - pwv/p) * (1 - theta*p) / ((1 - pwv) * (1 - theta))
}

// smVaporPressureAtm is the water vapour pressure used by Standard Methods 4500-O and the USGS
// tables: ln Pwv = 11.8571 − 3840.70/T − 216961/T² (atm; coefficients from memory; they agree
// with the IAPWS vapour pressure to 0.3 % over 0–40 °C, see the tests).
func smVaporPressureAtm(tempC float64) float64 {
	T := tempC + unit.ZeroCelsiusK
	return math.Exp(11.8571 - 3840.70/T - 216961/(T*T))
}

// ggCoef holds one Garcia & Gordon (1992) coefficient set.
type ggCoef struct {
	a  [6]float64
	b  [4]float64
	c0 float64
}

// Garcia & Gordon (1992) fits to the Benson & Krause data, in the corrected form used by
// R. Hamme's O2sol.m (the printed eq. 8 has a typo). µmol/kg set looked up (O2sol.m); mL/L set:
// A0–A5 and B0 looked up, B1–C0 from memory (the set reproduces the published check value).
var (
	ggUmolPerKg = ggCoef{
		a:  [6]float64{5.80871, 3.20291, 4.17887, 5.10006, -9.86643e-2, 3.80369},
		b:  [4]float64{-7.01577e-3, -7.70028e-3, -1.13864e-2, -9.51519e-3},
		c0: -2.75915e-7,
	}
	ggMLPerL = ggCoef{
		a:  [6]float64{2.00907, 3.22014, 4.05010, 4.94457, -2.56847e-1, 3.88767},
		b:  [4]float64{-6.24523e-3, -7.37614e-3, -1.03410e-2, -8.17083e-3},
		c0: -4.88682e-7,
	}
)

// garciaGordon evaluates ln C = Σ Ai·Tsⁱ + S·Σ Bi·Tsⁱ + C0·S², Ts = ln((298.15 − t)/(273.15 + t)).
func garciaGordon(k *ggCoef, tempC, salinity float64) float64 {
	ts := math.Log((298.15 - tempC) / (273.15 + tempC))
	a, b := &k.a, &k.b
	lnC := a[0] + ts*(a[1]+ts*(a[2]+ts*(a[3]+ts*(a[4]+ts*a[5])))) +
		salinity*(b[0]+ts*(b[1]+ts*(b[2]+ts*b[3]))) + k.c0*salinity*salinity
	return math.Exp(lnC)
}

// SeawaterDensityKgPerM3 is the density of seawater at atmospheric pressure by the one-atmosphere
// international equation of state EOS-80 (F. J. Millero and A. Poisson, Deep-Sea Res. 28A
// (1981) 625; UNESCO Tech. Pap. Mar. Sci. 36, 1981), coefficients from memory. S = 0 gives the
// SMOW pure-water polynomial. Valid −2 to 40 °C, S 0 to 42; callers keep to that range.
func SeawaterDensityKgPerM3(tempC, salinity float64) float64 {
	t, s := tempC, salinity
	rhoW := 999.842594 + t*(6.793952e-2+t*(-9.095290e-3+t*(1.001685e-4+t*(-1.120083e-6+t*6.536332e-9))))
	a := 8.24493e-1 + t*(-4.0899e-3+t*(7.6438e-5+t*(-8.2467e-7+t*5.3875e-9)))
	b := -5.72466e-3 + t*(1.0227e-4+t*-1.6546e-6)
	const c = 4.8314e-4
	return rhoW + a*s + b*s*math.Sqrt(s) + c*s*s
}
