package prep

import (
	"errors"
	"math"
	"slices"

	"saltcast/core/balance"
	"saltcast/core/compound"
	"saltcast/core/unit"
	"saltcast/core/water"
)

// Amount says what fixes the size of the batch.
type Amount int

// The ways to give the amount.
const (
	ByVolume Amount = iota + 1 // final volume of solution in mL, made up to the mark at the make-up temperature
	ByMass                     // final mass of solution in g
	ByWater                    // total water in the solution in g (added water plus any water of crystallization)
)

// Field returns the recipe key of the amount.
func (a Amount) Field() string {
	switch a {
	case ByVolume:
		return "final_volume_mL"
	case ByMass:
		return "final_mass_g"
	case ByWater:
		return "solvent_g"
	}
	return "amount"
}

// Spec is one preparation. Field names in errors are the recipe keys given in the comments.
type Spec struct {
	Compound  *compound.Compound
	Form      *compound.Form // "charged_form": the form on the shelf; nil = anhydrous; unused with a stock
	PurityPct float64        // "purity_pct": 0 < p ≤ 100; 0 means 100

	Concentration float64 // "concentration": > 0
	Unit          Unit    // "concentration_unit"

	Amount      Amount
	AmountValue float64 // "final_volume_mL", "final_mass_g" or "solvent_g"

	TempC float64 // "temp_C": make-up temperature, 0–100 °C

	HasStock           bool
	StockConcentration float64 // "stock_concentration"
	StockUnit          Unit    // "stock_unit"

	HasStoreAt bool
	StoreAtC   float64 // "store_at_C"
}

// Defaults and margins.
const (
	// DefaultTempC is the make-up temperature when none is given: volumetric glassware is
	// calibrated at 20 °C (ISO 1042, from memory).
	DefaultTempC = 20.0
	// StorageMarginK separates the saturation temperature from the "keep above" temperature.
	// Saltcast's own choice, not from a source: the same small, visible margin the batch
	// planner uses for clear_down_to_C.
	StorageMarginK = 2.0
	// heatNoteK is the temperature change on dissolving from which the plan tells the user to
	// wait for the solution to return to the make-up temperature before filling to the mark
	// (common practice: a 2 K error changes a dilute solution's volume by about 0.05 %, a
	// strong one's by about 0.1 %).
	heatNoteK = 2.0
	// strongThermalK is the change on dissolving that counts as a strong exo- or endotherm,
	// as in package balance (common practice).
	strongThermalK = 10.0
	// hotLiquidC: above this a spill scalds (common practice, as in package balance).
	hotLiquidC = 50.0
	// scanStepK is the step of the scans along the solubility curves, finer than any feature
	// of the library's curves; crossings are then refined by bisection.
	scanStepK = 0.25
)

// Sources and fixed notes.
const (
	atomicWeightsSource = "molar masses from the formulas with IUPAC/CIAAW standard atomic weights (2021, abridged)"
	safetyNote          = "Saltcast is a planning aid, not a safety assessment: read the SDS of every chemical and " +
		"follow your local rules and licensed practice."
	heatSource = "temperature change on dissolving: ΔsolH at infinite dilution and 25 °C over the heat capacity of the water " +
		"(water-equivalent model; approximate, common practice)"
)

// ErrNotFinite means the preparation produced NaN or ±Inf: a bug, not bad input.
var ErrNotFinite = errors.New("prep: the preparation produced a non-finite number; this is a bug, please report the recipe")

