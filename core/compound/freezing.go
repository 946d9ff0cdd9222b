package compound

import (
	"math"
	"strconv"

	"saltcast/core/solubility"
)

// Freezing is the freezing curve of a compound's solutions: the temperature at which ice
// starts to separate from a solution of a given concentration, and the eutectic where the
// curve meets the solubility of the coldest solid.
//
// Model: the depression ΔT (K) is interpolated linearly in the concentration (g anhydrous
// per 100 g water) between published points, from (0, 0) to the last point. The handbook
// rows are 0.5–1 mass % apart, so the linear interpolation adds well under 0.05 K
// (derived: the largest second difference of the CRC 102nd ed. rows of the library salts
// below their eutectics). Beyond the last point the curve is not known: the methods say so
// with ok = false and never extrapolate. When a eutectic is published it is the last point.
type Freezing struct {
	G100        []float64 // concentrations, g anhydrous per 100 g water, rising, G100[0] = 0
	DepressionK []float64 // ΔT below 0 °C at G100[i], rising, DepressionK[0] = 0
	Source      string

	HasEutectic    bool
	EutecticC      float64 // ice and EutecticForm crystallize together at this temperature
	EutecticG100   float64 // composition of the eutectic liquor
	EutecticForm   *Form
	EutecticSource string
}

// MaxG100 is the richest solution whose freezing point is known.
func (f *Freezing) MaxG100() float64 { return f.G100[len(f.G100)-1] }

// LowestC is the freezing point of the richest solution whose freezing point is known: the
// eutectic when there is one.
func (f *Freezing) LowestC() float64 { return -f.DepressionK[len(f.DepressionK)-1] }

// TempC returns the freezing point (°C) of a solution holding g100 g per 100 g water; ok is
// false for a negative or non-finite g100 or one beyond the data.
func (f *Freezing) TempC(g100 float64) (tempC float64, ok bool) {
	if !(g100 >= 0 && g100 <= f.MaxG100()) {
		return 0, false
	}
	return -interp(f.G100, f.DepressionK, g100), true
}

// LiquorG100 returns the concentration of the liquor left beside ice at tempC: the solution
// whose freezing point is tempC. At or above 0 °C no ice forms and it returns 0 with ok
// false; below LowestC the curve is not known (or, past a eutectic, no liquor is left) and ok
// is false too.
func (f *Freezing) LiquorG100(tempC float64) (g100 float64, ok bool) {
	d := -tempC
	if !(d > 0 && d <= f.DepressionK[len(f.DepressionK)-1]) {
		return 0, false
	}
	return interp(f.DepressionK, f.G100, d), true
}

// interp interpolates y(x) linearly; xs rises strictly and x lies within it.
func interp(xs, ys []float64, x float64) float64 {
	i := 1
	for i < len(xs)-1 && xs[i] < x {
		i++
	}
	x0, x1 := xs[i-1], xs[i]
	u := (x - x0) / (x1 - x0)
	return ys[i-1] + u*(ys[i]-ys[i-1])
}

// freezingTol is how closely a eutectic written inside the freezing rows must lie on them
// (K), and eutecticSolTol how closely (relative) it must lie on the solubility curve of its
// solid when written inside that curve's rows. Both are about the scatter between the
// handbook tables the library combines (common practice).
const (
	freezingTolK   = 0.3
	eutecticSolTol = 0.01
)

// freezingBlock starts the rows of the freezing curve: "freezing source".
func (p *parser) freezingBlock(fields []string) error {
	if p.freezing != nil {
		return p.fail("second freezing block")
	}
	if len(p.phases) == 0 {
		return p.fail("the freezing block comes after the phases")
	}
	if len(fields) != 1 || fields[0] == "" {
		return p.fail("want: freezing source")
	}
	src, err := p.source(fields[0])
	if err != nil {
		return err
	}
	p.freezing = &rowSet{line: p.line, unit: "freezing", source: src}
	p.rows = p.freezing
	return nil
}

