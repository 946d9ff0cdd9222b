//go:build !(js && wasm)

package main

import (
	"bytes"
	"encoding/json"
	"io"
	"net/http"
	"strings"
	"testing"

	"saltcast/core/recipe/demo"
	"saltcast/web/api"
)

// apiCase is one request and what the answer must be. The same table runs against the
// handler in-process (handler_test.go) and against the built worker under workerd
// (workerd_test.go).
//
// The expected bodies are not written here: they are what web/api (the functions the
// CLI prints) returns for the same input, so the test checks that the worker adds nothing,
// drops nothing and maps each error to the right status.
type apiCase struct {
	name        string
	method      string
	path        string // with the query string
	contentType string // "" sends none
	body        []byte
	status      int
	// want returns what web/api answers for this input; nil for answers the glue
	// makes itself (404, 405, 413, 415), whose shape alone is checked.
	want  func() ([]byte, error)
	field string // the "field" of an error answer, when want is nil or to double-check
	allow string // the Allow header of a 405 or OPTIONS answer
}

// testdataFile returns one of the invented demo recipes of core/recipe/demo by file name.
func testdataFile(t testing.TB, name string) []byte {
	t.Helper()
	d, ok := demo.Lookup(name)
	if !ok {
		t.Fatalf("no demo recipe %s in core/recipe/demo", name)
	}
	return d.JSON
}

func plan(body []byte) func() ([]byte, error) {
	return func() ([]byte, error) { return api.Plan(body) }
}

func prepare(body []byte) func() ([]byte, error) {
	return func() ([]byte, error) { return api.Prep(body) }
}

func params(call func(api.Params) ([]byte, error), p api.Params) func() ([]byte, error) {
	return func() ([]byte, error) { return call(p) }
}

