package main

import (
	"errors"
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/unit"
)

// convTol covers the binary rounding of a unit conversion and its inverse (relative).
const convTol = 1e-12

// shownTol covers a number converted to the user's units, shown with inputDigits (5)
// significant figures and typed back into a fresh draft (relative; the page's own draft keeps
// the value itself, see TestDraftRoundTrip's last check).
const shownTol = 5e-5

func near(a, b float64) bool { return nearTol(a, b, convTol) }

func nearTol(a, b, tol float64) bool {
	d := a - b
	if d < 0 {
		d = -d
	}
	m := b
	if m < 0 {
		m = -m
	}
	return d <= tol*max(m, 1)
}

// Typing in other units stores the recipe's own units. Check values: exact definitions in
// NIST SP 811 (2008), appendix B.8 (1 lb = 453.59237 g; 1 US gal = 3.785411784 L) and
// section 4.2.1.1 (t/°C = T/K − 273.15; t/°F = 1.8 t/°C + 32).
func TestSetConvertsToRecipeUnits(t *testing.T) {
	tests := []struct {
		name, text string
		u          Units
		want       float64
	}{
		{"dissolve_temp_C", "95", Units{Temp: "F", Mass: "g", Volume: "mL"}, 35},     // NIST SP 811: (95 − 32)/1.8
		{"dissolve_temp_C", "308,15", Units{Temp: "K", Mass: "g", Volume: "mL"}, 35}, // decimal comma, K
		{"cool_to_C", "-40", Units{Temp: "F", Mass: "g", Volume: "mL"}, -40},         // −40 °F = −40 °C
		{"water_g", "2", Units{Temp: "C", Mass: "lb", Volume: "mL"}, 907.18474},      // 2 × 453.59237 g
		{"water_g", "1,5", Units{Temp: "C", Mass: "kg", Volume: "mL"}, 1500},         // decimal comma, kg
		{"water_mL", "1", Units{Temp: "C", Mass: "g", Volume: "gal"}, 3785.411784},   // 1 US gal
		{"water_mL", "0.25", Units{Temp: "C", Mass: "g", Volume: "L"}, 250},          // L
		{"metastable_width_K", "9", Units{Temp: "F", Mass: "lb", Volume: "gal"}, 5},  // a width in °F-degrees: ΔT/K = ΔT/°F ÷ 1.8 (SP 811 B.9)
		{"metastable_width_K", "4", Units{Temp: "K", Mass: "lb", Volume: "gal"}, 4},  // a width in K stays
		{"vessel_heat_capacity_J_per_K", "1e3", DefaultUnits, 1000},                  // exponent accepted
	}
	for _, tt := range tests {
		d := NewDraft()
		if err := d.Set(tt.name, tt.text, tt.u); err != nil {
			t.Errorf("Set(%s, %q, %v): %v", tt.name, tt.text, tt.u, err)
			continue
		}
		if got := d.Num[tt.name]; !near(got, tt.want) {
			t.Errorf("Set(%s, %q, %v) stores %v, want %v", tt.name, tt.text, tt.u, got, tt.want)
		}
	}
}

func TestSetRefusesWithField(t *testing.T) {
	for _, tt := range []struct{ name, text string }{
		{"water_g", "1.234,5"}, // thousands separator
		{"water_g", "abc"},
		{"dissolve_temp_C", "NaN"},
		{"cool_to_C", "Inf"},
		{"custom.points", "20 31.6 7"},
		{"custom.points", "20; x"},
	} {
		d := NewDraft()
		err := d.Set(tt.name, tt.text, DefaultUnits)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.name {
			t.Errorf("Set(%s, %q) = %v, want a FieldError for %s", tt.name, tt.text, err, tt.name)
		}
		if d.Errs[tt.name] == nil {
			t.Errorf("Set(%s, %q) did not record the error", tt.name, tt.text)
		}
	}
}

