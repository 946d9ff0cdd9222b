package wire

import (
	"errors"
	"math"
	"strconv"
	"unicode/utf8"
)

// ErrNotFinite is wrapped by the error Encoder.Bytes returns when a NaN or ±Inf was
// written.
var ErrNotFinite = errors.New("not a finite number")

// NotFiniteError names the key whose value was NaN or ±Inf.
type NotFiniteError struct {
	Key string // the object key, or the key of the nearest enclosing object member
}

func (e *NotFiniteError) Error() string {
	return "wire: " + strconv.Quote(e.Key) + " is " + ErrNotFinite.Error()
}

func (e *NotFiniteError) Unwrap() error { return ErrNotFinite }

// Encoder writes JSON with keys in the order they are written. The zero Encoder is ready
// to use. Calls must form valid JSON: Key only inside an object and before each value;
// a misuse is a programming error and panics (it never depends on user data).
type Encoder struct {
	buf     []byte
	stack   []frame
	lastKey string
	err     error
}

type frame struct {
	object bool
	n      int  // values written so far
	key    bool // object: a key is written and waits for its value
}

// Grow makes room for n more bytes, so a writer that knows the size of its output
// allocates once.
func (e *Encoder) Grow(n int) {
	if cap(e.buf)-len(e.buf) < n {
		b := make([]byte, len(e.buf), len(e.buf)+n)
		copy(b, e.buf)
		e.buf = b
	}
}

// Bytes returns the JSON written so far. It is an error to call it with an object or
// array still open; a NaN or ±Inf written anywhere makes it return a *NotFiniteError.
func (e *Encoder) Bytes() ([]byte, error) {
	if e.err != nil {
		return nil, e.err
	}
	if len(e.stack) != 0 {
		panic("wire: Bytes called with an object or array still open")
	}
	return e.buf, nil
}

func (e *Encoder) beforeValue() {
	if len(e.stack) == 0 {
		if len(e.buf) != 0 {
			panic("wire: second top-level value")
		}
		return
	}
	f := &e.stack[len(e.stack)-1]
	if f.object {
		if !f.key {
			panic("wire: value in an object without a key")
		}
		f.key = false
		return
	}
	if f.n > 0 {
		e.buf = append(e.buf, ',')
	}
	f.n++
}

// Key writes an object key; the next call writes its value.
func (e *Encoder) Key(k string) *Encoder {
	if len(e.stack) == 0 || !e.stack[len(e.stack)-1].object || e.stack[len(e.stack)-1].key {
		panic("wire: Key outside an object or twice in a row")
	}
	f := &e.stack[len(e.stack)-1]
	if f.n > 0 {
		e.buf = append(e.buf, ',')
	}
	f.n++
	f.key = true
	e.lastKey = k
	e.buf = AppendString(e.buf, k)
	e.buf = append(e.buf, ':')
	return e
}

// BeginObject opens an object.
func (e *Encoder) BeginObject() *Encoder {
	e.beforeValue()
	e.buf = append(e.buf, '{')
	e.stack = append(e.stack, frame{object: true})
	return e
}

// EndObject closes the innermost object.
func (e *Encoder) EndObject() *Encoder {
	if len(e.stack) == 0 || !e.stack[len(e.stack)-1].object || e.stack[len(e.stack)-1].key {
		panic("wire: EndObject without an open object, or after a key")
	}
	e.stack = e.stack[:len(e.stack)-1]
	e.buf = append(e.buf, '}')
	return e
}

// BeginArray opens an array.
func (e *Encoder) BeginArray() *Encoder {
	e.beforeValue()
	e.buf = append(e.buf, '[')
	e.stack = append(e.stack, frame{})
	return e
}

// EndArray closes the innermost array.
func (e *Encoder) EndArray() *Encoder {
	if len(e.stack) == 0 || e.stack[len(e.stack)-1].object {
		panic("wire: EndArray without an open array")
	}
	e.stack = e.stack[:len(e.stack)-1]
	e.buf = append(e.buf, ']')
	return e
}

// String writes a string value.
func (e *Encoder) String(s string) *Encoder {
	e.beforeValue()
	e.buf = AppendString(e.buf, s)
	return e
}

// Bool writes true or false.
func (e *Encoder) Bool(b bool) *Encoder {
	e.beforeValue()
	e.buf = strconv.AppendBool(e.buf, b)
	return e
}

// Null writes null.
func (e *Encoder) Null() *Encoder {
	e.beforeValue()
	e.buf = append(e.buf, "null"...)
	return e
}

// Int writes an integer.
func (e *Encoder) Int(n int) *Encoder {
	e.beforeValue()
	e.buf = strconv.AppendInt(e.buf, int64(n), 10)
	return e
}

// Float writes v in the shortest form that reads back to the same float64.
// NaN and ±Inf are refused: null is written in their place and Bytes reports the key.
func (e *Encoder) Float(v float64) *Encoder {
	e.beforeValue()
	if math.IsNaN(v) || math.IsInf(v, 0) {
		if e.err == nil {
			e.err = &NotFiniteError{Key: e.lastKey}
		}
		e.buf = append(e.buf, "null"...)
		return e
	}
	e.buf = AppendFloat(e.buf, v)
	return e
}

