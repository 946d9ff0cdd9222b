package main

import (
	"math/rand/v2"
	"reflect"
	"slices"
	"strings"
	"testing"

	"saltcast/core/prep"
	"saltcast/core/recipe"
)

// The preparation form in web/shell.html has an input for every key of the preparation
// table (recipe.PrepFields) and none the table does not know, besides the radio buttons that
// pick a choice of each group.
func TestShellInputsMatchPrepTable(t *testing.T) {
	inputs := shellFormInputs(t, "prep")
	for _, s := range recipe.PrepSpecs {
		if PrepKnown(s.Key) && !slices.Contains(inputs, s.Key) {
			t.Errorf(`web/shell.html has no input named %q in <form id="prep"> (a key of recipe.PrepFields)`, s.Key)
		}
		if s.Group != "" && !slices.Contains(inputs, prepGroupInputs[s.Group]) {
			t.Errorf("web/shell.html has no %q control for the group %q", prepGroupInputs[s.Group], s.Group)
		}
	}
	for _, name := range inputs {
		isGroup := false
		for _, control := range prepGroupInputs {
			isGroup = isGroup || control == name
		}
		if !PrepKnown(name) && !isGroup {
			t.Errorf("web/shell.html has an input named %q in the preparation form that is not a key of recipe.PrepFields", name)
		}
	}
}

// tablePrep returns a valid preparation with every key set that its choices allow, values
// drawn from each key's range in recipe.PrepFields (bounds included when edges is set), each
// group's choice drawn too.
func tablePrep(rng *rand.Rand, edges bool) recipe.Prep {
	p := recipe.PrepFields.New()
	choices := map[string][]string{}
	for _, s := range recipe.PrepSpecs {
		if s.Group != "" && !slices.Contains(choices[s.Group], s.Choice) {
			choices[s.Group] = append(choices[s.Group], s.Choice)
		}
	}
	pick := map[string]string{}
	for g, cs := range choices {
		pick[g] = cs[rng.IntN(len(cs))]
	}
	for i := range recipe.PrepFields.Fields {
		f := &recipe.PrepFields.Fields[i]
		if f.Kind.Fixed() || (f.Group != "" && pick[f.Group] != f.Choice) {
			continue
		}
		switch f.Kind {
		case recipe.Text:
			var s string
			if f.Choices != nil {
				s = f.Choices[rng.IntN(len(f.Choices))]
			} else {
				s = randText(rng, f.MaxBytes-8)
				if f.Trim {
					s = strings.TrimSpace(s)
				}
				if strings.TrimSpace(s) == "" {
					s = "x" + s
				}
			}
			*f.Text(&p) = s
		default:
			v := randSpec(rng, &f.Spec, edges)
			if f.Opt != nil {
				*f.Opt(&p) = recipe.Some(v)
			} else {
				*f.Num(&p) = v
			}
		}
	}
	// The one rule across keys a draw can break: a mass per cent stays below 100.
	if p.ConcentrationUnit == string(prep.PctWW) && p.Concentration >= 100 {
		p.Concentration = randIn(rng, 1e-3, 99.9)
	}
	if p.StockUnit == string(prep.PctWW) && p.StockConcentration.Value >= 100 {
		p.StockConcentration = recipe.Some(randIn(rng, 1e-3, 99.9))
	}
	return p
}

// Property: a preparation shown in the form and read back (FromPrep, Display, Draft.Set,
// Draft.Prep, as the Make up screen does), then written as JSON and read again (storage,
// export, links), is the same preparation, for random preparations with every key of the
// table set (all choices of each group drawn), in every unit system the page offers.
func TestPrepFormRoundTripEveryKey(t *testing.T) {
	inputs := shellFormInputs(t, "prep")
	rng := rand.New(rand.NewPCG(20261203, 1))
	covered := map[string]bool{}
	for i := range formRecipes {
		p := tablePrep(rng, i%2 == 0)
		if _, err := recipe.DecodePrep(p.Encode()); err != nil {
			t.Fatalf("generator made an invalid preparation %d: %v\n%s", i, err, p.Encode())
		}
		d := FromPrep(p)
		for k := range d.Text {
			covered[k] = true
		}
		for k := range d.Num {
			covered[k] = true
		}
		for _, u := range allUnits() {
			shown := make([]string, len(inputs))
			for j, name := range inputs {
				shown[j] = d.Display(name, u)
			}
			back := FromPrep(p)
			for j, name := range inputs {
				if PrepKnown(name) {
					if err := back.Set(name, shown[j], u); err != nil {
						t.Fatalf("preparation %d in %v: %s: %v", i, u, name, err)
					}
				}
			}
			got, err := back.Prep()
			if err == nil {
				got, err = recipe.DecodePrep(got.Encode())
			}
			if err != nil {
				t.Fatalf("preparation %d in %v: %v\n%s", i, u, err, p.Encode())
			}
			if !reflect.DeepEqual(got, p) || string(got.Encode()) != string(p.Encode()) {
				t.Fatalf("preparation %d in %v changed through the form:\n got %s\nwant %s", i, u, got.Encode(), p.Encode())
			}
		}
	}
	for _, s := range recipe.PrepSpecs {
		if PrepKnown(s.Key) && !covered[s.Key] {
			t.Errorf("no random preparation set %q", s.Key)
		}
	}
}