// Result is the worked preparation. Quantities that need the density are valid only when
// HasDensity; stock quantities only when HasStock; the form's only when HasForm.
type Result struct {
	Compound   *compound.Compound
	SoluteID   string
	SoluteName string
	Form       string // formula of the form weighed; "" with a stock
	PurityPct  float64

	Concentration float64
	Unit          Unit
	Amount        Amount
	AmountValue   float64
	TempC         float64

	MassFraction float64 // anhydrous solute in the solution
	SoluteG      float64 // anhydrous solute
	TotalWaterG  float64 // all the water in the solution
	SolutionG    float64

	HasForm       bool
	FormG         float64 // to weigh
	HydrateWaterG float64 // water brought by a hydrate
	ImpurityG     float64

	HasStock          bool
	StockMassFraction float64
	StockG            float64
	HasStockVolume    bool
	StockML           float64 // at TempC

	WaterG      float64 // water to add
	WaterML     float64 // at TempC
	WaterApprox bool    // filled to the mark: the water is what the density data predict

	HasDensity     bool
	DensityKgPerM3 float64 // at TempC
	DensityErrPct  float64 // stated bound (see DensityErrorPct)
	DensitySource  string
	SolutionML     float64 // at TempC

	// The concentration in every unit; the per-volume ones only with HasDensity.
	MolPerL, MmolPerL, GPerL, MgPerL, PctWV float64
	PctWW, MolPerKg, GPer100gWater          float64

	SolubilityG100 float64 // of the stable solid at TempC, g anhydrous per 100 g water
	StablePhase    string  // the solid in equilibrium at TempC
	SaturationPct  float64 // at TempC
	Supersaturated bool    // stronger than saturated at TempC

	HasSaturationTemp bool
	SaturationTempC   float64 // see the package doc
	HasFreezingPoint  bool
	FreezingPointC    float64 // where ice starts to form from the solution as made
	HasKeepAbove      bool
	KeepAboveC        float64 // the higher of SaturationTempC and FreezingPointC, + StorageMarginK
	ClearDownToC      float64 // with !HasSaturationTemp: clear down to this end of the data
	HasWarmLimit      bool
	CrystallizesAbove float64 // retrograde solubility: saturates on warming here

	HasStoreAt   bool
	StoreAtC     float64
	ClearAtStore bool

	HasDissolveHeat bool
	DissolveChangeK float64 // temperature change on dissolving the form (water-equivalent model)

	Cautions     []string
	CautionKinds []balance.CautionKind // CautionKinds[i] is the kind of Cautions[i], as in a plan
	Warnings     []string
	Sources      []string
}

// notes collects text without repeats, in order.
type notes struct{ list []string }

func (n *notes) add(s string) {
	if s == "" || slices.Contains(n.list, s) {
		return
	}
	n.list = append(n.list, s)
}

// cautionNotes collects cautions with their kinds, without repeats, in order.
type cautionNotes struct {
	notes
	kinds []balance.CautionKind
}

func (n *cautionNotes) add(k balance.CautionKind, s string) {
	before := len(n.list)
	n.notes.add(s)
	if len(n.list) > before {
		n.kinds = append(n.kinds, k)
	}
}

