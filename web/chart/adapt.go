package chart

import (
	"math"

	"saltcast/core/balance"
	"saltcast/core/compound"
	"saltcast/core/gas"
)

// Options are the reader's display choices for the charts built from the
// core's own types.
type Options struct {
	Temp         TempUnit
	Conc         ConcUnit
	DecimalComma bool
	Zoom         bool // see SolubilityView.Zoom
	Samples      int  // points per solid phase or gas curve; 60 if 0
}

func (o Options) samples() int {
	if o.Samples <= 0 {
		return 60
	}
	return o.Samples
}

// Phases samples the curve of each of c's segments over the segment's own
// temperature range (n points each), so each solid phase is drawn only
// where it is the stable one and only where there are data.
func Phases(c *compound.Compound, n int) ([]Phase, error) {
	if c == nil || len(c.Segments) == 0 {
		return nil, ErrNoData
	}
	out := make([]Phase, 0, len(c.Segments))
	for _, seg := range c.Segments {
		pts, err := Sample(seg.MinC, seg.MaxC, n, func(t float64) (float64, error) {
			g, _, err := seg.Curve.At(t)
			return g, err
		})
		if err != nil {
			return nil, err
		}
		form := c.ID
		if seg.Form != nil {
			form = seg.Form.Formula
		}
		out = append(out, Phase{Form: form, Points: pts})
	}
	return out, nil
}

// CompoundView is the solubility chart of c alone, before a batch is planned.
func CompoundView(c *compound.Compound, o Options) (SolubilityView, error) {
	ph, err := Phases(c, o.samples())
	if err != nil {
		return SolubilityView{}, err
	}
	return SolubilityView{
		Title: compoundTitle(c), Phases: ph,
		Temp: o.Temp, Conc: o.Conc, DecimalComma: o.DecimalComma,
	}, nil
}

// PlanView is the solubility chart of a planned batch: the curves of
// r.Compound, the metastable band if the plan has one, and the batch's path.
// A point of the path outside the curve's data range adds a note, since the
// planner extrapolated there.
func PlanView(r *balance.Result, o Options) (SolubilityView, error) {
	if r == nil || r.Compound == nil {
		return SolubilityView{}, ErrNoData
	}
	v, err := CompoundView(r.Compound, o)
	if err != nil {
		return SolubilityView{}, err
	}
	v.Zoom = o.Zoom
	if r.HasMetastable {
		v.MetastableK = r.MetastableWidthK
	}
	b := BatchFromPlan(r)
	v.Batch = b
	lo, hi := r.Compound.Range()
	outside := false
	for _, p := range [...]*Point{&b.Dissolve, &b.End, b.Saturation, b.Onset, b.Seed, b.Settled} {
		if p != nil && (p.X < lo || p.X > hi) {
			outside = true
		}
	}
	if len(r.Cautions) > 0 {
		v.Notes = append(v.Notes, "Cautions apply to this batch: read them with the results, the SDS and your local rules.")
	}
	if outside {
		v.Notes = append(v.Notes, "Part of the batch lies outside the curve's data ("+
			formatTemp(o.Temp.FromCelsius(lo), o.DecimalComma)+" to "+
			formatTemp(o.Temp.FromCelsius(hi), o.DecimalComma)+" "+o.Temp.Symbol()+
			"): values there are extrapolated; see the warnings.")
	}
	return v, nil
}

// PathPoint returns the point of kind k on r's path (the last one, if the path had two),
// or nil. Every reader of the planner's path matches points here, by kind, never by label.
func PathPoint(r *balance.Result, k balance.PathKind) *Point {
	var out *Point
	for _, p := range r.Path {
		if p.Kind == k {
			out = &Point{p.TempC, p.G100}
		}
	}
	return out
}

// BatchFromPlan reads the batch's route from the planner's path points, or from the
// result's fields when the path is empty. It is the one adapter from a plan to the chart's
// route: the app's batch screen and its printed sheet draw through it. Path points are
// matched by kind (PathPoint), never by label.
//
// Where crystals start (Onset) follows the physics of a cooled (or, for a retrograde solute,
// heated) batch: at the seed point for a seeded batch, since seed crystals give the solid
// something to grow on at once; otherwise at the expected nucleation temperature, when a
// metastable width is known and the path reaches it; otherwise at the saturation (onset)
// temperature, where the solution first becomes supersaturated. A batch that ends with no
// crystals (no target, or a target short of saturation) has no Onset: its path runs straight
// from Dissolve to End, with the saturation point still marked if there is one.
func BatchFromPlan(r *balance.Result) *Batch {
	b := &Batch{
		Dissolve: Point{r.DissolveTempC, r.ConcentrationG100},
		End:      Point{r.DissolveTempC, r.ConcentrationG100},
	}
	hasEnd := false
	var nucleation *Point
	if len(r.Path) > 0 {
		if p := PathPoint(r, balance.PathDissolve); p != nil {
			b.Dissolve = *p
		}
		b.Saturation = PathPoint(r, balance.PathOnset)
		nucleation = PathPoint(r, balance.PathNucleation)
		b.Seed = PathPoint(r, balance.PathSeed)
		b.Settled = PathPoint(r, balance.PathAdiabaticEnd)
		if p := PathPoint(r, balance.PathEnd); p != nil {
			b.End, hasEnd = *p, true
		}
	} else {
		c := r.ConcentrationG100
		if r.HasOnset {
			b.Saturation = &Point{r.SaturationTempC, c}
			if r.HasMetastable && (!r.HasTarget || r.NucleationC >= r.TargetC) {
				nucleation = &Point{r.NucleationC, c}
			}
		}
		if r.HasAdiabatic {
			b.Seed = &Point{r.SeedAtC, c}
			b.Settled = &Point{r.AdiabaticEndC, r.AdiabaticG100}
		}
	}
	if !hasEnd && r.HasTarget {
		b.End = Point{r.TargetC, r.LiquorG100}
	}
	if !r.HasOnset {
		b.Saturation = nil
	}
	switch {
	case b.Seed != nil:
		b.Onset = b.Seed
	case nucleation != nil && r.HasTarget && r.CrystalsG > 0:
		b.Onset = nucleation
	case b.Saturation != nil && r.HasTarget && r.CrystalsG > 0:
		b.Onset = b.Saturation
	}
	if b.Onset == nil {
		b.Settled = nil
	}
	if r.HasClearDown {
		b.Storage = &Point{r.ClearDownToC, r.ConcentrationG100}
	}
	return b
}

