package chart

import (
	"math"
	"strconv"
	"strings"
)

// Render draws c as an SVG document. It returns ErrNoData if c has no
// points and a *DataError if any number is NaN or infinite; nothing is
// drawn in either case (see Placeholder).
func Render(c Chart) (string, error) {
	var r Renderer
	d, _, err := r.Draw(c)
	if err != nil {
		return "", err
	}
	return d.SVG(), nil
}

// Drawing is a chart drawn in parts, so that a page can replace only the part
// that changed. Its SVG is what Render returns for the same chart:
//
//	<svg … viewBox="ViewBox" …><title>…</title><desc>Desc</desc><rect …/>
//	<g data-layer="static">Static</g>
//	<g data-layer="batch">Batch</g>
//	</svg>
//
// The static layer holds the title, grid, axes, bands and curves; the batch
// layer the paths and jumps, markers, legend and notes (the legend follows
// the markers' labels). The viewBox's height and the description follow the
// batch too.
type Drawing struct {
	Head   string // from "<svg" to the space before the viewBox's height
	Height string // the viewBox's height
	Mid    string // from the viewBox's height to "<desc>"
	Desc   string // the text alternative, escaped
	Static string // the static layer's content
	Batch  string // the batch layer's content
}

// ViewBox is the value of the root's viewBox attribute.
func (d *Drawing) ViewBox() string {
	return "0 0 " + strconv.Itoa(chartWidth) + " " + d.Height
}

// The markup between the parts of a Drawing. Each layer's content is exactly
// Static or Batch, so a page can set it as the layer's inner markup.
const (
	staticOpen = "</desc>\n<rect width=\"100%\" height=\"100%\" fill=\"#fff\"/>\n<g data-layer=\"static\">"
	batchOpen  = "</g>\n<g data-layer=\"batch\">"
	svgClose   = "</g>\n</svg>\n"
)

// SVG is the whole document.
func (d *Drawing) SVG() string {
	return d.Head + d.Height + d.Mid + d.Desc + staticOpen + d.Static + batchOpen + d.Batch + svgClose
}

// Renderer draws charts one after another and keeps what it drew last, so
// that a chart whose static layer (see Drawing) is the same as the last one's
// reuses it instead of drawing it again. The zero value is ready to use.
type Renderer struct {
	last     Drawing
	haveLast bool
	key, old []byte // what the static layer was drawn from: now and last time
	w        svgWriter
}

// Draw draws c. same reports that the static layer is the one of the last
// chart drawn (byte for byte the same text; only Height, Desc and Batch can
// differ). Errors are those of Render; after one the next chart is drawn
// whole.
func (r *Renderer) Draw(c Chart) (d Drawing, same bool, err error) {
	if err := c.check(); err != nil {
		r.haveLast = false
		return Drawing{}, false, err
	}
	l, err := c.layout()
	if err != nil {
		r.haveLast = false
		return Drawing{}, false, err
	}
	r.key, r.old = l.staticKey(r.old[:0]), r.key
	same = r.haveLast && string(r.key) == string(r.old)
	w := &r.w
	if w.b == nil {
		w.b = make([]byte, 0, 8192)
	}
	// Head and Mid.
	w.b = w.b[:0]
	w.s(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 `)
	w.num(chartWidth)
	w.s(" ")
	if same {
		d.Head = r.last.Head
	} else {
		d.Head = string(w.b)
	}
	w.b = w.b[:0]
	w.num(math.Ceil(l.height))
	d.Height = string(w.b)
	if same {
		d.Mid = r.last.Mid
	} else {
		w.b = w.b[:0]
		w.s(`" width="100%" role="img" aria-label="`)
		w.text(c.Title)
		w.s(`" font-family="`)
		w.s(fontFamily)
		w.s(`">`)
		w.s("\n<title>")
		w.text(c.Title)
		w.s("</title>\n<desc>")
		d.Mid = string(w.b)
	}
	w.b = w.b[:0]
	if c.Desc != "" {
		w.text(c.Desc)
	} else {
		l.describe(w)
	}
	d.Desc = string(w.b)
	if same {
		d.Static = r.last.Static
	} else {
		w.b = w.b[:0]
		l.drawStatic(w)
		d.Static = string(w.b)
	}
	w.b = w.b[:0]
	l.drawBatch(w)
	d.Batch = string(w.b)
	if cap(w.b) > 1<<16 {
		w.b = nil // do not keep a large buffer after a large chart
	}
	r.last, r.haveLast = d, true
	return d, same, nil
}

