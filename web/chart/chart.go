package chart

import (
	"errors"
	"strconv"
)

// Point is one data point in the units shown on the axes.
type Point struct{ X, Y float64 }

// Kind says what a Series stands for, which decides how it is drawn.
type Kind int

const (
	// Curve is an equilibrium curve, such as the solubility of one solid
	// phase. Curves take their colour and dash pattern from their order among
	// the chart's curves: solid, long dash, dash-dot, short dash, and round.
	Curve Kind = iota
	// Path is the route a batch takes: heavy, near-black, with an arrowhead
	// at its last point.
	Path
	// Jump is a sudden change, such as the temperature rise of a seeded
	// supersaturated batch: dashed near-black with an arrowhead.
	Jump
	// Reference is a guide line for comparison: thin grey dashes.
	Reference
)

// Series is one line of the chart, drawn through its points in order.
type Series struct {
	Label  string // shown in the legend; empty keeps it out of the legend
	Points []Point
	Kind   Kind
}

// Shape is the symbol of a Marker. Shapes differ so that markers can be
// told apart without colour.
type Shape int

const (
	Circle Shape = iota
	Square
	Diamond
	TriangleUp
	TriangleDown
	Cross
	numShapes
)

// Marker is a labelled point such as the dissolve point or the day's
// oxygen saturation. Its label appears in the legend beside its symbol.
type Marker struct {
	Label string
	X, Y  float64
	Shape Shape
}

// Band is a shaded zone between two lines: Edge (usually a curve drawn as a
// Series as well) and Limit, whose far side is drawn dotted. The metastable
// zone is a band from the solubility curve to the same curve shifted to a
// lower temperature by the zone's width.
type Band struct {
	Label       string
	Edge, Limit []Point
}

// Axis names one axis and its unit, e.g. {"Temperature", "°C"}.
type Axis struct {
	Label, Unit string
	// FromZero makes the axis include zero, so that amounts are not
	// exaggerated by a cut-off axis.
	FromZero bool
}

// Chart is everything Render needs. Title is shown above the plot and is
// also the accessible name of the image; Desc, if empty, is written from
// the data for screen readers.
type Chart struct {
	Title   string
	Desc    string
	X, Y    Axis
	Series  []Series
	Bands   []Band
	Markers []Marker
	// Notes are short lines printed under the legend, e.g. that a curve is
	// extrapolated.
	Notes []string
	// DecimalComma prints tick labels and numbers with a decimal comma.
	DecimalComma bool
}

// ErrNoData is returned by Render for a chart with no points at all.
var ErrNoData = errors.New("chart: nothing to draw yet")

// DataError reports a number that cannot be drawn: where it is (series,
// band or marker and the point's position) and what is wrong with it.
type DataError struct {
	Where   string // e.g. `series "KNO3" point 4`
	Problem string // e.g. "y is NaN"
}

func (e *DataError) Error() string {
	return "chart: " + e.Where + ": " + e.Problem + "; allowed: finite numbers"
}

// check refuses non-finite numbers and reports whether there is anything to
// draw.
func (c *Chart) check() error {
	n := 0
	for _, s := range c.Series {
		if err := checkPoints("series", s.Label, s.Points); err != nil {
			return err
		}
		if s.Kind < Curve || s.Kind > Reference {
			return &DataError{Where: "series " + strconv.Quote(s.Label), Problem: "unknown kind " + strconv.Itoa(int(s.Kind))}
		}
		n += len(s.Points)
	}
	for _, b := range c.Bands {
		if err := checkPoints("band", b.Label, b.Edge); err != nil {
			return err
		}
		if err := checkPoints("band", b.Label, b.Limit); err != nil {
			return err
		}
		n += len(b.Edge) + len(b.Limit)
	}
	for i, m := range c.Markers {
		if !finite(m.X) || !finite(m.Y) {
			return checkPoint("marker "+strconv.Itoa(i+1)+" "+strconv.Quote(m.Label), Point{m.X, m.Y})
		}
		if m.Shape < 0 || m.Shape >= numShapes {
			return &DataError{Where: "marker " + strconv.Quote(m.Label), Problem: "unknown shape " + strconv.Itoa(int(m.Shape))}
		}
		n++
	}
	if n == 0 {
		return ErrNoData
	}
	return nil
}

func checkPoints(what, label string, pts []Point) error {
	for i, p := range pts {
		if !finite(p.X) || !finite(p.Y) {
			return checkPoint(what+" "+strconv.Quote(label)+" point "+strconv.Itoa(i+1), p)
		}
	}
	return nil
}

func checkPoint(where string, p Point) error {
	switch {
	case !finite(p.X):
		return &DataError{Where: where, Problem: "x is " + nonFinite(p.X)}
	case !finite(p.Y):
		return &DataError{Where: where, Problem: "y is " + nonFinite(p.Y)}
	}
	return nil
}

func nonFinite(v float64) string {
	if v != v {
		return "NaN"
	}
	if v > 0 {
		return "+Inf"
	}
	return "-Inf"
}
