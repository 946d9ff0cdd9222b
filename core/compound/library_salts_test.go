package compound

import (
	"errors"
	"math"
	"strings"
	"testing"

	"saltcast/core/solubility"
)

// Tests for the salts added from the CRC 98th ed. table (ammonium salts, halides, chromates,
// oxidizers). The library stores CRC mass %; these checks come from other sources.

// Tolerances (relative) for the second-source rows, by how well the two compilations agree.
const (
	// saltAgreeTol covers rows where the CRC 98th ed. and the Perry's-type table agree: the
	// differences measured for these rows are at most 3 %.
	saltAgreeTol = 0.03
	// saltOlderTol covers rows where the compilations rest on different, older measurements
	// (mostly 0 °C and above 80 °C): differences of 3 to 6.5 %.
	saltOlderTol = 0.065
)

// Sources of the check values, cited on every row.
const (
	// Durymanova, M. A.; Telepneva, A. E., Zh. Prikl. Khim. 45, 1610 (1972): Na2SO3 alone at
	// 100 °C, 20.8 mass % (solid anhydrous), as compiled in the IUPAC Solubility Data Series
	// sulfite volume (M. R. Masson, compiler; open copy: docslib.org/doc/2407391).
	durymanova = "Durymanova & Telepneva 1972, IUPAC SDS sulfite volume"
	// Wikipedia "Sodium sulfite" (2012 text, open mirror: the-uncensored-wiki.com):
	// "33.4 °C (dehydration of heptahydrate)", molar mass 126.043 g/mol.
	wikiNa2SO3 = "Wikipedia Sodium sulfite (2012 mirror)"
	// Bolshaya rossiyskaya entsiklopediya (Great Russian Encyclopedia), article "Sulfit natriya"
	// (open copy: bigenc.ru/c/sul-fit-natriia-431ab3): solubility in water, g per 100 g water,
	// 14.29 (0 °C), 26.10 (20 °C), 36.99 (40 °C), 29.20 (80 °C).
	bigencNa2SO3 = "Great Russian Encyclopedia, sodium sulfite (bigenc.ru)"
	// CRC 98th ed. table: an asterisk on two adjacent columns marks a change of the solid
	// between them (open mirror: github chicolucio/solutions, data/…_phase_changes_STRINGS.csv).
	crcAsterisk = "CRC 98th ed. phase-change asterisks"
)

