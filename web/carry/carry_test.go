package carry

import (
	"bytes"
	"errors"
	hashcrc "hash/crc32"
	"math/rand/v2"
	"saltcast/core/recipe"
	"saltcast/core/recipe/demo"
	"strconv"
	"strings"
	"testing"

	"saltcast/core/unit"
	"saltcast/core/wire"
)

// testPage is a small page shaped like the bench app: a strict CSP, an inline data script,
// script text that mentions the block's markup (as a loader might), a comment and an empty
// carried block.
const testPage = `<!doctype html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; script-src 'unsafe-inline'">
<title>Saltcast <script type="application/x-saltcast-recipes"> is only text here</title>
<style>p::after { content: "<script type='application/x-saltcast-recipes'>" }</style>
</head><body><p>app</p>
<!-- <script type="application/x-saltcast-recipes" id="saltcast-carried">{}</script> -->
<script id="saltcast-wasm" type="application/octet-stream">H4sIAAAAAAAA/wEAAP//AAAAAAAAAAA=</script>
<script>var s = '<script type="application/x-saltcast-recipes" id="saltcast-carried">'; // "</body>"
</script>
<script type="application/x-saltcast-recipes" id="saltcast-carried"></script>
</body>
</html>
`

// pageNoBlock is testPage without the empty block, as an older Saltcast page would be.
var pageNoBlock = strings.Replace(testPage,
	"<script type=\"application/x-saltcast-recipes\" id=\"saltcast-carried\"></script>\n", "", 1)

// demoRecipes reads the invented demo recipes (core/recipe/demo) and adds one whose name is
// markup, as a hostile or careless sender might type it.
func demoRecipes(t testing.TB) []recipe.Recipe {
	t.Helper()
	var rs []recipe.Recipe
	for _, d := range demo.All {
		r, err := demo.Recipe(d.Key)
		if err != nil {
			t.Fatalf("%s: %v", d.File, err)
		}
		rs = append(rs, r)
	}
	hostile, err := recipe.Decode([]byte(`{"name":"<img src=x onerror=alert(1)></script><script>alert(2)</script><!--",
		"notes":"(invented) & ]]> \u2028 end","solute":"KNO3","water_g":100,"dissolve_temp_C":60}`))
	if err != nil {
		t.Fatal(err)
	}
	return append(rs, hostile)
}

func demoCarried(t testing.TB) Carried {
	return Carried{AppVersion: "v0.9-test", SavedAt: "2026-12-01T09:30:00Z", SentBy: "Ana (bench 3) <ana@lab>",
		Recipes: demoRecipes(t)}
}

func sameRecipes(t *testing.T, what string, got, want []recipe.Recipe) {
	t.Helper()
	if g, w := recipe.EncodeCollection(got), recipe.EncodeCollection(want); !bytes.Equal(g, w) {
		t.Errorf("%s: recipes\n got %s\nwant %s", what, g, w)
	}
}

func TestCRC32(t *testing.T) {
	// Check value of CRC-32/ISO-HDLC: Greg Cook, "Catalogue of parametrised CRC algorithms"
	// (reveng), entry CRC-32/ISO-HDLC, check=0xcbf43926.
	if got := crc32([]byte("123456789")); got != 0xCBF43926 {
		t.Errorf("crc32(123456789) = %#08x, want 0xcbf43926", got)
	}
	// The CRC of the empty string is 0 for this CRC (init and xorout both 0xffffffff;
	// same catalogue entry).
	if got := crc32(nil); got != 0 {
		t.Errorf("crc32(nil) = %#08x, want 0", got)
	}
	// Go's hash/crc32 (IEEE) is an independent implementation of the same CRC.
	rng := rand.New(rand.NewPCG(1, 2))
	for n := range 200 {
		b := make([]byte, n*7)
		for i := range b {
			b[i] = byte(rng.Uint32())
		}
		if got, want := crc32(b), hashcrc.ChecksumIEEE(b); got != want {
			t.Fatalf("crc32(%d random bytes) = %#08x, hash/crc32 says %#08x", len(b), got, want)
		}
	}
}

