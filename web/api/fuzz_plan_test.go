package api_test

import (
	"testing"

	"saltcast/core/wire"
	"saltcast/web/api"
)

// Seeds also live in testdata/fuzz/<target>/ beside this file (Go reads them from there).

// FuzzServicePlan checks what a front end relies on: whatever the body, Plan never panics,
// every error is the user's (IsInputError, so the worker answers 4xx and never 5xx), and every
// answer is strict JSON (core/wire refuses NaN and Inf) with the contract keys.
func FuzzServicePlan(f *testing.F) {
	f.Add([]byte(`{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"cool_to_C":20}`))
	f.Add([]byte(`{"solute":"Na2SO4","water_mL":500,"water_temp_C":15,"dissolve_temp_C":40,"saturation_pct":90,"cool_to_C":10,"seed_at_C":25,"metastable_width_K":3,"cooling_time_min":90}`))
	f.Add([]byte(`{"solute":"sodium acetate trihydrate","water_g":10,"charge_g":100,"dissolve_temp_C":80,"seed_at_C":20}`))
	f.Add([]byte(`{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,10],[20,30],[40,50]],"model":"apelblat"},"water_g":100,"dissolve_temp_C":30,"cool_to_C":5}`))
	f.Add([]byte(`{"solute":"Ca(OH)2","water_g":1000,"dissolve_temp_C":20,"cool_to_C":80,"evaporated_water_g":100}`))
	f.Fuzz(func(t *testing.T, body []byte) {
		out, err := api.Plan(body)
		if err != nil {
			if !api.IsInputError(err) {
				t.Fatalf("Plan(%q) error %v is not an input error", body, err)
			}
			if _, err := wire.Decode(api.ErrorJSON(err)); err != nil {
				t.Fatalf("ErrorJSON is not strict JSON: %v", err)
			}
			return
		}
		v, err := wire.Decode(out)
		if err != nil {
			t.Fatalf("Plan(%q) answer is not strict JSON: %v", body, err)
		}
		for _, k := range []string{"charge_g", "water_g", "crystals_g", "cautions", "warnings"} {
			if _, ok := v.Get(k); !ok {
				t.Fatalf("Plan(%q) answer lacks %s", body, k)
			}
		}
	})
}

// FuzzServiceSolubility checks the solubility query the same way.
func FuzzServiceSolubility(f *testing.F) {
	f.Add("KNO3", "20")
	f.Add("Glauber's salt", "32,38")
	f.Add("alum", "-4,9")
	f.Add("Ca(OH)2", "1e308")
	f.Add("", "NaN")
	f.Fuzz(func(t *testing.T, solute, temp string) {
		out, err := api.Solubility(api.Params{"solute": solute, "temp_C": temp})
		if err != nil {
			if !api.IsInputError(err) {
				t.Fatalf("Solubility(%q, %q) error %v is not an input error", solute, temp, err)
			}
			return
		}
		if _, err := wire.Decode(out); err != nil {
			t.Fatalf("Solubility(%q, %q) answer is not strict JSON: %v", solute, temp, err)
		}
	})
}