// Plan works out a preparation. Errors are *unit.FieldError values naming the recipe key.
func Plan(s Spec) (Result, error) {
	c := s.Compound
	if c == nil || len(c.Segments) == 0 {
		return Result{}, errors.New("prep: Plan needs a compound")
	}
	res := Result{Compound: c, SoluteID: c.ID, SoluteName: c.Name, Concentration: s.Concentration, Unit: s.Unit,
		Amount: s.Amount, AmountValue: s.AmountValue, TempC: s.TempC}
	if err := s.check(); err != nil {
		return Result{}, err
	}
	var warn, srcs notes
	var cautions cautionNotes
	if c.Toxic {
		cautions.add(balance.CautionToxic, balance.ToxicCaution(c))
	}
	M := c.MolarMassGPerMol
	T := s.TempC
	display := unit.FormatCompact(s.Concentration, 6) + " " + string(s.Unit)

	// The target as a mass fraction.
	w, ok := MassFraction(s.Concentration, s.Unit, M)
	if !ok {
		if !c.HasDensity() {
			return Result{}, noDensity(c, "concentration_unit", string(s.Unit))
		}
		var err error
		if w, err = solveMassFraction(c, s.Concentration*s.Unit.gPerLFactor(M), T, "concentration", display); err != nil {
			return Result{}, err
		}
	}
	if !(w > 0 && w < 1) {
		return Result{}, unit.NumberError("concentration", s.Concentration, "a concentration below that of the pure solute")
	}
	res.MassFraction = w

	// Solubility at the make-up temperature.
	sat, seg, sw, err := c.SolubilityField("temp_C", T)
	if err != nil {
		return Result{}, err
	}
	warn.add(sw)
	srcs.add(seg.Curve.Source)
	srcs.add(atomicWeightsSource)
	res.SolubilityG100, res.StablePhase = sat, seg.Form.Formula

	// The density, where the data reach.
	if c.HasDensity() {
		rho, dw, err := SolutionDensity(c, w, T)
		switch {
		case err == nil:
			res.HasDensity, res.DensityKgPerM3 = true, rho
			res.DensityErrPct = DensityErrorPct(w, T)
			res.DensitySource = c.DensitySource()
			if math.Abs(T-densityRefC) > densityQuietC {
				res.DensitySource += "; " + scalingSource
			}
			warn.add(dw)
			srcs.add(c.DensitySource())
		case s.Amount == ByVolume:
			return Result{}, &unit.FieldError{Field: "concentration", Value: display, Allowed: "a solution the density data cover: " + allowedOf(err)}
		default:
			warn.add("no solution density for this concentration (" + allowedOf(err) + "): volumes and per-volume concentrations are left out")
		}
	} else if s.Amount == ByVolume {
		return Result{}, noDensity(c, "final_volume_mL", unit.FormatCompact(s.AmountValue, 6))
	}

	// The solution mass.
	var m float64
	switch s.Amount {
	case ByVolume:
		m = s.AmountValue * res.DensityKgPerM3 / 1000
		res.WaterApprox = true
	case ByMass:
		m = s.AmountValue
	case ByWater:
		m = s.AmountValue / (1 - w)
	}
	res.SolutionG = m
	res.SoluteG = w * m
	res.TotalWaterG = m - res.SoluteG
	if res.HasDensity {
		res.SolutionML = 1000 * m / res.DensityKgPerM3
	}
	if s.Amount == ByVolume {
		res.SolutionML = s.AmountValue // exactly as asked
	}
	rhoWater := water.DensityKgPerM3(T) / 1000 // g/mL
	srcs.add(DensityDataSource)

	if s.HasStock {
		if err := res.fromStock(s, &warn); err != nil {
			return Result{}, err
		}
	} else {
		if err := res.fromForm(s, display, &warn, &cautions); err != nil {
			return Result{}, err
		}
	}
	res.WaterML = res.WaterG / rhoWater
	if res.WaterApprox {
		warn.add("fill to the mark at " + unit.FormatCompact(T, 4) + " °C: the water figure is what the density data predict (about " +
			unit.FormatCompact(res.WaterML, 4) + " mL), not a volume to measure in")
	}

	// The concentration in every unit.
	res.PctWW = 100 * w
	res.MolPerKg = FromMassFraction(w, MolPerKg, M, 0)
	res.GPer100gWater = 100 * w / (1 - w)
	if res.HasDensity {
		rho := res.DensityKgPerM3
		res.MolPerL = FromMassFraction(w, MolPerL, M, rho)
		res.MmolPerL = FromMassFraction(w, MmolPerL, M, rho)
		res.GPerL = FromMassFraction(w, GPerL, M, rho)
		res.MgPerL = FromMassFraction(w, MgPerL, M, rho)
		res.PctWV = FromMassFraction(w, PctWV, M, rho)
	}

	res.saturation(s, &warn)
	res.freezing(&warn, &srcs)
	if s.HasStoreAt {
		if err := res.storage(s, &warn); err != nil {
			return Result{}, err
		}
	}

	// Cautions: the compound's note, the general ones, the SDS last.
	cautions.add(balance.CautionHazard, c.Hazard)
	if T > hotLiquidC {
		cautions.add(balance.CautionHot, "Hot liquid: the solution is made up at "+unit.FormatCompact(T, 4)+" °C. A spill scalds; use heat-resistant glassware, "+
			"gloves and eye protection, and note that volumetric glassware is not made for heating.")
	}
	if c.Oxidizer {
		cautions.add(balance.CautionOxidizer, c.ID+" is an oxidizer: keep the solid, its solutions and any dried residue away from organic material "+
			"and fuels; do not let spills dry on paper, wood or cloth.")
	}
	cautions.add(balance.CautionSDS, safetyNote)
	if res.HasDissolveHeat {
		srcs.add(heatSource)
	}

	res.Cautions, res.CautionKinds, res.Warnings, res.Sources = cautions.list, cautions.kinds, warn.list, srcs.list
	if !res.finite() {
		return Result{}, ErrNotFinite
	}
	return res, nil
}

