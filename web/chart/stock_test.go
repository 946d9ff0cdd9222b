package chart

import (
	"math"
	"strings"
	"testing"

	"saltcast/core/balance"
)

// A stock sized to stay clear down to a storage temperature, with no target: what is drawn
// is what the legend lists (no path of one point), no marker hides another, and the storage
// temperature is marked. KNO3 at 35 °C kept clear down to 4 °C with a 3 K margin (an
// invented batch); its saturation then lies at 1 °C by construction of the planner.
func TestClearStockChart(t *testing.T) {
	for _, target := range []bool{false, true} {
		b := balance.Batch{Compound: lookup(t, "KNO3"), WaterG: 1000, DissolveTempC: 35,
			HasClearDown: true, ClearDownToC: 4, ClearMarginK: 3}
		if target {
			b.HasTarget, b.TargetC = true, 4 // stored where it was sized for
		}
		r, err := balance.Plan(b)
		if err != nil {
			t.Fatal(err)
		}
		v, err := PlanView(&r, Options{})
		if err != nil {
			t.Fatal(err)
		}
		c, err := Solubility(v)
		if err != nil {
			t.Fatal(err)
		}
		for _, s := range c.Series {
			if s.Kind == Path && len(dedupe(s.Points)) < 2 {
				t.Errorf("target %v: the legend lists %q, drawn from %d point(s)", target, s.Label, len(s.Points))
			}
		}
		storage := false
		for i, m := range c.Markers {
			for _, o := range c.Markers[:i] {
				if math.Abs(m.X-o.X) < 1e-9 && math.Abs(m.Y-o.Y) < 1e-9 {
					t.Errorf("target %v: marker %q hides %q", target, m.Label, o.Label)
				}
			}
			if strings.Contains(m.Label, "clear") && math.Abs(m.X-4) < 1e-9 {
				storage = true
			}
		}
		if !storage {
			t.Errorf("target %v: no marker at the storage temperature 4 °C: %v", target, c.Markers)
		}
	}
}
