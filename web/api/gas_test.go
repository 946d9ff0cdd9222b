package api

import (
	"errors"
	"math"
	"strings"
	"testing"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

func decodeGas(t *testing.T, b []byte, err error) wire.Value {
	t.Helper()
	if err != nil {
		t.Fatalf("error: %v", err)
	}
	v, err := wire.Decode(b)
	if err != nil {
		t.Fatalf("output is not valid JSON: %v\n%s", err, b)
	}
	return v
}

func num(t *testing.T, v wire.Value, key string) float64 {
	t.Helper()
	m, ok := v.Get(key)
	if !ok || m.Kind != wire.Number {
		t.Fatalf("key %q missing or not a number in %+v", key, v)
	}
	return m.Num
}

func TestGasKeysInOrder(t *testing.T) {
	b, err := Gas(Params{"gas": "O2", "temp_C": "20", "salinity": "0", "pressure_kPa": "101.325"})
	v := decodeGas(t, b, err)
	want := []string{"gas", "temp_C", "salinity", "pressure_kPa", "saturation_mg_per_L",
		"saturation_umol_per_kg", "method", "source", "warnings"}
	if len(v.Members) < len(want) {
		t.Fatalf("too few keys: %s", b)
	}
	for i, k := range want {
		if v.Members[i].Key != k {
			t.Errorf("key %d = %q, want %q (%s)", i, v.Members[i].Key, k, b)
		}
	}
	// Benson & Krause at 20 °C, S 0, 1 atm: 9.092 mg/L (Benson & Krause 1984 equation, derived;
	// the Standard Methods 4500-O table prints the same, from memory).
	if got := num(t, v, "saturation_mg_per_L"); math.Abs(got-9.092) > 0.0015 {
		t.Errorf("saturation_mg_per_L = %v, want 9.092", got)
	}
	if _, ok := v.Get("percent_saturation"); ok {
		t.Errorf("percent_saturation present without a measurement")
	}
	if w, _ := v.Get("warnings"); w.Kind != wire.Array || len(w.Items) != 0 {
		t.Errorf("warnings = %+v, want []", w)
	}
}

func TestGasMeasuredAndSecondMethod(t *testing.T) {
	// Garcia & Gordon check value 6.315 mL/L at 10 °C, S 35 → × 1.42905 = 9.024 mg/L.
	b, err := Gas(Params{"temp_C": "10", "salinity": "35", "measured_mg_per_L": "4,512", "method": "garcia-gordon"})
	v := decodeGas(t, b, err)
	if got := num(t, v, "saturation_mg_per_L"); math.Abs(got-6.315*1.42905) > 0.002 {
		t.Errorf("saturation_mg_per_L = %v, want %.3f", got, 6.315*1.42905)
	}
	if got := num(t, v, "saturation_umol_per_kg"); math.Abs(got-274.610) > 0.0015 {
		t.Errorf("saturation_umol_per_kg = %v, want 274.610 (Garcia & Gordon 1992 check value)", got)
	}
	if got := num(t, v, "percent_saturation"); math.Abs(got-50) > 0.1 {
		t.Errorf("percent_saturation = %v, want 50", got)
	}
	if d := num(t, v, "difference_mg_per_L"); math.Abs(d) > 0.01 {
		t.Errorf("difference_mg_per_L = %v, want within 0.01", d)
	}
}

func TestGasPressureForms(t *testing.T) {
	// 1 atm written four ways gives the same answer.
	for _, p := range []Params{
		{"temp_C": "25"},
		{"temp_C": "25", "pressure_kPa": "101.325"},
		{"temp_C": "25", "pressure": "760", "pressure_unit": "Torr"},
		{"temp_C": "25", "pressure": "1013,25", "pressure_unit": "hPa"},
		{"temp_C": "25", "altitude_m": "0"},
	} {
		b, err := Gas(p)
		v := decodeGas(t, b, err)
		// 8.263 mg/L at 25 °C (Benson & Krause 1984 equation, derived; Standard Methods 4500-O
		// table, from memory).
		if got := num(t, v, "saturation_mg_per_L"); math.Abs(got-8.263) > 0.0015 {
			t.Errorf("%v: saturation_mg_per_L = %v, want 8.263", p, got)
		}
	}
}

func TestGasOtherGases(t *testing.T) {
	for _, id := range []string{"N2", "Ar", "CH4", "co2"} {
		b, err := Gas(Params{"gas": id, "temp_C": "20"})
		v := decodeGas(t, b, err)
		if got := num(t, v, "saturation_mg_per_L"); !(got >= 0) {
			t.Errorf("%s: saturation_mg_per_L = %v", id, got)
		}
	}
	// Weiss (1974): K0(25 °C, S 0) = 0.03397 mol/(L·atm); 420 ppm, (1 − 0.031262) atm dry air.
	b, err := Gas(Params{"gas": "CO2", "temp_C": "25", "co2_ppm": "420"})
	v := decodeGas(t, b, err)
	want := 0.03397 * 420e-6 * (1 - 0.031262) * 44.0095 * 1000
	if got := num(t, v, "saturation_mg_per_L"); math.Abs(got-want) > 0.002 {
		t.Errorf("CO2 saturation_mg_per_L = %v, want %.4f", got, want)
	}
}

func TestGasErrorsNameTheField(t *testing.T) {
	tests := []struct {
		p     Params
		field string
	}{
		{Params{}, "temp_C"},
		{Params{"temp_C": "abc"}, "temp_C"},
		{Params{"temp_C": "1.234,5"}, "temp_C"},
		{Params{"temp_C": "70"}, "temp_C"},
		{Params{"temp_C": "20", "salinity": "50"}, "salinity"},
		{Params{"temp_C": "20", "salinity": "4,5e1"}, "salinity"},
		{Params{"temp_C": "20", "pressure_kPa": "-3"}, "pressure_kPa"},
		{Params{"temp_C": "20", "pressure": "30", "pressure_unit": "psi"}, "pressure_unit"},
		{Params{"temp_C": "20", "pressure_unit": "hPa"}, "pressure_unit"},
		{Params{"temp_C": "20", "pressure_kPa": "100", "altitude_m": "200"}, "altitude_m"},
		{Params{"temp_C": "20", "altitude_m": "20000"}, "altitude_m"},
		{Params{"temp_C": "20", "gas": "H2"}, "gas"},
		{Params{"temp_C": "20", "method": "winkler"}, "method"},
		{Params{"temp_C": "20", "gas": "N2", "method": "gg"}, "method"},
		{Params{"temp_C": "20", "gas": "N2", "salinity": "35"}, "salinity"},
		{Params{"temp_C": "20", "gas": "O2", "co2_ppm": "400"}, "co2_ppm"},
		{Params{"temp_C": "20", "measured_mg_per_L": "-1"}, "measured_mg_per_L"},
		{Params{"temp_C": "20", "temperature": "20"}, "temperature"},
	}
	for _, tt := range tests {
		_, err := Gas(tt.p)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.field {
			t.Errorf("Gas(%v) error = %v, want a FieldError for %q", tt.p, err, tt.field)
		} else if raw, ok := tt.p[tt.field]; ok && fe.Value != raw {
			t.Errorf("Gas(%v) error quotes %q, want the typed %q", tt.p, fe.Value, raw)
		}
		if !IsInputError(err) {
			t.Errorf("Gas(%v): IsInputError = false", tt.p)
		}
	}
}

func TestGasWarnsOutsideRange(t *testing.T) {
	b, err := Gas(Params{"temp_C": "45"})
	v := decodeGas(t, b, err)
	if w, _ := v.Get("warnings"); len(w.Items) == 0 {
		t.Errorf("no warning at 45 °C: %s", b)
	}
}

func TestOutgasService(t *testing.T) {
	b, err := Outgas(Params{"from_C": "20", "to_C": "80"})
	v := decodeGas(t, b, err)
	gases, _ := v.Get("gases")
	if len(gases.Items) != 5 {
		t.Fatalf("gases: %s", b)
	}
	var sum float64
	for _, g := range gases.Items {
		sum += num(t, g, "released_mL_per_L")
	}
	if total := num(t, v, "total_released_mL_per_L"); math.Abs(total-sum) > 1e-3 {
		t.Errorf("total %v ≠ sum %v", total, sum)
	}
	if c, _ := v.Get("cautions"); len(c.Items) == 0 || !strings.Contains(c.Items[0].Text, "SDS") {
		t.Errorf("no hot-water caution at 80 °C: %s", b)
	}
	if bt := num(t, v, "bubble_temp_C"); bt != 20 {
		t.Errorf("bubble_temp_C = %v, want 20 (saturated at the same pressure)", bt)
	}

	b, err = Outgas(Params{"from_C": "20", "to_C": "90", "heat_pressure_kPa": "600"})
	v = decodeGas(t, b, err)
	if bt, _ := v.Get("bubble_temp_C"); bt.Kind != wire.Null {
		t.Errorf("bubble_temp_C at 600 kPa = %+v, want null", bt)
	}

	for _, tt := range []struct {
		p     Params
		field string
	}{
		{Params{"to_C": "80"}, "from_C"},
		{Params{"from_C": "20"}, "to_C"},
		{Params{"from_C": "80", "to_C": "20"}, "to_C"},
		{Params{"from_C": "20", "to_C": "80", "heat_pressure_kPa": "0"}, "heat_pressure_kPa"},
		{Params{"from_C": "20", "to_C": "80", "co2_ppm": "-1"}, "co2_ppm"},
		{Params{"from_C": "20", "to_C": "80", "salinity": "35"}, "salinity"},
	} {
		_, err := Outgas(tt.p)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.field {
			t.Errorf("Outgas(%v) error = %v, want a FieldError for %q", tt.p, err, tt.field)
		}
	}
}

func TestGasTableService(t *testing.T) {
	b, err := GasTable(Params{"temp_from_C": "0", "temp_to_C": "30", "temp_step_C": "10", "values": "101.325; 90 80"})
	v := decodeGas(t, b, err)
	rows, _ := v.Get("rows")
	if len(rows.Items) != 4 {
		t.Fatalf("rows: %s", b)
	}
	// 20 °C row, 80 kPa column: 7.135 mg/L (derived: Benson & Krause 1984 with the Standard
	// Methods 4500-O pressure correction), 2 decimals.
	cells, _ := rows.Items[2].Get("saturation_mg_per_L")
	if got := cells.Items[2].Num; math.Abs(got-7.135) > 0.006 {
		t.Errorf("table[20 °C][80 kPa] = %v, want 7.14", got)
	}
	b, err = GasTable(Params{"columns": "salinity", "temp_to_C": "10", "temp_step_C": "5"})
	v = decodeGas(t, b, err)
	cols, _ := v.Get("columns")
	if len(cols.Items) != 6 {
		t.Errorf("default salinity columns: %s", b)
	}
	for _, tt := range []struct {
		p     Params
		field string
	}{
		{Params{"columns": "altitude"}, "columns"},
		{Params{"values": "90,5;80,5;x"}, "values"},
		{Params{"temp_step_C": "0"}, "temp_step_C"},
		{Params{"temp_from_C": "30", "temp_to_C": "10"}, "temp_to_C"},
		{Params{"temp_to_C": "60"}, "temp_C"},
		{Params{"pressure_kPa": "90"}, "pressure_kPa"},
	} {
		_, err := GasTable(tt.p)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tt.field {
			t.Errorf("GasTable(%v) error = %v, want a FieldError for %q", tt.p, err, tt.field)
		}
	}
}

func FuzzGas(f *testing.F) {
	f.Add("O2", "20", "0", "101.325", "")
	f.Add("CO2", "25", "35", "99", "8")
	f.Add("n2", "-3", "1e400", "0", "NaN")
	f.Fuzz(func(t *testing.T, g, temp, sal, kPa, measured string) {
		p := Params{"gas": g, "temp_C": temp, "salinity": sal, "pressure_kPa": kPa}
		if measured != "" {
			p["measured_mg_per_L"] = measured
		}
		b, err := Gas(p)
		if err != nil {
			if !IsInputError(err) {
				t.Fatalf("Gas(%v): non-input error %v", p, err)
			}
			return
		}
		if _, err := wire.Decode(b); err != nil {
			t.Fatalf("Gas(%v) output invalid: %v", p, err)
		}
	})
}

func FuzzOutgas(f *testing.F) {
	f.Add("20", "80", "101.325", "")
	f.Add("0", "100", "40", "300")
	f.Fuzz(func(t *testing.T, from, to, kPa, heat string) {
		p := Params{"from_C": from, "to_C": to, "pressure_kPa": kPa}
		if heat != "" {
			p["heat_pressure_kPa"] = heat
		}
		b, err := Outgas(p)
		if err != nil {
			if !IsInputError(err) {
				t.Fatalf("Outgas(%v): non-input error %v", p, err)
			}
			return
		}
		if _, err := wire.Decode(b); err != nil {
			t.Fatalf("Outgas(%v) output invalid: %v", p, err)
		}
	})
}

func FuzzGasTable(f *testing.F) {
	f.Add("0", "40", "1", "pressure_kPa", "101.325;90")
	f.Add("10", "5", "0,5", "salinity", "0 35 40")
	f.Fuzz(func(t *testing.T, from, to, step, kind, values string) {
		p := Params{"temp_from_C": from, "temp_to_C": to, "temp_step_C": step, "columns": kind, "values": values}
		b, err := GasTable(p)
		if err != nil {
			if !IsInputError(err) {
				t.Fatalf("GasTable(%v): non-input error %v", p, err)
			}
			return
		}
		if _, err := wire.Decode(b); err != nil {
			t.Fatalf("GasTable(%v) output invalid: %v", p, err)
		}
	})
}

var sinkBytes []byte

func BenchmarkGasO2(b *testing.B) {
	p := Params{"gas": "O2", "temp_C": "17.5", "salinity": "0", "pressure_kPa": "97.2", "measured_mg_per_L": "8.1"}
	for b.Loop() {
		sinkBytes, _ = Gas(p)
	}
}
