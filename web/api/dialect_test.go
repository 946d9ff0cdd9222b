package api

import (
	"errors"
	"strings"
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Every route refuses a key it does not take in the same words, naming the key and listing
// the keys it does take.
func TestUnknownKeyOneWording(t *testing.T) {
	for _, tc := range []struct {
		route string
		call  func() ([]byte, error)
	}{
		{"plan", func() ([]byte, error) {
			return Plan([]byte(`{"solute":"KNO3","water_g":100,"dissolve_temp_C":40,"bogus":1}`))
		}},
		{"solubility", func() ([]byte, error) { return Solubility(Params{"solute": "KNO3", "temp_C": "20", "bogus": "1"}) }},
		{"gas", func() ([]byte, error) { return Gas(Params{"temp_C": "20", "bogus": "1"}) }},
		{"outgas", func() ([]byte, error) { return Outgas(Params{"from_C": "20", "to_C": "80", "bogus": "1"}) }},
		{"gas table", func() ([]byte, error) { return GasTable(Params{"bogus": "1"}) }},
	} {
		_, err := tc.call()
		var fe *unit.FieldError
		if !errors.As(err, &fe) {
			t.Errorf("%s with an unknown key: error %v, want a *unit.FieldError", tc.route, err)
			continue
		}
		if fe.Field != "bogus" || !strings.HasPrefix(fe.Allowed, unit.KeysAllowed(nil)) {
			t.Errorf("%s with an unknown key: %v; want the field bogus and %q…", tc.route, err, unit.KeysAllowed(nil))
		}
	}
}

// Every number of every answer is rounded by one rule, the plan's recipe.Digits significant
// figures: a trace gas keeps its digits instead of rounding to 0.
func TestOneRoundingRule(t *testing.T) {
	for _, tc := range []struct {
		what string
		call func() ([]byte, error)
	}{
		{"gas CH4", func() ([]byte, error) { return Gas(Params{"gas": "CH4", "temp_C": "25"}) }},
		{"gas O2 measured, second method", func() ([]byte, error) {
			return Gas(Params{"temp_C": "20.123456789", "measured_mg_per_L": "8.123456789"})
		}},
		{"outgas", func() ([]byte, error) { return Outgas(Params{"from_C": "20", "to_C": "80.987654321"}) }},
		{"gas table", func() ([]byte, error) { return GasTable(Params{"temp_to_C": "10"}) }},
		{"solubility", func() ([]byte, error) { return Solubility(Params{"solute": "KNO3", "temp_C": "20.123456789"}) }},
		{"plan", func() ([]byte, error) {
			return Plan([]byte(`{"solute":"KNO3","water_g":100.123456789,"dissolve_temp_C":40,"cool_to_C":10}`))
		}},
	} {
		b, err := tc.call()
		if err != nil {
			t.Errorf("%s: %v", tc.what, err)
			continue
		}
		v := decode(t, b)
		n := 0
		walkNumbers(v, func(x float64) {
			n++
			if x != wire.RoundSig(x, recipe.Digits) {
				t.Errorf("%s: %v has more than %d significant digits", tc.what, x, recipe.Digits)
			}
		})
		if n == 0 {
			t.Errorf("%s: no numbers in %s", tc.what, b)
		}
	}
	b, err := Gas(Params{"gas": "CH4", "temp_C": "25"})
	if err != nil {
		t.Fatal(err)
	}
	for _, key := range []string{"saturation_mg_per_L", "saturation_umol_per_kg"} {
		if got := num(t, decode(t, b), key); got <= 0 {
			t.Errorf("CH4 at 25 °C: %s = %v, want the trace amount, not 0", key, got)
		}
	}
}

func walkNumbers(v wire.Value, f func(float64)) {
	switch v.Kind {
	case wire.Number:
		f(v.Num)
	case wire.Array:
		for _, it := range v.Items {
			walkNumbers(it, f)
		}
	case wire.Object:
		for _, m := range v.Members {
			walkNumbers(m.Value, f)
		}
	}
}