// layout is a chart placed on the page: scales, ticks and legend rows.
type layout struct {
	c                      *Chart
	xt, yt                 Ticks
	left, top, plotW       float64
	height                 float64
	titleLines             []string
	legend                 []legendItem
	legendTop, notesTop    float64
	bandColour             []string // colour of each band, by index
	curveOrd               []int    // ordinal of each series among curves (-1 if not a curve)
	xAxisTitle, yAxisTitle string
}

type legendItem struct {
	label      string
	x, y       float64
	kind       int // 0 series, 1 band, 2 marker
	series     *Series
	ord        int
	shape      Shape
	bandColour string
}

func (c *Chart) layout() (*layout, error) {
	l := &layout{c: c}
	// Data bounds.
	minX, maxX, minY, maxY := math.Inf(1), math.Inf(-1), math.Inf(1), math.Inf(-1)
	add := func(x, y float64) {
		minX, maxX = math.Min(minX, x), math.Max(maxX, x)
		minY, maxY = math.Min(minY, y), math.Max(maxY, y)
	}
	for _, s := range c.Series {
		for _, p := range s.Points {
			add(p.X, p.Y)
		}
	}
	for _, b := range c.Bands {
		for _, p := range b.Edge {
			add(p.X, p.Y)
		}
		for _, p := range b.Limit {
			add(p.X, p.Y)
		}
	}
	for _, m := range c.Markers {
		add(m.X, m.Y)
	}
	if c.X.FromZero {
		minX, maxX = math.Min(minX, 0), math.Max(maxX, 0)
	}
	if c.Y.FromZero {
		minY, maxY = math.Min(minY, 0), math.Max(maxY, 0)
	}
	var ok bool
	if l.xt, ok = NiceTicks(minX, maxX, 8); !ok || len(l.xt.Values()) == 0 {
		return nil, &DataError{Where: "x axis", Problem: "the data span " + formatSig(minX, 3, false) + " to " + formatSig(maxX, 3, false) + " cannot be labelled"}
	}
	if l.yt, ok = NiceTicks(minY, maxY, 6); !ok || len(l.yt.Values()) == 0 {
		return nil, &DataError{Where: "y axis", Problem: "the data span " + formatSig(minY, 3, false) + " to " + formatSig(maxY, 3, false) + " cannot be labelled"}
	}

	// Left margin: rotated y title plus the widest y tick label.
	wy := 0.0
	for _, v := range l.yt.Values() {
		wy = math.Max(wy, textWidth(l.yt.Label(v, c.DecimalComma), fontTick))
	}
	// Labels wider than a third of the chart are clipped by the frame rather
	// than squeezing the plot away.
	l.left = outerMargin + fontAxis + 14 + math.Min(wy, chartWidth/3) + 10
	right := outerMargin + math.Min(textWidth(l.xt.Label(l.xt.Hi, c.DecimalComma), fontTick)/2, chartWidth/6)
	l.plotW = chartWidth - l.left - right
	l.xAxisTitle = axisTitle(c.X)
	l.yAxisTitle = axisTitle(c.Y)

	// Title, wrapped to the width.
	l.titleLines = wrap(c.Title, fontTitle, chartWidth-2*outerMargin, 2)
	l.top = outerMargin + 12 + float64(len(l.titleLines))*(fontTitle+6)
	if len(l.titleLines) == 0 {
		l.top = outerMargin + 12
	}

	// Colours of curves and bands.
	l.curveOrd = make([]int, len(c.Series))
	n := 0
	for i, s := range c.Series {
		l.curveOrd[i] = -1
		if s.Kind == Curve {
			l.curveOrd[i] = n
			n++
		}
	}
	l.bandColour = make([]string, len(c.Bands))
	for i := range c.Bands {
		l.bandColour[i] = palette[i%len(palette)]
	}

	// Legend: curves, bands (once per label), other lines, markers.
	items := make([]legendItem, 0, len(c.Series)+len(c.Bands)+len(c.Markers))
	for i := range c.Series {
		s := &c.Series[i]
		if s.Label != "" && s.Kind == Curve {
			items = append(items, legendItem{label: s.Label, kind: 0, series: s, ord: l.curveOrd[i]})
		}
	}
	seen := map[string]bool{}
	for i, b := range c.Bands {
		if b.Label != "" && !seen[b.Label] {
			seen[b.Label] = true
			items = append(items, legendItem{label: b.Label, kind: 1, bandColour: l.bandColour[i]})
		}
	}
	for i := range c.Series {
		s := &c.Series[i]
		if s.Label != "" && s.Kind != Curve {
			items = append(items, legendItem{label: s.Label, kind: 0, series: s})
		}
	}
	for i, m := range c.Markers {
		if m.Label != "" {
			items = append(items, legendItem{label: m.Label, kind: 2, ord: i, shape: m.Shape})
		}
	}
	plotBottom := l.top + plotHeight
	l.legendTop = plotBottom + fontTick + 10 + fontAxis + 22
	x0, x1 := l.left, chartWidth-outerMargin
	x, y := x0, l.legendTop
	l.legend = items[:0] // laid out in place
	for _, it := range items {
		maxText := x1 - x0 - legendSwW - 8
		it.label = truncate(it.label, fontLegend, maxText)
		wItem := legendSwW + 8 + textWidth(it.label, fontLegend)
		if x > x0 && x+wItem > x1 {
			x, y = x0, y+legendRow
		}
		it.x, it.y = x, y
		l.legend = append(l.legend, it)
		x += wItem + 26
	}
	l.notesTop = l.legendTop
	if len(l.legend) > 0 {
		l.notesTop = y + legendRow
	}
	l.height = l.notesTop + float64(len(c.Notes))*(fontLegend+8) + outerMargin - 8
	return l, nil
}

