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
	HeatCapacityKJPerK          float64 // batch (liquor + vessel)
	HeatCapacityModel           string
	HasDissolutionHeat          bool
	DissolutionHeatKJ           float64
	DissolutionTempChangeK      float64 // if insulated: negative = the batch cools
	DissolutionEnthalpyKJPerMol float64 // of the charged form
	CrystallizationHeatKJ       float64
	CrystalEnthalpyKJPerMol     float64 // of the crystal phase, the value used
	ApparentEnthalpyKJPerMol    float64 // van 't Hoff, from the curve slope (HasApparent)
	HasApparent                 bool
	EnthalpyBasis               string // which enthalpy is used and why
	SensibleHeatKJ              float64
	CoolingDutyKJ               float64
	HasCoolingPower             bool
	CoolingPowerW               float64 // mean over the cooling time
	CoolingTimeMin              float64

	// Seeded in an insulated vessel at SeedAtC.
	HasAdiabatic       bool
	SeedAtC            float64
	AdiabaticEndC      float64
	AdiabaticCrystalsG float64
	AdiabaticRiseK     float64
	AdiabaticPhase     string
	AdiabaticG100      float64 // liquor concentration at the end, g per 100 g water
	AdiabaticBasis     string  // the enthalpy used

	// Points for a chart of concentration against temperature, in path order.
	Path []PathPoint

	Cautions []string
	Warnings []string
	Sources  []string
}

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
	Label string // "dissolve", "onset", "nucleation", "seed", "adiabatic end", "end"
	TempC float64
	G100  float64 // liquor concentration, g per 100 g water
}
