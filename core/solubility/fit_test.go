package solubility

import (
	"errors"
	"math"
	"testing"

	"saltcast/core/unit"
)

// recoverTol is how closely a fit recovers the coefficients its points were generated from
// (relative): QR on exact data loses a few digits to the near-collinear Apelblat columns.
const recoverTol = 1e-6

func relClose(a, b, tol float64) bool { return math.Abs(a-b) <= tol*math.Max(1e-300, math.Abs(b)) }

func gen(m Model, temps ...float64) []Point {
	p := make([]Point, len(temps))
	for i, tc := range temps {
		p[i] = Point{tc, m.Value(tc)}
	}
	return p
}

func TestFitRecoversVantHoff(t *testing.T) {
	// A and B of the size KNO3 has (B = −ΔH/R with ΔH ≈ 35 kJ/mol); the values are invented.
	want := VantHoff{A: 4.2, B: -1900, MolarMassGPerMol: 101.10}
	res, err := Fit(KindVantHoff, gen(want, 5, 15, 30, 45, 70), 101.10)
	if err != nil {
		t.Fatal(err)
	}
	got := res.Curve.Model.(VantHoff)
	if !relClose(got.A, want.A, recoverTol) || !relClose(got.B, want.B, recoverTol) {
		t.Errorf("Fit(vant-hoff) = A %v B %v, want A %v B %v", got.A, got.B, want.A, want.B)
	}
	if res.R2 < 1-1e-12 || res.RMS > 1e-9 || res.Curve.MinC != 5 || res.Curve.MaxC != 70 {
		t.Errorf("Fit(vant-hoff) R2 %v RMS %v range %v–%v; want 1, 0, 5–70", res.R2, res.RMS, res.Curve.MinC, res.Curve.MaxC)
	}
}

func TestFitRecoversApelblat(t *testing.T) {
	// Coefficients of the size published Apelblat fits have (invented values), in another
	// solvent (ethanol, 46.07 g/mol) to exercise the solvent molar mass.
	want := Apelblat{A: -180.5, B: 6400, C: 27.3, MolarMassGPerMol: 122.12, SolventGPerMol: 46.07}
	res, err := FitWith(KindApelblat, gen(want, 0, 10, 20, 30, 40, 50), 122.12, FitOptions{SolventGPerMol: 46.07})
	if err != nil {
		t.Fatal(err)
	}
	got := res.Curve.Model.(Apelblat)
	if !relClose(got.A, want.A, recoverTol) || !relClose(got.B, want.B, recoverTol) || !relClose(got.C, want.C, recoverTol) {
		t.Errorf("Fit(apelblat) = %v %v %v, want %v %v %v", got.A, got.B, got.C, want.A, want.B, want.C)
	}
}

func TestFitRecoversPolynomial(t *testing.T) {
	// The sucrose polynomial's size of coefficients (invented cubic).
	want := Polynomial{Coef: []float64{180, 0.9, 0.012, 8e-5}}
	res, err := FitWith(KindPolynomial, gen(want, 0, 20, 35, 50, 75, 100), 342.30, FitOptions{Degree: 3})
	if err != nil {
		t.Fatal(err)
	}
	got := res.Curve.Model.(Polynomial)
	for i := range want.Coef {
		if !relClose(got.Coef[i], want.Coef[i], recoverTol) {
			t.Errorf("Fit(polynomial) coef %d = %v, want %v", i, got.Coef[i], want.Coef[i])
		}
	}
}

// TestFitStatistics checks R², RMS and residuals against a straight-line fit done by hand:
// points (0, 10), (10, 21), (20, 30). Least squares: slope = Σ(t−10)(g−61/3)/Σ(t−10)² =
// 200/200 = 1, intercept 61/3 − 10 = 10.333…; residuals −1/3, 2/3, −1/3; SSres = 2/3;
// SStot = 200.667; R² = 1 − (2/3)/200.667 = 0.996678; RMS = √(2/9) = 0.471405.
func TestFitStatistics(t *testing.T) {
	res, err := FitWith(KindPolynomial, []Point{{0, 10}, {10, 21}, {20, 30}}, 50, FitOptions{Degree: 1})
	if err != nil {
		t.Fatal(err)
	}
	const tol = 1e-9
	want := []float64{-1.0 / 3, 2.0 / 3, -1.0 / 3}
	for i, r := range res.Residuals {
		if math.Abs(r-want[i]) > tol {
			t.Errorf("residual %d = %v, want %v", i, r, want[i])
		}
	}
	if math.Abs(res.R2-(1-(2.0/3)/(602.0/3))) > tol || math.Abs(res.RMS-math.Sqrt(2.0/9)) > tol {
		t.Errorf("R2 %v RMS %v; want 0.996678 and 0.471405", res.R2, res.RMS)
	}
	// The default polynomial degree for 3 points is 1 (one spare point).
	def, _ := Fit(KindPolynomial, []Point{{0, 10}, {10, 21}, {20, 30}}, 50)
	if n := len(def.Curve.Model.(Polynomial).Coef); n != 2 {
		t.Errorf("default degree for 3 points gave %d coefficients, want 2", n)
	}
}