// saltSecondSource: g anhydrous per 100 g water at tempC from a source other than CRC 98th ed.
// The Wikipedia "Solubility table" rows (wiki) for KMnO4, NaBr, KBr, KI and LiCl agree with the
// CRC to under 1 %, so they are only weakly independent (probably older CRC editions).
var saltSecondSource = []solubilityCheck{
	{"(NH4)2SO4", 0, 70.6, saltAgreeTol, wiki},
	{"(NH4)2SO4", 20, 75.4, saltAgreeTol, wiki},
	{"(NH4)2SO4", 40, 81.2, saltAgreeTol, wiki},
	{"(NH4)2SO4", 60, 87.4, saltAgreeTol, wiki},
	{"(NH4)2SO4", 80, 94.1, saltAgreeTol, wiki},
	{"(NH4)2SO4", 100, 103, saltAgreeTol, wiki},

	{"NH4NO3", 0, 118, saltAgreeTol, wiki},
	{"NH4NO3", 20, 192, saltAgreeTol, wiki},
	{"NH4NO3", 40, 297, saltAgreeTol, wiki},
	{"NH4NO3", 60, 421, saltAgreeTol, wiki},
	{"NH4NO3", 80, 580, saltOlderTol, wiki},

	// NH4H2PO4: the sources part above 50 °C (a caution says so; see below).
	{"NH4H2PO4", 0, 22.7, saltOlderTol, wiki},
	{"NH4H2PO4", 20, 37.4, saltOlderTol, wiki},
	{"NH4H2PO4", 30, 46.4, saltAgreeTol, wiki},
	{"NH4H2PO4", 40, 56.7, saltAgreeTol, wiki},
	{"NH4H2PO4", 50, 69.0, saltOlderTol, wiki},

	{"(NH4)2HPO4", 10, 62.9, saltAgreeTol, wiki},
	{"(NH4)2HPO4", 20, 68.9, saltOlderTol, wiki},
	{"(NH4)2HPO4", 40, 81.8, saltOlderTol, wiki},
	{"(NH4)2HPO4", 60, 97.2, saltOlderTol, wiki},
	{"(NH4)2HPO4", 70, 106, saltAgreeTol, wiki},
	{"(NH4)2HPO4", 80, 110, saltOlderTol, wiki},

	{"CuCl2", 0, 68.6, saltAgreeTol, wiki},
	{"CuCl2", 10, 70.9, saltAgreeTol, wiki},
	{"CuCl2", 20, 73, saltAgreeTol, wiki},
	{"CuCl2", 30, 77.3, saltAgreeTol, wiki},
	{"CuCl2", 80, 104, saltOlderTol, wiki},
	{"CuCl2", 90, 108, saltAgreeTol, wiki},

	{"BaCl2", 0, 31.2, saltAgreeTol, wiki},
	{"BaCl2", 20, 35.8, saltAgreeTol, wiki},
	{"BaCl2", 40, 40.8, saltAgreeTol, wiki},
	{"BaCl2", 60, 46.2, saltAgreeTol, wiki},
	{"BaCl2", 80, 52.5, saltAgreeTol, wiki},
	{"BaCl2", 100, 59.4, saltAgreeTol, wiki},

	{"SrCl2", 10, 47.7, saltAgreeTol, wiki},
	{"SrCl2", 20, 52.9, saltAgreeTol, wiki},
	{"SrCl2", 40, 65.3, saltAgreeTol, wiki},
	{"SrCl2", 60, 81.8, saltAgreeTol, wiki},
	{"SrCl2", 80, 90.5, saltAgreeTol, wiki},
	{"SrCl2", 100, 101, saltAgreeTol, wiki},

	{"LiCl", 0, 69.2, saltAgreeTol, wiki},
	{"LiCl", 10, 74.5, saltAgreeTol, wiki},
	{"LiCl", 20, 83.5, saltAgreeTol, wiki},
	{"LiCl", 40, 89.8, saltAgreeTol, wiki},
	{"LiCl", 80, 112, saltAgreeTol, wiki},
	{"LiCl", 100, 128, saltAgreeTol, wiki},

	{"NaBr", 0, 80.2, saltAgreeTol, wiki},
	{"NaBr", 20, 90.8, saltAgreeTol, wiki},
	{"NaBr", 40, 107, saltAgreeTol, wiki},
	{"NaBr", 60, 118, saltAgreeTol, wiki},
	{"NaBr", 100, 121, saltAgreeTol, wiki},

	{"NaI", 0, 159, saltAgreeTol, wiki},
	{"NaI", 20, 178, saltAgreeTol, wiki},
	{"NaI", 40, 205, saltAgreeTol, wiki},
	{"NaI", 60, 257, saltAgreeTol, wiki},
	{"NaI", 80, 295, saltAgreeTol, wiki},
	{"NaI", 100, 302, saltAgreeTol, wiki},

	{"KBr", 0, 53.6, saltAgreeTol, wiki},
	{"KBr", 20, 65.3, saltAgreeTol, wiki},
	{"KBr", 60, 85.5, saltAgreeTol, wiki},
	{"KBr", 100, 104, saltAgreeTol, wiki},

	{"KI", 0, 128, saltAgreeTol, wiki},
	{"KI", 20, 144, saltAgreeTol, wiki},
	{"KI", 60, 176, saltAgreeTol, wiki},
	{"KI", 100, 206, saltAgreeTol, wiki},

	{"KClO3", 0, 3.3, saltOlderTol, wiki},
	{"KClO3", 10, 5.2, saltOlderTol, wiki},
	{"KClO3", 20, 7.3, saltAgreeTol, wiki},
	{"KClO3", 40, 13.9, saltAgreeTol, wiki},
	{"KClO3", 60, 23.8, saltAgreeTol, wiki},
	{"KClO3", 80, 37.5, saltAgreeTol, wiki},
	{"KClO3", 100, 56.3, saltAgreeTol, wiki},

	{"KMnO4", 0, 2.83, saltAgreeTol, wiki},
	{"KMnO4", 20, 6.34, saltAgreeTol, wiki},
	{"KMnO4", 40, 12.6, saltAgreeTol, wiki},
	{"KMnO4", 60, 22.1, saltAgreeTol, wiki},

	{"K2Cr2O7", 0, 4.7, saltOlderTol, wiki},
	{"K2Cr2O7", 20, 12.3, saltAgreeTol, wiki},
	{"K2Cr2O7", 40, 26.3, saltAgreeTol, wiki},
	{"K2Cr2O7", 50, 34, saltOlderTol, wiki},
	{"K2Cr2O7", 60, 45.6, saltAgreeTol, wiki},
	{"K2Cr2O7", 80, 73, saltAgreeTol, wiki},

	{"K2CrO4", 0, 56.3, saltOlderTol, wiki},
	{"K2CrO4", 20, 63.7, saltAgreeTol, wiki},
	{"K2CrO4", 40, 67.8, saltAgreeTol, wiki},
	{"K2CrO4", 60, 70.1, saltAgreeTol, wiki},
	{"K2CrO4", 90, 74.5, saltOlderTol, wiki},

	{"AgNO3", 0, 122, saltOlderTol, wiki},
	{"AgNO3", 20, 216, saltAgreeTol, wiki},
	{"AgNO3", 40, 311, saltAgreeTol, wiki},
	{"AgNO3", 60, 440, saltAgreeTol, wiki},
	{"AgNO3", 80, 585, saltAgreeTol, wiki},
	{"AgNO3", 100, 733, saltAgreeTol, wiki},

	{"Pb(NO3)2", 0, 37.5, saltOlderTol, wiki},
	{"Pb(NO3)2", 20, 54.3, saltAgreeTol, wiki},
	{"Pb(NO3)2", 40, 72.1, saltAgreeTol, wiki},
	{"Pb(NO3)2", 60, 91.6, saltAgreeTol, wiki},
	{"Pb(NO3)2", 80, 111, saltAgreeTol, wiki},
	{"Pb(NO3)2", 100, 133, saltAgreeTol, wiki},

	// Na2SO3: 20.8 mass % = 26.26 g/100 g water (derived). The encyclopedia rows agree with
	// CRC to 1.5 % except at 0 °C (4.8 %). Not used: the Perry's-type table's lone 30 °C value,
	// 27.0 "g/100 g water", is 24 % below CRC's 35.7 g/100 g (26.3 mass %) and looks like a mass %
	// printed as g/100 g.
	{"Na2SO3", 0, 14.29, saltOlderTol, bigencNa2SO3},
	{"Na2SO3", 20, 26.10, saltAgreeTol, bigencNa2SO3},
	{"Na2SO3", 40, 36.99, saltAgreeTol, bigencNa2SO3},
	{"Na2SO3", 80, 29.20, saltAgreeTol, bigencNa2SO3},
	{"Na2SO3", 100, 26.26, saltOlderTol, durymanova},
}

