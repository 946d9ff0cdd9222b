package api

import (
	"errors"
	"strconv"
	"strings"

	"saltcast/core/gas"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Gas answers a dissolved-gas saturation query: the concentration of a gas in water in
// equilibrium with water-saturated air.
//
// Keys: gas (O2 by default; N2, Ar, CO2, CH4), temp_C (required), salinity (default 0), the
// pressure as pressure_kPa (default 101.325) or as pressure with pressure_unit (kPa, hPa,
// mbar, mmHg, Torr, inHg, atm) or as altitude_m (standard atmosphere), method (O2 only:
// "benson-krause", the default, or "garcia-gordon"), co2_ppm (CO2 in the air, default 420) and
// measured_mg_per_L (adds percent_saturation). Unknown keys are refused.
//
// The output starts with the keys gas, temp_C, salinity, pressure_kPa, saturation_mg_per_L,
// saturation_umol_per_kg, method, source and warnings; for O2 it adds the other method's value
// and the difference.
func Gas(p Params) ([]byte, error) {
	b, err := gasQuery(p)
	return b, gasRawValue(err, p)
}

func gasQuery(p Params) ([]byte, error) {
	if err := knownKeys(p, "gas", "temp_C", "salinity", "pressure_kPa", "pressure", "pressure_unit",
		"altitude_m", "method", "co2_ppm", "measured_mg_per_L"); err != nil {
		return nil, err
	}
	g, err := gas.Lookup(gasString(p, "gas", "O2"))
	if err != nil {
		return nil, err
	}
	tempC, err := gasRequired(p, "temp_C")
	if err != nil {
		return nil, err
	}
	salinity, err := gasOptional(p, "salinity", 0)
	if err != nil {
		return nil, err
	}
	kPa, pressureFrom, err := gasPressure(p, "pressure_kPa")
	if err != nil {
		return nil, err
	}
	co2PPM, err := gasOptional(p, "co2_ppm", gas.DefaultCO2PPM)
	if err != nil {
		return nil, err
	}
	if _, ok := p["co2_ppm"]; ok && g.ID != "CO2" {
		return nil, &unit.FieldError{Field: "co2_ppm", Value: p["co2_ppm"], Allowed: "only with gas CO2"}
	}
	if _, ok := p["method"]; ok && g.ID != "O2" {
		return nil, &unit.FieldError{Field: "method", Value: p["method"], Allowed: "only with gas O2"}
	}
	c := gas.Conditions{TempC: tempC, Salinity: salinity, PressureKPa: kPa}

	var (
		mgPerL, umolPerKg float64
		method, source    string
		warnings          []string
		second            *gas.Oxygen
	)
	switch g.ID {
	case "O2":
		m, err := gasMethod(p["method"])
		if err != nil {
			return nil, err
		}
		o, err := gas.OxygenSaturation(c, m)
		if err != nil {
			return nil, err
		}
		other := gas.GarciaGordon
		if m == gas.GarciaGordon {
			other = gas.BensonKrause
		}
		o2, err := gas.OxygenSaturation(c, other)
		if err != nil {
			return nil, err
		}
		second = &o2
		mgPerL, umolPerKg, method, source, warnings = o.MgPerL, o.UmolPerKg, o.Method, o.Source, o.Warnings
	case "CO2":
		d, err := gas.CO2Saturation(c, co2PPM)
		if err != nil {
			return nil, err
		}
		mgPerL, umolPerKg, method, source, warnings = d.MgPerL, d.UmolPerKg, d.Method, d.Source, d.Warnings
		if _, ok := p["co2_ppm"]; !ok {
			warnings = append(warnings, gasCO2Default)
		}
	default:
		if salinity != 0 {
			return nil, &unit.FieldError{Field: "salinity", Value: p["salinity"],
				Allowed: "0 for " + g.ID + " (no sourced salinity correction here; O2 and CO2 take salinity)"}
		}
		d, err := gas.AirSaturated(g, tempC, kPa, co2PPM)
		if err != nil {
			return nil, err
		}
		mgPerL, umolPerKg, method, source, warnings = d.MgPerL, d.UmolPerKg, d.Method, d.Source, d.Warnings
	}

	var e wire.Encoder
	e.BeginObject()
	e.Key("gas").String(g.ID)
	e.Key("temp_C").Round(tempC, sig)
	e.Key("salinity").Round(salinity, sig)
	e.Key("pressure_kPa").Round(kPa, sig)
	e.Key("saturation_mg_per_L").Round(mgPerL, sig)
	e.Key("saturation_umol_per_kg").Round(umolPerKg, sig)
	e.Key("method").String(method)
	e.Key("source").String(source)
	gasStrings(&e, "warnings", warnings)
	if raw, ok := p["measured_mg_per_L"]; ok {
		measured, err := unit.ParseNumber("measured_mg_per_L", raw)
		if err != nil {
			return nil, err
		}
		if measured < 0 || measured > gas.MeasuredMaxMgPerL {
			return nil, unit.NumberError("measured_mg_per_L", measured, "a measured concentration from 0 to 100 mg/L")
		}
		e.Key("measured_mg_per_L").Round(measured, sig)
		e.Key("percent_saturation").Round(100*measured/mgPerL, sig)
	}
	if second != nil {
		e.Key("second_method").String(second.Method)
		e.Key("second_saturation_mg_per_L").Round(second.MgPerL, sig)
		e.Key("second_saturation_umol_per_kg").Round(second.UmolPerKg, sig)
		e.Key("difference_mg_per_L").Round(second.MgPerL-mgPerL, sig)
	}
	if g.ID == "CO2" {
		e.Key("co2_ppm").Round(co2PPM, sig)
	}
	e.Key("pressure_from").String(pressureFrom)
	if tempC >= 50 {
		gasStrings(&e, "cautions", []string{gas.HotWaterCaution})
	}
	e.EndObject()
	return e.Bytes()
}

// Outgas answers "how much gas comes out of air-saturated water when it is heated".
//
// Keys: from_C and to_C (required), the saturation pressure as pressure_kPa (default 101.325),
// pressure with pressure_unit, or altitude_m; heat_pressure_kPa (the pressure while heating,
// default the same) and co2_ppm (default 420). Volumes are mL of dry gas per litre of water
// measured at from_C, at to_C and heat_pressure_kPa and at STP.
func Outgas(p Params) ([]byte, error) {
	b, err := gasOutgasQuery(p)
	return b, gasRawValue(err, p)
}

func gasOutgasQuery(p Params) ([]byte, error) {
	for _, k := range []string{"salinity", "salt"} {
		if v, ok := p[k]; ok {
			return nil, &unit.FieldError{Field: k, Value: v, Allowed: "nothing: outgassing is computed for fresh water only " +
				"(no sourced salting-out coefficients here); for a salt solution the fresh-water result is an upper estimate"}
		}
	}
	if err := knownKeys(p, "from_C", "to_C", "pressure_kPa", "pressure", "pressure_unit", "altitude_m",
		"heat_pressure_kPa", "co2_ppm"); err != nil {
		return nil, err
	}
	fromC, err := gasRequired(p, "from_C")
	if err != nil {
		return nil, err
	}
	toC, err := gasRequired(p, "to_C")
	if err != nil {
		return nil, err
	}
	kPa, pressureFrom, err := gasPressure(p, "pressure_kPa")
	if err != nil {
		return nil, err
	}
	heatKPa, err := gasOptional(p, "heat_pressure_kPa", kPa)
	if err != nil {
		return nil, err
	}
	if heatKPa == 0 {
		return nil, unit.NumberError("heat_pressure_kPa", 0, "a pressure from 1 to 1000 kPa")
	}
	co2PPM, err := gasOptional(p, "co2_ppm", gas.DefaultCO2PPM)
	if err != nil {
		return nil, err
	}
	o, err := gas.Outgas(gas.OutgasInput{FromC: fromC, ToC: toC, PressureKPa: kPa, HeatPressureKPa: heatKPa, CO2PPM: co2PPM})
	if err != nil {
		return nil, err
	}
	if _, ok := p["co2_ppm"]; !ok {
		o.Notes = append(o.Notes, gasCO2Default)
	}

	var e wire.Encoder
	e.BeginObject()
	e.Key("from_C").Round(fromC, sig)
	e.Key("to_C").Round(toC, sig)
	e.Key("pressure_kPa").Round(kPa, sig)
	e.Key("heat_pressure_kPa").Round(heatKPa, sig)
	e.Key("co2_ppm").Round(co2PPM, sig)
	e.Key("gases").BeginArray()
	for _, r := range o.Gases {
		e.BeginObject()
		e.Key("gas").String(r.Gas.ID)
		e.Key("dissolved_umol_per_L").Round(r.DissolvedUmolPerL, sig)
		e.Key("remaining_umol_per_L").Round(r.RemainingUmolPerL, sig)
		e.Key("released_umol_per_L").Round(r.ReleasedUmolPerL, sig)
		e.Key("released_mL_per_L").Round(r.ReleasedMLPerL, sig)
		e.Key("released_mL_STP_per_L").Round(r.ReleasedMLSTPPerL, sig)
		e.EndObject()
	}
	e.EndArray()
	e.Key("total_released_mL_per_L").Round(o.TotalMLPerL, sig)
	e.Key("total_released_mL_STP_per_L").Round(o.TotalMLSTPPerL, sig)
	if o.BubbleFound {
		e.Key("bubble_temp_C").Round(o.BubbleTempC, sig)
	} else {
		e.Key("bubble_temp_C").Null()
	}
	e.Key("volume_basis").String("mL of dry gas per litre of water measured at from_C; " +
		"released_mL_per_L at to_C and heat_pressure_kPa, released_mL_STP_per_L at 0 °C and 101.325 kPa")
	e.Key("method").String(o.Method)
	e.Key("source").String(o.Source)
	e.Key("pressure_from").String(pressureFrom)
	gasStrings(&e, "warnings", o.Warnings)
	gasStrings(&e, "notes", o.Notes)
	gasStrings(&e, "cautions", o.Cautions)
	e.EndObject()
	return e.Bytes()
}

// GasTable answers a printable oxygen-saturation field table (mg/L): rows of temperature,
// columns of pressure (kPa) at a fixed salinity or of salinity at a fixed pressure.
//
// Keys: temp_from_C (default 0), temp_to_C (default 40), temp_step_C (default 1), columns
// ("pressure_kPa", the default, or "salinity"), values (column values separated by ';' or
// spaces, since ',' is a decimal comma; defaults 101.325;95;90;85;80;75;70 kPa or
// 0;10;20;30;35;40), salinity (fixed, for pressure columns, default 0), pressure_kPa (fixed,
// for salinity columns, default 101.325) and method.
func GasTable(p Params) ([]byte, error) {
	b, err := gasTableQuery(p)
	return b, gasRawValue(err, p)
}

func gasTableQuery(p Params) ([]byte, error) {
	if err := knownKeys(p, "temp_from_C", "temp_to_C", "temp_step_C", "columns", "values",
		"salinity", "pressure_kPa", "method"); err != nil {
		return nil, err
	}
	from, err := gasOptional(p, "temp_from_C", 0)
	if err != nil {
		return nil, err
	}
	to, err := gasOptional(p, "temp_to_C", 40)
	if err != nil {
		return nil, err
	}
	step, err := gasOptional(p, "temp_step_C", 1)
	if err != nil {
		return nil, err
	}
	if to < from {
		return nil, unit.NumberError("temp_to_C", to, "a temperature not below temp_from_C")
	}
	temps, err := gas.Steps("temp_step_C", from, to, step)
	if err != nil {
		return nil, err
	}
	kind := gasString(p, "columns", gas.ColumnsPressure)
	m, err := gasMethod(p["method"])
	if err != nil {
		return nil, err
	}
	var fixed float64
	var defaults string
	switch kind {
	case gas.ColumnsPressure:
		if _, ok := p["pressure_kPa"]; ok {
			return nil, &unit.FieldError{Field: "pressure_kPa", Value: p["pressure_kPa"], Allowed: "only with columns=salinity; give the pressures in values"}
		}
		fixed, err = gasOptional(p, "salinity", 0)
		defaults = "101.325;95;90;85;80;75;70"
	case gas.ColumnsSalinity:
		if _, ok := p["salinity"]; ok {
			return nil, &unit.FieldError{Field: "salinity", Value: p["salinity"], Allowed: "only with columns=pressure_kPa; give the salinities in values"}
		}
		fixed, err = gasOptional(p, "pressure_kPa", gas.StdKPa)
		defaults = "0;10;20;30;35;40"
	default:
		return nil, &unit.FieldError{Field: "columns", Value: kind, Allowed: `"pressure_kPa" or "salinity"`}
	}
	if err != nil {
		return nil, err
	}
	cols, err := gasList("values", gasString(p, "values", defaults))
	if err != nil {
		return nil, err
	}
	t, err := gas.OxygenTable(temps, kind, cols, fixed, m)
	if err != nil {
		return nil, err
	}

	var e wire.Encoder
	e.BeginObject()
	e.Key("gas").String("O2")
	e.Key("column_kind").String(kind)
	e.Key("columns").BeginArray()
	for _, c := range cols {
		e.Round(c, sig)
	}
	e.EndArray()
	if kind == gas.ColumnsPressure {
		e.Key("salinity").Round(fixed, sig)
	} else {
		e.Key("pressure_kPa").Round(fixed, sig)
	}
	e.Key("rows").BeginArray()
	for i, tc := range t.TempsC {
		e.BeginObject()
		e.Key("temp_C").Round(tc, sig)
		e.Key("saturation_mg_per_L").BeginArray()
		for _, v := range t.MgPerL[i] {
			e.Round(v, sig)
		}
		e.EndArray()
		e.EndObject()
	}
	e.EndArray()
	e.Key("method").String(t.Method)
	e.Key("source").String(t.Source)
	gasStrings(&e, "warnings", t.Warnings)
	e.EndObject()
	return e.Bytes()
}

func gasString(p Params, key, def string) string {
	if v, ok := p[key]; ok && strings.TrimSpace(v) != "" {
		return strings.TrimSpace(v)
	}
	return def
}

func gasRequired(p Params, key string) (float64, error) {
	v, ok := p[key]
	if !ok {
		return 0, &unit.FieldError{Field: key, Value: "", Allowed: "a number (required)"}
	}
	return unit.ParseNumber(key, v)
}

func gasOptional(p Params, key string, def float64) (float64, error) {
	v, ok := p[key]
	if !ok {
		return def, nil
	}
	return unit.ParseNumber(key, v)
}

// gasPressure reads the barometric pressure from exactly one of key (kPa), pressure with
// pressure_unit, or altitude_m; with none it is one standard atmosphere. It also says where
// the value came from.
func gasPressure(p Params, key string) (kPa float64, from string, err error) {
	_, hasKPa := p[key]
	_, hasP := p["pressure"]
	_, hasUnit := p["pressure_unit"]
	_, hasAlt := p["altitude_m"]
	n := 0
	for _, b := range []bool{hasKPa, hasP, hasAlt} {
		if b {
			n++
		}
	}
	if n > 1 {
		field := "altitude_m"
		if !hasAlt {
			field = "pressure"
		}
		return 0, "", &unit.FieldError{Field: field, Value: p[field], Allowed: "one of " + key + ", pressure (with pressure_unit) or altitude_m"}
	}
	if hasUnit && !hasP {
		return 0, "", &unit.FieldError{Field: "pressure_unit", Value: p["pressure_unit"], Allowed: "only together with pressure"}
	}
	switch {
	case hasP:
		v, err := unit.ParseNumber("pressure", p["pressure"])
		if err != nil {
			return 0, "", err
		}
		u := gasString(p, "pressure_unit", "kPa")
		kPa, err := gas.PressureKPa("pressure", v, u)
		if err != nil {
			return 0, "", err
		}
		return kPa, "barometer reading " + unit.FormatCompact(v, 8) + " " + u, nil
	case hasAlt:
		h, err := unit.ParseNumber("altitude_m", p["altitude_m"])
		if err != nil {
			return 0, "", err
		}
		kPa, err := gas.AltitudeKPa(h)
		if err != nil {
			return 0, "", err
		}
		return kPa, "altitude " + unit.FormatCompact(h, 6) + " m, U.S. Standard Atmosphere 1976 (a yearly average; a barometer reading is better)", nil
	case hasKPa:
		v, err := unit.ParseNumber(key, p[key])
		if err != nil {
			return 0, "", err
		}
		return v, "given", nil
	}
	return gas.StdKPa, "default: one standard atmosphere", nil
}

// gasMethod maps the method names users type to the gas package's method names.
func gasMethod(s string) (string, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "benson-krause", "bk", strings.ToLower(gas.BensonKrause):
		return gas.BensonKrause, nil
	case "garcia-gordon", "gg", strings.ToLower(gas.GarciaGordon):
		return gas.GarciaGordon, nil
	}
	return "", &unit.FieldError{Field: "method", Value: s, Allowed: `"benson-krause" or "garcia-gordon"`}
}

