package main

import (
	"math"
	"math/rand/v2"
	"reflect"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"

	"saltcast/core/recipe"
)

// roundTripRecipes is how many random recipes go through every path the page uses to keep,
// export, import and share recipes.
const roundTripRecipes = 1000

// Text a technician might type, and text meant to break out of JSON, HTML or a URL.
var awkwardText = []string{
	"Kupfersulfat Ansatz", "Lösung für Zürich", "硫酸铜 结晶", "Сульфат меди", "كبريتات النحاس",
	"🧪 batch ✓", "e\u0301t\u00e9 (combining)", "\u2028line sep\u2029", "tab\there", "new\nline",
	`"quoted" and 'single'`, `back\slash \\ \"`, "<script>alert(1)</script>", `<img src=x onerror="window.__xss=1">`,
	`"><svg onload=window.__xss=1>`, "&amp; &lt; &#x3c;", "#recipe=AAAA", "%00%2F?&=", "}]},{\"name\":",
	"\u0000nul \u001f unit sep", "\ufeffBOM", "\U0010FFFF max rune", "  leading and trailing  ",
	"(invented) trial", "--></script><!--",
}

var libSolutes = []struct{ solute, form string }{
	{"KNO3", ""}, {"NaCl", ""}, {"CuSO4", ""}, {"CuSO4", "CuSO4·5H2O"}, {"potassium nitrate", ""},
	{"KAl(SO4)2", "KAl(SO4)2·12H2O"}, {"Na2SO4", "Na2SO4·10H2O"},
}

// randText returns text of at most max bytes: pieces of awkwardText and random code points
// from several planes, always valid UTF-8 (what a browser text field can hold).
func randText(rng *rand.Rand, max int) string {
	var b strings.Builder
	want := 1 + rng.IntN(max)
	if rng.IntN(4) > 0 { // most text is short
		want = 1 + rng.IntN(min(max, 60))
	}
	for b.Len() < want {
		var piece string
		switch rng.IntN(3) {
		case 0:
			piece = awkwardText[rng.IntN(len(awkwardText))]
		case 1:
			piece = string(rune('a' + rng.IntN(26)))
		default:
			var r rune
			for {
				r = rune(rng.IntN(0x30000))
				if utf8.ValidRune(r) {
					break
				}
			}
			piece = string(r)
		}
		if b.Len()+len(piece) > want {
			break
		}
		b.WriteString(piece)
	}
	if b.Len() == 0 {
		b.WriteByte('x')
	}
	return b.String()
}

// randIn returns a number in [lo, hi]: a bound itself, a value on a 0.1 grid, or any float64
// between them (all 17 digits, so the round trip must keep every bit).
func randIn(rng *rand.Rand, lo, hi float64) float64 {
	switch rng.IntN(8) {
	case 0:
		return lo
	case 1:
		return hi
	case 2, 3:
		v := math.Round((lo+rng.Float64()*(hi-lo))*10) / 10
		return math.Max(lo, math.Min(hi, v))
	}
	return lo + rng.Float64()*(hi-lo)
}

// randPositive is like randIn for a lower bound that is excluded (0 < v ≤ hi).
func randPositive(rng *rand.Rand, hi float64) float64 {
	for {
		if v := randIn(rng, 0, hi); v > 0 {
			return v
		}
	}
}

func maybe(rng *rand.Rand) bool { return rng.IntN(2) == 0 }