// A recipe shown in the page and read back is the same recipe, whatever the units shown.
func TestDraftRoundTrip(t *testing.T) {
	recipes := []string{
		// invented: greenhouse KNO3 stock, kept clear down to a 4 °C night
		`{"format":1,"name":"night stock (invented)","solute":"KNO3","water_mL":20000,"water_temp_C":18,"dissolve_temp_C":35,"clear_down_to_C":4,"clear_margin_K":2}`,
		// invented: copper sulfate pentahydrate crystals
		`{"format":1,"name":"blue crystals (invented)","notes":"line 1\nline 2","solute":"CuSO4","charged_form":"CuSO4·5H2O","purity_pct":98.5,"water_g":500,"dissolve_temp_C":60,"saturation_pct":95,"cool_to_C":20,"seed_at_C":45,"metastable_width_K":6,"cooling_time_min":120,"vessel_heat_capacity_J_per_K":850}`,
		`{"format":1,"custom":{"name":"my salt","molar_mass_g_per_mol":120.5,"points":[[10,20],[30,35.5],[50,55]],"model":"table","source":"bench notebook"},"water_g":100,"dissolve_temp_C":45,"charge_g":30,"cool_to_C":15}`,
	}
	for _, src := range recipes {
		r, err := recipe.Decode([]byte(src))
		if err != nil {
			t.Fatalf("Decode(%s): %v", src, err)
		}
		for _, u := range []Units{DefaultUnits, {Temp: "F", Mass: "lb", Volume: "gal"}, {Temp: "K", Mass: "kg", Volume: "L"}} {
			shown := FromRecipe(r)
			back := NewDraft()
			for g, c := range shown.Pick {
				back.Pick[g] = c
			}
			for _, s := range recipe.FieldSpecs {
				name := s.Key
				if !Known(name) {
					continue
				}
				if txt := shown.Display(name, u); txt != "" {
					if err := back.Set(name, txt, u); err != nil {
						t.Fatalf("Set(%s, %q): %v", name, txt, err)
					}
				}
			}
			got, err := back.Recipe()
			if err != nil {
				t.Fatalf("%v: read back: %v\n%s", u, err, back.JSON())
			}
			if string(got.Encode()) != string(r.Encode()) {
				// Converted numbers may differ in the last bits; compare each one.
				if !sameRecipe(got, r) {
					t.Errorf("%v: read back\n%s\nwant\n%s", u, got.Encode(), r.Encode())
				}
			}
			// Without re-reading, the draft gives the recipe back byte for byte.
			if exact, _ := shown.Recipe(); string(exact.Encode()) != string(r.Encode()) {
				t.Errorf("FromRecipe(%s).Recipe() =\n%s", src, exact.Encode())
			}
		}
	}
}

func sameRecipe(a, b recipe.Recipe) bool {
	da, db := FromRecipe(a), FromRecipe(b)
	if len(da.Num) != len(db.Num) || string(a.Name) != string(b.Name) || a.Solute != b.Solute {
		return false
	}
	for k, v := range da.Num {
		if w, ok := db.Num[k]; !ok || !nearTol(v, w, shownTol) {
			return false
		}
	}
	return true
}

func TestParsePoints(t *testing.T) {
	pts, err := ParsePoints("custom.points", "# T; g\n20; 31,6\n40\t63.9\n\n60 110")
	if err != nil {
		t.Fatal(err)
	}
	want := []recipe.Point{{TempC: 20, GPer100gWater: 31.6}, {TempC: 40, GPer100gWater: 63.9}, {TempC: 60, GPer100gWater: 110}}
	if len(pts) != len(want) {
		t.Fatalf("ParsePoints = %v, want %v", pts, want)
	}
	for i := range want {
		if pts[i] != want[i] {
			t.Errorf("point %d = %v, want %v", i, pts[i], want[i])
		}
	}
	if back, _ := ParsePoints("p", FormatPoints(pts)); len(back) != 3 || back[1] != pts[1] {
		t.Errorf("FormatPoints does not read back: %v", back)
	}
}

// Switching the water between volume and mass carries the amount over at the density of
// pure water. Check values: 998.2067 kg/m³ at 20 °C and 999.1026 kg/m³ at 15 °C (CRC
// Handbook of Chemistry and Physics, 97th ed., "Properties of water in the range 0–100 °C",
// from memory); tolerance 1e-5 relative covers the fourth decimal of those table values.
func TestSwitchWaterCarriesAmount(t *testing.T) {
	d := NewDraft()
	d.Set("solute", "KNO3", DefaultUnits)
	d.Set("dissolve_temp_C", "30", DefaultUnits)
	d.SwitchWater("volume")
	if err := d.Set("water_mL", "1000", DefaultUnits); err != nil {
		t.Fatal(err)
	}
	d.SwitchWater("mass") // no temperature given: 20 °C
	if g := d.Num["water_g"]; !nearTol(g, 998.2067, 1e-5) {
		t.Errorf("1000 mL at 20 °C → %v g, want 998.2067 g", g)
	}
	d.SwitchWater("volume")
	if err := d.Set("water_temp_C", "15", DefaultUnits); err != nil {
		t.Fatal(err)
	}
	if err := d.Set("water_mL", "2000", DefaultUnits); err != nil {
		t.Fatal(err)
	}
	d.SwitchWater("mass")
	if g := d.Num["water_g"]; !nearTol(g, 1998.2052, 1e-5) {
		t.Errorf("2000 mL at 15 °C → %v g, want 1998.2052 g", g)
	}
	d.SwitchWater("volume") // and back: the same volume
	if ml := d.Num["water_mL"]; !nearTol(ml, 2000, convTol) {
		t.Errorf("back to volume: %v mL, want 2000", ml)
	}
	r, err := d.Recipe()
	if err != nil || !r.WaterML.Set || r.WaterG.Set {
		t.Errorf("the recipe after switching back: %+v, %v; want water_mL only", r, err)
	}
	// Nothing readable to carry: the other box keeps what it had.
	d.Set("water_mL", "12,5,0", DefaultUnits)
	d.SwitchWater("mass")
	if g := d.Num["water_g"]; !nearTol(g, 1998.2052, 1e-5) {
		t.Errorf("a wrong volume was carried over: water_g %v", g)
	}
}
