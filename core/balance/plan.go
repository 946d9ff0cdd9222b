package balance

import (
	"errors"
	"math"

	"saltcast/core/compound"
	"saltcast/core/unit"
	"saltcast/core/water"
)

// Batch is what the planner needs. Package recipe builds it from a checked recipe; the
// field names in errors are the recipe keys.
type Batch struct {
	Compound  *compound.Compound
	Form      *compound.Form // the charged form; nil means the anhydrous form
	PurityPct float64        // 0 means 100
	WaterG    float64        // water added, > 0

	DissolveTempC float64

	// The charge: ChargeG if > 0; else, if HasClearDown, the most that stays clear down to
	// ClearDownToC with its saturation temperature ClearMarginK below that; else SaturationPct % of saturation at the
	// dissolve temperature (0 means 100).
	ChargeG       float64
	HasClearDown  bool
	ClearDownToC  float64
	ClearMarginK  float64
	SaturationPct float64

	HasTarget        bool
	TargetC          float64 // cool_to_C
	EvaporatedWaterG float64

	HasSeedAt bool
	SeedAtC   float64

	MetastableWidthK float64 // 0: not given
	CoolingTimeMin   float64 // 0: not given

	LiquorCpKJPerKgK float64 // 0: the water-equivalent model
	VesselJPerK      float64
}

// Thresholds of the general cautions.
const (
	hotLiquidC      = 50.0 // above this a spill scalds (common practice)
	strongThermalK  = 10.0 // an insulated temperature swing above this is a strong exo/endotherm (common practice)
	enthalpyDiffPct = 25.0 // show both enthalpies when they differ by more than this
	programmeRows   = 10   // intervals of the cooling programme table
	pathPoints      = 8    // intervals of the supersaturation table
)

// Rules of thumb with their sources, reported with the suggestions they produce.
const (
	seedRule = "seed about 1 K below the saturation temperature and inside the metastable zone " +
		"(common practice; Walas, Chemical Process Equipment, rules of thumb for crystallization, from memory); " +
		"seed mass 1–2 % of the expected crystal mass (common practice: 0.5–5 % is typical; " +
		"a critical seed loading near 1 % kept potash alum free of secondary nucleation, " +
		"Doki, Kubota et al., J. Chem. Eng. Japan 1999–2002, from memory, low confidence)"
	programmeSource = "Mullin, J. W. & Nývlt, J. (1971), Programmed cooling of batch crystallizers, " +
		"Chem. Eng. Sci. 26:369 (cubic profile T = T0 − (T0 − Tf)(t/τ)³, from memory for the attribution)"
	heatSource = "crystallization heat on the basis that holds at saturation: the differential heat of solution from the " +
		"solubility slope with the Pitzer activity correction where the activity model covers the saturation molality, and " +
		"the heat of fusion for hydrates that melt in their own water; the design value is the largest best estimate " +
		"(Mullin, Crystallization, 4th ed., 2001, ch. 3, from memory, for the differential heat at saturation)"
	cpWaterSource = "c_p of water: IAPWS-95 (Wagner & Pruss, 2002, J. Phys. Chem. Ref. Data 31:387), " +
		"values tabulated every 10 K (from memory)"
	cpModelUser = "user value × mass of solute and water"
	// DensitySource is cited when water is given by volume.
	DensitySource = "density of water: Kell (1975), J. Chem. Eng. Data 20:97"
	safetyNote    = "Saltcast is a planning aid, not a safety assessment: read the SDS of every chemical and " +
		"follow your local rules and licensed practice."
)

// ErrNotFinite is returned instead of a Result holding NaN or ±Inf; it means a bug, not bad input.
var ErrNotFinite = errors.New("balance: the plan produced a non-finite number; this is a bug, please report the recipe")

// notes collects warnings, cautions and sources without repeats.
type notes struct{ list []string }

func (n *notes) add(s string) {
	if s == "" {
		return
	}
	for _, x := range n.list {
		if x == s {
			return
		}
	}
	n.list = append(n.list, s)
}

// planner carries one batch through the steps of Plan.
type planner struct {
	b        Batch
	c        *compound.Compound
	form     *compound.Form // the charged form
	p        float64        // purity, mass fraction
	res      *Result
	warn     notes
	srcs     notes
	cautions cautionList

	m, S, Wt, conc float64 // charge, anhydrous solute, total water, g/100 g water
	sD             float64 // solubility at the dissolve temperature
	heating        bool    // the target lies above the dissolve temperature (retrograde)
	sT             float64 // solubility at the target
	segT           *compound.Segment
}