// check validates the numbers of a Spec; the decoder has checked them already, so this
// guards callers that build a Spec by hand.
func (s Spec) check() error {
	if _, err := ParseUnit("concentration_unit", string(s.Unit)); err != nil {
		return err
	}
	if !(s.Concentration > 0 && s.Concentration < 1e9) {
		return unit.NumberError("concentration", s.Concentration, "a concentration > 0")
	}
	if s.Unit == PctWW && !(s.Concentration < 100) {
		return unit.NumberError("concentration", s.Concentration, "a mass per cent > 0 and below 100")
	}
	if s.Amount < ByVolume || s.Amount > ByWater {
		return &unit.FieldError{Field: "final_volume_mL", Value: "", Allowed: "exactly one of final_volume_mL, final_mass_g and solvent_g"}
	}
	if !(s.AmountValue >= 1e-3 && s.AmountValue <= 1e7) {
		return unit.NumberError(s.Amount.Field(), s.AmountValue, "an amount from 0.001 to 1e7")
	}
	if !(s.TempC >= water.MinC && s.TempC <= water.MaxC) {
		return unit.NumberError("temp_C", s.TempC, "a make-up temperature from 0 to 100 °C")
	}
	if s.PurityPct != 0 && !(s.PurityPct > 0 && s.PurityPct <= 100) {
		return unit.NumberError("purity_pct", s.PurityPct, "a percentage > 0 and ≤ 100")
	}
	if s.HasStock {
		if _, err := ParseUnit("stock_unit", string(s.StockUnit)); err != nil {
			return err
		}
		if !(s.StockConcentration > 0 && s.StockConcentration < 1e9) {
			return unit.NumberError("stock_concentration", s.StockConcentration, "a concentration > 0")
		}
	}
	if s.HasStoreAt && !(s.StoreAtC >= -40 && s.StoreAtC <= 150) {
		return unit.NumberError("store_at_C", s.StoreAtC, "a temperature from −40 to 150 °C")
	}
	return nil
}

// fromForm works out the weighing of the shelf form.
func (res *Result) fromForm(s Spec, display string, warn *notes, cautions *cautionNotes) error {
	form := s.Form
	if form == nil {
		form = res.Compound.Anhydrous()
	}
	purityPct := s.PurityPct
	if purityPct == 0 {
		purityPct = 100
	}
	p := purityPct / 100
	f := form.AnhydrousFraction
	pure := res.SoluteG / f
	res.HasForm, res.Form, res.PurityPct = true, form.Formula, purityPct
	res.FormG = pure / p
	res.ImpurityG = res.FormG - pure
	res.HydrateWaterG = pure - res.SoluteG
	res.WaterG = res.TotalWaterG - res.HydrateWaterG
	if res.WaterG < -1e-9*res.SolutionG {
		return &unit.FieldError{Field: "concentration", Value: display,
			Allowed: "at most " + unit.FormatCompact(100*f, 4) + " % w/w from " + form.Formula +
				" (the hydrate dissolved in its own water of crystallization); weigh the anhydrous form for a stronger solution"}
	}
	res.WaterG = math.Max(0, res.WaterG)
	if form.HasEnthalpy {
		n := pure / form.MolarMassGPerMol
		heatKJ := n * form.SolutionEnthalpyKJPerMol // positive: absorbed
		cKJPerK := res.TotalWaterG / 1000 * water.HeatCapacityKJPerKgK(res.TempC)
		res.HasDissolveHeat = true
		res.DissolveChangeK = -heatKJ / cKJPerK
		d := res.DissolveChangeK
		word := "cools"
		if d > 0 {
			word = "warms"
		}
		if math.Abs(d) >= heatNoteK {
			warn.add("dissolving " + form.Formula + " " + word + " the solution by about " + unit.FormatCompact(math.Abs(d), 2) +
				" K: let it return to " + unit.FormatCompact(res.TempC, 4) + " °C before filling to the mark")
		}
		if math.Abs(d) >= strongThermalK {
			kind, ck := "endotherm", balance.CautionEndotherm
			if d > 0 {
				kind, ck = "exotherm", balance.CautionExotherm
			}
			cautions.add(ck, "Strong "+kind+": dissolving "+form.Formula+
				" "+word+" the solution by about "+unit.FormatCompact(math.Abs(d), 2)+
				" K. Add the solid in portions to most of the water, stirring, in a beaker rather than the flask.")
		}
	}
	return nil
}

