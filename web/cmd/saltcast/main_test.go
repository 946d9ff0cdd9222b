package main

import (
	"bytes"
	"flag"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"saltcast/core/wire"
)

var update = flag.Bool("update", false, "rewrite the golden files in testdata/ with the current output")

func run(t *testing.T, stdin string, args ...string) (stdout, stderr string, code int) {
	t.Helper()
	var out, errb bytes.Buffer
	code = Run(args, strings.NewReader(stdin), &out, &errb)
	return out.String(), errb.String(), code
}

// golden compares got with testdata/name, or rewrites it with -update. The goldens hold
// rendered output; the numbers in them are checked by the balance and recipe tests against
// handbook values, so a golden catches unintended changes of layout and wording.
func golden(t *testing.T, name, got string) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		if err := os.WriteFile(path, []byte(got), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -update to create it)", err)
	}
	if got != string(want) {
		t.Errorf("output differs from %s (run go test -update after checking the change):\ngot:\n%s\nwant:\n%s", path, got, want)
	}
}

// Batches whose sheets show the heat basis, the insulated batch, ice and the toxic caution.
const (
	acetateSeeded = `{"solute":"CH3COONa","water_g":100,"dissolve_temp_C":70,"seed_at_C":20,"cool_to_C":20}`
	kno3Ice       = `{"solute":"KNO3","water_g":100,"charge_g":5,"dissolve_temp_C":20,"cool_to_C":-2}`
	dichromate    = `{"solute":"K2Cr2O7","water_g":100,"dissolve_temp_C":60,"saturation_pct":90,"cool_to_C":20}`
)

// The readable sheet shows what a chemist checks before the batch: the seeded sodium acetate
// batch holds at 58 °C (the trihydrate's incongruent melting point, 58 °C, Lane, Solar Heat
// Storage, 1983, from memory) on the heat-of-fusion basis; 5 g KNO3 in 100 g water
// (4.76 mass %) freezes at −1.43 °C (derived: between the CRC 102nd ed. "Concentrative
// Properties of Aqueous Solutions" rows 4 % (1.22 K) and 5 % (1.50 K)), so at −2 °C ice forms
// and its heat is in the duty; K2Cr2O7 opens with the toxic caution.
func TestSheetHeatAndCold(t *testing.T) {
	for _, tt := range []struct {
		stdin string
		want  []string
	}{
		{acetateSeeded, []string{"heat basis                    heat of fusion of the hydrate", "held at 58 °C", "with the lowest estimate", "heat-capacity model"}},
		{kno3Ice, []string{"freezing point                -1.43 °C", "  ice  ", "ice freezing releases", "eutectic"}},
		{dichromate, []string{"Cautions (read first)\n  - TOXIC: "}},
	} {
		out, errOut, code := run(t, tt.stdin, "demo", "-")
		if code != 0 {
			t.Fatalf("saltcast demo - <<< %s: exit %d, %s", tt.stdin, code, errOut)
		}
		for _, w := range tt.want {
			if !strings.Contains(out, w) {
				t.Errorf("saltcast demo - <<< %s: no %q in\n%s", tt.stdin, w, out)
			}
		}
	}
}

func TestGoldens(t *testing.T) {
	tests := []struct {
		golden string
		stdin  string
		args   []string
	}{
		{"solubility-kno3-20.json", "", []string{"solubility", "--solute", "KNO3", "--temp-C", "20"}},
		{"solubility-glauber-25.json", "", []string{"solubility", "--solute=Glauber's salt", "--temp-C=25,0"}},
		{"plan-cuso4.json", "", []string{"plan", "../../../core/recipe/demo/demo-cuso4-crystals.json"}},
		{"plan-stdin.json", `{"solute":"Na2SO4","water_g":100,"dissolve_temp_C":40,"cool_to_C":20}`, []string{"plan", "-"}},
		{"prep-kcl.json", "", []string{"prep", "../../../core/recipe/demo/demo-prep-kcl-coldroom.json"}},
		{"prep-stdin.json", `{"solute":"CuSO4·5H2O","concentration":0.1,"concentration_unit":"mol/L","final_volume_mL":250}`, []string{"prep", "-"}},
		{"demo.txt", "", []string{"demo", "../../../core/recipe/demo/demo-kno3-stock.json", "../../../core/recipe/demo/demo-cuso4-crystals.json"}},
		{"demo.txt", "", []string{"demo"}}, // the built-in demos are the same files
		{"demo-acetate-seeded.txt", acetateSeeded, []string{"demo", "-"}},
		{"demo-kno3-ice.txt", kno3Ice, []string{"demo", "-"}},
		{"demo-dichromate.txt", dichromate, []string{"demo", "-"}},
	}
	for _, tt := range tests {
		out, errOut, code := run(t, tt.stdin, tt.args...)
		if code != 0 {
			t.Errorf("saltcast %s: exit %d, stderr %s", strings.Join(tt.args, " "), code, errOut)
			continue
		}
		golden(t, tt.golden, out)
	}
}

