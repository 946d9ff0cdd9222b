package solubility

import (
	"math"
	"strconv"

	"saltcast/core/unit"
)

// FitResult is a fitted curve and how well it fits. Residuals are observed − fitted in g per
// 100 g solvent, in the order the points were given; RMS is their root mean square; R² is
// 1 − Σres²/Σ(obs − mean)² (1 when all points are equal and the fit passes through them).
// The fitted range is Curve.MinC to Curve.MaxC.
type FitResult struct {
	Curve     Curve
	Residuals []float64
	R2, RMS   float64
}

// FitOptions refines Fit. A zero SolventGPerMol means water; a zero Degree lets Fit choose
// the polynomial degree (min(3, n−2), at least 1, so there is always a spare point).
type FitOptions struct {
	SolventGPerMol float64
	Degree         int
}

// Fit kinds.
const (
	KindTable      = "table"
	KindVantHoff   = "vant-hoff"
	KindApelblat   = "apelblat"
	KindPolynomial = "polynomial"
)

// Fit fits a model of the named kind to points for a solute of molar mass molarMassGPerMol in
// water. See FitWith.
func Fit(kind string, points []Point, molarMassGPerMol float64) (FitResult, error) {
	return FitWith(kind, points, molarMassGPerMol, FitOptions{})
}

// FitWith fits a model of the named kind ("table", "vant-hoff", "apelblat", "polynomial").
// It needs at least 3 points with distinct finite temperatures and positive finite
// solubilities. A van 't Hoff line can only rise or only fall, so data with a maximum or a
// minimum are refused for it. Errors are *unit.FieldError (field "points", "kind",
// "degree" or a molar mass).
func FitWith(kind string, points []Point, molarMassGPerMol float64, opt FitOptions) (FitResult, error) {
	ms := solvent(opt.SolventGPerMol)
	if err := checkMolar(molarMassGPerMol, ms); err != nil {
		return FitResult{}, err
	}
	switch kind {
	case KindTable, KindVantHoff, KindApelblat, KindPolynomial:
	default:
		return FitResult{}, &unit.FieldError{Field: "kind", Value: kind, Allowed: "table, vant-hoff, apelblat or polynomial"}
	}
	if len(points) < 3 {
		return FitResult{}, &unit.FieldError{Field: "points", Value: strconv.Itoa(len(points)) + " points", Allowed: "at least 3 points"}
	}
	pts, err := checkPoints(points)
	if err != nil {
		return FitResult{}, err
	}
	var model Model
	switch kind {
	case KindTable:
		model, err = NewTableIn(pts, molarMassGPerMol, ms)
	case KindVantHoff:
		if !monotone(pts) {
			return FitResult{}, &unit.FieldError{Field: "points", Value: "data with a maximum or minimum",
				Allowed: "points whose solubility only rises or only falls with temperature for a van 't Hoff fit (use apelblat, polynomial or table, or split the data at the turn)"}
		}
		var c []float64
		c, err = lawFit(pts, molarMassGPerMol, ms, 2)
		if err == nil {
			model = VantHoff{A: c[0], B: c[1], MolarMassGPerMol: molarMassGPerMol, SolventGPerMol: opt.SolventGPerMol}
		}
	case KindApelblat:
		var c []float64
		c, err = lawFit(pts, molarMassGPerMol, ms, 3)
		if err == nil {
			model = Apelblat{A: c[0], B: c[1], C: c[2], MolarMassGPerMol: molarMassGPerMol, SolventGPerMol: opt.SolventGPerMol}
		}
	case KindPolynomial:
		deg := opt.Degree
		if deg == 0 {
			deg = max(1, min(3, len(pts)-2))
		}
		if deg < 1 || deg > 6 || deg > len(pts)-1 {
			return FitResult{}, &unit.FieldError{Field: "degree", Value: strconv.Itoa(deg),
				Allowed: "a polynomial degree from 1 to 6 and below the number of points"}
		}
		var c []float64
		c, err = polyFit(pts, deg)
		if err == nil {
			model = Polynomial{Coef: c}
		}
	}
	if err != nil {
		return FitResult{}, err
	}
	res := FitResult{
		Curve:     Curve{Model: model, MinC: pts[0].TempC, MaxC: pts[len(pts)-1].TempC, Source: "fit (" + kind + ") to " + strconv.Itoa(len(pts)) + " points"},
		Residuals: make([]float64, len(points)),
	}
	mean := 0.0
	for _, p := range points {
		mean += p.GPer100gWater
	}
	mean /= float64(len(points))
	var ssRes, ssTot float64
	for i, p := range points {
		f := model.Value(p.TempC)
		r := p.GPer100gWater - f
		if math.IsNaN(r) || math.IsInf(r, 0) || f < 0 {
			return FitResult{}, &unit.FieldError{Field: "points", Value: unit.FormatCompact(p.TempC, 6) + " °C",
				Allowed: "points a " + kind + " curve can follow with finite, non-negative values (try another kind)"}
		}
		res.Residuals[i] = r
		ssRes += r * r
		d := p.GPer100gWater - mean
		ssTot += d * d
	}
	res.RMS = math.Sqrt(ssRes / float64(len(points)))
	switch {
	case ssTot > 0:
		res.R2 = 1 - ssRes/ssTot
	case ssRes == 0:
		res.R2 = 1
	}
	if math.IsNaN(res.R2) || math.IsInf(res.R2, 0) || math.IsInf(res.RMS, 0) || math.IsNaN(res.RMS) {
		return FitResult{}, &unit.FieldError{Field: "points", Value: strconv.Itoa(len(points)) + " points",
			Allowed: "points of moderate size (the fit overflowed)"}
	}
	return res, nil
}

