package chart

// The palette is our own darkening of four hues from the colour-blind-safe
// set of Okabe & Ito ("Color Universal Design", 2008): blue, vermilion,
// bluish green and reddish purple, each darkened until its contrast with
// white is at least 4.5:1 (WCAG 2.1), so thin lines stay visible in bright
// light. Colour is never the only cue: see dashes and shapes.
var palette = [...]string{"#0072B2", "#C24E00", "#007D5A", "#A8548A"}

// ink is the near-black of the batch path, axes and text.
const ink = "#1A1A1A"

// grey is the colour of reference lines and secondary text (6.5:1 on white).
const grey = "#5E5E5E"

// curveDashes are the dash patterns of successive curves (in px at the
// chart's natural size); "" is a solid line.
var curveDashes = [...]string{"", "14 6", "14 5 3 5", "6 5", "2 5"}

// markerColours gives each Shape its own colour, so a kind of point looks
// the same on every chart (the dissolve point is always a vermilion
// diamond, the end point always a near-black square).
var markerColours = [numShapes]string{
	Circle:       "#007D5A",
	Square:       ink,
	Diamond:      "#C24E00",
	TriangleUp:   "#A8548A",
	TriangleDown: "#0072B2",
	Cross:        ink,
}

// Sizes at the chart's natural width of 768 px.
const (
	chartWidth  = 768.0
	plotHeight  = 340.0
	fontTick    = 16.0
	fontAxis    = 17.0
	fontTitle   = 19.0
	fontLegend  = 16.0
	curveWidth  = 3.0
	pathWidth   = 4.0
	markerSize  = 8.0 // half-width of a marker symbol
	legendRow   = 30.0
	legendSwW   = 44.0 // legend swatch width
	fontFamily  = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Noto Sans', sans-serif"
	outerMargin = 16.0
)
