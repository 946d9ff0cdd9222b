package wire

import (
	"strconv"
	"unicode/utf16"
	"unicode/utf8"
)

// Kind is the JSON type of a Value.
type Kind uint8

// The JSON kinds.
const (
	Null Kind = iota
	Bool
	Number
	String
	Array
	Object
)

var kindNames = [...]string{"null", "true or false", "a number", "a string", "an array", "an object"}

// String names the kind the way an error message needs it ("a number").
func (k Kind) String() string {
	if int(k) < len(kindNames) {
		return kindNames[k]
	}
	return "an unknown kind"
}

// Value is one decoded JSON value. Only the fields for its Kind are meaningful.
type Value struct {
	Kind    Kind
	Bool    bool
	Num     float64 // Number: the value, always finite
	Text    string  // Number: the literal as written; String: the decoded text
	Items   []Value
	Members []Member // Object: members in document order, keys unique
	Offset  int      // byte offset of the value's first byte in the input
}

// Member is one key and value of an object.
type Member struct {
	Key   string
	Value Value
}

// Get returns the member named key of an object and whether it was there.
func (v Value) Get(key string) (Value, bool) {
	for i := range v.Members {
		if v.Members[i].Key == key {
			return v.Members[i].Value, true
		}
	}
	return Value{}, false
}

// Limits bound what Decode accepts.
type Limits struct {
	MaxBytes int // the largest input accepted, in bytes
	MaxDepth int // the deepest nesting of arrays and objects accepted
}

// DefaultLimits are generous for one recipe and small enough that a hostile input cannot
// make the browser or the worker do much work.
var DefaultLimits = Limits{MaxBytes: 64 << 10, MaxDepth: 32}

// SyntaxError reports input that is not strict JSON or that breaks a limit.
type SyntaxError struct {
	Msg    string // what is wrong, e.g. "leading zeros are not allowed in numbers"
	Offset int    // byte offset of the problem
	Line   int    // 1-based line of the problem
	Column int    // 1-based column (in bytes) of the problem
}

func (e *SyntaxError) Error() string {
	return "JSON line " + strconv.Itoa(e.Line) + ", column " + strconv.Itoa(e.Column) + ": " + e.Msg
}

// Decode parses data as one JSON value under DefaultLimits.
func Decode(data []byte) (Value, error) {
	return DecodeLimits(data, DefaultLimits)
}

// DecodeLimits parses data as one JSON value under lim. A zero field in lim takes the
// default.
func DecodeLimits(data []byte, lim Limits) (Value, error) {
	if lim.MaxBytes <= 0 {
		lim.MaxBytes = DefaultLimits.MaxBytes
	}
	if lim.MaxDepth <= 0 {
		lim.MaxDepth = DefaultLimits.MaxDepth
	}
	d := decoder{data: data, lim: lim}
	if len(data) > lim.MaxBytes {
		return Value{}, d.errAt(lim.MaxBytes, "input is larger than the limit of "+strconv.Itoa(lim.MaxBytes)+" bytes")
	}
	if len(data) >= 3 && data[0] == 0xEF && data[1] == 0xBB && data[2] == 0xBF {
		d.pos = 3
	}
	d.skipSpace()
	v, err := d.value(0)
	if err != nil {
		return Value{}, err
	}
	d.skipSpace()
	if d.pos < len(d.data) {
		return Value{}, d.errAt(d.pos, "unexpected "+d.describe(d.pos)+" after the end of the JSON value")
	}
	return v, nil
}

type decoder struct {
	data []byte
	pos  int
	lim  Limits
}

func (d *decoder) errAt(off int, msg string) *SyntaxError {
	if off > len(d.data) {
		off = len(d.data)
	}
	line, col := 1, 1
	for _, c := range d.data[:off] {
		if c == '\n' {
			line++
			col = 1
		} else {
			col++
		}
	}
	return &SyntaxError{Msg: msg, Offset: off, Line: line, Column: col}
}

// describe names the byte at off for an error message.
func (d *decoder) describe(off int) string {
	if off >= len(d.data) {
		return "end of input"
	}
	c := d.data[off]
	if c >= 0x20 && c < 0x7f {
		return strconv.QuoteRune(rune(c))
	}
	return "byte 0x" + strconv.FormatUint(uint64(c), 16)
}

func (d *decoder) skipSpace() {
	for d.pos < len(d.data) {
		switch d.data[d.pos] {
		case ' ', '\t', '\n', '\r':
			d.pos++
		default:
			return
		}
	}
}

func (d *decoder) value(depth int) (Value, error) {
	if d.pos >= len(d.data) {
		return Value{}, d.errAt(d.pos, "unexpected end of input, expected a value")
	}
	start := d.pos
	switch c := d.data[d.pos]; {
	case c == '{':
		return d.object(depth + 1)
	case c == '[':
		return d.array(depth + 1)
	case c == '"':
		s, err := d.str()
		return Value{Kind: String, Text: s, Offset: start}, err
	case c == '-' || (c >= '0' && c <= '9'):
		return d.number()
	case c == 't':
		return Value{Kind: Bool, Bool: true, Offset: start}, d.literal("true")
	case c == 'f':
		return Value{Kind: Bool, Offset: start}, d.literal("false")
	case c == 'n':
		return Value{Kind: Null, Offset: start}, d.literal("null")
	case c == 'N' || c == 'I':
		return Value{}, d.errAt(d.pos, "NaN and Infinity are not numbers in JSON")
	default:
		return Value{}, d.errAt(d.pos, "unexpected "+d.describe(d.pos)+", expected a value")
	}
}