// Plan works out the whole batch, step by step: the charge, the onset, the crash-out at the
// target, the check of the seeding temperature, the unseeded path, the seed suggestion and
// the cooling programme, the heat, and the cautions.
func Plan(b Batch) (Result, error) {
	c := b.Compound
	if c == nil || len(c.Segments) == 0 {
		return Result{}, errors.New("balance: Plan needs a compound")
	}
	form := b.Form
	if form == nil {
		form = c.Forms[0]
	}
	purityPct := b.PurityPct
	if purityPct == 0 {
		purityPct = 100
	}
	res := Result{
		Compound: c, SoluteID: c.ID, SoluteName: c.Name, ChargedForm: form.Formula, PurityPct: purityPct,
		WaterG: b.WaterG, DissolveTempC: b.DissolveTempC,
	}
	pl := &planner{b: b, c: c, form: form, p: purityPct / 100, res: &res}
	for _, step := range [...]func() error{pl.charge, pl.onset, pl.crashOut, pl.checkSeed} {
		if err := step(); err != nil {
			return Result{}, err
		}
	}
	pl.unseededPath()
	pl.seedAndProgramme()
	pl.heat()
	pl.finishPath()
	temperatureWarnings(&res, b, &pl.warn)
	coldWarnings(&res, b, &pl.warn)
	pl.cautionNotes()

	res.Cautions, res.CautionKinds = pl.cautions.text, pl.cautions.kinds
	res.Warnings = pl.warn.list
	res.Sources = pl.srcs.list
	if err := res.checkFinite(); err != nil {
		return Result{}, err
	}
	return res, nil
}

// charge works out the charge to weigh and the composition of the batch.
func (pl *planner) charge() error {
	b, c, form, p, res := pl.b, pl.c, pl.form, pl.p, pl.res
	sD, segD, w, err := c.SolubilityField("dissolve_temp_C", b.DissolveTempC)
	if err != nil {
		return err
	}
	pl.warn.add(w)
	pl.srcs.add(segD.Curve.Source)
	res.SolubilityAtStart = sD
	pl.sD = sD

	var m float64
	switch {
	case b.ChargeG > 0:
		m = b.ChargeG
	case b.HasClearDown:
		// The saturation temperature is put ClearMarginK below the storage temperature.
		tc := b.ClearDownToC - b.ClearMarginK
		if tc > b.DissolveTempC {
			return unit.NumberError("clear_down_to_C", b.ClearDownToC,
				"a temperature at or below the dissolve temperature "+fmtC(b.DissolveTempC)+" plus the margin of "+
					unit.FormatCompact(b.ClearMarginK, 3)+" K")
		}
		_, segC, w, err := c.SolubilityField("clear_down_to_C", tc)
		if err != nil {
			var fe *unit.FieldError
			if errors.As(err, &fe) && b.ClearMarginK > 0 {
				fe.Allowed += " once the margin of " + unit.FormatCompact(b.ClearMarginK, 3) + " K is taken off"
			}
			return err
		}
		pl.warn.add(w)
		pl.srcs.add(segC.Curve.Source)
		g := lowestSolubility(c, tc, b.DissolveTempC)
		if err := clearOfIce(c, g, tc, b.ClearDownToC); err != nil {
			return err
		}
		if m, err = ChargeFor(form, p, b.WaterG, g, "clear_down_to_C"); err != nil {
			return err
		}
		res.HasClearDown, res.ClearDownToC = true, b.ClearDownToC
	default:
		q := b.SaturationPct
		if q == 0 {
			q = 100
		}
		if m, err = ChargeFor(form, p, b.WaterG, q/100*sD, "saturation_pct"); err != nil {
			return err
		}
	}
	S, Wt := Composition(form, p, m, b.WaterG)
	conc := 100 * S / Wt
	pl.m, pl.S, pl.Wt, pl.conc = m, S, Wt, conc
	res.ChargeG, res.SoluteG, res.TotalWaterG = m, S, Wt
	res.HydrateWaterG = Wt - b.WaterG
	res.ImpurityG = m * (1 - p)
	res.ConcentrationG100 = conc
	res.SaturationPct = 100 * conc / sD
	res.MinWaterG = MinWater(form, p, m, sD)
	if conc > sD*(1+1e-9) {
		most, _ := ChargeFor(form, p, b.WaterG, sD, "charge_g")
		return unit.NumberError("charge_g", m,
			"at most "+unit.FormatCompact(most, 4)+" g of "+form.Formula+" dissolves in "+unit.FormatCompact(b.WaterG, 4)+
				" g of water at "+fmtC(b.DissolveTempC)+"; this charge needs at least "+
				unit.FormatCompact(res.MinWaterG, 4)+" g of water")
	}
	freezingPoint(res, b, &pl.warn, &pl.srcs)
	if err := dissolveAboveFreezing(res, b); err != nil {
		return err
	}
	if res.MinWaterG == 0 {
		pl.warn.add("the water of crystallization of " + form.Formula + " alone dissolves this charge at " + fmtC(b.DissolveTempC))
	}
	res.Path = make([]PathPoint, 1, 6)
	res.Path[0] = point(PathDissolve, b.DissolveTempC, conc)
	return nil
}

