package recipe

import (
	"errors"
	"math"
	"strings"
	"testing"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

func mustPlan(t *testing.T, js string) Result {
	t.Helper()
	r, err := Decode([]byte(js))
	if err != nil {
		t.Fatalf("Decode(%s): %v", js, err)
	}
	res, err := Plan(r)
	if err != nil {
		t.Fatalf("Plan(%s): %v", js, err)
	}
	return res
}

// Water by volume: 500 mL at 20 °C weighs 500 × 0.998204 = 499.102 g (pure water 998.204
// kg/m³ at 20 °C, Kell 1975, J. Chem. Eng. Data 20:97, derived from its equation);
// at the default temperature (20 °C) the same.
func TestWaterByVolume(t *testing.T) {
	for _, js := range []string{
		`{"solute":"NaCl","water_mL":500,"water_temp_C":20,"dissolve_temp_C":25,"saturation_pct":50}`,
		`{"solute":"NaCl","water_mL":500,"dissolve_temp_C":25,"saturation_pct":50}`,
	} {
		res := mustPlan(t, js)
		if math.Abs(res.WaterG-499.102) > 0.005 {
			t.Errorf("%s: water = %.4f g, want 499.102 g", js, res.WaterG)
		}
		if !strings.Contains(strings.Join(res.Sources, "\n"), "Kell") {
			t.Errorf("%s: sources lack the water density source", js)
		}
	}
}

// A custom compound built from the CRC 98th ed. KNO3 rows ("Aqueous Solubility of Inorganic
// Compounds at Various Temperatures", converted to g/100 g water) plans
// the same crash-out as the library's KNO3: 109.2 − 31.93 = 77.27 g from 100 g water,
// 60 → 20 °C.
func TestCustomCompound(t *testing.T) {
	js := `{"custom":{"name":"our nitrate (invented)","molar_mass_g_per_mol":101.10,
	"points":[[0,13.64],[10,21.36],[20,31.93],[30,45.56],[40,62.87],[50,84.16],[60,109.2],[80,170.3],[100,242.5]],
	"model":"table","source":"CRC 98th ed. rows, typed by hand","solution_enthalpy_kJ_per_mol":34.89},
	"water_g":100,"dissolve_temp_C":60,"cool_to_C":20}`
	res := mustPlan(t, js)
	if math.Abs(res.CrystalsG-77.27) > 0.01 {
		t.Errorf("custom crystals = %.3f g, want 77.27 g", res.CrystalsG)
	}
	if !res.HasDissolutionHeat || math.Abs(res.DissolutionEnthalpyKJPerMol-34.89) > 1e-12 {
		t.Errorf("custom enthalpy not used: %+v", res.DissolutionEnthalpyKJPerMol)
	}
	if !strings.Contains(strings.Join(res.Cautions, " "), "SDS") {
		t.Errorf("custom compound without an SDS caution: %q", res.Cautions)
	}
	// A van 't Hoff fit through data with a maximum is refused, naming the recipe key.
	bad := `{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,10],[20,30],[40,10]],"model":"vant-hoff"},
	"water_g":100,"dissolve_temp_C":20}`
	r, err := Decode([]byte(bad))
	if err != nil {
		t.Fatal(err)
	}
	_, err = Plan(r)
	var fe *unit.FieldError
	if !errors.As(err, &fe) || !strings.HasPrefix(fe.Field, "custom.") {
		t.Errorf("Plan(non-monotone van 't Hoff) error %v, want a FieldError on a custom key", err)
	}
}

func TestPlanRefusals(t *testing.T) {
	tests := []struct{ js, field string }{
		{`{"solute":"unobtainium","water_g":100,"dissolve_temp_C":20}`, "solute"},
		{`{"solute":"KNO3","charged_form":"KNO3·7H2O","water_g":100,"dissolve_temp_C":20}`, "charged_form"},
		{`{"solute":"KNO3","water_g":100,"dissolve_temp_C":20,"evaporated_water_g":5}`, "evaporated_water_g"},
		{`{"solute":"KNO3","water_g":100,"dissolve_temp_C":20,"charge_g":500}`, "charge_g"},
		{`{"solute":"KNO3","water_g":100,"dissolve_temp_C":-30}`, "dissolve_temp_C"},
	}
	for _, tt := range tests {
		r, err := Decode([]byte(tt.js))
		if err == nil {
			_, err = Plan(r)
		}
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.field {
			t.Errorf("%s: error %v, want a FieldError for %s", tt.js, err, tt.field)
		}
	}
}

// The CLI contract: these keys are always present in a plan (web/cmd/saltcast/README.md).
var contractKeys = []string{"charge_g", "water_g", "saturation_temp_C", "crystals_g", "crystal_phase", "yield_pct",
	"liquor_g", "liquor_g_per_100g_water", "dissolution_heat_kJ", "crystallization_heat_kJ", "cooling_duty_kJ",
	"adiabatic_end_temp_C", "adiabatic_crystals_g", "cautions", "warnings", "sources"}

func TestResultEncode(t *testing.T) {
	for _, js := range []string{
		`{"solute":"CuSO4","charged_form":"CuSO4.5H2O","water_g":500,"dissolve_temp_C":60,"saturation_pct":95,"cool_to_C":20,"seed_at_C":55,"metastable_width_K":5,"cooling_time_min":240}`,
		`{"solute":"NaCl","water_g":100,"dissolve_temp_C":25,"saturation_pct":50}`,
	} {
		res := mustPlan(t, js)
		out := res.Encode()
		v, err := wire.Decode(out)
		if err != nil {
			t.Fatalf("Encode gives invalid JSON: %v\n%s", err, out)
		}
		for _, k := range contractKeys {
			if _, ok := v.Get(k); !ok {
				t.Errorf("%s: output lacks %q", js, k)
			}
		}
		crystals, _ := v.Get("crystals_g")
		if res.HasTarget != (crystals.Kind == wire.Number) {
			t.Errorf("crystals_g is %v with HasTarget %v", crystals.Kind, res.HasTarget)
		}
	}
	res := mustPlan(t, `{"solute":"CuSO4","charged_form":"CuSO4.5H2O","water_g":500,"dissolve_temp_C":60,"saturation_pct":95,"cool_to_C":20,"seed_at_C":55}`)
	v, _ := wire.Decode(res.Encode())
	end, _ := v.Get("adiabatic_end_temp_C")
	if end.Kind != wire.Number || math.Abs(end.Num-res.AdiabaticEndC) > 1e-4 {
		t.Errorf("adiabatic_end_temp_C = %+v, want %v", end, res.AdiabaticEndC)
	}
}

// FuzzPlan checks that no recipe, however odd, panics the planner or gets a NaN into the
// output: Plan either refuses it with an error or returns a result whose encoding is
// valid JSON.
func FuzzPlan(f *testing.F) {
	f.Add([]byte(`{"solute":"Na2SO4","water_g":100,"dissolve_temp_C":40,"cool_to_C":20,"seed_at_C":25,"metastable_width_K":2,"cooling_time_min":60}`))
	f.Add([]byte(`{"solute":"sodium acetate trihydrate","water_g":10,"charge_g":100,"dissolve_temp_C":80,"seed_at_C":20}`))
	f.Add([]byte(`{"solute":"Ca(OH)2","water_g":1000,"dissolve_temp_C":20,"cool_to_C":80,"evaporated_water_g":900}`))
	f.Add([]byte(`{"solute":"KNO3","water_mL":1e-300,"dissolve_temp_C":0,"clear_down_to_C":0,"clear_margin_K":0}`))
	f.Add([]byte(`{"custom":{"name":"x","molar_mass_g_per_mol":1,"points":[[0,1e-9],[0.001,1e5],[150,1]],"model":"polynomial"},"water_g":1,"dissolve_temp_C":75,"cool_to_C":-40}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		r, err := Decode(data)
		if err != nil {
			return
		}
		res, err := Plan(r)
		if err != nil {
			return
		}
		if _, err := wire.Decode(res.Encode()); err != nil {
			t.Fatalf("plan of %s encodes to invalid JSON: %v", data, err)
		}
	})
}
