package compound

import (
	"math"
	"strings"
	"testing"

	"saltcast/core/solubility"
)

// Freezing points against a second compilation: Forsythe, Smithsonian Physical Tables, 9th
// ed. (1956), as reprinted in the CRC Handbook of Chemistry and Physics, 86th ed. (2005),
// table "Freezing Point Lowering by Electrolytes in Aqueous Solution", p. 15-29 (open copy:
// zanotowane.pl/1028/6486), depression in K against molality. The library's rows are the CRC
// 102nd ed. "Concentrative Properties" (Wolf 1966), in mass %.
func TestFreezingPointSmithsonian(t *testing.T) {
	// smithsonianTol covers the spread between the two compilations (different original
	// measurements, rounded to 0.01 K) and the linear interpolation of the library rows.
	const smithsonianTol = 0.08 // K
	// kno3Tol: at 1 mol/kg KNO3 the two compilations themselves differ by 0.10 K.
	const kno3Tol = 0.12 // K
	tests := []struct {
		id          string
		molality    float64 // mol/kg water
		depressionK float64 // Smithsonian 9th ed. via CRC 86th ed. p. 15-29
	}{
		{"NaCl", 0.50, 1.68},
		{"NaCl", 0.75, 2.60},
		{"KCl", 0.50, 1.68},
		{"KCl", 1.00, 3.29},
		{"KCl", 2.00, 6.50},
		{"KNO3", 0.50, 1.47},
		{"KNO3", 1.00, 2.66}, // CRC 102nd ed. rows give 2.56: see kno3Tol
		{"NH4Cl", 0.50, 1.70},
		{"NH4Cl", 0.75, 2.55},
		{"MgSO4", 0.50, 1.01},
		{"MgSO4", 1.00, 2.08},
		{"K2SO4", 0.10, 0.43},
		{"K2SO4", 0.25, 1.01},
	}
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		g100 := tt.molality * c.MolarMassGPerMol / 10 // g per 100 g water
		got, ok := c.Freezing.TempC(g100)
		tol := smithsonianTol
		if tt.id == "KNO3" && tt.molality == 1 {
			tol = kno3Tol
		}
		if !ok || math.Abs(got+tt.depressionK) > tol {
			t.Errorf("%s.Freezing.TempC(%.4g g/100 g, %v mol/kg) = %.3f °C, %v; want %.2f °C (Smithsonian 9th ed.)",
				tt.id, g100, tt.molality, got, ok, -tt.depressionK)
		}
	}
}

// The rows as loaded: the CRC 102nd ed. "Concentrative Properties of Aqueous Solutions"
// values at two concentrations each, read back exactly.
func TestFreezingPointCRCRows(t *testing.T) {
	const rowTol = 1e-9 // K: a row is returned as printed
	tests := []struct {
		id          string
		massPct     float64
		depressionK float64 // CRC 102nd ed., column Δ
	}{
		{"NaCl", 10, 6.56},
		{"NaCl", 20, 16.46},
		{"KCl", 5, 2.32},
		{"KCl", 13, 6.45},
		{"KNO3", 4, 1.22},
		{"KNO3", 10, 2.75},
		{"NaNO3", 10, 3.84},
		{"NaNO3", 28, 11.28},
		{"CuSO4", 5, 0.59},
		{"CuSO4", 12, 1.45},
		{"Na2SO4", 2, 0.61},
		{"Na2SO4", 4, 1.13},
		{"MgSO4", 10, 1.85},
		{"MgSO4", 16, 3.67},
		{"C12H22O11", 10, 0.63},
		{"C12H22O11", 40, 4.45},
		{"CH3COONa", 5, 2.32},
		{"KH2PO4", 10, 2.23},
	}
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		got, ok := c.Freezing.TempC(solubility.FromMassPercent(tt.massPct))
		if !ok || math.Abs(got+tt.depressionK) > rowTol {
			t.Errorf("%s freezing point at %v mass %% = %v °C, %v; want %v (CRC 102nd ed.)", tt.id, tt.massPct, got, ok, -tt.depressionK)
		}
	}
}

// LiquorG100 inverts TempC, and neither answers beyond the data.
func TestFreezingInverse(t *testing.T) {
	const inverseTol = 1e-9 // relative
	for _, c := range All() {
		fz := c.Freezing
		if fz == nil {
			continue
		}
		for i := 1; i <= 40; i++ {
			g := fz.MaxG100() * float64(i) / 40
			tc, ok := fz.TempC(g)
			back, ok2 := fz.LiquorG100(tc)
			if !ok || !ok2 || math.Abs(back-g) > inverseTol*g {
				t.Fatalf("%s: TempC(%v) = %v, LiquorG100 back = %v (%v %v)", c.ID, g, tc, back, ok, ok2)
			}
		}
		if _, ok := fz.TempC(fz.MaxG100() * 1.001); ok {
			t.Errorf("%s: TempC answers beyond the data", c.ID)
		}
		if _, ok := fz.LiquorG100(fz.LowestC() - 0.01); ok {
			t.Errorf("%s: LiquorG100 answers below the data", c.ID)
		}
		if _, ok := fz.LiquorG100(0.5); ok {
			t.Errorf("%s: LiquorG100 answers above 0 °C", c.ID)
		}
	}
}

