package chart

import (
	"cmp"
	"math"
	"slices"
	"sort"
	"strconv"
	"strings"
)

// Sample evaluates f at n evenly spaced temperatures from minC to maxC
// (both included; n is held between 2 and 1000) and returns the points in
// order. The first error from f is returned with no points, so a curve is
// never drawn with holes.
func Sample(minC, maxC float64, n int, f func(tempC float64) (float64, error)) ([]Point, error) {
	if !finite(minC) || !finite(maxC) {
		return nil, &DataError{Where: "sample range", Problem: "an end is not finite"}
	}
	n = min(max(n, 2), 1000)
	pts := make([]Point, n)
	for i := range pts {
		t := minC + (maxC-minC)*float64(i)/float64(n-1)
		if i == n-1 {
			t = maxC
		}
		y, err := f(t)
		if err != nil {
			return nil, err
		}
		pts[i] = Point{t, y}
	}
	return pts, nil
}

// Phase is the solubility curve of one solid phase over the temperatures
// where that solid is the stable one: X in °C, Y in g of anhydrous solute
// per 100 g water.
type Phase struct {
	Form   string // the solid, e.g. "Na2SO4·10H2O"
	Points []Point
}

// Batch is the route of one batch, in °C and g per 100 g water. Pointers
// are optional points.
type Batch struct {
	Dissolve   Point  // the clear solution at the process temperature
	Saturation *Point // where cooling at constant composition meets the curve
	// Onset is where crystals first appear: at the edge of the metastable
	// zone, or at the seed temperature. Nil when no crystals form; the path
	// then runs straight from Dissolve to End.
	Onset *Point
	Seed  *Point // where seed crystals go in
	End   Point  // the batch at its target temperature
	// Settled is where the batch would come to rest if the heat of
	// crystallization released at Onset stayed in it (no cooling): drawn as
	// a jump from Onset.
	Settled *Point
	// Storage is where a stock sized to stay clear is kept (the temperature it was sized
	// for), nil for other batches. Without a target the path runs to it.
	Storage *Point
}

// SolubilityView is what the solubility chart shows.
type SolubilityView struct {
	Title       string  // e.g. "Potassium nitrate, KNO3"; "Solubility" if empty
	Phases      []Phase // the stable solid phases in order of temperature
	MetastableK float64 // width of the metastable zone in K; 0 draws no band
	Batch       *Batch  // nil draws the curves alone
	Temp        TempUnit
	Conc        ConcUnit
	// Zoom cuts the curves to the temperatures the batch passes through,
	// widened on each side by a quarter of that span (at least 5 K), so that
	// the batch's points do not crowd together on a long curve.
	Zoom bool
	// DecimalComma prints numbers with a decimal comma.
	DecimalComma bool
	Notes        []string
}

// Solubility builds the chart of a compound's solubility, one curve per
// solid phase, with the metastable band (each curve shifted to lower
// temperature by MetastableK, or to higher temperature for a phase whose
// solubility falls as it warms, so the band always lies on the
// supersaturated side) and the batch's path and points. The path
// cools at constant composition from the dissolve point to the onset, drops
// to the curve and follows it down to the end point. Values are converted to
// v.Temp and v.Conc for display.
func Solubility(v SolubilityView) (Chart, error) {
	return (*SolubilityCache)(nil).Solubility(v)
}

// SolubilityCache keeps the curves and bands of the last solubility chart built through
// it, so that a chart whose phases, zone, units and window are unchanged (the batch moved)
// reuses them instead of converting every point again (not for a ConcUnit with its own
// Convert, which cannot be compared). The charts it returns share their curves and bands
// with it: they are read, not changed. The zero value is ready; a nil cache keeps nothing.
type SolubilityCache struct {
	phases       []Phase // a copy of the last view's phases
	metastableK  float64
	temp         TempUnit
	concSymbol   string // a unit with its own Convert is not kept
	comma        bool
	winLo, winHi float64
	series       []Series // the curves
	bands        []Band
	curve        []Point // all phases in °C, sorted by temperature
	ok           bool
}

// hit reports whether the cache holds the curves of v in the window.
func (sc *SolubilityCache) hit(v *SolubilityView, winLo, winHi float64) bool {
	if sc == nil || !sc.ok || sc.metastableK != v.MetastableK || sc.temp != v.Temp || sc.concSymbol != v.Conc.Symbol || v.Conc.Convert != nil ||
		sc.comma != v.DecimalComma || sc.winLo != winLo || sc.winHi != winHi || len(sc.phases) != len(v.Phases) {
		return false
	}
	for i, ph := range v.Phases {
		if ph.Form != sc.phases[i].Form || !slices.Equal(ph.Points, sc.phases[i].Points) {
			return false
		}
	}
	return true
}