// randRecipe returns a valid recipe (one Decode accepts), with a name unique by its index i.
func randRecipe(rng *rand.Rand, i int) recipe.Recipe {
	r := recipe.Recipe{Format: recipe.CurrentFormat}
	suffix := " #" + strconv.Itoa(i)
	r.Name = randText(rng, 200-len(suffix)) + suffix
	if maybe(rng) {
		max := 200
		if rng.IntN(10) == 0 {
			max = 4000 // a long note now and then
		}
		r.Notes = randText(rng, max)
	}
	if rng.IntN(4) == 0 {
		c := &recipe.Custom{
			Name:             randText(rng, 200),
			MolarMassGPerMol: randIn(rng, 1, 1e4),
			Model:            []string{"table", "vant-hoff", "apelblat", "polynomial"}[rng.IntN(4)],
		}
		if strings.TrimSpace(c.Name) == "" {
			c.Name = "x" + c.Name
		}
		for n := 3 + rng.IntN(8); len(c.Points) < n; {
			c.Points = append(c.Points, recipe.Point{TempC: randIn(rng, -40, 150), GPer100gWater: randIn(rng, 1e-6, 1e5)})
		}
		if maybe(rng) {
			c.Source = randText(rng, 200)
		}
		if maybe(rng) {
			c.SolutionEnthalpyKJPerMol = recipe.Some(randIn(rng, -500, 500))
		}
		r.Custom = c
	} else {
		s := libSolutes[rng.IntN(len(libSolutes))]
		r.Solute, r.ChargedForm = s.solute, s.form
	}
	if maybe(rng) {
		r.PurityPct = recipe.Some(randPositive(rng, 100))
	}
	if maybe(rng) {
		r.WaterG = recipe.Some(randIn(rng, 1e-3, 1e7))
	} else {
		r.WaterML = recipe.Some(randIn(rng, 1e-3, 1e7))
		if maybe(rng) {
			r.WaterTempC = recipe.Some(randIn(rng, 0, 100))
		}
	}
	r.DissolveTempC = randIn(rng, -40, 150)
	switch rng.IntN(4) {
	case 0:
		r.SaturationPct = recipe.Some(randPositive(rng, 100))
	case 1:
		r.ChargeG = recipe.Some(randIn(rng, 1e-3, 1e7))
	case 2:
		r.ClearDownToC = recipe.Some(randIn(rng, -40, 150))
		if maybe(rng) {
			r.ClearMarginK = recipe.Some(randIn(rng, 0, 50))
		}
	}
	opt := func(o *recipe.Opt, v func() float64) {
		if maybe(rng) {
			*o = recipe.Some(v())
		}
	}
	opt(&r.CoolToC, func() float64 { return randIn(rng, -40, 150) })
	opt(&r.EvaporatedWaterG, func() float64 { return randIn(rng, 0, 1e7) })
	opt(&r.SeedAtC, func() float64 { return randIn(rng, -40, 150) })
	opt(&r.MetastableWidthK, func() float64 { return randPositive(rng, 50) })
	opt(&r.CoolingTimeMin, func() float64 { return randPositive(rng, 1e5) })
	opt(&r.LiquorHeatCapacityKJPerKgK, func() float64 { return randIn(rng, 0.5, 10) })
	opt(&r.VesselHeatCapacityJPerK, func() float64 { return randIn(rng, 0, 1e8) })
	return r
}

// randRecipes returns n random recipes from a fixed seed, so a failure can be replayed.
func randRecipes(t *testing.T, n int) []recipe.Recipe {
	t.Helper()
	rng := rand.New(rand.NewPCG(20261201, 6))
	rs := make([]recipe.Recipe, n)
	for i := range rs {
		rs[i] = randRecipe(rng, i)
		// The generator must make recipes the page could hold; a generator bug is not a
		// round-trip failure.
		if _, err := recipe.Decode(rs[i].Encode()); err != nil {
			t.Fatalf("generator made an invalid recipe %d: %v\n%s", i, err, rs[i].Encode())
		}
	}
	return rs
}

// exactRecipe reports whether got is want, field by field and byte by byte when encoded.
func exactRecipe(t *testing.T, what string, got, want recipe.Recipe) {
	t.Helper()
	if !reflect.DeepEqual(got, want) {
		t.Errorf("%s: recipe %q changed:\n got %#v\nwant %#v", what, want.Name, got, want)
		return
	}
	if g, w := string(got.Encode()), string(want.Encode()); g != w {
		t.Errorf("%s: recipe %q encodes differently:\n got %s\nwant %s", what, want.Name, g, w)
	}
}