func axisTitle(a Axis) string {
	switch {
	case a.Unit == "":
		return a.Label
	case a.Label == "":
		return a.Unit
	}
	return a.Label + " (" + a.Unit + ")"
}

// px and py map data to SVG coordinates.
func (l *layout) px(x float64) float64 {
	return l.left + (x-l.xt.Lo)/(l.xt.Hi-l.xt.Lo)*l.plotW
}

func (l *layout) py(y float64) float64 {
	return l.top + plotHeight - (y-l.yt.Lo)/(l.yt.Hi-l.yt.Lo)*plotHeight
}

// staticKey appends to key everything the static layer is drawn from.
func (l *layout) staticKey(key []byte) []byte {
	c := l.c
	u := func(v uint64) {
		key = append(key, byte(v), byte(v>>8), byte(v>>16), byte(v>>24), byte(v>>32), byte(v>>40), byte(v>>48), byte(v>>56))
	}
	f := func(v float64) { u(math.Float64bits(v)) }
	str := func(s string) {
		u(uint64(len(s)))
		key = append(key, s...)
	}
	if c.DecimalComma {
		key = append(key, 1)
	} else {
		key = append(key, 0)
	}
	for _, v := range [...]float64{l.xt.Lo, l.xt.Hi, l.xt.Step, l.yt.Lo, l.yt.Hi, l.yt.Step, float64(l.xt.Decimals), float64(l.yt.Decimals), l.left, l.top, l.plotW} {
		f(v)
	}
	str(c.Title)
	str(l.xAxisTitle)
	str(l.yAxisTitle)
	pts := func(p []Point) {
		f(float64(len(p)))
		for _, q := range p {
			f(q.X)
			f(q.Y)
		}
	}
	f(float64(len(c.Bands)))
	for _, b := range c.Bands {
		pts(b.Edge)
		pts(b.Limit)
	}
	for i, s := range c.Series {
		if s.Kind == Curve || s.Kind == Reference {
			f(float64(i))
			f(float64(s.Kind))
			f(float64(l.curveOrd[i]))
			pts(s.Points)
		}
	}
	return key
}

