package main

import (
	"io"
	"strconv"
	"strings"
	"unicode/utf8"

	"saltcast/core/unit"
	"saltcast/core/wire"
	"saltcast/web/api"
)

// gasUsage is printed by `saltcast gas --help`.
const gasUsage = `saltcast gas: dissolved gases in water

  saltcast gas [--gas O2] --temp-C T [--salinity S] [--pressure-kPa P | --pressure P --pressure-unit U | --altitude-m H]
               [--method benson-krause|garcia-gordon] [--measured-mg-per-L X] [--co2-ppm C]
      saturation of a gas (O2, N2, Ar, CO2, CH4) from water-saturated air, as JSON;
      O2 by Benson & Krause 1984 (or Garcia & Gordon 1992), CO2 by Weiss 1974, the others by Henry's law.
      --measured-mg-per-L adds percent_saturation. Pressure units: kPa, hPa, mbar, mmHg, Torr, inHg, atm.
      Use the station pressure (what a barometer on site reads), not the sea-level value of a weather report.

  saltcast gas outgas --from-C T1 --to-C T2 [--pressure-kPa P] [--heat-pressure-kPa P2] [--co2-ppm C]
      gas released per litre of air-saturated water heated from T1 to T2, and the bubble temperature.

  saltcast gas table [--temp-from-C 0] [--temp-to-C 40] [--temp-step-C 1] [--columns pressure_kPa|salinity]
               [--values "101.325;90;80"] [--salinity S | --pressure-kPa P] [--method ...] [--format json|text]
      oxygen saturation field table, mg/L.

Numbers accept a decimal comma (12,5). Flags map to query keys: --temp-C is temp_C.
Errors go to standard error with exit status 2.
`

// runGas runs `saltcast gas ...`; args are the words after "gas". It writes JSON (or, for
// `table --format text`, a text table) to stdout and returns the exit status: 0 on success, 2
// for a usage or input error (message on stderr), 1 if Saltcast itself failed.
func runGas(args []string, stdout, stderr io.Writer) int {
	sub := ""
	if len(args) > 0 && !strings.HasPrefix(args[0], "-") {
		sub, args = args[0], args[1:]
	}
	switch sub {
	case "", "outgas", "table":
	case "help":
		io.WriteString(stdout, gasUsage)
		return 0
	default:
		return gasFail(stderr, &unit.FieldError{Field: "command", Value: sub, Allowed: "gas, gas outgas or gas table (see saltcast gas --help)"})
	}
	p, help, err := flags(args, "see saltcast gas --help")
	if help {
		io.WriteString(stdout, gasUsage)
		return 0
	}
	if err != nil {
		return gasFail(stderr, err)
	}
	var out []byte
	switch sub {
	case "":
		out, err = api.Gas(p)
	case "outgas":
		out, err = api.Outgas(p)
	case "table":
		format := p["format"]
		delete(p, "format")
		if format != "" && format != "json" && format != "text" {
			return gasFail(stderr, &unit.FieldError{Field: "format", Value: format, Allowed: "json or text"})
		}
		out, err = api.GasTable(p)
		if err == nil && format == "text" {
			out, err = gasTableText(out)
		}
	}
	if err != nil {
		return gasFail(stderr, err)
	}
	stdout.Write(out)
	if len(out) == 0 || out[len(out)-1] != '\n' {
		io.WriteString(stdout, "\n")
	}
	return 0
}

func gasFail(stderr io.Writer, err error) int {
	err = asFlags(err)
	io.WriteString(stderr, "saltcast gas: "+err.Error()+"\n")
	if api.IsInputError(err) {
		return 2
	}
	return 1
}

// gasTableText renders GasTable's JSON as an aligned text table for printing.
func gasTableText(js []byte) ([]byte, error) {
	v, err := wire.Decode(js)
	if err != nil {
		return nil, err
	}
	get := func(v wire.Value, k string) wire.Value { m, _ := v.Get(k); return m }
	kind := get(v, "column_kind").Text
	var b strings.Builder
	b.WriteString("Oxygen saturation, mg/L, water-saturated air (" + get(v, "method").Text + ")\n")
	if kind == "salinity" {
		b.WriteString("pressure " + get(v, "pressure_kPa").Text + " kPa; columns: salinity\n")
	} else {
		b.WriteString("salinity " + get(v, "salinity").Text + "; columns: pressure, kPa\n")
	}
	const w = 9
	pad := func(s string) string {
		if n := utf8.RuneCountInString(s); n < w {
			return strings.Repeat(" ", w-n) + s
		}
		return " " + s
	}
	b.WriteString(pad("°C") + "  ")
	for _, c := range get(v, "columns").Items {
		b.WriteString(pad(c.Text))
	}
	b.WriteString("\n")
	for _, r := range get(v, "rows").Items {
		b.WriteString(pad(get(r, "temp_C").Text) + "  ")
		for _, c := range get(r, "saturation_mg_per_L").Items {
			b.WriteString(pad(strconv.FormatFloat(c.Num, 'f', 2, 64)))
		}
		b.WriteString("\n")
	}
	for _, w := range get(v, "warnings").Items {
		b.WriteString("warning: " + w.Text + "\n")
	}
	b.WriteString("source: " + get(v, "source").Text + "\n")
	return []byte(b.String()), nil
}
