package compound

import (
	"errors"
	"math"
	"strings"
	"testing"

	"saltcast/core/solubility"
	"saltcast/core/unit"
)

// lookupCase is a name as a technician types it, and the compound and form it must find.
type lookupCase struct{ in, id, form string }

// checkLookups looks each name up and reports a wrong compound or form.
func checkLookups(t *testing.T, tests []lookupCase) {
	t.Helper()
	for _, tt := range tests {
		c, f, err := Lookup(tt.in)
		if err != nil || c.ID != tt.id || f.Formula != tt.form {
			var id, form string
			if c != nil {
				id, form = c.ID, f.Formula
			}
			t.Errorf("Lookup(%q) = %s, %s, %v; want %s, %s", tt.in, id, form, err, tt.id, tt.form)
		}
	}
}

func TestLookup(t *testing.T) {
	tests := []lookupCase{
		// ids
		{"KNO3", "KNO3", "KNO3"},
		{"Na2SO4", "Na2SO4", "Na2SO4"},
		{"CH3COONa", "CH3COONa", "CH3COONa"},
		{"KAl(SO4)2", "KAl(SO4)2", "KAl(SO4)2"},
		{"C6H5COOH", "C6H5COOH", "C6H5COOH"},
		{"C12H22O11", "C12H22O11", "C12H22O11"},
		{" kno3 ", "KNO3", "KNO3"},
		// hydrate formulas typed with every dot
		{"CuSO4·5H2O", "CuSO4", "CuSO4·5H2O"},
		{"CuSO4.5H2O", "CuSO4", "CuSO4·5H2O"},
		{"CuSO4*5H2O", "CuSO4", "CuSO4·5H2O"},
		{"CuSO4 · 5H2O", "CuSO4", "CuSO4·5H2O"},
		{"CuSO4•5H2O", "CuSO4", "CuSO4·5H2O"},
		{"Na2SO4.10H2O", "Na2SO4", "Na2SO4·10H2O"},
		{"MgSO4.7H2O", "MgSO4", "MgSO4·7H2O"},
		{"KAl(SO4)2.12H2O", "KAl(SO4)2", "KAl(SO4)2·12H2O"},
		{"CH3COONa.3H2O", "CH3COONa", "CH3COONa·3H2O"},
		{"NaC2H3O2·3H2O", "CH3COONa", "CH3COONa·3H2O"},
		// common names
		{"potassium nitrate", "KNO3", "KNO3"},
		{"Potassium  Nitrate", "KNO3", "KNO3"},
		{"saltpetre", "KNO3", "KNO3"},
		{"table salt", "NaCl", "NaCl"},
		{"sal ammoniac", "NH4Cl", "NH4Cl"},
		{"blue vitriol", "CuSO4", "CuSO4·5H2O"},
		{"copper sulfate pentahydrate", "CuSO4", "CuSO4·5H2O"},
		{"copper sulphate", "CuSO4", "CuSO4"},
		{"Glauber's salt", "Na2SO4", "Na2SO4·10H2O"},
		{"Glauber’s salt", "Na2SO4", "Na2SO4·10H2O"},
		{"glaubers salt", "Na2SO4", "Na2SO4·10H2O"},
		{"sodium acetate trihydrate", "CH3COONa", "CH3COONa·3H2O"},
		{"sodium acetate", "CH3COONa", "CH3COONa"},
		{"alum", "KAl(SO4)2", "KAl(SO4)2·12H2O"},
		{"potash alum", "KAl(SO4)2", "KAl(SO4)2·12H2O"},
		{"Epsom salt", "MgSO4", "MgSO4·7H2O"},
		{"epsom salts", "MgSO4", "MgSO4·7H2O"},
		{"slaked lime", "Ca(OH)2", "Ca(OH)2"},
		{"benzoic acid", "C6H5COOH", "C6H5COOH"},
		{"sucrose", "C12H22O11", "C12H22O11"},
		{"table sugar", "C12H22O11", "C12H22O11"},
		{"lithium carbonate", "Li2CO3", "Li2CO3"},
		{"monopotassium phosphate", "KH2PO4", "KH2PO4"},
		{"potassium sulphate", "K2SO4", "K2SO4"},
		{"hydrohalite", "NaCl", "NaCl·2H2O"},
	}
	checkLookups(t, tests)
	for _, bad := range []string{"", "unobtainium", "KNO4", "CuSO4·6H2O", strings.Repeat("x", 10000)} {
		_, _, err := Lookup(bad)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != "solute" {
			t.Errorf("Lookup(%.20q) error = %v; want a *unit.FieldError for solute", bad, err)
		}
	}
}

