package balance

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"saltcast/core/compound"
	"saltcast/core/unit"
)

// Ice from a dilute NaCl brine: 5 mass % freezes at −3.05 °C (CRC 102nd ed., "Concentrative
// Properties of Aqueous Solutions"); at −5 °C the liquor left beside the ice is the one that
// freezes at −5 °C, 7.886 mass % (derived: linear between the CRC 7 % (4.38 K) and 8 %
// (5.08 K) rows).
func TestIceFromDiluteBrine(t *testing.T) {
	const (
		freezeTolK = 0.01  // K: the library interpolates in g/100 g, the check in mass %
		iceTol     = 0.005 // relative, the same interpolation difference carried into the ice
	)
	c, _ := lookup(t, "NaCl")
	S, W := 5.0, 95.0 // 5 mass %
	r := plan(t, Batch{Compound: c, WaterG: W, ChargeG: S, DissolveTempC: 20, HasTarget: true, TargetC: -5})
	if !r.HasFreezing || math.Abs(r.FreezingPointC+3.05) > freezeTolK {
		t.Errorf("freezing point %v (%v), want −3.05 °C (CRC 102nd ed.)", r.FreezingPointC, r.HasFreezing)
	}
	w := 7.886
	wantIce := W - S*(100-w)/w
	if !r.HasIce || r.Frozen || r.CrystalsG != 0 || math.Abs(r.IceG-wantIce) > iceTol*wantIce {
		t.Errorf("Plan(5 %% NaCl to −5 °C): ice %v g (has %v, frozen %v), crystals %v; want %.3f g of ice and no crystals",
			r.IceG, r.HasIce, r.Frozen, r.CrystalsG, wantIce)
	}
	if !strings.Contains(strings.Join(r.Warnings, "\n"), "ice") {
		t.Errorf("no warning about the ice: %q", r.Warnings)
	}
}

// Saturated brine cooled below 0.1 °C gives hydrohalite, no ice above the eutectic, and a
// solid batch below it.
func TestHydrohaliteAndEutectic(t *testing.T) {
	c, _ := lookup(t, "NaCl")
	warm := Batch{Compound: c, WaterG: 100, DissolveTempC: 20, HasTarget: true}
	warm.TargetC = -10
	r := plan(t, warm)
	if r.CrystalPhase != "NaCl·2H2O" || r.IceG != 0 || r.Frozen || !(r.CrystalsG > 0) {
		t.Errorf("saturated brine to −10 °C: %v g of %s, ice %v, frozen %v; want hydrohalite and no ice", r.CrystalsG, r.CrystalPhase, r.IceG, r.Frozen)
	}
	warm.TargetC = -22 // below the −21.2 °C eutectic, inside the 5 K margin of the data
	r = plan(t, warm)
	f := r.CrystalAnhydrousFrac
	if !r.Frozen || r.LiquorG != 0 || math.Abs(r.CrystalsG*f-r.SoluteG) > 1e-9*r.SoluteG || !(r.IceG > 0) {
		t.Errorf("saturated brine to −22 °C: frozen %v, liquor %v, crystals %v (solute %v), ice %v; want all solid",
			r.Frozen, r.LiquorG, r.CrystalsG, r.SoluteG, r.IceG)
	}
	if r.EutecticC != -21.2 || r.EutecticPhase != "NaCl·2H2O" {
		t.Errorf("eutectic %v °C %s, want −21.2 °C NaCl·2H2O", r.EutecticC, r.EutecticPhase)
	}
}

// Below 1.8 °C MgSO4 crystallizes as MgSO4·11H2O: anhydrous fraction 0.378 against 0.488
// for epsomite, so the same anhydrous yield weighs about half as much again.
func TestMeridianiiteCrash(t *testing.T) {
	c, _ := lookup(t, "MgSO4")
	cold := plan(t, Batch{Compound: c, WaterG: 100, DissolveTempC: 30, HasTarget: true, TargetC: 1})
	warm := plan(t, Batch{Compound: c, WaterG: 100, DissolveTempC: 30, HasTarget: true, TargetC: 2.5})
	if cold.CrystalPhase != "MgSO4·11H2O" || warm.CrystalPhase != "MgSO4·7H2O" {
		t.Fatalf("phases %s at 1 °C, %s at 2.5 °C; want MgSO4·11H2O and MgSO4·7H2O", cold.CrystalPhase, warm.CrystalPhase)
	}
	// The crystals weigh more than the warm ones by more than the mass factor 0.488/0.378 =
	// 1.29 (derived), since the colder liquor also holds less.
	ratio := cold.CrystalsG / warm.CrystalsG
	if !(ratio > 1.29) || !(cold.YieldPct > warm.YieldPct) || math.Abs(cold.CrystalAnhydrousFrac-0.378) > 0.0005 {
		t.Errorf("crystal mass at 1 °C / at 2.5 °C = %v, yields %v and %v %%, fraction %v; want above 1.29, a higher cold yield, 0.378",
			ratio, cold.YieldPct, warm.YieldPct, cold.CrystalAnhydrousFrac)
	}
	if cold.IceG != 0 {
		t.Errorf("ice %v at 1 °C", cold.IceG)
	}
}

