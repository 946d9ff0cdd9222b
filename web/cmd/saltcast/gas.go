package main

import (
	"strconv"
	"strings"
	"unicode/utf8"

	"saltcast/core/wire"
)

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