func TestCompoundForm(t *testing.T) {
	c, _ := mustLookup(t, "CuSO4")
	for _, in := range []string{"CuSO4.5H2O", "cuso4*5h2o", "blue vitriol", "CuSO4"} {
		if _, err := c.Form(in); err != nil {
			t.Errorf("CuSO4.Form(%q): %v", in, err)
		}
	}
	_, err := c.Form("CuSO4·3H2O")
	var fe *unit.FieldError
	if !errors.As(err, &fe) || fe.Field != "charged_form" || !strings.Contains(fe.Allowed, "CuSO4·5H2O") {
		t.Errorf("CuSO4.Form(3H2O) error = %v; want a field error listing the forms", err)
	}
}

func TestLibraryShape(t *testing.T) {
	all := All()
	// The widened library: the 16 first compounds plus the sections added after them.
	if len(all) < 60 {
		t.Errorf("library has %d compounds, want at least 60", len(all))
	}
	for _, c := range all {
		if c.Forms[0].Formula != c.ID || c.Forms[0].AnhydrousFraction != 1 {
			t.Errorf("%s: Forms[0] = %s, want the anhydrous form", c.ID, c.Forms[0].Formula)
		}
		if !strings.Contains(c.Hazard, "SDS") || len(c.Sources) == 0 || c.Name == "" {
			t.Errorf("%s: hazard %q, %d sources, name %q", c.ID, c.Hazard, len(c.Sources), c.Name)
		}
		for i := 1; i < len(c.Segments); i++ {
			if c.Segments[i].MinC != c.Segments[i-1].MaxC {
				t.Errorf("%s: segments not contiguous at %v", c.ID, c.Segments[i].MinC)
			}
		}
		for _, s := range c.Segments {
			if s.Curve.Source == "" {
				t.Errorf("%s: segment %s has no source", c.ID, s.Form.Formula)
			}
		}
	}
	for _, id := range []string{"KNO3", "NaNO3"} {
		c, _ := mustLookup(t, id)
		if !c.Oxidizer || !strings.Contains(c.Hazard, "Oxidizer") {
			t.Errorf("%s: not flagged as an oxidizer", id)
		}
	}
	for _, tt := range []struct{ id, word string }{
		{"Ca(OH)2", "eye"}, {"CuSO4", "aquatic"}, {"Li2CO3", "swallowed"},
	} {
		c, _ := mustLookup(t, tt.id)
		if !strings.Contains(c.Hazard, tt.word) {
			t.Errorf("%s hazard %q does not mention %q", tt.id, c.Hazard, tt.word)
		}
	}
}

