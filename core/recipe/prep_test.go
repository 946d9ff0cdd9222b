package recipe

import (
	"bytes"
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"

	"saltcast/core/prep"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// The four requests of a technician, as recipes.
var prepExamples = []string{
	`{"name":"cold-room KCl","solute":"KCl","concentration":1.5,"concentration_unit":"mol/L","final_volume_mL":2000,"temp_C":20,"store_at_C":4}`,
	`{"solute":"CuSO4","charged_form":"CuSO4·5H2O","purity_pct":98,"concentration":0.1,"concentration_unit":"mol/L","final_volume_mL":250}`,
	`{"solute":"potassium nitrate","concentration":10,"concentration_unit":"% w/v","final_volume_mL":500}`,
	`{"solute":"NaCl","concentration":0.5,"concentration_unit":"mol/L","final_volume_mL":1000,"stock_concentration":5,"stock_unit":"mol/L"}`,
	`{"format":1,"kind":"preparation","solute":"KNO3","concentration":1,"concentration_unit":"mol/kg","solvent_g":1000,"notes":"for the melting-point demo"}`,
	`{"solute":"KH2PO4","concentration":5,"concentration_unit":"% w/w","final_mass_g":200}`,
}

func TestDecodePrepAccepts(t *testing.T) {
	for _, s := range prepExamples {
		p, err := DecodePrep([]byte(s))
		if err != nil {
			t.Errorf("DecodePrep(%s): %v", s, err)
			continue
		}
		res, err := PlanPrep(p)
		if err != nil {
			t.Errorf("PlanPrep(%s): %v", s, err)
			continue
		}
		out := res.Encode()
		v, err := wire.Decode(out)
		if err != nil {
			t.Fatalf("result of %s is not JSON: %v", s, err)
		}
		// The contract's keys are always present.
		for _, k := range []string{"form_g", "water_g", "water_mL", "solution_g", "solution_mL", "density_g_per_mL",
			"density_source", "mol_per_L", "g_per_L", "pct_w_w", "pct_w_v", "mol_per_kg", "saturation_pct",
			"saturation_temp_C", "stock_mL", "stock_g", "cautions", "warnings", "sources"} {
			if _, ok := v.Get(k); !ok {
				t.Errorf("result of %s lacks %q", s, k)
			}
		}
	}
}

func TestDecodePrepRefuses(t *testing.T) {
	base := `"solute":"KCl","concentration":1,"concentration_unit":"mol/L"`
	cases := []struct {
		json, field string
	}{
		{`{` + base + `,"final_volume_mL":100,"colour":"red"}`, "colour"},
		{`{` + base + `,"final_volume_mL":"100"}`, "final_volume_mL"},
		{`{` + base + `,"final_volume_mL":0}`, "final_volume_mL"},
		{`{` + base + `,"final_volume_mL":-5}`, "final_volume_mL"},
		{`{` + base + `,"final_volume_mL":1e400}`, ""}, // not a float64: a syntax error
		{`{` + base + `}`, "final_volume_mL"},
		{`{` + base + `,"final_volume_mL":100,"final_mass_g":100}`, "final_mass_g"},
		{`{` + base + `,"final_volume_mL":100,"solvent_g":100}`, "solvent_g"},
		{`{"solute":"KCl","concentration":1,"concentration_unit":"M","final_volume_mL":100}`, "concentration_unit"},
		{`{"solute":"KCl","concentration_unit":"mol/L","final_volume_mL":100}`, "concentration"},
		{`{"solute":"KCl","concentration":0,"concentration_unit":"mol/L","final_volume_mL":100}`, "concentration"},
		{`{"solute":"KCl","concentration":100,"concentration_unit":"% w/w","final_mass_g":100}`, "concentration"},
		{`{"concentration":1,"concentration_unit":"mol/L","final_volume_mL":100}`, "solute"},
		{`{` + base + `,"final_volume_mL":100,"stock_concentration":3}`, "stock_unit"},
		{`{` + base + `,"final_volume_mL":100,"stock_unit":"mol/L"}`, "stock_concentration"},
		{`{` + base + `,"final_volume_mL":100,"stock_concentration":3,"stock_unit":"mol/L","purity_pct":99}`, "purity_pct"},
		{`{` + base + `,"final_volume_mL":100,"stock_concentration":3,"stock_unit":"mol/L","charged_form":"KCl"}`, "charged_form"},
		{`{` + base + `,"final_volume_mL":100,"temp_C":101}`, "temp_C"},
		{`{` + base + `,"final_volume_mL":100,"temp_C":null}`, "temp_C"},
		{`{` + base + `,"final_volume_mL":100,"kind":"batch"}`, "kind"},
		{`{` + base + `,"final_volume_mL":100,"format":2}`, "format"},
		{`{` + base + `,"final_volume_mL":100,"name":7}`, "name"},
		{`[` + base + `]`, ""},
		{`{` + base + `,"final_volume_mL":100,"final_volume_mL":200}`, ""}, // duplicate key: a syntax error
	}
	for _, tc := range cases {
		_, err := DecodePrep([]byte(tc.json))
		if err == nil {
			t.Errorf("DecodePrep(%s) accepted it", tc.json)
			continue
		}
		var fe *unit.FieldError
		var se *wire.SyntaxError
		switch {
		case tc.field == "":
			if !errors.As(err, &se) && !errors.As(err, &fe) {
				t.Errorf("DecodePrep(%s) error %T %v", tc.json, err, err)
			}
		case !errors.As(err, &fe) || fe.Field != tc.field:
			t.Errorf("DecodePrep(%s) error %v, want field %q", tc.json, err, tc.field)
		}
	}
}

// Errors found while working the recipe out also name the recipe key.
func TestPlanPrepFields(t *testing.T) {
	cases := []struct{ json, field string }{
		{`{"solute":"unobtainium","concentration":1,"concentration_unit":"mol/L","final_volume_mL":100}`, "solute"},
		{`{"solute":"KCl","charged_form":"KCl·7H2O","concentration":1,"concentration_unit":"mol/L","final_volume_mL":100}`, "charged_form"},
		{`{"solute":"KH2PO4","concentration":1,"concentration_unit":"mol/L","final_mass_g":100}`, "concentration_unit"},
		{`{"solute":"KH2PO4","concentration":1,"concentration_unit":"% w/w","final_volume_mL":100}`, "final_volume_mL"},
		{`{"solute":"NaCl","concentration":2,"concentration_unit":"mol/L","final_volume_mL":100,"stock_concentration":1,"stock_unit":"mol/L"}`, "stock_concentration"},
		{`{"solute":"KNO3","concentration":1,"concentration_unit":"% w/w","final_mass_g":100,"store_at_C":-30}`, "store_at_C"},
	}
	for _, tc := range cases {
		p, err := DecodePrep([]byte(tc.json))
		if err == nil {
			_, err = PlanPrep(p)
		}
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tc.field {
			t.Errorf("%s: error %v, want field %q", tc.json, err, tc.field)
		}
	}
}

// randomPrep draws a recipe that uses every key at random (text with quotes, markup and
// non-ASCII included).
func randomPrep(rng *rand.Rand) Prep {
	texts := []string{"", "KCl", `a "quoted" <b>name</b> & more`, "Lösung für 4 °C — ε", "line\nbreak\ttab", "\u2028"}
	num := func(lo, hi float64) float64 {
		v := lo + (hi-lo)*rng.Float64()
		if rng.IntN(4) == 0 {
			v = math.Round(v*100) / 100
		}
		return math.Max(v, lo+1e-3)
	}
	units := prep.Units
	p := Prep{Format: CurrentFormat, Name: texts[rng.IntN(len(texts))], Notes: texts[rng.IntN(len(texts))],
		Solute: "KCl", Concentration: num(0, 50), ConcentrationUnit: string(units[rng.IntN(len(units))])}
	if rng.IntN(2) == 0 {
		p.TempC = Some(num(0, 100))
	}
	if rng.IntN(2) == 0 {
		p.StoreAtC = Some(num(-40, 150))
	}
	switch rng.IntN(3) {
	case 0:
		p.FinalVolumeML = Some(num(1e-3, 1e7))
	case 1:
		p.FinalMassG = Some(num(1e-3, 1e7))
	default:
		p.SolventG = Some(num(1e-3, 1e7))
	}
	if rng.IntN(2) == 0 {
		p.StockConcentration = Some(num(0, 99))
		p.StockUnit = string(units[rng.IntN(len(units))])
	} else {
		p.ChargedForm = texts[rng.IntN(2)]
		if rng.IntN(2) == 0 {
			p.PurityPct = Some(num(0, 100))
		}
	}
	return p
}

// Every key round-trips: DecodePrep(p.Encode()) == p, and the encoding is stable.
func TestPrepRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	seen := map[string]bool{}
	for i := range 3000 {
		p := randomPrep(rng)
		b := p.Encode()
		q, err := DecodePrep(b)
		if err != nil {
			t.Fatalf("#%d DecodePrep(%s): %v", i, b, err)
		}
		if q != p {
			t.Fatalf("#%d round trip changed the recipe:\n%+v\n%+v", i, p, q)
		}
		if !bytes.Equal(q.Encode(), b) {
			t.Fatalf("#%d encoding not stable: %s", i, b)
		}
		v, _ := wire.Decode(b)
		for _, m := range v.Members {
			seen[m.Key] = true
		}
	}
	for _, k := range PrepKeys() {
		if !seen[k] {
			t.Errorf("key %q never round-tripped", k)
		}
	}
}

