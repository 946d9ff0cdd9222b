//go:build !(js && wasm)

package main

import (
	"net/http"
	"testing"

	"saltcast/web/api"
	"saltcast/web/badinput"
)

// catalogueCases turns the shared bad-input catalogue (testdata/bad-inputs.txt) into API
// cases: a refusal is a 4xx answer whose body is web/api's error JSON naming the field
// (413 for a body over the limit, which the glue answers itself); a warning or an accepted
// input is a 200 with web/api's answer. Rows for typed text (parse) have no route.
func catalogueCases(t testing.TB) []apiCase {
	t.Helper()
	rows, err := badinput.Load()
	if err != nil {
		t.Fatal(err)
	}
	var out []apiCase
	for _, r := range rows {
		if r.Route == badinput.RouteParse {
			continue
		}
		c := apiCase{name: r.ID, method: "GET", path: r.Path(), status: http.StatusOK}
		switch r.Route {
		case badinput.RoutePlan:
			c.method, c.contentType, c.body = "POST", "application/json", []byte(r.Input)
			c.want = plan(c.body)
		case badinput.RoutePrep:
			c.method, c.contentType, c.body = "POST", "application/json", []byte(r.Input)
			c.want = prepare(c.body)
		default:
			p, err := r.Params()
			if err != nil {
				t.Fatalf("line %d: %v", r.Line, err)
			}
			c.path += "?" + r.Input
			call := map[string]func(api.Params) ([]byte, error){
				badinput.RouteSolubility: api.Solubility,
				badinput.RouteGas:        api.Gas,
				badinput.RouteOutgas:     api.Outgas,
			}[r.Route]
			c.want = params(call, p)
		}
		if r.Kind == badinput.Refuse {
			c.status = http.StatusBadRequest
			if r.Field != badinput.JSONField {
				c.field = r.Field
			}
			if len(c.body) > MaxBodyBytes {
				c.status, c.want, c.field = http.StatusRequestEntityTooLarge, nil, ""
			}
		}
		out = append(out, c)
	}
	return out
}

// TestBadInputsInProcess sends the catalogue to the handler in-process.
func TestBadInputsInProcess(t *testing.T) {
	do := inProcess(NewHandler(Options{Page: []byte("<!doctype html><title>t</title>")}))
	cases := catalogueCases(t)
	if len(cases) < 40 {
		t.Fatalf("only %d catalogue cases reach the API", len(cases))
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) { c.check(t, "http://saltcast.test", do) })
	}
}
