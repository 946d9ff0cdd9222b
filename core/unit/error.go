package unit

import (
	"strconv"
	"strings"
	"unicode/utf8"
)

// FieldError reports a value a user gave that Saltcast cannot use. Field is the key the value
// arrived under (as in a recipe or a query, e.g. "water_g"), Value the text as typed, and
// Allowed says in words what would be accepted.
type FieldError struct {
	Field   string
	Value   string
	Allowed string
}

// Error reads like `water_g: "-5" is not allowed; allowed: a mass > 0 g`. A field or value
// longer than ClipBytes is shown clipped (a mistyped key can be as long as the whole input, and
// the message must stay readable and within what a JSON answer may carry).
func (e *FieldError) Error() string {
	s := Clip(e.Field) + ": " + strconv.Quote(Clip(e.Value)) + " is not allowed"
	if e.Allowed != "" {
		s += "; allowed: " + e.Allowed
	}
	return s
}

// NumberError is a short way to build a *FieldError for a number the program already holds.
func NumberError(field string, v float64, allowed string) *FieldError {
	return &FieldError{Field: field, Value: FormatCompact(v, 6), Allowed: allowed}
}

// KeysAllowed is the Allowed text of an error about a key (a recipe key, a query parameter, a
// command-line flag) that is not taken there: "one of the keys: a, b, c". Every format and
// front end words an unknown key this way.
func KeysAllowed(keys []string) string {
	return "one of the keys: " + strings.Join(keys, ", ")
}

// ClipBytes is the most of a user's text an error message repeats, in bytes of UTF-8.
const ClipBytes = 80

// Clip shortens s to at most ClipBytes bytes, cut at a character boundary, and marks the cut
// with "…" and the full length, so the user sees which text was meant and that it went on.
func Clip(s string) string {
	if len(s) <= ClipBytes {
		return s
	}
	n := ClipBytes
	for n > 0 && !utf8.RuneStart(s[n]) {
		n--
	}
	return s[:n] + "… (" + strconv.Itoa(len(s)) + " bytes)"
}
