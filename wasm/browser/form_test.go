package main

import (
	"math"
	"math/rand/v2"
	"os"
	"reflect"
	"slices"
	"sort"
	"strconv"
	"strings"
	"testing"

	"saltcast/core/recipe"
	"saltcast/core/recipe/demo"
	"saltcast/core/wire"
	"saltcast/web/api"
	"saltcast/web/htmlscan"
)

// shellInputs returns the names of the inputs, selects and text areas of the recipe form in
// web/shell.html, in page order: what the page fills from a draft and reads back.
func shellInputs(t testing.TB) []string {
	t.Helper()
	return shellFormInputs(t, "recipe")
}

// shellFormInputs returns the names of the inputs, selects and text areas of the form with
// id formID in web/shell.html, in page order.
func shellFormInputs(t testing.TB, formID string) []string {
	t.Helper()
	b, err := os.ReadFile("../../web/shell.html")
	if err != nil {
		t.Fatal(err)
	}
	page := string(b)
	start := strings.Index(page, `<form id="`+formID+`"`)
	end := strings.Index(page[max(start, 0):], "</form>")
	if start < 0 || end < 0 {
		t.Fatalf(`web/shell.html has no <form id="%s"> ... </form>`, formID)
	}
	form := page[start : start+end]
	var names []string
	for p := strings.IndexByte(form, '<'); p >= 0; {
		tag, after := htmlscan.TagName(form, p+1)
		next := after
		if tag == "input" || tag == "select" || tag == "textarea" {
			var name string
			name, next = htmlscan.Attr(form, after, "name")
			if next < 0 {
				t.Fatalf("web/shell.html: a <%s> in the %s form never ends", tag, formID)
			}
			if name != "" && !slices.Contains(names, name) {
				names = append(names, name)
			}
		}
		q := strings.IndexByte(form[next:], '<')
		if q < 0 {
			break
		}
		p = next + q
	}
	return names
}

// formKeys are the recipe table's keys the form has an input for (all but objects and the
// format).
func formKeys() []string {
	var keys []string
	for _, s := range recipe.FieldSpecs {
		if Known(s.Key) {
			keys = append(keys, s.Key)
		}
	}
	return keys
}

// The shell has an input for every key of the recipe table and none the table does not
// know, besides the controls that pick a choice of each group.
func TestShellInputsMatchRecipeTable(t *testing.T) {
	inputs := shellInputs(t)
	for _, k := range formKeys() {
		if !slices.Contains(inputs, k) {
			t.Errorf("web/shell.html has no input named %q in the recipe form (a key of recipe.Fields)", k)
		}
	}
	groups := map[string]bool{}
	for _, s := range recipe.FieldSpecs {
		if s.Group != "" {
			groups[s.Group] = true
			if groupInputs[s.Group] == "" {
				t.Errorf("group %q of recipe.Fields has no control in groupInputs", s.Group)
			}
		}
	}
	for _, name := range inputs {
		if Known(name) {
			continue
		}
		isGroup := false
		for g, control := range groupInputs {
			isGroup = isGroup || (control == name && groups[g])
		}
		if !isGroup {
			t.Errorf("web/shell.html has an input named %q that is not a key of recipe.Fields", name)
		}
	}
	for g := range groups {
		if !slices.Contains(inputs, groupInputs[g]) {
			t.Errorf("web/shell.html has no %q control for the group %q", groupInputs[g], g)
		}
	}
}

// throughForm opens r as the page does (app.load: FromRecipe, then every input shows
// Display in units u), has every input read back as the page reads a typed field
// (onRecipeInput: Draft.Set on the same draft), rebuilds the recipe from the draft (as
// planning, Save and Share do) and reads its JSON back (as storage, export and links do).
func throughForm(inputs []string, r recipe.Recipe, u Units) (recipe.Recipe, error) {
	d := FromRecipe(r)
	shown := make([]string, len(inputs))
	for i, name := range inputs {
		shown[i] = d.Display(name, u)
	}
	for i, name := range inputs {
		if err := d.Set(name, shown[i], u); err != nil {
			return recipe.Recipe{}, err
		}
	}
	got, err := d.Recipe()
	if err != nil {
		return recipe.Recipe{}, err
	}
	return recipe.Decode(got.Encode())
}