// Round writes v rounded to sig significant digits (1 ≤ sig ≤ 17), then in shortest
// form, so 77.27012 with sig 4 is written 77.27. NaN and ±Inf are refused as in Float.
func (e *Encoder) Round(v float64, sig int) *Encoder {
	return e.Float(RoundSig(v, sig))
}

// RoundSig rounds v to sig significant decimal digits (1 ≤ sig ≤ 17, clamped). Non-finite
// values are returned unchanged. The result is the float64 nearest to the rounded decimal,
// so its shortest form prints no more than sig digits.
func RoundSig(v float64, sig int) float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) || v == 0 {
		return v
	}
	sig = max(1, min(sig, 17))
	a := math.Abs(v)
	e := int(math.Floor(math.Log10(a)))
	if a < pow10(e) { // Log10 rounded up across a power of ten
		e--
	}
	k := sig - 1 - e
	// Scaling by an exact power of ten (up to 1e22) and dividing back gives the correctly
	// rounded double of the decimal. The scaled value stays below 2^44, so its own rounding
	// error (under 2^-9) can only move a value within 0.002 units of a tie; outside that
	// range strconv does it.
	switch {
	case k >= 0 && k <= 22 && a*pow10(k) < 1<<44:
		p := pow10(k)
		return math.Round(v*p) / p
	case k < 0 && -k <= 22 && a/pow10(-k) < 1<<44:
		p := pow10(-k)
		return math.Round(v/p) * p
	}
	r, err := strconv.ParseFloat(strconv.FormatFloat(v, 'e', sig-1, 64), 64)
	if err != nil {
		return v
	}
	return r
}

// pow10 returns 10^n for 0 ≤ n ≤ 22 exactly (and math.Pow10 otherwise).
func pow10(n int) float64 {
	if n >= 0 && n < len(powers) {
		return powers[n]
	}
	return math.Pow10(n)
}

var powers = [...]float64{1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
	1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22}

// AppendFloat appends the shortest JSON form of a finite v: plain decimals between 1e-6
// and 1e15, exponent form outside; -0 is written 0. The caller ensures v is finite.
func AppendFloat(buf []byte, v float64) []byte {
	if v == 0 {
		return append(buf, '0')
	}
	if a := math.Abs(v); a >= 1e-6 && a < 1e15 {
		return strconv.AppendFloat(buf, v, 'f', -1, 64)
	}
	return strconv.AppendFloat(buf, v, 'e', -1, 64)
}

// Value writes a decoded value back out. Numbers are written from Num in shortest form.
func (e *Encoder) Value(v Value) *Encoder {
	switch v.Kind {
	case Null:
		e.Null()
	case Bool:
		e.Bool(v.Bool)
	case Number:
		e.Float(v.Num)
	case String:
		e.String(v.Text)
	case Array:
		e.BeginArray()
		for _, it := range v.Items {
			e.Value(it)
		}
		e.EndArray()
	case Object:
		e.BeginObject()
		for _, m := range v.Members {
			e.Key(m.Key).Value(m.Value)
		}
		e.EndObject()
	default:
		panic("wire: Value of unknown kind")
	}
	return e
}

// Encode writes v as compact JSON.
func Encode(v Value) ([]byte, error) {
	var e Encoder
	e.Value(v)
	return e.Bytes()
}

const hexDigits = "0123456789abcdef"

// plain marks the ASCII bytes AppendString copies as they are.
var plain = func() (t [utf8.RuneSelf]bool) {
	for c := 0x20; c < utf8.RuneSelf; c++ {
		t[c] = c != '"' && c != '\\' && c != '<' && c != '>' && c != '&'
	}
	return t
}()

// AppendString appends s as a JSON string. Besides the required escapes it escapes <, >
// and & (so the text is safe inside HTML) and U+2028 and U+2029 (line separators in
// JavaScript). Invalid UTF-8 is replaced by U+FFFD.
func AppendString(buf []byte, s string) []byte {
	buf = append(buf, '"')
	start := 0
	for i := 0; i < len(s); {
		c := s[i]
		if c < utf8.RuneSelf {
			if plain[c] {
				i++
				continue
			}
			buf = append(buf, s[start:i]...)
			switch c {
			case '"', '\\':
				buf = append(buf, '\\', c)
			case '\n':
				buf = append(buf, '\\', 'n')
			case '\r':
				buf = append(buf, '\\', 'r')
			case '\t':
				buf = append(buf, '\\', 't')
			default:
				buf = append(buf, '\\', 'u', '0', '0', hexDigits[c>>4], hexDigits[c&0xF])
			}
			i++
			start = i
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 {
			buf = append(buf, s[start:i]...)
			buf = append(buf, `\ufffd`...)
			i++
			start = i
			continue
		}
		if r == '\u2028' || r == '\u2029' {
			buf = append(buf, s[start:i]...)
			buf = append(buf, '\\', 'u', '2', '0', '2', hexDigits[r&0xF])
			i += size
			start = i
			continue
		}
		i += size
	}
	buf = append(buf, s[start:]...)
	return append(buf, '"')
}
