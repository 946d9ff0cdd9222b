package main

import (
	"encoding/base64"
	"math"
	"strings"

	"saltcast/core/prep"
	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// The preparation screen's form, without the DOM: a Draft over the preparation table
// (recipe.PrepSpecs), so its inputs are named like the recipe keys, masses and volumes
// follow the unit switch like the batch screen's, and what the form holds is what a file can
// hold. The concentrations stay in the chosen concentration unit.

// prepGroupInputs names the radio buttons that pick the Choice of each Group of the
// preparation table; their values are the Choices.
var prepGroupInputs = map[string]string{"amount": "prep_amount", "from": "prep_from"}

// NewPrepDraft is the form of a first visit: 1 L of 0.1 mol/L NaCl at 20 °C (invented).
func NewPrepDraft() *Draft {
	d := newDraft(recipe.PrepSpecs)
	for k, v := range map[string]string{"solute": "NaCl", "concentration_unit": "mol/L", "charged_form": "NaCl", "stock_unit": "mol/L"} {
		d.Text[k] = v
	}
	d.Num["concentration"], d.Num["final_volume_mL"], d.Num["temp_C"] = 0.1, 1000, 20
	return d
}

// FromPrep makes the draft that shows p; a stock unit is kept ready for the stock choice.
func FromPrep(p recipe.Prep) *Draft {
	d := newDraft(recipe.PrepSpecs)
	recipe.PrepFields.ToForm(&p, &d.Form)
	if d.Text["stock_unit"] == "" {
		d.Text["stock_unit"] = string(prep.MolPerL)
	}
	return d
}

// Prep checks the draft as the CLI would check the same preparation file.
func (d *Draft) Prep() (recipe.Prep, error) { return recipe.DecodePrep(d.JSON()) }

// PrepKnown reports whether name is an input of the preparation form: a key of the
// preparation table that holds a value.
func PrepKnown(name string) bool {
	s, ok := recipe.PrepSpecs.Lookup(name)
	return ok && s.Kind != recipe.Object && !s.Kind.Fixed()
}

// prepShareKey starts the URL fragment that carries a preparation.
const prepShareKey = "#prep="

// PrepFragment is the URL fragment that carries p: "#prep=" and its JSON in unpadded
// base64url. A fragment never leaves the browser in a request.
func PrepFragment(p recipe.Prep) string {
	return prepShareKey + base64.RawURLEncoding.EncodeToString(p.Encode())
}

// PrepFromFragment reads a preparation from a fragment made by PrepFragment; ok is false
// when the fragment carries none.
func PrepFromFragment(hash string) (p recipe.Prep, ok bool, err error) {
	if !strings.HasPrefix(hash, prepShareKey) {
		return recipe.Prep{}, false, nil
	}
	b, err := base64.RawURLEncoding.DecodeString(strings.TrimRight(hash[len(prepShareKey):], "="))
	if err != nil {
		return recipe.Prep{}, true, &unit.FieldError{Field: "link", Value: "#prep=…",
			Allowed: "a link made by Saltcast's share button (this one is cut short or changed)"}
	}
	p, err = recipe.DecodePrep(b)
	return p, true, err
}

// Label is the text of one stock-bottle label.
type Label struct {
	Title         string // "Potassium chloride"
	Formula       string // "KCl"
	Concentration string // as asked: "1.5 mol/L"
	Also          string // the same in two other units
	Made          string // "223.6 g KCl made up to 2000 mL at 20 °C"
	Date, By      string
	Keep          string // "Keep above 6 °C" or "Clear down to 0 °C"
	Hazard        string // the compound's hazard note, which ends by pointing to the SDS
	Oxidizer      bool
}

// LabelFor writes the label of a worked preparation. by and date are as typed (the date is
// printed as given; the screen fills today's ISO date).
func LabelFor(res recipe.PrepResult, by, date string, u Units) Label {
	r := res.Result
	l := Label{Title: titleCase(r.SoluteName), Formula: r.SoluteID, Date: date, By: by, Hazard: r.Compound.Hazard,
		Oxidizer: r.Compound.Oxidizer}
	l.Concentration = unit.FormatCompact(r.Concentration, 6) + " " + string(r.Unit)
	var also []string
	for _, x := range []struct {
		u prep.Unit
		v float64
		d bool
	}{{prep.MolPerL, r.MolPerL, r.HasDensity}, {prep.GPerL, r.GPerL, r.HasDensity}, {prep.PctWW, r.PctWW, true}, {prep.MolPerKg, r.MolPerKg, true}} {
		if x.u != r.Unit && x.d && len(also) < 2 {
			also = append(also, unit.FormatCompact(x.v, 4)+" "+string(x.u))
		}
	}
	l.Also = strings.Join(also, " · ")
	mass := func(g float64) string { return unit.FormatNumber(MassFromG(g, u), 4) + " " + u.Mass }
	var amount string
	switch r.Amount {
	case prep.ByVolume:
		amount = "made up to " + unit.FormatCompact(wire.RoundSig(VolumeFromML(r.AmountValue, u), 6), 6) + " " + u.VolumeSymbol() +
			" at " + TempText(r.TempC, u)
	case prep.ByMass:
		amount = mass(r.AmountValue) + " of solution"
	default:
		amount = "in " + mass(r.AmountValue) + " of water"
	}
	if r.HasStock {
		l.Made = "Diluted from " + unit.FormatCompact(res.Recipe.StockConcentration.Value, 6) + " " + res.Recipe.StockUnit + " stock, " + amount
	} else {
		form := r.Form
		if r.PurityPct < 100 {
			form += " (" + unit.FormatCompact(r.PurityPct, 4) + " %)"
		}
		l.Made = mass(r.FormG) + " " + form + ", " + amount
	}
	switch {
	case r.HasKeepAbove:
		l.Keep = "Keep above " + unit.FormatCompact(math.Ceil(TempFromC(r.KeepAboveC, u)), 4) + " " + u.TempSymbol()
		if r.HasFreezingPoint && r.FreezingPointC+prep.StorageMarginK >= r.KeepAboveC {
			l.Keep += " (freezes at " + TempText(r.FreezingPointC, u) + ")"
		}
	case r.HasWarmLimit:
		l.Keep = "Keep below " + unit.FormatCompact(math.Floor(TempFromC(r.CrystallizesAbove, u)), 4) + " " + u.TempSymbol()
	default:
		l.Keep = "Clear down to " + unit.FormatCompact(TempFromC(r.ClearDownToC, u), 4) + " " + u.TempSymbol() + "; do not freeze"
	}
	return l
}

func titleCase(s string) string {
	if s == "" {
		return s
	}
	return strings.ToUpper(s[:1]) + s[1:]
}
