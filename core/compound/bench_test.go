package compound

import "testing"

var sink float64

func BenchmarkSolubilityNa2SO4TwoPhases(b *testing.B) {
	c, _, _ := Lookup("Na2SO4")
	t := 0.0
	for b.Loop() {
		g, _, _, _ := c.Solubility(t)
		sink += g
		if t += 3.7; t > 100 {
			t -= 100
		}
	}
}

func BenchmarkLookupCommonName(b *testing.B) {
	for b.Loop() {
		c, _, _ := Lookup("Glauber's salt")
		sink += c.MolarMassGPerMol
	}
}

func BenchmarkParseLibrary(b *testing.B) {
	for b.Loop() {
		lib, _ := Parse(libraryText)
		sink += float64(len(lib))
	}
}
