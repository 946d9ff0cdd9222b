package solubility

import "testing"

var sink float64

func benchAt(b *testing.B, c Curve) {
	t := 0.0
	for b.Loop() {
		v, _, _ := c.At(t)
		sink += v
		t += 7.3
		if t > 100 {
			t -= 100
		}
	}
}

func BenchmarkAtTable12Points(b *testing.B) {
	pts := []Point{{0, 13.64}, {10, 21.36}, {20, 31.93}, {25, 38.31}, {30, 45.56}, {40, 62.87},
		{50, 84.16}, {60, 109.2}, {70, 138.1}, {80, 170.3}, {90, 205.8}, {100, 242.5}}
	m, err := NewTable(pts, 101.10)
	if err != nil {
		b.Fatal(err)
	}
	benchAt(b, Curve{Model: m, MinC: 0, MaxC: 100})
}

func BenchmarkAtVantHoff(b *testing.B) {
	benchAt(b, Curve{Model: VantHoff{A: 4.2, B: -1900, MolarMassGPerMol: 101.10}, MinC: 0, MaxC: 100})
}

func BenchmarkAtApelblat(b *testing.B) {
	benchAt(b, Curve{Model: Apelblat{A: -180.5, B: 6400, C: 27.3, MolarMassGPerMol: 101.10}, MinC: 0, MaxC: 100})
}

func BenchmarkFitApelblat8Points(b *testing.B) {
	pts := []Point{{0, 13.64}, {10, 21.36}, {20, 31.93}, {25, 38.31}, {30, 45.56}, {40, 62.87}, {50, 84.16}, {60, 109.2}}
	for b.Loop() {
		r, _ := Fit(KindApelblat, pts, 101.10)
		sink += r.RMS
	}
}