// retyped is like throughForm with nothing but the texts on screen: a new draft reads every
// input, as if the user typed each one afresh in units u.
func retyped(inputs []string, r recipe.Recipe, u Units) (recipe.Recipe, *Draft, error) {
	d := FromRecipe(r)
	back := NewDraft()
	for g, c := range d.Pick {
		back.Pick[g] = c
	}
	for _, name := range inputs {
		if err := back.Set(name, d.Display(name, u), u); err != nil {
			return recipe.Recipe{}, back, err
		}
	}
	got, err := back.Recipe()
	if err != nil {
		return recipe.Recipe{}, back, err
	}
	got, err = recipe.Decode(got.Encode())
	return got, back, err
}

// allUnits are every unit system the page offers (the selects in web/shell.html).
func allUnits() []Units {
	var us []Units
	for _, t := range []string{"C", "F", "K"} {
		for _, m := range []string{"g", "kg", "lb"} {
			for _, v := range []string{"mL", "L", "gal"} {
				us = append(us, Units{Temp: t, Mass: m, Volume: v})
			}
		}
	}
	return us
}

// tableRecipe returns a valid recipe with every key set that its choices allow, values drawn
// from each key's range in recipe.Fields (its bounds included when edges is set). Each
// group's choice is drawn too, so across many recipes every key of the table is set.
func tableRecipe(rng *rand.Rand, i int, edges bool) recipe.Recipe {
	r := recipe.Fields.New()
	pick := map[string]string{}
	var groups []string
	choices := map[string][]string{}
	for _, s := range recipe.FieldSpecs {
		if s.Group != "" && !slices.Contains(choices[s.Group], s.Choice) {
			if len(choices[s.Group]) == 0 {
				groups = append(groups, s.Group)
			}
			choices[s.Group] = append(choices[s.Group], s.Choice)
		}
	}
	for _, g := range groups {
		pick[g] = choices[g][rng.IntN(len(choices[g]))]
	}
	has := map[string]bool{"": true}
	for i := range recipe.Fields.Fields {
		f := &recipe.Fields.Fields[i]
		if !has[f.Parent()] || (f.Group != "" && pick[f.Group] != f.Choice) {
			continue
		}
		switch f.Kind {
		case recipe.Version:
		case recipe.Object:
			f.Make(&r)
			has[f.Key] = true
		case recipe.Text:
			var s string
			if f.Choices != nil {
				s = f.Choices[rng.IntN(len(f.Choices))]
			} else {
				s = randText(rng, f.MaxBytes-8)
				if f.Trim {
					s = strings.TrimSpace(s)
				}
				if strings.TrimSpace(s) == "" {
					s = "x" + s
				}
			}
			if f.Key == "name" {
				s += " #" + strconv.Itoa(i) // the shelf keeps recipes by name
			}
			*f.Text(&r) = s
		case recipe.Points:
			// The decoder's limits: −40 to 150 °C, 1e-6 to 1e5 g per 100 g water.
			var pts []recipe.Point
			for n := 3 + rng.IntN(8); len(pts) < n; {
				pts = append(pts, recipe.Point{TempC: randIn(rng, -40, 150), GPer100gWater: randIn(rng, 1e-6, 1e5)})
			}
			*f.Points(&r) = pts
		default:
			v := randSpec(rng, &f.Spec, edges)
			if f.Opt != nil {
				*f.Opt(&r) = recipe.Some(v)
			} else {
				*f.Num(&r) = v
			}
		}
	}
	return r
}

// randSpec draws a number s accepts; without edges, not within a millionth of the range of
// either bound (a bound shown with ten digits in another unit may round past itself).
func randSpec(rng *rand.Rand, s *recipe.Spec, edges bool) float64 {
	lo, hi := s.Min, s.Max
	if !edges {
		lo, hi = lo+(hi-lo)*1e-6, hi-(hi-lo)*1e-6
	}
	for {
		if v := randIn(rng, lo, hi); !(s.MinOpen && v <= s.Min) {
			return v
		}
	}
}

// formRecipes is how many random recipes go through the form in each unit system.
const formRecipes = 300