// apiCases lists every route with good and bad input.
func apiCases(t testing.TB) []apiCase {
	kno3 := testdataFile(t, "demo-kno3-stock.json")
	cuso4 := testdataFile(t, "demo-cuso4-crystals.json")
	kclPrep := testdataFile(t, "demo-prep-kcl-coldroom.json")
	const dilution = `{"solute":"NaCl","concentration":0.5,"concentration_unit":"mol/L","final_volume_mL":1000,"stock_concentration":5,"stock_unit":"mol/L"}`
	oversize := append([]byte(`{"notes":"`), bytes.Repeat([]byte("x"), MaxBodyBytes)...)
	oversize = append(oversize, `"}`...)
	const js = "application/json"
	return []apiCase{
		// plan: the invented demo recipes
		{name: "plan kno3", method: "POST", path: "/api/v1/plan", contentType: js, body: kno3, status: 200, want: plan(kno3)},
		{name: "plan cuso4", method: "POST", path: "/api/v1/plan", contentType: js + "; charset=utf-8", body: cuso4, status: 200, want: plan(cuso4)},
		{name: "plan without content type", method: "POST", path: "/api/v1/plan", body: kno3, status: 200, want: plan(kno3)},
		// plan: bad input
		{name: "plan malformed", method: "POST", path: "/api/v1/plan", contentType: js, body: []byte(`{"solute": "KNO3",`), status: 400, want: plan([]byte(`{"solute": "KNO3",`))},
		{name: "plan unknown field", method: "POST", path: "/api/v1/plan", contentType: js, body: []byte(`{"solute":"KNO3","dissolve_temp_C":60,"water_g":100,"saturation_pct":80,"stir_rpm":300}`), status: 400, field: "stir_rpm",
			want: plan([]byte(`{"solute":"KNO3","dissolve_temp_C":60,"water_g":100,"saturation_pct":80,"stir_rpm":300}`))},
		{name: "plan NaN", method: "POST", path: "/api/v1/plan", contentType: js, body: []byte(`{"solute":"KNO3","dissolve_temp_C":NaN}`), status: 400, want: plan([]byte(`{"solute":"KNO3","dissolve_temp_C":NaN}`))},
		{name: "plan huge number", method: "POST", path: "/api/v1/plan", contentType: js, body: []byte(`{"solute":"KNO3","dissolve_temp_C":1e999,"water_g":100,"saturation_pct":80}`), status: 400,
			want: plan([]byte(`{"solute":"KNO3","dissolve_temp_C":1e999,"water_g":100,"saturation_pct":80}`))},
		{name: "plan unknown solute", method: "POST", path: "/api/v1/plan", contentType: js, body: []byte(`{"solute":"unobtainium","dissolve_temp_C":60,"water_g":100,"saturation_pct":80}`), status: 400, field: "solute",
			want: plan([]byte(`{"solute":"unobtainium","dissolve_temp_C":60,"water_g":100,"saturation_pct":80}`))},
		{name: "plan empty body", method: "POST", path: "/api/v1/plan", contentType: js, body: []byte{}, status: 400, want: plan([]byte{})},
		{name: "plan array", method: "POST", path: "/api/v1/plan", contentType: js, body: []byte(`[1,2]`), status: 400, want: plan([]byte(`[1,2]`))},
		{name: "plan oversize", method: "POST", path: "/api/v1/plan", contentType: js, body: oversize, status: 413},
		{name: "plan form-encoded", method: "POST", path: "/api/v1/plan", contentType: "application/x-www-form-urlencoded", body: []byte("solute=KNO3"), status: 415},
		{name: "plan GET", method: "GET", path: "/api/v1/plan", status: 405, allow: "POST, OPTIONS"},
		{name: "plan OPTIONS", method: "OPTIONS", path: "/api/v1/plan", status: 204, allow: "POST, OPTIONS"},

		// prep: a solution made up to the mark, a dilution, bad input
		{name: "prep kcl", method: "POST", path: "/api/v1/prep", contentType: js, body: kclPrep, status: 200, want: prepare(kclPrep)},
		{name: "prep dilution", method: "POST", path: "/api/v1/prep", contentType: js, body: []byte(dilution), status: 200, want: prepare([]byte(dilution))},
		{name: "prep unknown field", method: "POST", path: "/api/v1/prep", contentType: js, body: []byte(`{"solute":"KCl","concentration":1,"concentration_unit":"mol/L","final_volume_mL":100,"flask":"A"}`),
			status: 400, field: "flask", want: prepare([]byte(`{"solute":"KCl","concentration":1,"concentration_unit":"mol/L","final_volume_mL":100,"flask":"A"}`))},
		{name: "prep no density", method: "POST", path: "/api/v1/prep", contentType: js, body: []byte(`{"solute":"KH2PO4","concentration":1,"concentration_unit":"mol/L","final_volume_mL":100}`),
			status: 400, field: "concentration_unit", want: prepare([]byte(`{"solute":"KH2PO4","concentration":1,"concentration_unit":"mol/L","final_volume_mL":100}`))},
		{name: "prep malformed", method: "POST", path: "/api/v1/prep", contentType: js, body: []byte(`{"solute":`), status: 400, want: prepare([]byte(`{"solute":`))},
		{name: "prep oversize", method: "POST", path: "/api/v1/prep", contentType: js, body: oversize, status: 413},
		{name: "prep GET", method: "GET", path: "/api/v1/prep", status: 405, allow: "POST, OPTIONS"},

		// solubility
		{name: "solubility KNO3", method: "GET", path: "/api/v1/solubility?solute=KNO3&temp_C=20", status: 200,
			want: params(api.Solubility, api.Params{"solute": "KNO3", "temp_C": "20"})},
		{name: "solubility by name, decimal comma", method: "GET", path: "/api/v1/solubility?solute=potassium+nitrate&temp_C=20%2C5", status: 200,
			want: params(api.Solubility, api.Params{"solute": "potassium nitrate", "temp_C": "20,5"})},
		{name: "solubility hydrate formula", method: "GET", path: "/api/v1/solubility?solute=CuSO4.5H2O&temp_C=40", status: 200,
			want: params(api.Solubility, api.Params{"solute": "CuSO4.5H2O", "temp_C": "40"})},
		{name: "solubility unknown solute", method: "GET", path: "/api/v1/solubility?solute=unobtainium&temp_C=20", status: 400, field: "solute",
			want: params(api.Solubility, api.Params{"solute": "unobtainium", "temp_C": "20"})},
		{name: "solubility NaN", method: "GET", path: "/api/v1/solubility?solute=KNO3&temp_C=NaN", status: 400, field: "temp_C",
			want: params(api.Solubility, api.Params{"solute": "KNO3", "temp_C": "NaN"})},
		{name: "solubility Inf", method: "GET", path: "/api/v1/solubility?solute=KNO3&temp_C=-Inf", status: 400, field: "temp_C",
			want: params(api.Solubility, api.Params{"solute": "KNO3", "temp_C": "-Inf"})},
		{name: "solubility far outside range", method: "GET", path: "/api/v1/solubility?solute=KNO3&temp_C=500", status: 400, field: "temp_C",
			want: params(api.Solubility, api.Params{"solute": "KNO3", "temp_C": "500"})},
		{name: "solubility thousands separator", method: "GET", path: "/api/v1/solubility?solute=KNO3&temp_C=1.234%2C5", status: 400, field: "temp_C",
			want: params(api.Solubility, api.Params{"solute": "KNO3", "temp_C": "1.234,5"})},
		{name: "solubility missing temp", method: "GET", path: "/api/v1/solubility?solute=KNO3", status: 400, field: "temp_C",
			want: params(api.Solubility, api.Params{"solute": "KNO3"})},
		{name: "solubility unknown key", method: "GET", path: "/api/v1/solubility?solute=KNO3&temp_C=20&unit=F", status: 400, field: "unit",
			want: params(api.Solubility, api.Params{"solute": "KNO3", "temp_C": "20", "unit": "F"})},
		{name: "solubility key twice", method: "GET", path: "/api/v1/solubility?solute=KNO3&temp_C=20&temp_C=30", status: 400, field: "temp_C"},
		{name: "solubility bad escape", method: "GET", path: "/api/v1/solubility?solute=KN%zz&temp_C=20", status: 400, field: "solute"},
		{name: "solubility POST", method: "POST", path: "/api/v1/solubility?solute=KNO3&temp_C=20", contentType: js, body: []byte(`{}`), status: 405, allow: "GET, HEAD, OPTIONS"},

		// gas
		{name: "gas O2", method: "GET", path: "/api/v1/gas?gas=O2&temp_C=20", status: 200,
			want: params(api.Gas, api.Params{"gas": "O2", "temp_C": "20"})},
		{name: "gas seawater at altitude", method: "GET", path: "/api/v1/gas?temp_C=12%2C5&salinity=35&altitude_m=1500&method=garcia-gordon&measured_mg_per_L=7.1", status: 200,
			want: params(api.Gas, api.Params{"temp_C": "12,5", "salinity": "35", "altitude_m": "1500", "method": "garcia-gordon", "measured_mg_per_L": "7.1"})},
		{name: "gas POST", method: "POST", path: "/api/v1/gas", contentType: js, body: []byte(`{"gas":"CO2","temp_C":25,"co2_ppm":"420"}`), status: 200,
			want: params(api.Gas, api.Params{"gas": "CO2", "temp_C": "25", "co2_ppm": "420"})},
		{name: "gas POST number as written", method: "POST", path: "/api/v1/gas", contentType: js, body: []byte(`{"temp_C":2.50e1}`), status: 200,
			want: params(api.Gas, api.Params{"temp_C": "2.50e1"})},
		{name: "gas POST unknown key", method: "POST", path: "/api/v1/gas", contentType: js, body: []byte(`{"temp_C":20,"depth_m":3}`), status: 400, field: "depth_m",
			want: params(api.Gas, api.Params{"temp_C": "20", "depth_m": "3"})},
		{name: "gas POST nested value", method: "POST", path: "/api/v1/gas", contentType: js, body: []byte(`{"temp_C":[20]}`), status: 400, field: "temp_C"},
		{name: "gas POST not an object", method: "POST", path: "/api/v1/gas", contentType: js, body: []byte(`"O2"`), status: 400, field: "body"},
		{name: "gas POST malformed", method: "POST", path: "/api/v1/gas", contentType: js, body: []byte(`{"temp_C":20`), status: 400},
		{name: "gas POST duplicate key", method: "POST", path: "/api/v1/gas", contentType: js, body: []byte(`{"temp_C":20,"temp_C":30}`), status: 400},
		{name: "gas POST oversize", method: "POST", path: "/api/v1/gas", contentType: js, body: oversize, status: 413},
		{name: "gas unknown gas", method: "GET", path: "/api/v1/gas?gas=Xe&temp_C=20", status: 400, field: "gas",
			want: params(api.Gas, api.Params{"gas": "Xe", "temp_C": "20"})},
		{name: "gas text temperature", method: "GET", path: "/api/v1/gas?temp_C=warm", status: 400, field: "temp_C",
			want: params(api.Gas, api.Params{"temp_C": "warm"})},
		{name: "gas DELETE", method: "DELETE", path: "/api/v1/gas?temp_C=20", status: 405, allow: "GET, HEAD, POST, OPTIONS"},

		// outgassing and the field table
		{name: "outgas", method: "GET", path: "/api/v1/gas/outgas?from_C=15&to_C=80", status: 200,
			want: params(api.Outgas, api.Params{"from_C": "15", "to_C": "80"})},
		{name: "outgas salinity refused", method: "GET", path: "/api/v1/gas/outgas?from_C=15&to_C=80&salinity=35", status: 400, field: "salinity",
			want: params(api.Outgas, api.Params{"from_C": "15", "to_C": "80", "salinity": "35"})},
		{name: "outgas missing to", method: "GET", path: "/api/v1/gas/outgas?from_C=15", status: 400, field: "to_C",
			want: params(api.Outgas, api.Params{"from_C": "15"})},
		{name: "gas table", method: "GET", path: "/api/v1/gas/table?temp_to_C=10&values=101.325%3B90", status: 200,
			want: params(api.GasTable, api.Params{"temp_to_C": "10", "values": "101.325;90"})},

		// library, description, page, unknown addresses
		{name: "compounds", method: "GET", path: "/api/v1/compounds", status: 200, want: func() ([]byte, error) { return api.Compounds(), nil }},
		{name: "compounds PUT", method: "PUT", path: "/api/v1/compounds", contentType: js, body: []byte(`{}`), status: 405, allow: "GET, HEAD, OPTIONS"},
		{name: "openapi", method: "GET", path: "/api/v1/openapi.json", status: 200, want: func() ([]byte, error) { return openAPI, nil }},
		{name: "unknown address", method: "GET", path: "/api/v1/nothing", status: 404},
		{name: "trailing slash", method: "GET", path: "/api/v1/plan/", status: 404},
		{name: "page POST", method: "POST", path: "/", contentType: js, body: []byte(`{}`), status: 405, allow: "GET, HEAD"},
	}
}

