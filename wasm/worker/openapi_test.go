//go:build !(js && wasm)

package main

import (
	"encoding/json"
	"slices"
	"strings"
	"testing"

	"saltcast/web/api"
)

// openAPIDoc is the part of openapi.json these tests read.
type openAPIDoc struct {
	OpenAPI string `json:"openapi"`
	Paths   map[string]map[string]struct {
		Parameters []struct {
			Ref  string `json:"$ref"`
			Name string `json:"name"`
			In   string `json:"in"`
		} `json:"parameters"`
		Responses map[string]any `json:"responses"`
	} `json:"paths"`
	Components struct {
		Parameters map[string]struct {
			Name string `json:"name"`
		} `json:"parameters"`
		Schemas map[string]struct {
			Properties map[string]any `json:"properties"`
		} `json:"schemas"`
	} `json:"components"`
}

func readOpenAPI(t *testing.T) openAPIDoc {
	t.Helper()
	var doc openAPIDoc
	if err := json.Unmarshal(openAPI, &doc); err != nil {
		t.Fatalf("openapi.json: %v", err)
	}
	if doc.OpenAPI != "3.1.0" {
		t.Fatalf("openapi.json: version %q, want 3.1.0", doc.OpenAPI)
	}
	return doc
}

// Every route the handler answers is described, with the same methods, and nothing else is.
func TestOpenAPIDescribesEveryRoute(t *testing.T) {
	doc := readOpenAPI(t)
	h := newHandler(Options{})
	routes := map[string]string{"/": "GET, HEAD"}
	for p, rt := range h.routes {
		routes[p] = rt.methods
	}
	for path, methods := range routes {
		ops, ok := doc.Paths[path]
		if !ok {
			t.Errorf("openapi.json does not describe %s", path)
			continue
		}
		var want []string
		for m := range strings.SplitSeq(methods, ", ") {
			if m != "HEAD" { // HEAD follows GET; OpenAPI may leave it out
				want = append(want, strings.ToLower(m))
			}
		}
		var got []string
		for m, op := range ops {
			got = append(got, m)
			if _, ok := op.Responses["200"]; !ok {
				t.Errorf("openapi.json: %s %s has no 200 answer", m, path)
			}
		}
		slices.Sort(want)
		slices.Sort(got)
		if !slices.Equal(got, want) {
			t.Errorf("openapi.json: %s has methods %v, the handler answers %v", path, got, want)
		}
	}
	for path := range doc.Paths {
		if _, ok := routes[path]; !ok {
			t.Errorf("openapi.json describes %s, which the handler does not answer", path)
		}
	}
}

// The parameters described are the ones web/api takes: each service names its keys when
// given one it does not know, and the description must list exactly those.
func TestOpenAPIParametersMatchService(t *testing.T) {
	doc := readOpenAPI(t)
	const bogus = "zz_not_a_key"
	known := func(call func() ([]byte, error)) []string {
		_, err := call()
		msg := ""
		if err != nil {
			msg = err.Error()
		}
		i := strings.LastIndex(msg, "keys")
		if i < 0 || !strings.Contains(msg, bogus) {
			t.Fatalf("no list of keys in %q", msg)
		}
		list := strings.TrimLeft(msg[i+len("keys"):], ": ")
		var keys []string
		for k := range strings.SplitSeq(list, ", ") {
			keys = append(keys, strings.TrimSpace(k))
		}
		slices.Sort(keys)
		return keys
	}
	query := func(call func(api.Params) ([]byte, error)) func() ([]byte, error) {
		return func() ([]byte, error) { return call(api.Params{bogus: "1"}) }
	}
	described := func(path, method string) []string {
		var names []string
		for _, p := range doc.Paths[path][method].Parameters {
			name := p.Name
			if p.Ref != "" {
				name = doc.Components.Parameters[strings.TrimPrefix(p.Ref, "#/components/parameters/")].Name
			}
			names = append(names, name)
		}
		slices.Sort(names)
		return names
	}
	schema := func(name string) []string {
		var names []string
		for k := range doc.Components.Schemas[name].Properties {
			names = append(names, k)
		}
		slices.Sort(names)
		return names
	}
	for _, tt := range []struct {
		what      string
		got, want []string
	}{
		{"GET /api/v1/solubility", described("/api/v1/solubility", "get"), known(query(api.Solubility))},
		{"GET /api/v1/gas", described("/api/v1/gas", "get"), known(query(api.Gas))},
		{"POST /api/v1/gas", schema("GasRequest"), known(query(api.Gas))},
		{"GET /api/v1/gas/outgas", described("/api/v1/gas/outgas", "get"), known(query(api.Outgas))},
		{"GET /api/v1/gas/table", described("/api/v1/gas/table", "get"), known(query(api.GasTable))},
		{"POST /api/v1/plan", schema("Recipe"), known(func() ([]byte, error) {
			return api.Plan([]byte(`{"` + bogus + `":1,"dissolve_temp_C":20}`))
		})},
		{"POST /api/v1/prep", schema("Preparation"), known(func() ([]byte, error) {
			return api.Prep([]byte(`{"` + bogus + `":1}`))
		})},
		{"POST /api/v1/prep answer", schema("PreparationResult"), resultKeys(t, api.Prep,
			`{"solute":"NaCl","concentration":0.5,"concentration_unit":"mol/L","final_volume_mL":1000,"stock_concentration":5,"stock_unit":"mol/L"}`)},
	} {
		if !slices.Equal(tt.got, tt.want) {
			t.Errorf("%s: openapi.json lists %v, web/api takes %v", tt.what, tt.got, tt.want)
		}
	}
}

// resultKeys returns the sorted top-level keys of a service's answer to body.
func resultKeys(t *testing.T, call func([]byte) ([]byte, error), body string) []string {
	t.Helper()
	out, err := call([]byte(body))
	if err != nil {
		t.Fatalf("%s: %v", body, err)
	}
	var m map[string]any
	if err := json.Unmarshal(out, &m); err != nil {
		t.Fatalf("answer to %s: %v", body, err)
	}
	var keys []string
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	return keys
}

// The Compound schema lists exactly the keys of every compound in /api/v1/compounds, so a
// key added to the library's JSON (such as toxic) must be described.
func TestOpenAPICompoundKeys(t *testing.T) {
	doc := readOpenAPI(t)
	var described []string
	for k := range doc.Components.Schemas["Compound"].Properties {
		described = append(described, k)
	}
	slices.Sort(described)
	var list struct {
		Compounds []map[string]any `json:"compounds"`
	}
	if err := json.Unmarshal(api.Compounds(), &list); err != nil || len(list.Compounds) == 0 {
		t.Fatalf("api.Compounds(): %d compounds, %v", len(list.Compounds), err)
	}
	toxic := 0
	for _, c := range list.Compounds {
		var keys []string
		for k := range c {
			keys = append(keys, k)
		}
		slices.Sort(keys)
		if !slices.Equal(keys, described) {
			t.Fatalf("compound %v has keys %v, openapi.json's Compound lists %v", c["id"], keys, described)
		}
		if c["toxic"] == true {
			toxic++
		}
	}
	if toxic == 0 {
		t.Errorf("no compound of the library is flagged toxic in the JSON (K2Cr2O7 is, on its SDS)")
	}
}
