package carry

import (
	"errors"
	"strconv"
	"strings"
	"unicode/utf8"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
	"saltcast/web/htmlscan"
)

// A Saltcast page can carry recipes to whoever opens it: a copy of the app's HTML with one
// inert block
//
//	<script type="application/x-saltcast-recipes" id="saltcast-carried">{...}</script>
//
// The type is not a JavaScript type, so the browser never runs the block, and the page's
// Content-Security-Policy does not need to change. The block holds one JSON object of
// carried format 1:
//
//	{"format":1,"kind":"saltcast-carried-recipes","app_version":"v1.2","saved_at":"2026-12-01T09:30:00Z",
//	 "sent_by":"R. Ilves","recipes":{<a recipe collection file>},"crc32":"0a1b2c3d"}
//
// A block that also carries preparations (solutions made up to the mark) has them in the
// collection's optional "preparations" list, as an export file does, and says "format":2,
// so that a Saltcast that reads only format 1 asks to be updated instead of calling the
// block damaged. A block without preparations is written exactly as format 1 always was,
// byte for byte, so copies saved before still verify.
//
// "crc32" is the CRC-32 of the canonical encoding of the object without "crc32" (the
// bytes EncodeCarried writes up to that key), so any changed value, lost recipe or cut
// text is refused, while a mail program that turns LF into CR LF changes nothing. A CRC
// guards against accident, not against someone who means harm (no checksum without a
// secret key could), so the recipes read from a block are checked exactly like recipes
// typed in. CRC-32 rather than SHA-256 because crypto/sha256 adds about 73 KB of gzip to
// the page (it brings os, AES and a random generator with it) and a table CRC-32 about
// 0.4 KB, measured on the browser build; both catch every accidental change that matters
// here.

// Names and limits of the carried-recipes block.
const (
	CarriedFormat = 2                                // the newest carried format this Saltcast reads and writes (with preparations)
	carriedPlain  = 1                                // the carried format of a block without preparations
	CarriedKind   = "saltcast-carried-recipes"       // the "kind" of a carried block
	CarriedType   = "application/x-saltcast-recipes" // the type attribute of the <script> element
	CarriedID     = "saltcast-carried"               // the id attribute of the <script> element

	// MaxCarrierBytes bounds a file read by ExtractCarried: a Saltcast page is about
	// 1.5 MB and a full collection at most recipe.MaxCollectionBytes.
	MaxCarrierBytes = 16 << 20

	maxSentBy     = 200
	maxAppVersion = 100
)

// Carried is the content of a carried-recipes block, or of a JSON export read by
// ExtractCarried.
type Carried struct {
	AppVersion string          // "app_version": the version of the Saltcast that saved the copy
	SavedAt    string          // "saved_at": when, as 2026-12-01T09:30:00Z (UTC); "" if not known
	SentBy     string          // "sent_by": who saved it, as they typed it; may be ""
	Recipes    []recipe.Recipe // "recipes": a recipe collection
	Preps      []recipe.Prep   // its "preparations", when there are some (carried format 2)

	// Sealed reports that the recipes came in a carried block whose checksum matched.
	// Recipes read from a plain JSON export have no checksum and Sealed false.
	Sealed bool
}

// The kinds of error ExtractCarried returns; test them with errors.Is. Each comes inside a
// *CarryError that says more.
var (
	ErrNoRecipes   = errors.New("this file carries no Saltcast recipes")
	ErrMalformed   = errors.New("the recipes in this file are damaged or not in a Saltcast format")
	ErrChecksum    = errors.New("the recipes block was changed or cut short after it was saved (its checksum does not match)")
	ErrNewerFormat = errors.New("the recipes were saved by a newer Saltcast; update Saltcast to read them")
)

// CarryError is an error of ExtractCarried or WithCarried: Kind is one of the Err values
// above (or nil when the carried content itself was refused) and Err, when set, the
// detail, often a *unit.FieldError naming the key or a *wire.SyntaxError giving the line.
type CarryError struct {
	Kind error
	Err  error
}