// eutecticLine reads "eutectic °C | mass% | FORMULA | source".
func (p *parser) eutecticLine(fields []string) error {
	if p.freezing == nil {
		return p.fail("a eutectic comes after the freezing block")
	}
	if p.eutectic != nil {
		return p.fail("second eutectic")
	}
	if len(fields) != 4 {
		return p.fail("want: eutectic °C | mass% | FORMULA | source")
	}
	t, err1 := strconv.ParseFloat(fields[0], 64)
	w, err2 := strconv.ParseFloat(fields[1], 64)
	if err1 != nil || err2 != nil || !(t < 0 && t > -100) || !(w > 0 && w < 100) {
		return p.fail("a eutectic is a temperature below 0 °C (down to −100) and a mass % (0–100)")
	}
	f, err := p.findForm(fields[2])
	if err != nil {
		return err
	}
	src, err := p.source(fields[3])
	if err != nil {
		return err
	}
	p.addSource(src)
	p.eutectic = &eutecticDef{line: p.line, text: p.text, tempC: t, massP: w, form: f, source: src}
	p.rows = nil
	return nil
}

// extendToEutectic adds the eutectic to the coldest phase's rows when it lies below them,
// and reports whether it did.
func (p *parser) extendToEutectic() (bool, error) {
	e := p.eutectic
	if e == nil {
		return false, nil
	}
	ph := p.phases[0]
	fail := func(msg string) error { return &ParseError{Line: e.line, Text: e.text, Msg: msg} }
	if e.form != ph.form {
		return false, fail("the eutectic solid must be the coldest phase's form, " + ph.form.Formula)
	}
	if !(e.tempC < ph.maxC) {
		return false, fail("the eutectic must lie below the end of the coldest phase")
	}
	if e.tempC >= ph.minC {
		return false, nil
	}
	ph.minC = e.tempC
	ph.rows.pts = append(ph.rows.pts, solubility.Point{TempC: e.tempC, GPer100gWater: solubility.FromMassPercent(e.massP)})
	ph.rows.rowSources = append(ph.rows.rowSources, e.source)
	return true, nil
}

// buildFreezing checks the freezing rows and the eutectic and sets c.Freezing.
func (p *parser) buildFreezing(extended bool) error {
	if p.freezing == nil {
		return nil
	}
	rs := p.freezing
	fail := func(msg string) error { return &ParseError{Line: rs.line, Text: "freezing", Msg: msg} }
	if len(rs.pts) < 2 {
		return fail("a freezing curve needs at least 2 rows")
	}
	fz := &Freezing{G100: []float64{0}, DepressionK: []float64{0}, Source: rs.source}
	for i, q := range rs.pts {
		g := solubility.FromMassPercent(q.TempC) // the row's first number is mass %
		if !(g > fz.G100[i] && q.GPer100gWater > fz.DepressionK[i]) {
			return fail("freezing rows must rise in both mass % and depression")
		}
		fz.G100 = append(fz.G100, g)
		fz.DepressionK = append(fz.DepressionK, q.GPer100gWater)
	}
	if e := p.eutectic; e != nil {
		efail := func(msg string) error { return &ParseError{Line: e.line, Text: e.text, Msg: msg} }
		g := solubility.FromMassPercent(e.massP)
		if g > fz.MaxG100() {
			if !(-e.tempC > fz.DepressionK[len(fz.DepressionK)-1]) {
				return efail("the eutectic must lie below the last freezing row")
			}
			fz.G100 = append(fz.G100, g)
			fz.DepressionK = append(fz.DepressionK, -e.tempC)
		} else if d := interp(fz.G100, fz.DepressionK, g); math.Abs(d+e.tempC) > freezingTolK {
			return efail("the eutectic does not lie on the freezing curve (it gives " +
				strconv.FormatFloat(-d, 'f', 2, 64) + " °C at that composition)")
		} else {
			// The eutectic ends the curve: richer rows would describe a metastable liquor.
			i := 1
			for fz.G100[i] < g {
				i++
			}
			fz.G100 = append(fz.G100[:i], g)
			fz.DepressionK = append(fz.DepressionK[:i], -e.tempC)
		}
		if !extended {
			s := p.c.Segments[0].Curve.Model.Value(e.tempC)
			if math.Abs(s-g) > eutecticSolTol*math.Max(s, g) {
				return efail("the eutectic does not lie on the solubility curve of " + e.form.Formula + " (it gives " +
					strconv.FormatFloat(100*s/(100+s), 'f', 2, 64) + " mass % there)")
			}
		}
		fz.HasEutectic, fz.EutecticC, fz.EutecticG100, fz.EutecticForm, fz.EutecticSource = true, e.tempC, g, e.form, e.source
	}
	p.c.Freezing = fz
	return nil
}