// drawStatic draws the static layer: title, grid, axes, bands and curves.
func (l *layout) drawStatic(w *svgWriter) {
	c := l.c
	for i, t := range l.titleLines {
		w.s(`<text x="`)
		w.num(outerMargin)
		w.s(`" y="`)
		w.num(outerMargin + fontTitle + float64(i)*(fontTitle+6))
		w.s(`" font-size="19" font-weight="700" fill="` + ink + `">`)
		w.text(t)
		w.s("</text>\n")
	}

	l.drawGrid(w)
	for i := range c.Bands {
		l.drawBand(w, i)
	}
	for _, k := range [...]Kind{Reference, Curve} {
		for i := range c.Series {
			if c.Series[i].Kind == k {
				l.drawSeries(w, i)
			}
		}
	}
}

// drawBatch draws the batch layer: paths and jumps, markers, legend and notes.
func (l *layout) drawBatch(w *svgWriter) {
	c := l.c
	for _, k := range [...]Kind{Jump, Path} {
		for i := range c.Series {
			if c.Series[i].Kind == k {
				l.drawSeries(w, i)
			}
		}
	}
	for i := range c.Markers {
		m := c.Markers[i]
		l.drawMarker(w, m.Shape, l.px(m.X), l.py(m.Y))
	}
	l.drawLegend(w)
	for i, n := range c.Notes {
		w.s(`<text x="`)
		w.num(l.left)
		w.s(`" y="`)
		w.num(l.notesTop + float64(i)*(fontLegend+8) + fontLegend - 4)
		w.s(`" font-size="16" fill="` + grey + `">`)
		w.text(n)
		w.s("</text>\n")
	}
}

func (l *layout) drawGrid(w *svgWriter) {
	c := l.c
	top, bottom, left, right := l.top, l.top+plotHeight, l.left, l.left+l.plotW
	w.s(`<g stroke="#CCCCCC" stroke-width="1">`)
	for _, v := range l.xt.Values() {
		w.s(`<line`)
		w.attr("x1", l.px(v))
		w.attr("x2", l.px(v))
		w.attr("y1", top)
		w.attr("y2", bottom)
		w.s(`/>`)
	}
	for _, v := range l.yt.Values() {
		w.s(`<line`)
		w.attr("x1", left)
		w.attr("x2", right)
		w.attr("y1", l.py(v))
		w.attr("y2", l.py(v))
		w.s(`/>`)
	}
	w.s("</g>\n")
	// Frame.
	w.s(`<rect fill="none" stroke="` + ink + `" stroke-width="1.5"`)
	w.attr("x", left)
	w.attr("y", top)
	w.attr("width", l.plotW)
	w.attr("height", plotHeight)
	w.s("/>\n")
	// Tick labels.
	w.s(`<g font-size="16" fill="` + ink + `" text-anchor="middle">`)
	for _, v := range l.xt.Values() {
		w.s(`<text`)
		w.attr("x", l.px(v))
		w.attr("y", bottom+fontTick+6)
		w.s(">")
		w.text(l.xt.Label(v, c.DecimalComma))
		w.s("</text>")
	}
	w.s("</g>\n")
	w.s(`<g font-size="16" fill="` + ink + `" text-anchor="end">`)
	for _, v := range l.yt.Values() {
		w.s(`<text`)
		w.attr("x", left-8)
		w.attr("y", l.py(v)+fontTick*0.35)
		w.s(">")
		w.text(l.yt.Label(v, c.DecimalComma))
		w.s("</text>")
	}
	w.s("</g>\n")
	// Axis titles.
	w.s(`<text font-size="17" fill="` + ink + `" text-anchor="middle"`)
	w.attr("x", left+l.plotW/2)
	w.attr("y", bottom+fontTick+10+fontAxis+6)
	w.s(">")
	w.text(l.xAxisTitle)
	w.s("</text>\n")
	cy := top + plotHeight/2
	w.s(`<text font-size="17" fill="` + ink + `" text-anchor="middle" transform="rotate(-90)"`)
	w.attr("x", -cy)
	w.attr("y", outerMargin+fontAxis-2)
	w.s(">")
	w.text(truncate(l.yAxisTitle, fontAxis, plotHeight))
	w.s("</text>\n")
}

