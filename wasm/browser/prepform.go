package main

import (
	"encoding/base64"
	"errors"
	"math"
	"strings"

	"saltcast/core/prep"
	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// The preparation screen's form, without the DOM: the text of each input, which amount is
// given and whether a stock is diluted. Inputs are named like the recipe keys, except the
// amount, whose one input ("amount") means final_volume_mL, final_mass_g or solvent_g.
// Volumes and masses are mL and g (volumetric glassware is metric); temperatures follow the
// unit switch.

// prepTemps are the inputs holding temperatures.
var prepTemps = map[string]bool{"temp_C": true, "store_at_C": true}

// prepNumbers are the number inputs of the form.
var prepNumbers = []string{"concentration", "amount", "temp_C", "purity_pct", "stock_concentration", "store_at_C"}

// PrepForm is what the preparation form holds.
type PrepForm struct {
	Text      map[string]string // input text by name
	Amount    string            // "final_volume_mL", "final_mass_g" or "solvent_g"
	FromStock bool
}

// NewPrepForm is the form of a first visit: 1 L of 0.1 mol/L NaCl at 20 °C (invented).
func NewPrepForm() PrepForm {
	return PrepForm{Text: map[string]string{"solute": "NaCl", "concentration": "0.1", "concentration_unit": "mol/L",
		"amount": "1000", "temp_C": "20", "charged_form": "NaCl", "stock_unit": "mol/L"}, Amount: "final_volume_mL"}
}

// Prep reads the form into a checked preparation recipe. Errors name the input they belong
// to (the amount's key is "amount"); the recipe is only valid when there are none.
func (f PrepForm) Prep(u Units) (recipe.Prep, map[string]error) {
	errs := map[string]error{}
	p := recipe.Prep{Format: recipe.CurrentFormat}
	nums := map[string]recipe.Opt{}
	for _, name := range prepNumbers {
		text := strings.TrimSpace(f.Text[name])
		if text == "" {
			continue
		}
		v, err := unit.ParseNumber(name, text)
		if err == nil && prepTemps[name] && u.Temp != "C" {
			// 12 significant digits drop the binary noise of the conversion (39.2 °F is
			// 4 °C, not 4.000000000000002), far below any meaningful temperature.
			v, err = unit.ToCelsius(name, v, u.Temp)
			v = wire.RoundSig(v, 12)
		}
		if err != nil {
			errs[name] = err
			continue
		}
		nums[name] = recipe.Some(v)
	}
	p.Name, p.Notes = f.Text["name"], f.Text["notes"]
	p.Solute = strings.TrimSpace(f.Text["solute"])
	p.Concentration = nums["concentration"].Value
	p.ConcentrationUnit = f.Text["concentration_unit"]
	p.TempC, p.StoreAtC = nums["temp_C"], nums["store_at_C"]
	switch f.Amount {
	case "final_mass_g":
		p.FinalMassG = nums["amount"]
	case "solvent_g":
		p.SolventG = nums["amount"]
	default:
		p.FinalVolumeML = nums["amount"]
	}
	if f.FromStock {
		p.StockConcentration, p.StockUnit = nums["stock_concentration"], f.Text["stock_unit"]
		if !p.StockConcentration.Set && errs["stock_concentration"] == nil {
			errs["stock_concentration"] = &unit.FieldError{Field: "stock_concentration", Allowed: "the stock's concentration"}
		}
	} else {
		p.ChargedForm, p.PurityPct = f.Text["charged_form"], nums["purity_pct"]
	}
	if _, ok := nums["concentration"]; !ok && errs["concentration"] == nil {
		errs["concentration"] = &unit.FieldError{Field: "concentration", Allowed: "the concentration to make up"}
	}
	if _, ok := nums["amount"]; !ok && errs["amount"] == nil {
		errs["amount"] = &unit.FieldError{Field: "amount", Allowed: "how much to make"}
	}
	if len(errs) > 0 {
		return recipe.Prep{}, errs
	}
	// The decoder's checks, with their messages: ranges, units, combinations.
	checked, err := recipe.DecodePrep(p.Encode())
	if err != nil {
		errs[PrepInput(err)] = err
		return recipe.Prep{}, errs
	}
	return checked, nil
}

// PrepInput names the input an error belongs to.
func PrepInput(err error) string {
	var fe *unit.FieldError
	if !errors.As(err, &fe) {
		return ""
	}
	switch fe.Field {
	case "final_volume_mL", "final_mass_g", "solvent_g":
		return "amount"
	}
	return fe.Field
}

// FormFromPrep shows a preparation recipe in the form, temperatures in u.
func FormFromPrep(p recipe.Prep, u Units) PrepForm {
	f := PrepForm{Text: map[string]string{"solute": p.Solute, "concentration": exact(p.Concentration),
		"concentration_unit": p.ConcentrationUnit, "name": p.Name, "notes": p.Notes, "charged_form": p.ChargedForm,
		"stock_unit": string(prep.MolPerL)}, Amount: "final_volume_mL"}
	opt := func(name string, o recipe.Opt) {
		if !o.Set {
			return
		}
		if prepTemps[name] {
			f.Text[name] = editable(TempFromC(o.Value, u))
			return
		}
		f.Text[name] = exact(o.Value)
	}
	switch {
	case p.FinalMassG.Set:
		f.Amount = "final_mass_g"
		opt("amount", p.FinalMassG)
	case p.SolventG.Set:
		f.Amount = "solvent_g"
		opt("amount", p.SolventG)
	default:
		opt("amount", p.FinalVolumeML)
	}
	opt("temp_C", p.TempC)
	opt("store_at_C", p.StoreAtC)
	opt("purity_pct", p.PurityPct)
	if p.StockConcentration.Set {
		f.FromStock = true
		opt("stock_concentration", p.StockConcentration)
		f.Text["stock_unit"] = p.StockUnit
	}
	return f
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
	amount := unit.FormatCompact(r.AmountValue, 6)
	switch r.Amount {
	case prep.ByVolume:
		amount = "made up to " + amount + " mL at " + TempText(r.TempC, u)
	case prep.ByMass:
		amount = amount + " g of solution"
	default:
		amount = "in " + amount + " g of water"
	}
	if r.HasStock {
		l.Made = "Diluted from " + unit.FormatCompact(res.Recipe.StockConcentration.Value, 6) + " " + res.Recipe.StockUnit + " stock, " + amount
	} else {
		form := r.Form
		if r.PurityPct < 100 {
			form += " (" + unit.FormatCompact(r.PurityPct, 4) + " %)"
		}
		l.Made = unit.FormatNumber(r.FormG, 4) + " g " + form + ", " + amount
	}
	switch {
	case r.HasKeepAbove:
		l.Keep = "Keep above " + unit.FormatCompact(math.Ceil(TempFromC(r.KeepAboveC, u)), 4) + " " + u.TempSymbol()
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