func (d *decoder) literal(word string) error {
	if len(d.data)-d.pos >= len(word) && string(d.data[d.pos:d.pos+len(word)]) == word {
		d.pos += len(word)
		return nil
	}
	return d.errAt(d.pos, "unknown word; JSON allows only true, false and null here")
}

func (d *decoder) object(depth int) (Value, error) {
	start := d.pos
	if depth > d.lim.MaxDepth {
		return Value{}, d.errAt(start, "nesting deeper than the limit of "+strconv.Itoa(d.lim.MaxDepth))
	}
	d.pos++ // '{'
	v := Value{Kind: Object, Offset: start}
	d.skipSpace()
	if d.pos < len(d.data) && d.data[d.pos] == '}' {
		d.pos++
		return v, nil
	}
	var seen map[string]struct{}
	for {
		d.skipSpace()
		if d.pos >= len(d.data) || d.data[d.pos] != '"' {
			return Value{}, d.errAt(d.pos, "unexpected "+d.describe(d.pos)+", expected a key in double quotes")
		}
		keyAt := d.pos
		key, err := d.str()
		if err != nil {
			return Value{}, err
		}
		if dup := d.duplicate(v.Members, &seen, key); dup {
			return Value{}, d.errAt(keyAt, "duplicate key "+strconv.Quote(key))
		}
		d.skipSpace()
		if d.pos >= len(d.data) || d.data[d.pos] != ':' {
			return Value{}, d.errAt(d.pos, "unexpected "+d.describe(d.pos)+", expected ':' after the key")
		}
		d.pos++
		d.skipSpace()
		item, err := d.value(depth)
		if err != nil {
			return Value{}, err
		}
		v.Members = append(v.Members, Member{Key: key, Value: item})
		d.skipSpace()
		if d.pos >= len(d.data) {
			return Value{}, d.errAt(d.pos, "unexpected end of input, expected ',' or '}'")
		}
		switch d.data[d.pos] {
		case ',':
			d.pos++
		case '}':
			d.pos++
			return v, nil
		default:
			return Value{}, d.errAt(d.pos, "unexpected "+d.describe(d.pos)+", expected ',' or '}'")
		}
	}
}

// duplicate reports whether key is already among members. Small objects are searched
// linearly; past 16 members a set is built so a hostile input stays linear.
func (d *decoder) duplicate(members []Member, seen *map[string]struct{}, key string) bool {
	const linear = 16
	if len(members) < linear {
		for i := range members {
			if members[i].Key == key {
				return true
			}
		}
		return false
	}
	if *seen == nil {
		*seen = make(map[string]struct{}, 2*len(members))
		for i := range members {
			(*seen)[members[i].Key] = struct{}{}
		}
	}
	if _, ok := (*seen)[key]; ok {
		return true
	}
	(*seen)[key] = struct{}{}
	return false
}

func (d *decoder) array(depth int) (Value, error) {
	start := d.pos
	if depth > d.lim.MaxDepth {
		return Value{}, d.errAt(start, "nesting deeper than the limit of "+strconv.Itoa(d.lim.MaxDepth))
	}
	d.pos++ // '['
	v := Value{Kind: Array, Offset: start}
	d.skipSpace()
	if d.pos < len(d.data) && d.data[d.pos] == ']' {
		d.pos++
		return v, nil
	}
	for {
		d.skipSpace()
		item, err := d.value(depth)
		if err != nil {
			return Value{}, err
		}
		v.Items = append(v.Items, item)
		d.skipSpace()
		if d.pos >= len(d.data) {
			return Value{}, d.errAt(d.pos, "unexpected end of input, expected ',' or ']'")
		}
		switch d.data[d.pos] {
		case ',':
			d.pos++
		case ']':
			d.pos++
			return v, nil
		default:
			return Value{}, d.errAt(d.pos, "unexpected "+d.describe(d.pos)+", expected ',' or ']'")
		}
	}
}

func isDigit(c byte) bool { return c >= '0' && c <= '9' }