// TestMolarMasses checks the molar masses computed from the formulas against values summed by
// hand from the IUPAC/CIAAW standard atomic weights, abridged (2021) (derived; Tol ±0.02 g/mol,
// as older tables with S = 32.065 give CuSO4 159.61) and the anhydrous fractions
// f = M_anh/M_hydrate (derived; Tol ±0.0002).
func TestMolarMasses(t *testing.T) {
	tests := []struct {
		formula string
		m, f    float64 // f = 0: not listed
	}{
		{"NaCl", 58.44, 0}, {"KCl", 74.55, 0}, {"KNO3", 101.10, 0}, {"NaNO3", 84.99, 0},
		{"NH4Cl", 53.49, 0}, {"K2SO4", 174.25, 0}, {"CuSO4", 159.60, 0},
		{"CuSO4·5H2O", 249.68, 0.6392}, {"Na2SO4", 142.04, 0}, {"Na2SO4·10H2O", 322.19, 0.4409},
		{"CH3COONa", 82.03, 0}, {"CH3COONa·3H2O", 136.08, 0.6028}, {"KAl(SO4)2", 258.19, 0},
		{"KAl(SO4)2·12H2O", 474.37, 0.5443}, {"Ca(OH)2", 74.09, 0}, {"Li2CO3", 73.89, 0},
		{"MgSO4", 120.36, 0}, {"MgSO4·7H2O", 246.47, 0.4883}, {"MgSO4·6H2O", 228.45, 0},
		{"MgSO4·H2O", 138.38, 0}, {"KH2PO4", 136.08, 0}, {"C6H5COOH", 122.12, 0},
		{"C12H22O11", 342.30, 0}, {"NaCl·2H2O", 94.47, 0},
	}
	for _, tt := range tests {
		_, f, err := Lookup(tt.formula)
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(f.MolarMassGPerMol-tt.m) > 0.02 {
			t.Errorf("M(%s) = %.3f, want %.2f", tt.formula, f.MolarMassGPerMol, tt.m)
		}
		if tt.f != 0 && math.Abs(f.AnhydrousFraction-tt.f) > 0.0002 {
			t.Errorf("f(%s) = %.4f, want %.4f", tt.formula, f.AnhydrousFraction, tt.f)
		}
	}
	for _, bad := range []string{"", "Xx2", "K(NO3", "KNO3)", "·", "2", "H0", strings.Repeat("(", 300)} {
		if m, ok := MolarMass(bad); ok {
			t.Errorf("MolarMass(%q) = %v, want not ok", bad, m)
		}
	}
}

// TestEnthalpies checks the stored enthalpies of solution (kJ/mol, + = endothermic) against
// the published values named on each row (CRC "Enthalpy of Solution of Electrolytes", from
// Parker 1965, NSRDS-NBS 2; the PHREEQC databases llnl.dat, minteq.v4.dat and wateq4f.dat
// distributed by the USGS); where a second database gives a value the row checks against it.
func TestEnthalpies(t *testing.T) {
	tests := []struct {
		formula string
		want    float64
		tol     float64
		source  string
	}{
		{"NaCl", 3.74, 0.3, "PHREEQC llnl.dat, Halite"},
		{"KCl", 17.43, 0.4, "PHREEQC llnl.dat, Sylvite"},
		{"KNO3", 35.48, 0.8, "PHREEQC llnl.dat, Niter"},
		{"NaNO3", 20.50, 0.3, "CRC/Parker 1965"},
		{"NH4Cl", 14.78, 0.3, "CRC/Parker 1965"},
		{"CH3COONa", -17.32, 0.5, "CRC/Parker 1965"},
		{"CH3COONa·3H2O", 19.66, 0.5, "CRC/Parker 1965"},
		{"KH2PO4", 19.7, 1, "NBS tables arithmetic (from memory)"},
		{"K2SO4", 23.84, 0.5, "llnl.dat Arcanite"},
		{"CuSO4", -73.0, 1, "minteq.v4.dat"},
		{"CuSO4·5H2O", 6.58, 1, "llnl.dat Chalcanthite"},
		{"Na2SO4", -2.3, 1, "llnl.dat Thenardite"},
		{"Na2SO4·10H2O", 79.44, 1.5, "minteq.v4.dat Mirabilite"},
		{"MgSO4", -91.2, 1, "textbook tables (from memory)"},
		{"MgSO4·7H2O", 11.8, 1.5, "wateq4f.dat Epsomite, 2.82 kcal"},
		{"Ca(OH)2", -16.95, 1, "minteq.v4.dat Portlandite"},
		{"Li2CO3", -18.2, 1.5, "NBS tables arithmetic (from memory)"},
		{"C12H22O11", 5.8, 1, "(from memory, unsure)"},
	}
	for _, tt := range tests {
		_, f, err := Lookup(tt.formula)
		if err != nil {
			t.Fatal(err)
		}
		if !f.HasEnthalpy || math.Abs(f.SolutionEnthalpyKJPerMol-tt.want) > tt.tol || f.EnthalpySource == "" {
			t.Errorf("ΔsolH(%s) = %v (has %v), want %v ± %v (%s)", tt.formula, f.SolutionEnthalpyKJPerMol, f.HasEnthalpy, tt.want, tt.tol, tt.source)
		}
	}
}