// fromStock works out the dilution of a stock of the same solute.
func (res *Result) fromStock(s Spec, warn *notes) error {
	c := res.Compound
	M := c.MolarMassGPerMol
	T := res.TempC
	display := unit.FormatCompact(s.StockConcentration, 6) + " " + string(s.StockUnit)
	ws, ok := MassFraction(s.StockConcentration, s.StockUnit, M)
	if !ok {
		if !c.HasDensity() {
			return noDensity(c, "stock_unit", string(s.StockUnit))
		}
		var err error
		if ws, err = solveMassFraction(c, s.StockConcentration*s.StockUnit.gPerLFactor(M), T, "stock_concentration", display); err != nil {
			return err
		}
	}
	if !(ws > res.MassFraction && ws < 1) {
		return &unit.FieldError{Field: "stock_concentration", Value: display,
			Allowed: "a stock stronger than the target (" + unit.FormatCompact(100*res.MassFraction, 4) + " % w/w; the stock is " +
				unit.FormatCompact(100*ws, 4) + " % w/w)"}
	}
	res.HasStock, res.StockMassFraction = true, ws
	res.StockG = res.SoluteG / ws
	res.WaterG = res.SolutionG - res.StockG
	if c.HasDensity() {
		if rho, _, err := SolutionDensity(c, ws, T); err == nil {
			res.HasStockVolume = true
			res.StockML = 1000 * res.StockG / rho
		} else {
			warn.add("no density for the stock (" + allowedOf(err) + "): weigh it, " + unit.FormatCompact(res.StockG, 4) + " g")
		}
	}
	if sat, _, _, err := c.SolubilityField("temp_C", T); err == nil && 100*ws/(1-ws) > sat*(1+satTol) {
		warn.add("the stock is stronger than saturated at " + unit.FormatCompact(T, 4) + " °C and may hold crystals: " +
			"warm and stir it until clear before measuring it out, or weigh it")
	}
	return nil
}

// satTol is the relative amount by which a concentration must exceed the solubility to count
// as supersaturated: far below what any balance or flask resolves, above rounding.
const satTol = 1e-9

// saturation fills the saturation percentage, the saturation temperature and the storage
// limit at the make-up temperature.
func (res *Result) saturation(s Spec, warn *notes) {
	c := res.Compound
	T := res.TempC
	g := res.GPer100gWater
	res.SaturationPct = 100 * g / res.SolubilityG100
	lo, hi := c.Range()
	if g > res.SolubilityG100*(1+satTol) {
		res.Supersaturated = true
		most := res.describe(res.SolubilityG100, T)
		if t, ok := firstClear(c, g, T, hi); ok {
			res.HasSaturationTemp, res.SaturationTempC = true, t
			res.HasKeepAbove, res.KeepAboveC = true, t+StorageMarginK
			warn.add("above saturation at " + unit.FormatCompact(T, 4) + " °C (" + unit.FormatCompact(res.SaturationPct, 4) +
				" % of saturation): the solid will not all dissolve. Make it at most " + most + ", or warm it above " +
				unit.FormatCompact(t, 3) + " °C to dissolve, make it up and keep it above " + unit.FormatCompact(t+StorageMarginK, 3) +
				" °C; it crystallizes on cooling below " + unit.FormatCompact(t, 3) + " °C")
		} else if t, ok := firstClear(c, g, T, lo); ok {
			res.HasSaturationTemp, res.SaturationTempC = true, t
			warn.add("above saturation at " + unit.FormatCompact(T, 4) + " °C (" + unit.FormatCompact(res.SaturationPct, 4) +
				" % of saturation); its solubility falls on warming, so it dissolves only below " + unit.FormatCompact(t, 3) +
				" °C. Make it at most " + most)
		} else {
			warn.add("above saturation at " + unit.FormatCompact(T, 4) + " °C (" + unit.FormatCompact(res.SaturationPct, 4) +
				" % of saturation) and at every temperature of the data (" + unit.FormatCompact(lo, 3) + "–" + unit.FormatCompact(hi, 3) +
				" °C): it cannot be made. Make it at most " + most)
		}
		return
	}
	if T > lo {
		if t, ok := balance.Onset(c, g, T, lo); ok {
			res.HasSaturationTemp, res.SaturationTempC = true, t
			res.HasKeepAbove, res.KeepAboveC = true, t+StorageMarginK
		} else {
			res.ClearDownToC = lo
			warn.add("stays unsaturated down to " + unit.FormatCompact(lo, 3) + " °C, the cold end of the solubility data")
		}
	} else {
		res.ClearDownToC = T
	}
	if T < hi {
		if t, ok := balance.Onset(c, g, T, hi); ok && t > T {
			res.HasWarmLimit, res.CrystallizesAbove = true, t
			warn.add("the solubility of " + c.ID + " falls on warming: this solution crystallizes above " + unit.FormatCompact(t, 3) +
				" °C; do not heat it")
		}
	}
	if res.HasKeepAbove && res.KeepAboveC > T {
		warn.add("the saturation temperature (" + unit.FormatCompact(res.SaturationTempC, 3) + " °C) is within " +
			unit.FormatCompact(StorageMarginK, 2) + " K of the make-up temperature: the solution is nearly saturated and may crystallize on standing")
	}
}

