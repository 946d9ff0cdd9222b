package compound

import (
	"math"
	"strings"

	"saltcast/core/activity"
	"saltcast/core/solubility"
	"saltcast/core/unit"
)

// Form is one solid form of a compound: the anhydrous salt or a hydrate.
type Form struct {
	Formula           string   // "CuSO4·5H2O"; the anhydrous form's Formula is the compound ID
	Names             []string // common names of this form
	WaterPerFormula   float64  // n in ·nH2O
	MolarMassGPerMol  float64
	AnhydrousFraction float64 // mass of anhydrous salt per mass of this form
	// NotOnShelf marks a form that crystallizes but is not kept or sold (NaCl·2H2O, stable
	// only below 0.1 °C): front ends do not offer it as the form weighed.
	NotOnShelf               bool
	SolutionEnthalpyKJPerMol float64 // per mol of this form, infinite dilution, 25 °C; + = endothermic
	HasEnthalpy              bool
	EnthalpySource           string

	// Heat of fusion of a hydrate that melts congruently or nearly so (in its own water of
	// crystallization), per kg of this form; a published range, low ≤ high.
	FusionKJPerKgLow, FusionKJPerKgHigh float64
	HasFusion                           bool
	FusionSource                        string

	// Heat capacity of the solid near 25 °C; see SolidHeatCapacity for the fallback.
	SolidCpJPerMolK float64
	HasSolidCp      bool
	SolidCpSource   string

	// Heat capacity of the melt of this hydrate (the liquid of its own composition).
	MeltCpKJPerKgK float64
	HasMeltCp      bool
	MeltCpSource   string
}

// SolidHeatCapacity returns the heat capacity of the solid form in kJ/(kg·K) (= J/(g·K)) near
// 25 °C, and where it comes from: the library value, or else Kopp's rule (the sum of atomic
// heat capacities; see KoppHeatCapacity), said so in the source.
func (f *Form) SolidHeatCapacity() (kJPerKgK float64, source string) {
	if f.HasSolidCp {
		return f.SolidCpJPerMolK / f.MolarMassGPerMol, f.SolidCpSource
	}
	cp, ok := KoppHeatCapacity(f.Formula)
	if !ok {
		// Every library and custom formula parses (its molar mass did); keep a neutral value.
		cp = 1.0 * f.MolarMassGPerMol
	}
	return cp / f.MolarMassGPerMol, koppSource
}

// Segment is a temperature range in which Form is the stable solid, with its curve.
type Segment struct {
	Form       *Form
	MinC, MaxC float64
	Curve      solubility.Curve
}

// Caution is a warning attached to solubilities read between MinC and MaxC.
type Caution struct {
	MinC, MaxC float64
	Text       string
}

// Compound is one solute of the library, or a custom one from NewCustom.
type Compound struct {
	ID               string
	Name             string
	Names            []string
	MolarMassGPerMol float64
	Forms            []*Form        // Forms[0] is the anhydrous form
	Segments         []Segment      // ordered by temperature, contiguous
	Hazard           string         // general note, ends by pointing to the SDS
	Oxidizer         bool           // strong oxidizer: keep from organics and fuels
	Organic          bool           // the solute itself is organic (combustible)
	Toxic            bool           // acutely toxic, carcinogenic, mutagenic or toxic to reproduction: Hazard carries the strong wording
	Sources          []string       // every source cited by the compound's data
	Notes            []string       // remarks on the data a technician should see
	Cautions         []Caution      // range-bound warnings added to Solubility
	Custom           bool           // made by NewCustom, not from the library
	Activity         *activity.Salt // Pitzer parameters of the dissolved salt; nil when the library has none
	Freezing         *Freezing      // freezing curve and eutectic; nil where the library has no data
	density          *densityFit
}

// Range returns the temperature range covered by the compound's data.
func (c *Compound) Range() (minC, maxC float64) {
	return c.Segments[0].MinC, c.Segments[len(c.Segments)-1].MaxC
}

// Anhydrous returns Forms[0].
func (c *Compound) Anhydrous() *Form { return c.Forms[0] }

// Form returns the form with the given formula, accepting '.', '*' or '·' for the hydrate dot,
// spaces and any letter case, and the form's names ("blue vitriol"). Unknown forms give a
// *unit.FieldError for "charged_form".
func (c *Compound) Form(formula string) (*Form, error) {
	k := formulaKey(formula)
	nk := nameKey(formula)
	for _, f := range c.Forms {
		if formulaKey(f.Formula) == k {
			return f, nil
		}
		for _, n := range f.Names {
			if nameKey(n) == nk {
				return f, nil
			}
		}
	}
	return nil, &unit.FieldError{Field: "charged_form", Value: formula, Allowed: "a form of " + c.ID + ": " + c.formList()}
}

func (c *Compound) formList() string {
	s := make([]string, len(c.Forms))
	for i, f := range c.Forms {
		s[i] = f.Formula
	}
	return strings.Join(s, ", ")
}