// onset finds the direction of travel and the saturation (onset) temperature.
func (pl *planner) onset() error {
	b, c, res := pl.b, pl.c, pl.res
	minC, maxC := c.Range()
	if b.HasTarget {
		sT, segT, w, err := c.SolubilityField("cool_to_C", b.TargetC)
		if err != nil {
			return err
		}
		pl.sT, pl.segT = sT, segT
		pl.warn.add(w)
		pl.srcs.add(segT.Curve.Source)
		if b.TargetC > b.DissolveTempC {
			if !(sT < pl.sD) {
				return unit.NumberError("cool_to_C", b.TargetC,
					"a temperature below the dissolve temperature "+fmtC(b.DissolveTempC)+
						", or above it only where the solubility of "+c.ID+" is lower than there (retrograde)")
			}
			pl.heating = true
		}
	}
	if pl.heating {
		hi := math.Max(maxC, b.TargetC)
		res.SaturationTempC, res.HasOnset = Onset(c, pl.conc, b.DissolveTempC, hi)
		if !res.HasOnset {
			res.OnsetNote = "stays unsaturated on heating up to " + fmtC(hi) + " (end of the data)"
		}
	} else {
		// Down to the end of the data, or to a target in the extrapolated margin below it.
		lo := math.Min(minC, b.DissolveTempC)
		if b.HasTarget {
			lo = math.Min(lo, b.TargetC)
		}
		res.SaturationTempC, res.HasOnset = Onset(c, pl.conc, b.DissolveTempC, lo)
		if !res.HasOnset {
			res.OnsetNote = "stays unsaturated on cooling down to " + fmtC(lo) + " (end of the data)"
		}
	}
	if res.HasOnset {
		res.Path = append(res.Path, point(PathOnset, res.SaturationTempC, pl.conc))
	}
	return nil
}

// crashOut works out the equilibrium crystals and liquor at the target.
func (pl *planner) crashOut() error {
	b, c, res := pl.b, pl.c, pl.res
	if !b.HasTarget {
		return nil
	}
	S, Wt := pl.S, pl.Wt
	if b.EvaporatedWaterG >= Wt {
		return unit.NumberError("evaporated_water_g", b.EvaporatedWaterG,
			"less than the "+unit.FormatCompact(Wt, 4)+" g of water in the batch")
	}
	k, ok := CrashAt(pl.segT.Form, pl.sT, S, Wt-b.EvaporatedWaterG, b.TargetC)
	if !ok {
		return setsSolid(b, pl.segT.Form, pl.form, pl.p, S, Wt, pl.sD)
	}
	k, err := coldCrash(res, c, k, S, Wt-b.EvaporatedWaterG, &pl.warn)
	if err != nil {
		return err
	}
	res.HasTarget = true
	res.TargetC = b.TargetC
	res.EvaporatedWaterG = b.EvaporatedWaterG
	res.CrystalsG = k.CrystalsG
	res.CrystalPhase = k.Phase.Formula
	res.CrystalAnhydrousFrac = k.Phase.AnhydrousFraction
	res.YieldPct = 100 * k.CrystalsG * k.Phase.AnhydrousFraction / S
	res.LiquorSoluteG, res.LiquorWaterG = k.LiquorSoluteG, k.LiquorWaterG
	res.LiquorG = k.LiquorG()
	res.LiquorG100 = liquorG100(k, c)
	res.SolubilityAtTargetG100 = pl.sT
	res.PhaseChanges = phaseChanges(c, b.DissolveTempC, b.TargetC)
	for _, pc := range res.PhaseChanges {
		pl.warn.add("the stable solid changes from " + pc.From + " to " + pc.To + " at " + fmtC(pc.TempC) + " on the way")
	}
	if b.EvaporatedWaterG > 0 {
		pl.warn.add("the heat carried off by the evaporated water is not included in the cooling duty")
	}
	if k.CrystalsG == 0 && b.EvaporatedWaterG == 0 && res.HasOnset && !pl.heating && res.SaturationTempC > b.TargetC {
		// cannot happen for a curve that is consistent; kept as a guard
		pl.warn.add("no crystals at the target although the saturation temperature lies above it; check the curve")
	}
	return nil
}