// TestEnthalpySignMatchesSlope: a solid that dissolves endothermically becomes more soluble
// when warmed and one that dissolves exothermically less (Le Chatelier; common practice).
// Checked at 25 °C for every stable solid with an enthalpy.
func TestEnthalpySignMatchesSlope(t *testing.T) {
	for _, c := range All() {
		_, seg, _, err := c.Solubility(25)
		if err != nil {
			t.Fatal(err)
		}
		f := seg.Form
		if !f.HasEnthalpy || math.Abs(f.SolutionEnthalpyKJPerMol) < 2 {
			continue
		}
		if (f.SolutionEnthalpyKJPerMol < 0) != c.Retrograde(25) {
			t.Errorf("%s: ΔsolH %+v kJ/mol but retrograde at 25 °C = %v", f.Formula, f.SolutionEnthalpyKJPerMol, c.Retrograde(25))
		}
	}
}

// TestDensity checks the fitted densities against the CRC Handbook 102nd ed.,
// "Concentrative Properties of Aqueous Solutions", 20 °C (open mirror: github
// amosonabike/CRC-Solution-Properties-). Tol ±0.0005 g/cm³: the table prints 4 decimals.
func TestDensity(t *testing.T) {
	tests := []struct {
		id      string
		massPct float64
		gPerCm3 float64
	}{
		{"NaCl", 1, 1.0053}, {"NaCl", 10, 1.0707}, {"NaCl", 26, 1.1972},
		{"KNO3", 5, 1.0298}, {"KNO3", 24, 1.1623},
		{"KCl", 16, 1.1043}, {"NH4Cl", 20, 1.0567}, {"Na2SO4", 10, 1.0905},
		{"CuSO4", 16, 1.1796}, {"MgSO4", 20, 1.2198}, {"CH3COONa", 24, 1.1268},
		{"C12H22O11", 40, 1.1765}, {"C12H22O11", 60, 1.2864},
		{"NaNO3", 30, 1.2256}, {"K2SO4", 10, 1.0806},
	}
	const tol = 0.5 // kg/m³ = 0.0005 g/cm³
	for _, tt := range tests {
		c, _ := mustLookup(t, tt.id)
		rho, warn, err := c.SolutionDensityKgPerM3(tt.massPct/100, 20)
		if err != nil || warn != "" || math.Abs(rho-1000*tt.gPerCm3) > tol {
			t.Errorf("%s at %v %%: ρ = %.2f, %q, %v; want %.1f kg/m³", tt.id, tt.massPct, rho, warn, err, 1000*tt.gPerCm3)
		}
	}
	// Pure water at 20 °C: 998.21 kg/m³ (Kell 1975).
	c, _ := mustLookup(t, "NaCl")
	if rho, _, _ := c.SolutionDensityKgPerM3(0, 20); math.Abs(rho-998.21) > 0.01 {
		t.Errorf("NaCl at 0 %%: %v, want 998.21", rho)
	}
	// Warnings away from 20 °C and beyond the data; refusal far beyond.
	if _, w, err := c.SolutionDensityKgPerM3(0.1, 60); err != nil || w == "" {
		t.Errorf("NaCl density at 60 °C: %q, %v; want a warning", w, err)
	}
	if _, w, err := c.SolutionDensityKgPerM3(0.28, 20); err != nil || w == "" {
		t.Errorf("NaCl density at 28 %%: %q, %v; want a warning", w, err)
	}
	for _, bad := range []float64{0.5, -0.1, 1, math.NaN()} {
		if _, _, err := c.SolutionDensityKgPerM3(bad, 20); err == nil {
			t.Errorf("NaCl density at mass fraction %v: no error", bad)
		}
	}
	k, _ := mustLookup(t, "KH2PO4")
	_, _, err := k.SolutionDensityKgPerM3(0.1, 20)
	var fe *unit.FieldError
	if !errors.As(err, &fe) || fe.Field != "solution_density_kg_per_m3" || k.HasDensity() {
		t.Errorf("KH2PO4 density error = %v; want a request for the density", err)
	}
}