func TestCarriedRoundTrip(t *testing.T) {
	c := demoCarried(t)
	for _, page := range []string{testPage, pageNoBlock} {
		copy1, err := WithCarried([]byte(page), c)
		if err != nil {
			t.Fatal(err)
		}
		got, err := ExtractCarried(copy1)
		if err != nil {
			t.Fatalf("ExtractCarried(copy) = %v", err)
		}
		if !got.Sealed || got.AppVersion != c.AppVersion || got.SavedAt != c.SavedAt || got.SentBy != c.SentBy {
			t.Errorf("ExtractCarried(copy) = %+v, want the sender's details sealed", got)
		}
		sameRecipes(t, "round trip", got.Recipes, c.Recipes)

		// The copy is the page with one block more or one block filled: nothing else moved.
		block, _ := CarriedBlock(c)
		if n := bytes.Count(copy1, []byte(`id="saltcast-carried">{"format"`)); n != 1 {
			t.Errorf("copy holds %d filled blocks, want 1", n)
		}
		if rest := bytes.Replace(copy1, block, nil, 1); !strings.Contains(page, strings.TrimSpace(string(rest[:40]))) {
			t.Errorf("copy does not start like the page")
		}
		// A copy of the copy carries the new recipes only.
		c2 := Carried{AppVersion: "v1", Recipes: c.Recipes[:1]}
		copy2, err := WithCarried(copy1, c2)
		if err != nil {
			t.Fatal(err)
		}
		got2, err := ExtractCarried(copy2)
		if err != nil {
			t.Fatal(err)
		}
		sameRecipes(t, "copy of a copy", got2.Recipes, c2.Recipes)
		if len(copy2) >= len(copy1) {
			t.Errorf("copy of a copy is %d bytes, the first copy %d: the old block stayed", len(copy2), len(copy1))
		}
	}
}

// The block must not end the <script> early or start anything the HTML parser treats
// specially inside script text.
func TestCarriedBlockIsInert(t *testing.T) {
	js, err := EncodeCarried(demoCarried(t))
	if err != nil {
		t.Fatal(err)
	}
	if i := bytes.IndexAny(js, "<>&"); i >= 0 {
		t.Errorf("carried JSON has %q at byte %d; it must not, inside a <script>", js[i], i)
	}
	if _, err := wire.DecodeLimits(js, wire.Limits{MaxBytes: len(js)}); err != nil {
		t.Errorf("carried JSON is not strict JSON: %v", err)
	}
	block, _ := CarriedBlock(demoCarried(t))
	if !bytes.HasPrefix(block, []byte(`<script type="application/x-saltcast-recipes" id="saltcast-carried">`)) {
		t.Errorf("block starts %q", block[:80])
	}
	if n := bytes.Count(bytes.ToLower(block), []byte("</script")); n != 1 {
		t.Errorf("block holds %d </script, want 1 (its own end)", n)
	}
}

