package balance

import (
	"math"

	"saltcast/core/compound"
	"saltcast/core/solubility"
	"saltcast/core/unit"
)

// HeatBasis names how a crystallization enthalpy was obtained.
type HeatBasis string

// The bases, best first: the first two hold at saturation; the last two are fallbacks.
const (
	// BasisActivity is the differential heat of solution at saturation from the slope of the
	// solubility curve, corrected with the salt's activity model (package activity).
	BasisActivity HeatBasis = "van 't Hoff at saturation with Pitzer activity correction"
	// BasisFusion is the heat of fusion of a hydrate that melts (nearly) congruently.
	BasisFusion HeatBasis = "heat of fusion of the hydrate"
	// BasisInfinite is the tabulated enthalpy of solution at infinite dilution.
	BasisInfinite HeatBasis = "enthalpy of solution at infinite dilution"
	// BasisIdeal is the ideal van 't Hoff slope of the curve (mole fractions, no activities).
	BasisIdeal HeatBasis = "ideal van 't Hoff from the curve slope"
)

// Estimate is one estimate of the heat released by crystallizing one mol of a phase.
type Estimate struct {
	Basis    HeatBasis
	KJPerMol float64
	Source   string
}

// CrystalHeat is the heat released by crystallizing a solid phase out of its saturated
// liquor at one temperature, per mol of the phase (positive = released), with every
// estimate the library allows.
type CrystalHeat struct {
	Phase     *compound.Form
	TempC     float64
	Estimates []Estimate
	// Best estimates: those that hold at saturation (activity-corrected van 't Hoff, heat
	// of fusion), or when there are none the two fallbacks. Low and High bound them; the
	// design value is High, the safe side for a cooling duty and an insulated jump.
	Basis                     HeatBasis
	LowKJPerMol, HighKJPerMol float64
	OK                        bool
}

// waterKgPerMol is the molar mass of water in kg/mol (IUPAC atomic weights, derived).
const waterKgPerMol = solubility.WaterGPerMol / 1000

// slopeStepK is the half-width of the central difference of ln m against T.
const slopeStepK = 0.25

// DifferentialHeat returns the differential heat of solution of phase at saturation at tempC
// in kJ/mol (positive = dissolving absorbs heat, so crystallizing releases it), from the
// slope of the phase's solubility curve and the salt's activity model:
//
//	ΔH = ν·R·T²·(1 + d ln γ±/d ln m)·(1 − n·m·M_w)·d ln m_s/dT
//
// with m_s the saturation molality, n the water of crystallization per formula unit and M_w
// the molar mass of water (derived from d ln a_salt = ΔH/(RT²)·dT at saturation with the
// Gibbs–Duhem equation for the water activity; Mullin, Crystallization, 4th ed., 2001, ch. 3,
// from memory, gives the anhydrous form). ok is false without an activity model, beyond its
// molality range, or outside the phase's temperature range.
func DifferentialHeat(c *compound.Compound, phase *compound.Form, tempC float64) (kJPerMol float64, ok bool) {
	if c.Activity == nil {
		return 0, false
	}
	var seg *compound.Segment
	for i := range c.Segments {
		if c.Segments[i].Form == phase && tempC >= c.Segments[i].MinC && tempC <= c.Segments[i].MaxC {
			seg = &c.Segments[i]
		}
	}
	if seg == nil {
		return 0, false
	}
	molal := func(t float64) float64 { return seg.Curve.Model.Value(t) / c.MolarMassGPerMol * 10 }
	a := math.Max(seg.MinC, tempC-slopeStepK)
	b := math.Min(seg.MaxC, tempC+slopeStepK)
	if !(b > a) {
		return 0, false
	}
	m := molal(tempC)
	factor, ok := c.Activity.Thermodynamic(m, tempC)
	if !ok {
		return 0, false
	}
	slope := (math.Log(molal(b)) - math.Log(molal(a))) / (b - a)
	T := tempC + 273.15
	h := c.Activity.Nu() * gasConstant * T * T * factor * (1 - phase.WaterPerFormula*m*waterKgPerMol) * slope / 1000
	if math.IsNaN(h) || math.IsInf(h, 0) {
		return 0, false
	}
	return h, true
}