// storage checks the storage temperature against crystallization and freezing; either is
// a warning and makes ClearAtStore false.
func (res *Result) storage(s Spec, warn *notes) error {
	c := res.Compound
	S := s.StoreAtC
	res.HasStoreAt, res.StoreAtC = true, S
	_, _, sw, err := c.SolubilityField("store_at_C", S)
	if err != nil {
		return err
	}
	warn.add(sw)
	low := lowestSolubility(c, math.Min(S, res.TempC), math.Max(S, res.TempC))
	crystallizes := res.GPer100gWater > low*(1+satTol) || res.Supersaturated
	freezes := res.HasFreezingPoint && S < res.FreezingPointC
	res.ClearAtStore = !crystallizes && !freezes
	fp := unit.FormatCompact(res.FreezingPointC, 3)
	switch {
	case freezes:
		warn.add("stored at " + unit.FormatCompact(S, 3) + " °C it freezes: ice forms below " + fp +
			" °C, the freezing point of this solution; store it above " + unit.FormatCompact(res.FreezingPointC+StorageMarginK, 3) +
			" °C. Ice concentrates what is left, which may then crystallize the salt too, and can crack the bottle")
	case res.HasFreezingPoint && S < res.FreezingPointC+StorageMarginK:
		warn.add("stored at " + unit.FormatCompact(S, 3) + " °C it is only " + unit.FormatCompact(S-res.FreezingPointC, 2) +
			" K above its freezing point (" + fp + " °C): a colder spell freezes it")
	case !res.HasFreezingPoint && S <= 0:
		warn.add("stored at " + unit.FormatCompact(S, 3) + " °C, at or below the freezing point of water: the solution may freeze " +
			"(its own freezing point is not known here)")
	}
	switch {
	case crystallizes:
		warn.add("stored at " + unit.FormatCompact(S, 3) + " °C it crystallizes: make it at most " + res.describe(low, res.TempC) +
			" (saturated at " + unit.FormatCompact(S, 3) + " °C; leave a margin below that), or store it warmer")
	case res.HasSaturationTemp && S < res.SaturationTempC+StorageMarginK:
		warn.add("stored at " + unit.FormatCompact(S, 3) + " °C it is only " + unit.FormatCompact(S-res.SaturationTempC, 2) +
			" K above its saturation temperature: a colder spell or some evaporation crystallizes it")
	}
	return nil
}