// number scans the RFC 8259 number grammar:
// [ "-" ] ( "0" / digit1-9 *digit ) [ "." 1*digit ] [ ( "e" / "E" ) [ "-" / "+" ] 1*digit ]
func (d *decoder) number() (Value, error) {
	start := d.pos
	p := d.pos
	n := len(d.data)
	if d.data[p] == '-' {
		p++
	}
	switch {
	case p < n && d.data[p] == '0':
		p++
		if p < n && isDigit(d.data[p]) {
			return Value{}, d.errAt(start, "leading zeros are not allowed in numbers")
		}
	case p < n && isDigit(d.data[p]):
		for p < n && isDigit(d.data[p]) {
			p++
		}
	case p < n && (d.data[p] == 'I' || d.data[p] == 'N'):
		return Value{}, d.errAt(start, "NaN and Infinity are not numbers in JSON")
	default:
		return Value{}, d.errAt(p, "a digit must follow '-'")
	}
	if p < n && d.data[p] == '.' {
		p++
		if p >= n || !isDigit(d.data[p]) {
			return Value{}, d.errAt(p, "a digit must follow the decimal point")
		}
		for p < n && isDigit(d.data[p]) {
			p++
		}
	}
	if p < n && (d.data[p] == 'e' || d.data[p] == 'E') {
		p++
		if p < n && (d.data[p] == '+' || d.data[p] == '-') {
			p++
		}
		if p >= n || !isDigit(d.data[p]) {
			return Value{}, d.errAt(p, "a digit must follow the exponent mark")
		}
		for p < n && isDigit(d.data[p]) {
			p++
		}
	}
	text := string(d.data[start:p])
	f, err := strconv.ParseFloat(text, 64)
	if err != nil {
		// The grammar above admits only what ParseFloat accepts, so the error is range.
		return Value{}, d.errAt(start, "number "+text+" is too large for a float64")
	}
	d.pos = p
	return Value{Kind: Number, Num: f, Text: text, Offset: start}, nil
}

func hexVal(c byte) rune {
	switch {
	case c >= '0' && c <= '9':
		return rune(c - '0')
	case c >= 'a' && c <= 'f':
		return rune(c - 'a' + 10)
	case c >= 'A' && c <= 'F':
		return rune(c - 'A' + 10)
	}
	return -1
}

// hex4 reads the four hex digits of a \u escape starting at p.
func (d *decoder) hex4(p int) (rune, error) {
	if p+4 > len(d.data) {
		return 0, d.errAt(p, "\\u must be followed by four hex digits")
	}
	var r rune
	for i := 0; i < 4; i++ {
		h := hexVal(d.data[p+i])
		if h < 0 {
			return 0, d.errAt(p+i, "\\u must be followed by four hex digits")
		}
		r = r<<4 | h
	}
	return r, nil
}

// str reads a string starting at the opening quote.
func (d *decoder) str() (string, error) {
	d.pos++ // opening quote
	start := d.pos
	// Fast path: no escapes.
	for p := start; p < len(d.data); {
		c := d.data[p]
		if c == '"' {
			s := d.data[start:p]
			if !utf8.Valid(s) {
				break
			}
			d.pos = p + 1
			return string(s), nil
		}
		if c == '\\' || c < 0x20 {
			break
		}
		p++
	}
	buf := make([]byte, 0, 16)
	p := start
	for {
		if p >= len(d.data) {
			return "", d.errAt(p, "unexpected end of input inside a string")
		}
		c := d.data[p]
		switch {
		case c == '"':
			d.pos = p + 1
			return string(buf), nil
		case c < 0x20:
			return "", d.errAt(p, "control characters must be escaped inside strings")
		case c == '\\':
			if p+1 >= len(d.data) {
				return "", d.errAt(p, "unexpected end of input inside a string")
			}
			e := d.data[p+1]
			p += 2
			switch e {
			case '"', '\\', '/':
				buf = append(buf, e)
			case 'b':
				buf = append(buf, '\b')
			case 'f':
				buf = append(buf, '\f')
			case 'n':
				buf = append(buf, '\n')
			case 'r':
				buf = append(buf, '\r')
			case 't':
				buf = append(buf, '\t')
			case 'u':
				r, err := d.hex4(p)
				if err != nil {
					return "", err
				}
				p += 4
				if utf16.IsSurrogate(r) {
					if r >= 0xDC00 || p+6 > len(d.data) || d.data[p] != '\\' || d.data[p+1] != 'u' {
						return "", d.errAt(p-6, "unpaired surrogate in \\u escape")
					}
					r2, err := d.hex4(p + 2)
					if err != nil {
						return "", err
					}
					r = utf16.DecodeRune(r, r2)
					if r == utf8.RuneError {
						return "", d.errAt(p, "unpaired surrogate in \\u escape")
					}
					p += 6
				}
				buf = utf8.AppendRune(buf, r)
			default:
				return "", d.errAt(p-2, "unknown escape \\"+string(rune(e))+" in string")
			}
		case c < utf8.RuneSelf:
			buf = append(buf, c)
			p++
		default:
			r, size := utf8.DecodeRune(d.data[p:])
			if r == utf8.RuneError && size <= 1 {
				return "", d.errAt(p, "invalid UTF-8 in string")
			}
			buf = append(buf, d.data[p:p+size]...)
			p += size
		}
	}
}

// Literal gives a short form of a JSON value for an error message: a number as written,
// a string cut to 40 bytes, true or false, or the kind of anything else.
func Literal(v Value) string {
	switch v.Kind {
	case Number:
		return v.Text
	case String:
		if len(v.Text) > 40 {
			return v.Text[:40] + "…"
		}
		return v.Text
	case Bool:
		if v.Bool {
			return "true"
		}
		return "false"
	}
	return v.Kind.String()
}
