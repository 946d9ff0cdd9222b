package api_test

import (
	"errors"
	"math"
	"math/rand/v2"
	"slices"
	"strconv"
	"strings"
	"testing"

	"saltcast/core/balance"
	"saltcast/core/compound"
	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
	"saltcast/web/api"
)

// Tolerances of the property test, by intent.
const (
	massTol = 1e-9 // relative: mass in = crystals + liquor + evaporated water, solute likewise
	satTol  = 1e-9 // relative: a plan never charges more than saturation at the dissolve temperature
)

// finiteRecipes is how many random recipes TestPlanFinite plans.
const finiteRecipes = 4000

// TestPlanFinite plans thousands of random valid recipes across every library compound and
// random custom ones (fixed seed, so a failure reproduces): every number in the answer is
// finite, the mass balance closes, and the warnings and cautions are there where the recipe
// calls for them. A recipe the planner refuses must be refused as an input error naming a
// recipe key, and refusals must stay rare.
func TestPlanFinite(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261201, 7))
	lib := compound.All()
	planned, refused := 0, map[string]int{}
	for i := range finiteRecipes {
		g := gen{rng: rng}
		var r recipe.Recipe
		if i%5 == 4 {
			r = g.custom()
		} else {
			r = g.library(lib[i%len(lib)])
		}
		res, out, err := planBoth(t, r)
		if err == nil && res.HasTarget && res.HasOnset && res.SaturationTempC > res.TargetC && rng.IntN(5) < 2 &&
			!(res.TargetC > r.DissolveTempC) {
			// Seed somewhere between the target and the saturation temperature.
			on := res.SaturationTempC
			r.SeedAtC = recipe.Some(on - (on-res.TargetC)*(0.02+0.96*rng.Float64()))
			res, out, err = planBoth(t, r)
		}
		if err != nil {
			var fe *unit.FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("recipe %d %s: error %v is not a *unit.FieldError", i, r.Encode(), err)
			}
			if testing.Verbose() && refused[fe.Field] < 3 {
				t.Logf("refused %s: %v", r.Encode(), err)
			}
			refused[fe.Field]++
			continue
		}
		planned++
		checkFiniteJSON(t, i, r, out)
		checkBalance(t, i, r, res)
		checkNotes(t, i, r, res)
	}
	total := 0
	for _, n := range refused {
		total += n
	}
	t.Logf("%d recipes planned, %d refused %v", planned, total, refused)
	if total*20 > finiteRecipes {
		t.Errorf("%d of %d valid recipes refused (%v); want under 5 %%", total, finiteRecipes, refused)
	}
}

// planBoth plans r through the JSON service (as every front end does) and through
// recipe.Plan (for the Go fields), and checks they agree.
func planBoth(t *testing.T, r recipe.Recipe) (recipe.Result, []byte, error) {
	t.Helper()
	body := r.Encode()
	out, err := api.Plan(body)
	d, derr := recipe.Decode(body)
	if derr != nil {
		t.Fatalf("Decode(Encode(r)) = %v for %s", derr, body)
	}
	res, perr := recipe.Plan(d)
	if (err == nil) != (perr == nil) {
		t.Fatalf("api.Plan error %v but recipe.Plan error %v for %s", err, perr, body)
	}
	if err == nil && string(res.Encode()) != string(out) {
		t.Fatalf("api.Plan and recipe.Plan differ for %s", body)
	}
	return res, out, err
}

// checkFiniteJSON decodes the answer strictly (core/wire refuses NaN and Inf) and checks that
// every number is of a size a person can read.
func checkFiniteJSON(t *testing.T, i int, r recipe.Recipe, out []byte) {
	t.Helper()
	v, err := wire.Decode(out)
	if err != nil {
		t.Fatalf("recipe %d %s: answer is not strict JSON: %v", i, r.Encode(), err)
	}
	var walk func(path string, v wire.Value)
	walk = func(path string, v wire.Value) {
		switch v.Kind {
		case wire.Number:
			if math.IsNaN(v.Num) || math.IsInf(v.Num, 0) || math.Abs(v.Num) > 1e12 {
				t.Errorf("recipe %d %s: %s = %s", i, r.Encode(), path, v.Text)
			}
		case wire.Array:
			for k, it := range v.Items {
				walk(path+"["+strconv.Itoa(k)+"]", it)
			}
		case wire.Object:
			for _, m := range v.Members {
				walk(path+"."+m.Key, m.Value)
			}
		}
	}
	walk("", v)
}