func (e *CarryError) Error() string {
	switch {
	case e.Kind == nil:
		return e.Err.Error()
	case e.Err == nil:
		return e.Kind.Error()
	}
	return e.Kind.Error() + ": " + e.Err.Error()
}

// Unwrap gives both the kind and the detail to errors.Is and errors.As.
func (e *CarryError) Unwrap() []error {
	var out []error
	if e.Kind != nil {
		out = append(out, e.Kind)
	}
	if e.Err != nil {
		out = append(out, e.Err)
	}
	return out
}

func carryErr(kind, err error) error { return &CarryError{Kind: kind, Err: err} }

// EncodeCarried writes c as the JSON of a carried block, checksum last. It refuses what
// ExtractCarried would refuse (too many recipes, too long a sender or version text, a
// SavedAt not of the form 2026-12-01T09:30:00Z), naming the key. The output contains no
// '<', so it cannot end the <script> element that holds it.
func EncodeCarried(c Carried) ([]byte, error) {
	if err := c.check(); err != nil {
		return nil, err
	}
	body := c.body()
	out := make([]byte, 0, len(body)+24)
	out = append(out, body...)
	out = append(out, `,"crc32":"`...)
	out = appendHex32(out, crc32(body))
	out = append(out, `"}`...)
	return out, nil
}

// body is the canonical encoding of c without the checksum and without the closing
// brace: the bytes the checksum covers.
func (c Carried) body() []byte {
	coll := recipe.Collection{Recipes: c.Recipes, Preps: c.Preps}.Encode()
	var e wire.Encoder
	e.Grow(len(coll) + 256)
	e.BeginObject()
	e.Key("format").Int(c.format())
	e.Key("kind").String(CarriedKind)
	e.Key("app_version").String(c.AppVersion)
	e.Key("saved_at").String(c.SavedAt)
	e.Key("sent_by").String(c.SentBy)
	e.Key("recipes").BeginObject().EndObject() // a place holder, replaced below
	e.EndObject()
	b, err := e.Bytes()
	if err != nil {
		panic("recipe: carried header: " + err.Error()) // only strings and an int were written
	}
	// b ends in `"recipes":{}}`; put the collection in place of {} and drop the last brace.
	b = b[:len(b)-3]
	return append(b, coll...)
}

// format is the carried format c is written in: 1 unless it carries preparations.
func (c Carried) format() int {
	if len(c.Preps) > 0 {
		return CarriedFormat
	}
	return carriedPlain
}

// check applies the limits ExtractCarried applies.
func (c Carried) check() error {
	fe := func(field, value, allowed string) error {
		return &CarryError{Err: &unit.FieldError{Field: field, Value: value, Allowed: allowed}}
	}
	switch {
	case len(c.Recipes)+len(c.Preps) > recipe.MaxCollectionRecipes:
		return fe("recipes", strconv.Itoa(len(c.Recipes)+len(c.Preps))+" recipes",
			"at most "+strconv.Itoa(recipe.MaxCollectionRecipes)+" recipes in one copy")
	case len(c.SentBy) > maxSentBy || !utf8.ValidString(c.SentBy):
		return fe("sent_by", clip(c.SentBy), "a name of at most "+strconv.Itoa(maxSentBy)+" bytes of UTF-8 text")
	case len(c.AppVersion) > maxAppVersion || !utf8.ValidString(c.AppVersion):
		return fe("app_version", clip(c.AppVersion), "a version of at most "+strconv.Itoa(maxAppVersion)+" bytes of UTF-8 text")
	case c.SavedAt != "" && !isStamp(c.SavedAt):
		return fe("saved_at", clip(c.SavedAt), "a UTC time written 2026-12-01T09:30:00Z, or nothing")
	}
	for i, r := range c.Recipes {
		if err := r.Encodable(); err != nil {
			return fe("recipes["+strconv.Itoa(i)+"]", clip(r.Name), err.Error())
		}
	}
	for i, p := range c.Preps {
		if err := p.Encodable(); err != nil {
			return fe("preparations["+strconv.Itoa(i)+"]", clip(p.Name), err.Error())
		}
	}
	return nil
}