// points appends the "points" attribute of a polyline or polygon.
func (l *layout) points(w *svgWriter, pts []Point, reverse bool) {
	for i := range pts {
		p := pts[i]
		if reverse {
			p = pts[len(pts)-1-i]
		}
		if w.b[len(w.b)-1] != '"' {
			w.s(" ")
		}
		w.num(l.px(p.X))
		w.s(",")
		w.num(l.py(p.Y))
	}
}

func (l *layout) drawBand(w *svgWriter, i int) {
	b := l.c.Bands[i]
	col := l.bandColour[i]
	if len(b.Edge)+len(b.Limit) >= 3 {
		w.s3(`<polygon fill="`, col, `" fill-opacity="0.16" stroke="none" points="`)
		l.points(w, b.Edge, false)
		l.points(w, b.Limit, true)
		w.s("\"/>\n")
	}
	if len(b.Limit) >= 2 {
		w.s3(`<polyline fill="none" stroke="`, col, `" stroke-width="2.5" stroke-dasharray="0.1 6" stroke-linecap="round" points="`)
		l.points(w, b.Limit, false)
		w.s("\"/>\n")
	}
}

// lineStyle returns the stroke attributes of series i.
func (l *layout) lineStyle(s *Series, ord int) (colour string, width float64, dash string) {
	switch s.Kind {
	case Path:
		return ink, pathWidth, ""
	case Jump:
		return ink, 2.5, "9 6"
	case Reference:
		return grey, 2, "5 4"
	}
	return palette[ord%len(palette)], curveWidth, curveDashes[ord%len(curveDashes)]
}

func (l *layout) strokeAttrs(w *svgWriter, colour string, width float64, dash string) {
	w.s3(` fill="none" stroke="`, colour, `"`)
	w.attr("stroke-width", width)
	if dash != "" {
		w.s3(` stroke-dasharray="`, dash, `"`)
		if dash == curveDashes[len(curveDashes)-1] {
			w.s(` stroke-linecap="round"`)
		}
	}
	w.s(` stroke-linejoin="round"`)
}

func (l *layout) drawSeries(w *svgWriter, i int) {
	s := &l.c.Series[i]
	if len(s.Points) == 0 {
		return
	}
	colour, width, dash := l.lineStyle(s, l.curveOrd[i])
	if len(s.Points) == 1 {
		// A lone point of a line: a dot, so it is not lost.
		w.s3(`<circle fill="`, colour, `"`)
		w.attr("cx", l.px(s.Points[0].X))
		w.attr("cy", l.py(s.Points[0].Y))
		w.attr("r", width)
		w.s("/>\n")
		return
	}
	w.s(`<polyline`)
	l.strokeAttrs(w, colour, width, dash)
	w.s(` points="`)
	l.points(w, s.Points, false)
	w.s("\"/>\n")
	if s.Kind == Path || s.Kind == Jump {
		l.midArrow(w, s.Points, colour)
	}
}

