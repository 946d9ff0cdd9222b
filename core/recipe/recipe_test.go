package recipe

import (
	"errors"
	"strings"
	"testing"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

const minimal = `{"solute":"KNO3","water_g":100,"dissolve_temp_C":60}`

func TestDecodeMinimal(t *testing.T) {
	r, err := Decode([]byte(minimal))
	if err != nil {
		t.Fatal(err)
	}
	if r.Format != 1 || r.Solute != "KNO3" || r.WaterG != Some(100) || r.DissolveTempC != 60 {
		t.Errorf("Decode(minimal) = %+v", r)
	}
	if r.SaturationPct.Set || r.ChargeG.Set || r.PurityPct.Set {
		t.Errorf("Decode(minimal) set optional fields: %+v", r)
	}
}

func TestDecodeFull(t *testing.T) {
	in := `{"format":1,"name":"n","notes":"(invented)","solute":"CuSO4","charged_form":"CuSO4.5H2O",
	"purity_pct":99.5,"water_mL":500,"water_temp_C":18,"dissolve_temp_C":60,"charge_g":250,
	"cool_to_C":20,"evaporated_water_g":5,"seed_at_C":45,"metastable_width_K":4,"cooling_time_min":180,
	"liquor_heat_capacity_kJ_per_kgK":3.2,"vessel_heat_capacity_J_per_K":400}`
	r, err := Decode([]byte(in))
	if err != nil {
		t.Fatal(err)
	}
	want := Recipe{Format: 1, Name: "n", Notes: "(invented)", Solute: "CuSO4", ChargedForm: "CuSO4.5H2O",
		PurityPct: Some(99.5), WaterML: Some(500), WaterTempC: Some(18), DissolveTempC: 60, ChargeG: Some(250),
		CoolToC: Some(20), EvaporatedWaterG: Some(5), SeedAtC: Some(45), MetastableWidthK: Some(4),
		CoolingTimeMin: Some(180), LiquorHeatCapacityKJPerKgK: Some(3.2), VesselHeatCapacityJPerK: Some(400)}
	if r != want {
		t.Errorf("Decode(full) =\n%+v\nwant\n%+v", r, want)
	}
	// Encode → Decode gives the same recipe.
	r2, err := Decode(r.Encode())
	if err != nil {
		t.Fatalf("Decode(Encode()) error %v; encoded %s", err, r.Encode())
	}
	if r2 != r {
		t.Errorf("round trip changed the recipe:\n%+v\n%+v", r2, r)
	}
}

func TestDecodeCustom(t *testing.T) {
	in := `{"custom":{"name":"compound X (invented)","molar_mass_g_per_mol":150,
	"points":[[10,5],[30,9.5],[50,17]],"model":"vant-hoff","source":"our bench, 2024 (invented)",
	"solution_enthalpy_kJ_per_mol":25},"water_g":200,"dissolve_temp_C":50,"cool_to_C":10}`
	r, err := Decode([]byte(in))
	if err != nil {
		t.Fatal(err)
	}
	c := r.Custom
	if c == nil || c.Name != "compound X (invented)" || c.MolarMassGPerMol != 150 || len(c.Points) != 3 ||
		c.Points[1] != (Point{30, 9.5}) || c.Model != "vant-hoff" || c.SolutionEnthalpyKJPerMol != Some(25) {
		t.Fatalf("custom = %+v", c)
	}
	r2, err := Decode(r.Encode())
	if err != nil {
		t.Fatal(err)
	}
	if r2.Custom == nil || r2.Custom.Name != c.Name || len(r2.Custom.Points) != 3 || r2.Custom.Points[2] != c.Points[2] {
		t.Errorf("round trip of custom: %+v", r2.Custom)
	}
}

func TestDecodeRefuses(t *testing.T) {
	tests := []struct {
		name      string
		in        string
		wantField string
		wantText  string // part of the message
	}{
		// unknown and missing keys
		{"unknown key", `{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"colour":"red"}`, "colour", "one of the keys: "},
		{"missing dissolve", `{"solute":"KNO3","water_g":100}`, "dissolve_temp_C", "required"},
		{"missing water", `{"solute":"KNO3","dissolve_temp_C":60}`, "water_g", "water_mL"},
		{"missing solute", `{"water_g":100,"dissolve_temp_C":60}`, "solute", "compound"},
		// wrong types
		{"water as string", `{"solute":"KNO3","water_g":"100","dissolve_temp_C":60}`, "water_g", "not a string"},
		{"solute as number", `{"solute":5,"water_g":100,"dissolve_temp_C":60}`, "solute", "string"},
		{"array recipe", `[1]`, "recipe", "object"},
		// impossible values
		{"negative water", `{"solute":"KNO3","water_g":-5,"dissolve_temp_C":60}`, "water_g", "> 0"},
		{"zero purity", `{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"purity_pct":0}`, "purity_pct", "> 0"},
		{"purity over 100", `{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"purity_pct":100.1}`, "purity_pct", "≤ 100"},
		{"absurd mass", `{"solute":"KNO3","water_g":1e300,"dissolve_temp_C":60}`, "water_g", "1e7"},
		{"absurd temperature", `{"solute":"KNO3","water_g":100,"dissolve_temp_C":5000}`, "dissolve_temp_C", "150"},
		{"saturation over 100", `{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"saturation_pct":120}`, "saturation_pct", "≤ 100"},
		// contradictions
		{"saturation and charge", `{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"saturation_pct":90,"charge_g":50}`, "charge_g", "only one"},
		{"water both ways", `{"solute":"KNO3","water_g":100,"water_mL":100,"dissolve_temp_C":60}`, "water_mL", "not both"},
		{"water temp without volume", `{"solute":"KNO3","water_g":100,"water_temp_C":20,"dissolve_temp_C":60}`, "water_temp_C", "water_mL"},
		{"margin without clear", `{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"clear_margin_K":2}`, "clear_margin_K", "clear_down_to_C"},
		{"solute and custom", `{"solute":"KNO3","custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,1],[10,2],[20,3]]},"water_g":100,"dissolve_temp_C":60}`, "custom", "not both"},
		// format
		{"newer format", `{"format":2,"solute":"KNO3","water_g":100,"dissolve_temp_C":60}`, "format", "update Saltcast"},
		{"zero format", `{"format":0,"solute":"KNO3","water_g":100,"dissolve_temp_C":60}`, "format", "whole number"},
		{"fractional format", `{"format":1.5,"solute":"KNO3","water_g":100,"dissolve_temp_C":60}`, "format", "whole number"},
		// custom compound
		{"custom unknown key", `{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,1],[10,2],[20,3]],"colour":1},"water_g":100,"dissolve_temp_C":60}`, "custom.colour", "one of the keys: "},
		{"custom two points", `{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,1],[10,2]]},"water_g":100,"dissolve_temp_C":60}`, "custom.points", "at least 3"},
		{"custom bad point", `{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,1],[10],[20,3]]},"water_g":100,"dissolve_temp_C":60}`, "custom.points[1]", "pair"},
		{"custom negative g", `{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,1],[10,-2],[20,3]]},"water_g":100,"dissolve_temp_C":60}`, "custom.points[1]", "> 0"},
		{"custom model", `{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,1],[10,2],[20,3]],"model":"spline"},"water_g":100,"dissolve_temp_C":60}`, "custom.model", "apelblat"},
		{"custom no molar mass", `{"custom":{"name":"x","points":[[0,1],[10,2],[20,3]]},"water_g":100,"dissolve_temp_C":60}`, "custom.molar_mass_g_per_mol", "required"},
	}
	for _, tt := range tests {
		_, err := Decode([]byte(tt.in))
		var fe *unit.FieldError
		if !errors.As(err, &fe) {
			t.Errorf("%s: Decode error = %v, want a *unit.FieldError", tt.name, err)
			continue
		}
		if fe.Field != tt.wantField || !strings.Contains(fe.Error(), tt.wantText) {
			t.Errorf("%s: Decode error %q (field %q), want field %q and text %q", tt.name, fe.Error(), fe.Field, tt.wantField, tt.wantText)
		}
	}
}

func TestDecodeSyntax(t *testing.T) {
	for _, in := range []string{`{"solute":"KNO3",}`, `{"water_g":NaN}`, `{"a":1,"a":1}`, ``} {
		_, err := Decode([]byte(in))
		var se *wire.SyntaxError
		if !errors.As(err, &se) {
			t.Errorf("Decode(%q) error = %v, want *wire.SyntaxError", in, err)
		}
	}
}

func TestCollection(t *testing.T) {
	a, _ := Decode([]byte(minimal))
	b, _ := Decode([]byte(`{"solute":"NaCl","water_mL":250,"dissolve_temp_C":25,"charge_g":40,"name":"brine (invented)"}`))
	data := EncodeCollection([]Recipe{a, b})
	got, err := DecodeCollection(data)
	if err != nil {
		t.Fatalf("DecodeCollection(EncodeCollection) error %v; data %s", err, data)
	}
	if len(got) != 2 || got[0] != a || got[1] != b {
		t.Errorf("collection round trip = %+v", got)
	}
	// All or nothing: the second recipe is bad, so nothing is returned.
	bad := `{"format":1,"kind":"saltcast-recipes","recipes":[` + minimal + `,{"solute":"KNO3","water_g":0,"dissolve_temp_C":60}]}`
	got, err = DecodeCollection([]byte(bad))
	var fe *unit.FieldError
	if !errors.As(err, &fe) || fe.Field != "recipes[1].water_g" || got != nil {
		t.Errorf("DecodeCollection(bad second) = %v, %v; want nil and a field error on recipes[1].water_g", got, err)
	}
	for _, in := range []string{
		`{"format":1,"recipes":[]}`,
		`{"format":1,"kind":"other","recipes":[]}`,
		`{"format":3,"kind":"saltcast-recipes","recipes":[]}`,
		`{"format":1,"kind":"saltcast-recipes","recipes":{}}`,
		`{"format":1,"kind":"saltcast-recipes","recipes":[],"extra":1}`,
	} {
		if _, err := DecodeCollection([]byte(in)); err == nil {
			t.Errorf("DecodeCollection(%s) accepted", in)
		}
	}
}

// FuzzDecode checks properties: Decode never panics; a recipe it accepts encodes, and
// decoding that encoding gives the same recipe.
func FuzzDecode(f *testing.F) {
	f.Add([]byte(minimal))
	f.Add([]byte(`{"format":1,"solute":"CuSO4","charged_form":"CuSO4·5H2O","purity_pct":99,"water_mL":500,"water_temp_C":18,"dissolve_temp_C":60,"saturation_pct":95,"cool_to_C":20,"seed_at_C":45}`))
	f.Add([]byte(`{"custom":{"name":"x","molar_mass_g_per_mol":100,"points":[[0,1],[10,2],[20,3]],"model":"apelblat"},"water_g":100,"dissolve_temp_C":60,"clear_down_to_C":4,"clear_margin_K":2}`))
	f.Add([]byte(`{"solute":"KNO3","water_g":-1e999,"dissolve_temp_C":60}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		r, err := Decode(data)
		if err != nil {
			return
		}
		enc := r.Encode()
		r2, err := Decode(enc)
		if err != nil {
			t.Fatalf("Decode(Encode(Decode(%q))) error %v; encoded %s", data, err, enc)
		}
		if string(r2.Encode()) != string(enc) {
			t.Fatalf("unstable: %s vs %s", enc, r2.Encode())
		}
	})
}
