// Package service answers the requests every Saltcast front end makes (plan, solubility,
// compounds, and the gas requests in gas.go) with JSON in and JSON out. The CLI, the worker
// and the browser all call it, so their answers are byte-identical.
package service

import (
	"errors"

	"saltcast/core/recipe"
	"saltcast/core/unit"
	"saltcast/core/wire"
)

// Params are the parameters of a query, keyed like JSON keys: "solute", "temp_C", ...
type Params map[string]string

// Plan reads a recipe (JSON) and returns its plan (JSON).
func Plan(body []byte) ([]byte, error) {
	r, err := recipe.Decode(body)
	if err != nil {
		return nil, err
	}
	res, err := recipe.Plan(r)
	if err != nil {
		return nil, err
	}
	return res.Encode(), nil
}

// Solubility answers a solubility query. INCOMPLETE.
func Solubility(p Params) ([]byte, error) {
	return nil, errors.New("service: Solubility is not implemented yet")
}

// Compounds lists the built-in compounds. INCOMPLETE.
func Compounds() []byte {
	return []byte(`{"compounds":[]}`)
}

// ErrorJSON renders err as {"error":"...","field":"..."}; field is empty when the error
// is not about one field.
func ErrorJSON(err error) []byte {
	var e wire.Encoder
	e.BeginObject()
	e.Key("error").String(err.Error())
	field := ""
	var fe *unit.FieldError
	if errors.As(err, &fe) {
		field = fe.Field
	}
	e.Key("field").String(field)
	e.EndObject()
	b, _ := e.Bytes()
	return b
}

// IsInputError reports whether err is the user's (a bad field or malformed JSON) rather
// than Saltcast's.
func IsInputError(err error) bool {
	var fe *unit.FieldError
	var se *wire.SyntaxError
	return errors.As(err, &fe) || errors.As(err, &se)
}