// checkSeed checks seed_at_C before the unseeded path uses it.
func (pl *planner) checkSeed() error {
	b, c, res := pl.b, pl.c, pl.res
	if !b.HasSeedAt {
		return nil
	}
	_, segS, w, err := c.SolubilityField("seed_at_C", b.SeedAtC)
	if err != nil {
		return err
	}
	pl.warn.add(w)
	pl.srcs.add(segS.Curve.Source)
	if pl.heating || !res.HasOnset || !(b.SeedAtC < res.SaturationTempC) {
		allowed := "a temperature below the saturation temperature of the batch"
		if res.HasOnset && !pl.heating {
			allowed += ", " + fmtC(res.SaturationTempC)
		} else {
			allowed += "; this batch has none on cooling"
		}
		return unit.NumberError("seed_at_C", b.SeedAtC, allowed)
	}
	return nil
}

// unseededPath tabulates the supersaturation from the onset to the seed point or the
// target, and places the expected nucleation.
func (pl *planner) unseededPath() {
	b, c, res, conc := pl.b, pl.c, pl.res, pl.conc
	endC, hasEnd := 0.0, false
	switch {
	case b.HasSeedAt:
		endC, hasEnd = b.SeedAtC, true
	case b.HasTarget && !pl.heating:
		endC, hasEnd = b.TargetC, true
	}
	if res.HasOnset && !pl.heating && hasEnd && endC < res.SaturationTempC {
		on := res.SaturationTempC
		res.Supersaturation = make([]SupersaturationPoint, 1, pathPoints+1)
		res.Supersaturation[0] = SupersaturationPoint{TempC: on, Ratio: 1, DeltaG: 0}
		for i := 1; i <= pathPoints; i++ {
			t := on - (on-endC)*float64(i)/pathPoints
			s, _ := solAt(c, t)
			res.Supersaturation = append(res.Supersaturation, SupersaturationPoint{TempC: t, Ratio: conc / s, DeltaG: conc - s})
		}
	}
	if b.MetastableWidthK > 0 && res.HasOnset && !pl.heating {
		res.HasMetastable = true
		res.MetastableWidthK = b.MetastableWidthK
		res.NucleationC = res.SaturationTempC - b.MetastableWidthK
		if hasEnd && res.NucleationC >= endC {
			res.Path = append(res.Path, point(PathNucleation, res.NucleationC, conc))
		}
		switch {
		case b.HasSeedAt && b.SeedAtC < res.NucleationC:
			pl.warn.add("seed_at_C lies below the expected nucleation temperature " + fmtC(res.NucleationC) +
				" (saturation less the metastable width): the batch may crystallize on its own before it is seeded")
		case b.HasTarget && !b.HasSeedAt && res.CrystalsG > 0 && res.NucleationC < b.TargetC:
			pl.warn.add("unseeded, the batch may stay supersaturated down to " + fmtC(b.TargetC) +
				" (the metastable zone reaches " + fmtC(res.NucleationC) + "): seed it to get the crystals")
		}
	}
	if b.HasSeedAt {
		res.Path = append(res.Path, point(PathSeed, b.SeedAtC, conc))
	}
}

