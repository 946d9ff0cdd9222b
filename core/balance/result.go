package balance

import "saltcast/core/compound"

// Result is everything the planner works out for one batch. Masses are grams, temperatures
// °C, heats kJ; concentrations are g of anhydrous solute per 100 g of water. Fields behind a
// Has… flag are meaningful only when it is true. No field is ever NaN or ±Inf: Plan turns
// such a value into an error.
type Result struct {
	Compound    *compound.Compound // the solute, with its curve segments (for charts)
	SoluteID    string             // compound id, e.g. "CuSO4"
	SoluteName  string             // e.g. "copper(II) sulfate"
	ChargedForm string             // formula of the form weighed, e.g. "CuSO4·5H2O"
	PurityPct   float64

	// The charge and the water.
	ChargeG           float64 // grams of the charged form to weigh (including impurities)
	WaterG            float64 // water added
	HydrateWaterG     float64 // water brought in by the hydrate's water of crystallization
	TotalWaterG       float64 // WaterG + HydrateWaterG
	SoluteG           float64 // anhydrous solute dissolved
	ImpurityG         float64 // inert, insoluble impurity in the charge (filtered off with the crystals)
	DissolveTempC     float64
	SolubilityAtStart float64 // saturation at the dissolve temperature, g/100 g water
	ConcentrationG100 float64 // the batch, g/100 g water
	SaturationPct     float64 // % of saturation at the dissolve temperature
	MinWaterG         float64 // least water (added) that dissolves this charge at the dissolve temperature
	ClearDownToC      float64 // the storage temperature the charge was sized for (HasClearDown)
	HasClearDown      bool

	// Saturation (onset) temperature: crystals can form beyond it on the way to the target.
	HasOnset        bool
	SaturationTempC float64
	OnsetNote       string // why there is no onset, when HasOnset is false

	// Crash-out at the target temperature.
	HasTarget              bool
	TargetC                float64
	EvaporatedWaterG       float64
	CrystalsG              float64 // mass of the stable solid phase (hydrate water included)
	CrystalPhase           string  // formula of that phase, e.g. "Na2SO4·10H2O"
	CrystalAnhydrousFrac   float64 // anhydrous mass fraction of that phase
	YieldPct               float64 // anhydrous solute in the crystals / anhydrous solute charged × 100
	LiquorG                float64 // mother liquor: solute + water
	LiquorSoluteG          float64
	LiquorWaterG           float64
	LiquorG100             float64 // mother liquor concentration, g/100 g water
	SolubilityAtTargetG100 float64
	PhaseChanges           []PhaseChange

	// The cold side (ice.go). FreezingPointC is where ice starts to form from the solution as
	// made (HasFreezing: the freezing data cover it). IceG is the ice at the target (HasIce: the
	// target is below 0 °C and the compound has freezing data; 0 = none); Frozen means the
	// target is below the eutectic and no liquor is left. The eutectic is the compound's.
	HasFreezing    bool
	FreezingPointC float64
	HasIce         bool
	IceG           float64
	Frozen         bool
	HasEutectic    bool
	EutecticC      float64
	EutecticG100   float64
	EutecticPhase  string

	// Unseeded path and seeding.
	Supersaturation  []SupersaturationPoint // from the onset to the target (or to seed_at_C)
	HasMetastable    bool
	MetastableWidthK float64
	NucleationC      float64 // onset − width: nucleation expected about here, unseeded
	HasSeedHint      bool
	SeedHintC        float64 // suggested seeding temperature
	SeedLowG         float64 // suggested seed mass, low end
	SeedHighG        float64 // suggested seed mass, high end
	SeedPhase        string
	SeedRule         string // the rule used, with its source

	// Cooling programme (time → set-point) from ProgrammeFromC to ProgrammeToC.
	Programme      []ProgrammeStep
	ProgrammeFromC float64
	ProgrammeToC   float64

	// Heat. Positive DissolutionHeatKJ = the batch absorbs heat while dissolving; positive
	// CrystallizationHeatKJ = released by the crystals forming.
	HeatCapacityKJPerK          float64 // batch (liquor + vessel) before crystals form
	HeatCapacityModel           string  // the model, with its sources, beside the figure
	HasDissolutionHeat          bool
	DissolutionHeatKJ           float64
	DissolutionTempChangeK      float64 // if insulated: negative = the batch cools
	DissolutionEnthalpyKJPerMol float64 // of the charged form
	CrystallizationHeatKJ       float64
	CrystalEnthalpyKJPerMol     float64 // of the crystal phase, the design value (the safe end of the range)
	ApparentEnthalpyKJPerMol    float64 // van 't Hoff, from the curve slope (HasApparent)
	HasApparent                 bool
	EnthalpyBasis               string // which enthalpy is used and why, with every estimate and its source

	// The crystallization heat basis and the range of the estimates behind the design value.
	HeatBasis                  HeatBasis // short name of the basis of the central estimate
	CrystalEnthalpyLowKJPerMol float64   // lowest best estimate; equals the design value when they agree
	CrystallizationHeatLowKJ   float64   // the crystallization heat with the lowest best estimate
	SensibleHeatKJ             float64
	IceHeatKJ                  float64 // released by the ice that freezes at the target (HasIce)
	CoolingDutyKJ              float64 // SensibleHeatKJ + CrystallizationHeatKJ + IceHeatKJ
	HasCoolingPower            bool
	CoolingPowerW              float64 // mean over the cooling time
	CoolingTimeMin             float64

	// Seeded in an insulated vessel at SeedAtC.
	HasAdiabatic       bool
	SeedAtC            float64
	AdiabaticEndC      float64
	AdiabaticCrystalsG float64
	AdiabaticRiseK     float64
	AdiabaticPhase     string
	AdiabaticG100      float64 // liquor concentration at the end, g per 100 g water
	AdiabaticBasis     string  // the enthalpy used
	// The insulated balance: AdiabaticHeatKJ released by the crystals equals
	// AdiabaticHeatCapacityKJPerK × AdiabaticRiseK taken up by slurry and vessel.
	AdiabaticHeatKJ             float64
	AdiabaticEnthalpyKJPerMol   float64 // heat released per mol of the phase, the design value
	AdiabaticHeatCapacityKJPerK float64
	AdiabaticHeld               bool    // the temperature holds at the end of the seeded phase's range
	AdiabaticCrystalsLowG       float64 // crystals with the lowest best estimate of the heat
	AdiabaticEndLowC            float64 // end temperature with the lowest best estimate

	// Points for a chart of concentration against temperature, in path order.
	Path []PathPoint

	Cautions     []string
	CautionKinds []CautionKind // CautionKinds[i] is the kind of Cautions[i]
	Warnings     []string
	Sources      []string
}