// Solubility returns the solubility (g anhydrous per 100 g water) at tempC, the segment whose
// solid is stable there, and a warning (extrapolation, or a caution of the data); see
// SolubilityField. Errors name the field "temp_C".
func (c *Compound) Solubility(tempC float64) (gPer100gWater float64, seg *Segment, warning string, err error) {
	return c.SolubilityField("temp_C", tempC)
}

// SolubilityField is Solubility with the name of the field the temperature came from, for
// error messages. Exactly at a transition temperature the warmer phase is reported; both
// phases give the same value there.
func (c *Compound) SolubilityField(field string, tempC float64) (gPer100gWater float64, seg *Segment, warning string, err error) {
	seg = c.SegmentAt(tempC)
	g, warn, err := seg.Curve.AtField(field, tempC)
	if err != nil {
		return 0, nil, "", err
	}
	for _, k := range c.Cautions {
		if tempC >= k.MinC && tempC <= k.MaxC {
			warn = joinWarn(warn, c.ID+": "+k.Text)
		}
	}
	return g, seg, warn, nil
}

// SegmentAt returns the segment for tempC: the one containing it, or the first or last for a
// temperature outside the range (and for NaN, the first).
func (c *Compound) SegmentAt(tempC float64) *Segment {
	for i := range c.Segments {
		if tempC < c.Segments[i].MaxC {
			return &c.Segments[i]
		}
	}
	if math.IsNaN(tempC) {
		return &c.Segments[0]
	}
	return &c.Segments[len(c.Segments)-1]
}

// Retrograde reports whether the solubility falls with rising temperature at tempC (Ca(OH)2,
// Li2CO3, Na2SO4 above 32.38 °C). Outside the range it answers for the nearest end.
func (c *Compound) Retrograde(tempC float64) bool {
	lo, hi := c.Range()
	t := math.Max(lo, math.Min(hi, tempC))
	seg := c.SegmentAt(t)
	a := math.Max(seg.MinC, t-0.05)
	b := math.Min(seg.MaxC, t+0.05)
	if b <= a {
		return false
	}
	return seg.Curve.Model.Value(b) < seg.Curve.Model.Value(a)
}

func joinWarn(a, b string) string {
	if a == "" {
		return b
	}
	return a + "; " + b
}

// NewCustom makes a compound from a user's own curve, with one anhydrous form whose formula
// is name. It checks that name is short printable text, the molar mass is a positive finite
// number, and the curve has a finite range and gives finite, positive solubilities across it;
// errors are *unit.FieldError for "solute", "molar_mass_g_per_mol" or "curve".
func NewCustom(name string, molarMassGPerMol float64, curve solubility.Curve) (*Compound, error) {
	name = strings.TrimSpace(name)
	if name == "" || len(name) > 64 || strings.ContainsFunc(name, func(r rune) bool { return r < ' ' || r == 0x7f || r == '\uFFFD' }) {
		return nil, &unit.FieldError{Field: "solute", Value: name, Allowed: "a name of 1 to 64 printable characters"}
	}
	if !(molarMassGPerMol >= 1 && molarMassGPerMol <= 1e5) {
		return nil, unit.NumberError("molar_mass_g_per_mol", molarMassGPerMol, "a molar mass from 1 to 100000 g/mol")
	}
	if curve.Model == nil {
		return nil, &unit.FieldError{Field: "curve", Value: "", Allowed: "a solubility curve"}
	}
	if !(curve.MinC > -100 && curve.MaxC < 500 && curve.MinC < curve.MaxC) {
		return nil, &unit.FieldError{Field: "curve", Value: unit.FormatCompact(curve.MinC, 6) + " to " + unit.FormatCompact(curve.MaxC, 6) + " °C",
			Allowed: "a curve range from above −100 °C to below 500 °C, low end first"}
	}
	const samples = 64
	for i := 0; i <= samples; i++ {
		t := curve.MinC + (curve.MaxC-curve.MinC)*float64(i)/samples
		v := curve.Model.Value(t)
		if !(v > 0 && v < 1e9) {
			return nil, &unit.FieldError{Field: "curve", Value: unit.FormatCompact(t, 6) + " °C",
				Allowed: "a curve with positive, finite solubility over its whole range"}
		}
	}
	src := curve.Source
	if src == "" {
		src = "user data"
	}
	curve.Source = src
	f := &Form{Formula: name, MolarMassGPerMol: molarMassGPerMol, AnhydrousFraction: 1}
	return &Compound{
		ID: name, Name: name, MolarMassGPerMol: molarMassGPerMol,
		Forms:    []*Form{f},
		Segments: []Segment{{Form: f, MinC: curve.MinC, MaxC: curve.MaxC, Curve: curve}},
		Hazard:   "Custom solute: Saltcast knows nothing of its hazards. Read its SDS before heating or handling it.",
		Sources:  []string{src},
		Custom:   true,
	}, nil
}