// Property: a recipe shown in the form and read back, planned, saved and read again is the
// same recipe, for random recipes with every key of the recipe table set (all choices of
// each group drawn), in every unit system the page offers. It goes through the page's own
// path (FromRecipe, Display, Draft.Set, Draft.Recipe) over the inputs web/shell.html has.
func TestFormRoundTripEveryKey(t *testing.T) {
	inputs := shellInputs(t)
	rng := rand.New(rand.NewPCG(20261202, 7))
	covered := map[string]bool{}
	units := allUnits()
	for i := range formRecipes {
		r := tableRecipe(rng, i, true)
		if _, err := recipe.Decode(r.Encode()); err != nil {
			t.Fatalf("generator made an invalid recipe %d: %v\n%s", i, err, r.Encode())
		}
		f := FromRecipe(r)
		for k := range f.Text {
			covered[k] = true
		}
		for k := range f.Num {
			covered[k] = true
		}
		if f.Points != nil {
			covered["custom.points"] = true
		}
		for _, u := range units {
			got, err := throughForm(inputs, r, u)
			if err != nil {
				t.Fatalf("recipe %d in %v: through the form: %v\n%s", i, u, err, r.Encode())
			}
			if !reflect.DeepEqual(got, r) || string(got.Encode()) != string(r.Encode()) {
				t.Fatalf("recipe %d in %v changed through the form:\n got %s\nwant %s", i, u, got.Encode(), r.Encode())
			}
		}
	}
	for _, k := range formKeys() {
		if !covered[k] {
			t.Errorf("no random recipe set %q: the generator misses a key of recipe.Fields", k)
		}
	}
}

// Property: typed afresh from what the form shows, in every unit system, a recipe comes
// back with every text, point and choice exact and every number showing the same text in
// that unit (ten significant digits of a converted unit, every digit of the others).
func TestFormRetypedEveryKey(t *testing.T) {
	inputs := shellInputs(t)
	rng := rand.New(rand.NewPCG(20261202, 8))
	for i := range formRecipes / 3 {
		r := tableRecipe(rng, i, false)
		want := FromRecipe(r)
		for _, u := range allUnits() {
			got, back, err := retyped(inputs, r, u)
			if err != nil {
				t.Fatalf("recipe %d in %v: typed afresh: %v\n%s\n%s", i, u, err, r.Encode(), back.JSON())
			}
			g := FromRecipe(got)
			if !reflect.DeepEqual(g.Text, want.Text) || !reflect.DeepEqual(g.Points, want.Points) || !reflect.DeepEqual(g.Pick, want.Pick) {
				t.Fatalf("recipe %d in %v: texts, points or choices changed:\n got %s\nwant %s", i, u, got.Encode(), r.Encode())
			}
			if len(g.Num) != len(want.Num) {
				t.Fatalf("recipe %d in %v: %d numbers came back, want %d:\n got %s\nwant %s", i, u, len(g.Num), len(want.Num), got.Encode(), r.Encode())
			}
			for k := range want.Num {
				if gs, ws := g.Display(k, u), want.Display(k, u); gs != ws {
					t.Errorf("recipe %d in %v: %s shows %q after the round trip, %q before", i, u, k, gs, ws)
				}
			}
		}
	}
}

// resultTol covers the six significant digits of numbers in the plan's JSON (relative).
const resultTol = 1e-5

