package chart

import "testing"

var sink string

// benchView is the size of a live solubility chart: two phases of 60
// sampled points each, a band, a path along the curve and five markers.
func benchView() SolubilityView {
	pts := func(lo, hi float64, f func(float64) float64) []Point {
		p, _ := Sample(lo, hi, 60, func(t float64) (float64, error) { return f(t), nil })
		return p
	}
	return SolubilityView{
		Title: "Sodium sulfate (invented batch)",
		Phases: []Phase{
			{Form: "Na2SO4·10H2O", Points: pts(0, 32.38, func(t float64) float64 { return 4.9 + 0.0426*t*t })},
			{Form: "Na2SO4", Points: pts(32.38, 100, func(t float64) float64 { return 49.7 - 0.1*(t-32.38) })},
		},
		MetastableK: 3,
		Batch: &Batch{
			Dissolve: Point{30, 35}, Saturation: ptr(Point{27.6, 35}), Onset: ptr(Point{24.6, 35}),
			Seed: ptr(Point{26, 35}), End: Point{10, 9.1}, Settled: ptr(Point{27, 33}),
		},
		Zoom: true,
	}
}

// BenchmarkSolubilityTwoPhases60 builds and renders the chart, as the app
// does after every input.
func BenchmarkSolubilityTwoPhases60(b *testing.B) {
	v := benchView()
	for b.Loop() {
		c, err := Solubility(v)
		if err != nil {
			b.Fatal(err)
		}
		if sink, err = Render(c); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkOxygen41 renders the gas chart with a 41-point curve.
func BenchmarkOxygen41(b *testing.B) {
	curve, _ := Sample(0, 40, 41, func(t float64) (float64, error) { return 14.6 - 0.2*t, nil })
	v := OxygenView{Curve: curve, Day: ptr(Point{20, 9.1}), Measured: ptr(Point{20, 7.4})}
	for b.Loop() {
		c, err := Oxygen(v)
		if err != nil {
			b.Fatal(err)
		}
		if sink, err = Render(c); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkRedrawBatchOnly redraws the chart as typing a target temperature does: the
// batch moves, the axes and curves stay, so the static layer is reused.
func BenchmarkRedrawBatchOnly(b *testing.B) {
	var views [2]Chart
	for i, endC := range [...]float64{12, 13} {
		v := benchView()
		v.Zoom = false
		v.Batch.End = Point{endC, 4.9 + 0.0426*endC*endC}
		views[i], _ = Solubility(v)
	}
	var r Renderer
	i := 0
	for b.Loop() {
		d, _, err := r.Draw(views[i%2])
		if err != nil {
			b.Fatal(err)
		}
		sink = d.Batch
		i++
	}
}

// BenchmarkSolubilityRedrawBatchOnly builds the chart and redraws it as the app does while
// a target temperature is typed: Solubility, then the renderer with the static layer kept.
func BenchmarkSolubilityRedrawBatchOnly(b *testing.B) {
	var views [2]SolubilityView
	for i, endC := range [...]float64{12, 13} {
		views[i] = benchView()
		views[i].Zoom = false
		views[i].Batch.End = Point{endC, 4.9 + 0.0426*endC*endC}
	}
	var r Renderer
	var cache SolubilityCache
	i := 0
	for b.Loop() {
		c, err := cache.Solubility(views[i%2])
		if err != nil {
			b.Fatal(err)
		}
		d, _, err := r.Draw(c)
		if err != nil {
			b.Fatal(err)
		}
		sink = d.Batch
		i++
	}
}