// CrystallizationHeat gathers the estimates of the heat released by crystallizing phase
// from its saturated liquor at tempC (kept inside the phase's range) and picks the design
// value: the largest of the best estimates.
func CrystallizationHeat(c *compound.Compound, phase *compound.Form, tempC float64) CrystalHeat {
	ch := CrystalHeat{Phase: phase, TempC: tempC}
	var best []Estimate
	if h, ok := DifferentialHeat(c, phase, tempC); ok {
		e := Estimate{BasisActivity, h, c.Activity.Source}
		ch.Estimates = append(ch.Estimates, e)
		best = append(best, e)
	}
	if phase.HasFusion {
		lo := Estimate{BasisFusion, phase.FusionKJPerKgLow * phase.MolarMassGPerMol / 1000, phase.FusionSource}
		hi := Estimate{BasisFusion, phase.FusionKJPerKgHigh * phase.MolarMassGPerMol / 1000, phase.FusionSource}
		ch.Estimates = append(ch.Estimates, lo)
		best = append(best, lo)
		if hi.KJPerMol != lo.KJPerMol {
			ch.Estimates = append(ch.Estimates, hi)
			best = append(best, hi)
		}
	}
	var fallback []Estimate
	if phase.HasEnthalpy {
		e := Estimate{BasisInfinite, phase.SolutionEnthalpyKJPerMol, phase.EnthalpySource}
		ch.Estimates = append(ch.Estimates, e)
		fallback = append(fallback, e)
	}
	if h, ok := ApparentEnthalpy(c, tempC, tempC); ok && c.SegmentAt(tempC).Form == phase {
		e := Estimate{BasisIdeal, h, "derived: the library's solubility curve"}
		ch.Estimates = append(ch.Estimates, e)
		fallback = append(fallback, e)
	}
	if len(best) == 0 {
		best = fallback
	}
	if len(best) == 0 {
		return ch
	}
	ch.OK = true
	ch.Basis = best[0].Basis
	ch.LowKJPerMol, ch.HighKJPerMol = best[0].KJPerMol, best[0].KJPerMol
	for _, e := range best[1:] {
		ch.LowKJPerMol = math.Min(ch.LowKJPerMol, e.KJPerMol)
		ch.HighKJPerMol = math.Max(ch.HighKJPerMol, e.KJPerMol)
	}
	return ch
}

// Describe says in one paragraph which heat is used, on what basis, the range of the best
// estimates, and every estimate with its source.
func (ch CrystalHeat) Describe() string {
	if !ch.OK {
		return "no estimate of the heat of crystallization of " + ch.Phase.Formula
	}
	kj := func(v float64) string { return unit.FormatCompact(v, 3) + " kJ/mol" }
	s := "heat released by crystallizing " + ch.Phase.Formula + " from its saturated liquor near " + fmtC(ch.TempC) +
		": design value " + kj(ch.HighKJPerMol)
	if ch.Basis == BasisInfinite || ch.Basis == BasisIdeal {
		s += " (no estimate at saturation: the larger of the infinite-dilution and ideal van 't Hoff values"
	} else {
		s += " (" + string(ch.Basis)
	}
	if ch.LowKJPerMol < ch.HighKJPerMol {
		s += "; the estimates range from " + kj(ch.LowKJPerMol) + " to " + kj(ch.HighKJPerMol) +
			", and the larger sizes the cooling duty and the insulated jump"
	}
	s += "). Estimates:"
	for i, e := range ch.Estimates {
		if i > 0 {
			s += ";"
		}
		s += " " + string(e.Basis) + " " + kj(e.KJPerMol) + " (" + e.Source + ")"
	}
	return s
}