// midArrow draws an arrowhead along the polyline (measured on the page),
// pointing the way the points run. It goes half way along, or the nearest
// place to that clear of the chart's markers, so that no marker hides it.
func (l *layout) midArrow(w *svgWriter, pts []Point, colour string) {
	total := 0.0
	for i := 1; i < len(pts); i++ {
		total += math.Hypot(l.px(pts[i].X)-l.px(pts[i-1].X), l.py(pts[i].Y)-l.py(pts[i-1].Y))
	}
	if total < 30 {
		return
	}
	const clear = 2.5 * markerSize // distance from a marker's centre
	var tipX, tipY, ux, uy float64
	for _, f := range [...]float64{0.5, 0.4, 0.6, 0.3, 0.7, 0.2, 0.8, 0.5} {
		tipX, tipY, ux, uy = l.along(pts, f*total)
		free := true
		for _, m := range l.c.Markers {
			if math.Hypot(l.px(m.X)-tipX, l.py(m.Y)-tipY) < clear {
				free = false
				break
			}
		}
		if free {
			break
		}
	}
	const length, halfW = 16.0, 7.5
	tipX, tipY = tipX+ux*length/2, tipY+uy*length/2
	bx, by := tipX-ux*length, tipY-uy*length
	w.s3(`<polygon fill="`, colour, `" points="`)
	w.num(tipX)
	w.s(",")
	w.num(tipY)
	w.s(" ")
	w.num(bx - uy*halfW)
	w.s(",")
	w.num(by + ux*halfW)
	w.s(" ")
	w.num(bx + uy*halfW)
	w.s(",")
	w.num(by - ux*halfW)
	w.s("\"/>\n")
}

// along returns the page position at distance d along the polyline and the
// unit direction of the segment there.
func (l *layout) along(pts []Point, d float64) (x, y, ux, uy float64) {
	run := 0.0
	for i := 1; i < len(pts); i++ {
		x0, y0 := l.px(pts[i-1].X), l.py(pts[i-1].Y)
		dx, dy := l.px(pts[i].X)-x0, l.py(pts[i].Y)-y0
		n := math.Hypot(dx, dy)
		if n == 0 {
			continue
		}
		ux, uy = dx/n, dy/n
		if run+n >= d || i == len(pts)-1 {
			t := math.Min(1, (d-run)/n)
			return x0 + dx*t, y0 + dy*t, ux, uy
		}
		run += n
	}
	return l.px(pts[0].X), l.py(pts[0].Y), 1, 0
}

// drawMarker draws the symbol of shape at (x, y) in SVG units.
// Filled symbols have a white rim so they stand out on top of lines.
func (l *layout) drawMarker(w *svgWriter, shape Shape, x, y float64) {
	col := markerColours[shape]
	r := markerSize
	switch shape {
	case Circle:
		w.s3(`<circle fill="`, col, `" stroke="#fff" stroke-width="2"`)
		w.attr("cx", x)
		w.attr("cy", y)
		w.attr("r", r)
		w.s("/>\n")
	case Square:
		r *= 0.9
		w.s3(`<rect fill="`, col, `" stroke="#fff" stroke-width="2"`)
		w.attr("x", x-r)
		w.attr("y", y-r)
		w.attr("width", 2*r)
		w.attr("height", 2*r)
		w.s("/>\n")
	case Cross:
		w.s(`<path fill="none" stroke="#fff" stroke-width="7" stroke-linecap="round" d="`)
		crossPath(w, x, y, r)
		w.s("\"/>\n")
		w.s3(`<path fill="none" stroke="`, col, `" stroke-width="3.5" stroke-linecap="round" d="`)
		crossPath(w, x, y, r)
		w.s("\"/>\n")
	default:
		var pts [4][2]float64
		n := 4
		switch shape {
		case Diamond:
			r *= 1.25
			pts = [4][2]float64{{x, y - r}, {x + r, y}, {x, y + r}, {x - r, y}}
		case TriangleUp:
			r *= 1.2
			pts = [4][2]float64{{x, y - r}, {x + r, y + r*0.75}, {x - r, y + r*0.75}}
			n = 3
		case TriangleDown:
			r *= 1.2
			pts = [4][2]float64{{x, y + r}, {x - r, y - r*0.75}, {x + r, y - r*0.75}}
			n = 3
		}
		w.s3(`<polygon fill="`, col, `" stroke="#fff" stroke-width="2" stroke-linejoin="round" points="`)
		for i := 0; i < n; i++ {
			if i > 0 {
				w.s(" ")
			}
			w.num(pts[i][0])
			w.s(",")
			w.num(pts[i][1])
		}
		w.s("\"/>\n")
	}
}

