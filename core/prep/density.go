package prep

import (
	"math"

	"saltcast/core/compound"
	"saltcast/core/unit"
	"saltcast/core/water"
)

// Density scaling to other temperatures and its stated error (see the package doc).
const (
	// densityRefC is the temperature of the CRC concentrative-properties densities.
	densityRefC = 20.0

	// The bound on the error of scaling by the pure-water density ratio, in per cent, is
	// densityFitErrPct + sqrt(w/naclRefW)·k·(temperature factor), where k is
	// densityColdErrPct below 20 °C (factor (20 − T)/20) and densityWarmErrPct above it
	// (factor min(1, (T − 20)/20)). The envelope covers every deviation of the scaled CRC
	// NaCl densities from Rogers & Pitzer (1982) at 0–100 °C and 0.1–5 mol/kg: largest
	// 0.64 % at 0 °C and 0.35 % at 60 °C, both at 5 mol/kg (derived: see density_test.go).
	densityFitErrPct  = 0.05  // the 20 °C table itself: ±0.0005 g/cm³ on values near 1 g/cm³ (CRC rows to 4 decimals)
	densityColdErrPct = 0.7   // at 0 °C, for 22.6 mass % NaCl
	densityWarmErrPct = 0.45  // at 40 °C and above, for 22.6 mass % NaCl
	naclRefW          = 0.226 // 5 mol/kg NaCl as a mass fraction (derived: 5·58.44/(1000 + 5·58.44))

	// densityQuietC is how far from 20 °C the scaled density needs no warning: the bound
	// stays under about 0.15 % for near-saturated salt solutions there.
	densityQuietC = 5.0

	// DensityDataSource is cited for the temperature scaling and for water volumes.
	DensityDataSource = "density of pure water: Kell (1975), J. Chem. Eng. Data 20:97"
	scalingSource     = "solution density away from 20 °C: the 20 °C value scaled by the density ratio of pure water " +
		"(Kell 1975); error bound measured on NaCl against Rogers & Pitzer (1982), J. Phys. Chem. Ref. Data 11:15"
)

// DensityErrorPct is the stated relative error bound, in per cent, of SolutionDensity for a
// solution of mass fraction w at tempC: the 20 °C data's own uncertainty plus the error of
// the temperature scaling (see the package doc and the constants above). Beyond 22.6 mass %
// it grows with √w, an extrapolation of the NaCl measurements.
func DensityErrorPct(w, tempC float64) float64 {
	s := math.Sqrt(math.Max(0, w) / naclRefW)
	var k float64
	if tempC < densityRefC {
		k = densityColdErrPct * (densityRefC - tempC) / 20
	} else {
		k = densityWarmErrPct * math.Min(1, (tempC-densityRefC)/20)
	}
	return densityFitErrPct + s*k
}

// SolutionDensity returns the density in kg/m³ of a solution of c with mass fraction w of
// anhydrous solute at tempC: the library's 20 °C value scaled by the density ratio of pure
// water. The warning says when the density data are extrapolated in concentration or when the
// temperature scaling adds more than a trace of error. Without density data, or beyond the
// strongest solution the data answer for, the error is the compound's *unit.FieldError
// (field "solution_density_kg_per_m3"); callers rename it to their own key.
func SolutionDensity(c *compound.Compound, w, tempC float64) (rho float64, warning string, err error) {
	if math.IsNaN(tempC) || math.IsInf(tempC, 0) {
		return 0, "", unit.NumberError("temp_C", tempC, "a finite temperature")
	}
	rho20, warn, err := c.SolutionDensityKgPerM3(w, densityRefC)
	if err != nil {
		return 0, "", err
	}
	rho = rho20 * water.DensityKgPerM3(tempC) / water.DensityKgPerM3(densityRefC)
	if math.Abs(tempC-densityRefC) > densityQuietC {
		warn = join(warn, "solution density at "+unit.FormatCompact(tempC, 4)+" °C scaled from the 20 °C data by the density of pure water; "+
			"error up to about "+unit.FormatCompact(DensityErrorPct(w, tempC), 2)+" %")
	}
	return rho, warn, nil
}

// solveMassFraction finds the mass fraction w at which the solution holds gPerL grams of
// solute per litre at tempC: w·ρ(w, T) = gPerL. The left side grows with w for every
// solute of the library (its density rises with w), so bisection between 0 and the
// strongest solution the density data answer for converges to the last bit. field names the
// concentration for errors; display is the value as the user gave it, with its unit.
func solveMassFraction(c *compound.Compound, gPerL, tempC float64, field, display string) (float64, error) {
	_, hiW := c.DensityLimits()
	if hiW == 0 {
		return 0, noDensity(c, field, display)
	}
	hiW = math.Min(hiW, 0.999)
	f := func(w float64) (float64, error) {
		rho, _, err := SolutionDensity(c, w, tempC)
		if err != nil {
			return 0, err
		}
		return w*rho - gPerL, nil
	}
	fhi, err := f(hiW)
	if err != nil {
		return 0, err
	}
	if fhi < 0 {
		return 0, &unit.FieldError{Field: field, Value: display,
			Allowed: "a concentration the density data cover: up to " + unit.FormatCompact(hiW*100, 3) + " mass % of " + c.ID +
				" (" + unit.FormatCompact(fhi+gPerL, 4) + " g/L at " + unit.FormatCompact(tempC, 4) + " °C)"}
	}
	lo, hi := 0.0, hiW
	for range 200 {
		mid := 0.5 * (lo + hi)
		if mid <= lo || mid >= hi {
			break
		}
		fm, err := f(mid)
		if err != nil {
			return 0, err
		}
		if fm < 0 {
			lo = mid
		} else {
			hi = mid
		}
	}
	return 0.5 * (lo + hi), nil
}

// noDensity is the error for a per-volume quantity asked of a solute without density data.
func noDensity(c *compound.Compound, field, display string) error {
	return &unit.FieldError{Field: field, Value: display,
		Allowed: "a mass-based choice (% w/w or mol/kg; final_mass_g or solvent_g): Saltcast has no solution density for " + c.ID +
			", so it cannot turn volumes into masses without guessing"}
}

func join(a, b string) string {
	switch {
	case a == "":
		return b
	case b == "":
		return a
	}
	return a + "; " + b
}