// CarriedBlock returns the whole <script> element that carries c.
func CarriedBlock(c Carried) ([]byte, error) {
	js, err := EncodeCarried(c)
	if err != nil {
		return nil, err
	}
	const open, end = `<script type="` + CarriedType + `" id="` + CarriedID + `">`, "</script>"
	b := make([]byte, 0, len(open)+len(js)+len(end))
	b = append(b, open...)
	b = append(b, js...)
	return append(b, end...), nil
}

// WithCarried returns a copy of page, the app's own HTML, carrying c: the page's carried
// block, empty or not, is replaced; a page without one gets it just before </body>. page
// itself is not changed. A page with more than one block, or with neither a block nor
// </body>, is refused: it is not a page Saltcast wrote.
func WithCarried(page []byte, c Carried) ([]byte, error) {
	block, err := CarriedBlock(c)
	if err != nil {
		return nil, err
	}
	found, bodyEnd, err := scanBlocks(string(page))
	if err != nil {
		return nil, err
	}
	var at, end int
	switch len(found) {
	case 0:
		at = bodyEnd
		if at < 0 {
			return nil, carryErr(ErrMalformed, errors.New("the page has no </body>, so it is not a Saltcast page"))
		}
		end = at
	case 1:
		at, end = found[0].start, found[0].end
	default:
		return nil, carryErr(ErrMalformed, errors.New("the page holds "+strconv.Itoa(len(found))+" recipes blocks; a Saltcast page has one"))
	}
	out := make([]byte, 0, len(page)-(end-at)+len(block)+1)
	out = append(out, page[:at]...)
	out = append(out, block...)
	if len(found) == 0 {
		out = append(out, '\n')
	}
	return append(out, page[end:]...), nil
}

// ExtractCarried reads the recipes a file carries without running anything in it: a
// Saltcast HTML page with a carried block, the JSON of a carried block, a recipe
// collection file (a JSON export) or a single recipe. It is all or nothing: on any error
// the Carried is empty, and the error is a *CarryError of kind ErrNoRecipes (a page or
// file with no recipes, or an empty block), ErrMalformed (not our format, broken JSON, a
// recipe that does not read — the detail names the key), ErrChecksum or ErrNewerFormat.
// Recipes without a name are refused too, since recipes are kept by name.
func ExtractCarried(data []byte) (Carried, error) {
	if len(data) > MaxCarrierBytes {
		return Carried{}, carryErr(ErrMalformed, &unit.FieldError{Field: "file",
			Value: strconv.Itoa(len(data)) + " bytes", Allowed: "a file of at most " + strconv.Itoa(MaxCarrierBytes>>20) + " MB"})
	}
	page := string(data)
	text := strings.TrimLeft(strings.TrimPrefix(page, "\xEF\xBB\xBF"), " \t\r\n")
	if len(text) == 0 {
		return Carried{}, carryErr(ErrNoRecipes, nil)
	}
	if text[0] == '{' || text[0] == '[' {
		return readCarriedJSON([]byte(text), false)
	}
	found, _, err := scanBlocks(page)
	if err != nil {
		return Carried{}, err
	}
	switch len(found) {
	case 0:
		return Carried{}, carryErr(ErrNoRecipes, nil)
	case 1:
	default:
		return Carried{}, carryErr(ErrMalformed, errors.New("the file holds "+strconv.Itoa(len(found))+" recipes blocks; a Saltcast page has one"))
	}
	inner := strings.TrimSpace(page[found[0].textStart:found[0].textEnd])
	if len(inner) == 0 {
		return Carried{}, carryErr(ErrNoRecipes, nil)
	}
	return readCarriedJSON([]byte(inner), true)
}

