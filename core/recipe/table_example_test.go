package recipe_test

import (
	"fmt"

	"saltcast/core/recipe"
)

// stock is a small recipe kind of its own, to show how a kind is declared.
type stock struct {
	Format  int
	Solute  string
	VolumeL recipe.Opt
	TempC   float64
}

// A second kind of recipe file declares its keys once in a Table; decoding (with the keys
// named in errors), encoding and forms come from it.
func ExampleTable() {
	kind := recipe.Table[stock]{
		Noun: "stock",
		New:  func() stock { return stock{Format: 1} },
		Fields: []recipe.Field[stock]{
			{Spec: recipe.Spec{Key: "format", Kind: recipe.Version, Max: 1},
				Int: func(s *stock) *int { return &s.Format }},
			{Spec: recipe.Spec{Key: "solute", Kind: recipe.Text, MaxBytes: 200, Label: "Solute"},
				Text: func(s *stock) *string { return &s.Solute }},
			{Spec: recipe.Spec{Key: "volume_L", Kind: recipe.Plain, Unit: "L", Min: 0, MinOpen: true, Max: 1e4,
				Allowed: "a volume > 0 and ≤ 10000 L", Label: "Final volume"},
				Opt: func(s *stock) *recipe.Opt { return &s.VolumeL }},
			{Spec: recipe.Spec{Key: "temp_C", Kind: recipe.Temp, Min: -40, Max: 150, Required: true,
				Allowed: "a temperature from −40 to 150 °C", Need: "a temperature in °C (the key is required)", Label: "Made up at"},
				Num: func(s *stock) *float64 { return &s.TempC }},
		},
	}
	s, err := kind.Decode([]byte(`{"solute":"KNO3","volume_L":2.5,"temp_C":20}`))
	fmt.Println(s.Solute, s.VolumeL.Value, err)
	fmt.Println(string(kind.Encode(&s)))
	_, err = kind.Decode([]byte(`{"solute":"KNO3","volume":2.5,"temp_C":20}`))
	fmt.Println(err)
	_, err = kind.Decode([]byte(`{"solute":"KNO3","volume_L":0}`))
	fmt.Println(err)
	// Output:
	// KNO3 2.5 <nil>
	// {"format":1,"solute":"KNO3","volume_L":2.5,"temp_C":20}
	// volume: "volume" is not allowed; allowed: one of the keys: format, solute, volume_L, temp_C
	// volume_L: "0" is not allowed; allowed: a volume > 0 and ≤ 10000 L
}