func TestSaltSolubilityAgainstSecondSource(t *testing.T) {
	rows := checkSolubilities(t, saltSecondSource)
	for id, n := range rows {
		if n < 3 {
			t.Errorf("%s: %d second-source rows, want at least 3", id, n)
		}
	}
	if len(rows) != 19 {
		t.Errorf("second-source rows cover %d of the 19 added salts", len(rows))
	}
}

// TestSaltCautionsWhereSourcesDisagree: where the Perry's-type table (wiki) and the stored CRC
// curve differ by more than saltOlderTol, the library must say so with a caution. Each row is
// a real disagreement, checked first.
func TestSaltCautionsWhereSourcesDisagree(t *testing.T) {
	tests := []struct {
		id    string
		tempC float64
		other float64 // wiki, g/100 g water
	}{
		{"NH4NO3", 100, 871},
		{"NH4H2PO4", 60, 82.5},
		{"NH4H2PO4", 100, 173.2},
		{"(NH4)2HPO4", 0, 42.9},
		{"(NH4)2HPO4", 100, 121},
		{"CuCl2", 40, 87.6},
		{"CuCl2", 60, 96.5},
		{"CuCl2", 100, 120},
		{"SrCl2", 0, 43.5},
		{"K2Cr2O7", 10, 7},
	}
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		got, _, warn, err := c.Solubility(tt.tempC)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(got-tt.other) <= saltOlderTol*tt.other {
			t.Errorf("%s at %v °C: %.4g agrees with %v (%s); drop the row", tt.id, tt.tempC, got, tt.other, wiki)
		}
		if !strings.Contains(warn, "differ") {
			t.Errorf("%s at %v °C: warning %q; want a caution that the sources differ", tt.id, tt.tempC, warn)
		}
	}
}

