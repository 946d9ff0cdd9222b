package balance

import (
	"math"

	"saltcast/core/compound"
	"saltcast/core/unit"
)

// Composition returns the anhydrous solute and the total water (added water plus the
// hydrate's water of crystallization) when chargeG of form at purity (mass fraction, 0 < p ≤ 1)
// dissolves in waterG of water.
func Composition(form *compound.Form, purity, chargeG, waterG float64) (soluteG, totalWaterG float64) {
	pure := chargeG * purity
	return pure * form.AnhydrousFraction, waterG + pure*(1-form.AnhydrousFraction)
}

// ChargeFor returns the grams of form (at purity, a mass fraction) that bring waterG of
// water to a concentration of g100 grams of anhydrous solute per 100 g of water. A hydrate
// brings its own water, so past f/(1−f)·100 g/100 g (the hydrate's own composition) no
// amount reaches the target: that is a *unit.FieldError for field.
func ChargeFor(form *compound.Form, purity, waterG, g100 float64, field string) (float64, error) {
	k := g100 / 100
	f := form.AnhydrousFraction
	den := purity * (f - k*(1-f))
	if !(den > 0) {
		return 0, &unit.FieldError{Field: field, Value: form.Formula,
			Allowed: "a target below " + unit.FormatCompact(100*f/(1-f), 4) + " g per 100 g water, the composition of " +
				form.Formula + " itself (it dissolves in its own water of crystallization); charge the anhydrous form instead"}
	}
	return k * waterG / den, nil
}

// MinWater returns the least water to add so that chargeG of form (at purity) dissolves to
// a solution of g100 g per 100 g water. Zero means the hydrate's own water is enough.
func MinWater(form *compound.Form, purity, chargeG, g100 float64) float64 {
	s, hw := Composition(form, purity, chargeG, 0)
	return math.Max(0, 100*s/g100-hw)
}

// scanStepK is the widest step of the scans that look for where a curve crosses a
// concentration; narrower than any feature of the library curves.
const scanStepK = 2.5

// solAt evaluates the curve of the stable phase at t without range checks; callers keep t
// within the range already checked.
func solAt(c *compound.Compound, t float64) (float64, *compound.Segment) {
	seg := c.SegmentAt(t)
	return seg.Curve.Model.Value(t), seg
}

// Onset returns the saturation temperature of a solution holding g100 g per 100 g water,
// met first when its temperature moves from fromC toward toC: the first temperature on the
// way at which the solution is saturated and becomes supersaturated beyond. Moving down
// (cooling) it is the highest such T ≤ fromC; moving up, for retrograde solubility, the
// lowest such T ≥ fromC. Non-monotone curves (Na2SO4 across 32.38 °C) are scanned in steps
// of at most 2.5 K and the crossing refined by the Illinois method. ok is false when the
// solution stays unsaturated all the way.
func Onset(c *compound.Compound, g100, fromC, toC float64) (tempC float64, ok bool) {
	g := func(t float64) float64 {
		v, _ := solAt(c, t)
		return v - g100
	}
	tol := 1e-10 * g100 // relative; far below any difference a balance can weigh
	dir := 1.0
	if toC < fromC {
		dir = -1
	}
	prevT, prevG := fromC, g(fromC)
	switch {
	case prevG < -tol:
		return fromC, true // supersaturated already
	case prevG <= tol:
		// Saturated at the start: an onset here if it is supersaturated just beyond.
		if g(fromC+dir*1e-6) < 0 {
			return fromC, true
		}
		prevG = math.Abs(prevG)
	}
	root, found := 0.0, false
	eachStep(c, fromC, toC, func(t float64) bool {
		gt := g(t)
		if gt < 0 {
			root, found = refine(g, t, gt, prevT, prevG), true
			return false
		}
		if t == toC && gt <= tol {
			// Saturated to the last bits at the end of the scan. ln and exp differ in the
			// last bit between amd64 (assembly) and wasm (pure Go), so an exact comparison
			// here would let the CLI and the browser or worker disagree.
			root, found = t, true
			return false
		}
		prevT, prevG = t, gt
		return true
	})
	if found {
		return root, true
	}
	return 0, false
}

// eachStep calls fn with temperatures from fromC (excluded) to toC (included), at most
// scanStepK apart, with every segment boundary in between, until fn returns false.
func eachStep(c *compound.Compound, fromC, toC float64, fn func(t float64) bool) {
	dir := 1.0
	if toC < fromC {
		dir = -1
	}
	a := fromC
	for a != toC {
		// The next cut: the nearest segment boundary strictly beyond a, or toC.
		b := toC
		for i := 1; i < len(c.Segments); i++ {
			if m := c.Segments[i].MinC; (m-a)*dir > 0 && (b-m)*dir > 0 {
				b = m
			}
		}
		n := int(math.Ceil(math.Abs(b-a) / scanStepK))
		for k := 1; k <= n; k++ {
			t := a + (b-a)*float64(k)/float64(n)
			if k == n {
				t = b
			}
			if !fn(t) {
				return
			}
		}
		a = b
	}
}

// refine finds the root of g between a (g(a) = ga < 0) and b (g(b) = gb ≥ 0) by the
// Illinois variant of regula falsi, to 1e-9 K.
func refine(g func(float64) float64, a, ga, b, gb float64) float64 {
	side := 0
	t := b
	for range 100 {
		if math.Abs(b-a) < 1e-9 {
			break
		}
		t = (a*gb - b*ga) / (gb - ga)
		if !(t > math.Min(a, b) && t < math.Max(a, b)) {
			t = 0.5 * (a + b)
		}
		gt := g(t)
		if gt == 0 {
			return t
		}
		if gt < 0 {
			a, ga = t, gt
			if side == -1 {
				gb /= 2
			}
			side = -1
		} else {
			b, gb = t, gt
			if side == 1 {
				ga /= 2
			}
			side = 1
		}
	}
	return t
}

// lowestSolubility returns the lowest solubility met between loC and hiC: the most a
// solution may hold and stay clear everywhere in that range.
func lowestSolubility(c *compound.Compound, loC, hiC float64) float64 {
	m, _ := solAt(c, hiC)
	v, _ := solAt(c, loC)
	m = math.Min(m, v)
	eachStep(c, loC, hiC, func(t float64) bool {
		v, _ := solAt(c, t)
		m = math.Min(m, v)
		// Both phases meet at a boundary; take the colder phase's value too.
		for i := 1; i < len(c.Segments); i++ {
			if c.Segments[i].MinC == t {
				m = math.Min(m, c.Segments[i-1].Curve.Model.Value(t))
			}
		}
		return true
	})
	return m
}
