//go:build browser

package web_test

import (
	"math"
	"testing"

	"saltcast/core/water"
)

// Switching how the water is given carries the amount over: from "by volume" to "by mass"
// the mass box shows the grams of that volume at its temperature (pure water's density, as
// the planner converts it) and the charge stays what it was, computed, not stale; and back.
// A switch never leaves an empty box beside a live result.
func TestWaterBasisSwitchCarriesAmount(t *testing.T) {
	u := appURL(t)
	ctx := tab(t)
	open(t, ctx, u)
	click(t, ctx, `[data-demo="kno3"]`) // (invented) 20 000 mL of water at 15 °C
	r, _ := current(t, ctx)
	if !r.WaterML.Set {
		t.Fatalf("the KNO3 example no longer gives its water by volume: %+v", r)
	}
	charge := outputNumber(t, ctx, "charge_g")
	tempC := r.WaterTempC.Value
	wantG := r.WaterML.Value * water.DensityKgPerM3(tempC) / 1000

	click(t, ctx, `#recipe [name="water_basis"][value="mass"]`)
	box := mustEval[string](t, ctx, `document.querySelector('#recipe [name="water_g"]').value`)
	if box == "" {
		t.Fatal("switched to water by mass: the mass box is empty")
	}
	r2, res := current(t, ctx)
	if !r2.WaterG.Set || math.Abs(r2.WaterG.Value-wantG) > 1e-9*wantG {
		t.Errorf("after the switch the recipe has water_g %v, want %v g (%v mL at %v °C)", r2.WaterG, wantG, r.WaterML.Value, tempC)
	}
	if !mustEval[bool](t, ctx, `document.getElementById("stale").hidden`) {
		t.Error("after the switch the result is marked stale; the amount was carried over")
	}
	if got := outputNumber(t, ctx, "charge_g"); math.Abs(got-res.ChargeG) > shownTol*res.ChargeG || math.Abs(got-charge) > shownTol*charge {
		t.Errorf("charge after the switch %v; core says %v, before the switch %v", got, res.ChargeG, charge)
	}

	// And back: the volume of those grams at the temperature still in the volume box.
	click(t, ctx, `#recipe [name="water_basis"][value="volume"]`)
	r3, _ := current(t, ctx)
	if !r3.WaterML.Set || math.Abs(r3.WaterML.Value-r.WaterML.Value) > 1e-9*r.WaterML.Value {
		t.Errorf("back to volume: water_mL %v, want %v", r3.WaterML, r.WaterML.Value)
	}

	// Nothing to carry: an emptied box, switched away from, leaves the other box empty and
	// the result marked stale, never a live number beside an empty box.
	setField(t, ctx, "recipe", "water_mL", "")
	click(t, ctx, `#recipe [name="water_basis"][value="mass"]`)
	if v := mustEval[string](t, ctx, `document.querySelector('#recipe [name="water_g"]').value`); v == "" &&
		mustEval[bool](t, ctx, `document.getElementById("stale").hidden`) {
		t.Error("an empty water box beside a result not marked stale")
	}
}