// freezing fills the freezing point of the solution as made, from the compound's freezing
// curve (package compound: linear between published depressions, never extrapolated), and
// raises the keep-above temperature to it plus StorageMarginK. Without data it warns.
func (res *Result) freezing(warn, srcs *notes) {
	c := res.Compound
	fz := c.Freezing
	g := res.GPer100gWater
	if fz == nil {
		warn.add("no freezing-point data for " + c.ID + " in the library: the solution freezes below 0 °C, " +
			"but Saltcast cannot say how far below; do not store it below 0 °C")
		return
	}
	t, ok := fz.TempC(g)
	if !ok {
		if fz.HasEutectic {
			warn.add("richer than the eutectic liquor (" + unit.FormatCompact(fz.EutecticG100, 3) + " g per 100 g water): on cooling, " +
				fz.EutecticForm.Formula + " crystallizes before any ice forms, down to the eutectic at " + unit.FormatCompact(fz.EutecticC, 3) + " °C")
			return
		}
		warn.add("richer than the freezing-point data of " + c.ID + " reach (" + unit.FormatCompact(fz.MaxG100(), 3) +
			" g per 100 g water): its freezing point is not known, only that it lies below " + unit.FormatCompact(fz.LowestC(), 3) + " °C")
		return
	}
	res.HasFreezingPoint, res.FreezingPointC = true, t
	srcs.add(fz.Source)
	if k := t + StorageMarginK; !res.HasKeepAbove || k > res.KeepAboveC {
		res.HasKeepAbove, res.KeepAboveC = true, k
	}
}

// describe gives the concentration of a solution holding g100 g per 100 g water in the
// target's unit, with the density at tempC, or in % w/w where the density data stop.
func (res *Result) describe(g100, tempC float64) string {
	w := g100 / (100 + g100)
	u := res.Unit
	rho := 0.0
	if u.PerVolume() {
		r, _, err := SolutionDensity(res.Compound, w, tempC)
		if err != nil {
			return unit.FormatCompact(100*w, 4) + " % w/w"
		}
		rho = r
	}
	return unit.FormatCompact(FromMassFraction(w, u, res.Compound.MolarMassGPerMol, rho), 4) + " " + string(u)
}

// solAt is the stable phase's solubility at t, which callers keep inside the data range
// (with its margin) already checked.
func solAt(c *compound.Compound, t float64) float64 {
	return c.SegmentAt(t).Curve.Model.Value(t)
}

// firstClear returns the first temperature from fromC toward toC (both inside the checked
// range) at which the solubility reaches g100, refined by bisection to 1e-9 K.
func firstClear(c *compound.Compound, g100, fromC, toC float64) (float64, bool) {
	if fromC == toC {
		return 0, false
	}
	n := int(math.Ceil(math.Abs(toC-fromC) / scanStepK))
	prev := fromC
	for k := 1; k <= n; k++ {
		t := fromC + (toC-fromC)*float64(k)/float64(n)
		if solAt(c, t) >= g100 {
			a, b := prev, t // not clear at a, clear at b
			for range 100 {
				if math.Abs(b-a) < 1e-9 {
					break
				}
				mid := 0.5 * (a + b)
				if solAt(c, mid) >= g100 {
					b = mid
				} else {
					a = mid
				}
			}
			return b, true
		}
		prev = t
	}
	return 0, false
}

// lowestSolubility is the lowest solubility met between loC and hiC.
func lowestSolubility(c *compound.Compound, loC, hiC float64) float64 {
	m := math.Min(solAt(c, loC), solAt(c, hiC))
	n := int(math.Ceil((hiC - loC) / scanStepK))
	for k := 1; k < n; k++ {
		m = math.Min(m, solAt(c, loC+(hiC-loC)*float64(k)/float64(n)))
	}
	return m
}

// allowedOf gives the Allowed text of a *unit.FieldError, or the error's text.
func allowedOf(err error) string {
	var fe *unit.FieldError
	if errors.As(err, &fe) {
		return fe.Allowed
	}
	return err.Error()
}

// finite reports whether every number of the result is finite.
func (res *Result) finite() bool {
	for _, v := range []float64{res.MassFraction, res.SoluteG, res.TotalWaterG, res.SolutionG, res.FormG, res.HydrateWaterG,
		res.ImpurityG, res.StockMassFraction, res.StockG, res.StockML, res.WaterG, res.WaterML, res.DensityKgPerM3,
		res.DensityErrPct, res.SolutionML, res.MolPerL, res.MmolPerL, res.GPerL, res.MgPerL, res.PctWV, res.PctWW,
		res.MolPerKg, res.GPer100gWater, res.SolubilityG100, res.SaturationPct, res.SaturationTempC, res.KeepAboveC,
		res.ClearDownToC, res.CrystallizesAbove, res.DissolveChangeK, res.FreezingPointC} {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}