func TestExtractCarriedRefuses(t *testing.T) {
	c := demoCarried(t)
	good, err := WithCarried([]byte(testPage), c)
	if err != nil {
		t.Fatal(err)
	}
	js, _ := EncodeCarried(c)
	blockAt := bytes.Index(good, js)
	// the checksum itself edited: one hex digit changed
	sumAt := bytes.Index(good, []byte(`"crc32":"`)) + len(`"crc32":"`)
	flipped := bytes.Clone(good)
	flipped[sumAt] = "0123456789abcdef"[(strings.IndexByte("0123456789abcdef", flipped[sumAt])+1)%16]
	edit := func(old, new string) []byte {
		if !bytes.Contains(good, []byte(old)) {
			t.Fatalf("test page has no %q", old)
		}
		return bytes.Replace(good, []byte(old), []byte(new), 1)
	}
	cases := []struct {
		name string
		in   []byte
		kind error
	}{
		// nothing to take
		{"empty file", nil, ErrNoRecipes},
		{"page without recipes", []byte(testPage), ErrNoRecipes},
		{"older page without a block", []byte(pageNoBlock), ErrNoRecipes},
		{"other HTML", []byte("<!doctype html><p>hello</p>"), ErrNoRecipes},
		{"plain text", []byte("water 100 g"), ErrNoRecipes},
		// changed after saving
		{"a number changed", edit(`"dissolve_temp_C":35`, `"dissolve_temp_C":36`), ErrChecksum},
		{"a name changed", edit(`Potassium nitrate stock`, `Potassium nitrate stick`), ErrChecksum},
		{"the sender changed", edit(`Ana (bench 3)`, `Bob (bench 3)`), ErrChecksum},
		{"the checksum changed", flipped, ErrChecksum},
		{"a recipe taken out", dropFirstRecipe(t, good), ErrChecksum},
		// cut short or broken
		{"cut inside the block", good[:blockAt+len(js)/2], ErrMalformed},
		{"cut inside the end tag", good[:blockAt+len(js)+4], ErrMalformed},
		{"broken JSON", edit(`"recipes":{`, `"recipes":{,`), ErrMalformed},
		{"unknown key", edit(`"sent_by":`, `"sender":1,"sent_by":`), ErrMalformed},
		{"a bad recipe", edit(`"water_mL":20000`, `"water_mL":-20000`), ErrMalformed},
		{"checksum missing", []byte(strings.Replace(string(good), `,"crc32":"`, `,"crc":"`, 1)), ErrMalformed},
		{"two blocks", twoBlocks(t, good), ErrMalformed},
		{"a collection in the block", blockWith(t, string(recipe.EncodeCollection(c.Recipes))), ErrMalformed},
		{"saved_at not a time", blockWith(t, resealed(t, `"saved_at":"2026-12-01T09:30:00Z"`, `"saved_at":"yesterday"`)), ErrMalformed},
		{"a sealed bad recipe", blockWith(t, resealed(t, `"water_mL":20000`, `"water_mL":0`)), ErrMalformed},
		// newer
		{"newer block", blockWith(t, `{"format":`+strconv.Itoa(CarriedFormat+1)+`,"kind":"saltcast-carried-recipes","shelf":[],"sig":"x"}`), ErrNewerFormat},
		{"newer collection in a block", blockWith(t, resealed(t, `"recipes":{"format":1,`, `"recipes":{"format":2,"items":[],`)), ErrNewerFormat},
		{"newer JSON export", []byte(`{"format":3,"kind":"saltcast-recipes","things":[]}`), ErrNewerFormat},
		{"newer single recipe", []byte(`{"format":2,"name":"x","solvent":"ethanol"}`), ErrNewerFormat},
		// JSON exports that do not read
		{"collection with an unnamed recipe", []byte(`{"format":1,"kind":"saltcast-recipes","recipes":[{"solute":"KNO3","water_g":1,"dissolve_temp_C":20}]}`), ErrMalformed},
		{"empty collection", []byte(`{"format":1,"kind":"saltcast-recipes","recipes":[]}`), ErrNoRecipes},
		{"JSON array", []byte(`[1,2]`), ErrMalformed},
		{"JSON of another kind", []byte(`{"kind":"other"}`), ErrMalformed},
	}
	for _, tc := range cases {
		got, err := ExtractCarried(tc.in)
		if !errors.Is(err, tc.kind) {
			t.Errorf("%s: ExtractCarried error = %v, want kind %v", tc.name, err, tc.kind)
			continue
		}
		var ce *CarryError
		if !errors.As(err, &ce) {
			t.Errorf("%s: error %T is not a *CarryError", tc.name, err)
		}
		if got.Recipes != nil || got.Sealed || got.SentBy != "" {
			t.Errorf("%s: ExtractCarried gave %+v with its error; want nothing", tc.name, got)
		}
	}
}

// resealed returns the carried JSON of the demo with old replaced by new and the checksum
// made to match again, so only the replaced value is wrong.
func resealed(t *testing.T, old, new string) string {
	t.Helper()
	js, _ := EncodeCarried(demoCarried(t))
	body := string(js[:bytes.LastIndex(js, []byte(`,"crc32":"`))])
	if !strings.Contains(body, old) {
		t.Fatalf("no %s in the carried JSON", old)
	}
	body = strings.Replace(body, old, new, 1)
	return body + `,"crc32":"` + string(appendHex32(nil, crc32([]byte(body)))) + `"}`
}

