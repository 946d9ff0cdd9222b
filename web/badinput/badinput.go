// Package badinput reads testdata/bad-inputs.txt, the catalogue of bad inputs that the core,
// the worker and the browser tests all run, so that one list says what Saltcast must refuse
// or warn about. It is imported by tests only; the file's header explains its format.
package badinput

import (
	"bufio"
	"bytes"
	"errors"
	"net/url"
	"os"
	"path/filepath"
	"runtime"
	"strconv"
	"strings"
)

// Kinds of answer a case expects.
const (
	Refuse = "refuse" // an input error naming Field and what is allowed
	Warn   = "warn"   // an answer with a warning about the matter
	Accept = "accept" // an answer (for parse: the number Expect)
)

// Routes: where a case's input goes.
const (
	RoutePlan       = "plan"
	RoutePrep       = "prep"
	RouteSolubility = "solubility"
	RouteGas        = "gas"
	RouteOutgas     = "outgas"
	RouteParse      = "parse"
)

// JSONField is the Field of a case whose input is not valid JSON (a *wire.SyntaxError).
const JSONField = "JSON"

// Case is one line of the catalogue.
type Case struct {
	ID     string
	Route  string
	Input  string // expanded: the body, the query string or the typed text
	Field  string // "-" when no field applies
	Kind   string
	Expect string // as written; see Check
	Why    string
	Line   int
}

// Path returns the worker's address for the case's route ("" for parse).
func (c Case) Path() string {
	switch c.Route {
	case RoutePlan:
		return "/api/v1/plan"
	case RoutePrep:
		return "/api/v1/prep"
	case RouteSolubility:
		return "/api/v1/solubility"
	case RouteGas:
		return "/api/v1/gas"
	case RouteOutgas:
		return "/api/v1/gas/outgas"
	}
	return ""
}

// Params decodes a query case's input into keys and values ('+' is a space, %XX a byte).
func (c Case) Params() (map[string]string, error) {
	p := map[string]string{}
	for pair := range strings.SplitSeq(c.Input, "&") {
		if pair == "" {
			continue
		}
		k, v, _ := strings.Cut(pair, "=")
		key, err := url.QueryUnescape(k)
		if err != nil {
			return nil, err
		}
		val, err := url.QueryUnescape(v)
		if err != nil {
			return nil, err
		}
		p[key] = val
	}
	return p, nil
}

// Check reports the first of the case's expectations that text fails, or "" when text meets
// them all. Expect holds checks separated by ';': words text must contain, or, after '!',
// words it must not contain. "-" checks nothing.
func (c Case) Check(text string) string {
	if c.Expect == "-" {
		return ""
	}
	for w := range strings.SplitSeq(c.Expect, ";") {
		w = strings.TrimSpace(w)
		if not, ok := strings.CutPrefix(w, "!"); ok {
			if strings.Contains(text, not) {
				return "must not contain " + strconv.Quote(not)
			}
		} else if !strings.Contains(text, w) {
			return "must contain " + strconv.Quote(w)
		}
	}
	return ""
}

// File returns the path of testdata/bad-inputs.txt.
func File() string {
	_, here, _, _ := runtime.Caller(0)
	return filepath.Join(filepath.Dir(here), "..", "..", "testdata", "bad-inputs.txt")
}

// Load reads and checks the catalogue.
func Load() ([]Case, error) {
	data, err := os.ReadFile(File())
	if err != nil {
		return nil, err
	}
	return Parse(data)
}

// Parse reads a catalogue. Every line must have seven fields, a known route and kind, and a
// unique id.
func Parse(data []byte) ([]Case, error) {
	var out []Case
	seen := map[string]bool{}
	sc := bufio.NewScanner(bytes.NewReader(data))
	sc.Buffer(nil, 1<<20)
	for n := 1; sc.Scan(); n++ {
		line := strings.TrimSpace(sc.Text())
		if line == "" || line[0] == '#' {
			continue
		}
		bad := func(msg string) error {
			return errors.New("bad-inputs.txt line " + strconv.Itoa(n) + ": " + msg)
		}
		f := strings.Split(line, " | ")
		if len(f) != 7 {
			return nil, bad("want 7 fields separated by \" | \", got " + strconv.Itoa(len(f)))
		}
		c := Case{ID: f[0], Route: f[1], Field: f[3], Kind: f[4], Expect: f[5], Why: f[6], Line: n}
		if seen[c.ID] {
			return nil, bad("id " + c.ID + " repeats")
		}
		seen[c.ID] = true
		switch c.Kind {
		case Refuse, Warn, Accept:
		default:
			return nil, bad("unknown kind " + strconv.Quote(c.Kind))
		}
		in, err := expand(c.Route, f[2])
		if err != nil {
			return nil, bad(err.Error())
		}
		c.Input = in
		out = append(out, c)
	}
	return out, sc.Err()
}

// expand turns the input column into what is sent.
func expand(route, in string) (string, error) {
	switch route {
	case RouteSolubility, RouteGas, RouteOutgas:
		return in, nil
	case RouteParse:
		if strings.HasPrefix(in, `"`) {
			return strconv.Unquote(in)
		}
		return in, nil
	case RoutePrep:
		if in == "@empty" {
			return "", nil
		}
		return in, nil
	case RoutePlan:
	default:
		return "", errors.New("unknown route " + strconv.Quote(route))
	}
	if !strings.HasPrefix(in, "@") {
		return in, nil
	}
	name, arg, ok := strings.Cut(strings.TrimSuffix(in[1:], ")"), "(")
	n, err := strconv.Atoi(arg)
	if name == "empty" && !ok {
		return "", nil
	}
	if err != nil || n < 0 || n > 1<<20 {
		return "", errors.New("bad generator " + in)
	}
	const base = `{"solute":"KNO3","water_g":100,"dissolve_temp_C":40,"notes":`
	switch name {
	case "huge":
		pad := max(0, n-len(base)-3)
		return base + `"` + strings.Repeat("x", pad) + `"}`, nil
	case "deep":
		return base + strings.Repeat("[", n) + strings.Repeat("]", n) + "}", nil
	case "notes":
		return base + `"` + strings.Repeat("x", n) + `"}`, nil
	case "points":
		var b strings.Builder
		b.WriteString(`{"custom":{"name":"X (invented)","molar_mass_g_per_mol":100,"points":[`)
		for i := range n {
			if i > 0 {
				b.WriteByte(',')
			}
			b.WriteString("[" + strconv.FormatFloat(float64(i)*0.5, 'g', -1, 64) + "," + strconv.Itoa(10+i) + "]")
		}
		b.WriteString(`]},"water_g":100,"dissolve_temp_C":40}`)
		return b.String(), nil
	}
	return "", errors.New("unknown generator " + in)
}