// The solubility answer keeps the contract keys and values: KNO3 at 20 °C is 31.93 g per
// 100 g water (CRC 98th ed., "Aqueous Solubility of Inorganic Compounds at Various
// Temperatures", 24.2 mass %; r = 100·w/(100 − w), derived).
func TestSolubilityContract(t *testing.T) {
	out, _, code := run(t, "", "solubility", "--solute", "KNO3", "--temp-C", "20")
	if code != 0 {
		t.Fatalf("exit %d", code)
	}
	v, err := wire.Decode([]byte(out))
	if err != nil {
		t.Fatal(err)
	}
	for _, k := range []string{"solute", "temp_C", "g_per_100g_water", "solid_phase", "source", "warnings"} {
		if _, ok := v.Get(k); !ok {
			t.Errorf("output lacks %q: %s", k, out)
		}
	}
	g, _ := v.Get("g_per_100g_water")
	if d := g.Num - 31.93; d > 0.01 || d < -0.01 {
		t.Errorf("g_per_100g_water = %v, want 31.93", g.Num)
	}
	ph, _ := v.Get("solid_phase")
	if ph.Text != "KNO3" {
		t.Errorf("solid_phase = %q", ph.Text)
	}
	// Glauber's salt at 20 °C: the decahydrate is the stable solid (below 32.38 °C).
	out, _, _ = run(t, "", "solubility", "--solute", "Na2SO4", "--temp-C", "20")
	if !strings.Contains(out, `"solid_phase":"Na2SO4·10H2O"`) {
		t.Errorf("Na2SO4 at 20 °C: %s", out)
	}
}

func TestErrors(t *testing.T) {
	tests := []struct {
		args    []string
		stdin   string
		code    int
		wantErr string
	}{
		{nil, "", 2, "Commands:\n  plan "},
		{[]string{"frobnicate"}, "", 2, "command"},
		{[]string{"solubility", "--solute", "KNO3"}, "", 2, "solubility: --temp-C: "},
		{[]string{"solubility", "--solute", "KNO3", "--temp-C", "1.234,5"}, "", 2, "solubility: --temp-C: "},
		{[]string{"solubility", "--solute", "KNO3", "--temp-C", "500"}, "", 2, "solubility: --temp-C: "},
		{[]string{"solubility", "--solute", "KNO3", "--temp-F", "500"}, "", 2, `solubility: --temp-F: "500"`},
		{[]string{"solubility", "--solute", "KNO3", "--temp-C", "20", "--colour", "red"}, "", 2, "--colour"},
		{[]string{"solubility", "--solute", "kryptonite", "--temp-C", "20"}, "", 2, "--solute"},
		{[]string{"solubility", "--temp-C"}, "", 2, "--temp-C"},
		{[]string{"plan"}, "", 2, "arguments"},
		{[]string{"plan", "no-such-file.json"}, "", 2, "no-such-file.json"},
		{[]string{"plan", "-"}, `{"solute":"KNO3","water_g":-5,"dissolve_temp_C":60}`, 2, "water_g"},
		{[]string{"plan", "-"}, `{"solute":"KNO3","water_g":5,"dissolve_temp_C":60,"extra":1}`, 2, "extra"},
		{[]string{"plan", "-"}, `{"solute":"KNO3",`, 2, "JSON line 1"},
		{[]string{"plan", "-"}, `{"solute":"KNO3","water_g":NaN,"dissolve_temp_C":60}`, 2, "NaN"},
		{[]string{"prep"}, "", 2, "arguments"},
		{[]string{"prep", "-"}, `{"solute":"KCl","concentration":1,"concentration_unit":"mol/L","final_volume_mL":-1}`, 2, "final_volume_mL"},
		{[]string{"prep", "-"}, `{"solute":"KCl","concentration":1,"concentration_unit":"M","final_volume_mL":100}`, 2, "concentration_unit"},
		{[]string{"prep", "-"}, `{"solute":"KH2PO4","concentration":1,"concentration_unit":"mol/L","final_mass_g":100}`, 2, "concentration_unit"},
		{[]string{"demo", "-"}, `{"solute":"KNO3","water_g":100,"dissolve_temp_C":20,"cool_to_C":40}`, 2, "cool_to_C"},
		// A file's errors name its keys; flags' errors name the flags.
		{[]string{"plan", "--solute", "KNO3", "--water-g", "100", "--dissolve-temp-C", "20", "--cool-to-C", "40", "--format", "json"}, "", 2, "--cool-to-C"},
		{[]string{"plan", "--solute", "KNO3", "--water-g", "-5", "--dissolve-temp-C", "20"}, "", 2, `plan: --water-g: "-5"`},
		{[]string{"plan", "--solute", "KNO3", "--water-kg", "-5", "--dissolve-temp-C", "20"}, "", 2, `plan: --water-kg: "-5"`},
		// A value typed in another unit is explained in the flag's own unit, with the number as
		// read, never the raw text (which may hold a line break).
		{[]string{"plan", "--solute", "KNO3", "--water-L", "\n+0", "--dissolve-temp-C", "20"}, "", 2, `--water-L: "\n+0" is not allowed; allowed: a volume > 0, from 0.001 to 1e7 mL (0 L is 0 mL)`},
		{[]string{"plan", "--solute", "KNO3", "--water-g", "5", "--dissolve-temp-C", "20", "--charge-g", "1", "--saturation-pct", "50"}, "", 2, "only one of --saturation-pct, --charge-g and --clear-down-to-C"},
		{[]string{"plan", "--solute", "KNO3", "--water-g", "5"}, "", 2, "--dissolve-temp-C: "},
		{[]string{"plan", "--solute", "KNO3", "--water-g", "5", "--water-lb", "1", "--dissolve-temp-C", "20"}, "", 2, "--water-lb"},
		{[]string{"plan", "no-such-file.json", "--solute", "KNO3"}, "", 2, "no-such-file.json"},
		{[]string{"plan", "-", "--cool-to-C", "5"}, `{"solute":"KNO3","water_g":-1,"dissolve_temp_C":60}`, 2, `plan: -: water_g: "-1"`},
		{[]string{"plan", "../../../core/recipe/demo/demo-cuso4-crystals.json", "--charge-g", "300", "--saturation-pct", "50"}, "", 2, "--charge-g"},
		{[]string{"plan", "--custom-points", "10 5; 20", "--custom-name", "x"}, "", 2, "--custom-points"},
		{[]string{"plan", "--format", "pdf", "x.json"}, "", 2, "--format"},
		{[]string{"plan", "--temp-unit", "R", "x.json"}, "", 2, "--temp-unit"},
		{[]string{"plan", "-x"}, "", 2, "arguments"},
		{[]string{"prep", "--solute", "KCl", "--concentration", "1", "--concentration-unit", "M", "--final-volume-L", "1"}, "", 2, "--concentration-unit"},
		{[]string{"help", "frobnicate"}, "", 2, "command"},
		{[]string{"version", "x"}, "", 2, "arguments"},
	}
	for _, tt := range tests {
		out, errOut, code := run(t, tt.stdin, tt.args...)
		if code != tt.code || !strings.Contains(errOut, tt.wantErr) || out != "" && tt.args != nil {
			t.Errorf("saltcast %q: exit %d, stdout %q, stderr %q; want exit %d and %q on stderr", tt.args, code, out, errOut, tt.code, tt.wantErr)
		}
	}
}

