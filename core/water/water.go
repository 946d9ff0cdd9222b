package water

import "math"

// MinC and MaxC bound the temperatures (°C) for which all three functions are documented
// as valid: liquid water at about atmospheric pressure.
const (
	MinC = 0.0
	MaxC = 100.0
)

// Kell (1975) density of air-free water at 101.325 kPa, kg/m³, t in °C (IPTS-68):
// ρ = (a0 + a1 t + a2 t² + a3 t³ + a4 t⁴ + a5 t⁵)/(1 + b t).
// Coefficients: Kell, J. Chem. Eng. Data 20 (1975) 97, eq. 16 (from memory; they reproduce
// the published ITS-90 density table to 0.005 kg/m³, see the tests).
const (
	kellA0 = 999.83952
	kellA1 = 16.945176
	kellA2 = -7.9870401e-3
	kellA3 = -46.170461e-6
	kellA4 = 105.56302e-9
	kellA5 = -280.54253e-12
	kellB  = 16.879850e-3

	// kellMinC and kellMaxC bound the data Kell fitted.
	kellMinC = 0.0
	kellMaxC = 150.0
)

// DensityKgPerM3 returns the density of pure water at 101.325 kPa in kg/m³ (Kell 1975).
// The equation is used from 0 to 150 °C; below 0 °C the 0 °C value is returned and above
// 150 °C the 150 °C value, so a finite input always gives a finite, positive result.
func DensityKgPerM3(tempC float64) float64 {
	t := clamp(tempC, kellMinC, kellMaxC)
	num := kellA0 + t*(kellA1+t*(kellA2+t*(kellA3+t*(kellA4+t*kellA5))))
	return num / (1 + kellB*t)
}

// Wagner & Pruss (1993) saturation vapour pressure of water; IAPWS critical constants.
const (
	criticalK  = 647.096  // K, IAPWS
	criticalPa = 22.064e6 // Pa, IAPWS
	triplePtK  = 273.16   // K, definition of the kelvin before 2019, IAPWS
	kelvinZero = 273.15   // K at 0 °C, by definition of the Celsius scale

	wp1 = -7.85951783
	wp2 = 1.84408259
	wp3 = -11.7866497
	wp4 = 22.6807411
	wp5 = -15.9618719
	wp6 = 1.80122502
)

// VaporPressurePa returns the saturation vapour pressure of liquid water in Pa
// (Wagner & Pruss 1993, IAPWS). The equation holds from the triple point (0.01 °C) to the
// critical point (373.946 °C). Below the triple point the triple-point pressure (611.657 Pa)
// is returned; above the critical point the critical pressure.
func VaporPressurePa(tempC float64) float64 {
	if math.IsNaN(tempC) {
		return tempC
	}
	T := tempC + kelvinZero
	if T <= triplePtK {
		T = triplePtK
	}
	if T >= criticalK {
		return criticalPa
	}
	tau := 1 - T/criticalK
	st := math.Sqrt(tau)
	t3 := tau * tau * tau
	// a1τ + a2τ^1.5 + a3τ³ + a4τ^3.5 + a5τ⁴ + a6τ^7.5
	sum := wp1*tau + wp2*tau*st + wp3*t3 + wp4*t3*st + wp5*t3*tau + wp6*t3*t3*tau*st
	return criticalPa * math.Exp(criticalK/T*sum)
}

// cpNodes are the isobaric heat capacity of water at 101.325 kPa, kJ/(kg·K), from IAPWS-95
// (W. Wagner and A. Pruss, J. Phys. Chem. Ref. Data 31 (2002) 387) as tabulated in steam
// tables (from memory, ±0.003). The 0 °C row is for liquid at 0 °C.
var cpNodes = [...]struct{ tempC, cp float64 }{
	{0, 4.2199},
	{10, 4.1955},
	{20, 4.1841},
	{25, 4.1813},
	{30, 4.1798},
	{40, 4.1785},
	{50, 4.1806},
	{60, 4.1843},
	{80, 4.1964},
	{100, 4.2157},
}

// cpSlopes are the Fritsch–Carlson derivatives at cpNodes, computed once.
var cpSlopes = fritschCarlson()

// HeatCapacityKJPerKgK returns the isobaric specific heat capacity of liquid water at
// 101.325 kPa in kJ/(kg·K), interpolated in IAPWS-95 values tabulated at 0–100 °C.
// Outside 0–100 °C the value at the nearer end is returned (c_p varies by under 1 % near
// either end, and water at 101.325 kPa is not liquid much beyond them).
func HeatCapacityKJPerKgK(tempC float64) float64 {
	if math.IsNaN(tempC) {
		return tempC
	}
	n := len(cpNodes)
	if tempC <= cpNodes[0].tempC {
		return cpNodes[0].cp
	}
	if tempC >= cpNodes[n-1].tempC {
		return cpNodes[n-1].cp
	}
	i := 0
	for i < n-2 && tempC > cpNodes[i+1].tempC {
		i++
	}
	x0, x1 := cpNodes[i].tempC, cpNodes[i+1].tempC
	y0, y1 := cpNodes[i].cp, cpNodes[i+1].cp
	h := x1 - x0
	s := (tempC - x0) / h
	s2, s3 := s*s, s*s*s
	h00 := 2*s3 - 3*s2 + 1
	h10 := s3 - 2*s2 + s
	h01 := -2*s3 + 3*s2
	h11 := s3 - s2
	return h00*y0 + h10*h*cpSlopes[i] + h01*y1 + h11*h*cpSlopes[i+1]
}

// fritschCarlson returns monotone cubic Hermite slopes for cpNodes (F. N. Fritsch and
// R. E. Carlson, SIAM J. Numer. Anal. 17 (1980) 238), with the three-point end formula
// used by common PCHIP implementations. It keeps the interpolant from overshooting the
// tabulated values, so the minimum near 40 °C is not exaggerated.
func fritschCarlson() [len(cpNodes)]float64 {
	const n = len(cpNodes)
	var h, delta [n - 1]float64
	for i := 0; i < n-1; i++ {
		h[i] = cpNodes[i+1].tempC - cpNodes[i].tempC
		delta[i] = (cpNodes[i+1].cp - cpNodes[i].cp) / h[i]
	}
	var d [n]float64
	for i := 1; i < n-1; i++ {
		if delta[i-1]*delta[i] <= 0 {
			d[i] = 0
			continue
		}
		w1 := 2*h[i] + h[i-1]
		w2 := h[i] + 2*h[i-1]
		d[i] = (w1 + w2) / (w1/delta[i-1] + w2/delta[i])
	}
	d[0] = endSlope(h[0], h[1], delta[0], delta[1])
	d[n-1] = endSlope(h[n-2], h[n-3], delta[n-2], delta[n-3])
	return d
}

func endSlope(h0, h1, del0, del1 float64) float64 {
	d := ((2*h0+h1)*del0 - h0*del1) / (h0 + h1)
	switch {
	case d*del0 <= 0:
		return 0
	case del0*del1 <= 0 && math.Abs(d) > math.Abs(3*del0):
		return 3 * del0
	}
	return d
}

func clamp(x, lo, hi float64) float64 {
	if x < lo {
		return lo
	}
	if x > hi {
		return hi
	}
	return x
}
