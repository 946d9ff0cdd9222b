package compound

import (
	"math"

	"saltcast/core/solubility"
	"saltcast/core/unit"
)

// waterDensity20 is pure water at 20 °C in g/cm³ (Kell 1975, J. Chem. Eng. Data 20:97, gives
// 0.998207; CRC's concentrative-properties table starts from 0.9982).
const waterDensity20 = 0.99821

// densityWarnC is how far from 20 °C the 20 °C densities are used without a warning. Between 15
// and 25 °C water's own density changes by less than 0.15 % (Kell 1975).
const densityWarnC = 5

// densityOverMassPct is how far (in mass per cent) beyond the strongest tabulated solution the
// fit still answers, with a warning.
const densityOverMassPct = 10

// densityFit is ρ(w) = ρ_water + Σ a_k w^k (w mass fraction, g/cm³), fitted to CRC rows.
type densityFit struct {
	a      []float64 // a[0] multiplies w
	maxW   float64   // strongest tabulated mass fraction
	source string
}

func fitDensity(rows []solubility.Point, source string) (*densityFit, error) {
	n := len(rows)
	if n < 1 {
		return nil, &unit.FieldError{Field: "density", Value: "no rows", Allowed: "at least one density row"}
	}
	deg := min(3, n)
	maxW := 0.0
	for _, r := range rows {
		maxW = math.Max(maxW, r.TempC/100)
	}
	// Normal equations in s = w/maxW for conditioning.
	ata := make([][]float64, deg)
	atb := make([]float64, deg)
	for i := range ata {
		ata[i] = make([]float64, deg)
	}
	for _, r := range rows {
		s := r.TempC / 100 / maxW
		y := r.GPer100gWater - waterDensity20
		pw := make([]float64, deg)
		v := s
		for k := range pw {
			pw[k] = v
			v *= s
		}
		for i := range deg {
			atb[i] += pw[i] * y
			for j := range deg {
				ata[i][j] += pw[i] * pw[j]
			}
		}
	}
	x, ok := solveSmall(ata, atb)
	if !ok {
		return nil, &unit.FieldError{Field: "density", Value: "rows", Allowed: "density rows at distinct concentrations"}
	}
	for k := range x {
		x[k] /= math.Pow(maxW, float64(k+1))
	}
	return &densityFit{a: x, maxW: maxW, source: source}, nil
}

// solveSmall solves a small linear system by Gaussian elimination with partial pivoting.
func solveSmall(a [][]float64, b []float64) ([]float64, bool) {
	n := len(b)
	for k := range n {
		p := k
		for i := k + 1; i < n; i++ {
			if math.Abs(a[i][k]) > math.Abs(a[p][k]) {
				p = i
			}
		}
		if math.Abs(a[p][k]) < 1e-14 {
			return nil, false
		}
		a[k], a[p] = a[p], a[k]
		b[k], b[p] = b[p], b[k]
		for i := k + 1; i < n; i++ {
			f := a[i][k] / a[k][k]
			for j := k; j < n; j++ {
				a[i][j] -= f * a[k][j]
			}
			b[i] -= f * b[k]
		}
	}
	x := make([]float64, n)
	for k := n - 1; k >= 0; k-- {
		s := b[k]
		for j := k + 1; j < n; j++ {
			s -= a[k][j] * x[j]
		}
		x[k] = s / a[k][k]
	}
	return x, true
}

func (d *densityFit) at(w float64) float64 {
	s, v := 0.0, w
	for _, a := range d.a {
		s += a * v
		v *= w
	}
	return 1000 * (waterDensity20 + s)
}

// HasDensity reports whether the library has solution densities for the compound.
func (c *Compound) HasDensity() bool { return c.density != nil }

// DensityLimits returns the strongest tabulated solution (mass fraction of anhydrous solute)
// and the strongest that SolutionDensityKgPerM3 still answers, with a warning, beyond it;
// both are 0 when the compound has no density data.
func (c *Compound) DensityLimits() (tabulated, answered float64) {
	if c.density == nil {
		return 0, 0
	}
	return c.density.maxW, c.density.maxW + densityOverMassPct/100.0
}

// DensitySource names the source of the density data, or "" if there are none.
func (c *Compound) DensitySource() string {
	if c.density == nil {
		return ""
	}
	return c.density.source
}

// SolutionDensityKgPerM3 returns the density of a solution of the compound with the given
// mass fraction of anhydrous solute (0 ≤ massFraction < 1), from CRC data at 20 °C. Away
// from 20 °C (more than 5 K) or up to 10 mass % above the strongest tabulated solution the
// value comes with a warning; beyond that, or without density data, the error is a
// *unit.FieldError that asks for a measured density (field "solution_density_kg_per_m3").
func (c *Compound) SolutionDensityKgPerM3(massFraction, tempC float64) (rho float64, warning string, err error) {
	if !(massFraction >= 0 && massFraction < 1) {
		return 0, "", unit.NumberError("mass_fraction", massFraction, "a mass fraction from 0 to below 1")
	}
	if math.IsNaN(tempC) || math.IsInf(tempC, 0) {
		return 0, "", unit.NumberError("temp_C", tempC, "a finite temperature")
	}
	ask := "a measured solution density in kg/m³"
	if c.density == nil {
		return 0, "", &unit.FieldError{Field: "solution_density_kg_per_m3", Value: "",
			Allowed: ask + " (Saltcast has no density data for " + c.ID + ")"}
	}
	d := c.density
	if massFraction > d.maxW+densityOverMassPct/100.0 {
		return 0, "", &unit.FieldError{Field: "solution_density_kg_per_m3", Value: "",
			Allowed: ask + " (the density data for " + c.ID + " stop at " + unit.FormatCompact(100*d.maxW, 3) + " mass %)"}
	}
	rho = d.at(massFraction)
	if massFraction > d.maxW {
		warning = "solution density of " + c.ID + " extrapolated beyond the data (" + unit.FormatCompact(100*d.maxW, 3) + " mass %)"
	}
	if math.Abs(tempC-20) > densityWarnC {
		warning = joinWarn(warning, "solution density of "+c.ID+" is the 20 °C value; at "+unit.FormatCompact(tempC, 3)+" °C it differs by up to a few per cent")
	}
	if !(rho > 500 && rho < 5000) {
		return 0, "", &unit.FieldError{Field: "solution_density_kg_per_m3", Value: "", Allowed: ask}
	}
	return rho, warning, nil
}