// Export → import gives back exactly the recipes saved, for 1000 random recipes: one at a
// time (the "export this recipe" file), all at once ("export all", which is also what the
// browser stores), through the stored shelf, and through a share link. Each recipe is saved
// from the form and opened in it again as the page does (throughForm).
func TestRoundTripRandomRecipes(t *testing.T) {
	rs := randRecipes(t, roundTripRecipes)
	inputs := shellInputs(t)

	// Saved one by one, as the Save button does: the recipe on screen (shown in the form
	// and read back from it) is what is saved.
	var shelf Shelf
	for i, r := range rs {
		got, err := throughForm(inputs, r, DefaultUnits)
		if err != nil {
			t.Fatalf("recipe %d: through the form: %v", i, err)
		}
		exactRecipe(t, "shown in the form and saved", got, r)
		shelf.Put(got)
	}
	if len(shelf.Recipes) != len(rs) {
		t.Fatalf("shelf holds %d recipes after saving %d with distinct names", len(shelf.Recipes), len(rs))
	}

	// "Export all" and what the browser stores: the same bytes, read back on the next visit.
	stored := shelf.Encode()
	if len(stored) > recipe.MaxCollectionBytes {
		t.Fatalf("the export of %d recipes is %d bytes, more than an import accepts (%d)", len(rs), len(stored), recipe.MaxCollectionBytes)
	}
	loaded, err := LoadShelf(string(stored))
	if err != nil {
		t.Fatalf("LoadShelf(stored shelf): %v", err)
	}
	var imported Shelf
	n, err := imported.Import(stored)
	if err != nil || n != len(rs) {
		t.Fatalf("Import(export all) = %d, %v; want %d, nil", n, err, len(rs))
	}
	for i, r := range rs {
		exactRecipe(t, "stored and reloaded", loaded.Recipes[i], r)
		exactRecipe(t, "export all, import", imported.Recipes[i], r)
		if opened, err := throughForm(inputs, imported.Recipes[i], DefaultUnits); err != nil {
			t.Errorf("recipe %d: imported and opened in the form: %v", i, err)
		} else {
			exactRecipe(t, "imported and opened in the form", opened, r)
		}
	}
	if again := imported.Encode(); string(again) != string(stored) {
		t.Errorf("export after import differs from the first export (%d vs %d bytes)", len(again), len(stored))
	}

	for i, r := range rs {
		// "Export this recipe": a collection of one, imported into an empty shelf.
		var one Shelf
		if n, err := one.Import(recipe.EncodeCollection([]recipe.Recipe{r})); err != nil || n != 1 {
			t.Errorf("recipe %d: Import(export one) = %d, %v", i, n, err)
		} else {
			exactRecipe(t, "export one, import", one.Recipes[0], r)
		}
		// A single recipe file (not a collection) is read too.
		if got, err := ReadImport(r.Encode()); err != nil || len(got.Recipes) != 1 {
			t.Errorf("recipe %d: ReadImport(single recipe) = %d recipes, %v", i, len(got.Recipes), err)
		} else {
			exactRecipe(t, "single recipe file", got.Recipes[0], r)
		}
		// The share link.
		frag := ShareFragment(r)
		if strings.ContainsAny(frag[len(shareKey):], "<>\"' #%&?/+=") {
			t.Errorf("recipe %d: share fragment holds characters outside base64url: %s", i, frag)
		}
		got, ok, err := FromFragment(frag)
		if !ok || err != nil {
			t.Errorf("recipe %d: FromFragment(ShareFragment(r)) = ok %v, %v", i, ok, err)
			continue
		}
		exactRecipe(t, "share link", got, r)
		// Opened from the link, the page shows it in the form and plans what it reads back.
		if opened, err := throughForm(inputs, got, DefaultUnits); err != nil {
			t.Errorf("recipe %d: share link opened in the form: %v", i, err)
		} else {
			exactRecipe(t, "share link opened in the form", opened, r)
		}
	}
}

// Importing the export of a shelf into a shelf that already holds some of the same names
// replaces those by name and keeps the rest, so the result is the union with the import
// winning; nothing else is lost.
func TestImportOverExistingKeepsOthers(t *testing.T) {
	rs := randRecipes(t, 200)
	var mine Shelf
	for _, r := range rs[:120] {
		mine.Put(r)
	}
	var theirs Shelf
	for _, r := range rs[80:] {
		theirs.Put(r)
	}
	if _, err := mine.Import(theirs.Encode()); err != nil {
		t.Fatal(err)
	}
	if len(mine.Recipes) != len(rs) {
		t.Fatalf("after import the shelf holds %d recipes, want %d", len(mine.Recipes), len(rs))
	}
	for _, r := range rs {
		got, ok := mine.Get(r.Name)
		if !ok {
			t.Errorf("recipe %q lost by the import", r.Name)
			continue
		}
		exactRecipe(t, "import over existing", got, r)
	}
}
