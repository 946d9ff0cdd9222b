package main

import (
	"strings"
	"testing"

	"saltcast/core/recipe"
)

// The form reads back the recipe it shows, in every temperature unit.
func TestPrepFormRoundTrip(t *testing.T) {
	for _, s := range []string{
		`{"format":1,"kind":"preparation","name":"cold room","solute":"KCl","charged_form":"KCl","concentration":1.5,"concentration_unit":"mol/L","final_volume_mL":2000,"temp_C":20,"store_at_C":4}`,
		`{"format":1,"kind":"preparation","solute":"NaCl","concentration":0.5,"concentration_unit":"mol/L","final_mass_g":500,"stock_concentration":5,"stock_unit":"mol/L"}`,
		`{"format":1,"kind":"preparation","solute":"CuSO4","charged_form":"CuSO4·5H2O","purity_pct":98,"concentration":2,"concentration_unit":"% w/w","solvent_g":300,"temp_C":35.5}`,
	} {
		want, err := recipe.DecodePrep([]byte(s))
		if err != nil {
			t.Fatal(err)
		}
		for _, u := range []Units{DefaultUnits, {Temp: "F", Mass: "g", Volume: "mL"}, {Temp: "K", Mass: "kg", Volume: "L"}} {
			got, errs := FormFromPrep(want, u).Prep(u)
			if len(errs) > 0 {
				t.Fatalf("%s in %s: %v", s, u.Temp, errs)
			}
			if string(got.Encode()) != string(want.Encode()) {
				t.Errorf("%s in %s:\n got %s", s, u.Temp, got.Encode())
			}
		}
	}
}

// Errors land on the input that caused them.
func TestPrepFormErrors(t *testing.T) {
	f := NewPrepForm()
	f.Text["amount"] = "-3"
	if _, errs := f.Prep(DefaultUnits); errs["amount"] == nil {
		t.Errorf("negative amount: %v", errs)
	}
	f = NewPrepForm()
	f.Text["concentration"] = "1.234,5"
	if _, errs := f.Prep(DefaultUnits); errs["concentration"] == nil {
		t.Errorf("thousands separator: %v", errs)
	}
	f = NewPrepForm()
	f.FromStock = true
	if _, errs := f.Prep(DefaultUnits); errs["stock_concentration"] == nil {
		t.Errorf("stock without concentration: %v", errs)
	}
}

// The label says what the bottle holds, how it was made, how cold it may get and the hazard.
// 3.5 mol/L KCl saturates near 4.8 °C (CRC 98th ed. rows, see core/prep): keep above 7 °C.
func TestLabel(t *testing.T) {
	p, _ := recipe.DecodePrep([]byte(`{"solute":"KCl","concentration":3.5,"concentration_unit":"mol/L","final_volume_mL":1000}`))
	res, err := recipe.PlanPrep(p)
	if err != nil {
		t.Fatal(err)
	}
	l := LabelFor(res, "A. Tech", "2026-03-01", DefaultUnits)
	all := strings.Join([]string{l.Title, l.Formula, l.Concentration, l.Also, l.Made, l.Date, l.By, l.Keep, l.Hazard}, "|")
	for _, want := range []string{"Potassium chloride", "KCl", "3.5 mol/L", "% w/w", "g KCl, made up to 1000 mL at 20.0 °C",
		"2026-03-01", "A. Tech", "Keep above 7 °C", "SDS"} {
		if !strings.Contains(all, want) {
			t.Errorf("label lacks %q: %s", want, all)
		}
	}
}