// Masses and volumes typed in other units reach the recipe in g and mL: 2.5 L made up to the
// mark is 2500 mL; 1.5 lb of solution is 680.388555 g (1 lb = 453.59237 g exactly, by the
// international yard and pound agreement of 1959); 2 US gal is 7570.823568 mL (1 US gal =
// 231 in³ exactly).
func TestPrepFormUnits(t *testing.T) {
	const convTol = 1e-9 // relative: exact definitions, float arithmetic only
	for _, tc := range []struct {
		u          Units
		pick, name string
		text       string
		want       float64
	}{
		{Units{Temp: "C", Mass: "g", Volume: "L"}, "volume", "final_volume_mL", "2,5", 2500},
		{Units{Temp: "C", Mass: "lb", Volume: "mL"}, "mass", "final_mass_g", "1.5", 680.388555},
		{Units{Temp: "C", Mass: "kg", Volume: "gal"}, "volume", "final_volume_mL", "2", 7570.823568},
		{Units{Temp: "F", Mass: "kg", Volume: "mL"}, "water", "solvent_g", "0.25", 250},
	} {
		d := NewPrepDraft()
		d.Pick["amount"] = tc.pick
		if err := d.Set(tc.name, tc.text, tc.u); err != nil {
			t.Fatalf("Set(%s, %q, %v): %v", tc.name, tc.text, tc.u, err)
		}
		p, err := d.Prep()
		if err != nil {
			t.Fatalf("%v: %v", tc.u, err)
		}
		got := map[string]recipe.Opt{"final_volume_mL": p.FinalVolumeML, "final_mass_g": p.FinalMassG, "solvent_g": p.SolventG}[tc.name]
		if !got.Set || !relNear(got.Value, tc.want, convTol) {
			t.Errorf("%s typed %q in %v = %v, want %v", tc.name, tc.text, tc.u, got, tc.want)
		}
		// The temperature follows its own switch: 20 °C shows as 68 °F.
		if tc.u.Temp == "F" && d.Display("temp_C", tc.u) != "68" {
			t.Errorf("temp_C shows %q in °F, want 68", d.Display("temp_C", tc.u))
		}
	}
}

func relNear(got, want, tol float64) bool {
	d := got - want
	return d <= tol*want && -d <= tol*want
}

// Errors land on the input that caused them.
func TestPrepFormErrors(t *testing.T) {
	d := NewPrepDraft()
	if d.Set("final_volume_mL", "-3", DefaultUnits); d.Errs["final_volume_mL"] != nil {
		t.Errorf("a negative number is read, and refused by the recipe check: %v", d.Errs)
	}
	if _, err := d.Prep(); fieldOfErr(err) != "final_volume_mL" {
		t.Errorf("negative volume: %v", err)
	}
	d = NewPrepDraft()
	if err := d.Set("concentration", "1.234,5", DefaultUnits); err == nil {
		t.Errorf("thousands separator accepted")
	}
	d = NewPrepDraft()
	d.Pick["from"] = "stock"
	if _, err := d.Prep(); fieldOfErr(err) != "stock_concentration" {
		t.Errorf("stock without concentration: %v", err)
	}
}

func fieldOfErr(err error) string {
	if err == nil {
		return ""
	}
	if i := strings.IndexByte(err.Error(), ':'); i > 0 {
		return err.Error()[:i]
	}
	return ""
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
	// In litres and pounds the label speaks the user's units.
	l = LabelFor(res, "", "2026-03-01", Units{Temp: "C", Mass: "lb", Volume: "L"})
	if !strings.Contains(l.Made, "lb KCl, made up to 1 L at") {
		t.Errorf("label in lb and L: %s", l.Made)
	}
}

// The keep-above line counts freezing: 10 % w/w NaCl freezes at −6.56 °C (CRC Handbook,
// 102nd ed., "Concentrative Properties of Aqueous Solutions") and is unsaturated down to
// its eutectic, so the bottle is kept above −4 °C (−6.56 + 2 K, rounded up), not labelled
// "clear" down to the cold end of the solubility data.
func TestLabelKeepAboveFreezing(t *testing.T) {
	p, _ := recipe.DecodePrep([]byte(`{"solute":"NaCl","concentration":10,"concentration_unit":"% w/w","final_mass_g":500}`))
	res, err := recipe.PlanPrep(p)
	if err != nil {
		t.Fatal(err)
	}
	l := LabelFor(res, "", "2026-03-01", DefaultUnits)
	if !strings.HasPrefix(l.Keep, "Keep above -4 °C") || !strings.Contains(l.Keep, "freezes at -6.6 °C") {
		t.Errorf("Keep = %q, want keep above -4 °C, freezes at -6.6 °C", l.Keep)
	}
}
