package help

import (
	"regexp"
	"strings"
	"testing"

	"saltcast/core/recipe"
)

// Every key a user can type, of the batch recipe and of the preparation, has its entry on
// the Help screen, with its label from the recipe table; the longer words name only keys
// that exist, so a renamed or dropped key cannot leave a stale explanation behind.
func TestEveryFieldInHelp(t *testing.T) {
	page := HTML()
	for _, tc := range []struct {
		prefix string
		specs  recipe.Specs
		words  map[string]string
	}{{"f", recipe.Fields.Specs(), BatchWords}, {"p", recipe.PrepSpecs, PrepWords}} {
		keys := map[string]bool{}
		for _, s := range tc.specs {
			keys[s.Key] = true
			if s.Kind.Fixed() {
				continue
			}
			entry := `<dt id="help-` + tc.prefix + `-` + s.Key + `">`
			i := strings.Index(page, entry)
			if i < 0 {
				t.Errorf("%s: no help entry for %s", tc.prefix, s.Key)
				continue
			}
			if !strings.HasPrefix(page[i+len(entry):], s.Label) {
				t.Errorf("%s: the help entry of %s does not start with its label %q", tc.prefix, s.Key, s.Label)
			}
			if !strings.Contains(page[i:], "<code>"+s.Key+"</code>") {
				t.Errorf("%s: the help entry of %s does not name its recipe-file key", tc.prefix, s.Key)
			}
		}
		for k := range tc.words {
			if !keys[k] {
				t.Errorf("%s: help words for %s, which is no key of the table", tc.prefix, k)
			}
		}
	}
}

// Where a table's short meaning names another key, the Help screen shows that key's label
// instead: a technician reads "below “Stays clear down to”", not "below clear_down_to_C".
func TestReadableNamesFields(t *testing.T) {
	got := readable("lies this far below clear_down_to_C; default 2 K", recipe.Fields.Specs())
	if want := "lies this far below “Stays clear down to”; default 2 K"; got != want {
		t.Errorf("readable = %q, want %q", got, want)
	}
	// The entries written from the table's words carry no key name with an underscore
	// outside <code>.
	text := regexp.MustCompile(`<code>[^<]*</code>|id="[^"]*"|href="[^"]*"`).ReplaceAllString(HTML(), "")
	if m := regexp.MustCompile(`\b[a-z]+_[a-zA-Z_]+\b`).FindString(text); m != "" {
		t.Errorf("the help text shows the key %q outside a <code> mark", m)
	}
}

// Every output is listed once; the safety part points to the SDS and local rules.
func TestOutputsAndSafety(t *testing.T) {
	seen := map[string]bool{}
	for _, o := range Outputs {
		if seen[o.Key] {
			t.Errorf("output %s explained twice", o.Key)
		}
		seen[o.Key] = true
		if o.Label == "" || o.Text == "" {
			t.Errorf("output %s has no label or text", o.Key)
		}
	}
	page := HTML()
	for _, want := range []string{"SDS", "local rules", "licensed practice", "not a safety assessment", "inert and insoluble", "station pressure"} {
		if !strings.Contains(page, want) {
			t.Errorf("the help screen does not say %q", want)
		}
	}
}

// The help is markup we wrote: its tags open and close in order, so it cannot swallow the
// rest of the page; it holds nothing that runs.
func TestHelpMarkupBalanced(t *testing.T) {
	page := HTML()
	if strings.Contains(strings.ToLower(page), "<script") || strings.Contains(page, " on") && regexp.MustCompile(`\son[a-z]+=`).MatchString(page) {
		t.Fatal("the help holds a script or an event handler")
	}
	var stack []string
	for _, m := range regexp.MustCompile(`<(/?)([a-z0-9]+)[^>]*>`).FindAllStringSubmatch(page, -1) {
		name := m[2]
		if m[1] == "" {
			stack = append(stack, name)
			continue
		}
		if len(stack) == 0 || stack[len(stack)-1] != name {
			t.Fatalf("</%s> closes %v", name, stack)
		}
		stack = stack[:len(stack)-1]
	}
	if len(stack) != 0 {
		t.Errorf("left open: %v", stack)
	}
}