func compoundTitle(c *compound.Compound) string {
	switch {
	case c.Name == "" || c.Name == c.ID:
		return "Solubility of " + c.ID
	}
	return "Solubility of " + c.Name + ", " + c.ID
}

// SolubilitySVG draws the chart of c, with the batch r if it is not nil,
// and never fails: anything that cannot be drawn becomes a Placeholder
// saying why.
func SolubilitySVG(c *compound.Compound, r *balance.Result, o Options) string {
	var v SolubilityView
	var err error
	if r != nil && r.Compound != nil {
		v, err = PlanView(r, o)
	} else {
		v, err = CompoundView(c, o)
	}
	return renderOrPlaceholder("Solubility", func() (Chart, error) {
		if err != nil {
			return Chart{}, err
		}
		return Solubility(v)
	})
}

func renderOrPlaceholder(title string, build func() (Chart, error)) string {
	c, err := build()
	if err == nil {
		var svg string
		if svg, err = Render(c); err == nil {
			return svg
		}
		if c.Title != "" {
			title = c.Title
		}
	}
	return Placeholder(title, err.Error())
}

// OxygenChartView is the chart of oxygen saturation against temperature at
// the day's salinity and pressure by method (see gas.OxygenSaturation),
// with the day's point and, if measured is not nil, a reading in mg/L. The
// curve covers the methods' measured range, 0 to 40 °C, widened to the
// day's temperature if that lies outside, with a note that it is
// extrapolated there.
func OxygenChartView(day gas.Conditions, method string, measured *float64, o Options) (v OxygenView, err error) {
	// v stays the zero view until the end: every error return is a bare one (smaller in the
	// page's module than building a zero view at each).
	sat, err := gas.OxygenSaturation(day, method)
	if err != nil {
		return
	}
	lo, hi := math.Min(gas.O2MinC, day.TempC), math.Max(gas.O2MaxC, day.TempC)
	// o.samples() points (60 by default, as each solubility curve): the app drew 41 (1 K steps
	// over 0 to 40 °C) before it used this adapter. 60 keeps steps under 1 K when the curve is
	// widened to the day's temperature (up to -2 to 50 °C), and the two are indistinguishable
	// at the chart's size, so one number serves both the app and the sheet.
	curve, err := Sample(lo, hi, o.samples(), func(t float64) (float64, error) {
		c := day
		c.TempC = t
		s, err := gas.OxygenSaturation(c, method)
		return s.MgPerL, err
	})
	if err != nil {
		return
	}
	comma := o.DecimalComma
	var notes []string
	var reading *Point
	if measured != nil {
		pct, err := gas.PercentSaturation(*measured, sat)
		if err != nil {
			return v, err
		}
		reading = &Point{day.TempC, *measured}
		notes = append(notes, "Measured reading: "+formatShort(pct, 3, comma)+" % of saturation.")
	}
	if lo < gas.O2MinC || hi > gas.O2MaxC {
		notes = append(notes, "Outside "+formatTemp(o.Temp.FromCelsius(gas.O2MinC), comma)+" to "+
			formatTemp(o.Temp.FromCelsius(gas.O2MaxC), comma)+" "+o.Temp.Symbol()+
			" the curve is extrapolated beyond the method's measurements.")
	}
	return OxygenView{
		Curve: curve,
		// The label names the unit of every number, as the gas form does (practical
		// salinity, PSS-78, has none), and the method, so a printed or copied chart says what
		// it was drawn from.
		CurveLabel: "Saturation at " + formatShort(day.PressureKPa, 4, comma) + " kPa, practical salinity " +
			formatShort(day.Salinity, 3, comma) + " (" + sat.Method + ")",
		Day:          &Point{day.TempC, sat.MgPerL},
		Measured:     reading,
		Temp:         o.Temp,
		DecimalComma: comma,
		Notes:        notes,
	}, nil
}

// OxygenSVG draws OxygenChartView and never fails: an input the gas
// methods refuse becomes a Placeholder with their message.
func OxygenSVG(day gas.Conditions, method string, measured *float64, o Options) string {
	return renderOrPlaceholder("Oxygen saturation", func() (Chart, error) {
		v, err := OxygenChartView(day, method, measured, o)
		if err != nil {
			return Chart{}, err
		}
		return Oxygen(v)
	})
}