func TestHelpAndCompounds(t *testing.T) {
	out, _, code := run(t, "", "help")
	if code != 0 || !strings.Contains(out, "\n  plan ") {
		t.Errorf("help: exit %d, %q", code, out)
	}
	out, _, code = run(t, "", "compounds")
	if code != 0 {
		t.Fatalf("compounds: exit %d", code)
	}
	// The list of the whole library is larger than wire's default 64 KiB limit.
	v, err := wire.DecodeLimits([]byte(out), wire.Limits{MaxBytes: 1 << 20})
	if err != nil {
		t.Fatal(err)
	}
	list, _ := v.Get("compounds")
	if len(list.Items) < 60 {
		t.Errorf("compounds lists %d, want at least the 60 of the library", len(list.Items))
	}
}

// An unknown flag is refused in the same words by every subcommand: exit status 2 and
// `saltcast <command>: --bogus: "1" is not allowed; allowed: one of the flags: …`.
func TestUnknownFlagOneWording(t *testing.T) {
	for _, args := range [][]string{
		{"solubility", "--solute", "KNO3", "--temp-C", "20", "--bogus", "1"},
		{"gas", "--temp-C", "20", "--bogus", "1"},
		{"gas", "outgas", "--from-C", "20", "--to-C", "80", "--bogus=1"},
		{"gas", "table", "--bogus", "1"},
		{"plan", "--bogus", "1"},
		{"prep", "--bogus", "1"},
		{"demo", "--bogus", "1"},
		{"compounds", "--bogus", "1"},
	} {
		_, errs, code := run(t, "", args...)
		cmd := args[0]
		if len(args) > 1 && !strings.HasPrefix(args[1], "-") {
			cmd += " " + args[1]
		}
		want := "saltcast " + cmd + `: --bogus: "1" is not allowed; allowed: one of the flags: `
		if code != 2 || !strings.HasPrefix(errs, want) {
			t.Errorf("saltcast %s: exit %d, stderr %q; want 2 and %q…", strings.Join(args, " "), code, errs, want)
		}
	}
}