// seedAndProgramme suggests seeding and a cooling programme for a cooling batch that yields
// crystals.
func (pl *planner) seedAndProgramme() {
	b, c, res := pl.b, pl.c, pl.res
	if !(b.HasTarget && !pl.heating && res.HasOnset && res.CrystalsG > 0) {
		return
	}
	drop := 1.0
	if b.MetastableWidthK > 0 {
		drop = math.Min(drop, b.MetastableWidthK/2)
	}
	res.HasSeedHint = true
	res.SeedHintC = res.SaturationTempC - drop
	if res.SeedHintC < b.TargetC {
		res.SeedHintC = b.TargetC
		pl.warn.add("the seeding suggestion is held at the target " + fmtC(b.TargetC) +
			", less than " + unit.FormatCompact(drop, 2) + " K below the saturation temperature")
	}
	res.SeedPhase = c.SegmentAt(res.SeedHintC).Form.Formula
	res.SeedLowG = 0.01 * res.CrystalsG
	res.SeedHighG = 0.02 * res.CrystalsG
	res.SeedRule = seedRule
	pl.srcs.add(seedRule)
	if b.CoolingTimeMin > 0 && res.SeedHintC > b.TargetC {
		res.ProgrammeFromC, res.ProgrammeToC = res.SeedHintC, b.TargetC
		t0, tf := res.SeedHintC, b.TargetC
		res.Programme = make([]ProgrammeStep, 0, programmeRows+1)
		for i := 0; i <= programmeRows; i++ {
			u := float64(i) / programmeRows
			res.Programme = append(res.Programme, ProgrammeStep{
				TimeMin: b.CoolingTimeMin * u,
				LinearC: t0 - (t0-tf)*u,
				CubicC:  t0 - (t0-tf)*u*u*u,
			})
		}
		pl.srcs.add(programmeSource)
	}
}

// finishPath adds the insulated end and the target to the path.
func (pl *planner) finishPath() {
	b, res := pl.b, pl.res
	if res.HasAdiabatic {
		res.Path = append(res.Path, point(PathAdiabaticEnd, res.AdiabaticEndC, res.AdiabaticG100))
	}
	if res.HasTarget {
		res.Path = append(res.Path, point(PathEnd, res.TargetC, res.LiquorG100))
	}
	if b.WaterG > 0 && res.MinWaterG > 0 && res.SaturationPct > 99 {
		pl.warn.add("the batch is saturated at the dissolve temperature: any cooling or loss of water before filtering starts crystallization")
	}
}

// cautionNotes adds the strong caution of a toxic compound first, then the compound's note,
// the general cautions, and the SDS note last.
func (pl *planner) cautionNotes() {
	b, c, res := pl.b, pl.c, pl.res
	if c.Toxic {
		pl.cautions.add(CautionToxic, ToxicCaution(c))
	}
	pl.cautions.add(CautionHazard, c.Hazard)
	hottest := b.DissolveTempC
	if res.HasAdiabatic {
		hottest = math.Max(hottest, res.AdiabaticEndC)
	}
	if b.HasTarget {
		hottest = math.Max(hottest, b.TargetC)
	}
	if hottest > hotLiquidC {
		pl.cautions.add(CautionHot, "Hot liquid: the batch reaches "+fmtC(hottest)+". A spill scalds; use heat-resistant glassware, "+
			"eye protection and gloves, and never close a heated vessel (the "+unit.FormatCompact(hotLiquidC, 2)+
			" °C threshold is common practice).")
	}
	if res.HasAdiabatic && res.AdiabaticRiseK > strongThermalK {
		pl.cautions.add(CautionExotherm, "Strong exotherm: seeded, the insulated batch warms by "+unit.FormatCompact(res.AdiabaticRiseK, 3)+
			" K within minutes. Seed in an open vessel with room to stir, and expect a hot solid mass.")
	}
	if res.HasDissolutionHeat && math.Abs(res.DissolutionTempChangeK) > strongThermalK {
		if res.DissolutionTempChangeK < 0 {
			pl.cautions.add(CautionEndotherm, "Strong endotherm: dissolving the charge cools the batch by up to "+
				unit.FormatCompact(-res.DissolutionTempChangeK, 3)+" K; heat it while dissolving, and do not judge the temperature by touch.")
		} else {
			pl.cautions.add(CautionExotherm, "Strong exotherm: dissolving the charge heats the batch by up to "+
				unit.FormatCompact(res.DissolutionTempChangeK, 3)+" K; add the solid in portions with stirring.")
		}
	}
	if c.Oxidizer {
		pl.cautions.add(CautionOxidizer, c.ID+" is an oxidizer: keep the solid, its solutions and the crystals away from organic material "+
			"(paper, wood, cloth, sugar, solvents); residues dried onto organics burn fiercely.")
	}
	pl.cautions.add(CautionSDS, safetyNote)
}

