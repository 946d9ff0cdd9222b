package recipe

import (
	"os"
	"regexp"
	"slices"
	"sort"
	"strings"
	"testing"
)

// The CLI document's recipe key table lists exactly the keys of Fields, and its paragraph on the
// custom compound exactly the keys inside "custom": a key added to the table without a
// line in the documentation (or the other way round) fails here.
func TestReadmeListsEveryKey(t *testing.T) {
	b, err := os.ReadFile("../../web/cmd/saltcast/README.md")
	if err != nil {
		t.Fatal(err)
	}
	doc := string(b)
	const heading = "## `saltcast plan`: the recipe format"
	start := strings.Index(doc, heading)
	if start < 0 {
		t.Fatalf("web/cmd/saltcast/README.md has no section %q", heading)
	}
	section := doc[start+len(heading):]
	if end := strings.Index(section, "\n## "); end >= 0 {
		section = section[:end]
	}

	ident := regexp.MustCompile("`([a-z][A-Za-z0-9_]*)`")
	var top []string
	custom := ""
	for _, line := range strings.Split(section, "\n") {
		if strings.HasPrefix(line, "`custom`:") {
			custom = line
			continue
		}
		if custom != "" && line != "" && !strings.HasPrefix(line, "|") {
			custom += " " + line // the paragraph goes on
			continue
		}
		if custom != "" && line == "" && top != nil {
			break // the paragraph after the table ends the part about keys
		}
		cells := strings.Split(line, "|")
		if len(cells) < 3 || strings.HasPrefix(strings.TrimSpace(cells[1]), "---") || strings.TrimSpace(cells[1]) == "key" {
			continue
		}
		for _, m := range ident.FindAllStringSubmatch(cells[1], -1) {
			top = append(top, m[1])
		}
	}
	var inCustom []string
	for _, m := range regexp.MustCompile(`"([a-z][A-Za-z0-9_]*)":`).FindAllStringSubmatch(custom, -1) {
		inCustom = append(inCustom, m[1])
	}
	same(t, "web/cmd/saltcast/README.md's recipe key table", top, FieldSpecs.Keys(""))
	same(t, "web/cmd/saltcast/README.md's paragraph on `custom`", inCustom, FieldSpecs.Keys("custom"))
}

func same(t *testing.T, what string, doc, table []string) {
	t.Helper()
	doc, table = slices.Clone(doc), slices.Clone(table)
	sort.Strings(doc)
	sort.Strings(table)
	doc = slices.Compact(doc)
	if !slices.Equal(doc, table) {
		var missing, extra []string
		for _, k := range table {
			if !slices.Contains(doc, k) {
				missing = append(missing, k)
			}
		}
		for _, k := range doc {
			if !slices.Contains(table, k) {
				extra = append(extra, k)
			}
		}
		t.Errorf("%s lacks %v and lists %v that recipe.Fields does not have", what, missing, extra)
	}
}

// The CLI document's preparation key table lists exactly the keys of PrepFields.
func TestReadmeListsEveryPrepKey(t *testing.T) {
	b, err := os.ReadFile("../../web/cmd/saltcast/README.md")
	if err != nil {
		t.Fatal(err)
	}
	doc := string(b)
	const heading = "## `saltcast prep`"
	start := strings.Index(doc, heading)
	if start < 0 {
		t.Fatalf("web/cmd/saltcast/README.md has no section %q", heading)
	}
	section := doc[start+len(heading):]
	if end := strings.Index(section, "\n## "); end >= 0 {
		section = section[:end]
	}
	ident := regexp.MustCompile("`([a-z][A-Za-z0-9_]*)`")
	var keys []string
	for _, line := range strings.Split(section, "\n") {
		cells := strings.Split(line, "|")
		if len(cells) < 3 || strings.HasPrefix(strings.TrimSpace(cells[1]), "---") || strings.TrimSpace(cells[1]) == "key" {
			continue
		}
		for _, m := range ident.FindAllStringSubmatch(cells[1], -1) {
			keys = append(keys, m[1])
		}
	}
	same(t, "web/cmd/saltcast/README.md's preparation key table", keys, PrepSpecs.Keys(""))
}