// The result's numbers match the core's, and the mass balance closes in the JSON too.
func TestPrepResultBalance(t *testing.T) {
	for _, s := range prepExamples {
		p, _ := DecodePrep([]byte(s))
		res, err := PlanPrep(p)
		if err != nil {
			t.Fatal(err)
		}
		v, _ := wire.Decode(res.Encode())
		get := func(k string) float64 {
			x, _ := v.Get(k)
			if x.Kind == wire.Null {
				return 0
			}
			return x.Num
		}
		in := get("water_g") + get("stock_g") + get("form_g") - get("impurity_g")
		// The JSON rounds each number to 6 significant figures: up to 5e-6 of each term.
		terms := get("water_g") + get("stock_g") + get("form_g") + get("impurity_g") + get("solution_g")
		if math.Abs(in-get("solution_g")) > 5e-6*terms {
			t.Errorf("%s: in %.8g g, solution %.8g g", s, in, get("solution_g"))
		}
	}
}

func FuzzDecodePrep(f *testing.F) {
	for _, s := range prepExamples {
		f.Add([]byte(s))
	}
	f.Add([]byte(`{"solute":"KCl","concentration":1e-300,"concentration_unit":"mg/L","solvent_g":0.001,"temp_C":0,"store_at_C":-40}`))
	f.Add([]byte(`{"solute":"Na2SO4·10H2O","concentration":44.09,"concentration_unit":"% w/w","final_mass_g":1e7,"temp_C":100}`))
	f.Fuzz(func(t *testing.T, data []byte) {
		p, err := DecodePrep(data)
		if err != nil {
			var fe *unit.FieldError
			var se *wire.SyntaxError
			if !errors.As(err, &fe) && !errors.As(err, &se) {
				t.Fatalf("DecodePrep error %T %v", err, err)
			}
			return
		}
		b := p.Encode()
		q, err := DecodePrep(b)
		if err != nil || q != p || !bytes.Equal(q.Encode(), b) {
			t.Fatalf("decode→encode→decode not stable: %v\n%s", err, b)
		}
		res, err := PlanPrep(p)
		if err != nil {
			var fe *unit.FieldError
			if !errors.As(err, &fe) {
				t.Fatalf("PlanPrep error %T %v", err, err)
			}
			return
		}
		if _, err := wire.Decode(res.Encode()); err != nil {
			t.Fatalf("result is not JSON: %v", err)
		}
	})
}