// TestSaltPhases checks the stable solid on each side of every transition, and inside the
// ranges of the single-hydrate salts.
func TestSaltPhases(t *testing.T) {
	tests := []struct {
		id    string
		tempC float64
		want  string
		why   string
	}{
		{"SrCl2", 55, "SrCl2·6H2O", crcAsterisk + " between 60 and 70 °C"},
		{"SrCl2", 61, "SrCl2·6H2O", "61.3 °C (from memory)"},
		{"SrCl2", 62, "SrCl2·2H2O", "61.3 °C (from memory)"},
		{"SrCl2", 75, "SrCl2·2H2O", crcAsterisk + " between 60 and 70 °C"},

		{"LiCl", 5, "LiCl·2H2O", crcAsterisk + " between 10 and 20 °C"},
		{"LiCl", 18.5, "LiCl·2H2O", "19.1 °C (from memory)"},
		{"LiCl", 20, "LiCl·H2O", "19.1 °C (from memory)"},
		{"LiCl", 90, "LiCl·H2O", crcAsterisk + " between 90 and 100 °C"},
		{"LiCl", 93, "LiCl·H2O", "93.5 °C (from memory)"},
		{"LiCl", 94, "LiCl", "93.5 °C (from memory)"},
		{"LiCl", 100, "LiCl", crcAsterisk + " between 90 and 100 °C"},

		{"NaBr", 40, "NaBr·2H2O", "50.67 °C (from memory)"},
		{"NaBr", 50.5, "NaBr·2H2O", "50.67 °C (from memory)"},
		{"NaBr", 51, "NaBr", "50.67 °C (from memory)"},
		{"NaBr", 60, "NaBr", "50.67 °C (from memory)"},

		{"NaI", 60, "NaI·2H2O", "CRC 98th ed. rows: the slope breaks between 60 and 70 °C"},
		{"NaI", 64, "NaI·2H2O", "65 °C (from memory)"},
		{"NaI", 66, "NaI", "65 °C (from memory)"},
		{"NaI", 70, "NaI", "CRC 98th ed. rows: the slope breaks between 60 and 70 °C"},

		{"Na2SO3", 30, "Na2SO3·7H2O", crcAsterisk + " between 30 and 40 °C"},
		{"Na2SO3", 33, "Na2SO3·7H2O", "33.4 °C, " + wikiNa2SO3},
		{"Na2SO3", 34, "Na2SO3", "33.4 °C, " + wikiNa2SO3},
		{"Na2SO3", 40, "Na2SO3", crcAsterisk + " between 30 and 40 °C"},

		{"BaCl2", 50, "BaCl2·2H2O", "no change marked in the CRC 98th ed. rows; dihydrate from memory"},
		{"CuCl2", 50, "CuCl2·2H2O", "no change marked in the CRC 98th ed. rows; dihydrate from memory"},
		{"NH4NO3", 50, "NH4NO3", "polymorphs of the anhydrous salt (from memory)"},
		{"K2Cr2O7", 50, "K2Cr2O7", "anhydrous (from memory)"},
	}
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		_, seg, _, err := c.Solubility(tt.tempC)
		if err != nil || seg.Form.Formula != tt.want {
			var got string
			if seg != nil {
				got = seg.Form.Formula
			}
			t.Errorf("%s.Solubility(%v) solid = %s, %v; want %s (%s)", tt.id, tt.tempC, got, err, tt.want, tt.why)
		}
	}
}

