package solubility

import (
	"math"
	"math/rand/v2"
	"testing"
)

// monoSlack allows for rounding when comparing neighbouring values of a monotone curve.
const monoSlack = 1e-12 // relative

func TestTablePassesThroughPoints(t *testing.T) {
	// KNO3, CRC Handbook 98th ed., "Aqueous Solubility of Inorganic Compounds at Various
	// Temperatures", mass % converted to g/100 g water (open mirror: github chicolucio/solutions).
	pts := []Point{{0, 13.64}, {20, 31.93}, {40, 62.87}, {60, 109.2}, {80, 170.3}, {100, 242.5}}
	m, err := NewTable(pts, 101.10)
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range pts {
		if got := m.Value(p.TempC); math.Abs(got-p.GPer100gWater) > 1e-9*p.GPer100gWater {
			t.Errorf("Value(%v) = %v, want %v", p.TempC, got, p.GPer100gWater)
		}
	}
	// Between the data it must stay between the neighbouring points (KNO3 rises).
	for tc := 0.0; tc <= 100; tc += 0.25 {
		a, b := m.Value(tc), m.Value(tc+0.25)
		if !(b >= a) {
			t.Fatalf("KNO3 table falls between %v and %v °C: %v > %v", tc, tc+0.25, a, b)
		}
	}
}

// TestTableMonotoneProperty: for random monotone data (rising or falling), the table is
// monotone in the same sense everywhere inside the data, and for random data with turns it
// never leaves the band spanned by the two points of each interval (no overshoot).
func TestTableMonotoneProperty(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for trial := range 500 {
		n := 2 + r.IntN(12)
		pts := make([]Point, n)
		tc, g := -10+20*r.Float64(), 0.01+50*r.Float64()
		dir := 1.0
		if trial%2 == 1 {
			dir = -1
		}
		for i := range pts {
			pts[i] = Point{tc, g}
			tc += 0.5 + 20*r.Float64()
			step := g * r.Float64() * 0.9
			if r.IntN(5) == 0 {
				step = 0 // flat stretches happen (NaCl is almost flat)
			}
			g += dir * step
		}
		m, err := NewTable(pts, 10+200*r.Float64())
		if err != nil {
			t.Fatal(err)
		}
		lo, hi := pts[0].TempC, pts[n-1].TempC
		prev := m.Value(lo)
		for k := 1; k <= 400; k++ {
			x := lo + (hi-lo)*float64(k)/400
			v := m.Value(x)
			if dir*(v-prev) < -monoSlack*math.Abs(prev) {
				t.Fatalf("trial %d: table not monotone at %v °C (%v after %v); points %v", trial, x, v, prev, pts)
			}
			prev = v
		}
	}
	for trial := range 500 {
		n := 3 + r.IntN(10)
		pts := make([]Point, n)
		tc := 0.0
		for i := range pts {
			pts[i] = Point{tc, 0.1 + 100*r.Float64()}
			tc += 1 + 10*r.Float64()
		}
		m, err := NewTable(pts, 58.44)
		if err != nil {
			t.Fatal(err)
		}
		for i := 0; i+1 < n; i++ {
			a, b := pts[i].GPer100gWater, pts[i+1].GPer100gWater
			lo, hi := math.Min(a, b)*(1-monoSlack), math.Max(a, b)*(1+monoSlack)
			for k := 0; k <= 50; k++ {
				x := pts[i].TempC + (pts[i+1].TempC-pts[i].TempC)*float64(k)/50
				if v := m.Value(x); v < lo || v > hi {
					t.Fatalf("trial %d: Value(%v) = %v outside [%v, %v] of its interval", trial, x, v, a, b)
				}
			}
		}
	}
}

func TestNewTableErrors(t *testing.T) {
	tests := []struct {
		name string
		pts  []Point
		M    float64
	}{
		{"one point", []Point{{20, 30}}, 100},
		{"duplicate temperature", []Point{{20, 30}, {20, 31}, {40, 50}}, 100},
		{"zero solubility", []Point{{20, 0}, {40, 50}}, 100},
		{"negative solubility", []Point{{20, -1}, {40, 50}}, 100},
		{"NaN value", []Point{{20, math.NaN()}, {40, 50}}, 100},
		{"Inf temperature", []Point{{math.Inf(1), 3}, {40, 50}}, 100},
		{"below absolute zero", []Point{{-300, 3}, {40, 50}}, 100},
		{"bad molar mass", []Point{{20, 3}, {40, 50}}, 0},
		{"NaN molar mass", []Point{{20, 3}, {40, 50}}, math.NaN()},
	}
	for _, tt := range tests {
		if _, err := NewTable(tt.pts, tt.M); err == nil {
			t.Errorf("NewTable(%s) gave no error", tt.name)
		}
	}
}