// readCarriedJSON reads a carried block, a collection or a single recipe. inBlock says the
// JSON came from a carried block in a page, where only the carried format belongs.
func readCarriedJSON(text []byte, inBlock bool) (Carried, error) {
	v, err := wire.DecodeLimits(text, wire.Limits{MaxBytes: recipe.MaxCollectionBytes + 64<<10, MaxDepth: 32})
	if err != nil {
		return Carried{}, carryErr(ErrMalformed, err)
	}
	if v.Kind != wire.Object {
		return Carried{}, carryErr(ErrMalformed, &unit.FieldError{Field: "file", Value: v.Kind.String(),
			Allowed: "a JSON object: a Saltcast recipe, recipe collection or carried block"})
	}
	kind, _ := v.Get("kind")
	if inBlock {
		// A newer Saltcast may name its blocks differently; say "update" before "damaged".
		if err := newer(v, CarriedFormat); err != nil {
			return Carried{}, err
		}
	}
	if kind.Kind == wire.String && kind.Text == CarriedKind {
		return readCarriedValue(v)
	}
	if inBlock {
		return Carried{}, carryErr(ErrMalformed, &unit.FieldError{Field: "kind", Value: wire.Literal(kind),
			Allowed: `"` + CarriedKind + `" in a recipes block`})
	}
	if err := newer(v, recipe.CurrentFormat); err != nil {
		return Carried{}, err
	}
	var rs []recipe.Recipe
	var ps []recipe.Prep
	if _, ok := v.Get("kind"); ok {
		var coll recipe.Collection
		coll, err = recipe.CollectionFromValue(v)
		rs, ps = coll.Recipes, coll.Preps
	} else {
		var r recipe.Recipe
		if r, err = recipe.DecodeValue(v); err == nil {
			rs = []recipe.Recipe{r}
		}
	}
	if err != nil {
		return Carried{}, carryErr(ErrMalformed, err)
	}
	if err := named(rs, ps); err != nil {
		return Carried{}, err
	}
	if len(rs)+len(ps) == 0 {
		return Carried{}, carryErr(ErrNoRecipes, nil)
	}
	return Carried{Recipes: rs, Preps: ps}, nil
}

// readCarriedValue reads the object of a carried block and checks its checksum.
func readCarriedValue(v wire.Value) (Carried, error) {
	if err := newer(v, CarriedFormat); err != nil {
		return Carried{}, err
	}
	var c Carried
	var coll wire.Value
	var sum string
	format := 0
	d := reader{}
	for _, m := range v.Members {
		switch m.Key {
		case "format":
			format = d.format(m.Value)
		case "kind":
			// already checked by the caller
		case "app_version":
			c.AppVersion = d.text(m.Key, m.Value, maxAppVersion)
		case "saved_at":
			c.SavedAt = d.text(m.Key, m.Value, 40)
			if d.err == nil && c.SavedAt != "" && !isStamp(c.SavedAt) {
				d.fail(m.Key, c.SavedAt, "a UTC time written 2026-12-01T09:30:00Z, or nothing")
			}
		case "sent_by":
			c.SentBy = d.text(m.Key, m.Value, maxSentBy)
		case "recipes":
			if m.Value.Kind != wire.Object {
				d.fail(m.Key, wire.Literal(m.Value), "a recipe collection {\"format\":1,\"kind\":\""+recipe.CollectionKind+"\",\"recipes\":[...]}")
			}
			coll = m.Value
		case "crc32":
			sum = d.text(m.Key, m.Value, 8)
			if d.err == nil && !isHex32(sum) {
				d.fail(m.Key, sum, "8 lowercase hexadecimal digits")
			}
		default:
			d.fail(m.Key, m.Key, "one of the keys of a recipes block: format, kind, app_version, saved_at, sent_by, recipes, crc32")
		}
		if d.err != nil {
			return Carried{}, carryErr(ErrMalformed, d.err)
		}
	}
	for _, k := range []string{"format", "app_version", "saved_at", "sent_by", "recipes", "crc32"} {
		if _, ok := v.Get(k); !ok {
			return Carried{}, carryErr(ErrMalformed, &unit.FieldError{Field: k, Value: "",
				Allowed: "the key " + k + " (every recipes block has it)"})
		}
	}
	if err := newer(coll, recipe.CurrentFormat); err != nil {
		return Carried{}, err
	}
	collJSON, err := wire.Encode(coll)
	if err != nil {
		return Carried{}, carryErr(ErrMalformed, err)
	}
	all, err := recipe.DecodeAll(collJSON)
	if err != nil {
		return Carried{}, carryErr(ErrMalformed, err)
	}
	c.Recipes, c.Preps = all.Recipes, all.Preps
	if format != c.format() {
		// Format 1 has no preparations; format 2 is written only with them.
		return Carried{}, carryErr(ErrMalformed, &unit.FieldError{Field: "format", Value: strconv.Itoa(format),
			Allowed: "1 for a block of recipes only, 2 for one that carries preparations"})
	}
	if crc32(c.body()) != parseHex32(sum) {
		return Carried{}, carryErr(ErrChecksum, nil)
	}
	if err := named(c.Recipes, c.Preps); err != nil {
		return Carried{}, err
	}
	if len(c.Recipes)+len(c.Preps) == 0 {
		return Carried{}, carryErr(ErrNoRecipes, nil)
	}
	c.Sealed = true
	return c, nil
}