// TestSaltTransitionShape: the Na2SO3 curve has its maximum at the 33.4 °C transition and
// falls above it (CRC 98th ed.: 27.3 mass % at 40 °C, 21.5 at 100 °C), so it is retrograde
// there; the hexahydrate of SrCl2 climbs faster than the dihydrate above it (CRC 98th ed.
// rows: 3.5 mass % per 10 K at 50–60 °C, 0.9 at 70–80 °C).
func TestSaltTransitionShape(t *testing.T) {
	c, _ := mustLookup(t, "sodium sulfite")
	top, _, _, _ := c.Solubility(33.4)
	lo, _, _, _ := c.Solubility(30)
	hi, _, _, _ := c.Solubility(40)
	if !(lo < top && hi < top) {
		t.Errorf("Na2SO3: 30 °C %v, 33.4 °C %v, 40 °C %v; want the maximum at the transition", lo, top, hi)
	}
	if c.Retrograde(25) || !c.Retrograde(60) {
		t.Errorf("Na2SO3.Retrograde: 25 °C %v, 60 °C %v; want false, true", c.Retrograde(25), c.Retrograde(60))
	}
	s, _ := mustLookup(t, "SrCl2")
	slope := func(a, b float64) float64 {
		va, _, _, _ := s.Solubility(a)
		vb, _, _, _ := s.Solubility(b)
		return solubility.MassPercent(vb) - solubility.MassPercent(va)
	}
	if below, above := slope(55, 60), slope(70, 75); !(below > 2*above) {
		t.Errorf("SrCl2: mass %% rise 55–60 °C %v, 70–75 °C %v; want the hexahydrate branch steeper", below, above)
	}
}

// TestSaltMolarMasses checks formula masses that use the added atomic weights (Cr, Pb) and
// the new hydrates. Values: CRC Handbook, "Physical Constants of Inorganic Compounds" (from
// memory) unless named; Tol ±0.02 g/mol as for the other molar masses.
func TestSaltMolarMasses(t *testing.T) {
	tests := []struct {
		formula string
		m       float64
		source  string
	}{
		{"K2Cr2O7", 294.18, "CRC (from memory)"},
		{"K2CrO4", 194.19, "CRC (from memory)"},
		{"Pb(NO3)2", 331.2, "CRC (from memory)"},
		{"AgNO3", 169.87, "CRC (from memory)"},
		{"KMnO4", 158.03, "CRC (from memory)"},
		{"BaCl2·2H2O", 244.26, "CRC (from memory)"},
		{"SrCl2·6H2O", 266.62, "CRC (from memory)"},
		{"CuCl2·2H2O", 170.48, "CRC (from memory)"},
		{"(NH4)2SO4", 132.14, "CRC (from memory)"},
		{"NH4H2PO4", 115.03, "CRC (from memory)"},
		{"(NH4)2HPO4", 132.06, "CRC (from memory)"},
		{"NaI·2H2O", 185.92, "supplier data sheet for CAS 13517-06-1 (open page)"},
		{"Na2SO3", 126.04, wikiNa2SO3},
	}
	for _, tt := range tests {
		_, f, err := Lookup(tt.formula)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(f.MolarMassGPerMol-tt.m) > 0.02 {
			t.Errorf("M(%s) = %.3f, want %.2f (%s)", tt.formula, f.MolarMassGPerMol, tt.m, tt.source)
		}
	}
}