// Solubility is the package's Solubility, with the curves taken from the cache when they
// are the same.
func (sc *SolubilityCache) Solubility(v SolubilityView) (Chart, error) {
	if !v.Temp.valid() {
		return Chart{}, &DataError{Where: "temperature unit", Problem: "unknown unit " + strconv.Itoa(int(v.Temp))}
	}
	if !finite(v.MetastableK) || v.MetastableK < 0 {
		return Chart{}, &DataError{Where: "metastable zone width", Problem: "must be 0 K or more, got " + formatSig(v.MetastableK, 3, false)}
	}
	title := v.Title
	if title == "" {
		title = "Solubility"
	}
	c := Chart{
		Title:        title,
		X:            Axis{Label: "Temperature", Unit: v.Temp.Symbol()},
		Y:            Axis{Label: "Solubility", Unit: v.Conc.symbol(), FromZero: true},
		Notes:        v.Notes,
		DecimalComma: v.DecimalComma,
	}
	comma := v.DecimalComma
	conv := func(where func() string, p Point) (Point, error) {
		if !finite(p.X) || !finite(p.Y) {
			return Point{}, &DataError{Where: where(), Problem: "not a finite number"}
		}
		y, err := v.Conc.conv(p.Y)
		if err != nil {
			return Point{}, &DataError{Where: where(), Problem: "cannot be shown in " + v.Conc.symbol() + ": " + err.Error()}
		}
		return Point{v.Temp.FromCelsius(p.X), y}, nil
	}
	convAll := func(where string, pts []Point, shiftK float64) ([]Point, error) {
		out := make([]Point, len(pts))
		for i, p := range pts {
			q, err := conv(func() string { return where + " point " + strconv.Itoa(i+1) }, Point{p.X - shiftK, p.Y})
			if err != nil {
				return nil, err
			}
			out[i] = q
		}
		return out, nil
	}

	// The temperature window of the curves.
	winLo, winHi := math.Inf(-1), math.Inf(1)
	if b := v.Batch; v.Zoom && b != nil {
		winLo, winHi = b.Dissolve.X, b.Dissolve.X
		for _, p := range [...]*Point{&b.End, b.Saturation, b.Onset, b.Seed, b.Settled} {
			if p != nil && finite(p.X) {
				winLo, winHi = math.Min(winLo, p.X), math.Max(winHi, p.X)
			}
		}
		pad := math.Max(5, (winHi-winLo)/4)
		winLo, winHi = winLo-pad, winHi+pad
	}

	// Curves, and the band beside each.
	var curve []Point // all phases in °C, for following the curve
	if sc.hit(&v, winLo, winHi) {
		c.Series = sc.series[:len(sc.series):len(sc.series)] // appending copies
		c.Bands = sc.bands
		curve = sc.curve
		goto batch
	}
	for _, ph := range v.Phases {
		where := "phase " + strconv.Quote(ph.Form)
		for i, p := range ph.Points {
			if !finite(p.X) || !finite(p.Y) {
				return Chart{}, &DataError{Where: where + " point " + strconv.Itoa(i+1), Problem: "not a finite number"}
			}
		}
		curve = append(curve, ph.Points...)
		shown := clipX(ph.Points, winLo, winHi)
		pts, err := convAll(where, shown, 0)
		if err != nil {
			return Chart{}, err
		}
		if len(pts) == 0 {
			continue
		}
		label := "Saturated, solid " + ph.Form
		if ph.Form == "" {
			label = "Saturated solution"
		}
		c.Series = append(c.Series, Series{Label: label, Points: pts, Kind: Curve})
		if v.MetastableK > 0 && len(shown) >= 2 {
			shift := v.MetastableK
			if shown[len(shown)-1].Y < shown[0].Y == (shown[len(shown)-1].X > shown[0].X) {
				shift = -shift // retrograde: supersaturated on warming
			}
			lim := make([]Point, len(shown))
			for i, p := range shown {
				lim[i] = Point{p.X - shift, p.Y}
			}
			// Keep the band within the curve's own temperatures.
			lo, hi := math.Min(shown[0].X, shown[len(shown)-1].X), math.Max(shown[0].X, shown[len(shown)-1].X)
			limPts, err := convAll(where+" (metastable edge)", clipX(lim, lo, hi), 0)
			if err != nil {
				return Chart{}, err
			}
			c.Bands = append(c.Bands, Band{
				Label: "Metastable zone, " + formatShort(v.Temp.FromCelsiusDelta(v.MetastableK), 3, comma) + " " + deltaSymbol(v.Temp) + " wide",
				Edge:  pts, Limit: limPts,
			})
		}
	}
	slices.SortStableFunc(curve, func(a, b Point) int { return cmp.Compare(a.X, b.X) })
	if sc != nil {
		sc.ok = false
		sc.phases = sc.phases[:0]
		for _, ph := range v.Phases {
			sc.phases = append(sc.phases, Phase{Form: ph.Form, Points: slices.Clone(ph.Points)})
		}
		sc.metastableK, sc.temp, sc.concSymbol, sc.comma, sc.winLo, sc.winHi = v.MetastableK, v.Temp, v.Conc.Symbol, v.DecimalComma, winLo, winHi
		sc.series, sc.bands, sc.curve, sc.ok = c.Series, c.Bands, curve, true
		c.Series = c.Series[:len(c.Series):len(c.Series)]
	}

batch:
	if b := v.Batch; b != nil {
		route := []Point{b.Dissolve}
		if b.Onset != nil {
			route = append(route, *b.Onset)
			from := b.Onset.X
			if b.Saturation != nil && b.Saturation.X < from {
				// Seeded above saturation: the liquor stays clear until
				// it reaches the curve.
				route = append(route, *b.Saturation)
				from = b.Saturation.X
			}
			route = append(route, alongCurve(curve, from, b.End.X)...)
		}
		// No target: the batch stays where it was dissolved, or (a stock kept clear) is
		// cooled to its storage temperature without crystals.
		noTarget := b.End == b.Dissolve
		if noTarget && b.Storage != nil {
			route = append(route, *b.Storage)
		} else {
			route = append(route, b.End)
		}
		if route = dedupe(route); len(route) > 1 { // a path of one point is not drawn, nor listed
			pts, err := convAll("batch path", route, 0)
			if err != nil {
				return Chart{}, err
			}
			c.Series = append(c.Series, Series{Label: "Batch path", Points: pts, Kind: Path})
		}
		if b.Onset != nil && b.Settled != nil {
			j, err := convAll("insulated jump", []Point{*b.Onset, *b.Settled}, 0)
			if err != nil {
				return Chart{}, err
			}
			c.Series = append(c.Series, Series{Label: "If insulated: warms as crystals form", Points: j, Kind: Jump})
		}
		mark := func(label string, p *Point, s Shape) error {
			if p == nil {
				return nil
			}
			q, err := conv(func() string { return label }, *p)
			if err != nil {
				return err
			}
			c.Markers = append(c.Markers, Marker{
				Label: label + " " + formatTemp(q.X, comma) + " " + v.Temp.Symbol(),
				X:     q.X, Y: q.Y, Shape: s,
			})
			return nil
		}
		onsetMark := b.Onset
		if b.Seed != nil && b.Onset != nil && *b.Seed == *b.Onset {
			onsetMark = nil // seeding starts the crystals: one marker says it
		}
		// One marker a point: no end marker over the dissolved one (no target), and a stock
		// stored where it ends is marked as stored.
		endMark := &b.End
		if noTarget || (b.Storage != nil && *b.Storage == b.End) {
			endMark = nil
		}
		for _, m := range [...]struct {
			label string
			p     *Point
			s     Shape
		}{
			{"Dissolved at", &b.Dissolve, Diamond},
			{"Saturated at", b.Saturation, Circle},
			{"Seeded at", b.Seed, TriangleDown},
			{"Crystals from", onsetMark, TriangleUp},
			{"Insulated, ends at", b.Settled, Cross},
			{"Ends at", endMark, Square},
			{"Kept clear down to", b.Storage, Square},
		} {
			if err := mark(m.label, m.p, m.s); err != nil {
				return Chart{}, err
			}
		}
	}
	return c, nil
}