func crossPath(w *svgWriter, x, y, r float64) {
	r *= 0.85
	w.s("M")
	w.num(x - r)
	w.s(" ")
	w.num(y - r)
	w.s("L")
	w.num(x + r)
	w.s(" ")
	w.num(y + r)
	w.s("M")
	w.num(x - r)
	w.s(" ")
	w.num(y + r)
	w.s("L")
	w.num(x + r)
	w.s(" ")
	w.num(y - r)
}

func (l *layout) drawLegend(w *svgWriter) {
	if len(l.legend) == 0 {
		return
	}
	w.s(`<g font-size="16" fill="` + ink + `">` + "\n")
	for _, it := range l.legend {
		cy := it.y + legendRow/2 - 4
		switch it.kind {
		case 0:
			colour, width, dash := l.lineStyle(it.series, it.ord)
			w.s(`<line`)
			l.strokeAttrs(w, colour, width, dash)
			w.attr("x1", it.x)
			w.attr("x2", it.x+legendSwW)
			w.attr("y1", cy)
			w.attr("y2", cy)
			w.s("/>")
			if it.series.Kind == Path || it.series.Kind == Jump {
				w.s3(`<polygon fill="`, colour, `" points="`)
				w.num(it.x + legendSwW)
				w.s(",")
				w.num(cy)
				w.s(" ")
				w.num(it.x + legendSwW - 14)
				w.s(",")
				w.num(cy - 6.5)
				w.s(" ")
				w.num(it.x + legendSwW - 14)
				w.s(",")
				w.num(cy + 6.5)
				w.s(`"/>`)
			}
		case 1:
			w.s3(`<rect fill="`, it.bandColour, `" fill-opacity="0.16"`)
			w.attr("x", it.x)
			w.attr("y", cy-10)
			w.attr("width", legendSwW)
			w.attr("height", 20)
			w.s3(`/><line stroke="`, it.bandColour, `" stroke-width="2.5" stroke-dasharray="0.1 6" stroke-linecap="round"`)
			w.attr("x1", it.x+3)
			w.attr("x2", it.x+legendSwW)
			w.attr("y1", cy-10)
			w.attr("y2", cy-10)
			w.s("/>")
		case 2:
			l.drawMarker(w, it.shape, it.x+legendSwW/2, cy)
		}
		w.s(`<text`)
		w.attr("x", it.x+legendSwW+8)
		w.attr("y", cy+fontLegend*0.35)
		w.s(">")
		w.text(it.label)
		w.s("</text>\n")
	}
	w.s("</g>\n")
}