func blockWith(t *testing.T, js string) []byte {
	t.Helper()
	return []byte(strings.Replace(testPage, `id="saltcast-carried"></script>`, `id="saltcast-carried">`+js+`</script>`, 1))
}

func twoBlocks(t *testing.T, page []byte) []byte {
	block, _ := CarriedBlock(demoCarried(t))
	at := bytes.LastIndex(page, []byte("</body>"))
	return append(append(append([]byte{}, page[:at]...), block...), page[at:]...)
}

// dropFirstRecipe takes the first recipe out of the carried collection, leaving valid JSON.
func dropFirstRecipe(t *testing.T, page []byte) []byte {
	t.Helper()
	first := demoRecipes(t)[0].Encode()
	out := bytes.Replace(page, append(first, ','), nil, 1)
	if bytes.Equal(out, page) {
		t.Fatal("the first recipe is not in the page as encoded")
	}
	return out
}

// What a mail program or editor may do to a file without changing any value.
func TestExtractCarriedToleratesReformatting(t *testing.T) {
	c := demoCarried(t)
	good, _ := WithCarried([]byte(testPage), c)
	js, _ := EncodeCarried(c)
	spaced := bytes.ReplaceAll(bytes.ReplaceAll(js, []byte(`,"`), []byte(",\n  \"")), []byte(`":`), []byte(`": `))
	for name, in := range map[string][]byte{
		"CR LF line ends":     bytes.ReplaceAll(good, []byte("\n"), []byte("\r\n")),
		"byte order mark":     append([]byte("\xEF\xBB\xBF"), good...),
		"JSON spread out":     bytes.Replace(good, js, spaced, 1),
		"numbers written 1e2": bytes.Replace(good, []byte(`"purity_pct":99`), []byte(`"purity_pct":0.99e2`), 1),
		"upper-case tag":      bytes.Replace(good, []byte(`<script type="application/x-saltcast-recipes"`), []byte(`<SCRIPT TYPE='Application/X-Saltcast-Recipes '`), 1),
		"unquoted type":       bytes.Replace(good, []byte(`<script type="application/x-saltcast-recipes" id="saltcast-carried">`), []byte(`<script id=saltcast-carried type=application/x-saltcast-recipes>`), 1),
		"the JSON alone":      js,
	} {
		got, err := ExtractCarried(in)
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		if !got.Sealed || got.SentBy != c.SentBy {
			t.Errorf("%s: got %+v", name, got)
		}
		sameRecipes(t, name, got.Recipes, c.Recipes)
	}
}

func TestExtractCarriedJSONExports(t *testing.T) {
	rs := demoRecipes(t)
	got, err := ExtractCarried(recipe.EncodeCollection(rs))
	if err != nil {
		t.Fatal(err)
	}
	if got.Sealed || got.SentBy != "" {
		t.Errorf("a JSON export read as %+v; it has no seal and no sender", got)
	}
	sameRecipes(t, "collection", got.Recipes, rs)

	got, err = ExtractCarried(rs[1].Encode())
	if err != nil {
		t.Fatal(err)
	}
	sameRecipes(t, "single recipe", got.Recipes, rs[1:2])
}

