package compound

import "testing"

// The trade and common names below are the usual names of these solids on a laboratory shelf
// (from memory; the same names stand in the CRC Handbook's "Physical Constants of Inorganic
// Compounds" synonym column and on suppliers' labels).
func TestSearchFindsShelfNames(t *testing.T) {
	tests := []struct {
		query    string
		wantForm string // the form of the first match
	}{
		{"KNO3", "KNO3"},                 // an id is itself
		{"epsom", "MgSO4·7H2O"},          // Epsom salt
		{"blue vitriol", "CuSO4·5H2O"},   // copper(II) sulfate pentahydrate
		{"green vitriol", "FeSO4·7H2O"},  // iron(II) sulfate heptahydrate
		{"washing soda", "Na2CO3·10H2O"}, // sodium carbonate decahydrate
		{"baking soda", "NaHCO3"},        // sodium hydrogen carbonate
		{"hypo", "Na2S2O3·5H2O"},         // photographers' fixer, the pentahydrate
		{"borax", "Na2B4O7·10H2O"},       // the decahydrate
		{"cuso4.5h2o", "CuSO4·5H2O"},     // a hydrate formula typed with a full stop
		{"Potassium Sulphate", "K2SO4"},  // British spelling, any case
		{"glauber", "Na2SO4·10H2O"},      // Glauber's salt, typed without the apostrophe
	}
	for _, tt := range tests {
		got := Search(tt.query, 8)
		if len(got) == 0 {
			t.Errorf("Search(%q) found nothing, want %s first", tt.query, tt.wantForm)
			continue
		}
		if got[0].Form.Formula != tt.wantForm {
			var list []string
			for _, m := range got {
				list = append(list, m.Form.Formula)
			}
			t.Errorf("Search(%q) = %v, want %s first", tt.query, list, tt.wantForm)
		}
	}
}

func TestSearchRanksAndBounds(t *testing.T) {
	// "soda" names several shelf solids; each compound is listed once.
	got := Search("soda", 20)
	seen := map[string]bool{}
	for _, m := range got {
		if seen[m.Compound.ID] {
			t.Errorf("Search(soda) lists %s twice", m.Compound.ID)
		}
		seen[m.Compound.ID] = true
	}
	for _, id := range []string{"Na2CO3", "NaHCO3"} {
		if !seen[id] {
			t.Errorf("Search(soda) misses %s", id)
		}
	}
	if n := len(Search("", 5)); n != 5 {
		t.Errorf("Search(\"\", 5) lists %d, want 5", n)
	}
	if got := Search("no such salt anywhere", 8); len(got) != 0 {
		t.Errorf("Search(nonsense) = %d matches, want none", len(got))
	}
	// An exact formula outranks a longer one that merely starts with it.
	if got := Search("KCl", 8); len(got) == 0 || got[0].Compound.ID != "KCl" {
		t.Errorf("Search(KCl) does not put KCl first")
	}
}

func BenchmarkSearchWord(b *testing.B) {
	var sink []Match
	for b.Loop() {
		sink = Search("soda", 8)
	}
	_ = sink
}
