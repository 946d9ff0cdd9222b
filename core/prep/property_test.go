package prep

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"

	"saltcast/core/compound"
	"saltcast/core/unit"
)

// roundTripTol is the relative agreement of a concentration read back in its own unit, or of
// the same solution planned from another unit: bisection to the last bit of w, then
// arithmetic.
const roundTripTol = 1e-9

// valueIn reads the result's concentration in u.
func valueIn(r Result, u Unit) float64 {
	switch u {
	case MolPerL:
		return r.MolPerL
	case MmolPerL:
		return r.MmolPerL
	case GPerL:
		return r.GPerL
	case MgPerL:
		return r.MgPerL
	case PctWV:
		return r.PctWV
	case PctWW:
		return r.PctWW
	case MolPerKg:
		return r.MolPerKg
	}
	return math.NaN()
}

// randomSpec draws a preparation of a library compound with density data, at a strength
// between 0.1 % and 95 % of its saturation at the make-up temperature.
func randomSpec(rng *rand.Rand, withDensity []*compound.Compound) Spec {
	c := withDensity[rng.IntN(len(withDensity))]
	t := 5 + 60*rng.Float64()
	sat, _, _, _ := c.Solubility(t)
	_, hiW := c.DensityLimits()
	g := sat * (0.001 + 0.949*rng.Float64())
	w := math.Min(g/(100+g), hiW*0.98)
	s := Spec{Compound: c, TempC: t, Amount: Amount(1 + rng.IntN(3)), AmountValue: 1 + 5000*rng.Float64()}
	s.Unit = Units[rng.IntN(len(Units))]
	rho, _, _ := SolutionDensity(c, w, t)
	s.Concentration = FromMassFraction(w, s.Unit, c.MolarMassGPerMol, rho)
	if rng.IntN(3) == 0 {
		s.HasStock = true
		ws := w + (hiW*0.99-w)*(0.05+0.95*rng.Float64())
		s.StockUnit = Units[rng.IntN(len(Units))]
		rs, _, _ := SolutionDensity(c, ws, t)
		s.StockConcentration = FromMassFraction(ws, s.StockUnit, c.MolarMassGPerMol, rs)
	} else {
		s.Form = c.Forms[rng.IntN(len(c.Forms))]
		s.PurityPct = 90 + 10*rng.Float64()
	}
	return s
}

func withDensity(t testing.TB) []*compound.Compound {
	var out []*compound.Compound
	for _, c := range compound.All() {
		if c.HasDensity() {
			out = append(out, c)
		}
	}
	if len(out) < 5 {
		t.Fatalf("only %d compounds with density data", len(out))
	}
	return out
}

// Mass in = mass out; the concentration reads back in every unit; the same solution planned
// from any other unit is the same solution.
func TestPropertiesRandom(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 11))
	cs := withDensity(t)
	for i := range 2000 {
		s := randomSpec(rng, cs)
		r, err := Plan(s)
		if err != nil {
			var fe *unit.FieldError
			// A hydrate cannot make a solution stronger than itself: a legitimate refusal.
			if errors.As(err, &fe) && fe.Field == "concentration" && s.Form != nil && s.Form.WaterPerFormula > 0 {
				continue
			}
			t.Fatalf("#%d Plan(%s %.6g %s, %s %.6g at %.2f °C): %v", i, s.Compound.ID, s.Concentration, s.Unit, s.Amount.Field(), s.AmountValue, s.TempC, err)
		}
		in := r.WaterG
		if r.HasStock {
			in += r.StockG
		} else {
			in += r.FormG - r.ImpurityG
		}
		if math.Abs(in-r.SolutionG) > balanceTol*r.SolutionG {
			t.Errorf("#%d %s: in %.12g g, solution %.12g g", i, s.Compound.ID, in, r.SolutionG)
		}
		if math.Abs(r.SoluteG+r.TotalWaterG-r.SolutionG) > balanceTol*r.SolutionG {
			t.Errorf("#%d %s: solute + water ≠ solution", i, s.Compound.ID)
		}
		if r.HasForm && math.Abs(r.TotalWaterG-r.WaterG-r.HydrateWaterG) > balanceTol*r.SolutionG {
			t.Errorf("#%d %s: water added + hydrate water ≠ total water", i, s.Compound.ID)
		}
		if got := valueIn(r, s.Unit); !relNear(got, s.Concentration, roundTripTol) {
			t.Errorf("#%d %s: asked %.12g %s, result reads %.12g", i, s.Compound.ID, s.Concentration, s.Unit, got)
		}
		if r.HasDensity && !relNear(r.SolutionML*r.DensityKgPerM3/1000, r.SolutionG, roundTripTol) {
			t.Errorf("#%d %s: volume × density ≠ mass", i, s.Compound.ID)
		}
		if s.Amount == ByVolume && r.SolutionML != s.AmountValue {
			t.Errorf("#%d %s: solution %.12g mL, asked %.12g", i, s.Compound.ID, r.SolutionML, s.AmountValue)
		}
		other := Units[rng.IntN(len(Units))]
		s2 := s
		s2.Unit, s2.Concentration = other, valueIn(r, other)
		r2, err := Plan(s2)
		if err != nil {
			t.Fatalf("#%d replan in %s: %v", i, other, err)
		}
		if !relNear(r2.MassFraction, r.MassFraction, roundTripTol) || !relNear(r2.SolutionG, r.SolutionG, roundTripTol) {
			t.Errorf("#%d %s: %s → %s gives w %.12g (was %.12g), %.12g g (was %.12g)", i, s.Compound.ID, s.Unit, other,
				r2.MassFraction, r.MassFraction, r2.SolutionG, r.SolutionG)
		}
	}
}

// Plan never panics and never returns a non-finite number, whatever the numbers.
func TestNoPanicsOrNaN(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	all := compound.All()
	weird := []float64{0, -1, 1e-300, 1e-9, 0.5, 1, 99.999, 100, 1e6, 1e300, math.Inf(1), math.NaN()}
	pick := func() float64 {
		if rng.IntN(2) == 0 {
			return weird[rng.IntN(len(weird))]
		}
		return math.Exp(rng.NormFloat64() * 5)
	}
	for range 5000 {
		c := all[rng.IntN(len(all))]
		s := Spec{Compound: c, Form: c.Forms[rng.IntN(len(c.Forms))], PurityPct: pick(), Concentration: pick(),
			Unit: Units[rng.IntN(len(Units))], Amount: Amount(rng.IntN(5)), AmountValue: pick(), TempC: pick() - 5,
			HasStock: rng.IntN(3) == 0, StockConcentration: pick(), StockUnit: Units[rng.IntN(len(Units))],
			HasStoreAt: rng.IntN(2) == 0, StoreAtC: pick() - 20}
		r, err := Plan(s)
		if err != nil {
			var fe *unit.FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("Plan(%+v) error %v is not a *unit.FieldError", s, err)
			}
			continue
		}
		if !r.finite() {
			t.Fatalf("Plan(%+v) returned a non-finite number", s)
		}
	}
}