// ToxicCaution is the strong caution carried by every plan (and preparation) of a compound
// flagged toxic (acutely toxic, carcinogen, mutagen or reproductive toxicant on its SDS).
func ToxicCaution(c *compound.Compound) string {
	return "TOXIC: " + c.Name + " (" + c.ID + ") is acutely toxic, a carcinogen, a mutagen or a reproductive toxicant " +
		"(see its SDS for which). Work with it only where you are trained and allowed to: gloves, eye protection and a " +
		"fume hood for any dust or spray, nothing eaten or drunk nearby. Crystals, mother liquor, rinses and spills are " +
		"hazardous waste under your local rules; never pour them down the drain. Read the SDS before you weigh it."
}

// cautionList collects cautions with their kinds, without repeats.
type cautionList struct {
	text  []string
	kinds []CautionKind
}

func (l *cautionList) add(k CautionKind, s string) {
	if s == "" {
		return
	}
	for _, x := range l.text {
		if x == s {
			return
		}
	}
	l.text = append(l.text, s)
	l.kinds = append(l.kinds, k)
}

// setsSolid explains a batch whose crystals at the target would take up all the water:
// the liquor is at least as rich as the solid phase itself. It names evaporated_water_g when
// the batch works without the evaporation, else the key that set the charge.
func setsSolid(b Batch, phase, form *compound.Form, p, S, Wt, sD float64) error {
	f := phase.AnhydrousFraction
	limit := 100 * f / (1 - f) // g per 100 g water: the phase's own composition
	why := " (" + phase.Formula + " holds " + unit.FormatCompact(limit, 4) + " g per 100 g of its own water; a richer batch sets solid at " + fmtC(b.TargetC) + ")"
	if b.EvaporatedWaterG > 0 && 100*S/Wt < limit {
		most := Wt - 100*S/limit
		return unit.NumberError("evaporated_water_g", b.EvaporatedWaterG,
			"less than "+unit.FormatCompact(most, 4)+" g of water evaporated"+why)
	}
	switch {
	case b.ChargeG > 0:
		most, _ := ChargeFor(form, p, b.WaterG, limit, "charge_g")
		return unit.NumberError("charge_g", b.ChargeG, "a charge below "+unit.FormatCompact(most, 4)+" g"+why)
	case b.HasClearDown:
		return unit.NumberError("clear_down_to_C", b.ClearDownToC, "a lower storage temperature, so the charge stays below "+
			unit.FormatCompact(limit, 4)+" g per 100 g water"+why)
	}
	q := b.SaturationPct
	if q == 0 {
		q = 100
	}
	return unit.NumberError("saturation_pct", q, "a saturation below "+unit.FormatCompact(100*limit/sD, 4)+" %"+why)
}

// Water freezes below 0 °C and boils above 100 °C at 101.325 kPa (99.97 °C on ITS-90,
// IAPWS-95, from memory). A solute moves both points, which Saltcast does not compute.
const (
	freezeC = 0.0
	boilC   = 100.0
)

// temperatureWarnings warns about every planned temperature where the liquor may freeze or
// boil: neither ice nor boiling is modelled.
func temperatureWarnings(res *Result, b Batch, warn *notes) {
	type named struct {
		key string
		t   float64
		ok  bool
	}
	for _, n := range [...]named{
		{"dissolve_temp_C", b.DissolveTempC, true},
		{"cool_to_C", b.TargetC, b.HasTarget},
		{"seed_at_C", b.SeedAtC, b.HasSeedAt},
		{"clear_down_to_C", b.ClearDownToC, b.HasClearDown},
		{"saturation temperature", res.SaturationTempC, res.HasOnset},
		{"adiabatic end temperature", res.AdiabaticEndC, res.HasAdiabatic},
	} {
		switch {
		case !n.ok:
		case n.t < freezeC && res.Compound.Freezing != nil:
			warn.add(coldNote(res, n.key, n.t))
		case n.t < freezeC:
			warn.add(n.key + " " + fmtC(n.t) + " is below 0 °C: the liquor may freeze there, and ice is not modelled " +
				"(the solute lowers the freezing point by an amount Saltcast does not compute; below the eutectic ice and salt separate together)")
		case n.t > boilC:
			warn.add(n.key + " " + fmtC(n.t) + " is above 100 °C, where water boils at 101.325 kPa: the liquor stays liquid only " +
				"if the solute raises its boiling point enough or the vessel is under pressure, which Saltcast does not model")
		}
	}
}

