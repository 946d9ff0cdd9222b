package main

import (
	"strings"
	"testing"

	"saltcast/core/recipe"
)

// CSV quotes as RFC 4180 says: fields with commas, quotes or line breaks in double quotes,
// quotes doubled; lines end in CRLF.
func TestCSVQuoting(t *testing.T) {
	var r recipe.Result
	r.Recipe.Name = `tank "B", night`
	r.SoluteID = "KNO3"
	r.ChargeG = 1234.6
	r.Warnings = []string{"line one\nline two"}
	got := CSV(&r, DefaultUnits)
	for _, want := range []string{
		"key,value,unit,label\r\n",
		`name,"tank ""B"", night",,Batch name` + "\r\n",
		"charge_g,1235,g,Charge to weigh\r\n", // four significant figures
		"warning,\"line one\nline two\",,\r\n",
	} {
		if !strings.Contains(got, want) {
			t.Errorf("CSV lacks %q:\n%s", want, got)
		}
	}
}

// Figures never show NaN or Inf: a non-finite number shows as a dash.
func TestFigureNonFinite(t *testing.T) {
	var r recipe.Result
	r.HasOnset = true
	for _, v := range []float64{nan(), inf()} {
		r.SaturationTempC = v
		r.ChargeG = v
		for _, key := range []string{"saturation_temp_C", "charge_g"} {
			f, _ := FigureByKey(key)
			text, _, ok := f.Show(&r, Units{Temp: "F", Mass: "lb", Volume: "gal"})
			if !ok || text != "—" {
				t.Errorf("%s of %v shows %q, want —", key, v, text)
			}
		}
	}
}

func nan() float64 { z := 0.0; return z / z }
func inf() float64 { z := 0.0; return 1 / z }

// The heat figures of a seeded sodium acetate batch: the basis is the trihydrate's heat of
// fusion, and the insulated batch holds at 58 °C = 136.4 °F (the trihydrate's incongruent
// melting point, Lane, Solar Heat Storage, 1983, from memory; °F derived).
func TestHeatFigures(t *testing.T) {
	res, err := recipe.Plan(recipe.Recipe{Solute: "CH3COONa", WaterG: recipe.Some(100), DissolveTempC: 70,
		SeedAtC: recipe.Some(20), CoolToC: recipe.Some(20)})
	if err != nil {
		t.Fatal(err)
	}
	for _, tt := range []struct {
		key  string
		u    Units
		want string
	}{
		{"heat_basis", DefaultUnits, "heat of fusion of the hydrate"},
		{"adiabatic_held_at_transition", DefaultUnits, "held at 58 °C"},
		{"adiabatic_held_at_transition", Units{Temp: "F", Mass: "g", Volume: "mL"}, "held at 136.4 °F"},
		{"adiabatic_phase", DefaultUnits, "CH3COONa·3H2O"},
	} {
		f, _ := FigureByKey(tt.key)
		text, _, ok := f.Show(&res, tt.u)
		if !ok || !strings.HasPrefix(text, tt.want) {
			t.Errorf("%s in %s = %q (%v), want it to start %q", tt.key, tt.u.Temp, text, ok, tt.want)
		}
	}
}
