package chart

import (
	"strings"
	"testing"
)

// batchAt is benchView's chart with the batch cooled to endC and its other
// points moved with it (invented numbers, only for drawing).
func batchAt(endC, dissolveC float64, unit TempUnit) SolubilityView {
	v := benchView()
	v.Zoom = false
	v.Temp = unit
	v.Batch = &Batch{
		Dissolve: Point{dissolveC, 35}, Saturation: ptr(Point{27.6, 35}), Onset: ptr(Point{24.6, 35}),
		Seed: ptr(Point{26, 35}), End: Point{endC, 4.9 + 0.0426*endC*endC}, Settled: ptr(Point{27, 33}),
	}
	return v
}

// TestRendererEqualsFullRender edits the batch step by step, as typing does: after every
// step the renderer's drawing of the chart built through a SolubilityCache must be byte
// for byte a fresh Render of the chart built afresh, and
// the static layer must be reused exactly when the axes and curves stayed.
func TestRendererEqualsFullRender(t *testing.T) {
	steps := []struct {
		name      string
		v         SolubilityView
		sameAsPre bool // the static layer is the last one's
	}{
		{"first chart", batchAt(10, 30, Celsius), false},
		{"target 12 °C: only the batch moves", batchAt(12, 30, Celsius), true},
		{"target 15 °C", batchAt(15, 30, Celsius), true},
		{"dissolved at 31 °C", batchAt(15, 31, Celsius), true},
		{"shown in °F: axes and curves change", batchAt(15, 31, Fahrenheit), false},
		{"target 16 °C in °F", batchAt(16, 31, Fahrenheit), true},
		{"dissolved at 130 °C: the batch leaves the plotted range", batchAt(16, 130, Fahrenheit), false},
		{"back to 31 °C", batchAt(16, 31, Fahrenheit), false},
		{"no metastable zone: curves change", func() SolubilityView { v := batchAt(16, 31, Fahrenheit); v.MetastableK = 0; return v }(), false},
		{"decimal comma", func() SolubilityView {
			v := batchAt(16, 31, Fahrenheit)
			v.MetastableK = 0
			v.DecimalComma = true
			return v
		}(), false},
		{"no batch", func() SolubilityView {
			v := batchAt(16, 31, Fahrenheit)
			v.MetastableK = 0
			v.DecimalComma = true
			v.Batch = nil
			return v
		}(), true},
	}
	var r Renderer
	var cache SolubilityCache
	for _, st := range steps {
		c, err := Solubility(st.v)
		if err != nil {
			t.Fatalf("%s: %v", st.name, err)
		}
		want, err := Render(c)
		if err != nil {
			t.Fatalf("%s: %v", st.name, err)
		}
		cc, err := cache.Solubility(st.v) // curves reused when they are the same
		if err != nil {
			t.Fatalf("%s: %v", st.name, err)
		}
		d, same, err := r.Draw(cc)
		if err != nil {
			t.Fatalf("%s: %v", st.name, err)
		}
		if got := d.SVG(); got != want {
			t.Errorf("%s: the renderer's SVG differs from a fresh render:\n%s\nwant\n%s", st.name, got, want)
		}
		if same != st.sameAsPre {
			t.Errorf("%s: static layer reused = %v, want %v", st.name, same, st.sameAsPre)
		}
		if !strings.Contains(d.SVG(), `viewBox="`+d.ViewBox()+`"`) {
			t.Errorf("%s: ViewBox %q is not the root's", st.name, d.ViewBox())
		}
	}
	// After an error the next chart is drawn whole.
	if _, _, err := r.Draw(Chart{}); err != ErrNoData {
		t.Fatalf("empty chart: %v, want ErrNoData", err)
	}
	c, _ := Solubility(batchAt(16, 31, Fahrenheit))
	if _, same, _ := r.Draw(c); same {
		t.Error("after an error the static layer was reused")
	}
}

// TestRendererSteadyAllocs: redrawing a chart whose batch moved within the axes allocates
// only the new parts' strings, a few marker and legend labels and the layout, not the
// static layer.
func TestRendererSteadyAllocs(t *testing.T) {
	a, _ := Solubility(batchAt(12, 30, Celsius))
	b, _ := Solubility(batchAt(13, 30, Celsius))
	var r Renderer
	r.Draw(a)
	i := 0
	allocs := testing.AllocsPerRun(100, func() {
		c := a
		if i%2 == 1 {
			c = b
		}
		i++
		if _, same, err := r.Draw(c); err != nil || !same {
			t.Fatalf("same %v, err %v", same, err)
		}
	})
	var full float64
	full = testing.AllocsPerRun(100, func() {
		if _, err := Render(a); err != nil {
			t.Fatal(err)
		}
	})
	t.Logf("allocations: batch-only redraw %.0f, full render %.0f", allocs, full)
	if allocs >= full {
		t.Errorf("a batch-only redraw allocates %.0f times, a full render %.0f", allocs, full)
	}
}
