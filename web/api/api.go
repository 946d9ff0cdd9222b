// Package api answers the requests every Saltcast front end makes (plan, prep, solubility,
// compounds, and the gas requests in gas.go) with JSON in and JSON out. The CLI, the worker
// and the browser all call it, so their answers are byte-identical.
//
// Errors: a *unit.FieldError (a value the user gave) or a *wire.SyntaxError (malformed JSON)
// is an input error (IsInputError); ErrorJSON renders any error as {"error":...,"field":...}.
package api

import (
	"errors"
	"maps"
	"slices"
	"strings"
	"sync"

	"saltcast/core/compound"
	"saltcast/core/recipe"
	"saltcast/core/solubility"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Params are the parameters of a query, keyed like JSON keys: "solute", "temp_C", ...
// Values are the text the user typed; numbers may use a decimal comma.
type Params map[string]string

// Plan reads a recipe (JSON) and returns its plan (JSON); see recipe.Result.Encode.
func Plan(body []byte) ([]byte, error) {
	r, err := recipe.Decode(body)
	if err != nil {
		return nil, err
	}
	res, err := recipe.Plan(r)
	if err != nil {
		return nil, err
	}
	return res.Encode(), nil
}

// Prep reads a preparation recipe (JSON) and returns the worked preparation (JSON); see
// recipe.PrepResult.Encode.
func Prep(body []byte) ([]byte, error) {
	p, err := recipe.DecodePrep(body)
	if err != nil {
		return nil, err
	}
	res, err := recipe.PlanPrep(p)
	if err != nil {
		return nil, err
	}
	return res.Encode(), nil
}

// sig is the number of significant digits of every number in an answer, the plan's rule.
const sig = recipe.Digits

// Solubility answers the solubility of a library compound at one temperature.
//
// Keys: solute (required: id, hydrate formula or common name) and temp_C (required).
// Output keys, in order: solute, solute_name, temp_C, g_per_100g_water (anhydrous solute per
// 100 g water at saturation), solid_phase (the stable solid, e.g. "Na2SO4·10H2O"),
// mass_percent, mole_fraction, molality_mol_per_kg, g_per_L and mol_per_L (null without
// density data), valid_from_C, valid_to_C, source, warnings.
func Solubility(p Params) ([]byte, error) {
	if err := knownKeys(p, "solute", "temp_C"); err != nil {
		return nil, err
	}
	name, ok := p["solute"]
	if !ok || strings.TrimSpace(name) == "" {
		return nil, &unit.FieldError{Field: "solute", Value: name, Allowed: "a compound id or name, e.g. KNO3"}
	}
	c, _, err := compound.Lookup(strings.TrimSpace(name))
	if err != nil {
		return nil, err
	}
	text, ok := p["temp_C"]
	if !ok {
		return nil, &unit.FieldError{Field: "temp_C", Value: "", Allowed: "a temperature in °C (the key is required)"}
	}
	t, err := unit.ParseNumber("temp_C", text)
	if err != nil {
		return nil, err
	}
	g, seg, warn, err := c.SolubilityField("temp_C", t)
	if err != nil {
		return nil, err
	}
	var warnings []string
	if warn != "" {
		warnings = append(warnings, warn)
	}
	m := c.MolarMassGPerMol
	lo, hi := c.Range()

	var e wire.Encoder
	e.BeginObject()
	e.Key("solute").String(c.ID)
	e.Key("solute_name").String(c.Name)
	e.Key("temp_C").Round(t, sig)
	e.Key("g_per_100g_water").Round(g, sig)
	e.Key("solid_phase").String(seg.Form.Formula)
	e.Key("mass_percent").Round(solubility.MassPercent(g), sig)
	e.Key("mole_fraction").Round(solubility.MoleFraction(g, m), sig)
	e.Key("molality_mol_per_kg").Round(solubility.Molality(g, m), sig)
	rho, dwarn, derr := c.SolutionDensityKgPerM3(g/(100+g), t)
	if derr == nil {
		e.Key("g_per_L").Round(solubility.GPerL(g, rho), sig)
		e.Key("mol_per_L").Round(solubility.MolPerL(g, m, rho), sig)
		if dwarn != "" {
			warnings = append(warnings, dwarn)
		}
	} else {
		e.Key("g_per_L").Null()
		e.Key("mol_per_L").Null()
	}
	e.Key("valid_from_C").Round(lo, sig)
	e.Key("valid_to_C").Round(hi, sig)
	e.Key("source").String(seg.Curve.Source)
	strList(&e, "warnings", warnings)
	e.EndObject()
	return e.Bytes()
}

// Compounds lists the library: for each compound its id, name, other names, molar mass,
// forms (formula, names, molar mass, enthalpy of solution where known), stable phases with
// their ranges, valid range, flags and hazard note.
func Compounds() []byte {
	compoundsOnce.Do(func() { compoundsJSON = encodeCompounds() })
	return slices.Clone(compoundsJSON)
}

var (
	compoundsOnce sync.Once
	compoundsJSON []byte
)

func encodeCompounds() []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("compounds").BeginArray()
	for _, c := range compound.All() {
		lo, hi := c.Range()
		e.BeginObject()
		e.Key("id").String(c.ID)
		e.Key("name").String(c.Name)
		strList(&e, "names", c.Names)
		e.Key("molar_mass_g_per_mol").Round(c.MolarMassGPerMol, sig)
		e.Key("forms").BeginArray()
		for _, f := range c.Forms {
			e.BeginObject()
			e.Key("formula").String(f.Formula)
			strList(&e, "names", f.Names)
			e.Key("molar_mass_g_per_mol").Round(f.MolarMassGPerMol, sig)
			e.Key("anhydrous_fraction").Round(f.AnhydrousFraction, sig)
			if f.HasEnthalpy {
				e.Key("solution_enthalpy_kJ_per_mol").Round(f.SolutionEnthalpyKJPerMol, sig)
				e.Key("enthalpy_source").String(f.EnthalpySource)
			} else {
				e.Key("solution_enthalpy_kJ_per_mol").Null()
				e.Key("enthalpy_source").Null()
			}
			e.EndObject()
		}
		e.EndArray()
		e.Key("phases").BeginArray()
		for _, s := range c.Segments {
			e.BeginObject()
			e.Key("solid").String(s.Form.Formula)
			e.Key("from_C").Round(s.MinC, sig)
			e.Key("to_C").Round(s.MaxC, sig)
			e.Key("source").String(s.Curve.Source)
			e.EndObject()
		}
		e.EndArray()
		e.Key("valid_from_C").Round(lo, sig)
		e.Key("valid_to_C").Round(hi, sig)
		e.Key("oxidizer").Bool(c.Oxidizer)
		e.Key("toxic").Bool(c.Toxic)
		e.Key("organic").Bool(c.Organic)
		e.Key("hazard").String(c.Hazard)
		strList(&e, "notes", c.Notes)
		e.EndObject()
	}
	e.EndArray()
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		panic("service: the compound library holds a non-finite number: " + err.Error())
	}
	return b
}

func strList(e *wire.Encoder, key string, l []string) {
	e.Key(key).BeginArray()
	for _, s := range l {
		e.String(s)
	}
	e.EndArray()
}

// knownKeys refuses a parameter that the request does not take.
func knownKeys(p Params, keys ...string) error {
	for _, k := range slices.Sorted(maps.Keys(p)) {
		if !slices.Contains(keys, k) {
			return &unit.FieldError{Field: k, Value: p[k], Allowed: unit.KeysAllowed(keys)}
		}
	}
	return nil
}

// ErrorJSON renders err as {"error":"...","field":"..."}; field is "" when the error is not
// about one field. The message is the error's text, which for input errors names the field
// and what is allowed.
func ErrorJSON(err error) []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("error").String(err.Error())
	field := ""
	var fe *unit.FieldError
	if errors.As(err, &fe) {
		field = fe.Field
	}
	e.Key("field").String(unit.Clip(field))
	e.EndObject()
	b, _ := e.Bytes()
	return b
}

// IsInputError reports whether err is the user's (a bad field or malformed JSON) rather
// than Saltcast's.
func IsInputError(err error) bool {
	var fe *unit.FieldError
	var se *wire.SyntaxError
	return errors.As(err, &fe) || errors.As(err, &se)
}