// CautionKind sorts cautions so that code tests the kind, never the wording.
type CautionKind string

// The kinds of caution.
const (
	CautionToxic     CautionKind = "toxic"      // the compound is flagged toxic: the strong caution, first of all
	CautionHazard    CautionKind = "hazard"     // the compound's own hazard note (points to the SDS)
	CautionHot       CautionKind = "hot-liquid" // the batch gets hot enough to scald
	CautionExotherm  CautionKind = "exotherm"   // an insulated batch warms strongly
	CautionEndotherm CautionKind = "endotherm"  // dissolving cools the batch strongly
	CautionOxidizer  CautionKind = "oxidizer"   // keep from organics
	CautionSDS       CautionKind = "sds"        // read the SDS, local rules, licensed practice
)

// HasCaution reports whether a caution of kind k applies.
func (r *Result) HasCaution(k CautionKind) bool {
	for _, x := range r.CautionKinds {
		if x == k {
			return true
		}
	}
	return false
}

// PointsToSDS reports whether the cautions send the reader to the SDS (the general safety
// note, or the compound's hazard note, which always ends by pointing there).
func (r *Result) PointsToSDS() bool { return r.HasCaution(CautionSDS) || r.HasCaution(CautionHazard) }

// PhaseChange is a change of the stable solid phase crossed between the dissolve and the
// target temperature.
type PhaseChange struct {
	TempC    float64
	From, To string // formulas of the stable solid before and after, in path order
}

// SupersaturationPoint is the state of the unseeded liquor at one temperature.
type SupersaturationPoint struct {
	TempC  float64
	Ratio  float64 // S = c / c*(T)
	DeltaG float64 // ΔC = c − c*(T), g per 100 g water
}

// ProgrammeStep is one row of a cooling programme: set-points at TimeMin for a linear ramp
// and for the Mullin & Nývlt (1971) cubic profile.
type ProgrammeStep struct {
	TimeMin float64
	LinearC float64
	CubicC  float64
}

// PathPoint is a labelled state on the concentration–temperature chart.
type PathPoint struct {
	Kind  PathKind
	Label string // text for a reader: "dissolve", "onset", "nucleation", "seed", "adiabatic end", "end"
	TempC float64
	G100  float64 // liquor concentration, g per 100 g water
}

// PathKind says which state a path point is; code matches the kind, not the label.
type PathKind string

// The kinds of path point, in path order.
const (
	PathDissolve     PathKind = "dissolve"
	PathOnset        PathKind = "onset"
	PathNucleation   PathKind = "nucleation"
	PathSeed         PathKind = "seed"
	PathAdiabaticEnd PathKind = "adiabatic_end"
	PathEnd          PathKind = "end"
)

// pathLabels are the labels the JSON has always carried for each kind.
var pathLabels = map[PathKind]string{PathDissolve: "dissolve", PathOnset: "onset", PathNucleation: "nucleation",
	PathSeed: "seed", PathAdiabaticEnd: "adiabatic end", PathEnd: "end"}

func point(k PathKind, tempC, g100 float64) PathPoint {
	return PathPoint{Kind: k, Label: pathLabels[k], TempC: tempC, G100: g100}
}
