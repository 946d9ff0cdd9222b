package prep

import (
	"math"
	"slices"
	"strings"
	"testing"

	"saltcast/core/balance"
)

// freezeTolK covers the linear interpolation of the library's freezing curve between the
// CRC rows (0.5–1 mass % apart) and the rounding of the CRC molarity used for the per-volume
// row; the CRC depressions are printed to 0.01 K.
const freezeTolK = 0.03

// The freezing point of a prepared NaCl solution is the CRC row's. Source on every row: CRC
// Handbook of Chemistry and Physics, 102nd ed. (2021), "Concentrative Properties of Aqueous
// Solutions", NaCl, column Δ (freezing-point depression) and, for the per-volume row, the
// molarity c at 20 °C (open mirror: github amosonabike/CRC-Solution-Properties-, src/CRC
// Solution Properties.txt).
func TestFreezingPointCRC(t *testing.T) {
	c, f := mustLookup(t, "NaCl")
	for _, row := range []struct {
		conc  float64
		unit  Unit
		wantC float64
	}{
		{1, PctWW, -0.59},
		{5, PctWW, -3.05},
		{10, PctWW, -6.56},
		{20, PctWW, -16.46},
		{0.885, MolPerL, -3.05}, // the 5 % row: c = 0.885 mol/L at 20 °C
	} {
		s := Spec{Compound: c, Form: f, Concentration: row.conc, Unit: row.unit, Amount: ByMass, AmountValue: 500, TempC: 20}
		r := plan(t, s)
		if !r.HasFreezingPoint || math.Abs(r.FreezingPointC-row.wantC) > freezeTolK {
			t.Errorf("Plan(NaCl %v %s).FreezingPointC = %v (%v), want %v ± %v", row.conc, row.unit, r.FreezingPointC,
				r.HasFreezingPoint, row.wantC, freezeTolK)
		}
		// The keep-above temperature is never below the freezing point plus the margin.
		if !r.HasKeepAbove || r.KeepAboveC < r.FreezingPointC+StorageMarginK-1e-9 {
			t.Errorf("Plan(NaCl %v %s): keep above %v (%v), freezing point %v", row.conc, row.unit, r.KeepAboveC, r.HasKeepAbove, r.FreezingPointC)
		}
		if !slices.Contains(r.Sources, c.Freezing.Source) {
			t.Errorf("Plan(NaCl %v %s): the freezing data's source is not among the sources", row.conc, row.unit)
		}
	}
}

// A storage temperature below the freezing point is never passed silently: the solution is
// not clear there and a warning names the freezing point; just above it, a warning too.
// 10 % w/w NaCl freezes at −6.56 °C (CRC 102nd ed., as above).
func TestStoreBelowFreezing(t *testing.T) {
	c, f := mustLookup(t, "NaCl")
	base := Spec{Compound: c, Form: f, Concentration: 10, Unit: PctWW, Amount: ByMass, AmountValue: 500, TempC: 20, HasStoreAt: true}
	for _, row := range []struct {
		storeC    float64
		clear     bool
		warnWords string
	}{
		{-10, false, "it freezes: ice forms below -6.56 °C"},
		{-5, true, "K above its freezing point (-6.56 °C)"},
		{4, true, ""},
	} {
		s := base
		s.StoreAtC = row.storeC
		r := plan(t, s)
		if r.ClearAtStore != row.clear {
			t.Errorf("stored at %v °C: ClearAtStore = %v, want %v", row.storeC, r.ClearAtStore, row.clear)
		}
		all := strings.Join(r.Warnings, "\n")
		if row.warnWords != "" && !strings.Contains(all, row.warnWords) {
			t.Errorf("stored at %v °C: no warning with %q in\n%s", row.storeC, row.warnWords, all)
		}
		if row.warnWords == "" && strings.Contains(all, "freez") {
			t.Errorf("stored at %v °C: a freezing warning where none applies:\n%s", row.storeC, all)
		}
	}
}

// Without freezing data the freezing point is not given, and a warning says so.
func TestFreezingUnknownWarns(t *testing.T) {
	for _, id := range []string{"K2Cr2O7", "NaCl"} {
		c, f := mustLookup(t, id)
		if (c.Freezing == nil) != (id == "K2Cr2O7") {
			t.Skipf("the library's freezing data changed for %s; pick another compound", id)
		}
		r := plan(t, Spec{Compound: c, Form: f, Concentration: 2, Unit: PctWW, Amount: ByMass, AmountValue: 100, TempC: 20})
		warned := slices.ContainsFunc(r.Warnings, func(w string) bool { return strings.Contains(w, "no freezing-point data") })
		if r.HasFreezingPoint == warned {
			t.Errorf("%s: HasFreezingPoint %v, warned %v", id, r.HasFreezingPoint, warned)
		}
	}
}

// A compound flagged toxic carries the strong toxic caution first, with its kind, as a plan
// does; every preparation's cautions end with the SDS note.
func TestToxicCaution(t *testing.T) {
	for _, id := range []string{"K2Cr2O7", "KCl"} {
		c, f := mustLookup(t, id)
		if c.Toxic != (id == "K2Cr2O7") {
			t.Fatalf("%s: toxic flag %v; the test expects the dichromate flagged (its SDS: carcinogen, mutagen)", id, c.Toxic)
		}
		r := plan(t, Spec{Compound: c, Form: f, Concentration: 2, Unit: PctWW, Amount: ByMass, AmountValue: 100, TempC: 20})
		if len(r.CautionKinds) != len(r.Cautions) {
			t.Fatalf("%s: %d cautions, %d kinds", id, len(r.Cautions), len(r.CautionKinds))
		}
		first := r.CautionKinds[0] == balance.CautionToxic && r.Cautions[0] == balance.ToxicCaution(c)
		if first != c.Toxic {
			t.Errorf("%s (toxic %v): cautions %v", id, c.Toxic, r.CautionKinds)
		}
		if r.CautionKinds[len(r.CautionKinds)-1] != balance.CautionSDS {
			t.Errorf("%s: the last caution is %v, not the SDS note", id, r.CautionKinds[len(r.CautionKinds)-1])
		}
	}
}
