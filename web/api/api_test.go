package api

import (
	"errors"
	"math"
	"strings"
	"testing"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

func decode(t *testing.T, b []byte) wire.Value {
	t.Helper()
	v, err := wire.Decode(b)
	if err != nil {
		t.Fatalf("invalid JSON %s: %v", b, err)
	}
	return v
}

// Solubility against published values. g/100 g water from the CRC Handbook, 98th ed.
// (2017), "Aqueous Solubility of Inorganic Compounds at Various Temperatures", mass %
// converted by r = 100·w/(100 − w) (derived); mass % is the CRC figure itself.
func TestSolubility(t *testing.T) {
	tests := []struct {
		solute, temp string
		wantG        float64
		wantPhase    string
		wantMassPct  float64
		tol          float64 // g/100 g
	}{
		{"KNO3", "20", 31.93, "KNO3", 24.2, 0.02},                      // CRC 98th
		{"potassium nitrate", "60", 109.2, "KNO3", 52.2, 0.05},         // CRC 98th
		{"NaCl", "25", 35.96, "NaCl", 26.45, 0.02},                     // CRC 98th
		{"CuSO4·5H2O", "40", 28.53, "CuSO4·5H2O", 22.2, 0.03},          // CRC 98th, pentahydrate stable
		{"Na2SO4", "20", 19.23, "Na2SO4·10H2O", 16.13, 0.02},           // CRC 98th, below 32.38 °C
		{"Na2SO4", "50", 46.09, "Na2SO4", 31.55, 0.05},                 // CRC 98th, above the transition
		{"sodium acetate", "20,0", 46.63, "CH3COONa·3H2O", 31.8, 0.05}, // CRC 98th; decimal comma
	}
	for _, tt := range tests {
		out, err := Solubility(Params{"solute": tt.solute, "temp_C": tt.temp})
		if err != nil {
			t.Errorf("Solubility(%s, %s) error %v", tt.solute, tt.temp, err)
			continue
		}
		v := decode(t, out)
		g, _ := v.Get("g_per_100g_water")
		ph, _ := v.Get("solid_phase")
		mp, _ := v.Get("mass_percent")
		if math.Abs(g.Num-tt.wantG) > tt.tol || ph.Text != tt.wantPhase || math.Abs(mp.Num-tt.wantMassPct) > 0.05 {
			t.Errorf("Solubility(%s, %s) = %v g/100 g, %v mass %%, %s; want %v, %v, %s", tt.solute, tt.temp, g.Num, mp.Num, ph.Text, tt.wantG, tt.wantMassPct, tt.wantPhase)
		}
	}
}

// Molality of saturated NaCl at 20 °C: 35.89 g/100 g (CRC 98th) → 358.9/58.44 = 6.141
// mol/kg. Molarity: CRC 102nd ed. "Concentrative Properties" gives 5.326 mol/L at 26 mass %
// (ρ 1.1972 g/cm³; data of Wolf 1966 and Söhnel & Novotný 1985); saturated (26.41 %) is a
// little more, ≈5.42.
func TestSolubilityUnits(t *testing.T) {
	v := decode(t, must(Solubility(Params{"solute": "NaCl", "temp_C": "20"})))
	m, _ := v.Get("molality_mol_per_kg")
	if math.Abs(m.Num-6.141) > 0.005 {
		t.Errorf("molality = %v, want 6.141", m.Num)
	}
	c, _ := v.Get("mol_per_L")
	if c.Kind != wire.Number || math.Abs(c.Num-5.42) > 0.05 {
		t.Errorf("mol_per_L = %+v, want ≈5.42", c)
	}
}

func must(b []byte, err error) []byte {
	if err != nil {
		panic(err)
	}
	return b
}

func TestSolubilityRefusals(t *testing.T) {
	for _, tt := range []struct {
		p     Params
		field string
	}{
		{Params{"temp_C": "20"}, "solute"},
		{Params{"solute": "KNO3"}, "temp_C"},
		{Params{"solute": "KNO3", "temp_C": "hot"}, "temp_C"},
		{Params{"solute": "KNO3", "temp_C": "NaN"}, "temp_C"},
		{Params{"solute": "KNO3", "temp_C": "130"}, "temp_C"},
		{Params{"solute": "KNO3", "temp_C": "20", "pressure_kPa": "100"}, "pressure_kPa"},
		{Params{"solute": "adamantium", "temp_C": "20"}, "solute"},
	} {
		_, err := Solubility(tt.p)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.field || !IsInputError(err) {
			t.Errorf("Solubility(%v) error %v, want an input error on %s", tt.p, err, tt.field)
		}
	}
}

// compoundsListMaxBytes bounds the compounds list this test reads back: it grows by about
// 2.5 kB per compound of the library, past wire's 64 KiB default limit for user input.
const compoundsListMaxBytes = 1 << 20

func TestCompounds(t *testing.T) {
	v, err := wire.DecodeLimits(Compounds(), wire.Limits{MaxBytes: compoundsListMaxBytes})
	if err != nil {
		t.Fatalf("Compounds: invalid JSON: %v", err)
	}
	list, _ := v.Get("compounds")
	ids := map[string]bool{}
	for _, c := range list.Items {
		id, _ := c.Get("id")
		ids[id.Text] = true
		for _, k := range []string{"name", "names", "forms", "phases", "valid_from_C", "valid_to_C", "hazard"} {
			if _, ok := c.Get(k); !ok {
				t.Errorf("compound %s lacks %q", id.Text, k)
			}
		}
	}
	for _, id := range []string{"NaCl", "KCl", "KNO3", "NaNO3", "NH4Cl", "K2SO4", "CuSO4", "Na2SO4", "CH3COONa",
		"KAl(SO4)2", "MgSO4", "KH2PO4", "Ca(OH)2", "Li2CO3", "C6H5COOH", "C12H22O11"} {
		if !ids[id] {
			t.Errorf("Compounds lacks %s", id)
		}
	}
	// Callers get their own copy.
	a := Compounds()
	a[0] = 'X'
	if Compounds()[0] != '{' {
		t.Error("Compounds returns shared bytes")
	}
}

func TestPlanAndErrors(t *testing.T) {
	out, err := Plan([]byte(`{"solute":"KNO3","water_g":100,"dissolve_temp_C":60,"cool_to_C":20}`))
	if err != nil {
		t.Fatal(err)
	}
	c, _ := decode(t, out).Get("crystals_g")
	// 109.2 − 31.93 = 77.27 g (CRC 98th ed., worked in core/balance).
	if math.Abs(c.Num-77.27) > 0.1 {
		t.Errorf("crystals_g = %v, want 77.27", c.Num)
	}
	_, err = Plan([]byte(`{"solute":"KNO3","water_g":"lots","dissolve_temp_C":60}`))
	if !IsInputError(err) {
		t.Fatalf("Plan(bad type) error %v, want an input error", err)
	}
	e := decode(t, ErrorJSON(err))
	f, _ := e.Get("field")
	msg, _ := e.Get("error")
	if f.Text != "water_g" || !strings.Contains(msg.Text, "water_g") {
		t.Errorf("ErrorJSON = %s", ErrorJSON(err))
	}
	_, err = Plan([]byte(`{"solute":`))
	if !IsInputError(err) {
		t.Errorf("Plan(malformed) error %v is not an input error", err)
	}
	if f, _ := decode(t, ErrorJSON(err)).Get("field"); f.Text != "" {
		t.Errorf("syntax error has field %q", f.Text)
	}
	if IsInputError(errors.New("disk on fire")) {
		t.Error("a plain error counts as input error")
	}
	if got := string(ErrorJSON(errors.New("a <b> & c"))); got != `{"error":"a \u003cb\u003e \u0026 c","field":""}` {
		t.Errorf("ErrorJSON escaping: %s", got)
	}
}

func BenchmarkServicePlan(b *testing.B) {
	body := []byte(`{"solute":"CuSO4","charged_form":"CuSO4·5H2O","purity_pct":98,"water_g":500,"dissolve_temp_C":60,
"saturation_pct":95,"cool_to_C":20,"seed_at_C":55,"metastable_width_K":5,"cooling_time_min":240,"vessel_heat_capacity_J_per_K":450}`)
	for b.Loop() {
		out, err := Plan(body)
		if err != nil {
			b.Fatal(err)
		}
		benchSink = out
	}
}

var benchSink []byte