func TestEncodeCarriedRefuses(t *testing.T) {
	base := demoCarried(t)
	many := make([]recipe.Recipe, recipe.MaxCollectionRecipes+1)
	for i := range many {
		many[i] = base.Recipes[0]
	}
	for _, tc := range []struct {
		field string
		edit  func(*Carried)
	}{
		{"saved_at", func(c *Carried) { c.SavedAt = "2026-12-01 09:30" }},
		{"saved_at", func(c *Carried) { c.SavedAt = "2026-12-01T09:30:00+01:00" }},
		{"sent_by", func(c *Carried) { c.SentBy = strings.Repeat("x", 201) }},
		{"sent_by", func(c *Carried) { c.SentBy = "\xff" }},
		{"app_version", func(c *Carried) { c.AppVersion = strings.Repeat("v", 101) }},
		{"recipes", func(c *Carried) { c.Recipes = many }},
		{"recipes[0]", func(c *Carried) { c.Recipes = []recipe.Recipe{{Name: strings.Repeat("n", 201), Solute: "KNO3"}} }},
	} {
		c := base
		tc.edit(&c)
		_, err := EncodeCarried(c)
		var fe *unit.FieldError
		if !errors.As(err, &fe) || fe.Field != tc.field {
			t.Errorf("EncodeCarried with a bad %s: error %v, want a FieldError on %s", tc.field, err, tc.field)
		}
		if _, err := WithCarried([]byte(testPage), c); err == nil {
			t.Errorf("WithCarried with a bad %s: no error", tc.field)
		}
	}
	if _, err := WithCarried([]byte("<p>no body end</p>"), base); !errors.Is(err, ErrMalformed) {
		t.Errorf("WithCarried on a page without </body>: %v, want ErrMalformed", err)
	}
	if _, err := WithCarried(twoBlocks(t, []byte(testPage)), base); !errors.Is(err, ErrMalformed) {
		t.Errorf("WithCarried on a page with two blocks: %v, want ErrMalformed", err)
	}
}

func TestCarryErrorMessages(t *testing.T) {
	c := demoCarried(t)
	good, _ := WithCarried([]byte(testPage), c)
	for _, tc := range []struct {
		in   []byte
		want []string
	}{
		{[]byte(testPage), []string{"no Saltcast recipes"}},
		{bytes.Replace(good, []byte(`"dissolve_temp_C":35`), []byte(`"dissolve_temp_C":36`), 1), []string{"changed or cut short", "checksum"}},
		{[]byte(`{"format":2,"kind":"saltcast-recipes"}`), []string{"newer Saltcast", "update"}},
		{bytes.Replace(good, []byte(`"water_mL":20000`), []byte(`"water_mL":-20000`), 1), []string{"recipes[0].water_mL", "-20000"}},
	} {
		_, err := ExtractCarried(tc.in)
		for _, w := range tc.want {
			if err == nil || !strings.Contains(err.Error(), w) {
				t.Errorf("ExtractCarried error %v does not say %q", err, w)
			}
		}
	}
}

func BenchmarkExtractCarriedPage(b *testing.B) {
	// A page the size of the bench app (1.4 MB, mostly base64) carrying 50 recipes.
	c := demoCarried(b)
	for len(c.Recipes) < 50 {
		r := c.Recipes[len(c.Recipes)%3]
		r.Name += " " + strconv.Itoa(len(c.Recipes))
		c.Recipes = append(c.Recipes, r)
	}
	page := strings.Replace(testPage, "H4sIAAAAAAAA", strings.Repeat("QUJDRA", 1400<<10/6), 1)
	in, err := WithCarried([]byte(page), c)
	if err != nil {
		b.Fatal(err)
	}
	b.SetBytes(int64(len(in)))
	var sink Carried
	for b.Loop() {
		sink, err = ExtractCarried(in)
		if err != nil {
			b.Fatal(err)
		}
	}
	_ = sink
}

func BenchmarkWithCarriedPage(b *testing.B) {
	c := demoCarried(b)
	page := []byte(strings.Replace(testPage, "H4sIAAAAAAAA", strings.Repeat("QUJDRA", 1400<<10/6), 1))
	var sink []byte
	for b.Loop() {
		sink, _ = WithCarried(page, c)
	}
	_ = sink
}

// Text that is not UTF-8 would be written as U+FFFD and read back as other bytes, so the
// checksum could never match: it is refused when the copy is made, not when it is opened.
func TestEncodeCarriedRefusesInvalidUTF8(t *testing.T) {
	for _, r := range []recipe.Recipe{
		{Name: "a\xff", Solute: "KNO3"},
		{Name: "a", Notes: "\xc3", Solute: "KNO3"},
		{Name: "a", Custom: &recipe.Custom{Name: "x", Source: "\xed\xa0\x80", Model: "table"}},
	} {
		if _, err := EncodeCarried(Carried{Recipes: []recipe.Recipe{r}}); err == nil {
			t.Errorf("EncodeCarried(%q) gave no error", r.Name+r.Notes)
		}
	}
}