func checkBalance(t *testing.T, i int, r recipe.Recipe, res recipe.Result) {
	t.Helper()
	fail := func(format string, args ...any) {
		t.Helper()
		t.Errorf("recipe %d %s: "+format, append([]any{i, r.Encode()}, args...)...)
	}
	p := res.PurityPct / 100
	if res.SaturationPct > 100*(1+satTol) {
		fail("saturation_pct %v > 100", res.SaturationPct)
	}
	if w := r.WaterG; w.Set && res.WaterG != w.Value {
		fail("water_g %v, recipe says %v", res.WaterG, w.Value)
	}
	if !res.HasTarget {
		return
	}
	in := res.ChargeG*p + res.WaterG
	outG := res.CrystalsG + res.IceG + res.LiquorG + res.EvaporatedWaterG
	if math.Abs(in-outG) > massTol*in {
		fail("mass in %v ≠ crystals %v + ice %v + liquor %v + evaporated %v", in, res.CrystalsG, res.IceG, res.LiquorG, res.EvaporatedWaterG)
	}
	sol := res.CrystalsG*res.CrystalAnhydrousFrac + res.LiquorSoluteG
	if math.Abs(sol-res.SoluteG) > massTol*res.SoluteG {
		fail("solute %v ≠ in crystals %v + in liquor %v", res.SoluteG, res.CrystalsG*res.CrystalAnhydrousFrac, res.LiquorSoluteG)
	}
	if res.CrystalsG < 0 || res.YieldPct < 0 || res.YieldPct > 100*(1+massTol) {
		fail("crystals %v g, yield %v %%", res.CrystalsG, res.YieldPct)
	}
	if res.IceG < 0 || res.IceG > 0 && !res.HasIce {
		fail("ice %v g (has ice %v)", res.IceG, res.HasIce)
	}
	if res.Frozen || res.IceG > 0 {
		return // the liquor is set by the freezing curve or gone; checked in package balance
	}
	// The liquor is saturated when crystals form, and at most saturated when none do.
	s := res.SolubilityAtTargetG100
	if res.CrystalsG > 0 && math.Abs(res.LiquorG100-s) > 1e-6*s {
		fail("liquor %v g/100 g with crystals, solubility %v", res.LiquorG100, s)
	}
	if res.CrystalsG == 0 && res.LiquorG100 > s*(1+1e-9) {
		fail("liquor %v g/100 g above the solubility %v without crystals", res.LiquorG100, s)
	}
}

