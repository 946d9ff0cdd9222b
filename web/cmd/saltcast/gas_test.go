package main

import (
	"bytes"
	"math"
	"strings"
	"testing"

	"saltcast/core/wire"
)

func runGasArgs(t *testing.T, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	var out, errb bytes.Buffer
	code = runGas(args, &out, &errb)
	return out.String(), errb.String(), code
}

func TestGasCommand(t *testing.T) {
	out, errs, code := runGasArgs(t, "--gas", "O2", "--temp-C", "20", "--salinity", "0", "--pressure-kPa", "101.325", "--measured-mg-per-L=8,5")
	if code != 0 || errs != "" {
		t.Fatalf("exit %d, stderr %q", code, errs)
	}
	v, err := wire.Decode([]byte(out))
	if err != nil {
		t.Fatalf("stdout is not JSON: %v\n%s", err, out)
	}
	keys := []string{"gas", "temp_C", "salinity", "pressure_kPa", "saturation_mg_per_L",
		"saturation_umol_per_kg", "method", "source", "warnings"}
	for i, k := range keys {
		if v.Members[i].Key != k {
			t.Errorf("key %d = %q, want %q", i, v.Members[i].Key, k)
		}
	}
	// 9.092 mg/L at 20 °C, 1 atm, fresh water (Benson & Krause; SM 4500-O table).
	sat, _ := v.Get("saturation_mg_per_L")
	if math.Abs(sat.Num-9.092) > 0.0015 {
		t.Errorf("saturation_mg_per_L = %v, want 9.092", sat.Num)
	}
	// 8.5/9.092 = 93.5 %.
	pct, ok := v.Get("percent_saturation")
	if !ok || math.Abs(pct.Num-93.5) > 0.06 {
		t.Errorf("percent_saturation = %+v, want 93.5", pct)
	}
}

func TestGasOutgasCommand(t *testing.T) {
	out, errs, code := runGasArgs(t, "outgas", "--from-C", "20", "--to-C", "80")
	if code != 0 || errs != "" {
		t.Fatalf("exit %d, stderr %q", code, errs)
	}
	v, err := wire.Decode([]byte(out))
	if err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"gases", "total_released_mL_per_L", "total_released_mL_STP_per_L", "bubble_temp_C", "cautions"} {
		if _, ok := v.Get(k); !ok {
			t.Errorf("outgas output lacks %q", k)
		}
	}
}

func TestGasTableText(t *testing.T) {
	out, errs, code := runGasArgs(t, "table", "--temp-to-C", "10", "--temp-step-C", "5", "--values", "101.325;80", "--format", "text")
	if code != 0 {
		t.Fatalf("exit %d, stderr %q", code, errs)
	}
	// 0 °C, 1 atm: 14.621 → 14.62 mg/L (derived: Benson & Krause 1984 equation).
	for _, want := range []string{"14.62", "Benson & Krause"} {
		if !strings.Contains(out, want) {
			t.Errorf("text table lacks %q:\n%s", want, out)
		}
	}
	// 10 °C, 80 kPa: 8.885 ± 0.01 (derived: Benson & Krause 1984 with the Standard Methods
	// 4500-O pressure correction), printed to 2 decimals.
	if !strings.Contains(out, "8.88") && !strings.Contains(out, "8.89") {
		t.Errorf("text table lacks 8.88 or 8.89 at 10 °C, 80 kPa:\n%s", out)
	}
	lines := strings.Split(strings.TrimSpace(out), "\n")
	if len(lines) < 6 {
		t.Errorf("text table too short:\n%s", out)
	}
}

func TestGasCommandErrors(t *testing.T) {
	tests := []struct {
		args  []string
		field string
	}{
		{[]string{"--temp-C"}, "--temp-C"},
		{[]string{"--temp-C", "20", "--temp-C", "21"}, "--temp-C"},
		{[]string{"--temp-C", "hot"}, "--temp-C"},
		{[]string{"--temp-C", "20", "--pressure-kPa", "-1"}, "--pressure-kPa"},
		{[]string{"--temp-C", "20", "--salinity", "60"}, "--salinity"},
		{[]string{"--temp-C", "20", "--colour", "blue"}, "--colour"},
		{[]string{"temp", "20"}, "command"},
		{[]string{"outgas", "--from-C", "80", "--to-C", "20"}, "--to-C"},
		{[]string{"table", "--format", "pdf"}, "--format"},
		{[]string{"-t", "20"}, "arguments"},
	}
	for _, tt := range tests {
		out, errs, code := runGasArgs(t, tt.args...)
		if code != 2 || out != "" {
			t.Errorf("%v: exit %d, stdout %q; want 2 and nothing", tt.args, code, out)
		}
		if !strings.HasPrefix(errs, "saltcast gas: "+tt.field+":") {
			t.Errorf("%v: stderr %q does not name %q", tt.args, errs, tt.field)
		}
	}
}

func TestGasHelp(t *testing.T) {
	out, _, code := runGasArgs(t, "--help")
	if code != 0 || !strings.Contains(out, "saltcast gas outgas") {
		t.Errorf("help: exit %d\n%s", code, out)
	}
}
