package solubility

import (
	"math"
	"slices"

	"saltcast/core/unit"
)

// Table interpolates measured points with the Fritsch–Carlson monotone piecewise cubic in
// (1/T, ln x). Between points of rising (or falling) solubility it rises (or falls); at a
// local maximum of the data it has zero slope, so it never overshoots a data point. Outside
// the points it continues along the straight line of the end slope (a van 't Hoff
// extrapolation); Curve.At limits how far.
type Table struct {
	pts        []Point   // sorted by temperature
	u, y, d    []float64 // 1/T ascending, ln x, dy/du at each node
	molar, sol float64
}

// NewTable builds a table for a solute of molar mass molarMassGPerMol in water. It needs at
// least two points with distinct finite temperatures above −273.15 °C and positive finite
// solubilities; errors are *unit.FieldError for field "points".
func NewTable(points []Point, molarMassGPerMol float64) (Model, error) {
	return NewTableIn(points, molarMassGPerMol, WaterGPerMol)
}

// NewTableIn is NewTable for a solvent of molar mass solventGPerMol.
func NewTableIn(points []Point, molarMassGPerMol, solventGPerMol float64) (*Table, error) {
	if err := checkMolar(molarMassGPerMol, solventGPerMol); err != nil {
		return nil, err
	}
	if len(points) < 2 {
		return nil, &unit.FieldError{Field: "points", Value: unit.FormatCompact(float64(len(points)), 3) + " points",
			Allowed: "at least 2 points for a table"}
	}
	pts, err := checkPoints(points)
	if err != nil {
		return nil, err
	}
	n := len(pts)
	t := &Table{pts: pts, molar: molarMassGPerMol, sol: solventGPerMol,
		u: make([]float64, n), y: make([]float64, n), d: make([]float64, n)}
	// Store by ascending u = 1/T, i.e. descending temperature.
	for i, p := range pts {
		j := n - 1 - i
		t.u[j] = 1 / (p.TempC + 273.15)
		t.y[j] = math.Log(moleFractionIn(p.GPer100gWater, molarMassGPerMol, solventGPerMol))
	}
	fritschCarlson(t.u, t.y, t.d)
	return t, nil
}

// Points returns a copy of the table's points in order of temperature.
func (t *Table) Points() []Point { return slices.Clone(t.pts) }

// Kind names the model.
func (*Table) Kind() string { return "table" }

// Value returns g of solute per 100 g solvent at tempC.
func (t *Table) Value(tempC float64) float64 {
	return fromMoleFractionIn(math.Exp(t.lnX(1/(tempC+273.15))), t.molar, t.sol)
}

func (t *Table) lnX(u float64) float64 {
	n := len(t.u)
	if u <= t.u[0] {
		return t.y[0] + t.d[0]*(u-t.u[0])
	}
	if u >= t.u[n-1] {
		return t.y[n-1] + t.d[n-1]*(u-t.u[n-1])
	}
	// Largest k with u[k] <= u.
	lo, hi := 0, n-1
	for hi-lo > 1 {
		m := (lo + hi) / 2
		if t.u[m] <= u {
			lo = m
		} else {
			hi = m
		}
	}
	h := t.u[hi] - t.u[lo]
	s := (u - t.u[lo]) / h
	s2, s3 := s*s, s*s*s
	return (2*s3-3*s2+1)*t.y[lo] + (s3-2*s2+s)*h*t.d[lo] + (-2*s3+3*s2)*t.y[hi] + (s3-s2)*h*t.d[hi]
}

// fritschCarlson sets d to monotone Hermite slopes for the nodes (x ascending, y), following
// Fritsch & Carlson (1980): start from the mean of the adjacent secants (one-sided at the
// ends), set the slope to zero where the data change direction or are flat, and scale pairs
// of slopes back into the circle of radius 3 where they would overshoot.
func fritschCarlson(x, y, d []float64) {
	n := len(x)
	delta := make([]float64, n-1)
	for k := range n - 1 {
		delta[k] = (y[k+1] - y[k]) / (x[k+1] - x[k])
	}
	d[0], d[n-1] = delta[0], delta[n-2]
	for k := 1; k < n-1; k++ {
		if delta[k-1]*delta[k] <= 0 {
			d[k] = 0
		} else {
			d[k] = (delta[k-1] + delta[k]) / 2
		}
	}
	for k := range n - 1 {
		if delta[k] == 0 {
			d[k], d[k+1] = 0, 0
			continue
		}
		a, b := d[k]/delta[k], d[k+1]/delta[k]
		if a < 0 {
			d[k], a = 0, 0
		}
		if b < 0 {
			d[k+1], b = 0, 0
		}
		if r := a*a + b*b; r > 9 {
			tau := 3 / math.Sqrt(r)
			d[k] = tau * a * delta[k]
			d[k+1] = tau * b * delta[k]
		}
	}
}

func checkMolar(m, ms float64) error {
	if !(m > 0 && m < 1e6) {
		return unit.NumberError("molar_mass_g_per_mol", m, "a molar mass > 0 and < 1e6 g/mol")
	}
	if !(ms > 0 && ms < 1e6) {
		return unit.NumberError("solvent_molar_mass_g_per_mol", ms, "a molar mass > 0 and < 1e6 g/mol")
	}
	return nil
}

// checkPoints validates points and returns them sorted by temperature.
func checkPoints(points []Point) ([]Point, error) {
	pts := slices.Clone(points)
	for _, p := range pts {
		if !(p.TempC > -273.15 && p.TempC < 1e4) {
			return nil, unit.NumberError("points", p.TempC, "temperatures above −273.15 °C and below 10000 °C")
		}
		if !(p.GPer100gWater > 0 && p.GPer100gWater < 1e9) {
			return nil, unit.NumberError("points", p.GPer100gWater, "solubilities > 0 and < 1e9 g per 100 g solvent")
		}
	}
	slices.SortFunc(pts, func(a, b Point) int {
		switch {
		case a.TempC < b.TempC:
			return -1
		case a.TempC > b.TempC:
			return 1
		}
		return 0
	})
	for i := 1; i < len(pts); i++ {
		if pts[i].TempC == pts[i-1].TempC {
			return nil, unit.NumberError("points", pts[i].TempC, "one point per temperature (this temperature appears twice)")
		}
	}
	return pts, nil
}