// checkNotes checks the warnings and cautions a recipe calls for.
func checkNotes(t *testing.T, i int, r recipe.Recipe, res recipe.Result) {
	t.Helper()
	fail := func(format string, args ...any) {
		t.Helper()
		t.Errorf("recipe %d %s: "+format, append([]any{i, r.Encode()}, args...)...)
	}
	has := func(list []string, words string) bool {
		return slices.ContainsFunc(list, func(s string) bool { return strings.Contains(s, words) })
	}
	lo, hi := res.Compound.Range()
	temps := []float64{r.DissolveTempC}
	if r.CoolToC.Set {
		temps = append(temps, r.CoolToC.Value)
	}
	if r.SeedAtC.Set {
		temps = append(temps, r.SeedAtC.Value)
	}
	for _, tc := range temps {
		if (tc < lo || tc > hi) && !has(res.Warnings, "extrapolated") {
			fail("%v °C lies outside the data %v–%v °C but no warning says extrapolated: %q", tc, lo, hi, res.Warnings)
		}
	}
	coldest, hottest := slices.Min(temps), slices.Max(temps)
	if res.HasAdiabatic {
		coldest, hottest = min(coldest, res.AdiabaticEndC), max(hottest, res.AdiabaticEndC)
	}
	if coldest < 0 && !has(res.Warnings, "freez") {
		fail("the batch goes to %v °C but no warning mentions freezing: %q", coldest, res.Warnings)
	}
	if hottest > 100 && !has(res.Warnings, "boil") {
		fail("the batch goes to %v °C but no warning mentions boiling: %q", hottest, res.Warnings)
	}
	if hottest > 50 && !res.HasCaution(balance.CautionHot) {
		fail("the batch reaches %v °C but no hot-liquid caution: %q", hottest, res.CautionKinds)
	}
	if res.Compound.Oxidizer && !res.HasCaution(balance.CautionOxidizer) {
		fail("%s is an oxidizer but no caution says so: %q", res.SoluteID, res.CautionKinds)
	}
	if res.Compound.Toxic != res.HasCaution(balance.CautionToxic) || res.Compound.Toxic && res.CautionKinds[0] != balance.CautionToxic {
		fail("%s toxic %v, caution kinds %q: a toxic compound's plan opens with the toxic caution, no other has one",
			res.SoluteID, res.Compound.Toxic, res.CautionKinds)
	}
	if !res.PointsToSDS() || !has(res.Cautions, "SDS") {
		fail("no caution points to the SDS: %q", res.Cautions)
	}
	if res.HasTarget {
		a, b := min(r.DissolveTempC, res.TargetC), max(r.DissolveTempC, res.TargetC)
		segs := res.Compound.Segments
		for k := 1; k < len(segs); k++ {
			tb := segs[k].MinC
			if tb > a && tb < b && segs[k].Form != segs[k-1].Form && !has(res.Warnings, "stable solid changes") {
				fail("the path crosses the %s/%s transition at %v °C without a warning: %q",
					segs[k-1].Form.Formula, segs[k].Form.Formula, tb, res.Warnings)
			}
		}
		if res.EvaporatedWaterG > 0 && !has(res.Warnings, "evaporated") {
			fail("water evaporates but no warning says its heat is left out: %q", res.Warnings)
		}
	}
	if r.WaterML.Set && !has(res.Warnings, "mL of water at") {
		fail("water given by volume but no warning shows the conversion: %q", res.Warnings)
	}
}

// gen makes random valid recipes.
type gen struct{ rng *rand.Rand }

func (g gen) uniform(a, b float64) float64 { return a + (b-a)*g.rng.Float64() }

// logUniform spreads values evenly over the decades from a to b.
func (g gen) logUniform(a, b float64) float64 {
	return math.Exp(g.uniform(math.Log(a), math.Log(b)))
}

// temp picks a temperature inside [lo, hi], or now and then within the 5 K margin outside
// it, where the planner must warn.
func (g gen) temp(lo, hi float64) float64 {
	const edge = 0.98 * 5 // inside the margin of solubility.WarnMarginK
	switch g.rng.IntN(12) {
	case 0:
		return g.uniform(lo-edge, lo)
	case 1:
		return g.uniform(hi, hi+edge)
	}
	return g.uniform(lo, hi)
}

func (g gen) library(c *compound.Compound) recipe.Recipe {
	f := c.Forms[g.rng.IntN(len(c.Forms))]
	r := recipe.Recipe{Solute: c.ID, ChargedForm: f.Formula}
	if g.rng.IntN(3) == 0 {
		r.Solute, r.ChargedForm = f.Formula, "" // the form named by the solute itself
	}
	lo, hi := c.Range()
	// A recipe dissolving below the freezing point of its solution is invalid, so the
	// dissolve temperature of a compound with freezing data stays at or above 0 °C.
	dlo := lo
	if c.Freezing != nil {
		dlo = max(lo, 0)
	}
	g.common(&r, dlo, lo, hi, func(dissolveC, waterG, p float64) (float64, bool) {
		s, _, _, err := c.Solubility(dissolveC)
		if err != nil {
			return 0, false
		}
		most, err := balance.ChargeFor(f, p, waterG, s, "charge_g")
		return most, err == nil
	}, c.Retrograde)
	return r
}