// The liquor's heat capacity given in a recipe counts when the recipe is opened from a share
// link or an import, as it does in the CLI: potassium nitrate, 40 → 10 °C, 2.0 kJ/(kg·K)
// (an invented batch). Both sides are computed; the built-in model gives another answer, so
// the key must have been used.
func TestLiquorHeatCapacityReachesThePlan(t *testing.T) {
	src := []byte(`{"format":1,"name":"KNO3 with a measured liquor heat capacity (invented)","solute":"KNO3",` +
		`"water_g":100,"dissolve_temp_C":40,"cool_to_C":10,"liquor_heat_capacity_kJ_per_kgK":2.0}`)
	cli := func(body []byte) float64 {
		t.Helper()
		out, err := api.Plan(body)
		if err != nil {
			t.Fatal(err)
		}
		v, err := wire.Decode(out)
		if err != nil {
			t.Fatal(err)
		}
		s, ok := v.Get("sensible_heat_kJ")
		if !ok || s.Kind != wire.Number {
			t.Fatalf("the CLI's plan has no sensible_heat_kJ: %s", out)
		}
		return s.Num
	}
	want := cli(src)
	r, err := recipe.Decode(src)
	if err != nil {
		t.Fatal(err)
	}
	builtIn := r
	builtIn.LiquorHeatCapacityKJPerKgK = recipe.Opt{}
	if other := cli(builtIn.Encode()); math.Abs(other-want) <= resultTol*math.Abs(want) {
		t.Fatalf("sensible heat %v kJ with 2.0 kJ/(kg·K) and %v with the built-in model: the case does not tell them apart", want, other)
	}

	// opened is what the page plans once it shows r (app.load, then recompute).
	opened := func(how string, r recipe.Recipe) {
		t.Helper()
		got, err := FromRecipe(r).Recipe()
		if err != nil {
			t.Fatalf("%s: %v", how, err)
		}
		res, err := recipe.Plan(got)
		if err != nil {
			t.Fatalf("%s: plan: %v", how, err)
		}
		if math.Abs(res.SensibleHeatKJ-want) > resultTol*math.Abs(want) {
			t.Errorf("%s: sensible heat %v kJ in the page, %v kJ in the CLI", how, res.SensibleHeatKJ, want)
		}
	}
	linked, ok, err := FromFragment(ShareFragment(r))
	if !ok || err != nil {
		t.Fatalf("FromFragment(ShareFragment(r)) = %v, %v", ok, err)
	}
	opened("share link", linked)
	var shelf Shelf
	if _, err := shelf.Import(recipe.EncodeCollection([]recipe.Recipe{r})); err != nil {
		t.Fatal(err)
	}
	got, _ := shelf.Get(r.Name)
	opened("import", got)
}

// The sheet's and the CSV's rows of recipe numbers come from the recipe table: every
// number key outside the custom compound that a recipe sets has a row, labelled and with
// its unit.
func TestInputRowsCoverTable(t *testing.T) {
	rng := rand.New(rand.NewPCG(20261202, 9))
	seen := map[string]bool{}
	for i := range 50 {
		for _, row := range InputRows(tableRecipe(rng, i, true), Units{Temp: "F", Mass: "lb", Volume: "gal"}) {
			if row.Label == "" || row.Text == "" {
				t.Errorf("row %+v lacks a label or a value", row)
			}
			if s, _ := recipe.FieldSpecs.Lookup(row.Key); s.Kind == recipe.Plain && !isDelta(s) && row.Unit != s.Unit {
				t.Errorf("row %s has unit %q, want %q", row.Key, row.Unit, s.Unit)
			} else if isDelta(s) && row.Unit != "°F" {
				t.Errorf("row %s, a temperature difference, has unit %q in °F, want °F", row.Key, row.Unit)
			}
			seen[row.Key] = true
		}
	}
	var missing []string
	for _, s := range recipe.FieldSpecs {
		if s.Kind.IsNumber() && s.Parent() == "" && !seen[s.Key] {
			missing = append(missing, s.Key)
		}
	}
	sort.Strings(missing)
	if len(missing) > 0 {
		t.Errorf("keys with no sheet or CSV row: %v", missing)
	}
}

// The page's example buttons are exactly the demo recipes of core/recipe/demo.
func TestShellOffersEveryDemo(t *testing.T) {
	b, err := os.ReadFile("../../web/shell.html")
	if err != nil {
		t.Fatal(err)
	}
	page := string(b)
	var offered []string
	for p := strings.Index(page, "<button"); p >= 0; {
		key, end := htmlscan.Attr(page, p+len("<button"), "data-demo")
		if end < 0 {
			t.Fatal("web/shell.html: a <button> never ends")
		}
		if key != "" {
			offered = append(offered, key)
		}
		q := strings.Index(page[end:], "<button")
		if q < 0 {
			break
		}
		p = end + q
	}
	var want []string
	for _, d := range demo.All {
		want = append(want, d.Key)
	}
	if !slices.Equal(offered, want) {
		t.Errorf("web/shell.html offers the demos %v, core/recipe/demo has %v", offered, want)
	}
}