// TestSaltEnthalpies checks stored enthalpies of solution against a second database.
func TestSaltEnthalpies(t *testing.T) {
	tests := []struct {
		formula string
		want    float64
		tol     float64 // kJ/mol: the spread between the two databases
		source  string
	}{
		{"NaBr", -0.741, 0.3, "PHREEQC llnl.dat, NaBr"},
		{"NaBr·2H2O", 18.49, 0.3, "PHREEQC llnl.dat, NaBr:2H2O"},
		{"KBr", 19.87, 0.5, "CRC/Parker 1965 (from memory)"},
		// Perry's 8th ed. table 2-182: 6.47 kcal/mol absorbed at 18 °C and finite dilution
		// (open mirror: globalspec.com) = 27.07 kJ/mol (derived); the dilution effect and
		// the 7 K difference allow 2 kJ/mol.
		{"NH4NO3", 27.07, 2, "Perry's 8th ed. table 2-182"},
	}
	for _, tt := range tests {
		_, f, err := Lookup(tt.formula)
		if err != nil {
			t.Fatal(err)
		}
		if !f.HasEnthalpy || math.Abs(f.SolutionEnthalpyKJPerMol-tt.want) > tt.tol {
			t.Errorf("ΔsolH(%s) = %v (has %v), want %v ± %v (%s)", tt.formula, f.SolutionEnthalpyKJPerMol, f.HasEnthalpy, tt.want, tt.tol, tt.source)
		}
	}
	// Hydrates whose infinite-dilution value has the wrong sign for crystallizing from the
	// saturated solution carry none (see the compounds' notes).
	for _, id := range []string{"LiCl·H2O", "SrCl2·2H2O"} {
		if _, f, _ := Lookup(id); f == nil || f.HasEnthalpy {
			t.Errorf("%s: want no stored enthalpy", id)
		}
	}
}

// TestSaltDensityHeldOut checks the density fit at CRC 102nd ed. rows that the library does
// not store (open mirror: github amosonabike/CRC-Solution-Properties-, 20 °C).
// densityHeldOutTol covers the cubic fit's error between stored rows.
const densityHeldOutTol = 0.0015 // g/cm³

func TestSaltDensityHeldOut(t *testing.T) {
	tests := []struct {
		id      string
		massPct float64
		gPerCm3 float64
	}{
		{"(NH4)2SO4", 8, 1.0456}, {"(NH4)2SO4", 36, 1.2056},
		{"BaCl2", 8, 1.0721}, {"BaCl2", 18, 1.1793},
		{"SrCl2", 8, 1.0726}, {"SrCl2", 34, 1.3811},
		{"LiCl", 8, 1.0444}, {"LiCl", 28, 1.1658},
		{"NaBr", 8, 1.0630}, {"NaBr", 36, 1.3592},
		{"KBr", 8, 1.0581}, {"KBr", 36, 1.3263},
		{"KI", 8, 1.0598}, {"KI", 36, 1.3434},
		{"KMnO4", 3.5, 1.0220},
		{"AgNO3", 8, 1.0690}, {"AgNO3", 36, 1.4087},
	}
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		rho, _, err := c.SolutionDensityKgPerM3(tt.massPct/100, 20)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(rho/1000-tt.gPerCm3) > densityHeldOutTol {
			t.Errorf("%s at %v %%: %.4f g/cm³, want %v ± %v (CRC 102nd ed.)", tt.id, tt.massPct, rho/1000, tt.gPerCm3, densityHeldOutTol)
		}
	}
	for _, id := range []string{"NH4NO3", "K2Cr2O7", "Pb(NO3)2"} { // not in the open mirror
		c, _ := mustLookup(t, id)
		if c.HasDensity() {
			t.Errorf("%s has density data, but the open CRC mirror has none", id)
		}
	}
}