func TestNewCustom(t *testing.T) {
	// An invented product measured at four temperatures (invented).
	fit, err := solubility.Fit(solubility.KindVantHoff, []solubility.Point{{TempC: 10, GPer100gWater: 8}, {TempC: 25, GPer100gWater: 13}, {TempC: 40, GPer100gWater: 20}, {TempC: 60, GPer100gWater: 33}}, 180.16)
	if err != nil {
		t.Fatal(err)
	}
	c, err := NewCustom("product X (invented)", 180.16, fit.Curve)
	if err != nil {
		t.Fatal(err)
	}
	if g, seg, _, err := c.Solubility(25); err != nil || math.Abs(g-13) > 0.5 || seg.Form != c.Forms[0] || !c.Custom {
		t.Errorf("custom at 25 °C = %v, %v", g, err)
	}
	if !strings.Contains(c.Hazard, "SDS") {
		t.Errorf("custom hazard %q does not point to the SDS", c.Hazard)
	}
	tests := []struct {
		name  string
		cname string
		M     float64
		curve solubility.Curve
		field string
	}{
		{"empty name", " ", 100, fit.Curve, "solute"},
		{"control character", "a\x00b", 100, fit.Curve, "solute"},
		{"long name", strings.Repeat("n", 65), 100, fit.Curve, "solute"},
		{"zero molar mass", "x", 0, fit.Curve, "molar_mass_g_per_mol"},
		{"NaN molar mass", "x", math.NaN(), fit.Curve, "molar_mass_g_per_mol"},
		{"no model", "x", 100, solubility.Curve{MinC: 0, MaxC: 50}, "curve"},
		{"reversed range", "x", 100, solubility.Curve{Model: fit.Curve.Model, MinC: 50, MaxC: 10}, "curve"},
		{"NaN range", "x", 100, solubility.Curve{Model: fit.Curve.Model, MinC: math.NaN(), MaxC: 10}, "curve"},
		{"negative values", "x", 100, solubility.Curve{Model: solubility.Polynomial{Coef: []float64{5, -1}}, MinC: 0, MaxC: 20}, "curve"},
	}
	for _, tt := range tests {
		_, err := NewCustom(tt.cname, tt.M, tt.curve)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.field {
			t.Errorf("NewCustom(%s) error = %v; want a *unit.FieldError for %s", tt.name, err, tt.field)
		}
	}
}

// minimal is a valid one-compound library the parser tests break one line at a time.
const minimal = `source S | a source
compound KCl
  name potassium chloride
  hazard Low hazard. See the SDS.
  form KCl
  phase KCl | 0 | 100
    unit mass% | @S
    0 21.74
    100 36.05
end
`