// formatTemp prints a temperature to 0.1 degree, without a trailing ".0".
func formatTemp(v float64, comma bool) string {
	s := formatFixed(v, 1, comma)
	if strings.HasSuffix(s, ".0") || strings.HasSuffix(s, ",0") {
		s = s[:len(s)-2]
	}
	if s == "−0" {
		s = "0"
	}
	return s
}

func deltaSymbol(u TempUnit) string {
	if u == Fahrenheit {
		return "°F"
	}
	return "K"
}

// alongCurve returns the points of the curve (sorted by temperature) from
// temperature from down to to, both ends interpolated, for the stretch where
// the batch follows the curve. Outside the curve's range it returns nothing:
// the path then runs straight.
func alongCurve(curve []Point, from, to float64) []Point {
	if len(curve) < 2 || from <= to {
		return nil
	}
	lo, hi := curve[0].X, curve[len(curve)-1].X
	if from > hi || to < lo {
		return nil
	}
	out := []Point{{from, interp(curve, from)}}
	for i := len(curve) - 1; i >= 0; i-- {
		if p := curve[i]; p.X < from && p.X > to {
			out = append(out, p)
		}
	}
	return append(out, Point{to, interp(curve, to)})
}

// interp interpolates linearly in the sorted points at x (inside their
// range). Where two phases meet at one temperature it takes the first.
func interp(pts []Point, x float64) float64 {
	i := sort.Search(len(pts), func(i int) bool { return pts[i].X >= x })
	if i == 0 {
		return pts[0].Y
	}
	if i == len(pts) {
		return pts[len(pts)-1].Y
	}
	a, b := pts[i-1], pts[i]
	if b.X == a.X {
		return a.Y
	}
	return a.Y + (b.Y-a.Y)*(x-a.X)/(b.X-a.X)
}