// custom makes a user compound from a smooth invented curve (3 to 8 points), fitted by a
// random model.
func (g gen) custom() recipe.Recipe {
	n := 3 + g.rng.IntN(6)
	lo := g.uniform(-10, 40)
	hi := lo + g.uniform(20, 100)
	a, b := g.logUniform(0.5, 150), g.uniform(-0.01, 0.04)
	models := []string{"table", "vant-hoff", "apelblat", "polynomial"}
	cu := &recipe.Custom{
		Name:             "random solute " + strconv.Itoa(g.rng.IntN(1000)) + " (invented)",
		MolarMassGPerMol: g.uniform(20, 600),
		Model:            models[g.rng.IntN(len(models))],
		Source:           "invented for the property test",
	}
	for k := range n {
		tc := lo + (hi-lo)*float64(k)/float64(n-1)
		cu.Points = append(cu.Points, recipe.Point{TempC: tc, GPer100gWater: a * math.Exp(b*(tc-25))})
	}
	if g.rng.IntN(2) == 0 {
		cu.SolutionEnthalpyKJPerMol = recipe.Some(g.uniform(-40, 40))
	}
	r := recipe.Recipe{Custom: cu}
	g.common(&r, lo, lo, hi, func(dissolveC, waterG, p float64) (float64, bool) {
		return waterG * a * math.Exp(b*(dissolveC-25)) / 100 / p, true
	}, func(float64) bool { return b < 0 })
	return r
}

// common fills in the water, the temperatures, the charge and the options; the dissolve
// temperature is drawn from dissolveLo to hi, the others from lo.
func (g gen) common(r *recipe.Recipe, dissolveLo, lo, hi float64, most func(dissolveC, waterG, p float64) (float64, bool), retro func(float64) bool) {
	if g.rng.IntN(4) == 0 {
		r.PurityPct = recipe.Some(g.uniform(50, 100))
	}
	p := r.PurityPct.Or(100) / 100
	waterG := g.logUniform(1, 5e4)
	if g.rng.IntN(4) == 0 {
		r.WaterML = recipe.Some(waterG)
		if g.rng.IntN(2) == 0 {
			r.WaterTempC = recipe.Some(g.uniform(1, 99))
		}
	} else {
		r.WaterG = recipe.Some(waterG)
	}
	r.DissolveTempC = g.temp(dissolveLo, hi)
	switch k := g.rng.IntN(8); {
	case k < 4:
		r.SaturationPct = recipe.Some(g.uniform(5, 100))
	case k < 7:
		// Water given by volume weighs a little less than its mL, so stay below 95 %; and
		// weigh from 10 mg, well inside the masses a recipe may give (0.001 g to 1e7 g).
		if m, ok := most(r.DissolveTempC, waterG, p); ok && m*0.05 > 0.01 && m < 1e7 {
			r.ChargeG = recipe.Some(m * g.uniform(0.05, 0.95))
		} else {
			r.SaturationPct = recipe.Some(g.uniform(5, 100))
		}
	default:
		if r.DissolveTempC-lo > 3 {
			r.ClearDownToC = recipe.Some(g.uniform(lo+2, r.DissolveTempC))
			if g.rng.IntN(2) == 0 {
				r.ClearMarginK = recipe.Some(g.uniform(0, 1.9))
			}
		}
	}
	if g.rng.IntN(10) < 7 {
		low := lo
		if g.rng.IntN(12) == 0 || r.DissolveTempC <= lo {
			low = lo - 0.98*5 // inside the margin below the data
		}
		target := g.uniform(low, r.DissolveTempC)
		if retro(r.DissolveTempC) && g.rng.IntN(2) == 0 {
			target = g.uniform(r.DissolveTempC, hi)
		}
		if target != r.DissolveTempC {
			r.CoolToC = recipe.Some(target)
			if g.rng.IntN(5) == 0 {
				r.EvaporatedWaterG = recipe.Some(waterG * g.uniform(0, 0.3))
			}
		}
	}
	if g.rng.IntN(3) == 0 {
		r.MetastableWidthK = recipe.Some(g.uniform(0.5, 20))
	}
	if g.rng.IntN(3) == 0 {
		r.CoolingTimeMin = recipe.Some(g.uniform(5, 2000))
	}
	if g.rng.IntN(4) == 0 {
		r.VesselHeatCapacityJPerK = recipe.Some(g.uniform(0, 5000))
	}
	if g.rng.IntN(6) == 0 {
		r.LiquorHeatCapacityKJPerKgK = recipe.Some(g.uniform(2.5, 4.2))
	}
}