// newer refuses an object whose "format" is a number above max, before its keys are read
// (a newer format may have keys this Saltcast does not know).
func newer(v wire.Value, max int) error {
	f, ok := v.Get("format")
	if ok && f.Kind == wire.Number && f.Num > float64(max) {
		return carryErr(ErrNewerFormat, &unit.FieldError{Field: "format", Value: f.Text,
			Allowed: "format " + strconv.Itoa(max) + " or older"})
	}
	return nil
}

// named refuses recipes and preparations without a name: the recipe box keeps both by name.
func named(rs []recipe.Recipe, ps []recipe.Prep) error {
	for i, r := range rs {
		if strings.TrimSpace(r.Name) == "" {
			return carryErr(ErrMalformed, &unit.FieldError{Field: "recipes[" + strconv.Itoa(i) + "].name", Value: "",
				Allowed: "a name for every recipe (recipes are kept by name)"})
		}
	}
	for i, p := range ps {
		if strings.TrimSpace(p.Name) == "" {
			return carryErr(ErrMalformed, &unit.FieldError{Field: "preparations[" + strconv.Itoa(i) + "].name", Value: "",
				Allowed: "a name for every preparation (preparations are kept by name)"})
		}
	}
	return nil
}

// block is where a carried <script> element sits in a page: [start, end) is the whole
// element, [textStart, textEnd) its text.
type block struct{ start, textStart, textEnd, end int }