// The NaCl eutectic against its published value, and every eutectic on both its curves.
func TestEutectic(t *testing.T) {
	// Thermochimica Acta 647 (2017) 94, abstract: ice + NaCl·2H2O at −21.1 °C, 23.3 wt %.
	const (
		eutecticTolK   = 0.15 // the library keeps the usual −21.2 °C
		eutecticTolPct = 0.05 // mass %
	)
	c, _ := mustLookup(t, "NaCl")
	fz := c.Freezing
	if !fz.HasEutectic || math.Abs(fz.EutecticC+21.1) > eutecticTolK ||
		math.Abs(solubility.MassPercent(fz.EutecticG100)-23.3) > eutecticTolPct || fz.EutecticForm.Formula != "NaCl·2H2O" {
		t.Errorf("NaCl eutectic %v °C, %v mass %%, %s; want −21.1 °C, 23.3 %%, NaCl·2H2O (Thermochimica Acta 2017)",
			fz.EutecticC, solubility.MassPercent(fz.EutecticG100), fz.EutecticForm.Formula)
	}
	const meetTol = 1e-9 // relative: the eutectic is a node of both curves
	for _, c := range All() {
		fz := c.Freezing
		if fz == nil || !fz.HasEutectic {
			continue
		}
		s, seg, _, err := c.Solubility(fz.EutecticC)
		if err != nil || seg.Form != fz.EutecticForm || math.Abs(s-fz.EutecticG100) > meetTol*s {
			t.Errorf("%s: solubility at the eutectic %v °C = %v (%v, %v); want %v of %s", c.ID, fz.EutecticC, s, seg.Form.Formula, err,
				fz.EutecticG100, fz.EutecticForm.Formula)
		}
		if tc, ok := fz.TempC(fz.EutecticG100); !ok || math.Abs(tc-fz.EutecticC) > 1e-9 {
			t.Errorf("%s: freezing point of the eutectic liquor %v, want %v", c.ID, tc, fz.EutecticC)
		}
		if lo, _ := c.Range(); lo != fz.EutecticC {
			t.Errorf("%s: data start at %v °C, want the eutectic %v", c.ID, lo, fz.EutecticC)
		}
	}
}

// The cold hydrates on each side of their transitions.
func TestColdHydrates(t *testing.T) {
	tests := []struct {
		id    string
		tempC float64
		want  string
	}{
		// hydrohalite below 0.1 °C (Wikipedia "Hydrohalite": decomposes at 0.1 °C)
		{"NaCl", -10, "NaCl·2H2O"},
		{"NaCl", 0, "NaCl·2H2O"},
		{"NaCl", 0.5, "NaCl"},
		// meridianiite below about 2 °C (Peterson et al. 2007; Genceli et al. 2007)
		{"MgSO4", -3, "MgSO4·11H2O"},
		{"MgSO4", 1, "MgSO4·11H2O"},
		{"MgSO4", 3, "MgSO4·7H2O"},
	}
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		_, seg, _, err := c.Solubility(tt.tempC)
		if err != nil || seg.Form.Formula != tt.want {
			t.Errorf("%s stable solid at %v °C = %v (%v), want %s", tt.id, tt.tempC, seg.Form.Formula, err, tt.want)
		}
	}
	// Formula mass of MgSO4·11H2O: 318.55 (Genceli et al. 2007, Cryst. Growth Des. 7:2460,
	// abstract); anhydrous fraction 0.378 against 0.488 for epsomite (derived).
	const massTol = 0.05 // g/mol: IUPAC 2021 atomic weights against the paper's
	c, _ := mustLookup(t, "MgSO4")
	f, err := c.Form("meridianiite")
	if err != nil || math.Abs(f.MolarMassGPerMol-318.55) > massTol || math.Abs(f.AnhydrousFraction-0.378) > 0.0005 {
		t.Errorf("MgSO4·11H2O: %v g/mol, fraction %v (%v); want 318.55, 0.378", f.MolarMassGPerMol, f.AnhydrousFraction, err)
	}
}

// Parse checks freezing blocks and eutectics.
func TestParseFreezingErrors(t *testing.T) {
	head := "compound KCl\n name x\n hazard h. See the SDS.\n form KCl\n phase KCl | 0 | 20\n unit mass% | s\n 0 21.74\n 20 25.39\n"
	tests := []struct{ name, body, want string }{
		{"falling rows", " freezing s\n 1 0.5\n 2 0.4\nend\n", "rise"},
		{"eutectic without freezing", " eutectic -10.7 | 19.7 | KCl | s\nend\n", "after the freezing block"},
		{"eutectic above rows", " freezing s\n 1 0.5\n 13 6.45\n eutectic -5 | 19.7 | KCl | s\nend\n", "below the last freezing row"},
		{"eutectic off curve", " freezing s\n 1 0.5\n 13 6.45\n eutectic -3 | 10 | KCl | s\nend\n", "does not lie on the freezing curve"},
		{"phase after freezing", " freezing s\n 1 0.5\n 2 1\n phase KCl | 20 | 30\nend\n", "phases come before"},
		{"warm eutectic", " freezing s\n 1 0.5\n 2 1\n eutectic 3 | 10 | KCl | s\nend\n", "below 0 °C"},
	}
	for _, tt := range tests {
		_, err := Parse([]byte(head + tt.body))
		if err == nil || !strings.Contains(err.Error(), tt.want) {
			t.Errorf("%s: Parse error %v, want one containing %q", tt.name, err, tt.want)
		}
	}
	// A good block extends the phase down to the eutectic.
	cs, err := Parse([]byte(head + " freezing s\n 1 0.46\n 13 6.45\n eutectic -10.7 | 19.7 | KCl | s\nend\n"))
	if err != nil {
		t.Fatal(err)
	}
	if lo, _ := cs[0].Range(); lo != -10.7 {
		t.Errorf("range starts at %v, want −10.7", lo)
	}
}