// gasList reads numbers separated by ';' or white space (',' is a decimal comma).
func gasList(field, s string) ([]float64, error) {
	parts := strings.FieldsFunc(s, func(r rune) bool { return r == ';' || r == ' ' || r == '\t' })
	if len(parts) == 0 {
		return nil, &unit.FieldError{Field: field, Value: s, Allowed: "numbers separated by ';' or spaces"}
	}
	out := make([]float64, 0, len(parts))
	for _, part := range parts {
		v, err := unit.ParseNumber(field, part)
		if err != nil {
			return nil, err
		}
		out = append(out, v)
	}
	return out, nil
}

func gasStrings(e *wire.Encoder, key string, list []string) {
	e.Key(key).BeginArray()
	for _, s := range list {
		e.String(s)
	}
	e.EndArray()
}

// gasRawValue puts the text the user typed back into a *unit.FieldError raised deeper down
// (where the value was already a float64), so the message quotes "45", not "45.0000".
func gasRawValue(err error, p Params) error {
	var fe *unit.FieldError
	if errors.As(err, &fe) {
		if raw, ok := p[fe.Field]; ok {
			fe.Value = raw
		}
	}
	return err
}

// gasCO2Default is said whenever the CO2 content of the air was not given.
var gasCO2Default = "CO2 in air taken as " + strconv.FormatFloat(gas.DefaultCO2PPM, 'f', -1, 64) +
	" ppm, about the global mean of " + strconv.Itoa(gas.DefaultCO2Year) +
	" (NOAA; from memory); it rises about 2.5 ppm a year and is higher indoors: set co2_ppm for your site"