// clipX keeps the part of the polyline with lo ≤ X ≤ hi, with points
// interpolated where it crosses either limit. It suits curves that run
// one way in X, as solubility curves do.
func clipX(pts []Point, lo, hi float64) []Point {
	if len(pts) == 0 {
		return nil
	}
	if lo == math.Inf(-1) && hi == math.Inf(1) {
		return pts
	}
	in := func(p Point) bool { return p.X >= lo && p.X <= hi }
	cross := func(a, b Point, x float64) Point {
		return Point{x, a.Y + (b.Y-a.Y)*(x-a.X)/(b.X-a.X)}
	}
	var out []Point
	for i, p := range pts {
		if i > 0 {
			a := pts[i-1]
			for _, x := range [...]float64{lo, hi} {
				if (a.X < x) != (p.X < x) && a.X != x && p.X != x {
					q := cross(a, p, x)
					if in(q) {
						out = append(out, q)
					}
				}
			}
			// Two crossings in one segment must come out in the order of travel.
			if n := len(out); n >= 2 && (out[n-1].X-out[n-2].X)*(p.X-a.X) < 0 && !in(a) && !in(p) {
				out[n-1], out[n-2] = out[n-2], out[n-1]
			}
		}
		if in(p) {
			out = append(out, p)
		}
	}
	return out
}

// dedupe drops consecutive repeated points.
func dedupe(pts []Point) []Point {
	out := pts[:0:0]
	for i, p := range pts {
		if i > 0 && math.Abs(p.X-pts[i-1].X) < 1e-12 && math.Abs(p.Y-pts[i-1].Y) < 1e-12 {
			continue
		}
		out = append(out, p)
	}
	return out
}

// OxygenView is what the dissolved-oxygen chart shows, in °C and mg/L.
type OxygenView struct {
	Title      string  // "Oxygen saturation" if empty
	Curve      []Point // saturation vs temperature for the day's pressure and salinity
	CurveLabel string  // e.g. "Saturation at 101.3 kPa, salinity 0"
	Day        *Point  // the day's water temperature and its saturation
	Measured   *Point  // a reading at the water temperature, mg/L
	Temp       TempUnit
	// DecimalComma prints numbers with a decimal comma.
	DecimalComma bool
	Notes        []string
}

// Oxygen builds the chart of dissolved-oxygen saturation against
// temperature, with the day's point and a measured point.
func Oxygen(v OxygenView) (Chart, error) {
	if !v.Temp.valid() {
		return Chart{}, &DataError{Where: "temperature unit", Problem: "unknown unit " + strconv.Itoa(int(v.Temp))}
	}
	title := v.Title
	if title == "" {
		title = "Oxygen saturation"
	}
	label := v.CurveLabel
	if label == "" {
		label = "Saturation"
	}
	c := Chart{
		Title:        title,
		X:            Axis{Label: "Water temperature", Unit: v.Temp.Symbol()},
		Y:            Axis{Label: "Dissolved oxygen", Unit: "mg/L", FromZero: true},
		Notes:        v.Notes,
		DecimalComma: v.DecimalComma,
	}
	comma := v.DecimalComma
	pts := make([]Point, len(v.Curve))
	for i, p := range v.Curve {
		pts[i] = Point{v.Temp.FromCelsius(p.X), p.Y}
	}
	c.Series = append(c.Series, Series{Label: label, Points: pts, Kind: Curve})
	if p := v.Day; p != nil {
		x := v.Temp.FromCelsius(p.X)
		c.Markers = append(c.Markers, Marker{
			Label: "Saturation today: " + formatShort(p.Y, 3, comma) + " mg/L at " + formatTemp(x, comma) + " " + v.Temp.Symbol(),
			X:     x, Y: p.Y, Shape: Diamond,
		})
	}
	if p := v.Measured; p != nil {
		x := v.Temp.FromCelsius(p.X)
		c.Markers = append(c.Markers, Marker{
			Label: "Measured: " + formatShort(p.Y, 3, comma) + " mg/L at " + formatTemp(x, comma) + " " + v.Temp.Symbol(),
			X:     x, Y: p.Y, Shape: Square,
		})
	}
	return c, nil
}