// phaseChanges lists the boundaries between stable phases crossed from fromC to toC.
func phaseChanges(c *compound.Compound, fromC, toC float64) []PhaseChange {
	var out []PhaseChange
	lo, hi := math.Min(fromC, toC), math.Max(fromC, toC)
	for i := 1; i < len(c.Segments); i++ {
		t := c.Segments[i].MinC
		if t <= lo || t >= hi {
			continue
		}
		cold, hot := c.Segments[i-1].Form.Formula, c.Segments[i].Form.Formula
		if cold == hot {
			continue
		}
		if toC < fromC {
			out = append(out, PhaseChange{TempC: t, From: hot, To: cold})
		} else {
			out = append(out, PhaseChange{TempC: t, From: cold, To: hot})
		}
	}
	if toC < fromC {
		for i, j := 0, len(out)-1; i < j; i, j = i+1, j-1 {
			out[i], out[j] = out[j], out[i]
		}
	}
	return out
}

func fmtC(t float64) string { return unit.FormatCompact(t, 4) + " °C" }

// checkFinite is the last guard: no NaN or ±Inf leaves the planner.
func (r *Result) checkFinite() error {
	ok := true
	chk := func(v float64) {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			ok = false
		}
	}
	for _, v := range [...]float64{r.PurityPct, r.ChargeG, r.WaterG, r.HydrateWaterG, r.TotalWaterG, r.SoluteG, r.ImpurityG,
		r.DissolveTempC, r.SolubilityAtStart, r.ConcentrationG100, r.SaturationPct, r.MinWaterG, r.ClearDownToC,
		r.SaturationTempC, r.TargetC, r.EvaporatedWaterG, r.CrystalsG, r.CrystalAnhydrousFrac, r.YieldPct,
		r.LiquorG, r.LiquorSoluteG, r.LiquorWaterG, r.LiquorG100, r.SolubilityAtTargetG100,
		r.MetastableWidthK, r.NucleationC, r.SeedHintC, r.SeedLowG, r.SeedHighG, r.ProgrammeFromC, r.ProgrammeToC,
		r.HeatCapacityKJPerK, r.DissolutionHeatKJ, r.DissolutionTempChangeK, r.DissolutionEnthalpyKJPerMol,
		r.CrystallizationHeatKJ, r.CrystalEnthalpyKJPerMol, r.ApparentEnthalpyKJPerMol, r.SensibleHeatKJ,
		r.CoolingDutyKJ, r.CoolingPowerW, r.CoolingTimeMin, r.SeedAtC, r.AdiabaticEndC, r.AdiabaticCrystalsG,
		r.AdiabaticRiseK, r.AdiabaticG100, r.CrystalEnthalpyLowKJPerMol, r.CrystallizationHeatLowKJ, r.AdiabaticHeatKJ,
		r.AdiabaticEnthalpyKJPerMol, r.AdiabaticHeatCapacityKJPerK, r.AdiabaticCrystalsLowG, r.AdiabaticEndLowC,
		r.FreezingPointC, r.IceG, r.IceHeatKJ, r.EutecticC, r.EutecticG100} {
		chk(v)
	}
	for _, p := range r.PhaseChanges {
		chk(p.TempC)
	}
	for _, p := range r.Supersaturation {
		chk(p.TempC)
		chk(p.Ratio)
		chk(p.DeltaG)
	}
	for _, p := range r.Programme {
		chk(p.TimeMin)
		chk(p.LinearC)
		chk(p.CubicC)
	}
	for _, p := range r.Path {
		chk(p.TempC)
		chk(p.G100)
	}
	if !ok {
		return ErrNotFinite
	}
	return nil
}

// waterHeatCapacity is c_p of water in kJ/(kg·K) at t, kept inside the 0–100 °C table.
func waterHeatCapacity(t float64) float64 {
	return water.HeatCapacityKJPerKgK(math.Max(0, math.Min(100, t)))
}