// clear_down_to_C: a stock that would freeze is not clear.
func TestClearDownAgainstFreezing(t *testing.T) {
	c, _ := lookup(t, "NaCl")
	b := Batch{Compound: c, WaterG: 100, DissolveTempC: 20, HasClearDown: true, ClearDownToC: -22, ClearMarginK: 0.5}
	_, err := Plan(b)
	var fe *unit.FieldError
	if !errors.As(err, &fe) || fe.Field != "clear_down_to_C" || !strings.Contains(fe.Allowed, "eutectic") {
		t.Errorf("clear down to −22 °C (below the −21.2 °C eutectic): error %v, want one naming clear_down_to_C and the eutectic", err)
	}
	// Above the eutectic the richest clear stock is saturated in hydrohalite, and does not freeze.
	b.ClearDownToC = -15
	// (Richer than the eutectic liquor, it has no freezing point above the eutectic.)
	r := plan(t, b)
	if r.HasFreezing && r.FreezingPointC > -15.5 || !r.HasFreezing && !(r.ConcentrationG100 > r.EutecticG100) {
		t.Errorf("stock for −15 °C: %v g/100 g freezes at %v °C (%v); want at or below −15.5 °C (the storage temperature less the margin)",
			r.ConcentrationG100, r.FreezingPointC, r.HasFreezing)
	}
	// Without freezing data the storage below 0 °C is only warned about.
	a, _ := lookup(t, "alum")
	r = plan(t, Batch{Compound: a, WaterG: 100, DissolveTempC: 40, HasClearDown: true, ClearDownToC: -2, ClearMarginK: 0.5})
	if r.HasFreezing || !strings.Contains(strings.Join(r.Warnings, "\n"), "freeze") {
		t.Errorf("alum stored at −2 °C: has freezing %v, warnings %q; want no freezing point and a warning", r.HasFreezing, r.Warnings)
	}
}

// A compound without freezing data gives no ice figure below 0 °C, and says why.
func TestNoFreezingData(t *testing.T) {
	c, _ := lookup(t, "alum")
	r := plan(t, Batch{Compound: c, WaterG: 100, DissolveTempC: 40, HasTarget: true, TargetC: -3})
	if r.HasIce || r.HasFreezing || !strings.Contains(strings.Join(r.Warnings, "\n"), "ice is not modelled") {
		t.Errorf("alum to −3 °C: has ice %v, has freezing %v, warnings %q", r.HasIce, r.HasFreezing, r.Warnings)
	}
}

// Random cold batches of every compound with freezing data: the mass balance (crystals +
// ice + liquor + evaporated water) closes, the liquor beside ice lies on the freezing curve,
// the liquor beside crystals on the solubility curve, and a frozen batch has no liquor.
func TestColdMassBalanceProperty(t *testing.T) {
	const (
		balanceTol = 1e-9 // relative, mass closure
		curveTol   = 1e-9 // relative, liquor on its curve
	)
	rng := rand.New(rand.NewPCG(3, 4))
	var cold []*compound.Compound
	for _, c := range compound.All() {
		if c.Freezing != nil {
			cold = append(cold, c)
		}
	}
	planned, withIce, frozen := 0, 0, 0
	for range 4000 {
		c := cold[rng.IntN(len(cold))]
		fz := c.Freezing
		b := Batch{
			Compound:      c,
			Form:          c.Forms[rng.IntN(len(c.Forms))],
			PurityPct:     80 + 20*rng.Float64(),
			WaterG:        math.Pow(10, 4*rng.Float64()),
			DissolveTempC: 40 * rng.Float64(),
			SaturationPct: 1 + 99*rng.Float64(),
			HasTarget:     true,
			TargetC:       (fz.LowestC() - 3) * rng.Float64(),
		}
		if rng.IntN(3) == 0 {
			b.EvaporatedWaterG = b.WaterG * 0.3 * rng.Float64()
		}
		r, err := Plan(b)
		if err != nil {
			var fe *unit.FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("Plan(%+v) error %v, want a FieldError", b, err)
			}
			continue
		}
		planned++
		in := r.ChargeG*r.PurityPct/100 + r.WaterG
		out := r.CrystalsG + r.IceG + r.LiquorG + r.EvaporatedWaterG
		if math.Abs(out-in) > balanceTol*in || r.IceG < 0 || r.CrystalsG < 0 || r.LiquorWaterG < 0 {
			t.Fatalf("%s to %v °C: crystals %v + ice %v + liquor %v + evaporated %v = %v, want %v",
				r.SoluteID, r.TargetC, r.CrystalsG, r.IceG, r.LiquorG, r.EvaporatedWaterG, out, in)
		}
		if anh := r.CrystalsG*r.CrystalAnhydrousFrac + r.LiquorSoluteG; math.Abs(anh-r.SoluteG) > balanceTol*r.SoluteG {
			t.Fatalf("%s: solute %v in crystals and liquor, %v charged", r.SoluteID, anh, r.SoluteG)
		}
		switch {
		case r.Frozen:
			frozen++
			if r.LiquorG != 0 {
				t.Fatalf("%s frozen at %v °C with %v g of liquor", r.SoluteID, r.TargetC, r.LiquorG)
			}
		case r.IceG > 0:
			withIce++
			tf, ok := fz.TempC(r.LiquorG100)
			if !ok || math.Abs(tf-r.TargetC) > curveTol*math.Abs(r.TargetC) || r.CrystalsG != 0 {
				t.Fatalf("%s at %v °C: liquor beside ice %v g/100 g freezes at %v (%v), crystals %v", r.SoluteID, r.TargetC,
					r.LiquorG100, tf, ok, r.CrystalsG)
			}
		case r.CrystalsG > 0:
			if s := r.SolubilityAtTargetG100; math.Abs(r.LiquorG100-s) > 1e-6*s {
				t.Fatalf("%s: liquor %v beside crystals, solubility %v", r.SoluteID, r.LiquorG100, s)
			}
		}
	}
	if planned < 2000 || withIce < 200 || frozen < 200 {
		t.Errorf("planned %d, with ice %d, frozen %d: the generator misses the cold cases", planned, withIce, frozen)
	}
}