func TestSaltLookup(t *testing.T) {
	tests := []lookupCase{
		{"AMS", "(NH4)2SO4", "(NH4)2SO4"},
		{"ammonium sulphate", "(NH4)2SO4", "(NH4)2SO4"},
		{"MAP", "NH4H2PO4", "NH4H2PO4"},
		{"monoammonium phosphate", "NH4H2PO4", "NH4H2PO4"},
		{"DAP", "(NH4)2HPO4", "(NH4)2HPO4"},
		{"ammonium nitrate", "NH4NO3", "NH4NO3"},
		{"CuCl2.2H2O", "CuCl2", "CuCl2·2H2O"},
		{"BaCl2*2H2O", "BaCl2", "BaCl2·2H2O"},
		{"strontium chloride hexahydrate", "SrCl2", "SrCl2·6H2O"},
		{"LiCl.H2O", "LiCl", "LiCl·H2O"},
		{"NaBr.2H2O", "NaBr", "NaBr·2H2O"},
		{"sodium iodide", "NaI", "NaI"},
		{"potassium bichromate", "K2Cr2O7", "K2Cr2O7"},
		{"Condy's crystals", "KMnO4", "KMnO4"},
		{"lunar caustic", "AgNO3", "AgNO3"},
		{"lead nitrate", "Pb(NO3)2", "Pb(NO3)2"},
		{"Na2SO3.7H2O", "Na2SO3", "Na2SO3·7H2O"},
		{"sodium sulphite", "Na2SO3", "Na2SO3"},
	}
	checkLookups(t, tests)
}

// TestSaltHazards: oxidizers and toxic salts carry the flags and the strong wording (GHS
// hazard statements as on the usual SDS; common practice).
func TestSaltHazards(t *testing.T) {
	tests := []struct {
		id              string
		oxidizer, toxic bool
		words           []string
	}{
		{"K2Cr2O7", true, true, []string{"DANGER", "cancer", "genetic", "fertility", "sensitiser", "waste", "local rules"}},
		{"K2CrO4", false, true, []string{"DANGER", "cancer", "sensitiser", "waste"}},
		{"Pb(NO3)2", true, true, []string{"DANGER", "unborn", "fertility", "waste"}},
		{"BaCl2", false, true, []string{"Toxic if swallowed", "waste"}},
		{"KClO3", true, false, []string{"explode", "acids", "grind"}},
		{"NH4NO3", true, false, []string{"explode", "dryness", "closed vessel"}},
		{"KMnO4", true, false, []string{"glycerol"}},
		{"AgNO3", true, false, []string{"burns", "stains"}},
		{"NaBr", false, false, nil},
	}
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		if c.Oxidizer != tt.oxidizer || c.Toxic != tt.toxic {
			t.Errorf("%s: oxidizer %v toxic %v; want %v %v", tt.id, c.Oxidizer, c.Toxic, tt.oxidizer, tt.toxic)
		}
		for _, w := range tt.words {
			if !strings.Contains(c.Hazard, w) {
				t.Errorf("%s hazard does not mention %q", tt.id, w)
			}
		}
	}
}

func TestParseToxicFlag(t *testing.T) {
	ok := strings.Replace(minimal, "  form KCl\n", "  flags toxic\n  form KCl\n", 1)
	ok = strings.Replace(ok, "hazard Low hazard.", "hazard DANGER: toxic.", 1)
	lib, err := Parse([]byte(ok))
	if err != nil || !lib[0].Toxic {
		t.Fatalf("toxic flag: %v, %v", lib, err)
	}
	weak := strings.Replace(minimal, "  form KCl\n", "  flags toxic\n  form KCl\n", 1)
	_, err = Parse([]byte(weak))
	var pe *ParseError
	if !errors.As(err, &pe) || !strings.Contains(pe.Msg, "DANGER") {
		t.Errorf("toxic compound with a mild hazard note: %v; want a *ParseError asking for DANGER", err)
	}
}