// scanBlocks finds the carried blocks of an HTML page without building a DOM: it walks the
// markup as the HTML tokenizer does for what matters here, stepping over comments and over
// the text of <script>, <style>, <textarea> and <title> elements (where "<script" is only
// text), and reads the attributes of every <script> start tag. A carried block that never
// ends is malformed (the file was cut short). bodyEnd is where the last </body> tag
// outside such text starts, or -1.
func scanBlocks(page string) (found []block, bodyEnd int, err error) {
	bodyEnd = -1
	for i := 0; i < len(page); {
		lt := strings.IndexByte(page[i:], '<')
		if lt < 0 {
			break
		}
		i += lt
		if strings.HasPrefix(page[i:], "<!--") {
			end := strings.Index(page[i+4:], "-->")
			if end < 0 {
				break
			}
			i += 4 + end + 3
			continue
		}
		if i+1 < len(page) && page[i+1] == '/' {
			if name, _ := htmlscan.TagName(page, i+2); name == "body" {
				bodyEnd = i
			}
			i += 2
			continue
		}
		name, nameEnd := htmlscan.TagName(page, i+1)
		if name == "" {
			i++
			continue
		}
		typ, tagEnd := htmlscan.Attr(page, nameEnd, "type")
		if tagEnd < 0 {
			break // a start tag cut short: nothing after it is markup
		}
		switch name {
		case "script", "style", "textarea", "title":
		default:
			i = tagEnd
			continue
		}
		closing := htmlscan.IndexFold(page, tagEnd, "</"+name)
		carried := name == "script" && htmlscan.EqualFold(strings.TrimSpace(typ), CarriedType)
		if closing < 0 {
			if carried {
				return nil, bodyEnd, carryErr(ErrMalformed, errors.New("the recipes block has no end: the file was cut short"))
			}
			break
		}
		end := strings.IndexByte(page[closing:], '>')
		if end < 0 {
			end = len(page)
		} else {
			end += closing + 1
		}
		if carried {
			found = append(found, block{start: i, textStart: tagEnd, textEnd: closing, end: end})
		}
		i = end
	}
	return found, bodyEnd, nil
}

// isStamp reports whether s reads 2026-12-01T09:30:00Z: digits where the digits go.
func isStamp(s string) bool {
	const shape = "dddd-dd-ddTdd:dd:ddZ"
	if len(s) != len(shape) {
		return false
	}
	for i := 0; i < len(s); i++ {
		if shape[i] == 'd' {
			if s[i] < '0' || s[i] > '9' {
				return false
			}
		} else if s[i] != shape[i] {
			return false
		}
	}
	return true
}

// clip shortens a text for an error message.
func clip(s string) string {
	if len(s) <= 40 {
		return s
	}
	n := 40
	for n > 0 && !utf8.RuneStart(s[n]) {
		n--
	}
	return s[:n] + "…"
}

// crc32 is the CRC-32 of the carried block: recipe.CRC32 (CRC-32/ISO-HDLC).
func crc32(b []byte) uint32 { return recipe.CRC32(b) }

func appendHex32(b []byte, v uint32) []byte {
	const digits = "0123456789abcdef"
	for s := 28; s >= 0; s -= 4 {
		b = append(b, digits[v>>uint(s)&0xF])
	}
	return b
}

func isHex32(s string) bool {
	if len(s) != 8 {
		return false
	}
	for i := 0; i < 8; i++ {
		c := s[i]
		if !(c >= '0' && c <= '9' || c >= 'a' && c <= 'f') {
			return false
		}
	}
	return true
}

func parseHex32(s string) uint32 {
	var v uint32
	for i := 0; i < len(s); i++ {
		c := s[i]
		d := uint32(c - '0')
		if c >= 'a' {
			d = uint32(c-'a') + 10
		}
		v = v<<4 | d
	}
	return v
}

// reader collects the first error while reading the members of a carried block.
type reader struct{ err error }

func (d *reader) fail(field, value, allowed string) {
	if d.err == nil {
		d.err = &unit.FieldError{Field: field, Value: value, Allowed: allowed}
	}
}

func (d *reader) text(field string, v wire.Value, max int) string {
	if v.Kind != wire.String {
		d.fail(field, wire.Literal(v), "a JSON string")
		return ""
	}
	if len(v.Text) > max {
		d.fail(field, wire.Literal(v), "text of at most "+strconv.Itoa(max)+" bytes")
		return ""
	}
	return v.Text
}

// format checks the block's "format" and returns it; newer formats were refused before the
// keys were read.
func (d *reader) format(v wire.Value) int {
	if v.Kind != wire.Number || v.Num != float64(int(v.Num)) || v.Num < 1 || v.Num > CarriedFormat {
		d.fail("format", wire.Literal(v), "the whole number 1, or 2 with preparations")
		return 0
	}
	return int(v.Num)
}