// TestFitRealData fits KNO3 (CRC Handbook 98th ed., mass % converted to g/100 g water,
// 0–60 °C) without its 25 °C row and checks the fits against that held-out CRC value, 38.31
// g/100 g water. Tolerances: Apelblat 1 %, van 't Hoff 5 % (a straight line in ln x vs 1/T
// misses the curvature of a concentrated solution; hand check of the data).
func TestFitRealData(t *testing.T) {
	pts := []Point{{0, 13.64}, {10, 21.36}, {20, 31.93}, {30, 45.56}, {40, 62.87}, {50, 84.16}, {60, 109.2}}
	const held = 38.31
	for _, tt := range []struct {
		kind string
		tol  float64
	}{{KindApelblat, 0.01}, {KindVantHoff, 0.05}, {KindTable, 0.01}, {KindPolynomial, 0.01}} {
		res, err := Fit(tt.kind, pts, 101.10)
		if err != nil {
			t.Fatal(err)
		}
		v, warn, err := res.Curve.At(25)
		if err != nil || warn != "" || math.Abs(v-held) > tt.tol*held {
			t.Errorf("Fit(%s).At(25) = %v, %q, %v; want %v ± %v %%", tt.kind, v, warn, err, held, 100*tt.tol)
		}
		if res.R2 < 0.99 {
			t.Errorf("Fit(%s) R2 = %v, want > 0.99", tt.kind, res.R2)
		}
	}
	tab, _ := Fit(KindTable, pts, 101.10)
	if tab.RMS > 1e-9 || tab.R2 < 1-1e-12 {
		t.Errorf("Fit(table) RMS %v R2 %v; want an exact table", tab.RMS, tab.R2)
	}
}

func TestFitErrors(t *testing.T) {
	ok := []Point{{0, 10}, {20, 20}, {40, 35}}
	tests := []struct {
		name  string
		kind  string
		pts   []Point
		M     float64
		field string
	}{
		{"two points", KindApelblat, ok[:2], 100, "points"},
		{"no points", KindTable, nil, 100, "points"},
		{"duplicate temperature", KindVantHoff, []Point{{0, 10}, {20, 20}, {20, 21}}, 100, "points"},
		{"NaN", KindPolynomial, []Point{{0, 10}, {20, math.NaN()}, {40, 35}}, 100, "points"},
		{"Inf temperature", KindPolynomial, []Point{{0, 10}, {math.Inf(1), 20}, {40, 35}}, 100, "points"},
		{"zero solubility", KindVantHoff, []Point{{0, 0}, {20, 20}, {40, 35}}, 100, "points"},
		{"maximum in van 't Hoff data", KindVantHoff, []Point{{0, 10}, {20, 30}, {40, 20}}, 100, "points"},
		{"unknown kind", "spline", ok, 100, "kind"},
		{"bad molar mass", KindTable, ok, -1, "molar_mass_g_per_mol"},
	}
	for _, tt := range tests {
		_, err := Fit(tt.kind, tt.pts, tt.M)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.field {
			t.Errorf("Fit(%s) error = %v; want a *unit.FieldError for %s", tt.name, err, tt.field)
		}
	}
	if _, err := FitWith(KindPolynomial, ok, 100, FitOptions{Degree: 3}); err == nil {
		t.Error("cubic through 3 points gave no error")
	}
	// Non-monotone data are fine for Apelblat (one turn) and tables.
	for _, k := range []string{KindApelblat, KindTable, KindPolynomial} {
		if _, err := Fit(k, []Point{{0, 10}, {20, 30}, {40, 20}, {60, 15}}, 100); err != nil {
			t.Errorf("Fit(%s) of data with a maximum: %v", k, err)
		}
	}
}

// FuzzFit checks that Fit never panics and returns finite statistics or an error.
func FuzzFit(f *testing.F) {
	f.Add(uint8(0), 0.0, 10.0, 20.0, 20.0, 40.0, 35.0, 101.1)
	f.Add(uint8(1), 0.0, 1e-300, 1e-9, 1e300, 40.0, 35.0, 1.0)
	f.Add(uint8(2), -273.0, 1.0, 0.0, 1.0, 1e4, 1.0, 18.0)
	f.Add(uint8(3), 20.0, 5.0, 20.000000001, 5.0, 20.000000002, 5.0, 58.44)
	f.Fuzz(func(t *testing.T, k uint8, t1, g1, t2, g2, t3, g3, M float64) {
		kinds := []string{KindTable, KindVantHoff, KindApelblat, KindPolynomial}
		pts := []Point{{t1, g1}, {t2, g2}, {t3, g3}, {(t1 + t3) / 2, (g1 + g2) / 2}}
		res, err := Fit(kinds[int(k)%4], pts, M)
		if err != nil {
			var fe *unit.FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("error %v is not a *unit.FieldError", err)
			}
			return
		}
		for _, v := range append([]float64{res.R2, res.RMS, res.Curve.MinC, res.Curve.MaxC}, res.Residuals...) {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Fatalf("Fit gave non-finite output %+v", res)
			}
		}
		if v, _, err := res.Curve.At((res.Curve.MinC + res.Curve.MaxC) / 2); err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
			t.Fatalf("At gave %v", v)
		}
	})
}