var benchSink int

func BenchmarkPlanPrepVolume(b *testing.B) {
	p, _ := DecodePrep([]byte(prepExamples[0]))
	for b.Loop() {
		res, _ := PlanPrep(p)
		benchSink += len(res.Encode())
	}
}

// A collection of preparations reads back exactly; one bad entry refuses the file.
func TestPrepCollection(t *testing.T) {
	rng := rand.New(rand.NewPCG(9, 9))
	var ps []Prep
	for range 20 {
		ps = append(ps, randomPrep(rng))
	}
	got, err := DecodePrepCollection(EncodePrepCollection(ps))
	if err != nil || len(got) != len(ps) {
		t.Fatalf("DecodePrepCollection: %d, %v", len(got), err)
	}
	for i := range ps {
		if got[i] != ps[i] {
			t.Fatalf("entry %d changed: %+v → %+v", i, ps[i], got[i])
		}
	}
	bad := `{"format":1,"kind":"saltcast-preparations","recipes":[` + prepExamples[0] + `,{"solute":"KCl"}]}`
	var fe *unit.FieldError
	if _, err := DecodePrepCollection([]byte(bad)); !errors.As(err, &fe) || !strings.HasPrefix(fe.Field, "recipes[1].") {
		t.Errorf("bad entry: %v", err)
	}
}

// The batch handed over holds the same solution: same solute and water, so the same
// concentration in g per 100 g water.
func TestBatchFrom(t *testing.T) {
	for _, s := range prepExamples[:4] {
		p, _ := DecodePrep([]byte(s))
		res, err := PlanPrep(p)
		if err != nil {
			t.Fatal(err)
		}
		b := BatchFrom(res)
		plan, err := Plan(b)
		if err != nil {
			t.Fatalf("%s: batch plan: %v", s, err)
		}
		if math.Abs(plan.ConcentrationG100-res.GPer100gWater) > 1e-9*res.GPer100gWater {
			t.Errorf("%s: batch holds %.9g g/100 g water, the preparation %.9g", s, plan.ConcentrationG100, res.GPer100gWater)
		}
	}
}
