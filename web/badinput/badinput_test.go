package badinput

import (
	"strings"
	"testing"
)

func TestParse(t *testing.T) {
	good := "# comment\n\n" +
		"a | plan | @huge(70000) | JSON | refuse | larger | why\n" +
		"b | parse | \"1\\u00a0234\" | water_g | refuse | thousands;!number | why\n" +
		"c | solubility | solute=KNO3&temp_C=1+234 | temp_C | refuse | - | why\n"
	cs, err := Parse([]byte(good))
	if err != nil || len(cs) != 3 {
		t.Fatalf("Parse = %d cases, %v", len(cs), err)
	}
	if n := len(cs[0].Input); n != 70000 {
		t.Errorf("@huge(70000) is %d bytes", n)
	}
	if cs[1].Input != "1\u00a0234" {
		t.Errorf("quoted parse input = %q", cs[1].Input)
	}
	if p, err := cs[2].Params(); err != nil || p["temp_C"] != "1 234" || p["solute"] != "KNO3" {
		t.Errorf("Params = %v, %v", p, err)
	}
	for _, tt := range []struct {
		text string
		ok   bool
	}{
		{"refused: thousands separators", true},
		{"a number without thousands separators", false}, // contains the forbidden word
		{"nothing relevant", false},
	} {
		if got := cs[1].Check(tt.text) == ""; got != tt.ok {
			t.Errorf("Check(%q) passes = %v, want %v", tt.text, got, tt.ok)
		}
	}
	for _, bad := range []string{
		"a | plan | {} | solute | refuse | x\n",                                    // six fields
		"a | plan | {} | solute | maybe | x | why\n",                               // unknown kind
		"a | post | {} | solute | refuse | x | why\n",                              // unknown route
		"a | plan | @nope(3) | JSON | refuse | x | why\n",                          // unknown generator
		"a | plan | {} | s | refuse | x | y\na | plan | {} | s | refuse | x | y\n", // repeated id
	} {
		if _, err := Parse([]byte(bad)); err == nil || !strings.Contains(err.Error(), "line") {
			t.Errorf("Parse(%q) = %v, want an error naming the line", bad, err)
		}
	}
}

// The shared catalogue itself parses, and covers every route and kind.
func TestCatalogue(t *testing.T) {
	cs, err := Load()
	if err != nil {
		t.Fatal(err)
	}
	seen := map[string]bool{}
	for _, c := range cs {
		seen[c.Route] = true
		seen[c.Kind] = true
	}
	for _, k := range []string{RoutePlan, RouteSolubility, RouteGas, RouteOutgas, RouteParse, Refuse, Warn, Accept} {
		if !seen[k] {
			t.Errorf("the catalogue has no %s case", k)
		}
	}
}
