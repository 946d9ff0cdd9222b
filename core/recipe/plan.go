package recipe

import (
	"errors"
	"strings"

	"saltcast/core/balance"
	"saltcast/core/compound"
	"saltcast/core/solubility"
	"saltcast/core/unit"
	"saltcast/core/water"
)

// Result is the plan of one recipe: the recipe as read, and the balance.Result fields
// promoted for the browser and the chart (res.CrystalsG, res.Path, res.Compound, ...).
type Result struct {
	Recipe Recipe
	balance.Result
}

// Defaults applied by Plan to keys a recipe leaves out.
const (
	DefaultPurityPct     = 100.0
	DefaultSaturationPct = 100.0
	DefaultWaterTempC    = 20.0 // temperature of a water volume when water_temp_C is not given
	DefaultClearMarginK  = 2.0  // Saltcast's own default, not from a source: a small, visible margin
)

// Plan works out the batch a recipe describes. The compound, the charged form and every
// temperature are checked against the library (or the custom curve) here; errors are
// *unit.FieldError values naming the recipe key.
//
// The charged form is charged_form when given, else the form the solute names ("CuSO4" is
// the anhydrous salt, "CuSO4·5H2O" and "blue vitriol" the pentahydrate). Water given by
// volume is converted with the density of pure water at water_temp_C (Kell 1975).
func Plan(r Recipe) (Result, error) {
	res := Result{Recipe: r}
	c, form, err := r.compound()
	if err != nil {
		return res, err
	}
	if r.ChargedForm != "" {
		if form, err = c.Form(r.ChargedForm); err != nil {
			return res, err
		}
	}
	b := balance.Batch{
		Compound:         c,
		Form:             form,
		PurityPct:        r.PurityPct.Or(DefaultPurityPct),
		WaterG:           r.WaterG.Value,
		DissolveTempC:    r.DissolveTempC,
		ChargeG:          r.ChargeG.Value,
		SaturationPct:    r.SaturationPct.Or(DefaultSaturationPct),
		HasTarget:        r.CoolToC.Set,
		TargetC:          r.CoolToC.Value,
		EvaporatedWaterG: r.EvaporatedWaterG.Value,
		HasSeedAt:        r.SeedAtC.Set,
		SeedAtC:          r.SeedAtC.Value,
		MetastableWidthK: r.MetastableWidthK.Value,
		CoolingTimeMin:   r.CoolingTimeMin.Value,
		LiquorCpKJPerKgK: r.LiquorHeatCapacityKJPerKgK.Value,
		VesselJPerK:      r.VesselHeatCapacityJPerK.Value,
	}
	if r.ClearDownToC.Set {
		b.HasClearDown = true
		b.ClearDownToC = r.ClearDownToC.Value
		b.ClearMarginK = r.ClearMarginK.Or(DefaultClearMarginK)
	}
	var volumeNote string
	if r.WaterML.Set {
		t := r.WaterTempC.Or(DefaultWaterTempC)
		b.WaterG = r.WaterML.Value * WaterGPerML(t)
		volumeNote = unit.FormatCompact(r.WaterML.Value, 6) + " mL of water at " + unit.FormatCompact(t, 4) +
			" °C weighs " + unit.FormatCompact(b.WaterG, 6) + " g (density of pure water, Kell 1975, J. Chem. Eng. Data 20:97)"
	}
	if r.EvaporatedWaterG.Set && !r.CoolToC.Set {
		return res, unit.NumberError("evaporated_water_g", r.EvaporatedWaterG.Value, "evaporated_water_g only together with cool_to_C")
	}
	br, err := balance.Plan(b)
	if err != nil {
		return res, err
	}
	res.Result = br
	if volumeNote != "" {
		res.Warnings = append([]string{volumeNote}, res.Warnings...)
		res.Sources = append(res.Sources, balance.DensitySource)
	}
	if r.ClearDownToC.Set && !r.ClearMarginK.Set {
		res.Warnings = append(res.Warnings, "clear_margin_K not given: the saturation temperature is put "+
			unit.FormatCompact(DefaultClearMarginK, 2)+" K below clear_down_to_C (Saltcast's default margin)")
	}
	return res, nil
}

// compound finds the library compound or builds the custom one.
func (r Recipe) compound() (*compound.Compound, *compound.Form, error) {
	if r.Custom == nil {
		return compound.Lookup(r.Solute)
	}
	cu := r.Custom
	pts := make([]solubility.Point, len(cu.Points))
	for i, p := range cu.Points {
		pts[i] = solubility.Point{TempC: p.TempC, GPer100gWater: p.GPer100gWater}
	}
	fit, err := solubility.Fit(cu.Model, pts, cu.MolarMassGPerMol)
	if err != nil {
		return nil, nil, renameField(err, map[string]string{"points": "custom.points", "kind": "custom.model"}, "custom.")
	}
	if cu.Source != "" {
		fit.Curve.Source = cu.Source
	} else {
		fit.Curve.Source = "user data for " + cu.Name + " (no source given)"
	}
	c, err := compound.NewCustom(cu.Name, cu.MolarMassGPerMol, fit.Curve)
	if err != nil {
		return nil, nil, renameField(err, map[string]string{"solute": "custom.name", "curve": "custom.points"}, "custom.")
	}
	if cu.SolutionEnthalpyKJPerMol.Set {
		f := c.Forms[0]
		f.SolutionEnthalpyKJPerMol = cu.SolutionEnthalpyKJPerMol.Value
		f.HasEnthalpy = true
		f.EnthalpySource = "user value"
	}
	return c, c.Forms[0], nil
}

// renameField maps the field of a *unit.FieldError to the recipe's key.
func renameField(err error, names map[string]string, prefix string) error {
	var fe *unit.FieldError
	if !errors.As(err, &fe) {
		return err
	}
	out := *fe
	if n, ok := names[fe.Field]; ok {
		out.Field = n
	} else if !strings.HasPrefix(fe.Field, prefix) {
		out.Field = prefix + fe.Field
	}
	return &out
}

// WaterGPerML is the density of the batch water, g/mL, at tempC (pure water, Kell 1975,
// J. Chem. Eng. Data 20:97, through core/water): how a water volume becomes grams, for the
// planner and for the form that switches the water between volume and mass.
func WaterGPerML(tempC float64) float64 { return water.DensityKgPerM3(tempC) / 1000 }
