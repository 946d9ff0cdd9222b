package prep

import (
	"math"
	"strings"

	"saltcast/core/unit"
)

// Unit is a unit of concentration a technician asks for.
type Unit string

// The units of a target or stock concentration. Volume-based units refer to the solution's
// volume at the make-up temperature.
const (
	MolPerL  Unit = "mol/L"  // mol of anhydrous solute per litre of solution
	MmolPerL Unit = "mmol/L" // mmol per litre of solution
	GPerL    Unit = "g/L"    // g of anhydrous solute per litre of solution
	MgPerL   Unit = "mg/L"   // mg per litre of solution
	PctWV    Unit = "% w/v"  // g of anhydrous solute per 100 mL of solution
	PctWW    Unit = "% w/w"  // mass per cent of anhydrous solute in the solution
	MolPerKg Unit = "mol/kg" // molality: mol of anhydrous solute per kg of water
)

// Units lists every unit in display order.
var Units = []Unit{MolPerL, MmolPerL, GPerL, MgPerL, PctWV, PctWW, MolPerKg}

// ParseUnit reads a unit name as listed in Units. Spaces around it are ignored and "%w/v",
// "% wv", "w/v %" style variants are not accepted: the list is short and exact so that a
// recipe means one thing. An unknown unit is a *unit.FieldError for field.
func ParseUnit(field, s string) (Unit, error) {
	t := strings.TrimSpace(s)
	for _, u := range Units {
		if string(u) == t {
			return u, nil
		}
	}
	return "", &unit.FieldError{Field: field, Value: s, Allowed: "one of " + unitList()}
}

func unitList() string {
	s := make([]string, len(Units))
	for i, u := range Units {
		s[i] = string(u)
	}
	return strings.Join(s, ", ")
}

// PerVolume reports whether the unit refers to the solution's volume, so that converting it
// needs the solution's density.
func (u Unit) PerVolume() bool {
	return u != PctWW && u != MolPerKg
}

// gPerLFactor is the g of solute per litre of solution that one unit of u means, for a
// solute of molar mass M g/mol. It is 0 for the mass-based units.
func (u Unit) gPerLFactor(M float64) float64 {
	switch u {
	case MolPerL:
		return M
	case MmolPerL:
		return M / 1000
	case GPerL:
		return 1
	case MgPerL:
		return 1e-3
	case PctWV:
		return 10 // g per 100 mL = 10 g/L
	}
	return 0
}

// MassFraction converts a concentration v in a mass-based unit (% w/w, mol/kg) to the mass
// fraction of anhydrous solute, for a solute of molar mass M g/mol. ok is false for a
// per-volume unit, which needs the density (see Solver.MassFraction).
func MassFraction(v float64, u Unit, M float64) (w float64, ok bool) {
	switch u {
	case PctWW:
		return v / 100, true
	case MolPerKg:
		return v * M / (1000 + v*M), true
	}
	return 0, false
}

// FromMassFraction converts the mass fraction w to a concentration in u for a solute of
// molar mass M g/mol in a solution of density rhoKgPerM3 (ignored by the mass-based units;
// a non-positive density gives NaN for the per-volume units, which callers must not show).
func FromMassFraction(w float64, u Unit, M, rhoKgPerM3 float64) float64 {
	switch u {
	case PctWW:
		return 100 * w
	case MolPerKg:
		return 1000 * w / ((1 - w) * M)
	}
	if !(rhoKgPerM3 > 0) {
		return math.NaN()
	}
	return w * rhoKgPerM3 / u.gPerLFactor(M) // kg/m³ is numerically g/L
}
