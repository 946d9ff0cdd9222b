package api_test

import (
	"errors"
	"strconv"
	"strings"
	"testing"

	"saltcast/core/unit"
	"saltcast/core/wire"
	"saltcast/web/api"
	"saltcast/web/badinput"
)

// TestBadInputs runs the shared catalogue (testdata/bad-inputs.txt) through the core: each
// refusal is an input error naming the field and what is allowed, each warning case answers
// with a warning about the matter, and nothing panics.
func TestBadInputs(t *testing.T) {
	cases, err := badinput.Load()
	if err != nil {
		t.Fatal(err)
	}
	if len(cases) < 40 {
		t.Errorf("the catalogue holds %d cases, want at least 40", len(cases))
	}
	for _, c := range cases {
		t.Run(c.ID, func(t *testing.T) {
			if c.Route == badinput.RouteParse {
				checkParse(t, c)
				return
			}
			out, err := call(t, c)
			switch c.Kind {
			case badinput.Refuse:
				checkRefusal(t, c, out, err)
			case badinput.Warn, badinput.Accept:
				if err != nil {
					t.Fatalf("line %d: %s(%s) = error %v; want an answer (%s)", c.Line, c.Route, c.Input, err, c.Why)
				}
				v, derr := wire.Decode(out)
				if derr != nil {
					t.Fatalf("line %d: answer is not strict JSON: %v\n%s", c.Line, derr, out)
				}
				if c.Kind == badinput.Warn {
					checkWarning(t, c, v)
				}
			}
		})
	}
}

// call sends the case to web/api the way the worker does.
func call(t *testing.T, c badinput.Case) ([]byte, error) {
	t.Helper()
	switch c.Route {
	case badinput.RoutePlan:
		return api.Plan([]byte(c.Input))
	case badinput.RoutePrep:
		return api.Prep([]byte(c.Input))
	}
	p, err := c.Params()
	if err != nil {
		t.Fatalf("line %d: bad query in the catalogue: %v", c.Line, err)
	}
	switch c.Route {
	case badinput.RouteSolubility:
		return api.Solubility(p)
	case badinput.RouteGas:
		return api.Gas(p)
	case badinput.RouteOutgas:
		return api.Outgas(p)
	}
	t.Fatalf("line %d: route %q has no service call", c.Line, c.Route)
	return nil, nil
}

func checkRefusal(t *testing.T, c badinput.Case, out []byte, err error) {
	t.Helper()
	if err == nil {
		t.Fatalf("line %d: %s(%s) answered %.300s; want a refusal naming %s (%s)", c.Line, c.Route, c.Input, out, c.Field, c.Why)
	}
	if !api.IsInputError(err) {
		t.Fatalf("line %d: %s(%s) error %v is not an input error", c.Line, c.Route, short(c.Input), err)
	}
	msg := err.Error()
	if c.Field == badinput.JSONField {
		var se *wire.SyntaxError
		if !errors.As(err, &se) {
			t.Fatalf("line %d: error %v is not a JSON syntax error", c.Line, err)
		}
		if !strings.Contains(msg, "line ") || !strings.Contains(msg, "column ") {
			t.Errorf("line %d: %q does not say where the JSON is wrong", c.Line, msg)
		}
	} else {
		var fe *unit.FieldError
		if !errors.As(err, &fe) {
			t.Fatalf("line %d: error %v is not a *unit.FieldError", c.Line, err)
		}
		if fe.Field != c.Field {
			t.Errorf("line %d: error names field %q, want %q: %s", c.Line, fe.Field, c.Field, msg)
		}
		if fe.Allowed == "" || !strings.Contains(msg, "allowed: ") {
			t.Errorf("line %d: %q does not say what is allowed", c.Line, msg)
		}
		if !strings.HasPrefix(msg, c.Field+": ") {
			t.Errorf("line %d: %q does not start with the field %s", c.Line, msg, c.Field)
		}
		if got := jsonField(t, api.ErrorJSON(err)); got != c.Field {
			t.Errorf("line %d: ErrorJSON field = %q, want %q", c.Line, got, c.Field)
		}
	}
	if bad := c.Check(msg); bad != "" {
		t.Errorf("line %d: message %q %s (%s)", c.Line, msg, bad, c.Why)
	}
}

func checkWarning(t *testing.T, c badinput.Case, v wire.Value) {
	t.Helper()
	w, ok := v.Get("warnings")
	if !ok || w.Kind != wire.Array {
		t.Fatalf("line %d: answer has no warnings list", c.Line)
	}
	var all []string
	for _, it := range w.Items {
		if it.Kind == wire.String {
			if c.Check(it.Text) == "" {
				return
			}
			all = append(all, it.Text)
		}
	}
	t.Errorf("line %d: no warning meets %q (%s); warnings: %q", c.Line, c.Expect, c.Why, all)
}

func checkParse(t *testing.T, c badinput.Case) {
	t.Helper()
	v, err := unit.ParseNumber(c.Field, c.Input)
	switch c.Kind {
	case badinput.Accept:
		want, perr := strconv.ParseFloat(c.Expect, 64)
		if perr != nil {
			t.Fatalf("line %d: expect %q is not a number", c.Line, c.Expect)
		}
		if err != nil || v != want {
			t.Errorf("line %d: ParseNumber(%q, %q) = %v, %v; want %v", c.Line, c.Field, c.Input, v, err, want)
		}
	case badinput.Refuse:
		var fe *unit.FieldError
		if !errors.As(err, &fe) {
			t.Fatalf("line %d: ParseNumber(%q, %q) = %v, %v; want a *unit.FieldError", c.Line, c.Field, c.Input, v, err)
		}
		msg := err.Error()
		if fe.Field != c.Field || fe.Allowed == "" || fe.Value != c.Input {
			t.Errorf("line %d: ParseNumber(%q, %q) error %+v; want field %q, the text as typed and what is allowed", c.Line, c.Field, c.Input, *fe, c.Field)
		}
		if bad := c.Check(msg); bad != "" {
			t.Errorf("line %d: message %q %s (%s)", c.Line, msg, bad, c.Why)
		}
	default:
		t.Fatalf("line %d: parse cases are accept or refuse, not %s", c.Line, c.Kind)
	}
}

func jsonField(t *testing.T, b []byte) string {
	t.Helper()
	v, err := wire.Decode(b)
	if err != nil {
		t.Fatalf("ErrorJSON gave invalid JSON %s: %v", b, err)
	}
	f, _ := v.Get("field")
	return f.Text
}

func short(s string) string {
	if len(s) > 200 {
		return s[:200] + "…"
	}
	return s
}
