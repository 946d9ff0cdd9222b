package solubility

import "saltcast/core/unit"

// Conversions between g of anhydrous solute per 100 g water (g below) and other units of
// concentration of the same solution. M is the solute molar mass in g/mol, rho the density
// of the solution in kg/m³ (numerically g/L). The helpers are plain arithmetic with the
// domains stated; Convert checks its inputs and names the field at fault.

// MassPercent returns 100·m_solute/(m_solute + m_water) for g ≥ 0.
func MassPercent(g float64) float64 { return 100 * g / (100 + g) }

// FromMassPercent inverts MassPercent for 0 ≤ w < 100.
func FromMassPercent(w float64) float64 { return 100 * w / (100 - w) }

// MoleFraction returns the mole fraction of solute formula units in water.
func MoleFraction(g, M float64) float64 { return moleFractionIn(g, M, WaterGPerMol) }

// FromMoleFraction inverts MoleFraction for 0 ≤ x < 1.
func FromMoleFraction(x, M float64) float64 { return fromMoleFractionIn(x, M, WaterGPerMol) }

// Molality returns mol of solute per kg of water.
func Molality(g, M float64) float64 { return 10 * g / M }

// FromMolality inverts Molality.
func FromMolality(m, M float64) float64 { return m * M / 10 }

// GPerL returns g of solute per litre of solution.
func GPerL(g, rho float64) float64 { return rho * g / (100 + g) }

// FromGPerL inverts GPerL for 0 ≤ c < rho.
func FromGPerL(c, rho float64) float64 { return 100 * c / (rho - c) }

// MolPerL returns mol of solute per litre of solution.
func MolPerL(g, M, rho float64) float64 { return GPerL(g, rho) / M }

// FromMolPerL inverts MolPerL for 0 ≤ c·M < rho.
func FromMolPerL(c, M, rho float64) float64 { return FromGPerL(c*M, rho) }

func moleFractionIn(g, M, Ms float64) float64 {
	n := g / M
	return n / (n + 100/Ms)
}

func fromMoleFractionIn(x, M, Ms float64) float64 {
	return 100 * x * M / ((1 - x) * Ms)
}

// Unit names a unit of concentration for Convert.
type Unit string

// The units Convert knows.
const (
	GPer100gWater Unit = "g/100g" // g anhydrous solute per 100 g water
	MassPct       Unit = "mass%"  // mass per cent of solute in the solution
	MoleFrac      Unit = "x"      // mole fraction of solute formula units
	MolPerKg      Unit = "mol/kg" // molality
	GramsPerL     Unit = "g/L"    // g solute per litre of solution (needs rho)
	MolesPerL     Unit = "mol/L"  // mol solute per litre of solution (needs rho)
)

// Units lists the units Convert knows, in display order.
var Units = []Unit{GPer100gWater, MassPct, MoleFrac, MolPerKg, GramsPerL, MolesPerL}

// Convert converts v from one unit to another for a solute of molar mass M (g/mol) in a
// solution of density rho (kg/m³; only read for g/L and mol/L). Errors are *unit.FieldError
// for "value", "unit", "molar_mass_g_per_mol" or "density_kg_per_m3".
func Convert(v float64, from, to Unit, M, rho float64) (float64, error) {
	g, err := toG(v, from, to, M, rho)
	if err != nil {
		return 0, err
	}
	switch to {
	case GPer100gWater:
		return g, nil
	case MassPct:
		return MassPercent(g), nil
	case MoleFrac:
		return MoleFraction(g, M), nil
	case MolPerKg:
		return Molality(g, M), nil
	case GramsPerL:
		return GPerL(g, rho), nil
	case MolesPerL:
		return MolPerL(g, M, rho), nil
	}
	return 0, badUnit(to)
}

func toG(v float64, from, to Unit, M, rho float64) (float64, error) {
	if !(v >= 0 && v < 1e9) {
		return 0, unit.NumberError("value", v, "a concentration ≥ 0")
	}
	if !(M > 0 && M < 1e6) {
		return 0, unit.NumberError("molar_mass_g_per_mol", M, "a molar mass > 0 g/mol")
	}
	needRho := from == GramsPerL || from == MolesPerL || to == GramsPerL || to == MolesPerL
	if needRho && !(rho >= 500 && rho <= 5000) {
		return 0, unit.NumberError("density_kg_per_m3", rho, "a solution density from 500 to 5000 kg/m³")
	}
	var g float64
	switch from {
	case GPer100gWater:
		g = v
	case MassPct:
		if v >= 100 {
			return 0, unit.NumberError("value", v, "a mass per cent from 0 to below 100")
		}
		g = FromMassPercent(v)
	case MoleFrac:
		if v >= 1 {
			return 0, unit.NumberError("value", v, "a mole fraction from 0 to below 1")
		}
		g = FromMoleFraction(v, M)
	case MolPerKg:
		g = FromMolality(v, M)
	case GramsPerL:
		if v >= rho {
			return 0, unit.NumberError("value", v, "a concentration below the solution density ("+unit.FormatCompact(rho, 5)+" g/L)")
		}
		g = FromGPerL(v, rho)
	case MolesPerL:
		if v*M >= rho {
			return 0, unit.NumberError("value", v, "a concentration whose mass per litre is below the solution density")
		}
		g = FromMolPerL(v, M, rho)
	default:
		return 0, badUnit(from)
	}
	if !(g < 1e9) {
		return 0, unit.NumberError("value", v, "a concentration below 1e9 g per 100 g water")
	}
	return g, nil
}

func badUnit(u Unit) error {
	return &unit.FieldError{Field: "unit", Value: string(u), Allowed: "g/100g, mass%, x, mol/kg, g/L or mol/L"}
}