// check sends c with do and checks the answer.
func (c apiCase) check(t *testing.T, base string, do func(*http.Request) (*http.Response, error)) {
	t.Helper()
	var body io.Reader
	if c.body != nil {
		body = bytes.NewReader(c.body)
	}
	req, err := http.NewRequest(c.method, base+c.path, body)
	if err != nil {
		t.Fatal(err)
	}
	if c.contentType != "" {
		req.Header.Set("Content-Type", c.contentType)
	}
	res, err := do(req)
	if err != nil {
		t.Fatalf("%s %s: %v", c.method, c.path, err)
	}
	got, err := io.ReadAll(res.Body)
	res.Body.Close()
	if err != nil {
		t.Fatalf("%s %s: reading the body: %v", c.method, c.path, err)
	}
	if res.StatusCode != c.status {
		t.Errorf("%s %s: status %d, want %d; body %.300s", c.method, c.path, res.StatusCode, c.status, got)
	}
	if h := res.Header.Get("X-Content-Type-Options"); h != "nosniff" {
		t.Errorf("%s %s: X-Content-Type-Options %q, want nosniff", c.method, c.path, h)
	}
	if c.allow != "" {
		if h := res.Header.Get("Allow"); h != c.allow {
			t.Errorf("%s %s: Allow %q, want %q", c.method, c.path, h, c.allow)
		}
	}
	if c.status == http.StatusNoContent {
		if len(got) != 0 {
			t.Errorf("%s %s: 204 with a body %q", c.method, c.path, got)
		}
		return
	}
	if ct := res.Header.Get("Content-Type"); ct != "application/json" {
		t.Errorf("%s %s: Content-Type %q, want application/json", c.method, c.path, ct)
	}
	if c.want != nil {
		want, err := c.want()
		if err != nil {
			if !api.IsInputError(err) {
				t.Fatalf("%s %s: the case expects an input error, but web/api says %v", c.method, c.path, err)
			}
			want = api.ErrorJSON(err)
		}
		if !bytes.Equal(got, want) {
			t.Errorf("%s %s: body differs from web/api's\n got %.400s\nwant %.400s", c.method, c.path, got, want)
		}
	}
	if c.status >= 400 {
		checkErrorShape(t, c.method+" "+c.path, got, c.field)
	}
}

// checkErrorShape checks an error answer is {"error": non-empty, "field": string} and
// nothing else, with the field named when one is expected.
func checkErrorShape(t *testing.T, what string, body []byte, field string) {
	t.Helper()
	var e map[string]any
	if err := json.Unmarshal(body, &e); err != nil {
		t.Errorf("%s: error body is not JSON: %v: %.300s", what, err, body)
		return
	}
	msg, ok := e["error"].(string)
	if !ok || strings.TrimSpace(msg) == "" {
		t.Errorf("%s: error body has no message: %s", what, body)
	}
	f, ok := e["field"].(string)
	if !ok || len(e) != 2 {
		t.Errorf("%s: error body is not {error, field}: %s", what, body)
	}
	if field != "" && f != field {
		t.Errorf("%s: field %q, want %q (%s)", what, f, field, msg)
	}
}