func TestParseErrors(t *testing.T) {
	if _, err := Parse([]byte(minimal)); err != nil {
		t.Fatalf("minimal library: %v", err)
	}
	tests := []struct {
		name, from, to, msg string
	}{
		{"unknown statement", "  name potassium chloride", "  nom x", "unknown statement"},
		{"no end", "end\n", "", "no end line"},
		{"unknown source key", "@S", "@T", "unknown source key"},
		{"bad molar mass", "compound KCl", "compound Kq", "molar mass"},
		{"first form not anhydrous", "form KCl", "form KCl·2H2O", "first form"},
		{"hydrate without dot", "  form KCl\n", "  form KCl\n  form KCl2H2O\n", "middle dot"},
		{"phase of unknown form", "phase KCl |", "phase KBr |", "no form"},
		{"phase range reversed", "| 0 | 100", "| 100 | 0", "low first"},
		{"mass % of 100", "0 21.74", "0 100", "mass per cent"},
		{"row with letters", "0 21.74", "0 2l.74", "plain numbers"},
		{"row with three numbers", "0 21.74", "0 21.74 3", "temperature value"},
		{"rows do not cover", "100 36.05", "90 34.99", "do not cover"},
		{"one row", "    100 36.05\n", "", "at least 2"},
		{"no hazard", "  hazard Low hazard. See the SDS.\n", "", "hazard"},
		{"hazard without SDS", "See the SDS.", "Be careful.", "SDS"},
		{"row before unit", "    unit mass% | @S\n", "", "unit line"},
		{"unknown unit", "unit mass%", "unit ppm", "unit mass%"},
		{"unknown flag", "  form KCl\n", "  flags explosive\n  form KCl\n", "unknown flag"},
		{"statement outside a compound", "compound KCl", "name x\ncompound KCl", "outside a compound"},
		{"duplicate source", "source S | a source", "source S | a source\nsource S | again", "defined twice"},
		{"gap between phases", "    100 36.05\n", "    100 36.05\n  phase KCl | 110 | 120\n", "previous one ends"},
		{"enthalpy not a number", "  form KCl\n", "  form KCl\n  enthalpy KCl | hot | @S\n", "kJ/mol"},
		{"caution reversed", "  form KCl\n", "  form KCl\n  caution 50 | 10 | x\n", "from < to"},
		{"density rows bad", "end", "density @S\n 1 7.5\nend", "density row"},
		{"density with unknown source", "end", "density @X\n 1 1.01\nend", "unknown source key"},
	}
	for _, tt := range tests {
		src := strings.Replace(minimal, tt.from, tt.to, 1)
		if src == minimal {
			t.Fatalf("%s: replacement did not apply", tt.name)
		}
		_, err := Parse([]byte(src))
		var pe *ParseError
		if !errors.As(err, &pe) || !strings.Contains(pe.Error(), tt.msg) || pe.Line < 1 {
			t.Errorf("%s: error %v; want a *ParseError with a line mentioning %q", tt.name, err, tt.msg)
		}
	}
	// A citation that names a key is not expanded again (no loop).
	self := strings.Replace(minimal, "source S | a source", "source S | see @S", 1)
	lib, err := Parse([]byte(self))
	if err != nil || !strings.Contains(lib[0].Sources[0], "see @S") {
		t.Errorf("self-referring source: %v, %v", lib, err)
	}
	// Two phases whose curves do not meet at the transition.
	split := strings.Replace(minimal, "    100 36.05\n", "    100 36.05\n  phase KCl | 100 | 110\n    unit g/100g | @S\n    100 50\n    110 52\n", 1)
	if _, err := Parse([]byte(split)); err == nil || !strings.Contains(err.Error(), "do not meet") {
		t.Errorf("phases that do not meet: %v", err)
	}
}

// FuzzParse: the parser never panics, and a library it accepts answers solubility
// questions with finite numbers or errors.
func FuzzParse(f *testing.F) {
	f.Add([]byte(minimal))
	// The whole library is parsed by every other test; as a seed it is too large to mutate well.
	f.Fuzz(func(t *testing.T, data []byte) {
		lib, err := Parse(data)
		if err != nil {
			var pe *ParseError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v is not a *ParseError", err)
			}
			return
		}
		for _, c := range lib {
			lo, hi := c.Range()
			for _, tc := range []float64{lo, (lo + hi) / 2, hi} {
				if g, _, _, err := c.Solubility(tc); err == nil && (math.IsNaN(g) || math.IsInf(g, 0)) {
					t.Fatalf("%s at %v: %v", c.ID, tc, g)
				}
			}
		}
	})
}

// The salts whose harmonised classification (EU CLP Annex VI, as printed on their SDS; from
// memory) carries acute toxicity category 1–3, carcinogenicity, mutagenicity or reproductive
// toxicity are flagged toxic, so every plan and preparation opens with the strong caution.
func TestToxicFlags(t *testing.T) {
	for _, id := range []string{
		"BaCl2",    // H301, H332
		"K2Cr2O7",  // H350, H340, H360FD, H330
		"K2CrO4",   // H350i, H340
		"Pb(NO3)2", // H360Df
		"NiSO4",    // H350i, H341, H360D
		"CoCl2",    // H350i, H341, H360F
		"Na2B4O7",  // H360FD
		"H3BO3",    // H360FD
		"NaF",      // H301
	} {
		c, _, err := Lookup(id)
		if err != nil {
			t.Errorf("%s: %v", id, err)
			continue
		}
		if !c.Toxic {
			t.Errorf("%s is not flagged toxic", id)
		}
	}
	for _, id := range []string{"NaCl", "KNO3", "C12H22O11"} {
		if c, _, err := Lookup(id); err != nil || c.Toxic {
			t.Errorf("%s: flagged toxic (or %v); it is not", id, err)
		}
	}
}