func monotone(pts []Point) bool {
	up, down := false, false
	for i := 1; i < len(pts); i++ {
		switch d := pts[i].GPer100gWater - pts[i-1].GPer100gWater; {
		case d > 0:
			up = true
		case d < 0:
			down = true
		}
	}
	return !(up && down)
}

// lawFit fits ln x = c0 + c1/T (+ c2 ln T) by least squares in ln x.
func lawFit(pts []Point, M, Ms float64, n int) ([]float64, error) {
	rows := make([][]float64, len(pts))
	rhs := make([]float64, len(pts))
	for i, p := range pts {
		T := p.TempC + 273.15
		r := []float64{1, 1 / T}
		if n == 3 {
			r = append(r, math.Log(T))
		}
		rows[i] = r
		rhs[i] = math.Log(moleFractionIn(p.GPer100gWater, M, Ms))
	}
	return leastSquares(rows, rhs)
}

// polyFit fits g = Σ c_k t^k in a scaled variable s = (t − mid)/half for conditioning and
// expands the result back to powers of t.
func polyFit(pts []Point, deg int) ([]float64, error) {
	lo, hi := pts[0].TempC, pts[len(pts)-1].TempC
	mid, half := (lo+hi)/2, (hi-lo)/2
	rows := make([][]float64, len(pts))
	rhs := make([]float64, len(pts))
	for i, p := range pts {
		s := (p.TempC - mid) / half
		r := make([]float64, deg+1)
		v := 1.0
		for k := range r {
			r[k] = v
			v *= s
		}
		rows[i] = r
		rhs[i] = p.GPer100gWater
	}
	a, err := leastSquares(rows, rhs)
	if err != nil {
		return nil, err
	}
	// Σ a_k ((t − mid)/half)^k expanded with the binomial theorem.
	c := make([]float64, deg+1)
	for k, ak := range a {
		scale := ak / math.Pow(half, float64(k))
		binom := 1.0
		for j := 0; j <= k; j++ {
			// term: binom(k,j) t^j (−mid)^(k−j)
			c[j] += scale * binom * math.Pow(-mid, float64(k-j))
			binom = binom * float64(k-j) / float64(j+1)
		}
	}
	return c, nil
}

// leastSquares solves min ‖A c − b‖ by Householder QR with the columns scaled to unit norm.
// A column set that is (nearly) dependent is reported as points too close together.
func leastSquares(A [][]float64, b []float64) ([]float64, error) {
	m, n := len(A), len(A[0])
	a := make([][]float64, m)
	for i := range A {
		a[i] = append([]float64(nil), A[i]...)
	}
	rhs := append([]float64(nil), b...)
	scale := make([]float64, n)
	for j := range n {
		s := 0.0
		for i := range m {
			s += a[i][j] * a[i][j]
		}
		s = math.Sqrt(s)
		if !(s > 0) || math.IsInf(s, 0) {
			return nil, spreadErr()
		}
		scale[j] = s
		for i := range m {
			a[i][j] /= s
		}
	}
	for k := range n {
		norm := 0.0
		for i := k; i < m; i++ {
			norm += a[i][k] * a[i][k]
		}
		norm = math.Sqrt(norm)
		if norm < 1e-13 {
			return nil, spreadErr()
		}
		if a[k][k] > 0 {
			norm = -norm
		}
		// v = x − norm·e1, stored in place.
		a[k][k] -= norm
		vv := 0.0
		for i := k; i < m; i++ {
			vv += a[i][k] * a[i][k]
		}
		for j := k + 1; j < n; j++ {
			s := 0.0
			for i := k; i < m; i++ {
				s += a[i][k] * a[i][j]
			}
			f := 2 * s / vv
			for i := k; i < m; i++ {
				a[i][j] -= f * a[i][k]
			}
		}
		s := 0.0
		for i := k; i < m; i++ {
			s += a[i][k] * rhs[i]
		}
		f := 2 * s / vv
		for i := k; i < m; i++ {
			rhs[i] -= f * a[i][k]
		}
		a[k][k] = norm
	}
	c := make([]float64, n)
	for k := n - 1; k >= 0; k-- {
		s := rhs[k]
		for j := k + 1; j < n; j++ {
			s -= a[k][j] * c[j]
		}
		c[k] = s / a[k][k]
	}
	for j := range c {
		c[j] /= scale[j]
		if math.IsNaN(c[j]) || math.IsInf(c[j], 0) {
			return nil, spreadErr()
		}
	}
	return c, nil
}

func spreadErr() error {
	return &unit.FieldError{Field: "points", Value: "points too close together",
		Allowed: "points spread over a temperature range wide enough to fix every coefficient"}
}