// describe appends the text alternative of the chart, escaped: axes, lines
// with their ranges, and every marker with its coordinates.
func (l *layout) describe(w *svgWriter) {
	c := l.c
	comma := c.DecimalComma
	if c.Title != "" {
		w.text(c.Title)
		w.s(". ")
	}
	w.s("Horizontal axis: ")
	w.text(l.xAxisTitle)
	w.s(", ")
	w.text(l.xt.Label(l.xt.Lo, comma))
	w.s(" to ")
	w.text(l.xt.Label(l.xt.Hi, comma))
	w.s(". Vertical axis: ")
	w.text(l.yAxisTitle)
	w.s(", ")
	w.text(l.yt.Label(l.yt.Lo, comma))
	w.s(" to ")
	w.text(l.yt.Label(l.yt.Hi, comma))
	w.s(".")
	for _, s := range c.Series {
		if s.Label == "" || len(s.Points) == 0 {
			continue
		}
		first, last := s.Points[0], s.Points[len(s.Points)-1]
		w.s(" ")
		w.text(s.Label)
		w.s(": from ")
		l.pair(w, first)
		w.s(" to ")
		l.pair(w, last)
		w.s(".")
	}
	for _, m := range c.Markers {
		w.s(" ")
		w.text(m.Label)
		w.s(": ")
		l.pair(w, Point{m.X, m.Y})
		w.s(".")
	}
}

// pair appends a point with its units, e.g. "35 °C, 55.1 g/100 g water".
func (l *layout) pair(w *svgWriter, p Point) {
	w.text(formatShort(p.X, 4, l.c.DecimalComma))
	if l.c.X.Unit != "" {
		w.s(" ")
		w.text(l.c.X.Unit)
	}
	w.s(", ")
	w.text(formatShort(p.Y, 4, l.c.DecimalComma))
	if l.c.Y.Unit != "" {
		w.s(" ")
		w.text(l.c.Y.Unit)
	}
}

// wrap breaks s into at most max lines of the given width; the last line is
// truncated if needed. It measures each word once, so long text costs
// linear time.
func wrap(s string, size, width float64, max int) []string {
	words := strings.Fields(s)
	if len(words) == 0 {
		return nil
	}
	space := textWidth(" ", size)
	var lines []string
	start, w := 0, 0.0 // first word of the current line, its width so far
	for i, wd := range words {
		ww := textWidth(wd, size)
		if i > start && w+space+ww > width {
			if len(lines) == max-1 {
				break
			}
			lines = append(lines, strings.Join(words[start:i], " "))
			start, w = i, ww
			continue
		}
		if i > start {
			w += space
		}
		w += ww
	}
	return append(lines, truncate(strings.Join(words[start:], " "), size, width))
}

// truncate shortens s with "…" so that it fits width.
func truncate(s string, size, width float64) string {
	if textWidth(s, size) <= width {
		return s
	}
	limit := width - textWidth("…", size)
	w := 0.0
	for i, r := range s {
		w += textWidth(string(r), size)
		if w > limit {
			return s[:i] + "…"
		}
	}
	return s
}

// Placeholder returns a small SVG of the same width as a chart that shows
// title and a message, e.g. err.Error() from Render, instead of a chart.
func Placeholder(title, message string) string {
	w := &svgWriter{b: make([]byte, 0, 1024)}
	lines := wrap(message, fontAxis, chartWidth-4*outerMargin, 3)
	h := 2*outerMargin + 40 + float64(len(lines))*(fontAxis+8) + 24
	w.s(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 768 `)
	w.num(math.Ceil(h))
	w.s(`" width="100%" role="img" aria-label="`)
	w.text(title)
	w.s(`" font-family="` + fontFamily + `">` + "\n<title>")
	w.text(title)
	w.s("</title>\n<desc>")
	w.text(message)
	w.s("</desc>\n")
	w.s(`<rect x="1" y="1" width="766" fill="#fff" stroke="` + grey + `" stroke-width="2" stroke-dasharray="8 6"`)
	w.attr("height", math.Ceil(h)-2)
	w.s("/>\n")
	w.s(`<text x="32" y="52" font-size="19" font-weight="700" fill="` + ink + `">`)
	w.text(truncate(title, fontTitle, chartWidth-4*outerMargin))
	w.s("</text>\n")
	for i, ln := range lines {
		w.s(`<text x="32" font-size="17" fill="` + ink + `"`)
		w.attr("y", 52+34+float64(i)*(fontAxis+8))
		w.s(">")
		w.text(ln)
		w.s("</text>\n")
	}
	w.s("</svg>\n")
	return string(w.b)
}
