package unit

import (
	"strconv"
	"strings"
)

// FieldError reports a value a user gave that Saltcast cannot use. Field is the key the value
// arrived under (as in a recipe or a query, e.g. "water_g"), Value the text as typed, and
// Allowed says in words what would be accepted.
type FieldError struct {
	Field   string
	Value   string
	Allowed string
}

// Error reads like `water_g: "-5" is not allowed; allowed: a mass > 0 g`.
func (e *FieldError) Error() string {
	s := e.Field + ": " + strconv.Quote(e.Value) + " is not allowed"
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
