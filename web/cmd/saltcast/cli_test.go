package main

import (
	"bytes"
	"math"
	"math/rand/v2"
	"os"
	"path/filepath"
	"runtime/debug"
	"strconv"
	"strings"
	"testing"

	"saltcast/core/recipe"
	demos "saltcast/core/recipe/demo"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// words splits an example command line the way a shell would for the simple lines help
// shows: spaces separate words, double quotes keep spaces inside one.
func words(line string) []string {
	var out []string
	var b strings.Builder
	inQuote, any := false, false
	for _, r := range line {
		switch {
		case r == '"':
			inQuote, any = !inQuote, true
		case r == ' ' && !inQuote:
			if any {
				out = append(out, b.String())
			}
			b.Reset()
			any = false
		default:
			b.WriteRune(r)
			any = true
		}
	}
	if any {
		out = append(out, b.String())
	}
	return out
}

// Every command answers --help, -h and `saltcast help <command>` with the same text on
// standard output and exit status 0: a usage line, what it does, each flag with its unit
// and default, and examples; and each example runs.
func TestHelpEveryCommand(t *testing.T) {
	for _, c := range commands {
		name := strings.Fields(c.Name)
		ask := [][]string{append(name[:len(name):len(name)], "--help"), append(name[:len(name):len(name)], "-h"), append([]string{"help"}, name...)}
		var first string
		for i, args := range ask {
			out, errs, code := run(t, "", args...)
			if code != 0 || errs != "" {
				t.Errorf("saltcast %s: exit %d, stderr %q", strings.Join(args, " "), code, errs)
			}
			if i == 0 {
				first = out
			} else if out != first {
				t.Errorf("saltcast %s differs from saltcast %s --help", strings.Join(args, " "), c.Name)
			}
		}
		h := c.help()
		if first != h {
			t.Errorf("%s --help is not the command's help", c.Name)
		}
		for _, want := range []string{"Usage:\n  saltcast " + c.Name, "\nExample"} {
			if !strings.Contains(h, want) {
				t.Errorf("help of %s lacks %q:\n%s", c.Name, want, h)
			}
		}
		// Each flag is listed once, with its unit where it has one and its default (or
		// "optional").
		blocks := map[string]string{}
		var cur string
		for _, line := range strings.Split(h, "\n") {
			if strings.HasPrefix(line, "  --") {
				cur = strings.Fields(line)[0]
				if _, dup := blocks[cur]; dup {
					t.Errorf("help of %s lists %s twice", c.Name, cur)
				}
				blocks[cur] = ""
				continue
			}
			if cur != "" && strings.HasPrefix(line, "      ") {
				blocks[cur] += line + "\n"
			} else {
				cur = ""
			}
		}
		for _, f := range c.allFlags() {
			b, ok := blocks["--"+f.Name]
			if !ok {
				t.Errorf("help of %s lacks --%s", c.Name, f.Name)
				continue
			}
			if f.Unit != "" && !strings.Contains(b, "[unit: "+f.Unit) {
				t.Errorf("help of %s: --%s lacks its unit %q:\n%s", c.Name, f.Name, f.Unit, b)
			}
			if !strings.Contains(b, "[default: ") && !strings.Contains(b, "[optional]") {
				t.Errorf("help of %s: --%s says no default:\n%s", c.Name, f.Name, b)
			}
			if strings.TrimSpace(f.Help) == "" {
				t.Errorf("help of %s: --%s says nothing", c.Name, f.Name)
			}
		}
		if len(c.Examples) == 0 {
			t.Errorf("%s has no example", c.Name)
		}
		for _, e := range c.Examples {
			if strings.ContainsAny(e, "<>") || strings.Contains(e, ".json") {
				continue // needs files
			}
			args := words(e)
			if _, errs, code := run(t, "", args...); code != 0 {
				t.Errorf("example saltcast %s: exit %d, %s", e, code, errs)
			}
		}
	}
	// The list of commands names each one; without a command it goes to standard error
	// with exit status 2.
	out, _, code := run(t, "", "--help")
	if code != 0 {
		t.Errorf("saltcast --help: exit %d", code)
	}
	for _, c := range commands {
		if !strings.Contains(out, "\n  "+c.Name+" ") {
			t.Errorf("saltcast --help does not list %s:\n%s", c.Name, out)
		}
	}
	if _, errs, code := run(t, ""); code != 2 || errs != out {
		t.Errorf("saltcast alone: exit %d, stderr %q", code, errs)
	}
}

// Every key of the recipe and preparation tables has a flag of plan and prep, found by the
// key's name with "-" for "_" and "." and listed by --help; only the format number, the
// kind tag and the custom object itself (its keys have flags) have none.
func TestEveryRecipeKeyHasAFlag(t *testing.T) {
	for _, tt := range []struct {
		cmd   string
		specs recipe.Specs
	}{{"plan", recipe.FieldSpecs}, {"prep", recipe.PrepFields.Specs()}} {
		c := findCommand(tt.cmd)
		help := c.help()
		for i := range tt.specs {
			s := &tt.specs[i]
			if s.Kind.Fixed() || s.Kind == recipe.Object {
				continue
			}
			name := strings.NewReplacer("_", "-", ".", "-").Replace(s.Key)
			f, u := lookupFlag(c.Flags, name)
			if f == nil || f.Key != s.Key || u != "" {
				t.Errorf("%s: key %s has no flag --%s", tt.cmd, s.Key, name)
			}
			if !strings.Contains(help, "\n  --"+name+" ") {
				t.Errorf("%s --help does not list --%s", tt.cmd, name)
			}
		}
	}
}

// A value typed in another unit arrives in the file's unit. The factors are exact by
// definition (NIST SP 811, 2008 ed., appendix B.8: pound 0.45359237 kg, US gallon
// 3.785411784 L; B.9: t/°C = (t/°F − 32)/1.8, t/°C = T/K − 273.15).
func TestFlagUnits(t *testing.T) {
	base := []string{"plan", "--format", "recipe", "--solute", "KNO3"}
	for _, tt := range []struct {
		flags []string
		key   string
		want  float64
	}{
		{[]string{"--water-lb", "1", "--dissolve-temp-C", "20"}, "water_g", 453.59237},
		{[]string{"--water-kg", "0,5", "--dissolve-temp-C", "20"}, "water_g", 500},
		{[]string{"--water-gal", "1", "--dissolve-temp-C", "20"}, "water_mL", 3785.411784},
		{[]string{"--water-L", "2", "--water-temp-F", "59", "--dissolve-temp-C", "20"}, "water_temp_C", 15},
		{[]string{"--water-g", "100", "--dissolve-temp-F", "140"}, "dissolve_temp_C", 60},
		{[]string{"--water-g", "100", "--dissolve-temp-F", "-40"}, "dissolve_temp_C", -40},
		{[]string{"--water-g", "100", "--dissolve-temp-C", "60", "--cool-to-K", "283.15"}, "cool_to_C", 10},
		{[]string{"--water-g", "100", "--dissolve-temp-C", "60", "--charge-lb", "0.1"}, "charge_g", 45.359237},
		{[]string{"--water-g", "100", "--dissolve-temp-C", "60", "--cool-to-c", "5"}, "cool_to_C", 5}, // another case
	} {
		args := append(base[:len(base):len(base)], tt.flags...)
		out, errs, code := run(t, "", args...)
		if code != 0 {
			t.Errorf("saltcast %s: exit %d, %s", strings.Join(args, " "), code, errs)
			continue
		}
		v, err := wire.Decode([]byte(out))
		if err != nil {
			t.Fatal(err)
		}
		got, _ := v.Get(tt.key)
		if math.Abs(got.Num-tt.want) > 1e-9*math.Max(1, math.Abs(tt.want)) {
			t.Errorf("saltcast %s: %s = %v, want %v", strings.Join(args, " "), tt.key, got.Num, tt.want)
		}
	}
}

// flagsOf writes a recipe as command-line flags, from the table (not from the CLI's own
// flag list): every key that is set, as --key value, numbers in the file's units.
func flagsOf(t *testing.T, tab *recipe.Table[recipe.Recipe], r *recipe.Recipe, rng *rand.Rand) []string {
	t.Helper()
	var args []string
	add := func(key, value string) {
		name := "--" + strings.NewReplacer("_", "-", ".", "-").Replace(key)
		if rng != nil && rng.IntN(3) == 0 {
			args = append(args, name+"="+value)
		} else {
			args = append(args, name, value)
		}
	}
	num := func(v float64) string {
		s := strconv.FormatFloat(v, 'g', -1, 64)
		if rng != nil && rng.IntN(2) == 0 {
			s = strings.Replace(s, ".", ",", 1) // a decimal comma
		}
		return s
	}
	for i := range tab.Fields {
		f := &tab.Fields[i]
		if p := f.Parent(); p != "" && r.Custom == nil {
			continue
		}
		switch {
		case f.Kind.Fixed() || f.Kind == recipe.Object:
		case f.Text != nil:
			if s := *f.Text(r); s != "" {
				add(f.Key, s)
			}
		case f.Points != nil:
			var parts []string
			for _, p := range *f.Points(r) {
				parts = append(parts, num(p.TempC)+" "+num(p.GPer100gWater))
			}
			add(f.Key, strings.Join(parts, "; "))
		case f.Opt != nil:
			if o := *f.Opt(r); o.Set {
				add(f.Key, num(o.Value))
			}
		case f.Num != nil:
			add(f.Key, num(*f.Num(r)))
		}
	}
	return args
}

// randomRecipe draws a recipe that decodes: one choice of each group of keys, every
// optional key now and then, numbers anywhere in their ranges, texts with quotes, markup,
// control characters and non-ASCII letters.
func randomRecipe(rng *rand.Rand) recipe.Recipe {
	tab := &recipe.Fields
	r := tab.New()
	pick := map[string]string{}
	choices := map[string][]string{}
	for _, s := range recipe.FieldSpecs {
		if s.Group != "" && !contains(choices[s.Group], s.Choice) {
			choices[s.Group] = append(choices[s.Group], s.Choice)
		}
	}
	for g, cs := range choices {
		pick[g] = cs[rng.IntN(len(cs))]
	}
	// The first key of each choice (solute, water_g, clear_down_to_C...) is the one the
	// others of that choice go with.
	firstOfChoice := map[string]bool{}
	seenChoice := map[string]bool{}
	for _, s := range recipe.FieldSpecs {
		if s.Group != "" && s.Parent() == "" && !seenChoice[s.Group+"/"+s.Choice] {
			seenChoice[s.Group+"/"+s.Choice] = true
			firstOfChoice[s.Key] = true
		}
	}
	pieces := []string{"a", "Ω", "é", "\"", "\\", "<script>", " ", "\t", "\n", "·", "5", "H2O", "ü", "'", "=", "-", "--x"}
	text := func(max int) string {
		var b strings.Builder
		for n := 1 + rng.IntN(12); n > 0; n-- {
			p := pieces[rng.IntN(len(pieces))]
			if b.Len()+len(p) > max {
				break
			}
			b.WriteString(p)
		}
		if strings.TrimSpace(b.String()) == "" {
			return "x"
		}
		return b.String()
	}
	number := func(s *recipe.Spec) float64 {
		lo, hi := s.Min, s.Max
		var v float64
		switch rng.IntN(4) {
		case 0:
			v = math.Round(lo + rng.Float64()*(hi-lo)) // a whole number
		case 1:
			v = math.Round((lo+rng.Float64()*(hi-lo))*100) / 100
		case 2:
			v = lo + rng.Float64()*(hi-lo)
		default:
			v = lo + math.Pow(10, rng.Float64()*math.Log10(hi-lo+1)) - 1 // small values as often as large
		}
		v = math.Max(lo, math.Min(hi, v))
		if s.MinOpen && v <= lo {
			v = lo + (hi-lo)/7
		}
		return v
	}
	for i := range tab.Fields {
		f := &tab.Fields[i]
		group := f.Group
		if p := f.Parent(); p != "" {
			sp, _ := recipe.FieldSpecs.Lookup(p)
			group = sp.Group
			if r.Custom == nil {
				continue
			}
		} else if group != "" && pick[group] != f.Choice {
			continue
		}
		must := f.Required || f.Need != "" || f.Group != "" && firstOfChoice[f.Key]
		if f.Kind.Fixed() || (!must && rng.IntN(2) == 0) {
			continue
		}
		switch {
		case f.Kind == recipe.Object:
			f.Make(&r)
		case f.Text != nil:
			if f.Choices != nil {
				*f.Text(&r) = f.Choices[rng.IntN(len(f.Choices))]
			} else {
				*f.Text(&r) = text(f.MaxBytes)
			}
		case f.Points != nil:
			var pts []recipe.Point
			for n := 3 + rng.IntN(6); n > 0; n-- {
				pts = append(pts, recipe.Point{TempC: number(&recipe.Spec{Min: -40, Max: 150}), GPer100gWater: number(&recipe.Spec{Min: 1e-6, Max: 1e5})})
			}
			*f.Points(&r) = pts
		case f.Opt != nil:
			*f.Opt(&r) = recipe.Opt{Value: number(&f.Spec), Set: true}
		case f.Num != nil:
			*f.Num(&r) = number(&f.Spec)
		}
	}
	return r
}

// Property: a recipe written as flags comes back key for key and byte for byte
// (flags → recipe → JSON), for 500 random recipes covering every key of the table.
func TestFlagsRoundTripRandomRecipes(t *testing.T) {
	rng := rand.New(rand.NewPCG(14, 2026))
	seen := map[string]bool{}
	for i := 0; i < 500; i++ {
		r := randomRecipe(rng)
		want := recipe.Fields.Encode(&r)
		if _, err := recipe.Decode(want); err != nil {
			t.Fatalf("the generator made a recipe that does not decode (%v): %s", err, want)
		}
		v, _ := wire.Decode(want)
		for _, m := range v.Members {
			seen[m.Key] = true
			if m.Key == "custom" {
				for _, c := range m.Value.Members {
					seen["custom."+c.Key] = true
				}
			}
		}
		args := append([]string{"plan", "--format", "recipe"}, flagsOf(t, &recipe.Fields, &r, rng)...)
		out, errs, code := run(t, "", args...)
		if code != 0 {
			t.Fatalf("recipe %s\nas flags %q: exit %d, %s", want, args, code, errs)
		}
		if got := strings.TrimSuffix(out, "\n"); got != string(want) {
			t.Fatalf("flags %q\ngave %s\nwant %s", args, got, want)
		}
	}
	for _, s := range recipe.FieldSpecs {
		if !seen[s.Key] {
			t.Errorf("no random recipe had %s", s.Key)
		}
	}
}

// planJSON runs saltcast plan with args and --format json and decodes the answer.
func planJSON(t *testing.T, stdin string, args ...string) (string, wire.Value) {
	t.Helper()
	args = append([]string{"plan", "--format", "json"}, args...)
	out, errs, code := run(t, stdin, args...)
	if code != 0 {
		t.Fatalf("saltcast %s: exit %d, %s", strings.Join(args, " "), code, errs)
	}
	v, err := wire.Decode([]byte(out))
	if err != nil {
		t.Fatal(err)
	}
	return out, v
}

// sameNumbers compares two JSON answers: the same keys and texts, numbers within rel.
func sameNumbers(t *testing.T, path string, a, b wire.Value, rel float64) {
	t.Helper()
	if a.Kind != b.Kind {
		t.Errorf("%s: %s against %s", path, a.Kind, b.Kind)
		return
	}
	switch a.Kind {
	case wire.Number:
		if math.Abs(a.Num-b.Num) > rel*math.Abs(b.Num)+1e-12 {
			t.Errorf("%s: %v against %v", path, a.Num, b.Num)
		}
	case wire.String:
		if a.Text != b.Text {
			t.Errorf("%s: %q against %q", path, a.Text, b.Text)
		}
	case wire.Array:
		if len(a.Items) != len(b.Items) {
			t.Errorf("%s: %d items against %d", path, len(a.Items), len(b.Items))
			return
		}
		for i := range a.Items {
			sameNumbers(t, path+"["+strconv.Itoa(i)+"]", a.Items[i], b.Items[i], rel)
		}
	case wire.Object:
		if len(a.Members) != len(b.Members) {
			t.Errorf("%s: %d keys against %d", path, len(a.Members), len(b.Members))
			return
		}
		for i := range a.Members {
			if a.Members[i].Key != b.Members[i].Key {
				t.Errorf("%s: key %s against %s", path, a.Members[i].Key, b.Members[i].Key)
				return
			}
			sameNumbers(t, path+"."+a.Members[i].Key, a.Members[i].Value, b.Members[i].Value, rel)
		}
	}
}

// toOtherUnits rewrites flags in °C, g and mL into °F, lb and L (values converted with
// the exact factors of core/unit), so the quick plan reads every converted flag.
func toOtherUnits(t *testing.T, args []string) []string {
	t.Helper()
	out := append([]string(nil), args...)
	for i := 0; i+1 < len(out); i++ {
		f, _ := lookupFlag(recipeFlags, strings.TrimPrefix(out[i], "--"))
		if f == nil || variants(f.Kind, f.Name) == nil {
			continue
		}
		v, err := unit.ParseNumber(f.Key, out[i+1])
		if err != nil {
			t.Fatal(err)
		}
		base := strings.TrimSuffix(out[i], variants(f.Kind, f.Name)[0].Suffix)
		switch f.Kind {
		case recipe.Temp:
			out[i], out[i+1] = base+"F", strconv.FormatFloat(unit.FahrenheitFromCelsius(v), 'g', -1, 64)
		case recipe.Mass:
			out[i], out[i+1] = base+"lb", strconv.FormatFloat(unit.PoundsFromGrams(v), 'g', -1, 64)
		case recipe.Volume:
			out[i], out[i+1] = base+"L", strconv.FormatFloat(unit.LitersFromMilliliters(v), 'g', -1, 64)
		}
		i++
	}
	return out
}

// testRecipes are the demo recipes and the test batches of main_test.go, as files.
func testRecipes(t *testing.T) map[string][]byte {
	files := map[string][]byte{}
	for _, d := range demos.All {
		files[d.File] = d.JSON
	}
	files["acetate-seeded"] = []byte(acetateSeeded)
	files["kno3-ice"] = []byte(kno3Ice)
	files["dichromate"] = []byte(dichromate)
	files["custom"] = []byte(`{"name":"own salt (invented)","custom":{"name":"X","molar_mass_g_per_mol":150,"points":[[10,5.1],[30,9.4],[50,17]],"solution_enthalpy_kJ_per_mol":20},` +
		`"water_g":250,"dissolve_temp_C":45,"saturation_pct":95,"cool_to_C":12,"cooling_time_min":90}`)
	return files
}

// The quick plan from flags equals the plan of the same recipe as a file, byte for byte;
// with the flags in °F, lb and L the numbers agree to the 6 digits printed.
func TestQuickPlanEqualsFilePlan(t *testing.T) {
	dir := t.TempDir()
	for name, data := range testRecipes(t) {
		file := filepath.Join(dir, name+".json")
		if err := os.WriteFile(file, data, 0o644); err != nil {
			t.Fatal(err)
		}
		fromFile, want := planJSON(t, "", file)
		r, err := recipe.Decode(data)
		if err != nil {
			t.Fatal(err)
		}
		flags := flagsOf(t, &recipe.Fields, &r, nil)
		fromFlags, _ := planJSON(t, "", flags...)
		if fromFlags != fromFile {
			t.Errorf("%s: the plan from flags %q differs from the file's:\n%s\n%s", name, flags, fromFlags, fromFile)
		}
		// Six significant digits printed: a value converted there and back may differ by
		// one unit in the sixth digit, 1e-5 of it at most.
		const sixthDigit = 1.0001e-5
		_, other := planJSON(t, "", toOtherUnits(t, flags)...)
		sameNumbers(t, name, other, want, sixthDigit)
	}
}

// sheetNumber finds the row labelled label in a text sheet and reads the first number on it.
func sheetNumber(t *testing.T, sheet, label string) (float64, bool) {
	t.Helper()
	for _, line := range strings.Split(sheet, "\n") {
		if !strings.HasPrefix(line, "  "+label+"  ") {
			continue
		}
		rest := strings.Fields(strings.TrimSpace(strings.TrimPrefix(line, "  "+label)))
		v, err := strconv.ParseFloat(strings.TrimSuffix(rest[0], ","), 64)
		if err != nil {
			t.Errorf("row %q: %q is not a number", label, rest[0])
			return 0, false
		}
		return v, true
	}
	return 0, false
}

// The text plan shows the numbers of the JSON plan (converted to the units asked), its
// cautions first and every warning.
func TestTextPlanMatchesJSON(t *testing.T) {
	type row struct {
		label, key string
		kind       recipe.Kind // Temp, Mass or Plain
		sig        int         // significant figures the sheet prints (Temp in °F/K: decimals)
	}
	rows := []row{
		{"weigh", "charge_g", recipe.Mass, 4},
		{"into water", "water_g", recipe.Mass, 4},
		{"dissolve at", "dissolve_temp_C", recipe.Temp, 3},
		{"saturation temperature", "saturation_temp_C", recipe.Temp, 3},
		{"crystals", "crystals_g", recipe.Mass, 4},
		{"yield (anhydrous basis)", "yield_pct", recipe.Plain, 4},
		{"mother liquor", "liquor_g", recipe.Mass, 4},
		{"cooling duty", "cooling_duty_kJ", recipe.Plain, 4},
		{"batch heat capacity", "heat_capacity_kJ_per_K", recipe.Plain, 4},
	}
	for name, data := range testRecipes(t) {
		_, js := planJSON(t, string(data), "-")
		for _, u := range []units{defaultUnits, {Temp: "F", Mass: "lb", Volume: "L"}, {Temp: "K", Mass: "kg", Volume: "gal"}} {
			out, errs, code := run(t, string(data), "plan", "-", "--format", "text", "--temp-unit", u.Temp, "--mass-unit", u.Mass, "--volume-unit", u.Volume)
			if code != 0 {
				t.Fatalf("%s: exit %d, %s", name, code, errs)
			}
			checked := 0
			for _, rw := range rows {
				jv, ok := js.Get(rw.key)
				if !ok || jv.Kind != wire.Number || (rw.key == "crystals_g" || rw.key == "yield_pct") && crystalsNone(js) {
					continue
				}
				want, tol := jv.Num, 0.0
				switch rw.kind {
				case recipe.Temp:
					want = u.TempFromC(want)
					if u.Temp != "C" {
						tol = 0.05
					}
				case recipe.Mass:
					want = u.MassFromG(want)
				}
				if tol == 0 { // half a unit in the last figure printed
					tol = 0.5 * math.Pow(10, math.Floor(math.Log10(math.Abs(want)))-float64(rw.sig-1))
				}
				tol = tol*1.001 + 1e-5*math.Abs(want) // and the JSON's own 6 digits
				got, found := sheetNumber(t, out, rw.label)
				if !found {
					t.Errorf("%s in %s/%s: no row %q for %s", name, u.Temp, u.Mass, rw.label, rw.key)
					continue
				}
				checked++
				if math.Abs(got-want) > tol {
					t.Errorf("%s in %s/%s: %s shows %v, the JSON %s is %v (±%v)", name, u.Temp, u.Mass, rw.label, got, rw.key, want, tol)
				}
			}
			if checked < 5 {
				t.Errorf("%s: only %d rows checked", name, checked)
			}
			charge := strings.Index(out, "\nCharge\n")
			cautions, _ := js.Get("cautions")
			if len(cautions.Items) == 0 {
				t.Errorf("%s: no cautions in the JSON plan", name)
			}
			for _, c := range cautions.Items {
				if i := strings.Index(out, "  - "+c.Text+"\n"); i < 0 || i > charge {
					t.Errorf("%s: caution %q not before the charge in\n%s", name, c.Text, out)
				}
			}
			warnings, _ := js.Get("warnings")
			for _, w := range warnings.Items {
				if !strings.Contains(out, "  - "+w.Text+"\n") {
					t.Errorf("%s: warning %q not shown", name, w.Text)
				}
			}
		}
	}
}

// Without --format, plan writes JSON when its output is not a terminal (a script reads it).
func TestPlanFormatDefault(t *testing.T) {
	out, _, code := run(t, "", "plan", "../../../core/recipe/demo/demo-cuso4-crystals.json")
	if code != 0 || !strings.HasPrefix(out, `{"format":1`) {
		t.Errorf("plan into a buffer: exit %d, %.40q…; want JSON", code, out)
	}
	if isTerminal(&bytes.Buffer{}) {
		t.Error("a buffer taken for a terminal")
	}
}

func TestVersion(t *testing.T) {
	for _, args := range [][]string{{"--version"}, {"version"}} {
		out, errs, code := run(t, "", args...)
		if code != 0 || errs != "" || out != "saltcast "+Version()+"\n" {
			t.Errorf("saltcast %s: exit %d, %q, %q", args[0], code, out, errs)
		}
	}
	old := version
	version = "v1.4.0-3-gabc1234"
	if Version() != "v1.4.0-3-gabc1234" {
		t.Errorf("Version() = %q, want the -ldflags value", Version())
	}
	version = old
	for _, tt := range []struct {
		bi   debug.BuildInfo
		want string
	}{
		{debug.BuildInfo{Main: debug.Module{Version: "v1.2.3"}}, "v1.2.3"},
		{debug.BuildInfo{Main: debug.Module{Version: "(devel)"}, Settings: []debug.BuildSetting{
			{Key: "vcs.revision", Value: "B71CE2F0123456789abcdef0123456789abcdef0"}, {Key: "vcs.modified", Value: "true"}}}, "dev-b71ce2f01234-dirty"},
		{debug.BuildInfo{Settings: []debug.BuildSetting{{Key: "vcs.revision", Value: "4f9a6bb"}, {Key: "vcs.modified", Value: "false"}}}, "dev-4f9a6bb"},
		{debug.BuildInfo{Main: debug.Module{Version: "(devel)"}}, "dev"},
	} {
		if got := versionFrom(&tt.bi); got != tt.want {
			t.Errorf("versionFrom(%+v) = %q, want %q", tt.bi, got, tt.want)
		}
	}
}

// Every usage line of the top-level README and the CLI README that runs saltcast names a
// command and flags the CLI knows.
func TestReadmeCommandsRun(t *testing.T) {
	for _, path := range []string{"README.md", "../../../README.md"} {
		b, err := os.ReadFile(path)
		if err != nil {
			t.Fatal(err)
		}
		n := 0
		lines := strings.Split(strings.ReplaceAll(string(b), "\\\n", " "), "\n") // join continued lines
		for _, line := range lines {
			line = strings.TrimSpace(strings.TrimPrefix(strings.TrimSpace(line), "$"))
			line = strings.TrimPrefix(line, "./bin/")
			if !strings.HasPrefix(line, "saltcast ") || strings.ContainsAny(line, "<>|`…") || strings.Contains(line, ".json") {
				continue
			}
			if i := strings.Index(line, "  #"); i > 0 {
				line = strings.TrimSpace(line[:i])
			}
			args := words(strings.TrimPrefix(line, "saltcast "))
			if _, errs, code := run(t, "", args...); code != 0 {
				t.Errorf("%s: saltcast %s: exit %d, %s", path, strings.Join(args, " "), code, errs)
			}
			n++
		}
		if path == "README.md" && n < 5 {
			t.Errorf("%s: only %d command lines found", path, n)
		}
	}
}

func crystalsNone(js wire.Value) bool {
	c, _ := js.Get("crystals_g")
	return c.Kind != wire.Number || c.Num == 0
}

// The README's quick plan shows lines the command really prints: each line of the block
// under "$ saltcast plan --solute KNO3 …" (up to the next command, leaving out "…") is a
// line of the sheet, in the same order.
func TestReadmeQuickPlan(t *testing.T) {
	b, err := os.ReadFile("README.md")
	if err != nil {
		t.Fatal(err)
	}
	const prompt = "$ saltcast plan --solute KNO3 "
	doc := string(b)
	i := strings.Index(doc, prompt)
	if i < 0 {
		t.Fatal("README.md shows no quick plan")
	}
	lines := strings.Split(doc[i:], "\n")
	out, errs, code := run(t, "", append(words(strings.TrimPrefix(lines[0], "$ saltcast ")), "--format", "text")...)
	if code != 0 {
		t.Fatalf("%s: exit %d, %s", lines[0], code, errs)
	}
	got := strings.Split(out, "\n")
	at, shown := 0, 0
	for _, want := range lines[1:] {
		if strings.HasPrefix(want, "$ ") || strings.HasPrefix(want, "```") {
			break
		}
		if strings.TrimSpace(want) == "…" {
			continue
		}
		for at < len(got) && got[at] != want {
			at++
		}
		if at == len(got) {
			t.Errorf("README.md shows %q, which the command does not print (in this order):\n%s", want, out)
			return
		}
		shown++
	}
	if shown < 10 {
		t.Errorf("README.md shows only %d lines of the quick plan", shown)
	}
}

// Flags over a file change the file's recipe: the plan equals the plan of the file with the
// same change made to the recipe itself.
func TestFlagsOverFile(t *testing.T) {
	const file = "../../../core/recipe/demo/demo-cuso4-crystals.json"
	for _, tt := range []struct {
		flags  []string
		change func(r *recipe.Recipe)
	}{
		{[]string{"--cool-to-C", "5"}, func(r *recipe.Recipe) { r.CoolToC = recipe.Opt{Value: 5, Set: true} }},
		{[]string{"--cool-to-F", "41", "--name", "colder"}, func(r *recipe.Recipe) {
			r.CoolToC, r.Name = recipe.Opt{Value: 5, Set: true}, "colder"
		}},
		// Another choice of the amount replaces the file's saturation_pct.
		{[]string{"--charge-g", "400"}, func(r *recipe.Recipe) {
			r.SaturationPct, r.ChargeG = recipe.Opt{}, recipe.Opt{Value: 400, Set: true}
		}},
		// Water by volume replaces water by mass.
		{[]string{"--water-L", "0,5", "--water-temp-C", "25"}, func(r *recipe.Recipe) {
			r.WaterG, r.WaterML, r.WaterTempC = recipe.Opt{}, recipe.Opt{Value: 500, Set: true}, recipe.Opt{Value: 25, Set: true}
		}},
	} {
		data, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		r, err := recipe.Decode(data)
		if err != nil {
			t.Fatal(err)
		}
		tt.change(&r)
		want, _ := planJSON(t, string(recipe.Fields.Encode(&r)), "-")
		got, _ := planJSON(t, "", append([]string{file}, tt.flags...)...)
		if got != want {
			t.Errorf("plan %s %s:\n%s\nwant\n%s", file, strings.Join(tt.flags, " "), got, want)
		}
	}
}
